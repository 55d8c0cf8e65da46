import session from 'express-session';
import connectPgSimple from 'connect-pg-simple';
import pg from 'pg';
import { config } from '../config.ts';

const PgStore = connectPgSimple(session);

export function sessionMiddleware(pool: pg.Pool) {
  return session({
    name: 'patchwise.sid',
    secret: config.sessionSecret,
    store: new PgStore({ pool, tableName: 'session', pruneSessionInterval: config.isTest ? false : 15 * 60 }),
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: config.isProduction,
      maxAge: 12 * 60 * 60 * 1000,
    },
  });
}
