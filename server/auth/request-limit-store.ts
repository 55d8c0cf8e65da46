// An express-rate-limit store in PostgreSQL, so the sign-in limits hold across app processes and restarts.
// Written here rather than taken from npm: the PostgreSQL stores on offer pin their own `pg` and run their own
// migration tool at start-up; this is one upsert against a table of our own migrations (0006).
import type { ClientRateLimitInfo, IncrementResponse, Options, Store } from 'express-rate-limit';
import { countHit, deleteExpiredHits, deleteHits, findLiveHits, uncountHit } from '../queries/request-limit-hits.ts';

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
    const row = await findLiveHits(this.prefix + key);
    return row ? { totalHits: row.hits, resetTime: new Date(row.resets_at) } : undefined;
  }

  async increment(key: string): Promise<IncrementResponse> {
    await this.sweepNowAndThen();
    const row = await countHit(this.prefix + key, this.windowMs / 1000);
    return { totalHits: row.hits, resetTime: new Date(row.resets_at) };
  }

  async decrement(key: string) {
    await uncountHit(this.prefix + key);
  }

  async resetKey(key: string) {
    await deleteHits(this.prefix + key);
  }

  /** Expired counts are dead weight: cleared at most once a window, by whichever request comes first. */
  private async sweepNowAndThen() {
    if (Date.now() - this.lastSweep < this.windowMs) return;
    this.lastSweep = Date.now();
    await deleteExpiredHits(this.prefix);
  }
}
