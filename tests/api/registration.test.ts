import { describe, expect, it } from 'vitest';
import { appForThisFile, makeAirframe } from '../setup/api-harness';
import { inventedMark } from '../setup/registration';
import { signedIn } from '../setup/sign-in';
import { AuditEvent, Airframe } from '@server/db/models';
import type { AirframeSummary } from '@shared/schemas/airframes';
import type { FleetAirframe, TagSheetEntry } from '@shared/schemas/fleet';

const { app } = appForThisFile();

const inputOf = (a: Airframe, changes: Record<string, unknown>) => ({
  fleetNumber: a.fleetNumber,
  serial: a.serial,
  typeId: a.typeId,
  baseId: a.baseId,
  hours: Number(a.hours),
  ...changes,
});

describe('registration marks', () => {
  it('when engineering gives an airframe a mark, then it is kept in capitals, audited, and shown on the fleet, the tag sheet and the board', async () => {
    const { client } = await signedIn(app, ['engineering'], 'desk');
    const { airframe } = await makeAirframe();
    const mark = inventedMark();
    const res = await client.post(
      `/api/fleet/airframes/${airframe.id}`,
      inputOf(airframe, { registration: mark.toLowerCase() }),
    );
    expect(res.status).toBe(200);
    expect(res.body.changed).toEqual(['registration']);
    const event = await AuditEvent.findOne({
      where: { action: 'airframe.changed', entityId: String(airframe.id) },
    });
    expect(JSON.parse(event!.payload)).toEqual({ registration: { from: null, to: mark } });
    const fleet = (await client.get('/api/fleet/airframes')).body as FleetAirframe[];
    expect(fleet.find((a) => a.id === airframe.id)!.registration).toBe(mark);
    const sheet = (await client.get(`/api/fleet/tag-sheet?ids=${airframe.id}`)).body as TagSheetEntry[];
    expect(sheet[0]!.registration).toBe(mark);
    const board = (await client.get(`/api/airframes/${airframe.id}`)).body as AirframeSummary;
    expect(board.registration).toBe(mark);
  });

  it('when a mark is already on another airframe in service, then it is refused with a plain 409 naming that airframe, and nothing changes', async () => {
    const { client } = await signedIn(app, ['engineering'], 'desk');
    const first = await makeAirframe();
    const second = await makeAirframe();
    const mark = inventedMark();
    await first.airframe.update({ registration: mark });
    const res = await client.post(
      `/api/fleet/airframes/${second.airframe.id}`,
      inputOf(second.airframe, { registration: mark }),
    );
    expect(res.status).toBe(409);
    expect(res.body.code).toBe('registration_taken');
    expect(res.body.message).toBe(
      `Registration mark ${mark} is already on ${first.airframe.fleetNumber}. Each airframe in service has its own mark.`,
    );
    expect((await Airframe.findByPk(second.airframe.id))!.registration).toBeNull();
    // The database refuses it too, whoever writes.
    await expect(second.airframe.update({ registration: mark })).rejects.toThrow();
  });

  it('when the airframe that carried a mark is out of service, then another airframe may take the mark', async () => {
    const { client } = await signedIn(app, ['engineering'], 'desk');
    const retired = await makeAirframe();
    const next = await makeAirframe();
    const mark = inventedMark();
    await retired.airframe.update({ registration: mark, active: false });
    const res = await client.post(
      `/api/fleet/airframes/${next.airframe.id}`,
      inputOf(next.airframe, { registration: mark }),
    );
    expect(res.status).toBe(200);
  });

  it('when a mark is not letters and digits with one dash, then 400 with an example', async () => {
    const { client } = await signedIn(app, ['engineering'], 'desk');
    const { airframe } = await makeAirframe();
    const res = await client.post(
      `/api/fleet/airframes/${airframe.id}`,
      inputOf(airframe, { registration: 'Q X--1' }),
    );
    expect(res.status).toBe(400);
    expect(res.body.issues[0].message).toMatch(/e\.g\. QX-TNA/);
  });
});
