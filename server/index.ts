import { createApp } from './app.ts';
import { assertSafeForProduction, config } from './config.ts';
import { startWorkers } from './jobs/workers.ts';
import { stopQueue } from './jobs/queue.ts';
import './jobs/all-workers.ts';
import { closeSimulationPool } from './services/check-runner.ts';

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
    close: async () => {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await stopQueue();
      // Idle simulation worker threads would otherwise keep the process alive.
      await closeSimulationPool();
    },
  };
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const running = await startServer();
  console.log(`Patchwise is serving on ${config.publicUrl}`);
  for (const signal of ['SIGINT', 'SIGTERM'] as const) process.on(signal, () => void running.close().then(() => process.exit(0)));
}
