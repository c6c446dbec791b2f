import { restore } from '../backup/backup';
import { targetDatabase } from '../backup/target-database';

// `npm run restore -- <backup folder> [--force]`: into DATABASE_URL's database or the private instance.

const args = process.argv.slice(2);
const force = args.includes('--force');
const folder = args.find((a) => !a.startsWith('--'));
if (!folder) {
  process.stderr.write('Usage: npm run restore -- <backup folder> [--force]\n');
  process.exit(2);
}
const db = await targetDatabase();
try {
  process.stdout.write(`Restoring ${folder} into ${db.how}...\n`);
  const result = await restore({ folder, databaseUrl: db.url, dataDir: db.dataDir, force });
  process.stdout.write(
    `Restored the backup of ${result.manifest.createdAt}: database` +
      (result.replacedTables ? ` (replacing ${result.replacedTables} tables)` : '') +
      ` and ${result.photos} photo file(s). Start the app and check the audit trail verifies.\n`,
  );
} catch (err) {
  process.stderr.write(`Restore failed: ${(err as Error).message}\n`);
  process.exitCode = 1;
} finally {
  await db.stop();
}
