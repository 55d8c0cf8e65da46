// How evenly the field was searched: sightings and empty stops together.
import { cellAreasInsideField } from './cell-clipping.ts';
import type { PlanarField } from './field-geometry.ts';
import { clarkEvans } from './nearest-neighbour.ts';
import { meanNearestNeighbourDistance } from './nearest-neighbour-index.ts';
import { defaultCellSizeM, quadratGrid, SLIVER_SHARE } from './quadrat.ts';

export interface CoverageResult {
  stops: number;
  emptyStops: number;
  cellSizeM: number;
  /** Share of proper quadrat cells holding at least one stop or sighting. */
  visitedShare: number;
  /** The share an even (random) search with as many stops would reach. */
  expectedVisitedShare: number;
  /** Clark–Evans R of all stops against the field area. */
  stopsR: number | null;
  /** Stop share ÷ area share for the four quarters of the field's bounding box (null when under 10 % of the field). */
  quarterRatios: (number | null)[];
  uneven: boolean;
  warnings: string[];
}

/** Coverage of a walk: visited quadrat cells, spacing of stops and balance between the field's quarters (our rules). */
export function searchCoverage(field: PlanarField, stopsXY: Float64Array, emptyStops: number, areaM2: number): CoverageResult {
  const m = stopsXY.length / 2;
  const cellSizeM = defaultCellSizeM(areaM2, m);
  const grid = quadratGrid(field, m, areaM2, { cellSizeM });
  const areas = cellAreasInsideField(field, grid);
  const visited = new Uint8Array(areas.length);
  for (let i = 0; i < m; i++) {
    const col = Math.min(grid.cols - 1, Math.max(0, Math.floor((stopsXY[i * 2] - grid.originX) / grid.cellWidth)));
    const row = Math.min(grid.rows - 1, Math.max(0, Math.floor((stopsXY[i * 2 + 1] - grid.originY) / grid.cellHeight)));
    visited[row * grid.cols + col] = 1;
  }
  const full = grid.cellWidth * grid.cellHeight;
  let proper = 0;
  let hit = 0;
  let expected = 0;
  for (let c = 0; c < areas.length; c++) {
    if (areas[c] < SLIVER_SHARE * full) continue;
    proper++;
    hit += visited[c];
    expected += 1 - Math.exp((-m * areas[c]) / areaM2);
  }
  const visitedShare = proper ? hit / proper : 0;
  const expectedVisitedShare = proper ? expected / proper : 0;

  const midX = (field.minX + field.maxX) / 2;
  const midY = (field.minY + field.maxY) / 2;
  const quarterStops = [0, 0, 0, 0];
  for (let i = 0; i < m; i++) quarterStops[(stopsXY[i * 2] >= midX ? 1 : 0) + (stopsXY[i * 2 + 1] >= midY ? 2 : 0)]++;
  const quarterArea = [0, 0, 0, 0];
  for (let c = 0; c < areas.length; c++) {
    const col = c % grid.cols;
    const row = Math.floor(c / grid.cols);
    const x = grid.originX + (col + 0.5) * grid.cellWidth;
    const y = grid.originY + (row + 0.5) * grid.cellHeight;
    quarterArea[(x >= midX ? 1 : 0) + (y >= midY ? 2 : 0)] += areas[c];
  }
  const totalArea = quarterArea.reduce((a, b) => a + b, 0);
  const quarterRatios = quarterArea.map((a, q) => (a >= 0.1 * totalArea && m > 0 ? quarterStops[q] / m / (a / totalArea) : null));
  const stopsR = m >= 2 ? clarkEvans(meanNearestNeighbourDistance(stopsXY), m, areaM2).R : null;

  const warnings: string[] = [];
  if (emptyStops === 0) warnings.push('No empty stops were recorded, so a patchy walk cannot be told from a patchy pest; record "nothing found" stops too.');
  if (visitedShare < 0.6 * expectedVisitedShare) {
    warnings.push(
      `Only ${pct(visitedShare)} of the field's cells were visited, against about ${pct(expectedVisitedShare)} for an even search with ${m} stops.`,
    );
  }
  const neglected = quarterRatios.filter((r): r is number => r !== null && r < 0.25).length;
  if (neglected > 0)
    warnings.push(`${neglected === 1 ? 'One quarter' : `${neglected} quarters`} of the field received under a quarter of their fair share of stops.`);
  return {
    stops: m,
    emptyStops,
    cellSizeM,
    visitedShare,
    expectedVisitedShare,
    stopsR,
    quarterRatios,
    uneven: warnings.length > (emptyStops === 0 ? 1 : 0),
    warnings,
  };
}

function pct(share: number): string {
  return `${Math.round(share * 100)} %`;
}
