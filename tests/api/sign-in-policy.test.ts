import { afterAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { randomUUID } from 'node:crypto';
import { gzipSync } from 'node:zlib';
import { buildApp, Client, database, makeStaff } from '../setup/api-harness';
import { signedIn } from '../setup/sign-in';
import { AuditEvent, KioskDevice, Session, Staff } from '@server/db/models';
import { hashSecret } from '@server/security/hashing';
import { KIOSK_COOKIE } from '@server/middleware/kiosk-device';

// OWASP Authentication Cheat Sheet: one answer, after the same work, for an unknown user and a wrong password;
// slow repeated failures down before any lock, and do not let an outsider lock accounts.

const { app, close } = buildApp();
const apps = [close];
const appWith = (overrides: Record<string, string>) => {
  const built = buildApp(overrides);
  apps.push(built.close);
  return built.app;
};
afterAll(async () => {
  for (const stop of apps) stop();
  await database().close();
});

const unknownBadge = () => `U${randomUUID().slice(0, 8)}`;
const shape = (res: request.Response) => ({ status: res.status, body: res.body as Record<string, unknown> });

describe('one answer for every failed sign-in', () => {
  it('when a kiosk sign-in has an unknown badge, a wrong PIN or an inactive badge, then the answers are the same', async () => {
    const wrong = await makeStaff(['mechanic']);
    const inactive = await makeStaff(['mechanic']);
    await inactive.staff.update({ active: false });
    const kiosk = await Client.kiosk(app);
    const answers = [
      await kiosk.post('/api/auth/kiosk', { badge: unknownBadge(), pin: '1357' }),
      await kiosk.post('/api/auth/kiosk', { badge: wrong.badge, pin: '1357' }),
      await kiosk.post('/api/auth/kiosk', { badge: inactive.badge, pin: inactive.pin }),
    ].map(shape);
    expect(answers[0]!.status).toBe(401);
    expect(answers[1]).toEqual(answers[0]);
    expect(answers[2]).toEqual(answers[0]);
    expect(Object.keys(answers[0]!.body).sort()).toEqual(['code', 'message']);
  });

  it('when a desk sign-in has an unknown badge, a wrong password, an inactive badge or no desk password, then the answers are the same', async () => {
    const wrong = await makeStaff(['shift_lead'], { password: 'lead-pass-123' });
    const inactive = await makeStaff(['shift_lead'], { password: 'lead-pass-456' });
    await inactive.staff.update({ active: false });
    const mechanic = await makeStaff(['mechanic']);
    const desk = new Client(app);
    const answers = [
      await desk.signInDesk(unknownBadge(), 'some-password'),
      await desk.signInDesk(wrong.badge, 'some-password'),
      await desk.signInDesk(inactive.badge, 'lead-pass-456'),
      await desk.signInDesk(mechanic.badge, 'some-password'),
    ].map(shape);
    expect(answers[0]!.status).toBe(401);
    for (const answer of answers.slice(1)) expect(answer).toEqual(answers[0]);
  });

  it('when the badge is unknown, inactive or has no desk password, then the answer takes as long as a wrong password', async () => {
    // A real cost, so one comparison (about 50 ms) stands well above the noise of a request.
    const slow = appWith({ BCRYPT_COST: '10' });
    const make = async (active: boolean, password: string | null) =>
      (
        await Staff.create({
          badgeNumber: unknownBadge(),
          name: 'Timing test',
          licenceNumber: null,
          roles: 'shift_lead',
          pinHash: await hashSecret('2580', 10),
          passwordHash: password ? await hashSecret(password, 10) : null,
          lockedUntil: null,
          active,
        })
      ).badgeNumber;
    const desk = new Client(slow);
    await desk.signInDesk(unknownBadge(), 'warm-up-password');
    const timed = async (badge: string) => {
      const started = performance.now();
      const res = await desk.signInDesk(badge, 'not-the-password');
      expect(res.status).toBe(401);
      return performance.now() - started;
    };
    // Each attempt on a badge of its own, so the per-badge slowing down does not add to the times; the kinds take
    // turns, so a busy machine slows them alike. Before, an inactive badge or one without a password answered
    // without any comparison, in a tenth of the time.
    const kinds = {
      wrongSecret: () => make(true, 'the-password-1'),
      unknown: async () => unknownBadge(),
      inactive: () => make(false, 'the-password-1'),
      noPassword: () => make(true, null),
    };
    const times: Record<keyof typeof kinds, number[]> = {
      wrongSecret: [],
      unknown: [],
      inactive: [],
      noPassword: [],
    };
    for (let round = 0; round < 5; round++) {
      for (const kind of Object.keys(kinds) as (keyof typeof kinds)[]) {
        times[kind].push(await timed(await kinds[kind]()));
      }
    }
    const median = (list: number[]) => [...list].sort((a, b) => a - b)[2]!;
    for (const kind of ['unknown', 'inactive', 'noPassword'] as const) {
      expect(median(times[kind]), kind).toBeGreaterThan(median(times.wrongSecret) * 0.4);
    }
  });
});

describe('slowing down and locking', () => {
  it('when a badge fails again, then the next answer comes later, for a badge that exists and for one that does not', async () => {
    const mechanic = await makeStaff(['mechanic']);
    const desk = new Client(app);
    for (const badge of [mechanic.badge, unknownBadge()]) {
      await desk.signInDesk(badge, 'wrong-password');
      const started = performance.now();
      const second = await desk.signInDesk(badge, 'wrong-password');
      expect(second.status).toBe(401);
      expect(performance.now() - started).toBeGreaterThanOrEqual(240);
    }
  });

  it('when wrong passwords for a lead come from one address, then the badge is slowed but never locked, and the right password still works', async () => {
    const strict = appWith({ PIN_MAX_ATTEMPTS: '3' });
    const lead = await makeStaff(['shift_lead'], { password: 'lead-pass-789' });
    const outsider = new Client(strict);
    const statuses: number[] = [];
    for (let i = 0; i < 5; i++) statuses.push((await outsider.signInDesk(lead.badge, 'guess-' + i)).status);
    expect(statuses).toEqual([401, 401, 401, 401, 401]);
    await lead.staff.reload();
    expect(lead.staff.lockedUntil).toBeNull();
    const owner = new Client(strict);
    const res = await owner.signInDesk(lead.badge, 'lead-pass-789');
    expect(res.status).toBe(200);
  });

  it('when wrong passwords for a badge come from many addresses, then it locks', async () => {
    const behindProxy = appWith({ PIN_MAX_ATTEMPTS: '3', LOCK_MIN_ADDRESSES: '3', TRUST_PROXY: 'loopback' });
    const lead = await makeStaff(['shift_lead'], { password: 'lead-pass-321' });
    const client = new Client(behindProxy);
    await client.refresh();
    const statuses: number[] = [];
    for (const address of ['198.51.100.1', '198.51.100.2', '198.51.100.3']) {
      const res = await client.agent
        .post('/api/auth/desk')
        .set('X-CSRF-Token', client.csrf)
        .set('X-Forwarded-For', address)
        .send({ badge: lead.badge, password: 'wrong-one' });
      statuses.push(res.status);
    }
    expect(statuses).toEqual([401, 401, 423]);
    await lead.staff.reload();
    expect(lead.staff.lockedUntil!.getTime()).toBeGreaterThan(Date.now());
  });

  it('when wrong PINs for a badge that does not exist come from a tablet, then it "locks" with the same answer as a real badge', async () => {
    const strict = appWith({ PIN_MAX_ATTEMPTS: '3' });
    const real = await makeStaff(['mechanic']);
    const answers: { status: number; code: string }[][] = [];
    for (const badge of [real.badge, unknownBadge()]) {
      const kiosk = await Client.kiosk(strict);
      const list: { status: number; code: string }[] = [];
      for (let i = 0; i < 4; i++) {
        const res = await kiosk.post('/api/auth/kiosk', { badge, pin: '9753' });
        list.push({ status: res.status, code: res.body.code });
      }
      answers.push(list);
    }
    expect(answers[0]!.map((a) => a.status)).toEqual([401, 401, 423, 423]);
    expect(answers[1]).toEqual(answers[0]);
  });

  it('when a lead lifts a lock, then the right PIN works at once and the trail names who lifted it; a mechanic cannot', async () => {
    const locked = await makeStaff(['mechanic']);
    const tablet = await Client.kiosk(app);
    for (let i = 0; i < 5; i++) await tablet.post('/api/auth/kiosk', { badge: locked.badge, pin: '9999' });
    expect((await tablet.post('/api/auth/kiosk', { badge: locked.badge, pin: locked.pin })).status).toBe(423);
    const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
    const refused = await mechanic.client.post(`/api/staff/${locked.staff.id}/unlock`);
    expect(refused.status).toBe(403);
    const lead = await signedIn(app, ['shift_lead'], 'desk');
    const res = await lead.client.post(`/api/staff/${locked.staff.id}/unlock`);
    expect(res.status).toBe(200);
    expect(res.body.lockedUntil).toBeNull();
    const event = await AuditEvent.findOne({
      where: { action: 'staff.unlocked', entityId: String(locked.staff.id) },
    });
    expect(event?.actorId).toBe(lead.staff.id);
    const kiosk = await Client.kiosk(app);
    expect((await kiosk.post('/api/auth/kiosk', { badge: locked.badge, pin: locked.pin })).status).toBe(200);
    const again = await lead.client.post(`/api/staff/${locked.staff.id}/unlock`);
    expect(again.status).toBe(409);
  });
});

describe('proxy trust', () => {
  const attempts = async (target: ReturnType<typeof appWith>) => {
    const client = new Client(target);
    await client.refresh();
    const codes: string[] = [];
    for (let i = 0; i < 200; i++) {
      const res = await client.agent
        .post('/api/auth/desk')
        .set('X-CSRF-Token', client.csrf)
        .set('X-Forwarded-For', `203.0.113.${i % 250}, 10.1.${i % 200}.${i % 250}`)
        .send({ badge: unknownBadge(), password: 'not-a-real-one' });
      codes.push(res.status === 429 ? String(res.body.code) : String(res.status));
    }
    return codes;
  };

  it('when 200 sign-ins come with rotating X-Forwarded-For and no trusted proxy, then they count as one address', async () => {
    const codes = await attempts(appWith({ SIGN_IN_RATE_PER_MINUTE: '10' }));
    expect(codes.slice(0, 10)).toEqual(Array(10).fill('401'));
    expect(codes.slice(10).every((c) => c === 'too_many_attempts')).toBe(true);
  });

  it('when the proxy is trusted by TRUST_PROXY, then each forwarded address counts on its own', async () => {
    const codes = await attempts(appWith({ SIGN_IN_RATE_PER_MINUTE: '10', TRUST_PROXY: 'loopback' }));
    expect(codes.filter((c) => c === 'too_many_attempts').length).toBe(0);
  });
});

describe('sessions, headers and refusals', () => {
  it('when a visitor with no cookie asks for the session, then no session row is stored and the sign-in still works', async () => {
    const before = await Session.count();
    for (let i = 0; i < 5; i++) {
      const res = await request(app).get('/api/session').expect(200);
      expect(String(res.headers['set-cookie'] ?? '')).not.toMatch(/gw_session=/);
    }
    expect(await Session.count()).toBe(before);
    const { badge, pin } = await makeStaff(['mechanic']);
    const kiosk = await Client.kiosk(app);
    expect((await kiosk.signInKiosk(badge, pin)).body.user.badgeNumber).toBe(badge);
  });

  it('when someone plants their own session id in a browser before its owner signs in, then the sign-in gets a new id', async () => {
    // With no anonymous session rows, the only id an attacker can plant is one of a session of their own.
    const attacker = await signedIn(app, ['engineering'], 'desk');
    const access = { path: '/', domain: '127.0.0.1', secure: false, script: false };
    const plantedCookie = attacker.client.agent.jar.getCookie('gw_session', access)!.toValueString();
    const victimStaff = await makeStaff(['engineering'], { password: 'victim-pass-1' });
    const victim = new Client(app);
    victim.agent.jar.setCookie(`${plantedCookie}; Path=/`, '127.0.0.1', '/');
    const res = await victim.signInDesk(victimStaff.badge, 'victim-pass-1');
    expect(res.status).toBe(200);
    const newCookie = /gw_session=[^;]+/.exec(String(res.headers['set-cookie']))![0];
    expect(newCookie).not.toBe(plantedCookie);
    const withPlanted = await request(app).get('/api/session').set('Cookie', plantedCookie);
    expect(withPlanted.body.user?.badgeNumber).not.toBe(victimStaff.badge);
  });

  it('when an anonymous CSRF token is taken from one browser to another, then it is refused', async () => {
    const first = new Client(app);
    await first.refresh();
    const second = new Client(app);
    const res = await second.agent
      .post('/api/auth/desk')
      .set('X-CSRF-Token', first.csrf)
      .send({ badge: unknownBadge(), password: 'whatever-pass' });
    expect(res.status).toBe(403);
    expect(res.body.code).toBe('csrf_invalid');
  });

  it('when a signed-in person reads the API, then every answer says no-store and only the camera is allowed', async () => {
    const engineer = await signedIn(app, ['engineering'], 'desk');
    for (const path of [
      '/api/session',
      '/api/airframes',
      '/api/staff',
      '/api/records',
      '/api/kiosks',
      '/api/nope',
    ]) {
      const res = await engineer.client.get(path);
      expect(res.headers['cache-control'], path).toBe('no-store');
      expect(res.headers['permissions-policy'], path).toMatch(/^camera=\(self\)(, [a-z-]+=\(\))+$/);
    }
  });

  it('when a gzip body is broken, then the answer is in our words, not zlib codes', async () => {
    const client = new Client(app);
    await client.refresh();
    const broken = Buffer.concat([
      gzipSync('{"badge":"4101","pin":"2468"}').subarray(0, 12),
      Buffer.from('xx'),
    ]);
    const res = await client.agent
      .post('/api/auth/desk')
      .set('X-CSRF-Token', client.csrf)
      .set('Content-Type', 'application/json')
      .set('Content-Encoding', 'gzip')
      .send(broken);
    expect(res.status).toBe(400);
    expect(res.body.code).toMatch(/^[a-z_]+$/);
    expect(JSON.stringify(res.body)).not.toMatch(/Z_|zlib|header check|unexpected end/i);
  });

  it('when a tablet enrols, then its cookie lasts 90 days, and a tablet unseen for longer is no longer a kiosk', async () => {
    const engineer = await signedIn(app, ['engineering'], 'desk');
    const enrolment = await engineer.client.post('/api/kiosks', { name: 'Lifetime test tablet' });
    const tablet = new Client(app);
    const res = await tablet.post('/api/kiosks/enrol', { code: enrolment.body.code });
    expect(res.status).toBe(200);
    const cookie = String(res.headers['set-cookie'])
      .split(/,(?=\s*gw_)/)
      .find((c) => c.includes(`${KIOSK_COOKIE}=`))!;
    const maxAge = Number(/Max-Age=(\d+)/.exec(cookie)?.[1]);
    expect(maxAge).toBe(90 * 24 * 3600);
    expect((await tablet.get('/api/session')).body.kiosk).not.toBeNull();
    await KioskDevice.update(
      { lastSeenAt: new Date(Date.now() - 91 * 24 * 3_600_000) },
      { where: { id: res.body.kiosk.id } },
    );
    expect((await tablet.get('/api/session')).body.kiosk).toBeNull();
  });
});
