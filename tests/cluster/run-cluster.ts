import { spawn, type ChildProcess } from 'node:child_process';
import { chmodSync, createWriteStream, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { randomBytes } from 'node:crypto';
import { startGaleraCluster, type GaleraCluster } from '../../server/db/galera-cluster';
import { findFreePort } from '../../server/db/local-server';
import { startFakeObjectStore, type FakeObjectStore } from '../../server/storage/fake-object-store';
import { jfifJpeg } from '../setup/images';
import { preFlightBody } from '../setup/check-builder';
import { HttpClient, uploadPhoto, watchBoard, type Answer } from './http-client';
import { seedFleet, type Fleet } from './seed';

// `npm run test:cluster` (issue 16): a three-node Galera cluster on loopback ports, two app instances each on its
// own node and one s3rver for both, 500 checks from 20 tablets split across both instances with resends, a photo
// with every fifth check (uploaded through one instance, signed through the other), one database node SIGKILLed
// in the middle and started again. Then: every check stored exactly once on every node, every photo reads back the
// same through both instances, the audit trail verifies through both, a board stream on B heard of a check stored
// through A within 5 s, and every 5xx a tablet got was recovered by its resend. Prints one PASS or FAIL line; exits 1 on failure.

const TABLETS = 20;
const CHECKS_PER_TABLET = 25;
const KILL_AFTER = 200;
const root = resolve('.');
const tmp = mkdtempSync(join(tmpdir(), 'gaugewalk-cluster-'));
// The database nodes run as mysql, which must reach their folders inside.
chmodSync(tmp, 0o755);
const sleep = (ms: number) => new Promise((ok) => setTimeout(ok, ms));
const say = (line: string) => process.stdout.write(`[cluster test] ${line}\n`);

interface App {
  name: string;
  url: string;
  child: ChildProcess;
  log: string;
}

async function startApp(
  name: string,
  databaseUrl: string,
  secret: string,
  store: FakeObjectStore,
): Promise<App> {
  const port = await findFreePort(0);
  const log = join(tmp, `app-${name}.log`);
  const out = createWriteStream(log);
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/start.ts'], {
    cwd: root,
    stdio: ['ignore', 'pipe', 'pipe'],
    env: {
      ...process.env,
      NODE_ENV: 'test',
      HOST: '127.0.0.1',
      PORT: String(port),
      DATABASE_URL: databaseUrl,
      SESSION_SECRET: secret,
      DATA_DIR: join(tmp, `app-${name}`),
      LOG_LEVEL: 'warn',
      BCRYPT_COST: '4',
      KIOSK_IDLE_SECONDS: '3600',
      SIGN_IN_RATE_PER_MINUTE: '100000',
      ...store.env,
    },
  });
  child.stderr!.pipe(out);
  const listening = new Promise<void>((ok, fail) => {
    let text = '';
    child.stdout!.on('data', (chunk: Buffer) => {
      out.write(chunk);
      text += chunk.toString();
      if (text.includes('listening')) ok();
    });
    child.once('exit', (code) =>
      fail(new Error(`app ${name} exited (${code}) before listening; see ${log}`)),
    );
  });
  await Promise.race([
    listening,
    sleep(120_000).then(() => {
      throw new Error(`app ${name} did not listen within 120 s`);
    }),
  ]);
  say(`app instance ${name} listening on 127.0.0.1:${port}`);
  return { name, url: `http://127.0.0.1:${port}`, child, log };
}

async function stopApp(app: App) {
  if (app.child.exitCode !== null || app.child.signalCode !== null) return;
  const gone = new Promise((ok) => app.child.once('exit', ok));
  app.child.kill('SIGTERM');
  await Promise.race([gone, sleep(10_000)]);
  if (app.child.exitCode === null && app.child.signalCode === null) app.child.kill('SIGKILL');
}

/** Where the run is, to say when the 5xx answers came. */
let phase = 'before the kill';
const errorsSeen = new Map<string, number>();
const seen = (what: string) =>
  errorsSeen.set(`${phase}: ${what}`, (errorsSeen.get(`${phase}: ${what}`) ?? 0) + 1);

interface Outcome {
  stored: boolean;
  serverErrors: number;
  networkErrors: number;
  replay: boolean;
  refused: string | null;
}

/**
 * Sends a check the way the kiosk's queue does: the same id again after a 5xx or a lost connection, here to the
 * other instance in turn (as a load balancer moves a tablet off an instance that fails), for up to two minutes.
 */
async function deliver(tablet: HttpClient, body: unknown, order: string[]): Promise<Outcome> {
  const outcome: Outcome = { stored: false, serverErrors: 0, networkErrors: 0, replay: false, refused: null };
  const deadline = Date.now() + 120_000;
  for (let attempt = 0; Date.now() < deadline; attempt += 1) {
    let res: Answer | undefined;
    try {
      res = await tablet.post(order[attempt % order.length]!, '/api/checks', body);
    } catch {
      outcome.networkErrors += 1;
      seen('no answer');
    }
    if (res?.status === 201) return { ...outcome, stored: true, replay: res.replay };
    if (res && res.status < 500) return { ...outcome, refused: `${res.status} ${String(res.body.code)}` };
    if (res) {
      outcome.serverErrors += 1;
      seen(`${res.status} ${String(res.body.code)}`);
    }
    await sleep(Math.min(250 * (attempt + 1), 2_000));
  }
  return outcome;
}

/** Uploads a photo the way the kiosk does, again through the next instance after a 5xx or a lost connection. */
async function deliverPhoto(tablet: HttpClient, bytes: Buffer, order: string[]) {
  const deadline = Date.now() + 120_000;
  for (let attempt = 0; Date.now() < deadline; attempt += 1) {
    try {
      const res = await uploadPhoto(tablet, order[attempt % order.length]!, bytes, 'image/jpeg');
      if (res.status === 201) return { id: String(res.body.id), refused: null };
      if (res.status < 500) return { id: null, refused: `${res.status} ${String(res.body.code)}` };
      seen(`photo ${res.status} ${String(res.body.code)}`);
    } catch {
      seen('photo: no answer');
    }
    await sleep(Math.min(250 * (attempt + 1), 2_000));
  }
  return { id: null, refused: 'no answer within two minutes' };
}

interface Run {
  fleet: Fleet;
  a: App;
  b: App;
  cluster: GaleraCluster;
}

/** The signed-in tablets: each signs its mechanic in on its home instance. */
async function signedInTablets({ fleet, a, b }: Run) {
  return Promise.all(
    fleet.tablets.map(async (t, i) => {
      const client = new HttpClient({ gw_kiosk: t.kioskToken });
      const home = i % 2 === 0 ? a.url : b.url;
      const res = await client.post(home, '/api/auth/kiosk', { badge: t.badge, pin: t.pin });
      if (res.status !== 200) throw new Error(`tablet ${i + 1} could not sign in: ${res.status}`);
      return { client, home, other: home === a.url ? b.url : a.url, ...t };
    }),
  );
}

/** A board stream on B, and a check signed through A: how long until B's stream heard of it. */
async function boardProbe(run: Run, tablet: Awaited<ReturnType<typeof signedInTablets>>[number]) {
  const desk = new HttpClient();
  const signIn = await desk.post(run.a.url, '/api/auth/desk', run.fleet.engineer);
  if (signIn.status !== 200) throw new Error(`the engineer could not sign in: ${signIn.status}`);
  const heard: number[] = [];
  const stream = await watchBoard(run.b.url, desk.cookieHeader, (at) => heard.push(at));
  await sleep(1_500);
  const body = preFlightBody(tablet.airframeId, run.fleet.limitsId, tablet.pin);
  const res = await tablet.client.post(run.a.url, '/api/checks', body);
  const storedAt = performance.now();
  if (res.status !== 201) throw new Error(`the probe check answered ${res.status}`);
  while (heard.every((at) => at < storedAt) && performance.now() - storedAt < 10_000) await sleep(50);
  await stream.stop();
  const first = heard.find((at) => at >= storedAt);
  return { id: body.id, latencyMs: first === undefined ? null : Math.round(first - storedAt), desk };
}

interface Tally {
  planned: string[];
  outcomes: Outcome[];
  done: number;
  photos: { id: string; bytes: Buffer }[];
  photoRefusals: string[];
}

/** One tablet's checks: some sent to both instances at once, some sent again after their answer came. */
async function tabletRun(
  run: Run,
  tablet: Awaited<ReturnType<typeof signedInTablets>>[number],
  tally: Tally,
  skip: number,
) {
  for (let k = skip; k < CHECKS_PER_TABLET; k += 1) {
    const body = preFlightBody(tablet.airframeId, run.fleet.limitsId, tablet.pin);
    tally.planned.push(body.id);
    const homeFirst = [tablet.home, tablet.other];
    if (k % 5 === 1) {
      // A photo of the leak check, uploaded through the other instance: the check that names it is signed at home.
      const bytes = jfifJpeg(randomBytes(2_048));
      const photo = await deliverPhoto(tablet.client, bytes, [tablet.other, tablet.home]);
      if (photo.id) {
        body.readings[5] = { ...body.readings[5]!, photoIds: [photo.id] };
        tally.photos.push({ id: photo.id, bytes });
      } else tally.photoRefusals.push(photo.refused ?? 'refused');
    }
    if (k % 6 === 3) {
      // The same check sent through both instances at the same moment: two nodes race for one id.
      const both = await Promise.all([
        deliver(tablet.client, body, homeFirst),
        deliver(tablet.client, body, [tablet.other, tablet.home]),
      ]);
      tally.outcomes.push(...both);
    } else {
      tally.outcomes.push(await deliver(tablet.client, body, homeFirst));
      // The answer was lost on the way: the queue sends it again, through the other instance.
      if (k % 10 === 7)
        tally.outcomes.push({ ...(await deliver(tablet.client, body, [tablet.other, tablet.home])) });
    }
    tally.done += 1;
  }
}

const idList = (ids: string[]) => ids.map((id) => `'${id}'`).join(',');

/** What every node holds for the planned checks, whether every photo reads back through both instances, and whether
 * both instances verify the trail. */
async function verify(run: Run, planned: string[], photos: Tally['photos'], desk: HttpClient) {
  const problems: string[] = [];
  for (const app of [run.a, run.b]) {
    let same = 0;
    for (const photo of photos) {
      const res = await desk.bytes(app.url, `/api/photos/${photo.id}`);
      if (res.status === 200 && res.bytes.equals(photo.bytes)) same += 1;
    }
    say(`photos through ${app.name}: ${same} of ${photos.length} read back byte for byte`);
    if (same !== photos.length)
      problems.push(`${photos.length - same} photos do not read back through ${app.name}`);
  }
  for (const node of run.cluster.nodes) {
    const [checks, distinct, readings, events] = run.cluster
      .sql(
        node,
        `SELECT (SELECT COUNT(*) FROM gaugewalk.checks WHERE id IN (${idList(planned)})),
                (SELECT COUNT(DISTINCT id) FROM gaugewalk.checks WHERE id IN (${idList(planned)})),
                (SELECT COUNT(*) FROM gaugewalk.readings WHERE check_id IN (${idList(planned)})),
                (SELECT COUNT(*) FROM gaugewalk.audit_events WHERE action = 'check.signed' AND entity_id IN (${idList(planned)}))`,
      )
      .split('\t')
      .map(Number);
    say(
      `${node.name}: ${checks} checks (${distinct} ids), ${readings} readings, ${events} check.signed events`,
    );
    if (checks !== planned.length || distinct !== planned.length)
      problems.push(`${node.name} holds ${checks} of ${planned.length} checks`);
    if (readings !== planned.length * 8)
      problems.push(`${node.name} holds ${readings} readings, not ${planned.length * 8}`);
    if (events !== planned.length)
      problems.push(`${node.name} holds ${events} check.signed events, not ${planned.length}`);
  }
  for (const app of [run.a, run.b]) {
    const res = await desk.get(app.url, '/api/audit/verify');
    say(
      `audit trail through ${app.name}: ${res.status} ok=${String(res.body.ok)}, ${String(res.body.events)} events`,
    );
    if (res.status !== 200 || res.body.ok !== true)
      problems.push(`the audit trail does not verify through ${app.name}`);
  }
  return problems;
}

/** The errors an instance logged (its 5xx answers), counted by message, for the summary. */
function loggedErrors(app: App) {
  const counts = new Map<string, number>();
  for (const line of readFileSync(app.log, 'utf8').split('\n')) {
    if (!line.startsWith('{')) continue;
    const entry = JSON.parse(line) as {
      level?: number;
      url?: string;
      err?: { message?: string; errno?: number; triedTimes?: number };
    };
    if ((entry.level ?? 0) < 50) continue;
    const tried = entry.err?.triedTimes ? `, after ${entry.err.triedTimes} tries` : ', not retried';
    const why = entry.err?.errno
      ? `error ${entry.err.errno}${tried}`
      : (entry.err?.message ?? '').slice(0, 60);
    const what = `${entry.url?.split('?')[0] ?? ''} ${why}`;
    counts.set(what, (counts.get(what) ?? 0) + 1);
  }
  return [...counts].sort((x, y) => y[1] - x[1]).slice(0, 6);
}

async function main(cluster: GaleraCluster, apps: App[], store: FakeObjectStore) {
  const [n1, n2] = cluster.nodes;
  const secret = randomBytes(24).toString('hex');
  const a = await startApp('A', cluster.urlOf(n1!), secret, store);
  apps.push(a);
  const b = await startApp('B', cluster.urlOf(n2!), secret, store);
  apps.push(b);
  const fleet = await seedFleet(cluster.urlOf(n1!), TABLETS);
  const run: Run = { fleet, a, b, cluster };
  const tablets = await signedInTablets(run);
  const probe = await boardProbe(run, tablets[0]!);
  say(`board stream on B heard of a check stored through A after ${probe.latencyMs ?? 'never'} ms`);

  const tally: Tally = { planned: [probe.id], outcomes: [], done: 1, photos: [], photoRefusals: [] };
  let restarted: Promise<void> | undefined;
  const killer = (async () => {
    while (tally.done < KILL_AFTER) await sleep(100);
    say(`SIGKILL ${n2!.name} (under instance B) after ${tally.done} checks`);
    cluster.kill(n2!);
    phase = 'node down';
    await sleep(5_000);
    phase = 'node rejoining';
    say(`starting ${n2!.name} again; it rejoins by state transfer`);
    restarted = cluster.restart(n2!);
    await restarted;
    phase = 'after the rejoin';
    say(`${n2!.name} is synced again (cluster of ${cluster.status(n2!).size})`);
  })();
  const started = performance.now();
  await Promise.all(tablets.map((t, i) => tabletRun(run, t, tally, i === 0 ? 1 : 0)));
  const seconds = (performance.now() - started) / 1000;
  say(`${tally.planned.length} checks from ${TABLETS} tablets in ${seconds.toFixed(1)} s`);
  await Promise.race([killer, sleep(240_000)]);
  if (!restarted) throw new Error('the node was never killed: the run ended before the kill point');

  const problems = await verify(run, tally.planned, tally.photos, probe.desk);
  if (tally.photoRefusals.length > 0)
    problems.push(
      `${tally.photoRefusals.length} photo uploads refused: ${[...new Set(tally.photoRefusals)].join(', ')}`,
    );
  const errors = tally.outcomes.reduce((n, o) => n + o.serverErrors + o.networkErrors, 0);
  const lost = tally.outcomes.filter((o) => !o.stored);
  say(
    `5xx answers or lost connections: ${errors}, all recovered by a resend: ${lost.length === 0 ? 'yes' : 'no'}`,
  );
  for (const [what, n] of errorsSeen) say(`  ${what}: ${n}`);
  for (const app of [a, b])
    for (const [what, n] of loggedErrors(app)) say(`  logged by ${app.name}: ${n} x ${what}`);
  say(`resends answered from the stored record: ${tally.outcomes.filter((o) => o.replay).length}`);
  for (const node of cluster.nodes) {
    const [conflicts, aborts] = cluster
      .sql(
        node,
        "SELECT VARIABLE_VALUE FROM information_schema.GLOBAL_STATUS WHERE VARIABLE_NAME IN ('WSREP_LOCAL_CERT_FAILURES', 'WSREP_LOCAL_BF_ABORTS') ORDER BY VARIABLE_NAME DESC",
      )
      .split('\n');
    say(
      `${node.name}: ${conflicts} certification failures, ${aborts} transactions aborted by a replicated write`,
    );
  }
  if (lost.length > 0)
    problems.push(
      `${lost.length} sends never stored: ${[...new Set(lost.map((o) => o.refused ?? 'no answer'))].join(', ')}`,
    );
  if (probe.latencyMs === null || probe.latencyMs > 5_000)
    problems.push(`board stream on B: ${probe.latencyMs ?? 'never'} ms`);
  const status = cluster.nodes.map((n) => cluster.status(n));
  if (status.some((s) => s.size !== 3 || s.state !== 'Synced'))
    problems.push(`cluster not whole at the end: ${JSON.stringify(status)}`);
  return problems;
}

const began = performance.now();
let cluster: GaleraCluster | undefined;
let store: FakeObjectStore | undefined;
const apps: App[] = [];
let code = 1;
try {
  cluster = await startGaleraCluster(join(tmp, 'galera'), 'gaugewalk');
  store = await startFakeObjectStore({ directory: join(tmp, 'objects'), port: await findFreePort(0) });
  const problems = await main(cluster, apps, store);
  const seconds = Math.round((performance.now() - began) / 1000);
  if (problems.length === 0) {
    process.stdout.write(`cluster test: PASS (${seconds} s)\n`);
    code = 0;
  } else {
    process.stdout.write(
      `cluster test: FAIL (${seconds} s)\n${problems.map((p) => `  - ${p}`).join('\n')}\n`,
    );
  }
} catch (err) {
  process.stdout.write(`cluster test: FAIL: ${(err as Error).message}\n`);
  for (const app of apps) {
    process.stdout.write(
      `--- last lines of app ${app.name}:\n${readFileSync(app.log, 'utf8').split('\n').slice(-15).join('\n')}\n`,
    );
  }
} finally {
  for (const app of apps) await stopApp(app);
  await cluster?.stop();
  await store?.stop();
  rmSync(tmp, { recursive: true, force: true });
}
process.exit(code);
