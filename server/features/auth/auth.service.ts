import type { Attributes } from 'sequelize';
import type { Staff } from '@server/db/models';
import { roleSchema, type Role, type SessionUser } from '@shared/schemas/auth';

export function toSessionUser(
  staff: Pick<Attributes<Staff>, 'id' | 'badgeNumber' | 'name' | 'licenceNumber' | 'roles'>,
): SessionUser {
  return {
    id: staff.id,
    badgeNumber: staff.badgeNumber,
    name: staff.name,
    licenceNumber: staff.licenceNumber,
    roles: parseRoles(staff.roles),
  };
}

export function parseRoles(stored: string): Role[] {
  return stored
    .split(',')
    .map((r) => r.trim())
    .filter((r): r is Role => roleSchema.safeParse(r).success);
}
