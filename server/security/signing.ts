import type { Sequelize, Transaction } from 'sequelize';
import { badRequest, refusal } from '../errors/app-error';
import { appendAuditEvent, type AuditInput } from '../audit/audit-trail';
import { canonicalJson, sha256 } from './hashing';
import { verifyCredential, type LockoutPolicy, type StaffRow } from './credentials';

// Every signature in the product is the signer's own secret typed again for that one act (FAA AC 120-78B): the
// PIN on a kiosk, the password at the desk. What is signed is kept as canonical JSON beside its SHA-256, so the
// record check can prove later that the stored row still says what was signed. Every signing flow goes the same
// way: verifySigner (the secret, outside any transaction), then signContent (seal, store, audit event).

export interface SigningContext {
  signer: Express.User;
  channel: 'kiosk' | 'desk' | undefined;
  lockout: LockoutPolicy;
  /** The signer's row as this request already read it, so it is not read twice. */
  known?: StaffRow | undefined;
}

export interface Secret {
  pin?: string | undefined;
  password?: string | undefined;
}

/** A verified signer at the instant of signing: only verifySigner makes one. */
export interface Signature {
  row: StaffRow;
  which: 'pin' | 'password';
  at: Date;
}

/**
 * What a signature is for, as a refusal names it ("On a kiosk, defer by typing your PIN again."): a key of the
 * refusals catalogue's "signing.acts", so each language words the act its own way.
 */
export type SigningAct =
  | 'sign'
  | 'accept'
  | 'certify'
  | 'countersign'
  | 'defer'
  | 'closeFlight'
  | 'raiseDefect'
  | 'recordWork'
  | 'recordCorrectiveAction'
  | 'signInspection'
  | 'signRelease';

/** The secret the channel asks for: a kiosk has badge + PIN, the desk has a password. */
export function credentialFor(input: Secret, channel: SigningContext['channel'], act: SigningAct = 'sign') {
  const words = () => ({ act: { phrase: refusal(`signing.acts.${act}`) } });
  if (channel === 'kiosk') {
    if (!input.pin) throw badRequest('pin_required', refusal('signing.pinAgain', words()));
    return { which: 'pin' as const, secret: input.pin };
  }
  if (!input.password) throw badRequest('password_required', refusal('signing.passwordAgain', words()));
  return { which: 'password' as const, secret: input.password };
}

/**
 * Verifies the signer's secret for this act. Verified outside any transaction, so a wrong PIN still counts
 * towards the lockout.
 */
export async function verifySigner(
  input: Secret,
  ctx: SigningContext,
  act?: SigningAct,
  now?: Date,
): Promise<Signature> {
  const credential = credentialFor(input, ctx.channel, act);
  const row = await verifyCredential(
    ctx.signer.badgeNumber,
    credential.secret,
    credential.which,
    ctx.lockout,
    { signing: true, ...(ctx.known ? { known: ctx.known } : {}) },
  );
  return { row, which: credential.which, at: signingInstant(now) };
}

export interface SealedContent {
  contentHash: string;
  signedContent: string;
}

/** The signed content as stored (canonical JSON) and its hash. */
export function sealContent(content: unknown): SealedContent {
  const signedContent = canonicalJson(content);
  return { contentHash: sha256(signedContent), signedContent };
}

/** What an audit event of a signature says; who and when come from the signature itself. */
export type SignatureEvent = Omit<AuditInput, 'actorId' | 'at'>;

export type SignedRecord<Row> = {
  /** Exactly what the signature covers. */
  content: unknown;
  /** Writes the record with its sealed content. */
  store: (sealed: SealedContent) => Promise<Row>;
} & (
  | {
      /** The caller's transaction, which the record and its audit event commit in together. */
      trail: { sequelize: Sequelize; transaction: Transaction };
      event: (row: Row, sealed: SealedContent) => SignatureEvent;
    }
  | {
      /** A check chains its events in the statement that stores it, for throughput (checks.repository.ts). */
      trail: 'chained by store';
    }
);

/** The one way a signature is recorded: seal the content, store the record, chain the audit event. */
export async function signContent<Row>(
  signature: Signature,
  record: SignedRecord<Row>,
): Promise<{ row: Row; sealed: SealedContent }> {
  const sealed = sealContent(record.content);
  const row = await record.store(sealed);
  if (record.trail !== 'chained by store') {
    await appendAuditEvent(record.trail.sequelize, record.trail.transaction, {
      ...record.event(row, sealed),
      actorId: signature.row.id,
      at: signature.at,
    });
  }
  return { row, sealed };
}

/** Signatures are kept to the millisecond, as the columns store them. */
export const signingInstant = (now = new Date()) => new Date(Math.floor(now.getTime()));

export const signerOf = (row: StaffRow) => ({
  badge: row.badgeNumber,
  name: row.name,
  licence: row.licenceNumber,
});
