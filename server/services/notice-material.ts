// What a notice shows (figures, zones, boundary, sightings, verdict words, cautions): gathered from live data for
// a draft, and stored with the notice when it is sent (the snapshot), which is what everything reads afterwards.
import type { MultiPolygon } from 'geojson';
import { findNoticeById, findNoticeFacts, type NoticeRow } from '../queries/notices.ts';
import { findCheck } from '../queries/pattern-checks.ts';
import { notFound } from '../errors.ts';
import { zoneSetInOrganisation } from './zone-sets.ts';
import { listFoundPositions, listWalkDatesOfSightings } from '../queries/sightings.ts';
import { zonesGeoJson } from './zone-export.ts';
import { zoneLocation } from './zone-locations.ts';
import { zoneMeanCounts } from '../queries/zones.ts';
import { NOTICE_CAUTIONS } from '../../shared/notices/cautions.ts';
import { verdictInWords } from '../../shared/notices/verdict-words.ts';
import type { NoticeContent, NoticeMaterial } from '../../shared/schemas/notices.ts';

export type { NoticeMaterial };

/** Everything a notice shows: its snapshot once sent, the live data while it is a draft. */
export async function noticeMaterial(noticeId: string): Promise<NoticeMaterial> {
  const notice = await findNoticeById(noticeId);
  if (!notice) throw notFound('That notice');
  // Notices sent before snapshots were stored have none; they keep reading live data.
  return notice.material ?? liveNoticeMaterial(notice);
}

/** Everything a notice shows, gathered from the field, its sightings, the check and the zones as they are now. */
export async function liveNoticeMaterial(notice: NoticeRow): Promise<NoticeMaterial> {
  const noticeId = notice.id;
  const facts = await findNoticeFacts(noticeId);
  const check = notice.checkId ? await findCheck(notice.checkId) : null;
  const zoneSet = await zoneSetInOrganisation(notice.organisationId, notice.zoneSetId);
  if (!zoneSet) throw notFound('The zones of that notice');
  // The sightings behind the notice: the check's own, or (hand-drawn zones) the field's sightings of the pest.
  const sightingIds = check ? check.sightingIds : null;
  const walkDates = await listWalkDatesOfSightings(sightingIds, notice.fieldId, notice.pestId);
  const points = await listFoundPositions(sightingIds, notice.fieldId, notice.pestId);
  const counts = await zoneMeanCounts({ zoneSetId: zoneSet.id, sightingIds, fieldId: notice.fieldId, pestId: notice.pestId });
  const boundary = JSON.parse(facts.boundary) as MultiPolygon;
  const content: NoticeContent = {
    farmName: facts.farm_name,
    fieldName: facts.field_name,
    fieldAreaM2: facts.field_area_m2,
    pestName: facts.pest_name,
    walkDates,
    verdict: verdictInWords(check?.result ?? null),
    threshold: { value: facts.threshold, unit: facts.count_unit, source: facts.threshold_source, confirmed: facts.threshold_confirmed },
    zones: zoneSet.zones.map((z) => ({
      label: z.label,
      areaM2: z.areaM2,
      areaHa: z.areaHa,
      areaAc: z.areaAc,
      shareOfField: z.shareOfField,
      sightingsInside: z.sightingsInside,
      meanCount: counts.find((c) => c.zone_id === z.id)?.mean_count ?? null,
      counted: counts.find((c) => c.zone_id === z.id)?.counted ?? 0,
      location: zoneLocation(z.geometry, boundary),
    })),
    totalTreatedM2: zoneSet.totalTreatedM2,
    untreatedShare: zoneSet.untreatedShare,
    recommendation: notice.recommendation,
    rescoutOn: notice.rescoutOn,
    adviserName: facts.author,
    organisationName: facts.organisation,
    cautions: NOTICE_CAUTIONS,
    dateFormat: { locale: facts.locale, timeZone: facts.time_zone },
  };
  return {
    content,
    boundary,
    zonesGeoJson: zonesGeoJson(zoneSet),
    sightings: points.map((p) => [p.lon, p.lat]),
    zones: zoneSet.zones.map((z) => ({ label: z.label, geometry: z.geometry })),
  };
}
