// The adviser's home list: fields that need a look, for the adviser's own organisation only.
import { QueryTypes } from 'sequelize';
import { sequelize } from '../db.ts';
import type { Actor } from '../auth/passport.ts';
import { thresholdStatus } from '../../shared/thresholds/threshold-status.ts';
import type { ThresholdBasis } from '../../shared/schemas/pests.ts';
import type { AttentionField, AttentionResponse } from '../../shared/schemas/checks.ts';
import { listUnacknowledgedNotices } from './notice-reading.ts';
import { listWaitingGrowerQuestions } from './notice-questions.ts';
import { liveSighting } from '../queries/sightings.ts';

interface LatestCheckRow {
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
  counts: Array<number | null> | null;
}

/** Latest finished check per field and pest whose verdict is clustered, with the counts of its sightings. */
async function clusteredLatestChecks(organisationId: string): Promise<LatestCheckRow[]> {
  return sequelize.query<LatestCheckRow>(
    `WITH latest AS (
       SELECT DISTINCT ON (c.field_id, c.pest_id) c.id, c.field_id, c.pest_id, c.sighting_ids, c.result->'spread'->>'verdict' AS verdict
         FROM pattern_checks c
        WHERE c.organisation_id = :org AND c.status = 'done'
        ORDER BY c.field_id, c.pest_id, c.created_at DESC
     )
     SELECT l.id AS "checkId", f.id AS "fieldId", f.name AS "fieldName", fa.name AS "farmName",
            p.id AS "pestId", p.name AS "pestName", p.count_unit AS "countUnit", p.action_threshold AS "actionThreshold",
            p.threshold_basis AS "thresholdBasis", p.threshold_source AS "thresholdSource",
            (SELECT array_agg(s.count ORDER BY s.id) FROM sightings s WHERE s.id = ANY(l.sighting_ids) AND s.deleted_at IS NULL) AS counts
       FROM latest l JOIN fields f ON f.id = l.field_id JOIN farms fa ON fa.id = f.farm_id JOIN pests p ON p.id = l.pest_id
      WHERE l.verdict = 'clustered'
      ORDER BY fa.name, f.name, p.name`,
    { replacements: { org: organisationId }, type: QueryTypes.SELECT },
  );
}

interface UncheckedRow {
  fieldId: string;
  fieldName: string;
  farmName: string;
  pestId: string;
  pestName: string;
  actionThreshold: number;
  thresholdSource: string;
  checkId: string | null;
  newSightings: number;
}

/** Field and pest pairs with sightings added or edited after their latest check (or never checked). */
async function uncheckedSightings(organisationId: string): Promise<UncheckedRow[]> {
  return sequelize.query<UncheckedRow>(
    `WITH latest AS (
       SELECT DISTINCT ON (c.field_id, c.pest_id) c.id, c.field_id, c.pest_id, c.created_at
         FROM pattern_checks c
        WHERE c.organisation_id = :org AND c.status <> 'failed'
        ORDER BY c.field_id, c.pest_id, c.created_at DESC
     )
     SELECT f.id AS "fieldId", f.name AS "fieldName", fa.name AS "farmName", p.id AS "pestId", p.name AS "pestName",
            p.action_threshold AS "actionThreshold", p.threshold_source AS "thresholdSource", l.id AS "checkId",
            count(*) AS "newSightings"
       FROM sightings s
       JOIN fields f ON f.id = s.field_id
       JOIN farms fa ON fa.id = f.farm_id
       JOIN pests p ON p.id = s.pest_id
       LEFT JOIN latest l ON l.field_id = s.field_id AND l.pest_id = s.pest_id
      WHERE s.organisation_id = :org AND ${liveSighting('s')}
        AND (l.id IS NULL OR greatest(s.created_at, s.updated_at) > l.created_at)
      GROUP BY f.id, fa.name, p.id, l.id
      ORDER BY fa.name, f.name, p.name`,
    { replacements: { org: organisationId }, type: QueryTypes.SELECT },
  );
}

const figure = (v: number) => (Math.abs(v) >= 10 ? v.toFixed(1) : v.toFixed(2));

export async function fieldsNeedingAttention(actor: Actor): Promise<AttentionResponse> {
  const clusteredAboveThreshold: AttentionField[] = [];
  for (const row of await clusteredLatestChecks(actor.organisationId)) {
    const status = thresholdStatus(row.counts ?? [], row);
    // The point estimate decides here; the field page shows the interval and whether it is too close to call.
    const estimate = row.thresholdBasis === 'incidence' ? status.shareInfested : status.meanPerStop;
    if (estimate === null || !(estimate > row.actionThreshold)) continue;
    const measured = row.thresholdBasis === 'incidence' ? `${Math.round(estimate * 100)} % of stops infested` : `mean ${figure(estimate)} ${row.countUnit}`;
    clusteredAboveThreshold.push({
      fieldId: row.fieldId,
      fieldName: row.fieldName,
      farmName: row.farmName,
      pestId: row.pestId,
      pestName: row.pestName,
      reason: 'clustered-above-threshold',
      message: `${row.pestName} is clustered in ${row.fieldName} and above its action threshold (${measured}; threshold ${row.actionThreshold}, ${row.thresholdSource}).`,
      checkId: row.checkId,
      meanPerStop: status.meanPerStop,
      actionThreshold: row.actionThreshold,
      thresholdSource: row.thresholdSource,
      newSightings: 0,
    });
  }
  const notYetChecked: AttentionField[] = (await uncheckedSightings(actor.organisationId)).map((row) => ({
    fieldId: row.fieldId,
    fieldName: row.fieldName,
    farmName: row.farmName,
    pestId: row.pestId,
    pestName: row.pestName,
    reason: 'not-yet-checked',
    message: row.checkId
      ? `${row.newSightings} ${row.pestName} sighting${row.newSightings === 1 ? '' : 's'} in ${row.fieldName} added or changed since the last pattern check.`
      : `${row.newSightings} ${row.pestName} sighting${row.newSightings === 1 ? '' : 's'} in ${row.fieldName} not yet checked.`,
    checkId: row.checkId,
    meanPerStop: null,
    actionThreshold: row.actionThreshold,
    thresholdSource: row.thresholdSource,
    newSightings: row.newSightings,
  }));
  // Sent notices that no grower has acknowledged yet.
  const unacknowledgedNotices = await listUnacknowledgedNotices(actor);
  // Grower questions on notices that no adviser has answered yet.
  const growerQuestions = await listWaitingGrowerQuestions(actor);
  return { clusteredAboveThreshold, notYetChecked, unacknowledgedNotices, growerQuestions };
}
