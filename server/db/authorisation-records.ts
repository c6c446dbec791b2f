import { Op, type Transaction } from 'sequelize';
import {
  authorisationWords,
  type Authorisation,
  type AuthorisationTerms,
} from '@shared/domain/authorisation';
import type { Translate } from '@shared/i18n/translate';
import { StaffAuthorisation } from './models';

export type AuthorisationRecord = Authorisation & { id: number; reference: string };

export const toAuthorisation = (row: StaffAuthorisation): AuthorisationRecord => ({
  id: row.id,
  reference: row.reference,
  category: row.category,
  typeCodes: JSON.parse(row.typeCodes) as string[],
  scope: JSON.parse(row.scope) as string[],
  expiresOn: row.expiresOn,
  revokedAt: row.revokedAt,
});

/** The terms a signature kept (category, reference, types, chapters, expiry), or null when none was kept. */
export function signedTerms(signed: unknown): AuthorisationTerms | null {
  const a = signed as Partial<AuthorisationTerms> | null;
  if (!a || !a.category || !Array.isArray(a.typeCodes) || !Array.isArray(a.scope) || !a.expiresOn)
    return null;
  return {
    category: a.category,
    ...(a.reference ? { reference: a.reference } : {}),
    typeCodes: a.typeCodes,
    scope: a.scope,
    expiresOn: a.expiresOn,
  };
}

/** The authorisation kept with a signature, in words; null when none was kept (a legacy or keep decision). */
export function signedAuthorisationWords(signed: unknown, t?: Translate): string | null {
  const terms = signedTerms(signed);
  return terms ? authorisationWords(terms, t) : null;
}

/** A person's authorisations not withdrawn (expired ones included: the rule says why they do not count). */
export async function authorisationsOf(staffId: number, transaction?: Transaction) {
  const rows = await StaffAuthorisation.findAll({
    where: { staffId, revokedAt: { [Op.is]: null } },
    order: [['id', 'ASC']],
    ...(transaction ? { transaction } : {}),
  });
  return rows.map(toAuthorisation);
}
