import session from 'express-session';
import connectPgSimple from 'connect-pg-simple';
import pg from 'pg';
import { config, type Config } from '../config.ts';

const PgStore = connectPgSimple(session);

type SessionConfig = Pick<Config, 'sessionSecret' | 'isProduction' | 'isTest'>;

/** The session cookie's flags: never readable by scripts, not sent on cross-site sub-requests, HTTPS-only in production. */
export const sessionCookieOptions = (c: SessionConfig = config): session.CookieOptions => ({
  httpOnly: true,
  sameSite: 'lax',
  secure: c.isProduction,
  maxAge: 12 * 60 * 60 * 1000,
});

export function sessionMiddleware(pool: pg.Pool, c: SessionConfig = config) {
  const store = new PgStore({ pool, tableName: 'session', pruneSessionInterval: c.isTest ? false : 15 * 60 });
  // Without a listener the store's own connection errors (a database restart) would be thrown as unhandled events.
  store.on?.('error', () => {});
  return session({
    name: 'patchwise.sid',
    secret: c.sessionSecret,
    store,
    resave: false,
    saveUninitialized: false,
    // A session lasts one working day from sign-in; not rolling it spares every read a session UPDATE.
    rolling: false,
    cookie: sessionCookieOptions(c),
  });
}
