import { afterAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import bcrypt from 'bcrypt';
import { appForThisFile, buildApp, Client, database, makeKioskToken, makeStaff } from '../setup/api-harness';
import { randomUUID } from 'node:crypto';
import { AuditEvent, Session, Staff } from '@server/db/models';
import { createSessionStore } from '@server/middleware/session-store';
import { createEnrolment } from '@server/features/kiosks/kiosks.service';
import { verifyRecords } from '@server/audit/record-integrity';

const { app } = appForThisFile();

describe('health', () => {
  it('when the database is up, then /api/health answers 200 with both states', async () => {
    const res = await request(app).get('/api/health').expect(200);
    expect(res.body.app.state).toBe('up');
    expect(res.body.database.state).toBe('up');
  });
});

describe('kiosk sign-in', () => {
  it('when a mechanic signs in with the right PIN on an enrolled tablet, then the session names them and the session id changes', async () => {
    const { badge, pin, staff } = await makeStaff(['mechanic']);
    const client = await Client.kiosk(app);
    const before = await client.get('/api/session');
    const cookieBefore = String(before.headers['set-cookie'] ?? '');
    const res = await client.signInKiosk(badge, pin);
    expect(res.body.user).toMatchObject({ id: staff.id, badgeNumber: badge, roles: ['mechanic'] });
    expect(res.body.channel).toBe('kiosk');
    const sidOf = (cookie: string) => /gw_session=([^;]+)/.exec(cookie)?.[1];
    const cookieAfter = String(res.headers['set-cookie'] ?? '');
    expect(sidOf(cookieAfter)).toBeTruthy();
    expect(sidOf(cookieAfter)).not.toBe(sidOf(cookieBefore));
  });

  it('when the tablet is not enrolled, then kiosk sign-in is refused with 403', async () => {
    const { badge, pin } = await makeStaff(['mechanic']);
    const client = new Client(app);
    const res = await client.post('/api/auth/kiosk', { badge, pin });
    expect(res.status).toBe(403);
    expect(res.body.code).toBe('kiosk_not_enrolled');
  });

  it('when five wrong PINs are entered on an enrolled tablet, then the badge locks and the right PIN is refused with the time the lock ends', async () => {
    const { badge, pin } = await makeStaff(['mechanic']);
    const client = await Client.kiosk(app);
    for (let attempt = 1; attempt <= 4; attempt++) {
      const res = await client.post('/api/auth/kiosk', { badge, pin: '0000' });
      expect(res.status).toBe(401);
      // How many are left would tell an outsider the badge exists: an unknown badge has no count.
      expect(res.body.attemptsLeft).toBeUndefined();
    }
    const fifth = await client.post('/api/auth/kiosk', { badge, pin: '0000' });
    expect(fifth.status).toBe(423);
    const right = await client.post('/api/auth/kiosk', { badge, pin });
    expect(right.status).toBe(423);
    expect(right.body.code).toBe('badge_locked');
    const until = new Date(right.body.lockedUntil).getTime();
    expect(until - Date.now()).toBeGreaterThan(14 * 60_000);
    expect(until - Date.now()).toBeLessThanOrEqual(15 * 60_000);
    expect(right.body.message).toContain(new Date(until).toISOString().slice(11, 16));
  });

  it('when a lock has run out, then the right PIN works again', async () => {
    const { badge, pin, staff } = await makeStaff(['mechanic']);
    await staff.update({ lockedUntil: new Date(Date.now() - 1000) });
    const client = await Client.kiosk(app);
    await client.signInKiosk(badge, pin);
    await staff.reload();
    expect(staff.failedAttempts).toBe(0);
  });

  it('when a mechanic chooses a new PIN, then the app stores a bcrypt hash at the configured cost that matches it and not the PIN', async () => {
    const { staff, badge, pin } = await makeStaff(['mechanic']);
    const client = await Client.kiosk(app);
    await client.signInKiosk(badge, pin);
    const before = (await Staff.findByPk(staff.id))!.pinHash;
    const changed = await client.post('/api/auth/change-pin', { currentPin: pin, newPin: '9753' });
    expect(changed.status).toBe(200);
    const stored = (await Staff.findByPk(staff.id))!.pinHash!;
    expect(stored).not.toBe(before);
    // bcrypt's modular crypt format: $2b$, the cost in two digits (BCRYPT_COST is 4 in the test app), 53 characters.
    expect(stored).toMatch(/^\$2b\$04\$[./A-Za-z0-9]{53}$/);
    expect(stored).not.toContain('9753');
    expect(await bcrypt.compare('9753', stored)).toBe(true);
    expect(await bcrypt.compare(pin, stored)).toBe(false);
  });

  it('when the kiosk is idle longer than the limit, then the server ends the session', async () => {
    const short = buildApp({ KIOSK_IDLE_SECONDS: '1' });
    const { badge, pin } = await makeStaff(['mechanic']);
    const client = await Client.kiosk(short.app);
    await client.signInKiosk(badge, pin);
    expect((await client.get('/api/airframes')).status).toBe(200);
    await new Promise((r) => setTimeout(r, 1300));
    const res = await client.get('/api/airframes');
    expect(res.status).toBe(401);
    expect(res.body.code).toBe('idle_locked');
    await new Promise((r) => setTimeout(r, 1300));
    const session = await client.get('/api/session');
    short.close();
    expect(session.status).toBe(200);
    expect(session.body.user).toBeNull();
  });

  it('when the kiosk is used more often than the idle limit, then the session goes on past the limit', async () => {
    const short = buildApp({ KIOSK_IDLE_SECONDS: '1' });
    const { badge, pin } = await makeStaff(['mechanic']);
    const client = await Client.kiosk(short.app);
    await client.signInKiosk(badge, pin);
    const statuses: number[] = [];
    for (let i = 0; i < 6; i++) {
      await new Promise((r) => setTimeout(r, 400));
      statuses.push((await client.get('/api/airframes')).status);
    }
    short.close();
    expect(statuses).toEqual([200, 200, 200, 200, 200, 200]);
  });
});

describe('session store', () => {
  const store = createSessionStore(database());
  afterAll(() => store.stopExpiringSessions());
  const cookie = (expires: Date) => ({ originalMaxAge: 1000, expires, httpOnly: true, path: '/' });
  const read = (sid: string) =>
    new Promise((ok, fail) => store.get(sid, (err, data) => (err ? fail(err) : ok(data))));
  const write = (sid: string, data: object) =>
    new Promise<void>((ok, fail) => store.set(sid, data as never, (err) => (err ? fail(err) : ok())));

  it('when a session is stored twice, then the second write replaces the first and it reads back as written', async () => {
    const sid = `test-${randomUUID()}`;
    const later = new Date(Date.now() + 60_000);
    await write(sid, { cookie: cookie(later), lastSeenAt: 1 });
    await write(sid, { cookie: cookie(later), lastSeenAt: 2 });
    expect(await read(sid)).toMatchObject({ lastSeenAt: 2 });
    expect(await Session.count({ where: { sid } })).toBe(1);
  });

  it('when a stored session has run out, then it is not read back even before the cleanup removes it', async () => {
    const sid = `test-${randomUUID()}`;
    await write(sid, { cookie: cookie(new Date(Date.now() - 1_000)), lastSeenAt: 1 });
    expect(await Session.count({ where: { sid } })).toBe(1);
    expect(await read(sid)).toBeNull();
  });
});

describe('desk sign-in and roles', () => {
  it('when no one is signed in, then protected routes answer 401', async () => {
    expect((await request(app).get('/api/airframes')).status).toBe(401);
    expect((await request(app).get('/api/kiosks')).status).toBe(401);
  });

  it('when a mechanic signs in on a kiosk, then engineering routes answer 403', async () => {
    const { badge, pin } = await makeStaff(['mechanic']);
    const client = await Client.kiosk(app);
    await client.signInKiosk(badge, pin);
    expect((await client.get('/api/kiosks')).status).toBe(403);
    expect((await client.post('/api/kiosks', { name: 'x' })).status).toBe(403);
  });

  it('when a mechanic tries the desk, then it is refused; an engineer gets in', async () => {
    const mech = await makeStaff(['mechanic'], { password: 'mechanic-pass' });
    const eng = await makeStaff(['engineering'], { password: 'engineer-pass' });
    const client = new Client(app);
    expect((await client.signInDesk(mech.badge, 'mechanic-pass')).status).toBe(403);
    expect((await client.signInDesk(eng.badge, 'wrong')).status).toBe(401);
    const ok = await client.signInDesk(eng.badge, 'engineer-pass');
    expect(ok.status).toBe(200);
    expect(ok.body.channel).toBe('desk');
    expect((await client.get('/api/kiosks')).status).toBe(200);
  });

  it('when a state-changing request has no or a wrong CSRF token, then it is refused with 403', async () => {
    const client = new Client(app);
    await client.refresh();
    const none = await client.agent.post('/api/auth/desk').send({ badge: 'x1', password: 'y' });
    expect(none.status).toBe(403);
    expect(none.body.code).toBe('csrf_invalid');
    const wrong = await client.agent
      .post('/api/auth/desk')
      .set('X-CSRF-Token', 'f'.repeat(40))
      .send({ badge: 'x1', password: 'y' });
    expect(wrong.status).toBe(403);
  });

  it('when sign-in attempts from one address exceed the rate, then they are refused with 429', async () => {
    const limited = buildApp({ SIGN_IN_RATE_PER_MINUTE: '3' });
    const client = new Client(limited.app);
    const statuses: number[] = [];
    for (let i = 0; i < 5; i++)
      statuses.push((await client.post('/api/auth/desk', { badge: 'nobody1', password: 'x' })).status);
    limited.close();
    expect(statuses.slice(0, 3)).toEqual([401, 401, 401]);
    expect(statuses.slice(3)).toEqual([429, 429]);
  });

  it('when a body is not valid JSON or has wrong fields, then the answer is a 400 with a message', async () => {
    const client = new Client(app);
    await client.refresh();
    const broken = await client.postRaw('/api/auth/desk', '{"badge":', 'application/json');
    expect(broken.status).toBe(400);
    expect(broken.body.message).toMatch(/JSON/);
    const wrong = await client.post('/api/auth/desk', { badge: '<script>', password: 'x' });
    expect(wrong.status).toBe(400);
    expect(wrong.body.code).toBe('invalid_input');
    expect(wrong.body.issues[0].path).toBe('badge');
  });
});

describe('kiosk enrolment', () => {
  it('when engineering creates an enrolment link, then it works once, and a revoked tablet is no longer recognised', async () => {
    const eng = await makeStaff(['engineering'], { password: 'engineer-pass' });
    const desk = new Client(app);
    await desk.signInDesk(eng.badge, 'engineer-pass');
    const created = await desk.post('/api/kiosks', { name: 'Hangar 2 wall' });
    expect(created.status).toBe(201);
    const code = created.body.code as string;
    expect(created.body.enrolPath).toBe(`/enrol/${code}`);

    // Two browsers open the same link at once: one tablet is enrolled, the other is told the link is used.
    const browsers = [new Client(app), new Client(app)];
    const answers = await Promise.all(browsers.map((b) => b.post('/api/kiosks/enrol', { code })));
    expect(answers.map((a) => a.status).sort()).toEqual([200, 404]);
    const won = answers.findIndex((a) => a.status === 200);
    const tablet = browsers[won]!;
    const enrol = answers[won]!;
    expect((await browsers[1 - won]!.get('/api/session')).body.kiosk).toBeNull();
    expect(String(enrol.headers['set-cookie'])).toMatch(/gw_kiosk=.+HttpOnly/i);
    expect((await tablet.get('/api/session')).body.kiosk).toMatchObject({ name: 'Hangar 2 wall' });

    const again = await new Client(app).post('/api/kiosks/enrol', { code });
    expect(again.status).toBe(404);

    expect((await desk.post(`/api/kiosks/${created.body.id}/revoke`)).status).toBe(200);
    expect((await tablet.get('/api/session')).body.kiosk).toBeNull();
    // Revoking again changes nothing and writes no second event.
    expect((await desk.post(`/api/kiosks/${created.body.id}/revoke`)).status).toBe(200);

    // Who let a tablet in and who shut it out is on the trail, by the engineer who did it, and the chain holds.
    const events = await AuditEvent.findAll({
      where: { entity: 'kiosk', entityId: String(created.body.id) },
      order: [['id', 'ASC']],
    });
    expect(events.map((e) => [e.action, e.actorId])).toEqual([
      ['kiosk.enrolment_created', eng.staff.id],
      ['kiosk.enrolled', null],
      ['kiosk.revoked', eng.staff.id],
    ]);
    expect(JSON.parse(events[1]!.payload)).toMatchObject({ name: 'Hangar 2 wall' });
    expect(JSON.parse(events[2]!.payload)).toMatchObject({ name: 'Hangar 2 wall' });
    expect(await verifyRecords(database())).toMatchObject({ ok: true, firstBroken: null });
  });

  it('when an enrolment link runs out unused, then the list says so and the link no longer enrols', async () => {
    const eng = await makeStaff(['engineering'], { password: 'engineer-pass' });
    const desk = new Client(app);
    await desk.signInDesk(eng.badge, 'engineer-pass');
    const dayAndAnHourAgo = new Date(Date.now() - 25 * 3_600_000);
    const stale = await createEnrolment('Bay 9 wall (never hung)', eng.staff.id, dayAndAnHourAgo);
    const fresh = await createEnrolment('Bay 10 wall', eng.staff.id);
    const listed = await desk.get('/api/kiosks');
    const stateOf = (id: number) => listed.body.find((k: { id: number }) => k.id === id)?.state;
    expect(stateOf(stale.id)).toBe('link_expired');
    expect(stateOf(fresh.id)).toBe('awaiting_enrolment');
    expect((await new Client(app).post('/api/kiosks/enrol', { code: stale.code })).status).toBe(410);
  });

  it('when a device token is made, then only its hash is stored', async () => {
    const { token, device } = await makeKioskToken();
    const { KioskDevice } = await import('@server/db/models');
    const row = await KioskDevice.findByPk(device.id);
    expect(row!.tokenHash).toHaveLength(64);
    expect(row!.tokenHash).not.toBe(token);
  });
});
