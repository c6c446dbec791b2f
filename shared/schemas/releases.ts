import { z } from 'zod';
import { oneSecret, signedSecrets, signingRequest } from './signing';
import type { SignerRef } from './refs';
import type { AuthorisationTerms } from '../domain/authorisation';

export const releaseAirframeSchema = z
  .object({ ...signedSecrets, ...signingRequest })
  .strict()
  .superRefine(oneSecret());
export type ReleaseAirframeInput = z.infer<typeof releaseAirframeSchema>;

/** The wording of a certificate of release to service (EASA Part-145 145.A.50, from memory). */
export const releaseStatement =
  'Certifies that the work specified, except as otherwise specified, was carried out in accordance with the ' +
  "operator's approved maintenance data and Part-145, and in respect to that work the aircraft is considered " +
  'ready for release to service.';

export interface AirframeReleaseView {
  id: number;
  airframeId: number;
  statement: string;
  chapters: (string | null)[];
  certifiedBy: SignerRef;
  /** The authorisation it was signed under; null for a release recorded before authorisations were kept. */
  authorisation: AuthorisationTerms | null;
  signedAt: string;
  contentHash: string;
}
