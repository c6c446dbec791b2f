import { createHash } from 'node:crypto';
import { existsSync, readFileSync, readdirSync, rmSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { photoKey, photoTypeOfName, type PhotoStore } from './photo-store';

export interface PhotoMove {
  /** Put into the bucket, then removed from the folder. */
  moved: string[];
  /** Already in the bucket with the same SHA-256 (a run cut short): removed from the folder. */
  alreadyThere: string[];
  /** Files the app never names a photo so: left in the folder. */
  notPhotos: string[];
  /** Photos left in the folder because the bucket did not take them as they are, with the reason. */
  failed: { name: string; reason: string }[];
}

/**
 * Moves the photo files of DATA_DIR/photos (where photos were kept before the object store) into the bucket under
 * the keys the app reads them by. A file is removed only once the bucket holds an object with its SHA-256, so a run
 * cut short loses nothing and the next run finishes it; a second run finds nothing to move.
 */
export async function moveLocalPhotos(dataDir: string, store: PhotoStore): Promise<PhotoMove> {
  const folder = resolve(dataDir, 'photos');
  const result: PhotoMove = { moved: [], alreadyThere: [], notPhotos: [], failed: [] };
  if (!existsSync(folder)) return result;
  for (const entry of readdirSync(folder, { withFileTypes: true }).sort((a, b) =>
    a.name.localeCompare(b.name),
  )) {
    const contentType = entry.isFile() ? photoTypeOfName(entry.name) : null;
    if (!contentType) {
      result.notPhotos.push(entry.name);
      continue;
    }
    const file = join(folder, entry.name);
    const bytes = readFileSync(file);
    const sha256 = createHash('sha256').update(bytes).digest('hex');
    const key = photoKey(entry.name);
    const there = await store.head(key);
    if (there && there.sha256 !== sha256) {
      result.failed.push({ name: entry.name, reason: 'the bucket holds different bytes under its name' });
      continue;
    }
    if (!there) await store.put(key, bytes, { contentType, sha256 });
    const check = await store.get(key);
    if (!check || !check.bytes.equals(bytes)) {
      result.failed.push({ name: entry.name, reason: 'the bucket did not give the same bytes back' });
      continue;
    }
    rmSync(file);
    (there ? result.alreadyThere : result.moved).push(entry.name);
  }
  return result;
}
