import { afterAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { database } from '../setup/api-harness';
import { Base, KioskDevice } from '@server/db/models';
import { atomicBlock, insertStatement, runSql, selectRow, selectRows, withConnection } from '@server/db/sql';
import { isDuplicateKey } from '@server/db/unique-violation';

// server/db/sql.ts leans on Sequelize internals (a transaction's `connection`, the `connectionManager`) and on the
// mariadb connector's own behaviour (array expansion, errno). An upgrade that moves any of them fails here first.
afterAll(async () => {
  await database().close();
});

const code = () => `SQ${randomUUID().replace(/-/g, '').slice(0, 8)}`;
const baseByCode = (c: string) => selectRow(Base, '`code` = ?', [c]);

describe('the raw-SQL module', () => {
  it('when a Sequelize transaction is open, then its connection is a connector connection that sees its own writes and rolls back with it', async () => {
    const sequelize = database();
    const c = code();
    const transaction = await sequelize.transaction();
    expect(typeof (transaction as unknown as { connection: { query: unknown } }).connection.query).toBe(
      'function',
    );
    await runSql(sequelize, 'INSERT INTO `bases` (`code`, `name`) VALUES (?, ?)', [c, 'inside'], transaction);
    expect(await selectRow(Base, '`code` = ?', [c], { transaction })).toMatchObject({
      code: c,
      name: 'inside',
    });
    expect(await baseByCode(c)).toBeNull();
    await transaction.rollback();
    expect(await baseByCode(c)).toBeNull();
  });

  it('when a pooled connection is taken, then the connection manager hands out and takes back a connector connection', async () => {
    const sequelize = database();
    expect(typeof sequelize.connectionManager.getConnection).toBe('function');
    expect(typeof sequelize.connectionManager.releaseConnection).toBe('function');
    const [row] = await withConnection(sequelize, (connection) =>
      connection.query('SELECT 1 + ? AS two', [1]),
    );
    expect(Number((row as { two: number }).two)).toBe(2);
  });

  it('when an array is bound to IN (?), then the connector expands it into a list', async () => {
    const sequelize = database();
    const [a, b] = [code(), code()];
    await Base.bulkCreate([
      { code: a, name: 'first' },
      { code: b, name: 'second' },
    ]);
    const rows = await runSql<{ code: string }[]>(
      sequelize,
      'SELECT `code` FROM `bases` WHERE `code` IN (?) ORDER BY `code`',
      [[a, b]],
    );
    expect(rows.map((r) => r.code)).toEqual([a, b].sort());
  });

  it('when rows are selected, then they come back named and typed as the model gives them', async () => {
    const name = `sql-${code()}`;
    const created = await KioskDevice.create({
      name,
      tokenHash: null,
      enrolCodeHash: null,
      enrolExpiresAt: null,
      enrolledAt: new Date('2026-03-01T06:00:00.123Z'),
      revokedAt: null,
      lastSeenAt: null,
      createdBy: null,
    });
    const [row] = await selectRows(KioskDevice, '`name` = ?', [name]);
    expect(row).toMatchObject({ id: created.id, name, tokenHash: null });
    expect(row!.enrolledAt).toEqual(new Date('2026-03-01T06:00:00.123Z'));
  });

  it('when a compound block fails, then everything it did is rolled back and the error raised', async () => {
    const sequelize = database();
    const c = code();
    const block = atomicBlock([
      { sql: 'START TRANSACTION', values: [] },
      insertStatement(Base, [{ code: c, name: 'first' }]),
      insertStatement(Base, [{ code: c, name: 'duplicate' }]),
      { sql: 'COMMIT', values: [] },
    ]);
    const failure = await withConnection(sequelize, (connection) =>
      connection.query(block.sql, block.values),
    ).catch((err: unknown) => err);
    expect(isDuplicateKey(failure)).toBe(true);
    expect(await baseByCode(c)).toBeNull();
  });

  it('when a model write hits a unique key, then it is recognised as a duplicate like the connector error', async () => {
    const c = code();
    await Base.create({ code: c, name: 'first' });
    const failure = await Base.create({ code: c, name: 'again' }).catch((err: unknown) => err);
    expect(isDuplicateKey(failure)).toBe(true);
    expect(isDuplicateKey(new Error('other'))).toBe(false);
  });
});
