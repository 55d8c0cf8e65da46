// Spatial scan statistic over the stops: the most likely patch and its Monte Carlo p.
import { neighbourOrder, relabelWithinWalks } from './labelling.ts';
import { createRandom, deriveSeed, type Seed } from './random.ts';

export interface ScanResult {
  method: string;
  /** Index of the centre stop and the number of nearest stops (itself included) in the window. */
  centre: number;
  size: number;
  radiusM: number;
  members: number[];
  found: number;
  expected: number;
  /** Rate inside ÷ rate outside; null when every found stop is inside. */
  relativeRisk: number | null;
  logLikelihoodRatio: number;
  pValue: number;
  simulations: number;
  maxWindowStops: number;
}

const xlogx = (c: number, n: number) => (c > 0 ? c * Math.log(c / n) : 0);

/** Bernoulli log likelihood ratio of a window holding c of C found among n of N stops (Kulldorff 1997), 0 unless its rate is higher inside. */
export function bernoulliLLR(c: number, n: number, C: number, N: number): number {
  if (n >= N || c * (N - n) <= (C - c) * n) return 0;
  const inside = xlogx(c, n) + xlogx(n - c, n);
  const outside = xlogx(C - c, N - n) + xlogx(N - n - (C - c), N - n);
  return inside + outside - (xlogx(C, N) + xlogx(N - C, N));
}

/** k·ln k for k = 0 … N, so a window's likelihood ratio costs table look-ups only. */
function xlnxTable(N: number): Float64Array {
  const t = new Float64Array(N + 1);
  for (let k = 1; k <= N; k++) t[k] = k * Math.log(k);
  return t;
}

/** The best window; with `enough`, stops at the first window reaching it (a relabelling only needs to know that). */
function bestWindow(
  labels: Uint8Array,
  near: ReturnType<typeof neighbourOrder>,
  maxSize: number,
  C: number,
  t: Float64Array,
  enough = Infinity,
): { llr: number; centre: number; size: number } {
  const N = labels.length;
  // The same Bernoulli ratio as bernoulliLLR, rewritten as Σ k ln k terms.
  const whole = t[C] + t[N - C] - t[N];
  let best = { llr: 0, centre: -1, size: 0 };
  const { order, width } = near;
  for (let i = 0; i < N; i++) {
    let c = labels[i];
    for (let n = 1; n <= maxSize; n++) {
      if (n > 1) c += labels[order[i * width + n - 2]];
      if (c * N <= C * n) continue;
      const rest = N - n;
      const llr = t[c] + t[n - c] - t[n] + t[C - c] + t[rest - C + c] - t[rest] - whole;
      if (llr > best.llr) {
        best = { llr, centre: i, size: n };
        if (llr >= enough) return best;
      }
    }
  }
  return best;
}

/**
 * Circular spatial scan statistic, Bernoulli model over the stops (Kulldorff 1997): windows are each stop with its
 * nearest stops, up to half the stops or 64 (our cap, for speed); the p comes from relabellings stratified by walk.
 */
export function bernoulliScan(xy: Float64Array, found: Uint8Array, walkMembers: Int32Array[], options: { simulations: number; seed: Seed }): ScanResult | null {
  const N = found.length;
  let C = 0;
  for (let i = 0; i < N; i++) C += found[i];
  if (N < 4 || C < 2 || C === N) return null;
  const near = neighbourOrder(xy);
  const maxSize = Math.min(Math.floor(N / 2), near.width + 1);
  const table = xlnxTable(N);
  const observed = bestWindow(found, near, maxSize, C, table);
  if (observed.centre < 0) return null;
  const labels = new Uint8Array(N);
  let atLeast = 0;
  for (let t = 0; t < options.simulations; t++) {
    relabelWithinWalks(found, walkMembers, createRandom(deriveSeed(options.seed, t)), labels);
    if (bestWindow(labels, near, maxSize, C, table, observed.llr - 1e-9).llr >= observed.llr - 1e-9) atLeast++;
  }
  const members = [observed.centre];
  for (let k = 1; k < observed.size; k++) members.push(near.order[observed.centre * near.width + k - 1]);
  const c = members.reduce((sum, i) => sum + found[i], 0);
  const n = members.length;
  return {
    method: 'spatial scan statistic, Bernoulli model over the stops (Kulldorff 1997)',
    centre: observed.centre,
    size: n,
    radiusM: n > 1 ? near.distance[observed.centre * near.width + n - 2] : 0,
    members,
    found: c,
    expected: (n * C) / N,
    relativeRisk: C - c > 0 ? c / n / ((C - c) / (N - n)) : null,
    logLikelihoodRatio: observed.llr,
    pValue: (1 + atLeast) / (options.simulations + 1),
    simulations: options.simulations,
    maxWindowStops: maxSize,
  };
}
