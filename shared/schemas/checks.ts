import { z } from 'zod';
import {
  checkContextSchema,
  checkKindSchema,
  readingEntrySchema,
  volumeUnits,
  type CheckContext,
  type CheckKind,
  type Checkpoint,
  type Fluid,
  type LevelMarks,
  type LimitBand,
  type ReadingEntry,
  type Unit,
  type Verdict,
} from './limits';
import { pinSchema } from './auth';
import { freeText } from './free-text';
import type { AirframeRef, SignerRef } from './refs';
import { usageFiguresSchema, type UsageFigures } from './usage';
import { calendarDateSchema, toolNumberSchema, type SignedTool } from './tools';

export const photoIdsSchema = z.array(z.uuid()).max(6, 'words:validation.photos');

export const checkReadingSchema = z
  .object({
    code: z.string().min(1).max(64),
    entry: readingEntrySchema,
    photoIds: photoIdsSchema.optional(),
    /** The register's number of the tool the reading was taken with, e.g. "PG-014". */
    tool: toolNumberSchema.optional(),
  })
  .strict();

/**
 * Fluid added at a level checkpoint during the check, recorded once and as measured: the quantity poured, the
 * fluid, its batch and the day its can was opened. The reading sent for that checkpoint is the level re-read after.
 */
export const servicingEntrySchema = z
  .object({
    code: z.string().min(1).max(64),
    quantity: z
      .object({
        value: z.number().positive('words:validation.quantityAdded').max(100),
        unit: z.enum(volumeUnits),
      })
      .strict(),
    fluidSpec: freeText('words:validation.field.fluidSpec', {
      min: 1,
      minMessage: 'words:validation.fluidSpec',
      max: 64,
    }),
    batch: z
      .string()
      .trim()
      .regex(/^[A-Za-z0-9][A-Za-z0-9 ./-]{0,39}$/, 'words:validation.batch'),
    /** The day the can was opened ("YYYY-MM-DD"): an opened can takes up moisture, so its age is traced. */
    canOpenedOn: calendarDateSchema('words:validation.field.canOpenedOn'),
    levelBefore: readingEntrySchema,
    /** A servicing cart from the tools register, when the fluid was pumped from one. */
    tool: toolNumberSchema.optional(),
  })
  .strict();
export type ServicingEntryInput = z.infer<typeof servicingEntrySchema>;

/** What the kiosk sends to sign a check. The id is made on the tablet and doubles as the idempotency key. */
export const submitCheckSchema = z
  .object({
    id: z.uuid({ message: 'words:validation.checkId' }),
    airframeId: z.number().int().positive(),
    kind: checkKindSchema,
    limitsVersionId: z.number().int().positive(),
    context: checkContextSchema,
    readings: z.array(checkReadingSchema).min(1, 'words:validation.oneReading').max(100),
    servicing: z.array(servicingEntrySchema).max(10).optional(),
    note: freeText('words:validation.field.note', {
      max: 2000,
      maxMessage: 'words:validation.noteTooLong',
    }).optional(),
    correctsCheckId: z.uuid().optional(),
    /** After-flight only: the airframe's hours, flights and landings as read at the end of the flight. */
    usage: usageFiguresSchema.optional(),
    pin: pinSchema,
  })
  .strict();
export type SubmitCheck = z.infer<typeof submitCheckSchema>;

/** How long a started, unsigned check keeps its airframe "in progress" after the tablet last touched it. */
export const draftLifetimeMs = 30 * 60_000;

export const checkDraftSchema = z
  .object({ id: z.uuid(), airframeId: z.number().int().positive(), kind: checkKindSchema })
  .strict();

export { checkKindLabels, verdictLabels } from './plain';

export const closeDraftSchema = z
  .object({
    reason: freeText('words:validation.field.text', {
      min: 3,
      minMessage: 'words:validation.closeReason',
      max: 500,
      maxMessage: 'words:validation.atMostCharacters',
    }),
  })
  .strict();
export type CloseDraftInput = z.infer<typeof closeDraftSchema>;

export interface OpenDraft {
  id: string;
  airframe: AirframeRef;
  kind: CheckKind;
  startedBy: string;
  startedAt: string;
  touchedAt: string;
}

export interface CheckCard {
  airframeId: number;
  kind: CheckKind;
  limitsVersion: { id: number; version: number; publishedAt: string | null };
  type: { code: string; name: string };
  requires: ('attitude' | 'systemPressure' | 'ambientTempC')[];
  checkpoints: Checkpoint[];
  /** The fluids approved for the type, so the kiosk can offer them and refuse another base at once. */
  fluids: Fluid[];
  /** After-flight cards: the airframe's hours, flights and landings as last recorded, which the entry starts from. */
  lastUsage?: UsageFigures;
}

export interface StoredReading {
  code: string;
  label: string;
  entry: ReadingEntry;
  value: number | null;
  unit: string | null;
  verdict: Verdict;
  bandId: string;
  message: string;
  action: string;
  expected: number | null;
  /** The tool the reading was taken with, as it stood in the register at signing. */
  tool: SignedTool | null;
  photos: { id: string; mimeType: string; sizeBytes: number; sha256: string; uploadedAt: string }[];
}

export interface StoredServicing {
  code: string;
  system: string | null;
  quantityL: number;
  entered: { value: number; unit: string };
  fluidSpec: string;
  batch: string;
  /** "YYYY-MM-DD"; null on top-ups recorded before the day was asked. */
  canOpenedOn: string | null;
  levelBefore: ReadingEntry;
  tool: SignedTool | null;
  addedAt: string;
}

export interface StoredCheck {
  id: string;
  airframe: AirframeRef;
  kind: CheckKind;
  limitsVersion: { id: number; typeCode: string; version: number };
  context: CheckContext;
  verdict: Verdict;
  note: string | null;
  airframeHours: number | null;
  /** The airframe's flights when the check was signed; null on checks signed before flights were stamped. */
  airframeFlights: number | null;
  signedBy: SignerRef & { badgeNumber: string };
  signedAt: string;
  contentHash: string;
  correctsCheckId: string | null;
  readings: StoredReading[];
  servicing: StoredServicing[];
  holdOpened: boolean;
}

/** A stored reading next to the limit it was judged against (from the limits version of its check). */
export interface ReadingAgainstLimits extends StoredReading {
  /** The checkpoint's canonical unit; null for yes/no. */
  canonicalUnit: Unit | null;
  system: string | null;
  /** The band the reading fell in, edges in the canonical unit. */
  band: LimitBand | null;
  /** The band in words, e.g. "at or above 5.5 L and below 7 L". */
  limitText: string | null;
  marks: LevelMarks | null;
  /** Where the limit comes from in the approved maintenance data. */
  reference: string | null;
}
