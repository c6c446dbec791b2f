import { Router, type Request, type Response, type NextFunction } from 'express';
import passport from 'passport';
import { Strategy as CustomStrategy } from 'passport-custom';
import { rateLimit, type Store } from 'express-rate-limit';
import { deskSignInSchema, kioskSignInSchema, type SessionInfo } from '@shared/schemas/auth';
import { checkSignIn, type LockoutPolicy } from '@server/security/credentials';
import type { SignInThrottle } from '@server/security/sign-in-throttle';
import { AppError, forbidden, refusal } from '@server/errors/app-error';
import { requireKiosk } from '@server/middleware/session-guard';
import { rowsReadWithSession } from '@server/middleware/session-store';
import { hangarTimeZone, signedInStaff, toSessionUser } from './auth.service';

interface AuthOptions {
  lockout: LockoutPolicy;
  signInPerMinute: number;
  /** Where the per-address sign-in count is kept (the database, shared by every instance). */
  signInCounts: Store;
  kioskIdleSeconds: number;
  generateCsrfToken: (req: Request, overwrite?: boolean) => string;
}

export function configurePassport(
  instance: passport.PassportStatic,
  lockout: LockoutPolicy,
  throttle: SignInThrottle,
) {
  const attempt = (req: Request, badge: string, secret: string, which: 'pin' | 'password') =>
    checkSignIn(
      { badge, secret, which, address: req.ip ?? 'unknown', fromTablet: req.kiosk !== undefined },
      lockout,
      throttle,
    );
  instance.use(
    'kiosk-pin',
    new CustomStrategy((req, done) => {
      const { badge, pin } = kioskSignInSchema.parse(req.body);
      attempt(req, badge, pin, 'pin')
        .then((staff) => {
          // A temporary PIN from a reset opens only the change-PIN screen (see refuseTemporaryPin).
          req.temporaryPin = Boolean(staff.mustChangePin);
          done(null, toSessionUser(staff));
        })
        .catch(done);
    }),
  );
  instance.use(
    'desk-password',
    new CustomStrategy((req, done) => {
      const { badge, password } = deskSignInSchema.parse(req.body);
      attempt(req, badge, password, 'password')
        .then((staff) => {
          const user = toSessionUser(staff);
          if (!user.roles.some((r) => r === 'shift_lead' || r === 'engineering')) {
            throw forbidden(refusal('access.deskSignInRoles'));
          }
          done(null, user);
        })
        .catch(done);
    }),
  );
  instance.serializeUser((user, done) => done(null, user.id));
  instance.deserializeUser(
    (req: Request, id: number, done: (err: unknown, user?: Express.User | false) => void) => {
      signedInStaff(id, rowsReadWithSession(req.session)?.staff)
        .then((staff) => {
          if (!staff) return done(null, false);
          req.staffRow = staff.row;
          done(null, staff.user);
        })
        .catch(done);
    },
  );
}

export function authRoutes(instance: passport.PassportStatic, options: AuthOptions): Router {
  const router = Router();
  const signInLimiter = rateLimit({
    windowMs: 60_000,
    limit: options.signInPerMinute,
    store: options.signInCounts,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    // X-Forwarded-For is ignored on purpose unless TRUST_PROXY names the proxy that sets it.
    validate: { xForwardedForHeader: false },
    handler: (_req, res) => {
      res.status(429).json({
        code: 'too_many_attempts',
        message: 'Too many sign-in attempts from this device. Wait a minute.',
      });
    },
  });

  const sessionInfo = async (req: Request): Promise<SessionInfo> => ({
    user: req.user ?? null,
    channel: req.user ? (req.session.channel ?? null) : null,
    kiosk: req.kiosk ?? null,
    csrfToken: options.generateCsrfToken(req),
    idleSeconds: options.kioskIdleSeconds,
    timeZone: await hangarTimeZone(),
  });
  const sendSession = (req: Request, res: Response, next: NextFunction, extra: object = {}) => {
    sessionInfo(req)
      .then((info) => res.json({ ...info, ...extra }))
      .catch(next);
  };

  const signIn =
    (strategy: string, channel: 'kiosk' | 'desk') => (req: Request, res: Response, next: NextFunction) => {
      instance.authenticate(strategy, { session: false }, (err: unknown, user: Express.User | false) => {
        if (err) return next(err);
        if (!user) return next(new AppError(401, 'not_signed_in', refusal('access.signInFailed')));
        // passport 0.7 regenerates the session id here, so a planted id never becomes a signed-in one.
        req.login(user, (loginErr) => {
          if (loginErr) return next(loginErr);
          req.session.channel = channel;
          req.session.lastSeenAt = Date.now();
          if (channel === 'kiosk' && req.kiosk) req.session.kioskId = req.kiosk.id;
          options.generateCsrfToken(req, true);
          if (channel !== 'kiosk') return sendSession(req, res, next);
          // A temporary PIN from a reset must be replaced before the badge does anything else (POST /auth/change-pin).
          if (req.temporaryPin) req.session.temporaryPin = true;
          sendSession(req, res, next, { mustChangePin: Boolean(req.temporaryPin) });
        });
      })(req, res, next);
    };

  router.get('/session', (req, res, next) => {
    sendSession(req, res, next);
  });
  router.post('/auth/kiosk', signInLimiter, requireKiosk, signIn('kiosk-pin', 'kiosk'));
  router.post('/auth/desk', signInLimiter, signIn('desk-password', 'desk'));
  router.post('/auth/touch', (req, res, next) => {
    sendSession(req, res, next);
  });
  router.post('/auth/sign-out', (req, res, next) => {
    req.logout((err) => {
      if (err) return next(err);
      req.session.regenerate((regenErr) => {
        if (regenErr) return next(regenErr);
        sendSession(req, res, next);
      });
    });
  });
  return router;
}
