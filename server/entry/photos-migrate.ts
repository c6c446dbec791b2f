import { resolve } from 'node:path';
import { moveLocalPhotos } from '../storage/move-local-photos';
import { targetPhotoStore } from '../storage/target-photo-store';

// `npm run photos:migrate`: moves the photo files of DATA_DIR/photos into the photo store's bucket. Safe to run
// again: what is already moved is not moved twice, and a run cut short is finished by the next.

const dataDir = resolve(process.env.DATA_DIR ?? '.data');
let target: Awaited<ReturnType<typeof targetPhotoStore>> | undefined;
try {
  target = await targetPhotoStore();
  process.stdout.write(`Moving the photos of ${resolve(dataDir, 'photos')} into ${target.how}...\n`);
  const { moved, alreadyThere, notPhotos, failed } = await moveLocalPhotos(dataDir, target.store);
  const lines = [
    ...moved.map((name) => `  moved ${name}`),
    ...alreadyThere.map((name) => `  already in the bucket, removed from the folder: ${name}`),
    ...notPhotos.map((name) => `  left in the folder, not a photo the app stored: ${name}`),
    ...failed.map(({ name, reason }) => `  NOT MOVED: ${name}: ${reason}`),
    moved.length + alreadyThere.length + failed.length === 0
      ? 'Nothing to move: the folder holds no photos.'
      : `Moved ${moved.length} photo(s); ${alreadyThere.length} already in the bucket; ${failed.length} not moved.`,
  ];
  process.stdout.write(`${lines.join('\n')}\n`);
  if (failed.length > 0) process.exitCode = 1;
} catch (err) {
  process.stderr.write(`Photo migration failed: ${(err as Error).message}\n`);
  process.exitCode = 1;
} finally {
  await target?.stop();
}
