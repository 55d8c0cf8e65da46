import { execute, selectRow } from './sql.ts';

export interface HitRow {
  hits: number;
  resets_at: Date;
}

export const findLiveHits = (key: string) =>
  selectRow<HitRow>('SELECT hits, resets_at FROM request_limit_hits WHERE key = :key AND resets_at > now()', { key });

/** One statement, so concurrent requests from one client each count (the row lock orders them). */
export const countHit = async (key: string, windowSeconds: number) =>
  (await selectRow<HitRow>(
    `INSERT INTO request_limit_hits AS h (key, hits, resets_at)
       VALUES (:key, 1, now() + make_interval(secs => :seconds))
       ON CONFLICT (key) DO UPDATE SET
         hits = CASE WHEN h.resets_at <= now() THEN 1 ELSE h.hits + 1 END,
         resets_at = CASE WHEN h.resets_at <= now() THEN EXCLUDED.resets_at ELSE h.resets_at END
       RETURNING hits, resets_at`,
    { key, seconds: windowSeconds },
  ))!;

export const uncountHit = (key: string) => execute('UPDATE request_limit_hits SET hits = greatest(hits - 1, 0) WHERE key = :key', { key });

export const deleteHits = (key: string) => execute('DELETE FROM request_limit_hits WHERE key = :key', { key });

/** Clears the expired counts whose keys start with `prefix` (taken literally, not as a pattern). */
export const deleteExpiredHits = (prefix: string) =>
  execute('DELETE FROM request_limit_hits WHERE key LIKE :prefix AND resets_at <= now()', { prefix: `${prefix.replace(/[\\%_]/g, '\\$&')}%` });
