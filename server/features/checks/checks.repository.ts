import type { Attributes, CreationAttributes, Sequelize, Transaction } from 'sequelize';
import { chainEvents, lockAuditHeadSql, type AuditHead, type AuditInput } from '@server/audit/audit-trail';
import { auditStatements, auditStatementsInSql } from '@server/audit/audit.repository';
import {
  atomicBlock,
  insertStatement,
  runSql,
  sqlVariable,
  withConnection,
  type Statement,
} from '@server/db/sql';
import { currentLimitsIdSql, limitsById } from '@server/db/limits-store';
import { retryTransient } from '@server/db/retry';
import { usageStatements, type UsageRow } from '@server/db/usage-records';
import type { UsageFigures } from '@shared/schemas/usage';
import { Op } from 'sequelize';
import {
  Airframe,
  Check,
  CheckDraft,
  Defect,
  Hold,
  Photo,
  Reading,
  ServicingEntry,
  Staff,
  Tool,
} from '@server/db/models';

export type SigningAirframe = Pick<
  Attributes<Airframe>,
  'id' | 'fleetNumber' | 'registration' | 'typeId' | 'hours' | 'flights' | 'active'
>;

interface TargetRow {
  existingId: string | null;
  existingSubmissionHash: string | null;
  existingSignedBy: number | null;
  airframeId: number | null;
  fleetNumber: string;
  registration: string | null;
  typeId: number;
  hours: string;
  flights: number;
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
            a.id AS airframeId, a.fleet_number AS fleetNumber, a.registration, a.type_id AS typeId,
            a.hours, a.flights, a.active,
            ${currentLimitsIdSql('a.type_id')} AS currentLimitsId
       FROM (SELECT ? AS check_id, ? AS airframe_id) wanted
       LEFT JOIN checks c ON c.id = wanted.check_id
       LEFT JOIN airframes a ON a.id = wanted.airframe_id`,
    [checkId, airframeId],
  );
  const airframe: SigningAirframe | null =
    row?.airframeId == null
      ? null
      : {
          id: row.airframeId,
          fleetNumber: row.fleetNumber,
          registration: row.registration,
          typeId: row.typeId,
          hours: row.hours,
          flights: Number(row.flights),
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
  /** Tech-log defects the check raises (its finding out of limits, its defect note); `ofHold` links the hold. */
  defects: { row: Omit<CreationAttributes<Defect>, 'holdId'>; ofHold: boolean }[];
  /** The flight hours, flights and landings an after-flight check records, and the figures they were judged against. */
  usage: { row: UsageRow; last: UsageFigures } | null;
  /** The audit events, made once the hold (if any), the defects and the usage entry have their ids. */
  events: (holdId: number | null, defectIds: number[], usageId: number | null) => AuditInput[];
}

/** Raised when a photo of the check was attached to another check in the meantime. */
export const PHOTO_TAKEN_SQLSTATE = '45001';

/** The check's own rows, its photo claims and the removal of its draft, after START TRANSACTION. */
function checkRowStatements(rows: SignedCheckRows): Statement[] {
  const checkId = rows.check.id;
  const claims: Statement[] = rows.photos.map((photo) => ({
    sql:
      'UPDATE `photos` SET `check_id` = ?, `checkpoint_code` = ? WHERE `id` = ? AND `check_id` IS NULL;\n' +
      `IF ROW_COUNT() <> 1 THEN SIGNAL SQLSTATE '${PHOTO_TAKEN_SQLSTATE}' SET MESSAGE_TEXT = 'photo taken'; END IF`,
    values: [checkId, photo.code, photo.id],
  }));
  return [
    { sql: 'START TRANSACTION', values: [] },
    insertStatement(Check, [rows.check]),
    insertStatement(Reading, rows.readings),
    ...(rows.servicing.length ? [insertStatement(ServicingEntry, rows.servicing)] : []),
    ...claims,
    { sql: 'DELETE FROM `check_drafts` WHERE `id` = ?', values: [checkId] },
  ];
}

/**
 * Stores a signed check, its readings, top-ups, photo claims, hold, defects and audit events in one transaction.
 * Every signed check waits for the audit chain's head lock, so the time it is held is what limits how many checks a
 * second the hangar can sign; the lock is taken last.
 * - A check that raises nothing (no hold, defect or usage entry) knows its one event before anything is written:
 *   its rows, the event chained by MariaDB under the lock (chainEventsInSql) and the COMMIT go in one round trip,
 *   and the lock is held for the rest of that one statement.
 * - Otherwise the events name the ids the first block gives the hold, the defects and the usage entry: the first
 *   block writes the rows and takes the lock last, the second sends the chained events, the new head and the
 *   COMMIT together, so the lock is held for one round trip.
 * A failure anywhere rolls back everything.
 */
export async function storeSignedCheck(sequelize: Sequelize, rows: SignedCheckRows) {
  const checkRows = checkRowStatements(rows);
  if (!rows.hold && rows.defects.length === 0 && !rows.usage) {
    const whole = atomicBlock([
      ...checkRows,
      ...auditStatementsInSql(rows.events(null, [], null)),
      { sql: 'COMMIT', values: [] },
    ]);
    // A deadlock or a Galera certification failure rolls the whole transaction back: it is sent again, same rows.
    await retryTransient(() =>
      withConnection(sequelize, (connection) => connection.query(whole.sql, whole.values)),
    );
    return { hold: null };
  }
  const write = atomicBlock([
    ...checkRows,
    // The connection is pooled: set every variable read below, so none carries over from another check.
    { sql: 'SET @hold_id = NULL, @defect_0 = NULL, @defect_1 = NULL, @usage_id = NULL', values: [] },
    ...(rows.usage
      ? [
          ...usageStatements(rows.usage.row, rows.usage.last),
          { sql: 'SET @usage_id = LAST_INSERT_ID()', values: [] },
        ]
      : []),
    ...(rows.hold
      ? [insertStatement(Hold, [rows.hold]), { sql: 'SET @hold_id = LAST_INSERT_ID()', values: [] }]
      : []),
    ...rows.defects
      .slice(0, 2)
      .flatMap((defect, i) => [
        insertStatement(Defect, [
          { ...defect.row, holdId: defect.ofHold ? sqlVariable('@hold_id') : null } as never,
        ]),
        { sql: `SET @defect_${i} = LAST_INSERT_ID()`, values: [] },
      ]),
    {
      sql: lockAuditHeadSql(
        '@hold_id AS hold_id, @defect_0 AS defect_0, @defect_1 AS defect_1, @usage_id AS usage_id',
      ),
      values: [],
    },
  ]);
  // A deadlock or a Galera certification failure rolls the whole transaction back: it is sent again, same rows.
  return retryTransient(() =>
    withConnection(sequelize, async (connection) => {
      const [[head]] = (await connection.query(write.sql, write.values)) as [
        (AuditHead & {
          hold_id: number | null;
          defect_0: number | null;
          defect_1: number | null;
          usage_id: number | null;
        })[],
      ];
      try {
        const holdId = rows.hold ? Number(head!.hold_id) : null;
        const defectIds = [head!.defect_0, head!.defect_1].filter((id) => id !== null).map(Number);
        const usageId = rows.usage ? Number(head!.usage_id) : null;
        const chained = chainEvents(head, rows.events(holdId, defectIds, usageId));
        const commit = atomicBlock([...auditStatements(chained), { sql: 'COMMIT', values: [] }]);
        await connection.query(commit.sql, commit.values);
        const hold: Attributes<Hold> | null = rows.hold && { ...rows.hold, id: holdId! };
        return { hold };
      } catch (err) {
        await connection.query('ROLLBACK').catch(() => {});
        throw err;
      }
    }),
  );
}

export const checkById = (id: string) => Check.findByPk(id);

export type StoredPhoto = Attributes<Photo>;

export async function photosByIds(ids: string[]): Promise<StoredPhoto[]> {
  if (ids.length === 0) return [];
  const photos = await Photo.findAll({ where: { id: { [Op.in]: ids } } });
  return photos.map((p) => p.get({ plain: true }));
}

export const airframeExists = async (id: number) =>
  (await Airframe.findByPk(id, { attributes: ['id'] })) !== null;

/** A check started on a tablet; locked for the caller's transaction when one is given. */
export const draftById = (id: string, transaction?: Transaction) =>
  CheckDraft.findByPk(id, transaction ? { transaction, lock: transaction.LOCK.UPDATE } : {});

export const createDraft = (row: CreationAttributes<CheckDraft>) => CheckDraft.create(row);

export const updateDraft = (
  draft: CheckDraft,
  fields: Partial<Pick<Attributes<CheckDraft>, 'touchedAt' | 'closedAt' | 'closedBy' | 'closeReason'>>,
  transaction?: Transaction,
) => draft.update(fields, transaction ? { transaction } : {});

/** Drafts not closed and touched since `since`, oldest first, with their airframes' fleet numbers and starters' names. */
export async function openDraftRows(since: Date) {
  const drafts = await CheckDraft.findAll({
    where: { closedAt: { [Op.is]: null }, touchedAt: { [Op.gt]: since } },
    order: [['startedAt', 'ASC']],
  });
  const [airframes, people] = await Promise.all([
    Airframe.findAll({
      where: { id: { [Op.in]: drafts.map((d) => d.airframeId) } },
      attributes: ['id', 'fleetNumber'],
    }),
    Staff.findAll({ where: { id: { [Op.in]: drafts.map((d) => d.startedBy) } }, attributes: ['id', 'name'] }),
  ]);
  return {
    drafts,
    fleet: new Map(airframes.map((a) => [a.id, a.fleetNumber])),
    names: new Map(people.map((p) => [p.id, p.name])),
  };
}

/** The register's tools with these numbers, retired ones included (signing says why a retired one is refused). */
export async function toolsByNumbers(numbers: string[]) {
  if (numbers.length === 0) return [];
  const tools = await Tool.findAll({ where: { number: { [Op.in]: numbers } } });
  return tools.map((t) => t.get({ plain: true }));
}
