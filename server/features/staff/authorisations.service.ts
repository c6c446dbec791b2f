import type { Sequelize } from 'sequelize';
import type { AuthorisationView, GrantAuthorisationInput } from '@shared/schemas/staff';
import { updateRow } from '@server/db/rows';
import { staffNames } from '@server/db/staff-names';
import {
  authorisationsOf,
  insertAuthorisation,
  lockAuthorisation,
  staffById,
  typeCodes,
  type StaffAuthorisation,
} from './staff.repository';
import { toAuthorisation } from '@server/db/authorisation-records';
import { appendAuditEvent } from '@server/audit/audit-trail';
import { badRequest, conflict, notFound, refusal } from '@server/errors/app-error';
import { inTransaction } from '@server/db/retry';

const today = (now: Date) => now.toISOString().slice(0, 10);

async function view(rows: StaffAuthorisation[]): Promise<AuthorisationView[]> {
  const granters = await staffNames(rows.map((r) => r.grantedBy));
  return rows.map((row) => {
    const a = toAuthorisation(row);
    return {
      id: row.id,
      staffId: row.staffId,
      category: a.category,
      typeCodes: [...a.typeCodes],
      scope: [...a.scope],
      expiresOn: a.expiresOn,
      reference: row.reference,
      grantedBy: granters.get(row.grantedBy) ?? 'unknown',
      grantedAt: row.grantedAt.toISOString(),
      revokedAt: row.revokedAt?.toISOString() ?? null,
    };
  });
}

export async function listAuthorisations(staffId: number) {
  if (!(await staffById(staffId))) throw notFound(refusal('staff.personGone'));
  return view(await authorisationsOf(staffId));
}

/**
 * Records a certifying authorisation (EASA Part-145 145.A.35, from memory: issued by the organisation, with its
 * scope and validity written down). Refused when it has already expired or names a type the fleet does not have.
 */
export async function grantAuthorisation(
  sequelize: Sequelize,
  staffId: number,
  input: GrantAuthorisationInput,
  actorId: number,
  now = new Date(),
) {
  const person = await staffById(staffId);
  if (!person) throw notFound(refusal('staff.personGone'));
  if (!person.active)
    throw conflict('staff_inactive', refusal('staff.personInactive', { name: person.name }));
  if (input.expiresOn < today(now)) {
    throw badRequest(
      'authorisation_expired',
      refusal('staff.authorisationExpired', { day: { day: input.expiresOn } }),
    );
  }
  const known = await typeCodes();
  const unknown = input.typeCodes.filter((c) => !known.has(c));
  if (unknown.length > 0)
    throw badRequest('unknown_type', refusal('staff.unknownTypes', { types: unknown.join(', ') }));
  const scope = input.scope.includes('all') ? ['all'] : [...new Set(input.scope)].sort();
  const row = await inTransaction(sequelize, async (transaction) => {
    const created = await insertAuthorisation(
      {
        staffId,
        category: input.category,
        typeCodes: JSON.stringify([...new Set(input.typeCodes)]),
        scope: JSON.stringify(scope),
        expiresOn: input.expiresOn,
        reference: input.reference,
        grantedBy: actorId,
        grantedAt: now,
      },
      transaction,
    );
    await appendAuditEvent(sequelize, transaction, {
      actorId,
      action: 'authorisation.granted',
      entity: 'authorisation',
      entityId: String(created.id),
      payload: {
        staffId,
        category: input.category,
        typeCodes: [...new Set(input.typeCodes)],
        scope,
        expiresOn: input.expiresOn,
        reference: input.reference,
      },
      at: now,
    });
    return created;
  });
  return (await view([row]))[0]!;
}

export async function revokeAuthorisation(
  sequelize: Sequelize,
  staffId: number,
  authorisationId: number,
  actorId: number,
  now = new Date(),
) {
  return inTransaction(sequelize, async (transaction) => {
    const row = await lockAuthorisation(authorisationId, staffId, transaction);
    if (!row) throw notFound(refusal('staff.authorisationGone'));
    if (row.revokedAt) throw conflict('already_revoked', refusal('staff.alreadyWithdrawn'));
    await updateRow(row, { revokedAt: now, revokedBy: actorId }, transaction);
    await appendAuditEvent(sequelize, transaction, {
      actorId,
      action: 'authorisation.revoked',
      entity: 'authorisation',
      entityId: String(row.id),
      payload: { staffId, reference: row.reference },
      at: now,
    });
    return (await view([row]))[0]!;
  });
}
