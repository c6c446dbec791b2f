import express, { type Express, type Request } from 'express';
import session from 'express-session';
import cookieParser from 'cookie-parser';
import helmet from 'helmet';
import compression from 'compression';
import expressStaticGzip from 'express-static-gzip';
import passport from 'passport';
import { csrfSync } from 'csrf-sync';
import { existsSync } from 'node:fs';
import { resolve } from 'node:path';
import type { ServerResponse } from 'node:http';
import type { Sequelize } from 'sequelize';
import pino, { type Logger } from 'pino';
// Sets up the process's i18next before any request: shared words a path calls without a language read in English.
import './i18n/translator';
import { usageLimitsOf, type Config } from './config';
import { errorHandler } from './errors/error-handler';
import { AppError, refusal } from './errors/app-error';
import { recogniseKiosk } from './middleware/kiosk-device';
import { firstScreenPages } from './middleware/first-screen-hints';
import { onlyForItsRoutes } from './middleware/route-prefix';
import { idleGuard, refuseTemporaryPin } from './middleware/session-guard';
import { csrfState } from './middleware/csrf-state';
import { pilotReadScope } from './middleware/pilot-read-scope';
import { SignInThrottle, defaultThrottlePolicy } from './security/sign-in-throttle';
import { DatabaseFailureStore, DatabaseRateLimitStore } from './security/sign-in-counts.repository';
import { createSessionStore } from './middleware/session-store';
import { authRoutes, configurePassport } from './features/auth/auth.routes';
import { kioskRoutes } from './features/kiosks/kiosks.routes';
import { checkRoutes } from './features/checks/checks.routes';
import { airframeRoutes } from './features/airframes/airframes.routes';
import { healthRoutes } from './features/health/health.routes';
import { photoRoutes } from './features/photos/photos.routes';
import { photoFileBytes } from './features/photos/photos.service';
import type { PrintOptions } from './pdf/print-options';
import { createPhotoStore, type PhotoStore } from './storage/photo-store';
import { ChangeFeed } from './features/airframes/change-feed';
import { airframeStatuses, airframeSummaries } from './features/airframes/airframes.service';
import { loadStoredCheck } from './features/checks/checks.service';
import { holdRoutes } from './features/holds/holds.routes';
import { holdMailSweep } from './features/holds/hold-mail';
import { acceptanceRoutes } from './features/acceptance/acceptance.routes';
import { boardLinkRoutes } from './features/board-links/board-links.routes';
import { recogniseBoardLink } from './features/board-links/board-link.middleware';
import { handoverRoutes } from './features/handover/handover.routes';
import { defectRoutes } from './features/defects/defects.routes';
import { releaseRoutes } from './features/releases/releases.routes';
import { consumptionMailSweep } from './features/handover/handover.service';
import { mailRoutes } from './features/mail/mail.routes';
import { createMailer } from './mail/mailer';
import { serialTask } from './mail/serial-task';
import { engineeringTypeRoutes } from './features/engineering-types/types.routes';
import { fleetRoutes } from './features/fleet/fleet.routes';
import { staffRoutes } from './features/staff/staff.routes';
import { recordRoutes } from './features/records/records.routes';
import { toolRoutes } from './features/tools/tools.routes';

const permissionsPolicy = [
  'camera=(self)',
  ...[
    'accelerometer',
    'autoplay',
    'bluetooth',
    'display-capture',
    'fullscreen',
    'geolocation',
    'gyroscope',
    'hid',
    'magnetometer',
    'microphone',
    'midi',
    'payment',
    'publickey-credentials-get',
    'screen-wake-lock',
    'serial',
    'usb',
    'xr-spatial-tracking',
  ].map((feature) => `${feature}=()`),
].join(', ');

export interface AppDeps {
  config: Config;
  sequelize: Sequelize;
  logger?: Logger;
  /** Folder with the built client; served with an SPA fallback when it exists. */
  clientDir?: string;
}

/** Headers every answer carries, and the body and cookie parsers. */
function baseMiddleware(app: Express, config: Config) {
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          mediaSrc: ["'self'", 'blob:'],
          styleSrc: ["'self'", "'unsafe-inline'"],
          connectSrc: ["'self'"],
          workerSrc: ["'self'", 'blob:'],
          upgradeInsecureRequests: null,
        },
      },
      crossOriginEmbedderPolicy: false,
      strictTransportSecurity: config.SECURE_COOKIES,
    }),
  );
  // The camera is the only device feature the app uses (the tag and badge scan).
  app.use((_req, res, next) => {
    res.set('Permissions-Policy', permissionsPolicy);
    next();
  });
  app.use(express.json({ limit: '200kb' }));
  app.use(cookieParser(config.SESSION_SECRET));
}

/** Sessions in the database and the sign-in strategies; the lockout policy and the throttle the routes share. */
function sessionsAndSignIn(app: Express, config: Config, sequelize: Sequelize) {
  const store = createSessionStore(sequelize);
  app.use(
    session({
      name: 'gw_session',
      secret: config.SESSION_SECRET,
      store,
      resave: false,
      saveUninitialized: false,
      rolling: true,
      cookie: { httpOnly: true, sameSite: 'lax', secure: config.SECURE_COOKIES, maxAge: 24 * 3_600_000 },
    }),
  );

  const auth = new passport.Passport() as unknown as passport.PassportStatic;
  const lockout = {
    maxAttempts: config.PIN_MAX_ATTEMPTS,
    lockMinutes: config.PIN_LOCK_MINUTES,
    lockMinAddresses: config.LOCK_MIN_ADDRESSES,
    bcryptCost: config.BCRYPT_COST,
  };
  // Counted in the database, so every instance behind the load balancer slows and locks on the same failures.
  const signInThrottle = new SignInThrottle(
    defaultThrottlePolicy,
    Date.now,
    new DatabaseFailureStore(sequelize, config.SIGN_IN_COUNT_SCOPE, defaultThrottlePolicy.windowMs),
  );
  const signInCounts = new DatabaseRateLimitStore(sequelize, config.SIGN_IN_COUNT_SCOPE);
  configurePassport(auth, lockout, signInThrottle);
  // compat: false skips the req._passport object kept for strategies of passport 0.4 and older; none is used, and
  // it was one more object on every request.
  app.use(auth.initialize({ compat: false }));
  app.use(auth.session());
  return { store, auth, lockout, signInThrottle, signInCounts };
}

/**
 * E-mail goes out after the commit, in the background: a mail server that is down never fails a check. What to
 * call after a check is stored, and the retry timer to stop at close.
 */
function backgroundMail(config: Config, sequelize: Sequelize, logger: Logger, changes: ChangeFeed) {
  const mailer = createMailer({
    host: config.SMTP_HOST,
    port: config.SMTP_PORT,
    from: config.MAIL_FROM,
    to: config.MAINTENANCE_CONTROL_EMAILS,
    logger,
    language: config.OPERATOR_LANGUAGE,
  });
  const announceHolds = serialTask('hold e-mail', holdMailSweep(mailer, loadStoredCheck), logger);
  const announceConsumption = serialTask(
    'consumption e-mail',
    consumptionMailSweep(sequelize, mailer),
    logger,
  );
  // The sweeps read every recent hold or every recent top-up, so they run only after a check that opened a hold
  // or added fluid (and the hold sweep once at start, for a hold stored just before a restart).
  const afterCheck = (stored?: { holdOpened: boolean; servicing: unknown[] }) => {
    changes.notify();
    if (!stored) return;
    const holds = stored.holdOpened ? announceHolds() : Promise.resolve();
    if (stored.servicing.length > 0) void holds.then(announceConsumption);
  };
  void announceHolds();
  // Hold and consumption e-mail that failed (mail server down) is tried again, backing off to every 30 minutes.
  const retryMail = serialTask(
    'e-mail retry',
    async () => {
      await mailer.retryFailed();
    },
    logger,
  );
  const retryTimer = setInterval(() => void retryMail(), 60_000);
  retryTimer.unref();
  return { mailer, afterCheck, retryTimer };
}

interface ApiParts {
  config: Config;
  sequelize: Sequelize;
  changes: ChangeFeed;
  signIn: ReturnType<typeof sessionsAndSignIn>;
  mail: ReturnType<typeof backgroundMail>;
  csrf: ReturnType<typeof csrfSync>;
  photos: PhotoStore;
}

/** Every API route, after the guards that recognise the tablet, the board link and the session. */
function apiRouter({ config, sequelize, changes, signIn, mail, csrf, photos }: ApiParts) {
  const { auth, lockout, signInThrottle, signInCounts } = signIn;
  const { mailer, afterCheck } = mail;
  const { csrfSynchronisedProtection, generateToken } = csrf;
  const api = express.Router();
  // Each feature router runs only for the paths its routes start with (server/middleware/route-prefix.ts).
  const mount = (router: express.Router) => api.use(onlyForItsRoutes(router));
  // Shared tablets: no answer of the API is kept in a browser or proxy cache.
  api.use((_req, res, next) => {
    res.set('Cache-Control', 'no-store');
    next();
  });
  api.use(recogniseKiosk({ secureCookies: config.SECURE_COOKIES }));
  api.use(recogniseBoardLink);
  api.use(
    idleGuard({ kioskIdleSeconds: config.KIOSK_IDLE_SECONDS, deskIdleMinutes: config.DESK_IDLE_MINUTES }),
  );
  mount(healthRoutes(sequelize, new Date()));
  api.use(refuseTemporaryPin);
  api.use(csrfSynchronisedProtection);
  mount(
    authRoutes(auth, {
      lockout,
      signInPerMinute: config.SIGN_IN_RATE_PER_MINUTE,
      signInCounts,
      kioskIdleSeconds: config.KIOSK_IDLE_SECONDS,
      generateCsrfToken: generateToken,
    }),
  );
  const print: PrintOptions = {
    operator: config.OPERATOR_NAME,
    publicBaseUrl: config.PUBLIC_BASE_URL,
    photoBytes: (storedName) => photoFileBytes(photos, storedName),
  };
  mount(kioskRoutes({ secureCookies: config.SECURE_COOKIES, sequelize }));
  mount(airframeRoutes(sequelize, changes));
  mount(pilotReadScope(sequelize));
  mount(photoRoutes({ store: photos }));
  const usageLimits = usageLimitsOf(config);
  const statusOf = async (id: number, now: Date) => (await airframeStatuses(sequelize, now, id))[0];
  const onChange = () => changes.notify();
  mount(checkRoutes(sequelize, { lockout, usageLimits, onChange: afterCheck }));
  mount(holdRoutes(sequelize, { lockout, loadCheck: loadStoredCheck, onChange, print }));
  mount(
    acceptanceRoutes(sequelize, {
      lockout,
      usageLimits,
      loadCheck: loadStoredCheck,
      statusOf,
      onChange,
    }),
  );
  mount(defectRoutes(sequelize, { lockout, onChange }));
  mount(
    releaseRoutes(sequelize, {
      lockout,
      statusOf,
      onChange,
    }),
  );
  mount(boardLinkRoutes(sequelize));
  mount(handoverRoutes(sequelize, mailer, () => airframeSummaries(sequelize)));
  mount(mailRoutes());
  mount(engineeringTypeRoutes(sequelize));
  mount(fleetRoutes(sequelize));
  mount(staffRoutes(sequelize, { bcryptCost: config.BCRYPT_COST, lockout, signInThrottle }));
  mount(recordRoutes(sequelize, print));
  mount(toolRoutes(sequelize));
  // The method and path are for the program that asked (beside the words); a person reads what to do.
  api.use((req, _res, next) =>
    next(new AppError(404, 'not_found', refusal('request.noRoute'), { method: req.method, path: req.path })),
  );
  return api;
}

/**
 * Headers that only a page or a worker obeys. A hashed script, style sheet or font is neither (the page's own
 * policy governs what it loads), so these are dropped there: a kilobyte less on each of the first screen's files.
 */
const documentOnlyHeaders = [
  'Content-Security-Policy',
  'Permissions-Policy',
  'Cross-Origin-Opener-Policy',
  'Origin-Agent-Cluster',
  'Referrer-Policy',
  'X-DNS-Prefetch-Control',
  'X-Download-Options',
  'X-Frame-Options',
  'X-Permitted-Cross-Domain-Policies',
  'X-XSS-Protection',
];

/** Vite names each built asset by a hash of its content, so a name never changes meaning: cache it for a year. */
function cacheForever(res: ServerResponse, path: string) {
  // The service worker itself is checked on every start, so a new build is found (its own caches do the rest).
  if (/[\\/]sw\.js$/.test(path)) res.setHeader('Cache-Control', 'no-cache');
  if (/[\\/]assets[\\/][^\\/]+-[A-Za-z0-9_-]{8,}\.[a-z0-9.]+$/.test(path)) {
    res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
    for (const name of documentOnlyHeaders) res.removeHeader(name);
  }
}

/**
 * Answers to reads (the app's page, lists, the board, records) are compressed. Two kinds are not:
 * - the board's event stream, since compression would hold its events back;
 * - the answer to a write (a signed check, a countersign). It is a few kilobytes for the one tablet that wrote,
 *   well inside a first TCP window compressed or not. Compressing it cost the server a zlib stream and two more
 *   socket writes for each signature, about a fifth of a signed check's CPU (measured, DEVELOPERS.md).
 */
const compressAnswers = compression({
  filter: (req, res) =>
    (req.method === 'GET' || req.method === 'HEAD') &&
    !String(res.getHeader('Content-Type') ?? '').startsWith('text/event-stream') &&
    compression.filter(req, res),
});

/** The kiosk's manifest and icons, and the built client with an SPA fallback when it exists. */
function serveClient(app: Express, clientDir: string) {
  // The kiosk's install manifest and icons live with the rest of the tablet provisioning in kiosk/.
  app.get('/manifest.webmanifest', (_req, res) => {
    res.type('application/manifest+json').sendFile(resolve('kiosk', 'manifest.webmanifest'));
  });
  app.use('/kiosk-icons', express.static(resolve('kiosk', 'icons'), { maxAge: '1d' }));

  if (existsSync(resolve(clientDir, 'index.html'))) {
    // The build writes a brotli and a gzip copy beside each asset; the tablet gets the smallest it accepts.
    app.use(
      expressStaticGzip(clientDir, {
        enableBrotli: true,
        orderPreference: ['br', 'gz'],
        index: false,
        serveStatic: { maxAge: '1h', setHeaders: cacheForever },
      }),
    );
    // Every other address is the app: index.html, naming what that address's first screen fetches.
    const pageFor = firstScreenPages(clientDir);
    app.get('/{*splat}', compressAnswers, (req, res) => {
      res
        .set('Cache-Control', 'no-cache')
        .type('html')
        .send(pageFor(req.path, new URL(req.originalUrl, 'http://page').searchParams));
    });
  }
}

export function createApp({
  config,
  sequelize,
  logger = pino({ level: config.LOG_LEVEL }),
  clientDir = resolve('dist'),
}: AppDeps) {
  const app = express();
  app.disable('x-powered-by');
  // Only the proxies named in TRUST_PROXY may say who the client is; by default nobody, so a made-up
  // X-Forwarded-For changes neither the sign-in rate limit nor the failure counts.
  app.set('trust proxy', config.TRUST_PROXY);
  baseMiddleware(app, config);
  const signIn = sessionsAndSignIn(app, config, sequelize);
  const csrf = csrfSync({
    getTokenFromRequest: (req: Request) => req.get('x-csrf-token') ?? undefined,
    ...csrfState(config.SECURE_COOKIES),
    errorConfig: {
      statusCode: 403,
      message: 'The form expired. Reload the page and try again.',
      code: 'csrf_invalid',
    },
  });
  const changes = new ChangeFeed();
  const mail = backgroundMail(config, sequelize, logger, changes);
  const photos = createPhotoStore(config);
  app.use('/api', compressAnswers, apiRouter({ config, sequelize, changes, signIn, mail, csrf, photos }));
  serveClient(app, clientDir);
  app.use(errorHandler(logger));
  return {
    app,
    changes,
    close: () => {
      clearInterval(mail.retryTimer);
      changes.close();
      signIn.store.stopExpiringSessions();
      mail.mailer.close();
      photos.close();
    },
  };
}
