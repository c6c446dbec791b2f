import { describe, expect, it } from 'vitest';
import { appForThisFile, Client, database, makeAirframe, makeStaff } from '../setup/api-harness';
import { preFlightBody } from '../setup/check-builder';
import { checkRecordProblem, verifyRecords } from '@server/audit/record-integrity';

const { app } = appForThisFile();

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

  it("when a check's verdict and its signature hash are replaced in SQL, then the record check and the trail each name their reason", async () => {
    const id = await signCheck();
    const [[before]] = (await database().query('SELECT verdict, content_hash FROM checks WHERE id = ?', {
      replacements: [id],
    })) as [{ verdict: string; content_hash: string }[], unknown];
    await database().query("UPDATE checks SET verdict = 'out_of_limits' WHERE id = ?", {
      replacements: [id],
    });
    expect(await checkRecordProblem(id)).toBe(`check ${id}: its verdict was changed after signing`);
    expect((await verifyRecords(database())).firstBroken).toMatchObject({
      entityId: id,
      reason: `check ${id}: its verdict was changed after signing`,
    });
    await database().query('UPDATE checks SET verdict = ?, content_hash = ? WHERE id = ?', {
      replacements: [before!.verdict, 'e'.repeat(64), id],
    });
    expect((await verifyRecords(database())).firstBroken).toMatchObject({
      entityId: id,
      reason: `check ${id}: its signature hash was replaced`,
    });
    await database().query('UPDATE checks SET content_hash = ? WHERE id = ?', {
      replacements: [before!.content_hash, id],
    });
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
    const reason = `check ${id}: reading "sys1.level" was changed after signing (its entry)`;
    expect(await checkRecordProblem(id)).toBe(reason);
    const result = await verifyRecords(database());
    expect(result.ok).toBe(false);
    expect(result.firstBroken).toMatchObject({
      entity: 'check',
      entityId: id,
      action: 'check.signed',
      reason,
    });
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
