import { AppError, refusal } from '../errors/app-error';

export interface LockoutPolicy {
  maxAttempts: number;
  lockMinutes: number;
  /** Failures of one badge from this many addresses lock it even when none came from an enrolled tablet. */
  lockMinAddresses?: number;
  /** Cost of the hash compared when there is no real one, so every failed sign-in takes as long. */
  bcryptCost?: number;
}

export type SecretKind = 'pin' | 'password';

/** The columns of a badge that decide whether it may try its secret and what a try changes. */
export interface CredentialState {
  badgeNumber: string;
  active: boolean;
  lockedUntil: Date | null;
  failedAttempts: number;
  mustChangePin: boolean;
  pinHash: string | null;
  passwordHash: string | null;
}

export function lockedError(badge: string, until: Date): AppError {
  return new AppError(
    423,
    'badge_locked',
    refusal('access.badgeLocked', { badge, until: { instant: until.toISOString() } }),
    { lockedUntil: until.toISOString() },
  );
}

/** The same answer for an unknown badge and a wrong secret, so badge numbers cannot be probed. */
export function wrongSecretError(which: SecretKind, attemptsLeft?: number): AppError {
  const pin = which === 'pin';
  return new AppError(
    401,
    pin ? 'wrong_pin' : 'wrong_password',
    attemptsLeft === undefined
      ? refusal(pin ? 'access.wrongPin' : 'access.wrongPassword')
      : refusal(pin ? 'access.wrongPinAttemptsLeft' : 'access.wrongPasswordAttemptsLeft', {
          count: attemptsLeft,
        }),
    attemptsLeft === undefined ? undefined : { attemptsLeft },
  );
}

/** The hash to compare with, or the refusal that comes before any comparison (inactive, locked, no password). */
export function hashToCompare(staff: CredentialState, which: SecretKind, now: Date): string {
  if (!staff.active)
    throw new AppError(403, 'badge_inactive', refusal('access.badgeInactive', { badge: staff.badgeNumber }));
  if (staff.lockedUntil && staff.lockedUntil > now) throw lockedError(staff.badgeNumber, staff.lockedUntil);
  const hash = which === 'pin' ? staff.pinHash : staff.passwordHash;
  if (!hash) {
    throw new AppError(
      403,
      'no_desk_password',
      refusal('access.noDeskPassword', { badge: staff.badgeNumber }),
    );
  }
  return hash;
}

export interface AttemptOutcome {
  /** What to write to the badge's row, or null when nothing changes. */
  store: { failedAttempts: number; lockedUntil?: Date | null } | null;
  /** The refusal to answer with after storing, or null when the badge is signed in. */
  refusal: AppError | null;
}

/**
 * What one comparison means for the badge: a right secret clears the count, a wrong one adds to it and locks the
 * badge at the policy's limit. A temporary PIN is right but cannot sign. Refusals are made only here, when
 * refusing: an Error records its stack, which every signature would otherwise pay for.
 */
export function attemptOutcome(
  staff: CredentialState,
  matched: boolean,
  which: SecretKind,
  policy: LockoutPolicy,
  options: { now: Date; signing?: boolean },
): AttemptOutcome {
  if (matched) {
    const store =
      staff.failedAttempts > 0 || staff.lockedUntil ? { failedAttempts: 0, lockedUntil: null } : null;
    // A temporary PIN was set by someone else, so it cannot be this person's signature.
    const refused =
      options.signing && which === 'pin' && staff.mustChangePin
        ? new AppError(403, 'pin_change_required', refusal('access.temporaryPinBeforeSigning'))
        : null;
    return { store, refusal: refused };
  }
  const failed = staff.failedAttempts + 1;
  if (failed >= policy.maxAttempts) {
    const lockedUntil = new Date(options.now.getTime() + policy.lockMinutes * 60_000);
    return {
      store: { failedAttempts: 0, lockedUntil },
      refusal: lockedError(staff.badgeNumber, lockedUntil),
    };
  }
  return {
    store: { failedAttempts: failed },
    refusal: wrongSecretError(which, policy.maxAttempts - failed),
  };
}
