// The spread verdict, always with the figures behind it.
import type { CoverageResult } from './coverage.ts';
import type { NearestNeighbourResult } from './nearest-neighbour.ts';
import type { QuadratResult } from './quadrat.ts';
import type { RipleyResult } from './ripley.ts';

/** The pattern check's verdict: the one declaration that the API, the e-mail and the screens import. */
export type SpreadVerdict = 'clustered' | 'random' | 'regular' | 'too-few';

export interface SpreadResult {
  verdict: SpreadVerdict;
  alpha: number;
  minSightings: number;
  /** Which p-value decided: the Monte Carlo test inside the boundary, or Donnelly's normal approximation. */
  decidedBy: 'monte-carlo' | 'donnelly' | null;
  reasons: string[];
}

export function formatP(p: number | null): string {
  if (p === null || Number.isNaN(p)) return 'p not available';
  if (p < 0.001) return 'p < 0.001';
  return `p = ${p.toFixed(3)}`;
}

const fixed = (value: number | null, digits = 2) => (value === null || !Number.isFinite(value) ? 'n/a' : value.toFixed(digits));

/**
 * Verdict from the Donnelly-corrected Clark–Evans index: clustered when R < 1 and the Monte Carlo p
 * (or, without simulations, the normal p) is under alpha; regular when R > 1 likewise; otherwise random.
 */
export function spreadVerdict(input: {
  n: number;
  alpha: number;
  minSightings: number;
  nearestNeighbour: NearestNeighbourResult | null;
  quadrat: QuadratResult | null;
  ripley: RipleyResult | null;
  coverage: CoverageResult | null;
}): SpreadResult {
  const { n, alpha, minSightings, nearestNeighbour: nn, quadrat, ripley, coverage } = input;
  const reasons: string[] = [];
  if (n < minSightings || !nn) {
    reasons.push(`Only ${n} sighting${n === 1 ? '' : 's'} inside the field; a pattern check needs at least ${minSightings}.`);
    if (coverage) reasons.push(...coverage.warnings);
    return { verdict: 'too-few', alpha, minSightings, decidedBy: null, reasons };
  }
  const decidedBy = nn.monteCarlo.pValue !== null ? 'monte-carlo' : 'donnelly';
  const p = decidedBy === 'monte-carlo' ? (nn.monteCarlo.pValue as number) : nn.donnelly.pValue;
  const R = nn.donnelly.R;
  const verdict: SpreadVerdict = p < alpha ? (R < 1 ? 'clustered' : 'regular') : 'random';
  const pText = decidedBy === 'monte-carlo' ? `${formatP(p)} from ${nn.monteCarlo.simulations} random patterns inside the boundary` : `${formatP(p)}, normal approximation`;
  const reading = verdict === 'clustered' ? 'sightings lie closer together than chance would place them' : verdict === 'regular' ? 'sightings are spaced more evenly than chance' : 'the spacing is what chance alone would give';
  reasons.push(
    `Nearest-neighbour index R = ${fixed(R)} with Donnelly's edge correction (Clark–Evans R = ${fixed(nn.R)}, z = ${fixed(nn.z)}; ${pText}): ${reading} at α = ${alpha}.`,
  );
  if (quadrat && quadrat.df > 0) {
    const vmr = quadrat.varianceToMean;
    reasons.push(
      `Quadrat test: χ² = ${fixed(quadrat.chiSquare, 1)} on ${quadrat.df} df (${formatP(quadrat.pValue)}), variance-to-mean ratio ${fixed(vmr)}${vmr === null ? '' : vmr > 1 ? ' (above 1 suggests patches)' : ' (at or below 1 suggests no patches)'}${quadrat.lowExpected ? '; some cells expect fewer than 5 sightings, so read χ² with care' : ''}.`,
    );
  }
  if (ripley && ripley.envelopeHigh) {
    if (ripley.aboveEnvelopeM.length) reasons.push(`Ripley's L rises above the random envelope at ${rangeText(ripley.aboveEnvelopeM)}: clustering shows at that scale.`);
    else if (ripley.belowEnvelopeM.length) reasons.push(`Ripley's L falls below the random envelope at ${rangeText(ripley.belowEnvelopeM)}: regular spacing shows at that scale.`);
    else reasons.push(`Ripley's L stays inside the random envelope up to ${fixed(ripley.radiiM[ripley.radiiM.length - 1], 0)} m.`);
  }
  if (coverage) reasons.push(...coverage.warnings);
  return { verdict, alpha, minSightings, decidedBy, reasons };
}

function rangeText(radii: number[]): string {
  const lo = radii[0];
  const hi = radii[radii.length - 1];
  return lo === hi ? `${lo.toFixed(0)} m` : `${lo.toFixed(0)}–${hi.toFixed(0)} m`;
}
