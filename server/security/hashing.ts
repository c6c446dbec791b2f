// The native bcrypt hashes on libuv's thread pool, so a PIN check does not hold up other requests.
import bcrypt from 'bcrypt';
import { createHash, createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import stringify from 'safe-stable-stringify';

export const hashSecret = (secret: string, cost: number) => bcrypt.hash(secret, cost);

/**
 * Secrets this process has already proven against a stored bcrypt hash: the hash, and an HMAC of the secret under a
 * key made at start-up and never stored. A mechanic's PIN is compared with bcrypt at sign-in; each check they sign
 * asks for it again, and a typed PIN that matches the memo of the same stored hash is accepted without a second
 * bcrypt run (about a millisecond of CPU at the bench's cost 4, 60 ms or more at a hangar's cost 10 to 12).
 * Anything else, a wrong PIN included, still goes through bcrypt, so a wrong PIN costs the same time as before and
 * a new PIN (a new hash) starts again. bcrypt protects stored hashes against an offline search; this memo is
 * never stored, and the lockout, not bcrypt's time, is what stops guessing online.
 */
const proven = new Map<string, Buffer>();
const memoKey = randomBytes(32);
const PROVEN_LIMIT = 5000;
const keyed = (secret: string) => createHmac('sha256', memoKey).update(secret, 'utf8').digest();

export async function secretMatches(secret: string, hash: string): Promise<boolean> {
  const known = proven.get(hash);
  if (known && timingSafeEqual(known, keyed(secret))) return true;
  const matches = await bcrypt.compare(secret, hash);
  if (matches) {
    // The oldest entry goes first when the memo is full; a badge whose entry went is compared with bcrypt again.
    if (proven.size >= PROVEN_LIMIT && !proven.has(hash)) proven.delete(proven.keys().next().value!);
    proven.set(hash, keyed(secret));
  }
  return matches;
}

export const sha256 = (text: string) => createHash('sha256').update(text, 'utf8').digest('hex');

/** URL-safe random token; 24 bytes gives 192 bits, not guessable from anything else. */
export const randomToken = (bytes = 24) => randomBytes(bytes).toString('base64url');

/** Key order independent JSON, so the same content always hashes the same. */
export const canonicalJson = (value: unknown): string => stringify(value) ?? 'null';

export const contentHash = (value: unknown) => sha256(canonicalJson(value));

export const sha256Bytes = (bytes: Buffer) => createHash('sha256').update(bytes).digest('hex');
