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
  // disableTouch: with rolling off a session ends a working day after sign-in, so its row's expiry never moves; without it
  // express-session touches the store (an UPDATE) on every request that did not change the session.
  const store = new PgStore({ pool, tableName: 'session', pruneSessionInterval: c.isTest ? false : 15 * 60, disableTouch: true });
  // Without a listener the store's own connection errors (a database restart) would be thrown as unhandled events.
  store.on?.('error', () => {});
  return session({
    name: 'patchwise.sid',
    secret: c.sessionSecret,
    store,
    resave: false,
    saveUninitialized: false,
    // A session lasts one working day from sign-in.
    rolling: false,
    cookie: sessionCookieOptions(c),
  });
}
