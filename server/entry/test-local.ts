import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { findFreePort, startLocalMariadb } from '../db/local-server';

// `npm test`: a throw-away MariaDB, then typecheck, lint, build and every vitest project, then one summary line.

const root = resolve('.');
const bin = (name: string) => join(root, 'node_modules', '.bin', name);

function ensureChromium() {
  if (existsSync('/usr/bin/chromium')) return;
  if (process.getuid?.() !== 0 || !existsSync('/usr/bin/apt-get')) {
    throw new Error(
      'Browser tests need Chromium at /usr/bin/chromium: install it with `sudo apt-get install -y chromium`.',
    );
  }
  process.stdout.write('Chromium not found: installing Debian package chromium (apt-get, about 40 s)...\n');
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  if (spawnSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env }).status !== 0)
    throw new Error('apt-get update failed.');
  if (spawnSync('apt-get', ['install', '-y', '-qq', 'chromium'], { stdio: 'inherit', env }).status !== 0) {
    throw new Error('apt-get install chromium failed.');
  }
}

function run(command: string, args: string[], env: NodeJS.ProcessEnv = process.env): Promise<number> {
  return new Promise((ok) => {
    const child = spawn(command, args, { stdio: 'inherit', env, cwd: root });
    child.on('exit', (code, signal) => ok(code ?? (signal ? 1 : 0)));
  });
}

interface Step {
  name: string;
  passed: boolean;
}

const steps: Step[] = [];
let passed = 0;
let failed = 0;
const tmp = mkdtempSync(join(tmpdir(), 'gaugewalk-test-'));
let stopDb: (() => Promise<void>) | undefined;
let interrupted = false;

const finish = async (code: number) => {
  await stopDb?.();
  rmSync(tmp, { recursive: true, force: true });
  for (const s of steps) process.stdout.write(`${s.passed ? 'ok  ' : 'FAIL'} ${s.name}\n`);
  process.stdout.write(`${passed} passed, ${failed} failed\n`);
  process.exit(code);
};
for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.on(signal, () => {
    if (interrupted) return;
    interrupted = true;
    failed += 1;
    void finish(1);
  });
}

try {
  ensureChromium();
  const db = await startLocalMariadb({
    dataDir: join(tmp, 'db'),
    port: await findFreePort(0),
    database: 'gaugewalk_api',
    extraDatabases: ['gaugewalk_e2e'],
    ephemeral: true,
  });
  stopDb = db.stop;
  const env = {
    ...process.env,
    NODE_ENV: 'test',
    TEST_DATABASE_URL_API: db.url,
    TEST_DATABASE_URL_E2E: db.url.replace(/\/gaugewalk_api$/, '/gaugewalk_e2e'),
  };

  const gate = async (name: string, command: string, args: string[], extraEnv: NodeJS.ProcessEnv = {}) => {
    process.stdout.write(`\n== ${name}\n`);
    const ok = (await run(command, args, { ...env, ...extraEnv })) === 0;
    steps.push({ name, passed: ok });
    if (ok) passed += 1;
    else failed += 1;
    return ok;
  };
  // `npm test -- <vitest filters>` runs just those tests (with the build the browser tests need): a quick loop while
  // working. Without filters, every gate runs.
  const filters = process.argv.slice(2);
  if (filters.length === 0) {
    await gate('typecheck (tsc --noEmit)', bin('tsc'), ['--noEmit', '-p', '.']);
    await gate('lint (eslint)', bin('eslint'), ['.', '--max-warnings=0']);
  }
  // The browser tests and a later `npm start` serve this build: it must be the production one (with NODE_ENV=test
  // Vite bundles React's development build, a third larger and slower).
  const built = await gate('build (vite build)', bin('vite'), ['build', '--logLevel', 'warn'], {
    NODE_ENV: 'production',
  });

  process.stdout.write('\n== vitest: unit, api, e2e\n');
  const report = join(tmp, 'vitest.json');
  const projects = built ? [] : ['--project', 'unit', '--project', 'api'];
  const code = await run(
    bin('vitest'),
    ['run', ...projects, ...filters, '--reporter=default', '--reporter=json', `--outputFile.json=${report}`],
    env,
  );
  if (existsSync(report)) {
    const result = JSON.parse(readFileSync(report, 'utf8')) as {
      numPassedTests: number;
      numFailedTests: number;
      numTotalTests: number;
    };
    passed += result.numPassedTests;
    failed += result.numFailedTests;
    steps.push({
      name: `vitest (${result.numPassedTests} of ${result.numTotalTests} passed)`,
      passed: code === 0 && result.numTotalTests > 0,
    });
    if (code !== 0 && result.numFailedTests === 0) failed += 1; // a suite that failed to load counts too
    if (result.numTotalTests === 0) failed += 1;
  } else {
    steps.push({ name: 'vitest (no report: it did not run)', passed: false });
    failed += 1;
  }
  await finish(failed > 0 ? 1 : 0);
} catch (err) {
  process.stderr.write(`\n${(err as Error).message}\n`);
  failed += 1;
  await finish(1);
}
