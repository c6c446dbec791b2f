import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { AuditEvent } from '../db/models';
import { sqlTime } from '../db/insert-rows';
import { runSql } from '../db/direct-sql';
import { canonicalJson, sha256 } from '../security/hashing';

export interface AuditInput {
  actorId: number | null;
  action: string;
  entity: string;
  entityId: string;
  payload: unknown;
  at?: Date;
}

const GENESIS = '0'.repeat(64);

export function eventHash(
  prevHash: string,
  e: { at: Date; actorId: number | null; action: string; entity: string; entityId: string; payload: string },
) {
  return sha256(
    canonicalJson({
      prevHash,
      at: e.at.toISOString(),
      actorId: e.actorId,
      action: e.action,
      entity: e.entity,
      entityId: e.entityId,
      payload: e.payload,
    }),
  );
}

export interface AuditHead {
  hash: string;
  last_event_id: number | bigint | null;
}

/**
 * Takes the chain's head row lock; a locking read sees the newest head even when the snapshot is older. `also`
 * adds select-list entries read in the same statement.
 */
export const lockAuditHeadSql = (also = '') =>
  `SELECT hash, last_event_id${also ? `, ${also}` : ''} FROM audit_head WHERE id = 1 FOR UPDATE`;

/**
 * The statements that chain `inputs`, in order, onto `head`: one INSERT of the events and one UPDATE of the head.
 * Ids are chosen under the head lock, so both can be sent together, right after the lock was granted.
 */
export function chainEvents(head: AuditHead | undefined, inputs: AuditInput[]) {
  let prevHash = head?.hash ?? GENESIS;
  let id = Number(head?.last_event_id ?? 0);
  const rows = inputs.map((input) => {
    id += 1;
    // Millisecond precision is what the column keeps; hash exactly what is stored.
    const at = new Date(Math.floor((input.at ?? new Date()).getTime()));
    const fields = {
      at,
      actorId: input.actorId,
      action: input.action,
      entity: input.entity,
      entityId: input.entityId,
      payload: canonicalJson(input.payload),
    };
    const hash = eventHash(prevHash, fields);
    const row = [
      id,
      sqlTime(at),
      fields.actorId,
      fields.action,
      fields.entity,
      fields.entityId,
      fields.payload,
      prevHash,
      hash,
    ];
    prevHash = hash;
    return row;
  });
  return {
    head: { id, hash: prevHash },
    insert: {
      sql:
        'INSERT INTO audit_events (id, at, actor_id, action, entity, entity_id, payload, prev_hash, hash) VALUES ' +
        rows.map(() => '(?, ?, ?, ?, ?, ?, ?, ?, ?)').join(', '),
      values: rows.flat(),
    },
    updateHead: {
      sql: 'UPDATE audit_head SET hash = ?, last_event_id = ? WHERE id = 1',
      values: [prevHash, id],
    },
  };
}

/**
 * Appends one event to the hash chain inside the caller's transaction; the head row lock keeps the chain linear.
 * Every signed check waits for that lock, so it is taken last and held as briefly as possible: the event and the
 * new head are sent together, and the caller's commit follows at once.
 */
export async function appendAuditEvent(
  sequelize: Sequelize,
  transaction: Transaction,
  input: AuditInput,
): Promise<{ id: number; hash: string }> {
  const [head] = await runSql<AuditHead[]>(sequelize, lockAuditHeadSql(), [], transaction);
  const chained = chainEvents(head, [input]);
  await Promise.all(
    [chained.insert, chained.updateHead].map(({ sql, values }) =>
      runSql(sequelize, sql, values, transaction),
    ),
  );
  return chained.head;
}

export interface TrailVerification {
  ok: boolean;
  events: number;
  firstBroken: { id: number; action: string; entity: string; entityId: string; reason: string } | null;
}

/** Walks the chain from the start and reports the first event whose hash or link does not hold. */
export async function verifyAuditTrail(
  sequelize: Sequelize,
  checkEntity?: (event: AuditEvent) => Promise<string | null>,
): Promise<TrailVerification> {
  let prevHash = GENESIS;
  let lastId = 0;
  let count = 0;
  for (;;) {
    const batch = await AuditEvent.findAll({
      where: sequelize.literal(`id > ${lastId}`),
      order: [['id', 'ASC']],
      limit: 1000,
    });
    if (batch.length === 0) break;
    for (const e of batch) {
      count += 1;
      const broken = (reason: string) => ({
        ok: false,
        events: count,
        firstBroken: { id: Number(e.id), action: e.action, entity: e.entity, entityId: e.entityId, reason },
      });
      if (e.prevHash !== prevHash) return broken('its link to the previous event does not match');
      if (eventHash(prevHash, e) !== e.hash) return broken('its content does not match its hash');
      const entityProblem = checkEntity ? await checkEntity(e) : null;
      if (entityProblem) return broken(entityProblem);
      prevHash = e.hash;
      lastId = Number(e.id);
    }
  }
  const [head] = await sequelize.query<{ hash: string }>('SELECT hash FROM audit_head WHERE id = 1', {
    type: QueryTypes.SELECT,
  });
  if (head && head.hash !== prevHash) {
    return {
      ok: false,
      events: count,
      firstBroken: {
        id: lastId,
        action: 'end',
        entity: 'trail',
        entityId: '',
        reason: 'events after this one were removed',
      },
    };
  }
  return { ok: true, events: count, firstBroken: null };
}
