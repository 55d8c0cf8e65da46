// Worker-thread body: runs one chunk of a simulation plan. Its typed arrays (simulations × radii numbers) are small
// enough to come back by structured clone.
import { runSimulationChunk, type SimulationPlan } from '../../../shared/analysis/monte-carlo.ts';

export interface ChunkRequest {
  plan: SimulationPlan;
  start: number;
  end: number;
}

export function runChunk(request: ChunkRequest) {
  return runSimulationChunk(request.plan, request.start, request.end);
}
