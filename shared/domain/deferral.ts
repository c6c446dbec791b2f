// Deferred defects: how long a defect may stay open under a deferral, and whether that limit has run out.
// MMEL/MEL rectification interval categories as commonly published (from memory; EASA CS-MMEL and the FAA MMEL
// policy letters are the usual references): A as the item's remarks say, B 3 consecutive calendar days, C 10,
// D 120, not counting the day of discovery. A deferral is valid up to its limit, not past it.
import { endOfLocalDay, endOfLocalDayAfter, localDay } from './local-time';
import { instantValue, joined, phrase, type Phrase } from '../i18n/phrase';

export const deferralCategories = ['A', 'B', 'C', 'D'] as const;
export type DeferralCategory = (typeof deferralCategories)[number];

/** Calendar days allowed after the day of discovery; A has no fixed interval (the item's remarks give it). */
export const categoryDays: Record<DeferralCategory, number | null> = { A: null, B: 3, C: 10, D: 120 };

/** Where a deferral ends: an instant, an airframe hours figure and a flight count; any may be absent. */
export interface DeferralLimit {
  /** Valid up to and including this instant. */
  at?: Date | string | null;
  /** Valid while the airframe's total hours are at or below this figure. */
  hours?: number | null;
  /** Valid while the airframe's flight count is at or below this figure. */
  flights?: number | null;
}

export interface Usage {
  hours: number;
  flights: number;
}

export interface DeferralRequest {
  category: DeferralCategory;
  /** Last local calendar day on which it is valid, "YYYY-MM-DD"; at most the category's interval. */
  untilDay?: string | null;
  /** Flight hours it may be carried for. */
  hours?: number | null;
  /** Flights it may be carried for. */
  flights?: number | null;
}

/** A refusal's reason is a phrase of the refusals catalogue: the server writes it in the asking screen's language. */
export type LimitOutcome = { ok: true; limit: DeferralLimit } | { ok: false; field: string; reason: Phrase };

/**
 * The limit of a deferral made now for a defect found at `discoveredAt`, from its category and any shorter limit
 * asked for. Refuses a day in the past, a day beyond the category's interval and a category A deferral with no
 * limit at all.
 */
export function deferralLimit(
  request: DeferralRequest,
  discoveredAt: Date,
  now: Date,
  usage: Usage,
  timeZone: string,
): LimitOutcome {
  const days = categoryDays[request.category];
  const categoryEnd = days === null ? null : endOfLocalDayAfter(discoveredAt, days, timeZone);
  let at: Date | null = categoryEnd;
  if (request.untilDay) {
    const asked = endOfLocalDay(request.untilDay, timeZone);
    if (asked.getTime() < now.getTime()) {
      return {
        ok: false,
        field: 'untilDay',
        reason: phrase('refusals:defects.deferralInPast', { day: { day: request.untilDay } }),
      };
    }
    if (categoryEnd && asked.getTime() > categoryEnd.getTime()) {
      return {
        ok: false,
        field: 'untilDay',
        reason: phrase('refusals:defects.deferralBeyondCategory', {
          category: request.category,
          count: days!,
          day: { day: localDay(categoryEnd, timeZone) },
        }),
      };
    }
    at = asked;
  }
  if (at && at.getTime() < now.getTime()) {
    return {
      ok: false,
      field: 'category',
      reason: phrase('refusals:defects.deferralRanOut', {
        category: request.category,
        at: { instant: at.toISOString(), timeZone },
      }),
    };
  }
  const limit: DeferralLimit = {
    at,
    hours: request.hours ? usage.hours + request.hours : null,
    flights: request.flights ? usage.flights + request.flights : null,
  };
  if (!limit.at && limit.hours === null && limit.flights === null) {
    return {
      ok: false,
      field: 'untilDay',
      reason: phrase('refusals:defects.deferralNeedsLimit'),
    };
  }
  return { ok: true, limit };
}

export interface DeferralState {
  expired: boolean;
  /** Its limit, for the board and the pilot: "until 5 Dec 2026, 23:59 UTC or until 1234.5 airframe hours". */
  until: Phrase;
  /** Why it ran out, when it did. */
  reason: Phrase | null;
}

/** Whether a deferral still holds now: valid up to its limit, not one instant or one hour or flight past it. */
export function deferralState(limit: DeferralLimit, now: Date, usage: Usage): DeferralState {
  const at = limit.at ? new Date(limit.at) : null;
  const parts: Phrase[] = [];
  if (at) parts.push(phrase('untilInstant', { at: instantValue(at) }));
  if (limit.hours != null) parts.push(phrase('untilHours', { hours: { decimal: limit.hours, places: 1 } }));
  if (limit.flights != null) parts.push(phrase('untilFlight', { flight: limit.flights }));
  let reason: Phrase | null = null;
  if (at && now.getTime() > at.getTime()) reason = phrase('limitInstantPassed', { at: instantValue(at) });
  else if (limit.hours != null && usage.hours > limit.hours)
    reason = phrase('limitHoursPassed', {
      hours: { decimal: usage.hours, places: 1 },
      limit: { decimal: limit.hours, places: 1 },
    });
  else if (limit.flights != null && usage.flights > limit.flights)
    reason = phrase('limitFlightsPassed', { flights: usage.flights, limit: limit.flights });
  return { expired: reason !== null, until: joined(parts, 'or'), reason };
}
