// The notice's decision and its "how we know" in plain sentences, the same in the e-mail, the page and the print.
import type { NoticeContent, NoticeThreshold, NoticeZoneRow } from '../schemas/notices.ts';
import { NEEDS_CONFIRMING, unconfirmedThresholdNoticeSentence } from '../thresholds/threshold-confirmation.ts';

const ha = (m2: number) => (m2 / 10_000).toFixed(2);
const ac = (m2: number) => (m2 / 4046.8564224).toFixed(2);
const percent = (share: number) => `${(share * 100).toFixed(1)} %`;
/** Counts keep two significant decimals at most: 0.75 beetles, 12.4 aphids. */
const countText = (value: number) => String(Number(value.toFixed(value < 10 ? 2 : 1)));

/** "Zone 1", "Zone 1 and Zone 2", "Zone 1, Zone 2 and Zone 3". */
export function zoneList(labels: string[]) {
  if (labels.length <= 1) return labels.join('');
  return `${labels.slice(0, -1).join(', ')} and ${labels[labels.length - 1]}`;
}

/** The decision in one sentence: which zones, how large in ha and ac, and the share left untreated. */
export function decisionText(c: Pick<NoticeContent, 'zones' | 'totalTreatedM2' | 'untreatedShare'>) {
  const count = c.zones.length === 1 ? 'one zone' : `${c.zones.length} zones`;
  return `Treat ${count}, ${zoneList(c.zones.map((z) => z.label))}: ${ha(c.totalTreatedM2)} ha (${ac(c.totalTreatedM2)} ac) in all. ${percent(c.untreatedShare)} of the field is left untreated.`;
}

/** One zone's mean count against the pest's action threshold, in words. */
export function zoneEvidenceText(z: NoticeZoneRow, threshold: NoticeThreshold | undefined) {
  if (z.meanCount === undefined) return `${z.label}: ${z.sightingsInside} sighting${z.sightingsInside === 1 ? '' : 's'} inside.`;
  if (z.meanCount === null || !z.counted) return `${z.label}: no counted sightings inside; the adviser drew this zone from the field visit.`;
  const mean = `a mean of ${countText(z.meanCount)}${threshold ? ` ${threshold.unit}` : ''} over ${z.counted} counted sighting${z.counted === 1 ? '' : 's'}`;
  if (!threshold) return `${z.label}: ${mean}.`;
  const side = z.meanCount >= threshold.value ? 'at or above' : 'below';
  return `${z.label}: ${mean}, ${side} the action threshold of ${countText(threshold.value)}.`;
}

/** The threshold and where it comes from, for the line under the zone counts. */
export const thresholdLineText = (t: NoticeThreshold) => `Action threshold: ${countText(t.value)} ${t.unit} (${t.source}).`;

/** The same line for mail and plain text, where an unchecked threshold says so in the line itself. */
export const thresholdSourceText = (t: NoticeThreshold) =>
  `${thresholdLineText(t)}${t.confirmed === false ? ` ${NEEDS_CONFIRMING}: ${unconfirmedThresholdNoticeSentence}` : ''}`;
