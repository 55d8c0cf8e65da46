// The pattern-check API's contract: request schemas (zod) and response types, shared by the server and the
// adviser's screens. Check options are the engine's own schema, so the API accepts exactly what the engine does.
import { z } from 'zod';
import { analysisOptionsSchema } from '../analysis/options.ts';
import type { MultiPolygon } from 'geojson';
import type { AnalysisResult, CountsResult, ScoutedSummary, StopsSummary } from '../analysis/analyse.ts';
import type { QuadratCell, QuadratResult } from '../analysis/quadrat.ts';
import type { StopsQuadratResult } from '../analysis/stops-quadrat.ts';
import type { StopMerge } from '../analysis/stops.ts';
import type { SpreadVerdict } from '../analysis/spread.ts';
import { calendarDateSchema } from './calendar-date.ts';
import { pageQueryFields, type PageInfo } from './page.ts';
import type { ThresholdStatus } from '../thresholds/threshold-status.ts';
import type { UnacknowledgedNotice } from './notices.ts';
import type { WaitingGrowerQuestion } from './notice-questions.ts';

export const checkStatuses = ['queued', 'running', 'done', 'failed'] as const;
export type CheckStatus = (typeof checkStatuses)[number];

const isoDate = (label: string) =>
  calendarDateSchema({ shape: `Enter the ${label} date as YYYY-MM-DD.`, notADay: `The ${label} date is not a real calendar date.` });

const windowFields = {
  fieldId: z.uuid({ error: 'Choose the field to check.' }),
  pestId: z.uuid({ error: 'Choose the pest to check.' }),
  from: isoDate('from').optional(),
  to: isoDate('to').optional(),
  // prefault: an absent options object still goes through the engine's defaults.
  options: analysisOptionsSchema.prefault({}),
};

const windowInOrder = (v: { from?: string; to?: string }) => !v.from || !v.to || v.from <= v.to;
const windowMessage = { error: 'The window’s from date must not be after its to date.', path: ['to'] };

export const checkRequestSchema = z.object(windowFields).strict().refine(windowInOrder, windowMessage);
export type CheckRequest = z.output<typeof checkRequestSchema>;
export type CheckRequestInput = z.input<typeof checkRequestSchema>;

/** Sensitivity runs fewer simulations by default so the strip comes back quickly. */
export const SENSITIVITY_SIMULATIONS = 199;
export const sensitivityRequestSchema = checkRequestSchema;

/** Checks per page of GET /api/fields/:id/checks, newest first. */
export const CHECK_PAGE = { default: 20, max: 100 };
export const fieldChecksQuerySchema = z.object({
  pestId: z.uuid({ error: 'That pest id is not valid.' }).optional(),
  ...pageQueryFields('checks', CHECK_PAGE),
});
export type FieldChecksQuery = z.infer<typeof fieldChecksQuerySchema>;
export const thresholdStatusQuerySchema = z.object({
  pestId: z.uuid({ error: 'That pest id is not valid.' }).optional(),
  walkId: z.uuid({ error: 'That walk id is not valid.' }).optional(),
});
export const fieldHistoryQuerySchema = z.object({ pestId: z.uuid({ error: 'That pest id is not valid.' }).optional() });

export interface PersonRef {
  id: string;
  name: string;
}

export interface CheckView {
  id: string;
  fieldId: string;
  pestId: string;
  from: string | null;
  to: string | null;
  options: z.output<typeof analysisOptionsSchema>;
  /** How many sightings the check took in; their ids come from GET /api/checks/:id/sighting-ids. */
  sightingCount: number;
  sightingsHash: string;
  engineVersion: string;
  status: CheckStatus;
  progress: number;
  /** The engine's result as analyse() returned it, less the parts that grow with the sightings (CheckFigures). */
  result: CheckFigures | null;
  /** Stored beside the result: stops (empty stops recorded) or whole-field (photos only). */
  design?: 'stops' | 'whole-field' | null;
  /** Part of the field no stop speaks for, m². */
  notScoutedM2?: number | null;
  /** Sightings merged into one stop, one entry per merged stop. */
  stopMerges?: number | null;
  error: string | null;
  createdBy: PersonRef;
  createdAt: string;
  finishedAt: string | null;
  /** True when an identical stored check answered instead of a new computation. */
  reused?: boolean;
}

/**
 * The engine's result as a check's answer carries it: the figures the review page shows first. Per-stop figures,
 * quadrat cells and the scouted-area polygons grow with the sightings, so each has a route of its own and only
 * its size stays here; the density grid likewise (GET /api/checks/:id/density).
 */
export type CheckFigures = Omit<AnalysisResult, 'stops' | 'scouted' | 'quadrat' | 'stopsQuadrat' | 'counts'> & {
  stops: Omit<StopsSummary, 'merges'>;
  scouted: (Omit<ScoutedSummary, 'scouted' | 'notScouted'> & { notScoutedParts: number }) | null;
  quadrat: (Omit<QuadratResult, 'cells'> & { cellCount: number }) | null;
  stopsQuadrat: (Omit<StopsQuadratResult, 'cells'> & { cellCount: number }) | null;
  counts: Omit<CountsResult, 'giStar'> | null;
};

/** GET /api/checks/:id/stops: the per-stop figures (same-stop merges, Gi* per stop). */
export interface CheckStopsResponse {
  merges: StopMerge[];
  giStar: CountsResult['giStar'];
}

/** GET /api/checks/:id/quadrats: the cells of the quadrat count test and of the stops' quadrat test, null where the check has none. */
export interface CheckQuadratsResponse {
  quadratCells: QuadratCell[] | null;
  stopsQuadratCells: StopsQuadratResult['cells'] | null;
}

/**
 * GET /api/checks/:id/scouted-area: where the stops speak for the crop and the rest (longitude/latitude, on a grid of
 * 1e-6°, about 0.1 m), null without stops. The figures' scoutedM2 and notScoutedM2 are measured before that rounding.
 */
export interface CheckScoutedAreaResponse {
  scouted: MultiPolygon | null;
  notScouted: MultiPolygon | null;
}

/** GET /api/checks/:id/not-scouted-area: only the part of the field no stop speaks for, as the map draws it. */
export type CheckNotScoutedAreaResponse = Pick<CheckScoutedAreaResponse, 'notScouted'>;

/** GET /api/checks/:id/sighting-ids: the exact sightings the check took in. */
export interface CheckSightingIdsResponse {
  sightingIds: string[];
}

export interface CheckSummary {
  id: string;
  fieldId: string;
  pestId: string;
  pestName: string;
  from: string | null;
  to: string | null;
  status: CheckStatus;
  progress: number;
  verdict: SpreadVerdict | null;
  n: number | null;
  engineVersion: string;
  createdBy: PersonRef;
  createdAt: string;
  finishedAt: string | null;
  /** The options the check ran with, as stored. */
  options: z.output<typeof analysisOptionsSchema>;
  design: 'stops' | 'whole-field' | null;
  /** Sightings (photos and empty stops) the check took in, and the days of their walks, oldest first. */
  sightings: number;
  walkDates: string[];
  /** Read from the stored result (null until it is done, or where the check has no such figure). */
  figures: CheckSummaryFigures;
  /** The check's sightings against the pest's action threshold, as the threshold status reads them. */
  threshold: CheckSummaryThreshold;
}

export interface CheckSummaryFigures {
  /** Stops after same-stop merging, found and empty. */
  stops: number | null;
  emptyStops: number | null;
  clarkEvansR: number | null;
  /** Clark–Evans R with Donnelly's edge correction. */
  donnellyR: number | null;
  moranI: number | null;
  zoneCount: number | null;
  /** Total area of the proposed zones, m². */
  zonesM2: number | null;
  notScoutedM2: number | null;
}

export interface CheckSummaryThreshold {
  meanPerStop: number | null;
  shareInfested: number | null;
  actionThreshold: number;
  thresholdBasis: 'mean' | 'incidence';
  thresholdSource: string;
  /** False while the admin has not checked the threshold against its published source. */
  thresholdConfirmed: boolean;
  countUnit: string;
  status: ThresholdStatus['status'];
}

export interface CheckResponse {
  check: CheckView;
}
export interface FieldChecksResponse extends PageInfo {
  checks: CheckSummary[];
}

export interface SensitivityRow {
  cellSizeM: number | null;
  /** The cell side as a multiple of the default side (0.5, 1, 2). */
  cellSizeFactor: number;
  areaBasis: 'boundary' | 'bbox' | 'hull';
  /** null when the engine could not run this variant (see error). */
  verdict: SpreadVerdict | null;
  /** Clark–Evans figures on this area basis. */
  R: number | null;
  z: number | null;
  pValue: number | null;
  /** The figures the verdict rests on: Donnelly-corrected R and the Monte Carlo p. */
  donnellyR: number | null;
  monteCarloPValue: number | null;
  chiSquare: number | null;
  quadratPValue: number | null;
  error?: string;
}
export interface SensitivityResponse {
  simulations: number;
  rows: SensitivityRow[];
}

export interface WalkThresholdStatus extends ThresholdStatus {
  walkId: string;
  walkedOn: string;
  pestId: string;
  pestName: string;
  countUnit: string;
  /** False while the admin has not checked the threshold against its published source. */
  thresholdConfirmed: boolean;
}
export interface ThresholdStatusResponse {
  statuses: WalkThresholdStatus[];
}

export interface WalkPestFigures {
  pestId: string;
  pestName: string;
  /** Sightings with the pest found (count above 0, or present without a count). */
  sightings: number;
  /** Every stop for this pest, empty ones included. */
  stops: number;
  meanCount: number | null;
}
export interface HistoryWalk {
  walkId: string;
  walkedOn: string;
  scout: PersonRef;
  pests: WalkPestFigures[];
}
export interface FieldHistoryResponse {
  walks: HistoryWalk[];
  checks: CheckSummary[];
}

/** Why a line is on the adviser's attention list. */
export type AttentionReason = 'field-above-threshold' | 'patch-above-threshold' | 'not-yet-checked' | 'rescout-due' | 'too-few-stops';
export interface AttentionField {
  fieldId: string;
  fieldName: string;
  farmName: string;
  pestId: string;
  pestName: string;
  reason: AttentionReason;
  /** A sentence for the adviser. */
  message: string;
  /** The page that opens exactly what the line is about (a check, a zone set or the field's review). */
  link: string;
  checkId: string | null;
  zoneSetId: string | null;
  meanPerStop: number | null;
  actionThreshold: number;
  /** The threshold in words with its unit or basis ("250 aphids per plant", "50 % of stops infested"). */
  thresholdWords: string;
  thresholdSource: string;
  /** False while the admin has not checked the threshold against its published source. */
  thresholdConfirmed: boolean;
  /** Stops (found and empty) added or changed since the latest check; `emptyStops` of them found nothing. */
  newSightings: number;
  emptyStops: number;
}
export interface AttentionRescout {
  fieldId: string;
  fieldName: string;
  farmName: string;
  pestId: string;
  pestName: string;
  reason: 'rescout-due';
  message: string;
  link: string;
  lastWalkedOn: string;
  daysSinceWalk: number;
  rescoutDays: number;
  rescoutSource: string;
  /** False while the interval waits for the admin to confirm it against a published source. */
  rescoutConfirmed: boolean;
}
export interface AttentionResponse {
  /** Fields above their pest's threshold whatever the spread, and patches or zones above it where the field mean is not. */
  aboveThreshold: AttentionField[];
  /** Fields whose latest walk has too few stops to call against the threshold: scout again before deciding. */
  tooFewStops: AttentionField[];
  notYetChecked: AttentionField[];
  /** Fields whose latest walk is older than the pest's re-scout interval, most overdue first. */
  rescoutDue: AttentionRescout[];
  unacknowledgedNotices: Array<UnacknowledgedNotice & { link: string }>;
  /** Grower questions on notices waiting for an answer, oldest first. */
  growerQuestions: Array<WaitingGrowerQuestion & { link: string }>;
}
