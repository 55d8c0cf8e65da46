// Counts and severities: is a heavy count near other heavy counts?
import { normalTwoSided } from './distributions.ts';
import { nearestNeighbourDistances } from './nearest-neighbour-index.ts';
import { createRandom, type Seed } from './random.ts';
import { neighbourOrder } from './labelling.ts';
import { forEachPairWithin } from './ripley.ts';

export interface Neighbours {
  bandM: number;
  /** CSR adjacency: neighbours of i are list[offsets[i] .. offsets[i+1]). */
  offsets: Int32Array;
  list: Int32Array;
  pairs: number;
}

/** Distance-band neighbours; default band: the largest nearest-neighbour distance, so no stop is alone (common practice). */
export function distanceBandNeighbours(xy: Float64Array, bandM?: number): Neighbours {
  const n = xy.length / 2;
  let band = bandM ?? 0;
  if (bandM === undefined) {
    const d = nearestNeighbourDistances(xy);
    for (let i = 0; i < n; i++) if (d[i] > band) band = d[i];
    band *= 1 + 1e-9;
  }
  const degree = new Int32Array(n + 1);
  const pairs: number[] = [];
  forEachPairWithin(xy, band, (i, j) => {
    pairs.push(i, j);
    degree[i + 1]++;
    degree[j + 1]++;
  });
  for (let i = 0; i < n; i++) degree[i + 1] += degree[i];
  const fill = degree.slice(0, n);
  const list = new Int32Array(pairs.length);
  for (let p = 0; p < pairs.length; p += 2) {
    list[fill[pairs[p]]++] = pairs[p + 1];
    list[fill[pairs[p + 1]]++] = pairs[p];
  }
  return { bandM: band, offsets: degree, list, pairs: pairs.length / 2 };
}

export interface MoranResult {
  I: number;
  expected: number;
  variance: number;
  z: number;
  /** Normal p under the randomisation assumption (Cliff & Ord 1981). */
  normalPValue: number;
  /** Permutation p: (1 + permutations at least as far from E[I]) / (permutations + 1). */
  pValue: number | null;
  permutations: number;
  bandM: number;
  neighbourPairs: number;
}

function moranNumerator(z: Float64Array, nb: Neighbours, order?: Int32Array): number {
  let sum = 0;
  const n = z.length;
  for (let i = 0; i < n; i++) {
    const zi = order ? z[order[i]] : z[i];
    let local = 0;
    for (let p = nb.offsets[i]; p < nb.offsets[i + 1]; p++) local += order ? z[order[nb.list[p]]] : z[nb.list[p]];
    sum += zi * local;
  }
  return sum;
}

/** Global Moran's I with binary distance-band weights (Moran 1950; moments from Cliff & Ord 1981). */
export function moransI(values: ArrayLike<number>, nb: Neighbours, permutations = 999, seed: Seed = 1): MoranResult {
  const n = values.length;
  let mean = 0;
  for (let i = 0; i < n; i++) mean += values[i];
  mean /= n;
  const z = new Float64Array(n);
  let m2 = 0;
  let m4 = 0;
  for (let i = 0; i < n; i++) {
    z[i] = values[i] - mean;
    m2 += z[i] * z[i];
    m4 += z[i] ** 4;
  }
  const s0 = 2 * nb.pairs;
  const expected = -1 / (n - 1);
  if (s0 === 0 || m2 === 0) {
    return { I: NaN, expected, variance: NaN, z: NaN, normalPValue: NaN, pValue: null, permutations: 0, bandM: nb.bandM, neighbourPairs: nb.pairs };
  }
  const I = ((n / s0) * moranNumerator(z, nb)) / m2;
  const s1 = 4 * nb.pairs;
  let s2 = 0;
  for (let i = 0; i < n; i++) s2 += (2 * (nb.offsets[i + 1] - nb.offsets[i])) ** 2;
  const b2 = (n * m4) / (m2 * m2);
  const expectedSquare =
    (n * ((n * n - 3 * n + 3) * s1 - n * s2 + 3 * s0 * s0) - b2 * ((n * n - n) * s1 - 2 * n * s2 + 6 * s0 * s0)) / ((n - 1) * (n - 2) * (n - 3) * s0 * s0);
  const variance = expectedSquare - expected * expected;
  const zScore = (I - expected) / Math.sqrt(variance);
  let pValue: number | null = null;
  if (permutations > 0) {
    const random = createRandom(seed);
    const order = new Int32Array(n);
    for (let i = 0; i < n; i++) order[i] = i;
    const gap = Math.abs(I - expected) - 1e-12;
    let extreme = 0;
    for (let p = 0; p < permutations; p++) {
      for (let i = n - 1; i > 0; i--) {
        const j = Math.floor(random() * (i + 1));
        const t = order[i];
        order[i] = order[j];
        order[j] = t;
      }
      const permuted = ((n / s0) * moranNumerator(z, nb, order)) / m2;
      if (Math.abs(permuted - expected) >= gap) extreme++;
    }
    pValue = (1 + extreme) / (permutations + 1);
  }
  return { I, expected, variance, z: zScore, normalPValue: normalTwoSided(zScore), pValue, permutations, bandM: nb.bandM, neighbourPairs: nb.pairs };
}

/** Local Getis–Ord Gi* z-scores with each point its own neighbour (Getis & Ord 1992; Ord & Getis 1995). */
export function getisOrdGiStar(values: ArrayLike<number>, nb: Neighbours): Float64Array {
  const n = values.length;
  let sum = 0;
  let sumSquares = 0;
  for (let i = 0; i < n; i++) {
    sum += values[i];
    sumSquares += values[i] * values[i];
  }
  const mean = sum / n;
  const s = Math.sqrt(sumSquares / n - mean * mean);
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let local = values[i];
    for (let p = nb.offsets[i]; p < nb.offsets[i + 1]; p++) local += values[nb.list[p]];
    const w = nb.offsets[i + 1] - nb.offsets[i] + 1;
    const denominator = s * Math.sqrt((n * w - w * w) / (n - 1));
    out[i] = denominator > 0 ? (local - mean * w) / denominator : 0;
  }
  return out;
}

/** Benjamini–Hochberg adjusted p-values (Benjamini & Hochberg 1995), in input order. */
export function benjaminiHochberg(pValues: ArrayLike<number>): Float64Array {
  const m = pValues.length;
  const order = Array.from({ length: m }, (_, i) => i).sort((a, b) => pValues[a] - pValues[b]);
  const adjusted = new Float64Array(m);
  let running = 1;
  for (let rank = m; rank >= 1; rank--) {
    const i = order[rank - 1];
    running = Math.min(running, (pValues[i] * m) / rank);
    adjusted[i] = running;
  }
  return adjusted;
}

export interface HotPatch {
  /** Indices of the sightings in the patch. */
  members: number[];
  meanCount: number;
  centroidX: number;
  centroidY: number;
}

/** Significant positive Gi* sightings joined into patches through the distance band. */
export function hotPatches(
  values: ArrayLike<number>,
  xy: Float64Array,
  nb: Neighbours,
  giStar: Float64Array,
  qValues: Float64Array,
  alpha: number,
): HotPatch[] {
  const n = values.length;
  const hot = new Uint8Array(n);
  for (let i = 0; i < n; i++) hot[i] = giStar[i] > 0 && qValues[i] < alpha ? 1 : 0;
  const seen = new Uint8Array(n);
  const patches: HotPatch[] = [];
  for (let i = 0; i < n; i++) {
    if (!hot[i] || seen[i]) continue;
    const members: number[] = [];
    const stack = [i];
    seen[i] = 1;
    while (stack.length) {
      const k = stack.pop() as number;
      members.push(k);
      for (let p = nb.offsets[k]; p < nb.offsets[k + 1]; p++) {
        const j = nb.list[p];
        if (hot[j] && !seen[j]) {
          seen[j] = 1;
          stack.push(j);
        }
      }
    }
    members.sort((a, b) => a - b);
    let total = 0;
    let cx = 0;
    let cy = 0;
    for (const k of members) {
      total += values[k];
      cx += xy[k * 2];
      cy += xy[k * 2 + 1];
    }
    patches.push({ members, meanCount: total / members.length, centroidX: cx / members.length, centroidY: cy / members.length });
  }
  return patches;
}

/**
 * Neighbours at the stop-spacing scale: the band is the median distance to the third-nearest stop, and a stop with
 * fewer than three stops in the band takes its three nearest (symmetrised), so one isolated stop does not widen the
 * band for every stop (our rule; at least 3 neighbours is common practice for local statistics).
 */
export function stopSpacingNeighbours(xy: Float64Array, minNeighbours = 3): Neighbours {
  const n = xy.length / 2;
  if (n <= minNeighbours) return distanceBandNeighbours(xy);
  const near = neighbourOrder(xy);
  const k = Math.min(minNeighbours, near.width);
  const third = Array.from({ length: n }, (_, i) => near.distance[i * near.width + k - 1]).sort((a, b) => a - b);
  const band = third[Math.floor(n / 2)] * (1 + 1e-9);
  const sets: Set<number>[] = Array.from({ length: n }, () => new Set<number>());
  forEachPairWithin(xy, band, (i, j) => {
    sets[i].add(j);
    sets[j].add(i);
  });
  for (let i = 0; i < n; i++) {
    for (let w = 0; sets[i].size < k && w < near.width; w++) {
      const j = near.order[i * near.width + w];
      sets[i].add(j);
      sets[j].add(i);
    }
  }
  const offsets = new Int32Array(n + 1);
  for (let i = 0; i < n; i++) offsets[i + 1] = offsets[i] + sets[i].size;
  const list = new Int32Array(offsets[n]);
  sets.forEach((set, i) =>
    list.set(
      [...set].sort((a, b) => a - b),
      offsets[i],
    ),
  );
  return { bandM: band, offsets, list, pairs: offsets[n] / 2 };
}

/**
 * Conditional permutation p-values of local Gi* (Anselin 1995): each stop keeps its own value while its neighbours'
 * values are drawn from the other stops; two-sided, p = (1 + permutations at least as far from the mean) / (P + 1).
 */
export function giStarPermutationP(values: ArrayLike<number>, nb: Neighbours, permutations: number, seed: Seed): Float64Array {
  const n = values.length;
  const p = new Float64Array(n).fill(NaN);
  if (permutations <= 0 || n < 3) return p;
  let total = 0;
  for (let i = 0; i < n; i++) total += values[i];
  const random = createRandom(seed);
  const others = new Float64Array(n - 1);
  for (let i = 0; i < n; i++) {
    const w = nb.offsets[i + 1] - nb.offsets[i];
    let observed = 0;
    for (let q = nb.offsets[i]; q < nb.offsets[i + 1]; q++) observed += values[nb.list[q]];
    const expected = (w * (total - values[i])) / (n - 1);
    const gap = Math.abs(observed - expected) - 1e-9;
    for (let j = 0, k = 0; j < n; j++) if (j !== i) others[k++] = values[j];
    let extreme = 0;
    for (let t = 0; t < permutations; t++) {
      let sum = 0;
      // Partial Fisher–Yates: the first w entries become a random draw without replacement.
      for (let a = 0; a < w; a++) {
        const b = a + Math.floor(random() * (n - 1 - a));
        const x = others[a];
        others[a] = others[b];
        others[b] = x;
        sum += others[a];
      }
      if (Math.abs(sum - expected) >= gap) extreme++;
    }
    p[i] = (1 + extreme) / (permutations + 1);
  }
  return p;
}
