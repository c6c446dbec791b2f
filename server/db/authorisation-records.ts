import { Op, type Transaction } from 'sequelize';
import { ataChapters, type Authorisation, type AtaScope } from '@shared/domain/authorisation';
import { formatDay } from '@shared/domain/when';
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

/** "B1 (TIA-A-12) for RX-4, RL-2, all chapters of the type, until 1 Dec 2027". */
export function authorisationWords(a: Authorisation & { reference?: string }): string {
  const chapters = a.scope.includes('all')
    ? ataChapters.all.toLowerCase()
    : a.scope.map((c) => ataChapters[c as AtaScope] ?? `ATA ${c}`).join(', ');
  const ref = a.reference ? ` (${a.reference})` : '';
  return `${a.category}${ref} for ${a.typeCodes.join(', ')}, ${chapters}, until ${formatDay(a.expiresOn)}`;
}

/** The authorisation kept with a signature, in words; null when none was kept (a legacy or keep decision). */
export function signedAuthorisationWords(signed: unknown): string | null {
  const a = signed as Partial<Authorisation & { reference: string }> | null;
  if (!a || !a.category || !Array.isArray(a.typeCodes) || !Array.isArray(a.scope) || !a.expiresOn)
    return null;
  return authorisationWords(a as Authorisation & { reference?: string });
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
