import { randomUUID } from 'node:crypto';
import { afterAll, describe, expect, it } from 'vitest';
import { buildApp, database, makeAirframe } from '../setup/api-harness';
import { authorise } from '../setup/lead-fixtures';
import { checkBody, servicingReadings, servicingTopUps, signCheck } from '../setup/check-builder';
import { type SignedIn, signedIn } from '../setup/sign-in';
import { verifyRecords } from '@server/audit/record-integrity';
import {
  Acceptance,
  AirframeRelease,
  AuditEvent,
  CheckDraft,
  Defect,
  DefectEntry,
  Hold,
} from '@server/db/models';
import type { AirframeSummary } from '@shared/schemas/airframes';
import type { AcceptanceView } from '@shared/schemas/acceptance';
import type { DefectView } from '@shared/schemas/defects';
import { authorisationWords } from '@shared/domain/authorisation';
import { inWords } from '@shared/i18n/phrase';

// The rules these tests rely on: every finding counts until the records show it cleared; a release is a
// certificate of release to service signed by authorised certifying staff (EASA Part-145 145.A.30 and 145.A.50,
// from memory); record content per 14 CFR 43.9 / 43.11 (from memory); deferral categories per the MMEL/MEL
// intervals as commonly published (from memory); independent inspection after disturbing a system (EASA
// Part-145 AMC on error capturing, from memory). People, types and figures are invented.

const { app, close } = buildApp();
afterAll(async () => {
  close();
});

const inLimits = (code: string, value: number) => ({ code, entry: { value, unit: 'L' } });

/** An after-flight of the demo RX-4 card with System 2 at 2.0 L: below its 3.5 L minimum, above isolation. */
function afterFlight(mechanic: SignedIn, airframeId: number, limitsId: number, sys2 = 2.0, note?: string) {
  return mechanic.client.post('/api/checks', {
    id: randomUUID(),
    airframeId,
    kind: 'after_flight',
    limitsVersionId: limitsId,
    pin: mechanic.pin,
    context: { attitude: 'on_wheels' },
    readings: [
      inLimits('sys1.level', 7.0),
      inLimits('sys2.level', sys2),
      { code: 'sys1.leaks', entry: { dropsPerMinute: 0 } },
      { code: 'sys2.leaks', entry: { dropsPerMinute: 0 } },
      { code: 'brakes.leaks', entry: { dropsPerMinute: 0 } },
      { code: 'sys1.filter_bypass', entry: { answer: false } },
      { code: 'sys2.filter_bypass', entry: { answer: false } },
    ],
    ...(note ? { note } : {}),
  });
}

function servicing(mechanic: SignedIn, airframeId: number, limitsId: number) {
  return mechanic.client.post(
    '/api/checks',
    checkBody('servicing', airframeId, limitsId, mechanic.pin, servicingReadings(), {
      servicing: servicingTopUps(0, 0.6),
    }),
  );
}

const summaryOf = async (who: SignedIn, id: number): Promise<AirframeSummary> =>
  (await who.client.get(`/api/airframes/${id}`)).body;

describe('the safety fault: a finding from an after-flight', () => {
  it('when an after-flight finds System 2 below its minimum after a good pre-flight, then the airframe is unserviceable everywhere and the pilot cannot accept it; after a servicing check in limits the pilot can', async () => {
    const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
    const pilot = await signedIn(app, ['pilot'], 'kiosk');
    const { airframe, limits } = await makeAirframe();
    await signCheck(mechanic, airframe.id, limits.id);
    const found = await afterFlight(mechanic, airframe.id, limits.id);
    expect(found.status).toBe(201);
    expect(found.body.verdict).toBe('service');

    const summary = await summaryOf(pilot, airframe.id);
    expect(summary.state).toBe('unserviceable');
    expect(summary.causes).toEqual(['service_needed']);
    expect(summary.formerState).toBe('due');
    // Sent as a phrase each screen writes in its own language; in English:
    expect(inWords(summary.stateReasons)).toEqual([
      expect.stringMatching(/^System 2 reservoir level needs service \(found on the after-flight check of /),
    ]);
    const board: AirframeSummary[] = (await pilot.client.get('/api/airframes')).body;
    expect(board.find((a) => a.id === airframe.id)?.state).toBe('unserviceable');

    const view: AcceptanceView = (await pilot.client.get(`/api/airframes/${airframe.id}/acceptance-view`))
      .body;
    expect(view).toMatchObject({ state: 'unserviceable', causes: ['service_needed'], canAccept: false });
    expect(inWords(view.refusal)).toMatch(/unserviceable: a reading needs service/);
    const refused = await pilot.client.post(`/api/airframes/${airframe.id}/accept`, { pin: pilot.pin });
    expect(refused.status).toBe(409);
    expect(refused.body.code).toBe('airframe_unserviceable');
    expect(refused.body.message).toMatch(/System 2 reservoir level needs service/);
    expect(await Acceptance.count({ where: { airframeId: airframe.id } })).toBe(0);

    expect((await servicing(mechanic, airframe.id, limits.id)).status).toBe(201);
    expect((await summaryOf(pilot, airframe.id)).state).toBe('checks_in_limits');
    const accepted = await pilot.client.post(`/api/airframes/${airframe.id}/accept`, { pin: pilot.pin });
    expect(accepted.status).toBe(201);
    expect(await Acceptance.count({ where: { airframeId: airframe.id } })).toBe(1);
  });

  it('when a check is found out of limits, then its finding becomes a numbered defect tied to the hold', async () => {
    const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
    const { airframe, limits } = await makeAirframe();
    const check = await signCheck(mechanic, airframe.id, limits.id, {}, [inLimits('sys1.level', 2.9)]);
    const hold = await Hold.findOne({ where: { checkId: check.id } });
    const defects: DefectView[] = (await mechanic.client.get(`/api/airframes/${airframe.id}/defects`)).body;
    expect(defects).toHaveLength(1);
    expect(defects[0]).toMatchObject({
      source: 'finding',
      checkId: check.id,
      holdId: hold!.id,
      chapter: '12',
      status: 'open',
      raisedBy: { id: mechanic.staff.id },
    });
    expect(defects[0]!.description).toMatch(/System 1 reservoir level/);
  });
});

/** A desk lead with an authorisation, or none. */
async function deskLead(typeCode: string | null, changes: Parameters<typeof authorise>[2] = {}) {
  const lead = await signedIn(app, ['shift_lead'], 'desk');
  if (typeCode) await authorise(lead.staff.id, typeCode, changes);
  return lead;
}

describe('defects: from a defect note to a deferral and a release', () => {
  it('when a mechanic signs a check with a defect note, then it becomes a defect; it is deferred only by authorised staff within its category; then an authorised release makes the airframe released', async () => {
    const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
    const { airframe, limits, type } = await makeAirframe();
    await signCheck(mechanic, airframe.id, limits.id, { note: 'Chafed hose clamp at the System 2 pump.' });
    let summary = await summaryOf(mechanic, airframe.id);
    expect(summary.state).toBe('unserviceable');
    expect(summary.causes).toEqual(['open_defect']);
    expect(summary.defects).toEqual([
      expect.objectContaining({ description: 'Chafed hose clamp at the System 2 pump.', status: 'open' }),
    ]);
    const defectId = summary.defects[0]!.id;
    const deferral = { reference: 'MEL 29-10-02 (test)', category: 'B' };

    const unauthorised = await deskLead(null);
    const none = await unauthorised.client.post(`/api/defects/${defectId}/defer`, {
      ...deferral,
      password: unauthorised.password,
    });
    expect(none.status).toBe(403);
    expect(none.body).toMatchObject({ code: 'not_authorised' });
    expect(none.body.message).toBe(
      'You cannot defer this defect: no certifying authorisation is recorded for this person.',
    );

    const otherType = await deskLead('RL-2', { typeCodes: ['RL-2'] });
    const wrongType = await otherType.client.post(`/api/defects/${defectId}/defer`, {
      ...deferral,
      password: otherType.password,
    });
    expect(wrongType.status).toBe(403);
    expect(wrongType.body.message).toBe(
      `You cannot defer this defect: the authorisation covers RL-2, not ${type.code}.`,
    );

    const lapsed = await deskLead(type.code, { expiresOn: '2025-06-30' });
    const expired = await lapsed.client.post(`/api/defects/${defectId}/defer`, {
      ...deferral,
      password: lapsed.password,
    });
    expect(expired.status).toBe(403);
    expect(expired.body.message).toBe(
      'You cannot defer this defect: the authorisation expired on 30 Jun 2025.',
    );

    const certifier = await deskLead(type.code);
    const past = await certifier.client.post(`/api/defects/${defectId}/defer`, {
      ...deferral,
      untilDay: '2020-01-01',
      password: certifier.password,
    });
    expect(past.status).toBe(400);
    expect(past.body).toMatchObject({ code: 'invalid_deferral', field: 'untilDay' });
    expect(past.body.message).toMatch(/is in the past/);
    expect(await DefectEntry.count({ where: { defectId } })).toBe(0);

    const deferred = await certifier.client.post(`/api/defects/${defectId}/defer`, {
      ...deferral,
      password: certifier.password,
    });
    expect(deferred.status).toBe(201);
    expect((deferred.body as DefectView).status).toBe('deferred');
    summary = await summaryOf(mechanic, airframe.id);
    expect(summary.state).toBe('checks_in_limits');
    expect(summary.defects[0]).toMatchObject({ status: 'deferred' });
    // Category B: three calendar days after the day of discovery, to the end of the type's local day.
    const until = new Date(summary.defects[0]!.deferredUntil!);
    expect(until.getTime() - Date.now()).toBeGreaterThan(3 * 24 * 3_600_000 - 1);
    expect(until.getTime() - Date.now()).toBeLessThan(4 * 24 * 3_600_000 + 2 * 3_600_000);

    const noRelease = await otherType.client.post(`/api/airframes/${airframe.id}/release`, {
      password: otherType.password,
    });
    expect(noRelease.status).toBe(403);
    expect(noRelease.body.code).toBe('not_authorised');
    const release = await certifier.client.post(`/api/airframes/${airframe.id}/release`, {
      password: certifier.password,
    });
    expect(release.status).toBe(201);
    expect(release.body).toMatchObject({
      certifiedBy: { id: certifier.staff.id, licenceNumber: certifier.staff.licenceNumber },
      statement: expect.stringMatching(/^Certifies that the work specified/),
    });
    summary = await summaryOf(mechanic, airframe.id);
    expect(summary.state).toBe('released');
    expect(summary.release).toEqual({ by: certifier.staff.name, at: release.body.signedAt });
    expect(await verifyRecords(database())).toMatchObject({ ok: true });
  });

  it('when a pilot raises a defect, then the airframe is unserviceable with the reason; a defect on an airframe id that is not ours is refused and nothing is stored', async () => {
    const pilot = await signedIn(app, ['pilot'], 'kiosk');
    const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
    const { airframe, limits } = await makeAirframe();
    await signCheck(mechanic, airframe.id, limits.id);
    const raised = await pilot.client.post(`/api/airframes/${airframe.id}/defects`, {
      description: 'Hydraulic smell in the cabin after start.',
      chapter: '29',
      pin: pilot.pin,
    });
    expect(raised.status).toBe(201);
    expect(raised.body).toMatchObject({ source: 'raised', status: 'open', raisedBy: { id: pilot.staff.id } });
    const view: AcceptanceView = (await pilot.client.get(`/api/airframes/${airframe.id}/acceptance-view`))
      .body;
    expect(view.canAccept).toBe(false);
    expect(inWords(view.refusal)).toMatch(/a defect is open, neither rectified nor deferred/);

    const before = await Defect.count();
    const foreign = await pilot.client.post('/api/airframes/999999999/defects', {
      description: 'Not our aircraft',
      pin: pilot.pin,
    });
    expect(foreign.status).toBe(404);
    expect(await Defect.count()).toBe(before);
  });
});

describe('rectification: performed by, inspected by, certified by', () => {
  it('when the work needs an independent inspection, then certifying without it, inspecting one own work or certifying one own work is refused; with a second inspector it is certified', async () => {
    const { airframe, limits, type } = await makeAirframe();
    const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
    await signCheck(mechanic, airframe.id, limits.id);
    const raised = await mechanic.client.post(`/api/airframes/${airframe.id}/defects`, {
      description: 'Tail rotor pitch link bolt loose.',
      chapter: '64',
      pin: mechanic.pin,
    });
    const id = raised.body.id as number;
    const certifier = await deskLead(type.code);
    const early = await certifier.client.post(`/api/defects/${id}/certify`, { password: certifier.password });
    expect(early.status).toBe(409);
    expect(early.body.code).toBe('no_work');

    const work = await mechanic.client.post(`/api/defects/${id}/work`, {
      action: 'Bolt replaced and torqued to the maintenance data figure; flight controls disturbed.',
      independentInspection: true,
      pin: mechanic.pin,
    });
    expect(work.status).toBe(201);
    const own = await mechanic.client.post(`/api/defects/${id}/inspection`, {
      statement: 'Checked my own work.',
      pin: mechanic.pin,
    });
    expect(own.status).toBe(403);
    expect(own.body.code).toBe('not_independent');
    const missing = await certifier.client.post(`/api/defects/${id}/certify`, {
      password: certifier.password,
    });
    expect(missing.status).toBe(409);
    expect(missing.body.code).toBe('inspection_missing');

    const inspector = await signedIn(app, ['mechanic'], 'kiosk');
    expect(
      (
        await inspector.client.post(`/api/defects/${id}/inspection`, {
          statement: 'Full and free movement, locking correct.',
          pin: inspector.pin,
        })
      ).status,
    ).toBe(201);

    const selfCert = await signedIn(app, ['mechanic', 'shift_lead'], 'kiosk');
    await authorise(selfCert.staff.id, type.code);
    const more = await selfCert.client.post(`/api/defects/${id}/work`, {
      action: 'Split pin fitted.',
      pin: selfCert.pin,
    });
    expect(more.status).toBe(201);
    const second = await signedIn(app, ['mechanic'], 'kiosk');
    await second.client.post(`/api/defects/${id}/inspection`, {
      statement: 'Split pin seen fitted.',
      pin: second.pin,
    });
    const mine = await selfCert.client.post(`/api/defects/${id}/certify`, { pin: selfCert.pin });
    expect(mine.status).toBe(403);
    expect(mine.body.code).toBe('self_certification');
    const entriesBefore = await DefectEntry.count({ where: { defectId: id } });

    const certified = await certifier.client.post(`/api/defects/${id}/certify`, {
      password: certifier.password,
    });
    expect(certified.status).toBe(201);
    const view = certified.body as DefectView;
    expect(view.status).toBe('rectified');
    expect(view.entries.map((e) => e.kind)).toEqual([
      'work',
      'inspection',
      'work',
      'inspection',
      'certification',
    ]);
    expect(view.entries.at(-1)).toMatchObject({
      signedBy: { id: certifier.staff.id },
      authorisation: expect.objectContaining({ category: 'B1', scope: expect.any(Array) }),
    });
    expect(await DefectEntry.count({ where: { defectId: id } })).toBe(entriesBefore + 1);
    expect((await summaryOf(mechanic, airframe.id)).state).toBe('released');
  });
});

describe('hold release by certifying staff', () => {
  it('when a lead without authorisation, or the re-check signer, or the corrective action recorder releases a hold, then it is refused; an authorised second person releases it', async () => {
    const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
    const { airframe, limits, type } = await makeAirframe();
    const check = await signCheck(mechanic, airframe.id, limits.id, {}, [inLimits('sys1.level', 2.9)]);
    const hold = (await Hold.findOne({ where: { checkId: check.id } }))!;
    const leadMechanic = await signedIn(app, ['shift_lead', 'mechanic'], 'kiosk');
    await authorise(leadMechanic.staff.id, type.code);
    expect(
      (
        await leadMechanic.client.post(`/api/holds/${hold.id}/corrective-action`, {
          text: 'Seal replaced, topped up.',
          pin: leadMechanic.pin,
        })
      ).status,
    ).toBe(201);
    await signCheck(leadMechanic, airframe.id, limits.id);

    const plain = await deskLead(null);
    const noAuth = await plain.client.post(`/api/holds/${hold.id}/countersign`, {
      decision: 'release',
      password: plain.password,
    });
    expect(noAuth.status).toBe(403);
    expect(noAuth.body.code).toBe('not_authorised');
    const ownRecheck = await leadMechanic.client.post(`/api/holds/${hold.id}/countersign`, {
      decision: 'release',
      pin: leadMechanic.pin,
    });
    expect(ownRecheck.status).toBe(403);
    expect(ownRecheck.body.code).toBe('own_recheck');
    expect((await Hold.findByPk(hold.id))!.releasedAt).toBeNull();

    const certifier = await deskLead(type.code);
    const released = await certifier.client.post(`/api/holds/${hold.id}/countersign`, {
      decision: 'release',
      password: certifier.password,
    });
    expect(released.status).toBe(200);
    expect((await summaryOf(mechanic, airframe.id)).state).toBe('released');
    // The hold's defect is rectified with the release: nothing more is signed against it.
    const defect = (await Defect.findOne({ where: { holdId: hold.id } }))!;
    const late = await mechanic.client.post(`/api/defects/${defect.id}/inspection`, {
      statement: 'Looked again after the release.',
      pin: mechanic.pin,
    });
    expect(late.status).toBe(409);
    expect(late.body.code).toBe('defect_rectified');
  });
});

describe('abandoned checks', () => {
  it('when a lead closes a check left open on a tablet, with a reason, then it no longer holds the airframe in progress and the reason is audited', async () => {
    const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
    const lead = await deskLead(null);
    const { airframe, limits } = await makeAirframe();
    await signCheck(mechanic, airframe.id, limits.id);
    const id = randomUUID();
    await mechanic.client.post('/api/check-drafts', { id, airframeId: airframe.id, kind: 'ground_run' });
    expect((await summaryOf(lead, airframe.id)).state).toBe('in_progress');
    const noReason = await lead.client.post(`/api/check-drafts/${id}/close`, { reason: '' });
    expect(noReason.status).toBe(400);
    const closed = await lead.client.post(`/api/check-drafts/${id}/close`, {
      reason: 'Tablet left on the ramp; mechanic off shift.',
    });
    expect(closed.status).toBe(200);
    expect((await summaryOf(lead, airframe.id)).state).toBe('checks_in_limits');
    // The tablet touching it again does not reopen it.
    await mechanic.client.post('/api/check-drafts', { id, airframeId: airframe.id, kind: 'ground_run' });
    expect((await summaryOf(lead, airframe.id)).state).toBe('checks_in_limits');
    expect((await CheckDraft.findByPk(id))?.closeReason).toBe('Tablet left on the ramp; mechanic off shift.');
    const event = await AuditEvent.findOne({ where: { action: 'check_draft.closed', entityId: id } });
    expect(JSON.parse(event!.payload)).toMatchObject({
      reason: 'Tablet left on the ramp; mechanic off shift.',
    });
  });
});

describe('authorisations on the staff page', () => {
  it('when engineering grants an authorisation, then it is listed in words and audited; an expired one cannot be granted', async () => {
    const eng = await signedIn(app, ['engineering'], 'desk');
    const person = await signedIn(app, ['shift_lead'], 'desk');
    const { type } = await makeAirframe();
    const expired = await eng.client.post(`/api/staff/${person.staff.id}/authorisations`, {
      category: 'B1',
      typeCodes: [type.code],
      scope: ['29'],
      expiresOn: '2025-01-31',
      reference: 'CA-1',
    });
    expect(expired.status).toBe(400);
    expect(expired.body.code).toBe('authorisation_expired');
    const granted = await eng.client.post(`/api/staff/${person.staff.id}/authorisations`, {
      category: 'B1',
      typeCodes: [type.code],
      scope: ['29', '32'],
      expiresOn: '2099-12-31',
      reference: 'CA-2',
    });
    expect(granted.status).toBe(201);
    expect(authorisationWords(granted.body)).toBe(
      `B1 (CA-2) for ${type.code}, ATA 29 Hydraulic power, ATA 32 Landing gear, until 31 Dec 2099`,
    );
    const list = (await eng.client.get(`/api/staff/${person.staff.id}/authorisations`)).body;
    expect(list).toHaveLength(1);
    const revoked = await eng.client.post(
      `/api/staff/${person.staff.id}/authorisations/${granted.body.id}/revoke`,
    );
    expect(revoked.status).toBe(200);
    const events = await AuditEvent.findAll({
      where: { entity: 'authorisation', entityId: String(granted.body.id) },
    });
    expect(events.map((e) => e.action)).toEqual(['authorisation.granted', 'authorisation.revoked']);
  });
});

describe('the audit trail covers the tech log', () => {
  it('when a tech-log entry or a certificate of release is changed in SQL behind the application, then verification names it', async () => {
    const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
    const { airframe, limits, type } = await makeAirframe();
    await signCheck(mechanic, airframe.id, limits.id, { note: 'Seat belt buckle stiff.' });
    const defect = (await Defect.findOne({ where: { airframeId: airframe.id } }))!;
    const certifier = await deskLead(type.code);
    await certifier.client.post(`/api/defects/${defect.id}/defer`, {
      reference: 'MEL 25 (test)',
      category: 'C',
      password: certifier.password,
    });
    await certifier.client.post(`/api/airframes/${airframe.id}/release`, { password: certifier.password });
    const entry = (await DefectEntry.findOne({ where: { defectId: defect.id } }))!;
    const release = (await AirframeRelease.findOne({ where: { airframeId: airframe.id } }))!;
    const sequelize = database();
    const tamper = async (sql: string, undo: string, expected: string) => {
      await sequelize.query(sql);
      try {
        const result = await verifyRecords(sequelize);
        expect(result.ok).toBe(false);
        expect(result.firstBroken?.reason).toBe(expected);
      } finally {
        await sequelize.query(undo);
      }
    };
    await tamper(
      `UPDATE defect_entries SET limit_at = DATE_ADD(limit_at, INTERVAL 30 DAY) WHERE id = ${entry.id}`,
      `UPDATE defect_entries SET limit_at = DATE_SUB(limit_at, INTERVAL 30 DAY) WHERE id = ${entry.id}`,
      `tech-log entry ${entry.id}: its at was changed after signing`,
    );
    await tamper(
      `UPDATE defects SET description = 'Nothing' WHERE id = ${defect.id}`,
      `UPDATE defects SET description = 'Seat belt buckle stiff.' WHERE id = ${defect.id}`,
      `defect ${defect.id}: its description was changed after signing`,
    );
    await tamper(
      `UPDATE airframe_releases SET chapters = '["29"]' WHERE id = ${release.id}`,
      `UPDATE airframe_releases SET chapters = '${release.chapters}' WHERE id = ${release.id}`,
      `certificate of release ${release.id}: its chapters was changed after signing`,
    );
    expect((await verifyRecords(sequelize)).ok).toBe(true);
  });
});
