import { z } from 'zod';
import { freeText } from './free-text';

const printIdsMessages = {
  airframe: 'words:validation.airframeIds',
  staff: 'words:validation.staffIds',
} as const;

/** A print sheet's `?ids=3,7`: which airframes or staff to print; absent prints them all. */
export const printIdsSchema = (what: keyof typeof printIdsMessages) =>
  z
    .string()
    .regex(/^\d+(,\d+)*$/, printIdsMessages[what])
    .transform((s) => s.split(',').map(Number))
    .optional();

const fleetNumberSchema = z
  .string()
  .trim()
  .regex(/^[A-Za-z0-9][A-Za-z0-9-]{0,31}$/, 'words:validation.fleetNumber');

/**
 * A registration mark as the register writes it: letters and digits, at most one dash, 3 to 10 characters
 * ("QX-TNA", "N123AB"). Typed in any case, kept in capitals.
 */
export const registrationSchema = z
  .string()
  .trim()
  .toUpperCase()
  .regex(/^(?=.{3,10}$)[A-Z0-9]+(-[A-Z0-9]+)?$/, 'words:validation.registration');

export const airframeInputSchema = z
  .object({
    fleetNumber: fleetNumberSchema,
    serial: freeText('words:validation.field.airframeSerial', {
      min: 1,
      minMessage: 'words:validation.airframeSerial',
      max: 64,
    }),
    // JSON numbers only: true, [1], "1" or null are refused, not turned into 1 or 0.
    typeId: z
      .number({ error: 'words:validation.type' })
      .int('words:validation.type')
      .positive('words:validation.type'),
    baseId: z
      .number({ error: 'words:validation.base' })
      .int('words:validation.base')
      .positive('words:validation.base'),
    hours: z
      .number({ error: 'words:validation.hoursNumber' })
      .min(0, 'words:validation.hoursNotNegative')
      .max(1_000_000),
    /** Flights flown; like hours it only moves forward. Left out: unchanged. */
    flights: z
      .number({ error: 'words:validation.wholeFlights' })
      .int('words:validation.wholeFlights')
      .min(0, 'words:validation.flightsNotNegative')
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
