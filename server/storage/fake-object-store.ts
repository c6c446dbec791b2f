import { mkdirSync } from 'node:fs';
import S3rver from 's3rver';

export interface FakeObjectStore {
  endpoint: string;
  bucket: string;
  /** The settings that point the app (or a command it spawns) at this store. */
  env: Record<string, string>;
  stop(): Promise<void>;
}

/** s3rver accepts any signature made with these; they open nothing anywhere else. */
const fakeKeys = { PHOTO_STORE_ACCESS_KEY_ID: 'S3RVER', PHOTO_STORE_SECRET_ACCESS_KEY: 'S3RVER' };

/**
 * A local S3-compatible store for the demo and the tests (s3rver), on loopback, keeping its objects as files in
 * `directory`. The bucket is made when missing; objects already in the folder are kept.
 */
export async function startFakeObjectStore(options: {
  directory: string;
  port: number;
  bucket?: string;
}): Promise<FakeObjectStore> {
  const bucket = options.bucket ?? 'gaugewalk-photos';
  mkdirSync(options.directory, { recursive: true });
  const server = new S3rver({
    port: options.port,
    address: '127.0.0.1',
    silent: true,
    directory: options.directory,
    configureBuckets: [{ name: bucket, configs: [] }],
  });
  const address = await server.run();
  const endpoint = `http://127.0.0.1:${address.port}`;
  let stopping: Promise<void> | undefined;
  return {
    endpoint,
    bucket,
    env: {
      PHOTO_STORE_ENDPOINT: endpoint,
      PHOTO_STORE_BUCKET: bucket,
      PHOTO_STORE_REGION: 'us-east-1',
      PHOTO_STORE_PATH_STYLE: 'true',
      ...fakeKeys,
    },
    stop: () => (stopping ??= server.close()),
  };
}
