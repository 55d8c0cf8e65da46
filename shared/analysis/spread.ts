// The spread verdict, always with the figures behind it.
import type { CoverageResult } from './coverage.ts';
import type { NearestNeighbourResult } from './nearest-neighbour.ts';
import type { QuadratResult } from './quadrat.ts';
import type { RandomLabellingResult } from './labelling.ts';
import type { RipleyResult } from './ripley.ts';

/** The pattern check's verdict: the one declaration that the API, the e-mail and the screens import. */
export type SpreadVerdict = 'clustered' | 'random' | 'regular' | 'too-few' | 'everywhere' | 'cant-tell';

export type CheckDesign = 'stops' | 'whole-field';

export interface Evidence {
  /** The one pre-declared test that decides, or a figure shown beside it. */
  role: 'primary' | 'supporting';
  test: string;
  pValue: number | null;
  text: string;
}

export interface SpreadResult {
  verdict: SpreadVerdict;
  design: CheckDesign;
  alpha: number;
  minSightings: number;
  /** Which p-value decided: random labelling of the stops, the Monte Carlo test inside the boundary, or Donnelly's normal approximation. */
  decidedBy: 'random-labelling' | 'monte-carlo' | 'donnelly' | null;
  /** The verdict in one plain sentence, for the review screen and the notice. */
  headline: string;
  /** Radii at which the found stops bunch beyond the global envelope (stops design). */
  clusteredAtM: number[];
  spreadOutAtM: number[];
  evidence: Evidence[];
  /** The evidence as sentences, primary first. */
  reasons: string[];
}

export function formatP(p: number | null): string {
  if (p === null || Number.isNaN(p)) return 'p not available';
  if (p < 0.001) return 'p < 0.001';
  return `p = ${p.toFixed(3)}`;
}

const fixed = (value: number | null, digits = 2) => (value === null || !Number.isFinite(value) ? 'n/a' : value.toFixed(digits));

const headlines: Record<SpreadVerdict, string> = {
  clustered: 'Clustered: the pest is more bunched than chance would bunch it',
  regular: 'Spread out: the pest is spaced more evenly than chance would space it',
  random: 'Random: the pest is no more bunched than chance would bunch it',
  'too-few': 'Too few sightings to tell a patch from chance',
  everywhere: 'Everywhere: the pest was found at most stops; decide for the whole field against the threshold',
  'cant-tell': "Can't tell",
};

/** Fields shorter across than this share of their perimeter are "long and narrow" for Donnelly's formula (our rule: P/√A above 5.5, about a 1 : 4 rectangle). */
export const NARROW_FIELD_SHAPE = 5.5;

/**
 * Whole-field design (photos only): verdict from the Donnelly-corrected Clark–Evans index against CSR inside
 * the boundary, Monte Carlo p (Donnelly's normal p only without simulations and never for long narrow fields);
 * "can't tell" when the search covered the field unevenly, since CSR assumes an even search.
 */
export function spreadVerdict(input: {
  n: number;
  alpha: number;
  minSightings: number;
  nearestNeighbour: NearestNeighbourResult | null;
  quadrat: QuadratResult | null;
  ripley: RipleyResult | null;
  coverage: CoverageResult | null;
  areaM2?: number;
  perimeterM?: number;
}): SpreadResult {
  const { n, alpha, minSightings, nearestNeighbour: nn, quadrat, ripley, coverage } = input;
  const base = { design: 'whole-field' as const, alpha, minSightings, clusteredAtM: [] as number[], spreadOutAtM: [] as number[] };
  if (n < minSightings || !nn) return tooFew(base, `Only ${n} sighting${n === 1 ? '' : 's'} inside the field; a pattern check needs at least ${minSightings}.`);
  const assumption =
    'Photos only, no empty stops: these tests compare the sightings with chance over the whole field, which assumes the whole field was searched evenly.';
  if (coverage?.uneven) {
    const warnings = coverage.warnings.filter((w) => !w.startsWith('No empty stops'));
    return finish(
      {
        ...base,
        verdict: 'cant-tell',
        decidedBy: null,
        headline:
          "Can't tell: search uneven. The stops cover the field unevenly and no empty stops were recorded, so the walk cannot be told from the pest; no zone is proposed.",
      },
      [{ role: 'primary', test: 'search coverage', pValue: null, text: `${warnings.join(' ')} ${assumption}` }],
    );
  }
  const narrow = input.areaM2 !== undefined && input.perimeterM !== undefined && input.perimeterM / Math.sqrt(input.areaM2) > NARROW_FIELD_SHAPE;
  if (nn.monteCarlo.pValue === null && narrow) {
    return finish(
      {
        ...base,
        verdict: 'cant-tell',
        decidedBy: null,
        headline: "Can't tell: Donnelly's normal approximation does not hold for a long narrow field; run the check with simulations.",
      },
      [{ role: 'primary', test: 'Clark–Evans with Donnelly correction', pValue: null, text: assumption }],
    );
  }
  const decidedBy = nn.monteCarlo.pValue !== null ? 'monte-carlo' : 'donnelly';
  const p = decidedBy === 'monte-carlo' ? (nn.monteCarlo.pValue as number) : nn.donnelly.pValue;
  const R = nn.donnelly.R;
  // Direction from the same test as the p: the Monte Carlo mean is simulated in the boundary, whatever the area basis.
  const closer = decidedBy === 'monte-carlo' && nn.monteCarlo.meanSimulatedDistanceM !== null ? nn.meanDistanceM < nn.monteCarlo.meanSimulatedDistanceM : R < 1;
  const verdict: SpreadVerdict = p < alpha ? (closer ? 'clustered' : 'regular') : 'random';
  const pText =
    decidedBy === 'monte-carlo' ? `${formatP(p)} from ${nn.monteCarlo.simulations} random patterns inside the boundary` : `${formatP(p)}, normal approximation`;
  const reading =
    verdict === 'clustered'
      ? 'sightings lie closer together than chance would place them'
      : verdict === 'regular'
        ? 'sightings are spaced more evenly than chance'
        : 'the spacing is what chance alone would give';
  const evidence: Evidence[] = [
    {
      role: 'primary',
      test: 'Clark–Evans with Donnelly correction',
      pValue: p,
      text: `Nearest-neighbour index R = ${fixed(R)} with Donnelly's edge correction (${pText}): ${reading} at α = ${alpha}. ${assumption}`,
    },
    {
      role: 'supporting',
      test: 'Clark–Evans, no edge correction',
      pValue: null,
      text: `Clark–Evans R = ${fixed(nn.R)} without edge correction (a value only: biased upwards in a bounded field).`,
    },
  ];
  if (quadrat && quadrat.df > 0) {
    const vmr = quadrat.varianceToMean;
    evidence.push({
      role: 'supporting',
      test: 'quadrat count test',
      pValue: quadrat.pValue,
      text: `Quadrat test: χ² = ${fixed(quadrat.chiSquare, 1)} on ${quadrat.df} df (two-sided ${formatP(quadrat.pValue)}), variance-to-mean ratio ${fixed(vmr)}${vmr === null ? '' : vmr > 1 ? ' (above 1 suggests patches)' : ' (at or below 1 suggests no patches)'}${quadrat.lowExpected ? '; some cells expect fewer than 5 sightings, so read χ² with care' : ''}.`,
    });
  }
  if (ripley && ripley.envelopeHigh) {
    const text = ripley.aboveEnvelopeM.length
      ? `Ripley's L rises above the pointwise random envelope at ${radiiText(ripley.aboveEnvelopeM, ripley.radiiM)}.`
      : ripley.belowEnvelopeM.length
        ? `Ripley's L falls below the pointwise random envelope at ${radiiText(ripley.belowEnvelopeM, ripley.radiiM)}.`
        : `Ripley's L stays inside the pointwise random envelope up to ${fixed(ripley.radiiM[ripley.radiiM.length - 1], 0)} m.`;
    evidence.push({ role: 'supporting', test: "Ripley's L", pValue: null, text: `${text} Pointwise, so not a test on its own.` });
  }
  for (const warning of coverage?.warnings ?? []) evidence.push({ role: 'supporting', test: 'search coverage', pValue: null, text: warning });
  return finish({ ...base, verdict, decidedBy, headline: `${headlines[verdict]} (${pText}).` }, evidence);
}

/**
 * Stops design (empty stops recorded): verdict from the global envelope test of K_found − K_all stops under
 * random labelling stratified by walk; "everywhere" when more than everywhereShare of the stops hold the pest.
 */
export function stopsVerdict(input: {
  stops: number;
  found: number;
  alpha: number;
  minSightings: number;
  everywhereShare: number;
  labelling: RandomLabellingResult | null;
  supporting: Evidence[];
}): SpreadResult {
  const { stops, found, alpha, minSightings, labelling } = input;
  const base = { design: 'stops' as const, alpha, minSightings, clusteredAtM: [] as number[], spreadOutAtM: [] as number[] };
  if (found < minSightings) {
    return tooFew(base, `The pest was found at ${found} of ${stops} stops; telling a patch from chance needs at least ${minSightings} stops with the pest.`);
  }
  if (found > input.everywhereShare * stops) {
    const share = Math.round((100 * found) / stops);
    return finish({ ...base, verdict: 'everywhere', decidedBy: null, headline: `${headlines.everywhere} (found at ${found} of ${stops} stops, ${share} %).` }, [
      {
        role: 'primary',
        test: 'share of stops infested',
        pValue: null,
        text: `Found at ${share} % of the stops, more than ${Math.round(input.everywhereShare * 100)} %: a whole-field decision against the action threshold, not a patch.`,
      },
      ...input.supporting,
    ]);
  }
  if (!labelling || labelling.simulations === 0) {
    return finish(
      { ...base, verdict: 'cant-tell', decidedBy: null, headline: "Can't tell: the stops test needs relabellings (simulations above 0)." },
      input.supporting,
    );
  }
  const env = labelling.envelope;
  const p = env.pValue;
  const verdict: SpreadVerdict = p <= alpha ? (env.side === 'high' ? 'clustered' : 'regular') : 'random';
  const where =
    verdict === 'clustered' && env.aboveM.length
      ? ` Found stops bunch at ${radiiText(env.aboveM, labelling.radiiM)}.`
      : verdict === 'regular' && env.belowM.length
        ? ` Found stops keep apart at ${radiiText(env.belowM, labelling.radiiM)}.`
        : '';
  const undefinedText = env.undefinedM.length
    ? ` Not testable at ${radiiText(env.undefinedM, labelling.radiiM)} (no stops that close, or the same in every relabelling).`
    : '';
  const pText = `${formatP(p)} against ${labelling.simulations} relabellings of the same ${stops} stops${labelling.walks > 1 ? `, within each of ${labelling.walks} walks` : ''}`;
  const primary: Evidence = {
    role: 'primary',
    test: 'random labelling, K_found − K_all stops, global envelope',
    pValue: p,
    text: `Is the pest more bunched among the places the scout stopped than chance would bunch it? Global rank envelope test of K_found − K_all stops at α = ${alpha}: ${pText}.${where}${undefinedText}`,
  };
  return finish(
    {
      ...base,
      verdict,
      decidedBy: 'random-labelling',
      headline: `${headlines[verdict]} among the stops made (${formatP(p)}).`,
      clusteredAtM: verdict === 'clustered' ? env.aboveM : [],
      spreadOutAtM: verdict === 'regular' ? env.belowM : [],
    },
    [primary, ...input.supporting],
  );
}

type Base = Pick<SpreadResult, 'design' | 'alpha' | 'minSightings' | 'clusteredAtM' | 'spreadOutAtM'>;

/** "Too few" shows nothing beneath it that could read as a pattern. */
function tooFew(base: Base, sentence: string): SpreadResult {
  return finish({ ...base, verdict: 'too-few', decidedBy: null, headline: `${headlines['too-few']}: ${sentence}` }, [
    { role: 'primary', test: 'number of sightings', pValue: null, text: sentence },
  ]);
}

function finish(head: Omit<SpreadResult, 'evidence' | 'reasons'>, evidence: Evidence[]): SpreadResult {
  const marked = evidence.map((e) =>
    e.role === 'supporting' ? { ...e, text: e.text.startsWith('Supporting') ? e.text : `Supporting evidence, not the verdict: ${e.text}` } : e,
  );
  return { ...head, evidence: marked, reasons: marked.map((e) => e.text) };
}

/** Radii as a list of runs, e.g. "10–30 m and 60 m", so separate ranges are not read as one. */
export function radiiText(radii: number[], grid: number[] = radii): string {
  if (radii.length === 0) return 'no radius';
  const sorted = [...radii].sort((a, b) => a - b);
  const position = new Map(grid.map((r, k) => [r, k]));
  const runs: [number, number][] = [];
  let lastIndex = -2;
  for (const r of sorted) {
    const k = position.get(r) ?? -10;
    const last = runs[runs.length - 1];
    if (last && k === lastIndex + 1) last[1] = r;
    else runs.push([r, r]);
    lastIndex = k;
  }
  const text = runs.map(([lo, hi]) => (lo === hi ? `${round(lo)} m` : `${round(lo)}–${round(hi)} m`));
  return text.length === 1 ? text[0] : `${text.slice(0, -1).join(', ')} and ${text[text.length - 1]}`;
}

const round = (v: number) => (v >= 10 ? v.toFixed(0) : v.toFixed(1));
