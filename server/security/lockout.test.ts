import { describe, expect, it } from 'vitest';
import { AppError } from '../errors/app-error';
import {
  attemptOutcome,
  hashToCompare,
  lockedError,
  wrongSecretError,
  type CredentialState,
} from './lockout';

const now = new Date('2026-03-01T06:00:00.000Z');
const policy = { maxAttempts: 5, lockMinutes: 15 };
const badge = (over: Partial<CredentialState> = {}): CredentialState => ({
  badgeNumber: '4101',
  active: true,
  lockedUntil: null,
  failedAttempts: 0,
  mustChangePin: false,
  pinHash: '$2b$04$pin',
  passwordHash: '$2b$04$password',
  ...over,
});

function refusalOf(run: () => unknown): AppError {
  try {
    run();
  } catch (err) {
    return err as AppError;
  }
  throw new Error('expected a refusal');
}

const plain = (e: AppError | null) =>
  e && { status: e.status, code: e.code, message: e.message, details: e.details };

describe('before the comparison', () => {
  it('when the badge is active and not locked, then the hash of the asked kind is compared', () => {
    expect(hashToCompare(badge(), 'pin', now)).toBe('$2b$04$pin');
    expect(hashToCompare(badge(), 'password', now)).toBe('$2b$04$password');
  });

  it('when the badge is no longer active, then it is 403 badge_inactive before any comparison', () => {
    expect(plain(refusalOf(() => hashToCompare(badge({ active: false }), 'pin', now)))).toEqual({
      status: 403,
      code: 'badge_inactive',
      message: 'Badge 4101 is no longer active.',
      details: undefined,
    });
  });

  it('when the lock runs until after now, then it is 423 with the time of day it ends', () => {
    const until = new Date('2026-03-01T06:14:00.000Z');
    expect(plain(refusalOf(() => hashToCompare(badge({ lockedUntil: until }), 'pin', now)))).toEqual({
      status: 423,
      code: 'badge_locked',
      message:
        'Badge 4101 is locked until 1 Mar 2026, 06:14 UTC after too many wrong attempts. A shift lead or engineering can unlock it sooner.',
      details: { lockedUntil: '2026-03-01T06:14:00.000Z' },
    });
  });

  it('when the lock ends exactly now or earlier, then the badge may try again', () => {
    expect(hashToCompare(badge({ lockedUntil: now }), 'pin', now)).toBe('$2b$04$pin');
    expect(hashToCompare(badge({ lockedUntil: new Date(now.getTime() - 1) }), 'pin', now)).toBe('$2b$04$pin');
  });

  it('when a badge without a desk password tries the desk, then it is 403 no_desk_password', () => {
    const refusal = refusalOf(() => hashToCompare(badge({ passwordHash: null }), 'password', now));
    expect(plain(refusal)).toEqual({
      status: 403,
      code: 'no_desk_password',
      message: 'Badge 4101 has no desk password. Sign in on a kiosk instead.',
      details: undefined,
    });
    expect(plain(refusalOf(() => hashToCompare(badge({ pinHash: '' }), 'pin', now)))?.code).toBe(
      'no_desk_password',
    );
  });
});

describe('after the comparison', () => {
  it('when the secret is right and nothing was counted, then nothing is stored and the badge is in', () => {
    expect(attemptOutcome(badge(), true, 'pin', policy, { now })).toEqual({ store: null, refusal: null });
  });

  it('when the secret is right after wrong tries or a lock that ran out, then the count and the lock are cleared', () => {
    const cleared = { store: { failedAttempts: 0, lockedUntil: null }, refusal: null };
    expect(attemptOutcome(badge({ failedAttempts: 3 }), true, 'pin', policy, { now })).toEqual(cleared);
    expect(attemptOutcome(badge({ lockedUntil: new Date(0) }), true, 'password', policy, { now })).toEqual(
      cleared,
    );
  });

  it('when a temporary PIN is right and used to sign, then it is 403 pin_change_required, after clearing the count', () => {
    const outcome = attemptOutcome(badge({ mustChangePin: true, failedAttempts: 1 }), true, 'pin', policy, {
      now,
      signing: true,
    });
    expect(outcome.store).toEqual({ failedAttempts: 0, lockedUntil: null });
    expect(plain(outcome.refusal)).toEqual({
      status: 403,
      code: 'pin_change_required',
      message: 'Your PIN is a temporary one. Choose your own PIN before you sign.',
      details: undefined,
    });
  });

  it('when a temporary PIN is right for a sign-in, or a password is right while a PIN change is due, then the badge is in', () => {
    const temporary = badge({ mustChangePin: true });
    expect(attemptOutcome(temporary, true, 'pin', policy, { now }).refusal).toBeNull();
    expect(attemptOutcome(temporary, true, 'password', policy, { now, signing: true }).refusal).toBeNull();
  });
});

describe('after the comparison: a wrong secret', () => {
  it.each([
    [0, 4, 'That badge and PIN do not match. 4 attempts left.'],
    [2, 2, 'That badge and PIN do not match. 2 attempts left.'],
    [3, 1, 'That badge and PIN do not match. 1 attempt left.'],
  ])(
    'when the PIN is wrong after %i wrong tries, then the count goes up and %i are left',
    (before, left, message) => {
      const outcome = attemptOutcome(badge({ failedAttempts: before }), false, 'pin', policy, { now });
      expect(outcome.store).toEqual({ failedAttempts: before + 1 });
      expect(plain(outcome.refusal)).toEqual({
        status: 401,
        code: 'wrong_pin',
        message,
        details: { attemptsLeft: left },
      });
    },
  );

  it('when the password is wrong, then the desk answer names the password', () => {
    const outcome = attemptOutcome(badge(), false, 'password', policy, { now });
    expect(plain(outcome.refusal)).toEqual({
      status: 401,
      code: 'wrong_password',
      message: 'That badge and password do not match. 4 attempts left.',
      details: { attemptsLeft: 4 },
    });
  });

  it('when the fifth wrong try comes, then the badge locks for the policy minutes from now and the count restarts', () => {
    const outcome = attemptOutcome(badge({ failedAttempts: 4 }), false, 'pin', policy, { now });
    const until = new Date('2026-03-01T06:15:00.000Z');
    expect(outcome.store).toEqual({ failedAttempts: 0, lockedUntil: until });
    expect(plain(outcome.refusal)).toEqual(plain(lockedError('4101', until)));
    expect(outcome.refusal!.status).toBe(423);
  });

  it('when the count is already past the limit, then a wrong try locks too', () => {
    const outcome = attemptOutcome(
      badge({ failedAttempts: 9 }),
      false,
      'pin',
      { maxAttempts: 3, lockMinutes: 1 },
      { now },
    );
    expect(outcome.store).toEqual({ failedAttempts: 0, lockedUntil: new Date('2026-03-01T06:01:00.000Z') });
    expect(outcome.refusal!.code).toBe('badge_locked');
  });
});

describe('the refusals themselves', () => {
  it('when a badge is unknown, then the answer is the wrong-secret one with no count', () => {
    expect(plain(wrongSecretError('pin'))).toEqual({
      status: 401,
      code: 'wrong_pin',
      message: 'That badge and PIN do not match.',
      details: undefined,
    });
    expect(plain(wrongSecretError('password'))?.message).toBe('That badge and password do not match.');
  });
});
