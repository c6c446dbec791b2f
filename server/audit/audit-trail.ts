import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { AuditEvent } from '../db/models';
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

/** Appends one event to the hash chain inside the caller's transaction; the head row lock keeps the chain linear. */
export async function appendAuditEvent(
  sequelize: Sequelize,
  transaction: Transaction,
  input: AuditInput,
): Promise<AuditEvent> {
  const [head] = await sequelize.query<{ hash: string }>(
    'SELECT hash FROM audit_head WHERE id = 1 FOR UPDATE',
    {
      type: QueryTypes.SELECT,
      transaction,
    },
  );
  const prevHash = head?.hash ?? GENESIS;
  // Millisecond precision is what the column keeps; hash exactly what is stored.
  const at = new Date(Math.floor((input.at ?? new Date()).getTime()));
  const payload = canonicalJson(input.payload);
  const fields = {
    at,
    actorId: input.actorId,
    action: input.action,
    entity: input.entity,
    entityId: input.entityId,
    payload,
  };
  const hash = eventHash(prevHash, fields);
  const event = await AuditEvent.create({ ...fields, prevHash, hash }, { transaction });
  await sequelize.query('UPDATE audit_head SET hash = ?, last_event_id = ? WHERE id = 1', {
    replacements: [hash, event.id],
    transaction,
  });
  return event;
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
