import { describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { appForThisFile, Client, database, makeKioskToken, makeStaff } from '../setup/api-harness';
import { KioskDevice, Staff } from '@server/db/models';
import { KIOSK_COOKIE } from '@server/middleware/kiosk-device';
import { readSessionData } from '@server/db/session-rows';
import { staffById } from '@server/features/auth/auth.repository';
import { enrolledDevice } from '@server/db/kiosk-device-rows';
import { sha256 } from '@server/security/hashing';

// A signed-in tablet's session is read with its person and its tablet in one statement (server/db/session-rows.ts).
// What those rows allow is still decided where they are used, so each change below must end the session at once.
const { app } = appForThisFile();

/** A mechanic signed in on a tablet of their own: the client, the tablet's token and row, and the person. */
async function signedInTablet() {
  const mechanic = await makeStaff(['mechanic']);
  const { token, device } = await makeKioskToken();
  const client = new Client(app);
  client.agent.jar.setCookie(`${KIOSK_COOKIE}=${token}; Path=/`, '127.0.0.1', '/');
  await client.refresh();
  await client.signInKiosk(mechanic.badge, mechanic.pin);
  return { client, token, device, mechanic };
}

const sessionIdOf = (client: Client) => {
  const cookie = client.agent.jar.getCookie('gw_session', {
    domain: '127.0.0.1',
    path: '/',
    secure: false,
    script: false,
  });
  // express-session signs the id: "s:<id>.<signature>", URL-encoded.
  return /^s:([^.]+)\./.exec(decodeURIComponent(cookie!.value))![1]!;
};

describe('the session read with its person and tablet', () => {
  it('when a signed-in session is read, then the person and the tablet come back as their own reads give them', async () => {
    const { client, token, device, mechanic } = await signedInTablet();
    const read = await readSessionData(database(), sessionIdOf(client), new Date());
    expect(read).not.toBeNull();
    expect(JSON.parse(read!.data)).toMatchObject({
      passport: { user: mechanic.staff.id },
      kioskId: device.id,
    });
    expect(read!.staff).toEqual(await staffById(mechanic.staff.id));
    expect(read!.device).toEqual(await enrolledDevice(sha256(token), new Date(0)));
  });

  it('when the badge is deactivated during a session, then the next request is signed out', async () => {
    const { client, mechanic } = await signedInTablet();
    expect((await client.get('/api/session')).body.user).toMatchObject({ id: mechanic.staff.id });
    await Staff.update({ active: false }, { where: { id: mechanic.staff.id } });
    // Reading a check needs someone signed in: no longer this badge.
    expect((await client.get(`/api/checks/${randomUUID()}`)).status).toBe(401);
    expect((await client.get('/api/session')).body.user).toBeNull();
  });

  it('when the tablet is revoked during a session, then the next request is refused and the session ends', async () => {
    const { client, device } = await signedInTablet();
    expect((await client.get('/api/airframes')).status).toBe(200);
    await KioskDevice.update({ revokedAt: new Date() }, { where: { id: device.id } });
    const after = await client.get('/api/airframes');
    expect(after.status).toBe(401);
    expect(after.body.code).toBe('kiosk_revoked');
    expect((await client.get('/api/session')).body.user).toBeNull();
  });

  it('when the session is sent with another tablet’s cookie, then the tablet read with the session is not taken for it', async () => {
    const { client } = await signedInTablet();
    const other = await makeKioskToken();
    client.agent.jar.setCookie(`${KIOSK_COOKIE}=${other.token}; Path=/`, '127.0.0.1', '/');
    const after = await client.get('/api/airframes');
    expect(after.status).toBe(401);
    expect(after.body.code).toBe('kiosk_revoked');
  });
});
