// Monte Carlo simulations spread over worker threads through piscina (the pool the thumbnails and analyses use,
// which replaces a thread that crashed). Each simulation draws from its own seeded stream, so the joined result is
// bit-identical to runSimulations() on one thread whatever the number of threads or chunks.
import { availableParallelism } from 'node:os';
import { Piscina } from 'piscina';
import { joinSimulationChunks, type SimulationChunk, type SimulationPlan } from '../../../shared/analysis/monte-carlo.ts';
import type { ChunkRequest } from './monte-carlo-thread.ts';

export interface MonteCarloPool {
  threads: number;
  /** `onChunk` hears each finished chunk (done of total), for a progress bar; the result does not depend on it. */
  run(plan: SimulationPlan, onChunk?: (done: number, total: number) => void): Promise<SimulationChunk>;
  close(): Promise<void>;
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
  const pool = new Piscina({
    filename: new URL('./monte-carlo-thread-bootstrap.mjs', import.meta.url).href,
    minThreads: threads,
    maxThreads: threads,
    idleTimeout: 30_000,
    ...(options.niceIncrement ? { niceIncrement: options.niceIncrement } : {}),
  });

  return {
    threads,
    async run(plan, onChunk) {
      const chunkCount = Math.max(1, Math.min(plan.simulations, threads * chunksPerThread));
      const bounds = Array.from({ length: chunkCount + 1 }, (_, k) => Math.round((plan.simulations * k) / chunkCount));
      let done = 0;
      const runChunk = async (start: number, end: number) => {
        const chunk = (await pool.run({ plan, start, end } satisfies ChunkRequest)) as SimulationChunk;
        onChunk?.(++done, chunkCount);
        return chunk;
      };
      const chunks = await Promise.all(bounds.slice(0, -1).map((start, k) => runChunk(start, bounds[k + 1])));
      return joinSimulationChunks(plan, chunks);
    },
    async close() {
      await pool.destroy();
    },
  };
}
