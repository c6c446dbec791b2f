import { existsSync, mkdirSync, readFileSync, writeFileSync, statSync, readdirSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { spawnSync } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { findFreePort, startLocalMariadb, type LocalDatabase } from '../db/local-server';
import { startFakeObjectStore, type FakeObjectStore } from '../storage/fake-object-store';
import type { Sequelize } from 'sequelize';
import { createBoardLink, isLiveBoardToken } from '../features/board-links/board-links.service';
import { createEnrolment, pendingEnrolmentExpiry } from '../features/kiosks/kiosks.service';

/** A database for this run: DATABASE_URL when set (no server started), otherwise the private instance in the data directory. */
export async function localDatabase(dataDir: string): Promise<{ url: string; local: LocalDatabase | null }> {
  if (process.env.DATABASE_URL) {
    process.stdout.write('Using the MariaDB server at DATABASE_URL; no local server started.\n');
    return { url: process.env.DATABASE_URL, local: null };
  }
  const local = await startLocalMariadb({
    dataDir,
    port: Number(process.env.DB_PORT ?? 3307),
    database: 'gaugewalk',
  });
  return { url: local.url, local };
}

/**
 * The photo store for this run: the one PHOTO_STORE_ENDPOINT names (none started), otherwise a local fake (s3rver)
 * on loopback keeping its objects as files in DATA_DIR/objects, as the fake SMTP server catches the e-mail.
 */
export async function localPhotoStore(dataDir: string): Promise<FakeObjectStore | null> {
  if (process.env.PHOTO_STORE_ENDPOINT) return null;
  return startFakeObjectStore({
    directory: join(dataDir, 'objects'),
    port: await findFreePort(Number(process.env.PHOTO_STORE_PORT ?? 4568)),
  });
}

/** A session secret kept in the data directory, so a restart does not sign everyone out. */
export function sessionSecret(dataDir: string): string {
  if (process.env.SESSION_SECRET) return process.env.SESSION_SECRET;
  mkdirSync(dataDir, { recursive: true });
  const file = join(dataDir, 'session-secret');
  if (!existsSync(file)) writeFileSync(file, randomBytes(32).toString('hex'), { mode: 0o600 });
  return readFileSync(file, 'utf8').trim();
}

/** A link whose secret is kept in the data directory: reused while `reuse` finds it still good, else made anew. */
async function keptLink<T>(
  file: string,
  reuse: (secret: string) => Promise<T | null>,
  make: () => Promise<{ secret: string; link: T }>,
): Promise<T> {
  if (existsSync(file)) {
    const again = await reuse(readFileSync(file, 'utf8').trim());
    if (again) return again;
  }
  const { secret, link } = await make();
  writeFileSync(file, secret, { mode: 0o600 });
  return link;
}

/**
 * The links `npm start` prints are printed again at the next start while they are still good, so a hangar sets a
 * TV up once and the desk's lists do not fill with a new link per start. Only their hashes are in the database;
 * the secrets are kept in the data directory beside the session secret. The TV board link lasts until it is
 * revoked; the kiosk enrolment link until a tablet uses it or it runs out.
 */
export function printedBoardLink(sequelize: Sequelize, dataDir: string, by: number) {
  return keptLink(
    join(dataDir, 'board-link-token'),
    async (token) => ((await isLiveBoardToken(token)) ? { path: `/board?board=${token}` } : null),
    async () => {
      const created = await createBoardLink(sequelize, 'Hangar board (printed at start)', by);
      return { secret: created.token, link: { path: created.path } };
    },
  );
}

export function printedEnrolmentLink(dataDir: string, now = new Date()) {
  return keptLink(
    join(dataDir, 'enrolment-code'),
    async (code) => {
      const expiresAt = await pendingEnrolmentExpiry(code, now);
      return expiresAt ? { enrolPath: `/enrol/${code}`, expiresAt } : null;
    },
    async () => {
      const created = await createEnrolment('Demo tablet (printed at start)', null, now, 'NP');
      return { secret: created.code, link: { enrolPath: created.enrolPath, expiresAt: created.expiresAt } };
    },
  );
}

function newestMtime(path: string): number {
  const stat = statSync(path);
  if (!stat.isDirectory()) return stat.mtimeMs;
  return Math.max(stat.mtimeMs, ...readdirSync(path).map((name) => newestMtime(join(path, name))));
}

/** Builds the client when dist/ is missing or older than its sources. */
export function buildClientIfStale(root = resolve('.')): void {
  const built = join(root, 'dist', 'index.html');
  const sources = ['src', 'shared', 'public', 'index.html', 'vite.config.ts', 'tailwind.config.ts']
    .map((p) => join(root, p))
    .filter(existsSync);
  if (existsSync(built) && statSync(built).mtimeMs >= Math.max(...sources.map(newestMtime))) return;
  process.stdout.write('Building the client (vite build)...\n');
  const result = spawnSync(
    process.execPath,
    [join(root, 'node_modules', 'vite', 'bin', 'vite.js'), 'build', '--logLevel', 'warn'],
    // Always the production build, whatever NODE_ENV the caller runs with (a test run sets it to "test").
    { stdio: 'inherit', cwd: root, env: { ...process.env, NODE_ENV: 'production' } },
  );
  if (result.status !== 0) throw new Error('vite build failed; see the output above.');
}

export function onShutdown(handler: () => Promise<void>): void {
  let done = false;
  const run = (signal: string) => {
    if (done) return;
    done = true;
    process.stdout.write(`\n${signal}: stopping...\n`);
    handler().then(
      () => process.exit(0),
      (err) => {
        process.stderr.write(`${(err as Error).message}\n`);
        process.exit(1);
      },
    );
  };
  process.on('SIGINT', () => run('SIGINT'));
  process.on('SIGTERM', () => run('SIGTERM'));
}
