// The adviser's home list: fields that need a look, for the adviser's own organisation only.
import type { Actor } from '../auth/passport.ts';
import { thresholdStatus } from '../../shared/thresholds/threshold-status.ts';
import type { AttentionField, AttentionResponse } from '../../shared/schemas/checks.ts';
import { listUnacknowledgedNotices } from './notice-reading.ts';
import { listWaitingGrowerQuestions } from './notice-questions.ts';
import { listUncheckedSightings, type UncheckedRow } from '../queries/sightings.ts';
import { listClusteredLatestChecks, type LatestCheckRow } from '../queries/pattern-checks.ts';

/** Latest finished check per field and pest whose verdict is clustered, with the counts of its sightings. */
async function clusteredLatestChecks(organisationId: string): Promise<LatestCheckRow[]> {
  return listClusteredLatestChecks(organisationId);
}

/** Field and pest pairs with sightings added or edited after their latest check (or never checked). */
async function uncheckedSightings(organisationId: string): Promise<UncheckedRow[]> {
  return listUncheckedSightings(organisationId);
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
