import type { Attitude } from '../schemas/limits';
import { phrase, type Phrase } from '../i18n/phrase';

/** Fluid put into (positive litres) or drawn off (negative litres, e.g. drained or sampled) one system. */
export interface ServicingEvent {
  at: Date | string;
  system: string;
  litres: number;
  airframeHours?: number;
}

/** Hours flown by the airframe, recorded at the end of a flight or as a day's total. */
export interface FlightHoursEntry {
  at: Date | string;
  flightHours: number;
}

export interface ConsumptionInput {
  system: string;
  events: readonly ServicingEvent[];
  flights: readonly FlightHoursEntry[];
  /** The window is (windowEnd - windowDays, windowEnd]: the end instant counts, the start does not. */
  windowEnd: Date | string;
  windowDays: number;
  /** The type's consumptionAlertLPerFh. */
  alertLPerFh: number;
}

export interface ConsumptionAlert {
  kind: 'rate_at_or_above_threshold' | 'fluid_without_flying';
  message: Phrase;
}

export interface ConsumptionSummary {
  system: string;
  from: Date;
  to: Date;
  litresAdded: number;
  flightHours: number;
  /** null when nothing was flown in the window. */
  litresPerFlightHour: number | null;
  litresPerDay: number;
  alert: ConsumptionAlert | null;
}

const dayMs = 24 * 60 * 60 * 1000;

function toDate(at: Date | string): Date {
  const date = at instanceof Date ? at : new Date(at);
  if (Number.isNaN(date.getTime())) throw new Error(`'${String(at)}' is not a date and time.`);
  return date;
}

function within(at: Date | string, from: Date, to: Date): boolean {
  const time = toDate(at).getTime();
  return time > from.getTime() && time <= to.getTime();
}

function sum(values: number[]): number {
  return values.reduce((total, value) => total + value, 0);
}

function assertFinite(name: string, value: number): void {
  if (!Number.isFinite(value)) throw new Error(`${name} must be a finite number, got ${value}.`);
}

/**
 * Fluid added to one system per flight hour and per day over a rolling window. Alerts at or above the type's
 * threshold (a leak shows as a trend before it shows as a low level), and when fluid went in with nothing flown.
 */
export function consumptionOverWindow(input: ConsumptionInput): ConsumptionSummary {
  const { system, events, flights, windowDays, alertLPerFh } = input;
  if (!(windowDays > 0) || !Number.isFinite(windowDays))
    throw new Error(`The window must be a positive number of days, got ${windowDays}.`);
  assertFinite('The alert threshold', alertLPerFh);
  const to = toDate(input.windowEnd);
  const from = new Date(to.getTime() - windowDays * dayMs);
  const added = events.filter(
    (event) => event.system === system && event.litres > 0 && within(event.at, from, to),
  );
  added.forEach((event) => assertFinite('Litres added', event.litres));
  const flown = flights.filter((flight) => within(flight.at, from, to));
  flown.forEach((flight) => {
    assertFinite('Flight hours', flight.flightHours);
    if (flight.flightHours < 0)
      throw new Error(`Flight hours cannot be negative, got ${flight.flightHours}.`);
  });
  const litresAdded = sum(added.map((event) => event.litres));
  const flightHours = sum(flown.map((flight) => flight.flightHours));
  const litresPerFlightHour = flightHours > 0 ? litresAdded / flightHours : null;
  let alert: ConsumptionAlert | null = null;
  if (litresPerFlightHour !== null && litresPerFlightHour >= alertLPerFh) {
    alert = {
      kind: 'rate_at_or_above_threshold',
      message: phrase('consumptionRate', {
        system: { system },
        rate: { decimal: litresPerFlightHour, places: 3 },
        days: windowDays,
        alert: { decimal: alertLPerFh, places: (String(alertLPerFh).split('.')[1] ?? '').length },
      }),
    };
  } else if (litresPerFlightHour === null && litresAdded > 0) {
    alert = {
      kind: 'fluid_without_flying',
      message: phrase('consumptionNoFlying', {
        system: { system },
        litres: { decimal: litresAdded, places: 2 },
        days: windowDays,
      }),
    };
  }
  return {
    system,
    from,
    to,
    litresAdded,
    flightHours,
    litresPerFlightHour,
    litresPerDay: litresAdded / windowDays,
    alert,
  };
}

/** A reservoir level as read at a check, in litres. */
export interface LevelCheck {
  at: Date | string;
  system: string;
  levelL: number;
  attitude?: Attitude;
}

export interface LevelDropInput {
  system: string;
  checks: readonly LevelCheck[];
  events: readonly ServicingEvent[];
  flights: readonly FlightHoursEntry[];
  /** A drop up to this many litres is reading scatter and temperature, not a loss. */
  toleranceL?: number;
}

export interface LevelDropAlert {
  system: string;
  from: LevelCheck;
  to: LevelCheck;
  /** The level the later check should have shown, in litres, given fluid added or drawn in between. */
  expectedL: number;
  dropL: number;
  message: Phrase;
}

export const defaultLevelDropToleranceL = 0.2;

/**
 * Consecutive checks of the same system and attitude with nothing flown in between: a level lower than the first
 * level plus fluid added (minus fluid drawn) by more than the tolerance means fluid went somewhere it should not.
 */
export function unexplainedLevelDrops(input: LevelDropInput): LevelDropAlert[] {
  const { system, events, flights } = input;
  const toleranceL = input.toleranceL ?? defaultLevelDropToleranceL;
  if (!(toleranceL >= 0) || !Number.isFinite(toleranceL))
    throw new Error(`The tolerance must be zero or more litres, got ${toleranceL}.`);
  const checks = input.checks
    .filter((check) => check.system === system)
    .map((check) => ({ check, time: toDate(check.at).getTime() }))
    .sort((a, b) => a.time - b.time);
  const alerts: LevelDropAlert[] = [];
  for (let index = 1; index < checks.length; index += 1) {
    const previous = checks[index - 1];
    const current = checks[index];
    if (previous === undefined || current === undefined) continue;
    // Levels read in different attitudes sit against different marks and cannot be compared.
    if (previous.check.attitude !== current.check.attitude) continue;
    const from = new Date(previous.time);
    const to = new Date(current.time);
    const flownBetween = flights.some((flight) => flight.flightHours > 0 && within(flight.at, from, to));
    if (flownBetween) continue;
    const change = sum(
      events
        .filter((event) => event.system === system && within(event.at, from, to))
        .map((event) => event.litres),
    );
    const expectedL = previous.check.levelL + change;
    const dropL = expectedL - current.check.levelL;
    if (dropL > toleranceL) {
      alerts.push({
        system,
        from: previous.check,
        to: current.check,
        expectedL,
        dropL,
        message: phrase('levelFellBetweenChecks', {
          system: { system },
          litres: { decimal: dropL, places: 2 },
        }),
      });
    }
  }
  return alerts;
}
