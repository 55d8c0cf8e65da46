// Kernel density estimate of sightings per hectare on a grid clipped to the field.
import { AnalysisInputError } from './errors.ts';
import { distanceToBoundary, isInsideField, type PlanarField } from './field-geometry.ts';

export type Kernel = 'quartic' | 'gaussian';

export interface DensityOptions {
  kernel?: Kernel;
  bandwidthM?: number;
  cellSizeM?: number;
  /** Divide each sighting's kernel by its mass inside the field (Diggle 1985), so none leaks outside. */
  edgeCorrection?: boolean;
}

/** How the bandwidth was chosen: given with the check, Silverman's rule, or that rule capped by the field's size. */
export type BandwidthRule = 'given' | 'normal-reference' | 'field-cap';

export interface DensityResult {
  kernel: Kernel;
  bandwidthM: number;
  /** How the bandwidth was chosen, in words (kept as stored results and exports have always carried it). */
  bandwidthRule: string;
  /** What the bandwidth means on the ground, as a phrase (kept beside the sentence for the same reason). */
  bandwidthMeaning: string;
  /** How the bandwidth was chosen, as a code. */
  bandwidthChoice: BandwidthRule;
  /** The bandwidth in one plain sentence: how far each sighting counts, and the rule that chose that distance. */
  bandwidthSentence: string;
  cellSizeM: number;
  /** South-west corner of cell (0, 0), in the result's planar coordinates. */
  originX: number;
  originY: number;
  cols: number;
  rows: number;
  /** Row-major from the south; null where the cell centre lies outside the field. */
  perHa: (number | null)[];
  maxPerHa: number;
  /** Σ density × cell area: the number of sightings the surface accounts for. */
  integratedSightings: number;
  edgeCorrected: boolean;
}

const M2_PER_HA = 10_000;
const GAUSSIAN_REACH = 4;
/** Upper bound on the density grid, to keep a result within memory and a sensible JSON size. */
export const MAX_DENSITY_CELLS = 4_000_000;

/**
 * Default bandwidth: Silverman's normal-reference rule for two dimensions, σ·n^(−1/6) with σ the mean
 * of the coordinates' robust spreads (Silverman 1986, eq. 4.14); for the quartic kernel the radius with
 * the same variance, √8 times that. Capped at a quarter of the field's shorter side.
 */
export function defaultBandwidthM(field: PlanarField, xy: Float64Array, kernel: Kernel): number {
  return defaultBandwidth(field, xy, kernel).bandwidthM;
}

/** The default bandwidth and whether the field's size capped it. */
export function defaultBandwidth(field: PlanarField, xy: Float64Array, kernel: Kernel): { bandwidthM: number; rule: 'normal-reference' | 'field-cap' } {
  const n = xy.length / 2;
  const spreadOf = (axis: number): number => {
    const values = new Float64Array(n);
    for (let i = 0; i < n; i++) values[i] = xy[i * 2 + axis];
    return robustSpread(values);
  };
  const sigma = (spreadOf(0) + spreadOf(1)) / 2;
  const gaussian = sigma * n ** (-1 / 6);
  const h = kernel === 'quartic' ? Math.sqrt(8) * gaussian : gaussian;
  const cap = Math.min(field.maxX - field.minX, field.maxY - field.minY) / 4;
  // One sighting (or all at one spot) has no spread: fall back to the cap.
  return h > 0 && h <= cap ? { bandwidthM: h, rule: 'normal-reference' } : { bandwidthM: cap, rule: 'field-cap' };
}

/** min(standard deviation, interquartile range / 1.349): Silverman's (1986, eq. 3.30) guard against long tails. */
function robustSpread(values: Float64Array): number {
  const n = values.length;
  let mean = 0;
  for (let i = 0; i < n; i++) mean += values[i];
  mean /= n;
  let ss = 0;
  for (let i = 0; i < n; i++) ss += (values[i] - mean) ** 2;
  const sd = Math.sqrt(ss / Math.max(n - 1, 1));
  const sorted = values.slice().sort();
  const quantile = (q: number) => {
    const position = (n - 1) * q;
    const low = Math.floor(position);
    const high = Math.min(n - 1, low + 1);
    return sorted[low] + (sorted[high] - sorted[low]) * (position - low);
  };
  const iqr = (quantile(0.75) - quantile(0.25)) / 1.349;
  return iqr > 0 ? Math.min(sd, iqr) : sd;
}

/** Default grid: about 20,000 cells over the field's bounding box, and at least four cells per bandwidth. */
export function defaultDensityCellSizeM(field: PlanarField, bandwidthM: number): number {
  const boxArea = (field.maxX - field.minX) * (field.maxY - field.minY);
  return Math.max(Math.min(Math.max(Math.sqrt(boxArea / 20_000), 0.5), bandwidthM / 4), Math.sqrt(boxArea / MAX_DENSITY_CELLS));
}

/** Quartic (biweight) kernel 3/(πh²)·(1 − d²/h²)² for d < h, or Gaussian 1/(2πh²)·exp(−d²/2h²) (Silverman 1986). */
export function kernelValue(kernel: Kernel, d2: number, h: number): number {
  const h2 = h * h;
  if (kernel === 'quartic') {
    if (d2 >= h2) return 0;
    const u = 1 - d2 / h2;
    return (3 / (Math.PI * h2)) * u * u;
  }
  return Math.exp(-d2 / (2 * h2)) / (2 * Math.PI * h2);
}

/** Kernel density estimate (Rosenblatt 1956; Silverman 1986) of sightings per hectare over the field. */
export function densitySurface(field: PlanarField, xy: Float64Array, options: DensityOptions = {}): DensityResult {
  const kernel = options.kernel ?? 'quartic';
  const chosen = options.bandwidthM !== undefined ? { bandwidthM: options.bandwidthM, rule: 'given' as const } : defaultBandwidth(field, xy, kernel);
  const h = chosen.bandwidthM;
  const cell = options.cellSizeM ?? defaultDensityCellSizeM(field, h);
  const edgeCorrection = options.edgeCorrection ?? true;
  const originX = field.minX;
  const originY = field.minY;
  const cols = Math.max(1, Math.ceil((field.maxX - field.minX) / cell));
  const rows = Math.max(1, Math.ceil((field.maxY - field.minY) / cell));
  if (cols * rows > MAX_DENSITY_CELLS) {
    const smallest = Math.sqrt(((field.maxX - field.minX) * (field.maxY - field.minY)) / MAX_DENSITY_CELLS);
    throw new AnalysisInputError(`A density cell of ${cell} m gives ${cols * rows} cells; use at least ${Math.ceil(smallest * 100) / 100} m.`);
  }
  const inside = new Uint8Array(cols * rows);
  for (let row = 0; row < rows; row++) {
    const y = originY + (row + 0.5) * cell;
    for (let col = 0; col < cols; col++) inside[row * cols + col] = isInsideField(field, originX + (col + 0.5) * cell, y) ? 1 : 0;
  }
  const density = new Float64Array(cols * rows);
  const reach = kernel === 'quartic' ? h : GAUSSIAN_REACH * h;
  const reach2 = reach * reach;
  const cellArea = cell * cell;
  const n = xy.length / 2;
  const h2 = h * h;
  const quarticScale = 3 / (Math.PI * h2);
  const gaussianScale = 1 / (2 * Math.PI * h2);

  // One pass adds each sighting's kernel (scaled by `weight`) into the grid; the other only measures it.
  const spread = (i: number, weight: number, add: boolean): number => {
    const px = xy[i * 2];
    const py = xy[i * 2 + 1];
    const colFrom = Math.max(0, Math.floor((px - reach - originX) / cell));
    const colTo = Math.min(cols - 1, Math.floor((px + reach - originX) / cell));
    const rowFrom = Math.max(0, Math.floor((py - reach - originY) / cell));
    const rowTo = Math.min(rows - 1, Math.floor((py + reach - originY) / cell));
    let mass = 0;
    for (let row = rowFrom; row <= rowTo; row++) {
      const dy = originY + (row + 0.5) * cell - py;
      const dy2 = dy * dy;
      if (dy2 >= reach2) continue;
      const base = row * cols;
      for (let col = colFrom; col <= colTo; col++) {
        const c = base + col;
        if (!inside[c]) continue;
        const dx = originX + (col + 0.5) * cell - px;
        const d2 = dx * dx + dy2;
        if (d2 >= reach2) continue;
        let k: number;
        if (kernel === 'quartic') {
          const u = 1 - d2 / h2;
          k = quarticScale * u * u;
        } else {
          k = gaussianScale * Math.exp(-d2 / (2 * h2));
        }
        if (add) density[c] += weight * k;
        else mass += k;
      }
    }
    return mass * cellArea;
  };
  for (let i = 0; i < n; i++) {
    let weight = 1;
    // A kernel wholly inside the field keeps its full unit mass; only sightings near the edge need measuring.
    if (edgeCorrection && distanceToBoundary(field, xy[i * 2], xy[i * 2 + 1]) < reach) {
      const mass = spread(i, 0, false);
      weight = mass > 0 ? 1 / mass : 0;
    }
    spread(i, weight, true);
  }

  const perHa: (number | null)[] = new Array(cols * rows);
  let maxPerHa = 0;
  let integrated = 0;
  for (let c = 0; c < cols * rows; c++) {
    if (!inside[c]) {
      perHa[c] = null;
      continue;
    }
    const value = density[c] * M2_PER_HA;
    perHa[c] = value;
    integrated += density[c] * cellArea;
    if (value > maxPerHa) maxPerHa = value;
  }
  return {
    kernel,
    bandwidthM: h,
    bandwidthRule: ruleWords[chosen.rule](kernel),
    bandwidthMeaning:
      kernel === 'quartic'
        ? `search radius: each sighting counts within ${metresText(h)} and not at all beyond it`
        : `standard deviation: each sighting's weight halves at about ${metresText(h * Math.sqrt(2 * Math.LN2))} and fades out by ${metresText(3 * h)}`,
    bandwidthChoice: chosen.rule,
    bandwidthSentence: bandwidthSentence(kernel, h, chosen.rule),
    cellSizeM: cell,
    originX,
    originY,
    cols,
    rows,
    perHa,
    maxPerHa,
    integratedSightings: integrated,
    edgeCorrected: edgeCorrection,
  };
}

const ruleWords: Record<BandwidthRule, (kernel: Kernel) => string> = {
  given: () => 'the bandwidth set for this check',
  'normal-reference': (kernel) =>
    kernel === 'quartic'
      ? "Silverman's normal-reference rule on the sightings' spread, times √8 for the quartic kernel"
      : "Silverman's normal-reference rule on the sightings' spread",
  'field-cap': () => "a quarter of the field's shorter side, the widest allowed: Silverman's normal-reference rule asked for more",
};

/** The quartic bandwidth is its radius; a Gaussian kernel's weight halves at h·√(2 ln 2) and is near nothing by 3h. */
function bandwidthSentence(kernel: Kernel, h: number, rule: BandwidthRule): string {
  const reach =
    kernel === 'quartic'
      ? `Each sighting counts within ${metresText(h)} of it, less with distance, and not at all beyond`
      : `Each sighting's weight halves at about ${metresText(h * Math.sqrt(2 * Math.LN2))} from it and fades out by ${metresText(3 * h)}`;
  return `${reach} (${ruleWords[rule](kernel)}).`;
}

/** Whole metres from 10 m, tenths below, as a person reads a distance on the ground. */
function metresText(value: number): string {
  return `${value >= 10 ? Math.round(value) : Math.round(value * 10) / 10} m`;
}
