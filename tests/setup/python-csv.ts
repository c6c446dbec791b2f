import { execFileSync } from 'node:child_process';

/** Python's own csv module reads the file, so a test does not trust the library that wrote it. */
export const pythonCsv = (text: string): string[][] =>
  JSON.parse(
    execFileSync(
      'python3',
      [
        '-c',
        'import csv, io, json, sys; print(json.dumps(list(csv.reader(io.StringIO(sys.stdin.read(), newline="")))))',
      ],
      { input: text, encoding: 'utf8' },
    ),
  ) as string[][];
