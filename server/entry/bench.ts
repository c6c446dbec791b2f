import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { cpus, tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { randomUUID } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { findFreePort, startLocalMariadb } from '../db/local-server';
import { createSequelize } from '../db/connection';
import { AircraftType, Airframe, LimitsVersion, Staff, initModels } from '../db/models';
import { migrate } from '../db/migrate';
import { seedDemo } from '../demo/demo-seed';
import { hashSecret } from '../security/hashing';
import { createEnrolment, redeemEnrolment } from '../features/kiosks/kiosks.service';
import { KIOSK_COOKIE } from '../middleware/kiosk-device';
import { buildClientIfStale } from './local-environment';
import { seedFleet } from '../bench/seed-fleet';
import { load, type LoadFigures } from '../bench/load';
import { entryBundleSizes, kioskStartScreen } from '../bench/client-figures';

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

/** A session of its own (cookie jar of two cookies and the CSRF token), as a tablet or a desk browser has. */
async function signIn(base: string, path: string, body: object, deviceToken?: string) {
  const cookies = new Map<string, string>();
  if (deviceToken) cookies.set(KIOSK_COOKIE, deviceToken);
  let csrf = '';
  const call = async (method: string, url: string, payload?: object) => {
    const res = await fetch(`${base}${url}`, {
      method,
      headers: {
        cookie: [...cookies].map(([k, v]) => `${k}=${v}`).join('; '),
        'content-type': 'application/json',
        'x-csrf-token': csrf,
      },
      body: payload ? JSON.stringify(payload) : undefined,
    });
    for (const line of res.headers.getSetCookie()) {
      const [pair] = line.split(';');
      const at = pair!.indexOf('=');
      cookies.set(pair!.slice(0, at), pair!.slice(at + 1));
    }
    const json = (await res.json()) as { csrfToken?: string };
    if (json.csrfToken) csrf = json.csrfToken;
    if (!res.ok) throw new Error(`${method} ${url}: ${res.status} ${JSON.stringify(json)}`);
  };
  await call('GET', '/api/session');
  await call('POST', path, body);
  return {
    cookie: [...cookies].map(([k, v]) => `${k}=${v}`).join('; '),
    'x-csrf-token': csrf,
    'content-type': 'application/json',
  };
}

const preFlight = {
  context: { attitude: 'on_wheels', systemPressure: 'relieved', ambientTempC: 20 },
  readings: [
    { code: 'sys1.level', entry: { value: 7.0, unit: 'L' } },
    { code: 'sys2.level', entry: { value: 4.5, unit: 'L' } },
    { code: 'brake.precharge', entry: { value: 45, unit: 'bar' } },
    { code: 'sys1.filter_bypass', entry: { answer: false } },
    { code: 'sys2.filter_bypass', entry: { answer: false } },
    { code: 'sys1.leaks', entry: { answer: false } },
    { code: 'sys2.leaks', entry: { answer: false } },
    { code: 'brakes.leaks', entry: { answer: false } },
  ],
};

const line = (name: string, f: LoadFigures) =>
  `${name.padEnd(22)} ${String(f.rps).padStart(8)} rps   p50 ${String(f.p50).padStart(6)} ms   p95 ${String(
    f.p95,
  ).padStart(6)} ms   p99 ${String(f.p99).padStart(6)} ms   (${f.connections} conn, ${f.requests} req, ${
    f.non2xx
  } non-2xx, ${f.errors} errors)`;

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
  const stopDb = db.stop;
  try {
    const sequelize = createSequelize(db.url);
    initModels(sequelize);
    await migrate(sequelize);
    await seedDemo(sequelize, { bcryptCost: 4, withHistory: false });
    const mechanics = await Staff.bulkCreate(
      await Promise.all(
        Array.from({ length: 32 }, async (_, i) => ({
          badgeNumber: `9${String(i).padStart(3, '0')}`,
          name: `Bench mechanic ${i + 1}`,
          licenceNumber: `BENCH-${i + 1}`,
          roles: 'mechanic',
          pinHash: await hashSecret(PIN, 4),
          passwordHash: null,
          lockedUntil: null,
        })),
      ),
    );
    const types = await AircraftType.findAll();
    const limits = await LimitsVersion.findAll();
    const typeIds = new Map(types.map((t) => [t.code, t.id]));
    const limitsIds = new Map(types.map((t) => [t.code, limits.find((l) => l.typeId === t.id)!.id]));

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

    const fleet = await Airframe.findAll({ where: { typeId: typeIds.get('RX-4')! }, attributes: ['id'] });
    const rx4 = fleet.map((a) => a.id);
    const allIds = (await Airframe.findAll({ attributes: ['id'] })).map((a) => a.id);
    const explain = await sequelize.query<Record<string, unknown>>(
      `EXPLAIN SELECT c.id, c.airframe_id, c.kind, c.verdict, c.signed_at, c.signed_by
         FROM checks c
         JOIN (SELECT airframe_id, kind, MAX(signed_at) AS signed_at
                 FROM checks WHERE airframe_id IN (:ids) GROUP BY airframe_id, kind) latest
           ON latest.airframe_id = c.airframe_id AND latest.kind = c.kind AND latest.signed_at = c.signed_at`,
      { replacements: { ids: allIds }, type: QueryTypes.SELECT },
    );
    say('EXPLAIN of the board query (latest check of each kind per airframe):');
    for (const row of explain)
      say(
        `  ${row.select_type} ${row.table} type=${row.type} key=${row.key} rows=${row.rows} ${row.Extra ?? ''}`,
      );

    const kiosks = await Promise.all(
      mechanics.map(async (m) => ({
        badge: m.badgeNumber,
        ...(await redeemEnrolment((await createEnrolment(`Bench ${m.id}`, null)).code)),
      })),
    );
    const lcpEnrolment = await createEnrolment('Bench LCP tablet', null);
    await sequelize.close();

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
    const app = `http://127.0.0.1:${appPort}`;
    const sessions: Record<string, string>[] = [];
    for (const k of kiosks)
      sessions.push(await signIn(app, '/api/auth/kiosk', { badge: k.badge, pin: PIN }, k.token));
    const desk = await signIn(app, '/api/auth/desk', { badge: '5201', password: 'north-pad-lead' });
    const pick = (ids: number[]) => ids[Math.floor(Math.random() * ids.length)]!;
    const rx4Limits = limitsIds.get('RX-4')!;

    say(`\nLoad, ${SECONDS} s each:`);
    const board = await load({
      url: app,
      connections: 8,
      seconds: SECONDS,
      headersFor: (i) => sessions[i % sessions.length]!,
      requests: [{ method: 'GET', path: '/api/airframes' }],
    });
    say(line('board (GET /api/airframes)', board));
    const history = await load({
      url: app,
      connections: 8,
      seconds: SECONDS,
      headersFor: () => desk,
      requests: [
        {
          method: 'GET',
          setupRequest: (req) => ({ ...req, path: `/api/records?airframeId=${pick(rx4)}&pageSize=50` }),
        },
      ],
    });
    say(line('history (records, 50)', history));
    const trends = await load({
      url: app,
      connections: 8,
      seconds: SECONDS,
      headersFor: () => desk,
      requests: [
        {
          method: 'GET',
          setupRequest: (req) => ({ ...req, path: `/api/trends?airframeId=${pick(rx4)}&days=90` }),
        },
      ],
    });
    say(line('trends (90 days)', trends));
    const baseline = await load({
      url: `http://127.0.0.1:${basePort}`,
      connections: 32,
      seconds: SECONDS,
      headersFor: () => ({ 'content-type': 'application/json' }),
      requests: [
        {
          method: 'POST',
          path: '/baseline/checks',
          setupRequest: (req) => ({
            ...req,
            body: JSON.stringify({
              airframeId: pick(rx4),
              limitsVersionId: rx4Limits,
              signerId: mechanics[0]!.id,
              ...preFlight,
            }),
          }),
        },
      ],
    });
    say(line('baseline (bare conn.)', baseline));
    const submit = await load({
      url: app,
      connections: 32,
      seconds: SECONDS,
      headersFor: (i) => sessions[i % sessions.length]!,
      requests: [
        {
          method: 'POST',
          path: '/api/checks',
          setupRequest: (req) => ({
            ...req,
            body: JSON.stringify({
              id: randomUUID(),
              airframeId: pick(rx4),
              kind: 'pre_flight',
              limitsVersionId: rx4Limits,
              pin: PIN,
              ...preFlight,
            }),
          }),
        },
      ],
    });
    say(line('submit (signed check)', submit));
    say('  (each signed check verifies the PIN again: one bcrypt comparison by design; BCRYPT_COST=4 here)');

    const bundle = entryBundleSizes();
    const screen = await kioskStartScreen(app, lcpEnrolment.enrolPath);
    const ratio = Math.round((submit.rps / baseline.rps) * 100) / 100;
    const results = {
      date: new Date().toISOString(),
      machine: `${cpus().length} cores, ${cpus()[0]?.model ?? 'unknown CPU'}`,
      seconds: SECONDS,
      airframes: seeded.airframes,
      checks: seeded.checks,
      readings: seeded.readings,
      seedSeconds,
      'submit.rps': submit.rps,
      'submit.p50': submit.p50,
      'submit.p95': submit.p95,
      'submit.p99': submit.p99,
      'submit.non2xx': submit.non2xx,
      'baseline.rps': baseline.rps,
      'baseline.p50': baseline.p50,
      'baseline.p95': baseline.p95,
      'baseline.p99': baseline.p99,
      ratio,
      p99Ratio: Math.round((submit.p99 / baseline.p99) * 100) / 100,
      'board.rps': board.rps,
      'board.p50': board.p50,
      'board.p95': board.p95,
      'board.p99': board.p99,
      'history.rps': history.rps,
      'history.p50': history.p50,
      'history.p95': history.p95,
      'history.p99': history.p99,
      'trends.rps': trends.rps,
      'trends.p95': trends.p95,
      kioskJsGzipKB: screen.jsGzipKB,
      kioskCssGzipKB: screen.cssGzipKB,
      'entry.jsGzipKB': bundle.jsGzipKB,
      'entry.cssGzipKB': bundle.cssGzipKB,
      lcpMs: screen.lcpMs,
      kioskFiles: screen.files.map((f) => new URL(f).pathname),
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
    say('Figures written to bench-results.json.');
  } finally {
    for (const proc of children) if (proc.exitCode === null) proc.kill('SIGTERM');
    await new Promise((r) => setTimeout(r, 500));
    await stopDb();
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
