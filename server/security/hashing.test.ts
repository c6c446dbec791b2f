import bcrypt from 'bcrypt';
import { describe, expect, it, vi } from 'vitest';
import {
  canonicalJson,
  contentHash,
  hashSecret,
  randomToken,
  secretMatches,
  sha256,
  sha256Bytes,
} from './hashing';

// FIPS 180-2, appendix B.1: SHA-256("abc").
const abc = 'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad';

describe('the hashes a signature rests on', () => {
  it('when "abc" is hashed as text or as bytes, then it is the FIPS 180-2 example digest', () => {
    expect(sha256('abc')).toBe(abc);
    expect(sha256Bytes(Buffer.from('abc'))).toBe(abc);
  });

  it('when text outside ASCII is hashed, then it is hashed as UTF-8', () => {
    // "é" is c3 a9 in UTF-8 and e9 in Latin-1 (Unicode code point U+00E9).
    expect(sha256('é')).toBe(sha256Bytes(Buffer.from([0xc3, 0xa9])));
    expect(sha256('é')).not.toBe(sha256Bytes(Buffer.from([0xe9])));
  });

  it('when objects differ only in key order, then their canonical JSON and content hash are the same, keys sorted at every depth', () => {
    const a = {
      verdict: 'in_limits',
      readings: [{ value: 7, code: 'sys1.level' }],
      at: '2026-03-01T06:00:00.000Z',
    };
    const b = {
      at: '2026-03-01T06:00:00.000Z',
      readings: [{ code: 'sys1.level', value: 7 }],
      verdict: 'in_limits',
    };
    expect(canonicalJson(a)).toBe(
      '{"at":"2026-03-01T06:00:00.000Z","readings":[{"code":"sys1.level","value":7}],"verdict":"in_limits"}',
    );
    expect(canonicalJson(b)).toBe(canonicalJson(a));
    expect(contentHash(b)).toBe(sha256(canonicalJson(a)));
  });

  it('when nothing is given, then the canonical JSON is null rather than an empty string', () => {
    expect(canonicalJson(undefined)).toBe('null');
    expect(canonicalJson(null)).toBe('null');
  });

  it('when a token is made, then it is URL-safe base64 of the asked number of random bytes', () => {
    expect(randomToken()).toMatch(/^[A-Za-z0-9_-]{32}$/);
    expect(randomToken(6)).toMatch(/^[A-Za-z0-9_-]{8}$/);
    expect(randomToken()).not.toBe(randomToken());
  });

  it('when a PIN is hashed, then only that PIN matches the hash, which carries the asked cost', async () => {
    const hash = await hashSecret('2468', 4);
    expect(hash).toMatch(/^\$2b\$04\$/);
    expect(await secretMatches('2468', hash)).toBe(true);
    expect(await secretMatches('2469', hash)).toBe(false);
  });

  it('when a PIN was proven once against a hash, then the same PIN is accepted again without a second bcrypt run', async () => {
    const hash = await hashSecret('1357', 4);
    const compare = vi.spyOn(bcrypt, 'compare');
    try {
      expect(await secretMatches('1357', hash)).toBe(true);
      expect(await secretMatches('1357', hash)).toBe(true);
      expect(compare).toHaveBeenCalledTimes(1);
    } finally {
      compare.mockRestore();
    }
  });

  it('when a proven hash is given a wrong PIN, or the PIN is given a new hash, then bcrypt decides', async () => {
    const hash = await hashSecret('8642', 4);
    expect(await secretMatches('8642', hash)).toBe(true);
    const compare = vi.spyOn(bcrypt, 'compare');
    try {
      expect(await secretMatches('8643', hash)).toBe(false);
      expect(await secretMatches('8642 ', hash)).toBe(false);
      const renewed = await hashSecret('8642', 4);
      expect(await secretMatches('8642', renewed)).toBe(true);
      expect(await secretMatches('8642', await hashSecret('9753', 4))).toBe(false);
      expect(compare).toHaveBeenCalledTimes(4);
    } finally {
      compare.mockRestore();
    }
  });
});
