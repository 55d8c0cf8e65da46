// Quadrat test for the stops design: are found stops spread over the cells in the same proportion as the stops?
import type { GridSpec } from './cell-clipping.ts';
import { chiSquareUpper } from './distributions.ts';
import { relabelWithinWalks } from './labelling.ts';
import { createRandom, deriveSeed, type Seed } from './random.ts';

export interface StopsQuadratResult {
  grid: GridSpec;
  /** Cells holding at least one stop; the others are not scouted (not "clean"). */
  cells: Array<{ col: number; row: number; stops: number; found: number }>;
  notScoutedCells: number;
  chiSquare: number;
  df: number;
  pValue: number;
  pValueSides: 'two-sided';
  /** Monte Carlo over relabellings (an exact conditional test in the limit) when any expected count is under 5, else χ². */
  pValueMethod: 'monte-carlo' | 'chi-square';
  lowExpected: boolean;
}

function homogeneity(cellOf: Int32Array, cells: number, labels: Uint8Array, stopsPer: Float64Array, share: number): number {
  const found = new Float64Array(cells);
  for (let i = 0; i < labels.length; i++) if (cellOf[i] >= 0) found[cellOf[i]] += labels[i];
  let chi = 0;
  for (let c = 0; c < cells; c++) {
    const expected = stopsPer[c] * share;
    chi += (found[c] - expected) ** 2 / (expected * (1 - share));
  }
  return chi;
}

/**
 * Test of equal proportions (Pearson's χ² for a k × 2 table, Pearson 1900) of found stops among the stops per cell,
 * two-sided; with small expected counts the p comes from relabellings of the stops stratified by walk.
 */
export function stopsQuadratTest(
  grid: GridSpec,
  xy: Float64Array,
  found: Uint8Array,
  walkMembers: Int32Array[],
  options: { simulations: number; seed: Seed; cellCount: number },
): StopsQuadratResult | null {
  const m = found.length;
  const index = new Map<number, number>();
  const cellOf = new Int32Array(m);
  const where: Array<{ col: number; row: number }> = [];
  for (let i = 0; i < m; i++) {
    const col = Math.min(grid.cols - 1, Math.max(0, Math.floor((xy[i * 2] - grid.originX) / grid.cellWidth)));
    const row = Math.min(grid.rows - 1, Math.max(0, Math.floor((xy[i * 2 + 1] - grid.originY) / grid.cellHeight)));
    const key = row * grid.cols + col;
    if (!index.has(key)) {
      index.set(key, where.length);
      where.push({ col, row });
    }
    cellOf[i] = index.get(key) as number;
  }
  const k = where.length;
  let total = 0;
  for (let i = 0; i < m; i++) total += found[i];
  const share = total / m;
  if (k < 2 || total === 0 || total === m) return null;
  const stopsPer = new Float64Array(k);
  const foundPer = new Float64Array(k);
  for (let i = 0; i < m; i++) {
    stopsPer[cellOf[i]]++;
    foundPer[cellOf[i]] += found[i];
  }
  const chiSquare = homogeneity(cellOf, k, found, stopsPer, share);
  const df = k - 1;
  let lowExpected = false;
  for (let c = 0; c < k; c++) if (stopsPer[c] * Math.min(share, 1 - share) < 5) lowExpected = true;
  let pValue: number;
  let method: StopsQuadratResult['pValueMethod'] = 'chi-square';
  if (lowExpected && options.simulations > 0) {
    method = 'monte-carlo';
    const labels = new Uint8Array(m);
    let above = 0;
    let below = 0;
    for (let t = 0; t < options.simulations; t++) {
      relabelWithinWalks(found, walkMembers, createRandom(deriveSeed(options.seed, t)), labels);
      const chi = homogeneity(cellOf, k, labels, stopsPer, share);
      if (chi >= chiSquare - 1e-9) above++;
      if (chi <= chiSquare + 1e-9) below++;
    }
    pValue = Math.min(1, (2 * (1 + Math.min(above, below))) / (options.simulations + 1));
  } else {
    const upper = chiSquareUpper(chiSquare, df);
    pValue = Math.min(1, 2 * Math.min(upper, 1 - upper));
  }
  return {
    grid,
    cells: where.map((w, c) => ({ ...w, stops: stopsPer[c], found: foundPer[c] })),
    notScoutedCells: Math.max(0, options.cellCount - k),
    chiSquare,
    df,
    pValue,
    pValueSides: 'two-sided',
    pValueMethod: method,
    lowExpected,
  };
}
