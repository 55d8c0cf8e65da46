// Analyses and boundary checks run on worker threads (piscina), at the background priority of the Monte Carlo
// threads, so a heavy check, strip or boundary never holds up the answers to other requests.
import { availableParallelism } from 'node:os';
import { Piscina } from 'piscina';
import { BACKGROUND_THREAD_NICE } from './background-priority.ts';
import type { AnalysisAnswer, AnalysisTask } from './analysis-thread.ts';
import { AnalysisInputError } from '../../shared/analysis/errors.ts';
import { BoundaryError } from '../../shared/boundary/boundary-faults.ts';

let pool: Piscina | null = null;

export const analysisThreads = () => {
  const configured = Number(process.env.ANALYSIS_THREADS);
  return Number.isFinite(configured) && configured >= 1 ? Math.floor(configured) : Math.max(1, availableParallelism());
};

/** Runs one task on an analysis thread; the engine's input errors and boundary faults are thrown here as their own classes. */
export async function runInAnalysisThread<K extends AnalysisTask['kind']>(task: AnalysisTask & { kind: K }): Promise<Extract<AnalysisAnswer, { kind: K }>> {
  pool ??= new Piscina({
    filename: new URL('./analysis-thread-bootstrap.mjs', import.meta.url).href,
    minThreads: 0,
    maxThreads: analysisThreads(),
    idleTimeout: 10_000,
    // piscina applies it through @napi-rs/nice, in each analysis thread only.
    niceIncrement: BACKGROUND_THREAD_NICE,
  });
  const answer = (await pool.run(task)) as AnalysisAnswer;
  if (answer.kind === 'input-error') throw new AnalysisInputError(answer.message);
  if (answer.kind === 'boundary-fault') throw new BoundaryError(answer.fault);
  return answer as Extract<AnalysisAnswer, { kind: K }>;
}

export async function closeAnalysisPool() {
  const closing = pool;
  pool = null;
  await closing?.destroy();
}
