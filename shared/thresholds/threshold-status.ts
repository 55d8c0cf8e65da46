// Threshold status of one walk for one pest: the mean count per stop (empty stops included) against the
// pest's action threshold, with a confidence interval, so the adviser reads "above", "below" or
// "too close to call" rather than a bare number, and "too few stops to call" below MIN_STOPS_TO_CALL. Pure: the server and the client both run it.
import jstat from 'jstat';
import { mean, sampleStandardDeviation, sampleVariance } from 'simple-statistics';
import { countWithUnit } from '../units/count-unit.ts';

export type ThresholdBasis = 'mean' | 'incidence';
export type ThresholdVerdict = 'above' | 'below' | 'too-close' | 'too-few';

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

const chiSquare = jstat.jStat.chisquare;
const standardNormal = jstat.jStat.normal;

/** Fewer counted stops than this and no verdict is given: a walk of about 5 areas is the usual minimum. */
export const MIN_STOPS_TO_CALL = 5;

/** The action threshold as a person reads it: "250 aphids per plant", "1 beetle per plant" or "50 % of stops infested". */
export function actionThresholdWords(rule: Pick<ThresholdRule, 'actionThreshold' | 'thresholdBasis'>, countUnit: string): string {
  if (rule.thresholdBasis === 'incidence') return `${(rule.actionThreshold * 100).toLocaleString('en-GB', { maximumFractionDigits: 1 })} % of stops infested`;
  return countWithUnit(rule.actionThreshold, countUnit, (v) => v.toLocaleString('en-GB', { maximumFractionDigits: 4 }));
}

/**
 * Exact interval for a Poisson mean from an observed total x (Garwood 1936, Biometrika 28:437–442):
 * low = χ²(α/2; 2x)/2, high = χ²(1−α/2; 2x+2)/2, quantiles from jstat. Never below zero.
 */
export function garwoodInterval(total: number, level = 0.95): { low: number; high: number } {
  const alpha = 1 - level;
  return { low: total > 0 ? chiSquare.inv(alpha / 2, 2 * total) / 2 : 0, high: chiSquare.inv(1 - alpha / 2, 2 * total + 2) / 2 };
}

/**
 * Index of dispersion test (Fisher 1950; Cochran 1954): D = (n−1)s²/x̄ against χ² with n−1 df; the upper-tail p
 * says whether the counts vary more between stops than a Poisson count would.
 */
export function dispersionTest(values: number[]): { ratio: number; pValue: number } | null {
  if (values.length < 2) return null;
  const m = mean(values);
  if (m === 0) return { ratio: 0, pValue: 1 };
  const ratio = sampleVariance(values) / m;
  return { ratio, pValue: 1 - chiSquare.cdf((values.length - 1) * ratio, values.length - 1) };
}

/**
 * Interval for the mean count per stop. Counts are never negative, so the interval is Garwood's exact Poisson
 * interval of the total, divided by the number of stops. When the index of dispersion shows the counts
 * overdispersed (p < 0.05, as aggregated pests usually are), the total is scaled by the dispersion φ = s²/x̄
 * before and after (quasi-Poisson, McCullagh & Nelder 1989, §4.5), which widens the interval as a negative
 * binomial spread would.
 */
export function meanConfidenceInterval(values: number[], level = 0.95): Interval | null {
  if (values.length < 2) return null;
  const n = values.length;
  const total = values.reduce((a, b) => a + b, 0);
  const dispersion = dispersionTest(values)!;
  if (dispersion.pValue < 0.05 && dispersion.ratio > 1) {
    const phi = dispersion.ratio;
    const scaled = garwoodInterval(total / phi, level);
    return {
      low: (scaled.low * phi) / n,
      high: (scaled.high * phi) / n,
      level,
      method: `Garwood (1936) exact Poisson interval, scaled for overdispersion φ = ${phi.toFixed(2)} (McCullagh & Nelder 1989)`,
    };
  }
  const exact = garwoodInterval(total, level);
  return { low: exact.low / n, high: exact.high / n, level, method: 'Garwood (1936) exact Poisson interval' };
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
const thresholdWritten = (value: number) => value.toLocaleString('en-GB', { maximumFractionDigits: 4 });
const stopsWord = (n: number) => `${n} stop${n === 1 ? '' : 's'}`;

function sentenceFor(s: Omit<ThresholdStatus, 'sentence'>, unit: string): string {
  const source = ` (threshold source: ${s.thresholdSource})`;
  if (s.stops === 0) return 'No stops recorded for this pest on this walk — scout again.';
  if (s.status === 'too-few') {
    const have = s.thresholdBasis === 'incidence' ? stopsWord(s.stops) : `${stopsWord(s.countedStops)} with a count`;
    return `Too few stops to call: ${have}; at least ${MIN_STOPS_TO_CALL} are needed before this walk can be compared with the threshold — scout again.`;
  }
  if (s.thresholdBasis === 'incidence') {
    const share = s.shareInfested ?? 0;
    const interval = s.shareInterval!;
    const figures = `${s.infestedStops} of ${s.stops} stops infested (${percent(share)}, 95 % interval ${percent(interval.low)}–${percent(interval.high)})`;
    if (s.status === 'above') return `Above the action threshold: ${figures}, above ${percent(s.actionThreshold)}${source}.`;
    if (s.status === 'below') return `Below the action threshold: ${figures}, below ${percent(s.actionThreshold)}${source}.`;
    return `Too close to call — scout again: ${figures} includes the action threshold of ${percent(s.actionThreshold)}${source}.`;
  }
  const interval = s.meanInterval!;
  const figures = `mean ${figure(s.meanPerStop!)} ${unit} over ${stopsWord(s.countedStops)} (95 % interval ${figure(interval.low)}–${figure(interval.high)}, ${interval.method})`;
  if (s.status === 'above') return `Above the action threshold: ${figures}, above ${countWithUnit(s.actionThreshold, unit, thresholdWritten)}${source}.`;
  if (s.status === 'below') return `Below the action threshold: ${figures}, below ${countWithUnit(s.actionThreshold, unit, thresholdWritten)}${source}.`;
  return `Too close to call — scout again: ${figures} includes the action threshold of ${countWithUnit(s.actionThreshold, unit, thresholdWritten)}${source}.`;
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
  const enough = rule.thresholdBasis === 'incidence' ? counts.length >= MIN_STOPS_TO_CALL : counted.length >= MIN_STOPS_TO_CALL;
  const status: ThresholdVerdict = !enough
    ? 'too-few'
    : rule.thresholdBasis === 'incidence'
      ? verdictAgainst(shareInterval, rule.actionThreshold)
      : verdictAgainst(meanInterval, rule.actionThreshold);
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
