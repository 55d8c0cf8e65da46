// Treatment zones from abundance among the stops, in the pest's own unit, never past the scouted area.
import { createPlanarField, isInsideField } from './field-geometry.ts';
import { relabelWithinWalks } from './labelling.ts';
import { createRandom, deriveSeed, type Seed } from './random.ts';
import { forEachPairWithin } from './ripley.ts';
import type { ScoutedArea } from './scouted.ts';
import { discsAround, grow, intersection, polygonsArea, type Polygons } from './vector-buffer.ts';

export type ZoneBasis = 'mean-count' | 'relative-risk';

export interface StopSurface {
  basis: ZoneBasis;
  bandwidthM: number;
  /** Why the kernel reaches as far as it does, in words ("three stop spacings of 12.3 m"). */
  bandwidthRule: string;
  /** Kernel-weighted mean count per stop (zeros included), or the found share of the stops nearby. */
  value: Float64Array;
  /** Relative risk only: share of relabellings at least as high (pointwise tolerance). */
  tolerance: Float64Array | null;
  /** Stops at or above the threshold (mean count) or beyond the tolerance contour (relative risk). */
  high: Uint8Array;
}

const quartic = (d2: number, h2: number) => (d2 < h2 ? (1 - d2 / h2) ** 2 : 0);

/** Kernel neighbour lists (self included) within the quartic radius. */
function kernelNeighbours(xy: Float64Array, h: number) {
  const m = xy.length / 2;
  const lists: number[][] = Array.from({ length: m }, (_, i) => [i]);
  const weights: number[][] = Array.from({ length: m }, () => [1]);
  forEachPairWithin(xy, h, (i, j, d) => {
    const w = quartic(d * d, h * h);
    if (w <= 0) return;
    lists[i].push(j);
    weights[i].push(w);
    lists[j].push(i);
    weights[j].push(w);
  });
  return { lists: lists.map((l) => Int32Array.from(l)), weights: weights.map((w) => Float64Array.from(w)) };
}

function smooth(values: ArrayLike<number>, nb: ReturnType<typeof kernelNeighbours>, out: Float64Array): Float64Array {
  for (let i = 0; i < out.length; i++) {
    let sum = 0;
    let total = 0;
    const list = nb.lists[i];
    const w = nb.weights[i];
    for (let p = 0; p < list.length; p++) {
      sum += w[p] * values[list[p]];
      total += w[p];
    }
    out[i] = sum / total;
  }
  return out;
}

/** Default quartic radius: three stop spacings, so about three stops each way along a walk share each estimate (our rule). */
export const BANDWIDTH_STOP_SPACINGS = 3;

/**
 * Per-stop surface: with an action threshold, the Nadaraya–Watson kernel-weighted mean count per stop (zeros
 * included) against it; without one, the relative risk found ÷ all stops (Kelsall & Diggle 1995) with pointwise
 * tolerance from relabellings stratified by walk, high where fewer than α of the relabellings reach it.
 */
export function stopSurface(
  xy: Float64Array,
  counts: ArrayLike<number>,
  found: Uint8Array,
  walkMembers: Int32Array[],
  spacingM: number,
  options: { threshold: number | null; bandwidthM?: number; simulations: number; seed: Seed; alpha: number },
): StopSurface {
  const m = found.length;
  const bandwidthM = options.bandwidthM ?? Math.max(BANDWIDTH_STOP_SPACINGS * spacingM, 1);
  const bandwidthRule = options.bandwidthM ? 'the bandwidth set for this check' : `three stop spacings of ${spacingM.toFixed(1)} m`;
  const nb = kernelNeighbours(xy, bandwidthM);
  const value = new Float64Array(m);
  const high = new Uint8Array(m);
  if (options.threshold !== null) {
    smooth(counts, nb, value);
    for (let i = 0; i < m; i++) high[i] = value[i] >= options.threshold ? 1 : 0;
    return { basis: 'mean-count', bandwidthM, bandwidthRule, value, tolerance: null, high };
  }
  smooth(found, nb, value);
  const atLeast = new Float64Array(m);
  const labels = new Uint8Array(m);
  const simulated = new Float64Array(m);
  for (let t = 0; t < options.simulations; t++) {
    relabelWithinWalks(found, walkMembers, createRandom(deriveSeed(options.seed, t)), labels);
    smooth(labels, nb, simulated);
    for (let i = 0; i < m; i++) if (simulated[i] >= value[i] - 1e-12) atLeast[i]++;
  }
  const tolerance = atLeast.map((k) => (1 + k) / (options.simulations + 1));
  for (let i = 0; i < m; i++) high[i] = found[i] && tolerance[i] <= options.alpha ? 1 : 0;
  return { basis: 'relative-risk', bandwidthM, bandwidthRule, value, tolerance, high };
}

export interface AbundanceZone {
  rings: number[][][];
  areaM2: number;
  stops: number[];
  meanCount: number;
}

/**
 * Zones: the scouted discs of the high stops grown by the margin (a round vector buffer), clipped to the
 * scouted area (so never past it) and the field; each zone lists the stops inside it and their mean count.
 */
export function abundanceZones(
  xy: Float64Array,
  counts: ArrayLike<number>,
  surface: StopSurface,
  scouted: ScoutedArea,
  options: { marginM: number; minZoneAreaM2: number },
): AbundanceZone[] {
  const highXY: number[] = [];
  for (let i = 0; i < surface.high.length; i++) if (surface.high[i]) highXY.push(xy[i * 2], xy[i * 2 + 1]);
  if (highXY.length === 0) return [];
  const core = discsAround(new Float64Array(highXY), scouted.radiusM);
  const shaped: Polygons = intersection(grow(core, options.marginM), scouted.scouted);
  const zones: AbundanceZone[] = [];
  for (const rings of shaped) {
    const areaM2 = polygonsArea([rings]);
    if (areaM2 < options.minZoneAreaM2) continue;
    const shape = createPlanarField([rings]);
    const stops: number[] = [];
    let total = 0;
    for (let i = 0; i < xy.length / 2; i++) {
      if (!isInsideField(shape, xy[i * 2], xy[i * 2 + 1])) continue;
      stops.push(i);
      total += counts[i];
    }
    // A part where no stop found the pest is smoothing or margin reaching past the patch (its kernel mean comes from
    // neighbours across an unscouted gap): a sprayer sent there would treat where the scout found nothing.
    if (total <= 0) continue;
    zones.push({ rings, areaM2, stops, meanCount: total / stops.length });
  }
  return zones.sort((a, b) => b.areaM2 - a.areaM2);
}
