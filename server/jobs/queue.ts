// The PostgreSQL-backed job queue (pg-boss): web and worker processes on any number of machines share it.
import PgBoss from 'pg-boss';
import { config } from '../config.ts';
import { logger } from '../logger.ts';

let boss: PgBoss | null = null;
let starting: Promise<PgBoss> | null = null;

export function queue(): Promise<PgBoss> {
  if (boss) return Promise.resolve(boss);
  starting ??= (async () => {
    // Maintenance (which retries jobs whose worker died) every 2 minutes, pg-boss's default; fault tests set it shorter.
    const maintenanceIntervalSeconds = Number(process.env.JOB_MAINTENANCE_SECONDS) || 120;
    const instance = new PgBoss({ connectionString: config.databaseUrl, schema: 'pgboss', max: 5, maintenanceIntervalSeconds });
    instance.on('error', (error) => logger.error({ err: error }, 'job queue error'));
    await instance.start();
    boss = instance;
    return instance;
  })();
  return starting;
}

export async function stopQueue() {
  const instance = boss ?? (starting ? await starting.catch(() => null) : null);
  boss = null;
  starting = null;
  if (instance) await instance.stop({ graceful: true, wait: true, timeout: 10_000 });
}

// Creating a queue adds a partition to pg-boss's job table; two processes creating queues at the same moment (two
// workers starting together) can deadlock, and PostgreSQL then fails one of them. The queue exists after either.
const RETRIED_CODES = new Set(['40P01', '40001', '23505', '42P07']);

/** boss.createQueue(), tried again when another process creating queues at the same time made it fail. */
export async function createQueueOnce(boss: PgBoss, name: string, options?: PgBoss.Queue) {
  for (let attempt = 1; ; attempt++) {
    try {
      return await boss.createQueue(name, options);
    } catch (error) {
      if (attempt >= 5 || !RETRIED_CODES.has((error as { code?: string }).code ?? '')) throw error;
      await new Promise((resolve) => setTimeout(resolve, 50 * attempt + Math.random() * 100));
    }
  }
}
