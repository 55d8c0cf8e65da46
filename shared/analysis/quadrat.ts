// Quadrat count test of spread over square (or NX × NY) cells clipped to the field.
import { cellAreasInsideField, type GridSpec } from './cell-clipping.ts';
import { chiSquareUpper } from './distributions.ts';
import { AnalysisInputError } from './errors.ts';
import type { PlanarField } from './field-geometry.ts';

/** Upper bound on quadrat cells: beyond it the test has no meaning and the result no sensible size. */
export const MAX_QUADRAT_CELLS = 1_000_000;

export type SliverRule = 'merge' | 'keep' | 'drop';

/** A cell whose area inside the field is under this share of a full cell is a sliver. */
export const SLIVER_SHARE = 0.1;

export interface QuadratCell {
  col: number;
  row: number;
  count: number;
  expected: number;
  areaM2: number;
  /** Whole cell inside the field (used for the equal-area figures). */
  full: boolean;
  /** Sum of the sightings' counts in the cell, when sightings carry counts. */
  countTotal: number | null;
  /** Sliver cells folded into this one. */
  mergedSlivers: number;
}

export interface QuadratOptions {
  cellSizeM?: number;
  grid?: { nx: number; ny: number };
  slivers?: SliverRule;
  /** Per-sighting counts (for countTotal), aligned with the points. */
  counts?: ArrayLike<number> | null;
}

export interface QuadratResult {
  cellSizeM: number | null;
  grid: GridSpec;
  cells: QuadratCell[];
  n: number;
  chiSquare: number;
  df: number;
  /** Two-sided: 2 · min(upper, lower tail) of χ² on df, so too even a spread is also a departure. */
  pValue: number;
  pValueSides: 'two-sided';
  /** The upper tail alone (clumping only). */
  upperTailPValue: number;
  lowExpected: boolean;
  fullCells: number;
  meanPerFullCell: number;
  varianceToMean: number | null;
  dispersionPValue: number | null;
  morisita: number | null;
  meanCrowding: number | null;
  patchiness: number | null;
  negativeBinomialK: number | null;
  slivers: { rule: SliverRule; sliverCells: number; merged: number; dropped: number; sightingsDropped: number };
}

/** Default cell side from the rule of thumb cell area ≈ 2A/n (common practice: about two sightings per cell). */
export function defaultCellSizeM(areaM2: number, n: number): number {
  return Math.sqrt((2 * areaM2) / Math.max(n, 1));
}

export function quadratGrid(field: PlanarField, n: number, areaM2: number, options: QuadratOptions = {}): GridSpec {
  const width = field.maxX - field.minX;
  const height = field.maxY - field.minY;
  if (options.grid) {
    return {
      originX: field.minX,
      originY: field.minY,
      cols: options.grid.nx,
      rows: options.grid.ny,
      cellWidth: width / options.grid.nx,
      cellHeight: height / options.grid.ny,
    };
  }
  const side = options.cellSizeM ?? defaultCellSizeM(areaM2, n);
  return {
    originX: field.minX,
    originY: field.minY,
    cellWidth: side,
    cellHeight: side,
    cols: Math.max(1, Math.ceil(width / side)),
    rows: Math.max(1, Math.ceil(height / side)),
  };
}

/**
 * Quadrat count test: Pearson χ² of observed against area-proportional expected counts with k − 1
 * degrees of freedom (Pearson 1900; Greig-Smith 1952), with the index of dispersion (Fisher 1950),
 * Morisita's index (Morisita 1959), Lloyd's mean crowding and patchiness (Lloyd 1967) and the negative
 * binomial k by moments (Anscombe 1949) from the full cells.
 */
export function quadratTest(field: PlanarField, xy: Float64Array, fieldAreaM2: number, options: QuadratOptions = {}): QuadratResult {
  const n = xy.length / 2;
  const grid = quadratGrid(field, n, fieldAreaM2, options);
  const { cols, rows, cellWidth, cellHeight } = grid;
  const cellCount = cols * rows;
  if (cellCount > MAX_QUADRAT_CELLS) {
    throw new AnalysisInputError(`The quadrat grid would have ${cellCount} cells; choose larger cells (at most ${MAX_QUADRAT_CELLS} cells).`);
  }
  const areas = cellAreasInsideField(field, grid);
  const counts = new Float64Array(cellCount);
  const totals = options.counts ? new Float64Array(cellCount) : null;
  for (let i = 0; i < n; i++) {
    let col = Math.floor((xy[i * 2] - grid.originX) / cellWidth);
    let row = Math.floor((xy[i * 2 + 1] - grid.originY) / cellHeight);
    if (col >= cols) col = cols - 1;
    if (row >= rows) row = rows - 1;
    if (col < 0) col = 0;
    if (row < 0) row = 0;
    counts[row * cols + col]++;
    if (totals && options.counts) totals[row * cols + col] += options.counts[i];
  }

  const fullArea = cellWidth * cellHeight;
  const rule = options.slivers ?? 'merge';
  const merged = new Float64Array(cellCount);
  const alive = new Uint8Array(cellCount);
  let sliverCells = 0;
  let mergedCount = 0;
  let dropped = 0;
  let sightingsDropped = 0;
  const isSliver = (c: number) => areas[c] < SLIVER_SHARE * fullArea && (areas[c] > 0 || counts[c] > 0);
  for (let c = 0; c < cellCount; c++) alive[c] = areas[c] > 0 || counts[c] > 0 ? 1 : 0;
  if (rule !== 'keep') {
    for (let c = 0; c < cellCount; c++) {
      if (!isSliver(c)) continue;
      sliverCells++;
      const target = rule === 'merge' ? largestNeighbour(c, cols, rows, areas, isSliver) : -1;
      alive[c] = 0;
      if (target >= 0) {
        areas[target] += areas[c];
        counts[target] += counts[c];
        if (totals) totals[target] += totals[c];
        merged[target]++;
        mergedCount++;
      } else {
        dropped++;
        sightingsDropped += counts[c];
      }
    }
  } else {
    for (let c = 0; c < cellCount; c++) if (isSliver(c)) sliverCells++;
  }

  let testN = 0;
  let testArea = 0;
  for (let c = 0; c < cellCount; c++) {
    if (!alive[c]) continue;
    testN += counts[c];
    testArea += areas[c];
  }
  const cells: QuadratCell[] = [];
  let chiSquare = 0;
  let lowExpected = false;
  const fullCounts: number[] = [];
  for (let c = 0; c < cellCount; c++) {
    if (!alive[c]) continue;
    const expected = (testN * areas[c]) / testArea;
    if (expected > 0) chiSquare += (counts[c] - expected) ** 2 / expected;
    if (expected < 5) lowExpected = true;
    const full = merged[c] === 0 && areas[c] >= fullArea * (1 - 1e-9);
    if (full) fullCounts.push(counts[c]);
    cells.push({
      col: c % cols,
      row: Math.floor(c / cols),
      count: counts[c],
      expected,
      areaM2: areas[c],
      full,
      countTotal: totals ? totals[c] : null,
      mergedSlivers: merged[c],
    });
  }
  const df = cells.length - 1;
  return {
    cellSizeM: options.grid ? null : cellWidth,
    grid,
    cells,
    n: testN,
    chiSquare,
    df,
    pValue: df > 0 ? Math.min(1, 2 * Math.min(chiSquareUpper(chiSquare, df), 1 - chiSquareUpper(chiSquare, df))) : NaN,
    pValueSides: 'two-sided',
    upperTailPValue: df > 0 ? chiSquareUpper(chiSquare, df) : NaN,
    lowExpected,
    ...aggregationFigures(fullCounts),
    slivers: { rule, sliverCells, merged: mergedCount, dropped, sightingsDropped },
  };
}

function largestNeighbour(c: number, cols: number, rows: number, areas: Float64Array, isSliver: (c: number) => boolean): number {
  const col = c % cols;
  const row = Math.floor(c / cols);
  let best = -1;
  // Edge neighbours first; corner neighbours only when no edge neighbour is a proper cell.
  for (const ring of [
    [
      [1, 0],
      [-1, 0],
      [0, 1],
      [0, -1],
    ],
    [
      [1, 1],
      [-1, 1],
      [1, -1],
      [-1, -1],
    ],
  ]) {
    for (const [dx, dy] of ring) {
      const x = col + dx;
      const y = row + dy;
      if (x < 0 || y < 0 || x >= cols || y >= rows) continue;
      const g = y * cols + x;
      if (isSliver(g) || areas[g] <= 0) continue;
      if (best < 0 || areas[g] > areas[best]) best = g;
    }
    if (best >= 0) return best;
  }
  return best;
}

/** Equal-area figures from the counts of full cells. */
export function aggregationFigures(counts: number[]) {
  const q = counts.length;
  const empty = {
    fullCells: q,
    meanPerFullCell: NaN,
    varianceToMean: null,
    dispersionPValue: null,
    morisita: null,
    meanCrowding: null,
    patchiness: null,
    negativeBinomialK: null,
  };
  if (q < 2) return { ...empty, meanPerFullCell: q === 1 ? counts[0] : NaN };
  let total = 0;
  let pairs = 0;
  for (const x of counts) {
    total += x;
    pairs += x * (x - 1);
  }
  const mean = total / q;
  let ss = 0;
  for (const x of counts) ss += (x - mean) ** 2;
  const variance = ss / (q - 1);
  if (mean === 0) return { ...empty, meanPerFullCell: 0 };
  const varianceToMean = variance / mean;
  const meanCrowding = mean + (varianceToMean - 1);
  return {
    fullCells: q,
    meanPerFullCell: mean,
    varianceToMean,
    // Two-sided: a variance well under the mean (regular spacing) is as notable as one well over it.
    dispersionPValue: Math.min(1, 2 * Math.min(chiSquareUpper((q - 1) * varianceToMean, q - 1), 1 - chiSquareUpper((q - 1) * varianceToMean, q - 1))),
    morisita: total > 1 ? (q * pairs) / (total * (total - 1)) : null,
    meanCrowding,
    patchiness: meanCrowding / mean,
    negativeBinomialK: variance > mean ? (mean * mean) / (variance - mean) : null,
  };
}
