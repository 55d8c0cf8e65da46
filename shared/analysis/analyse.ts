// One pattern check: every figure the app, the e-mail and the command line show comes from here.
import type { Feature, FeatureCollection, MultiPolygon, Point, Polygon } from 'geojson';
import { areaFigures, type AreaFigures } from './area.ts';
import {
  benjaminiHochberg,
  distanceBandNeighbours,
  getisOrdGiStar,
  giStarPermutationP,
  hotPatches,
  moransI,
  stopSpacingNeighbours,
  type MoranResult,
} from './autocorrelation.ts';
import { searchCoverage, type CoverageResult } from './coverage.ts';
import { densitySurface, type DensityResult } from './density.ts';
import { normalTwoSided } from './distributions.ts';
import { AnalysisInputError } from './errors.ts';
import { createPlanarField, fieldToCoordinates, snapInsideField, type PlanarField } from './field-geometry.ts';
import { randomLabellingTest, type RandomLabellingResult } from './labelling.ts';
import { mergeStops, type PlacedSighting, type StopMerge } from './stops.ts';
import { abundanceZones, stopSurface, type ZoneBasis } from './abundance-zones.ts';
import { bernoulliScan, type ScanResult } from './scan.ts';
import { scoutedArea, type ScoutedArea } from './scouted.ts';
import { intersection, polygonsArea } from './vector-buffer.ts';
import { stopsQuadratTest, type StopsQuadratResult } from './stops-quadrat.ts';
import { quadratGrid } from './quadrat.ts';
import { cellAreasInsideField } from './cell-clipping.ts';
import { readBoundary, readSightings } from './input.ts';
import { runSimulations, type SimulationPlan } from './monte-carlo.ts';
import { nearestNeighbourTest, type NearestNeighbourResult } from './nearest-neighbour.ts';
import { analysisOptionsSchema, type AnalysisOptions, type AnalysisOptionsInput } from './options.ts';
import { boundaryCentroid, planarProjection, utmProjectionFor, type Projection } from './projection.ts';
import { planarFrame, zoneFeature } from './planar-frame.ts';
import { quadratTest, type QuadratResult } from './quadrat.ts';
import { defaultRipleyRadii, ripleyK, ripleyResult, type RipleyResult } from './ripley.ts';
import { formatP, spreadVerdict, stopsVerdict, type CheckDesign, type Evidence, type SpreadResult } from './spread.ts';
import { ENGINE_VERSION } from './version.ts';
import { densityThresholdPerHa, zonesFromDensity } from './zones.ts';

export { analysisOptionsSchema };
export type { AnalysisOptions, AnalysisOptionsInput };

export type BoundaryInput = Polygon | MultiPolygon | Feature<Polygon | MultiPolygon> | FeatureCollection<Polygon | MultiPolygon>;
export type SightingsInput = FeatureCollection<Point, { count?: number | null; id?: string } | null>;

export interface ZoneProperties {
  zone: number;
  areaM2: number;
  areaHa: number;
  areaAc: number;
  shareOfField: number;
  sightings: number;
  /** Stops inside the zone (found and empty), their ids, mean count per stop and the threshold it was held against. */
  stopCount?: number;
  stops?: string[];
  meanCount?: number;
  threshold?: number | null;
  basis?: ZoneBasis;
}

export interface ScoutedSummary {
  stopSpacingM: number;
  radiusM: number;
  rule: string;
  scoutedM2: number;
  notScoutedM2: number;
  /** Share of the field the stops speak for. */
  scoutedShare: number;
  scouted: MultiPolygon;
  notScouted: MultiPolygon;
}

export interface ScanSummary extends Omit<ScanResult, 'members' | 'centre'> {
  centre: [number, number];
  stops: string[];
}

export interface CountsResult {
  stops: number;
  moran: MoranResult;
  /** Gi* per stop (sightings and empty stops with a count), with BH-adjusted q-values. */
  giStar: Array<{ id: string; count: number; z: number; pValue: number; qValue: number; hot: boolean; cold: boolean }>;
  hotPatches: Array<{ sightings: number; ids: string[]; meanCount: number; centre: [number, number] }>;
}

export interface StopsSummary {
  /** Stops after same-stop merging (found and empty). */
  count: number;
  found: number;
  empty: number;
  walks: number;
  radiusM: number | null;
  rule: string;
  merges: StopMerge[];
  /** Sightings just outside the boundary (within the tolerance) moved onto it. */
  movedInside: { count: number; ids: string[]; toleranceM: number };
}

export interface AnalysisResult {
  engineVersion: string;
  /** stops: empty stops recorded, tested by random labelling; whole-field: photos only, tested against chance over the field. */
  design: CheckDesign;
  designNote: string;
  /** Stops with the pest (after same-stop merging). */
  n: number;
  stops: StopsSummary;
  randomLabelling: RandomLabellingResult | null;
  /** Where the stops speak for the crop, and the rest of the field: "not scouted", never clean. */
  scouted: ScoutedSummary | null;
  /** Stops design: found stops against stops per quadrat cell (supporting evidence). */
  stopsQuadrat: StopsQuadratResult | null;
  /** The most likely patch by the spatial scan statistic (stops design). */
  scan: ScanSummary | null;
  crs: string;
  crsDefinition: string | null;
  excluded: { count: number; ids: string[] };
  emptyStops: number;
  area: AreaFigures;
  quadrat: QuadratResult | null;
  nearestNeighbour: (NearestNeighbourResult & { reference: 'csr' | 'random-labelling' }) | null;
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
  design: CheckDesign;
  found: Uint8Array;
  walkOf: Int32Array;
  summary: StopsSummary;
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
  const { originX, originY, local } = planarFrame(polygons, projection);
  refuseOverlappingParts(local);
  const field = createPlanarField(local);
  const placed: PlacedSighting[] = [];
  const excluded: string[] = [];
  const moved: string[] = [];
  for (const sighting of records) {
    const [px, py] = projection.forward(sighting.x, sighting.y);
    const spot = snapInsideField(field, px - originX, py - originY, options.boundaryToleranceM);
    if (!spot) {
      excluded.push(sighting.id);
      continue;
    }
    if (spot[0] !== px - originX || spot[1] !== py - originY) moved.push(sighting.id);
    placed.push({ id: sighting.id, x: spot[0], y: spot[1], count: sighting.count, walk: sighting.walk, accuracyM: sighting.accuracyM });
  }
  const merged = mergeStops(placed, options.stopRadiusM);
  const located: number[] = [];
  const locatedIds: string[] = [];
  const locatedCounts: (number | null)[] = [];
  const stops: number[] = [];
  const stopIds: string[] = [];
  const stopCounts: (number | null)[] = [];
  const found = new Uint8Array(merged.stops.length);
  const walkOf = new Int32Array(merged.stops.length);
  let emptyStops = 0;
  merged.stops.forEach((stop, i) => {
    stops.push(stop.x, stop.y);
    stopIds.push(stop.id);
    stopCounts.push(stop.count);
    walkOf[i] = stop.walk;
    if (!stop.found) {
      emptyStops++;
      return;
    }
    found[i] = 1;
    located.push(stop.x, stop.y);
    locatedIds.push(stop.id);
    locatedCounts.push(stop.count);
  });
  const design: CheckDesign = emptyStops > 0 ? 'stops' : 'whole-field';
  const summary: StopsSummary = {
    count: merged.stops.length,
    found: merged.stops.length - emptyStops,
    empty: emptyStops,
    walks: merged.walks.length,
    radiusM: merged.radiusM,
    rule: merged.rule,
    merges: merged.merges,
    movedInside: { count: moved.length, ids: moved, toleranceM: options.boundaryToleranceM },
  };
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
    design,
    found,
    walkOf,
    summary,
  };
}

/** Parts of a MultiPolygon that overlap would count their shared ground twice: refused with a sentence. */
function refuseOverlappingParts(polygons: number[][][][]): void {
  for (let a = 0; a < polygons.length; a++)
    for (let b = a + 1; b < polygons.length; b++) {
      const shared = polygonsArea(intersection([polygons[a]], [polygons[b]]));
      if (shared > 1) {
        throw new AnalysisInputError(
          `Parts ${a + 1} and ${b + 1} of the boundary overlap (${shared.toFixed(0)} m²); join them into one part or fix the outline before a check.`,
        );
      }
    }
}

function plansOf(prepared: Prepared): { nearestNeighbour: SimulationPlan | null; ripley: SimulationPlan | null } {
  const n = prepared.located.length / 2;
  const { options } = prepared;
  // The stops design relabels the stops it has (cheap, on this thread); CSR simulations serve the whole-field design only.
  if (n < 2 || options.simulations === 0 || prepared.design === 'stops') return { nearestNeighbour: null, ripley: null };
  const base = { fieldCoordinates: fieldToCoordinates(prepared.field), n, simulations: options.simulations };
  return {
    nearestNeighbour: { ...base, seed: `${options.seed}:nearest-neighbour`, nearestNeighbour: true, ripley: null },
    ripley: {
      ...base,
      seed: `${options.seed}:ripley`,
      nearestNeighbour: false,
      ripley: { radiiM: prepared.radiiM, correction: options.ripleyCorrection, areaM2: prepared.area.usedM2 },
    },
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

  const quadrat =
    n >= 2
      ? timed('quadrat', () =>
          quadratTest(field, located, area.boundaryM2, { cellSizeM: options.cellSizeM, grid: options.grid, slivers: options.slivers, counts }),
        )
      : null;

  const labelling =
    prepared.design === 'stops' && n >= 2 && options.simulations > 0
      ? timed('randomLabelling', () =>
          randomLabellingTest(field, prepared.stops, prepared.found, prepared.walkOf, prepared.radiiM, area.boundaryM2, {
            correction: options.ripleyCorrection,
            simulations: options.simulations,
            seed: `${options.seed}:random-labelling`,
            alpha: options.alpha,
          }),
        )
      : null;

  const nearestNeighbour =
    n >= 2
      ? timed('nearestNeighbour', () => {
          if (prepared.design === 'stops') {
            const values = nearestNeighbourTest(located, area.usedM2, area.perimeterM);
            const relabelled = labelling?.nearestNeighbour;
            return {
              ...values,
              reference: 'random-labelling' as const,
              monteCarlo: {
                simulations: relabelled?.simulations ?? 0,
                pValue: relabelled?.pValue ?? null,
                meanSimulatedDistanceM: relabelled?.relabellingMeanM ?? null,
              },
            };
          }
          const simulated = plans.nearestNeighbour
            ? (precomputed.meanNearestDistances ?? runSimulations(plans.nearestNeighbour, field).meanNearestDistances)
            : undefined;
          return { ...nearestNeighbourTest(located, area.usedM2, area.perimeterM, simulated), reference: 'csr' as const };
        })
      : null;

  const ripley =
    n >= 2
      ? timed('ripley', () => {
          if (prepared.design === 'stops')
            return labelling
              ? labellingRipley(labelling)
              : ripleyResult(
                  prepared.radiiM,
                  ripleyK(field, located, prepared.radiiM, area.boundaryM2, options.ripleyCorrection),
                  options.ripleyCorrection,
                  null,
                  0,
                );
          const K = ripleyK(field, located, prepared.radiiM, area.usedM2, options.ripleyCorrection);
          const simulated = plans.ripley ? (precomputed.ripleyL ?? runSimulations(plans.ripley, field).ripleyL) : null;
          return ripleyResult(prepared.radiiM, K, options.ripleyCorrection, simulated, plans.ripley ? options.simulations : 0);
        })
      : null;

  const density =
    n >= 1
      ? timed('density', () => {
          const surface = densitySurface(field, located, {
            kernel: options.kernel,
            bandwidthM: options.bandwidthM,
            cellSizeM: options.densityCellSizeM,
            edgeCorrection: options.densityEdgeCorrection,
          });
          return { ...surface, originX: surface.originX + originX, originY: surface.originY + originY };
        })
      : null;

  const countsResult = timed('counts', () => countStatistics(prepared));
  const stopsQuadrat =
    prepared.design === 'stops' && n >= 1
      ? timed('stopsQuadrat', () => {
          const grid = quadratGrid(field, prepared.summary.count, area.boundaryM2, { cellSizeM: options.cellSizeM, grid: options.grid });
          const inField = cellAreasInsideField(field, grid).filter((a) => a > 0).length;
          const result = stopsQuadratTest(grid, prepared.stops, prepared.found, walkMembersOf(prepared.walkOf), {
            simulations: options.simulations,
            seed: `${options.seed}:stops-quadrat`,
            cellCount: inField,
          });
          return result && { ...result, grid: { ...result.grid, originX: result.grid.originX + originX, originY: result.grid.originY + originY } };
        })
      : null;
  const coverage = prepared.stops.length >= 4 ? timed('coverage', () => searchCoverage(field, prepared.stops, prepared.emptyStops, area.boundaryM2)) : null;
  const spread =
    prepared.design === 'stops'
      ? stopsVerdict({
          stops: prepared.summary.count,
          found: n,
          alpha: options.alpha,
          minSightings: options.minSightings,
          everywhereShare: options.everywhereShare,
          labelling,
          supporting: stopsSupportingEvidence(labelling, countsResult, stopsQuadrat),
        })
      : spreadVerdict({
          n,
          alpha: options.alpha,
          minSightings: options.minSightings,
          nearestNeighbour,
          quadrat,
          ripley,
          coverage,
          areaM2: area.boundaryM2,
          perimeterM: area.perimeterM,
        });
  const scouted = prepared.stops.length >= 4 ? timed('scouted', () => scoutedArea(field, prepared.stops)) : null;
  const walkMembers = walkMembersOf(prepared.walkOf);
  const scan =
    prepared.design === 'stops' && options.simulations > 0
      ? timed('scan', () => bernoulliScan(prepared.stops, prepared.found, walkMembers, { simulations: options.simulations, seed: `${options.seed}:scan` }))
      : null;
  const zones = timed('zones', () =>
    prepared.design === 'stops' && scouted ? stopZones(prepared, scouted, spread, walkMembers) : treatmentZones(prepared, density, spread),
  );
  return {
    engineVersion: ENGINE_VERSION,
    design: prepared.design,
    designNote:
      prepared.design === 'stops'
        ? 'Stops design: empty stops were recorded, so the pest is compared with the stops the scout made (random labelling, stratified by walk).'
        : 'Whole-field design: no empty stops were recorded, so the tests compare the sightings with chance over the whole field, which assumes the whole field was searched evenly.',
    n,
    stops: prepared.summary,
    randomLabelling: labelling,
    scouted: scouted && scoutedSummary(prepared, scouted),
    scan: scan && scanSummary(prepared, scan),
    stopsQuadrat,
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

/** The stops design's Ripley figures: L of the found stops with its pointwise range over the relabellings. */
function labellingRipley(labelling: RandomLabellingResult): RipleyResult {
  const above: number[] = [];
  const below: number[] = [];
  labelling.radiiM.forEach((r, k) => {
    if (labelling.lFound[k] > labelling.lHigh[k]) above.push(r);
    else if (labelling.lFound[k] < labelling.lLow[k]) below.push(r);
  });
  return {
    correction: labelling.correction,
    radiiM: labelling.radiiM,
    K: labelling.kFound,
    L: labelling.lFound,
    envelopeLow: labelling.lLow,
    envelopeHigh: labelling.lHigh,
    simulations: labelling.simulations,
    aboveEnvelopeM: above,
    belowEnvelopeM: below,
  };
}

function stopsSupportingEvidence(labelling: RandomLabellingResult | null, counts: CountsResult | null, quadrat: StopsQuadratResult | null): Evidence[] {
  const evidence: Evidence[] = [];
  if (quadrat) {
    evidence.push({
      role: 'supporting',
      test: 'quadrat test of equal proportions over the stops',
      pValue: quadrat.pValue,
      text: `Found stops against stops per quadrat cell: χ² = ${quadrat.chiSquare.toFixed(1)} on ${quadrat.df} df, two-sided ${formatP(quadrat.pValue)} (${quadrat.pValueMethod === 'monte-carlo' ? 'relabellings, as expected counts are small' : 'χ² distribution'}); ${quadrat.notScoutedCells} cell${quadrat.notScoutedCells === 1 ? '' : 's'} without a stop are not scouted.`,
    });
  }
  const foundNearest = labelling?.nearestNeighbour;
  if (foundNearest) {
    evidence.push({
      role: 'supporting',
      test: 'Clark–Evans among found stops, random labelling',
      pValue: foundNearest.pValue,
      text: `Mean distance from a found stop to the nearest other found stop: ${foundNearest.meanDistanceM.toFixed(1)} m against ${foundNearest.relabellingMeanM.toFixed(1)} m on average over ${foundNearest.simulations} relabellings (R = ${foundNearest.R.toFixed(2)}, ${formatP(foundNearest.pValue)}).`,
    });
  }
  if (counts && Number.isFinite(counts.moran.I)) {
    evidence.push({
      role: 'supporting',
      test: "Moran's I of stop counts",
      pValue: counts.moran.pValue,
      text: `Moran's I of the counts per stop, empty stops included: I = ${counts.moran.I.toFixed(3)} (expected ${counts.moran.expected.toFixed(3)}; permutation ${formatP(counts.moran.pValue)}), neighbours within ${counts.moran.bandM.toFixed(0)} m.`,
    });
  }
  return evidence;
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
  const nb = options.moranBandM === undefined ? stopSpacingNeighbours(xy) : distanceBandNeighbours(xy, options.moranBandM);
  const moran = moransI(values, nb, options.simulations, `${options.seed}:moran`);
  const gi = getisOrdGiStar(values, nb);
  // Conditional permutation p (Anselin 1995) when simulations run; the normal p only without them.
  const permuted = giStarPermutationP(values, nb, Math.min(options.simulations, 999), `${options.seed}:gi-star`);
  const p = gi.map((z, k) => (Number.isNaN(permuted[k]) ? normalTwoSided(z) : permuted[k]));
  const q = benjaminiHochberg(p);
  const patches = hotPatches(values, xy, nb, gi, q, options.alpha);
  return {
    stops: index.length,
    moran,
    giStar: index.map((i, k) => ({
      id: stopIds[i],
      count: values[k],
      z: gi[k],
      pValue: p[k],
      qValue: q[k],
      hot: gi[k] > 0 && q[k] < options.alpha,
      cold: gi[k] < 0 && q[k] < options.alpha,
    })),
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

function scanSummary(prepared: Prepared, scan: ScanResult): ScanSummary {
  const { members, centre, ...figures } = scan;
  return {
    ...figures,
    centre: prepared.projection.inverse(prepared.stops[centre * 2] + prepared.originX, prepared.stops[centre * 2 + 1] + prepared.originY),
    stops: members.map((i) => prepared.stopIds[i]),
  };
}

function walkMembersOf(walkOf: Int32Array): Int32Array[] {
  const lists = new Map<number, number[]>();
  walkOf.forEach((w, i) => (lists.get(w) ?? lists.set(w, []).get(w)!).push(i));
  return [...lists.values()].filter((l) => l.length > 1).map((l) => Int32Array.from(l));
}

const toLonLat = (prepared: Prepared, polygons: number[][][][]): MultiPolygon => ({
  type: 'MultiPolygon',
  coordinates: polygons.map((rings) => rings.map((ring) => ring.map(([x, y]) => prepared.projection.inverse(x + prepared.originX, y + prepared.originY)))),
});

function scoutedSummary(prepared: Prepared, scouted: ScoutedArea): ScoutedSummary {
  return {
    stopSpacingM: scouted.stopSpacingM,
    radiusM: scouted.radiusM,
    rule: scouted.rule,
    scoutedM2: scouted.scoutedM2,
    notScoutedM2: scouted.notScoutedM2,
    scoutedShare: scouted.scoutedM2 / prepared.area.boundaryM2,
    scouted: toLonLat(prepared, scouted.scouted),
    notScouted: toLonLat(prepared, scouted.notScouted),
  };
}

/** Stops design: zones from abundance among the stops (mean count against the action threshold, or relative risk). */
function stopZones(prepared: Prepared, scouted: ScoutedArea, spread: SpreadResult, walkMembers: Int32Array[]): AnalysisResult['zones'] {
  const { options } = prepared;
  const threshold = options.zones.actionThreshold ?? null;
  const empty = (note: string) => ({ type: 'FeatureCollection' as const, features: [], thresholdPerHa: null, note });
  if (options.zones.onlyWhenClustered && spread.verdict !== 'clustered') return empty(`No zones proposed: the spread is ${spread.verdict}, not clustered.`);
  const counts = prepared.stopCounts.map((c, i) => c ?? (prepared.found[i] ? 1 : 0));
  const surface = stopSurface(prepared.stops, counts, prepared.found, walkMembers, scouted.stopSpacingM, {
    threshold,
    bandwidthM: options.bandwidthM,
    simulations: Math.min(options.simulations, 999),
    seed: `${options.seed}:relative-risk`,
    alpha: options.alpha,
  });
  const planar = abundanceZones(prepared.stops, counts, surface, scouted, { marginM: options.zones.marginM, minZoneAreaM2: options.zones.minZoneAreaM2 });
  const unit = options.zones.unit ?? 'per stop';
  const rule =
    surface.basis === 'mean-count'
      ? `Mean count per stop over the stops within ${surface.bandwidthM.toFixed(0)} m (${surface.bandwidthRule}; nearer stops weigh more, empty stops included) at or above the action threshold of ${threshold} ${unit}`
      : `No action threshold given: stops where the found share of the stops within ${surface.bandwidthM.toFixed(0)} m (${surface.bandwidthRule}; relative risk) is beyond its ${Math.round((1 - options.alpha) * 100)} % tolerance over relabellings`;
  return {
    type: 'FeatureCollection',
    thresholdPerHa: null,
    note: `${rule}; ${options.zones.marginM} m margin, kept inside the scouted area (${scouted.rule}); zones under ${options.zones.minZoneAreaM2} m² dropped. The rest of the field is not scouted.`,
    features: planar.map((zone, index) => {
      const feature = zoneFeature(prepared, { rings: zone.rings, areaM2: zone.areaM2 }, index, prepared.located, prepared.area.boundaryM2);
      const properties: ZoneProperties = {
        ...feature.properties,
        stopCount: zone.stops.length,
        stops: zone.stops.map((i) => prepared.stopIds[i]),
        meanCount: zone.meanCount,
        threshold,
        basis: surface.basis,
      };
      return { ...feature, properties };
    }),
  };
}
