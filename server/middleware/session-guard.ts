import type { RequestHandler } from 'express';
import type { Role } from '@shared/schemas/auth';
import { AppError, forbidden, refusal, unauthorized } from '../errors/app-error';

/**
 * Ends a session that has been idle too long. Kiosk sessions are short (a shared tablet); the page locks
 * itself too, but the server is the one that decides.
 */
export function idleGuard(options: { kioskIdleSeconds: number; deskIdleMinutes: number }): RequestHandler {
  return (req, _res, next) => {
    if (!req.user || !req.session) return next();
    const limitMs =
      req.session.channel === 'kiosk' ? options.kioskIdleSeconds * 1000 : options.deskIdleMinutes * 60_000;
    const now = Date.now();
    const last = req.session.lastSeenAt ?? now;
    const kioskGone = req.session.channel === 'kiosk' && (!req.kiosk || req.kiosk.id !== req.session.kioskId);
    if (now - last > limitMs || kioskGone) {
      req.logout((err) => {
        if (err) return next(err);
        // Asking "who am I" after a lock is not an error: it answers signed out.
        if (req.method === 'GET' && req.path === '/session') return next();
        next(
          new AppError(
            401,
            kioskGone ? 'kiosk_revoked' : 'idle_locked',
            refusal(kioskGone ? 'access.tabletNoLongerEnrolled' : 'access.idleSignedOut'),
          ),
        );
      });
      return;
    }
    // Writing the time on every request would store the session on every request. Stored at a tenth of the
    // limit (at most every 5 s), a lock can come that much early, never late.
    if (now - last >= Math.min(5_000, limitMs / 10) || req.session.lastSeenAt === undefined) {
      req.session.lastSeenAt = now;
    }
    next();
  };
}

export const requireUser: RequestHandler = (req, _res, next) => {
  next(req.user ? undefined : unauthorized());
};

export function requireRole(...roles: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) return next(unauthorized());
    if (!roles.some((r) => req.user!.roles.includes(r))) {
      return next(forbidden(refusal('access.needsRole', { roles: { roles } })));
    }
    next();
  };
}

export const requireKiosk: RequestHandler = (req, _res, next) => {
  next(req.kiosk ? undefined : forbidden(refusal('access.tabletNotEnrolled'), 'kiosk_not_enrolled'));
};

/** What a session signed in with a temporary PIN may still do: choose its own PIN, ask who it is, sign out. */
const openToTemporaryPin = new Set([
  'GET /session',
  'POST /auth/change-pin',
  'POST /auth/touch',
  'POST /auth/sign-out',
]);

/**
 * Engineering chose the temporary PIN, so what it signs is not the badge holder's act: until the PIN is changed,
 * the session is refused everything else. Lifted on the first request after the change (the row is read fresh).
 */
export const refuseTemporaryPin: RequestHandler = (req, _res, next) => {
  if (!req.user || !req.session?.temporaryPin) return next();
  if (!req.staffRow?.mustChangePin) {
    delete req.session.temporaryPin;
    return next();
  }
  if (openToTemporaryPin.has(`${req.method} ${req.path}`)) return next();
  next(new AppError(403, 'pin_change_required', refusal('access.temporaryPinFirst')));
};
