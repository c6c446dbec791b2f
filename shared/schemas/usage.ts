import { z } from 'zod';
import { pinSchema } from './auth';

/**
 * The airframe's figures as read from the aircraft (hours meter, flight and landing counts) at the end of a flight:
 * totals, not what was flown. Hours in tenths, as the meter shows them.
 */
export const usageFiguresSchema = z
  .object({
    hours: z
      .number({ message: 'words:validation.airframeHours' })
      .min(0, 'words:validation.hoursNotBelowZero')
      .max(999_999.9, 'words:validation.hoursAtMost')
      .multipleOf(0.1, 'words:validation.hoursTenths'),
    flights: z
      .number({ message: 'words:validation.flights' })
      .int('words:validation.wholeFlights')
      .min(0, 'words:validation.flightsNotBelowZero')
      .max(9_999_999),
    landings: z
      .number({ message: 'words:validation.landings' })
      .int('words:validation.wholeLandings')
      .min(0, 'words:validation.landingsNotBelowZero')
      .max(9_999_999),
  })
  .strict();
export type UsageFigures = z.infer<typeof usageFiguresSchema>;

/** The pilot's close of a flight: the figures after it, signed with the pilot's PIN. */
export const closeFlightSchema = z.object({ usage: usageFiguresSchema, pin: pinSchema }).strict();
export type CloseFlightInput = z.infer<typeof closeFlightSchema>;

/** One recorded set of figures, as the records show it. */
export interface UsageEntry {
  id: number;
  airframeId: number;
  recordedAt: string;
  recordedBy: { id: number; name: string };
  /** After-flight check or the pilot's close of a flight. */
  source: 'after_flight_check' | 'flight_close';
  checkId: string | null;
  figures: UsageFigures;
  /** What this entry adds to the one before it. */
  flown: { hours: number; flights: number; landings: number };
}
