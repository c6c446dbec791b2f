import type { Attributes, CreationAttributes, Sequelize } from 'sequelize';
import { chainEvents, lockAuditHeadSql, type AuditHead, type AuditInput } from '../../audit/audit-trail';
import { atomicBlock, runSql, withConnection } from '../../db/direct-sql';
import { currentLimitsIdSql, limitsById } from '../../db/limits-store';
import { insertStatement, type Statement } from '../../db/insert-rows';
import { Check, Hold, Reading, ServicingEntry, type Airframe } from '../../db/models';

interface TargetRow {
  existingId: string | null;
  existingSubmissionHash: string | null;
  existingSignedBy: number | null;
  airframeId: number | null;
  fleetNumber: string;
  typeId: number;
  hours: string;
  active: number;
  currentLimitsId: number | null;
}

/**
 * What signing needs to know before anything else, in one round trip: whether the check id is taken already (a
 * resend), the airframe, and its type's current limits version.
 */
export async function signingTargets(sequelize: Sequelize, checkId: string, airframeId: number) {
  const [row] = await runSql<TargetRow[]>(
    sequelize,
    `SELECT c.id AS existingId, c.submission_hash AS existingSubmissionHash, c.signed_by AS existingSignedBy,
            a.id AS airframeId, a.fleet_number AS fleetNumber, a.type_id AS typeId, a.hours, a.active,
            ${currentLimitsIdSql('a.type_id')} AS currentLimitsId
       FROM (SELECT ? AS check_id, ? AS airframe_id) wanted
       LEFT JOIN checks c ON c.id = wanted.check_id
       LEFT JOIN airframes a ON a.id = wanted.airframe_id`,
    [checkId, airframeId],
  );
  const airframe: Pick<Attributes<Airframe>, 'id' | 'fleetNumber' | 'typeId' | 'hours' | 'active'> | null =
    row?.airframeId == null
      ? null
      : {
          id: row.airframeId,
          fleetNumber: row.fleetNumber,
          typeId: row.typeId,
          hours: row.hours,
          active: Boolean(row.active),
        };
  return {
    existing:
      row?.existingId == null
        ? null
        : {
            id: row.existingId,
            submissionHash: row.existingSubmissionHash!,
            signedBy: row.existingSignedBy!,
          },
    airframe,
    limits: row?.currentLimitsId ? await limitsById(row.currentLimitsId) : null,
  };
}

export interface SignedCheckRows {
  check: CreationAttributes<Check>;
  readings: CreationAttributes<Reading>[];
  servicing: CreationAttributes<ServicingEntry>[];
  /** Photos uploaded for this check, each claimed for its checkpoint. */
  photos: { id: string; code: string }[];
  hold: Omit<Attributes<Hold>, 'id'> | null;
  /** The audit events, made once the hold (if any) has its id. */
  events: (holdId: number | null) => AuditInput[];
}

/** Raised when a photo of the check was attached to another check in the meantime. */
export const PHOTO_TAKEN_SQLSTATE = '45001';

/**
 * Stores a signed check, its readings, top-ups, photo claims, hold and audit events in one transaction of two
 * round trips. Every signed check waits for the audit chain's head lock, so the time it is held is what limits
 * how many checks a second the hangar can sign: the first block writes the rows and takes the lock last; the
 * second sends the chained events, the new head and the COMMIT together, so the lock is held for one round trip.
 * A failure anywhere rolls back everything.
 */
export async function storeSignedCheck(sequelize: Sequelize, rows: SignedCheckRows) {
  const checkId = rows.check.id;
  const claims: Statement[] = rows.photos.map((photo) => ({
    sql:
      'UPDATE `photos` SET `check_id` = ?, `checkpoint_code` = ? WHERE `id` = ? AND `check_id` IS NULL;\n' +
      `IF ROW_COUNT() <> 1 THEN SIGNAL SQLSTATE '${PHOTO_TAKEN_SQLSTATE}' SET MESSAGE_TEXT = 'photo taken'; END IF`,
    values: [checkId, photo.code, photo.id],
  }));
  const write = atomicBlock([
    { sql: 'START TRANSACTION', values: [] },
    insertStatement(Check, [rows.check]),
    insertStatement(Reading, rows.readings),
    ...(rows.servicing.length ? [insertStatement(ServicingEntry, rows.servicing)] : []),
    ...claims,
    { sql: 'DELETE FROM `check_drafts` WHERE `id` = ?', values: [checkId] },
    // The hold is inserted last, so LAST_INSERT_ID() below is its id.
    ...(rows.hold ? [insertStatement(Hold, [rows.hold])] : []),
    { sql: lockAuditHeadSql('LAST_INSERT_ID() AS inserted_id'), values: [] },
  ]);
  return withConnection(sequelize, async (connection) => {
    const [[head]] = (await connection.query(write.sql, write.values)) as [
      (AuditHead & { inserted_id: number })[],
    ];
    try {
      const holdId = rows.hold ? Number(head!.inserted_id) : null;
      const chained = chainEvents(head, rows.events(holdId));
      const commit = atomicBlock([chained.insert, chained.updateHead, { sql: 'COMMIT', values: [] }]);
      await connection.query(commit.sql, commit.values);
      const hold: Attributes<Hold> | null = rows.hold && { ...rows.hold, id: holdId! };
      return { hold };
    } catch (err) {
      await connection.query('ROLLBACK').catch(() => {});
      throw err;
    }
  });
}
