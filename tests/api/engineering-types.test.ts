import { describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { appForThisFile, Client, makeAirframe, makeStaff } from '../setup/api-harness';
import { preFlightBody } from '../setup/check-builder';
import { signedIn } from '../setup/sign-in';
import { AuditEvent } from '@server/db/models';
import { demoTypes } from '@shared/demo/demo-types';
import type { AircraftTypeDefinition } from '@shared/schemas/limits';
import { starterCard } from '@shared/domain/starter-card';
import type { LimitsDiff, TypeDetail } from '@shared/schemas/engineering-types';

const { app } = appForThisFile();

const deskAs = async (roles: ('engineering' | 'shift_lead')[]) => (await signedIn(app, roles, 'desk')).client;

const rx4 = () => structuredClone(demoTypes[0]!) as AircraftTypeDefinition;
const newCode = () => `EN-${randomUUID().slice(0, 6).toUpperCase()}`;

/** RX-4 with the system 1 minimum mark moved, its bands moved with it. */
function withSys1Minimum(definition: AircraftTypeDefinition, minimum: number): AircraftTypeDefinition {
  const level = definition.checkpoints.find((c) => c.code === 'sys1.level')!;
  level.marks!.minimum = minimum;
  for (const band of level.bands) {
    if (band.id === 'below_minimum') band.upper = { value: minimum, closed: false };
    if (band.id === 'in_limits_wheels' || band.id === 'in_limits_jacks')
      band.lower = { value: minimum, closed: true };
  }
  return definition;
}

describe('types and limits versions', () => {
  it('when engineering creates a type and publishes its draft, then version 1 is published and an audit event records it', async () => {
    const eng = await deskAs(['engineering']);
    const code = newCode();
    const created = await eng.post('/api/types', { code, name: 'Test twin', definition: rx4() });
    expect(created.status).toBe(201);
    const published = await eng.post(`/api/types/${created.body.id}/draft/publish`);
    expect(published.status).toBe(200);
    expect(published.body).toMatchObject({ version: 1, status: 'published' });
    const detail = (await eng.get(`/api/types/${created.body.id}`)).body as TypeDetail;
    expect(detail.current?.version).toBe(1);
    expect(detail.draft).toBeNull();
    const event = await AuditEvent.findOne({
      where: { action: 'limits.published', entityId: String(published.body.id) },
    });
    expect(event).not.toBeNull();
    expect(JSON.parse(event!.payload)).toMatchObject({ type: code, version: 1 });
  });

  it('when engineering creates a type without a definition, then its draft is the starter card under its own code and name', async () => {
    const eng = await deskAs(['engineering']);
    const code = newCode();
    const created = await eng.post('/api/types', { code, name: 'Started type' });
    expect(created.status).toBe(201);
    expect(Object.keys(created.body).sort()).toEqual(['draftVersionId', 'id']);
    const draft = await eng.get(`/api/types/${created.body.id}/versions/${created.body.draftVersionId}`);
    expect(draft.body.definition).toEqual(starterCard(code, 'Started type'));
    const demoReferences = new Set(demoTypes.flatMap((t) => t.checkpoints.map((c) => c.reference)));
    for (const checkpoint of draft.body.definition.checkpoints as AircraftTypeDefinition['checkpoints'])
      expect(demoReferences.has(checkpoint.reference)).toBe(false);
  });

  it('when someone edits a published version, then it is refused with 409 and the version is unchanged', async () => {
    const eng = await deskAs(['engineering']);
    const { type, limits } = await makeAirframe();
    const before = (await eng.get(`/api/types/${type.id}/versions/${limits.id}`)).body;
    const res = await eng.post(`/api/types/${type.id}/versions/${limits.id}`, {
      definition: withSys1Minimum(rx4(), 5.0),
    });
    expect(res.status).toBe(409);
    expect(res.body.code).toBe('limits_version_published');
    const after = (await eng.get(`/api/types/${type.id}/versions/${limits.id}`)).body;
    expect(after.definition).toEqual(before.definition);
  });

  it('when a draft has overlapping bands, then publishing is refused with 400 naming the bands and the draft stays a draft', async () => {
    const eng = await deskAs(['engineering']);
    const { type } = await makeAirframe();
    const definition = rx4();
    const level = definition.checkpoints.find((c) => c.code === 'sys1.level')!;
    level.bands.find((b) => b.id === 'below_minimum')!.upper = { value: 5.5, closed: true };
    expect((await eng.post(`/api/types/${type.id}/draft`, { definition })).status).toBe(200);
    const res = await eng.post(`/api/types/${type.id}/draft/publish`);
    expect(res.status).toBe(400);
    expect(res.body.code).toBe('limits_problems');
    expect(res.body.message).toMatch(
      /sys1\.level: Bands 'below_minimum', 'in_limits_wheels' overlap from 5\.500 L to 5\.500 L/,
    );
    expect(res.body.problems).toContainEqual(
      expect.objectContaining({
        checkpoint: 'sys1.level',
        kind: 'overlap',
        bands: ['below_minimum', 'in_limits_wheels'],
      }),
    );
    const detail = (await eng.get(`/api/types/${type.id}`)).body as TypeDetail;
    expect(detail.current?.version).toBe(1);
    expect(detail.draft?.version).toBe(2);
  });

  it('when a draft leaves a gap, then publishing is refused naming the uncovered span', async () => {
    const eng = await deskAs(['engineering']);
    const { type } = await makeAirframe();
    const definition = rx4();
    const level = definition.checkpoints.find((c) => c.code === 'sys1.level')!;
    level.bands.find((b) => b.id === 'below_minimum')!.upper = { value: 5.0, closed: false };
    await eng.post(`/api/types/${type.id}/draft`, { definition });
    const res = await eng.post(`/api/types/${type.id}/draft/publish`);
    expect(res.status).toBe(400);
    expect(res.body.message).toMatch(/sys1\.level: No band covers 5\.000 L to 5\.500 L/);
  });

  it('when a new version is published, then a new check is judged by it while the old check keeps the old version', async () => {
    const eng = await deskAs(['engineering']);
    const { airframe, type, limits } = await makeAirframe();
    const mechanic = await makeStaff(['mechanic']);
    const kiosk = await Client.kiosk(app);
    await kiosk.signInKiosk(mechanic.badge, mechanic.pin);
    // 5.7 L is within the old limits (minimum 5.5 L) and below the new minimum of 6.0 L.
    const low = (id: number) =>
      preFlightBody(airframe.id, id, mechanic.pin, {
        readings: preFlightBody(airframe.id, id, mechanic.pin).readings.map((r) =>
          r.code === 'sys1.level' ? { ...r, entry: { value: 5.7, unit: 'L' } } : r,
        ),
      });
    const oldCheck = await kiosk.post('/api/checks', low(limits.id));
    expect(oldCheck.status).toBe(201);
    expect(oldCheck.body.verdict).toBe('in_limits');

    expect(
      (await eng.post(`/api/types/${type.id}/draft`, { definition: withSys1Minimum(rx4(), 6.0) })).status,
    ).toBe(200);
    const published = await eng.post(`/api/types/${type.id}/draft/publish`);
    expect(published.body.version).toBe(2);

    const stale = await kiosk.post('/api/checks', low(limits.id));
    expect(stale.status).toBe(409);
    const newCheck = await kiosk.post('/api/checks', low(published.body.id));
    expect(newCheck.status).toBe(201);
    expect(newCheck.body.limitsVersion).toMatchObject({ id: published.body.id, version: 2 });
    expect(newCheck.body.readings.find((r: { code: string }) => r.code === 'sys1.level').verdict).toBe(
      'service',
    );

    const again = await eng.get(`/api/records/${oldCheck.body.id}`);
    expect(again.body.limitsVersion).toMatchObject({ id: limits.id, version: 1 });
    expect(again.body.readings.find((r: { code: string }) => r.code === 'sys1.level').verdict).toBe(
      'in_limits',
    );
  });

  it('when two versions are compared, then the diff names the changed checkpoint, its marks and bands, and an added checkpoint', async () => {
    const eng = await deskAs(['engineering']);
    const { type, limits } = await makeAirframe();
    const next = withSys1Minimum(rx4(), 6.0);
    next.checkpoints.push({
      ...structuredClone(next.checkpoints.find((c) => c.code === 'sys1.leaks')!),
      code: 'sys1.extra',
      label: 'Extra look',
    });
    const saved = await eng.post(`/api/types/${type.id}/draft`, { definition: next });
    const diff = (await eng.get(`/api/types/${type.id}/diff?from=${limits.id}&to=${saved.body.id}`))
      .body as LimitsDiff;
    const sys1 = diff.checkpoints.find((c) => c.code === 'sys1.level')!;
    expect(sys1.change).toBe('changed');
    expect(sys1.fields.map((f) => f.field)).toEqual(['marks']);
    expect(sys1.bands.map((b) => [b.id, b.change])).toEqual([
      ['below_minimum', 'changed'],
      ['in_limits_wheels', 'changed'],
      ['in_limits_jacks', 'changed'],
    ]);
    expect(diff.checkpoints.find((c) => c.code === 'sys1.extra')?.change).toBe('added');
    expect(diff.checkpoints.filter((c) => c.change === 'removed')).toEqual([]);
  });

  it('when a shift lead or no one asks for types, then 403 and 401', async () => {
    const lead = await deskAs(['shift_lead']);
    expect((await lead.get('/api/types')).status).toBe(403);
    expect((await new Client(app).get('/api/types')).status).toBe(401);
  });
});
