import { z } from 'zod';
import { aircraftTypeDefinitionSchema, checkpointSchema, checkKindSchema, type Checkpoint } from './limits';
import { badgeSchema, pinSchema, roleSchema, type Role } from './auth';

/** A print sheet's `?ids=3,7`: which airframes or staff to print; absent prints them all. */
export const printIdsSchema = (what: string) =>
  z
    .string()
    .regex(/^\d+(,\d+)*$/, `ids is a comma-separated list of ${what} ids.`)
    .transform((s) => s.split(',').map(Number))
    .optional();

const typeCodeSchema = z
  .string()
  .trim()
  .regex(
    /^[A-Z0-9][A-Z0-9-]{0,31}$/,
    'A type code is up to 32 capital letters, digits or dashes, e.g. RX-4.',
  );

/** A new type starts as a draft limits version; it is judged by nothing until published. */
export const createTypeSchema = z
  .object({
    code: typeCodeSchema,
    name: z.string().trim().min(1, 'Give the type a name.').max(100),
    /** Optional starting definition (for example a copy of another type); code and name are taken from above. */
    definition: aircraftTypeDefinitionSchema.optional(),
  })
  .strict();
export type CreateType = z.infer<typeof createTypeSchema>;

/** A draft is saved whole: it only has to be well-formed, gaps and overlaps are refused at publication. */
export const saveDraftSchema = z.object({ definition: aircraftTypeDefinitionSchema }).strict();
export type SaveDraft = z.infer<typeof saveDraftSchema>;

export interface LimitsVersionSummary {
  id: number;
  version: number;
  status: 'draft' | 'published';
  publishedAt: string | null;
  publishedBy: string | null;
  createdAt: string;
}

export interface TypeSummary {
  id: number;
  code: string;
  name: string;
  current: LimitsVersionSummary | null;
  draft: LimitsVersionSummary | null;
  airframes: number;
}

export interface TypeDetail extends TypeSummary {
  versions: LimitsVersionSummary[];
}

export interface LimitsVersionDetail extends LimitsVersionSummary {
  typeId: number;
  definition: z.infer<typeof aircraftTypeDefinitionSchema>;
}

export interface PublicationProblem {
  checkpoint: string;
  kind: string;
  message: string;
  bands?: string[];
}

export interface FieldChange {
  field: string;
  from: unknown;
  to: unknown;
}

export interface CheckpointDiff {
  code: string;
  label: string;
  change: 'added' | 'removed' | 'changed';
  fields: FieldChange[];
  bands: { id: string; change: 'added' | 'removed' | 'changed'; fields: FieldChange[] }[];
  from: Checkpoint | null;
  to: Checkpoint | null;
}

export interface LimitsDiff {
  from: { id: number; version: number; status: string };
  to: { id: number; version: number; status: string };
  type: FieldChange[];
  cards: { kind: z.infer<typeof checkKindSchema>; from: string[]; to: string[] }[];
  checkpoints: CheckpointDiff[];
}

export const checkpointFormSchema = checkpointSchema;

const fleetNumberSchema = z
  .string()
  .trim()
  .regex(
    /^[A-Za-z0-9][A-Za-z0-9-]{0,31}$/,
    'A fleet number is up to 32 letters, digits or dashes, e.g. T-09.',
  );

export const airframeInputSchema = z
  .object({
    fleetNumber: fleetNumberSchema,
    serial: z.string().trim().min(1, 'Enter the serial number.').max(64),
    typeId: z.coerce.number().int().positive('Choose a type.'),
    baseId: z.coerce.number().int().positive('Choose a base.'),
    hours: z.coerce.number().min(0, 'Hours cannot be negative.').max(1_000_000),
    /** Flights flown; like hours it only moves forward. Left out: unchanged. */
    flights: z.coerce
      .number()
      .int('Flights are a whole number.')
      .min(0, 'Flights cannot be negative.')
      .max(10_000_000)
      .optional(),
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
  active: boolean;
  tag: { id: number; token: string; shortCode: string; issuedAt: string } | null;
  revokedTags: number;
}

export interface TagSheetEntry {
  airframeId: number;
  fleetNumber: string;
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

const licenceSchema = z
  .string()
  .trim()
  .max(64)
  .transform((v) => (v === '' ? null : v))
  .nullable();

const rolesSchema = z.array(roleSchema).min(1, 'Give at least one role.');

const deskPasswordSchema = z.string().min(10, 'A desk password is at least 10 characters.').max(200);

export const staffInputSchema = z
  .object({
    badgeNumber: badgeSchema,
    name: z.string().trim().min(1, 'Enter the name.').max(100),
    licenceNumber: licenceSchema,
    roles: rolesSchema,
    /** Only shift leads and engineering sign in at the desk. */
    deskPassword: deskPasswordSchema.optional(),
  })
  .strict();
export type StaffInput = z.input<typeof staffInputSchema>;

export const staffEditSchema = z
  .object({
    name: z.string().trim().min(1, 'Enter the name.').max(100),
    licenceNumber: licenceSchema,
    roles: rolesSchema,
  })
  .strict();
export type StaffEdit = z.input<typeof staffEditSchema>;

export interface StaffMember {
  id: number;
  badgeNumber: string;
  name: string;
  licenceNumber: string | null;
  roles: Role[];
  active: boolean;
  mustChangePin: boolean;
  hasDeskPassword: boolean;
  lockedUntil: string | null;
  createdAt: string;
}

/** The temporary PIN is in this answer and nowhere else: only its hash is kept. */
export interface TemporaryPin {
  staff: StaffMember;
  temporaryPin: string;
}

export interface BadgeCard {
  id: number;
  badgeNumber: string;
  name: string;
  licenceNumber: string | null;
  roles: Role[];
  qrSvg: string;
}

export const changePinSchema = z
  .object({ currentPin: pinSchema, newPin: pinSchema })
  .strict()
  .refine((v) => v.currentPin !== v.newPin, {
    message: 'Choose a PIN other than the temporary one.',
    path: ['newPin'],
  });
export type ChangePin = z.infer<typeof changePinSchema>;

export const kioskRenameSchema = z
  .object({ name: z.string().trim().min(1, 'Give the tablet a name.').max(100) })
  .strict();
