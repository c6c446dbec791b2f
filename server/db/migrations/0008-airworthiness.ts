import { DataTypes, QueryTypes, type QueryInterface } from 'sequelize';
import { chainEvents, lockAuditHeadSql, type AuditHead, type AuditInput } from '@server/audit/audit-trail';
import type { ChainedEvent } from '@server/audit/trail-chain';
import { canonicalJson, contentHash } from '@server/security/hashing';
import { sqlTime } from '@server/db/sql-time';

/** The INSERT of chained audit events with the audit_events columns as they stood at this migration (history). */
export const auditEventsInsert = (events: ChainedEvent[]) => ({
  sql:
    'INSERT INTO audit_events (id, at, actor_id, action, entity, entity_id, payload, prev_hash, hash) VALUES ' +
    events.map(() => '(?, ?, ?, ?, ?, ?, ?, ?, ?)').join(', '),
  values: events.flatMap((e) => [
    e.id,
    sqlTime(e.at),
    e.actorId,
    e.action,
    e.entity,
    e.entityId,
    e.payload,
    e.prevHash,
    e.hash,
  ]),
});

const id = { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true };
const ref = (table: string, allowNull = false) => ({
  type: DataTypes.INTEGER.UNSIGNED,
  allowNull,
  references: { model: table, key: 'id' },
});
const time = (allowNull = false) => ({ type: DataTypes.DATE(3), allowNull });
const signature = {
  signed_by: ref('staff'),
  signed_at: time(),
  signed_with: { type: DataTypes.ENUM('pin', 'password'), allowNull: false },
  content_hash: { type: DataTypes.CHAR(64), allowNull: false },
  signed_content: { type: DataTypes.TEXT('long'), allowNull: false },
};

export async function up(qi: QueryInterface): Promise<void> {
  // What a certifying person may sign: licence category, types, ATA chapters and until when. Rows are never
  // edited: a change is a withdrawal and a new grant, both in the audit trail.
  await qi.createTable('staff_authorisations', {
    id,
    staff_id: ref('staff'),
    category: { type: DataTypes.ENUM('A', 'B1', 'B2', 'B3', 'C'), allowNull: false },
    type_codes: { type: DataTypes.TEXT, allowNull: false },
    scope: { type: DataTypes.TEXT, allowNull: false },
    expires_on: { type: DataTypes.DATEONLY, allowNull: false },
    reference: { type: DataTypes.STRING(64), allowNull: false },
    granted_by: ref('staff'),
    granted_at: time(),
    revoked_at: time(true),
    revoked_by: ref('staff', true),
  });
  await qi.addIndex('staff_authorisations', ['staff_id', 'revoked_at']);

  // The tech log: a numbered defect per finding out of limits, defect note or defect raised by a person.
  await qi.createTable('defects', {
    id,
    airframe_id: ref('airframes'),
    description: { type: DataTypes.TEXT, allowNull: false },
    chapter: { type: DataTypes.STRING(8), allowNull: true },
    source: { type: DataTypes.ENUM('finding', 'check_note', 'raised'), allowNull: false },
    check_id: { type: DataTypes.CHAR(36), allowNull: true, references: { model: 'checks', key: 'id' } },
    hold_id: ref('holds', true),
    needs_independent_inspection: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    raised_by: ref('staff'),
    raised_at: time(),
    content_hash: { type: DataTypes.CHAR(64), allowNull: false },
    signed_content: { type: DataTypes.TEXT('long'), allowNull: false },
  });
  await qi.addIndex('defects', ['airframe_id', 'raised_at']);
  await qi.addIndex('defects', ['check_id', 'source'], { unique: true, name: 'defects_check_source' });

  // Everything signed against a defect, only ever added: work done, an independent inspection, the certification
  // of its rectification, or a deferral with its limits.
  await qi.createTable('defect_entries', {
    id,
    defect_id: ref('defects'),
    kind: { type: DataTypes.ENUM('work', 'inspection', 'certification', 'deferral'), allowNull: false },
    text: { type: DataTypes.TEXT, allowNull: false },
    independent_inspection: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    authorisation: { type: DataTypes.TEXT, allowNull: true },
    category: { type: DataTypes.ENUM('A', 'B', 'C', 'D'), allowNull: true },
    reference: { type: DataTypes.STRING(100), allowNull: true },
    limit_at: time(true),
    limit_hours: { type: DataTypes.DECIMAL(10, 1), allowNull: true },
    limit_flights: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    ...signature,
  });
  await qi.addIndex('defect_entries', ['defect_id', 'signed_at']);

  // A certificate of release to service for the whole airframe.
  await qi.createTable('airframe_releases', {
    id,
    airframe_id: ref('airframes'),
    statement: { type: DataTypes.TEXT, allowNull: false },
    chapters: { type: DataTypes.TEXT, allowNull: false },
    authorisation: { type: DataTypes.TEXT, allowNull: false },
    ...signature,
  });
  await qi.addIndex('airframe_releases', ['airframe_id', 'signed_at']);

  // A release's authorisation as it stood when signed; releases signed before authorisations were kept say so.
  await qi.addColumn('hold_countersigns', 'authorisation', { type: DataTypes.TEXT, allowNull: true });
  await qi.addColumn('hold_countersigns', 'legacy', {
    type: DataTypes.BOOLEAN,
    allowNull: false,
    defaultValue: false,
  });
  await qi.sequelize.query('UPDATE hold_countersigns SET legacy = 1');
  // A corrective action that disturbed, for example, flight controls needs a second person's inspection.
  await qi.addColumn('hold_corrective_actions', 'independent_inspection', {
    type: DataTypes.BOOLEAN,
    allowNull: false,
    defaultValue: false,
  });

  // A lead can close a check left open on a tablet, with a reason.
  await qi.addColumn('check_drafts', 'closed_at', time(true));
  await qi.addColumn('check_drafts', 'closed_by', ref('staff', true));
  await qi.addColumn('check_drafts', 'close_reason', { type: DataTypes.TEXT, allowNull: true });

  // Flights only ever move forward, like hours; a deferral may be limited in flights.
  await qi.addColumn('airframes', 'flights', {
    type: DataTypes.INTEGER.UNSIGNED,
    allowNull: false,
    defaultValue: 0,
  });

  // Every finding counts until cleared: the state reads each airframe's checks with findings.
  await qi.addIndex('checks', ['verdict', 'airframe_id', 'signed_at'], { name: 'checks_verdict_airframe' });

  await defectsForExistingRecords(qi);
}

interface OldHold {
  id: number;
  airframe_id: number;
  check_id: string;
  reason: string;
  opened_at: Date;
  signed_by: number;
}

interface OldNote {
  id: string;
  airframe_id: number;
  note: string;
  signed_by: number;
  signed_at: Date;
}

/**
 * Existing records keep their meaning in the tech log: every hold becomes the defect of its finding (it clears
 * when the hold is released, as before), and every defect note on a signed check becomes an open defect, which it
 * always was: nothing recorded it as rectified or deferred. Each is chained into the audit trail as recorded by
 * this migration (no actor).
 */
async function defectsForExistingRecords(qi: QueryInterface) {
  const sequelize = qi.sequelize;
  const holds = await sequelize.query<OldHold>(
    `SELECT h.id, h.airframe_id, h.check_id, h.reason, h.opened_at, c.signed_by
       FROM holds h JOIN checks c ON c.id = h.check_id ORDER BY h.id`,
    { type: QueryTypes.SELECT },
  );
  const notes = await sequelize.query<OldNote>(
    `SELECT id, airframe_id, note, signed_by, signed_at FROM checks
      WHERE note IS NOT NULL AND TRIM(note) <> '' ORDER BY signed_at, id`,
    { type: QueryTypes.SELECT },
  );
  const rows = [
    ...holds.map((h) => ({
      airframeId: h.airframe_id,
      description: h.reason,
      source: 'finding' as const,
      checkId: h.check_id,
      holdId: h.id,
      raisedBy: h.signed_by,
      raisedAt: new Date(h.opened_at),
    })),
    ...notes.map((n) => ({
      airframeId: n.airframe_id,
      description: n.note,
      source: 'check_note' as const,
      checkId: n.id,
      holdId: null,
      raisedBy: n.signed_by,
      raisedAt: new Date(n.signed_at),
    })),
  ];
  if (rows.length === 0) return;
  const recordedAt = new Date();
  await sequelize.transaction(async (transaction) => {
    const events: AuditInput[] = [];
    for (const row of rows) {
      const content = {
        airframeId: row.airframeId,
        description: row.description,
        chapter: null,
        source: row.source,
        checkId: row.checkId,
        holdId: row.holdId,
        needsIndependentInspection: false,
        raisedBy: row.raisedBy,
        raisedAt: row.raisedAt.toISOString(),
        recordedBy: 'migration 0008 from the existing records',
      };
      const hash = contentHash(content);
      const [insertedId] = await sequelize.query(
        `INSERT INTO defects (airframe_id, description, chapter, source, check_id, hold_id,
                              needs_independent_inspection, raised_by, raised_at, content_hash, signed_content)
         VALUES (?, ?, NULL, ?, ?, ?, 0, ?, ?, ?, ?)`,
        {
          replacements: [
            row.airframeId,
            row.description,
            row.source,
            row.checkId,
            row.holdId,
            row.raisedBy,
            row.raisedAt,
            hash,
            canonicalJson(content),
          ],
          type: QueryTypes.INSERT,
          transaction,
        },
      );
      events.push({
        actorId: null,
        action: 'defect.recorded',
        entity: 'defect',
        entityId: String(insertedId),
        payload: { contentHash: hash, migrated: true },
        at: recordedAt,
      });
    }
    const [head] = await sequelize.query<AuditHead>(lockAuditHeadSql(), {
      type: QueryTypes.SELECT,
      transaction,
    });
    const chained = chainEvents(head, events);
    const insert = auditEventsInsert(chained.events);
    for (const statement of [insert, chained.updateHead]) {
      await sequelize.query(statement.sql, { replacements: statement.values, transaction });
    }
  });
}
