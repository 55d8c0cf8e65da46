// Pattern checks: run one (or find the identical stored one), fetch one, list a field's checks.
import * as checks from '../queries/pattern-checks.ts';
import type { PestRow } from '../queries/pests.ts';
import { thresholdStatus } from '../../shared/thresholds/threshold-status.ts';
import { findUserNames } from '../queries/users.ts';
import type { Actor } from '../auth/passport.ts';
import { badRequest, notFound } from '../errors.ts';
import { findVisibleField } from './fields.ts';
import { findPest } from './pests.ts';
import { decodePageCursor, pageOf, type CursorPart } from './page-cursor.ts';
import { recordAudit } from './audit.ts';
import { checkWork, INLINE_WORK_LIMIT, optionsHash, runStoredCheck, sightingsHash, sightingsInWindow } from './check-runner.ts';
import { enqueueCheck } from '../jobs/check-worker.ts';
import { ENGINE_VERSION } from '../../shared/analysis/version.ts';
import type { AnalysisOptions } from '../../shared/analysis/options.ts';
import type { CheckFigures, CheckRequest, CheckSummary, CheckView, FieldChecksQuery, FieldChecksResponse } from '../../shared/schemas/checks.ts';
import type { SpreadVerdict } from '../../shared/analysis/spread.ts';
import { cachedAnswer, serialise, type SerialisedAnswer } from './check-answer-cache.ts';
import { assertCheckWithinBudget, fieldExtent, INLINE_WORK_UNITS } from './check-budget.ts';

const iso = (d: Date | null) => (d ? new Date(d).toISOString() : null);

async function peopleById(ids: string[]) {
  const users = await findUserNames([...new Set(ids)]);
  return new Map(users.map((u) => [u.id, { id: u.id, name: u.name }]));
}

function presentCheck(check: checks.PatternCheckRow, people: Map<string, { id: string; name: string }>, reused?: boolean): CheckView {
  return {
    id: check.id,
    fieldId: check.fieldId,
    pestId: check.pestId,
    from: check.windowFrom,
    to: check.windowTo,
    options: check.options as AnalysisOptions,
    sightingCount: check.sightingIds.length,
    sightingsHash: check.sightingsHash,
    engineVersion: check.engineVersion,
    status: check.status,
    progress: check.progress,
    // The stored JSONB is analyse()'s answer; the view carries it less the parts with routes of their own.
    result: (check.result as CheckFigures | null) ?? null,
    design: check.design ?? null,
    notScoutedM2: check.notScoutedM2 ?? null,
    stopMerges: check.stopMerges ? check.stopMerges.length : null,
    error: check.error ?? null,
    createdBy: people.get(check.createdBy) ?? { id: check.createdBy, name: '' },
    createdAt: iso(check.createdAt)!,
    finishedAt: iso(check.finishedAt ?? null),
    ...(reused !== undefined ? { reused } : {}),
  };
}

const present = async (check: checks.PatternCheckRow, reused?: boolean) => presentCheck(check, await peopleById([check.createdBy]), reused);

/** The planar option is for files already in metres; sightings in the database are always longitude/latitude. */
function assertGeographic(options: AnalysisOptions) {
  if (options.planar)
    throw badRequest('Option planar: stored sightings are longitude/latitude, so a field check cannot use planar coordinates.', {
      'options.planar': 'Leave planar off for field checks.',
    });
}

/** A queued or running check untouched this long lost its worker (a process stopped mid-run); run it again. */
const STALE_AFTER_MS = 30 * 60 * 1000;
const isStale = (check: checks.PatternCheckRow) =>
  (check.status === 'queued' || check.status === 'running') && Date.now() - new Date(check.updatedAt).getTime() > STALE_AFTER_MS;

export interface CheckOutcome {
  /** `{ check }` already serialised, its figures spliced in as stored. */
  json: string;
  /** What happened: an identical check was already stored, this one was computed now, or it waits in the queue. */
  happened: 'stored' | 'computed' | 'queued';
}

/** Finds the stored check with exactly these inputs, or stores a new one and runs it (inline or queued). */
/**
 * Zones follow the pest's own action threshold (a mean count per stop, in its unit) unless the adviser set one; a
 * threshold on the share of plants infested has no mean count to hold, so those zones follow relative risk.
 */
export function withPestThreshold(options: AnalysisOptions, pest: Pick<PestRow, 'actionThreshold' | 'thresholdBasis' | 'countUnit'>): AnalysisOptions {
  if (pest.thresholdBasis !== 'mean' || !(pest.actionThreshold > 0) || options.zones.actionThreshold !== undefined) return options;
  const unit = options.zones.unit ?? (pest.countUnit.trim() ? pest.countUnit.trim().slice(0, 80) : undefined);
  return { ...options, zones: { ...options.zones, actionThreshold: pest.actionThreshold, ...(unit ? { unit } : {}) } };
}

export async function requestCheck(actor: Actor, asked: CheckRequest): Promise<CheckOutcome> {
  assertGeographic(asked.options);
  const field = await findVisibleField(actor, asked.fieldId);
  const pest = await findPest(actor, asked.pestId);
  const request = { ...asked, options: withPestThreshold(asked.options, pest) };
  const sightings = await sightingsInWindow(request);
  // Refused before any row exists, so an over-budget request leaves nothing behind.
  const work = assertCheckWithinBudget(request.options, sightings.length, fieldExtent(field.boundary, field.areaM2));
  const key = {
    fieldId: request.fieldId,
    pestId: request.pestId,
    windowFrom: request.from ?? null,
    windowTo: request.to ?? null,
    optionsHash: optionsHash(request.options),
    sightingsHash: sightingsHash(sightings),
    engineVersion: ENGINE_VERSION,
  };

  const stored = await checks.findCheckWithInputs(key);
  if (stored && stored.status !== 'failed' && !isStale(stored)) return { json: await checkAnswerJson(actor, stored.id, true), happened: 'stored' };

  let check: checks.PatternCheckRow;
  if (stored) {
    // A failed (or abandoned) check is tried again under the same id rather than answering with the old failure.
    check = await checks.requeueCheck(stored.id, actor.id);
  } else {
    const inserted = await checks.insertCheck({
      ...key,
      organisationId: actor.organisationId,
      options: request.options as unknown as Record<string, unknown>,
      sightingIds: sightings.map((s) => s.id),
      createdBy: actor.id,
    });
    // Two identical requests at once: the second finds the first's row.
    if (!inserted) return { json: await checkAnswerJson(actor, (await checks.findCheckWithInputs(key))!.id, true), happened: 'stored' };
    check = (await checks.findCheck(inserted))!;
    await recordAudit(actor, 'run', 'pattern-check', check.id, { fieldId: key.fieldId, pestId: key.pestId, sightings: sightings.length });
  }

  if (checkWork(request.options, sightings.length) <= INLINE_WORK_LIMIT && work.total <= INLINE_WORK_UNITS) {
    const inputError = await runStoredCheck(check.id);
    if (inputError) {
      // Input the engine cannot analyse (e.g. a zero area basis) is the adviser's to fix: answer it, keep no row.
      await checks.deleteCheck(check.id);
      throw badRequest(inputError.message);
    }
    return { json: await checkAnswerJson(actor, check.id, false), happened: 'computed' };
  }
  await enqueueCheck(check.id);
  return { json: await checkAnswerJson(actor, check.id, false), happened: 'queued' };
}

/** The stored figures as text (less the parts with routes of their own): spliced into the answer, never parsed on this thread. */
async function storedFiguresText(id: string): Promise<string | null> {
  return checks.findCheckLeanFiguresText(id);
}

/** `{ check }` as JSON, its result the stored text itself. */
async function checkAnswerJson(actor: Actor, id: string, reused?: boolean): Promise<string> {
  const check = await checks.findCheckInOrganisationButResult(actor.organisationId, id);
  if (!check) throw notFound('That pattern check');
  const { result: _omitted, ...view } = await present(check, reused);
  const figures = await storedFiguresText(id);
  return `{"check":${JSON.stringify(view).slice(0, -1)},"result":${figures ?? 'null'}}}`;
}

/**
 * The GET answer `{ check }` for one check, already serialised. A done check's bytes come from the cache,
 * keyed by what could change them; a cheap scoped look-up still runs first, so a deleted check is gone at once.
 */
export async function getCheckAnswer(actor: Actor, id: string): Promise<SerialisedAnswer> {
  const stored = await checks.findCheckAnswerVersion(actor.organisationId, id);
  if (!stored) throw notFound('That pattern check');
  const build = () => checkAnswerJson(actor, id);
  return stored.status === 'done' ? cachedAnswer(id, stored.version, build) : serialise(await build());
}

export async function summarise(rows: checks.CheckSummaryRow[]): Promise<CheckSummary[]> {
  const people = await peopleById(rows.map((c) => c.createdBy));
  return rows.map((check) => {
    const threshold = thresholdStatus(check.counts ?? [], check);
    return {
      id: check.id,
      fieldId: check.fieldId,
      pestId: check.pestId,
      pestName: check.pestName,
      from: check.windowFrom,
      to: check.windowTo,
      status: check.status,
      progress: check.progress,
      verdict: (check.verdict as SpreadVerdict | null) ?? null,
      n: check.n,
      engineVersion: check.engineVersion,
      createdBy: people.get(check.createdBy) ?? { id: check.createdBy, name: '' },
      createdAt: iso(check.createdAt)!,
      finishedAt: iso(check.finishedAt ?? null),
      options: check.options as AnalysisOptions,
      design: check.design,
      sightings: check.sightingCount,
      walkDates: check.walkDates,
      figures: {
        stops: check.stops,
        emptyStops: check.emptyStops,
        clarkEvansR: check.clarkEvansR,
        donnellyR: check.donnellyR,
        moranI: check.moranI,
        zoneCount: check.zoneCount,
        zonesM2: check.zonesM2,
        notScoutedM2: check.notScoutedM2,
      },
      threshold: {
        meanPerStop: threshold.meanPerStop,
        shareInfested: threshold.shareInfested,
        actionThreshold: check.actionThreshold,
        thresholdBasis: check.thresholdBasis,
        thresholdSource: check.thresholdSource,
        thresholdConfirmed: check.thresholdConfirmed,
        countUnit: check.countUnit,
        status: threshold.status,
      },
    };
  });
}

export async function fieldCheckSummaries(organisationId: string, fieldId: string, pestId?: string): Promise<CheckSummary[]> {
  // Summaries leave the (large) result out of the query: only its scalars are read from it.
  return summarise(await checks.listCheckSummariesOfField(organisationId, fieldId, pestId));
}

/** A check's page key: creation time, id. */
const CHECK_KEY_PARTS: CursorPart[] = ['timestamp', 'uuid'];

/** One page of a field's checks the actor may see, newest first (one pest's when asked). */
export async function listFieldChecks(actor: Actor, fieldId: string, query: FieldChecksQuery): Promise<FieldChecksResponse> {
  const after = query.cursor ? decodePageCursor(query.cursor, CHECK_KEY_PARTS) : undefined;
  await findVisibleField(actor, fieldId);
  const rows = await checks.listCheckSummariesOfField(actor.organisationId, fieldId, query.pestId, { after, limit: query.limit + 1 });
  const { page, nextCursor } = pageOf(rows, query.limit, (row) => row.pageKey);
  return { checks: await summarise(page), limit: query.limit, nextCursor };
}
