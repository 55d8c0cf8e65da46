import { describe, expect, it } from 'vitest';
import { fieldAreaM2 } from '../../shared/analysis/area.ts';
import { fieldToCoordinates } from '../../shared/analysis/field-geometry.ts';
import { runSimulations, type SimulationPlan } from '../../shared/analysis/monte-carlo.ts';
import { createMonteCarloPool } from '../../server/services/monte-carlo/monte-carlo-pool.ts';
import { irregularField } from './patterns.ts';
import { mainThreadNice, threadNices } from '../helpers/thread-priority.ts';

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
      const heard: Array<[number, number]> = [];
      const threaded = await pool.run(plan, (done, total) => heard.push([done, total]));
      // Six chunks (2 threads × 3), each reported once, counting up to the total.
      expect(heard).toEqual(Array.from({ length: 6 }, (_, k) => [k + 1, 6]));
      const single = runSimulations(plan);
      expect(Array.from(threaded.meanNearestDistances)).toEqual(Array.from(single.meanNearestDistances));
      expect(Array.from(threaded.ripleyL)).toEqual(Array.from(single.ripleyL));
    } finally {
      await pool.close();
    }
  });

  // Linux keeps a nice value per thread (see tests/helpers/thread-priority.ts).
  it.runIf(process.platform === 'linux')('runs its threads at the raised nice value asked for, leaving the calling thread as it was', async () => {
    const before = mainThreadNice();
    const pool = createMonteCarloPool({ threads: 2, niceIncrement: 5 });
    try {
      const field = irregularField();
      await pool.run({ fieldCoordinates: fieldToCoordinates(field), n: 30, seed: 'nice', simulations: 4, nearestNeighbour: true, ripley: null });
      expect(threadNices().filter((n) => n === Math.min(19, before + 5)).length).toBeGreaterThanOrEqual(2);
      expect(mainThreadNice()).toBe(before);
    } finally {
      await pool.close();
    }
  });
});
