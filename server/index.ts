import { createApp } from './app.ts';
import { assertSafeForProduction, config } from './config.ts';
import { startWorkers } from './jobs/workers.ts';
import { stopQueue } from './jobs/queue.ts';
import './jobs/all-workers.ts';
import { closeSimulationPool } from './services/check-runner.ts';
import { markStopping } from './services/readiness.ts';
import { logger } from './logger.ts';

// Requests still running when this runs out are cut off, so a stuck one cannot hold a deploy for ever.
const SHUTDOWN_GRACE_MS = Number(process.env.SHUTDOWN_GRACE_MS ?? 25_000);

/** Starts the HTTP server and, unless WORKERS=off, the background workers in the same process. */
export async function startServer(options: { port?: number; host?: string } = {}) {
  assertSafeForProduction();
  if (process.env.WORKERS !== 'off') await startWorkers();
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
  const running = await startServer();
  logger.info({ url: config.publicUrl }, `Patchwise is serving on ${config.publicUrl}`);
  for (const signal of ['SIGINT', 'SIGTERM'] as const) {
    process.once(signal, () => {
      logger.info({ signal }, 'Stopping: finishing the requests in flight');
      void running.close().then(() => process.exit(0));
    });
  }
}
