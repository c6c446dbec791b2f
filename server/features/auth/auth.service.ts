import { roleSchema, type Role, type SessionUser } from '@shared/schemas/auth';
import { staffById, type StaffRecord } from './auth.repository';

export function toSessionUser(
  staff: Pick<StaffRecord, 'id' | 'badgeNumber' | 'name' | 'licenceNumber' | 'roles'>,
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

/** The person behind a session, read again on every request: a deactivated badge is signed out at once. */
export async function signedInStaff(id: number): Promise<{ row: StaffRecord; user: SessionUser } | null> {
  const row = await staffById(id);
  return row?.active ? { row, user: toSessionUser(row) } : null;
}
