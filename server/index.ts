import { createApp } from './app.ts';
import { assertSafeForProduction, config } from './config.ts';
import { startWorkers } from './jobs/workers.ts';
import { stopQueue } from './jobs/queue.ts';
import './jobs/all-workers.ts';
import { closeSimulationPool } from './services/check-runner.ts';
import { markStopping } from './services/readiness.ts';
import { logger } from './logger.ts';
import { workerMode } from './jobs/worker-mode.ts';
import { startWorkerProcess } from './worker.ts';

// Requests still running when this runs out are cut off, so a stuck one cannot hold a deploy for ever.
const SHUTDOWN_GRACE_MS = Number(process.env.SHUTDOWN_GRACE_MS ?? 25_000);

/**
 * Starts the HTTP server and, with WORKERS=all (the default), the background workers in the same process.
 * The web part keeps nothing another process needs (sessions, limits, jobs and files live in PostgreSQL and storage),
 * so any number of these run behind a balancer with WORKERS=none.
 */
export async function startServer(options: { port?: number; host?: string } = {}) {
  assertSafeForProduction();
  if (workerMode() === 'all') await startWorkers();
  const app = createApp();
  const server = await new Promise<import('node:http').Server>((resolve) => {
    const s = app.listen(options.port ?? config.port, options.host ?? '127.0.0.1', () => resolve(s));
  });
  return {
    server,
    /** Graceful: no new connections, requests in flight finish (up to the grace period), then the queue stops. */
    close: async () => {
      markStopping();
      const closed = new Promise<void>((resolve) => server.close(() => resolve()));
      // Idle keep-alive connections would otherwise hold close() open until the client hangs up.
      server.closeIdleConnections();
      const grace = setTimeout(() => server.closeAllConnections(), SHUTDOWN_GRACE_MS);
      grace.unref();
      await closed;
      clearTimeout(grace);
      await stopQueue();
      // Idle simulation worker threads would otherwise keep the process alive.
      await closeSimulationPool();
    },
  };
}

if (import.meta.url === `file://${process.argv[1]}`) {
  // WORKERS=only: the same entry runs as a worker process with no HTTP (server/worker.ts does the same).
  const running = workerMode() === 'only' ? await startWorkerProcess() : await startServer();
  if ('server' in running) logger.info({ url: config.publicUrl }, `Patchwise is serving on ${config.publicUrl}`);
  else logger.info({ workers: running.workers }, 'Patchwise workers are running');
  for (const signal of ['SIGINT', 'SIGTERM'] as const) {
    process.once(signal, () => {
      logger.info({ signal }, 'Stopping: finishing the requests in flight');
      void running.close().then(() => process.exit(0));
    });
  }
}
