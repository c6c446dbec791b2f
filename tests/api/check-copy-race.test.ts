import { describe, expect, it, vi } from 'vitest';
import { appForThisFile, Client, makeAirframe } from '../setup/api-harness';
import { preFlightBody } from '../setup/check-builder';
import { signedIn } from '../setup/sign-in';
import { onePixelPng } from '../setup/images';
import { AuditEvent, Check, Photo, Reading } from '@server/db/models';

/**
 * The one interleaving a tablet's two copies of a check can meet (its resend through a second instance, or a double
 * tap): the late copy looks for the check and finds none, the early copy commits, and only then does the late copy
 * read its photos, now part of that very check. `signingTargets` is wrapped so that the test holds the late copy
 * between those two reads until the early copy is stored.
 */
const hold = vi.hoisted(() => ({ checkId: null as string | null, until: null as Promise<unknown> | null }));

vi.mock('@server/features/checks/checks.repository', async (original) => {
  const real = await original<typeof import('@server/features/checks/checks.repository')>();
  return {
    ...real,
    signingTargets: async (...args: Parameters<typeof real.signingTargets>) => {
      const targets = await real.signingTargets(...args);
      if (args[1] === hold.checkId && hold.until) {
        const until = hold.until;
        hold.until = null;
        await until;
      }
      return targets;
    },
  };
});

const { app } = appForThisFile();

function upload(client: Client, bytes: Buffer) {
  return client.agent
    .post('/api/photos')
    .set('X-CSRF-Token', client.csrf)
    .attach('photo', bytes, { filename: 'p.png', contentType: 'image/png' });
}

describe('two copies of one check with a photo', () => {
  it('when the other copy is stored between the resend looking for the check and reading its photos, then the resend is answered with the stored check, not refused', async () => {
    const { client, pin } = await signedIn(app, ['mechanic'], 'kiosk');
    const photo = await upload(client, onePixelPng);
    expect(photo.status).toBe(201);
    const { airframe, limits } = await makeAirframe();
    const body = preFlightBody(airframe.id, limits.id, pin);
    body.readings[5] = { ...body.readings[5]!, photoIds: [photo.body.id] };

    let storeEarly!: () => void;
    const earlyStored = new Promise<void>((resolve) => (storeEarly = resolve));
    hold.checkId = body.id;
    hold.until = earlyStored;

    const late = client.post('/api/checks', body);
    // The late copy is now held after finding no check; the early copy is sent and stored meanwhile.
    await vi.waitFor(() => expect(hold.until).toBeNull());
    const earlyAnswer = await client.post('/api/checks', body);
    storeEarly();
    const lateAnswer = await late;

    expect(earlyAnswer.status).toBe(201);
    expect(lateAnswer.status, JSON.stringify(lateAnswer.body)).toBe(201);
    expect(lateAnswer.body).toEqual(earlyAnswer.body);
    expect(await Check.count({ where: { id: body.id } })).toBe(1);
    expect(await Reading.count({ where: { checkId: body.id } })).toBe(body.readings.length);
    expect((await Photo.findByPk(photo.body.id))!.checkId).toBe(body.id);
    expect(await AuditEvent.count({ where: { action: 'check.signed', entityId: body.id } })).toBe(1);
  });
});
