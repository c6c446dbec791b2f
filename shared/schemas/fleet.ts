import { z } from 'zod';
import { freeText } from './free-text';

/** A print sheet's `?ids=3,7`: which airframes or staff to print; absent prints them all. */
export const printIdsSchema = (what: string) =>
  z
    .string()
    .regex(/^\d+(,\d+)*$/, `ids is a comma-separated list of ${what} ids.`)
    .transform((s) => s.split(',').map(Number))
    .optional();

const fleetNumberSchema = z
  .string()
  .trim()
  .regex(
    /^[A-Za-z0-9][A-Za-z0-9-]{0,31}$/,
    'A fleet number is up to 32 letters, digits or dashes, e.g. T-09.',
  );

/**
 * A registration mark as the register writes it: letters and digits, at most one dash, 3 to 10 characters
 * ("QX-TNA", "N123AB"). Typed in any case, kept in capitals.
 */
export const registrationSchema = z
  .string()
  .trim()
  .toUpperCase()
  .regex(
    /^(?=.{3,10}$)[A-Z0-9]+(-[A-Z0-9]+)?$/,
    'A registration mark is 3 to 10 letters or digits with at most one dash, e.g. QX-TNA.',
  );

export const airframeInputSchema = z
  .object({
    fleetNumber: fleetNumberSchema,
    serial: freeText('The serial number', { min: 1, minMessage: 'Enter the serial number.', max: 64 }),
    // JSON numbers only: true, [1], "1" or null are refused, not turned into 1 or 0.
    typeId: z.number({ error: 'Choose a type.' }).int('Choose a type.').positive('Choose a type.'),
    baseId: z.number({ error: 'Choose a base.' }).int('Choose a base.').positive('Choose a base.'),
    hours: z
      .number({ error: 'Hours are a number, e.g. 1234.5.' })
      .min(0, 'Hours cannot be negative.')
      .max(1_000_000),
    /** Flights flown; like hours it only moves forward. Left out: unchanged. */
    flights: z
      .number({ error: 'Flights are a whole number.' })
      .int('Flights are a whole number.')
      .min(0, 'Flights cannot be negative.')
      .max(10_000_000)
      .optional(),
    /** The registration mark; null or empty clears it, left out leaves it unchanged. */
    registration: z.preprocess((v) => (v === '' ? null : v), registrationSchema.nullable()).optional(),
  })
  .strict();
export type AirframeInput = z.infer<typeof airframeInputSchema>;

export interface FleetAirframe {
  id: number;
  fleetNumber: string;
  serial: string;
  type: { id: number; code: string };
  base: { id: number; code: string; name: string };
  hours: number;
  flights: number;
  registration: string | null;
  active: boolean;
  tag: { id: number; token: string; shortCode: string; issuedAt: string } | null;
  revokedTags: number;
}

export interface TagSheetEntry {
  airframeId: number;
  fleetNumber: string;
  registration: string | null;
  typeCode: string;
  url: string;
  shortCode: string;
  /** An SVG document of the QR code encoding url. */
  qrSvg: string;
}

/** The first six characters of a tag token, grouped for reading aloud: "Xy3-k9Q". */
export function tagShortCode(token: string): string {
  const head = token.slice(0, 6);
  return `${head.slice(0, 3)}-${head.slice(3)}`;
}
