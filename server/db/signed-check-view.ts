import { formatDay } from '@shared/domain/when';
import type { SignedTool } from '@shared/schemas/tools';
import type { CheckContext, Checkpoint, ReadingEntry, Unit, Verdict } from '@shared/schemas/limits';
import type { CheckKind } from '@shared/schemas/limits';
import { checkKindLabel, verdictLabel } from '@shared/schemas/plain';
import { englishPrint, type PrintWords } from '../pdf/print-words';
import { describeContext, describeEntry, localNumber } from '@shared/domain/words';
import { say } from '@shared/i18n/translate';
import { evaluateReading } from '@shared/domain/limits';
import { unitLabel } from '@shared/domain/units';
import { AppError, notFound, refusal } from '../errors/app-error';
import { limitsById, type LoadedLimits } from './limits-store';
import { Airframe, Check, Photo } from './models';
import { describeBand } from './reading-limits';

// A signed check as a printed record or an export row says it: built from the signed content (what the signer's
// PIN covered), with the words of the limits version it was judged against, never from today's staff rows.

/** The signed content of a check, as checks/check-record.ts seals it; later fields are optional. */
export interface SignedCheckContent {
  id: string;
  fleetNumber: string;
  registration?: string | null;
  kind: CheckKind;
  typeCode: string;
  limitsVersion: number;
  context: CheckContext;
  readings: {
    code: string;
    entry: ReadingEntry;
    verdict: Verdict;
    bandId: string;
    tool?: SignedTool | null;
  }[];
  servicing: SignedTopUp[];
  photos: { id: string; code: string; sha256: string }[];
  signer: { badge: string; name: string; licence: string | null };
  signedAt: string;
  airframeHours: number | null;
  airframeFlights?: number | null;
  flights?: number | null;
  note: string | null;
  correctsCheckId: string | null;
}

export interface SignedTopUp {
  code: string;
  system: string | null;
  quantityL: number;
  entered: { value: number; unit: string };
  fluidSpec: string;
  batch: string;
  levelBefore: ReadingEntry;
  /** Added by the fluid and tools work when present: the day the can was opened, the tools used. */
  canOpenedOn?: string | null;
  tools?: { name: string; serial?: string | null; calibrationDueOn?: string | null }[];
  /** The servicing cart as signed (the tools register's `SignedTool`), when one was named. */
  tool?: SignedTool | null;
}

export interface PrintedReading {
  code: string;
  label: string;
  system: string | null;
  entered: string;
  /** The number as entered, for exports; null for a position or an answer. */
  value: number | null;
  unit: string | null;
  verdict: Verdict;
  verdictWords: string;
  limitText: string;
  message: string;
  reference: string | null;
  /** The instrument the reading was taken with, as the register stood at signing, in words. */
  toolWords: string | null;
}

export interface PrintedTopUp extends SignedTopUp {
  label: string;
  quantityWords: string;
  levelBeforeWords: string;
}

export interface SignedCheckView {
  id: string;
  kind: CheckKind;
  kindWords: string;
  verdict: Verdict;
  verdictWords: string;
  fleetNumber: string;
  /** The mark as signed; for a check signed before the airframe had one, its mark now (said so in print). */
  registration: string | null;
  registrationSigned: boolean;
  serial: string;
  typeCode: string;
  typeName: string;
  limitsVersion: number;
  airframeHours: number | null;
  airframeFlights: number | null;
  /** The conditions it was taken in, e.g. "On wheels · System pressure relieved · 20.0 °C"; empty if none. */
  contextWords: string;
  readings: PrintedReading[];
  servicing: PrintedTopUp[];
  photos: { id: string; label: string; sha256: string; storedName: string | null; mimeType: string | null }[];
  note: string | null;
  correctsCheckId: string | null;
  signer: SignedCheckContent['signer'];
  signedAt: string;
  contentHash: string;
}

/** The band in words, or for a pre-charge the corrected expected pressure, from the version it was judged by. */
function limitWords(
  checkpoint: Checkpoint | undefined,
  reading: SignedCheckContent['readings'][number],
  context: CheckContext,
  words: PrintWords,
) {
  const { pdf } = words;
  if (!checkpoint) return { limitText: pdf('view.notInVersion'), message: '' };
  const band = checkpoint.bands.find((b) => b.id === reading.bandId);
  let evaluation;
  try {
    evaluation = evaluateReading(checkpoint, { ...reading.entry, context });
  } catch {
    evaluation = null;
  }
  const unit = checkpoint.unit ? ` ${unitLabel(checkpoint.unit)}` : '';
  const limitText = band
    ? describeBand(band, checkpoint, words.t)
    : checkpoint.precharge && evaluation?.expected !== undefined
      ? say(words.t, 'words:band.precharge', {
          expected: `${localNumber(evaluation.expected, 1, words.t)}${unit}`,
          tolerance: `${checkpoint.precharge.tolerance}${unit}`,
        })
      : pdf('view.noBand');
  return { limitText, message: evaluation?.message ?? '' };
}

function printedReading(
  reading: SignedCheckContent['readings'][number],
  checkpoints: Map<string, Checkpoint>,
  context: CheckContext,
  words: PrintWords,
): PrintedReading {
  const { t, pdf, language } = words;
  const tool = reading.tool;
  const checkpoint = checkpoints.get(reading.code);
  const entry = reading.entry;
  return {
    code: reading.code,
    label: checkpoint?.label ?? reading.code,
    system: checkpoint?.system ?? null,
    entered: describeEntry(entry, t),
    value: 'value' in entry ? entry.value : null,
    unit: 'value' in entry ? unitLabel(entry.unit) : null,
    verdict: reading.verdict,
    verdictWords: verdictLabel(reading.verdict, t),
    ...limitWords(checkpoint, reading, context, words),
    reference: checkpoint?.reference ?? null,
    toolWords: tool
      ? pdf('view.tool', { number: tool.number, description: tool.description }) +
        (tool.serial ? pdf('view.toolSerial', { serial: tool.serial }) : '') +
        pdf('view.toolCalibration', { day: formatDay(tool.calibrationDue, language) })
      : null,
  };
}

type CheckRow = Pick<Check, 'verdict' | 'contentHash' | 'signedContent'>;
type AirframeRow = Pick<Airframe, 'serial' | 'registration'>;
type PhotoRow = Pick<Photo, 'id' | 'storedName' | 'mimeType'>;

/**
 * One signed check in words, from its row, its airframe as now, its limits version and its photo rows; the words
 * in the language of `words` (English by default: exports keep their values as recorded).
 */
export function viewOfSigned(
  check: CheckRow,
  airframe: AirframeRow,
  limits: LoadedLimits,
  photoRows: PhotoRow[],
  words: PrintWords = englishPrint(),
): SignedCheckView {
  const { t, pdf } = words;
  const valueWords = (value: number, unit: Unit) => describeEntry({ value, unit }, t);
  const signed = JSON.parse(check.signedContent!) as SignedCheckContent;
  const checkpoints = new Map(limits.definition.checkpoints.map((c) => [c.code, c]));
  const labelOf = (code: string) => checkpoints.get(code)?.label ?? code;
  return {
    id: signed.id,
    kind: signed.kind,
    kindWords: checkKindLabel(signed.kind, t),
    verdict: check.verdict,
    verdictWords: verdictLabel(check.verdict, t),
    fleetNumber: signed.fleetNumber,
    registration: signed.registration ?? airframe.registration ?? null,
    registrationSigned: Boolean(signed.registration),
    serial: airframe.serial,
    typeCode: signed.typeCode,
    typeName: limits.definition.name,
    limitsVersion: signed.limitsVersion,
    airframeHours: signed.airframeHours ?? null,
    airframeFlights: signed.airframeFlights ?? signed.flights ?? null,
    contextWords: describeContext(signed.context, '', t),
    readings: signed.readings.map((r) => printedReading(r, checkpoints, signed.context, words)),
    servicing: signed.servicing.map((s) => ({
      ...s,
      label: labelOf(s.code),
      quantityWords: pdf('view.quantity', {
        litres: valueWords(s.quantityL, 'L'),
        entered: valueWords(s.entered.value, s.entered.unit as Unit),
      }),
      levelBeforeWords: describeEntry(s.levelBefore, t),
      tools:
        s.tools ??
        (s.tool
          ? [
              {
                name: pdf('view.tool', { number: s.tool.number, description: s.tool.description }),
                serial: s.tool.serial,
                calibrationDueOn: s.tool.calibrationDue,
              },
            ]
          : []),
    })),
    photos: signed.photos.map((p) => {
      const row = photoRows.find((r) => r.id === p.id);
      return {
        id: p.id,
        label: labelOf(p.code),
        sha256: p.sha256,
        storedName: row?.storedName ?? null,
        mimeType: row?.mimeType ?? null,
      };
    }),
    note: signed.note,
    correctsCheckId: signed.correctsCheckId,
    signer: signed.signer,
    signedAt: signed.signedAt,
    contentHash: check.contentHash,
  };
}

/** The signed check `id`, in words, from its signed content. */
export async function signedCheckView(
  id: string,
  words: PrintWords = englishPrint(),
): Promise<SignedCheckView> {
  const check = await Check.findByPk(id);
  if (!check) throw notFound(refusal('checks.checkNotInRecords'));
  if (!check.signedContent)
    throw new AppError(409, 'record_incomplete', refusal('checks.noSignedContent'), { checkId: id });
  const [airframe, limits, photoRows] = await Promise.all([
    Airframe.findByPk(check.airframeId),
    limitsById(check.limitsVersionId),
    Photo.findAll({ where: { checkId: id } }),
  ]);
  if (!airframe || !limits)
    throw new AppError(500, 'record_incomplete', refusal('checks.rowsMissing'), { checkId: id });
  return viewOfSigned(check, airframe, limits, photoRows, words);
}
