// The app server for the load bench, as a Node process of its own so that its memory figures are the server's
// alone (the load generator stays in the bench process). Started by load-server-process.ts with --expose-gc and
// an IPC channel; reports its port over IPC and answers memory-sample requests with figures taken after a
// forced full garbage collection, so a sample shows what the server keeps, not what it has yet to collect.
import { startServer } from '../../../server/index.ts';
import { sequelize } from '../../../server/db.ts';
import type { LoadServerReply, LoadServerRequest } from './load-server-process.ts';

const send = (reply: LoadServerReply) => process.send?.(reply);
const collectGarbage = globalThis.gc;
if (!process.send || !collectGarbage) throw new Error('load-server.ts runs as a child: started with --expose-gc and an IPC channel.');

/** Waits (at most 30 s) until requests left in flight at the bell have let go of the model pool (sequelize-pool's untyped counters). */
async function untilDatabaseIdle() {
  const pool = (sequelize.connectionManager as unknown as { pool?: { using: number; waiting: number } }).pool;
  const deadline = Date.now() + 30_000;
  while (pool && pool.using + pool.waiting > 0 && Date.now() < deadline) await new Promise((resolve) => setTimeout(resolve, 100));
}

// The parent sets WORKERS=off: thumbnail jobs only queue (rows in PostgreSQL, not memory here). Thumbnail
// threads would take the two cores the read latency is measured on, and the ingest bench measures them already.
const running = await startServer({ port: 0, host: '127.0.0.1' });
const address = running.server.address();
if (!address || typeof address === 'string') throw new Error('the load server has no TCP address');

process.on('message', (request: LoadServerRequest) => {
  if (request.type === 'memory') {
    collectGarbage();
    const m = process.memoryUsage();
    send({ type: 'memory', id: request.id, heapUsed: m.heapUsed, heapTotal: m.heapTotal, external: m.external, arrayBuffers: m.arrayBuffers, rss: m.rss });
  } else if (request.type === 'cpu') {
    const { user, system } = process.cpuUsage();
    send({ type: 'cpu', id: request.id, user, system });
  } else if (request.type === 'stop') {
    running.server.closeAllConnections();
    void untilDatabaseIdle()
      .then(() => running.close())
      .then(() => sequelize.close())
      .finally(() => process.exit(0));
  }
});
// The bench process went away (crash, Ctrl-C): do not outlive it.
process.on('disconnect', () => process.exit(1));

send({ type: 'listening', port: address.port });
