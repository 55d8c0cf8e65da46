// A check's stored answer in parts: the figures (JSON), the density grid (binary) and the scouted-area polygons
// (geometry columns), so reading a check never drags the grid or the polygons along and the figures stay within a
// stated size. Over 5,000 evenly spread stops the scouted area alone has some 180,000 corners in each of its two
// polygons, about 14 MB as JSON; in the figures it would break the bound, so it is stored apart (migration 0018).
import type { AnalysisResult } from '../../shared/analysis/analyse.ts';
import type { DensityResult } from '../../shared/analysis/density.ts';
import type { MultiPolygon } from 'geojson';

/** The most bytes a check's stored figures may take (JSON, density grid and scouted-area polygons excluded); 5,000 sightings take about 1 MB. */
export const MAX_FIGURES_BYTES = 4 * 1024 * 1024;

/** The density figures as stored and served: everything but the grid, which has a route of its own. */
export type StoredDensity = Omit<DensityResult, 'perHa'>;

/** The figures as stored: the scouted area's scalars, its polygons in columns of their own. */
export type StoredScouted = Omit<NonNullable<AnalysisResult['scouted']>, 'scouted' | 'notScouted'>;

/** What a finished check rests on, stored in columns beside its figures (migrations 0009 and 0018). */
export interface DesignColumns {
  design: AnalysisResult['design'];
  stopMerges: AnalysisResult['stops']['merges'];
  /** RFC 7946 MultiPolygon in longitude/latitude, or null without stops. */
  scouted: string | null;
  /** RFC 7946 MultiPolygon in longitude/latitude, or null when every part of the field was scouted. */
  notScouted: string | null;
  notScoutedM2: number | null;
}

const polygonsText = (polygons: MultiPolygon | undefined) => (polygons && polygons.coordinates.length ? JSON.stringify(polygons) : null);

export function designColumns(result: AnalysisResult): DesignColumns {
  return {
    design: result.design,
    stopMerges: result.stops.merges,
    scouted: polygonsText(result.scouted?.scouted),
    notScouted: polygonsText(result.scouted?.notScouted),
    notScoutedM2: result.scouted ? result.scouted.notScoutedM2 : null,
  };
}

export interface SplitResult {
  figuresJson: string;
  design: DesignColumns;
  /** Row-major from the south, sightings per ha as the engine computed them (64-bit); NaN where the cell centre lies outside the field. */
  densityGrid: Float64Array | null;
  figuresBytes: number;
}

/** Splits the engine's result into its figures, its density grid and its scouted-area polygons, without changing any figure. */
export function splitResult(result: AnalysisResult): SplitResult {
  const density = result.density;
  let densityGrid: Float64Array | null = null;
  let storedDensity: StoredDensity | null = null;
  if (density) {
    const { perHa, ...rest } = density;
    densityGrid = Float64Array.from(perHa, (value) => (value === null ? Number.NaN : value));
    storedDensity = rest;
  }
  let storedScouted: StoredScouted | null = null;
  if (result.scouted) {
    const { scouted: _scouted, notScouted: _notScouted, ...scalars } = result.scouted;
    storedScouted = scalars;
  }
  const figuresJson = JSON.stringify({ ...result, density: storedDensity, scouted: storedScouted });
  return { figuresJson, design: designColumns(result), densityGrid, figuresBytes: Buffer.byteLength(figuresJson, 'utf8') };
}

/** The largest parts of the figures, for the sentence that says which option to change. */
function largestPart(result: AnalysisResult): string {
  const sizes: Array<[string, number]> = [
    ['quadrat cells (choose a larger quadrat cell size)', JSON.stringify(result.quadrat ?? null).length],
    ['per-stop figures (check fewer sightings, for example a shorter date window)', JSON.stringify(result.counts ?? null).length],
    ['Ripley figures (give fewer Ripley radii)', JSON.stringify(result.ripley ?? null).length],
    ['proposed zones (raise the zone threshold or the smallest zone area)', JSON.stringify(result.zones ?? null).length],
  ];
  return sizes.sort((a, b) => b[1] - a[1])[0][0];
}

/**
 * The most corners a check's scouted-area polygons may have, scouted and not scouted together: about 16 MB as
 * stored (two 64-bit numbers a corner) and 22 MB as the map fetches it. 5,000 evenly spread stops have about 360,000 (measured).
 */
export const MAX_SCOUTED_AREA_CORNERS = 1_000_000;

export function scoutedAreaCorners(result: AnalysisResult): number {
  let corners = 0;
  for (const polygons of [result.scouted?.scouted, result.scouted?.notScouted])
    for (const polygon of polygons?.coordinates ?? []) for (const ring of polygon) corners += ring.length;
  return corners;
}

/** The sentence for figures or scouted-area polygons over their bound, or null when they fit. */
export function oversizeMessage(result: AnalysisResult, figuresBytes: number): string | null {
  const mb = (bytes: number) => (bytes / (1024 * 1024)).toFixed(1);
  if (figuresBytes > MAX_FIGURES_BYTES)
    return `This check's figures would take ${mb(figuresBytes)} MB, over the ${mb(MAX_FIGURES_BYTES)} MB a check may store; most of it is ${largestPart(result)}.`;
  const corners = scoutedAreaCorners(result);
  if (corners > MAX_SCOUTED_AREA_CORNERS)
    return `This check's scouted area would have ${corners.toLocaleString('en')} corners, over the ${MAX_SCOUTED_AREA_CORNERS.toLocaleString('en')} a check may store; check fewer stops, for example a shorter date window.`;
  return null;
}

/** The stored grid back as the engine's perHa list (null outside the field), for code that needs the surface. */
export function densityValues(grid: Float64Array): (number | null)[] {
  return Array.from(grid, (value) => (Number.isNaN(value) ? null : value));
}
