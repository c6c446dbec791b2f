import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { credentialFor, sealContent, signContent, signerOf, signingInstant, type Signature } from './signing';

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

describe('sealContent', () => {
  it('when content is signed, then the stored text is key-order-independent JSON and the hash is its SHA-256', () => {
    const a = sealContent({ b: 2, a: { d: 1, c: [3, 'x'] } });
    const b = sealContent({ a: { c: [3, 'x'], d: 1 }, b: 2 });
    expect(a.signedContent).toBe('{"a":{"c":[3,"x"],"d":1},"b":2}');
    expect(a).toEqual(b);
    // Written out here, independent of the project's hashing module.
    expect(a.contentHash).toBe(
      createHash('sha256').update('{"a":{"c":[3,"x"],"d":1},"b":2}', 'utf8').digest('hex'),
    );
  });
});

describe('signContent', () => {
  const signature = { row: { id: 7 }, which: 'pin', at: new Date(0) } as Signature;

  it('when a record is signed, then its store receives exactly the sealed content and the row comes back', async () => {
    const stored: unknown[] = [];
    const signed = await signContent(signature, {
      content: { b: 1, a: 2 },
      store: (sealed) => {
        stored.push(sealed);
        return Promise.resolve({ id: 'row-1' });
      },
      trail: 'chained by store',
    });
    expect(stored).toEqual([sealContent({ a: 2, b: 1 })]);
    expect(signed).toEqual({ row: { id: 'row-1' }, sealed: sealContent({ a: 2, b: 1 }) });
  });

  it('when the store fails, then the failure reaches the caller', async () => {
    await expect(
      signContent(signature, {
        content: {},
        store: () => Promise.reject(new Error('disk full')),
        trail: 'chained by store',
      }),
    ).rejects.toThrow('disk full');
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
