import { describe, expect, it } from 'vitest';
import { fieldAreaM2 } from '../../shared/analysis/area.ts';
import { simulateCsr } from '../../shared/analysis/csr.ts';
import { circleShareInside } from '../../shared/analysis/edge-correction.ts';
import { createPlanarField, fieldToCoordinates } from '../../shared/analysis/field-geometry.ts';
import { runSimulations } from '../../shared/analysis/monte-carlo.ts';
import { createRandom } from '../../shared/analysis/random.ts';
import { defaultRipleyRadii, ripleyK, ripleyResult } from '../../shared/analysis/ripley.ts';
import { irregularField, thomasPattern } from './patterns.ts';

function check(xy: Float64Array, seed: string) {
  const field = irregularField();
  const area = fieldAreaM2(field);
  const radii = defaultRipleyRadii(field);
  const K = ripleyK(field, xy, radii, area, 'isotropic');
  const sims = runSimulations(
    {
      fieldCoordinates: fieldToCoordinates(field),
      n: xy.length / 2,
      seed,
      simulations: 99,
      nearestNeighbour: false,
      ripley: { radiiM: radii, correction: 'isotropic', areaM2: area },
    },
    field,
  );
  return ripleyResult(radii, K, 'isotropic', sims.ripleyL, 99);
}

describe("Ripley's K and L", () => {
  it('gives the share of a circle inside a half-plane as 1 − arccos(h/r)/π (plane geometry)', () => {
    const square = createPlanarField([
      [
        [
          [0, 0],
          [1000, 0],
          [1000, 1000],
          [0, 1000],
          [0, 0],
        ],
      ],
    ]);
    for (const [h, r] of [
      [10, 20],
      [30, 31],
      [5, 100],
    ]) {
      expect(circleShareInside(square, 500, h, r)).toBeCloseTo(1 - Math.acos(h / r) / Math.PI, 10);
    }
    // At a right-angle corner with the circle reaching past both sides only the quarter inside remains.
    expect(circleShareInside(square, 0.001, 0.001, 50)).toBeCloseTo(0.25, 4);
  });

  it('keeps L(r) ≈ r and inside the envelope under CSR (Besag 1977: L(r) = r for a Poisson process)', () => {
    const field = irregularField();
    const xy = simulateCsr(field, 200, createRandom('csr-ripley'));
    const result = check(xy, 'csr-envelope');
    const outside = result.aboveEnvelopeM.length + result.belowEnvelopeM.length;
    expect(outside).toBeLessThanOrEqual(2);
    result.radiiM.forEach((r, k) => expect(Math.abs(result.L[k] - r)).toBeLessThan(0.15 * r + 2));
  });

  it('puts a clustered (Thomas-like) pattern above the envelope at short distances', () => {
    const field = irregularField();
    const xy = thomasPattern(field, 8, 25, 12, 21);
    const result = check(xy, 'thomas-envelope');
    expect(result.aboveEnvelopeM.length).toBeGreaterThan(5);
    expect(result.aboveEnvelopeM[0]).toBe(result.radiiM[0]);
  });

  it('agrees between isotropic and border corrections on average under CSR (both unbiased for πr²)', () => {
    const field = irregularField();
    const area = fieldAreaM2(field);
    const radii = [10, 25, 50];
    const mean = { isotropic: [0, 0, 0], border: [0, 0, 0] };
    const random = createRandom('corrections');
    for (let k = 0; k < 60; k++) {
      const xy = simulateCsr(field, 150, random);
      for (const correction of ['isotropic', 'border'] as const) {
        const K = ripleyK(field, xy, radii, area, correction);
        radii.forEach((_, i) => (mean[correction][i] += K[i] / 60));
      }
    }
    radii.forEach((r, i) => {
      expect(mean.isotropic[i] / (Math.PI * r * r)).toBeCloseTo(1, 1);
      expect(mean.border[i] / (Math.PI * r * r)).toBeCloseTo(1, 1);
    });
  });
});
