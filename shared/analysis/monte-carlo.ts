// CSR simulations inside the field for the Monte Carlo tests. Simulation i draws only from random
// stream i of the seed, so any split of the simulations into chunks (threads) gives identical figures.
import { simulateCsr } from './csr.ts';
import { createPlanarField, type PlanarField } from './field-geometry.ts';
import { meanNearestNeighbourDistance } from './nearest-neighbour-index.ts';
import { createRandom, deriveSeed, type Seed } from './random.ts';
import { ripleyK, ripleyL, type RipleyCorrection } from './ripley.ts';

export interface SimulationPlan {
  /** Field rings as plain coordinates, so a plan can cross into a worker thread. */
  fieldCoordinates: number[][][][];
  n: number;
  seed: Seed;
  simulations: number;
  nearestNeighbour: boolean;
  ripley: { radiiM: number[]; correction: RipleyCorrection; areaM2: number } | null;
}

export interface SimulationChunk {
  start: number;
  end: number;
  meanNearestDistances: Float64Array;
  /** L values, one row of radii per simulation. */
  ripleyL: Float64Array;
}

/** Runs simulations [start, end) of a plan. */
export function runSimulationChunk(plan: SimulationPlan, start: number, end: number, field?: PlanarField): SimulationChunk {
  const planar = field ?? createPlanarField(plan.fieldCoordinates);
  const count = Math.max(0, end - start);
  const radiusCount = plan.ripley ? plan.ripley.radiiM.length : 0;
  const meanNearestDistances = new Float64Array(plan.nearestNeighbour ? count : 0);
  const ripleyValues = new Float64Array(count * radiusCount);
  const xy = new Float64Array(plan.n * 2);
  for (let s = 0; s < count; s++) {
    const random = createRandom(deriveSeed(plan.seed, start + s));
    simulateCsr(planar, plan.n, random, xy);
    if (plan.nearestNeighbour) meanNearestDistances[s] = meanNearestNeighbourDistance(xy);
    if (plan.ripley) {
      const L = ripleyL(ripleyK(planar, xy, plan.ripley.radiiM, plan.ripley.areaM2, plan.ripley.correction));
      ripleyValues.set(L, s * radiusCount);
    }
  }
  return { start, end, meanNearestDistances, ripleyL: ripleyValues };
}

/** Joins chunks (in any order) into one result covering all simulations of the plan. */
export function joinSimulationChunks(plan: SimulationPlan, chunks: SimulationChunk[]): SimulationChunk {
  const radiusCount = plan.ripley ? plan.ripley.radiiM.length : 0;
  const meanNearestDistances = new Float64Array(plan.nearestNeighbour ? plan.simulations : 0);
  const ripleyValues = new Float64Array(plan.simulations * radiusCount);
  for (const chunk of chunks) {
    if (plan.nearestNeighbour) meanNearestDistances.set(chunk.meanNearestDistances, chunk.start);
    ripleyValues.set(chunk.ripleyL, chunk.start * radiusCount);
  }
  return { start: 0, end: plan.simulations, meanNearestDistances, ripleyL: ripleyValues };
}

/** All simulations of a plan on the calling thread. */
export function runSimulations(plan: SimulationPlan, field?: PlanarField): SimulationChunk {
  return runSimulationChunk(plan, 0, plan.simulations, field);
}
