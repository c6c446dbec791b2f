import { z } from 'zod';
import { pinSchema } from './auth';
import { ataChapters, licenceCategories } from '../domain/authorisation';
import { deferralCategories } from '../domain/deferral';

// Tech-log acts: raising a defect, recording work, an independent inspection, certifying a rectification,
// deferring a defect, and a certificate of release to service for the airframe. Each is signed by typing the PIN
// (kiosk) or the password (desk) again: FAA AC 120-78B asks for a deliberate act per signature.

const signed = {
  pin: pinSchema.optional(),
  password: z.string().min(1, 'Enter your password.').max(200).optional(),
};

function oneSecret(value: { pin?: string | undefined; password?: string | undefined }, ctx: z.RefinementCtx) {
  if (value.pin === undefined && value.password === undefined) {
    ctx.addIssue({
      code: 'custom',
      path: ['pin'],
      message: 'Type your PIN (kiosk) or password (desk) again to sign.',
    });
  }
  if (value.pin !== undefined && value.password !== undefined) {
    ctx.addIssue({ code: 'custom', path: ['password'], message: 'Give the PIN or the password, not both.' });
  }
}

const text = (what: string, max = 2000) =>
  z.string().trim().min(3, `Say ${what}, in a few words at least.`).max(max, `At most ${max} characters.`);

export const chapterSchema = z.enum(
  Object.keys(ataChapters).filter((k) => k !== 'all') as [string, ...string[]],
  {
    message: 'Choose the ATA chapter from the list.',
  },
);

export const raiseDefectSchema = z
  .object({
    description: text('what was found'),
    chapter: chapterSchema.nullable().optional(),
    needsIndependentInspection: z.boolean().optional(),
    ...signed,
  })
  .strict()
  .superRefine(oneSecret);
export type RaiseDefectInput = z.infer<typeof raiseDefectSchema>;

export const defectWorkSchema = z
  .object({
    action: text('what was done'),
    /** The work disturbed something (for example flight controls) that a second person must inspect. */
    independentInspection: z.boolean().optional(),
    ...signed,
  })
  .strict()
  .superRefine(oneSecret);
export type DefectWorkInput = z.infer<typeof defectWorkSchema>;

export const inspectionSchema = z
  .object({ statement: text('what you inspected'), ...signed })
  .strict()
  .superRefine(oneSecret);
export type InspectionInput = z.infer<typeof inspectionSchema>;

export const certifySchema = z
  .object({ ...signed })
  .strict()
  .superRefine(oneSecret);
export type CertifyInput = z.infer<typeof certifySchema>;

const calendarDay = z.iso.date({ message: 'Give the day as YYYY-MM-DD.' });

export const deferDefectSchema = z
  .object({
    reference: z
      .string()
      .trim()
      .min(2, 'Give the MEL item or the deferred-defect procedure reference.')
      .max(100, 'At most 100 characters.'),
    category: z.enum(deferralCategories, { message: 'Choose the category: A, B, C or D.' }),
    untilDay: calendarDay.nullable().optional(),
    hours: z.number().positive('Flight hours must be more than 0.').max(10_000).nullable().optional(),
    flights: z
      .number()
      .int('Flights are a whole number.')
      .positive('Flights must be more than 0.')
      .max(10_000)
      .nullable()
      .optional(),
    repeatInspection: z.string().trim().max(500, 'At most 500 characters.').optional(),
    ...signed,
  })
  .strict()
  .superRefine(oneSecret);
export type DeferDefectInput = z.infer<typeof deferDefectSchema>;

export const releaseAirframeSchema = z
  .object({ ...signed })
  .strict()
  .superRefine(oneSecret);
export type ReleaseAirframeInput = z.infer<typeof releaseAirframeSchema>;

export const closeDraftSchema = z.object({ reason: text('why the check is closed', 500) }).strict();
export type CloseDraftInput = z.infer<typeof closeDraftSchema>;

export const grantAuthorisationSchema = z
  .object({
    category: z.enum(licenceCategories, { message: 'Choose the licence category.' }),
    typeCodes: z.array(z.string().trim().min(1).max(32)).min(1, 'Choose at least one type.').max(50),
    scope: z
      .array(
        z.enum(Object.keys(ataChapters) as [string, ...string[]], {
          message: 'Choose chapters from the list.',
        }),
      )
      .min(1, 'Choose the chapters it covers, or all chapters.'),
    expiresOn: calendarDay,
    reference: z.string().trim().min(2, 'Give the authorisation number.').max(64),
  })
  .strict();
export type GrantAuthorisationInput = z.infer<typeof grantAuthorisationSchema>;

/** The wording of a certificate of release to service (EASA Part-145 145.A.50, from memory). */
export const releaseStatement =
  'Certifies that the work specified, except as otherwise specified, was carried out in accordance with the ' +
  "operator's approved maintenance data and Part-145, and in respect to that work the aircraft is considered " +
  'ready for release to service.';

export interface DefectEntryView {
  id: number;
  kind: 'work' | 'inspection' | 'certification' | 'deferral';
  text: string;
  independentInspection: boolean;
  category: string | null;
  reference: string | null;
  limitAt: string | null;
  limitHours: number | null;
  limitFlights: number | null;
  signedBy: { id: number; name: string; licenceNumber: string | null };
  signedAt: string;
  contentHash: string;
  /** For a certification or deferral: the authorisation it was signed under, in words. */
  authorisation: string | null;
}

export interface DefectView {
  id: number;
  number: number;
  airframe: { id: number; fleetNumber: string; typeCode: string };
  description: string;
  chapter: string | null;
  source: 'finding' | 'check_note' | 'raised';
  checkId: string | null;
  holdId: number | null;
  needsIndependentInspection: boolean;
  raisedBy: { id: number; name: string };
  raisedAt: string;
  status: 'open' | 'deferred' | 'deferral_expired' | 'rectified';
  reason: string;
  contentHash: string;
  entries: DefectEntryView[];
}

export interface AuthorisationView {
  id: number;
  staffId: number;
  category: string;
  typeCodes: string[];
  scope: string[];
  expiresOn: string;
  reference: string;
  grantedBy: string;
  grantedAt: string;
  revokedAt: string | null;
  /** Plain words: "B1 for RX-4, RL-2, all chapters, until 1 Dec 2027". */
  words: string;
}

export interface AirframeReleaseView {
  id: number;
  airframeId: number;
  statement: string;
  chapters: (string | null)[];
  certifiedBy: { id: number; name: string; licenceNumber: string | null };
  authorisation: string;
  signedAt: string;
  contentHash: string;
}

export interface OpenDraft {
  id: string;
  airframe: { id: number; fleetNumber: string };
  kind: 'pre_flight' | 'ground_run' | 'after_flight' | 'servicing';
  startedBy: string;
  startedAt: string;
  touchedAt: string;
}
