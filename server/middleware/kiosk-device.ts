import type { CookieOptions, RequestHandler } from 'express';
import { enrolledDevice, markDeviceSeen } from '../db/kiosk-device-rows';
import { sha256 } from '../security/hashing';
import { rowsReadWithSession } from './session-store';

export const KIOSK_COOKIE = 'gw_kiosk';

/** As `enrolledDevice` asks it of the database: seen after `seenAfter`. */
const usedSince = (device: { lastSeenAt: Date | null }, seenAfter: Date) =>
  device.lastSeenAt !== null && new Date(device.lastSeenAt).getTime() > seenAfter.getTime();

/**
 * A tablet stays enrolled while it is used: its cookie lasts 90 days from the last use and is renewed as it is
 * used, and the server no longer recognises a device unseen for that long. A tablet on the hangar wall never
 * notices; one lost or left in a drawer for a season stops being a kiosk by itself. 90 days is well inside the
 * 400 days browsers now cap a cookie at.
 */
export const KIOSK_DEVICE_DAYS = 90;
const deviceLifetimeMs = KIOSK_DEVICE_DAYS * 24 * 3_600_000;

export const kioskCookieOptions = (secureCookies: boolean): CookieOptions => ({
  httpOnly: true,
  sameSite: 'lax',
  secure: secureCookies,
  maxAge: deviceLifetimeMs,
  path: '/',
});

/** Recognises an enrolled tablet by its device cookie; revoked devices and devices unseen too long are not. */
export function recogniseKiosk(options: { secureCookies: boolean }): RequestHandler {
  return async (req, res, next) => {
    const token: unknown = req.cookies?.[KIOSK_COOKIE];
    if (typeof token === 'string' && token.length >= 20 && token.length <= 100) {
      const now = new Date();
      const tokenHash = sha256(token);
      const seenAfter = new Date(now.getTime() - deviceLifetimeMs);
      // The tablet the session was opened on was read with the session; it is this one only if the cookie is its.
      const read = rowsReadWithSession(req.session)?.device;
      const device =
        read && read.tokenHash === tokenHash && read.revokedAt === null && usedSince(read, seenAfter)
          ? read
          : await enrolledDevice(tokenHash, seenAfter);
      if (device) {
        req.kiosk = { id: device.id, name: device.name, baseId: device.baseId ?? null };
        const lastSeen = device.lastSeenAt ? new Date(device.lastSeenAt).getTime() : 0;
        if (now.getTime() - lastSeen > 60_000) {
          await markDeviceSeen(device.id, now);
          res.cookie(KIOSK_COOKIE, token, kioskCookieOptions(options.secureCookies));
        }
      }
    }
    next();
  };
}
