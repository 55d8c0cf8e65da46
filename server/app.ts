// Builds the Express app (exported for supertest); server/index.ts only listens.
import express, { type Express } from 'express';
import helmet from 'helmet';
import compression from 'compression';
import fs from 'node:fs';
import path from 'node:path';
import { config } from './config.ts';
import { passport } from './auth/passport.ts';
import { sessionMiddleware } from './auth/session.ts';
import { csrfProtection } from './auth/csrf.ts';
import { errorHandler, notFound } from './errors.ts';
import { authRouter } from './routes/auth.ts';
import { usersRouter } from './routes/users.ts';
import { farmsRouter } from './routes/farms.ts';
import { fieldsRouter } from './routes/fields.ts';
import { pestsRouter } from './routes/pests.ts';
import { mailboxRouter } from './routes/mailbox.ts';
import { configRouter } from './routes/config.ts';
import { zoneSetsRouter } from './routes/zone-sets.ts';
import { noticesRouter } from './routes/notices.ts';
import { noticeLinksRouter } from './routes/notice-links.ts';
import { growerRouter } from './routes/grower.ts';
import { walksRouter } from './routes/walks.ts';
import { sightingsRouter } from './routes/sightings.ts';
import { photosRouter } from './routes/photos.ts';
import { checksRouter } from './routes/checks.ts';
import { fieldInsightsRouter } from './routes/field-insights.ts';
import { advisersRouter } from './routes/advisers.ts';
import { healthRouter } from './routes/health.ts';
import { logger, requestLogging } from './logger.ts';
import { queryPool } from './queries/pool.ts';
import { readYourWrites } from './db-freshness.ts';
import type { Logger } from 'pino';
import { prepareSpool } from './services/photo-spool.ts';

function tileOrigin(tileUrl: string) {
  try {
    return new URL(tileUrl.replace(/\{[a-z]\}/g, 'a')).origin;
  } catch {
    return null;
  }
}

export interface AppOptions {
  /** Serve the built client from this folder (skipped when it does not exist). */
  clientDir?: string;
  /** Where request lines go (tests hand in their own to read them). */
  logger?: Logger;
}

export function createApp(options: AppOptions = {}): Express {
  const app = express();
  // Off by default: X-Forwarded-For is believed only from the proxies TRUST_PROXY names, so no client picks its own address.
  app.set('trust proxy', config.trustProxy);
  app.disable('x-powered-by');
  app.use(requestLogging(options.logger ?? logger));
  prepareSpool().catch((error: unknown) => logger.error({ err: error, dir: config.photoSpoolDir }, 'The photo spool folder could not be made'));
  // Before sessions: a probe creates no session and needs no database beyond its own check.
  app.use(healthRouter);

  const tiles = tileOrigin(config.tileUrl);
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          'img-src': ["'self'", 'data:', 'blob:', ...(tiles ? [tiles] : [])],
          'connect-src': ["'self'"],
          'frame-src': ["'self'"],
          'upgrade-insecure-requests': config.isProduction ? [] : null,
        },
      },
      strictTransportSecurity: config.isProduction,
    }),
  );

  // Check results, sightings and field lists grow with the data to megabytes of JSON; gzip shrinks them about tenfold.
  // Below 8 KB a gzip stream costs the server more than the few hundred bytes it saves on the wire. The routes whose
  // answers stay small whatever the data (config, sign-in, the pest library, photos already compressed) skip the middleware: merely wrapping
  // each answer costs about 30 µs of CPU, a seventh of a small signed-in read (measured with the load bench).
  const gzipLargeAnswers = compression({ threshold: '8kb' });
  const SMALL_ANSWERS = /^\/api\/(config|auth|pests|photos)(\/|$)/;
  app.use((req, res, next) => (SMALL_ANSWERS.test(req.path) ? next() : gzipLargeAnswers(req, res, next)));

  app.use('/api', express.json({ limit: '6mb' }));
  app.use('/api', sessionMiddleware(queryPool));
  app.use('/api', passport.session());
  app.use('/api', (req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  app.use('/api', readYourWrites());
  // The public POSTs of the e-mailed link, without a session: a grower acknowledging a notice, and the page recording
  // its opening. Exempt from CSRF only because the unguessable token in the path is itself the credential (a forged
  // request cannot know it).
  const noticeLinkPost = /^\/notice-links\/[^/]+\/(acknowledge|opened)$/;
  app.use('/api', (req, res, next) => (req.method === 'POST' && noticeLinkPost.test(req.path) ? next() : csrfProtection(req, res, next)));

  app.use('/api/auth', authRouter);
  app.use('/api/config', configRouter);
  app.use('/api/users', usersRouter);
  app.use('/api/farms', farmsRouter);
  app.use('/api/fields', fieldsRouter);
  app.use('/api/fields', fieldInsightsRouter);
  app.use('/api/checks', checksRouter);
  app.use('/api/advisers', advisersRouter);
  app.use('/api/pests', pestsRouter);
  app.use('/api/mailbox', mailboxRouter);
  app.use('/api', zoneSetsRouter);
  app.use('/api/notices', noticesRouter);
  app.use('/api/notice-links', noticeLinksRouter);
  app.use('/api/grower', growerRouter);
  app.use('/api/walks', walksRouter);
  app.use('/api/sightings', sightingsRouter);
  app.use('/api/photos', photosRouter);

  app.use('/api', (_req, _res, next) => next(notFound('That API route')));

  const clientDir = options.clientDir ?? config.clientDir;
  if (fs.existsSync(path.join(clientDir, 'index.html'))) {
    app.use(
      express.static(clientDir, {
        index: false,
        maxAge: '1h',
        // The service worker and manifest name the build's files: a phone must see a new build at once, not in an hour.
        setHeaders: (res, file) => {
          if (/(^|[\\/])(sw\.js|manifest\.webmanifest)$/.test(file)) res.setHeader('Cache-Control', 'no-cache');
        },
      }),
    );
    app.get(/^(?!\/api\/).*/, (_req, res) => res.sendFile(path.join(clientDir, 'index.html')));
  }

  app.use(errorHandler);
  return app;
}
