import type { RequestHandler, Request } from 'express';
import type { Role } from '../../shared/schemas/roles.ts';
import { forbidden, unauthorised } from '../errors.ts';
import type { Actor } from '../auth/passport.ts';

/** Lets the request through only for a signed-in user holding one of the roles. */
export function requireRole(...allowed: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) return next(unauthorised());
    if (!allowed.includes(req.user.role)) return next(forbidden());
    next();
  };
}

export const requireSignedIn: RequestHandler = (req, _res, next) => (req.user ? next() : next(unauthorised()));

export function actor(req: Request): Actor {
  if (!req.user) throw unauthorised();
  return req.user;
}
