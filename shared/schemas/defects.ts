import { z } from 'zod';
import { freeText } from './free-text';
import { oneSecret, signedSecrets } from './signing';
import { ataScopes, type AuthorisationTerms } from '../domain/authorisation';
import { deferralCategories } from '../domain/deferral';
import type { AirframeRef, PersonRef, SignerRef } from './refs';
import type { Phrase } from '../i18n/phrase';

// Tech-log acts: raising a defect, recording work, an independent inspection, certifying a rectification,
// deferring a defect. Each is signed (see ./signing).

const text = (what: string, max = 2000) =>
  freeText('The text', {
    min: 3,
    minMessage: `Say ${what}, in a few words at least.`,
    max,
    maxMessage: `At most ${max} characters.`,
  });

export const chapterSchema = z.enum(ataScopes.filter((k) => k !== 'all') as [string, ...string[]], {
  message: 'common:validation.ataChapter',
});

export const raiseDefectSchema = z
  .object({
    description: text('what was found'),
    chapter: chapterSchema.nullable().optional(),
    needsIndependentInspection: z.boolean().optional(),
    ...signedSecrets,
  })
  .strict()
  .superRefine(oneSecret());
export type RaiseDefectInput = z.infer<typeof raiseDefectSchema>;

export const defectWorkSchema = z
  .object({
    action: text('what was done'),
    /** The work disturbed something (for example flight controls) that a second person must inspect. */
    independentInspection: z.boolean().optional(),
    ...signedSecrets,
  })
  .strict()
  .superRefine(oneSecret());
export type DefectWorkInput = z.infer<typeof defectWorkSchema>;

export const inspectionSchema = z
  .object({ statement: text('what you inspected'), ...signedSecrets })
  .strict()
  .superRefine(oneSecret());
export type InspectionInput = z.infer<typeof inspectionSchema>;

export const certifySchema = z
  .object({ ...signedSecrets })
  .strict()
  .superRefine(oneSecret());
export type CertifyInput = z.infer<typeof certifySchema>;

const calendarDay = z.iso.date({ message: 'common:validation.dayFormat' });

export const deferDefectSchema = z
  .object({
    reference: freeText('The reference', {
      min: 2,
      minMessage: 'Give the MEL item or the deferred-defect procedure reference.',
      max: 100,
      maxMessage: 'At most 100 characters.',
    }),
    category: z.enum(deferralCategories, { message: 'common:validation.deferralCategory' }),
    untilDay: calendarDay.nullable().optional(),
    hours: z.number().positive('Flight hours must be more than 0.').max(10_000).nullable().optional(),
    flights: z
      .number()
      .int('Flights are a whole number.')
      .positive('Flights must be more than 0.')
      .max(10_000)
      .nullable()
      .optional(),
    repeatInspection: freeText('The repeat inspection', {
      max: 500,
      maxMessage: 'At most 500 characters.',
    }).optional(),
    ...signedSecrets,
  })
  .strict()
  .superRefine(oneSecret());
export type DeferDefectInput = z.infer<typeof deferDefectSchema>;

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
  signedBy: SignerRef;
  signedAt: string;
  contentHash: string;
  /** For a certification or deferral: the authorisation it was signed under, as it stood that day. */
  authorisation: AuthorisationTerms | null;
}

export interface DefectView {
  id: number;
  number: number;
  airframe: AirframeRef & { typeCode: string };
  description: string;
  chapter: string | null;
  source: 'finding' | 'check_note' | 'raised';
  checkId: string | null;
  holdId: number | null;
  needsIndependentInspection: boolean;
  raisedBy: PersonRef;
  raisedAt: string;
  status: 'open' | 'deferred' | 'deferral_expired' | 'rectified';
  reason: Phrase;
  contentHash: string;
  entries: DefectEntryView[];
}

export interface DefectSummary {
  id: number;
  number: number;
  /** The hold whose finding this defect records, when it is one: the hold's countersigned release clears it. */
  holdId: number | null;
  description: string;
  status: 'open' | 'deferred' | 'deferral_expired';
  /** Why it is open, or its deferral's limit. */
  reason: Phrase;
  /** The calendar limit of its deferral, for a countdown. */
  deferredUntil: string | null;
}
