// The spread verdict and its key figures in plain words, from a stored check result (the engine's own figures).
import { formatP, type SpreadVerdict as Spread } from '../analysis/spread.ts';

interface StoredResult {
  n?: number;
  area?: { boundaryM2?: number };
  design?: 'stops' | 'whole-field';
  spread?: {
    verdict?: Spread;
    alpha?: number;
    minSightings?: number;
    decidedBy?: 'random-labelling' | 'monte-carlo' | 'donnelly' | null;
    headline?: string;
    evidence?: Array<{ role: 'primary' | 'supporting'; text: string }>;
  };
  nearestNeighbour?: {
    R: number;
    z: number;
    pValue: number;
    donnelly?: { R: number; z: number; pValue: number };
    monteCarlo?: { simulations: number; pValue: number | null };
  } | null;
  quadrat?: { chiSquare: number; df: number; pValue: number; varianceToMean: number | null } | null;
  coverage?: { warnings?: string[] } | null;
}

/** A signed number with a true minus sign, as printed figures use. */
export const signed = (value: number, digits = 2) => (value < 0 ? `−${Math.abs(value).toFixed(digits)}` : value.toFixed(digits));

const reading: Record<Spread, string> = {
  clustered: 'Clustered: sightings are closer together than chance would place them',
  regular: 'Spread out: sightings are spaced more evenly than chance would place them',
  random: 'Random: the spacing of the sightings is what chance alone would give',
  'too-few': 'Too few sightings to tell a pattern',
  everywhere: 'Everywhere: the pest was found at most stops, a whole-field decision against the threshold',
  'cant-tell': "Can't tell: the data cannot separate the walk from the pest",
};

export interface VerdictWords {
  spread: Spread | null;
  /** The verdict in plain words, without figures; absent in notices sent before it was kept (the headline stands in). */
  plain?: string;
  headline: string;
  figures: string[];
}

/** Headline and figure sentences for the e-mail and the notice page; null result means zones drawn without a check. */
export function verdictInWords(result: unknown): VerdictWords {
  const r = (result ?? null) as StoredResult | null;
  if (!r?.spread?.verdict) {
    const headline = 'No pattern check is attached: the adviser drew these zones from the field visit.';
    return { spread: null, plain: headline, headline, figures: [] };
  }
  const verdict = r.spread.verdict;
  const nearest = r.nearestNeighbour;
  const figures: string[] = [];
  if (typeof r.n === 'number') figures.push(`${r.n} sighting${r.n === 1 ? '' : 's'} inside the field.`);
  if (verdict === 'too-few' || !nearest) {
    const headline = `${reading['too-few']} (a check needs at least ${r.spread.minSightings ?? 10} sightings).`;
    return { spread: verdict, plain: headline, headline, figures };
  }
  const primary = r.spread.evidence?.find((e) => e.role === 'primary');
  if (r.design === 'stops' && r.spread.headline && primary) {
    // Checks that state their design lead with their one primary test; Clark–Evans stays a value beside it.
    figures.push(primary.text);
    figures.push(`Clark–Evans R = ${nearest.R.toFixed(2)} (no edge correction; a value, not evidence).`);
    if (typeof r.spread.alpha === 'number') figures.push(`Significance level α = ${r.spread.alpha}.`);
    for (const warning of r.coverage?.warnings ?? []) figures.push(warning);
    const sentence = `${r.spread.headline.replace(/\.+$/, '')}.`;
    return { spread: verdict, plain: sentence, headline: sentence, figures };
  }
  const monteCarlo = r.spread.decidedBy === 'monte-carlo' && nearest.monteCarlo?.pValue != null;
  const p = monteCarlo ? (nearest.monteCarlo!.pValue as number) : (nearest.donnelly?.pValue ?? nearest.pValue);
  const pText = monteCarlo ? `${formatP(p)} against ${nearest.monteCarlo!.simulations} random patterns inside the field` : formatP(p);
  const headline = `${reading[verdict]} (Clark–Evans R = ${nearest.R.toFixed(2)}, z = ${signed(nearest.z, 1)}, ${pText}).`;
  if (nearest.donnelly)
    figures.push(
      `With Donnelly’s edge correction for the field boundary, R = ${nearest.donnelly.R.toFixed(2)} (z = ${signed(nearest.donnelly.z, 1)}, ${formatP(nearest.donnelly.pValue)}); R below 1 means closer together than chance, above 1 more evenly spaced.`,
    );
  if (r.quadrat && r.quadrat.df > 0) {
    const vmr = r.quadrat.varianceToMean;
    figures.push(
      `Quadrat count test: χ² = ${r.quadrat.chiSquare.toFixed(1)} on ${r.quadrat.df} degrees of freedom (${formatP(r.quadrat.pValue)})${vmr === null ? '' : `, variance-to-mean ratio ${vmr.toFixed(2)}`}.`,
    );
  }
  if (typeof r.spread.alpha === 'number') figures.push(`Significance level α = ${r.spread.alpha}.`);
  for (const warning of r.coverage?.warnings ?? []) figures.push(warning);
  return { spread: verdict, plain: `${reading[verdict]}.`, headline, figures };
}
