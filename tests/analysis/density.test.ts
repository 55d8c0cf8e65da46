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

  describe('the bandwidth in one sentence', () => {
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
    /** One sentence: a capital first, one full stop at the very end and none before it. */
    const oneSentence = /^[A-Z][^.]*(\d\.\d[^.]*)*\.$/;

    it('gives the quartic bandwidth as the distance each sighting counts within (the kernel is 0 beyond h: Silverman 1986, Table 3.1)', () => {
      const surface = densitySurface(square, new Float64Array([100, 100, 300, 300]), { bandwidthM: 50, cellSizeM: 10 });
      expect(surface.bandwidthChoice).toBe('given');
      expect(surface.bandwidthSentence).toMatch(oneSentence);
      expect(surface.bandwidthSentence).toMatch(/^Each sighting counts within 50 m of it, .*not at all beyond \(the bandwidth set for this check\)\.$/);
    });

    it('gives a Gaussian bandwidth h as the half-weight distance h·√(2 ln 2) and 3h (the normal density: exp(−r²/2h²) = ½ at r = 1.1774h)', () => {
      const surface = densitySurface(square, new Float64Array([100, 100, 300, 300]), { kernel: 'gaussian', bandwidthM: 14, cellSizeM: 10 });
      // 14 × 1.1774 = 16.48 m, written as whole metres; 3 × 14 = 42 m.
      expect(surface.bandwidthSentence).toMatch(oneSentence);
      expect(surface.bandwidthSentence).toMatch(/^Each sighting's weight halves at about 16 m from it and fades out by 42 m \(/);
    });

    it("names Silverman's normal-reference rule when it chose the bandwidth, and the field's cap when that rule asked for more", () => {
      // 200 sightings in an 80 m patch: σ ≈ 23 m, so the quartic radius √8·σ·200^(−1/6) ≈ 27 m stays under the cap.
      const random = createRandom('bandwidth-rule');
      const xy = Float64Array.from({ length: 400 }, () => 160 + 80 * random());
      const chosen = densitySurface(square, xy, { cellSizeM: 10 });
      expect(chosen.bandwidthChoice).toBe('normal-reference');
      expect(chosen.bandwidthSentence).toMatch(oneSentence);
      expect(chosen.bandwidthSentence).toContain("Silverman's normal-reference rule");
      // Two sightings at opposite corners: the rule asks for more than a quarter of the 400 m side, the cap of 100 m.
      const capped = densitySurface(square, new Float64Array([20, 20, 380, 380]), { cellSizeM: 10 });
      expect(capped.bandwidthChoice).toBe('field-cap');
      expect(capped.bandwidthM).toBe(100);
      expect(capped.bandwidthSentence).toMatch(/^Each sighting counts within 100 m of it, .*\(a quarter of the field's shorter side/);
    });
  });
});
