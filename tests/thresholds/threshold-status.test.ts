import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import {
  actionThresholdWords,
  dispersionTest,
  garwoodInterval,
  meanConfidenceInterval,
  thresholdStatus,
  wilsonInterval,
} from '../../shared/thresholds/threshold-status.ts';

const meanRule = { actionThreshold: 2, thresholdBasis: 'mean' as const, thresholdSource: 'test source', countUnit: 'larvae per seedling' };
const incidenceRule = { actionThreshold: 0.5, thresholdBasis: 'incidence' as const, thresholdSource: 'test source' };

// Exact 95 % limits for a Poisson mean from an observed count x, as tabulated by Garwood (1936), Biometrika 28,
// Table 1 (the same figures R's poisson.test(x)$conf.int prints: 10 → 4.795389 18.390356).
const garwoodTable: Array<[number, number, number]> = [
  [0, 0, 3.689],
  [1, 0.0253, 5.572],
  [2, 0.2422, 7.225],
  [3, 0.6187, 8.767],
  [5, 1.6235, 11.668],
  [10, 4.7954, 18.39],
  [20, 12.217, 30.888],
];

// R's poisson.test(x)$conf.int for totals 0–50 and some larger ones, at 95 % and 90 %, frozen by
// tests/fixtures/analysis/reference-r/make-poisson-limits.R (the R version is in the file).
const rLimits: { source: string; rows: Array<{ total: number; level: number; low: number; high: number }> } = JSON.parse(
  readFileSync(new URL('../fixtures/analysis/reference-r/poisson-limits.expected.json', import.meta.url), 'utf8'),
);
const relativeGap = (a: number, b: number) => (b === 0 ? Math.abs(a) : Math.abs(a - b) / Math.abs(b));

describe("mean count interval against R's poisson.test", () => {
  it('has every total from 0 to 50 at both levels in the fixture', () => {
    for (const level of [0.95, 0.9]) {
      const totals = rLimits.rows.filter((r) => r.level === level).map((r) => r.total);
      expect(totals).toEqual(expect.arrayContaining(Array.from({ length: 51 }, (_, x) => x)));
    }
  });

  it.each(rLimits.rows.map((r) => [r.total, r.level, r]))('gives R’s limits for a total of %i at level %s', (_total, _level, row) => {
    const interval = garwoodInterval(row.total, row.level);
    expect(relativeGap(interval.low, row.low)).toBeLessThan(1e-6);
    expect(relativeGap(interval.high, row.high)).toBeLessThan(1e-6);
  });
});

describe('mean count interval', () => {
  it.each(garwoodTable)('gives Garwood’s exact Poisson limits for a total of %i', (x, low, high) => {
    const interval = garwoodInterval(x);
    expect(interval.low).toBeCloseTo(low, 3);
    expect(interval.high).toBeCloseTo(high, 2);
  });

  it('divides the exact limits of the total by the number of stops when counts are not overdispersed', () => {
    // Total 10 over 5 stops, no spread between stops: Garwood's limits for 10, divided by 5.
    const interval = meanConfidenceInterval([2, 2, 2, 2, 2])!;
    expect(interval.low).toBeCloseTo(4.7954 / 5, 4);
    expect(interval.high).toBeCloseTo(18.39 / 5, 3);
    expect(interval.method).toMatch(/Garwood \(1936\)/);
  });

  it('never goes below zero, even when most stops are empty', () => {
    // The Student t interval of these counts would run from −0.18: an impossible negative count.
    const interval = meanConfidenceInterval([0, 0, 0, 0, 0, 0, 0, 0, 1, 2])!;
    expect(interval.low).toBeGreaterThanOrEqual(0);
    expect(interval.low).toBeCloseTo(0.6187 / 10, 4);
    expect(interval.high).toBeCloseTo(8.767 / 10, 3);
  });

  it('widens by the dispersion when counts are overdispersed (quasi-Poisson scaling)', () => {
    // Mean 2, variance 4: index of dispersion φ = 2, D = 9·2 = 18 on 9 df, p ≈ 0.035 (χ² table: 16.92 at 0.05).
    // Scaled total 20/2 = 10 → Garwood (10) × φ / n = [4.7954, 18.390] × 0.2.
    const counts = [0, 0, 0, 0, 1, 3, 3, 4, 4, 5];
    expect(dispersionTest(counts)!.ratio).toBeCloseTo(2, 12);
    expect(dispersionTest(counts)!.pValue).toBeLessThan(0.05);
    const interval = meanConfidenceInterval(counts)!;
    expect(interval.low).toBeCloseTo(4.7954 * 0.2, 4);
    expect(interval.high).toBeCloseTo(18.39 * 0.2, 3);
    expect(interval.method).toMatch(/overdispersion/);
  });

  it('gives no interval from a single stop', () => {
    expect(meanConfidenceInterval([4])).toBeNull();
  });
});

describe('Wilson interval for the share of stops infested', () => {
  it('equals Wilson’s score formula worked by hand', () => {
    // Wilson (1927): (p + z²/2n ± z·√(p(1−p)/n + z²/4n²)) / (1 + z²/n), z = 1.959964 (standard normal 97.5 % point,
    // NIST/SEMATECH e-Handbook normal table gives 1.96).
    const x = 7;
    const n = 20;
    const z = 1.959963984540054;
    const p = x / n;
    const centre = p + (z * z) / (2 * n);
    const spread = z * Math.sqrt((p * (1 - p)) / n + (z * z) / (4 * n * n));
    const denominator = 1 + (z * z) / n;
    const interval = wilsonInterval(x, n)!;
    expect(interval.low).toBeCloseTo((centre - spread) / denominator, 10);
    expect(interval.high).toBeCloseTo((centre + spread) / denominator, 10);
  });

  it('stays inside 0–1 when no stop is infested', () => {
    const interval = wilsonInterval(0, 10)!;
    expect(interval.low).toBe(0);
    expect(interval.high).toBeGreaterThan(0);
    expect(interval.high).toBeLessThan(1);
  });
});

describe('threshold status', () => {
  it('says plainly when there are too few stops to call it', () => {
    const status = thresholdStatus([9, 8, 7, 9], meanRule);
    expect(status.status).toBe('too-few');
    expect(status.sentence).toMatch(/^Too few stops to call: 4 stops with a count; at least 5/);
  });

  it('says above when the whole interval lies over the threshold', () => {
    const status = thresholdStatus([4, 5, 6, 5, 4, 6, 5, 5], meanRule);
    expect(status.meanInterval!.low).toBeGreaterThan(2);
    expect(status.status).toBe('above');
    expect(status.sentence).toMatch(/^Above the action threshold/);
    expect(status.sentence).toContain('test source');
  });

  it('says below when the whole interval lies under the threshold, counting empty stops as zeros', () => {
    const status = thresholdStatus([0, 0, 1, 0, 0, 1, 0, 0, 0, 1], meanRule);
    expect(status.stops).toBe(10);
    expect(status.meanPerStop).toBeCloseTo(0.3, 12);
    expect(status.meanInterval!.high).toBeLessThan(2);
    expect(status.status).toBe('below');
  });

  it('says too close to call when the interval straddles the threshold', () => {
    const status = thresholdStatus([0, 4, 1, 3, 2, 0, 5, 1], meanRule);
    expect(status.meanInterval!.low).toBeLessThan(2);
    expect(status.meanInterval!.high).toBeGreaterThan(2);
    expect(status.status).toBe('too-close');
    expect(status.sentence).toMatch(/too close to call — scout again/i);
  });

  it('decides an incidence rule by the Wilson interval of the share infested', () => {
    const mostly = thresholdStatus([1, 2, 1, 3, 1, 1, 2, 1, 1, 1, 1, 2, 1, 1, 1, 1, 0, 1, 1, 1], incidenceRule);
    expect(mostly.shareInfested).toBeCloseTo(19 / 20, 12);
    expect(mostly.shareInterval!.low).toBeGreaterThan(0.5);
    expect(mostly.status).toBe('above');
    const half = thresholdStatus([1, 0, 1, 0, 1, 0, 1, 0, 1, 0], incidenceRule);
    expect(half.status).toBe('too-close');
  });

  it('counts a sighting without a count as infested but leaves it out of the mean', () => {
    const status = thresholdStatus([null, 0, 2, 4], meanRule);
    expect(status.stops).toBe(4);
    expect(status.countedStops).toBe(3);
    expect(status.infestedStops).toBe(3);
    expect(status.meanPerStop).toBeCloseTo(2, 12);
  });
});

describe('threshold sentence wording', () => {
  it('writes the threshold with its unit in grammatical English', () => {
    const status = thresholdStatus([0, 0, 0, 0, 0, 0, 0, 0, 1, 2], {
      actionThreshold: 1,
      thresholdBasis: 'mean',
      thresholdSource: 'test source',
      countUnit: 'larvae per seedling',
    });
    expect(status.sentence).toContain('below 1 larva per seedling');
    const two = thresholdStatus([0, 0, 0, 0, 0, 0, 0, 0, 1, 2], meanRule);
    expect(two.sentence).toContain('below 2 larvae per seedling');
  });
});

describe('actionThresholdWords', () => {
  it('writes a mean-count threshold with its unit, singular only for exactly 1 (CLDR English plural rule "one": i = 1 and v = 0)', () => {
    expect(actionThresholdWords({ actionThreshold: 250, thresholdBasis: 'mean' }, 'aphids per plant')).toBe('250 aphids per plant');
    expect(actionThresholdWords({ actionThreshold: 1, thresholdBasis: 'mean' }, 'beetles per plant')).toBe('1 beetle per plant');
    expect(actionThresholdWords({ actionThreshold: 0.5, thresholdBasis: 'mean' }, 'larvae per plant')).toBe('0.5 larvae per plant');
  });

  it('writes an incidence threshold as the share of stops infested, in per cent with a space before % (SI brochure, 9th ed., 2019, section 5.4.7 — the section number from memory)', () => {
    expect(actionThresholdWords({ actionThreshold: 0.5, thresholdBasis: 'incidence' }, 'lesions per leaf')).toBe('50 % of stops infested');
    expect(actionThresholdWords({ actionThreshold: 0.125, thresholdBasis: 'incidence' }, 'lesions per leaf')).toBe('12.5 % of stops infested');
  });
});
