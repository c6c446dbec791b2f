import { describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { appForThisFile, Client, makeAirframe, makeStaff } from '../setup/api-harness';
import { preFlightBody } from '../setup/check-builder';
import { signedIn } from '../setup/sign-in';
import { AuditEvent, Base, Staff } from '@server/db/models';
import type { FleetAirframe, TagSheetEntry } from '@shared/schemas/fleet';
import type { StaffMember } from '@shared/schemas/staff';

const { app } = appForThisFile();

const engineering = () => signedIn(app, ['engineering'], 'desk');

const short = () => randomUUID().slice(0, 6).toUpperCase();

describe('airframes and tags', () => {
  it('when engineering adds an airframe, then it gets a tag whose sheet entry encodes <origin>/t/<token> with its short code', async () => {
    const { client } = await engineering();
    const { type } = await makeAirframe();
    const [base] = await Base.findOrCreate({
      where: { code: 'TB' },
      defaults: { code: 'TB', name: 'Test base' },
    });
    const fleetNumber = `N-${short()}`;
    const created = await client.post('/api/fleet/airframes', {
      fleetNumber,
      serial: 'SN 1001',
      typeId: type.id,
      baseId: base.id,
      hours: 12.5,
    });
    expect(created.status).toBe(201);
    const fleet = (await client.get('/api/fleet/airframes')).body as FleetAirframe[];
    const mine = fleet.find((a) => a.fleetNumber === fleetNumber)!;
    expect(mine).toMatchObject({ serial: 'SN 1001', hours: 12.5, type: { id: type.id } });
    expect(mine.tag?.shortCode).toBe(`${mine.tag!.token.slice(0, 3)}-${mine.tag!.token.slice(3, 6)}`);
    const sheet = (await client.get(`/api/fleet/tag-sheet?ids=${mine.id}`).set('Host', 'hangar.example:8080'))
      .body as TagSheetEntry[];
    expect(sheet).toHaveLength(1);
    expect(sheet[0]!.url).toBe(`http://hangar.example:8080/t/${mine.tag!.token}`);
    expect(sheet[0]!.qrSvg).toMatch(/^<svg/);

    const dup = await client.post('/api/fleet/airframes', {
      fleetNumber,
      serial: 'x',
      typeId: type.id,
      baseId: base.id,
      hours: 0,
    });
    expect(dup.status).toBe(409);
    expect(dup.body.message).toContain(fleetNumber);
  });

  it('when an airframe is edited, then only the changed fields are in its audit event', async () => {
    const { client } = await engineering();
    const { airframe } = await makeAirframe();
    const body = {
      fleetNumber: airframe.fleetNumber,
      serial: 'NEW-SERIAL',
      typeId: airframe.typeId,
      baseId: airframe.baseId,
      hours: 1234.5,
    };
    const res = await client.post(`/api/fleet/airframes/${airframe.id}`, body);
    expect(res.body.changed).toEqual(['serial']);
    const event = await AuditEvent.findOne({
      where: { action: 'airframe.changed', entityId: String(airframe.id) },
    });
    expect(JSON.parse(event!.payload)).toEqual({ serial: { from: airframe.serial, to: 'NEW-SERIAL' } });
  });

  it('when a tag is reissued, then the old URL answers 410 at once and the new one finds the airframe', async () => {
    const { client } = await engineering();
    const { airframe, tag } = await makeAirframe();
    const kiosk = await Client.kiosk(app);
    expect((await kiosk.get(`/api/tags/${tag.token}`)).status).toBe(200);
    const res = await client.post(`/api/fleet/airframes/${airframe.id}/reissue-tag`);
    expect(res.status).toBe(200);
    expect(res.body.revoked).toBe(1);
    const old = await kiosk.get(`/api/tags/${tag.token}`);
    expect(old.status).toBe(410);
    expect(old.body.code).toBe('tag_revoked');
    const fresh = await kiosk.get(`/api/tags/${res.body.tag.token}`);
    expect(fresh.body).toEqual({ airframeId: airframe.id, fleetNumber: airframe.fleetNumber });
    expect(await AuditEvent.count({ where: { action: 'tag.revoked', entityId: String(tag.id) } })).toBe(1);
  });
});

describe('staff, badges and PINs', () => {
  it('when a person is added, then a temporary PIN is shown once, kiosk sign-in says it must be changed, and after the change it is not', async () => {
    const { client } = await engineering();
    const badgeNumber = `M${short()}`;
    const created = await client.post('/api/staff', {
      badgeNumber,
      name: 'Ada Newhire',
      licenceNumber: 'B1-0042',
      roles: ['mechanic'],
    });
    expect(created.status).toBe(201);
    const pin = created.body.temporaryPin as string;
    expect(pin).toMatch(/^\d{6}$/);
    expect(JSON.stringify((await client.get('/api/staff')).body)).not.toContain(pin);
    const audit = await AuditEvent.findOne({
      where: { action: 'staff.created', entityId: String(created.body.staff.id) },
    });
    expect(audit!.payload).not.toContain(pin);

    const kiosk = await Client.kiosk(app);
    const signIn = await kiosk.signInKiosk(badgeNumber, pin);
    expect(signIn.body.mustChangePin).toBe(true);
    const same = await kiosk.post('/api/auth/change-pin', { currentPin: pin, newPin: pin });
    expect(same.status).toBe(400);
    const changed = await kiosk.post('/api/auth/change-pin', { currentPin: pin, newPin: '8642' });
    expect(changed.status).toBe(200);
    await kiosk.post('/api/auth/sign-out');
    expect((await kiosk.post('/api/auth/kiosk', { badge: badgeNumber, pin })).status).toBe(401);
    expect((await kiosk.signInKiosk(badgeNumber, '8642')).body.mustChangePin).toBe(false);
  });

  it('when a PIN is reset, then the old PIN stops working and the new temporary one must be changed', async () => {
    const { client } = await engineering();
    const mech = await makeStaff(['mechanic']);
    const res = await client.post(`/api/staff/${mech.staff.id}/reset-pin`);
    expect(res.body.staff.mustChangePin).toBe(true);
    const kiosk = await Client.kiosk(app);
    expect((await kiosk.post('/api/auth/kiosk', { badge: mech.badge, pin: mech.pin })).status).toBe(401);
    expect((await kiosk.signInKiosk(mech.badge, res.body.temporaryPin)).body.mustChangePin).toBe(true);
  });

  it('when a badge is deactivated, then it cannot sign in but its old records still show the name and licence', async () => {
    const { client } = await engineering();
    const mech = await makeStaff(['mechanic']);
    const kiosk = await Client.kiosk(app);
    await kiosk.signInKiosk(mech.badge, mech.pin);
    const { airframe, limits } = await makeAirframe();
    const check = await kiosk.post('/api/checks', preFlightBody(airframe.id, limits.id, mech.pin));
    expect(check.status).toBe(201);
    await kiosk.post('/api/auth/sign-out');

    const res = await client.post(`/api/staff/${mech.staff.id}/deactivate`);
    expect(res.body.active).toBe(false);
    const refused = await kiosk.post('/api/auth/kiosk', { badge: mech.badge, pin: mech.pin });
    // The same answer as a wrong PIN: an inactive badge is not told apart from one that never existed.
    expect(refused.status).toBe(401);
    expect(refused.body.code).toBe('wrong_pin');
    const record = await client.get(`/api/records/${check.body.id}`);
    expect(record.body.signedBy).toMatchObject({
      name: mech.staff.name,
      licenceNumber: mech.staff.licenceNumber,
      active: false,
    });
    const rows = await client.get(`/api/records?staffId=${mech.staff.id}`);
    expect(rows.body.rows[0]).toMatchObject({ signedBy: mech.staff.name, id: check.body.id });
    expect(await Staff.count({ where: { id: mech.staff.id } })).toBe(1);
  });

  it('when badge cards are asked for, then each carries a QR code of the badge number and the roles', async () => {
    const { client } = await engineering();
    const mech = await makeStaff(['mechanic', 'shift_lead']);
    const cards = (await client.get(`/api/staff/badge-cards?ids=${mech.staff.id}`)).body;
    expect(cards).toEqual([
      expect.objectContaining({
        badgeNumber: mech.badge,
        roles: ['mechanic', 'shift_lead'],
        qrSvg: expect.stringMatching(/^<svg/),
      }),
    ]);
  });

  it('when staff details change, then the change is audited and a bad role is refused with a message', async () => {
    const { client } = await engineering();
    const mech = await makeStaff(['mechanic']);
    const edit = await client.post(`/api/staff/${mech.staff.id}`, {
      name: mech.staff.name,
      licenceNumber: 'B1-9',
      roles: ['mechanic', 'pilot'],
    });
    expect((edit.body as StaffMember).roles).toEqual(['mechanic', 'pilot']);
    const bad = await client.post(`/api/staff/${mech.staff.id}`, {
      name: 'x',
      licenceNumber: null,
      roles: ['captain'],
    });
    expect(bad.status).toBe(400);
    expect(
      await AuditEvent.count({ where: { action: 'staff.changed', entityId: String(mech.staff.id) } }),
    ).toBe(1);
  });
});

describe('preferred language', () => {
  it('when a person is added with German as preferred language, then the list, the audit and the kiosk session carry it', async () => {
    const { client } = await engineering();
    const badgeNumber = `L${short()}`;
    const created = await client.post('/api/staff', {
      badgeNumber,
      name: 'Greta Vogt',
      licenceNumber: null,
      roles: ['mechanic'],
      preferredLanguage: 'de',
    });
    expect(created.status).toBe(201);
    expect((created.body.staff as StaffMember).preferredLanguage).toBe('de');
    const listed = ((await client.get('/api/staff')).body as StaffMember[]).find(
      (s) => s.badgeNumber === badgeNumber,
    );
    expect(listed?.preferredLanguage).toBe('de');
    const audit = await AuditEvent.findOne({
      where: { action: 'staff.created', entityId: String(created.body.staff.id) },
    });
    expect(JSON.parse(audit!.payload)).toMatchObject({ preferredLanguage: 'de' });

    const kiosk = await Client.kiosk(app);
    const signIn = await kiosk.signInKiosk(badgeNumber, created.body.temporaryPin as string);
    expect(signIn.body.user.preferredLanguage).toBe('de');
    expect((await kiosk.get('/api/session')).body.user.preferredLanguage).toBe('de');
  });

  it('when a preferred language is changed or cleared, then each change is audited and an edit without it keeps it', async () => {
    const { client } = await engineering();
    const mech = await makeStaff(['mechanic']);
    const base = { name: mech.staff.name, licenceNumber: mech.staff.licenceNumber, roles: ['mechanic'] };
    expect(
      (await client.post(`/api/staff/${mech.staff.id}`, { ...base, preferredLanguage: 'de' })).status,
    ).toBe(200);
    const kept = await client.post(`/api/staff/${mech.staff.id}`, { ...base, licenceNumber: 'B1-77' });
    expect((kept.body as StaffMember).preferredLanguage).toBe('de');
    const cleared = await client.post(`/api/staff/${mech.staff.id}`, {
      ...base,
      licenceNumber: 'B1-77',
      preferredLanguage: null,
    });
    expect((cleared.body as StaffMember).preferredLanguage).toBeNull();
    const events = await AuditEvent.findAll({
      where: { action: 'staff.changed', entityId: String(mech.staff.id) },
      order: [['id', 'ASC']],
    });
    expect(events.map((e) => JSON.parse(e.payload) as Record<string, unknown>)).toEqual([
      { preferredLanguage: { from: null, to: 'de' } },
      { licenceNumber: { from: mech.staff.licenceNumber, to: 'B1-77' } },
      { preferredLanguage: { from: 'de', to: null } },
    ]);
    const kiosk = await Client.kiosk(app);
    expect((await kiosk.signInKiosk(mech.badge, mech.pin)).body.user.preferredLanguage).toBeNull();
  });

  it('when a language Gaugewalk does not ship is given, then 400 with a plain message and nothing changes', async () => {
    const { client } = await engineering();
    const mech = await makeStaff(['mechanic']);
    const edit = await client.post(`/api/staff/${mech.staff.id}`, {
      name: mech.staff.name,
      licenceNumber: mech.staff.licenceNumber,
      roles: ['mechanic'],
      preferredLanguage: 'fr',
    });
    expect(edit.status).toBe(400);
    expect(edit.body.message).toContain('Choose one of the languages Gaugewalk ships: English, Deutsch.');
    const create = await client.post('/api/staff', {
      badgeNumber: `L${short()}`,
      name: 'Remy Faure',
      licenceNumber: null,
      roles: ['mechanic'],
      preferredLanguage: 'fr-FR',
    });
    expect(create.status).toBe(400);
    expect(create.body.issues).toEqual([expect.objectContaining({ path: 'preferredLanguage' })]);
    expect(
      await AuditEvent.count({ where: { action: 'staff.changed', entityId: String(mech.staff.id) } }),
    ).toBe(0);
    expect((await Staff.findByPk(mech.staff.id))!.preferredLanguage).toBeNull();
  });
});

describe('kiosk tablets', () => {
  it('when a tablet is renamed, then the list shows the new name and it stays enrolled', async () => {
    const { client } = await engineering();
    const kiosk = await Client.kiosk(app);
    const list = (await client.get('/api/kiosks')).body as { id: number; name: string; state: string }[];
    const mine = list.find((k) => k.state === 'enrolled')!;
    const name = `Wall ${short()}`;
    expect((await client.post(`/api/kiosks/${mine.id}/rename`, { name })).body).toEqual({
      id: mine.id,
      name,
    });
    expect(
      ((await client.get('/api/kiosks')).body as { id: number; name: string; state: string }[]).find(
        (k) => k.id === mine.id,
      ),
    ).toMatchObject({ name, state: 'enrolled' });
    expect((await kiosk.get('/api/session')).body.kiosk).not.toBeNull();
  });

  it('when a shift lead tries engineering actions, then 403; without a session, 401', async () => {
    const lead = await makeStaff(['shift_lead'], { password: 'correct horse battery' });
    const client = new Client(app);
    await client.signInDesk(lead.badge, 'correct horse battery');
    expect((await client.get('/api/staff')).status).toBe(403);
    expect((await client.post('/api/fleet/airframes/1/reissue-tag')).status).toBe(403);
    expect((await new Client(app).get('/api/fleet/airframes')).status).toBe(401);
  });
});
