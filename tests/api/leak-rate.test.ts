import { describe, expect, it } from 'vitest';
import { appForThisFile, makeAirframe } from '../setup/api-harness';
import { preFlightBody } from '../setup/check-builder';
import { signedIn } from '../setup/sign-in';
import { Check, Hold, Reading } from '@server/db/models';
import { demoTypes } from '@shared/demo/demo-types';
import type { AircraftTypeDefinition, Checkpoint } from '@shared/schemas/limits';
import type { TypeDetail } from '@shared/schemas/engineering-types';
import type { HoldDetail } from '@shared/schemas/holds';

const { app } = appForThisFile();

const rx4 = () => structuredClone(demoTypes[0]!) as AircraftTypeDefinition;

const leakReadings = (sys2: unknown) => [
  { code: 'sys1.leaks', entry: { dropsPerMinute: 0 } },
  { code: 'sys2.leaks', entry: sys2 },
  { code: 'brakes.leaks', entry: { dropsPerMinute: 0, leakState: 'static' } },
];

function withReadings(body: ReturnType<typeof preFlightBody>, readings: { code: string; entry: unknown }[]) {
  body.readings = body.readings.map(
    (r) => readings.find((x) => x.code === r.code) ?? r,
  ) as typeof body.readings;
  return body;
}

describe('signing a check with leak rates', () => {
  it('when a pre-flight counts no leak at two places and 4 drops/min dynamic at system 2, then the verdict is stored from the dynamic bands with the count as its value', async () => {
    const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
    const { airframe, limits } = await makeAirframe();
    const body = withReadings(
      preFlightBody(airframe.id, limits.id, mechanic.pin),
      leakReadings({ dropsPerMinute: 4, leakState: 'dynamic' }),
    );
    const res = await mechanic.client.post('/api/checks', body);
    expect(res.status).toBe(201);
    // The demo RX-4 allows 3 drops/min dynamic and watches up to 6 (invented, common practice, no source).
    expect(res.body.verdict).toBe('service');
    const stored = await Reading.findOne({ where: { checkId: body.id, checkpointCode: 'sys2.leaks' } });
    expect(stored).toMatchObject({ value: 4, unit: null, verdict: 'service', bandId: 'dynamic_watch' });
    const none = await Reading.findOne({ where: { checkId: body.id, checkpointCode: 'sys1.leaks' } });
    expect(none).toMatchObject({ value: 0, verdict: 'in_limits', bandId: 'static_in_limits' });

    const eng = (await signedIn(app, ['engineering'], 'desk')).client;
    const record = (await eng.get(`/api/records/${body.id}`)).body;
    const sys2 = record.readings.find((r: { code: string }) => r.code === 'sys2.leaks');
    expect(sys2).toMatchObject({
      entry: { dropsPerMinute: 4, leakState: 'dynamic' },
      verdict: 'service',
      ata: '29',
    });
    expect(sys2.reference).toMatch(/Approved maintenance data/);
  });

  it('when 12 drops/min dynamic are counted at system 2, then the check holds the airframe and the hold reads the leak against its band in words', async () => {
    const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
    const { airframe, limits } = await makeAirframe();
    const body = withReadings(
      preFlightBody(airframe.id, limits.id, mechanic.pin),
      leakReadings({ dropsPerMinute: 12, leakState: 'dynamic' }),
    );
    const res = await mechanic.client.post('/api/checks', body);
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ verdict: 'out_of_limits', holdOpened: true });
    const hold = await Hold.findOne({ where: { checkId: body.id } });
    const lead = (await signedIn(app, ['shift_lead'], 'desk')).client;
    const detail = (await lead.get(`/api/holds/${hold!.id}`)).body as HoldDetail;
    expect(detail.readings.find((r) => r.code === 'sys2.leaks')).toMatchObject({
      verdict: 'out_of_limits',
      bandId: 'dynamic_out',
      value: 12,
      limitText: 'above 6 drops/min and at or below 50 drops/min for a dynamic leak',
    });
    expect(detail.readings.find((r) => r.code === 'sys1.leaks')).toMatchObject({
      verdict: 'in_limits',
      value: 0,
    });
  });

  it('when a leak count is fractional, negative or lacks static/dynamic, then 400 with a plain message and nothing is stored', async () => {
    const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
    const { airframe, limits } = await makeAirframe();
    for (const [entry, words] of [
      [{ dropsPerMinute: 2.5, leakState: 'static' }, 'Count whole drops'],
      [{ dropsPerMinute: -1, leakState: 'static' }, 'cannot be less than none'],
      [{ dropsPerMinute: 3 }, 'static (system not pressurised) or dynamic'],
    ] as const) {
      const body = withReadings(preFlightBody(airframe.id, limits.id, mechanic.pin), leakReadings(entry));
      const res = await mechanic.client.post('/api/checks', body);
      expect(res.status).toBe(400);
      expect(res.body.message).toContain(words);
      expect(res.body.message).not.toMatch(/dropsPerMinute|leak_rate/);
    }
    expect(await Check.count({ where: { airframeId: airframe.id } })).toBe(0);
  });

  it('when the limits version in force still has yes/no leak questions, then a "no" is signed and its record still reads', async () => {
    const older = rx4();
    for (const code of ['sys1.leaks', 'sys2.leaks', 'brakes.leaks']) {
      const at = older.checkpoints.findIndex((c) => c.code === code);
      const leak = older.checkpoints[at]!;
      older.checkpoints[at] = {
        ...leak,
        kind: 'yes_no',
        range: { min: 0, max: 1 },
        bands: [
          {
            id: 'no',
            lower: { value: 0, closed: true },
            upper: { value: 0, closed: true },
            verdict: 'in_limits',
            message: 'Nothing found.',
            action: 'None.',
          },
          {
            id: 'yes',
            lower: { value: 1, closed: true },
            upper: { value: 1, closed: true },
            verdict: 'out_of_limits',
            message: 'Hydraulic leak found.',
            action: 'Do not fly.',
          },
        ],
      } satisfies Checkpoint;
    }
    const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
    const { airframe, limits } = await makeAirframe({ definition: older });
    const answers = ['sys1.leaks', 'sys2.leaks', 'brakes.leaks'].map((code) => ({
      code,
      entry: { answer: false },
    }));
    const body = withReadings(preFlightBody(airframe.id, limits.id, mechanic.pin), answers);
    const res = await mechanic.client.post('/api/checks', body);
    expect(res.status).toBe(201);
    expect(res.body.verdict).toBe('in_limits');
    const eng = (await signedIn(app, ['engineering'], 'desk')).client;
    const record = (await eng.get(`/api/records/${body.id}`)).body;
    expect(record.readings.find((r: { code: string }) => r.code === 'sys1.leaks')).toMatchObject({
      entry: { answer: false },
      verdict: 'in_limits',
    });
  });
});

describe('engineering defines a leak-rate checkpoint', () => {
  const leakCheckpoint = (dynamicUpTo: number): Checkpoint => ({
    code: 'gear.leaks',
    label: 'Landing gear actuator leaks',
    instruction: 'Count the drops at the gear actuator for one minute.',
    kind: 'leak_rate',
    unit: null,
    range: { min: 0, max: 30 },
    requires: [],
    ata: '32',
    reference: 'Approved maintenance data, test chapter',
    bands: [
      {
        id: 'static_ok',
        lower: { value: 0, closed: true },
        upper: { value: 2, closed: true },
        verdict: 'in_limits',
        message: 'Within the allowed seep.',
        action: 'None.',
        when: { leakState: 'static' },
      },
      {
        id: 'static_out',
        lower: { value: 3, closed: true },
        upper: { value: 30, closed: true },
        verdict: 'out_of_limits',
        message: 'Static leak beyond the limit.',
        action: 'Do not fly.',
        when: { leakState: 'static' },
      },
      {
        id: 'dynamic_ok',
        lower: { value: 0, closed: true },
        upper: { value: dynamicUpTo, closed: true },
        verdict: 'in_limits',
        message: 'Within the allowed leak.',
        action: 'None.',
        when: { leakState: 'dynamic' },
      },
      {
        id: 'dynamic_out',
        lower: { value: 5, closed: false },
        upper: { value: 30, closed: true },
        verdict: 'out_of_limits',
        message: 'Dynamic leak beyond the limit.',
        action: 'Do not fly.',
        when: { leakState: 'dynamic' },
      },
    ],
  });

  it('when a draft adds a leak-rate checkpoint with a gap in its dynamic bands, then publishing names the gap in drops/min; once closed it publishes and the card asks it', async () => {
    const eng = (await signedIn(app, ['engineering'], 'desk')).client;
    const { type } = await makeAirframe();
    const definition = rx4();
    definition.checkpoints.push(leakCheckpoint(3));
    definition.cards.after_flight = [...definition.cards.after_flight!, 'gear.leaks'];
    expect((await eng.post(`/api/types/${type.id}/draft`, { definition })).status).toBe(200);
    const refused = await eng.post(`/api/types/${type.id}/draft/publish`);
    expect(refused.status).toBe(400);
    expect(refused.body.message).toContain(
      'gear.leaks: No band covers 4 drops/min to 5 drops/min (dynamic leak).',
    );

    definition.checkpoints[definition.checkpoints.length - 1] = leakCheckpoint(5);
    expect((await eng.post(`/api/types/${type.id}/draft`, { definition })).status).toBe(200);
    const published = await eng.post(`/api/types/${type.id}/draft/publish`);
    expect(published.status).toBe(200);
    const detail = (await eng.get(`/api/types/${type.id}`)).body as TypeDetail;
    expect(detail.current?.version).toBe(2);
    const version = (await eng.get(`/api/types/${type.id}/versions/${published.body.id}`)).body;
    expect(version.definition.checkpoints.find((c: Checkpoint) => c.code === 'gear.leaks')).toMatchObject({
      kind: 'leak_rate',
      unit: null,
    });
  });

  it('when a leak-rate checkpoint is given a unit, then saving keeps the draft and publishing refuses it in words', async () => {
    const eng = (await signedIn(app, ['engineering'], 'desk')).client;
    const { type } = await makeAirframe();
    const definition = rx4();
    definition.checkpoints.push({ ...leakCheckpoint(5), unit: 'bar' });
    expect((await eng.post(`/api/types/${type.id}/draft`, { definition })).status).toBe(200);
    const refused = await eng.post(`/api/types/${type.id}/draft/publish`);
    expect(refused.status).toBe(400);
    expect(refused.body.message).toContain(
      'A leak rate is counted in drops per minute; it has no unit to pick.',
    );
  });
});
