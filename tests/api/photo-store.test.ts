import { describe, expect, inject, it } from 'vitest';
import { createHash } from 'node:crypto';
import { DeleteObjectCommand, GetObjectCommand, S3Client } from '@aws-sdk/client-s3';
import { appForThisFile, buildApp, Client, makeStaff } from '../setup/api-harness';
import { signedIn } from '../setup/sign-in';
import { findFreePort } from '@server/db/local-server';
import { Photo } from '@server/db/models';
import { onePixelPng, jfifJpeg } from '../setup/images';

const { app } = appForThisFile();

/** The bucket as any other S3 client sees it: the SDK straight, none of the app's code. */
function bucketClient() {
  const env = inject('photoStoreEnv');
  return {
    bucket: env.PHOTO_STORE_BUCKET!,
    s3: new S3Client({
      endpoint: env.PHOTO_STORE_ENDPOINT,
      region: env.PHOTO_STORE_REGION,
      forcePathStyle: true,
      credentials: {
        accessKeyId: env.PHOTO_STORE_ACCESS_KEY_ID!,
        secretAccessKey: env.PHOTO_STORE_SECRET_ACCESS_KEY!,
      },
    }),
  };
}

const png = onePixelPng;
// A JPEG start-of-image with a JFIF header, and a WebP RIFF header, each followed by bytes of every value.
const everyByte = Buffer.from(Array.from({ length: 256 }, (_, i) => i));
const jpeg = jfifJpeg(everyByte);
const webp = Buffer.concat([
  Buffer.from('RIFF'),
  Buffer.from([0x24, 0x01, 0, 0]),
  Buffer.from('WEBPVP8 '),
  everyByte,
]);

const upload = (client: Client, bytes: Buffer, filename: string, contentType: string) =>
  client.agent
    .post('/api/photos')
    .set('X-CSRF-Token', client.csrf)
    .attach('photo', bytes, { filename, contentType });

const sha256 = (bytes: Buffer) => createHash('sha256').update(bytes).digest('hex');

describe('photos in the object store', () => {
  it.each([
    ['PNG', png, 'png', 'image/png'],
    ['JPEG', jpeg, 'jpg', 'image/jpeg'],
    ['WebP', webp, 'webp', 'image/webp'],
  ] as const)(
    'when a %s photo is uploaded, then the bucket holds the same bytes with its content type and fingerprint, and the app serves them back unchanged',
    async (_, bytes, ext, mime) => {
      const { client } = await signedIn(app, ['mechanic'], 'kiosk');
      // The browser's claim is wrong on purpose: the stored type comes from the bytes.
      const up = await upload(client, bytes, `evidence.${ext}`, 'application/octet-stream');
      expect(up.status).toBe(201);
      expect(up.body).toMatchObject({ mimeType: mime, sizeBytes: bytes.length, sha256: sha256(bytes) });

      const { s3, bucket } = bucketClient();
      const object = await s3.send(
        new GetObjectCommand({ Bucket: bucket, Key: `photos/${up.body.id}.${ext}` }),
      );
      const inBucket = Buffer.from(await object.Body!.transformToByteArray());
      expect(Buffer.compare(inBucket, bytes)).toBe(0);
      expect(object.ContentType).toBe(mime);
      expect(object.Metadata?.sha256).toBe(sha256(bytes));
      s3.destroy();

      const served = await client.get(`/api/photos/${up.body.id}`).buffer(true);
      expect(served.status).toBe(200);
      expect(served.headers['content-type']).toBe(mime);
      expect(served.headers['x-content-type-options']).toBe('nosniff');
      expect(served.headers['cache-control']).toBe('no-store');
      expect(Buffer.compare(served.body as Buffer, bytes)).toBe(0);
    },
  );

  it('when the object is gone from the bucket, then reading the photo is a 404 that says so in words', async () => {
    const { client } = await signedIn(app, ['mechanic'], 'kiosk');
    const up = await upload(client, png, 'gone.png', 'image/png');
    expect(up.status).toBe(201);
    const { s3, bucket } = bucketClient();
    await s3.send(new DeleteObjectCommand({ Bucket: bucket, Key: `photos/${up.body.id}.png` }));
    s3.destroy();
    const res = await client.get(`/api/photos/${up.body.id}`);
    expect(res.status).toBe(404);
    expect(res.body).toEqual({
      code: 'photo_file_missing',
      message: 'The photo is recorded but its file is missing from the photo store.',
    });
  });

  it('when the photo store does not answer, then the upload is refused with 503 and a plain message, and no photo is recorded', async () => {
    const closedPort = await findFreePort(0);
    const down = buildApp({ PHOTO_STORE_ENDPOINT: `http://127.0.0.1:${closedPort}` });
    const { badge, pin } = await makeStaff(['mechanic']);
    const client = await Client.kiosk(down.app);
    await client.signInKiosk(badge, pin);
    const before = await Photo.count();
    const res = await upload(client, png, 'p.png', 'image/png');
    expect(res.status).toBe(503);
    expect(res.body).toEqual({
      code: 'photo_store_unavailable',
      message:
        'The photo store does not answer just now. Try the photo again in a minute; the readings entered are kept.',
    });
    expect(await Photo.count()).toBe(before);
    down.close();
  });

  it('when no photo store is configured, then the upload is refused with the same 503 and nothing is recorded', async () => {
    const none = buildApp({ PHOTO_STORE_ENDPOINT: '' });
    const { badge, pin } = await makeStaff(['mechanic']);
    const client = await Client.kiosk(none.app);
    await client.signInKiosk(badge, pin);
    const before = await Photo.count();
    const res = await upload(client, png, 'p.png', 'image/png');
    expect(res.status).toBe(503);
    expect(res.body.code).toBe('photo_store_unavailable');
    expect(await Photo.count()).toBe(before);
    none.close();
  });
});
