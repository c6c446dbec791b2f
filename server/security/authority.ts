import { coveringAuthorisation, type WorkScope } from '@shared/domain/authorisation';
import { authorisationsOf } from '../db/authorisation-records';
import { forbidden, refusal } from '../errors/app-error';
import type { Phrase } from '@shared/i18n/phrase';

/**
 * The signer's certifying authorisation that covers this work now, as JSON to keep with the signature, or a 403
 * that says why none does (EASA Part-145 145.A.30 and 145.A.35, from memory). `act` completes "You cannot ...": a
 * phrase of the refusals catalogue's "signing.acts" ("defer this defect").
 */
export async function authorityFor(staffId: number, work: WorkScope, at: Date, act: Phrase): Promise<string> {
  const cover = coveringAuthorisation(await authorisationsOf(staffId), work, at);
  if (!cover.ok)
    throw forbidden(
      refusal('signing.notAuthorised', { act: { phrase: act }, reason: { phrase: cover.reason } }),
      'not_authorised',
    );
  const { id: _id, revokedAt: _revoked, ...kept } = cover.authorisation;
  return JSON.stringify(kept);
}
