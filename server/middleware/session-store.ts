import session from 'express-session';
import ConnectSessionSequelize from 'connect-session-sequelize';
import type { Sequelize } from 'sequelize';
import { readSessionData, writeSessionData, type SessionRead } from '../db/session-rows';

const SequelizeStore = ConnectSessionSequelize(session.Store);

const EXPIRATION_MS = 24 * 3_600_000;

type ReadWithSession = Omit<SessionRead, 'data'>;

/**
 * The person and tablet rows read with a session, for the rest of that request. Keyed by the session's `passport`
 * object, which express-session hands on to `req.session` as it is, so the rows live exactly as long as the request's
 * session and no other request can see them.
 */
const readWith = new WeakMap<object, ReadWithSession>();

/** The rows read with this request's session, if the session is signed in and was read this request. */
export function rowsReadWithSession(session: Partial<session.SessionData> | undefined) {
  const passport = (session as { passport?: unknown } | undefined)?.passport;
  return typeof passport === 'object' && passport !== null ? readWith.get(passport) : undefined;
}

/**
 * Sessions live in the database (`sessions`), so any app instance can answer any tablet. The package's store reads
 * a session through a model instance on every request and writes one with a find, a create and a save; this one
 * reads and upserts the row straight through the connector, and leaves out a session whose time has run out even
 * before the package's cleanup removes it. Cleanup and destroy stay the package's.
 */
class SessionStore extends SequelizeStore {
  constructor(private readonly sequelize: Sequelize) {
    // disableTouch is in the store's options but not in its type declarations.
    const options: ConstructorParameters<typeof SequelizeStore>[0] & { disableTouch: boolean } = {
      db: sequelize,
      table: 'Session',
      checkExpirationInterval: 15 * 60_000,
      expiration: EXPIRATION_MS,
      // The idle guard stores the session when its last-seen time moves; a write of the expiry on every other
      // request as well would add a commit to every read and every signed check.
      disableTouch: true,
    };
    super(options);
  }

  override get(sid: string, done: (err: unknown, data?: session.SessionData | null) => void) {
    readSessionData(this.sequelize, sid, new Date()).then(
      (read) => {
        if (!read) return done(null, null);
        const data = JSON.parse(read.data) as session.SessionData & { passport?: unknown };
        if (typeof data.passport === 'object' && data.passport !== null)
          readWith.set(data.passport, { staff: read.staff, device: read.device });
        done(null, data);
      },
      (err: unknown) => done(err),
    );
  }

  override set(sid: string, data: session.SessionData, done?: (err?: unknown) => void) {
    const expires = data.cookie.expires
      ? new Date(data.cookie.expires)
      : new Date(Date.now() + EXPIRATION_MS);
    writeSessionData(this.sequelize, sid, expires, JSON.stringify(data)).then(
      () => done?.(),
      (err: unknown) => done?.(err),
    );
  }
}

export const createSessionStore = (sequelize: Sequelize) => new SessionStore(sequelize);
