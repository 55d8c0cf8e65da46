// Structured JSON logs (pino), one line per request with its id, so a request can be followed across processes.
import crypto from 'node:crypto';
import type { IncomingMessage, ServerResponse } from 'node:http';
import pino, { type DestinationStream, type Logger } from 'pino';
import { pinoHttp } from 'pino-http';

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

export function requestLogging(log: Logger = logger) {
  return pinoHttp({
    logger: log,
    genReqId(req: IncomingMessage, res: ServerResponse) {
      const given = req.headers['x-request-id'];
      const id = typeof given === 'string' && ACCEPTABLE_REQUEST_ID.test(given) ? given : crypto.randomUUID();
      res.setHeader('X-Request-Id', id);
      return id;
    },
    serializers: {
      req: (req: { id: string; method: string; url: string }) => ({ id: req.id, method: req.method, path: redactPath(req.url) }),
      res: (res: { statusCode: number }) => ({ status: res.statusCode }),
    },
    customLogLevel: (_req, res, error) => (error || res.statusCode >= 500 ? 'error' : res.statusCode >= 400 ? 'warn' : 'info'),
    autoLogging: { ignore: (req) => req.url === '/healthz' || req.url === '/readyz' },
  });
}
