import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { appForThisFile, makeAirframe } from '../setup/api-harness';
import { authorise, heldAirframe } from '../setup/lead-fixtures';
import { signCheck } from '../setup/check-builder';
import { signedIn } from '../setup/sign-in';
import { Acceptance, AirframeRelease, AuditEvent, HoldCountersign } from '@server/db/models';
import type { AirframeReleaseView } from '@shared/schemas/releases';
import type { AcceptanceRecord } from '@shared/schemas/acceptance';
import type { HoldDetail } from '@shared/schemas/holds';

// A signed act sent again with the id its screen gave it (the answer was lost on the way back, or a double tap)
// is answered as the first and stored once: two certificates of release for one piece of work would be a false
// record (EASA Part-145 145.A.50, from memory).

const { app } = appForThisFile();

async function releasable() {
  const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
  const { airframe, limits, type } = await makeAirframe();
  await signCheck(mechanic, airframe.id, limits.id);
  const lead = await signedIn(app, ['shift_lead'], 'desk');
  await authorise(lead.staff.id, type.code);
  return { airframe, type, lead };
}

describe('a signed act sent twice with the same signing id', () => {
  it('when a release is sent again after its answer was lost, then the same certificate answers and only one is stored', async () => {
    const { airframe, lead } = await releasable();
    const body = { password: lead.password, requestId: randomUUID() };
    const first = await lead.client.post(`/api/airframes/${airframe.id}/release`, body);
    expect(first.status).toBe(201);
    const again = await lead.client.post(`/api/airframes/${airframe.id}/release`, body);
    expect(again.status).toBe(201);
    expect((again.body as AirframeReleaseView).id).toBe((first.body as AirframeReleaseView).id);
    expect(again.body).toEqual(first.body);
    expect(await AirframeRelease.count({ where: { airframeId: airframe.id } })).toBe(1);
    expect(
      await AuditEvent.count({ where: { action: 'airframe.released', entityId: String(first.body.id) } }),
    ).toBe(1);

    // A new act (a new id) is a new certificate, as before.
    const next = await lead.client.post(`/api/airframes/${airframe.id}/release`, {
      password: lead.password,
      requestId: randomUUID(),
    });
    expect(next.status).toBe(201);
    expect(await AirframeRelease.count({ where: { airframeId: airframe.id } })).toBe(2);
  });

  it('when two copies of one release arrive together (a double tap), then both get the one certificate', async () => {
    const { airframe, lead } = await releasable();
    const body = { password: lead.password, requestId: randomUUID() };
    const [a, b] = await Promise.all([
      lead.client.post(`/api/airframes/${airframe.id}/release`, body),
      lead.client.post(`/api/airframes/${airframe.id}/release`, body),
    ]);
    expect([a.status, b.status]).toEqual([201, 201]);
    expect(a.body.id).toBe(b.body.id);
    expect(await AirframeRelease.count({ where: { airframeId: airframe.id } })).toBe(1);
  });

  it('when the resend carries a wrong password or comes from someone else, then it is refused and answers nothing of the record', async () => {
    const { airframe, type, lead } = await releasable();
    const requestId = randomUUID();
    await lead.client.post(`/api/airframes/${airframe.id}/release`, { password: lead.password, requestId });
    const wrong = await lead.client.post(`/api/airframes/${airframe.id}/release`, {
      password: 'not-the-password',
      requestId,
    });
    expect(wrong.status).toBe(401);
    expect(wrong.body.id).toBeUndefined();
    const other = await signedIn(app, ['shift_lead'], 'desk');
    await authorise(other.staff.id, type.code);
    const stolen = await other.client.post(`/api/airframes/${airframe.id}/release`, {
      password: other.password,
      requestId,
    });
    expect(stolen.status).toBe(409);
    expect(stolen.body.code).toBe('signing_id_reused');
    expect(stolen.body.id).toBeUndefined();
    expect(await AirframeRelease.count({ where: { airframeId: airframe.id } })).toBe(1);
  });

  it('when a countersign is sent again, then the hold answers as it stands with one countersign; a changed decision under the same id is refused', async () => {
    const held = await heldAirframe(app);
    const lead = await signedIn(app, ['shift_lead'], 'kiosk');
    const body = {
      decision: 'keep',
      reason: 'Waiting for the dye test.',
      pin: lead.pin,
      requestId: randomUUID(),
    };
    const first = await lead.client.post(`/api/holds/${held.holdId}/countersign`, body);
    expect(first.status).toBe(200);
    const again = await lead.client.post(`/api/holds/${held.holdId}/countersign`, body);
    expect(again.status).toBe(200);
    expect((again.body as HoldDetail).countersigns).toHaveLength(1);
    expect(await HoldCountersign.count({ where: { holdId: held.holdId } })).toBe(1);

    const changed = await lead.client.post(`/api/holds/${held.holdId}/countersign`, {
      ...body,
      decision: 'release',
      reason: undefined,
    });
    expect(changed.status).toBe(409);
    expect(changed.body.code).toBe('signing_id_reused');
    expect(await HoldCountersign.count({ where: { holdId: held.holdId } })).toBe(1);
  });

  it("when a pilot's acceptance is sent again, then the same acceptance answers and only one is stored", async () => {
    const mechanic = await signedIn(app, ['mechanic'], 'kiosk');
    const { airframe, limits } = await makeAirframe();
    await signCheck(mechanic, airframe.id, limits.id);
    const pilot = await signedIn(app, ['pilot'], 'kiosk');
    const body = { pin: pilot.pin, requestId: randomUUID() };
    const first = await pilot.client.post(`/api/airframes/${airframe.id}/accept`, body);
    expect(first.status).toBe(201);
    const again = await pilot.client.post(`/api/airframes/${airframe.id}/accept`, body);
    expect(again.status).toBe(201);
    expect(again.body as AcceptanceRecord).toEqual(first.body);
    expect(await Acceptance.count({ where: { airframeId: airframe.id } })).toBe(1);
    // Without an id, each acceptance is its own act, as before.
    expect((await pilot.client.post(`/api/airframes/${airframe.id}/accept`, { pin: pilot.pin })).status).toBe(
      201,
    );
    expect(await Acceptance.count({ where: { airframeId: airframe.id } })).toBe(2);
  });

  it('when the signing id is not a UUID, then it is refused with words', async () => {
    const { airframe, lead } = await releasable();
    const res = await lead.client.post(`/api/airframes/${airframe.id}/release`, {
      password: lead.password,
      requestId: 'one-two',
    });
    expect(res.status).toBe(400);
    expect(res.body.message).toMatch(/not the id of a signing/);
  });
});
