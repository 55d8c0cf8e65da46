// Ripley's K and L functions with a polygon edge correction.
import { circleShareInside, edgesWithin } from './edge-correction.ts';
import { distanceToBoundary, type PlanarField } from './field-geometry.ts';

/** Isotropic edge weights are capped at 100, as spatstat's Kest does by default (maxweight = 100). */
export const MAX_EDGE_WEIGHT = 100;

export type RipleyCorrection = 'isotropic' | 'border';

export interface RipleyResult {
  correction: RipleyCorrection;
  radiiM: number[];
  K: number[];
  L: number[];
  /** Pointwise minimum and maximum of L over the CSR simulations. */
  envelopeLow: number[] | null;
  envelopeHigh: number[] | null;
  simulations: number;
  /** Radii where L leaves the envelope, in plain figures. */
  aboveEnvelopeM: number[];
  belowEnvelopeM: number[];
}

/** Default radii: twenty steps up to a quarter of the field's shorter side. */
export function defaultRipleyRadii(field: PlanarField): number[] {
  const rMax = Math.min(field.maxX - field.minX, field.maxY - field.minY) / 4;
  return Array.from({ length: 20 }, (_, k) => (rMax * (k + 1)) / 20);
}

/**
 * Ripley's K (Ripley 1976, 1977) at each radius: isotropic correction K = A/(n(n−1)) Σ w_ij 1(d_ij ≤ r)
 * with w_ij the reciprocal share of the circle through j about i inside the field, or the border
 * (reduced-sample) estimator using only points at least r from the boundary.
 */
export function ripleyK(field: PlanarField, xy: Float64Array, radiiM: number[], areaM2: number, correction: RipleyCorrection): Float64Array {
  const n = xy.length / 2;
  const radiusCount = radiiM.length;
  const K = new Float64Array(radiusCount);
  if (n < 2 || radiusCount === 0) return K;
  const rMax = radiiM[radiusCount - 1];
  const toBoundary = new Float64Array(n);
  for (let i = 0; i < n; i++) toBoundary[i] = distanceToBoundary(field, xy[i * 2], xy[i * 2 + 1]);

  // Border estimator bookkeeping: a pair counts for i only at radii ≤ i's distance to the boundary.
  const lastEligible = new Int32Array(n);
  if (correction === 'border') for (let i = 0; i < n; i++) lastEligible[i] = lastRadiusWithin(radiiM, toBoundary[i]);
  const histogram = new Float64Array(radiusCount + 1);
  const isotropic = correction === 'isotropic';
  const shares = isotropic ? circleShareTable(field, xy, toBoundary, rMax) : null;
  const binOf = radiusBins(radiiM);
  const bucketWidth = rMax / binOf.length;
  const lastBucket = binOf.length - 1;
  const grid = pairGrid(xy, rMax);
  const { cols, rows, start, order } = grid;
  const r2 = rMax * rMax;
  // Inlined pair walk (no callbacks): this loop runs once per simulation of the envelope.
  for (let c = 0; c < cols * rows; c++) {
    const cx = c % cols;
    const cy = (c - cx) / cols;
    for (let a = start[c]; a < start[c + 1]; a++) {
      const i = order[a];
      const x = xy[i * 2];
      const y = xy[i * 2 + 1];
      for (let f = 0; f < 5; f++) {
        const gx = cx + FORWARD_X[f];
        const gy = cy + FORWARD_Y[f];
        if (gx < 0 || gx >= cols || gy >= rows) continue;
        const g = gy * cols + gx;
        for (let b = f === 0 ? a + 1 : start[g], bEnd = start[g + 1]; b < bEnd; b++) {
          const j = order[b];
          const dx = xy[j * 2] - x;
          const dy = xy[j * 2 + 1] - y;
          const d2 = dx * dx + dy * dy;
          if (d2 > r2) continue;
          const d = Math.sqrt(d2);
          let bin = binOf[Math.min(lastBucket, Math.floor(d / bucketWidth))];
          while (radiiM[bin] < d) bin++;
          if (isotropic) {
            const wi =
              d <= toBoundary[i] ? 1 : 1 / Math.max(shares ? tableShare(shares, toBoundary, i, d) : circleShareInside(field, x, y, d), 1 / MAX_EDGE_WEIGHT);
            const wj =
              d <= toBoundary[j]
                ? 1
                : 1 / Math.max(shares ? tableShare(shares, toBoundary, j, d) : circleShareInside(field, xy[j * 2], xy[j * 2 + 1], d), 1 / MAX_EDGE_WEIGHT);
            histogram[bin] += wi + wj;
          } else {
            if (bin <= lastEligible[i]) {
              histogram[bin] += 1;
              histogram[lastEligible[i] + 1] -= 1;
            }
            if (bin <= lastEligible[j]) {
              histogram[bin] += 1;
              histogram[lastEligible[j] + 1] -= 1;
            }
          }
        }
      }
    }
  }

  let running = 0;
  if (correction === 'isotropic') {
    for (let k = 0; k < radiusCount; k++) {
      running += histogram[k];
      K[k] = (areaM2 * running) / (n * (n - 1));
    }
    return K;
  }
  // Points eligible at radius k: those whose last eligible radius is ≥ k.
  const eligibleAt = new Float64Array(radiusCount + 1);
  for (let i = 0; i < n; i++) if (lastEligible[i] >= 0) eligibleAt[lastEligible[i]] += 1;
  let eligible = 0;
  const eligibleCount = new Float64Array(radiusCount);
  for (let k = radiusCount - 1; k >= 0; k--) {
    eligible += eligibleAt[k];
    eligibleCount[k] = eligible;
  }
  for (let k = 0; k < radiusCount; k++) {
    running += histogram[k];
    K[k] = eligibleCount[k] > 0 ? (areaM2 * running) / ((n - 1) * eligibleCount[k]) : NaN;
  }
  return K;
}

/** Besag's L(r) = √(K/π), which equals r under CSR (Besag 1977). */
export function ripleyL(K: ArrayLike<number>): Float64Array {
  const L = new Float64Array(K.length);
  for (let k = 0; k < K.length; k++) L[k] = Math.sqrt(K[k] / Math.PI);
  return L;
}

function lastRadiusWithin(radiiM: number[], distance: number): number {
  let k = -1;
  while (k + 1 < radiiM.length && radiiM[k + 1] <= distance) k++;
  return k;
}

// Above this many points the isotropic shares come from a per-point table instead of exact geometry.
export const ISOTROPIC_EXACT_UP_TO = 300;
const TABLE_NODES = 12;

interface ShareTable {
  /** TABLE_NODES + 1 shares per point, at radii b_i + (m·step_i)², m = 0 … TABLE_NODES. */
  values: Float64Array;
  inverseStep: Float64Array;
}

/**
 * Per-point tables of the circle share inside the field, for patterns above ISOTROPIC_EXACT_UP_TO points (null
 * below: those use the exact geometry). Nodes are spaced evenly in √(r − b_i), where b_i is the distance to the
 * boundary: the share falls like √(r − b_i) just past b_i, so the table is linear there. Observed and simulated
 * patterns of the same size always use the same rule.
 */
function circleShareTable(field: PlanarField, xy: Float64Array, toBoundary: Float64Array, rMax: number): ShareTable | null {
  const n = xy.length / 2;
  if (n <= ISOTROPIC_EXACT_UP_TO) return null;
  const stride = TABLE_NODES + 1;
  const values = new Float64Array(n * stride);
  const inverseStep = new Float64Array(n);
  // Only edges within rMax of a point can meet its circles; finding them once serves all its radii.
  const near = new Int32Array(field.edgeCount);
  for (let i = 0; i < n; i++) {
    const span = rMax - toBoundary[i];
    values[i * stride] = 1;
    if (span <= 0) continue;
    const step = Math.sqrt(span) / TABLE_NODES;
    inverseStep[i] = 1 / step;
    const nearCount = edgesWithin(field, xy[i * 2], xy[i * 2 + 1], rMax, near);
    for (let m = 1; m <= TABLE_NODES; m++) {
      const u = m * step;
      values[i * stride + m] = circleShareInside(field, xy[i * 2], xy[i * 2 + 1], toBoundary[i] + u * u, near, nearCount);
    }
  }
  return { values, inverseStep };
}

/**
 * Interpolated share for point i at distance d > b_i. A plain top-level function rather than a closure, so the
 * pair loop's call site stays monomorphic and V8 inlines it whatever pattern sizes ran before in the thread.
 */
function tableShare(table: ShareTable, toBoundary: Float64Array, i: number, d: number): number {
  const position = Math.sqrt(d - toBoundary[i]) * table.inverseStep[i];
  let m = Math.floor(position);
  if (m >= TABLE_NODES) m = TABLE_NODES - 1;
  const base = i * (TABLE_NODES + 1) + m;
  return table.values[base] + (table.values[base + 1] - table.values[base]) * (position - m);
}

// Own cell first (pairs after a), then the four forward neighbours, so each pair is met once.
const FORWARD_X = [0, 1, -1, 0, 1];
const FORWARD_Y = [0, 0, 1, 1, 1];

/** For each of 4096 distance buckets up to the last radius, the first radius index that could hold it. */
function radiusBins(radiiM: number[]): Int32Array {
  const buckets = 4096;
  const width = radiiM[radiiM.length - 1] / buckets;
  const first = new Int32Array(buckets);
  let k = 0;
  for (let b = 0; b < buckets; b++) {
    while (k < radiiM.length - 1 && radiiM[k] < b * width) k++;
    first[b] = k;
  }
  return first;
}

interface PairGrid {
  cols: number;
  rows: number;
  start: Int32Array;
  order: Int32Array;
}

/** Points counting-sorted into square cells of side ≥ rMax (never more than about 4n cells). */
function pairGrid(xy: Float64Array, rMax: number): PairGrid {
  const n = xy.length / 2;
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (let i = 0; i < n * 2; i += 2) {
    if (xy[i] < minX) minX = xy[i];
    if (xy[i] > maxX) maxX = xy[i];
    if (xy[i + 1] < minY) minY = xy[i + 1];
    if (xy[i + 1] > maxY) maxY = xy[i + 1];
  }
  const size = Math.max(rMax, Math.sqrt(((maxX - minX) * (maxY - minY)) / (4 * n)));
  const cols = Math.max(1, Math.floor((maxX - minX) / size) + 1);
  const rows = Math.max(1, Math.floor((maxY - minY) / size) + 1);
  const start = new Int32Array(cols * rows + 1);
  const cellOf = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    const c = Math.floor((xy[i * 2 + 1] - minY) / size) * cols + Math.floor((xy[i * 2] - minX) / size);
    cellOf[i] = c;
    start[c + 1]++;
  }
  for (let c = 0; c < cols * rows; c++) start[c + 1] += start[c];
  const fill = start.slice(0, cols * rows);
  const order = new Int32Array(n);
  for (let i = 0; i < n; i++) order[fill[cellOf[i]]++] = i;
  return { cols, rows, start, order };
}

/** Calls visit(i, j, d) once for every unordered pair no farther apart than rMax. */
export function forEachPairWithin(xy: Float64Array, rMax: number, visit: (i: number, j: number, d: number) => void): void {
  const { cols, rows, start, order } = pairGrid(xy, rMax);
  const r2 = rMax * rMax;
  for (let c = 0; c < cols * rows; c++) {
    const cx = c % cols;
    const cy = (c - cx) / cols;
    for (let a = start[c]; a < start[c + 1]; a++) {
      const i = order[a];
      for (let f = 0; f < 5; f++) {
        const gx = cx + FORWARD_X[f];
        const gy = cy + FORWARD_Y[f];
        if (gx < 0 || gx >= cols || gy >= rows) continue;
        const g = gy * cols + gx;
        for (let b = f === 0 ? a + 1 : start[g]; b < start[g + 1]; b++) {
          const j = order[b];
          const dx = xy[j * 2] - xy[i * 2];
          const dy = xy[j * 2 + 1] - xy[i * 2 + 1];
          const d2 = dx * dx + dy * dy;
          if (d2 <= r2) visit(i, j, Math.sqrt(d2));
        }
      }
    }
  }
}

/** Envelope and verdict figures from observed K and the simulated L curves (row-major, one row per simulation). */
export function ripleyResult(
  radiiM: number[],
  K: Float64Array,
  correction: RipleyCorrection,
  simulatedL: Float64Array | null,
  simulations: number,
): RipleyResult {
  const L = ripleyL(K);
  const radiusCount = radiiM.length;
  let low: number[] | null = null;
  let high: number[] | null = null;
  const above: number[] = [];
  const below: number[] = [];
  if (simulatedL && simulations > 0) {
    low = new Array(radiusCount).fill(Infinity);
    high = new Array(radiusCount).fill(-Infinity);
    for (let s = 0; s < simulations; s++) {
      for (let k = 0; k < radiusCount; k++) {
        const v = simulatedL[s * radiusCount + k];
        if (v < low[k]) low[k] = v;
        if (v > high[k]) high[k] = v;
      }
    }
    for (let k = 0; k < radiusCount; k++) {
      if (L[k] > high[k]) above.push(radiiM[k]);
      else if (L[k] < low[k]) below.push(radiiM[k]);
    }
  }
  return {
    correction,
    radiiM: [...radiiM],
    K: Array.from(K),
    L: Array.from(L),
    envelopeLow: low,
    envelopeHigh: high,
    simulations,
    aboveEnvelopeM: above,
    belowEnvelopeM: below,
  };
}
