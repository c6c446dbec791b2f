import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join, resolve } from 'node:path';
import subsetFont from 'subset-font';

// `npm run fonts`: writes src/assets/fonts/ (committed), the Barlow files the screens load. Run it again after
// @fontsource/barlow changes or when the screens start to use a weight or a character outside the core set.
//
// Each weight gets two faces. The core face holds printable ASCII and the few signs the screens and the English
// catalogue use (·, …, —, °, −, arrows), unhinted (tablets and phones ignore TrueType hinting), with kerning and
// tabular figures kept: about 8 KB instead of Fontsource's 22 KB latin file. The full latin file stays as a second
// face for any other latin character (a name with é): the browser fetches it only for a page that has one.

const WEIGHTS = [400, 600, 700] as const;
const CORE_SIGNS = '\u00a0°±·×\u2009–—‘’“”•…\u202f↑↓→−';
const CORE_TEXT = Array.from({ length: 95 }, (_, i) => String.fromCharCode(32 + i)).join('') + CORE_SIGNS;
// Fontsource's latin range (its 400.css), for the fallback face.
const LATIN_RANGE =
  'U+0000-00FF, U+0131, U+0152-0153, U+02BB-02BC, U+02C6, U+02DA, U+02DC, U+0304, U+0308, U+0329, ' +
  'U+2000-206F, U+20AC, U+2122, U+2191, U+2193, U+2212, U+2215, U+FEFF, U+FFFD';

const hex = (code: number) => code.toString(16).toUpperCase().padStart(4, '0');
const coreRange = () =>
  ['U+0020-007E', ...[...CORE_SIGNS].map((c) => `U+${hex(c.codePointAt(0)!)}`)].join(', ');

function face(weight: number, src: string, range: string) {
  return [
    '@font-face {',
    "  font-family: 'Barlow';",
    '  font-style: normal;',
    `  font-weight: ${weight};`,
    '  font-display: swap;',
    `  src: url(${src}) format('woff2');`,
    `  unicode-range: ${range};`,
    '}',
  ].join('\n');
}

async function main() {
  const out = resolve('src', 'assets', 'fonts');
  mkdirSync(out, { recursive: true });
  const files = join(
    dirname(createRequire(import.meta.url).resolve('@fontsource/barlow/package.json')),
    'files',
  );
  const css = [
    '/* Written by `npm run fonts` (server/entry/subset-fonts.ts); do not edit by hand. */',
    '/* The full latin face comes first: for a character both faces cover, the one declared last is used. */',
  ];
  for (const weight of WEIGHTS) {
    const latin = `barlow-latin-${weight}-normal.woff2`;
    const original = readFileSync(join(files, latin));
    const core = await subsetFont(original, CORE_TEXT, {
      targetFormat: 'woff2',
      noHinting: true,
      keepFeatures: ['kern', 'tnum'],
    });
    writeFileSync(join(out, `barlow-${weight}-core.woff2`), core);
    writeFileSync(join(out, latin), original);
    css.push(
      face(weight, `./${latin}`, LATIN_RANGE),
      face(weight, `./barlow-${weight}-core.woff2`, coreRange()),
    );
    process.stdout.write(`Barlow ${weight}: core ${core.length} bytes (latin ${original.length})\n`);
  }
  writeFileSync(join(out, 'barlow.css'), `${css.join('\n')}\n`);
}

await main();
