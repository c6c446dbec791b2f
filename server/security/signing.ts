import { badRequest } from '../errors/app-error';
import { canonicalJson, sha256 } from './hashing';
import { verifyCredential, type LockoutPolicy, type StaffRow } from './credentials';

// Every signature in the product is the signer's own secret typed again for that one act (FAA AC 120-78B): the
// PIN on a kiosk, the password at the desk. What is signed is kept as canonical JSON beside its SHA-256, so the
// record check can prove later that the stored row still says what was signed.

export interface SigningContext {
  signer: Express.User;
  channel: 'kiosk' | 'desk' | undefined;
  lockout: LockoutPolicy;
}

export interface Secret {
  pin?: string | undefined;
  password?: string | undefined;
}

/** The secret the channel asks for: a kiosk has badge + PIN, the desk has a password. */
export function credentialFor(input: Secret, channel: SigningContext['channel'], act = 'sign') {
  if (channel === 'kiosk') {
    if (!input.pin) throw badRequest('pin_required', `On a kiosk, ${act} by typing your PIN again.`);
    return { which: 'pin' as const, secret: input.pin };
  }
  if (!input.password)
    throw badRequest('password_required', `At the desk, ${act} by typing your password again.`);
  return { which: 'password' as const, secret: input.password };
}

/**
 * Verifies the signer's secret for this act. Verified outside any transaction, so a wrong PIN still counts
 * towards the lockout.
 */
export async function verifySigner(
  input: Secret,
  ctx: SigningContext,
  act?: string,
): Promise<{ row: StaffRow; which: 'pin' | 'password' }> {
  const credential = credentialFor(input, ctx.channel, act);
  const row = await verifyCredential(
    ctx.signer.badgeNumber,
    credential.secret,
    credential.which,
    ctx.lockout,
    {
      signing: true,
    },
  );
  return { row, which: credential.which };
}

/** The signed content as stored (canonical JSON) and its hash. */
export function signContent(content: unknown): { contentHash: string; signedContent: string } {
  const signedContent = canonicalJson(content);
  return { contentHash: sha256(signedContent), signedContent };
}

/** Signatures are kept to the millisecond, as the columns store them. */
export const signingInstant = (now = new Date()) => new Date(Math.floor(now.getTime()));

export const signerOf = (row: StaffRow) => ({
  badge: row.badgeNumber,
  name: row.name,
  licence: row.licenceNumber,
});
