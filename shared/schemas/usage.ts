import { z } from 'zod';
import { pinSchema } from './auth';

/**
 * The airframe's figures as read from the aircraft (hours meter, flight and landing counts) at the end of a flight:
 * totals, not what was flown. Hours in tenths, as the meter shows them.
 */
export const usageFiguresSchema = z
  .object({
    hours: z
      .number({ message: 'common:validation.airframeHours' })
      .min(0, 'Airframe hours cannot be below zero.')
      .max(999_999.9, 'Airframe hours are at most 999 999.9.')
      .multipleOf(0.1, 'Enter the hours to one decimal place, as the meter shows them.'),
    flights: z
      .number({ message: 'common:validation.flights' })
      .int('Flights are a whole number.')
      .min(0, 'Flights cannot be below zero.')
      .max(9_999_999),
    landings: z
      .number({ message: 'common:validation.landings' })
      .int('Landings are a whole number.')
      .min(0, 'Landings cannot be below zero.')
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
