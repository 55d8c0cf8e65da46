// Structured JSON logs (pino), one line per request with its id, so a request can be followed across processes.
import crypto from 'node:crypto';
import type { RequestHandler } from 'express';
import pino, { type DestinationStream, type Logger } from 'pino';

// The suites would drown in request lines; LOG_LEVEL turns them back on.
const defaultLevel = process.env.LOG_LEVEL ?? (process.env.NODE_ENV === 'test' ? 'silent' : 'info');

// Lines go to stdout without blocking the request: while one write is under way the next lines queue and go out
// together, so under load there is one write per batch, not one blocking write per request (a slow log pipe would
// otherwise stall every answer). pino flushes what is left when the process exits.
const bufferedStdout = () => pino.destination({ dest: 1, sync: false });

export function createLogger(destination?: DestinationStream, level = defaultLevel): Logger {
  return pino({ level, base: { service: 'patchwise', pid: process.pid } }, destination ?? (level === 'silent' ? undefined : bufferedStdout()));
}

export const logger = createLogger();

// A caller's own id is kept when it looks like one (a proxy in front may have set it); anything else is replaced.
const ACCEPTABLE_REQUEST_ID = /^[A-Za-z0-9._-]{8,64}$/;

// Notice links carry their credential in the path; logs keep the route, never the token.
export const redactPath = (url: string) =>
  url
    .split('?')[0]
    .replace(/^\/api\/notice-links\/[^/]+/, '/api/notice-links/[token]')
    .replace(/^\/n\/[^/]+/, '/n/[token]');

declare module 'http' {
  interface IncomingMessage {
    /** The request id: the caller's own when well-formed, otherwise a fresh UUID; also sent back as X-Request-Id. */
    id?: string;
    /** A logger whose lines carry the request id (made on first use). */
    log?: Logger;
  }
}

const PROBES = new Set(['/healthz', '/readyz']);

/**
 * One JSON line per request with its id, method, path (tokens redacted), status and time. Hand-written on pino rather
 * than pino-http: its per-request child logger and serializer pass cost about 50 µs of CPU on every request, a
 * quarter of what a small signed-in read costs here; this costs about half as much. The child logger that error lines
 * need is made only when one is written.
 */
export function requestLogging(log: Logger = logger): RequestHandler {
  return (req, res, next) => {
    const given = req.headers['x-request-id'];
    const id = typeof given === 'string' && ACCEPTABLE_REQUEST_ID.test(given) ? given : crypto.randomUUID();
    res.setHeader('X-Request-Id', id);
    req.id = id;
    let child: Logger | undefined;
    Object.defineProperty(req, 'log', { configurable: true, get: () => (child ??= log.child({ reqId: id })) });
    if (PROBES.has(req.url)) return next();
    // Read now: a mounted router rewrites req.url while it handles the request.
    const line = { id, method: req.method, path: redactPath(req.url) };
    const started = performance.now();
    const written = (message: string) => {
      const status = res.statusCode;
      const level = status >= 500 ? 'error' : status >= 400 ? 'warn' : 'info';
      log[level]({ req: line, res: { status }, responseTime: Math.round(performance.now() - started) }, message);
    };
    res.once('finish', () => written('request completed'));
    res.once('close', () => {
      if (!res.writableFinished) written('request aborted');
    });
    next();
  };
}
