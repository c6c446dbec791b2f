import { describe, expect, it } from 'vitest';
import { appForThisFile } from '../setup/api-harness';
import { preFlightBody, signCheck, topUp } from '../setup/check-builder';
import { authorise, heldAirframe } from '../setup/lead-fixtures';
import { inventedMark } from '../setup/registration';
import { pythonCsv } from '../setup/python-csv';
import { signedIn } from '../setup/sign-in';
import { recordExportNames, type ExportCell, type RecordExport } from '@shared/schemas/records';

const { app } = appForThisFile();

/** What a cell must read as in the file: the API's value, with an apostrophe before a would-be formula. */
const asWritten = (cell: ExportCell) => {
  if (cell === null) return '';
  if (typeof cell === 'number') return String(cell);
  return /^[=+\-@\t\r]/.test(cell) ? `'${cell}` : cell;
};

const formula = '=HYPERLINK("http://evil.example/x","Click to see the readings")';
const atFormula = '@SUM(1+1)*cmd|" /C calc"!A0';

/** One airframe with every kind of row: a check with fluid added, a hold, its corrective action and release. */
async function auditedAirframe() {
  const held = await heldAirframe(app);
  const mark = inventedMark();
  await held.airframe.update({ registration: mark });
  const body = preFlightBody(held.airframe.id, held.limits.id, held.mechanic.pin, {
    servicing: [topUp({ batch: 'LOT 26-431' })],
    note: formula,
  });
  expect((await held.mechanic.client.post('/api/checks', body)).status).toBe(201);
  expect(
    (
      await held.mechanic.client.post(`/api/holds/${held.holdId}/corrective-action`, {
        text: atFormula,
        pin: held.mechanic.pin,
      })
    ).status,
  ).toBe(201);
  await signCheck(held.mechanic, held.airframe.id, held.limits.id);
  const lead = await signedIn(app, ['shift_lead'], 'desk');
  await authorise(lead.staff.id, held.type.code);
  const released = await lead.client.post(`/api/holds/${held.holdId}/countersign`, {
    decision: 'release',
    password: lead.password,
  });
  expect(released.status).toBe(200);
  return { ...held, mark, lead };
}

describe('record exports', () => {
  it('when each export is read back with Python csv, then every cell is what the API gives, formulas made inert, and every row names the registration', async () => {
    const { airframe, mark, lead } = await auditedAirframe();
    const expected = { checks: 3, readings: 24, fluid: 1, holds: 1, releases: 1 };
    for (const name of recordExportNames) {
      const json = (await lead.client.get(`/api/records/exports/${name}?airframeId=${airframe.id}`))
        .body as RecordExport;
      const csv = await lead.client.get(`/api/records/exports/${name}.csv?airframeId=${airframe.id}`);
      expect(csv.status).toBe(200);
      expect(csv.headers['content-type']).toMatch(/^text\/csv/);
      const [header, ...rows] = pythonCsv(csv.text);
      expect(header).toEqual(json.headers);
      expect(rows).toEqual(json.rows.map((r) => r.map(asWritten)));
      expect(rows, name).toHaveLength(expected[name]);
      const markColumn = header!.indexOf('Registration mark');
      expect(
        rows.every((r) => r[markColumn] === mark),
        name,
      ).toBe(true);
      // Headers are words for people, not field names.
      expect(
        header!.every((h) => /^[A-Z][a-z]+( [a-z]+)*$/.test(h)),
        name,
      ).toBe(true);
    }
  });

  it('when free text a spreadsheet would run reaches an export, then it comes back as inert text with a leading apostrophe', async () => {
    const { airframe, lead } = await auditedAirframe();
    const checks = pythonCsv((await lead.client.get(`/api/records.csv?airframeId=${airframe.id}`)).text);
    const note = checks[0]!.indexOf('Note');
    expect(checks.map((r) => r[note])).toContain(`'${formula}`);
    const holds = pythonCsv(
      (await lead.client.get(`/api/records/exports/holds.csv?airframeId=${airframe.id}`)).text,
    );
    const action = holds[1]![holds[0]!.indexOf('Corrective action')]!;
    expect(action.startsWith(`'${atFormula}`)).toBe(true);
    // Numbers stay numbers: litres and hours are written as plain numbers a spreadsheet can sum.
    const fluid = pythonCsv(
      (await lead.client.get(`/api/records/exports/fluid.csv?airframeId=${airframe.id}`)).text,
    );
    expect(fluid[1]![fluid[0]!.indexOf('Litres')]).toBe('0.5');
    expect(fluid[1]![fluid[0]!.indexOf('Batch')]).toBe('LOT 26-431');
  });

  it('when an export name is unknown, then 400 with the names it takes', async () => {
    const lead = await signedIn(app, ['shift_lead'], 'desk');
    const res = await lead.client.get('/api/records/exports/everything.csv');
    expect(res.status).toBe(400);
    expect(res.body.message).toMatch(/checks, readings, fluid, holds, releases/);
  });
});
