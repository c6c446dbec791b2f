import { z } from 'zod';
import { pinSchema } from './auth';

// A signed act carries the signer's PIN (kiosk) or password (desk) typed again, and not both: FAA AC 120-78B
// asks for a deliberate act per signature (from memory).
export const signedSecrets = {
  pin: pinSchema.optional(),
  password: z.string().min(1, 'words:validation.password').max(200).optional(),
};

/**
 * The id a screen gives one act of signing (a UUID), the same on every resend of it: a resend after a lost answer,
 * or a double tap, is answered as the first instead of signing twice. A new act gets a new id.
 */
export const signingRequest = {
  requestId: z.string().uuid('words:validation.signingId').optional(),
};

/** The acts whose schemas ask for the PIN or the password: each has its own message (words:validation.secret). */
export type SecretAct = 'sign' | 'recordCorrectiveAction' | 'countersign';

/** A refinement that asks for exactly one of the PIN and the password, naming the act in its message. */
export const oneSecret =
  (act: SecretAct = 'sign') =>
  (value: { pin?: string | undefined; password?: string | undefined }, ctx: z.RefinementCtx) => {
    if (value.pin === undefined && value.password === undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['pin'],
        message: `words:validation.secret.${act}`,
      });
    }
    if (value.pin !== undefined && value.password !== undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['password'],
        message: 'words:validation.secret.notBoth',
      });
    }
  };
