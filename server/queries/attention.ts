// What the adviser's attention list reads: latest checks, their patches and zones, accepted zones, fields overdue a walk.
import { QueryTypes } from 'sequelize';
import { sequelize } from '../db.ts';
import { readsFromPrimary } from '../db-freshness.ts';
import type { ThresholdBasis } from '../../shared/schemas/pests.ts';
import { liveSighting } from './sightings.ts';

export interface LatestCheckRow {
  checkId: string;
  fieldId: string;
  fieldName: string;
  farmName: string;
  pestId: string;
  pestName: string;
  countUnit: string;
  actionThreshold: number;
  thresholdBasis: ThresholdBasis;
  thresholdSource: string;
  thresholdConfirmed: boolean;
  verdict: string | null;
  counts: Array<number | null> | null;
  /** Mean count per stop of each zone the check proposed, and of each hot patch (Gi*) it found. */
  zoneMeans: number[];
  patchMeans: number[];
}

/** The latest finished check per field and pest, whatever its verdict, with its sightings' counts. */
export async function selectLatestDoneChecks(organisationId: string): Promise<LatestCheckRow[]> {
  return sequelize.query<LatestCheckRow>(
    `WITH latest AS (
       SELECT DISTINCT ON (c.field_id, c.pest_id) c.id, c.field_id, c.pest_id, c.sighting_ids, c.result
         FROM pattern_checks c
        WHERE c.organisation_id = :org AND c.status = 'done'
        ORDER BY c.field_id, c.pest_id, c.created_at DESC
     )
     SELECT l.id AS "checkId", f.id AS "fieldId", f.name AS "fieldName", fa.name AS "farmName",
            p.id AS "pestId", p.name AS "pestName", p.count_unit AS "countUnit", p.action_threshold AS "actionThreshold",
            p.threshold_basis AS "thresholdBasis", p.threshold_source AS "thresholdSource", p.threshold_confirmed AS "thresholdConfirmed",
            l.result->'spread'->>'verdict' AS verdict,
            (SELECT array_agg(s.count ORDER BY s.id) FROM sightings s WHERE s.id = ANY(l.sighting_ids) AND s.deleted_at IS NULL) AS counts,
            ARRAY(SELECT (z->'properties'->>'meanCount')::float8 FROM jsonb_array_elements(coalesce(l.result->'zones'->'features', '[]')) z
                   WHERE z->'properties' ? 'meanCount') AS "zoneMeans",
            ARRAY(SELECT (h->>'meanCount')::float8 FROM jsonb_array_elements(coalesce(l.result->'counts'->'hotPatches', '[]')) h
                   WHERE h ? 'meanCount') AS "patchMeans"
       FROM latest l JOIN fields f ON f.id = l.field_id JOIN farms fa ON fa.id = f.farm_id JOIN pests p ON p.id = l.pest_id AND p.active
      ORDER BY fa.name, f.name, p.name`,
    { replacements: { org: organisationId }, type: QueryTypes.SELECT, useMaster: readsFromPrimary() },
  );
}

export interface AcceptedZoneMeanRow {
  zoneSetId: string;
  checkId: string | null;
  fieldId: string;
  pestId: string;
  label: string;
  /** Mean count of the pest's live sightings inside the stored zone (empty stops count as 0); null when none lie inside. */
  meanCount: number | null;
}

/** Each zone of the accepted zone sets, with the mean count of the live sightings inside it as stored (clipped). */
export async function selectAcceptedZoneMeans(organisationId: string): Promise<AcceptedZoneMeanRow[]> {
  return sequelize.query<AcceptedZoneMeanRow>(
    `SELECT zs.id AS "zoneSetId", zs.check_id AS "checkId", zs.field_id AS "fieldId", zs.pest_id AS "pestId", z.label,
            (SELECT avg(s.count) FROM sightings s
              WHERE s.field_id = zs.field_id AND s.pest_id = zs.pest_id AND ${liveSighting('s')} AND ST_Covers(z.geometry, s.position)) AS "meanCount"
       FROM zone_sets zs JOIN zones z ON z.zone_set_id = zs.id
      WHERE zs.organisation_id = :org AND zs.status = 'accepted'
      ORDER BY zs.id, z.position`,
    { replacements: { org: organisationId }, type: QueryTypes.SELECT, useMaster: readsFromPrimary() },
  );
}

export interface UncheckedRow {
  fieldId: string;
  fieldName: string;
  farmName: string;
  pestId: string;
  pestName: string;
  actionThreshold: number;
  thresholdBasis: ThresholdBasis;
  countUnit: string;
  thresholdSource: string;
  thresholdConfirmed: boolean;
  checkId: string | null;
  newSightings: number;
  emptyStops: number;
}

/** Field and pest pairs with sightings added or edited after their latest check (or never checked). */
export async function selectUncheckedSightings(organisationId: string): Promise<UncheckedRow[]> {
  return sequelize.query<UncheckedRow>(
    `WITH latest AS (
       SELECT DISTINCT ON (c.field_id, c.pest_id) c.id, c.field_id, c.pest_id, c.created_at
         FROM pattern_checks c
        WHERE c.organisation_id = :org AND c.status <> 'failed'
        ORDER BY c.field_id, c.pest_id, c.created_at DESC
     )
     SELECT f.id AS "fieldId", f.name AS "fieldName", fa.name AS "farmName", p.id AS "pestId", p.name AS "pestName",
            p.action_threshold AS "actionThreshold", p.threshold_basis AS "thresholdBasis", p.count_unit AS "countUnit",
            p.threshold_source AS "thresholdSource", p.threshold_confirmed AS "thresholdConfirmed", l.id AS "checkId",
            count(*)::int AS "newSightings", count(*) FILTER (WHERE s.photo_id IS NULL AND s.count = 0)::int AS "emptyStops"
       FROM sightings s
       JOIN fields f ON f.id = s.field_id
       JOIN farms fa ON fa.id = f.farm_id
       JOIN pests p ON p.id = s.pest_id
       LEFT JOIN latest l ON l.field_id = s.field_id AND l.pest_id = s.pest_id
      WHERE s.organisation_id = :org AND ${liveSighting('s')}
        AND (l.id IS NULL OR greatest(s.created_at, s.updated_at) > l.created_at)
      GROUP BY f.id, fa.name, p.id, l.id
      ORDER BY fa.name, f.name, p.name`,
    { replacements: { org: organisationId }, type: QueryTypes.SELECT, useMaster: readsFromPrimary() },
  );
}

export interface OverdueRow {
  fieldId: string;
  fieldName: string;
  farmName: string;
  pestId: string;
  pestName: string;
  rescoutDays: number;
  rescoutSource: string;
  rescoutConfirmed: boolean;
  lastWalkedOn: string;
  daysSinceWalk: number;
  checkId: string | null;
}

/** Field and pest pairs (the pest was scouted there) whose field's latest walk is older than the pest's re-scout interval. */
export async function selectOverdueRescouts(organisationId: string): Promise<OverdueRow[]> {
  return sequelize.query<OverdueRow>(
    `WITH scouted AS (
       SELECT DISTINCT s.field_id, s.pest_id FROM sightings s WHERE s.organisation_id = :org AND ${liveSighting('s')}
     ), last_walk AS (
       SELECT w.field_id, max(w.walked_on) AS walked_on FROM walks w WHERE w.organisation_id = :org GROUP BY w.field_id
     )
     SELECT f.id AS "fieldId", f.name AS "fieldName", fa.name AS "farmName", p.id AS "pestId", p.name AS "pestName",
            p.rescout_days AS "rescoutDays", p.rescout_source AS "rescoutSource", p.rescout_confirmed AS "rescoutConfirmed",
            to_char(lw.walked_on, 'YYYY-MM-DD') AS "lastWalkedOn", (current_date - lw.walked_on)::int AS "daysSinceWalk",
            (SELECT c.id FROM pattern_checks c WHERE c.field_id = f.id AND c.pest_id = p.id AND c.status = 'done'
              ORDER BY c.created_at DESC LIMIT 1) AS "checkId"
       FROM scouted sc
       JOIN last_walk lw ON lw.field_id = sc.field_id
       JOIN fields f ON f.id = sc.field_id
       JOIN farms fa ON fa.id = f.farm_id
       JOIN pests p ON p.id = sc.pest_id AND p.active
      WHERE current_date - lw.walked_on > p.rescout_days
      ORDER BY current_date - lw.walked_on - p.rescout_days DESC, fa.name, f.name, p.name`,
    { replacements: { org: organisationId }, type: QueryTypes.SELECT, useMaster: readsFromPrimary() },
  );
}

export interface LatestWalkStopsRow {
  fieldId: string;
  fieldName: string;
  farmName: string;
  pestId: string;
  pestName: string;
  countUnit: string;
  actionThreshold: number;
  thresholdBasis: ThresholdBasis;
  thresholdSource: string;
  thresholdConfirmed: boolean;
  walkId: string;
  walkedOn: string;
  /** Every live stop of that walk for the pest: empty stops are 0, a sighting without a count is null. */
  counts: Array<number | null>;
  /** The field and pest's latest finished check, if any. */
  checkId: string | null;
}

/** For each field and pest, the stops of the latest walk that recorded the pest (found or empty stops). */
export async function selectLatestWalkStops(organisationId: string): Promise<LatestWalkStopsRow[]> {
  return sequelize.query<LatestWalkStopsRow>(
    `WITH latest AS (
       SELECT DISTINCT ON (s.field_id, s.pest_id) s.field_id, s.pest_id, w.id AS walk_id, w.walked_on
         FROM sightings s JOIN walks w ON w.id = s.walk_id
        WHERE s.organisation_id = :org AND ${liveSighting('s')}
        ORDER BY s.field_id, s.pest_id, w.walked_on DESC, w.created_at DESC
     )
     SELECT f.id AS "fieldId", f.name AS "fieldName", fa.name AS "farmName", p.id AS "pestId", p.name AS "pestName",
            p.count_unit AS "countUnit", p.action_threshold AS "actionThreshold", p.threshold_basis AS "thresholdBasis",
            p.threshold_source AS "thresholdSource", p.threshold_confirmed AS "thresholdConfirmed", l.walk_id AS "walkId", to_char(l.walked_on, 'YYYY-MM-DD') AS "walkedOn",
            (SELECT array_agg(s.count ORDER BY s.id) FROM sightings s
              WHERE s.walk_id = l.walk_id AND s.pest_id = l.pest_id AND ${liveSighting('s')}) AS counts,
            (SELECT c.id FROM pattern_checks c WHERE c.field_id = f.id AND c.pest_id = p.id AND c.status = 'done'
              ORDER BY c.created_at DESC LIMIT 1) AS "checkId"
       FROM latest l JOIN fields f ON f.id = l.field_id JOIN farms fa ON fa.id = f.farm_id JOIN pests p ON p.id = l.pest_id
      ORDER BY fa.name, f.name, p.name`,
    { replacements: { org: organisationId }, type: QueryTypes.SELECT, useMaster: readsFromPrimary() },
  );
}
