import { z } from 'zod';
import { pinSchema } from './auth';

export const correctiveActionSchema = z
  .object({
    text: z
      .string()
      .trim()
      .min(3, 'Say what was done, in a few words at least.')
      .max(2000, 'A corrective action is at most 2000 characters.'),
    /** The work disturbed something (for example flight controls) that a second person must inspect. */
    independentInspection: z.boolean().optional(),
  })
  .strict();
export type CorrectiveActionInput = z.infer<typeof correctiveActionSchema>;

/** A shift lead's countersign: the PIN on a kiosk or the password at the desk, typed again. */
export const countersignSchema = z
  .object({
    decision: z.enum(['release', 'keep']),
    reason: z.string().trim().max(2000, 'A reason is at most 2000 characters.').optional(),
    pin: pinSchema.optional(),
    password: z.string().min(1, 'Enter your password.').max(200).optional(),
  })
  .strict()
  .superRefine((value, ctx) => {
    if (value.pin === undefined && value.password === undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['pin'],
        message: 'Type your PIN (kiosk) or password (desk) again to countersign.',
      });
    }
    if (value.pin !== undefined && value.password !== undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['password'],
        message: 'Give the PIN or the password, not both.',
      });
    }
    if (value.decision === 'keep' && !value.reason) {
      ctx.addIssue({ code: 'custom', path: ['reason'], message: 'Say why the hold stays.' });
    }
  });
export type CountersignInput = z.infer<typeof countersignSchema>;

export const acceptAirframeSchema = z.object({ pin: pinSchema }).strict();
export type AcceptAirframeInput = z.infer<typeof acceptAirframeSchema>;

export const createBoardLinkSchema = z
  .object({ name: z.string().trim().min(1, 'Name the screen, e.g. "Crew room TV".').max(100) })
  .strict();
export type CreateBoardLinkInput = z.infer<typeof createBoardLinkSchema>;

/** A board link token as handed out: URL-safe base64 of 24 random bytes. */
export const boardTokenSchema = z.string().regex(/^[A-Za-z0-9_-]{20,64}$/, 'That is not a board link.');

export const handoverWindowSchema = z
  .object({
    from: z.iso
      .datetime({ offset: true, message: 'from is a date and time, e.g. 2026-01-15T06:00:00Z.' })
      .optional(),
    to: z.iso
      .datetime({ offset: true, message: 'to is a date and time, e.g. 2026-01-15T18:00:00Z.' })
      .optional(),
  })
  .strict()
  .refine((w) => !w.from || !w.to || Date.parse(w.from) < Date.parse(w.to), {
    path: ['to'],
    message: 'The end of the shift comes after its start.',
  })
  .refine((w) => !w.from || !w.to || Date.parse(w.to) - Date.parse(w.from) <= 31 * 24 * 3_600_000, {
    path: ['from'],
    message: 'A handover covers at most 31 days.',
  });
export type HandoverWindow = z.infer<typeof handoverWindowSchema>;
