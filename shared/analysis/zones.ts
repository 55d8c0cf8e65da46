// Treatment zones: cells above a threshold, merged, buffered by a margin, clipped to the field, slivers dropped.
import { featureCollection, intersect, polygon as turfPolygon, union } from '@turf/turf';
import type { Feature, MultiPolygon, Polygon } from 'geojson';
import type { DensityResult } from './density.ts';
import { fieldToCoordinates, type PlanarField } from './field-geometry.ts';
import type { QuadratResult } from './quadrat.ts';

export interface ZoneShapeOptions {
  /** Margin added around each patch, metres. */
  marginM?: number;
  /** Zones smaller than this after clipping are dropped, m². */
  minZoneAreaM2?: number;
}

/** One proposed zone in planar coordinates: rings of [x, y], outer ring first. */
export interface PlanarZone {
  rings: number[][][];
  areaM2: number;
}

/** Common practice for a boom sprayer: a 10 m margin; zones under 0.05 ha are not worth a separate pass (our defaults). */
export const DEFAULT_MARGIN_M = 10;
export const DEFAULT_MIN_ZONE_AREA_M2 = 500;

type Rect = [number, number, number, number];

function rectPolygon([x0, y0, x1, y1]: Rect): Feature<Polygon> {
  return turfPolygon([
    [
      [x0, y0],
      [x1, y0],
      [x1, y1],
      [x0, y1],
      [x0, y0],
    ],
  ]);
}

function polygonsOf(geometry: Polygon | MultiPolygon): number[][][][] {
  return geometry.type === 'Polygon' ? [geometry.coordinates] : geometry.coordinates;
}

function ringArea(ring: number[][]): number {
  let sum = 0;
  for (let i = 0; i + 1 < ring.length; i++) sum += ring[i][0] * ring[i + 1][1] - ring[i + 1][0] * ring[i][1];
  return Math.abs(sum / 2);
}

/**
 * Zones from grid rectangles (already chosen by some threshold): rasterised onto a grid of at most half
 * the margin, dilated by the margin on that grid (so the buffer is exact to half a raster cell), merged
 * as row runs, clipped to the field, slivers dropped. Raster dilation rather than a vector buffer because
 * a polygon union of discs and edge bands costs a second for one patch, the raster a few milliseconds.
 */
export function zonesFromRectangles(field: PlanarField, rects: Rect[], options: ZoneShapeOptions = {}): PlanarZone[] {
  if (rects.length === 0) return [];
  const marginM = options.marginM ?? DEFAULT_MARGIN_M;
  const minArea = options.minZoneAreaM2 ?? DEFAULT_MIN_ZONE_AREA_M2;
  let smallest = Infinity;
  for (const [x0, y0, x1, y1] of rects) smallest = Math.min(smallest, x1 - x0, y1 - y0);
  const span = Math.max(field.maxX - field.minX, field.maxY - field.minY) + 2 * marginM;
  const step = Math.max(Math.min(smallest, marginM > 0 ? marginM / 2 : Infinity), span / 1500);
  const originX = field.minX - marginM;
  const originY = field.minY - marginM;
  const cols = Math.ceil((field.maxX - field.minX + 2 * marginM) / step) + 1;
  const rows = Math.ceil((field.maxY - field.minY + 2 * marginM) / step) + 1;
  const core = new Uint8Array(cols * rows);
  for (const [x0, y0, x1, y1] of rects) {
    const colFrom = Math.max(0, Math.round((x0 - originX) / step));
    const colTo = Math.min(cols, Math.round((x1 - originX) / step));
    const rowFrom = Math.max(0, Math.round((y0 - originY) / step));
    const rowTo = Math.min(rows, Math.round((y1 - originY) / step));
    for (let row = rowFrom; row < rowTo; row++) core.fill(1, row * cols + colFrom, row * cols + colTo);
  }
  let mask = core;
  if (marginM > 0) {
    mask = new Uint8Array(cols * rows);
    const reach = Math.floor(marginM / step);
    const offsets: number[] = [];
    // A cell joins when its centre lies within the margin of a core cell's square (not just its centre).
    const r = marginM / step;
    for (let dy = -reach - 1; dy <= reach + 1; dy++) {
      const gap = Math.max(Math.abs(dy) - 0.5, 0);
      if (gap > r) continue;
      offsets.push(dy, Math.floor(0.5 + Math.sqrt(r * r - gap * gap)));
    }
    for (let row = 0; row < rows; row++) {
      for (let col = 0; col < cols; col++) {
        if (!core[row * cols + col]) continue;
        // Only cells on the edge of the core spread outwards.
        const interior =
          row > 0 &&
          row < rows - 1 &&
          col > 0 &&
          col < cols - 1 &&
          core[row * cols + col - 1] &&
          core[row * cols + col + 1] &&
          core[(row - 1) * cols + col] &&
          core[(row + 1) * cols + col];
        if (interior) {
          mask[row * cols + col] = 1;
          continue;
        }
        for (let k = 0; k < offsets.length; k += 2) {
          const y = row + offsets[k];
          if (y < 0 || y >= rows) continue;
          const dx = offsets[k + 1];
          mask.fill(1, y * cols + Math.max(0, col - dx), y * cols + Math.min(cols, col + dx + 1));
        }
      }
    }
  }
  const runs = runsToRectangles(cols, rows, originX, originY, step, step, (c) => mask[c] === 1);
  if (runs.length === 0) return [];
  const merged = runs.length === 1 ? rectPolygon(runs[0]) : union(featureCollection(runs.map(rectPolygon)));
  if (!merged) return [];
  const fieldFeature: Feature<MultiPolygon> = { type: 'Feature', properties: {}, geometry: { type: 'MultiPolygon', coordinates: fieldToCoordinates(field) } };
  const clipped = intersect(featureCollection<Polygon | MultiPolygon>([merged, fieldFeature]));
  if (!clipped) return [];
  const zones: PlanarZone[] = [];
  for (const rings of polygonsOf(clipped.geometry)) {
    const areaM2 = rings.reduce((sum, ring, index) => sum + (index === 0 ? ringArea(ring) : -ringArea(ring)), 0);
    if (areaM2 >= minArea) zones.push({ rings, areaM2 });
  }
  return zones.sort((a, b) => b.areaM2 - a.areaM2);
}

/** Row runs of selected cells as rectangles, so the union has few pieces. */
function runsToRectangles(
  cols: number,
  rows: number,
  originX: number,
  originY: number,
  width: number,
  height: number,
  selected: (c: number) => boolean,
): Rect[] {
  const rects: Rect[] = [];
  for (let row = 0; row < rows; row++) {
    let col = 0;
    while (col < cols) {
      if (!selected(row * cols + col)) {
        col++;
        continue;
      }
      const from = col;
      while (col < cols && selected(row * cols + col)) col++;
      rects.push([originX + from * width, originY + row * height, originX + col * width, originY + (row + 1) * height]);
    }
  }
  return rects;
}

export interface DensityZoneOptions extends ZoneShapeOptions {
  /** Sightings per hectare; when absent, shareOfMax × the surface maximum. */
  densityThresholdPerHa?: number;
  shareOfMax?: number;
}

/** The density threshold actually used, in sightings per hectare. */
export function densityThresholdPerHa(density: DensityResult, options: DensityZoneOptions = {}): number {
  return options.densityThresholdPerHa ?? (options.shareOfMax ?? 0.5) * density.maxPerHa;
}

/** Zones where the kernel density surface reaches the threshold. */
export function zonesFromDensity(field: PlanarField, density: DensityResult, options: DensityZoneOptions = {}): PlanarZone[] {
  const threshold = densityThresholdPerHa(density, options);
  if (!(threshold > 0)) return [];
  const rects = runsToRectangles(density.cols, density.rows, density.originX, density.originY, density.cellSizeM, density.cellSizeM, (c) => {
    const value = density.perHa[c];
    return value !== null && value >= threshold;
  });
  return zonesFromRectangles(field, rects, options);
}

export interface QuadratZoneOptions extends ZoneShapeOptions {
  /** The pest's action threshold, in the sightings' own count unit. */
  actionThreshold: number;
  /** Compare the mean count per sighting in a cell, or the cell's total count, with the threshold. */
  measure?: 'perSighting' | 'perCell';
}

/** Zones from quadrat cells whose counts exceed a pest's action threshold. */
export function zonesFromQuadrat(field: PlanarField, quadrat: QuadratResult, options: QuadratZoneOptions): PlanarZone[] {
  const { grid } = quadrat;
  const selected = new Uint8Array(grid.cols * grid.rows);
  const measure = options.measure ?? 'perSighting';
  for (const cell of quadrat.cells) {
    const total = cell.countTotal ?? cell.count;
    const value = measure === 'perSighting' ? (cell.count > 0 ? total / cell.count : 0) : total;
    if (value > options.actionThreshold) selected[cell.row * grid.cols + cell.col] = 1;
  }
  const rects = runsToRectangles(grid.cols, grid.rows, grid.originX, grid.originY, grid.cellWidth, grid.cellHeight, (c) => selected[c] === 1);
  return zonesFromRectangles(field, rects, options);
}
