import { afterAll, describe, expect, it } from 'vitest';
import { Client, buildApp, database, makeAirframe, makeStaff, preFlightBody } from '../setup/api-harness';
import { checkRecordProblem, verifyRecords } from '../../server/audit/record-integrity';

const { app, close } = buildApp();
afterAll(async () => {
  close();
  await database().close();
});

async function signCheck() {
  const { badge, pin } = await makeStaff(['mechanic']);
  const client = await Client.kiosk(app);
  await client.signInKiosk(badge, pin);
  const { airframe, limits } = await makeAirframe();
  const body = preFlightBody(airframe.id, limits.id, pin);
  expect((await client.post('/api/checks', body)).status).toBe(201);
  return body.id;
}

describe('tamper evidence', () => {
  it('when nothing was touched, then every signed check matches its signature and the trail verifies', async () => {
    const id = await signCheck();
    expect(await checkRecordProblem(id)).toBeNull();
    expect((await verifyRecords(database())).ok).toBe(true);
  });

  // Runs last in this file: it breaks the shared test database's trail on purpose.
  it('when a stored reading is changed in SQL behind the application, then verification names that check', async () => {
    const id = await signCheck();
    await database().query(
      'UPDATE readings SET value = 9.9, entry = \'{"unit":"L","value":9.9}\' WHERE check_id = ? AND checkpoint_code = \'sys1.level\'',
      {
        replacements: [id],
      },
    );
    expect(await checkRecordProblem(id)).toMatch(/reading "sys1.level" was changed/);
    const result = await verifyRecords(database());
    expect(result.ok).toBe(false);
    expect(result.firstBroken).toMatchObject({ entity: 'check', entityId: id, action: 'check.signed' });
    // Put it back so later files see an intact trail.
    await database().query(
      'UPDATE readings SET value = 7, entry = \'{"unit":"L","value":7}\' WHERE check_id = ? AND checkpoint_code = \'sys1.level\'',
      {
        replacements: [id],
      },
    );
    expect((await verifyRecords(database())).ok).toBe(true);
  });
});
