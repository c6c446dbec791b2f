import { restore } from '../backup/backup';
import { targetDatabase } from '../backup/target-database';
import { targetPhotoStore } from '../storage/target-photo-store';

// `npm run restore -- <backup folder> [--force]`: into DATABASE_URL's database or the private instance, and the
// photos into the photo store's bucket.

const args = process.argv.slice(2);
const force = args.includes('--force');
const folder = args.find((a) => !a.startsWith('--'));
if (!folder) {
  process.stderr.write('Usage: npm run restore -- <backup folder> [--force]\n');
  process.exit(2);
}
const db = await targetDatabase();
let photoStore: Awaited<ReturnType<typeof targetPhotoStore>> | undefined;
try {
  photoStore = await targetPhotoStore();
  process.stdout.write(`Restoring ${folder} into ${db.how} and ${photoStore.how}...\n`);
  const result = await restore({ folder, databaseUrl: db.url, store: photoStore.store, force });
  process.stdout.write(
    `Restored the backup of ${result.manifest.createdAt}: database` +
      (result.replacedTables ? ` (replacing ${result.replacedTables} tables)` : '') +
      ` and ${result.photos} photo(s) into the bucket. Start the app and check the audit trail verifies.\n`,
  );
} catch (err) {
  process.stderr.write(`Restore failed: ${(err as Error).message}\n`);
  process.exitCode = 1;
} finally {
  await photoStore?.stop();
  await db.stop();
}
