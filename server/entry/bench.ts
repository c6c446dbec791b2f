import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { cpus, tmpdir } from 'node:os';
import { join } from 'node:path';
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
import { benchBoardBase, seedFleet, type FleetSize } from '../db/seeders/bench-fleet';
import { load, type LoadFigures } from '../bench/load';
import { entryBundleSizes, kioskStartScreen } from '../bench/client-figures';
import { firstScreens, type FirstScreenFigures } from '../bench/first-screens';
import { createBoardLink } from '../features/board-links/board-links.service';
import { demoStaffByBadge } from '../db/seeders/demo-rows';
import { goodPreFlight as preFlight } from '@tests/setup/check-builder';

// `npm run bench`: a throw-away MariaDB with a large invented fleet, then fixed-time load on the real server and
// on a bare-connector baseline, the kiosk's bundle size and its LCP on a 4x slowed CPU. Not part of `npm test`.

const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);
const WARM_UP_SECONDS = 3;
const SIZE: FleetSize = {
  airframes: Number(process.env.BENCH_AIRFRAMES ?? 500),
  readings: Number(process.env.BENCH_READINGS ?? 1_000_000),
  days: 730,
  bases: 3,
};

/**
 * `npm run bench -- --scale 10` (or BENCH_SCALE=10): after the 1x run, a second throw-away database with ten times
 * the airframes and readings over ten bases (the demo's two and eight invented), measured the same way, written as
 * the `scale10` block of bench-results.json.
 */
function scaleAsked(): number {
  const at = process.argv.indexOf('--scale');
  const value = at >= 0 ? process.argv[at + 1] : process.env.BENCH_SCALE;
  const scale = value === undefined ? 1 : Number(value);
  if (!Number.isInteger(scale) || scale < 1 || scale > 20)
    throw new Error(`--scale takes a whole number from 1 to 20, not ${String(value)}.`);
  return scale;
}

const sizeAt = (scale: number): FleetSize =>
  scale === 1
    ? SIZE
    : { ...SIZE, airframes: SIZE.airframes * scale, readings: SIZE.readings * scale, bases: 8 };
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
async function prepare(db: LocalDatabase, size: FleetSize) {
  const sequelize = openDatabase(db.url);
  await migrate(sequelize);
  await seedDemo(sequelize, { bcryptCost: 4, withHistory: false });
  const mechanics = await benchMechanics(32, await hashSecret(PIN, 4));
  const { typeIds, limitsIds } = await typeAndLimitsIds();
  say(
    `Seeding ${size.airframes} airframes over ${size.bases + 2} bases and ${size.readings.toLocaleString('en')} ` +
      'readings over two years...',
  );
  const t0 = Date.now();
  const seeded = await seedFleet(db.url, db.socket, size, {
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
    // A hangar's TV shows its own base: the board Lighthouse opens is the one base whose board the load measures.
    boardPath: `${boardLink.path}&base=${benchBoardBase}`,
  };
}

type Prepared = Awaited<ReturnType<typeof prepare>>;

/** The app and the baseline, each in a process of its own; their base URLs. */
async function startServers(db: LocalDatabase, scale: number) {
  // A build older than its sources would measure yesterday's screens.
  buildClientIfStale();
  const [appPort, basePort] = [await findFreePort(0), await findFreePort(0)];
  await child('server/start.ts', {
    PORT: String(appPort),
    HOST: '127.0.0.1',
    DATABASE_URL: db.url,
    DATA_DIR: join(tmp, `data-${scale}`),
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

/** What Chromium sends on every request; the tablets' answers are compressed as a browser's are. */
const browserAccepts = { 'accept-encoding': 'gzip, deflate, br, zstd' };

/**
 * Fixed-time load of one kind of request; its figures are printed under `name`. A short run before it is thrown
 * away, so the figures are those of a server that has been answering (compiled code, warm caches), as a hangar's
 * server is after its first minute, and not of its first seconds.
 */
async function measure(
  name: string,
  url: string,
  connections: number,
  headersFor: (i: number) => Record<string, string>,
  request: Parameters<typeof load>[0]['requests'][number],
) {
  const withAccepts = (i: number) => ({ ...headersFor(i), ...browserAccepts });
  const options = { url, connections, headersFor: withAccepts, requests: [request] };
  await load({ ...options, seconds: WARM_UP_SECONDS });
  const figures = await load({ ...options, seconds: SECONDS });
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
  const board = await measure(`board, base ${benchBoardBase}`, app, 8, kiosk, {
    method: 'GET',
    path: `/api/airframes?base=${benchBoardBase}`,
  });
  const boardAll = await measure('board, every base', app, 8, kiosk, {
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
  say(
    '  (each signed check verifies the PIN again; the sessions signed in first, so a PIN already proven against ' +
      'its hash is compared by HMAC, not bcrypt: DEVELOPERS.md, Decisions)',
  );
  return { board, boardAll, history, trends, baseline, submit };
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

type Loads = Awaited<ReturnType<typeof runLoads>>;

/** The load figures of one run, under the names bench-results.json has always used. */
function loadFigures(prepared: Prepared, loads: Loads) {
  const { board, boardAll, history, trends, baseline, submit } = loads;
  const percentiles: (keyof LoadFigures)[] = ['rps', 'p50', 'p95', 'p99'];
  return {
    airframes: prepared.seeded.airframes,
    checks: prepared.seeded.checks,
    readings: prepared.seeded.readings,
    seedSeconds: prepared.seedSeconds,
    ...figuresOf('submit', submit, [...percentiles, 'non2xx']),
    ...figuresOf('baseline', baseline, percentiles),
    ratio: Math.round((submit.rps / baseline.rps) * 100) / 100,
    p99Ratio: Math.round((submit.p99 / baseline.p99) * 100) / 100,
    boardBase: benchBoardBase,
    ...figuresOf('board', board, percentiles),
    ...figuresOf('boardAll', boardAll, percentiles),
    ...figuresOf('history', history, percentiles),
    ...figuresOf('trends', trends, ['rps', 'p95']),
  };
}

async function report(app: string, prepared: Prepared, loads: Loads) {
  const { board, history, trends } = loads;
  const bundle = entryBundleSizes();
  const screen = await kioskStartScreen(app, prepared.lcpEnrolment.enrolPath);
  const screens = await browserFigures(app, prepared);
  const figures = loadFigures(prepared, loads);
  const { ratio } = figures;
  const results = {
    date: new Date().toISOString(),
    machine: `${cpus().length} cores, ${cpus()[0]?.model ?? 'unknown CPU'}`,
    seconds: SECONDS,
    ...figures,
    kioskJsGzipKB: screen.jsGzipKB,
    kioskCssGzipKB: screen.cssGzipKB,
    'entry.jsGzipKB': bundle.jsGzipKB,
    'entry.cssGzipKB': bundle.cssGzipKB,
    lcpMs: screen.lcpMs,
    kioskFiles: screen.files.map((f) => new URL(f).pathname),
    ...screenFigures(screens),
  };
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
  return results;
}

/** One size's run on a database of its own: seed, serve, load; the browser figures only in the 1x run. */
async function runAt(scale: number): Promise<Record<string, unknown>> {
  say(scale === 1 ? '\n== 1x' : `\n== ${scale}x`);
  const db = await startLocalMariadb({
    dataDir: join(tmp, `db-${scale}`),
    port: await findFreePort(0),
    database: 'gaugewalk_bench',
    ephemeral: true,
    quiet: true,
  });
  const first = children.length;
  try {
    const prepared = await prepare(db, sizeAt(scale));
    const urls = await startServers(db, scale);
    const loads = await runLoads(urls, prepared);
    if (scale === 1) return await report(urls.app, prepared, loads);
    const figures: Record<string, unknown> = loadFigures(prepared, loads);
    say(
      `${scale}x: board (base ${benchBoardBase}) p95 ${String(figures['board.p95'])} ms (target under 30 ms); ` +
        `submit / baseline ${String(figures.ratio)} (target at least 0.5)`,
    );
    return figures;
  } finally {
    for (const proc of children.slice(first)) if (proc.exitCode === null) proc.kill('SIGTERM');
    await new Promise((r) => setTimeout(r, 500));
    await db.stop();
  }
}

async function main() {
  const scale = scaleAsked();
  say(
    `Gaugewalk bench on ${cpus().length} cores (${cpus()[0]?.model ?? 'unknown CPU'}), ${new Date().toISOString()}`,
  );
  const results: Record<string, unknown> = await runAt(1);
  if (scale > 1) {
    const scaled = await runAt(scale);
    // How each figure grows from the 1x run to this one, both measured in this run on this machine.
    const growth = (key: string) =>
      Math.round(((scaled[key] as number) / (results[key] as number)) * 100) / 100;
    results[`scale${scale}`] = {
      ...scaled,
      'growth.board.p95': growth('board.p95'),
      'growth.history.p95': growth('history.p95'),
      'growth.trends.p95': growth('trends.p95'),
      'growth.ratio': growth('ratio'),
    };
    say(
      `\n${scale}x against 1x in this run: board p95 x${growth('board.p95')}, history p95 x${growth('history.p95')} ` +
        `and trends p95 x${growth('trends.p95')} (targets at most 1.5), submit ratio ${String(scaled.ratio)}`,
    );
  }
  writeFileSync('bench-results.json', `${JSON.stringify(results, null, 2)}\n`);
  say('Figures written to bench-results.json.');
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
