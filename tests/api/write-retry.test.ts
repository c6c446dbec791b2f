import { describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import type { Connection } from 'mariadb';
import { appForThisFile, database, makeAirframe } from '../setup/api-harness';
import { preFlightBody } from '../setup/check-builder';
import { signedIn } from '../setup/sign-in';
import { withConnection } from '@server/db/sql';
import { inTransaction, retryCount } from '@server/db/retry';
import { runSql } from '@server/db/sql';
import { verifyAuditTrail } from '@server/audit/audit-trail';

// A signed check that loses a deadlock is rolled back whole by the database and sent again with the same id. On a
// Galera cluster the same error number (1213) is what a certification failure raises at commit (MariaDB's Galera
// cluster limitations page, from memory), so this real InnoDB deadlock stands for it.
const { app } = appForThisFile();

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/** Waits until the check's uncommitted row exists: its transaction has written its rows and wants the audit head. */
async function untilWritten(checkId: string, table = 'checks', column = 'id') {
  await withConnection(database(), async (peek) => {
    await peek.query('SET SESSION TRANSACTION ISOLATION LEVEL READ UNCOMMITTED');
    for (let i = 0; i < 200; i += 1) {
      const [row] = (await peek.query(`SELECT COUNT(*) AS n FROM ${table} WHERE ${column} = ?`, [
        checkId,
      ])) as {
        n: bigint;
      }[];
      if (Number(row!.n) > 0) return;
      await sleep(20);
    }
    throw new Error('The check never reached the audit head lock.');
  });
}

/**
 * Holds the audit head in a heavy transaction (400 rows written, so InnoDB picks the writer as the smaller victim),
 * then asks for the row the writer wrote: each waits for the other, and the writer's transaction is rolled back.
 */
async function deadlockTheWriter(
  blocker: Connection,
  checkId: string,
  submit: () => Promise<unknown>,
  row = { table: 'checks', column: 'id' },
) {
  await blocker.query(
    'CREATE TABLE IF NOT EXISTS retry_test_ballast (id INT AUTO_INCREMENT PRIMARY KEY, n INT)',
  );
  await blocker.query('START TRANSACTION');
  await blocker.query('INSERT INTO retry_test_ballast (n) SELECT seq FROM seq_1_to_400');
  await blocker.query('SELECT hash FROM audit_head WHERE id = 1 FOR UPDATE');
  const answer = submit();
  await untilWritten(checkId, row.table, row.column);
  await sleep(100);
  const seen = (await blocker.query(`SELECT 1 FROM ${row.table} WHERE ${row.column} = ? FOR UPDATE`, [
    checkId,
  ])) as unknown[];
  await blocker.query('ROLLBACK');
  return { answer: await answer, blockerSawRow: seen.length > 0 };
}

describe('write paths under deadlocks and certification failures', () => {
  it('when a signed check loses a deadlock on its first try, then it is stored once with its id and answered once', async () => {
    const { client, pin } = await signedIn(app, ['mechanic'], 'kiosk');
    const { airframe, limits } = await makeAirframe();
    const body = preFlightBody(airframe.id, limits.id, pin);
    const retriesBefore = retryCount.total;
    const { answer, blockerSawRow } = await withConnection(database(), (blocker) =>
      deadlockTheWriter(blocker, body.id, () => client.post('/api/checks', body)),
    );
    const res = answer as Awaited<ReturnType<typeof client.post>>;
    // The check was the victim: the blocker's wait ended with the check's row rolled back, not committed.
    expect(blockerSawRow).toBe(false);
    expect(retryCount.total).toBeGreaterThan(retriesBefore);
    expect(res.status).toBe(201);
    expect(res.body.id).toBe(body.id);
    expect(res.headers['idempotent-replay']).toBe('false');

    const count = async (sql: string) => {
      const rows = (await database().query(sql, { replacements: [body.id], plain: true })) as { n: number };
      return Number(rows.n);
    };
    expect(await count('SELECT COUNT(*) AS n FROM checks WHERE id = ?')).toBe(1);
    expect(await count('SELECT COUNT(*) AS n FROM readings WHERE check_id = ?')).toBe(8);
    expect(
      await count("SELECT COUNT(*) AS n FROM audit_events WHERE action = 'check.signed' AND entity_id = ?"),
    ).toBe(1);

    const resent = await client.post('/api/checks', body);
    expect(resent.status).toBe(201);
    expect(resent.headers['idempotent-replay']).toBe('true');
    expect(resent.body.contentHash).toBe(res.body.contentHash);
    expect(await count('SELECT COUNT(*) AS n FROM checks WHERE id = ?')).toBe(1);
    expect((await verifyAuditTrail(database())).ok).toBe(true);
  });

  it('when a Sequelize transaction that appends to the trail loses a deadlock, then inTransaction runs it again and its row is stored once', async () => {
    const sequelize = database();
    const code = `RT${randomUUID().slice(0, 8)}`;
    const retriesBefore = retryCount.total;
    let runs = 0;
    const { answer, blockerSawRow } = await withConnection(sequelize, (blocker) =>
      deadlockTheWriter(
        blocker,
        code,
        () =>
          inTransaction(sequelize, async (transaction) => {
            runs += 1;
            await runSql(
              sequelize,
              'INSERT INTO bases (code, name) VALUES (?, ?)',
              [code, 'Retry base'],
              transaction,
            );
            await runSql(sequelize, 'SELECT hash FROM audit_head WHERE id = 1 FOR UPDATE', [], transaction);
            return 'committed';
          }),
        { table: 'bases', column: 'code' },
      ),
    );
    expect(blockerSawRow).toBe(false);
    expect(answer).toBe('committed');
    expect(runs).toBe(2);
    expect(retryCount.total).toBeGreaterThan(retriesBefore);
    const [row] = (await runSql(sequelize, 'SELECT COUNT(*) AS n FROM bases WHERE code = ?', [code])) as {
      n: bigint;
    }[];
    expect(Number(row!.n)).toBe(1);
  });
});
