import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import { findActiveActor, findUserByEmail, type UserRow } from '../queries/users.ts';
import type { Request } from 'express';
import { verifyPassword } from './passwords.ts';
import { actorReadWithSession } from './session.ts';
import type { Role } from '../../shared/schemas/roles.ts';
import type { DateFormat } from '../../shared/dates/format-dates.ts';

export interface Actor {
  id: string;
  organisationId: string;
  role: Role;
  name: string;
  email: string;
  /** The organisation's date format, when it was read with the session (absent after a sign-in or a fallback read). */
  dateFormat?: DateFormat;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends Actor {}
  }
}

export const actorOf = (user: UserRow): Actor => ({
  id: user.id,
  organisationId: user.organisationId,
  role: user.role,
  name: user.name,
  email: user.email,
});

passport.use(
  new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, async (email, password, done) => {
    try {
      const user = await findUserByEmail(email.trim().toLowerCase());
      const ok = await verifyPassword(user?.passwordHash ?? null, password);
      if (!user || !ok || !user.active) return done(null, false);
      return done(null, actorOf(user));
    } catch (error) {
      return done(error);
    }
  }),
);

passport.serializeUser((actor, done) => done(null, actor.id));

// Reload the user on every request so a deactivated account or a changed role takes effect at once: no cache to go
// stale across processes. The session store reads the user with the session (one query); otherwise, one indexed read.
passport.deserializeUser(async (req: Request, id: string, done: (error: unknown, actor?: Actor | false) => void) => {
  try {
    const readWithSession = actorReadWithSession(req);
    if (readWithSession !== undefined && (readWithSession === null || readWithSession.id === id)) return done(null, (readWithSession as Actor | null) ?? false);
    done(null, (await findActiveActor(id)) ?? false);
  } catch (error) {
    done(error);
  }
});

export { passport };
