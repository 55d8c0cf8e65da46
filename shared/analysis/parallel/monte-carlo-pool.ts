// Monte Carlo simulations spread over worker threads. Not part of the pure engine: it starts threads.
// Each simulation draws from its own seeded stream, so the joined result is bit-identical to
// runSimulations() on one thread whatever the number of threads or chunks.
import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import { joinSimulationChunks, type SimulationChunk, type SimulationPlan } from '../monte-carlo.ts';

export interface MonteCarloPool {
  threads: number;
  /** `onChunk` hears each finished chunk (done of total), for a progress bar; the result does not depend on it. */
  run(plan: SimulationPlan, onChunk?: (done: number, total: number) => void): Promise<SimulationChunk>;
  close(): Promise<void>;
}

interface Pending {
  resolve(chunk: SimulationChunk): void;
  reject(error: Error): void;
}

export interface MonteCarloPoolOptions {
  threads?: number;
  chunksPerThread?: number;
  /**
   * Added to each thread's nice value (Linux keeps one per thread), so a server's own request thread stays ahead of
   * the simulations. 0 (the default) for the command line and benchmarks.
   */
  niceIncrement?: number;
}

export function createMonteCarloPool(options: MonteCarloPoolOptions = {}): MonteCarloPool {
  const threads = Math.max(1, options.threads ?? availableParallelism());
  const chunksPerThread = options.chunksPerThread ?? 4;
  const workers: Worker[] = [];
  const idle: Worker[] = [];
  const queue: Array<{ message: { id: number; plan: SimulationPlan; start: number; end: number } }> = [];
  const pending = new Map<number, Pending>();
  let nextId = 0;
  // A JavaScript entry that registers tsx in the thread: loader flags inherited from the parent do not reach workers on Node 20.
  const workerUrl = new URL('./monte-carlo-worker-bootstrap.mjs', import.meta.url);

  const dispatch = () => {
    while (idle.length && queue.length) {
      const worker = idle.pop() as Worker;
      const job = queue.shift() as (typeof queue)[number];
      worker.postMessage(job.message);
    }
  };
  for (let t = 0; t < threads; t++) {
    const worker = new Worker(workerUrl, { workerData: { niceIncrement: options.niceIncrement ?? 0 } });
    worker.on('message', (reply: { id: number; chunk?: SimulationChunk; error?: string }) => {
      const waiting = pending.get(reply.id);
      pending.delete(reply.id);
      idle.push(worker);
      dispatch();
      if (!waiting) return;
      if (reply.chunk) waiting.resolve(reply.chunk);
      else waiting.reject(new Error(reply.error ?? 'A simulation worker failed.'));
    });
    worker.on('error', (error) => {
      for (const waiting of pending.values()) waiting.reject(error);
      pending.clear();
    });
    workers.push(worker);
    idle.push(worker);
  }

  const runChunk = (plan: SimulationPlan, start: number, end: number) =>
    new Promise<SimulationChunk>((resolve, reject) => {
      const id = nextId++;
      pending.set(id, { resolve, reject });
      queue.push({ message: { id, plan, start, end } });
      dispatch();
    });

  return {
    threads,
    async run(plan, onChunk) {
      const chunkCount = Math.max(1, Math.min(plan.simulations, threads * chunksPerThread));
      const bounds = Array.from({ length: chunkCount + 1 }, (_, k) => Math.round((plan.simulations * k) / chunkCount));
      let done = 0;
      const counted = (chunk: SimulationChunk) => {
        onChunk?.(++done, chunkCount);
        return chunk;
      };
      const chunks = await Promise.all(bounds.slice(0, -1).map((start, k) => runChunk(plan, start, bounds[k + 1]).then(counted)));
      return joinSimulationChunks(plan, chunks);
    },
    async close() {
      await Promise.all(workers.map((worker) => worker.terminate()));
    },
  };
}
