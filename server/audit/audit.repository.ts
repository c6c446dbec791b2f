import { Op, QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import {
  Acceptance,
  AirframeRelease,
  AuditEvent,
  Check,
  CheckDraft,
  Defect,
  DefectEntry,
  HoldCountersign,
  LimitsVersion,
  Reading,
  ServicingEntry,
  StaffAuthorisation,
} from '../db/models';
import { insertStatement, runSql, sqlVariable, type Statement } from '../db/sql';
import {
  chainEventsInSql,
  lockAuditHeadSql,
  type AuditHead,
  type AuditInput,
  type chainEvents,
} from './trail-chain';

// The audit trail's and the record check's reads and writes: the only place under server/audit that touches
// models or SQL.

export type StoredEvent = AuditEvent;
export type StoredCheck = Check;
export type StoredReading = Reading;

/** Takes the chain's head row lock in the caller's transaction and returns the head. */
export async function lockedAuditHead(sequelize: Sequelize, transaction: Transaction) {
  const [head] = await runSql<AuditHead[]>(sequelize, lockAuditHeadSql(), [], transaction);
  return head;
}

/** The chained events' INSERT, its columns taken from the AuditEvent model, then the head's UPDATE. */
export const auditStatements = (chained: ReturnType<typeof chainEvents>): Statement[] => [
  insertStatement(AuditEvent, chained.events),
  chained.updateHead,
];

/**
 * Statements that take the head lock, chain `inputs` onto it and move the head, all inside the caller's compound
 * statement (chainEventsInSql): for events whose content is known before anything is written. Each event is one
 * INSERT built from the AuditEvent model, its id and hashes taken from the variables the chain sets.
 */
export function auditStatementsInSql(inputs: AuditInput[]): Statement[] {
  const chain = chainEventsInSql(inputs);
  return [
    ...chain.lock,
    ...chain.events.flatMap((e) => [
      e.set,
      insertStatement(AuditEvent, [
        {
          ...e.fields,
          id: sqlVariable(e.variables.id),
          prevHash: sqlVariable(e.variables.prevHash),
          hash: sqlVariable(e.variables.hash),
        } as never,
      ]),
    ]),
    chain.updateHead,
  ];
}

/** Sends the statements together, in the caller's transaction. */
export async function runTogether(sequelize: Sequelize, statements: Statement[], transaction: Transaction) {
  await Promise.all(statements.map(({ sql, values }) => runSql(sequelize, sql, values, transaction)));
}

export const eventsAfter = (lastId: number, limit: number) =>
  AuditEvent.findAll({ where: { id: { [Op.gt]: lastId } }, order: [['id', 'ASC']], limit });

export async function auditHeadHash(sequelize: Sequelize) {
  const [head] = await sequelize.query<{ hash: string }>('SELECT hash FROM audit_head WHERE id = 1', {
    type: QueryTypes.SELECT,
  });
  return head?.hash ?? null;
}

export const readingsOf = (checkId: string) =>
  Reading.findAll({ where: { checkId }, order: [['seq', 'ASC']] });
export const servicingOf = (checkId: string) =>
  ServicingEntry.findAll({ where: { checkId }, order: [['id', 'ASC']] });
export const checkById = (id: string) => Check.findByPk(id);
export const limitsVersionNumber = async (id: number) =>
  (await LimitsVersion.findByPk(id, { attributes: ['version'] }))?.version;

export const signedRows = {
  defect: (id: string) => Defect.findByPk(id),
  defectEntry: (id: string) => DefectEntry.findByPk(id),
  release: (id: string) => AirframeRelease.findByPk(id),
  countersign: (id: number) => HoldCountersign.findByPk(id),
  acceptance: (id: string) => Acceptance.findByPk(id),
  authorisation: (id: string) => StaffAuthorisation.findByPk(id),
  draft: (id: string) => CheckDraft.findByPk(id),
  check: checkById,
};
