// Pattern generators for the engine tests (planar metres). Generated inputs only: expected values in the
// tests come from published formulas, tables or reference libraries, never from these generators.
import { createPlanarField, isInsideField, type PlanarField } from '../../shared/analysis/field-geometry.ts';
import { simulateCsr } from '../../shared/analysis/csr.ts';
import { createRandom, normalDeviate } from '../../shared/analysis/random.ts';

/** An irregular (concave) field of about 30 ha with a notch, in metres. */
export const IRREGULAR_FIELD_RING = [
  [0, 0],
  [700, 0],
  [760, 220],
  [600, 480],
  [380, 420],
  [300, 260],
  [180, 500],
  [0, 430],
  [0, 0],
];

export function irregularField(): PlanarField {
  return createPlanarField([[IRREGULAR_FIELD_RING]]);
}

export function squareLattice(k: number, spacing: number): Float64Array {
  const xy = new Float64Array(k * k * 2);
  for (let i = 0; i < k; i++)
    for (let j = 0; j < k; j++) {
      xy[(i * k + j) * 2] = (i + 0.5) * spacing;
      xy[(i * k + j) * 2 + 1] = (j + 0.5) * spacing;
    }
  return xy;
}

export function hexagonalLattice(cols: number, rows: number, spacing: number): Float64Array {
  const xy: number[] = [];
  const rowHeight = (spacing * Math.sqrt(3)) / 2;
  for (let r = 0; r < rows; r++) for (let c = 0; c < cols; c++) xy.push((c + (r % 2 ? 0.5 : 0)) * spacing, r * rowHeight);
  return new Float64Array(xy);
}

/** Thomas-like cluster process: parents uniform in the field, offspring Gaussian around them, kept inside. */
export function thomasPattern(field: PlanarField, parents: number, perParent: number, sigma: number, seed: number): Float64Array {
  const random = createRandom(seed);
  const centres = simulateCsr(field, parents, random);
  const xy: number[] = [];
  for (let p = 0; p < parents; p++) {
    let placed = 0;
    while (placed < perParent) {
      const x = centres[p * 2] + sigma * normalDeviate(random);
      const y = centres[p * 2 + 1] + sigma * normalDeviate(random);
      if (!isInsideField(field, x, y)) continue;
      xy.push(x, y);
      placed++;
    }
  }
  return new Float64Array(xy);
}

export function asFeatureCollection(xy: Float64Array, counts?: number[]) {
  const features = [];
  for (let i = 0; i < xy.length / 2; i++) {
    features.push({
      type: 'Feature' as const,
      properties: { id: `s${i + 1}`, count: counts ? counts[i] : null },
      geometry: { type: 'Point' as const, coordinates: [xy[i * 2], xy[i * 2 + 1]] },
    });
  }
  return { type: 'FeatureCollection' as const, features };
}
