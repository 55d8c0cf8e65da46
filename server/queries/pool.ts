// One pg pool for the raw SQL query modules of server/queries/ and the session store: the per-request reads (the
// session, the signed-in user) skip the model layer, whose building and hydrating cost more than the query itself.
import pg from 'pg';
import { config } from '../config.ts';

export const queryPool = new pg.Pool({ connectionString: config.databaseUrl, max: 10, idleTimeoutMillis: 10_000, allowExitOnIdle: true });
// A database restart ends idle connections; the next query gets a fresh one, so the pool's own error is not thrown.
queryPool.on('error', () => {});
