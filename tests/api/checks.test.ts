import { describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { appForThisFile, Client, database, makeAirframe, makeStaff } from '../setup/api-harness';
import { preFlightBody } from '../setup/check-builder';
import { signedIn } from '../setup/sign-in';
import { Check, Hold, LimitsVersion, Reading, Tag } from '@server/db/models';
import { verifyAuditTrail } from '@server/audit/audit-trail';
import type { AirframeSummary } from '@shared/schemas/airframes';

const { app } = appForThisFile();

const signedInMechanic = () => signedIn(app, ['mechanic'], 'kiosk');

describe('tags and check cards', () => {
  it('when a tag is scanned, then its random token opens the airframe; unknown and revoked tags say so', async () => {
    const { client } = await signedInMechanic();
    const { airframe, tag } = await makeAirframe();
    expect(tag.token).not.toContain(airframe.fleetNumber);
    const ok = await client.get(`/api/tags/${tag.token}`);
    expect(ok.status).toBe(200);
    expect(ok.body).toEqual({ airframeId: airframe.id, fleetNumber: airframe.fleetNumber });
    expect((await client.get('/api/tags/notARealTag123')).body.code).toBe('tag_unknown');
    await Tag.update({ revokedAt: new Date() }, { where: { id: tag.id } });
    const revoked = await client.get(`/api/tags/${tag.token}`);
    expect(revoked.status).toBe(410);
    expect(revoked.body.message).toMatch(/no longer works/);
  });

  it('when the pre-flight card is asked for, then it lists the type checkpoints in order with the limits version', async () => {
    const { client } = await signedInMechanic();
    const { airframe, limits } = await makeAirframe();
    const res = await client.get(`/api/airframes/${airframe.id}/cards/pre_flight`);
    expect(res.status).toBe(200);
    expect(res.body.limitsVersion.id).toBe(limits.id);
    expect(res.body.checkpoints.map((c: { code: string }) => c.code)).toEqual([
      'sys1.level',
      'sys2.level',
      'brake.precharge',
      'sys1.filter_bypass',
      'sys2.filter_bypass',
      'sys1.leaks',
      'sys2.leaks',
      'brakes.leaks',
    ]);
    expect(res.body.requires).toEqual(expect.arrayContaining(['attitude', 'systemPressure', 'ambientTempC']));
    expect((await client.get(`/api/airframes/${airframe.id}/cards/sideways`)).status).toBe(400);
  });
});

describe('submitting a signed check', () => {
  it('when a pre-flight in limits is signed, then the check and its readings are stored with the limits version and a content hash', async () => {
    const { client, staff, pin } = await signedInMechanic();
    const { airframe, limits } = await makeAirframe();
    const body = preFlightBody(airframe.id, limits.id, pin);
    const res = await client.post('/api/checks', body);
    expect(res.status).toBe(201);
    // The answer to a write goes uncompressed, though the client accepts gzip (server/app.ts, compressAnswers).
    const sent = (res as unknown as { req: { getHeader: (name: string) => unknown } }).req;
    expect(String(sent.getHeader('accept-encoding'))).toContain('gzip');
    expect(res.headers['content-encoding']).toBeUndefined();
    expect(res.body).toMatchObject({
      id: body.id,
      verdict: 'in_limits',
      kind: 'pre_flight',
      limitsVersion: { id: limits.id, version: 1 },
      signedBy: { id: staff.id, name: staff.name, licenceNumber: staff.licenceNumber },
      holdOpened: false,
      airframeHours: 1234.5,
    });
    expect(res.body.contentHash).toMatch(/^[0-9a-f]{64}$/);
    expect(res.body.readings).toHaveLength(8);
    const precharge = res.body.readings.find((r: { code: string }) => r.code === 'brake.precharge');
    expect(precharge.expected).toBeCloseTo(45, 9);
    expect(await Reading.count({ where: { checkId: body.id } })).toBe(8);

    const summary: AirframeSummary = (await client.get(`/api/airframes/${airframe.id}`)).body;
    expect(summary.state).toBe('checks_in_limits');
    expect(summary.lastCheck).toMatchObject({ id: body.id, kind: 'pre_flight', signedBy: staff.name });
  });

  it('when the same check is sent twice, then it is stored once and both answers are the same', async () => {
    const { client, pin } = await signedInMechanic();
    const { airframe, limits } = await makeAirframe();
    const body = preFlightBody(airframe.id, limits.id, pin);
    const first = await client.post('/api/checks', body);
    const second = await client.post('/api/checks', body);
    expect(first.status).toBe(201);
    expect(second.status).toBe(201);
    expect(second.headers['idempotent-replay']).toBe('true');
    expect(second.body).toEqual(first.body);
    expect(await Check.count({ where: { id: body.id } })).toBe(1);
    expect(await Reading.count({ where: { checkId: body.id } })).toBe(8);
  });

  it('when the same check is sent twice at once, then it is still stored once', async () => {
    const { client, pin } = await signedInMechanic();
    const { airframe, limits } = await makeAirframe();
    const body = preFlightBody(airframe.id, limits.id, pin);
    const [a, b] = await Promise.all([client.post('/api/checks', body), client.post('/api/checks', body)]);
    expect([a.status, b.status]).toEqual([201, 201]);
    expect(a.body.id).toBe(b.body.id);
    expect(await Check.count({ where: { id: body.id } })).toBe(1);
  });

  it('when a used check id comes with different readings, then it is refused with 409 and the first record stands', async () => {
    const { client, pin } = await signedInMechanic();
    const { airframe, limits } = await makeAirframe();
    const body = preFlightBody(airframe.id, limits.id, pin);
    await client.post('/api/checks', body);
    const changed = {
      ...body,
      readings: body.readings.map((r) =>
        r.code === 'sys1.level' ? { ...r, entry: { value: 6.0, unit: 'L' } } : r,
      ),
    };
    const res = await client.post('/api/checks', changed);
    expect(res.status).toBe(409);
    const stored = await Reading.findOne({ where: { checkId: body.id, checkpointCode: 'sys1.level' } });
    expect(stored!.value).toBe(7);
  });

  it('when a reading is for a checkpoint the card does not ask for, then the person reads what to do, never the code, and nothing is stored', async () => {
    const { client, pin } = await signedInMechanic();
    const { airframe, limits } = await makeAirframe();
    const body = preFlightBody(airframe.id, limits.id, pin);
    body.readings = [...body.readings, { code: 'sys3.level', entry: { value: 5, unit: 'L' } }];
    const res = await client.post('/api/checks', body);
    expect(res.status).toBe(400);
    expect(res.body.code).toBe('unknown_checkpoint');
    expect(res.body.message).toBe(
      'The Pre-flight card no longer asks for one of the readings on this tablet. Start the check again from the airframe.',
    );
    // The code is there for the program that sent it.
    expect(res.body).toMatchObject({ path: 'readings.8', checkpoint: 'sys3.level' });
    const german = await client.agent
      .post('/api/checks')
      .set('X-CSRF-Token', client.csrf)
      .set('Accept-Language', 'de')
      .send(body);
    expect(german.status).toBe(400);
    expect(german.body.message).not.toContain('sys3');
    expect(german.body.message).toBe(
      'Die Prüfkarte „Vorflug“ fragt einen der Messwerte auf diesem Tablet nicht mehr ab. Beginnen Sie die Prüfung beim Luftfahrzeug neu.',
    );
    expect(await Check.count({ where: { id: body.id } })).toBe(0);
  });

  it('when the PIN at signing is wrong, then the check is refused and nothing is stored', async () => {
    const { client } = await signedInMechanic();
    const { airframe, limits } = await makeAirframe();
    const body = preFlightBody(airframe.id, limits.id, '9999');
    const res = await client.post('/api/checks', body);
    expect(res.status).toBe(401);
    expect(res.body.code).toBe('wrong_pin');
    expect(await Check.count({ where: { id: body.id } })).toBe(0);
  });

  it('when a level is below the isolation mark, then the check is out of limits and the airframe goes on hold', async () => {
    const { client, pin } = await signedInMechanic();
    const { airframe, limits } = await makeAirframe();
    const body = preFlightBody(airframe.id, limits.id, pin);
    body.readings = body.readings.map((r) =>
      r.code === 'sys1.level' ? { ...r, entry: { value: 2.9, unit: 'L' } } : r,
    );
    const res = await client.post('/api/checks', body);
    expect(res.status).toBe(201);
    expect(res.body.verdict).toBe('out_of_limits');
    expect(res.body.holdOpened).toBe(true);
    const hold = await Hold.findOne({ where: { checkId: body.id } });
    expect(hold!.releasedAt).toBeNull();
    const summary: AirframeSummary = (await client.get(`/api/airframes/${airframe.id}`)).body;
    expect(summary.state).toBe('unserviceable');
    expect(summary.causes).toEqual(['on_hold']);
    expect(summary.formerState).toBe('hold');
    expect(summary.openHolds[0]!.reason).toMatch(/System 1/);
    const board: AirframeSummary[] = (await client.get('/api/airframes')).body;
    const firstNotHeld = board.findIndex((a) => a.state !== 'unserviceable');
    const ours = board.findIndex((a) => a.id === airframe.id);
    expect(firstNotHeld === -1 || ours < firstNotHeld).toBe(true);
  });

  it('when values are given in other units, then they are judged in the canonical unit at full precision', async () => {
    const { client, pin } = await signedInMechanic();
    const { airframe, limits } = await makeAirframe();
    const body = preFlightBody(airframe.id, limits.id, pin);
    // 7.0 L is about 7.397 US quarts; 45 bar is 652.67 psi (NIST SP 811, B.9 factors).
    body.readings = body.readings.map((r) =>
      r.code === 'sys1.level'
        ? { ...r, entry: { value: 7.0 / 0.946352946, unit: 'US_qt' } }
        : r.code === 'brake.precharge'
          ? { ...r, entry: { value: 45e5 / 6894.757293168361, unit: 'psi' } }
          : r,
    );
    const res = await client.post('/api/checks', body);
    expect(res.status).toBe(201);
    expect(res.body.verdict).toBe('in_limits');
  });

  it.each([
    [
      'a negative level',
      (b: ReturnType<typeof preFlightBody>) => {
        b.readings[0] = { code: 'sys1.level', entry: { value: -1, unit: 'L' } };
      },
      /negative|below/i,
    ],
    [
      'a missing reading',
      (b: ReturnType<typeof preFlightBody>) => {
        b.readings = b.readings.slice(1);
      },
      /missing/i,
    ],
    [
      'an unknown checkpoint',
      (b: ReturnType<typeof preFlightBody>) => {
        b.readings.push({ code: 'rotor.spin', entry: { answer: true } });
      },
      /no longer asks for one of the readings/,
    ],
    [
      'a level given as a pressure',
      (b: ReturnType<typeof preFlightBody>) => {
        b.readings[0] = { code: 'sys1.level', entry: { value: 7, unit: 'bar' } };
      },
      /unit|bar/i,
    ],
    [
      'no attitude',
      (b: ReturnType<typeof preFlightBody>) => {
        b.context = { systemPressure: 'relieved', ambientTempC: 20 } as typeof b.context;
      },
      /attitude|wheels|jacks/i,
    ],
    [
      'a pre-charge read with pressure on',
      (b: ReturnType<typeof preFlightBody>) => {
        b.context = { ...b.context, systemPressure: 'on' } as unknown as typeof b.context;
      },
      /relieved|pressure/i,
    ],
    [
      'a value beyond the gauge',
      (b: ReturnType<typeof preFlightBody>) => {
        b.readings[2] = { code: 'brake.precharge', entry: { value: 5000, unit: 'bar' } };
      },
      /range|gauge/i,
    ],
    [
      'a check id that is not a UUID',
      (b: ReturnType<typeof preFlightBody>) => {
        (b as { id: string }).id = 'check-1';
      },
      /UUID/,
    ],
  ])(
    'when a check has %s, then it is refused with a 400 and a message, and nothing is stored',
    async (_name, change, message) => {
      const { client, pin } = await signedInMechanic();
      const { airframe, limits } = await makeAirframe();
      const body = preFlightBody(airframe.id, limits.id, pin);
      change(body);
      const res = await client.post('/api/checks', body);
      expect(res.status).toBe(400);
      expect(res.body.message).toMatch(message);
      expect(await Check.count({ where: { airframeId: airframe.id } })).toBe(0);
    },
  );

  it('when the limits were published again while the check was open, then signing is refused with 409', async () => {
    const { client, pin } = await signedInMechanic();
    const { airframe, limits, type } = await makeAirframe();
    await LimitsVersion.create({
      typeId: type.id,
      version: 2,
      status: 'published',
      definition: limits.definition,
      publishedAt: new Date(),
      publishedBy: null,
    });
    const res = await client.post('/api/checks', preFlightBody(airframe.id, limits.id, pin));
    expect(res.status).toBe(409);
    expect(res.body.code).toBe('limits_changed');
  });

  it('when a pilot tries to sign a check, then it is refused with 403; without a session 401', async () => {
    const pilot = await makeStaff(['pilot']);
    const client = await Client.kiosk(app);
    await client.signInKiosk(pilot.badge, pilot.pin);
    const { airframe, limits } = await makeAirframe();
    expect((await client.post('/api/checks', preFlightBody(airframe.id, limits.id, pilot.pin))).status).toBe(
      403,
    );
    const anonymous = await Client.kiosk(app);
    expect((await anonymous.post('/api/checks', preFlightBody(airframe.id, limits.id, '1234'))).status).toBe(
      401,
    );
  });

  it('when checks are signed, then each is in the audit trail and the trail verifies', async () => {
    const { client, pin } = await signedInMechanic();
    const { airframe, limits } = await makeAirframe();
    const body = preFlightBody(airframe.id, limits.id, pin);
    await client.post('/api/checks', body);
    const { AuditEvent } = await import('@server/db/models');
    const event = await AuditEvent.findOne({ where: { entity: 'check', entityId: body.id } });
    expect(event!.action).toBe('check.signed');
    const result = await verifyAuditTrail(database());
    expect(result.ok).toBe(true);
    expect(result.events).toBeGreaterThan(0);
  });

  it('when a stored check is fetched by id, then it is the same record the signing returned', async () => {
    const { client, pin } = await signedInMechanic();
    const { airframe, limits } = await makeAirframe();
    const body = preFlightBody(airframe.id, limits.id, pin);
    const signed = await client.post('/api/checks', body);
    const fetched = await client.get(`/api/checks/${body.id}`);
    expect(fetched.body).toEqual(signed.body);
    expect((await client.get(`/api/checks/${randomUUID()}`)).status).toBe(404);
  });
});

describe('temporary PINs', () => {
  it('when a mechanic still has a temporary PIN, then signing a check is refused until they choose their own', async () => {
    const { client, pin, staff } = await signedInMechanic();
    await staff.update({ mustChangePin: true });
    const { airframe, limits } = await makeAirframe();
    const body = preFlightBody(airframe.id, limits.id, pin);
    const res = await client.post('/api/checks', body);
    expect(res.status).toBe(403);
    expect(res.body.code).toBe('pin_change_required');
    expect(await Check.count({ where: { id: body.id } })).toBe(0);
    await staff.update({ mustChangePin: false });
    expect((await client.post('/api/checks', body)).status).toBe(201);
  });
});
