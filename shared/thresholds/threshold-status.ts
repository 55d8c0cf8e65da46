// Threshold status of one walk for one pest: the mean count per stop (empty stops included) against the
// pest's action threshold, with a confidence interval, so the adviser reads "above", "below" or
// "too close to call" rather than a bare number. Pure: the server and the client both run it.
import jstat from 'jstat';
import { mean, sampleStandardDeviation } from 'simple-statistics';

export type ThresholdBasis = 'mean' | 'incidence';
export type ThresholdVerdict = 'above' | 'below' | 'too-close';

export interface ThresholdRule {
  actionThreshold: number;
  thresholdBasis: ThresholdBasis;
  thresholdSource: string;
  /** The pest's count unit, e.g. "aphids per plant", used in the sentence. */
  countUnit?: string;
}

export interface Interval {
  low: number;
  high: number;
  level: number;
  method: string;
}

export interface ThresholdStatus {
  /** Every stop of the walk for this pest, empty stops (count 0) included. */
  stops: number;
  /** Stops with a number; a sighting without a count shows presence only and stays out of the mean. */
  countedStops: number;
  infestedStops: number;
  meanPerStop: number | null;
  standardDeviation: number | null;
  meanInterval: Interval | null;
  shareInfested: number | null;
  shareInterval: Interval | null;
  actionThreshold: number;
  thresholdBasis: ThresholdBasis;
  thresholdSource: string;
  status: ThresholdVerdict;
  sentence: string;
}

// jstat ships no types for its Student t distribution; this is the one call used here.
const studentT = (jstat.jStat as unknown as { studentt: { inv(p: number, dof: number): number } }).studentt;
const standardNormal = jstat.jStat.normal;

/** Two-sided Student t interval for a mean: x̄ ± t(1−α/2, n−1)·s/√n (Student 1908), quantile from jstat. */
export function meanConfidenceInterval(values: number[], level = 0.95): Interval | null {
  if (values.length < 2) return null;
  const m = mean(values);
  const s = sampleStandardDeviation(values);
  const half = studentT.inv(1 - (1 - level) / 2, values.length - 1) * (s / Math.sqrt(values.length));
  return { low: m - half, high: m + half, level, method: 'Student t interval (quantile from jstat studentt.inv)' };
}

/**
 * Wilson score interval for a proportion (Wilson 1927). Hand-written: neither simple-statistics nor jstat
 * offers it; the normal quantile comes from jstat.
 */
export function wilsonInterval(successes: number, trials: number, level = 0.95): Interval | null {
  if (trials < 1) return null;
  const z = standardNormal.inv(1 - (1 - level) / 2, 0, 1);
  const p = successes / trials;
  const z2n = (z * z) / trials;
  const centre = (p + z2n / 2) / (1 + z2n);
  const half = (z / (1 + z2n)) * Math.sqrt((p * (1 - p)) / trials + (z * z) / (4 * trials * trials));
  return { low: Math.max(0, centre - half), high: Math.min(1, centre + half), level, method: 'Wilson score interval (Wilson 1927)' };
}

/** Where an interval lies against a threshold; an interval touching or straddling it is too close to call. */
export function verdictAgainst(interval: { low: number; high: number } | null, threshold: number): ThresholdVerdict {
  if (!interval) return 'too-close';
  if (interval.low > threshold) return 'above';
  if (interval.high < threshold) return 'below';
  return 'too-close';
}

const figure = (value: number) => (Math.abs(value) >= 100 ? value.toFixed(0) : Math.abs(value) >= 10 ? value.toFixed(1) : value.toFixed(2));
const percent = (share: number) => `${(share * 100).toFixed(0)} %`;

function sentenceFor(s: Omit<ThresholdStatus, 'sentence'>, unit: string): string {
  const source = ` (threshold source: ${s.thresholdSource})`;
  if (s.stops === 0) return 'No stops recorded for this pest on this walk — scout again.';
  if (s.thresholdBasis === 'incidence') {
    const share = s.shareInfested ?? 0;
    const interval = s.shareInterval!;
    const figures = `${s.infestedStops} of ${s.stops} stops infested (${percent(share)}, 95 % interval ${percent(interval.low)}–${percent(interval.high)})`;
    if (s.status === 'above') return `Above the action threshold: ${figures}, above ${percent(s.actionThreshold)}${source}.`;
    if (s.status === 'below') return `Below the action threshold: ${figures}, below ${percent(s.actionThreshold)}${source}.`;
    return `Too close to call — scout again: ${figures} includes the action threshold of ${percent(s.actionThreshold)}${source}.`;
  }
  if (!s.meanInterval) {
    return `Too close to call — scout again: only ${s.countedStops} counted stop${s.countedStops === 1 ? '' : 's'}, too few for an interval around the mean (threshold ${figure(s.actionThreshold)} ${unit}${source}).`;
  }
  const figures = `mean ${figure(s.meanPerStop!)} ${unit} over ${s.countedStops} stops (95 % interval ${figure(s.meanInterval.low)}–${figure(s.meanInterval.high)})`;
  if (s.status === 'above') return `Above the action threshold: ${figures}, above ${figure(s.actionThreshold)}${source}.`;
  if (s.status === 'below') return `Below the action threshold: ${figures}, below ${figure(s.actionThreshold)}${source}.`;
  return `Too close to call — scout again: ${figures} includes the action threshold of ${figure(s.actionThreshold)}${source}.`;
}

/**
 * Status of one walk's stops for one pest. `counts` holds one entry per stop: 0 for an empty stop, a number
 * for a counted sighting, null for a sighting without a count (infested, but left out of the mean).
 * With the incidence basis the threshold is a share of stops infested (0–1) and the Wilson interval decides.
 */
export function thresholdStatus(counts: Array<number | null>, rule: ThresholdRule, level = 0.95): ThresholdStatus {
  const counted = counts.filter((c): c is number => c !== null);
  const infestedStops = counts.filter((c) => c === null || c > 0).length;
  const meanInterval = meanConfidenceInterval(counted, level);
  const shareInterval = wilsonInterval(infestedStops, counts.length, level);
  const status = rule.thresholdBasis === 'incidence' ? verdictAgainst(shareInterval, rule.actionThreshold) : verdictAgainst(meanInterval, rule.actionThreshold);
  const base = {
    stops: counts.length,
    countedStops: counted.length,
    infestedStops,
    meanPerStop: counted.length ? mean(counted) : null,
    standardDeviation: counted.length >= 2 ? sampleStandardDeviation(counted) : null,
    meanInterval,
    shareInfested: counts.length ? infestedStops / counts.length : null,
    shareInterval: rule.thresholdBasis === 'incidence' ? shareInterval : null,
    actionThreshold: rule.actionThreshold,
    thresholdBasis: rule.thresholdBasis,
    thresholdSource: rule.thresholdSource,
    status,
  };
  return { ...base, sentence: sentenceFor(base, rule.countUnit ?? 'per stop') };
}
