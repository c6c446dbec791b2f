import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { cpSync, mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { QueryTypes, type Sequelize } from 'sequelize';
import { createApp } from '@server/app';
import { createSequelize } from '@server/db/connection';
import { loadConfig } from '@server/config';
import { verifyRecords } from '@server/audit/record-integrity';
import { verifyBackup } from '@server/backup/backup';
import { Client, makeAirframe, makeStaff } from '../setup/api-harness';
import { preFlightBody } from '../setup/check-builder';
import { KillableDatabase, connect } from './fault-harness';

const folders: string[] = [];
const tempDir = (name: string) => {
  const dir = mkdtempSync(join(tmpdir(), `gaugewalk-${name}-`));
  folders.push(dir);
  return dir;
};
const databases: KillableDatabase[] = [];
afterAll(async () => {
  for (const db of databases) await db.remove();
  for (const dir of folders) rmSync(dir, { recursive: true, force: true });
});

function appOn(sequelize: Sequelize, url: string, dataDir: string) {
  const config = loadConfig({
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

/** The real commands, as an operator runs them. */
function npmScript(script: 'backup' | 'restore', args: string[], env: Record<string, string>) {
  const result = spawnSync(process.execPath, ['--import', 'tsx', `server/entry/${script}.ts`, ...args], {
    env: { ...process.env, ...env },
    encoding: 'utf8',
  });
  return { code: result.status, out: result.stdout + result.stderr };
}

const png = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==',
  'base64',
);

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
  it('when a backup is restored into a fresh MariaDB, then the same checks, photos and a verifying trail come back, and a non-empty database is only replaced with --force', async () => {
    const source = new KillableDatabase();
    databases.push(source);
    await source.start();
    const sourceData = tempDir('backup-source-data');
    let sequelize = await connect(source.url);
    const sourceApp = appOn(sequelize, source.url, sourceData);
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
    const made = npmScript('backup', [backups], { DATABASE_URL: source.url, DATA_DIR: sourceData });
    expect(made.code, made.out).toBe(0);
    const [folderName] = readdirSync(backups);
    const folder = join(backups, folderName!);
    const manifest = verifyBackup(folder);
    expect(manifest.files.map((f) => f.path).sort()).toEqual(
      ['database.sql', `photos/${photo.body.id}.png`].sort(),
    );
    expect(manifest.files.find((f) => f.path.startsWith('photos/'))!.sha256).toBe(photo.body.sha256);

    const fresh = new KillableDatabase();
    databases.push(fresh);
    await fresh.start();
    const freshData = tempDir('backup-fresh-data');
    const restored = npmScript('restore', [folder], { DATABASE_URL: fresh.url, DATA_DIR: freshData });
    expect(restored.code, restored.out).toBe(0);

    sequelize = await connect(fresh.url);
    expect(await recordsOf(sequelize)).toEqual(before);
    expect(await verifyRecords(sequelize)).toMatchObject({ ok: true, firstBroken: null });
    // The same tablet and session carry on against the restored server: records and photo read back the same.
    const freshApp = appOn(sequelize, fresh.url, freshData);
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
    const refused = npmScript('restore', [folder], { DATABASE_URL: fresh.url, DATA_DIR: freshData });
    expect(refused.code).toBe(1);
    expect(refused.out).toContain(
      `Restore failed: Database gaugewalk_fault is not empty (${marked.tables} tables). Restore into an empty database, ` +
        'or add --force to replace everything in it.',
    );
    expect(await markers()).toEqual(marked);
    const forced = npmScript('restore', [folder, '--force'], {
      DATABASE_URL: fresh.url,
      DATA_DIR: freshData,
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
      const made = npmScript('backup', [backups], { DATABASE_URL: source.url, DATA_DIR: tempDir('data') });
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
        const refused = npmScript('restore', [copy], { DATABASE_URL: fresh.url, DATA_DIR: tempDir('data') });
        expect(refused.code).toBe(1);
        expect(refused.out).toContain(message);
        const db = await rawConnection(fresh.url);
        expect(await tableNames(db)).toEqual([]);
        await db.close();
        // The same folder, unedited, restores: the refusal was the edit's doing.
        const clean = npmScript('restore', [folder], { DATABASE_URL: fresh.url, DATA_DIR: tempDir('data') });
        expect(clean.code, clean.out).toBe(0);
      },
    );
  });
});
