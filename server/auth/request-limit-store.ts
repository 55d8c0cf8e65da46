// An express-rate-limit store in PostgreSQL, so the sign-in limits hold across app processes and restarts.
// Written here rather than taken from npm: the PostgreSQL stores on offer pin their own `pg` and run their own
// migration tool at start-up; this is one upsert against a table of our own migrations (0006).
import { QueryTypes } from 'sequelize';
import type { ClientRateLimitInfo, IncrementResponse, Options, Store } from 'express-rate-limit';
import { sequelize } from '../db.ts';

interface HitRow {
  hits: number;
  resets_at: Date;
}

export class PostgresRequestLimitStore implements Store {
  readonly localKeys = false;
  private windowMs = 60_000;
  private lastSweep = 0;

  /** `prefix` keeps two limiters' counts for the same client apart. */
  constructor(readonly prefix: string) {}

  init(options: Options) {
    this.windowMs = options.windowMs;
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const [row] = await sequelize.query<HitRow>('SELECT hits, resets_at FROM request_limit_hits WHERE key = :key AND resets_at > now()', {
      replacements: { key: this.prefix + key },
      type: QueryTypes.SELECT,
    });
    return row ? { totalHits: row.hits, resetTime: new Date(row.resets_at) } : undefined;
  }

  /** One statement, so concurrent requests from one client each count (the row lock orders them). */
  async increment(key: string): Promise<IncrementResponse> {
    await this.sweepNowAndThen();
    const [row] = await sequelize.query<HitRow>(
      `INSERT INTO request_limit_hits AS h (key, hits, resets_at)
       VALUES (:key, 1, now() + make_interval(secs => :seconds))
       ON CONFLICT (key) DO UPDATE SET
         hits = CASE WHEN h.resets_at <= now() THEN 1 ELSE h.hits + 1 END,
         resets_at = CASE WHEN h.resets_at <= now() THEN EXCLUDED.resets_at ELSE h.resets_at END
       RETURNING hits, resets_at`,
      { replacements: { key: this.prefix + key, seconds: this.windowMs / 1000 }, type: QueryTypes.SELECT },
    );
    return { totalHits: row.hits, resetTime: new Date(row.resets_at) };
  }

  async decrement(key: string) {
    await sequelize.query('UPDATE request_limit_hits SET hits = greatest(hits - 1, 0) WHERE key = :key', { replacements: { key: this.prefix + key } });
  }

  async resetKey(key: string) {
    await sequelize.query('DELETE FROM request_limit_hits WHERE key = :key', { replacements: { key: this.prefix + key } });
  }

  /** Expired counts are dead weight: cleared at most once a window, by whichever request comes first. */
  private async sweepNowAndThen() {
    if (Date.now() - this.lastSweep < this.windowMs) return;
    this.lastSweep = Date.now();
    await sequelize.query('DELETE FROM request_limit_hits WHERE key LIKE :prefix AND resets_at <= now()', {
      replacements: { prefix: `${this.prefix.replace(/[\\%_]/g, '\\$&')}%` },
    });
  }
}
