import { canonicalJson, sha256 } from '../security/hashing';

export interface AuditInput {
  actorId: number | null;
  action: string;
  entity: string;
  entityId: string;
  payload: unknown;
  at?: Date;
}

export const GENESIS = '0'.repeat(64);

/** What an event's hash covers besides the previous hash. */
interface HashedFields {
  at: Date;
  actorId: number | null;
  action: string;
  entity: string;
  entityId: string;
  payload: string;
}

/** The text an event's hash covers: its fields and the previous event's hash, as canonical JSON. */
const hashedText = (prevHash: string, e: HashedFields) =>
  canonicalJson({
    prevHash,
    at: e.at.toISOString(),
    actorId: e.actorId,
    action: e.action,
    entity: e.entity,
    entityId: e.entityId,
    payload: e.payload,
  });

export function eventHash(prevHash: string, e: HashedFields) {
  return sha256(hashedText(prevHash, e));
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

/** An audit event as chained, by the AuditEvent model's attribute names; the database layer writes it. */
export interface ChainedEvent extends HashedFields {
  id: number;
  prevHash: string;
  hash: string;
}

/** An event's fields as stored and hashed: millisecond time (what the column keeps) and the payload as canonical JSON. */
function eventFields(input: AuditInput): HashedFields {
  return {
    at: new Date(Math.floor((input.at ?? new Date()).getTime())),
    actorId: input.actorId,
    action: input.action,
    entity: input.entity,
    entityId: input.entityId,
    payload: canonicalJson(input.payload),
  };
}

/**
 * The events that chain `inputs`, in order, onto `head`, and the statement that moves the head to the last of them.
 * Ids are chosen under the head lock, so the events and the head update can be sent together, right after the lock
 * was granted. The INSERT itself is built from the model (server/audit/audit.repository.ts), so its column list is
 * never written by hand.
 */
export function chainEvents(head: AuditHead | undefined, inputs: AuditInput[]) {
  let prevHash = head?.hash ?? GENESIS;
  let id = Number(head?.last_event_id ?? 0);
  const events = inputs.map((input): ChainedEvent => {
    id += 1;
    const fields = eventFields(input);
    const hash = eventHash(prevHash, fields);
    const event = { id, ...fields, prevHash, hash };
    prevHash = hash;
    return event;
  });
  return {
    head: { id, hash: prevHash },
    events,
    updateHead: {
      sql: 'UPDATE audit_head SET hash = ?, last_event_id = ? WHERE id = 1',
      values: [prevHash, id],
    },
  };
}

/** How the hashed text ends: `prevHash` is the last key in canonical order, so its value can be joined on at the end. */
const PREV_HASH_AT_END = '"prevHash":""}';

/**
 * The same chain as chainEvents, worked out by MariaDB inside the statement that takes the head lock, for events
 * whose content is known before anything is written. The head lock is then held for that one statement, not for a
 * round trip to the app and back. Each event's hashed text is sent with its previous hash left out; MariaDB joins
 * on the hash it read under the lock and takes SHA2(…, 256) of it, which is the hex SHA-256 of the same UTF-8
 * bytes eventHash hashes (the connection is utf8mb4), so verifyChain checks these events as any other.
 * Statements, in order: `lock` clears and reads the head into user variables, `events` sets each event's id and hash and
 * inserts its row (the caller builds the INSERT from the model, see `rows`), `updateHead` moves the head.
 */
export function chainEventsInSql(inputs: AuditInput[]) {
  if (inputs.length === 0) throw new Error('No audit events to chain.');
  const events = inputs.map((input, i) => {
    const fields = eventFields(input);
    const text = hashedText('', fields);
    if (!text.endsWith(PREV_HASH_AT_END))
      throw new Error('The hashed text no longer ends with the previous hash.');
    const prev = i === 0 ? '@audit_prev' : `@audit_hash_${i - 1}`;
    return {
      set: {
        sql: `SET @audit_id_${i} = @audit_last + ${i + 1}, @audit_hash_${i} = SHA2(CONCAT(?, ${prev}, '"}'), 256)`,
        values: [text.slice(0, -2)],
      },
      fields,
      variables: { id: `@audit_id_${i}`, prevHash: prev, hash: `@audit_hash_${i}` },
    };
  });
  const last = inputs.length - 1;
  return {
    // The connection is pooled: without the head row the SELECT would leave the last check's values in place, so
    // they are cleared first, and a missing head makes the event's hash NULL, which its column refuses.
    lock: [
      { sql: 'SET @audit_prev = NULL, @audit_last = NULL', values: [] },
      {
        sql: 'SELECT hash, COALESCE(last_event_id, 0) INTO @audit_prev, @audit_last FROM audit_head WHERE id = 1 FOR UPDATE',
        values: [],
      },
    ],
    events,
    updateHead: {
      sql: `UPDATE audit_head SET hash = @audit_hash_${last}, last_event_id = @audit_last + ${inputs.length} WHERE id = 1`,
      values: [],
    },
  };
}

export interface TrailVerification {
  ok: boolean;
  events: number;
  firstBroken: { id: number; action: string; entity: string; entityId: string; reason: string } | null;
}

/** An event as stored (the id as the driver hands it back): the fields its hash covers, its link and its hash. */
export interface StoredEvent extends Omit<ChainedEvent, 'id'> {
  id: number | bigint | string;
}

/** What the verifier reports, one reason per way a trail can be broken. */
export const trailReasons = {
  link: 'its link to the previous event does not match',
  content: 'its content does not match its hash',
  truncated: 'events after this one were removed',
  headMissing: "the trail's head row is missing",
} as const;

/**
 * Walks `events` in id order from the start and reports the first one whose link, hash or (through `checkEntity`)
 * record does not hold; then compares the last hash with the chain's head, so a deleted tail is seen too. Pure:
 * the events and the head come from the caller.
 */
export async function verifyChain<E extends StoredEvent>(
  events: Iterable<E> | AsyncIterable<E>,
  readHeadHash: () => Promise<string | null>,
  checkEntity?: (event: E) => Promise<string | null>,
): Promise<TrailVerification> {
  let prevHash = GENESIS;
  let lastId = 0;
  let count = 0;
  for await (const e of events) {
    count += 1;
    const broken = (reason: string) => ({
      ok: false,
      events: count,
      firstBroken: { id: Number(e.id), action: e.action, entity: e.entity, entityId: e.entityId, reason },
    });
    if (e.prevHash !== prevHash) return broken(trailReasons.link);
    if (eventHash(prevHash, e) !== e.hash) return broken(trailReasons.content);
    const entityProblem = checkEntity ? await checkEntity(e) : null;
    if (entityProblem) return broken(entityProblem);
    prevHash = e.hash;
    lastId = Number(e.id);
  }
  const head = await readHeadHash();
  // A trail with events always has a head; without one, a deleted tail could not be seen.
  const endProblem =
    head === null
      ? count > 0
        ? trailReasons.headMissing
        : null
      : head !== prevHash
        ? trailReasons.truncated
        : null;
  if (endProblem) {
    return {
      ok: false,
      events: count,
      firstBroken: { id: lastId, action: 'end', entity: 'trail', entityId: '', reason: endProblem },
    };
  }
  return { ok: true, events: count, firstBroken: null };
}
