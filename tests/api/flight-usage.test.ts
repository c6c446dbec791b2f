import { describe, expect, it } from 'vitest';
import { appForThisFile, database, makeAirframe } from '../setup/api-harness';
import { afterFlightBody, preFlightBody, signCheck, topUp } from '../setup/check-builder';
import { signedIn } from '../setup/sign-in';
import { Airframe, AuditEvent, Check, UsageEntry } from '@server/db/models';
import { airframeStatuses } from '@server/features/airframes/airframes.service';
import { demoTypes } from '@shared/demo/demo-types';
import type { Trends } from '@shared/schemas/records';
import type { UsageEntry as UsageEntryView } from '@shared/schemas/usage';
import { inWords } from '@shared/i18n/phrase';

const { app } = appForThisFile();

const mechanic = () => signedIn(app, ['mechanic'], 'kiosk');
const pilot = () => signedIn(app, ['pilot'], 'kiosk');

/** makeAirframe starts every airframe at 1 234.5 h, no flights and no landings (as set at the desk). */
const startHours = 1234.5;

async function figuresOf(airframeId: number) {
  const a = (await Airframe.findByPk(airframeId))!;
  return { hours: Number(a.hours), flights: Number(a.flights), landings: Number(a.landings) };
}

const entriesOf = (airframeId: number) => UsageEntry.count({ where: { airframeId } });

describe('recording flight hours at the after-flight check', () => {
  it('when an after-flight records the figures, then they are stored, audited, stamped on the check and moved on the airframe', async () => {
    const m = await mechanic();
    const { airframe, limits } = await makeAirframe();
    const usage = { hours: 1236.5, flights: 1, landings: 2 };
    const res = await m.client.post('/api/checks', afterFlightBody(airframe.id, limits.id, m.pin, usage));
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ airframeHours: 1236.5, airframeFlights: 1 });
    expect(await figuresOf(airframe.id)).toEqual(usage);
    const entry = (await UsageEntry.findOne({ where: { checkId: res.body.id } }))!;
    expect(entry).toMatchObject({ source: 'after_flight_check', flightsFlown: 1, landingsMade: 2 });
    expect(Number(entry.hoursFlown)).toBe(2);
    const event = await AuditEvent.findOne({
      where: { entity: 'airframe_usage', entityId: String(entry.id) },
    });
    expect(event?.action).toBe('usage.recorded');
  });

  it('when the figures are the last ones (nothing flown since), then the after-flight is stored and adds nothing', async () => {
    const m = await mechanic();
    const { airframe, limits } = await makeAirframe();
    const usage = { hours: startHours, flights: 0, landings: 0 };
    const res = await m.client.post('/api/checks', afterFlightBody(airframe.id, limits.id, m.pin, usage));
    expect(res.status).toBe(201);
    expect(await entriesOf(airframe.id)).toBe(1);
    expect(await figuresOf(airframe.id)).toEqual(usage);
  });

  it('when hours go back, then the check is refused with the last figure and nothing is stored', async () => {
    const m = await mechanic();
    const { airframe, limits } = await makeAirframe();
    const body = afterFlightBody(airframe.id, limits.id, m.pin, { hours: 1234.4, flights: 1, landings: 1 });
    const res = await m.client.post('/api/checks', body);
    expect(res.status).toBe(400);
    expect(res.body).toMatchObject({
      code: 'usage_backwards',
      message: 'Hours cannot go back: the last figure is 1 234.5 h, set at the desk. Read the figure again.',
      path: 'usage.hours',
      last: { hours: startHours, flights: 0, landings: 0 },
    });
    expect(await Check.findByPk(body.id)).toBeNull();
    expect(await entriesOf(airframe.id)).toBe(0);
    expect(await figuresOf(airframe.id)).toEqual({ hours: startHours, flights: 0, landings: 0 });
  });

  it('when hours go back after a recorded flight, then the message says when the last figure was recorded', async () => {
    const m = await mechanic();
    const { airframe, limits } = await makeAirframe();
    const first = await m.client.post(
      '/api/checks',
      afterFlightBody(airframe.id, limits.id, m.pin, { hours: 1235.5, flights: 1, landings: 1 }),
    );
    expect(first.status).toBe(201);
    const body = afterFlightBody(airframe.id, limits.id, m.pin, { hours: 1236.0, flights: 0, landings: 1 });
    const res = await m.client.post('/api/checks', body);
    expect(res.status).toBe(400);
    expect(res.body.code).toBe('usage_backwards');
    expect(res.body.message).toMatch(
      /^Flights cannot go back: the last figure is 1 flight, recorded \d{1,2} [A-Z][a-z]{2} \d{4}, \d\d:\d\d UTC\./,
    );
    expect(await Check.findByPk(body.id)).toBeNull();
    expect(await entriesOf(airframe.id)).toBe(1);
  });

  it('when the hours jump more than 24 h in one entry, then the check is refused and nothing is stored', async () => {
    const m = await mechanic();
    const { airframe, limits } = await makeAirframe();
    const body = afterFlightBody(airframe.id, limits.id, m.pin, { hours: 1258.6, flights: 1, landings: 1 });
    const res = await m.client.post('/api/checks', body);
    expect(res.status).toBe(400);
    expect(res.body.code).toBe('usage_jump');
    expect(res.body.message).toContain('the last figure is 1 234.5 h');
    expect(await Check.findByPk(body.id)).toBeNull();
    expect(await figuresOf(airframe.id)).toEqual({ hours: startHours, flights: 0, landings: 0 });
  });

  it('when 51 landings are entered at once, then they are refused as a jump', async () => {
    const m = await mechanic();
    const { airframe, limits } = await makeAirframe();
    const res = await m.client.post(
      '/api/checks',
      afterFlightBody(airframe.id, limits.id, m.pin, { hours: 1240, flights: 5, landings: 51 }),
    );
    expect(res.status).toBe(400);
    expect(res.body).toMatchObject({ code: 'usage_jump', path: 'usage.landings' });
  });

  it('when a pre-flight carries figures, then it is refused: they belong to the after-flight', async () => {
    const m = await mechanic();
    const { airframe, limits } = await makeAirframe();
    const res = await m.client.post(
      '/api/checks',
      preFlightBody(airframe.id, limits.id, m.pin, { usage: { hours: 1236, flights: 1, landings: 1 } }),
    );
    expect(res.status).toBe(400);
    expect(res.body.code).toBe('usage_not_after_flight');
  });

  it('when the same after-flight is sent twice, then the flight is recorded once', async () => {
    const m = await mechanic();
    const { airframe, limits } = await makeAirframe();
    const body = afterFlightBody(airframe.id, limits.id, m.pin, { hours: 1236.5, flights: 1, landings: 1 });
    expect((await m.client.post('/api/checks', body)).status).toBe(201);
    const again = await m.client.post('/api/checks', body);
    expect(again.status).toBe(201);
    expect(again.headers['idempotent-replay']).toBe('true');
    expect(await entriesOf(airframe.id)).toBe(1);
    expect(await figuresOf(airframe.id)).toEqual({ hours: 1236.5, flights: 1, landings: 1 });
  });
});

describe("the pilot's close of a flight", () => {
  it('when a pilot closes a flight with badge and PIN, then the figures are recorded and signed', async () => {
    const p = await pilot();
    const { airframe } = await makeAirframe();
    const res = await p.client.post(`/api/airframes/${airframe.id}/flight-close`, {
      usage: { hours: 1235.7, flights: 1, landings: 3 },
      pin: p.pin,
    });
    expect(res.status).toBe(201);
    const entry = res.body as UsageEntryView;
    expect(entry).toMatchObject({
      source: 'flight_close',
      checkId: null,
      figures: { hours: 1235.7, flights: 1, landings: 3 },
      flown: { hours: 1.2, flights: 1, landings: 3 },
    });
    expect(await figuresOf(airframe.id)).toEqual({ hours: 1235.7, flights: 1, landings: 3 });
    const row = (await UsageEntry.findByPk(entry.id))!;
    expect(row.signedWith).toBe('pin');
    expect(row.contentHash).toMatch(/^[0-9a-f]{64}$/);
  });

  it('when a mechanic tries to close a flight, then it is refused and nothing is stored', async () => {
    const m = await mechanic();
    const { airframe } = await makeAirframe();
    const res = await m.client.post(`/api/airframes/${airframe.id}/flight-close`, {
      usage: { hours: 1235.7, flights: 1, landings: 1 },
      pin: m.pin,
    });
    expect(res.status).toBe(403);
    expect(await entriesOf(airframe.id)).toBe(0);
  });

  it('when the pilot enters hours below the last figure, then it is refused with that figure', async () => {
    const p = await pilot();
    const { airframe } = await makeAirframe();
    const res = await p.client.post(`/api/airframes/${airframe.id}/flight-close`, {
      usage: { hours: 1200, flights: 1, landings: 1 },
      pin: p.pin,
    });
    expect(res.status).toBe(400);
    expect(res.body.message).toContain('Hours cannot go back: the last figure is 1 234.5 h');
    expect(await entriesOf(airframe.id)).toBe(0);
  });

  it('when the PIN is wrong, then nothing is stored', async () => {
    const p = await pilot();
    const { airframe } = await makeAirframe();
    const res = await p.client.post(`/api/airframes/${airframe.id}/flight-close`, {
      usage: { hours: 1235, flights: 1, landings: 1 },
      pin: p.pin === '0000' ? '1111' : '0000',
    });
    expect(res.status).toBeGreaterThanOrEqual(400);
    expect(res.status).toBeLessThan(500);
    expect(await entriesOf(airframe.id)).toBe(0);
  });
});

describe('consumption per flight hour from the recorded hours', () => {
  it('when 0.6 L goes into system 1 after 2.0 h recorded at the after-flight, then the per-flight-hour alert fires at 0.30 L/FH', async () => {
    const m = await mechanic();
    const { airframe, limits } = await makeAirframe();
    // The flight leaves system 1 at 6.4 L; the 0.6 L top-up at the next pre-flight brings it back to 7.0 L.
    const usage = { hours: startHours + 2.0, flights: 1, landings: 1 };
    const flown = await m.client.post(
      '/api/checks',
      afterFlightBody(airframe.id, limits.id, m.pin, usage, {}, 6.4),
    );
    expect(flown.status).toBe(201);
    await signCheck(m, airframe.id, limits.id, {
      servicing: [topUp({ quantity: { value: 0.6, unit: 'L' }, levelBefore: { value: 6.4, unit: 'L' } })],
    });
    const lead = await signedIn(app, ['shift_lead'], 'desk');
    const res = await lead.client.get(`/api/trends?airframeId=${airframe.id}&days=7`);
    expect(res.status).toBe(200);
    const sys1 = (res.body as Trends).systems.find((s) => s.system === 'sys1')!;
    // Hand-computed: 0.6 L over 2.0 h = 0.30 L per flight hour, at or above the demo RX-4's invented 0.08 alert.
    expect(sys1.window.flightHours).toBeCloseTo(2.0, 6);
    expect(sys1.window.litresAdded).toBeCloseTo(0.6, 6);
    expect(sys1.window.litresPerFlightHour).toBeCloseTo(0.3, 6);
    expect(sys1.ratePerFh.map((r) => r.litresPerFh)).toEqual([expect.closeTo(0.3, 6)]);
    expect(sys1.alerts.map((a) => a.kind)).toEqual(['rate_at_or_above_threshold']);
    expect(inWords(sys1.alerts.find((a) => a.kind === 'rate_at_or_above_threshold')!.message)).toContain(
      '0.300 L per flight hour',
    );
  });

  it('when no flight was recorded between a pre-flight and an after-flight, then the trends say nothing was flown; once recorded, they do not', async () => {
    const m = await mechanic();
    const { airframe, limits } = await makeAirframe();
    await signCheck(m, airframe.id, limits.id, {
      servicing: [topUp({ quantity: { value: 0.6, unit: 'L' } })],
    });
    const lead = await signedIn(app, ['shift_lead'], 'desk');
    const before = (await lead.client.get(`/api/trends?airframeId=${airframe.id}&days=7`)).body as Trends;
    expect(before.systems[0]!.alerts.map((a) => a.kind)).toContain('fluid_without_flying');
    await m.client.post(
      '/api/checks',
      afterFlightBody(airframe.id, limits.id, m.pin, { hours: startHours + 10, flights: 2, landings: 2 }),
    );
    const after = (await lead.client.get(`/api/trends?airframeId=${airframe.id}&days=7`)).body as Trends;
    // 0.6 L over 10 h = 0.06 L per flight hour: below the 0.08 alert, and something was flown.
    expect(after.systems[0]!.window.litresPerFlightHour).toBeCloseTo(0.06, 6);
    expect(after.systems[0]!.alerts).toEqual([]);
  });
});

describe('a check valid for one flight', () => {
  // The demo RX-4's ground run covers one flight; here the pre-flight does, so the test needs only its card.
  const oneFlight = { ...demoTypes[0]!, validity: { ...demoTypes[0]!.validity, pre_flight: { flights: 1 } } };

  const preFlightDue = async (airframeId: number) =>
    (await airframeStatuses(database(), new Date(), airframeId))[0]!.status.due.find(
      (d) => d.kind === 'pre_flight',
    )!;

  it('when a flight is recorded at the after-flight, then the pre-flight is used up', async () => {
    const m = await mechanic();
    const { airframe, limits } = await makeAirframe({ definition: oneFlight });
    await signCheck(m, airframe.id, limits.id);
    expect((await preFlightDue(airframe.id)).expired).toBe(false);
    const res = await m.client.post(
      '/api/checks',
      afterFlightBody(airframe.id, limits.id, m.pin, { hours: startHours + 1, flights: 1, landings: 1 }),
    );
    expect(res.status).toBe(201);
    const due = await preFlightDue(airframe.id);
    expect(due.expired).toBe(true);
    expect(inWords(due.reason)).toMatch(/used up by 1 flight$/);
  });

  it('when the pilot closes a flight, then the pre-flight is used up; figures with no flight leave it valid', async () => {
    const m = await mechanic();
    const p = await pilot();
    const { airframe, limits } = await makeAirframe({ definition: oneFlight });
    await signCheck(m, airframe.id, limits.id);
    const noFlight = await p.client.post(`/api/airframes/${airframe.id}/flight-close`, {
      usage: { hours: startHours, flights: 0, landings: 0 },
      pin: p.pin,
    });
    expect(noFlight.status).toBe(201);
    expect((await preFlightDue(airframe.id)).expired).toBe(false);
    const closed = await p.client.post(`/api/airframes/${airframe.id}/flight-close`, {
      usage: { hours: startHours + 0.8, flights: 1, landings: 1 },
      pin: p.pin,
    });
    expect(closed.status).toBe(201);
    expect((await preFlightDue(airframe.id)).expired).toBe(true);
  });
});

describe('a level that fell with nothing flown, on the board and the kiosk', () => {
  const summaryOf = async (airframeId: number) =>
    (await airframeStatuses(database(), new Date(), airframeId))[0]!.summary;

  it('when system 1 reads 0.5 L lower at the next check with no flight recorded, then the airframe carries the alert in words and its state is unchanged; after a recorded flight the next check clears it', async () => {
    const m = await mechanic();
    const p = await pilot();
    const { airframe, limits } = await makeAirframe();
    const usage = { hours: startHours + 1, flights: 1, landings: 1 };
    expect(
      (await m.client.post('/api/checks', afterFlightBody(airframe.id, limits.id, m.pin, usage))).status,
    ).toBe(201);
    await signCheck(m, airframe.id, limits.id, {}, [
      { code: 'sys1.level', entry: { value: 6.5, unit: 'L' } },
    ]);
    const alerted = await summaryOf(airframe.id);
    expect(inWords(alerted.fluidAlerts)).toEqual([
      {
        system: 'System 1',
        message:
          'System 1: level fell 0.50 L between the last two checks with no flight recorded and no fluid drawn to ' +
          'account for it. Look for a leak before flight.',
      },
    ]);
    // An alert beside the state, not a finding: both checks are in limits and nothing holds the airframe.
    expect(alerted.state).toBe('checks_in_limits');
    expect(alerted.causes).toEqual([]);

    const closed = await p.client.post(`/api/airframes/${airframe.id}/flight-close`, {
      usage: { hours: startHours + 2, flights: 2, landings: 2 },
      pin: p.pin,
    });
    expect(closed.status).toBe(201);
    await signCheck(m, airframe.id, limits.id, {}, [
      { code: 'sys1.level', entry: { value: 6.3, unit: 'L' } },
    ]);
    expect((await summaryOf(airframe.id)).fluidAlerts).toEqual([]);
  });
});
