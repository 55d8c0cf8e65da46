import { chiSquaredDistributionTable, cumulativeStdNormalProbability, errorFunction } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { chiSquareCritical, chiSquareUpper, normalCritical, normalTwoSided } from '../../shared/analysis/distributions.ts';

describe('reference distributions', () => {
  it('matches the NIST/SEMATECH e-Handbook chi-square table (section 1.3.6.7.4) at the upper 5 % and 1 % points', () => {
    // NIST/SEMATECH e-Handbook of Statistical Methods, upper critical values of the chi-square distribution.
    const table: Array<[number, number, number]> = [
      [1, 0.05, 3.841],
      [10, 0.05, 18.307],
      [24, 0.05, 36.415],
      [24, 0.01, 42.98],
      [50, 0.05, 67.505],
    ];
    for (const [df, alpha, critical] of table) {
      expect(chiSquareCritical(alpha, df)).toBeCloseTo(critical, 2);
      expect(chiSquareUpper(critical, df)).toBeCloseTo(alpha, 4);
    }
  });

  it("agrees with simple-statistics' chi-square table on the upper tail", () => {
    const reference = chiSquaredDistributionTable as unknown as Record<number, Record<number, number>>;
    for (const df of [2, 5, 12, 30]) {
      for (const p of [0.1, 0.05, 0.01]) expect(chiSquareUpper(reference[df][p], df)).toBeCloseTo(p, 3);
    }
  });

  it('agrees with simple-statistics on standard normal tails (its table is printed to 4 decimals)', () => {
    for (const z of [0.5, 1.0, 1.96, 2.5, 3.2]) {
      expect(normalTwoSided(z)).toBeCloseTo(1 - errorFunction(z / Math.SQRT2), 6);
      expect(1 - normalTwoSided(z) / 2).toBeCloseTo(cumulativeStdNormalProbability(z), 3);
    }
    // |z| > 1.96 at α = 0.05 (standard normal table).
    expect(normalCritical(0.05)).toBeCloseTo(1.96, 2);
  });
});
