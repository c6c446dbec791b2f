import { toLanguage } from '@shared/i18n/languages';
import { roleSchema, type Role, type SessionUser } from '@shared/schemas/auth';
import { baseTimeZones, staffById, type StaffRecord } from './auth.repository';

export function toSessionUser(
  staff: Pick<StaffRecord, 'id' | 'badgeNumber' | 'name' | 'licenceNumber' | 'roles' | 'preferredLanguage'>,
): SessionUser {
  return {
    id: staff.id,
    badgeNumber: staff.badgeNumber,
    name: staff.name,
    licenceNumber: staff.licenceNumber,
    roles: parseRoles(staff.roles),
    // A language dropped from the shipped list since it was chosen reads as no preference.
    preferredLanguage: toLanguage(staff.preferredLanguage) ?? null,
  };
}

export function parseRoles(stored: string): Role[] {
  return stored
    .split(',')
    .map((r) => r.trim())
    .filter((r): r is Role => roleSchema.safeParse(r).success);
}

/** The person behind a session, read again on every request: a deactivated badge is signed out at once. */
export async function signedInStaff(
  id: number,
  /** The row as read with the session this request, when it was. */
  known?: StaffRecord | null,
): Promise<{ row: StaffRecord; user: SessionUser } | null> {
  const row = known?.id === id ? known : await staffById(id);
  return row?.active ? { row, user: toSessionUser(row) } : null;
}

let zoneRead: { at: number; zone: Promise<string> } | null = null;

/**
 * The hangar's clock for kiosk times: the zone every base shares, or UTC when they differ (or none is set). Every
 * session read and kiosk touch answers with it, so it is read from the bases at most once a minute.
 */
export function hangarTimeZone(now = Date.now()): Promise<string> {
  if (!zoneRead || now - zoneRead.at > 60_000) {
    const zone = baseTimeZones().then((zones) => {
      const distinct = [...new Set(zones)];
      return distinct.length === 1 ? distinct[0]! : 'UTC';
    });
    // A failed read is not kept: the next request asks the database again.
    zone.catch(() => {
      zoneRead = null;
    });
    zoneRead = { at: now, zone };
  }
  return zoneRead.zone;
}
