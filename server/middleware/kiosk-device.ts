import type { RequestHandler } from 'express';
import { Op } from 'sequelize';
import { KioskDevice } from '../db/models';
import { sha256 } from '../security/hashing';

export const KIOSK_COOKIE = 'gw_kiosk';

/** Recognises an enrolled tablet by its long-lived device cookie; revoked devices are not recognised. */
export const recogniseKiosk: RequestHandler = async (req, _res, next) => {
  const token: unknown = req.cookies?.[KIOSK_COOKIE];
  if (typeof token === 'string' && token.length >= 20 && token.length <= 100) {
    // Asked on every API request from a tablet: only the three columns it needs, as a plain row.
    const device = await KioskDevice.findOne({
      where: { tokenHash: sha256(token), revokedAt: { [Op.is]: null } },
      attributes: ['id', 'name', 'lastSeenAt'],
      raw: true,
    });
    if (device) {
      req.kiosk = { id: device.id, name: device.name };
      const now = new Date();
      const lastSeen = device.lastSeenAt ? new Date(device.lastSeenAt).getTime() : 0;
      if (now.getTime() - lastSeen > 60_000) {
        await KioskDevice.update({ lastSeenAt: now }, { where: { id: device.id } });
      }
    }
  }
  next();
};
