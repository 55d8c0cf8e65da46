// Worker thread body: runs one chunk of a simulation plan and hands the typed arrays back without copying.
import { parentPort } from 'node:worker_threads';
import { runSimulationChunk, type SimulationPlan } from '../monte-carlo.ts';

interface ChunkRequest {
  id: number;
  plan: SimulationPlan;
  start: number;
  end: number;
}

parentPort?.on('message', (request: ChunkRequest) => {
  try {
    const chunk = runSimulationChunk(request.plan, request.start, request.end);
    parentPort?.postMessage({ id: request.id, chunk }, [chunk.meanNearestDistances.buffer as ArrayBuffer, chunk.ripleyL.buffer as ArrayBuffer]);
  } catch (error) {
    parentPort?.postMessage({ id: request.id, error: error instanceof Error ? error.message : String(error) });
  }
});
