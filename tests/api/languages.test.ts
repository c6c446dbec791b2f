import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildApp, database, makeAirframe } from '../setup/api-harness';
import { preFlightBody, topUp } from '../setup/check-builder';
import { eventually, heldAirframe } from '../setup/lead-fixtures';
import { pythonCsv } from '../setup/python-csv';
import { signedIn } from '../setup/sign-in';
import { findFreePort } from '@server/db/local-server';
import { startFakeSmtp, type FakeSmtp } from '@server/mail/fake-smtp';
import type { CaughtMailItem } from '@shared/schemas/mail';

// The server writes what people read in their language: a printed record and an export's headers in the reader's
// (?lang=, then Accept-Language), e-mail to maintenance control in the operator's (OPERATOR_LANGUAGE). What was
// signed stays as signed, and English output stays as it was.

let smtp: FakeSmtp;
let german: ReturnType<typeof buildApp>;
const folder = mkdtempSync(join(tmpdir(), 'gaugewalk-languages-'));

beforeAll(async () => {
  smtp = await startFakeSmtp({ port: await findFreePort(0), sequelize: database() });
  german = buildApp({
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(smtp.port),
    MAINTENANCE_CONTROL_EMAILS: 'leitstelle@test.example',
    OPERATOR_LANGUAGE: 'de',
  });
});
afterAll(async () => {
  german.close();
  await smtp.stop();
  await database().close();
});

type Request = ReturnType<Awaited<ReturnType<typeof signedIn>>['client']['get']>;

/** A PDF answer read back to text with poppler's pdftotext, whitespace made single. */
async function pdfText(request: Request): Promise<string> {
  const res = await request.buffer(true).parse((response, done) => {
    const chunks: Buffer[] = [];
    response.on('data', (c: Buffer) => chunks.push(c));
    response.on('end', () => done(null, Buffer.concat(chunks)));
  });
  expect(res.status).toBe(200);
  const file = join(folder, `${Math.random().toString(36).slice(2)}.pdf`);
  writeFileSync(file, res.body as Buffer);
  return execFileSync('/usr/bin/pdftotext', ['-enc', 'UTF-8', file, '-'], { encoding: 'utf8' }).replace(
    /\s+/g,
    ' ',
  );
}

async function signedCheck() {
  const { app } = german;
  const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
  const auditor = await signedIn(app, ['engineering'], 'desk');
  const { airframe, limits } = await makeAirframe();
  const body = preFlightBody(airframe.id, limits.id, mechanic.pin, {
    servicing: [topUp({ batch: 'LOT 26-431', levelBefore: { value: 6.2, unit: 'L' } })],
  });
  expect((await mechanic.client.post('/api/checks', body)).status).toBe(201);
  return { mechanic, auditor, airframe, body };
}

describe('a printed record in German', () => {
  it('when an auditor asks for ?lang=de, then pdftotext reads German labels with their umlauts, and the signed words as signed', async () => {
    const { mechanic, auditor, airframe, body } = await signedCheck();
    const text = await pdfText(auditor.client.get(`/api/records/checks/${body.id}.pdf?lang=de`));
    expect(text).toContain('Prüfnachweis Vorflug');
    expect(text).toContain(`Flottennummer: ${airframe.fleetNumber}`);
    expect(text).toContain('Seriennummer');
    expect(text).toContain('1.234,5 Flugstunden');
    expect(text).toContain('Ablesungen gegen Grenzwerte Version');
    // The checkpoint's own label is the type's data; the value and the verdict read in German.
    expect(text).toContain('System 1 reservoir level: 7,00 L, In Grenzwerten');
    expect(text).toMatch(/Grenzwert: mindestens 5,5 L und/);
    expect(text).toContain('Füllstand vor dem Nachfüllen');
    expect(text).toContain('Charge LOT 26-431');
    expect(text).toContain(`Unterschrieben von ${mechanic.staff.name}`);
    expect(text).toMatch(/Unterschrieben \d{1,2}\. [A-ZÄÖÜ][a-zäöü]{2,4}\.? \d{4}, \d{2}:\d{2} UTC/);
    expect(text).toContain('Seite 1 von');
    expect(text).not.toContain('Registration mark');
    expect(text).not.toContain('Page 1 of');
  }, 120_000);

  it('when the browser prefers German and the link says ?lang=en, then the link wins and the record is in English', async () => {
    const { auditor, body } = await signedCheck();
    const text = await pdfText(
      auditor.client
        .get(`/api/records/checks/${body.id}.pdf?lang=en`)
        .set('Accept-Language', 'de-DE,de;q=0.9'),
    );
    expect(text).toContain('Pre-flight check record');
    expect(text).toContain('Page 1 of');
    const german = await pdfText(
      auditor.client.get(`/api/records/checks/${body.id}.pdf`).set('Accept-Language', 'de-AT,en;q=0.5'),
    );
    expect(german).toContain('Seite 1 von');
  }, 120_000);
});

describe('an export in German', () => {
  it('when a German browser downloads the checks CSV, then Python reads German headers over the cells as recorded', async () => {
    const { auditor, airframe } = await signedCheck();
    const csv = await auditor.client
      .get(`/api/records/exports/checks.csv?airframeId=${airframe.id}`)
      .set('Accept-Language', 'de-DE,de;q=0.9,en;q=0.5');
    expect(csv.status).toBe(200);
    const [header, ...rows] = pythonCsv(csv.text);
    expect(header).toEqual([
      'Unterschrieben',
      'Kennzeichen',
      'Flottennummer',
      'Muster',
      'Seriennummer',
      'Prüfung',
      'Ergebnis',
      'Stunden',
      'Flüge',
      'Grenzwert-Version',
      'Unterschrieben von',
      'Ausweis',
      'Lizenz',
      'Notiz',
      'Signatur-Prüfsumme',
    ]);
    // Values stay as recorded: the same cells as the English export.
    const english = pythonCsv(
      (await auditor.client.get(`/api/records/exports/checks.csv?airframeId=${airframe.id}&lang=en`)).text,
    );
    expect(english[0]![0]).toBe('Signed');
    expect(rows).toEqual(english.slice(1));
    expect(rows[0]).toContain('Pre-flight');
  }, 120_000);
});

describe('e-mail in the operator language', () => {
  it('when OPERATOR_LANGUAGE is de and a check opens a hold, then maintenance control gets the hold e-mail in German', async () => {
    const held = await heldAirframe(german.app);
    const engineer = await signedIn(german.app, ['engineering'], 'desk');
    const mail = await eventually(async () => {
      const res = await engineer.client.get('/api/mail/outbox');
      return (res.body as CaughtMailItem[]).find((m) => m.subject.includes(held.airframe.fleetNumber));
    });
    expect(mail.subject).toBe(`GESPERRT ${held.airframe.fleetNumber}: System 1 reservoir level`);
    expect(mail.text).toContain(`Luftfahrzeug ${held.airframe.fleetNumber}`);
    expect(mail.text).toContain('ist GESPERRT seit');
    expect(mail.text).toContain('Außerhalb der Grenzwerte:');
    expect(mail.text).toContain('System 1 reservoir level: 2,90 L (Grenzwert: mindestens 0 L und unter 3 L)');
    expect(mail.text).toContain('Prüfung „Vorflug“ unterschrieben');
    expect(mail.text).toContain('Freigabebescheinigung (CRS)');
    expect(mail.text).not.toContain('ON HOLD');
  }, 120_000);
});

describe('refusals in the language of the screen that asked', () => {
  it('when a German screen is refused, then the message is German; without a language it stays English', async () => {
    const { app } = german;
    const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
    const inGerman = await mechanic.client.get('/api/audit/verify').set('Accept-Language', 'de-DE,de;q=0.9');
    expect(inGerman.status).toBe(403);
    expect(inGerman.body).toMatchObject({
      code: 'forbidden',
      message: 'Dafür braucht es die Rolle Technik.',
    });
    const inEnglish = await mechanic.client.get('/api/audit/verify');
    expect(inEnglish.body.message).toBe('This needs the Engineering role.');

    const broken = await mechanic.client.agent
      .post('/api/checks')
      .set('X-CSRF-Token', mechanic.client.csrf)
      .set('Content-Type', 'application/json')
      .set('Accept-Language', 'de')
      .send('{"id": ');
    expect(broken.status).toBe(400);
    expect(broken.body).toMatchObject({
      code: 'entity_parse_failed',
      message: 'Der Inhalt der Anfrage ist kein gültiges JSON.',
    });
  });

  it('when a German kiosk signs a reading its gauge cannot show, then the refusal names the checkpoint and reads in German', async () => {
    const { app } = german;
    const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
    const { airframe, limits } = await makeAirframe();
    const body = preFlightBody(airframe.id, limits.id, mechanic.pin);
    body.readings[0] = { code: 'sys1.level', entry: { value: 80, unit: 'L' } };
    const res = await mechanic.client.agent
      .post('/api/checks')
      .set('X-CSRF-Token', mechanic.client.csrf)
      .set('Accept-Language', 'de')
      .send(body);
    expect(res.status).toBe(400);
    expect(res.body.code).toBe('out_of_range');
    expect(res.body.message).toMatch(
      /^System 1 reservoir level: 80,00 L liegt außerhalb dessen, was diese Anzeige zeigen kann/,
    );
  });
});
