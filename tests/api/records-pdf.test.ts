import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { appForThisFile, makeAirframe } from '../setup/api-harness';
import { preFlightBody, signCheck, topUp } from '../setup/check-builder';
import { authorise, heldAirframe } from '../setup/lead-fixtures';
import { signedIn } from '../setup/sign-in';
import { inventedMark } from '../setup/registration';
import { Check } from '@server/db/models';
import { onePixelPng } from '../setup/images';

const { app } = appForThisFile();
const folder = mkdtempSync(join(tmpdir(), 'gaugewalk-pdf-'));

type Request = ReturnType<Awaited<ReturnType<typeof signedIn>>['client']['get']>;

/** The PDF answer as bytes, read back to text with Debian's pdftotext (poppler), whitespace made single. */
async function pdfText(
  request: Request,
): Promise<{ status: number; type: string; text: string; images: number }> {
  const res = await request.buffer(true).parse((response, done) => {
    const chunks: Buffer[] = [];
    response.on('data', (c: Buffer) => chunks.push(c));
    response.on('end', () => done(null, Buffer.concat(chunks)));
  });
  if (res.status !== 200)
    return { status: res.status, type: res.headers['content-type'] ?? '', text: '', images: 0 };
  const file = join(folder, `${Math.random().toString(36).slice(2)}.pdf`);
  writeFileSync(file, res.body as Buffer);
  const text = execFileSync('/usr/bin/pdftotext', ['-enc', 'UTF-8', file, '-'], { encoding: 'utf8' });
  // pdfimages lists each embedded image after a two-line header; a PNG's alpha channel is a row of type smask.
  const list = execFileSync('/usr/bin/pdfimages', ['-list', file], { encoding: 'utf8' });
  const images = list
    .trim()
    .split('\n')
    .slice(2)
    .filter((line) => line.trim().split(/\s+/)[2] === 'image').length;
  return {
    status: res.status,
    type: res.headers['content-type'] ?? '',
    text: text.replace(/\s+/g, ' '),
    images,
  };
}

describe('the printed record of a check', () => {
  it('when an auditor prints a signed check, then the PDF names the registration, each reading against its band, the batch, the signer and the hash on every page', async () => {
    const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
    const auditor = await signedIn(app, ['engineering'], 'desk');
    const { airframe, limits } = await makeAirframe();
    const mark = inventedMark();
    await airframe.update({ registration: mark });
    const body = preFlightBody(airframe.id, limits.id, mechanic.pin, {
      servicing: [topUp({ batch: 'LOT 26-431', levelBefore: { value: 6.2, unit: 'L' } })],
      note: 'Glass wiped before reading',
    });
    expect((await mechanic.client.post('/api/checks', body)).status).toBe(201);
    const check = (await Check.findByPk(body.id))!;

    const { status, type, text } = await pdfText(auditor.client.get(`/api/records/checks/${body.id}.pdf`));
    expect(status).toBe(200);
    expect(type).toMatch(/^application\/pdf/);
    // The mark was recorded before signing, so it is printed as signed.
    expect(text).toContain(`Registration mark: ${mark} Fleet number`);
    expect(text).toContain(airframe.fleetNumber);
    expect(text).toContain(airframe.serial);
    expect(text).toContain('1234.5 flight hours');
    // Each reading in words against the band of the limits version it was judged by (demo RX-4, invented).
    expect(text).toContain('System 1 reservoir level: 7.00 L, in limits');
    expect(text).toContain('Brake accumulator pre-charge: 45.0 bar, in limits');
    expect(text).toMatch(/Limit: at or above 5\.5 L and/);
    expect(text).toContain('Batch LOT 26-431');
    expect(text).toContain('MIL-PRF-83282');
    expect(text).toContain(`Signed by ${mechanic.staff.name}`);
    expect(text).toContain(mechanic.staff.licenceNumber!);
    expect(text).toContain(check.contentHash);
    expect(text).toMatch(/Signed \d{1,2} [A-Z][a-z]{2} \d{4}, \d{2}:\d{2} UTC/);
    expect(text).toContain('Page 1 of');
    expect(text).toContain('Tern Island Air Ambulance');
    // People read words: no checkpoint codes, snake_case names or raw ISO instants.
    expect(text).not.toMatch(/sys1\.level|pre_flight|in_limits|\d{4}-\d{2}-\d{2}T\d{2}/);
  });

  it('when a mechanic or a pilot asks for the printed record, then it is refused', async () => {
    const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
    const { airframe, limits } = await makeAirframe();
    const check = await signCheck(mechanic, airframe.id, limits.id);
    expect((await mechanic.client.get(`/api/records/checks/${check.id}.pdf`)).status).toBe(403);
    const auditor = await signedIn(app, ['engineering'], 'desk');
    const missing = await auditor.client.get('/api/records/checks/not-a-check.pdf');
    expect(missing.status).toBe(400);
  });
});

const png = onePixelPng;

describe('photos on the printed record', () => {
  it('when a reading carries a photo, then the PDF embeds it as a thumbnail beside its checkpoint and fingerprint', async () => {
    const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
    const auditor = await signedIn(app, ['engineering'], 'desk');
    const up = await mechanic.client.agent
      .post('/api/photos')
      .set('X-CSRF-Token', mechanic.client.csrf)
      .attach('photo', png, { filename: 'leak.png', contentType: 'image/png' });
    expect(up.status).toBe(201);
    const { airframe, limits } = await makeAirframe();
    const body = preFlightBody(airframe.id, limits.id, mechanic.pin);
    body.readings[5] = { ...body.readings[5]!, photoIds: [up.body.id as string] };
    expect((await mechanic.client.post('/api/checks', body)).status).toBe(201);
    const without = await signCheck(mechanic, airframe.id, limits.id);

    const withPhoto = await pdfText(auditor.client.get(`/api/records/checks/${body.id}.pdf`));
    expect(withPhoto.text).toContain(`System 1 leaks. Photo fingerprint (SHA-256) ${up.body.sha256}`);
    // The QR code and the photo.
    expect(withPhoto.images).toBe(2);
    const plain = await pdfText(auditor.client.get(`/api/records/checks/${without.id}.pdf`));
    expect(plain.images).toBe(1);
    expect(plain.text).not.toContain('Photo fingerprint');
  });
});

describe('the printed record of a hold', () => {
  it('when a hold was corrected, re-checked and released, then its PDF holds the finding, the corrective action and the countersign with its signature', async () => {
    const held = await heldAirframe(app);
    const mark = inventedMark();
    await held.airframe.update({ registration: mark });
    const lead = await signedIn(app, ['shift_lead'], 'desk');
    await authorise(lead.staff.id, held.type.code);
    const action = 'Replaced the return line seal and topped up System 1 to the normal mark';
    expect(
      (
        await held.mechanic.client.post(`/api/holds/${held.holdId}/corrective-action`, {
          text: action,
          pin: held.mechanic.pin,
        })
      ).status,
    ).toBe(201);
    await signCheck(held.mechanic, held.airframe.id, held.limits.id);
    const released = await lead.client.post(`/api/holds/${held.holdId}/countersign`, {
      decision: 'release',
      password: lead.password,
    });
    expect(released.status).toBe(200);
    const countersignHash = released.body.countersigns[0].contentHash as string;

    const { status, text } = await pdfText(lead.client.get(`/api/holds/${held.holdId}.pdf`));
    expect(status).toBe(200);
    expect(text).toContain(`Hold ${held.holdId} record`);
    expect(text).toContain(mark);
    expect(text).toContain('System 1 reservoir level: 2.90 L, out of limits');
    expect(text).toContain(action);
    expect(text).toContain('Released: certificate of release to service');
    expect(text).toContain(`Signed by ${lead.staff.name}`);
    expect(text).toContain(countersignHash);
    expect(text).toMatch(/authorisation B1 \(AUTH-\d+\)/);
    expect(text).toContain('Passing re-check');
    expect(text).toContain('Page 1 of');
    expect(text).not.toMatch(/sys1\.level|out_of_limits|pre_flight/);
  });
});
