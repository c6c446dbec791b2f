import type { CheckKind, ValidityWindow, Verdict } from '../schemas/limits';

export type AirframeState = 'released' | 'due' | 'in_progress' | 'hold' | 'not_checked';

export interface SignedCheck {
  id: string;
  kind: CheckKind;
  signedAt: Date | string;
  /** Staff id of the mechanic who signed. */
  signedBy: string;
  /** The check's overall verdict: the worst of its readings. */
  verdict: Verdict;
  /** Flights flown since the check was signed; counts against a window given in flights. */
  flightsSince?: number;
}

export interface CheckInProgress {
  id: string;
  kind: CheckKind;
  startedAt: Date | string;
  startedBy: string;
}

export interface Countersign {
  by: string;
  at: Date | string;
  decision: 'release' | 'keep';
}

export interface Hold {
  id: string;
  /** The signed check whose finding raised the hold. */
  checkId?: string;
  openedAt: Date | string;
  reason: string;
  /** Who signed the check that raised the hold; that person cannot countersign its release. */
  raisedBy: string;
  countersigns?: readonly Countersign[];
}

export interface AirframeStatusInput {
  now: Date | string;
  /** The type's time zone, for windows that end at a local clock time. */
  timeZone: string;
  validity: Partial<Record<CheckKind, ValidityWindow>>;
  checks: readonly SignedCheck[];
  inProgress?: readonly CheckInProgress[];
  holds?: readonly Hold[];
}

export interface DueItem {
  kind: CheckKind;
  /** The instant the latest check of this kind stops being valid; null when only a flight count limits it, or none was signed. */
  at: Date | null;
  expired: boolean;
  reason: string;
}

export interface AirframeStatus {
  state: AirframeState;
  reasons: string[];
  /** Until when the release holds (exclusive), when released. */
  validUntil?: Date;
  due: DueItem[];
  openHolds: string[];
}

function toDate(at: Date | string): Date {
  const date = at instanceof Date ? at : new Date(at);
  if (Number.isNaN(date.getTime())) throw new Error(`'${String(at)}' is not a date and time.`);
  return date;
}

interface LocalParts {
  year: number;
  month: number;
  day: number;
  hour: number;
  minute: number;
  second: number;
}

// Building an Intl.DateTimeFormat costs far more than using one; the board derives hundreds of airframes per read.
const formats = new Map<string, Intl.DateTimeFormat>();

function localParts(date: Date, timeZone: string): LocalParts {
  let format = formats.get(timeZone);
  if (!format) {
    format = new Intl.DateTimeFormat('en-GB', {
      timeZone,
      hourCycle: 'h23',
      year: 'numeric',
      month: 'numeric',
      day: 'numeric',
      hour: 'numeric',
      minute: 'numeric',
      second: 'numeric',
    });
    formats.set(timeZone, format);
  }
  const parts = Object.fromEntries(format.formatToParts(date).map((part) => [part.type, Number(part.value)]));
  return {
    year: parts.year ?? 0,
    month: parts.month ?? 0,
    day: parts.day ?? 0,
    hour: parts.hour ?? 0,
    minute: parts.minute ?? 0,
    second: parts.second ?? 0,
  };
}

/** Milliseconds the zone's clock is ahead of UTC at this instant. */
function zoneOffsetMs(date: Date, timeZone: string): number {
  const p = localParts(date, timeZone);
  const wholeSeconds = Math.floor(date.getTime() / 1000) * 1000;
  return Date.UTC(p.year, p.month - 1, p.day, p.hour, p.minute, p.second) - wholeSeconds;
}

function localToInstant(
  year: number,
  month: number,
  day: number,
  hour: number,
  minute: number,
  timeZone: string,
): Date {
  const asIfUtc = Date.UTC(year, month - 1, day, hour, minute);
  const firstGuess = asIfUtc - zoneOffsetMs(new Date(asIfUtc), timeZone);
  // Re-read the offset at the guess, in case a daylight-saving change lies between the two.
  return new Date(asIfUtc - zoneOffsetMs(new Date(firstGuess), timeZone));
}

/** The first instant after `after` at which the zone's clock shows hh:mm. */
function nextLocalTime(after: Date, hhmm: string, timeZone: string): Date {
  const [hour = 0, minute = 0] = hhmm.split(':').map(Number);
  const today = localParts(after, timeZone);
  const candidate = localToInstant(today.year, today.month, today.day, hour, minute, timeZone);
  if (candidate.getTime() > after.getTime()) return candidate;
  const tomorrow = new Date(Date.UTC(today.year, today.month - 1, today.day + 1));
  return localToInstant(
    tomorrow.getUTCFullYear(),
    tomorrow.getUTCMonth() + 1,
    tomorrow.getUTCDate(),
    hour,
    minute,
    timeZone,
  );
}

/**
 * The instant a check stops being valid: the earliest of its hours limit and its local clock limit; null when
 * neither applies. Valid up to, not including, this instant.
 */
export function checkValidUntil(
  signedAt: Date | string,
  window: ValidityWindow,
  timeZone: string,
): Date | null {
  const signed = toDate(signedAt);
  const limits: number[] = [];
  if (window.hours !== undefined) limits.push(signed.getTime() + window.hours * 3_600_000);
  if (window.untilLocalTime !== undefined)
    limits.push(nextLocalTime(signed, window.untilLocalTime, timeZone).getTime());
  return limits.length === 0 ? null : new Date(Math.min(...limits));
}

function latestCountersign(hold: Hold, now: Date): Countersign | undefined {
  const valid = (hold.countersigns ?? []).filter(
    (sign) => sign.by !== hold.raisedBy && toDate(sign.at).getTime() <= now.getTime(),
  );
  return valid.sort((a, b) => toDate(a.at).getTime() - toDate(b.at).getTime()).at(-1);
}

/** Open until its latest countersign, by someone other than the check's signer, is a release. */
export function isHoldOpen(hold: Hold, now: Date | string): boolean {
  const at = toDate(now);
  if (toDate(hold.openedAt).getTime() > at.getTime()) return false;
  return latestCountersign(hold, at)?.decision !== 'release';
}

export interface CountersignDecision {
  allowed: boolean;
  reason?: string;
}

/** A countersign is a second person's judgement; the signer of the check cannot give it. */
export function canCountersign(hold: Pick<Hold, 'raisedBy'>, countersignerId: string): CountersignDecision {
  if (countersignerId === hold.raisedBy) {
    return {
      allowed: false,
      reason: 'The person who signed the check cannot countersign its hold. Ask another shift lead.',
    };
  }
  return { allowed: true };
}

function latestOf(checks: readonly SignedCheck[], kind: CheckKind): SignedCheck | undefined {
  return checks
    .filter((check) => check.kind === kind)
    .sort((a, b) => toDate(a.signedAt).getTime() - toDate(b.signedAt).getTime())
    .at(-1);
}

function dueItem(
  check: SignedCheck,
  kind: CheckKind,
  window: ValidityWindow,
  timeZone: string,
  now: Date,
): DueItem {
  const at = checkValidUntil(check.signedAt, window, timeZone);
  const flightsUsed = window.flights !== undefined && (check.flightsSince ?? 0) >= window.flights;
  const timeUsed = at !== null && now.getTime() >= at.getTime();
  const label = kind.replaceAll('_', '-');
  const reason = flightsUsed
    ? `${label} of ${toDate(check.signedAt).toISOString()} used up by ${check.flightsSince ?? 0} flight(s)`
    : timeUsed
      ? `${label} of ${toDate(check.signedAt).toISOString()} expired at ${at.toISOString()}`
      : at === null
        ? `${label} valid for ${window.flights ?? 'unlimited'} flight(s)`
        : `${label} valid until ${at.toISOString()}`;
  return { kind, at, expired: flightsUsed || timeUsed, reason };
}

/**
 * The airframe's state, in this order of precedence: any open hold (including a signed out-of-limits check with no
 * hold recorded against it) -> hold; else any check in progress -> in_progress; else no pre-flight ever signed ->
 * not_checked; else the latest pre-flight expired (valid up to, not including, its expiry instant) or not wholly
 * in limits -> due; else released. A later passing check never closes a hold; only a countersigned release does.
 */
export function deriveAirframeStatus(input: AirframeStatusInput): AirframeStatus {
  const now = toDate(input.now);
  const holds = input.holds ?? [];
  const inProgress = input.inProgress ?? [];
  const signed = input.checks.filter((check) => toDate(check.signedAt).getTime() <= now.getTime());

  const due: DueItem[] = [];
  for (const [kind, window] of Object.entries(input.validity) as [CheckKind, ValidityWindow | undefined][]) {
    const latest = latestOf(signed, kind);
    if (window === undefined) continue;
    if (latest === undefined) {
      if (kind === 'pre_flight') due.push({ kind, at: null, expired: true, reason: 'no pre-flight signed' });
      continue;
    }
    due.push(dueItem(latest, kind, window, input.timeZone, now));
  }

  const openHolds = holds.filter((hold) => isHoldOpen(hold, now));
  const heldCheckIds = new Set(holds.map((hold) => hold.checkId).filter((id) => id !== undefined));
  const unheldFailures = signed.filter(
    (check) => check.verdict === 'out_of_limits' && !heldCheckIds.has(check.id),
  );
  if (openHolds.length > 0 || unheldFailures.length > 0) {
    return {
      state: 'hold',
      reasons: [
        ...openHolds.map((hold) => `hold open: ${hold.reason}`),
        ...unheldFailures.map((check) => `${check.kind.replaceAll('_', '-')} ${check.id} out of limits`),
      ],
      due,
      openHolds: openHolds.map((hold) => hold.id),
    };
  }
  if (inProgress.length > 0) {
    return {
      state: 'in_progress',
      reasons: inProgress.map(
        (check) =>
          `${check.kind.replaceAll('_', '-')} in progress since ${toDate(check.startedAt).toISOString()}`,
      ),
      due,
      openHolds: [],
    };
  }
  const preFlight = latestOf(signed, 'pre_flight');
  if (preFlight === undefined)
    return { state: 'not_checked', reasons: ['no pre-flight signed'], due, openHolds: [] };

  const window = input.validity.pre_flight ?? {};
  const preFlightDue = dueItem(preFlight, 'pre_flight', window, input.timeZone, now);
  if (preFlightDue.expired) return { state: 'due', reasons: [preFlightDue.reason], due, openHolds: [] };
  if (preFlight.verdict !== 'in_limits') {
    return {
      state: 'due',
      reasons: [`latest pre-flight found ${preFlight.verdict.replaceAll('_', ' ')}: service and check again`],
      due,
      openHolds: [],
    };
  }
  const status: AirframeStatus = { state: 'released', reasons: [preFlightDue.reason], due, openHolds: [] };
  if (preFlightDue.at !== null) status.validUntil = preFlightDue.at;
  return status;
}
