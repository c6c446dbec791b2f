import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { credentialFor, signContent, signerOf, signingInstant } from './signing';

// A signature is a deliberate act per record, bound to exactly what it signs: FAA AC 120-78B (2024).

describe('credentialFor', () => {
  it('when signing on a kiosk, then the PIN is the secret, and without one the refusal names the act', () => {
    expect(credentialFor({ pin: '2468' }, 'kiosk')).toEqual({ which: 'pin', secret: '2468' });
    expect(() => credentialFor({ password: 'x' }, 'kiosk', 'defer')).toThrow(
      expect.objectContaining({
        status: 400,
        code: 'pin_required',
        message: 'On a kiosk, defer by typing your PIN again.',
      }),
    );
  });

  it('when signing at the desk (or with no channel), then the password is the secret', () => {
    expect(credentialFor({ password: 'north-pad-lead' }, 'desk')).toEqual({
      which: 'password',
      secret: 'north-pad-lead',
    });
    expect(() => credentialFor({ pin: '2468' }, undefined)).toThrow(
      expect.objectContaining({
        status: 400,
        code: 'password_required',
        message: 'At the desk, sign by typing your password again.',
      }),
    );
  });
});

describe('signContent', () => {
  it('when content is signed, then the stored text is key-order-independent JSON and the hash is its SHA-256', () => {
    const a = signContent({ b: 2, a: { d: 1, c: [3, 'x'] } });
    const b = signContent({ a: { c: [3, 'x'], d: 1 }, b: 2 });
    expect(a.signedContent).toBe('{"a":{"c":[3,"x"],"d":1},"b":2}');
    expect(a).toEqual(b);
    // Written out here, independent of the project's hashing module.
    expect(a.contentHash).toBe(
      createHash('sha256').update('{"a":{"c":[3,"x"],"d":1},"b":2}', 'utf8').digest('hex'),
    );
  });
});

describe('signingInstant and signerOf', () => {
  it('when a signature is timed, then it keeps whole milliseconds as the columns store them', () => {
    expect(signingInstant(new Date(1_700_000_000_123.9)).getTime()).toBe(1_700_000_000_123);
  });

  it('when a signer is named in signed content, then it is badge, name and licence, as 14 CFR 43.9 asks (from memory)', () => {
    expect(
      signerOf({ badgeNumber: '5201', name: 'Jonah Pell', licenceNumber: 'TIA-B1-0301' } as Parameters<
        typeof signerOf
      >[0]),
    ).toEqual({ badge: '5201', name: 'Jonah Pell', licence: 'TIA-B1-0301' });
  });
});
