import { roleSchema, type Role, type SessionUser } from '@shared/schemas/auth';
import { baseTimeZones, staffById, type StaffRecord } from './auth.repository';

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

/** The hangar's clock for kiosk times: the zone every base shares, or UTC when they differ (or none is set). */
export async function hangarTimeZone(): Promise<string> {
  const zones = [...new Set(await baseTimeZones())];
  return zones.length === 1 ? zones[0]! : 'UTC';
}
