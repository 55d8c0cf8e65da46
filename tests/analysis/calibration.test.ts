// Calibration under complete spatial randomness inside an irregular (concave) field.
import { describe, expect, it } from 'vitest';
import { fieldAreaM2, fieldPerimeterM } from '../../shared/analysis/area.ts';
import { simulateCsr } from '../../shared/analysis/csr.ts';
import { fieldToCoordinates } from '../../shared/analysis/field-geometry.ts';
import { runSimulations } from '../../shared/analysis/monte-carlo.ts';
import { nearestNeighbourTest } from '../../shared/analysis/nearest-neighbour.ts';
import { createRandom } from '../../shared/analysis/random.ts';
import { irregularField } from './patterns.ts';

describe('calibration over 500 CSR patterns', () => {
  const field = irregularField();
  const area = fieldAreaM2(field);
  const perimeter = fieldPerimeterM(field);
  const patterns = 500;
  const n = 60;
  const random = createRandom('calibration');
  let rejections = 0;
  let naiveR = 0;
  let donnellyR = 0;
  for (let k = 0; k < patterns; k++) {
    const xy = simulateCsr(field, n, random);
    // 99 simulations per pattern keeps the suite fast; the test's size does not depend on the count.
    const simulated = runSimulations(
      { fieldCoordinates: fieldToCoordinates(field), n, seed: `pattern-${k}`, simulations: 99, nearestNeighbour: true, ripley: null },
      field,
    );
    const result = nearestNeighbourTest(xy, area, perimeter, simulated.meanNearestDistances);
    if ((result.monteCarlo.pValue as number) < 0.05) rejections++;
    naiveR += result.R / patterns;
    donnellyR += result.donnelly.R / patterns;
  }

  it('rejects CSR at α = 0.05 between 3 % and 7 % of the time with the Monte Carlo test (Besag & Diggle 1977)', () => {
    const rate = rejections / patterns;
    expect(rate).toBeGreaterThanOrEqual(0.03);
    expect(rate).toBeLessThanOrEqual(0.07);
  });

  it("brings the mean R within 0.02 of 1 with Donnelly's edge correction (Donnelly 1978)", () => {
    expect(Math.abs(donnellyR - 1)).toBeLessThan(0.02);
  });

  it('shows the naive Clark–Evans R biased upwards in a bounded field (points near the edge lose neighbours beyond it)', () => {
    // Known edge effect (Donnelly 1978): without correction, R exceeds 1 under CSR in a finite window.
    expect(naiveR).toBeGreaterThan(1.03);
    expect(naiveR).toBeGreaterThan(donnellyR + 0.03);
  });
});
