import session from 'express-session';
import connectPgSimple from 'connect-pg-simple';
import type { Request } from 'express';
import pg from 'pg';
import { config, type Config } from '../config.ts';
import { findLiveSessionWithActor, type SessionWithActorRow } from '../queries/session.ts';

const PgStore = connectPgSimple(session);

type SessionConfig = Pick<Config, 'sessionSecret' | 'isProduction' | 'isTest'>;
type SessionActor = SessionWithActorRow['actor'];

/** The session cookie's flags: never readable by scripts, not sent on cross-site sub-requests, HTTPS-only in production. */
export const sessionCookieOptions = (c: SessionConfig = config): session.CookieOptions => ({
  httpOnly: true,
  sameSite: 'lax',
  secure: c.isProduction,
  maxAge: 12 * 60 * 60 * 1000,
});

// The user read with each session, keyed by the stored session object until express-session builds the request's
// session from it (createSession), which is where the request first meets it.
const actorsOfLoadedSessions = new WeakMap<object, SessionActor>();
const actorsOfRequests = new WeakMap<Request, SessionActor>();

/**
 * The signed-in user read with the session (`findLiveSessionWithActor`), or undefined when this request's session was
 * not loaded from the store (then passport reads the user itself).
 */
export const actorReadWithSession = (req: Request): SessionActor | undefined => actorsOfRequests.get(req);

/** connect-pg-simple, but a session's read brings its signed-in user along: one query per request instead of two. */
class SessionWithActorStore extends PgStore {
  readonly #pool: pg.Pool;

  constructor(options: ConstructorParameters<typeof PgStore>[0] & { pool: pg.Pool }) {
    super(options);
    this.#pool = options.pool;
  }

  override get(sid: string, callback: (error: unknown, session?: session.SessionData | null) => void) {
    findLiveSessionWithActor(this.#pool, sid).then(
      (row) => {
        if (!row) return callback(null, null);
        actorsOfLoadedSessions.set(row.sess, row.actor);
        callback(null, row.sess as unknown as session.SessionData);
      },
      (error: unknown) => callback(error),
    );
  }

  override createSession(req: Request, stored: session.SessionData) {
    const actor = actorsOfLoadedSessions.get(stored);
    if (actor !== undefined) actorsOfRequests.set(req, actor);
    return super.createSession(req, stored);
  }
}

export function sessionMiddleware(pool: pg.Pool, c: SessionConfig = config) {
  // disableTouch: with rolling off a session ends a working day after sign-in, so its row's expiry never moves; without it
  // express-session touches the store (an UPDATE) on every request that did not change the session.
  const store = new SessionWithActorStore({ pool, tableName: 'session', pruneSessionInterval: c.isTest ? false : 15 * 60, disableTouch: true });
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
