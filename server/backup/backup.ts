import { spawn } from 'node:child_process';
import { createHash } from 'node:crypto';
import {
  copyFileSync,
  createReadStream,
  createWriteStream,
  existsSync,
  mkdirSync,
  readFileSync,
  mkdtempSync,
  readdirSync,
  rmSync,
  statSync,
  writeFileSync,
} from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, relative, resolve, sep } from 'node:path';
import { ensureMariadbInstalled } from '../db/local-server';
import { photoTypeOfName, type PhotoStore } from '../storage/photo-store';

export interface DatabaseTarget {
  host: string;
  port: number;
  user: string;
  password: string;
  database: string;
}

export interface ManifestFile {
  path: string;
  bytes: number;
  sha256: string;
  /** For an object of the photo store: its content type, given back to it on restore. */
  contentType?: string;
}

export interface Manifest {
  format: 'gaugewalk-backup/1';
  createdAt: string;
  database: string;
  dump: string;
  files: ManifestFile[];
}

export function parseDatabaseUrl(url: string): DatabaseTarget {
  const u = new URL(url);
  return {
    host: u.hostname,
    port: Number(u.port || 3306),
    user: decodeURIComponent(u.username),
    password: decodeURIComponent(u.password),
    database: decodeURIComponent(u.pathname.replace(/^\//, '')),
  };
}

function tools() {
  const { client } = ensureMariadbInstalled();
  const dir = dirname(client);
  const dump = ['mariadb-dump', 'mysqldump'].map((n) => join(dir, n)).find(existsSync);
  if (!dump) throw new Error(`mariadb-dump was not found next to ${client}; install mariadb-client.`);
  return { client, dump };
}

const connectionArgs = (t: DatabaseTarget) => [
  '--no-defaults',
  `--host=${t.host}`,
  `--port=${t.port}`,
  `--user=${t.user}`,
  '--protocol=TCP',
  '--default-character-set=utf8mb4',
];

/** Runs a MariaDB client tool; the password goes through the environment, never the command line. */
function runTool(
  command: string,
  args: string[],
  target: DatabaseTarget,
  io: { stdinFile?: string; stdoutFile?: string; input?: string } = {},
): Promise<string> {
  return new Promise((ok, fail) => {
    const child = spawn(command, args, {
      env: { ...process.env, MYSQL_PWD: target.password },
      stdio: ['pipe', 'pipe', 'pipe'],
    });
    let out = '';
    let err = '';
    // The file is complete only when its stream has flushed, which can be after the tool has exited: hashing it
    // at exit gave the manifest the hash of a partly written dump on a busy machine.
    const sink = io.stdoutFile ? createWriteStream(io.stdoutFile) : null;
    const written = new Promise<void>((done, broken) => {
      if (!sink) return done();
      sink.once('finish', done);
      sink.once('error', broken);
    });
    if (sink) child.stdout.pipe(sink);
    else child.stdout.on('data', (c: Buffer) => (out += c.toString()));
    child.stderr.on('data', (c: Buffer) => (err += c.toString()));
    if (io.stdinFile) createReadStream(io.stdinFile).pipe(child.stdin);
    else child.stdin.end(io.input ?? '');
    child.once('error', fail);
    child.once('close', (code) => {
      // The dump is whole only once the file has been written to the end, so a 0 exit waits for that too.
      if (code === 0) void written.then(() => ok(out), fail);
      else fail(new Error(`${command} failed (${code}): ${err.trim()}`));
    });
  });
}

const sha256File = (path: string) => createHash('sha256').update(readFileSync(path)).digest('hex');

function filesUnder(root: string): string[] {
  if (!existsSync(root)) return [];
  return readdirSync(root, { withFileTypes: true }).flatMap((entry) => {
    const full = join(root, entry.name);
    return entry.isDirectory() ? filesUnder(full) : entry.isFile() ? [full] : [];
  });
}

const stamp = (d: Date) =>
  d
    .toISOString()
    .replace(/[-:]/g, '')
    .replace(/\.\d+Z$/, 'Z');

/** A key of the bucket as a path inside the backup folder; null for one that would leave it. */
function insideFolder(folder: string, key: string): string | null {
  const to = resolve(folder, key);
  return key.startsWith('photos/') && to.startsWith(join(folder, 'photos') + sep) ? to : null;
}

/**
 * Every photo object of the bucket, and any photo file still in DATA_DIR/photos that `npm run photos:migrate` has
 * not moved yet, into `photos/` of the backup. The content types of the objects, by path.
 */
async function copyPhotos(folder: string, store: PhotoStore, dataDir: string) {
  const types = new Map<string, string>();
  for await (const key of store.keys('photos/')) {
    const to = insideFolder(folder, key);
    if (!to) throw new Error(`The photo store holds a key the backup cannot name as a file: ${key}`);
    const object = await store.get(key);
    if (!object) continue; // deleted between the listing and the read
    mkdirSync(dirname(to), { recursive: true });
    writeFileSync(to, object.bytes);
    if (object.contentType) types.set(key, object.contentType);
  }
  const photoRoot = resolve(dataDir, 'photos');
  for (const file of filesUnder(photoRoot)) {
    const to = join(folder, 'photos', relative(photoRoot, file));
    if (!existsSync(to)) copyFileSync(file, to);
  }
  return types;
}

/**
 * A consistent dump of the database (one transaction, so checks, readings and the trail agree) and a copy of the
 * photo bucket, in a new timestamped folder under `outRoot`, with a manifest of every file's SHA-256.
 */
export async function backup(options: {
  databaseUrl: string;
  store: PhotoStore;
  dataDir: string;
  outRoot: string;
  now?: Date;
}) {
  const target = parseDatabaseUrl(options.databaseUrl);
  const { dump } = tools();
  const createdAt = options.now ?? new Date();
  const folder = resolve(options.outRoot, `gaugewalk-${stamp(createdAt)}`);
  if (existsSync(folder)) throw new Error(`${folder} already exists.`);
  mkdirSync(join(folder, 'photos'), { recursive: true });
  await runTool(
    dump,
    [
      ...connectionArgs(target),
      '--single-transaction',
      '--routines',
      '--triggers',
      '--events',
      '--hex-blob',
      '--no-tablespaces',
      '--skip-lock-tables',
      target.database,
    ],
    target,
    { stdoutFile: join(folder, 'database.sql') },
  );
  // A photo is stored before the row that names it, so every photo the dump knows is in the bucket by now.
  const types = await copyPhotos(folder, options.store, options.dataDir);
  const files = filesUnder(folder).map((file) => {
    const path = relative(folder, file).split(sep).join('/');
    const contentType = types.get(path);
    return {
      path,
      bytes: statSync(file).size,
      sha256: sha256File(file),
      ...(contentType ? { contentType } : {}),
    };
  });
  const manifest: Manifest = {
    format: 'gaugewalk-backup/1',
    createdAt: createdAt.toISOString(),
    database: target.database,
    dump: 'database.sql',
    files,
  };
  writeFileSync(join(folder, 'manifest.json'), `${JSON.stringify(manifest, null, 2)}\n`);
  return { folder, manifest };
}

function checkedFile(folder: string, f: ManifestFile): string {
  const path = resolve(folder, f.path);
  if (!path.startsWith(resolve(folder) + sep))
    throw new Error(`The manifest names a file outside: ${f.path}`);
  if (!existsSync(path)) throw new Error(`The backup is incomplete: ${f.path} is missing.`);
  if (statSync(path).size !== f.bytes || sha256File(path) !== f.sha256)
    throw new Error(`The backup is damaged: ${f.path} does not match.`);
  return path;
}

/**
 * Every file the manifest lists is there with the same size and SHA-256, and the dump is one of them; a changed,
 * missing or unlisted dump stops the restore before anything is loaded.
 */
export function verifyBackup(folder: string): Manifest {
  const manifestFile = join(folder, 'manifest.json');
  if (!existsSync(manifestFile)) throw new Error(`${folder} has no manifest.json: not a Gaugewalk backup.`);
  const manifest = JSON.parse(readFileSync(manifestFile, 'utf8')) as Manifest;
  if (manifest.format !== 'gaugewalk-backup/1') throw new Error(`Unknown backup format ${manifest.format}.`);
  if (!manifest.files.some((f) => f.path === manifest.dump))
    throw new Error(`The manifest does not list the dump ${manifest.dump}: it cannot be checked.`);
  for (const f of manifest.files) checkedFile(folder, f);
  return manifest;
}

/**
 * A private copy of the dump, checked again after copying, so the bytes loaded are the bytes that were verified
 * even if the backup folder changes during the restore.
 */
function verifiedDumpCopy(folder: string, manifest: Manifest): { path: string; remove: () => void } {
  const dir = mkdtempSync(join(tmpdir(), 'gaugewalk-restore-'));
  const remove = () => rmSync(dir, { recursive: true, force: true });
  try {
    const listed = manifest.files.find((f) => f.path === manifest.dump)!;
    copyFileSync(checkedFile(folder, listed), join(dir, 'database.sql'));
    checkedFile(dir, { ...listed, path: 'database.sql' });
    return { path: join(dir, 'database.sql'), remove };
  } catch (err) {
    remove();
    throw err;
  }
}

async function tablesIn(target: DatabaseTarget, client: string) {
  const out = await runTool(
    client,
    [...connectionArgs(target), '--batch', '--skip-column-names', target.database],
    target,
    { input: 'SHOW FULL TABLES;' },
  );
  return out
    .split('\n')
    .filter(Boolean)
    .map((line) => {
      const [name, type] = line.split('\t');
      return { name: name!, view: type === 'VIEW' };
    });
}

/** The backup's photos into the bucket, each with its content type (from the manifest, or else its name). */
async function putPhotos(folder: string, manifest: Manifest, store: PhotoStore) {
  let photos = 0;
  for (const f of manifest.files.filter((file) => file.path.startsWith('photos/'))) {
    const name = f.path.slice('photos/'.length);
    const contentType = f.contentType ?? photoTypeOfName(name);
    if (!contentType) throw new Error(`The backup holds ${f.path}, which is not a photo the app stores.`);
    // Read once and checked again: the bytes put are the bytes the manifest vouches for.
    const bytes = readFileSync(resolve(folder, f.path));
    if (createHash('sha256').update(bytes).digest('hex') !== f.sha256)
      throw new Error(`The backup is damaged: ${f.path} does not match.`);
    await store.put(f.path, bytes, { contentType, sha256: f.sha256 });
    photos += 1;
  }
  return photos;
}

/**
 * Puts a backup's photos into the photo store's bucket and loads its dump into the database at `databaseUrl`.
 * Refuses a database that already has tables unless `force`, which drops them first. Objects already in the bucket
 * stay; one under the same key is replaced by the backup's.
 */
export async function restore(options: {
  folder: string;
  databaseUrl: string;
  store: PhotoStore;
  force?: boolean;
}) {
  const folder = resolve(options.folder);
  const manifest = verifyBackup(folder);
  const target = parseDatabaseUrl(options.databaseUrl);
  const { client } = tools();
  const existing = await tablesIn(target, client);
  if (existing.length > 0 && !options.force) {
    throw new Error(
      `Database ${target.database} is not empty (${existing.length} tables). Restore into an empty database, ` +
        'or add --force to replace everything in it.',
    );
  }
  const dump = verifiedDumpCopy(folder, manifest);
  let photos = 0;
  try {
    // The photos before the rows that name them, as when they were taken: a restore cut short leaves spare
    // objects at worst, never a record whose photo is missing.
    photos = await putPhotos(folder, manifest, options.store);
    if (existing.length > 0) {
      const drops = existing
        .map((t) => `DROP ${t.view ? 'VIEW' : 'TABLE'} IF EXISTS \`${t.name.replace(/`/g, '``')}\`;`)
        .join('\n');
      await runTool(client, [...connectionArgs(target), target.database], target, {
        input: `SET FOREIGN_KEY_CHECKS=0;\n${drops}\nSET FOREIGN_KEY_CHECKS=1;\n`,
      });
    }
    await runTool(client, [...connectionArgs(target), target.database], target, { stdinFile: dump.path });
  } finally {
    dump.remove();
  }
  return { manifest, photos, replacedTables: existing.length };
}
