import { describe, expect, it } from 'vitest';
import { benjaminiHochberg, distanceBandNeighbours, getisOrdGiStar, moransI } from '../../shared/analysis/autocorrelation.ts';

function lattice(k: number): Float64Array {
  const xy = new Float64Array(k * k * 2);
  for (let i = 0; i < k; i++)
    for (let j = 0; j < k; j++) {
      xy[(i * k + j) * 2] = i * 10;
      xy[(i * k + j) * 2 + 1] = j * 10;
    }
  return xy;
}

function permutations(values: number[]): number[][] {
  if (values.length <= 1) return [values];
  return values.flatMap((v, i) => permutations([...values.slice(0, i), ...values.slice(i + 1)]).map((rest) => [v, ...rest]));
}

describe("Moran's I", () => {
  // A 10 m band on a 10 m lattice is rook contiguity.
  const nb = distanceBandNeighbours(lattice(6), 10.000001);

  it('gives I = −1 on a checkerboard with rook neighbours (textbook case of perfect negative autocorrelation, Cliff & Ord 1981; from memory)', () => {
    const values = Array.from({ length: 36 }, (_, k) => (Math.floor(k / 6) + (k % 6)) % 2);
    expect(moransI(values, nb, 0).I).toBeCloseTo(-1, 12);
  });

  it('gives I = +1 in the limit of two solid halves: strongly positive (Moran 1950 definition)', () => {
    const values = Array.from({ length: 36 }, (_, k) => (Math.floor(k / 6) < 3 ? 1 : 0));
    const result = moransI(values, nb, 199, 5);
    expect(result.I).toBeGreaterThan(0.7);
    expect(result.pValue).toBeLessThan(0.01);
  });

  it('has expectation −1/(n−1) and the randomisation variance of Cliff & Ord (1981) over all permutations', () => {
    const xy = new Float64Array([0, 0, 10, 0, 20, 0, 0, 10, 10, 10, 20, 10]);
    const small = distanceBandNeighbours(xy, 10.000001);
    const values = [3, 0, 7, 1, 1, 12];
    const all = permutations(values).map((p) => moransI(p, small, 0).I);
    const exactMean = all.reduce((a, b) => a + b, 0) / all.length;
    const exactVariance = all.reduce((a, b) => a + (b - exactMean) ** 2, 0) / all.length;
    const result = moransI(values, small, 0);
    expect(result.expected).toBeCloseTo(-1 / 5, 15);
    expect(exactMean).toBeCloseTo(-1 / 5, 12);
    expect(result.variance).toBeCloseTo(exactVariance, 12);
  });
});

describe('Getis–Ord Gi* and the false-discovery-rate correction', () => {
  it('scores a lone heavy count as the hottest spot with the Gi* formula of Ord & Getis (1995)', () => {
    const xy = lattice(7);
    const nb = distanceBandNeighbours(xy, 10.000001);
    const values = Array.from({ length: 49 }, () => 1);
    values[24] = 30;
    const gi = getisOrdGiStar(values, nb);
    // Its four rook neighbours share the same neighbourhood sum, so they tie with it.
    for (let k = 0; k < 49; k++) expect(gi[k]).toBeLessThanOrEqual(gi[24] + 1e-12);
    expect(gi[0]).toBeLessThan(0);
    // Gi* formula by hand for the centre cell: w = 5, Σw·x = 30 + 4, x̄ = 78/49, S = √(Σx²/n − x̄²).
    const n = 49;
    const mean = 78 / n;
    const s = Math.sqrt((48 + 900) / n - mean * mean);
    const expected = (34 - mean * 5) / (s * Math.sqrt((n * 5 - 25) / (n - 1)));
    expect(gi[24]).toBeCloseTo(expected, 12);
  });

  it('adjusts p-values by the step-up rule of Benjamini & Hochberg (1995)', () => {
    // By hand: sorted p 0.01, 0.02, 0.03, 0.5 with m = 4 → 0.04, 0.04, 0.04, 0.5.
    const q = benjaminiHochberg([0.5, 0.03, 0.01, 0.02]);
    expect(Array.from(q)).toEqual([0.5, 0.04, 0.04, 0.04]);
  });
});
