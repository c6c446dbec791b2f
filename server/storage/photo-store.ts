import {
  GetObjectCommand,
  HeadObjectCommand,
  ListObjectsV2Command,
  PutObjectCommand,
  S3Client,
  S3ServiceException,
} from '@aws-sdk/client-s3';
import type { PhotoStoreConfig } from '../config';

/** A stored object's bytes with what the store keeps beside them. */
export interface StoredObject {
  bytes: Buffer;
  contentType: string | undefined;
  /** The SHA-256 the app wrote as metadata when it stored the object. */
  sha256: string | undefined;
}

export interface ObjectFacts {
  bytes: number;
  contentType: string | undefined;
  sha256: string | undefined;
}

/** The store did not answer, refused the keys, or has no such bucket: anything but "no such object". */
export class PhotoStoreError extends Error {
  constructor(message: string, options?: { cause?: unknown }) {
    super(message, options);
    this.name = 'PhotoStoreError';
  }
}

/** Photos, and anything else the app keeps as whole files, in one bucket of an S3-compatible store. */
export interface PhotoStore {
  /** "bucket gaugewalk-photos at http://127.0.0.1:4568", for messages to the operator. */
  readonly where: string;
  put(key: string, bytes: Buffer, meta: { contentType: string; sha256: string }): Promise<void>;
  /** null when there is no such object. */
  get(key: string): Promise<StoredObject | null>;
  /** null when there is no such object. */
  head(key: string): Promise<ObjectFacts | null>;
  /** Every key under `prefix`, page by page. */
  keys(prefix: string): AsyncGenerator<string>;
  close(): void;
}

/** The key a photo's stored name is kept under; backups use the same path, so a backup's layout is the bucket's. */
export const photoKey = (storedName: string) => `photos/${storedName}`;

const notFound = (err: unknown) =>
  err instanceof S3ServiceException &&
  (err.name === 'NoSuchKey' || err.name === 'NotFound' || err.$metadata.httpStatusCode === 404) &&
  err.name !== 'NoSuchBucket';

function describeFailure(err: unknown): string {
  if (err instanceof S3ServiceException)
    return `${err.name} (${err.$metadata.httpStatusCode ?? 'no status'})`;
  const e = err as NodeJS.ErrnoException;
  return e.code ?? e.message ?? String(err);
}

function s3ClientFor(config: PhotoStoreConfig, endpoint: string) {
  return new S3Client({
    endpoint,
    region: config.PHOTO_STORE_REGION,
    forcePathStyle: config.PHOTO_STORE_PATH_STYLE ?? true,
    ...(config.PHOTO_STORE_ACCESS_KEY_ID
      ? {
          credentials: {
            accessKeyId: config.PHOTO_STORE_ACCESS_KEY_ID,
            secretAccessKey: config.PHOTO_STORE_SECRET_ACCESS_KEY!,
          },
        }
      : {}),
    // Checksums only where the operation needs one: many S3-compatible stores refuse the SDK's newer default
    // trailing checksums. Integrity is kept by the SHA-256 the app stores with each photo and checks on backup.
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
    maxAttempts: 3,
  });
}

/** A store for the configuration; with no endpoint configured every call fails with a plain reason. */
export function createPhotoStore(config: PhotoStoreConfig): PhotoStore {
  const endpoint = config.PHOTO_STORE_ENDPOINT;
  const bucket = config.PHOTO_STORE_BUCKET;
  const where = endpoint
    ? `bucket ${bucket} at ${endpoint}`
    : 'no photo store (PHOTO_STORE_ENDPOINT is unset)';
  const client = endpoint ? s3ClientFor(config, endpoint) : null;

  async function send<T>(what: string, call: (s3: S3Client) => Promise<T>): Promise<T> {
    if (!client) throw new PhotoStoreError(`Cannot ${what}: ${where}.`);
    try {
      return await call(client);
    } catch (err) {
      if (notFound(err)) throw err;
      throw new PhotoStoreError(`Cannot ${what} in ${where}: ${describeFailure(err)}.`, { cause: err });
    }
  }
  const orNull = async <T>(work: Promise<T>): Promise<T | null> => {
    try {
      return await work;
    } catch (err) {
      if (notFound(err)) return null;
      throw err;
    }
  };

  return {
    where,
    async put(key, bytes, meta) {
      await send(`store ${key}`, (s3) =>
        s3.send(
          new PutObjectCommand({
            Bucket: bucket,
            Key: key,
            Body: bytes,
            ContentType: meta.contentType,
            ContentLength: bytes.length,
            Metadata: { sha256: meta.sha256 },
          }),
        ),
      );
    },
    get: (key) =>
      orNull(
        send(`read ${key}`, async (s3) => {
          const out = await s3.send(new GetObjectCommand({ Bucket: bucket, Key: key }));
          const bytes = Buffer.from(await out.Body!.transformToByteArray());
          return { bytes, contentType: out.ContentType, sha256: out.Metadata?.sha256 };
        }),
      ),
    head: (key) =>
      orNull(
        send(`look up ${key}`, async (s3) => {
          const out = await s3.send(new HeadObjectCommand({ Bucket: bucket, Key: key }));
          return {
            bytes: out.ContentLength ?? 0,
            contentType: out.ContentType,
            sha256: out.Metadata?.sha256,
          };
        }),
      ),
    async *keys(prefix) {
      let token: string | undefined;
      do {
        const page = await send(`list ${prefix}`, (s3) =>
          s3.send(new ListObjectsV2Command({ Bucket: bucket, Prefix: prefix, ContinuationToken: token })),
        );
        for (const item of page.Contents ?? []) if (item.Key) yield item.Key;
        token = page.IsTruncated ? page.NextContinuationToken : undefined;
      } while (token);
    },
    close: () => client?.destroy(),
  };
}

const typesByExtension: Record<string, string> = { jpg: 'image/jpeg', png: 'image/png', webp: 'image/webp' };

/**
 * The content type of a stored name (`<uuid>.<ext>`, the extension chosen from the photo's own first bytes when it
 * was taken); null for a name the app never makes.
 */
export function photoTypeOfName(storedName: string): string | null {
  const match = /^[0-9a-f-]{36}\.(jpg|png|webp)$/.exec(storedName);
  return match ? typesByExtension[match[1]!]! : null;
}
