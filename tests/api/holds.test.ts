import { describe, expect, it } from 'vitest';
import { appForThisFile, database } from '../setup/api-harness';
import { authorise, heldAirframe } from '../setup/lead-fixtures';
import { isolatedLevel, signCheck } from '../setup/check-builder';
import { signedIn } from '../setup/sign-in';
import { AuditEvent, Hold, HoldCorrectiveAction, HoldCountersign } from '@server/db/models';
import { verifyAuditTrail } from '@server/audit/audit-trail';
import type { AirframeSummary } from '@shared/schemas/airframes';
import type { HoldDetail, HoldQueueItem } from '@shared/schemas/holds';

const { app } = appForThisFile();

const deskLead = () => signedIn(app, ['shift_lead'], 'desk');

describe('the holds queue and a hold in detail', () => {
  it('when a pre-flight is out of limits, then the queue shows the hold with the reading, its value and its limit band', async () => {
    const held = await heldAirframe(app);
    const lead = await deskLead();
    const res = await lead.client.get('/api/holds');
    expect(res.status).toBe(200);
    const item = (res.body as HoldQueueItem[]).find((h) => h.id === held.holdId);
    expect(item).toMatchObject({
      airframe: { id: held.airframe.id, fleetNumber: held.airframe.fleetNumber },
      check: {
        id: held.check.id,
        kind: 'pre_flight',
        verdict: 'out_of_limits',
        signedBy: { id: held.mechanic.staff.id },
      },
      correctiveActionCount: 0,
      lastCountersign: null,
      recheckPassed: false,
    });
    expect(item!.findings).toHaveLength(1);
    expect(item!.findings[0]).toMatchObject({
      code: 'sys1.level',
      value: 2.9,
      unit: 'L',
      verdict: 'out_of_limits',
      bandId: 'isolated',
      limitText: 'at or above 0 L and below 3 L',
    });
  });

  it('when the detail is opened, then it has every reading against its band and says what a release still needs', async () => {
    const held = await heldAirframe(app);
    const lead = await deskLead();
    const res = await lead.client.get(`/api/holds/${held.holdId}`);
    expect(res.status).toBe(200);
    const detail = res.body as HoldDetail;
    expect(detail.state).toBe('open');
    expect(detail.raisedBy.id).toBe(held.mechanic.staff.id);
    expect(detail.check.id).toBe(held.check.id);
    expect(detail.readings).toHaveLength(8);
    expect(detail.readings.find((r) => r.code === 'sys2.level')).toMatchObject({
      verdict: 'in_limits',
      marks: { normal: 4.5 },
    });
    expect(detail.releaseReadiness.hasCorrectiveAction).toBe(false);
    expect(detail.releaseReadiness.recheck).toBeNull();
    expect(detail.releaseReadiness.missing).toHaveLength(2);
    expect(detail.caution).toMatch(/approved maintenance data/);
    expect((await lead.client.get('/api/holds/999999999')).status).toBe(404);
    expect((await lead.client.get('/api/holds/abc')).status).toBe(400);
  });
});

describe('corrective action, re-check and countersign', () => {
  it('when the lead records the action, a re-check passes and the lead countersigns, then the hold is released and the board shows the airframe released', async () => {
    const held = await heldAirframe(app);
    const lead = await deskLead();
    await authorise(lead.staff.id, held.type.code);
    const before = await lead.client.post(`/api/holds/${held.holdId}/countersign`, {
      decision: 'release',
      password: lead.password,
    });
    expect(before.status).toBe(409);
    expect(before.body.code).toBe('release_not_ready');
    expect(before.body.message).toMatch(/corrective action/);
    expect(before.body.message).toMatch(/re-check/);

    const action = await held.mechanic.client.post(`/api/holds/${held.holdId}/corrective-action`, {
      text: 'Replaced the leaking return line seal, topped up System 1 to the normal mark.',
      pin: held.mechanic.pin,
    });
    expect(action.status).toBe(201);
    expect(action.body.recordedBy.id).toBe(held.mechanic.staff.id);

    const noRecheck = await lead.client.post(`/api/holds/${held.holdId}/countersign`, {
      decision: 'release',
      password: lead.password,
    });
    expect(noRecheck.status).toBe(409);
    expect(noRecheck.body.missing).toEqual([expect.stringMatching(/re-check/)]);

    const recheck = await signCheck(held.mechanic, held.airframe.id, held.limits.id);
    expect(recheck.verdict).toBe('in_limits');
    const stillHeld: AirframeSummary = (await lead.client.get(`/api/airframes/${held.airframe.id}`)).body;
    expect(stillHeld.state).toBe('unserviceable');
    expect(stillHeld.causes).toEqual(['on_hold']);

    const released = await lead.client.post(`/api/holds/${held.holdId}/countersign`, {
      decision: 'release',
      password: lead.password,
    });
    expect(released.status).toBe(200);
    const detail = released.body as HoldDetail;
    expect(detail.state).toBe('released');
    expect(detail.releasedBy).toEqual({ id: lead.staff.id, name: lead.staff.name });
    expect(detail.countersigns).toHaveLength(1);
    expect(detail.countersigns[0]).toMatchObject({
      decision: 'release',
      recheckCheckId: recheck.id,
      signedWith: 'password',
    });
    expect(detail.countersigns[0]!.contentHash).toMatch(/^[0-9a-f]{64}$/);

    const summary: AirframeSummary = (await lead.client.get(`/api/airframes/${held.airframe.id}`)).body;
    // The countersigned release by authorised certifying staff is a certificate of release to service.
    expect(summary.state).toBe('released');
    expect(summary.release).toEqual({ by: lead.staff.name, at: detail.releasedAt });
    expect(summary.openHolds).toEqual([]);
    const queue = (await lead.client.get('/api/holds')).body as HoldQueueItem[];
    expect(queue.some((h) => h.id === held.holdId)).toBe(false);

    const events = await AuditEvent.findAll({ where: { entity: 'hold', entityId: String(held.holdId) } });
    expect(events.map((e) => e.action)).toEqual(['hold.opened', 'hold.corrective_action', 'hold.released']);
    expect((await verifyAuditTrail(database())).ok).toBe(true);

    const late = await held.mechanic.client.post(`/api/holds/${held.holdId}/corrective-action`, {
      text: 'One more thing',
      pin: held.mechanic.pin,
    });
    expect(late.status).toBe(409);
    expect(late.body.code).toBe('hold_already_released');
  });

  it('when the lead signed the held check, then the countersign is refused: nobody countersigns their own check', async () => {
    const leadMechanic = await signedIn(app, ['shift_lead', 'mechanic'], 'kiosk');
    const held = await heldAirframe(app, leadMechanic);
    const res = await leadMechanic.client.post(`/api/holds/${held.holdId}/countersign`, {
      decision: 'release',
      pin: leadMechanic.pin,
    });
    expect(res.status).toBe(403);
    expect(res.body.code).toBe('own_check');
    expect(res.body.message).toMatch(/Nobody countersigns their own check/);
    expect(await HoldCountersign.count({ where: { holdId: held.holdId } })).toBe(0);
  });

  it('when a lead keeps the hold, then a reason is required and the hold stays open', async () => {
    const held = await heldAirframe(app);
    const lead = await signedIn(app, ['shift_lead'], 'kiosk');
    const noReason = await lead.client.post(`/api/holds/${held.holdId}/countersign`, {
      decision: 'keep',
      pin: lead.pin,
    });
    expect(noReason.status).toBe(400);
    expect(noReason.body.message).toBe('Say why the hold stays.');
    expect(noReason.body.issues[0].path).toBe('reason');
    const kept = await lead.client.post(`/api/holds/${held.holdId}/countersign`, {
      decision: 'keep',
      reason: 'Leak source not found yet; waiting for the dye test.',
      pin: lead.pin,
    });
    expect(kept.status).toBe(200);
    expect(kept.body.state).toBe('open');
    expect(kept.body.countersigns[0]).toMatchObject({ decision: 'keep', signedWith: 'pin' });
    expect((await Hold.findByPk(held.holdId))!.releasedAt).toBeNull();
    const queue = (await lead.client.get('/api/holds')).body as HoldQueueItem[];
    expect(queue.find((h) => h.id === held.holdId)?.lastCountersign).toMatchObject({
      decision: 'keep',
      by: lead.staff.name,
    });
  });

  it('when the password is wrong or the kiosk PIN is given at the desk, then nothing is countersigned', async () => {
    const held = await heldAirframe(app);
    const lead = await deskLead();
    const wrong = await lead.client.post(`/api/holds/${held.holdId}/countersign`, {
      decision: 'keep',
      reason: 'Waiting for parts',
      password: 'not-my-password',
    });
    expect(wrong.status).toBe(401);
    expect(wrong.body.code).toBe('wrong_password');
    const pinAtDesk = await lead.client.post(`/api/holds/${held.holdId}/countersign`, {
      decision: 'keep',
      reason: 'Waiting for parts',
      pin: lead.pin,
    });
    expect(pinAtDesk.status).toBe(400);
    expect(pinAtDesk.body.code).toBe('password_required');
    expect(await HoldCountersign.count({ where: { holdId: held.holdId } })).toBe(0);
  });

  it('when a corrective action is empty, then it is refused with a message and nothing is stored', async () => {
    const held = await heldAirframe(app);
    const res = await held.mechanic.client.post(`/api/holds/${held.holdId}/corrective-action`, {
      text: '  ',
    });
    expect(res.status).toBe(400);
    expect(res.body.message).toMatch(/what was done/);
    expect(await HoldCorrectiveAction.count({ where: { holdId: held.holdId } })).toBe(0);
  });

  it('when a new finding comes after a release, then the airframe is on hold again', async () => {
    const held = await heldAirframe(app);
    const lead = await deskLead();
    await authorise(lead.staff.id, held.type.code);
    await held.mechanic.client.post(`/api/holds/${held.holdId}/corrective-action`, {
      text: 'Seal replaced.',
      pin: held.mechanic.pin,
    });
    await signCheck(held.mechanic, held.airframe.id, held.limits.id);
    const released = await lead.client.post(`/api/holds/${held.holdId}/countersign`, {
      decision: 'release',
      password: lead.password,
    });
    expect(released.status).toBe(200);
    const again = await signCheck(held.mechanic, held.airframe.id, held.limits.id, {}, [isolatedLevel]);
    expect(again.holdOpened).toBe(true);
    const summary: AirframeSummary = (await lead.client.get(`/api/airframes/${held.airframe.id}`)).body;
    expect(summary.state).toBe('unserviceable');
    expect(summary.causes).toEqual(['on_hold']);
    expect(summary.openHolds).toHaveLength(1);
  });
});
