import { describe, expect, it } from 'vitest';
import { appForThisFile, Client, database, makeAirframe, makeStaff } from '../setup/api-harness';
import { afterFlightBody, preFlightBody, topUp } from '../setup/check-builder';
import { signedIn } from '../setup/sign-in';
import type { RecordExport, RecordPage, Trends } from '@shared/schemas/records';
import { inWords } from '@shared/i18n/phrase';

const { app } = appForThisFile();

const desk = async (roles: ('engineering' | 'shift_lead')[]) => (await signedIn(app, roles, 'desk')).client;

async function mechanicAtKiosk() {
  const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
  return { kiosk: mechanic.client, ...mechanic };
}

/** RFC 4180 by hand, so the test does not trust the library that wrote the file to read it back. */
function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let field = '';
  let quoted = false;
  for (let i = 0; i < text.length; i += 1) {
    const ch = text[i]!;
    if (quoted) {
      if (ch === '"' && text[i + 1] === '"') {
        field += '"';
        i += 1;
      } else if (ch === '"') quoted = false;
      else field += ch;
    } else if (ch === '"') quoted = true;
    else if (ch === ',') {
      row.push(field);
      field = '';
    } else if (ch === '\n') {
      row.push(field);
      rows.push(row);
      row = [];
      field = '';
    } else if (ch !== '\r') field += ch;
  }
  if (field !== '' || row.length) rows.push([...row, field]);
  return rows;
}

describe('records search and export', () => {
  it('when checks are searched by airframe, kind and verdict, then only matching checks come back, newest first, paginated', async () => {
    const eng = await desk(['engineering']);
    const { kiosk, pin, staff } = await mechanicAtKiosk();
    const { airframe, limits } = await makeAirframe();
    const ids: string[] = [];
    for (const value of [7.0, 5.0, 7.0]) {
      const body = preFlightBody(airframe.id, limits.id, pin, {
        readings: preFlightBody(airframe.id, limits.id, pin).readings.map((r) =>
          r.code === 'sys1.level' ? { ...r, entry: { value, unit: 'L' } } : r,
        ),
      });
      expect((await kiosk.post('/api/checks', body)).status).toBe(201);
      ids.push(body.id);
    }
    const all = (await eng.get(`/api/records?airframeId=${airframe.id}&pageSize=2`)).body as RecordPage;
    expect(all.total).toBe(3);
    expect(all.rows.map((r) => r.id)).toEqual([ids[2], ids[1]]);
    const page2 = (await eng.get(`/api/records?airframeId=${airframe.id}&pageSize=2&page=2`))
      .body as RecordPage;
    expect(page2.rows.map((r) => r.id)).toEqual([ids[0]]);
    const service = (await eng.get(`/api/records?airframeId=${airframe.id}&verdict=service&kind=pre_flight`))
      .body as RecordPage;
    expect(service.rows.map((r) => r.id)).toEqual([ids[1]]);
    expect(service.rows[0]).toMatchObject({
      fleetNumber: airframe.fleetNumber,
      signedBy: staff.name,
      licenceNumber: staff.licenceNumber,
      limitsVersionId: limits.id,
      limitsVersion: 1,
      airframeHours: 1234.5,
    });
    const today = new Date().toISOString().slice(0, 10);
    const byDay = (
      await eng.get(`/api/records?airframeId=${airframe.id}&from=${today}&to=${today}&staffId=${staff.id}`)
    ).body;
    expect(byDay.total).toBe(3);
    const yesterday = new Date(Date.now() - 86_400_000).toISOString().slice(0, 10);
    expect((await eng.get(`/api/records?airframeId=${airframe.id}&to=${yesterday}`)).body.total).toBe(0);
    const bad = await eng.get(`/api/records?from=${today}&to=${yesterday}`);
    expect(bad.status).toBe(400);
    expect(bad.body.message).toMatch(/start date is after the end date/);
  });

  it('when a search is exported, then the CSV parses back to the same rows the JSON search returns', async () => {
    const lead = await desk(['shift_lead']);
    const { kiosk, pin } = await mechanicAtKiosk();
    const { airframe, limits } = await makeAirframe();
    for (let i = 0; i < 3; i += 1) {
      const note = i === 1 ? 'Wiped glass, "smeared", re-read' : undefined;
      const body = preFlightBody(airframe.id, limits.id, pin, note ? { note } : {});
      expect((await kiosk.post('/api/checks', body)).status).toBe(201);
    }
    const json = (await lead.get(`/api/records?airframeId=${airframe.id}&pageSize=200`)).body as RecordPage;
    const res = await lead.get(`/api/records.csv?airframeId=${airframe.id}`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    const [header, ...rows] = parseCsv(res.text);
    const table = (await lead.get(`/api/records/exports/checks?airframeId=${airframe.id}`))
      .body as RecordExport;
    expect(header).toEqual(table.headers);
    expect(rows).toEqual(table.rows.map((r) => r.map((c) => (c === null ? '' : String(c)))));
    expect(rows).toHaveLength(3);
    // Oldest first in the export, newest first in the search: the same three signed checks.
    const hashes = rows.map((r) => r[header!.indexOf('Signature hash')]);
    expect(hashes).toEqual(json.rows.map((r) => r.contentHash).reverse());
    expect(rows[1]![header!.indexOf('Note')]).toBe('Wiped glass, "smeared", re-read');
  });

  it('when a full record is asked for, then it holds what an auditor needs, fluid added included', async () => {
    const eng = await desk(['engineering']);
    const { kiosk, pin, staff } = await mechanicAtKiosk();
    const { airframe, limits } = await makeAirframe();
    const body = preFlightBody(airframe.id, limits.id, pin, {
      servicing: [topUp({ batch: 'B-7', levelBefore: { value: 6.5, unit: 'L' } })],
    });
    expect((await kiosk.post('/api/checks', body)).status).toBe(201);
    const rec = (await eng.get(`/api/records/${body.id}`)).body;
    expect(rec).toMatchObject({
      id: body.id,
      airframe: { fleetNumber: airframe.fleetNumber },
      limitsVersion: { id: limits.id, version: 1 },
      airframeHours: 1234.5,
      signedBy: { name: staff.name, licenceNumber: staff.licenceNumber, badgeNumber: staff.badgeNumber },
      integrity: { ok: true, problem: null },
      servicing: [{ code: 'sys1.level', quantityL: 0.5, fluidSpec: 'MIL-PRF-83282', batch: 'B-7' }],
      countersigns: [],
    });
    expect(rec.contentHash).toMatch(/^[0-9a-f]{64}$/);
    expect(rec.auditEvent.hash).toMatch(/^[0-9a-f]{64}$/);
    const level = rec.readings.find((r: { code: string }) => r.code === 'sys1.level');
    expect(level).toMatchObject({ ata: '12', reference: expect.any(String), verdict: 'in_limits' });
  });

  it('when a pilot asks for records, then 403; with no session, 401', async () => {
    const pilot = await makeStaff(['pilot']);
    const kiosk = await Client.kiosk(app);
    await kiosk.signInKiosk(pilot.badge, pilot.pin);
    expect((await kiosk.get('/api/records')).status).toBe(403);
    expect((await new Client(app).get('/api/records.csv')).status).toBe(401);
  });
});

describe('trends', () => {
  it('when fluid goes in faster than the type threshold per flight hour, then the rate and an alert naming the check are reported', async () => {
    const lead = await desk(['shift_lead']);
    const { kiosk, pin } = await mechanicAtKiosk();
    const { airframe, limits } = await makeAirframe();
    const first = preFlightBody(airframe.id, limits.id, pin);
    expect((await kiosk.post('/api/checks', first)).status).toBe(201);
    // Two hours flown, recorded at the after-flight, then 1 L into system 1: 0.5 L per flight hour against the
    // RX-4 demo threshold of 0.08.
    // The flight used the litre: system 1 reads 6.0 L after it, and the top-up brings it back to 7.0 L.
    const usage = { hours: 1236.5, flights: 1, landings: 1 };
    const flown = afterFlightBody(airframe.id, limits.id, pin, usage, {}, 6.0);
    expect((await kiosk.post('/api/checks', flown)).status).toBe(201);
    const second = preFlightBody(airframe.id, limits.id, pin, {
      servicing: [
        topUp({ quantity: { value: 1, unit: 'L' }, batch: 'B-8', levelBefore: { value: 6.0, unit: 'L' } }),
      ],
    });
    expect((await kiosk.post('/api/checks', second)).status).toBe(201);
    const trends = (await lead.get(`/api/trends?airframeId=${airframe.id}&days=30`)).body as Trends;
    expect(trends.thresholdLPerFh).toBe(0.08);
    const sys1 = trends.systems.find((s) => s.system === 'sys1')!;
    expect(sys1.levels.map((l) => l.levelL)).toEqual([7, 6, 7]);
    expect(sys1.ratePerFh).toEqual([{ at: expect.any(String), checkId: second.id, litresPerFh: 0.5 }]);
    expect(sys1.window).toMatchObject({ litresAdded: 1, flightHours: 2, litresPerFlightHour: 0.5 });
    expect(inWords(sys1.alerts)).toEqual([
      {
        kind: 'rate_at_or_above_threshold',
        message: expect.stringMatching(/0\.500 L per flight hour/),
        checkIds: [second.id],
      },
    ]);
    const sys2 = trends.systems.find((s) => s.system === 'sys2')!;
    expect(sys2.alerts).toEqual([]);
  });
});

describe('verify the trail', () => {
  it('when nothing was touched, then the trail verifies; when a reading is changed in SQL, then the API names that check', async () => {
    const eng = await desk(['engineering']);
    const { kiosk, pin } = await mechanicAtKiosk();
    const { airframe, limits } = await makeAirframe();
    const body = preFlightBody(airframe.id, limits.id, pin);
    expect((await kiosk.post('/api/checks', body)).status).toBe(201);
    const clean = await eng.get('/api/audit/verify');
    expect(clean.body).toMatchObject({ ok: true, firstBroken: null });
    expect(clean.body.events).toBeGreaterThan(0);

    const tamper = (value: number) =>
      database().query(
        `UPDATE readings SET value = ${value}, entry = '{"unit":"L","value":${value}}' WHERE check_id = ? AND checkpoint_code = 'sys2.level'`,
        { replacements: [body.id] },
      );
    await tamper(6.2);
    try {
      const broken = await eng.get('/api/audit/verify');
      expect(broken.body.ok).toBe(false);
      expect(broken.body.firstBroken).toMatchObject({
        entity: 'check',
        entityId: body.id,
        action: 'check.signed',
      });
      expect(broken.body.firstBroken.reason).toMatch(/reading "sys2.level" was changed/);
      expect((await eng.get(`/api/records/${body.id}`)).body.integrity.ok).toBe(false);
    } finally {
      // Put it back so later files see an intact trail.
      await tamper(4.5);
    }
    expect((await eng.get('/api/audit/verify')).body.ok).toBe(true);
    const lead = await desk(['shift_lead']);
    expect((await lead.get('/api/audit/verify')).status).toBe(403);
  });
});
