import { Op, type Sequelize, type Transaction } from 'sequelize';
import type { DefectEntryView, DefectView } from '@shared/schemas/defects';
import { defectState } from '@shared/domain/status';
import { signContent, signerOf, type Signature } from '../security/signing';
import { forbidden, refusal } from '../errors/app-error';
import { parseAuthority, statusDefect } from './airworthiness-records';
import { signedTerms } from './authorisation-records';
import { currentLimits } from './limits-store';
import { AircraftType, Airframe, Defect, DefectEntry, Hold, Staff } from './models';

export type EntryFields = Pick<DefectEntry, 'kind' | 'text'> &
  Partial<
    Pick<
      DefectEntry,
      | 'independentInspection'
      | 'authorisation'
      | 'category'
      | 'reference'
      | 'limitAt'
      | 'limitHours'
      | 'limitFlights'
    >
  >;

/**
 * Adds one signed entry to a defect, inside the caller's transaction, and chains it into the audit trail. The
 * signed content is the defect's own hash plus everything the entry says.
 */
export async function appendDefectEntry(
  sequelize: Sequelize,
  transaction: Transaction,
  defect: Defect,
  fields: EntryFields,
  signature: Signature,
) {
  const content = {
    defect: { id: defect.id, contentHash: defect.contentHash },
    kind: fields.kind,
    text: fields.text,
    independentInspection: fields.independentInspection ?? false,
    authorisation: fields.authorisation ? (JSON.parse(fields.authorisation) as unknown) : null,
    category: fields.category ?? null,
    reference: fields.reference ?? null,
    limit: {
      at: fields.limitAt?.toISOString() ?? null,
      hours: fields.limitHours ?? null,
      flights: fields.limitFlights ?? null,
    },
    signer: signerOf(signature.row),
    signedWith: signature.which,
    signedAt: signature.at.toISOString(),
  };
  const { row } = await signContent(signature, {
    content,
    store: (sealed) =>
      DefectEntry.create(
        {
          defectId: defect.id,
          kind: fields.kind,
          text: fields.text,
          independentInspection: fields.independentInspection ?? false,
          authorisation: fields.authorisation ?? null,
          category: fields.category ?? null,
          reference: fields.reference ?? null,
          limitAt: fields.limitAt ?? null,
          limitHours: fields.limitHours ?? null,
          limitFlights: fields.limitFlights ?? null,
          signedBy: signature.row.id,
          signedAt: signature.at,
          signedWith: signature.which,
          ...sealed,
        },
        { transaction },
      ),
    trail: { sequelize, transaction },
    event: (entry, sealed) => ({
      action: `defect.${fields.kind}`,
      entity: 'defect_entry',
      entityId: String(entry.id),
      payload: { defectId: defect.id, contentHash: sealed.contentHash },
    }),
  });
  return row;
}

/**
 * A second person's independent inspection of the work on a defect (EASA Part-145 AMC on error capturing, from
 * memory): refused for anyone who did the work, then signed like any entry.
 */
export async function appendInspection(
  sequelize: Sequelize,
  transaction: Transaction,
  defect: Defect,
  doers: readonly number[],
  statement: string,
  signature: Signature,
) {
  if (doers.includes(signature.row.id)) {
    throw forbidden(refusal('defects.notIndependent'), 'not_independent');
  }
  return appendDefectEntry(
    sequelize,
    transaction,
    defect,
    { kind: 'inspection', text: statement },
    signature,
  );
}

/** The defect row, locked for the caller's transaction so entries on one defect are added one at a time. */
export const lockDefect = (id: number, transaction: Transaction) =>
  Defect.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });

export const entriesOf = (ids: number[], transaction?: Transaction) =>
  ids.length === 0
    ? Promise.resolve([])
    : DefectEntry.findAll({
        where: { defectId: { [Op.in]: ids } },
        order: [
          ['signedAt', 'ASC'],
          ['id', 'ASC'],
        ],
        ...(transaction ? { transaction } : {}),
      });

function entryView(
  e: DefectEntry,
  people: Map<number, { name: string; licenceNumber: string | null }>,
): DefectEntryView {
  const authority = parseAuthority(e.authorisation);
  return {
    id: e.id,
    kind: e.kind,
    text: e.text,
    independentInspection: e.independentInspection,
    category: e.category,
    reference: e.reference,
    limitAt: e.limitAt?.toISOString() ?? null,
    limitHours: e.limitHours === null ? null : Number(e.limitHours),
    limitFlights: e.limitFlights,
    signedBy: {
      id: e.signedBy,
      name: people.get(e.signedBy)?.name ?? 'unknown',
      licenceNumber: people.get(e.signedBy)?.licenceNumber ?? null,
    },
    signedAt: e.signedAt.toISOString(),
    contentHash: e.contentHash,
    authorisation: authority && authority !== 'legacy' ? signedTerms(authority) : null,
  };
}

/** Defects as people read them, each with its standing now from the one state rule. */
export async function defectViews(defects: Defect[], now = new Date()): Promise<DefectView[]> {
  if (defects.length === 0) return [];
  const entries = await entriesOf(defects.map((d) => d.id));
  const airframeIds = [...new Set(defects.map((d) => d.airframeId))];
  const airframes = await Airframe.findAll({ where: { id: { [Op.in]: airframeIds } } });
  const types = new Map(
    (
      await AircraftType.findAll({ where: { id: { [Op.in]: [...new Set(airframes.map((a) => a.typeId))] } } })
    ).map((t) => [t.id, t]),
  );
  const zones = new Map(
    await Promise.all(
      [...types.keys()].map(
        async (id) => [id, (await currentLimits(id))?.definition.timeZone ?? 'UTC'] as const,
      ),
    ),
  );
  const holdIds = defects.map((d) => d.holdId).filter((id): id is number => id !== null);
  const released = new Set(
    (holdIds.length
      ? await Hold.findAll({
          where: { id: { [Op.in]: holdIds }, releasedAt: { [Op.ne]: null } },
          attributes: ['id'],
        })
      : []
    ).map((h) => String(h.id)),
  );
  const people = new Map(
    (
      await Staff.findAll({
        where: {
          id: {
            [Op.in]: [...new Set([...defects.map((d) => d.raisedBy), ...entries.map((e) => e.signedBy)])],
          },
        },
        attributes: ['id', 'name', 'licenceNumber'],
      })
    ).map((s) => [s.id, s]),
  );
  const byId = new Map(airframes.map((a) => [a.id, a]));
  return defects.map((d) => {
    const airframe = byId.get(d.airframeId)!;
    const type = types.get(airframe.typeId);
    const state = defectState(statusDefect(d, entries), {
      now,
      typeCode: type?.code ?? '',
      usage: { hours: Number(airframe.hours), flights: Number(airframe.flights ?? 0) },
      timeZone: zones.get(airframe.typeId) ?? 'UTC',
      holdOpen: (id) => !released.has(id),
    });
    return {
      id: d.id,
      number: d.id,
      airframe: { id: airframe.id, fleetNumber: airframe.fleetNumber, typeCode: type?.code ?? '' },
      description: d.description,
      chapter: d.chapter,
      source: d.source,
      checkId: d.checkId,
      holdId: d.holdId,
      needsIndependentInspection: d.needsIndependentInspection,
      raisedBy: { id: d.raisedBy, name: people.get(d.raisedBy)?.name ?? 'unknown' },
      raisedAt: d.raisedAt.toISOString(),
      status: state.status,
      reason: state.reason,
      contentHash: d.contentHash,
      entries: entries.filter((e) => e.defectId === d.id).map((e) => entryView(e, people)),
    };
  });
}
