import type { BandCondition, CheckContext, Edge, LeakState, LimitBand, Verdict } from '../schemas/limits';

/** What a band condition is matched against: the check's context, plus a leak-rate reading's static or dynamic. */
export type BandContext = CheckContext & { leakState?: LeakState };

/** A stretch of the number line with explicit edges; null is unbounded on that side. */
export interface Interval {
  lower: Edge | null;
  upper: Edge | null;
}

export function contains(interval: Interval, value: number): boolean {
  const { lower, upper } = interval;
  const aboveLower = lower === null || value > lower.value || (lower.closed && value === lower.value);
  const belowUpper = upper === null || value < upper.value || (upper.closed && value === upper.value);
  return aboveLower && belowUpper;
}

export function isEmpty(interval: Interval): boolean {
  const { lower, upper } = interval;
  if (lower === null || upper === null) return false;
  if (lower.value > upper.value) return true;
  if (lower.value === upper.value) return !(lower.closed && upper.closed);
  // Open at both ends between two neighbouring numbers, nothing a reading can hold lies inside.
  return !lower.closed && !upper.closed && nextNumberUp(lower.value) === upper.value;
}

function nextNumberUp(value: number): number {
  if (value === 0) return Number.MIN_VALUE;
  const bits = new DataView(new ArrayBuffer(8));
  bits.setFloat64(0, value);
  bits.setBigInt64(0, bits.getBigInt64(0) + (value > 0 ? 1n : -1n));
  return bits.getFloat64(0);
}

/** The higher of two lower edges; at equal values the open one is the tighter. */
function tighterLower(a: Edge | null, b: Edge | null): Edge | null {
  if (a === null) return b;
  if (b === null) return a;
  if (a.value !== b.value) return a.value > b.value ? a : b;
  return { value: a.value, closed: a.closed && b.closed };
}

function tighterUpper(a: Edge | null, b: Edge | null): Edge | null {
  if (a === null) return b;
  if (b === null) return a;
  if (a.value !== b.value) return a.value < b.value ? a : b;
  return { value: a.value, closed: a.closed && b.closed };
}

export function intersects(a: Interval, b: Interval): boolean {
  return !isEmpty({ lower: tighterLower(a.lower, b.lower), upper: tighterUpper(a.upper, b.upper) });
}

export function conditionMatches(when: BandCondition | undefined, context: BandContext): boolean {
  if (when === undefined) return true;
  if (when.attitude !== undefined && when.attitude !== context.attitude) return false;
  if (when.systemPressure !== undefined && when.systemPressure !== context.systemPressure) return false;
  if (when.leakState !== undefined && when.leakState !== context.leakState) return false;
  return true;
}

export function applicableBands(bands: readonly LimitBand[], context: BandContext): LimitBand[] {
  return bands.filter((band) => conditionMatches(band.when, context));
}

const severity: Record<Verdict, number> = { in_limits: 0, service: 1, out_of_limits: 2 };

/** The most severe band; among equals the first in the checkpoint's order. */
export function worstBand(bands: readonly LimitBand[]): LimitBand | undefined {
  let worst: LimitBand | undefined;
  for (const band of bands) {
    if (worst === undefined || severity[band.verdict] > severity[worst.verdict]) worst = band;
  }
  return worst;
}

/** The verdict of a whole check: its most severe reading's; no reading at all is in limits. */
export const worstVerdict = (verdicts: readonly Verdict[]): Verdict =>
  verdicts.reduce<Verdict>((worst, v) => (severity[v] > severity[worst] ? v : worst), 'in_limits');
