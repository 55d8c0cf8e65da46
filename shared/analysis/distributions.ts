// Tail probabilities of the reference distributions, through jstat.
import jstat from 'jstat';

const { jStat } = jstat;

/** Two-sided p-value of a standard normal z. */
export function normalTwoSided(z: number): number {
  if (!Number.isFinite(z)) return Number.isNaN(z) ? NaN : 0;
  return Math.min(1, 2 * jStat.normal.cdf(-Math.abs(z), 0, 1));
}

/** Upper-tail p-value P(X ≥ x) of a chi-square variable with df degrees of freedom. */
export function chiSquareUpper(x: number, df: number): number {
  if (df <= 0 || !Number.isFinite(x)) return NaN;
  return Math.max(0, 1 - jStat.chisquare.cdf(x, df));
}

/** Critical value with upper-tail probability alpha. */
export function chiSquareCritical(alpha: number, df: number): number {
  return jStat.chisquare.inv(1 - alpha, df);
}

/** Two-sided normal critical value, 1.96 at alpha = 0.05. */
export function normalCritical(alpha: number): number {
  return -jStat.normal.inv(alpha / 2, 0, 1);
}
