import { createPool, type PoolConnection } from 'mariadb';
import { randomUUID } from 'node:crypto';
import { eventHash } from '../audit/trail-chain';
import { canonicalJson, sha256 } from '../security/hashing';
import { parseDatabaseUrl } from '../backup/backup';

export interface BaselineCheck {
  airframeId: number;
  limitsVersionId: number;
  signerId: number;
  context: unknown;
  readings: { code: string; entry: { value?: number; unit?: string; answer?: boolean } }[];
}

/**
 * The bench's floor: the same rows a signed check writes (the check, its readings, an audit event and the chain
 * head) in one transaction through the bare connector, without the ORM. Bench only; never part of the product.
 */
export function baselineCheckStore(databaseUrl: string) {
  const pool = createPool({ ...parseDatabaseUrl(databaseUrl), connectionLimit: 10 });
  return {
    async store(body: BaselineCheck) {
      const conn = await pool.getConnection();
      try {
        await conn.beginTransaction();
        const stored = await writeCheck(conn, body);
        await conn.commit();
        return stored;
      } catch (err) {
        await conn.rollback().catch(() => {});
        throw err;
      } finally {
        await conn.release();
      }
    },
    close: () => pool.end(),
  };
}

async function writeCheck(conn: PoolConnection, body: BaselineCheck) {
  const id = randomUUID();
  const signedAt = new Date();
  const signedContent = canonicalJson({ id, ...body, signedAt: signedAt.toISOString() });
  const contentHash = sha256(signedContent);
  await conn.query(
    `INSERT INTO checks (id, airframe_id, kind, limits_version_id, context, verdict, airframe_hours, signed_by,
         signed_at, content_hash, signed_content, submission_hash, created_at)
       VALUES (?, ?, 'pre_flight', ?, ?, 'in_limits', 0, ?, ?, ?, ?, ?, ?)`,
    [
      id,
      body.airframeId,
      body.limitsVersionId,
      canonicalJson(body.context),
      body.signerId,
      signedAt,
      contentHash,
      signedContent,
      sha256(id),
      signedAt,
    ],
  );
  const rows = body.readings.map((r, seq) => [
    id,
    seq,
    r.code,
    canonicalJson(r.entry),
    r.entry.value ?? (r.entry.answer ? 1 : 0),
    r.entry.unit ?? null,
    'in_limits',
    'in_limits',
    'Between the marks.',
    'None.',
  ]);
  await conn.query(
    `INSERT INTO readings (check_id, seq, checkpoint_code, entry, value, unit, verdict, band_id, message, action)
       VALUES ${rows.map(() => '(?,?,?,?,?,?,?,?,?,?)').join(',')}`,
    rows.flat(),
  );
  const [head] = (await conn.query('SELECT hash FROM audit_head WHERE id = 1 FOR UPDATE')) as {
    hash: string;
  }[];
  const payload = canonicalJson({ contentHash, verdict: 'in_limits' });
  const fields = {
    at: signedAt,
    actorId: body.signerId,
    action: 'check.signed',
    entity: 'check',
    entityId: id,
    payload,
  };
  const hash = eventHash(head!.hash, fields);
  const event = (await conn.query(
    `INSERT INTO audit_events (at, actor_id, action, entity, entity_id, payload, prev_hash, hash)
       VALUES (?, ?, 'check.signed', 'check', ?, ?, ?, ?)`,
    [signedAt, body.signerId, id, payload, head!.hash, hash],
  )) as { insertId: number | bigint };
  await conn.query('UPDATE audit_head SET hash = ?, last_event_id = ? WHERE id = 1', [hash, event.insertId]);
  return { id, contentHash };
}
