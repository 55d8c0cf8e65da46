// A full pattern check with its Monte Carlo simulations on worker threads; same figures as analyse().
import { analyse, planSimulations, type AnalysisOptionsInput, type AnalysisResult } from '../analyse.ts';
import type { MonteCarloPool } from './monte-carlo-pool.ts';

export async function analyseInParallel(boundary: unknown, sightings: unknown, options: AnalysisOptionsInput | undefined, pool: MonteCarloPool): Promise<AnalysisResult> {
  const plans = planSimulations(boundary, sightings, options);
  const [nearest, ripley] = await Promise.all([plans.nearestNeighbour ? pool.run(plans.nearestNeighbour) : null, plans.ripley ? pool.run(plans.ripley) : null]);
  return analyse(boundary, sightings, options, { meanNearestDistances: nearest?.meanNearestDistances, ripleyL: ripley?.ripleyL });
}
