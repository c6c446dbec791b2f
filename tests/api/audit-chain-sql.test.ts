import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { database, makeStaff } from '../setup/api-harness';
import { AuditEvent } from '@server/db/models';
import { atomicBlock, selectRows, withConnection } from '@server/db/sql';
import { auditStatementsInSql } from '@server/audit/audit.repository';
import { chainEvents, eventHash, type AuditInput } from '@server/audit/trail-chain';

// A signed check that raises nothing has its audit event chained by MariaDB (SHA2 over the hashed text, under the
// head lock) instead of in the app. The verifier hashes in the app, so the two must agree byte for byte, on any
// text a payload can hold.
afterAll(async () => {
  await database().close();
});

const awkward: unknown[] = [
  { name: 'Jörg Müller-Lüdenscheidt', note: 'Größe ≥ 3,5 l ✈' },
  { said: 'He wrote "check \\ again"\nthen left.\ttab', emoji: '🛩️ 😀', empty: '' },
  { figures: [1.5, -0, 1e21, 0.1 + 0.2], nested: { z: null, a: true } },
];

let actorId = 0;
beforeAll(async () => {
  // An event's actor is a staff row.
  database();
  actorId = (await makeStaff(['mechanic'])).staff.id;
});

const inputsFor = (entityId: string): AuditInput[] =>
  awkward.map((payload, i) => ({
    actorId: i === 1 ? null : actorId,
    action: 'test.chained',
    entity: 'test',
    entityId,
    payload,
    at: new Date(Date.UTC(2026, 11, 5, 6, 0, i, 250 + i)),
  }));

describe('audit events chained inside the statement', () => {
  it('when MariaDB chains events with text outside ASCII, quotes and escapes, then each hash is the one the app computes and the head moves to the last', async () => {
    const sequelize = database();
    const entityId = randomUUID();
    const inputs = inputsFor(entityId);
    const block = atomicBlock([
      { sql: 'START TRANSACTION', values: [] },
      ...auditStatementsInSql(inputs),
      { sql: 'SELECT hash, last_event_id FROM audit_head WHERE id = 1', values: [] },
      { sql: 'COMMIT', values: [] },
    ]);
    const [[head]] = (await withConnection(sequelize, (connection) =>
      connection.query(block.sql, block.values),
    )) as [{ hash: string; last_event_id: number | bigint }[]];
    const stored = await selectRows(AuditEvent, '`entity` = ? AND `entity_id` = ? ORDER BY `id`', [
      'test',
      entityId,
    ]);
    expect(stored).toHaveLength(3);
    // The events follow each other under the lock: consecutive ids, each linked to the one before.
    const first = stored[0]!;
    const expected = chainEvents({ hash: first.prevHash, last_event_id: Number(first.id) - 1 }, inputs);
    stored.forEach((row, i) => {
      const want = expected.events[i]!;
      expect(Number(row.id)).toBe(want.id);
      expect(row.prevHash).toBe(want.prevHash);
      expect(row.payload).toBe(want.payload);
      expect(row.at.toISOString()).toBe(want.at.toISOString());
      expect(row.hash).toBe(want.hash);
      expect(eventHash(row.prevHash, row)).toBe(row.hash);
    });
    expect(head).toEqual({ hash: expected.head.hash, last_event_id: expect.anything() });
    expect(Number(head!.last_event_id)).toBe(expected.head.id);
  });

  it('when the block fails after the events, then neither the events nor the head move', async () => {
    const sequelize = database();
    const entityId = randomUUID();
    const block = atomicBlock([
      { sql: 'START TRANSACTION', values: [] },
      ...auditStatementsInSql(inputsFor(entityId)),
      { sql: "SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'refused after the events'", values: [] },
      { sql: 'COMMIT', values: [] },
    ]);
    await expect(
      withConnection(sequelize, (connection) => connection.query(block.sql, block.values)),
    ).rejects.toThrow(/refused after the events/);
    expect(await selectRows(AuditEvent, '`entity_id` = ?', [entityId])).toEqual([]);
    // Other files may append meanwhile, so the head is not compared with a hash from before; it must still be the
    // hash of an event that is stored.
    const [head] = (await withConnection(sequelize, (connection) =>
      connection.query(
        'SELECT COUNT(e.id) AS stored FROM audit_head h LEFT JOIN audit_events e ON e.hash = h.hash WHERE h.id = 1',
      ),
    )) as { stored: number | bigint }[];
    expect(Number(head!.stored)).toBe(1);
  });

  it("when the head row is missing, then the block fails instead of chaining onto the connection's last values, and nothing is kept", async () => {
    const sequelize = database();
    const entityId = randomUUID();
    // The same pooled connection has just chained an event, so its user variables hold a real head.
    await withConnection(sequelize, async (connection) => {
      const good = atomicBlock([
        { sql: 'START TRANSACTION', values: [] },
        ...auditStatementsInSql(inputsFor(randomUUID()).slice(0, 1)),
        { sql: 'COMMIT', values: [] },
      ]);
      await connection.query(good.sql, good.values);
      const headless = atomicBlock([
        { sql: 'START TRANSACTION', values: [] },
        { sql: 'DELETE FROM audit_head WHERE id = 1', values: [] },
        ...auditStatementsInSql(inputsFor(entityId)),
        { sql: 'COMMIT', values: [] },
      ]);
      await expect(connection.query(headless.sql, headless.values)).rejects.toThrow(/cannot be null/i);
    });
    expect(await selectRows(AuditEvent, '`entity_id` = ?', [entityId])).toEqual([]);
    const [head] = (await withConnection(sequelize, (connection) =>
      connection.query('SELECT COUNT(*) AS n FROM audit_head WHERE id = 1'),
    )) as { n: number | bigint }[];
    expect(Number(head!.n)).toBe(1);
  });
});
