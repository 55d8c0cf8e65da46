import type { CheckStatus } from '../../shared/schemas/checks.ts';
import { execute, selectRow, selectRows, type InTransaction } from './sql.ts';

/** One pattern check: field × pest × date window, with the exact inputs that reproduce it. */
export interface PatternCheckRow {
  id: string;
  organisationId: string;
  fieldId: string;
  pestId: string;
  /** YYYY-MM-DD, or null for an open window. */
  windowFrom: string | null;
  windowTo: string | null;
  options: Record<string, unknown>;
  optionsHash: string;
  sightingIds: string[];
  sightingsHash: string;
  engineVersion: string;
  status: CheckStatus;
  progress: number;
  /** Left out (undefined) where the columns read leave it out. */
  result?: Record<string, unknown> | null;
  error: string | null;
  createdBy: string;
  createdAt: Date;
  updatedAt: Date;
  finishedAt: Date | null;
  /** From the finished result: the design, the same-stop merges and how much of the field is not scouted (its polygons are read by checkPartSql). */
  design: 'stops' | 'whole-field' | null;
  stopMerges: unknown[] | null;
  notScoutedM2: number | null;
}

const COLUMNS_BUT_RESULT = `id, organisation_id AS "organisationId", field_id AS "fieldId", pest_id AS "pestId", window_from AS "windowFrom",
  window_to AS "windowTo", options, options_hash AS "optionsHash", sighting_ids AS "sightingIds", sightings_hash AS "sightingsHash",
  engine_version AS "engineVersion", status, progress, error, created_by AS "createdBy", created_at AS "createdAt", updated_at AS "updatedAt",
  finished_at AS "finishedAt", design, stop_merges AS "stopMerges", not_scouted_m2 AS "notScoutedM2"`;
const ALL_COLUMNS = `${COLUMNS_BUT_RESULT}, result`;

export const findCheck = (id: string, options: InTransaction = {}) =>
  selectRow<PatternCheckRow>(`SELECT ${ALL_COLUMNS} FROM pattern_checks WHERE id = :id`, { id }, options);

export const findCheckInOrganisation = (organisationId: string, id: string) =>
  selectRow<PatternCheckRow>(`SELECT ${ALL_COLUMNS} FROM pattern_checks WHERE id = :id AND organisation_id = :org`, { id, org: organisationId });

/** The check without its (large) result. */
export const findCheckInOrganisationButResult = (organisationId: string, id: string) =>
  selectRow<PatternCheckRow>(`SELECT ${COLUMNS_BUT_RESULT} FROM pattern_checks WHERE id = :id AND organisation_id = :org`, { id, org: organisationId });

export interface CheckInputs {
  fieldId: string;
  pestId: string;
  windowFrom: string | null;
  windowTo: string | null;
  optionsHash: string;
  sightingsHash: string;
  engineVersion: string;
}

// An open end of the window is NULL, which `=` never matches.
const sameInputs = (key: CheckInputs) =>
  `field_id = :fieldId AND pest_id = :pestId AND ${key.windowFrom === null ? 'window_from IS NULL' : 'window_from = :windowFrom'}
   AND ${key.windowTo === null ? 'window_to IS NULL' : 'window_to = :windowTo'}
   AND options_hash = :optionsHash AND sightings_hash = :sightingsHash AND engine_version = :engineVersion`;

/** The stored check with exactly these inputs, if any. */
export const findCheckWithInputs = (key: CheckInputs) =>
  selectRow<PatternCheckRow>(`SELECT ${ALL_COLUMNS} FROM pattern_checks WHERE ${sameInputs(key)} LIMIT 1`, { ...key });

/** Stores a new queued check; undefined when an identical one got there first. */
export const insertCheck = async (
  check: CheckInputs & { organisationId: string; options: Record<string, unknown>; sightingIds: string[]; createdBy: string },
) =>
  (
    await selectRow<{ id: string }>(
      `INSERT INTO pattern_checks (organisation_id, field_id, pest_id, window_from, window_to, options, options_hash, sighting_ids, sightings_hash, engine_version, created_by)
       VALUES (:org, :fieldId, :pestId, :windowFrom, :windowTo, CAST(:options AS jsonb), :optionsHash, CAST(:sightingIds AS uuid[]), :sightingsHash, :engineVersion, :createdBy)
       ON CONFLICT DO NOTHING RETURNING id`,
      {
        fieldId: check.fieldId,
        pestId: check.pestId,
        windowFrom: check.windowFrom,
        windowTo: check.windowTo,
        optionsHash: check.optionsHash,
        sightingsHash: check.sightingsHash,
        engineVersion: check.engineVersion,
        org: check.organisationId,
        options: JSON.stringify(check.options),
        sightingIds: `{${check.sightingIds.join(',')}}`,
        createdBy: check.createdBy,
      },
    )
  )?.id;

/** A failed or abandoned check queued again under the same id, for this person. */
export const requeueCheck = async (id: string, createdBy: string) =>
  (await selectRow<PatternCheckRow>(
    `UPDATE pattern_checks SET status = 'queued', progress = 0, error = NULL, finished_at = NULL, created_by = :createdBy, updated_at = now()
      WHERE id = :id RETURNING ${ALL_COLUMNS}`,
    { id, createdBy },
  ))!;

export const deleteCheck = (id: string) => execute('DELETE FROM pattern_checks WHERE id = :id', { id });

export const markCheckRunning = (id: string) =>
  execute(`UPDATE pattern_checks SET status = 'running', progress = 0, updated_at = now() WHERE id = :id`, { id });

export const markCheckFailed = (id: string, error: string) =>
  execute(`UPDATE pattern_checks SET status = 'failed', error = :error, finished_at = now(), updated_at = now() WHERE id = :id`, { id, error });

/** Progress of a running check (a check no longer running keeps what it has). */
export const setRunningCheckProgress = (id: string, progress: number) =>
  execute(`UPDATE pattern_checks SET progress = :progress, updated_at = now() WHERE id = :id AND status = 'running'`, { id, progress });

export interface CheckDesign {
  design: string | null;
  stopMerges: unknown[] | null | undefined;
  notScoutedM2: number | null;
  /** RFC 7946 MultiPolygon text, or null. */
  scouted: string | null;
  notScouted: string | null;
}

// Polygons are stored on a grid of 1e-6 degrees (about 0.11 m north–south, 0.08 m east–west at 45°): well inside a
// phone's GPS error (metres under open sky), so no figure a scout could stand behind is lost. ST_ReducePrecision
// snaps and keeps the polygons valid, where rounding each corner alone can fold the thin necks between stop discs.
const POLYGON_GRID_DEGREES = 1e-6;
const storedPolygons = (param: string) =>
  `CASE WHEN CAST(:${param} AS text) IS NULL THEN NULL
        ELSE ST_Multi(ST_CollectionExtract(ST_ReducePrecision(ST_SetSRID(ST_GeomFromGeoJSON(CAST(:${param} AS text)), 4326), :grid), 3)) END`;

/** Stores the figures as the thread serialised them (JSON text) with the design facts and scouted-area polygons read from them. */
export const storeCheckResult = (checkId: string, figuresJson: string, design: CheckDesign, options: InTransaction = {}) =>
  execute(
    `UPDATE pattern_checks SET status = 'done', progress = 1, result = CAST(:figures AS jsonb), error = NULL, finished_at = now(), updated_at = now(),
              design = :design, stop_merges = CAST(:stopMerges AS jsonb), not_scouted_m2 = :notScoutedM2,
              scouted = ${storedPolygons('scouted')}, not_scouted = ${storedPolygons('notScouted')}
        WHERE id = :checkId`,
    {
      checkId,
      figures: figuresJson,
      design: design.design,
      stopMerges: JSON.stringify(design.stopMerges ?? []),
      notScoutedM2: design.notScoutedM2,
      scouted: design.scouted,
      notScouted: design.notScouted,
      grid: POLYGON_GRID_DEGREES,
    },
    options,
  );

/** The stored figures as text, never parsed. */
export const findCheckFiguresText = async (id: string) =>
  (await selectRow<{ figures: string | null }>('SELECT result::text AS figures FROM pattern_checks WHERE id = :id', { id }))?.figures ?? null;

// The answer's figures leave out what grows with the sightings (per-stop figures, quadrat cells; the scouted-area
// polygons are stored in columns of their own); each has a route of its own (checkPartSql) and only its size stays
// behind, so the page knows it exists.
const withoutCells = (key: string) =>
  `CASE WHEN jsonb_typeof(result->'${key}') = 'object'
     THEN (result->'${key}') - 'cells' || jsonb_build_object('cellCount', jsonb_array_length(result#>'{${key},cells}')) ELSE result->'${key}' END`;
const LEAN_FIGURES = `CASE WHEN jsonb_typeof(result) = 'object' THEN result || jsonb_build_object(
    'stops', (result->'stops') - 'merges',
    'scouted', CASE WHEN jsonb_typeof(result->'scouted') = 'object'
      THEN (result->'scouted') - 'scouted' - 'notScouted'
        || jsonb_build_object('notScoutedParts', coalesce(ST_NumGeometries(not_scouted), 0))
      ELSE result->'scouted' END,
    'quadrat', ${withoutCells('quadrat')},
    'stopsQuadrat', ${withoutCells('stopsQuadrat')},
    'counts', CASE WHEN jsonb_typeof(result->'counts') = 'object' THEN (result->'counts') - 'giStar' ELSE result->'counts' END
  ) ELSE result END`;

/** The stored figures as the check's answer carries them (LEAN_FIGURES), as text. */
export const findCheckLeanFiguresText = async (id: string) =>
  (await selectRow<{ figures: string | null }>(`SELECT (${LEAN_FIGURES})::text AS figures FROM pattern_checks WHERE id = :id`, { id }))?.figures ?? null;

/** The parts left out of the answer's figures, each read out of the stored result (or the check's row) as JSON text. */
const checkPartSql = {
  stops: `jsonb_build_object('merges', coalesce(result#>'{stops,merges}', '[]'), 'giStar', coalesce(result#>'{counts,giStar}', '[]'))`,
  quadrats: `jsonb_build_object('quadratCells', result#>'{quadrat,cells}', 'stopsQuadratCells', result#>'{stopsQuadrat,cells}')`,
  // From the geometry columns (migration 0018), at the 6 decimals they are stored to; a scouted check with every
  // part of the field scouted answers an empty not-scouted MultiPolygon, as the engine does.
  'scouted-area': `json_build_object('scouted', CAST(ST_AsGeoJSON(scouted, 6) AS json), 'notScouted', CASE WHEN scouted IS NULL THEN NULL
     ELSE coalesce(CAST(ST_AsGeoJSON(not_scouted, 6) AS json), CAST('{"type":"MultiPolygon","coordinates":[]}' AS json)) END)`,
  // The map draws only the part no stop speaks for: on its own it is half the bytes of the scouted area.
  'not-scouted-area': `json_build_object('notScouted', CASE WHEN scouted IS NULL THEN NULL
     ELSE coalesce(CAST(ST_AsGeoJSON(not_scouted, 6) AS json), CAST('{"type":"MultiPolygon","coordinates":[]}' AS json)) END)`,
  'sighting-ids': `jsonb_build_object('sightingIds', to_jsonb(sighting_ids))`,
} as const;
export type CheckPart = keyof typeof checkPartSql;

export const findCheckPartText = async (id: string, part: CheckPart) =>
  (await selectRow<{ part: string }>(`SELECT (${checkPartSql[part]})::text AS part FROM pattern_checks WHERE id = :id`, { id }))?.part ?? null;

/** Status and what the answer's bytes depend on (row times and the author's name). */
export const findCheckAnswerVersion = (organisationId: string, id: string) =>
  selectRow<{ status: string; version: string }>(
    `SELECT c.status, concat_ws('|', c.updated_at::text, c.finished_at::text, u.name) AS version
       FROM pattern_checks c LEFT JOIN users u ON u.id = c.created_by
      WHERE c.id = :id AND c.organisation_id = :org`,
    { id, org: organisationId },
  );

/** One row of a field's list of checks: the scalars read out of the stored result, never its figures. */
export interface CheckSummaryRow {
  id: string;
  fieldId: string;
  pestId: string;
  pestName: string;
  windowFrom: string | null;
  windowTo: string | null;
  status: CheckStatus;
  progress: number;
  engineVersion: string;
  options: Record<string, unknown>;
  design: 'stops' | 'whole-field' | null;
  createdBy: string;
  createdAt: Date;
  finishedAt: Date | null;
  sightingCount: number;
  /** The days of the walks whose sightings the check took in, oldest first. */
  walkDates: string[];
  verdict: string | null;
  n: number | null;
  stops: number | null;
  emptyStops: number | null;
  clarkEvansR: number | null;
  donnellyR: number | null;
  moranI: number | null;
  zoneCount: number | null;
  zonesM2: number | null;
  notScoutedM2: number | null;
  /** The counts of the check's sightings still live, by id: the mean per stop is taken from them. */
  counts: Array<number | null> | null;
  countUnit: string;
  actionThreshold: number;
  thresholdBasis: 'mean' | 'incidence';
  thresholdSource: string;
  thresholdConfirmed: boolean;
}

const resultNumber = (path: string) => `CAST(c.result #>> '{${path}}' AS float8)`;

/** Where a page of a field's checks starts and how long it is: strictly after the sort key (creation time, id), newest first. */
export interface CheckSummaryPage {
  after?: string[];
  limit: number;
}

/**
 * A field's checks in the organisation, newest first (one pest's when given), without their (large) results; one page
 * of them when `page` is given, each row with its sort key.
 */
export function listCheckSummariesOfField(organisationId: string, fieldId: string, pestId?: string, page?: CheckSummaryPage) {
  const where = ['c.organisation_id = :org', 'c.field_id = :fieldId'];
  if (pestId) where.push('c.pest_id = :pestId');
  if (page?.after) where.push('(c.created_at, c.id) < (CAST(:afterCreated AS timestamptz), CAST(:afterId AS uuid))');
  return selectRows<CheckSummaryRow & { pageKey: string[] }>(
    `SELECT c.id, c.field_id AS "fieldId", c.pest_id AS "pestId", p.name AS "pestName", to_char(c.window_from, 'YYYY-MM-DD') AS "windowFrom",
            to_char(c.window_to, 'YYYY-MM-DD') AS "windowTo", c.status, c.progress, c.engine_version AS "engineVersion", c.options, c.design,
            c.created_by AS "createdBy", c.created_at AS "createdAt", c.finished_at AS "finishedAt",
            cardinality(c.sighting_ids) AS "sightingCount",
            ARRAY(SELECT DISTINCT to_char(w.walked_on, 'YYYY-MM-DD') FROM sightings s JOIN walks w ON w.id = s.walk_id
                   WHERE s.id = ANY(c.sighting_ids) ORDER BY 1) AS "walkDates",
            c.result #>> '{spread,verdict}' AS verdict,
            ${resultNumber('n')} AS n, ${resultNumber('stops,count')} AS stops, ${resultNumber('stops,empty')} AS "emptyStops",
            ${resultNumber('nearestNeighbour,R')} AS "clarkEvansR", ${resultNumber('nearestNeighbour,donnelly,R')} AS "donnellyR",
            ${resultNumber('counts,moran,I')} AS "moranI",
            CASE WHEN jsonb_typeof(c.result #> '{zones,features}') = 'array' THEN jsonb_array_length(c.result #> '{zones,features}') END AS "zoneCount",
            (SELECT sum(CAST(z #>> '{properties,areaM2}' AS float8)) FROM jsonb_array_elements(
               CASE WHEN jsonb_typeof(c.result #> '{zones,features}') = 'array' THEN c.result #> '{zones,features}' ELSE CAST('[]' AS jsonb) END) z) AS "zonesM2",
            c.not_scouted_m2 AS "notScoutedM2",
            (SELECT array_agg(s.count ORDER BY s.id) FROM sightings s WHERE s.id = ANY(c.sighting_ids) AND s.deleted_at IS NULL) AS counts,
            p.count_unit AS "countUnit", p.action_threshold AS "actionThreshold", p.threshold_basis AS "thresholdBasis",
            p.threshold_source AS "thresholdSource", p.threshold_confirmed AS "thresholdConfirmed",
            ARRAY[c.created_at::text, c.id::text] AS "pageKey"
       FROM pattern_checks c JOIN pests p ON p.id = c.pest_id
      WHERE ${where.join(' AND ')}
      ORDER BY c.created_at DESC, c.id DESC${page ? ' LIMIT :limit' : ''}`,
    { org: organisationId, fieldId, pestId, afterCreated: page?.after?.[0], afterId: page?.after?.[1], limit: page?.limit },
  );
}

export const findCheckDensityState = (organisationId: string, checkId: string) =>
  selectRow<{ status: string; hasDensity: boolean }>(
    `SELECT status, (result->'density') IS NOT NULL AND jsonb_typeof(result->'density') = 'object' AS "hasDensity"
       FROM pattern_checks WHERE id = :checkId AND organisation_id = :org`,
    { checkId, org: organisationId },
  );
