// Read-your-own-writes with read replicas. A replica trails the primary by a moment, so a person who has just saved
// something must not read the older copy: every query of a request that writes goes to the primary, and so do the
// reads of the same browser for a few seconds after it (a short cookie says until when). Tampering with the cookie
// only sends that browser's reads to the primary.
import { AsyncLocalStorage } from 'node:async_hooks';
import type { RequestHandler } from 'express';
import { config } from './config.ts';

const PRIMARY_COOKIE = 'pw_reads_primary_until';
const readsOfThisRequest = new AsyncLocalStorage<{ fromPrimary: boolean }>();

/** Whether the current reads must go to the primary. Outside a request (workers, scripts) they always do: a job reads
 * the rows queued for it the moment they commit. */
export const readsFromPrimary = () => readsOfThisRequest.getStore()?.fromPrimary ?? true;

const writes = (method: string) => method !== 'GET' && method !== 'HEAD' && method !== 'OPTIONS';

function primaryUntil(cookieHeader: string | undefined): number {
  const match = cookieHeader?.match(new RegExp(`(?:^|;\\s*)${PRIMARY_COOKIE}=(\\d+)`));
  return match ? Number(match[1]) : 0;
}

/** Marks each request's reads as primary or replica; a no-op without replicas. */
export function readYourWrites(catchUpSeconds = config.replicaCatchUpSeconds): RequestHandler {
  if (config.databaseReplicaUrls.length === 0) return (_req, _res, next) => next();
  return (req, res, next) => {
    const writing = writes(req.method);
    const fromPrimary = writing || primaryUntil(req.headers.cookie) > Date.now();
    if (writing) {
      // Set before the answer goes, so the browser's next read (often sent the moment this one answers) carries it.
      const until = Date.now() + catchUpSeconds * 1000;
      res.cookie(PRIMARY_COOKIE, String(until), { httpOnly: true, sameSite: 'lax', secure: config.isProduction, maxAge: catchUpSeconds * 1000 });
    }
    readsOfThisRequest.run({ fromPrimary }, next);
  };
}
