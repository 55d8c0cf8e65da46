// Nearest-neighbour test of spread.
import { normalTwoSided } from './distributions.ts';
import { meanNearestNeighbourDistance } from './nearest-neighbour-index.ts';

export interface NearestNeighbourFigures {
  expectedDistanceM: number;
  R: number;
  z: number;
  pValue: number;
}

export interface NearestNeighbourResult extends NearestNeighbourFigures {
  n: number;
  meanDistanceM: number;
  standardErrorM: number;
  donnelly: NearestNeighbourFigures & { standardErrorM: number };
  monteCarlo: { simulations: number; pValue: number | null; meanSimulatedDistanceM: number | null };
}

/** Clark–Evans nearest-neighbour index R with its normal test (Clark & Evans 1954). */
export function clarkEvans(meanDistanceM: number, n: number, areaM2: number): NearestNeighbourFigures & { standardErrorM: number } {
  const expectedDistanceM = 0.5 * Math.sqrt(areaM2 / n);
  const standardErrorM = (0.26136 * Math.sqrt(areaM2)) / n;
  const z = (meanDistanceM - expectedDistanceM) / standardErrorM;
  return { expectedDistanceM, standardErrorM, R: meanDistanceM / expectedDistanceM, z, pValue: normalTwoSided(z) };
}

/** Clark–Evans with Donnelly's edge correction for a bounded study area of perimeter P (Donnelly 1978). */
export function donnellyCorrected(meanDistanceM: number, n: number, areaM2: number, perimeterM: number): NearestNeighbourFigures & { standardErrorM: number } {
  const expectedDistanceM = 0.5 * Math.sqrt(areaM2 / n) + ((0.0514 + 0.0412 / Math.sqrt(n)) * perimeterM) / n;
  const standardErrorM = Math.sqrt((0.0703 * areaM2) / (n * n) + 0.037 * perimeterM * Math.sqrt(areaM2 / n ** 5));
  const z = (meanDistanceM - expectedDistanceM) / standardErrorM;
  return { expectedDistanceM, standardErrorM, R: meanDistanceM / expectedDistanceM, z, pValue: normalTwoSided(z) };
}

/**
 * Monte Carlo p-value of an observed statistic against simulated ones, two-sided around the simulated
 * mean: p = (1 + simulations at least as far from the mean) / (simulations + 1) (Besag & Diggle 1977).
 */
export function monteCarloPValue(observed: number, simulated: ArrayLike<number>): { pValue: number; mean: number } {
  const s = simulated.length;
  let mean = 0;
  for (let i = 0; i < s; i++) mean += simulated[i];
  mean /= s;
  const gap = Math.abs(observed - mean);
  let extreme = 0;
  // A relative tolerance keeps ties (e.g. identical lattices) counted as extreme.
  const tolerance = 1e-12 * Math.max(1, Math.abs(mean));
  for (let i = 0; i < s; i++) if (Math.abs(simulated[i] - mean) >= gap - tolerance) extreme++;
  return { pValue: (1 + extreme) / (s + 1), mean };
}

/** The whole nearest-neighbour test; the Monte Carlo part takes simulated mean distances if given. */
export function nearestNeighbourTest(xy: Float64Array, areaM2: number, perimeterM: number, simulatedMeanDistances?: ArrayLike<number>): NearestNeighbourResult {
  const n = xy.length / 2;
  const meanDistanceM = meanNearestNeighbourDistance(xy);
  const naive = clarkEvans(meanDistanceM, n, areaM2);
  const mc = simulatedMeanDistances && simulatedMeanDistances.length > 0 ? monteCarloPValue(meanDistanceM, simulatedMeanDistances) : null;
  return {
    n,
    meanDistanceM,
    ...naive,
    donnelly: donnellyCorrected(meanDistanceM, n, areaM2, perimeterM),
    monteCarlo: {
      simulations: simulatedMeanDistances?.length ?? 0,
      pValue: mc ? mc.pValue : null,
      meanSimulatedDistanceM: mc ? mc.mean : null,
    },
  };
}
