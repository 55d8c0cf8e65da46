import { Router, type Request } from 'express';
import rateLimit, { ipKeyGenerator } from 'express-rate-limit';
import { passport, type Actor } from '../auth/passport.ts';
import { csrfTokenFor, generateCsrfToken } from '../auth/csrf.ts';
import { parse } from '../middleware/validate.ts';
import { forgotPasswordSchema, setPasswordSchema, signInSchema } from '../../shared/schemas/auth.ts';
import { AppError } from '../errors.ts';
import { currentUser, requestPasswordReset, setPasswordWithToken } from '../services/users.ts';
import { config } from '../config.ts';
import { PostgresRequestLimitStore } from '../auth/request-limit-store.ts';
import { logger } from '../logger.ts';

export const authRouter = Router();

// The client address is the socket's, or what a proxy named in TRUST_PROXY reports: never a header the client chose.
const clientAddress = (req: Request) => ipKeyGenerator(req.ip ?? '');

// Failed sign-ins from one address over every e-mail address, against guessing one password across many accounts
// (OWASP ASVS 4.0.3 V2.2.1). Successful sign-ins do not count, so a busy office behind one address is not held up.
const signInAddressLimiter = rateLimit({
  windowMs: 15 * 60 * 1000,
  limit: () => config.signInAddressLimitPerWindow,
  skipSuccessfulRequests: true,
  standardHeaders: 'draft-7',
  legacyHeaders: false,
  keyGenerator: clientAddress,
  store: new PostgresRequestLimitStore('sign-in-address|'),
  handler: (_req, _res, next) => next(new AppError(429, 'rate_limited', 'Too many failed sign-ins from this network; wait 15 minutes and try again.')),
});

// Counted per address and e-mail, so one person's typos do not lock out a whole office.
const signInLimiter = rateLimit({
  windowMs: 15 * 60 * 1000,
  limit: () => config.signInLimitPerWindow,
  standardHeaders: 'draft-7',
  legacyHeaders: false,
  keyGenerator: (req) =>
    `${clientAddress(req)}|${String(req.body?.email ?? '')
      .trim()
      .toLowerCase()}`,
  store: new PostgresRequestLimitStore('sign-in|'),
  handler: (_req, _res, next) => next(new AppError(429, 'rate_limited', 'Too many sign-in attempts; wait 15 minutes and try again.')),
});

const forgotLimiter = rateLimit({
  windowMs: 15 * 60 * 1000,
  limit: 5,
  keyGenerator: (req) =>
    `${clientAddress(req)}|${String(req.body?.email ?? '')
      .trim()
      .toLowerCase()}`,
  store: new PostgresRequestLimitStore('forgot-password|'),
  handler: (_req, _res, next) => next(new AppError(429, 'rate_limited', 'Too many requests; wait 15 minutes and try again.')),
});

// A visitor's token lives in a signed cookie, so asking for one writes no session row.
authRouter.get('/csrf', (req, res) => {
  res.json({ csrfToken: csrfTokenFor(req, res) });
});

authRouter.get('/me', async (req, res) => {
  res.json({ user: req.user ? await currentUser(req.user) : null });
});

function regenerate(req: Request) {
  return new Promise<void>((resolve, reject) => req.session.regenerate((err) => (err ? reject(err) : resolve())));
}
function logIn(req: Request, actor: Actor) {
  return new Promise<void>((resolve, reject) => req.login(actor, (err) => (err ? reject(err) : resolve())));
}

authRouter.post('/sign-in', signInAddressLimiter, signInLimiter, async (req, res, next) => {
  try {
    parse(signInSchema, req.body);
    const actor = await new Promise<Actor | false>((resolve, reject) =>
      passport.authenticate('local', (err: unknown, user: Actor | false) => (err ? reject(err) : resolve(user)))(req, res, next),
    );
    if (!actor) throw new AppError(401, 'bad_credentials', 'That e-mail and password do not match an active account.');
    // A fresh session id at sign-in, so a session id planted before sign-in is worthless.
    await regenerate(req);
    await logIn(req, actor);
    res.json({ user: await currentUser(actor), csrfToken: generateCsrfToken(req, true) });
  } catch (error) {
    next(error);
  }
});

authRouter.post('/sign-out', (req, res, next) => {
  req.logout((err) => {
    if (err) return next(err);
    req.session.destroy(() => {
      res.clearCookie('patchwise.sid');
      res.status(204).end();
    });
  });
});

authRouter.post('/forgot-password', forgotLimiter, (req, res) => {
  const { email } = parse(forgotPasswordSchema, req.body);
  // Answer before any lookup finishes: the reply and its timing say nothing about whether the address exists.
  void requestPasswordReset(email).catch((error) => logger.error({ err: error }, 'password reset failed'));
  res.status(202).json({ message: 'If that address has a Patchwise account, a reset link is on its way.' });
});

authRouter.post('/set-password', async (req, res) => {
  const { token, password } = parse(setPasswordSchema, req.body);
  // Every other session of the account ends; the one that set the password (if it is one) stays.
  const user = await setPasswordWithToken(token, password, req.sessionID);
  res.json({ user, message: 'Your password is set; sign in with it now.' });
});
