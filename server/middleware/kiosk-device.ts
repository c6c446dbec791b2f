import type { RequestHandler } from 'express';
import { KioskDevice } from '../db/models';
import { runSql, selectRow } from '../db/direct-sql';
import { sha256 } from '../security/hashing';

export const KIOSK_COOKIE = 'gw_kiosk';

/** Recognises an enrolled tablet by its long-lived device cookie; revoked devices are not recognised. */
export const recogniseKiosk: RequestHandler = async (req, _res, next) => {
  const token: unknown = req.cookies?.[KIOSK_COOKIE];
  if (typeof token === 'string' && token.length >= 20 && token.length <= 100) {
    // Asked on every API request from a tablet, so straight to the connector.
    const device = await selectRow(KioskDevice, '`token_hash` = ? AND `revoked_at` IS NULL', [sha256(token)]);
    if (device) {
      req.kiosk = { id: device.id, name: device.name };
      const now = new Date();
      const lastSeen = device.lastSeenAt ? new Date(device.lastSeenAt).getTime() : 0;
      if (now.getTime() - lastSeen > 60_000) {
        await runSql(KioskDevice.sequelize!, 'UPDATE `kiosk_devices` SET `last_seen_at` = ? WHERE `id` = ?', [
          now,
          device.id,
        ]);
      }
    }
  }
  next();
};
