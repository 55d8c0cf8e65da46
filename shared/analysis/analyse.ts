// One pattern check: every figure the app, the e-mail and the command line show comes from here.
import type { Feature, FeatureCollection, MultiPolygon, Point, Polygon } from 'geojson';
import { areaFigures, type AreaFigures } from './area.ts';
import { benjaminiHochberg, distanceBandNeighbours, getisOrdGiStar, hotPatches, moransI, type MoranResult } from './autocorrelation.ts';
import { searchCoverage, type CoverageResult } from './coverage.ts';
import { densitySurface, type DensityResult } from './density.ts';
import { normalTwoSided } from './distributions.ts';
import { AnalysisInputError } from './errors.ts';
import { createPlanarField, fieldToCoordinates, isInsideField, type PlanarField } from './field-geometry.ts';
import { readBoundary, readSightings } from './input.ts';
import { runSimulations, type SimulationPlan } from './monte-carlo.ts';
import { nearestNeighbourTest, type NearestNeighbourResult } from './nearest-neighbour.ts';
import { analysisOptionsSchema, type AnalysisOptions, type AnalysisOptionsInput } from './options.ts';
import { boundaryCentroid, planarProjection, utmProjectionFor, type Projection } from './projection.ts';
import { quadratTest, type QuadratResult } from './quadrat.ts';
import { defaultRipleyRadii, ripleyK, ripleyResult, type RipleyResult } from './ripley.ts';
import { spreadVerdict, type SpreadResult } from './spread.ts';
import { ENGINE_VERSION } from './version.ts';
import { densityThresholdPerHa, zonesFromDensity, type PlanarZone } from './zones.ts';

export { analysisOptionsSchema };
export type { AnalysisOptions, AnalysisOptionsInput };

export type BoundaryInput = Polygon | MultiPolygon | Feature<Polygon | MultiPolygon> | FeatureCollection<Polygon | MultiPolygon>;
export type SightingsInput = FeatureCollection<Point, { count?: number | null; id?: string } | null>;

const M2_PER_HA = 10_000;
const M2_PER_AC = 4046.8564224;

export interface ZoneProperties {
  zone: number;
  areaM2: number;
  areaHa: number;
  areaAc: number;
  shareOfField: number;
  sightings: number;
}

export interface CountsResult {
  stops: number;
  moran: MoranResult;
  /** Gi* per stop (sightings and empty stops with a count), with BH-adjusted q-values. */
  giStar: Array<{ id: string; count: number; z: number; pValue: number; qValue: number; hot: boolean; cold: boolean }>;
  hotPatches: Array<{ sightings: number; ids: string[]; meanCount: number; centre: [number, number] }>;
}

export interface AnalysisResult {
  engineVersion: string;
  n: number;
  crs: string;
  crsDefinition: string | null;
  excluded: { count: number; ids: string[] };
  emptyStops: number;
  area: AreaFigures;
  quadrat: QuadratResult | null;
  nearestNeighbour: NearestNeighbourResult | null;
  ripley: RipleyResult | null;
  density: DensityResult | null;
  counts: CountsResult | null;
  coverage: CoverageResult | null;
  zones: FeatureCollection<Polygon, ZoneProperties> & { thresholdPerHa: number | null; note: string };
  spread: SpreadResult;
  timingsMs: Record<string, number>;
}

/** Simulated statistics computed elsewhere (e.g. on worker threads) for the plans of `planSimulations`. */
export interface PrecomputedSimulations {
  meanNearestDistances?: Float64Array;
  ripleyL?: Float64Array;
}

interface Prepared {
  options: AnalysisOptions;
  projection: Projection;
  originX: number;
  originY: number;
  field: PlanarField;
  located: Float64Array;
  locatedIds: string[];
  locatedCounts: (number | null)[];
  stops: Float64Array;
  stopIds: string[];
  stopCounts: (number | null)[];
  emptyStops: number;
  excluded: string[];
  area: AreaFigures;
  radiiM: number[];
}

function parseOptions(options: AnalysisOptionsInput | undefined): AnalysisOptions {
  const parsed = analysisOptionsSchema.safeParse(options ?? {});
  if (parsed.success) return parsed.data;
  const issue = parsed.error.issues[0];
  throw new AnalysisInputError(issue.message.endsWith('.') ? issue.message : `Option ${issue.path.join('.')}: ${issue.message}.`);
}

function prepare(boundary: unknown, sightings: unknown, optionsInput: AnalysisOptionsInput | undefined): Prepared {
  const options = parseOptions(optionsInput);
  const polygons = readBoundary(boundary);
  const records = readSightings(sightings);
  let projection = planarProjection;
  if (!options.planar) {
    const outOfRange = (x: number, y: number) => !(x >= -180 && x <= 180 && y >= -90 && y <= 90);
    if (polygons.some((p) => p.some((ring) => ring.some(([x, y]) => outOfRange(x, y)))) || records.some((s) => outOfRange(s.x, s.y))) {
      throw new AnalysisInputError('Coordinates are outside longitude/latitude range; if they are metres, use the planar option (--planar).');
    }
    const [lon, lat] = boundaryCentroid(polygons);
    projection = utmProjectionFor(lon, lat);
  }
  const projected = polygons.map((polygon) => polygon.map((ring) => ring.map(([x, y]) => projection.forward(x, y))));
  // Work relative to the boundary's south-west corner so areas keep full precision.
  let originX = Infinity;
  let originY = Infinity;
  for (const polygon of projected) for (const ring of polygon) for (const [x, y] of ring) {
    originX = Math.min(originX, x);
    originY = Math.min(originY, y);
  }
  originX = Math.floor(originX);
  originY = Math.floor(originY);
  const field = createPlanarField(projected.map((polygon) => polygon.map((ring) => ring.map(([x, y]) => [x - originX, y - originY]))));
  const located: number[] = [];
  const locatedIds: string[] = [];
  const locatedCounts: (number | null)[] = [];
  const stops: number[] = [];
  const stopIds: string[] = [];
  const stopCounts: (number | null)[] = [];
  const excluded: string[] = [];
  let emptyStops = 0;
  for (const sighting of records) {
    const [px, py] = projection.forward(sighting.x, sighting.y);
    const x = px - originX;
    const y = py - originY;
    if (!isInsideField(field, x, y)) {
      excluded.push(sighting.id);
      continue;
    }
    stops.push(x, y);
    stopIds.push(sighting.id);
    stopCounts.push(sighting.count);
    if (sighting.count === 0) {
      emptyStops++;
      continue;
    }
    located.push(x, y);
    locatedIds.push(sighting.id);
    locatedCounts.push(sighting.count);
  }
  const locatedXY = new Float64Array(located);
  const area = areaFigures(field, locatedXY, options.areaBasis, options.customAreaM2);
  if (!(area.usedM2 > 0)) throw new AnalysisInputError(`The ${options.areaBasis} area is zero; choose another area basis.`);
  const radiiM = options.radiiM ?? defaultRipleyRadii(field);
  return {
    options,
    projection,
    originX,
    originY,
    field,
    located: locatedXY,
    locatedIds,
    locatedCounts,
    stops: new Float64Array(stops),
    stopIds,
    stopCounts,
    emptyStops,
    excluded,
    area,
    radiiM,
  };
}

function plansOf(prepared: Prepared): { nearestNeighbour: SimulationPlan | null; ripley: SimulationPlan | null } {
  const n = prepared.located.length / 2;
  const { options } = prepared;
  if (n < 2 || options.simulations === 0) return { nearestNeighbour: null, ripley: null };
  const base = { fieldCoordinates: fieldToCoordinates(prepared.field), n, simulations: options.simulations };
  return {
    nearestNeighbour: { ...base, seed: `${options.seed}:nearest-neighbour`, nearestNeighbour: true, ripley: null },
    ripley: { ...base, seed: `${options.seed}:ripley`, nearestNeighbour: false, ripley: { radiiM: prepared.radiiM, correction: options.ripleyCorrection, areaM2: prepared.area.usedM2 } },
  };
}

/** The CSR simulation plans a check will need, so a caller can run them on worker threads first. */
export function planSimulations(boundary: BoundaryInput | unknown, sightings: SightingsInput | unknown, options?: AnalysisOptionsInput) {
  return plansOf(prepare(boundary, sightings, options));
}

/** Runs a full pattern check of the sightings inside the boundary. */
export function analyse(
  boundary: BoundaryInput | unknown,
  sightings: SightingsInput | unknown,
  optionsInput?: AnalysisOptionsInput,
  precomputed: PrecomputedSimulations = {},
): AnalysisResult {
  const timingsMs: Record<string, number> = {};
  const timed = <T>(label: string, work: () => T): T => {
    const started = performance.now();
    const value = work();
    timingsMs[label] = Math.round((performance.now() - started) * 100) / 100;
    return value;
  };
  const prepared = timed('prepare', () => prepare(boundary, sightings, optionsInput));
  const { options, field, located, area, originX, originY, projection } = prepared;
  const n = located.length / 2;
  const plans = plansOf(prepared);
  const counts = prepared.locatedCounts.some((c) => c !== null) ? prepared.locatedCounts.map((c) => c ?? 1) : null;

  const quadrat = n >= 2 ? timed('quadrat', () => quadratTest(field, located, area.boundaryM2, { cellSizeM: options.cellSizeM, grid: options.grid, slivers: options.slivers, counts })) : null;

  const nearestNeighbour =
    n >= 2
      ? timed('nearestNeighbour', () => {
          const simulated = plans.nearestNeighbour ? (precomputed.meanNearestDistances ?? runSimulations(plans.nearestNeighbour, field).meanNearestDistances) : undefined;
          return nearestNeighbourTest(located, area.usedM2, area.perimeterM, simulated);
        })
      : null;

  const ripley =
    n >= 2
      ? timed('ripley', () => {
          const K = ripleyK(field, located, prepared.radiiM, area.usedM2, options.ripleyCorrection);
          const simulated = plans.ripley ? (precomputed.ripleyL ?? runSimulations(plans.ripley, field).ripleyL) : null;
          return ripleyResult(prepared.radiiM, K, options.ripleyCorrection, simulated, plans.ripley ? options.simulations : 0);
        })
      : null;

  const density =
    n >= 1
      ? timed('density', () => {
          const surface = densitySurface(field, located, { kernel: options.kernel, bandwidthM: options.bandwidthM, cellSizeM: options.densityCellSizeM, edgeCorrection: options.densityEdgeCorrection });
          return { ...surface, originX: surface.originX + originX, originY: surface.originY + originY };
        })
      : null;

  const countsResult = timed('counts', () => countStatistics(prepared));
  const coverage = prepared.stops.length >= 4 ? timed('coverage', () => searchCoverage(field, prepared.stops, prepared.emptyStops, area.boundaryM2)) : null;
  const spread = spreadVerdict({ n, alpha: options.alpha, minSightings: options.minSightings, nearestNeighbour, quadrat, ripley, coverage });
  const zones = timed('zones', () => treatmentZones(prepared, density, spread));
  return {
    engineVersion: ENGINE_VERSION,
    n,
    crs: projection.crs,
    crsDefinition: projection.definition,
    excluded: { count: prepared.excluded.length, ids: prepared.excluded },
    emptyStops: prepared.emptyStops,
    area,
    quadrat: quadrat && { ...quadrat, grid: { ...quadrat.grid, originX: quadrat.grid.originX + originX, originY: quadrat.grid.originY + originY } },
    nearestNeighbour,
    ripley,
    density,
    counts: countsResult,
    coverage,
    zones,
    spread,
    timingsMs,
  };
}

function countStatistics(prepared: Prepared): CountsResult | null {
  const { stopCounts, stops, stopIds, options } = prepared;
  const index: number[] = [];
  stopCounts.forEach((c, i) => {
    if (c !== null) index.push(i);
  });
  if (index.length < 4) return null;
  const xy = new Float64Array(index.length * 2);
  const values = new Float64Array(index.length);
  index.forEach((i, k) => {
    xy[k * 2] = stops[i * 2];
    xy[k * 2 + 1] = stops[i * 2 + 1];
    values[k] = stopCounts[i] as number;
  });
  const nb = distanceBandNeighbours(xy, options.moranBandM);
  const moran = moransI(values, nb, options.simulations, `${options.seed}:moran`);
  const gi = getisOrdGiStar(values, nb);
  const p = gi.map((z) => normalTwoSided(z));
  const q = benjaminiHochberg(p);
  const patches = hotPatches(values, xy, nb, gi, q, options.alpha);
  return {
    stops: index.length,
    moran,
    giStar: index.map((i, k) => ({ id: stopIds[i], count: values[k], z: gi[k], pValue: p[k], qValue: q[k], hot: gi[k] > 0 && q[k] < options.alpha, cold: gi[k] < 0 && q[k] < options.alpha })),
    hotPatches: patches.map((patch) => ({
      sightings: patch.members.length,
      ids: patch.members.map((k) => stopIds[index[k]]),
      meanCount: patch.meanCount,
      centre: prepared.projection.inverse(patch.centroidX + prepared.originX, patch.centroidY + prepared.originY),
    })),
  };
}

function treatmentZones(prepared: Prepared, density: DensityResult | null, spread: SpreadResult): AnalysisResult['zones'] {
  const { options, field, located, area } = prepared;
  const empty = (note: string, thresholdPerHa: number | null = null) => ({ type: 'FeatureCollection' as const, features: [], thresholdPerHa, note });
  if (!density) return empty('No sightings inside the field.');
  if (options.zones.onlyWhenClustered && spread.verdict !== 'clustered') return empty(`No zones proposed: the spread is ${spread.verdict}, not clustered.`);
  const local = { ...density, originX: density.originX - prepared.originX, originY: density.originY - prepared.originY };
  const threshold = densityThresholdPerHa(local, options.zones);
  const planarZones = zonesFromDensity(field, local, options.zones);
  return {
    type: 'FeatureCollection',
    thresholdPerHa: threshold,
    note: `Density of at least ${threshold.toFixed(1)} sightings per ha, ${options.zones.marginM} m margin, zones under ${options.zones.minZoneAreaM2} m² dropped.`,
    features: planarZones.map((zone, index) => zoneFeature(prepared, zone, index, located, area.boundaryM2)),
  };
}

function zoneFeature(prepared: Prepared, zone: PlanarZone, index: number, located: Float64Array, fieldAreaM2: number): Feature<Polygon, ZoneProperties> {
  const shape = createPlanarField([zone.rings]);
  let inside = 0;
  for (let i = 0; i < located.length; i += 2) if (isInsideField(shape, located[i], located[i + 1])) inside++;
  return {
    type: 'Feature',
    properties: {
      zone: index + 1,
      areaM2: zone.areaM2,
      areaHa: zone.areaM2 / M2_PER_HA,
      areaAc: zone.areaM2 / M2_PER_AC,
      shareOfField: zone.areaM2 / fieldAreaM2,
      sightings: inside,
    },
    geometry: {
      type: 'Polygon',
      coordinates: zone.rings.map((ring) => ring.map(([x, y]) => prepared.projection.inverse(x + prepared.originX, y + prepared.originY))),
    },
  };
}
