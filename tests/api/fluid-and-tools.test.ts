import { execFileSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { appForThisFile, makeAirframe } from '../setup/api-harness';
import { checkBody, preFlightBody, servicingReadings, servicingTopUps, topUp } from '../setup/check-builder';
import { signedIn, type SignedIn } from '../setup/sign-in';
import { Check, Reading, ServicingEntry } from '@server/db/models';
import { demoTypes } from '@shared/demo/demo-types';
import { localDay } from '@shared/domain/local-time';
import type { AircraftTypeDefinition } from '@shared/schemas/limits';
import type { HandoverSummary } from '@shared/schemas/handover';
import type { AcceptanceView } from '@shared/schemas/acceptance';
import type { Tool } from '@shared/schemas/tools';

const { app } = appForThisFile();

/** A day counted from today in the demo type's zone, where signing reads the calibration day. */
const day = (offsetDays: number) =>
  localDay(new Date(Date.now() + offsetDays * 86_400_000), demoTypes[0]!.timeZone);
let toolSeq = 0;

/** Registers a tool through the engineering desk, as a person would. */
async function registerTool(engineer: SignedIn, changes: Partial<Tool> = {}): Promise<Tool> {
  toolSeq += 1;
  const res = await engineer.client.post('/api/tools', {
    number: `PG-${Date.now() % 100000}-${toolSeq}`,
    kind: 'pressure_gauge',
    description: 'Test gauge 0-160 bar',
    serial: `TG-${toolSeq}`,
    calibrationDue: day(30),
    ...changes,
  });
  expect(res.status).toBe(201);
  return res.body as Tool;
}

const withTool = (readings: ReturnType<typeof preFlightBody>['readings'], code: string, tool: string) =>
  readings.map((r) => (r.code === code ? { ...r, tool } : r));

describe('the tools register', () => {
  it('when engineering registers, recalibrates and retires a tool, then the register shows it and a mechanic cannot change it', async () => {
    const engineer = await signedIn(app, ['engineering'], 'desk');
    const tool = await registerTool(engineer, {
      number: `nk-${toolSeq + 900}`,
      kind: 'nitrogen_charging_kit',
    });
    expect(tool.number).toMatch(/^NK-/);
    expect(
      (await engineer.client.post('/api/tools', { ...tool, id: undefined, retiredAt: undefined })).status,
    ).toBe(409);
    const moved = await engineer.client.post(`/api/tools/${tool.id}`, { calibrationDue: day(200) });
    expect(moved.status).toBe(200);
    expect(moved.body.tool.calibrationDue).toBe(day(200));
    const bad = await engineer.client.post(`/api/tools/${tool.id}`, { calibrationDue: '2026-02-30' });
    expect(bad.status).toBe(400);
    expect(bad.body.message).toContain('that day does not exist');
    expect((await engineer.client.post(`/api/tools/${tool.id}/retire`, {})).body.retiredAt).not.toBeNull();
    expect((await engineer.client.post(`/api/tools/${tool.id}/retire`, {})).status).toBe(409);
    const listed = (await engineer.client.get('/api/tools')).body as Tool[];
    expect(listed.find((t) => t.id === tool.id)).toMatchObject({ calibrationDue: day(200) });

    const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
    expect((await mechanic.client.get('/api/tools')).status).toBe(200);
    expect((await mechanic.client.post('/api/tools', { ...tool })).status).toBe(403);
  });
});

describe('a reading taken with a tool', () => {
  it('when the gauge was due for calibration before today, then the check is refused with the gauge and the day named, and nothing is stored', async () => {
    const engineer = await signedIn(app, ['engineering'], 'desk');
    const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
    const { airframe, limits } = await makeAirframe();
    const overdue = await registerTool(engineer, { calibrationDue: '2026-01-01' });
    const body = preFlightBody(airframe.id, limits.id, mechanic.pin);
    body.readings = withTool(body.readings, 'brake.precharge', overdue.number);
    const res = await mechanic.client.post('/api/checks', body);
    expect(res.status).toBe(400);
    expect(res.body).toMatchObject({
      code: 'tool_calibration_overdue',
      message: `Gauge ${overdue.number} was due for calibration on 1 Jan 2026; use another gauge.`,
    });
    expect(await Check.count({ where: { id: body.id } })).toBe(0);
    expect(await Reading.count({ where: { checkId: body.id } })).toBe(0);
  });

  it('when the tool is retired, unknown or of another kind, then the check is refused with the reason', async () => {
    const engineer = await signedIn(app, ['engineering'], 'desk');
    const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
    const { airframe, limits } = await makeAirframe();
    const retired = await registerTool(engineer);
    await engineer.client.post(`/api/tools/${retired.id}/retire`, {});
    const cart = await registerTool(engineer, { kind: 'servicing_cart' });
    const refusal = async (reading: string, tool: string) => {
      const body = preFlightBody(airframe.id, limits.id, mechanic.pin);
      body.readings = withTool(body.readings, reading, tool);
      const res = await mechanic.client.post('/api/checks', body);
      expect(await Check.count({ where: { id: body.id } })).toBe(0);
      return [res.status, res.body.code];
    };
    expect(await refusal('brake.precharge', retired.number)).toEqual([400, 'tool_retired']);
    expect(await refusal('brake.precharge', 'ZZ-999')).toEqual([400, 'tool_unknown']);
    expect(await refusal('brake.precharge', cart.number)).toEqual([400, 'tool_wrong_kind']);
    expect(await refusal('sys1.leaks', (await registerTool(engineer)).number)).toEqual([
      400,
      'tool_not_asked',
    ]);
  });

  it('when a checkpoint requires a tool and none is named, then the check is refused and says which tool to scan', async () => {
    const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
    const definition: AircraftTypeDefinition = structuredClone(demoTypes[0]!);
    definition.checkpoints.find((c) => c.code === 'brake.precharge')!.tool = {
      kinds: ['pressure_gauge'],
      required: true,
    };
    const { airframe, limits } = await makeAirframe({ definition });
    const res = await mechanic.client.post(
      '/api/checks',
      preFlightBody(airframe.id, limits.id, mechanic.pin),
    );
    expect(res.status).toBe(400);
    expect(res.body.code).toBe('tool_required');
    expect(res.body.message).toContain('pressure gauge from the tools register');
  });

  it('when the gauge is in calibration, then the stored and signed check name it with its calibration due date as at signing', async () => {
    const engineer = await signedIn(app, ['engineering'], 'desk');
    const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
    const { airframe, limits } = await makeAirframe();
    // Due today still counts: a tool may be used up to and including its due date (common practice, no source).
    const gauge = await registerTool(engineer, {
      calibrationDue: day(0),
      description: 'Test gauge 0-100 bar',
    });
    const cart = await registerTool(engineer, { kind: 'servicing_cart', description: 'Servicing cart' });
    const body = preFlightBody(airframe.id, limits.id, mechanic.pin, {
      servicing: [topUp({ tool: cart.number })],
    });
    body.readings = withTool(body.readings, 'brake.precharge', gauge.number);
    const res = await mechanic.client.post('/api/checks', body);
    expect(res.status).toBe(201);
    const named = {
      number: gauge.number,
      kind: 'pressure_gauge',
      description: 'Test gauge 0-100 bar',
      serial: gauge.serial,
      calibrationDue: day(0),
    };
    expect(res.body.readings.find((r: { code: string }) => r.code === 'brake.precharge').tool).toEqual(named);
    expect(res.body.readings.find((r: { code: string }) => r.code === 'sys1.level').tool).toBeNull();
    expect(res.body.servicing[0].tool).toMatchObject({ number: cart.number, kind: 'servicing_cart' });

    // A later calibration moves the register's date, not the record's.
    await engineer.client.post(`/api/tools/${gauge.id}`, { calibrationDue: day(365) });
    const record = await engineer.client.get(`/api/records/${body.id}`);
    expect(record.status).toBe(200);
    const signed = record.body.signedContent as {
      readings: { code: string; tool?: unknown }[];
      servicing: { tool: unknown }[];
    };
    expect(signed.readings.find((r) => r.code === 'brake.precharge')!.tool).toEqual(named);
    expect(signed.servicing[0]!.tool).toMatchObject({ number: cart.number });
    const again = await mechanic.client.get(`/api/checks/${body.id}`);
    expect(again.body.readings.find((r: { code: string }) => r.code === 'brake.precharge').tool).toEqual(
      named,
    );

    // The printed record names the gauge on its reading and the cart on the top-up, read back by pdftotext.
    const pdf = await engineer.client
      .get(`/api/records/checks/${body.id}.pdf`)
      .buffer(true)
      .parse((response, done) => {
        const chunks: Buffer[] = [];
        response.on('data', (c: Buffer) => chunks.push(c));
        response.on('end', () => done(null, Buffer.concat(chunks)));
      });
    expect(pdf.status).toBe(200);
    const text = execFileSync('/usr/bin/pdftotext', ['-enc', 'UTF-8', '-', '-'], {
      input: pdf.body as Buffer,
      encoding: 'utf8',
    }).replace(/\s+/g, ' ');
    expect(text).toContain(`Taken with ${gauge.number}, Test gauge 0-100 bar`);
    expect(text).toContain(`Tool: ${cart.number}, Servicing cart`);
  });
});

describe('fluid recorded once', () => {
  it('when two top-ups are sent for the same level, then the check is refused and nothing is stored', async () => {
    const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
    const { airframe, limits } = await makeAirframe();
    const body = preFlightBody(airframe.id, limits.id, mechanic.pin, {
      servicing: [topUp(), topUp({ quantity: { value: 0.4, unit: 'L' } })],
    });
    const res = await mechanic.client.post('/api/checks', body);
    expect(res.status).toBe(400);
    expect(res.body.code).toBe('servicing_twice');
    expect(res.body.message).toContain('already entered once');
    expect(await Check.count({ where: { id: body.id } })).toBe(0);
    expect(await ServicingEntry.count({ where: { checkId: body.id } })).toBe(0);
  });

  it('when an older card still has a "fluid added" reading and a top-up of the same system is sent, then the check is refused and nothing is stored', async () => {
    const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
    const { airframe, limits } = await makeAirframe({ definition: withFluidAddedCheckpoint() });
    const body = checkBody(
      'servicing',
      airframe.id,
      limits.id,
      mechanic.pin,
      [...servicingReadings(), { code: 'sys1.fluid_added', entry: { value: 1.5, unit: 'L' } }],
      { servicing: servicingTopUps(1.5, 0) },
    );
    const res = await mechanic.client.post('/api/checks', body);
    expect(res.status).toBe(400);
    expect(res.body).toMatchObject({ code: 'servicing_twice' });
    expect(res.body.message).toContain('recorded with its top-up');
    expect(await Check.count({ where: { id: body.id } })).toBe(0);
    expect(await ServicingEntry.count({ where: { checkId: body.id } })).toBe(0);
  });

  it('when the can is said to be opened after today, then the top-up is refused', async () => {
    const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
    const { airframe, limits } = await makeAirframe();
    const body = preFlightBody(airframe.id, limits.id, mechanic.pin, {
      servicing: [topUp({ canOpenedOn: day(3) })],
    });
    const res = await mechanic.client.post('/api/checks', body);
    expect(res.status).toBe(400);
    expect(res.body.code).toBe('can_opened_later');
    expect(await Check.count({ where: { id: body.id } })).toBe(0);
  });

  it('when 1.5 L was added, then the handover, the pilot view and the trends each count 1.5 L, also for an older check that stored both a top-up and a "fluid added" reading', async () => {
    const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
    const lead = await signedIn(app, ['shift_lead'], 'desk');
    const pilot = await signedIn(app, ['pilot'], 'kiosk');
    const { airframe, limits } = await makeAirframe({ definition: withFluidAddedCheckpoint() });
    // An older check, as stored before the top-up became the one record: the reading said 1.5 L and so did its entry.
    const older = checkBody('servicing', airframe.id, limits.id, mechanic.pin, [
      ...servicingReadings(),
      { code: 'sys1.fluid_added', entry: { value: 1.5, unit: 'L' } },
    ]);
    expect((await mechanic.client.post('/api/checks', older)).status).toBe(201);
    const signedAt = (await Check.findByPk(older.id))!.signedAt;
    await ServicingEntry.create({
      checkId: older.id,
      airframeId: airframe.id,
      checkpointCode: 'sys1.level',
      system: 'sys1',
      quantityL: 1.5,
      enteredValue: 1.5,
      enteredUnit: 'L',
      fluidSpec: 'MIL-PRF-83282',
      batch: 'OLD-1',
      levelBefore: JSON.stringify({ value: 5.5, unit: 'L' }),
      addedAt: signedAt,
    });

    const sys1 = async () => {
      const summary = (await lead.client.get('/api/handover')).body as HandoverSummary;
      return summary.fluidUsed.byAirframe.find((f) => f.airframe.id === airframe.id && f.system === 'sys1')
        ?.litres;
    };
    const trend = async () =>
      (await lead.client.get(`/api/trends?airframeId=${airframe.id}&days=7`)).body.systems.find(
        (s: { system: string }) => s.system === 'sys1',
      ).window.litresAdded as number;
    expect(await sys1()).toBe(1.5);
    expect(await trend()).toBe(1.5);
    const view = (await pilot.client.get(`/api/airframes/${airframe.id}/acceptance-view`))
      .body as AcceptanceView;
    expect(view.fluidAdded).toEqual([
      expect.objectContaining({ checkId: older.id, litres: 1.5, source: 'servicing' }),
    ]);

    // The new way: one top-up of 1.5 L, measured; the card's old checkpoint left at 0.
    const now = checkBody(
      'servicing',
      airframe.id,
      limits.id,
      mechanic.pin,
      [...servicingReadings(), { code: 'sys1.fluid_added', entry: { value: 0, unit: 'L' } }],
      { id: randomUUID(), servicing: servicingTopUps(1.5, 0) },
    );
    expect((await mechanic.client.post('/api/checks', now)).status).toBe(201);
    expect(await sys1()).toBe(3);
    expect(await trend()).toBe(3);
  });
});

/** The demo RX-4 as it was before the top-up became the one fluid record: a "fluid added" quantity on its card. */
function withFluidAddedCheckpoint(): AircraftTypeDefinition {
  const definition: AircraftTypeDefinition = structuredClone(demoTypes[0]!);
  definition.checkpoints.push({
    code: 'sys1.fluid_added',
    label: 'System 1: fluid added',
    instruction: 'Enter the fluid added, in litres. Enter 0 if none.',
    kind: 'quantity',
    unit: 'L',
    range: { min: 0, max: 10 },
    system: 'sys1',
    requires: [],
    ata: '12',
    reference: 'Approved maintenance data, RX-4 ch. 12-10 (demo)',
    bands: [
      {
        id: 'usual',
        lower: { value: 0, closed: true },
        upper: { value: 10, closed: true },
        verdict: 'in_limits',
        message: 'Top-up recorded.',
        action: 'None.',
      },
    ],
  });
  definition.cards.servicing = [...definition.cards.servicing!, 'sys1.fluid_added'];
  return definition;
}
