import type { Attributes, Model, Sequelize, Transaction } from 'sequelize';
import { fieldChanges, updateRow } from '../db/rows';
import {
  auditHeadHash,
  auditStatements,
  eventsAfter,
  lockedAuditHead,
  runTogether,
  type StoredEvent,
} from './audit.repository';
import {
  chainEvents,
  lockAuditHeadSql,
  verifyChain,
  type AuditHead,
  type AuditInput,
  type TrailVerification,
} from './trail-chain';

// The signing path and the features append through this module; the chain's pure rules live in trail-chain.ts.
export { chainEvents, lockAuditHeadSql, type AuditHead, type AuditInput, type TrailVerification };

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
  const head = await lockedAuditHead(sequelize, transaction);
  const chained = chainEvents(head, [input]);
  await runTogether(sequelize, auditStatements(chained), transaction);
  return chained.head;
}

/**
 * Writes the fields of a row that changed between `before` and `after` and audits them, as { from, to } each, in the
 * caller's transaction; when nothing changed nothing is written or audited. Returns the names of the changed fields.
 */
export async function updateAudited<M extends Model, T extends Partial<Attributes<M>>>(
  sequelize: Sequelize,
  transaction: Transaction,
  row: M,
  change: { before: T; after: T },
  event: Omit<AuditInput, 'payload'>,
) {
  const { changed, payload } = fieldChanges(change.before, change.after);
  if (changed.length > 0) {
    await updateRow(row, change.after, transaction);
    await appendAuditEvent(sequelize, transaction, { ...event, payload });
  }
  return changed;
}

async function* storedEvents(): AsyncGenerator<StoredEvent> {
  let lastId = 0;
  for (;;) {
    const batch = await eventsAfter(lastId, 1000);
    if (batch.length === 0) return;
    yield* batch;
    lastId = Number(batch[batch.length - 1]!.id);
  }
}

/** Walks the stored chain from the start and reports the first event whose hash or link does not hold. */
export function verifyAuditTrail(
  sequelize: Sequelize,
  checkEntity?: (event: StoredEvent) => Promise<string | null>,
): Promise<TrailVerification> {
  return verifyChain(storedEvents(), () => auditHeadHash(sequelize), checkEntity);
}
