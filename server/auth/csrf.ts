import crypto from 'node:crypto';
import type { Request, RequestHandler, Response } from 'express';
import { csrfSync } from 'csrf-sync';
import { config } from '../config.ts';

// Signed-in requests: a synchroniser token kept in the session; the client sends it back in the x-csrf-token header.
export const { csrfSynchronisedProtection: sessionCsrfProtection, generateToken: generateCsrfToken } = csrfSync({
  getTokenFromRequest: (req) => req.headers['x-csrf-token'] as string | undefined,
});

// Visitors who are not signed in (signing in, asking for a reset link, setting a password): a signed double-submit
// cookie (OWASP CSRF Prevention Cheat Sheet, "signed double-submit cookie"), so handing out a token writes no session
// row. Hand-written: csrf-csrf would bring a second cookie scheme for signed-in requests too; this is one HMAC.
const VISITOR_COOKIE = 'patchwise.csrf';
const UNSAFE_METHODS = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

const signature = (nonce: string) => crypto.createHmac('sha256', config.sessionSecret).update(`csrf-visitor:${nonce}`).digest('base64url');

function visitorCookie(req: Request) {
  const match = new RegExp(`(?:^|;\\s*)${VISITOR_COOKIE.replace('.', '\\.')}=([A-Za-z0-9_.-]+)`).exec(req.headers.cookie ?? '');
  return match?.[1] ?? null;
}

function sameText(a: string, b: string) {
  const left = Buffer.from(a);
  const right = Buffer.from(b);
  return left.length === right.length && crypto.timingSafeEqual(left, right);
}

function signedByUs(token: string | null): token is string {
  const [nonce, signed] = (token ?? '').split('.');
  return Boolean(nonce && signed) && sameText(signed, signature(nonce));
}

function validVisitorToken(req: Request) {
  const sent = req.headers['x-csrf-token'];
  const cookie = visitorCookie(req);
  return typeof sent === 'string' && signedByUs(cookie) && sameText(sent, cookie);
}

/** The token for this request: the session's when signed in, otherwise the visitor cookie's (made if missing). */
export function csrfTokenFor(req: Request, res: Response) {
  if (req.user) return generateCsrfToken(req);
  const held = visitorCookie(req);
  if (signedByUs(held)) return held;
  const nonce = crypto.randomBytes(32).toString('base64url');
  const token = `${nonce}.${signature(nonce)}`;
  // The session cookie's flags, but ending with the browser session: a visitor's token is for the next few minutes.
  res.cookie(VISITOR_COOKIE, token, { httpOnly: true, sameSite: 'lax', secure: config.isProduction, path: '/api' });
  return token;
}

export const csrfProtection: RequestHandler = (req, res, next) => {
  if (req.user) return sessionCsrfProtection(req, res, next);
  if (!UNSAFE_METHODS.has(req.method) || validVisitorToken(req)) return next();
  const error = Object.assign(new Error('invalid csrf token'), { code: 'EBADCSRFTOKEN' });
  next(error);
};
