import { z } from 'zod';
import { badgeSchema, pinSchema, roleSchema, type Role } from './auth';
import { freeText } from './free-text';
import { ataScopes, licenceCategories } from '../domain/authorisation';
import { languages, type Language } from '../i18n/languages';

const licenceSchema = freeText('words:validation.field.licenceNumber', { max: 64 })
  .transform((v) => (v === '' ? null : v))
  .nullable();

const personName = freeText('words:validation.field.name', {
  min: 1,
  minMessage: 'words:validation.name',
  max: 100,
});

const rolesSchema = z.array(roleSchema).min(1, 'words:validation.oneRole');

/**
 * null: the kiosk keeps the tablet's language at this badge's sign-in. The message names every shipped language
 * ({{languages}}, filled in by shared/i18n/validation.ts).
 */
const preferredLanguageSchema = z.enum(languages, { message: 'words:validation.language' }).nullable();

const deskPasswordSchema = z.string().min(10, 'words:validation.deskPassword').max(200);

export const staffInputSchema = z
  .object({
    badgeNumber: badgeSchema,
    name: personName,
    licenceNumber: licenceSchema,
    roles: rolesSchema,
    preferredLanguage: preferredLanguageSchema.default(null),
    /** Only shift leads and engineering sign in at the desk. */
    deskPassword: deskPasswordSchema.optional(),
  })
  .strict();
export type StaffInput = z.input<typeof staffInputSchema>;

export const staffEditSchema = z
  .object({
    name: personName,
    licenceNumber: licenceSchema,
    roles: rolesSchema,
    /** Left out: the preferred language stays as it is (clients older than migration 0013 do not send it). */
    preferredLanguage: preferredLanguageSchema.optional(),
  })
  .strict();
export type StaffEdit = z.input<typeof staffEditSchema>;

export interface StaffMember {
  id: number;
  badgeNumber: string;
  name: string;
  licenceNumber: string | null;
  roles: Role[];
  preferredLanguage: Language | null;
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
    message: 'words:validation.pinNotTemporary',
    path: ['newPin'],
  });
export type ChangePin = z.infer<typeof changePinSchema>;

const calendarDay = z.iso.date({ message: 'words:validation.dayFormat' });

export const grantAuthorisationSchema = z
  .object({
    category: z.enum(licenceCategories, { message: 'words:validation.licenceCategory' }),
    typeCodes: z.array(z.string().trim().min(1).max(32)).min(1, 'words:validation.oneType').max(50),
    scope: z
      .array(
        z.enum(ataScopes as [string, ...string[]], {
          message: 'words:validation.chaptersFromList',
        }),
      )
      .min(1, 'words:validation.chapters'),
    expiresOn: calendarDay,
    reference: freeText('words:validation.field.authorisationNumber', {
      min: 2,
      minMessage: 'words:validation.authorisationNumber',
      max: 64,
    }),
  })
  .strict();
export type GrantAuthorisationInput = z.infer<typeof grantAuthorisationSchema>;

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
}
