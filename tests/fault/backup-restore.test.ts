import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { spawn } from 'node:child_process';
import { cpSync, mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { QueryTypes, type Sequelize } from 'sequelize';
import { createApp } from '@server/app';
import { createSequelize } from '@server/db/connection';
import { loadConfig, loadPhotoStoreConfig } from '@server/config';
import { verifyRecords } from '@server/audit/record-integrity';
import { verifyBackup } from '@server/backup/backup';
import { findFreePort } from '@server/db/local-server';
import { startFakeObjectStore, type FakeObjectStore } from '@server/storage/fake-object-store';
import { createPhotoStore } from '@server/storage/photo-store';
import { Client, makeAirframe, makeStaff } from '../setup/api-harness';
import { preFlightBody } from '../setup/check-builder';
import { KillableDatabase, connect } from './fault-harness';
import { onePixelPng } from '../setup/images';

const folders: string[] = [];
const tempDir = (name: string) => {
  const dir = mkdtempSync(join(tmpdir(), `gaugewalk-${name}-`));
  folders.push(dir);
  return dir;
};
const databases: KillableDatabase[] = [];
const photoStores: FakeObjectStore[] = [];
afterAll(async () => {
  for (const store of photoStores) await store.stop();
  for (const db of databases) await db.remove();
  for (const dir of folders) rmSync(dir, { recursive: true, force: true });
});

/** A bucket of its own in a fake object store (s3rver) with its files in a folder of its own. */
async function photoStore(name: string) {
  const store = await startFakeObjectStore({ directory: tempDir(name), port: await findFreePort(0) });
  photoStores.push(store);
  return store;
}

function appOn(sequelize: Sequelize, url: string, dataDir: string, store: FakeObjectStore) {
  const config = loadConfig({
    ...store.env,
    DATABASE_URL: url,
    SESSION_SECRET: 'backup-secret-that-is-long-enough',
    LOG_LEVEL: 'silent',
    BCRYPT_COST: '4',
    SIGN_IN_RATE_PER_MINUTE: '100000',
    DATA_DIR: dataDir,
  });
  return createApp({ config, sequelize, clientDir: '/nonexistent' });
}

/** A connection that neither defines models nor migrates, to look at a database as it is. */
const rawConnection = (url: string) => createSequelize(url, { pool: 1 });
const tableNames = async (db: Sequelize) =>
  (
    await db.query<{ name: string }>(
      'SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE() ORDER BY 1',
      { type: QueryTypes.SELECT },
    )
  ).map((t) => t.name);

/**
 * The real commands, as an operator runs them. Not spawnSync: the fake object stores answer from this process, so
 * it must keep running while the command works.
 */
function npmScript(script: 'backup' | 'restore', args: string[], env: Record<string, string>) {
  return new Promise<{ code: number | null; out: string }>((ok) => {
    const child = spawn(process.execPath, ['--import', 'tsx', `server/entry/${script}.ts`, ...args], {
      env: { ...process.env, ...env },
    });
    let out = '';
    child.stdout.on('data', (chunk: Buffer) => (out += chunk.toString()));
    child.stderr.on('data', (chunk: Buffer) => (out += chunk.toString()));
    child.once('close', (code) => ok({ code, out }));
  });
}

const png = onePixelPng;

async function recordsOf(sequelize: Sequelize) {
  return {
    checks: await sequelize.query(
      'SELECT id, content_hash, signed_content, verdict FROM checks ORDER BY id',
      { type: QueryTypes.SELECT },
    ),
    readings: await sequelize.query(
      'SELECT check_id, seq, entry, verdict FROM readings ORDER BY check_id, seq',
      {
        type: QueryTypes.SELECT,
      },
    ),
    trailHead: await sequelize.query('SELECT hash FROM audit_head', { type: QueryTypes.SELECT }),
  };
}

describe('backup and restore', () => {
  it('when a backup is restored into a fresh MariaDB and an empty bucket, then the same checks, photos with their content type and a verifying trail come back, and a non-empty database is only replaced with --force', async () => {
    const source = new KillableDatabase();
    databases.push(source);
    await source.start();
    const sourceData = tempDir('backup-source-data');
    const sourceBucket = await photoStore('backup-source-objects');
    let sequelize = await connect(source.url);
    const sourceApp = appOn(sequelize, source.url, sourceData, sourceBucket);
    const { badge, pin } = await makeStaff(['mechanic']);
    const client = await Client.kiosk(sourceApp.app);
    await client.signInKiosk(badge, pin);
    const { airframe, limits } = await makeAirframe();
    const photo = await client.agent
      .post('/api/photos')
      .set('X-CSRF-Token', client.csrf)
      .attach('photo', png, { filename: 'glass.png', contentType: 'image/png' });
    expect(photo.status).toBe(201);
    const withPhoto = preFlightBody(airframe.id, limits.id, pin);
    withPhoto.readings[0] = { ...withPhoto.readings[0]!, photoIds: [photo.body.id] };
    const low = preFlightBody(airframe.id, limits.id, pin);
    low.readings[1] = { code: 'sys2.level', entry: { value: 1.2, unit: 'L' } };
    const signed = [];
    for (const body of [withPhoto, low, preFlightBody(airframe.id, limits.id, pin)]) {
      const res = await client.post('/api/checks', body);
      expect(res.status).toBe(201);
      signed.push(res.body);
    }
    expect(signed[1].holdOpened).toBe(true);
    const before = await recordsOf(sequelize);
    sourceApp.close();
    await sequelize.close();

    const backups = tempDir('backups');
    const made = await npmScript('backup', [backups], {
      DATABASE_URL: source.url,
      DATA_DIR: sourceData,
      ...sourceBucket.env,
    });
    expect(made.code, made.out).toBe(0);
    expect(made.out).toContain('database.sql and 1 photo(s)');
    const [folderName] = readdirSync(backups);
    const folder = join(backups, folderName!);
    const manifest = verifyBackup(folder);
    expect(manifest.files.map((f) => f.path).sort()).toEqual(
      ['database.sql', `photos/${photo.body.id}.png`].sort(),
    );
    expect(manifest.files.find((f) => f.path.startsWith('photos/'))).toMatchObject({
      sha256: photo.body.sha256,
      contentType: 'image/png',
    });

    const fresh = new KillableDatabase();
    databases.push(fresh);
    await fresh.start();
    const freshData = tempDir('backup-fresh-data');
    const freshBucket = await photoStore('backup-fresh-objects');
    const freshStore = createPhotoStore(loadPhotoStoreConfig(freshBucket.env));
    expect(await freshStore.get(`photos/${photo.body.id}.png`)).toBeNull();
    const restored = await npmScript('restore', [folder], {
      DATABASE_URL: fresh.url,
      DATA_DIR: freshData,
      ...freshBucket.env,
    });
    expect(restored.code, restored.out).toBe(0);
    expect(restored.out).toContain('and 1 photo(s) into the bucket');
    // The object is back in the new bucket, read straight from it: same bytes, type and fingerprint.
    const object = await freshStore.get(`photos/${photo.body.id}.png`);
    expect(object).not.toBeNull();
    expect(Buffer.compare(object!.bytes, png)).toBe(0);
    expect(object).toMatchObject({ contentType: 'image/png', sha256: photo.body.sha256 });
    freshStore.close();
    // Nothing went to the data folder: the bucket is where photos live.
    expect(readdirSync(freshData)).toEqual([]);

    sequelize = await connect(fresh.url);
    expect(await recordsOf(sequelize)).toEqual(before);
    expect(await verifyRecords(sequelize)).toMatchObject({ ok: true, firstBroken: null });
    // The same tablet and session carry on against the restored server: records and photo read back the same.
    const freshApp = appOn(sequelize, fresh.url, freshData, freshBucket);
    const again = new Client(freshApp.app);
    for (const cookie of client.agent.jar.getCookies({
      domain: '127.0.0.1',
      path: '/',
      secure: false,
      script: false,
    }))
      again.agent.jar.setCookie(`${cookie.name}=${cookie.value}; Path=/`, '127.0.0.1', '/');
    for (const check of signed) {
      const res = await again.get(`/api/checks/${check.id}`);
      expect(res.status).toBe(200);
      expect(res.body).toEqual(check);
    }
    const image = await again.get(`/api/photos/${photo.body.id}`);
    expect(image.status).toBe(200);
    expect(image.headers['content-type']).toBe('image/png');
    expect(Buffer.compare(image.body as Buffer, png)).toBe(0);
    freshApp.close();
    await sequelize.close();

    // Marks that a restore over this database must wipe: a row in a restored table and a table of its own.
    sequelize = await connect(fresh.url);
    await sequelize.query("INSERT INTO bases (code, name) VALUES ('MARKER', 'Written after the backup')");
    await sequelize.query('CREATE TABLE restore_marker (note VARCHAR(40))');
    await sequelize.query("INSERT INTO restore_marker VALUES ('written after the backup')");
    await sequelize.close();
    const markers = async () => {
      const db = await rawConnection(fresh.url);
      const [rows] = await db.query("SELECT code FROM bases WHERE code = 'MARKER'");
      const tables = await tableNames(db);
      await db.close();
      return { rows: rows.length, markerTable: tables.includes('restore_marker'), tables: tables.length };
    };
    const marked = await markers();
    expect(marked).toMatchObject({ rows: 1, markerTable: true });
    const refused = await npmScript('restore', [folder], {
      DATABASE_URL: fresh.url,
      DATA_DIR: freshData,
      ...freshBucket.env,
    });
    expect(refused.code).toBe(1);
    expect(refused.out).toContain(
      `Restore failed: Database gaugewalk_fault is not empty (${marked.tables} tables). Restore into an empty database, ` +
        'or add --force to replace everything in it.',
    );
    expect(await markers()).toEqual(marked);
    const forced = await npmScript('restore', [folder, '--force'], {
      DATABASE_URL: fresh.url,
      DATA_DIR: freshData,
      ...freshBucket.env,
    });
    expect(forced.code, forced.out).toBe(0);
    expect(forced.out).toContain(`(replacing ${marked.tables} tables)`);
    expect(await markers()).toEqual({ rows: 0, markerTable: false, tables: marked.tables - 1 });
    sequelize = await connect(fresh.url);
    expect(await recordsOf(sequelize)).toEqual(before);
    await sequelize.close();
  });

  describe('when the dump was edited after the backup was written', () => {
    let folder = '';
    beforeAll(async () => {
      const source = new KillableDatabase();
      databases.push(source);
      await source.start();
      await (await connect(source.url)).close();
      const backups = tempDir('backups-edited');
      const made = await npmScript('backup', [backups], {
        DATABASE_URL: source.url,
        DATA_DIR: tempDir('data'),
      });
      expect(made.code, made.out).toBe(0);
      folder = join(backups, readdirSync(backups)[0]!);
    });

    const editions: [string, (dump: Buffer, copy: string) => void, string][] = [
      [
        'one byte changed',
        (dump, copy) => {
          const at = dump.indexOf('CREATE TABLE `checks`');
          expect(at).toBeGreaterThan(0);
          dump[at + 14] = 'C'.charCodeAt(0);
          writeFileSync(join(copy, 'database.sql'), dump);
        },
        'Restore failed: The backup is damaged: database.sql does not match.',
      ],
      [
        'a harmless CREATE TABLE added',
        (dump, copy) => writeFileSync(join(copy, 'database.sql'), Buffer.concat([dump, Buffer.from(canary)])),
        'Restore failed: The backup is damaged: database.sql does not match.',
      ],
      [
        'the manifest pointed at an unlisted dump',
        (dump, copy) => {
          writeFileSync(join(copy, 'other.sql'), Buffer.concat([dump, Buffer.from(canary)]));
          const manifest = JSON.parse(readFileSync(join(copy, 'manifest.json'), 'utf8'));
          writeFileSync(join(copy, 'manifest.json'), JSON.stringify({ ...manifest, dump: 'other.sql' }));
        },
        'Restore failed: The manifest does not list the dump other.sql: it cannot be checked.',
      ],
    ];
    const canary = '\nCREATE TABLE restore_canary (id INT);\n';

    it.each(editions)(
      'when the dump has %s, then restore refuses it and the target database still has zero tables',
      async (_, edit, message) => {
        const copy = tempDir('backup-edited-copy');
        cpSync(folder, copy, { recursive: true });
        edit(readFileSync(join(folder, 'database.sql')), copy);
        const fresh = new KillableDatabase();
        databases.push(fresh);
        await fresh.start();
        const refused = await npmScript('restore', [copy], {
          DATABASE_URL: fresh.url,
          DATA_DIR: tempDir('data'),
        });
        expect(refused.code).toBe(1);
        expect(refused.out).toContain(message);
        const db = await rawConnection(fresh.url);
        expect(await tableNames(db)).toEqual([]);
        await db.close();
        // The same folder, unedited, restores: the refusal was the edit's doing.
        const clean = await npmScript('restore', [folder], {
          DATABASE_URL: fresh.url,
          DATA_DIR: tempDir('data'),
        });
        expect(clean.code, clean.out).toBe(0);
      },
    );
  });
});
