import { z } from 'zod';
import { freeText } from './free-text';
import type { ValidationKey } from '../i18n/validation';
import { oneSecret, signedSecrets } from './signing';
import { ataScopes, type AuthorisationTerms } from '../domain/authorisation';
import { deferralCategories } from '../domain/deferral';
import type { AirframeRef, PersonRef, SignerRef } from './refs';
import type { Phrase } from '../i18n/phrase';

// Tech-log acts: raising a defect, recording work, an independent inspection, certifying a rectification,
// deferring a defect. Each is signed (see ./signing).

/** A signed act's text; `minMessage` asks for it ("Say what was found, in a few words at least."). */
const text = (minMessage: ValidationKey, max = 2000) =>
  freeText('words:validation.field.text', {
    min: 3,
    minMessage,
    max,
    maxMessage: 'words:validation.atMostCharacters',
  });

export const chapterSchema = z.enum(ataScopes.filter((k) => k !== 'all') as [string, ...string[]], {
  message: 'words:validation.ataChapter',
});

export const raiseDefectSchema = z
  .object({
    description: text('words:validation.sayWhatWasFound'),
    chapter: chapterSchema.nullable().optional(),
    needsIndependentInspection: z.boolean().optional(),
    ...signedSecrets,
  })
  .strict()
  .superRefine(oneSecret());
export type RaiseDefectInput = z.infer<typeof raiseDefectSchema>;

export const defectWorkSchema = z
  .object({
    action: text('words:validation.sayWhatWasDone'),
    /** The work disturbed something (for example flight controls) that a second person must inspect. */
    independentInspection: z.boolean().optional(),
    ...signedSecrets,
  })
  .strict()
  .superRefine(oneSecret());
export type DefectWorkInput = z.infer<typeof defectWorkSchema>;

export const inspectionSchema = z
  .object({ statement: text('words:validation.sayWhatYouInspected'), ...signedSecrets })
  .strict()
  .superRefine(oneSecret());
export type InspectionInput = z.infer<typeof inspectionSchema>;

export const certifySchema = z
  .object({ ...signedSecrets })
  .strict()
  .superRefine(oneSecret());
export type CertifyInput = z.infer<typeof certifySchema>;

const calendarDay = z.iso.date({ message: 'words:validation.dayFormat' });

export const deferDefectSchema = z
  .object({
    reference: freeText('words:validation.field.reference', {
      min: 2,
      minMessage: 'words:validation.deferralReference',
      max: 100,
      maxMessage: 'words:validation.atMostCharacters',
    }),
    category: z.enum(deferralCategories, { message: 'words:validation.deferralCategory' }),
    untilDay: calendarDay.nullable().optional(),
    hours: z.number().positive('words:validation.deferralHours').max(10_000).nullable().optional(),
    flights: z
      .number()
      .int('words:validation.wholeFlights')
      .positive('words:validation.deferralFlights')
      .max(10_000)
      .nullable()
      .optional(),
    repeatInspection: freeText('words:validation.field.repeatInspection', {
      max: 500,
      maxMessage: 'words:validation.atMostCharacters',
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
