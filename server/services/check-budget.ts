// How much work a pattern check's options ask for, counted before anything runs, so that no single request can
// hold a thread for minutes or store tens of megabytes. The units are rough operation counts, stated once here.
import type { MultiPolygon } from 'geojson';
import type { AnalysisOptions } from '../../shared/analysis/options.ts';
import { badRequest } from '../errors.ts';

// Measured on the 2-core development machine: an inline check of 200 sightings, 999 simulations and 200 Ripley radii
// (4e9 units) took 34 s on one analysis thread under test load (1.2e8 units a second); `npm run bench -- stalls` ran
// 9.1e8 units in 1.75 s on a quiet machine (5e8 a second).
/** A full check may ask for at most this many work units (about 15 thread-minutes); 5,000 sightings at the defaults take about 5e10. */
export const CHECK_WORK_BUDGET = 100_000_000_000;
/** Checks up to this many units answer within the request (a few seconds on a thread); heavier ones go to the queue. */
export const INLINE_WORK_UNITS = 1_000_000_000;
/** The sensitivity strip answers within the request, so its nine runs together get a budget of seconds, not minutes. */
export const SENSITIVITY_WORK_BUDGET = 2_000_000_000;
/** Stored as 64-bit values, 250,000 density cells are 2 MB; the engine's default grid has about 20,000. */
export const MAX_DENSITY_GRID_CELLS = 250_000;
/** Each quadrat cell is about 100 bytes of figures; the default grid has about half as many cells as sightings. */
export const MAX_STORED_QUADRAT_CELLS = 20_000;

// The engine's defaults the estimate needs (shared/analysis: 20 Ripley radii, about 20,000 density cells, cell area 2A/n).
const DEFAULT_RADII = 20;
const DEFAULT_DENSITY_CELLS = 20_000;
/** Kernel sums and edge corrections per density cell, and clipping per quadrat cell, each as about 100 distance steps. */
const CELL_COST = 100;

export interface FieldExtent {
  /** Bounding rectangle of the boundary, in metres (equirectangular at the centre latitude: near enough for a budget). */
  widthM: number;
  heightM: number;
  areaM2: number;
}

export function fieldExtent(boundary: MultiPolygon, areaM2: number): FieldExtent {
  let minX = Infinity,
    minY = Infinity,
    maxX = -Infinity,
    maxY = -Infinity;
  for (const polygon of boundary.coordinates) {
    for (const [x, y] of polygon[0]) {
      if (x < minX) minX = x;
      if (x > maxX) maxX = x;
      if (y < minY) minY = y;
      if (y > maxY) maxY = y;
    }
  }
  const metresPerDegree = 111_320;
  const widthM = (maxX - minX) * metresPerDegree * Math.cos((((minY + maxY) / 2) * Math.PI) / 180);
  return { widthM, heightM: (maxY - minY) * metresPerDegree, areaM2 };
}

export interface CheckWork {
  simulations: number;
  density: number;
  quadrat: number;
  total: number;
  densityCells: number;
  quadratCells: number;
}

/**
 * Work units of one run: per simulation (and the observed pattern), one nearest-neighbour pass over the sightings and,
 * for Ripley's K, each pair within the largest radius once per radius; plus a fixed cost per density and quadrat cell.
 */
export function estimateWork(options: AnalysisOptions, sightings: number, extent: FieldExtent, cellSideFactor = 1): CheckWork {
  const n = Math.max(sightings, 1);
  const radii = options.radiiM?.length ?? DEFAULT_RADII;
  const box = Math.max(extent.widthM * extent.heightM, 1);
  // The engine's default largest radius is a quarter of the shorter side; the share of pairs closer than it is about the circle's share of the box.
  const largestRadius = options.radiiM ? Math.max(...options.radiiM) : Math.min(extent.widthM, extent.heightM) / 4;
  const closePairs = ((n * (n - 1)) / 2) * Math.min(1, (Math.PI * largestRadius * largestRadius) / box);
  const densityCells = options.densityCellSizeM
    ? Math.ceil(extent.widthM / options.densityCellSizeM) * Math.ceil(extent.heightM / options.densityCellSizeM)
    : DEFAULT_DENSITY_CELLS;
  const side = options.grid ? null : (options.cellSizeM ?? Math.sqrt((2 * extent.areaM2) / n)) * cellSideFactor;
  const quadratCells = options.grid ? options.grid.nx * options.grid.ny : Math.ceil(box / (side! * side!));
  const simulations = (options.simulations + 1) * (n + closePairs * radii);
  const density = densityCells * CELL_COST;
  const quadrat = quadratCells * CELL_COST;
  return { simulations, density, quadrat, total: simulations + density + quadrat, densityCells, quadratCells };
}

const plain = (value: number) => Math.floor(value).toLocaleString('en');

/** Refuses options whose stored figures would be too large, naming the option to change. */
function checkSizes(work: CheckWork, extent: FieldExtent) {
  if (work.densityCells > MAX_DENSITY_GRID_CELLS) {
    const side = Math.ceil(Math.sqrt((extent.widthM * extent.heightM) / MAX_DENSITY_GRID_CELLS) * 10) / 10;
    throw badRequest(
      `Option "densityCellSizeM": this density grid would have ${plain(work.densityCells)} cells, over the ${plain(MAX_DENSITY_GRID_CELLS)} a check may store; use a density cell size of at least ${side} m.`,
      {
        'options.densityCellSizeM': `Use at least ${side} m.`,
      },
    );
  }
  if (work.quadratCells > MAX_STORED_QUADRAT_CELLS) {
    throw badRequest(
      `Option "cellSizeM" or "grid": the quadrat grid would have about ${plain(work.quadratCells)} cells, over the ${plain(MAX_STORED_QUADRAT_CELLS)} a check may store; choose larger quadrat cells or fewer grid rows and columns.`,
      {
        'options.cellSizeM': 'Choose larger quadrat cells.',
      },
    );
  }
}

/** Refuses work over the budget with a sentence naming the option that costs most and how far to reduce it. */
function checkBudget(work: CheckWork, budget: number, runs: number, options: AnalysisOptions, what: string) {
  if (work.total * runs <= budget) return;
  const share = budget / runs;
  const spare = share - work.density - work.quadrat;
  const largest = Math.max(work.simulations, work.density, work.quadrat);
  const lead = `${what} would take ${(work.total * runs).toExponential(1)} work units, over its budget of ${budget.toExponential(1)}`;
  if (largest === work.simulations) {
    const perSimulation = work.simulations / (options.simulations + 1);
    const maxSimulations = Math.floor(spare / perSimulation) - 1;
    const hint =
      maxSimulations >= 19
        ? `reduce "simulations" to at most ${plain(maxSimulations)}${options.radiiM ? ' or give fewer Ripley radii' : ''}`
        : `give fewer Ripley radii ("radiiM") and fewer "simulations", or check fewer sightings (a shorter date window)`;
    throw badRequest(`Option "simulations": ${lead}; ${hint}.`, {
      'options.simulations': `Reduce simulations${maxSimulations >= 19 ? ` to at most ${plain(maxSimulations)}` : ''}.`,
    });
  }
  if (largest === work.density)
    throw badRequest(`Option "densityCellSizeM": ${lead}; use a larger density cell size.`, { 'options.densityCellSizeM': 'Use a larger density cell size.' });
  throw badRequest(`Option "cellSizeM" or "grid": ${lead}; choose larger quadrat cells.`, { 'options.cellSizeM': 'Choose larger quadrat cells.' });
}

/** The work of one check, refused with a sentence when over the budget or the stored-size limits. */
export function assertCheckWithinBudget(options: AnalysisOptions, sightings: number, extent: FieldExtent): CheckWork {
  const work = estimateWork(options, sightings, extent);
  checkSizes(work, extent);
  checkBudget(work, CHECK_WORK_BUDGET, 1, options, 'This check');
  return work;
}

/** The strip runs nine variants and stores nothing; each is counted at its finest (half-side) quadrat cells. */
export function assertSensitivityWithinBudget(options: AnalysisOptions, sightings: number, extent: FieldExtent) {
  const finest = estimateWork(options, sightings, extent, 0.5);
  checkBudget(finest, SENSITIVITY_WORK_BUDGET, 9, options, 'This sensitivity strip (nine runs)');
}
