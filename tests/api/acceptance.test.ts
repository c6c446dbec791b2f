import { describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { appForThisFile, database, makeAirframe } from '../setup/api-harness';
import {
  checkBody,
  goodPreFlight,
  isolatedLevel,
  preFlightBody,
  servicingReadings,
  servicingTopUps,
  signCheck,
} from '../setup/check-builder';
import { heldAirframe } from '../setup/lead-fixtures';
import { signedIn } from '../setup/sign-in';
import { Acceptance, Staff } from '@server/db/models';
import { loadStoredCheck, submitCheck } from '@server/features/checks/checks.service';
import { acceptAirframe, type AirframeStatusOf } from '@server/features/acceptance/acceptance.service';
import { airframeStatuses } from '@server/features/airframes/airframes.service';
import type { SubmitCheck } from '@shared/schemas/checks';
import { defaultUsageStepLimits } from '@shared/domain/usage';
import { toSessionUser } from '@server/features/auth/auth.service';
import type { AirframeSummary } from '@shared/schemas/airframes';
import type { AcceptanceRecord, AcceptanceView } from '@shared/schemas/acceptance';

const { app } = appForThisFile();

const pilot = () => signedIn(app, ['pilot'], 'kiosk');
const mechanic = () => signedIn(app, ['mechanic'], 'kiosk');

describe('the pilot view', () => {
  it('when a released airframe is opened, then the pilot sees its state, the latest checks against limits, fluid added and the caution', async () => {
    const m = await mechanic();
    const { airframe, limits } = await makeAirframe();
    const preFlight = await signCheck(m, airframe.id, limits.id);
    const servicing = await m.client.post(
      '/api/checks',
      checkBody('servicing', airframe.id, limits.id, m.pin, servicingReadings(), {
        servicing: servicingTopUps(0.4, 0),
      }),
    );
    expect(servicing.status).toBe(201);

    const p = await pilot();
    const res = await p.client.get(`/api/airframes/${airframe.id}/acceptance-view`);
    expect(res.status).toBe(200);
    const view = res.body as AcceptanceView;
    // Checks in limits but no certificate of release to service: a pilot may accept, and is told there is none.
    expect(view).toMatchObject({
      state: 'checks_in_limits',
      canAccept: true,
      refusal: null,
      lastAcceptance: null,
      release: null,
      defects: [],
    });
    expect(view.caution).toMatch(/approved maintenance data.*local regulations.*licensed engineers/);
    expect(view.latestChecks.map((c) => c.kind)).toEqual(['pre_flight', 'servicing']);
    const pf = view.latestChecks[0]!;
    expect(pf).toMatchObject({ id: preFlight.id, valid: true, verdict: 'in_limits' });
    expect(pf.readings.find((r) => r.code === 'sys1.level')).toMatchObject({
      value: 7,
      unit: 'L',
      bandId: 'in_limits_wheels',
      limitText: 'at or above 5.5 L and at or below 7 L',
    });
    // A German screen asks in German (its Accept-Language) and reads the same band in German.
    const german = (
      await p.client.get(`/api/airframes/${airframe.id}/acceptance-view`).set('Accept-Language', 'de')
    ).body as AcceptanceView;
    expect(german.latestChecks[0]!.readings.find((r) => r.code === 'sys1.level')?.limitText).toBe(
      'mindestens 5,5 L und höchstens 7 L',
    );
    expect(view.fluidAdded).toEqual([
      expect.objectContaining({
        checkId: servicing.body.id,
        system: 'sys1',
        litres: 0.4,
        fluidSpec: 'MIL-PRF-83282',
        source: 'servicing',
      }),
    ]);
  });
});

describe('accepting an aircraft', () => {
  it('when the pilot accepts a released airframe with their PIN, then the acceptance records the exact checks and the board shows it', async () => {
    const m = await mechanic();
    const { airframe, limits } = await makeAirframe();
    const preFlight = await signCheck(m, airframe.id, limits.id);
    const p = await pilot();
    const res = await p.client.post(`/api/airframes/${airframe.id}/accept`, { pin: p.pin });
    expect(res.status).toBe(201);
    const record = res.body as AcceptanceRecord;
    expect(record).toMatchObject({
      airframeId: airframe.id,
      acceptedBy: { id: p.staff.id },
      checkIds: [preFlight.id],
    });
    expect(record.contentHash).toMatch(/^[0-9a-f]{64}$/);
    const stored = await Acceptance.findByPk(record.id);
    expect(JSON.parse(stored!.checkIds)).toEqual([preFlight.id]);
    expect(JSON.parse(stored!.signedContent).checks[0].id).toBe(preFlight.id);
    const summary: AirframeSummary = (await p.client.get(`/api/airframes/${airframe.id}`)).body;
    expect(summary.lastAcceptance).toEqual({ by: p.staff.name, at: record.acceptedAt });
  });

  it('when the airframe is on hold, then acceptance is refused with the reason', async () => {
    const held = await heldAirframe(app);
    const p = await pilot();
    const view = (await p.client.get(`/api/airframes/${held.airframe.id}/acceptance-view`))
      .body as AcceptanceView;
    expect(view.canAccept).toBe(false);
    expect(view.openHolds).toHaveLength(1);
    const res = await p.client.post(`/api/airframes/${held.airframe.id}/accept`, { pin: p.pin });
    expect(res.status).toBe(409);
    expect(res.body.code).toBe('airframe_on_hold');
    expect(res.body.message).toMatch(/on hold.*System 1 reservoir level/);
    expect(await Acceptance.count({ where: { airframeId: held.airframe.id } })).toBe(0);
  });

  it('when no pre-flight was signed, then acceptance is refused: the pre-flight is missing', async () => {
    const { airframe } = await makeAirframe();
    const p = await pilot();
    const res = await p.client.post(`/api/airframes/${airframe.id}/accept`, { pin: p.pin });
    expect(res.status).toBe(409);
    expect(res.body.code).toBe('preflight_missing');
    expect(res.body.message).toMatch(/no pre-flight/);
  });

  it('when the pre-flight was signed 15 hours ago (past its 14 h window), then acceptance is refused: it expired', async () => {
    const m = await mechanic();
    const { airframe, limits } = await makeAirframe();
    const staff = await Staff.findByPk(m.staff.id);
    await submitCheck(
      database(),
      {
        id: randomUUID(),
        airframeId: airframe.id,
        kind: 'pre_flight',
        limitsVersionId: limits.id,
        pin: m.pin,
        ...structuredClone(goodPreFlight),
      },
      {
        signer: toSessionUser(staff!),
        kioskId: null,
        lockout: { maxAttempts: 5, lockMinutes: 15 },
        usageLimits: defaultUsageStepLimits,
        now: new Date(Date.now() - 15 * 3_600_000),
      },
    );
    const p = await pilot();
    const view = (await p.client.get(`/api/airframes/${airframe.id}/acceptance-view`)).body as AcceptanceView;
    expect(view.state).toBe('due');
    expect(view.latestChecks[0]).toMatchObject({ kind: 'pre_flight', valid: false });
    const res = await p.client.post(`/api/airframes/${airframe.id}/accept`, { pin: p.pin });
    expect(res.status).toBe(409);
    expect(res.body.code).toBe('preflight_expired');
    expect(res.body.message).toMatch(/no longer valid/);
  });

  it('when the PIN is wrong, then nothing is accepted', async () => {
    const m = await mechanic();
    const { airframe, limits } = await makeAirframe();
    await signCheck(m, airframe.id, limits.id);
    const p = await pilot();
    const res = await p.client.post(`/api/airframes/${airframe.id}/accept`, { pin: '0000' });
    expect(res.status).toBe(401);
    expect(res.body.code).toBe('wrong_pin');
    expect(await Acceptance.count({ where: { airframeId: airframe.id } })).toBe(0);
    expect((await p.client.post(`/api/airframes/${airframe.id}/accept`, {})).status).toBe(400);
    expect((await p.client.post('/api/airframes/999999999/accept', { pin: p.pin })).status).toBe(404);
  });

  it('when a check opens a hold while the pilot is signing, then the acceptance is refused and not stored', async () => {
    const m = await mechanic();
    const { airframe, limits } = await makeAirframe();
    await signCheck(m, airframe.id, limits.id);
    const p = await pilot();
    const pilotRow = await Staff.findByPk(p.staff.id);
    const mechanicRow = await Staff.findByPk(m.staff.id);
    const lockout = { maxAttempts: 5, lockMinutes: 15 };
    // The state is read (checks in limits), and then, before the acceptance is written, a mechanic's finding lands.
    const statusOf: AirframeStatusOf = async (id, now) => {
      const detail = (await airframeStatuses(database(), now, id))[0];
      await submitCheck(
        database(),
        preFlightBody(airframe.id, limits.id, m.pin, {
          readings: goodPreFlight.readings.map((r) => (r.code === 'sys1.level' ? isolatedLevel : r)),
        }) as SubmitCheck,
        { signer: toSessionUser(mechanicRow!), kioskId: null, lockout, usageLimits: defaultUsageStepLimits },
      );
      return detail;
    };
    expect((await airframeStatuses(database(), new Date(), airframe.id))[0]?.status.state).toBe(
      'checks_in_limits',
    );
    await expect(
      acceptAirframe(
        database(),
        { statusOf, loadCheck: loadStoredCheck },
        airframe.id,
        { pin: p.pin },
        {
          pilot: toSessionUser(pilotRow!),
          lockout,
        },
      ),
    ).rejects.toMatchObject({ status: 409, code: 'state_changed' });
    expect(await Acceptance.count({ where: { airframeId: airframe.id } })).toBe(0);
    // Without anything landing in between, the same pilot can accept an airframe whose checks are in limits.
    const other = await makeAirframe();
    await signCheck(m, other.airframe.id, other.limits.id);
    const accepted = await acceptAirframe(
      database(),
      {
        statusOf: async (id, now) => (await airframeStatuses(database(), now, id))[0],
        loadCheck: loadStoredCheck,
      },
      other.airframe.id,
      { pin: p.pin },
      { pilot: toSessionUser(pilotRow!), lockout },
    );
    expect(accepted.airframeId).toBe(other.airframe.id);
  });
});
