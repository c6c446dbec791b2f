import type { ReadingEntry } from '@shared/schemas/limits';
import type { StoredReading, StoredServicing } from '@shared/schemas/checks';
import type { SignedTool } from '@shared/schemas/tools';
import { AppError, notFound, refusal } from '../errors/app-error';
import type { Attributes } from 'sequelize';
import { limitsById, type LoadedLimits } from './limits-store';
import { Airframe, Check, Hold, Photo, Reading, ServicingEntry, Staff } from './models';

/** The rows that make up one signed check; the kiosk result and the auditor's full record are both built from them. */
export async function loadCheckRows(id: string) {
  const check = await Check.findByPk(id);
  if (!check) throw notFound(refusal('checks.checkNotInRecords'));
  const [airframe, signer, readings, limits, hold, servicing, photos] = await Promise.all([
    Airframe.findByPk(check.airframeId),
    Staff.findByPk(check.signedBy),
    Reading.findAll({ where: { checkId: id }, order: [['seq', 'ASC']] }),
    limitsById(check.limitsVersionId),
    Hold.findOne({ where: { checkId: id } }),
    ServicingEntry.findAll({ where: { checkId: id }, order: [['id', 'ASC']] }),
    Photo.findAll({ where: { checkId: id }, order: [['uploadedAt', 'ASC']] }),
  ]);
  if (!airframe || !signer || !limits) {
    throw new AppError(500, 'record_incomplete', refusal('checks.rowsMissing'), { checkId: id });
  }
  return { check, airframe, signer, readings, limits, hold, servicing, photos };
}

/** The same rows as plain values: read back as model instances, or exactly as the signing path just wrote them. */
export interface CheckRows {
  check: Attributes<Check>;
  airframe: Pick<Attributes<Airframe>, 'id' | 'fleetNumber'>;
  signer: Pick<Attributes<Staff>, 'id' | 'name' | 'badgeNumber' | 'licenceNumber'>;
  readings: Omit<Attributes<Reading>, 'id'>[];
  limits: LoadedLimits;
  hold: Attributes<Hold> | null;
  servicing: Omit<Attributes<ServicingEntry>, 'id'>[];
  photos: Attributes<Photo>[];
}

export function readingView(
  row: Omit<Attributes<Reading>, 'id'>,
  label: string,
  photos: Attributes<Photo>[],
): StoredReading {
  return {
    code: row.checkpointCode,
    label,
    entry: JSON.parse(row.entry) as ReadingEntry,
    value: row.value,
    unit: row.unit,
    verdict: row.verdict,
    bandId: row.bandId,
    message: row.message,
    action: row.action,
    expected: row.expected,
    tool: row.tool ? (JSON.parse(row.tool) as SignedTool) : null,
    photos: photos
      .filter((p) => p.checkpointCode === row.checkpointCode)
      .map((p) => ({
        id: p.id,
        mimeType: p.mimeType,
        sizeBytes: p.sizeBytes,
        sha256: p.sha256,
        uploadedAt: p.uploadedAt.toISOString(),
      })),
  };
}

export function servicingView(entry: Omit<Attributes<ServicingEntry>, 'id'>): StoredServicing {
  return {
    code: entry.checkpointCode,
    system: entry.system,
    quantityL: entry.quantityL,
    entered: { value: entry.enteredValue, unit: entry.enteredUnit },
    fluidSpec: entry.fluidSpec,
    batch: entry.batch,
    canOpenedOn: entry.canOpenedOn ?? null,
    levelBefore: JSON.parse(entry.levelBefore) as ReadingEntry,
    tool: entry.tool ? (JSON.parse(entry.tool) as SignedTool) : null,
    addedAt: entry.addedAt.toISOString(),
  };
}
