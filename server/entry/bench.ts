import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { cpus, tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { randomUUID } from 'node:crypto';
import { findFreePort, startLocalMariadb, type LocalDatabase } from '../db/local-server';
import { openDatabase } from '../db/connection';
import { airframeIdsOf, benchMechanics, typeAndLimitsIds } from '../db/seeders/bench-rows';
import { explainLatestChecksByKind } from '../features/airframes/airframes.repository';
import { migrate } from '../db/migrate';
import { seedDemo } from '../demo/demo-seed';
import { hashSecret } from '../security/hashing';
import { createEnrolment, redeemEnrolment } from '../features/kiosks/kiosks.service';
import { signIn } from '../bench/sessions';
import { buildClientIfStale } from './local-environment';
import { seedFleet } from '../db/seeders/bench-fleet';
import { load, type LoadFigures } from '../bench/load';
import { entryBundleSizes, kioskStartScreen } from '../bench/client-figures';
import { firstScreens, type FirstScreenFigures } from '../bench/first-screens';
import { createBoardLink } from '../features/board-links/board-links.service';
import { demoStaffByBadge } from '../db/seeders/demo-rows';
import { goodPreFlight as preFlight } from '@tests/setup/check-builder';

// `npm run bench`: a throw-away MariaDB with a large invented fleet, then fixed-time load on the real server and
// on a bare-connector baseline, the kiosk's bundle size and its LCP on a 4x slowed CPU. Not part of `npm test`.

const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);
const SIZE = {
  airframes: Number(process.env.BENCH_AIRFRAMES ?? 500),
  readings: Number(process.env.BENCH_READINGS ?? 1_000_000),
  days: 730,
};
const PIN = '2580';
const say = (line: string) => process.stdout.write(`${line}\n`);
const children: ChildProcess[] = [];
const tmp = mkdtempSync(join(tmpdir(), 'gaugewalk-bench-'));

function child(script: string, env: Record<string, string>): Promise<ChildProcess> {
  const proc = spawn(process.execPath, ['--import', 'tsx', script], {
    env: { ...process.env, ...env },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  children.push(proc);
  return new Promise((ok, fail) => {
    const timer = setTimeout(() => fail(new Error(`${script} did not start within 60 s`)), 60_000);
    proc.stdout?.on('data', (chunk: Buffer) => {
      if (chunk.toString().includes('listening')) {
        clearTimeout(timer);
        ok(proc);
      }
    });
    proc.once('exit', (code) => fail(new Error(`${script} exited with ${code}`)));
  });
}

const line = (name: string, f: LoadFigures) =>
  `${name.padEnd(22)} ${String(f.rps).padStart(8)} rps   p50 ${String(f.p50).padStart(6)} ms   p95 ${String(
    f.p95,
  ).padStart(6)} ms   p99 ${String(f.p99).padStart(6)} ms   (${f.connections} conn, ${f.requests} req, ${
    f.non2xx
  } non-2xx, ${f.errors} errors)`;

/** The throw-away database, the demo, the bench's mechanics and fleet, and an enrolled tablet per mechanic. */
async function prepare(db: LocalDatabase) {
  const sequelize = openDatabase(db.url);
  await migrate(sequelize);
  await seedDemo(sequelize, { bcryptCost: 4, withHistory: false });
  const mechanics = await benchMechanics(32, await hashSecret(PIN, 4));
  const { typeIds, limitsIds } = await typeAndLimitsIds();
  say(
    `Seeding ${SIZE.airframes} airframes and ${SIZE.readings.toLocaleString('en')} readings over two years...`,
  );
  const t0 = Date.now();
  const seeded = await seedFleet(db.url, db.socket, SIZE, {
    typeIds,
    limitsIds,
    signerIds: mechanics.map((m) => m.id),
  });
  const seedSeconds = Math.round((Date.now() - t0) / 100) / 10;
  say(
    `Seeded ${seeded.airframes} airframes, ${seeded.checks.toLocaleString('en')} checks, ` +
      `${seeded.readings.toLocaleString('en')} readings in ${seedSeconds} s.`,
  );
  const rx4 = await airframeIdsOf(typeIds.get('RX-4')!);
  say('EXPLAIN of the board query (latest check of each kind per airframe):');
  for (const row of await explainLatestChecksByKind(sequelize, await airframeIdsOf()))
    say(
      `  ${row.select_type} ${row.table} type=${row.type} key=${row.key} rows=${row.rows} ${row.Extra ?? ''}`,
    );
  const kiosks = await Promise.all(
    mechanics.map(async (m) => ({
      badge: m.badge,
      ...(await redeemEnrolment((await createEnrolment(`Bench ${m.id}`, null)).code)),
    })),
  );
  const lcpEnrolment = await createEnrolment('Bench LCP tablet', null);
  const screenEnrolment = await createEnrolment('Bench first-screen tablet', null);
  const boardLink = await createBoardLink(sequelize, 'Bench TV', (await demoStaffByBadge('5201'))!.id);
  await sequelize.close();
  return {
    mechanics,
    rx4,
    rx4Limits: limitsIds.get('RX-4')!,
    seeded,
    seedSeconds,
    kiosks,
    lcpEnrolment,
    screenEnrolment,
    boardPath: boardLink.path,
  };
}

type Prepared = Awaited<ReturnType<typeof prepare>>;

/** The app and the baseline, each in a process of its own; their base URLs. */
async function startServers(db: LocalDatabase) {
  if (!existsSync(resolve('dist', 'index.html'))) buildClientIfStale();
  const [appPort, basePort] = [await findFreePort(0), await findFreePort(0)];
  await child('server/start.ts', {
    PORT: String(appPort),
    HOST: '127.0.0.1',
    DATABASE_URL: db.url,
    DATA_DIR: join(tmp, 'data'),
    SESSION_SECRET: 'bench-secret-that-is-long-enough',
    BCRYPT_COST: '4',
    SIGN_IN_RATE_PER_MINUTE: '1000000',
    KIOSK_IDLE_SECONDS: '3600',
    LOG_LEVEL: 'warn',
    NODE_ENV: 'production',
  });
  await child('server/bench/baseline-server.ts', { PORT: String(basePort), DATABASE_URL: db.url });
  return { app: `http://127.0.0.1:${appPort}`, baseline: `http://127.0.0.1:${basePort}` };
}

const pick = (ids: number[]) => ids[Math.floor(Math.random() * ids.length)]!;

/** Fixed-time load of one kind of request; its figures are printed under `name`. */
async function measure(
  name: string,
  url: string,
  connections: number,
  headersFor: (i: number) => Record<string, string>,
  request: Parameters<typeof load>[0]['requests'][number],
) {
  const figures = await load({ url, connections, seconds: SECONDS, headersFor, requests: [request] });
  say(line(name, figures));
  return figures;
}

async function runLoads(urls: { app: string; baseline: string }, prepared: Prepared) {
  const { app } = urls;
  const { rx4, rx4Limits } = prepared;
  const sessions: Record<string, string>[] = [];
  for (const k of prepared.kiosks)
    sessions.push(await signIn(app, '/api/auth/kiosk', { badge: k.badge, pin: PIN }, k.token));
  const kiosk = (i: number) => sessions[i % sessions.length]!;
  const desk = await signIn(app, '/api/auth/desk', { badge: '5201', password: 'north-pad-lead' });
  const body = (extra: object) => (req: { body?: unknown }) => ({ ...req, body: JSON.stringify(extra) });
  say(`\nLoad, ${SECONDS} s each:`);
  const board = await measure('board (GET /api/airframes)', app, 8, kiosk, {
    method: 'GET',
    path: '/api/airframes',
  });
  const history = await measure('history (records, 50)', app, 8, () => desk, {
    method: 'GET',
    setupRequest: (req) => ({ ...req, path: `/api/records?airframeId=${pick(rx4)}&pageSize=50` }),
  });
  const trends = await measure('trends (90 days)', app, 8, () => desk, {
    method: 'GET',
    setupRequest: (req) => ({ ...req, path: `/api/trends?airframeId=${pick(rx4)}&days=90` }),
  });
  const signerId = prepared.mechanics[0]!.id;
  const baseline = await measure(
    'baseline (bare conn.)',
    urls.baseline,
    32,
    () => ({ 'content-type': 'application/json' }),
    {
      method: 'POST',
      path: '/baseline/checks',
      setupRequest: (req) =>
        body({ airframeId: pick(rx4), limitsVersionId: rx4Limits, signerId, ...preFlight })(req),
    },
  );
  const submit = await measure('submit (signed check)', app, 32, kiosk, {
    method: 'POST',
    path: '/api/checks',
    setupRequest: (req) =>
      body({
        id: randomUUID(),
        airframeId: pick(rx4),
        kind: 'pre_flight',
        limitsVersionId: rx4Limits,
        pin: PIN,
        ...preFlight,
      })(req),
  });
  say('  (each signed check verifies the PIN again: one bcrypt comparison by design; BCRYPT_COST=4 here)');
  return { board, history, trends, baseline, submit };
}

/** `prefix.key` for each of the figures' keys, in that order. */
const figuresOf = (prefix: string, f: LoadFigures, keys: (keyof LoadFigures)[]) =>
  Object.fromEntries(keys.map((k) => [`${prefix}.${k}`, f[k]]));

/** The kiosk, board and desk first screens in Chromium and Lighthouse, each opened as its users open it. */
async function browserFigures(app: string, prepared: Prepared) {
  const tablet = await signIn(app, '/api/kiosks/enrol', { code: prepared.screenEnrolment.code });
  const desk = await signIn(app, '/api/auth/desk', { badge: '5201', password: 'north-pad-lead' });
  say('\nFirst screens in Chromium, then Lighthouse (mobile preset) on /, /kiosk, /board and /desk...');
  return firstScreens(app, {
    kioskCookie: tablet.cookie,
    boardPath: prepared.boardPath,
    deskCookie: desk.cookie,
  });
}

const screenFigures = (f: FirstScreenFigures) => ({
  ...Object.fromEntries(
    Object.entries(f.transfer).flatMap(([page, t]) => [
      [`firstScreen.${page}.kB`, t.kB],
      [`firstScreen.${page}.requests`, t.requests],
    ]),
  ),
  ...Object.fromEntries(
    Object.entries(f.lighthouse).flatMap(([page, a]) => [
      [`lighthouse.${page}.performance`, a.performance],
      [`lighthouse.${page}.accessibility`, a.accessibility],
      [`lighthouse.${page}.lcpMs`, a.lcpMs],
    ]),
  ),
  'lighthouse.loadAverage': f.loadAverage,
  browserSeconds: f.seconds,
});

function sayScreens(f: FirstScreenFigures) {
  const t = f.transfer;
  say(
    `first screens on the wire, empty cache: kiosk ${t.kiosk.kB} KB in ${t.kiosk.requests} requests ` +
      `(target at most 130 KB), board ${t.board.kB} KB, desk ${t.desk.kB} KB`,
  );
  for (const [page, a] of Object.entries(f.lighthouse))
    say(
      `Lighthouse ${page.padEnd(6)} performance ${a.performance}, accessibility ${a.accessibility}, ` +
        `LCP ${a.lcpMs} ms (targets 0.95, 1, under 2000 ms)`,
    );
  say(`  (load average ${f.loadAverage} during the audits; browser figures took ${f.seconds} s)`);
}

async function report(app: string, prepared: Prepared, loads: Awaited<ReturnType<typeof runLoads>>) {
  const { board, history, trends, baseline, submit } = loads;
  const bundle = entryBundleSizes();
  const screen = await kioskStartScreen(app, prepared.lcpEnrolment.enrolPath);
  const screens = await browserFigures(app, prepared);
  const ratio = Math.round((submit.rps / baseline.rps) * 100) / 100;
  const percentiles: (keyof LoadFigures)[] = ['rps', 'p50', 'p95', 'p99'];
  const results = {
    date: new Date().toISOString(),
    machine: `${cpus().length} cores, ${cpus()[0]?.model ?? 'unknown CPU'}`,
    seconds: SECONDS,
    airframes: prepared.seeded.airframes,
    checks: prepared.seeded.checks,
    readings: prepared.seeded.readings,
    seedSeconds: prepared.seedSeconds,
    ...figuresOf('submit', submit, [...percentiles, 'non2xx']),
    ...figuresOf('baseline', baseline, percentiles),
    ratio,
    p99Ratio: Math.round((submit.p99 / baseline.p99) * 100) / 100,
    ...figuresOf('board', board, percentiles),
    ...figuresOf('history', history, percentiles),
    ...figuresOf('trends', trends, ['rps', 'p95']),
    kioskJsGzipKB: screen.jsGzipKB,
    kioskCssGzipKB: screen.cssGzipKB,
    'entry.jsGzipKB': bundle.jsGzipKB,
    'entry.cssGzipKB': bundle.cssGzipKB,
    lcpMs: screen.lcpMs,
    kioskFiles: screen.files.map((f) => new URL(f).pathname),
    ...screenFigures(screens),
  };
  writeFileSync('bench-results.json', `${JSON.stringify(results, null, 2)}\n`);
  say(
    `\nsubmit / baseline throughput: ${ratio} (target at least 0.5); p99 ratio ${results.p99Ratio} (target at most 2)`,
  );
  say(
    `board p95 ${board.p95} ms (target under 30 ms); history p95 ${history.p95} ms; trends p95 ${trends.p95} ms`,
  );
  say(
    `kiosk first screen: ${screen.jsGzipKB} KB gzip JS, ${screen.cssGzipKB} KB gzip CSS ` +
      `(index.html alone: ${bundle.jsGzipKB} KB JS, ${bundle.cssGzipKB} KB CSS; target at most 150 KB JS)`,
  );
  say(`kiosk start screen LCP with 4x CPU throttling: ${screen.lcpMs} ms (target under 1500 ms)`);
  sayScreens(screens);
  say('Figures written to bench-results.json.');
}

async function main() {
  say(
    `Gaugewalk bench on ${cpus().length} cores (${cpus()[0]?.model ?? 'unknown CPU'}), ${new Date().toISOString()}`,
  );
  const db = await startLocalMariadb({
    dataDir: join(tmp, 'db'),
    port: await findFreePort(0),
    database: 'gaugewalk_bench',
    ephemeral: true,
    quiet: true,
  });
  try {
    const prepared = await prepare(db);
    const urls = await startServers(db);
    await report(urls.app, prepared, await runLoads(urls, prepared));
  } finally {
    for (const proc of children) if (proc.exitCode === null) proc.kill('SIGTERM');
    await new Promise((r) => setTimeout(r, 500));
    await db.stop();
  }
}

main()
  .then(() => {
    rmSync(tmp, { recursive: true, force: true });
    process.exit(0);
  })
  .catch((err: unknown) => {
    process.stderr.write(`\nbench failed: ${(err as Error).stack ?? String(err)}\n`);
    for (const proc of children) if (proc.exitCode === null) proc.kill('SIGKILL');
    rmSync(tmp, { recursive: true, force: true });
    process.exit(1);
  });
