// Plain words for an adviser beside each figure. These read the engine's figures against 1, 0 or α;
// they never compute a statistic of their own.
import type { NearestNeighbourResult } from '@shared/analysis/nearest-neighbour.ts';
import type { QuadratResult } from '@shared/analysis/quadrat.ts';
import type { MoranResult } from '@shared/analysis/autocorrelation.ts';
import { fixed, metres, pText } from './figures.ts';

export function explainR(R: number, p: number, alpha: number): string {
  const strong = p < alpha;
  if (R < 1)
    return strong
      ? `R below 1: sightings sit closer together than chance would put them, and p ${pText(p)} says chance alone rarely does that.`
      : `R below 1 leans towards patches, but p ${pText(p)} is not below ${alpha}: chance could give this spacing.`;
  if (R > 1)
    return strong
      ? `R above 1: sightings are spaced more evenly than chance, as if kept apart (rows, stations, a grid walk).`
      : `R above 1 leans towards even spacing, but p ${pText(p)} is not below ${alpha}: chance could give this.`;
  return 'R of 1 is exactly the spacing chance would give.';
}

export function explainZ(z: number): string {
  return `How many standard errors the mean spacing is from the chance spacing; beyond ±1.96 is unusual at the 5 % level. Here ${fixed(z)}${z < 0 ? ' (closer than chance)' : z > 0 ? ' (wider than chance)' : ''}.`;
}

export function explainP(p: number, alpha: number): string {
  return p < alpha
    ? `The chance of spacing this far from random if the pest were scattered by chance: ${pText(p)}, below your α of ${alpha}.`
    : `The chance of spacing this far from random if the pest were scattered by chance: ${pText(p)}, not below your α of ${alpha} — no firm pattern.`;
}

export function explainMeanDistance(nn: NearestNeighbourResult): string {
  return `On average each sighting's nearest other sighting is ${metres(nn.meanDistanceM)} away; chance would put it about ${metres(nn.expectedDistanceM)} away in this area.`;
}

export function explainDonnelly(nn: NearestNeighbourResult): string {
  return `The same test allowing for the field edge (sightings near the edge have fewer neighbours): R ${fixed(nn.donnelly.R)}. This is the R the verdict reads.`;
}

export function explainMonteCarlo(nn: NearestNeighbourResult, alpha: number): string {
  const { simulations, pValue } = nn.monteCarlo;
  if (pValue === null) return 'No random patterns were simulated; the verdict falls back to the edge-corrected normal p.';
  return `Your spacing compared with ${simulations} random scatters of as many sightings inside this very boundary: p ${pText(pValue)}${pValue < alpha ? ', so few random scatters come out this far from chance — the pattern is real' : ', so random scatters often look like this — not unusual'}. This p decides the verdict.`;
}

export function explainChiSquare(q: Pick<QuadratResult, 'pValue'>, alpha: number): string {
  return q.pValue < alpha
    ? `Cell counts differ more from cell to cell than chance would make them (p ${pText(q.pValue)}).`
    : `Cell counts vary about as much as chance would make them (p ${pText(q.pValue)}).`;
}

export function explainVarianceToMean(vmr: number | null): string {
  if (vmr === null) return 'Needs at least two whole cells inside the field.';
  if (vmr > 1) return `Above 1: some cells hold many sightings and others few — the mark of patches.`;
  if (vmr < 1) return 'Below 1: cells hold more alike numbers than chance — an even spread.';
  return 'About 1: what a chance scatter gives.';
}

export function explainMorisita(value: number | null): string {
  if (value === null) return 'Needs at least two sightings in whole cells.';
  return value > 1
    ? 'Above 1: two sightings picked at random share a cell more often than chance — patchy.'
    : value < 1
      ? 'Below 1: sightings share cells less often than chance — even.'
      : 'About 1: random.';
}

export function explainMoran(moran: MoranResult, alpha: number): string {
  const p = moran.pValue ?? moran.normalPValue;
  if (p >= alpha) return `Heavy and light counts are mixed across the field (p ${pText(p)}): no sign that high counts sit together.`;
  return moran.I > moran.expected
    ? `High counts sit next to high counts and low next to low (p ${pText(p)}): heavy infestation is grouped, not scattered.`
    : `High counts tend to sit next to low ones (p ${pText(p)}): a checkerboard rather than patches.`;
}
