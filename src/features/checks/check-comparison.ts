// Two stored checks side by side: the figures each one's summary row holds, and what changed from the earlier
// to the later. Nothing is computed here beyond the difference of two stored figures.
import type { CheckSummary } from '@shared/schemas/checks.ts';
import { datesIn, type Dates } from '@shared/dates/format-dates.ts';
import { hectaresAndAcres } from './utils/figures.ts';
import { spreadLabels } from '../../lib/spread-labels.ts';

export interface ComparisonRow {
  key: string;
  label: string;
  earlier: string;
  later: string;
  /** The later value less the earlier one (numbers), or "changed" / "same" (words); "—" when either is missing. */
  change: string;
  changed: boolean;
}

const blank = '—';
const M2_PER_HA = 10_000;

/** Earlier first, by the time each check was run. */
export function inRunOrder(a: CheckSummary, b: CheckSummary): [CheckSummary, CheckSummary] {
  return a.createdAt <= b.createdAt ? [a, b] : [b, a];
}

export function windowText(check: Pick<CheckSummary, 'from' | 'to'>, dates: Dates = datesIn()): string {
  return `${check.from ? dates.calendarDate(check.from) : 'season start'} – ${check.to ? dates.calendarDate(check.to) : 'today'}`;
}

export function optionsText(check: Pick<CheckSummary, 'options'>): string {
  const o = check.options;
  const parts = [`${o.simulations} simulations`, `α ${o.alpha}`, `${o.areaBasis} area`, `${o.kernel} kernel`];
  parts.push(`seed ${o.seed}`);
  if (o.cellSizeM) parts.push(`cells ${o.cellSizeM} m`);
  if (o.bandwidthM) parts.push(`bandwidth ${o.bandwidthM} m`);
  return parts.join(' · ');
}

function wordsRow(key: string, label: string, earlier: string, later: string): ComparisonRow {
  return { key, label, earlier, later, change: earlier === later ? 'same' : 'changed', changed: earlier !== later };
}

function numberRow(
  key: string,
  label: string,
  earlier: number | null,
  later: number | null,
  digits: number,
  show = (v: number) => v.toFixed(digits),
): ComparisonRow {
  const text = (v: number | null) => (v === null || !Number.isFinite(v) ? blank : show(v));
  if (earlier === null || later === null || !Number.isFinite(earlier) || !Number.isFinite(later)) {
    return { key, label, earlier: text(earlier), later: text(later), change: earlier === later ? 'same' : blank, changed: earlier !== later };
  }
  // Compared as shown, so a difference below the digits on screen is not called a change.
  const delta = Number((later - earlier).toFixed(digits));
  const change = delta === 0 ? 'same' : `${delta > 0 ? '+' : '−'}${Math.abs(delta).toFixed(digits)}`;
  return { key, label, earlier: text(earlier), later: text(later), change, changed: delta !== 0 };
}

const walksText = (c: CheckSummary, dates: Dates) => c.walkDates.map(dates.calendarDate).join(', ') || blank;
const verdictText = (c: CheckSummary) => (c.verdict ? spreadLabels[c.verdict] : c.status);
const meanText = (c: CheckSummary) => c.threshold.meanPerStop;
const shareText = (c: CheckSummary) => (c.threshold.shareInfested === null ? null : c.threshold.shareInfested * 100);

export function compareChecks(earlier: CheckSummary, later: CheckSummary, dates: Dates = datesIn()): ComparisonRow[] {
  const f = (c: CheckSummary) => c.figures;
  const rows: ComparisonRow[] = [
    wordsRow('pest', 'Pest', earlier.pestName, later.pestName),
    wordsRow('window', 'Date window', windowText(earlier, dates), windowText(later, dates)),
    wordsRow('walks', 'Walks included', walksText(earlier, dates), walksText(later, dates)),
    wordsRow('options', 'Options', optionsText(earlier), optionsText(later)),
    wordsRow('verdict', 'Spread', verdictText(earlier), verdictText(later)),
    numberRow('sightings', 'Sightings and empty stops taken in', earlier.sightings, later.sightings, 0),
    numberRow('stops', 'Stops (after same-stop merging)', f(earlier).stops, f(later).stops, 0),
    numberRow('found', 'Stops with the pest (n)', earlier.n, later.n, 0),
    numberRow('mean', `Mean count per stop (${later.threshold.countUnit})`, meanText(earlier), meanText(later), 2),
    numberRow('share', 'Stops infested (%)', shareText(earlier), shareText(later), 0),
    wordsRow('threshold', 'Action threshold', thresholdText(earlier), thresholdText(later)),
    wordsRow('against', 'Against the threshold', thresholdStanding(earlier), thresholdStanding(later)),
    numberRow('R', 'Clark–Evans R', f(earlier).clarkEvansR, f(later).clarkEvansR, 3),
    numberRow('donnelly-R', 'R, edge-corrected (Donnelly)', f(earlier).donnellyR, f(later).donnellyR, 3),
    numberRow('moran-I', 'Moran’s I', f(earlier).moranI, f(later).moranI, 3),
    numberRow('zones', 'Proposed zones', f(earlier).zoneCount, f(later).zoneCount, 0),
    numberRow('zones-ha', 'Zones’ area (ha)', hectares(f(earlier).zonesM2, f(earlier).zoneCount), hectares(f(later).zonesM2, f(later).zoneCount), 2),
    numberRow('not-scouted-ha', 'Not scouted (ha)', hectares(f(earlier).notScoutedM2), hectares(f(later).notScoutedM2), 2),
  ];
  return rows;
}

/** A check with no zones has none of their area, which is 0 ha, not unknown. */
function hectares(m2: number | null, zoneCount?: number | null): number | null {
  if (m2 === null) return zoneCount === 0 ? 0 : null;
  return m2 / M2_PER_HA;
}

function thresholdText(c: CheckSummary): string {
  const t = c.threshold;
  return t.thresholdBasis === 'incidence' ? `${Math.round(t.actionThreshold * 100)} % of stops infested` : `${t.actionThreshold} ${t.countUnit}`;
}

const standingWords = { above: 'above', below: 'below', 'too-close': 'too close to call', 'too-few': 'too few stops to call' } as const;
const thresholdStanding = (c: CheckSummary) => standingWords[c.threshold.status];

/** The zones' area for the table of past checks. */
export const zonesAreaText = (c: CheckSummary) => (c.figures.zoneCount ? hectaresAndAcres(c.figures.zonesM2) : 'none');
