import { describe, expect, it } from 'vitest';
import { densitySurface, kernelValue } from '../../shared/analysis/density.ts';
import { createPlanarField } from '../../shared/analysis/field-geometry.ts';
import { createRandom } from '../../shared/analysis/random.ts';
import { simulateCsr } from '../../shared/analysis/csr.ts';
import { irregularField } from './patterns.ts';

describe('kernel density estimate', () => {
  it('uses the quartic kernel 3/(πh²)·(1 − d²/h²)² of Silverman (1986, Table 3.1 in two dimensions)', () => {
    const h = 40;
    expect(kernelValue('quartic', 0, h)).toBeCloseTo(3 / (Math.PI * h * h), 15);
    expect(kernelValue('quartic', (h / 2) ** 2, h)).toBeCloseTo((3 / (Math.PI * h * h)) * 0.75 ** 2, 15);
    expect(kernelValue('quartic', h * h, h)).toBe(0);
    // Gaussian: 1/(2πh²)·exp(−d²/2h²) (Silverman 1986).
    expect(kernelValue('gaussian', h * h, h)).toBeCloseTo(Math.exp(-0.5) / (2 * Math.PI * h * h), 15);
  });

  it('integrates to n over the field within 2 % for sightings a bandwidth inside the boundary, without correction', () => {
    const square = createPlanarField([
      [
        [
          [0, 0],
          [600, 0],
          [600, 600],
          [0, 600],
          [0, 0],
        ],
      ],
    ]);
    const inner = createPlanarField([
      [
        [
          [60, 60],
          [540, 60],
          [540, 540],
          [60, 540],
          [60, 60],
        ],
      ],
    ]);
    const xy = simulateCsr(inner, 150, createRandom('density'));
    for (const kernel of ['quartic', 'gaussian'] as const) {
      const bandwidthM = kernel === 'quartic' ? 50 : 14;
      const surface = densitySurface(square, xy, { kernel, bandwidthM, cellSizeM: 4, edgeCorrection: false });
      expect(Math.abs(surface.integratedSightings / 150 - 1)).toBeLessThan(0.02);
    }
  });

  it('integrates to n within 2 % with the edge correction when sightings sit near the boundary', () => {
    const field = irregularField();
    const xy = simulateCsr(field, 200, createRandom('edge'));
    const surface = densitySurface(field, xy, { bandwidthM: 60, cellSizeM: 5 });
    expect(Math.abs(surface.integratedSightings / 200 - 1)).toBeLessThan(0.02);
    const uncorrected = densitySurface(field, xy, { bandwidthM: 60, cellSizeM: 5, edgeCorrection: false });
    expect(uncorrected.integratedSightings).toBeLessThan(0.98 * 200);
  });

  it('reports sightings per hectare: one sighting at the centre of a quartic kernel gives 3/(πh²)·10,000', () => {
    const square = createPlanarField([
      [
        [
          [0, 0],
          [400, 0],
          [400, 400],
          [0, 400],
          [0, 0],
        ],
      ],
    ]);
    const h = 50;
    const surface = densitySurface(square, new Float64Array([202, 202]), { bandwidthM: h, cellSizeM: 4, edgeCorrection: false });
    expect(surface.maxPerHa).toBeCloseTo((3 / (Math.PI * h * h)) * 10_000, 6);
  });
});
