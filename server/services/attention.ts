// The adviser's home list: every field and pest that needs action, for the adviser's own organisation only.
import type { Actor } from '../auth/passport.ts';
import { MIN_STOPS_TO_CALL, actionThresholdWords, thresholdStatus } from '../../shared/thresholds/threshold-status.ts';
import { stopsWord } from '../../shared/units/stops-summary.ts';
import { datesIn, type Dates } from '../../shared/dates/format-dates.ts';
import { dateFormatOf } from './organisation-date-format.ts';
import type { SpreadVerdict } from '../../shared/analysis/spread.ts';
import type { AttentionField, AttentionResponse, AttentionRescout } from '../../shared/schemas/checks.ts';
import { noticePath, reviewPath, zoneEditorPath } from '../../shared/attention-links.ts';
import { listUnacknowledgedNotices } from './notice-reading.ts';
import { listWaitingGrowerQuestions } from './notice-questions.ts';
import {
  selectAcceptedZoneMeans,
  selectLatestDoneChecks,
  selectOverdueRescouts,
  selectLatestWalkStops,
  selectUncheckedSightings,
  type AcceptedZoneMeanRow,
  type LatestCheckRow,
  type LatestWalkStopsRow,
} from '../queries/attention.ts';

const figure = (v: number) => (Math.abs(v) >= 10 ? v.toFixed(1) : v.toFixed(2));
const verdictWords: Record<SpreadVerdict, string> = {
  clustered: 'spread clustered',
  random: 'spread random',
  regular: 'spread out',
  everywhere: 'found everywhere',
  'too-few': 'too few sightings to tell the spread',
  'cant-tell': 'spread not told',
};
const spreadWords = (verdict: string | null) => verdictWords[verdict as SpreadVerdict] ?? 'spread unknown';

/** A field whose latest check is above threshold as a whole; otherwise a patch or zone of it above threshold; or nothing. */
function aboveThresholdLine(row: LatestCheckRow, acceptedZones: AcceptedZoneMeanRow[]): AttentionField | null {
  const status = thresholdStatus(row.counts ?? [], row);
  const base = {
    fieldId: row.fieldId,
    fieldName: row.fieldName,
    farmName: row.farmName,
    pestId: row.pestId,
    pestName: row.pestName,
    checkId: row.checkId,
    meanPerStop: status.meanPerStop,
    actionThreshold: row.actionThreshold,
    thresholdWords: actionThresholdWords(row, row.countUnit),
    thresholdSource: row.thresholdSource,
    thresholdConfirmed: row.thresholdConfirmed,
    newSightings: 0,
    emptyStops: 0,
  };
  // The point estimate decides here; the review page shows the interval and whether it is too close to call.
  const estimate = row.thresholdBasis === 'incidence' ? status.shareInfested : status.meanPerStop;
  if (estimate !== null && estimate > row.actionThreshold) {
    const measured = row.thresholdBasis === 'incidence' ? `${Math.round(estimate * 100)} % of stops infested` : `mean ${figure(estimate)} ${row.countUnit}`;
    return {
      ...base,
      reason: 'field-above-threshold',
      message: `${row.pestName} in ${row.fieldName} is above its action threshold over the whole field (${measured}; threshold ${base.thresholdWords}), ${spreadWords(row.verdict)}.`,
      link: reviewPath(row.fieldId, row.pestId, row.checkId),
      zoneSetId: null,
    };
  }
  // Patches and zones hold mean counts, so they are held against a mean-count threshold only.
  if (row.thresholdBasis !== 'mean') return null;
  const accepted = acceptedZones.filter(
    (z) => z.fieldId === row.fieldId && z.pestId === row.pestId && z.meanCount !== null && z.meanCount > row.actionThreshold,
  );
  const fieldMean = status.meanPerStop === null ? '' : ` while the field mean is ${figure(status.meanPerStop)}`;
  if (accepted.length > 0) {
    const highest = Math.max(...accepted.map((z) => z.meanCount as number));
    return {
      ...base,
      reason: 'patch-above-threshold',
      message: `${accepted.length} accepted zone${accepted.length === 1 ? '' : 's'} of ${row.pestName} in ${row.fieldName} above the action threshold (up to ${figure(highest)} ${row.countUnit} against ${base.thresholdWords})${fieldMean}.`,
      link: zoneEditorPath(row.fieldId, accepted[0].checkId, accepted[0].zoneSetId),
      zoneSetId: accepted[0].zoneSetId,
    };
  }
  const zones = row.zoneMeans.filter((m) => m > row.actionThreshold);
  const patches = row.patchMeans.filter((m) => m > row.actionThreshold);
  if (zones.length === 0 && patches.length === 0) return null;
  const highest = Math.max(...zones, ...patches);
  const what =
    zones.length > 0 ? `${zones.length} proposed zone${zones.length === 1 ? '' : 's'}` : `${patches.length} patch${patches.length === 1 ? '' : 'es'}`;
  return {
    ...base,
    reason: 'patch-above-threshold',
    message: `${what} of ${row.pestName} in ${row.fieldName} above the action threshold (up to ${figure(highest)} ${row.countUnit} against ${base.thresholdWords})${fieldMean}.`,
    link: zones.length > 0 ? zoneEditorPath(row.fieldId, row.checkId) : reviewPath(row.fieldId, row.pestId, row.checkId),
    zoneSetId: null,
  };
}

/** A field and pest whose latest walk has too few stops to compare with the threshold; or nothing when it has enough. */
function tooFewStopsLine(row: LatestWalkStopsRow, dates: Dates): AttentionField | null {
  const status = thresholdStatus(row.counts ?? [], row);
  if (status.status !== 'too-few') return null;
  // An incidence rule counts every stop, a mean-count rule only the stops with a number.
  const have = row.thresholdBasis === 'incidence' ? status.stops : status.countedStops;
  const stops = `${have} stop${have === 1 ? '' : 's'}${row.thresholdBasis === 'incidence' ? '' : ' with a count'}`;
  return {
    fieldId: row.fieldId,
    fieldName: row.fieldName,
    farmName: row.farmName,
    pestId: row.pestId,
    pestName: row.pestName,
    reason: 'too-few-stops',
    message: `${row.pestName} in ${row.fieldName}: too few stops to call — scout again. The latest walk (${dates.calendarDate(row.walkedOn)}) has ${stops}; at least ${MIN_STOPS_TO_CALL} are needed to compare it with the action threshold.`,
    link: reviewPath(row.fieldId, row.pestId, row.checkId),
    checkId: row.checkId,
    zoneSetId: null,
    meanPerStop: status.meanPerStop,
    actionThreshold: row.actionThreshold,
    thresholdWords: actionThresholdWords(row, row.countUnit),
    thresholdSource: row.thresholdSource,
    thresholdConfirmed: row.thresholdConfirmed,
    newSightings: 0,
    emptyStops: 0,
  };
}

export async function fieldsNeedingAttention(actor: Actor): Promise<AttentionResponse> {
  const [latest, acceptedZones, unchecked, overdue, latestWalks, dateFormat] = await Promise.all([
    selectLatestDoneChecks(actor.organisationId),
    selectAcceptedZoneMeans(actor.organisationId),
    selectUncheckedSightings(actor.organisationId),
    selectOverdueRescouts(actor.organisationId),
    selectLatestWalkStops(actor.organisationId),
    dateFormatOf(actor),
  ]);
  const dates = datesIn(dateFormat);
  const tooFewStops = latestWalks.map((row) => tooFewStopsLine(row, dates)).filter((line): line is AttentionField => line !== null);
  const tooFew = new Set(tooFewStops.map((line) => `${line.fieldId}|${line.pestId}`));
  // Where the latest walk is too thin to call, the field is not called above its threshold either; a patch or an
  // accepted zone above it still shows, since those stand on the stops inside them.
  const aboveThreshold = latest
    .map((row) => aboveThresholdLine(row, acceptedZones))
    .filter((line): line is AttentionField => line !== null && !(line.reason === 'field-above-threshold' && tooFew.has(`${line.fieldId}|${line.pestId}`)));
  const notYetChecked: AttentionField[] = unchecked.map((row) => ({
    fieldId: row.fieldId,
    fieldName: row.fieldName,
    farmName: row.farmName,
    pestId: row.pestId,
    pestName: row.pestName,
    reason: 'not-yet-checked',
    // Stops, not sightings: an empty stop is a place the scout looked and found nothing.
    message: `${stopsWord(row.newSightings)} for ${row.pestName} in ${row.fieldName} ${row.checkId ? 'added or changed since the last pattern check' : 'not yet checked'}: ${row.newSightings - row.emptyStops} with ${row.pestName}, ${row.emptyStops} empty.`,
    link: reviewPath(row.fieldId, row.pestId),
    checkId: row.checkId,
    zoneSetId: null,
    meanPerStop: null,
    actionThreshold: row.actionThreshold,
    thresholdWords: actionThresholdWords(row, row.countUnit),
    thresholdSource: row.thresholdSource,
    thresholdConfirmed: row.thresholdConfirmed,
    newSightings: row.newSightings,
    emptyStops: row.emptyStops,
  }));
  const rescoutDue: AttentionRescout[] = overdue.map((row) => ({
    fieldId: row.fieldId,
    fieldName: row.fieldName,
    farmName: row.farmName,
    pestId: row.pestId,
    pestName: row.pestName,
    reason: 'rescout-due',
    message: `${row.fieldName} was last walked ${row.daysSinceWalk} days ago; ${row.pestName} is due a walk every ${row.rescoutDays} days.`,
    link: reviewPath(row.fieldId, row.pestId, row.checkId),
    lastWalkedOn: row.lastWalkedOn,
    daysSinceWalk: row.daysSinceWalk,
    rescoutDays: row.rescoutDays,
    rescoutSource: row.rescoutSource,
    rescoutConfirmed: row.rescoutConfirmed,
  }));
  // Sent notices that no grower has acknowledged yet, and grower questions no adviser has answered.
  const unacknowledgedNotices = (await listUnacknowledgedNotices(actor)).map((n) => ({ ...n, link: noticePath(n.noticeId) }));
  const growerQuestions = (await listWaitingGrowerQuestions(actor)).map((q) => ({ ...q, link: noticePath(q.noticeId) }));
  return { aboveThreshold, tooFewStops, notYetChecked, rescoutDue, unacknowledgedNotices, growerQuestions };
}
