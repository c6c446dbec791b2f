import { describe, expect, it } from 'vitest';
import { appForThisFile, makeAirframe } from '../setup/api-harness';
import { preFlightBody, signCheck } from '../setup/check-builder';
import { signedIn } from '../setup/sign-in';
import { pythonCsv } from '../setup/python-csv';
import { Airframe, Check } from '@server/db/models';
import { checkRecordProblem } from '@server/audit/record-integrity';
import { onePixelPng } from '../setup/images';

const { app } = appForThisFile();

const png = onePixelPng;

describe('JSON numbers are numbers', () => {
  it('when an airframe is sent with true, [1], "1" or null for a number, then each is a 400 naming the field and nothing is stored', async () => {
    const engineer = await signedIn(app, ['engineering'], 'desk');
    const { type } = await makeAirframe();
    const good = { fleetNumber: 'X-STRICT', serial: 'S-STRICT-1', typeId: type.id, baseId: 1, hours: 10 };
    const wrong: [string, unknown][] = [
      ['typeId', true],
      ['baseId', [1]],
      ['hours', null],
      ['typeId', String(type.id)],
      ['hours', '12.5'],
    ];
    for (const [field, value] of wrong) {
      const res = await engineer.client.post('/api/fleet/airframes', { ...good, [field]: value });
      expect(res.status, `${field}=${JSON.stringify(value)}`).toBe(400);
      expect(res.body.issues[0].path).toBe(field);
    }
    expect(await Airframe.count({ where: { fleetNumber: 'X-STRICT' } })).toBe(0);
  });
});

describe('dates in a query are real days', () => {
  it.each(['2026-13-45', '0000-00-00', '2026-02-30', '2026-1-5'])(
    'when records are searched from %s, then it is a 400, not an empty or unfiltered list',
    async (day) => {
      const lead = await signedIn(app, ['shift_lead'], 'desk');
      const res = await lead.client.get(`/api/records?from=${day}`);
      expect(res.status).toBe(400);
      expect(res.body.issues[0].path).toBe('from');
    },
  );

  // zod's ISO date-time already knows the days of each month; this holds that in place.
  it('when the handover window names a day that does not exist, then it is a 400', async () => {
    const lead = await signedIn(app, ['shift_lead'], 'desk');
    const res = await lead.client.get('/api/handover?from=2026-02-30T06:00:00Z&to=2026-03-01T06:00:00Z');
    expect(res.status).toBe(400);
  });

  it('when records are searched over real days, then it answers 200', async () => {
    const lead = await signedIn(app, ['shift_lead'], 'desk');
    expect((await lead.client.get('/api/records?from=2024-02-29&to=2026-12-31')).status).toBe(200);
  });
});

describe('free text', () => {
  it.each([
    ['a control character', 'Level ok\u0007'],
    ['a carriage return', 'Line one\r\nline two'],
    ['a bidi override', 'Leak \u202Enone\u202C found'],
    ['a bidi isolate', 'Seal \u2066ok\u2069'],
    ['a lone surrogate', 'Half \uD83D a smile'],
  ])(
    'when a note holds %s, then the check is a 400 naming the note and nothing is stored',
    async (_what, note) => {
      const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
      const { airframe, limits } = await makeAirframe();
      const body = preFlightBody(airframe.id, limits.id, mechanic.pin, { note });
      const res = await mechanic.client.post('/api/checks', body);
      expect(res.status).toBe(400);
      expect(res.body.message).toMatch(/^The note holds/);
      expect(await Check.count({ where: { id: body.id } })).toBe(0);
    },
  );

  it('when a note is typed with decomposed accents, tabs and line breaks, then it is stored in NFC and they stay', async () => {
    const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
    const { airframe, limits } = await makeAirframe();
    const note = ' Te\u0301 fluide\tok\nre\u0301servoir 1 ';
    const body = preFlightBody(airframe.id, limits.id, mechanic.pin, { note });
    const res = await mechanic.client.post('/api/checks', body);
    expect(res.status).toBe(201);
    expect(res.body.note).toBe('T\u00e9 fluide\tok\nr\u00e9servoir 1');
    expect((await Check.findByPk(body.id))!.note).toBe('T\u00e9 fluide\tok\nr\u00e9servoir 1');
  });

  it('when a person, a corrective action or a screen name holds a bidi override, then it is refused naming the field', async () => {
    const engineer = await signedIn(app, ['engineering'], 'desk');
    const person = await engineer.client.post('/api/staff', {
      badgeNumber: 'BIDI-1',
      name: 'Ann \u202Eeb\u202C',
      licenceNumber: null,
      roles: ['mechanic'],
    });
    expect(person.status).toBe(400);
    expect(person.body.issues[0].path).toBe('name');
    const board = await engineer.client.post('/api/board-links', { name: 'Crew \u2067room' });
    expect(board.status).toBe(400);
    expect(board.body.issues[0].path).toBe('name');
  });

  it('when a signed note is changed in SQL behind the application, then the integrity check names the note', async () => {
    const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
    const { airframe, limits } = await makeAirframe();
    const check = await signCheck(mechanic, airframe.id, limits.id, { note: 'Sight glass clean.' });
    expect(await checkRecordProblem(check.id)).toBeNull();
    await Check.update({ note: 'Sight glass clean. Leak seen.' }, { where: { id: check.id } });
    expect(await checkRecordProblem(check.id)).toMatch(/its note was changed after signing/);
    await Check.update({ airframeHours: 99 }, { where: { id: check.id } });
    await Check.update({ note: 'Sight glass clean.' }, { where: { id: check.id } });
    expect(await checkRecordProblem(check.id)).toMatch(/its airframe hours was changed after signing/);
    await Check.update({ airframeHours: 1234.5 }, { where: { id: check.id } });
    expect(await checkRecordProblem(check.id)).toBeNull();
  });
});

describe('CSV export', () => {
  it('when a licence number starts with a formula character, then its cell is neutralised with an apostrophe', async () => {
    const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
    const formula = '=HYPERLINK(A1)';
    await mechanic.staff.update({ licenceNumber: formula });
    const { airframe, limits } = await makeAirframe();
    await signCheck(mechanic, airframe.id, limits.id);
    const lead = await signedIn(app, ['shift_lead'], 'desk');
    const res = await lead.client.get(`/api/records.csv?airframeId=${airframe.id}`);
    expect(res.status).toBe(200);
    // OWASP "CSV Injection": cells starting with = + - @ tab or carriage return are prefixed.
    const [header, row] = pythonCsv(res.text);
    expect(row![header!.indexOf('Licence')]).toBe(`'${formula}`);
    expect(row![header!.indexOf('Hours')]).toBe('1234.5');
  });
});

describe('what a pilot reads', () => {
  it('when a pilot asks for a check of an airframe in service, then it is answered; of one out of service, then 403', async () => {
    const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
    const pilot = await signedIn(app, ['pilot'], 'kiosk');
    const { airframe, limits } = await makeAirframe();
    const check = await signCheck(mechanic, airframe.id, limits.id);
    expect((await pilot.client.get(`/api/checks/${check.id}`)).status).toBe(200);
    await Airframe.update({ active: false }, { where: { id: airframe.id } });
    const refused = await pilot.client.get(`/api/checks/${check.id}`);
    expect(refused.status).toBe(403);
    expect(refused.body.code).toBe('pilot_out_of_scope');
    expect((await mechanic.client.get(`/api/checks/${check.id}`)).status).toBe(200);
  });

  it('when a pilot asks for a photo not part of a signed check, then 403, while its mechanic reads it', async () => {
    const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
    const pilot = await signedIn(app, ['pilot'], 'kiosk');
    const upload = await mechanic.client.agent
      .post('/api/photos')
      .set('X-CSRF-Token', mechanic.client.csrf)
      .attach('photo', png, { filename: 'p.png', contentType: 'image/png' });
    expect(upload.status).toBe(201);
    expect((await mechanic.client.get(`/api/photos/${upload.body.id}`)).status).toBe(200);
    expect((await pilot.client.get(`/api/photos/${upload.body.id}`)).status).toBe(403);
  });
});
