import { describe, expect, it } from 'vitest';
import jstat from 'jstat';
import { mean, sampleStandardDeviation } from 'simple-statistics';
import { meanConfidenceInterval, thresholdStatus, wilsonInterval } from '../../shared/thresholds/threshold-status.ts';

const { jStat } = jstat as unknown as { jStat: { tci(mean: number, alpha: number, sd: number, n: number): [number, number] } };

const meanRule = { actionThreshold: 2, thresholdBasis: 'mean' as const, thresholdSource: 'test source', countUnit: 'larvae per seedling' };
const incidenceRule = { actionThreshold: 0.5, thresholdBasis: 'incidence' as const, thresholdSource: 'test source' };

describe('mean count interval', () => {
  it('matches jstat.tci (Student t confidence interval) on the same stops', () => {
    const counts = [0, 3, 1, 4, 0, 2, 5, 1, 0, 2, 3, 6];
    const interval = meanConfidenceInterval(counts)!;
    // Reference: jstat's own t confidence interval, with mean and sd from simple-statistics.
    const [low, high] = jStat.tci(mean(counts), 0.05, sampleStandardDeviation(counts), counts.length);
    expect(interval.low).toBeCloseTo(low, 10);
    expect(interval.high).toBeCloseTo(high, 10);
  });

  it('uses the t quantile of the handbook table for 9 degrees of freedom', () => {
    // NIST/SEMATECH e-Handbook, table of the t distribution: t(0.975, 9) = 2.262.
    const counts = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10];
    const interval = meanConfidenceInterval(counts)!;
    const half = (interval.high - interval.low) / 2;
    expect(half / (sampleStandardDeviation(counts) / Math.sqrt(10))).toBeCloseTo(2.262, 3);
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
