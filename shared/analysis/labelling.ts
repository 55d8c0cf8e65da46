// Random labelling of the stops: is the pest more bunched among the places the scout looked than chance?
import { circleShareInside } from './edge-correction.ts';
import { distanceToBoundary, type PlanarField } from './field-geometry.ts';
import { globalRankEnvelope, type GlobalEnvelope } from './global-envelope.ts';
import { monteCarloPValue } from './nearest-neighbour.ts';
import { createRandom, deriveSeed, type Seed } from './random.ts';
import { forEachPairWithin, MAX_EDGE_WEIGHT, type RipleyCorrection } from './ripley.ts';

/** Stop pairs within the largest radius, with the bin of their distance and each side's edge weight. */
export interface StopPairs {
  m: number;
  radiiM: number[];
  areaM2: number;
  correction: RipleyCorrection;
  a: Int32Array;
  b: Int32Array;
  bin: Int32Array;
  /** Isotropic: edge weight of each side. Border: 1 while the radius is within the point's boundary distance. */
  weightA: Float64Array;
  weightB: Float64Array;
  /** Border correction: last radius index at which each stop is eligible (−1: never); isotropic: all. */
  lastEligible: Int32Array;
}

/** The pairs of stops once, so each relabelling only sums the pairs whose ends are both found. */
export function stopPairs(field: PlanarField, xy: Float64Array, radiiM: number[], areaM2: number, correction: RipleyCorrection): StopPairs {
  const m = xy.length / 2;
  const R = radiiM.length;
  const rMax = radiiM[R - 1];
  const toBoundary = new Float64Array(m);
  for (let i = 0; i < m; i++) toBoundary[i] = distanceToBoundary(field, xy[i * 2], xy[i * 2 + 1]);
  const lastEligible = new Int32Array(m).fill(R - 1);
  if (correction === 'border') {
    for (let i = 0; i < m; i++) {
      let k = -1;
      while (k + 1 < R && radiiM[k + 1] <= toBoundary[i]) k++;
      lastEligible[i] = k;
    }
  }
  const a: number[] = [];
  const b: number[] = [];
  const bins: number[] = [];
  const wa: number[] = [];
  const wb: number[] = [];
  const weight = (i: number, d: number) =>
    correction === 'border' ? 1 : d <= toBoundary[i] ? 1 : Math.min(MAX_EDGE_WEIGHT, 1 / circleShareInside(field, xy[i * 2], xy[i * 2 + 1], d));
  forEachPairWithin(xy, rMax, (i, j, d) => {
    let k = 0;
    while (radiiM[k] < d) k++;
    a.push(i);
    b.push(j);
    bins.push(k);
    wa.push(weight(i, d));
    wb.push(weight(j, d));
  });
  return {
    m,
    radiiM,
    areaM2,
    correction,
    a: Int32Array.from(a),
    b: Int32Array.from(b),
    bin: Int32Array.from(bins),
    weightA: Float64Array.from(wa),
    weightB: Float64Array.from(wb),
    lastEligible,
  };
}

/**
 * Ripley's K of the labelled stops (label 1), from the stop pairs: isotropic K = A/(n(n−1)) Σ w_ij 1(d_ij ≤ r)
 * (Ripley 1977, weights capped at 100), or the border estimator K = A Σ_i∈eligible Σ_j 1(d_ij ≤ r) / ((n−1) n_r)
 * with λ estimated as (n−1)/A and n_r the points at least r from the boundary.
 */
export function labelledK(
  pairs: StopPairs,
  labels: Uint8Array,
  out = new Float64Array(pairs.radiiM.length),
  scratch = new Float64Array(pairs.radiiM.length + 1),
): Float64Array {
  const R = pairs.radiiM.length;
  scratch.fill(0);
  let n = 0;
  for (let i = 0; i < pairs.m; i++) n += labels[i];
  const { a, b, bin, weightA, weightB, lastEligible } = pairs;
  for (let p = 0; p < a.length; p++) {
    const i = a[p];
    const j = b[p];
    if (!labels[i] || !labels[j]) continue;
    const k = bin[p];
    if (k <= lastEligible[i]) {
      scratch[k] += weightA[p];
      scratch[lastEligible[i] + 1] -= weightA[p];
    }
    if (k <= lastEligible[j]) {
      scratch[k] += weightB[p];
      scratch[lastEligible[j] + 1] -= weightB[p];
    }
  }
  if (n < 2) return out.fill(NaN);
  let running = 0;
  if (pairs.correction === 'border') {
    const eligibleAt = new Float64Array(R + 1);
    for (let i = 0; i < pairs.m; i++) if (labels[i] && lastEligible[i] >= 0) eligibleAt[lastEligible[i]]++;
    let eligible = 0;
    for (let k = R - 1; k >= 0; k--) {
      eligible += eligibleAt[k];
      eligibleAt[k] = eligible;
    }
    for (let k = 0; k < R; k++) {
      running += scratch[k];
      out[k] = eligibleAt[k] > 0 ? (pairs.areaM2 * running) / ((n - 1) * eligibleAt[k]) : NaN;
    }
    return out;
  }
  for (let k = 0; k < R; k++) {
    running += scratch[k];
    out[k] = (pairs.areaM2 * running) / (n * (n - 1));
  }
  return out;
}

/** Shuffles the labels within each walk (Fisher–Yates), so every relabelling keeps each walk's found count. */
export function relabelWithinWalks(labels: Uint8Array, walkMembers: Int32Array[], random: () => number, out: Uint8Array): Uint8Array {
  out.set(labels);
  for (const members of walkMembers) {
    for (let t = members.length - 1; t > 0; t--) {
      const s = Math.floor(random() * (t + 1));
      const x = out[members[t]];
      out[members[t]] = out[members[s]];
      out[members[s]] = x;
    }
  }
  return out;
}

type NeighbourOrder = { order: Int32Array; distance: Float64Array; width: number };
// The nearest-neighbour test, the scan and the tolerance all ask for the same stops' order: computed once per array.
const orders = new WeakMap<Float64Array, NeighbourOrder>();

/** For each stop, the other stops nearest first (up to 64), so a relabelling finds nearest found stops fast. */
export function neighbourOrder(xy: Float64Array): NeighbourOrder {
  const known = orders.get(xy);
  if (known) return known;
  const computed = computeNeighbourOrder(xy);
  orders.set(xy, computed);
  return computed;
}

function computeNeighbourOrder(xy: Float64Array): NeighbourOrder {
  const m = xy.length / 2;
  const width = Math.min(m - 1, 64);
  const order = new Int32Array(m * width);
  const distance = new Float64Array(m * width);
  const d = new Float64Array(m);
  const index = new Int32Array(m);
  for (let i = 0; i < m; i++) {
    for (let j = 0; j < m; j++) {
      d[j] = j === i ? Infinity : Math.hypot(xy[j * 2] - xy[i * 2], xy[j * 2 + 1] - xy[i * 2 + 1]);
      index[j] = j;
    }
    // Only the nearest `width` are kept, so a partial selection by a distance cut avoids sorting every stop.
    const sorted = nearestFirst(d, index, width);
    for (let w = 0; w < width; w++) {
      order[i * width + w] = sorted[w];
      distance[i * width + w] = d[sorted[w]];
    }
  }
  return { order, distance, width };
}

function nearestFirst(d: Float64Array, index: Int32Array, width: number): number[] {
  if (width >= d.length - 1) return Array.from(index).sort((p, q) => d[p] - d[q]);
  const cut = Float64Array.from(d).sort()[width];
  const kept: number[] = [];
  for (let j = 0; j < d.length; j++) if (d[j] <= cut) kept.push(j);
  return kept.sort((p, q) => d[p] - d[q]);
}

function meanNearestFound(xy: Float64Array, labels: Uint8Array, near: ReturnType<typeof neighbourOrder>): number {
  const m = labels.length;
  let sum = 0;
  let n = 0;
  for (let i = 0; i < m; i++) {
    if (!labels[i]) continue;
    n++;
    let best = Infinity;
    for (let w = 0; w < near.width; w++) {
      if (labels[near.order[i * near.width + w]]) {
        best = near.distance[i * near.width + w];
        break;
      }
    }
    if (best === Infinity) {
      for (let j = 0; j < m; j++) if (j !== i && labels[j]) best = Math.min(best, Math.hypot(xy[j * 2] - xy[i * 2], xy[j * 2 + 1] - xy[i * 2 + 1]));
    }
    sum += best;
  }
  return n >= 2 ? sum / n : NaN;
}

export interface RandomLabellingResult {
  method: string;
  stops: number;
  found: number;
  walks: number;
  simulations: number;
  correction: RipleyCorrection;
  /** λ convention of the K estimates. */
  intensity: string;
  radiiM: number[];
  kFound: number[];
  kAllStops: number[];
  /** K_found − K_all stops (Diggle & Chetwynd 1991); positive where found stops bunch more than the stops do. */
  kDifference: number[];
  envelope: GlobalEnvelope;
  /** L of the found stops with its pointwise range over the relabellings (for the Ripley figures). */
  lFound: number[];
  lLow: number[];
  lHigh: number[];
  nearestNeighbour: {
    meanDistanceM: number;
    relabellingMeanM: number;
    R: number;
    pValue: number;
    simulations: number;
  } | null;
}

/**
 * Random labelling test of the found stops among all stops, stratified by walk: the global envelope test of
 * K_found(r) − K_all(r) (Diggle & Chetwynd 1991; global rank envelope, Myllymäki et al. 2017) and the
 * Clark–Evans mean nearest-neighbour distance among found stops against its relabelling distribution.
 */
export function randomLabellingTest(
  field: PlanarField,
  xy: Float64Array,
  found: Uint8Array,
  walkOf: Int32Array,
  radiiM: number[],
  areaM2: number,
  options: { correction: RipleyCorrection; simulations: number; seed: Seed; alpha: number },
): RandomLabellingResult {
  const m = found.length;
  const R = radiiM.length;
  const pairs = stopPairs(field, xy, radiiM, areaM2, options.correction);
  const all = new Uint8Array(m).fill(1);
  const kAll = labelledK(pairs, all);
  const kFound = labelledK(pairs, found);
  const kDifference = kFound.map((v, k) => v - kAll[k]);
  const walkCount = Math.max(0, ...walkOf) + 1;
  const lists: number[][] = Array.from({ length: walkCount }, () => []);
  for (let i = 0; i < m; i++) lists[walkOf[i]].push(i);
  const walkMembers = lists.filter((l) => l.length > 1).map((l) => Int32Array.from(l));
  const s = options.simulations;
  const simulatedD = new Float64Array(s * R);
  const simulatedL = new Float64Array(s * R);
  const simulatedNN = new Float64Array(s);
  const near = m >= 2 ? neighbourOrder(xy) : null;
  const labels = new Uint8Array(m);
  const K = new Float64Array(R);
  const scratch = new Float64Array(R + 1);
  for (let t = 0; t < s; t++) {
    relabelWithinWalks(found, walkMembers, createRandom(deriveSeed(options.seed, t)), labels);
    labelledK(pairs, labels, K, scratch);
    for (let k = 0; k < R; k++) {
      simulatedD[t * R + k] = K[k] - kAll[k];
      simulatedL[t * R + k] = Math.sqrt(K[k] / Math.PI);
    }
    if (near) simulatedNN[t] = meanNearestFound(xy, labels, near);
  }
  const envelope = globalRankEnvelope(radiiM, kDifference, simulatedD, s, options.alpha);
  const lLow = new Array(R).fill(Infinity);
  const lHigh = new Array(R).fill(-Infinity);
  for (let t = 0; t < s; t++)
    for (let k = 0; k < R; k++) {
      const v = simulatedL[t * R + k];
      if (v < lLow[k]) lLow[k] = v;
      if (v > lHigh[k]) lHigh[k] = v;
    }
  let nearestNeighbour: RandomLabellingResult['nearestNeighbour'] = null;
  const nFound = found.reduce((sum, v) => sum + v, 0);
  if (near && nFound >= 2 && s > 0) {
    const observed = meanNearestFound(xy, found, near);
    const mc = monteCarloPValue(observed, simulatedNN);
    nearestNeighbour = { meanDistanceM: observed, relabellingMeanM: mc.mean, R: observed / mc.mean, pValue: mc.pValue, simulations: s };
  }
  return {
    method: 'random labelling of the stops, stratified by walk (Diggle & Chetwynd 1991)',
    stops: m,
    found: nFound,
    walks: walkCount,
    simulations: s,
    correction: options.correction,
    intensity:
      options.correction === 'border'
        ? 'border K: λ estimated as (n − 1)/A, summed over points at least r from the boundary'
        : 'isotropic K: λ² estimated as n(n − 1)/A², edge weights capped at 100',
    radiiM: [...radiiM],
    kFound: Array.from(kFound),
    kAllStops: Array.from(kAll),
    kDifference: Array.from(kDifference),
    envelope,
    lFound: Array.from(kFound, (v) => Math.sqrt(v / Math.PI)),
    lLow: lLow.map((v) => (Number.isFinite(v) ? v : NaN)),
    lHigh: lHigh.map((v) => (Number.isFinite(v) ? v : NaN)),
    nearestNeighbour,
  };
}
