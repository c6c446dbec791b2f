// The native bcrypt hashes on libuv's thread pool, so a PIN check does not hold up other requests.
import bcrypt from 'bcrypt';
import { createHash, randomBytes } from 'node:crypto';
import stringify from 'safe-stable-stringify';

export const hashSecret = (secret: string, cost: number) => bcrypt.hash(secret, cost);
export const secretMatches = (secret: string, hash: string) => bcrypt.compare(secret, hash);

export const sha256 = (text: string) => createHash('sha256').update(text, 'utf8').digest('hex');

/** URL-safe random token; 24 bytes gives 192 bits, not guessable from anything else. */
export const randomToken = (bytes = 24) => randomBytes(bytes).toString('base64url');

/** Key order independent JSON, so the same content always hashes the same. */
export const canonicalJson = (value: unknown): string => stringify(value) ?? 'null';

export const contentHash = (value: unknown) => sha256(canonicalJson(value));

export const sha256Bytes = (bytes: Buffer) => createHash('sha256').update(bytes).digest('hex');
