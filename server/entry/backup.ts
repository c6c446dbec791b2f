import { resolve } from 'node:path';
import { backup } from '../backup/backup';
import { targetDatabase } from '../backup/target-database';
import { targetPhotoStore } from '../storage/target-photo-store';

// `npm run backup -- <folder>`: a consistent dump and the photo bucket, in a new timestamped folder inside <folder>.

const outRoot = process.argv[2];
if (!outRoot || outRoot.startsWith('-')) {
  process.stderr.write(
    'Usage: npm run backup -- <folder>   (DATABASE_URL or the private instance in DATA_DIR)\n',
  );
  process.exit(2);
}
const db = await targetDatabase();
let photoStore: Awaited<ReturnType<typeof targetPhotoStore>> | undefined;
try {
  photoStore = await targetPhotoStore();
  process.stdout.write(`Backing up ${db.how} and ${photoStore.how}...\n`);
  const t0 = Date.now();
  const { folder, manifest } = await backup({
    databaseUrl: db.url,
    store: photoStore.store,
    dataDir: db.dataDir,
    outRoot: resolve(outRoot),
  });
  const bytes = manifest.files.reduce((sum, f) => sum + f.bytes, 0);
  const photos = manifest.files.filter((f) => f.path.startsWith('photos/')).length;
  process.stdout.write(
    `Backup written to ${folder}\n  database.sql and ${photos} photo(s), ${(bytes / 1024 / 1024).toFixed(1)} MB, ` +
      `in ${((Date.now() - t0) / 1000).toFixed(1)} s; SHA-256 of each in manifest.json.\n` +
      'Copy this folder to another place (another building or an off-site store) today.\n',
  );
} catch (err) {
  process.stderr.write(`Backup failed: ${(err as Error).message}\n`);
  process.exitCode = 1;
} finally {
  await photoStore?.stop();
  await db.stop();
}
