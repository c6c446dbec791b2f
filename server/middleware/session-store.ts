import session from 'express-session';
import ConnectSessionSequelize from 'connect-session-sequelize';
import type { Sequelize } from 'sequelize';
import { readSessionData, writeSessionData } from '../db/session-rows';

const SequelizeStore = ConnectSessionSequelize(session.Store);

const EXPIRATION_MS = 24 * 3_600_000;

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
      (data) => done(null, data ? (JSON.parse(data) as session.SessionData) : null),
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
