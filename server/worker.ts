// A worker-only process: the pg-boss workers (checks, notice copies, thumbnails, housekeeping) and no HTTP.
// Run as many as the queue needs beside web processes started with WORKERS=none; all share one database.
import { assertSafeForProduction } from './config.ts';
import { startWorkers } from './jobs/workers.ts';
import { stopQueue } from './jobs/queue.ts';
import './jobs/all-workers.ts';
import { closeSimulationPool } from './services/check-runner.ts';
import { logger } from './logger.ts';

/** Starts every registered worker; close() lets jobs in hand finish (pg-boss's graceful stop) and ends the thread pools. */
export async function startWorkerProcess() {
  assertSafeForProduction();
  const workers = await startWorkers();
  return {
    workers,
    close: async () => {
      await stopQueue();
      await closeSimulationPool();
    },
  };
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const running = await startWorkerProcess();
  logger.info({ workers: running.workers }, 'Patchwise workers are running');
  for (const signal of ['SIGINT', 'SIGTERM'] as const) {
    process.once(signal, () => {
      logger.info({ signal }, 'Stopping: letting the jobs in hand finish');
      void running.close().then(() => process.exit(0));
    });
  }
}
