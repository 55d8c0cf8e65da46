// Global envelope test over a set of radii, with the extreme rank length ordering.
// Hand-written: no npm package offers the global rank envelope; the method is short and published.

export interface GlobalEnvelope {
  method: 'global rank envelope, extreme rank length (Myllymäki et al. 2017)';
  alpha: number;
  simulations: number;
  /** Two-sided p of the extreme rank length ordering (ties counted against the observation, so conservative). */
  pValue: number;
  /** Envelope of the curves not among the α most extreme, per radius (null where the curve is undefined). */
  low: (number | null)[];
  high: (number | null)[];
  /** Radii where the observed curve lies above / below the global envelope. */
  aboveM: number[];
  belowM: number[];
  /** Radii left out of the test: the curve is undefined there or the same in every relabelling. */
  undefinedM: number[];
  /** Side on which the observed curve is most extreme. */
  side: 'high' | 'low' | null;
}

/**
 * Global rank envelope test (Myllymäki, Mrkvička, Grabarnik, Seijo & Hahn 2017) of an observed curve
 * against simulated curves (row-major, one row per simulation), two-sided, extreme rank length ordering.
 */
export function globalRankEnvelope(radiiM: number[], observed: ArrayLike<number>, simulated: Float64Array, simulations: number, alpha: number): GlobalEnvelope {
  const R = radiiM.length;
  const curves = simulations + 1;
  const value = (c: number, k: number) => (c === 0 ? observed[k] : simulated[(c - 1) * R + k]);
  const used: number[] = [];
  const undefinedM: number[] = [];
  for (let k = 0; k < R; k++) {
    let finite = true;
    let lo = Infinity;
    let hi = -Infinity;
    for (let c = 0; c < curves; c++) {
      const v = value(c, k);
      if (!Number.isFinite(v)) {
        finite = false;
        break;
      }
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
    if (finite && hi - lo > 1e-9 * Math.max(1, Math.abs(hi))) used.push(k);
    else undefinedM.push(radiiM[k]);
  }
  const U = used.length;
  // ranks[c * U + u]: two-sided pointwise rank of curve c at used radius u (1 = most extreme).
  const ranks = new Float64Array(curves * U);
  const sideOfObserved = { high: Infinity, low: Infinity };
  const column = new Float64Array(curves);
  for (let u = 0; u < U; u++) {
    const k = used[u];
    for (let c = 0; c < curves; c++) column[c] = value(c, k);
    const sorted = Float64Array.from(column).sort();
    for (let c = 0; c < curves; c++) {
      const v = column[c];
      const atMost = upperBound(sorted, v);
      const atLeast = curves - lowerBound(sorted, v);
      ranks[c * U + u] = Math.min(atMost, atLeast);
      if (c === 0) {
        sideOfObserved.low = Math.min(sideOfObserved.low, atMost);
        sideOfObserved.high = Math.min(sideOfObserved.high, atLeast);
      }
    }
  }
  // Each curve's ranks sorted ascending; the lexicographically smaller vector is the more extreme curve.
  for (let c = 0; c < curves; c++) ranks.subarray(c * U, (c + 1) * U).sort();
  const compare = (a: number, b: number) => {
    for (let u = 0; u < U; u++) {
      const d = ranks[a * U + u] - ranks[b * U + u];
      if (d !== 0) return d;
    }
    return 0;
  };
  const order = Array.from({ length: curves }, (_, c) => c).sort(compare);
  // p_c = share of curves at least as extreme as c (ties included).
  const pOf = new Float64Array(curves);
  for (let a = 0; a < curves;) {
    let b = a;
    while (b + 1 < curves && compare(order[b + 1], order[a]) === 0) b++;
    for (let t = a; t <= b; t++) pOf[order[t]] = (b + 1) / curves;
    a = b + 1;
  }
  const low: (number | null)[] = new Array(R).fill(null);
  const high: (number | null)[] = new Array(R).fill(null);
  const aboveM: number[] = [];
  const belowM: number[] = [];
  for (const k of used) {
    let lo = Infinity;
    let hi = -Infinity;
    for (let c = 1; c < curves; c++) {
      if (pOf[c] <= alpha) continue;
      const v = value(c, k);
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
    if (lo > hi) continue;
    low[k] = lo;
    high[k] = hi;
    if (observed[k] > hi) aboveM.push(radiiM[k]);
    else if (observed[k] < lo) belowM.push(radiiM[k]);
  }
  const side =
    U === 0
      ? null
      : sideOfObserved.high < sideOfObserved.low
        ? 'high'
        : sideOfObserved.low < sideOfObserved.high
          ? 'low'
          : aboveM.length >= belowM.length
            ? 'high'
            : 'low';
  return {
    method: 'global rank envelope, extreme rank length (Myllymäki et al. 2017)',
    alpha,
    simulations,
    pValue: U === 0 ? 1 : pOf[0],
    low,
    high,
    aboveM,
    belowM,
    undefinedM,
    side,
  };
}

/** Number of entries ≤ v in a sorted array. */
function upperBound(sorted: Float64Array, v: number): number {
  let lo = 0;
  let hi = sorted.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (sorted[mid] <= v) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** Number of entries < v in a sorted array. */
function lowerBound(sorted: Float64Array, v: number): number {
  let lo = 0;
  let hi = sorted.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (sorted[mid] < v) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}
