import { afterAll, describe, expect, inject, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { mkdirSync, mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { appForThisFile, makeStaff, testPhotoStore } from '../setup/api-harness';
import { signedIn } from '../setup/sign-in';
import { Photo } from '@server/db/models';
import { sha256Bytes } from '@server/security/hashing';
import { onePixelPng, jfifJpeg } from '../setup/images';

const { app } = appForThisFile();
const folders: string[] = [];
afterAll(() => {
  for (const dir of folders) rmSync(dir, { recursive: true, force: true });
});

const png = onePixelPng;
const jpeg = jfifJpeg(Buffer.alloc(32, 7));

/** A data folder as an older Gaugewalk left it: photos as files in DATA_DIR/photos. */
function oldDataDir(files: Record<string, Buffer>) {
  const dataDir = mkdtempSync(join(tmpdir(), 'gaugewalk-migrate-'));
  folders.push(dataDir);
  mkdirSync(join(dataDir, 'photos'));
  for (const [name, bytes] of Object.entries(files)) writeFileSync(join(dataDir, 'photos', name), bytes);
  return dataDir;
}

/** The real command, as an operator runs it. */
function migrate(dataDir: string, env: Record<string, string> = inject('photoStoreEnv')) {
  const result = spawnSync(process.execPath, ['--import', 'tsx', 'server/entry/photos-migrate.ts'], {
    env: { ...process.env, DATA_DIR: dataDir, ...env },
    encoding: 'utf8',
  });
  return { code: result.status, out: result.stdout + result.stderr };
}

describe('npm run photos:migrate', () => {
  it('when DATA_DIR/photos holds photos, then they move into the bucket with their type, the app serves them, and a second run moves nothing', async () => {
    const a = `${randomUUID()}.png`;
    const b = `${randomUUID()}.jpg`;
    const dataDir = oldDataDir({ [a]: png, [b]: jpeg, 'notes.txt': Buffer.from('not a photo') });
    const { staff } = await makeStaff(['mechanic']);
    await Photo.create({
      id: a.slice(0, 36),
      checkId: null,
      checkpointCode: null,
      storedName: a,
      mimeType: 'image/png',
      sizeBytes: png.length,
      sha256: sha256Bytes(png),
      uploadedBy: staff.id,
      uploadedAt: new Date(),
    });

    const first = migrate(dataDir);
    expect(first.code, first.out).toBe(0);
    const [moved1, moved2] = [a, b].sort();
    expect(first.out).toContain(`  moved ${moved1}\n  moved ${moved2}\n`);
    expect(first.out).toContain('  left in the folder, not a photo the app stored: notes.txt');
    expect(first.out).toContain('Moved 2 photo(s); 0 already in the bucket; 0 not moved.');
    expect(readdirSync(join(dataDir, 'photos'))).toEqual(['notes.txt']);

    const store = testPhotoStore();
    expect(await store.get(`photos/${a}`)).toMatchObject({ bytes: png, contentType: 'image/png' });
    expect(await store.get(`photos/${b}`)).toMatchObject({ bytes: jpeg, contentType: 'image/jpeg' });
    const { client } = await signedIn(app, ['mechanic'], 'kiosk');
    const served = await client.get(`/api/photos/${a.slice(0, 36)}`).buffer(true);
    expect(served.status).toBe(200);
    expect(served.headers['content-type']).toBe('image/png');
    expect(Buffer.compare(served.body as Buffer, png)).toBe(0);

    const second = migrate(dataDir);
    expect(second.code, second.out).toBe(0);
    expect(second.out).toContain('Nothing to move: the folder holds no photos.');
    expect(second.out).not.toContain('  moved ');
    expect(await store.get(`photos/${a}`)).toMatchObject({ bytes: png, contentType: 'image/png' });
    store.close();
  });

  it('when a run was cut short after the upload, then the next run finds the photo in the bucket and only clears the folder; a name the bucket holds with other bytes is kept and reported', async () => {
    const done = `${randomUUID()}.png`;
    const clash = `${randomUUID()}.png`;
    const store = testPhotoStore();
    await store.put(`photos/${done}`, png, { contentType: 'image/png', sha256: sha256Bytes(png) });
    await store.put(`photos/${clash}`, jpeg, { contentType: 'image/jpeg', sha256: sha256Bytes(jpeg) });
    const dataDir = oldDataDir({ [done]: png, [clash]: png });

    const run = migrate(dataDir);
    expect(run.code, run.out).toBe(1);
    expect(run.out).toContain(`  already in the bucket, removed from the folder: ${done}`);
    expect(run.out).toContain(`  NOT MOVED: ${clash}: the bucket holds different bytes under its name`);
    expect(run.out).toContain('Moved 0 photo(s); 1 already in the bucket; 1 not moved.');
    expect(readdirSync(join(dataDir, 'photos'))).toEqual([clash]);
    expect(await store.get(`photos/${clash}`)).toMatchObject({ bytes: jpeg, contentType: 'image/jpeg' });
    store.close();
  });

  it('when no photo store is configured, then the photos move into the local fake store of npm start, under DATA_DIR/objects', () => {
    const name = `${randomUUID()}.png`;
    const dataDir = oldDataDir({ [name]: png });
    const run = migrate(dataDir, { PHOTO_STORE_ENDPOINT: '' });
    expect(run.code, run.out).toBe(0);
    expect(run.out).toContain(`into the local photo store in ${join(dataDir, 'objects')}`);
    expect(run.out).toContain(`  moved ${name}`);
    expect(readdirSync(join(dataDir, 'photos'))).toEqual([]);
    // s3rver keeps each object as a file named after its key.
    expect(
      readdirSync(join(dataDir, 'objects', 'gaugewalk-photos', 'photos')).some((f) => f.startsWith(name)),
    ).toBe(true);
  });
});
