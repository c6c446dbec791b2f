import { KioskDevice } from './models';
import { runSql, selectRow } from './sql';
import { retryTransient } from './retry';

// Asked on every API request from a tablet, so straight to the connector.

/** The enrolled, unrevoked device with this token hash, seen after `seenAfter`. */
export const enrolledDevice = (tokenHash: string, seenAfter: Date) =>
  selectRow(KioskDevice, '`token_hash` = ? AND `revoked_at` IS NULL AND `last_seen_at` > ?', [
    tokenHash,
    seenAfter,
  ]);

/** A tablet's two requests through two nodes may both mark it seen: the refused one is sent again. */
export async function markDeviceSeen(id: number, at: Date) {
  await retryTransient(() =>
    runSql(KioskDevice.sequelize!, 'UPDATE `kiosk_devices` SET `last_seen_at` = ? WHERE `id` = ?', [at, id]),
  );
}
