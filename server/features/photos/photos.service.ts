import { basename } from 'node:path';
import { randomUUID } from 'node:crypto';
import { insertPhoto, photoById } from './photos.repository';
import { sha256Bytes } from '@server/security/hashing';
import { AppError, badRequest, notFound, refusal } from '@server/errors/app-error';
import { PhotoStoreError, photoKey, type PhotoStore } from '@server/storage/photo-store';

export const MAX_PHOTO_BYTES = 8 * 1024 * 1024;

/** The file's own first bytes decide its type; the name and the browser's claim are not trusted. */
function sniffImageType(bytes: Buffer): { mime: string; ext: string } | null {
  if (bytes.length >= 3 && bytes[0] === 0xff && bytes[1] === 0xd8 && bytes[2] === 0xff)
    return { mime: 'image/jpeg', ext: 'jpg' };
  if (
    bytes.length >= 8 &&
    bytes.subarray(0, 8).equals(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]))
  ) {
    return { mime: 'image/png', ext: 'png' };
  }
  if (
    bytes.length >= 12 &&
    bytes.toString('ascii', 0, 4) === 'RIFF' &&
    bytes.toString('ascii', 8, 12) === 'WEBP'
  ) {
    return { mime: 'image/webp', ext: 'webp' };
  }
  return null;
}

/** The store failed: the tablet is told in words and may try again; the check itself never waits on a photo. */
function unavailable(err: unknown): never {
  if (!(err instanceof PhotoStoreError)) throw err;
  throw new AppError(503, 'photo_store_unavailable', refusal('photos.storeUnavailable'), undefined, err);
}

export async function storePhoto(store: PhotoStore, bytes: Buffer, uploadedBy: number) {
  if (bytes.length === 0) throw badRequest('photo_empty', refusal('photos.empty'));
  const type = sniffImageType(bytes);
  if (!type) throw new AppError(415, 'photo_not_image', refusal('photos.notImage'));
  const id = randomUUID();
  // The stored name is made here from the id; nothing the client sent reaches the key.
  const storedName = `${id}.${type.ext}`;
  const sha256 = sha256Bytes(bytes);
  // The object before the row that names it: every photo a record (or a backup's dump) knows is in the bucket.
  await store.put(photoKey(storedName), bytes, { contentType: type.mime, sha256 }).catch(unavailable);
  const photo = await insertPhoto({
    id,
    checkId: null,
    checkpointCode: null,
    storedName,
    mimeType: type.mime,
    sizeBytes: bytes.length,
    sha256,
    uploadedBy,
    uploadedAt: new Date(),
  });
  return { id: photo.id, mimeType: photo.mimeType, sizeBytes: photo.sizeBytes, sha256: photo.sha256 };
}

export async function readPhoto(store: PhotoStore, id: string) {
  const photo = await photoById(id);
  if (!photo) throw notFound(refusal('photos.notFound'));
  const stored = await store.get(photoKey(photo.storedName)).catch(unavailable);
  if (!stored) throw notFound(refusal('photos.fileMissing'), 'photo_file_missing');
  return { photo, bytes: stored.bytes };
}

/** A stored photo's bytes by its stored name, for a printed record; null when the object is gone. */
export async function photoFileBytes(store: PhotoStore, storedName: string): Promise<Buffer | null> {
  const stored = await store.get(photoKey(basename(storedName))).catch(unavailable);
  return stored?.bytes ?? null;
}
