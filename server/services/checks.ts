// Pattern checks: run one (or find the identical stored one), fetch one, list a field's checks.
import { Op, QueryTypes } from 'sequelize';
import { sequelize } from '../db.ts';
import { PatternCheck } from '../models/pattern-check.ts';
import { Pest } from '../models/pest.ts';
import { User } from '../models/user.ts';
import type { Actor } from '../auth/passport.ts';
import { badRequest, notFound } from '../errors.ts';
import { findVisibleField } from './fields.ts';
import { findPest } from './pests.ts';
import { recordAudit } from './audit.ts';
import { checkWork, INLINE_WORK_LIMIT, optionsHash, runStoredCheck, sightingsHash, sightingsInWindow } from './check-runner.ts';
import { enqueueCheck } from '../jobs/check-worker.ts';
import { ENGINE_VERSION } from '../../shared/analysis/version.ts';
import type { AnalysisOptions } from '../../shared/analysis/options.ts';
import type { CheckRequest, CheckSummary, CheckView } from '../../shared/schemas/checks.ts';
import type { AnalysisResult } from '../../shared/analysis/analyse.ts';
import type { SpreadVerdict } from '../../shared/analysis/spread.ts';
import { cachedAnswer, serialise, type SerialisedAnswer } from './check-answer-cache.ts';
import { assertCheckWithinBudget, fieldExtent, INLINE_WORK_UNITS } from './check-budget.ts';

const iso = (d: Date | null) => (d ? new Date(d).toISOString() : null);

async function peopleById(ids: string[]) {
  const users = await User.findAll({ where: { id: { [Op.in]: [...new Set(ids)] } }, attributes: ['id', 'name'] });
  return new Map(users.map((u) => [u.id, { id: u.id, name: u.name }]));
}

function presentCheck(check: PatternCheck, people: Map<string, { id: string; name: string }>, reused?: boolean): CheckView {
  return {
    id: check.id,
    fieldId: check.fieldId,
    pestId: check.pestId,
    from: check.windowFrom,
    to: check.windowTo,
    options: check.options as AnalysisOptions,
    sightingIds: check.sightingIds,
    sightingsHash: check.sightingsHash,
    engineVersion: check.engineVersion,
    status: check.status,
    progress: check.progress,
    // The stored JSONB is analyse()'s answer, exactly as it returned it.
    result: (check.result as AnalysisResult | null) ?? null,
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

const present = async (check: PatternCheck, reused?: boolean) => presentCheck(check, await peopleById([check.createdBy]), reused);

/** The planar option is for files already in metres; sightings in the database are always longitude/latitude. */
function assertGeographic(options: AnalysisOptions) {
  if (options.planar)
    throw badRequest('Option planar: stored sightings are longitude/latitude, so a field check cannot use planar coordinates.', {
      'options.planar': 'Leave planar off for field checks.',
    });
}

/** A queued or running check untouched this long lost its worker (a process stopped mid-run); run it again. */
const STALE_AFTER_MS = 30 * 60 * 1000;
const isStale = (check: PatternCheck) =>
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
export function withPestThreshold(options: AnalysisOptions, pest: Pick<Pest, 'actionThreshold' | 'thresholdBasis' | 'countUnit'>): AnalysisOptions {
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

  const stored = await PatternCheck.findOne({ where: key });
  if (stored && stored.status !== 'failed' && !isStale(stored)) return { json: await checkAnswerJson(actor, stored.id, true), happened: 'stored' };

  let check: PatternCheck;
  if (stored) {
    // A failed (or abandoned) check is tried again under the same id rather than answering with the old failure.
    check = await stored.update({ status: 'queued', progress: 0, error: null, finishedAt: null, createdBy: actor.id });
  } else {
    const [inserted] = await sequelize.query<{ id: string }>(
      `INSERT INTO pattern_checks (organisation_id, field_id, pest_id, window_from, window_to, options, options_hash, sighting_ids, sightings_hash, engine_version, created_by)
       VALUES (:org, :fieldId, :pestId, :windowFrom, :windowTo, CAST(:options AS jsonb), :optionsHash, CAST(:sightingIds AS uuid[]), :sightingsHash, :engineVersion, :createdBy)
       ON CONFLICT DO NOTHING RETURNING id`,
      {
        replacements: {
          ...key,
          org: actor.organisationId,
          options: JSON.stringify(request.options),
          sightingIds: `{${sightings.map((s) => s.id).join(',')}}`,
          createdBy: actor.id,
        },
        type: QueryTypes.SELECT,
      },
    );
    // Two identical requests at once: the second finds the first's row.
    if (!inserted)
      return { json: await checkAnswerJson(actor, (await PatternCheck.findOne({ where: key, attributes: ['id'] }))!.id, true), happened: 'stored' };
    check = (await PatternCheck.findByPk(inserted.id))!;
    await recordAudit(actor, 'run', 'pattern-check', check.id, { fieldId: key.fieldId, pestId: key.pestId, sightings: sightings.length });
  }

  if (checkWork(request.options, sightings.length) <= INLINE_WORK_LIMIT && work.total <= INLINE_WORK_UNITS) {
    const inputError = await runStoredCheck(check.id);
    if (inputError) {
      // Input the engine cannot analyse (e.g. a zero area basis) is the adviser's to fix: answer it, keep no row.
      await PatternCheck.destroy({ where: { id: check.id } });
      throw badRequest(inputError.message);
    }
    return { json: await checkAnswerJson(actor, check.id, false), happened: 'computed' };
  }
  await enqueueCheck(check.id);
  return { json: await checkAnswerJson(actor, check.id, false), happened: 'queued' };
}

/** One check of the actor's organisation (another organisation's id simply is not found). */
export async function getCheck(actor: Actor, id: string): Promise<CheckView> {
  const check = await PatternCheck.findOne({ where: { id, organisationId: actor.organisationId } });
  if (!check) throw notFound('That pattern check');
  return present(check);
}

/** The stored figures as text: spliced into the answer as they are, never parsed and re-serialised on this thread. */
async function storedFiguresText(id: string): Promise<string | null> {
  const [row] = await sequelize.query<{ figures: string | null }>('SELECT result::text AS figures FROM pattern_checks WHERE id = :id', {
    replacements: { id },
    type: QueryTypes.SELECT,
  });
  return row?.figures ?? null;
}

/** `{ check }` as JSON, its result the stored text itself. */
async function checkAnswerJson(actor: Actor, id: string, reused?: boolean): Promise<string> {
  const attributes = Object.keys(PatternCheck.getAttributes()).filter((name) => name !== 'result');
  const check = await PatternCheck.findOne({ where: { id, organisationId: actor.organisationId }, attributes });
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
  const [stored] = await sequelize.query<{ status: string; version: string }>(
    `SELECT c.status, concat_ws('|', c.updated_at::text, c.finished_at::text, u.name) AS version
       FROM pattern_checks c LEFT JOIN users u ON u.id = c.created_by
      WHERE c.id = :id AND c.organisation_id = :org`,
    { replacements: { id, org: actor.organisationId }, type: QueryTypes.SELECT },
  );
  if (!stored) throw notFound('That pattern check');
  const build = () => checkAnswerJson(actor, id);
  return stored.status === 'done' ? cachedAnswer(id, stored.version, build) : serialise(await build());
}

type SpreadOf = { spread?: { verdict?: SpreadVerdict }; n?: number };

export async function summarise(checks: PatternCheck[]): Promise<CheckSummary[]> {
  const people = await peopleById(checks.map((c) => c.createdBy));
  const pests = await Pest.findAll({ where: { id: { [Op.in]: [...new Set(checks.map((c) => c.pestId))] } }, attributes: ['id', 'name'] });
  const pestNames = new Map(pests.map((p) => [p.id, p.name]));
  return checks.map((check) => {
    const result = check.result as SpreadOf | null;
    return {
      id: check.id,
      fieldId: check.fieldId,
      pestId: check.pestId,
      pestName: pestNames.get(check.pestId) ?? '',
      from: check.windowFrom,
      to: check.windowTo,
      status: check.status,
      progress: check.progress,
      verdict: result?.spread?.verdict ?? null,
      n: result?.n ?? null,
      engineVersion: check.engineVersion,
      createdBy: people.get(check.createdBy) ?? { id: check.createdBy, name: '' },
      createdAt: iso(check.createdAt)!,
      finishedAt: iso(check.finishedAt ?? null),
    };
  });
}

// Summaries leave the (large) result out of the query: only the verdict and n are read from it.
const summaryAttributes = [
  'id',
  'fieldId',
  'pestId',
  'windowFrom',
  'windowTo',
  'status',
  'progress',
  'engineVersion',
  'createdBy',
  'createdAt',
  'finishedAt',
] as const;

export async function fieldCheckSummaries(fieldId: string, pestId?: string): Promise<CheckSummary[]> {
  const checks = await PatternCheck.findAll({
    where: { fieldId, ...(pestId ? { pestId } : {}) },
    attributes: [
      ...summaryAttributes,
      [sequelize.literal(`jsonb_build_object('n', result->'n', 'spread', jsonb_build_object('verdict', result->'spread'->'verdict'))`), 'result'],
    ],
    order: [['createdAt', 'DESC']],
  });
  return summarise(checks);
}

export async function listFieldChecks(actor: Actor, fieldId: string, pestId?: string): Promise<CheckSummary[]> {
  await findVisibleField(actor, fieldId);
  return fieldCheckSummaries(fieldId, pestId);
}
