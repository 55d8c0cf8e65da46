// Area of the field inside each rectangle of a grid, by Sutherland–Hodgman clipping (Sutherland &
// Hodgman 1974). Clipping a ring against a convex window keeps its signed area exact even for concave
// rings; each ring is clipped to the row's band once, then the short band rings to each cell.
import type { PlanarField } from './field-geometry.ts';

export interface GridSpec {
  originX: number;
  originY: number;
  cellWidth: number;
  cellHeight: number;
  cols: number;
  rows: number;
}

/** Field area (m²) inside every cell, row-major (row 0 at the south). */
export function cellAreasInsideField(field: PlanarField, grid: GridSpec): Float64Array {
  const areas = new Float64Array(grid.cols * grid.rows);
  const rings: Float64Array[] = [];
  for (const polygon of field.polygons) for (const ring of polygon) rings.push(ring);
  let bandA: number[] = [];
  let bandB: number[] = [];
  let cellA: number[] = [];
  let cellB: number[] = [];
  for (let row = 0; row < grid.rows; row++) {
    const y0 = grid.originY + row * grid.cellHeight;
    const y1 = y0 + grid.cellHeight;
    for (const ring of rings) {
      bandA = fromRing(ring, bandA);
      bandB = clipAxis(bandA, 1, y0, true, bandB);
      bandA = clipAxis(bandB, 1, y1, false, bandA);
      if (bandA.length < 6) continue;
      let minX = Infinity;
      let maxX = -Infinity;
      for (let i = 0; i < bandA.length; i += 2) {
        if (bandA[i] < minX) minX = bandA[i];
        if (bandA[i] > maxX) maxX = bandA[i];
      }
      const colFrom = Math.max(0, Math.floor((minX - grid.originX) / grid.cellWidth));
      const colTo = Math.min(grid.cols - 1, Math.floor((maxX - grid.originX) / grid.cellWidth));
      for (let col = colFrom; col <= colTo; col++) {
        const x0 = grid.originX + col * grid.cellWidth;
        cellA = clipAxis(bandA, 0, x0, true, cellA);
        cellB = clipAxis(cellA, 0, x0 + grid.cellWidth, false, cellB);
        if (cellB.length >= 6) areas[row * grid.cols + col] += signedArea(cellB);
      }
    }
  }
  // Rounding can leave −1e-9 in empty cells.
  for (let c = 0; c < areas.length; c++) if (areas[c] < 0) areas[c] = 0;
  return areas;
}

function fromRing(ring: Float64Array, out: number[]): number[] {
  out.length = ring.length;
  for (let i = 0; i < ring.length; i++) out[i] = ring[i];
  return out;
}

/** Keeps the part of a ring with coordinate `axis` ≥ bound (keepAbove) or ≤ bound. */
function clipAxis(input: number[], axis: 0 | 1, bound: number, keepAbove: boolean, out: number[]): number[] {
  out.length = 0;
  const m = input.length;
  if (m === 0) return out;
  const other = 1 - axis;
  let px = input[m - 2];
  let py = input[m - 1];
  let pIn = keepAbove ? (axis === 0 ? px : py) >= bound : (axis === 0 ? px : py) <= bound;
  for (let i = 0; i < m; i += 2) {
    const cx = input[i];
    const cy = input[i + 1];
    const c = axis === 0 ? cx : cy;
    const cIn = keepAbove ? c >= bound : c <= bound;
    if (cIn !== pIn) {
      const p = axis === 0 ? px : py;
      const t = (bound - p) / (c - p);
      const q = (other === 0 ? px : py) + t * ((other === 0 ? cx : cy) - (other === 0 ? px : py));
      if (axis === 0) out.push(bound, q);
      else out.push(q, bound);
    }
    if (cIn) out.push(cx, cy);
    px = cx;
    py = cy;
    pIn = cIn;
  }
  return out;
}

function signedArea(ring: number[]): number {
  let sum = 0;
  const m = ring.length;
  for (let i = 0; i < m; i += 2) {
    const j = (i + 2) % m;
    sum += ring[i] * ring[j + 1] - ring[j] * ring[i + 1];
  }
  return sum / 2;
}
