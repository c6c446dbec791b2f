import type { StoredCheck, StoredEvent, StoredReading } from './audit.repository';
import { canonicalJson, sha256 } from '../security/hashing';

interface SignedReading {
  code: string;
  entry: unknown;
  verdict: string;
  bandId: string;
}

/** The columns of a stored check that its signature covers. */
export type StoredCheckRow = Pick<StoredCheck, 'id' | 'kind' | 'verdict' | 'contentHash' | 'signedContent'>;
/** The columns of a stored reading that its check's signature covers, in `seq` order. */
export type StoredReadingRow = Pick<
  StoredReading,
  'checkpointCode' | 'entry' | 'value' | 'verdict' | 'bandId'
>;

const parsed = (json: string): unknown => {
  try {
    return JSON.parse(json);
  } catch {
    return undefined;
  }
};

/** The first field of a stored reading that differs from what was signed, or null. */
function changedField(row: StoredReadingRow, signed: SignedReading): string | null {
  if (row.checkpointCode !== signed.code) return 'checkpoint';
  const entry = parsed(row.entry) as { value?: number; answer?: boolean } | undefined;
  if (entry === undefined || canonicalJson(entry) !== canonicalJson(signed.entry)) return 'entry';
  if (row.verdict !== signed.verdict) return 'verdict';
  if (row.bandId !== signed.bandId) return 'band';
  const value = entry.value ?? (entry.answer === undefined ? null : entry.answer ? 1 : 0);
  if (value !== null && row.value !== value) return 'value';
  return null;
}

/**
 * Why a stored check and its readings no longer match what was signed, or null when they do. Pure: the rows come
 * from the caller, so every way a record can be tampered with is reachable without a database.
 */
export function recordProblem(
  checkId: string,
  check: StoredCheckRow | null,
  readings: StoredReadingRow[],
): string | null {
  if (!check) return `check ${checkId} is missing`;
  if (!check.signedContent) return `check ${checkId} has no signed content`;
  if (sha256(check.signedContent) !== check.contentHash)
    return `check ${checkId}: the signed content does not match its signature hash`;
  const signed = parsed(check.signedContent) as { readings?: SignedReading[]; kind?: string } | undefined;
  if (!signed || !Array.isArray(signed.readings)) return `check ${checkId}: its signed content is unreadable`;
  if (signed.kind !== check.kind) return `check ${checkId}: its kind was changed after signing`;
  if (readings.length !== signed.readings.length)
    return `check ${checkId}: readings were added or removed after signing`;
  for (const [i, row] of readings.entries()) {
    const s = signed.readings[i]!;
    const field = changedField(row, s);
    if (field) return `check ${checkId}: reading "${s.code}" was changed after signing (its ${field})`;
  }
  const worst = readings.some((r) => r.verdict === 'out_of_limits')
    ? 'out_of_limits'
    : readings.some((r) => r.verdict === 'service')
      ? 'service'
      : 'in_limits';
  if (worst !== check.verdict) return `check ${checkId}: its verdict was changed after signing`;
  return null;
}

/** What a `check.signed` event says about its check that the check's rows alone cannot show. */
export function signedEventProblem(
  event: Pick<StoredEvent, 'entityId' | 'payload'>,
  check: StoredCheckRow | null,
): string | null {
  if (!check) return `check ${event.entityId} was removed`;
  const payload = parsed(event.payload) as { contentHash?: string } | undefined;
  if (payload?.contentHash !== check.contentHash)
    return `check ${event.entityId}: its signature hash was replaced`;
  return null;
}
