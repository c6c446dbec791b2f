import { describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { appForThisFile, Client, makeAirframe, testPhotoStore } from '../setup/api-harness';
import { preFlightBody, topUp } from '../setup/check-builder';
import { signedIn } from '../setup/sign-in';
import { Check, Photo, ServicingEntry } from '@server/db/models';
import { photoKey } from '@server/storage/photo-store';
import type { AirframeSummary } from '@shared/schemas/airframes';
import { onePixelPng, jfifJpeg } from '../setup/images';

const { app } = appForThisFile();

const signedInMechanic = () => signedIn(app, ['mechanic'], 'kiosk');

const png = onePixelPng;
const jpeg = jfifJpeg(Buffer.alloc(64));

function upload(client: Client, bytes: Buffer, filename: string, contentType = 'image/png') {
  return client.agent
    .post('/api/photos')
    .set('X-CSRF-Token', client.csrf)
    .attach('photo', bytes, { filename, contentType });
}

describe('servicing inside a check', () => {
  it('when fluid is added at a low level with an approved fluid and batch, then the quantity in litres, fluid, batch and both levels are recorded', async () => {
    const { client, pin } = await signedInMechanic();
    const { airframe, limits } = await makeAirframe();
    const body = preFlightBody(airframe.id, limits.id, pin, {
      servicing: [topUp({ quantity: { value: 1, unit: 'US_qt' } })],
    });
    const res = await client.post('/api/checks', body);
    expect(res.status).toBe(201);
    // 1 US liquid quart = 0.946352946 L exactly (NIST SP 811, B.9: 9.463529E-04 m3).
    expect(res.body.servicing).toEqual([
      {
        code: 'sys1.level',
        system: 'sys1',
        quantityL: expect.closeTo(0.946352946, 12),
        entered: { value: 1, unit: 'US_qt' },
        fluidSpec: 'MIL-PRF-83282',
        batch: 'LOT 24-117',
        canOpenedOn: '2026-01-05',
        levelBefore: { value: 6.1, unit: 'L' },
        tool: null,
        addedAt: res.body.signedAt,
      },
    ]);
    expect(await ServicingEntry.count({ where: { checkId: body.id } })).toBe(1);
  });

  it('when the fluid is of another base than the type uses, then the check is refused with the mixing warning and nothing is stored', async () => {
    const { client, pin } = await signedInMechanic();
    const { airframe, limits } = await makeAirframe();
    const body = preFlightBody(airframe.id, limits.id, pin, {
      servicing: [topUp({ fluidSpec: 'MIL-PRF-5606', batch: 'A1' })],
    });
    const res = await client.post('/api/checks', body);
    expect(res.status).toBe(400);
    expect(res.body.code).toBe('fluid_wrong_base');
    expect(res.body.message).toMatch(/DO NOT ADD MIL-PRF-5606/);
    expect(await Check.count({ where: { id: body.id } })).toBe(0);
  });

  it('when the fluid is not on the type list, or the batch is missing, then the answer names what to fix', async () => {
    const { client, pin } = await signedInMechanic();
    const { airframe, limits } = await makeAirframe();
    const unknown = await client.post(
      '/api/checks',
      preFlightBody(airframe.id, limits.id, pin, {
        servicing: [topUp({ fluidSpec: 'HOUSE-OIL-9', batch: 'A1' })],
      }),
    );
    expect(unknown.status).toBe(400);
    expect(unknown.body.message).toMatch(/not approved.*MIL-PRF-83282/);
    const noBatch = await client.post(
      '/api/checks',
      preFlightBody(airframe.id, limits.id, pin, {
        servicing: [topUp({ batch: '' })],
      }),
    );
    expect(noBatch.status).toBe(400);
    expect(noBatch.body.message).toMatch(/batch/i);
  });
});

describe('the answer to a signed check', () => {
  it('when a check with a top-up, a photo and a finding is signed, then its answer equals reading it back and a resend', async () => {
    const { client, pin } = await signedInMechanic();
    const up = await upload(client, png, 'leak.png');
    const { airframe, limits } = await makeAirframe();
    const body = preFlightBody(airframe.id, limits.id, pin, {
      note: 'Wet patch under the pump.',
      servicing: [topUp()],
    });
    body.readings[5] = {
      code: 'sys1.leaks',
      entry: { dropsPerMinute: 12, leakState: 'dynamic' },
      photoIds: [up.body.id],
    };
    const signed = await client.post('/api/checks', body);
    expect(signed.status).toBe(201);
    expect(signed.body.holdOpened).toBe(true);
    expect(signed.body.servicing).toHaveLength(1);
    expect(signed.body.readings[5].photos).toHaveLength(1);
    const readBack = await client.get(`/api/checks/${body.id}`);
    expect(readBack.status).toBe(200);
    expect(signed.body).toEqual(readBack.body);
    const resent = await client.post('/api/checks', body);
    expect(resent.headers['idempotent-replay']).toBe('true');
    expect(resent.body).toEqual(readBack.body);
  });
});

describe('photos', () => {
  it('when a photo is uploaded and attached to a reading, then it is stored in the photo store and shown with the check', async () => {
    const { client, pin } = await signedInMechanic();
    const up = await upload(client, png, 'leak.png');
    expect(up.status).toBe(201);
    expect(up.body).toMatchObject({ mimeType: 'image/png', sizeBytes: png.length });
    const { airframe, limits } = await makeAirframe();
    const body = preFlightBody(airframe.id, limits.id, pin);
    body.readings[5] = { ...body.readings[5]!, photoIds: [up.body.id] };
    const signed = await client.post('/api/checks', body);
    expect(signed.status).toBe(201);
    expect(signed.body.readings[5].photos).toEqual([
      {
        id: up.body.id,
        mimeType: 'image/png',
        sizeBytes: png.length,
        sha256: up.body.sha256,
        uploadedAt: expect.stringMatching(/^\d{4}-\d\d-\d\dT/),
      },
    ]);
    const file = await client.get(`/api/photos/${up.body.id}`);
    expect(file.status).toBe(200);
    expect(file.headers['content-type']).toBe('image/png');
    expect(Buffer.compare(file.body as Buffer, png)).toBe(0);
  });

  it('when the upload is not an image, then it is refused with 415 and a message, even if it claims to be one', async () => {
    const { client } = await signedInMechanic();
    const res = await upload(client, Buffer.from('#!/bin/sh\necho hi\n'), 'photo.jpg', 'image/jpeg');
    expect(res.status).toBe(415);
    expect(res.body.message).toMatch(/not a photo/);
  });

  it('when the upload is larger than 8 MB, then it is refused with 413 and a message', async () => {
    const { client } = await signedInMechanic();
    const big = Buffer.concat([jpeg, Buffer.alloc(8 * 1024 * 1024)]);
    const res = await upload(client, big, 'big.jpg', 'image/jpeg');
    expect(res.status).toBe(413);
    expect(res.body.message).toMatch(/larger than 8 MB/);
  });

  it('when the file name carries a path, then the photo is still stored in the photo store under a key of our own', async () => {
    const { client } = await signedInMechanic();
    const res = await upload(client, jpeg, '../../../../etc/cron.d/evil.jpg', 'image/jpeg');
    expect(res.status).toBe(201);
    const photo = await Photo.findByPk(res.body.id);
    expect(photo!.storedName).toBe(`${res.body.id}.jpg`);
    const store = testPhotoStore();
    expect(await store.head(photoKey(photo!.storedName))).toMatchObject({ bytes: jpeg.length });
    const keys = [];
    for await (const key of store.keys('')) keys.push(key);
    expect(keys).toContain(`photos/${res.body.id}.jpg`);
    expect(keys.every((key) => /^photos\/[0-9a-f-]{36}\.(jpg|png|webp)$/.test(key))).toBe(true);
    store.close();
  });

  it("when a check names another person's photo, then it is refused", async () => {
    const other = await signedInMechanic();
    const up = await upload(other.client, png, 'p.png');
    const { client, pin } = await signedInMechanic();
    const { airframe, limits } = await makeAirframe();
    const body = preFlightBody(airframe.id, limits.id, pin);
    body.readings[0] = { ...body.readings[0]!, photoIds: [up.body.id] };
    const res = await client.post('/api/checks', body);
    expect(res.status).toBe(400);
    expect(res.body.code).toBe('photo_unknown');
  });

  it('when two checks claim the same photo at once, then one is stored with it and the other is refused and not stored', async () => {
    const { client, pin } = await signedInMechanic();
    const up = await upload(client, png, 'p.png');
    const { airframe, limits } = await makeAirframe();
    const bodies = [0, 1].map(() => {
      const body = preFlightBody(airframe.id, limits.id, pin);
      body.readings[5] = { ...body.readings[5]!, photoIds: [up.body.id] };
      return body;
    });
    const answers = await Promise.all(bodies.map((body) => client.post('/api/checks', body)));
    expect(answers.map((a) => a.status).sort()).toEqual([201, 400]);
    const loser = answers.findIndex((a) => a.status === 400);
    expect(answers[loser]!.body.code).toBe('photo_unknown');
    expect(await Check.findByPk(bodies[loser]!.id)).toBeNull();
    expect((await Photo.findByPk(up.body.id))!.checkId).toBe(bodies[1 - loser]!.id);
  });
});

describe('signed records and checks in progress', () => {
  it('when someone tries to change or delete a signed check, then it is refused with 409 and the record is unchanged', async () => {
    const { client, pin } = await signedInMechanic();
    const { airframe, limits } = await makeAirframe();
    const body = preFlightBody(airframe.id, limits.id, pin);
    const signed = await client.post('/api/checks', body);
    for (const method of ['put', 'patch', 'delete'] as const) {
      const res = await client.agent[method](`/api/checks/${body.id}`)
        .set('X-CSRF-Token', client.csrf)
        .send({ verdict: 'in_limits' });
      expect(res.status).toBe(409);
      expect(res.body.code).toBe('signed_check_immutable');
    }
    expect((await client.get(`/api/checks/${body.id}`)).body).toEqual(signed.body);
  });

  it('when a correction is signed, then it is a new check that points at the old one, and the old one stays', async () => {
    const { client, pin } = await signedInMechanic();
    const { airframe, limits } = await makeAirframe();
    const first = preFlightBody(airframe.id, limits.id, pin);
    await client.post('/api/checks', first);
    const correction = preFlightBody(airframe.id, limits.id, pin, {
      correctsCheckId: first.id,
      note: 'System 2 glass re-read in better light.',
    });
    const res = await client.post('/api/checks', correction);
    expect(res.status).toBe(201);
    expect(res.body.correctsCheckId).toBe(first.id);
    expect(await Check.count({ where: { airframeId: airframe.id } })).toBe(2);
  });

  it('when a mechanic starts a check, then the airframe shows in progress until the check is signed', async () => {
    const { client, pin } = await signedInMechanic();
    const { airframe, limits } = await makeAirframe();
    const id = randomUUID();
    const draft = await client.post('/api/check-drafts', { id, airframeId: airframe.id, kind: 'pre_flight' });
    expect(draft.status).toBe(200);
    let summary: AirframeSummary = (await client.get(`/api/airframes/${airframe.id}`)).body;
    expect(summary.state).toBe('in_progress');
    await client.post('/api/checks', preFlightBody(airframe.id, limits.id, pin, { id }));
    summary = (await client.get(`/api/airframes/${airframe.id}`)).body;
    expect(summary.state).toBe('checks_in_limits');
  });
});

describe('a finding cannot be topped up out of sight', () => {
  it('when the level before a top-up was out of limits, then the check is refused and nothing is stored', async () => {
    const { client, pin } = await signedInMechanic();
    const { airframe, limits } = await makeAirframe();
    const body = preFlightBody(airframe.id, limits.id, pin, {
      servicing: [
        topUp({
          quantity: { value: 4.5, unit: 'L' },
          batch: 'LOT 7',
          levelBefore: { value: 2.5, unit: 'L' },
        }),
      ],
    });
    const res = await client.post('/api/checks', body);
    expect(res.status).toBe(400);
    expect(res.body.code).toBe('servicing_hides_finding');
    expect(res.body.message).toMatch(/Sign the level as found/);
    expect(await Check.count({ where: { id: body.id } })).toBe(0);
  });
});
