import { describe, expect, it } from 'vitest';
import { fieldAreaM2 } from '../../shared/analysis/area.ts';
import { fieldToCoordinates } from '../../shared/analysis/field-geometry.ts';
import { runSimulations, type SimulationPlan } from '../../shared/analysis/monte-carlo.ts';
import { createMonteCarloPool } from '../../shared/analysis/parallel/monte-carlo-pool.ts';
import { irregularField } from './patterns.ts';

describe('Monte Carlo on worker threads', () => {
  it('gives bit-identical simulations to the single-thread run for the same seed', async () => {
    const field = irregularField();
    const plan: SimulationPlan = {
      fieldCoordinates: fieldToCoordinates(field),
      n: 120,
      seed: 'threads',
      simulations: 37,
      nearestNeighbour: true,
      ripley: { radiiM: [10, 20, 40], correction: 'isotropic', areaM2: fieldAreaM2(field) },
    };
    const pool = createMonteCarloPool({ threads: 2, chunksPerThread: 3 });
    try {
      const threaded = await pool.run(plan);
      const single = runSimulations(plan);
      expect(Array.from(threaded.meanNearestDistances)).toEqual(Array.from(single.meanNearestDistances));
      expect(Array.from(threaded.ripleyL)).toEqual(Array.from(single.ripleyL));
    } finally {
      await pool.close();
    }
  });
});
