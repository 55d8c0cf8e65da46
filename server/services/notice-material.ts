// What a notice shows (figures, zones, boundary, sightings, verdict words, cautions): gathered from live data for
// a draft, and stored with the notice when it is sent (the snapshot), which is what everything reads afterwards.
import { QueryTypes } from 'sequelize';
import type { MultiPolygon } from 'geojson';
import { sequelize } from '../db.ts';
import { Notice } from '../models/notice.ts';
import { PatternCheck } from '../models/pattern-check.ts';
import { notFound } from '../errors.ts';
import { zoneSetInOrganisation } from './zone-sets.ts';
import { liveSighting } from '../queries/sightings.ts';
import { zonesGeoJson } from './zone-export.ts';
import { zoneLocation } from './zone-locations.ts';
import { NOTICE_CAUTIONS } from '../../shared/notices/cautions.ts';
import { verdictInWords } from '../../shared/notices/verdict-words.ts';
import type { NoticeContent, NoticeMaterial } from '../../shared/schemas/notices.ts';

export type { NoticeMaterial };

/** Everything a notice shows: its snapshot once sent, the live data while it is a draft. */
export async function noticeMaterial(noticeId: string): Promise<NoticeMaterial> {
  const notice = await Notice.findByPk(noticeId);
  if (!notice) throw notFound('That notice');
  // Notices sent before snapshots were stored have none; they keep reading live data.
  return notice.material ?? liveNoticeMaterial(notice);
}

/** Everything a notice shows, gathered from the field, its sightings, the check and the zones as they are now. */
export async function liveNoticeMaterial(notice: Notice): Promise<NoticeMaterial> {
  const noticeId = notice.id;
  const [facts] = await sequelize.query<{
    farm_name: string;
    field_name: string;
    field_area_m2: number;
    boundary: string;
    pest_name: string;
    author: string;
    organisation: string;
  }>(
    `SELECT fa.name AS farm_name, f.name AS field_name, f.area_m2 AS field_area_m2, ST_AsGeoJSON(ST_ForcePolygonCCW(f.boundary), 9) AS boundary,
            p.name AS pest_name, u.name AS author, o.name AS organisation
       FROM notices n JOIN fields f ON f.id = n.field_id JOIN farms fa ON fa.id = f.farm_id JOIN pests p ON p.id = n.pest_id
       JOIN users u ON u.id = n.created_by JOIN organisations o ON o.id = n.organisation_id WHERE n.id = :id`,
    { replacements: { id: noticeId }, type: QueryTypes.SELECT },
  );
  const check = notice.checkId ? await PatternCheck.findByPk(notice.checkId) : null;
  const zoneSet = await zoneSetInOrganisation(notice.organisationId, notice.zoneSetId);
  if (!zoneSet) throw notFound('The zones of that notice');
  // The sightings behind the notice: the check's own, or (hand-drawn zones) the field's sightings of the pest.
  const sightingFilter = check ? 's.id = ANY(CAST(:ids AS uuid[]))' : 's.field_id = :fieldId AND s.pest_id = :pestId';
  const replacements = { ids: check ? `{${check.sightingIds.join(',')}}` : '{}', fieldId: notice.fieldId, pestId: notice.pestId };
  const walks = await sequelize.query<{ walked_on: string }>(
    `SELECT DISTINCT w.walked_on::text AS walked_on FROM sightings s JOIN walks w ON w.id = s.walk_id
      WHERE ${sightingFilter} AND s.deleted_at IS NULL ORDER BY 1`,
    { replacements, type: QueryTypes.SELECT },
  );
  const points = await sequelize.query<{ lon: number; lat: number }>(
    `SELECT ST_X(s.position) AS lon, ST_Y(s.position) AS lat FROM sightings s
      WHERE ${sightingFilter} AND ${liveSighting('s')} AND (s.count IS NULL OR s.count > 0)`,
    { replacements, type: QueryTypes.SELECT },
  );
  const boundary = JSON.parse(facts.boundary) as MultiPolygon;
  const content: NoticeContent = {
    farmName: facts.farm_name,
    fieldName: facts.field_name,
    fieldAreaM2: facts.field_area_m2,
    pestName: facts.pest_name,
    walkDates: walks.map((w) => w.walked_on),
    verdict: verdictInWords(check?.result ?? null),
    zones: zoneSet.zones.map((z) => ({
      label: z.label,
      areaM2: z.areaM2,
      areaHa: z.areaHa,
      areaAc: z.areaAc,
      shareOfField: z.shareOfField,
      sightingsInside: z.sightingsInside,
      location: zoneLocation(z.geometry, boundary),
    })),
    totalTreatedM2: zoneSet.totalTreatedM2,
    untreatedShare: zoneSet.untreatedShare,
    recommendation: notice.recommendation,
    rescoutOn: notice.rescoutOn,
    adviserName: facts.author,
    organisationName: facts.organisation,
    cautions: NOTICE_CAUTIONS,
  };
  return {
    content,
    boundary,
    zonesGeoJson: zonesGeoJson(zoneSet),
    sightings: points.map((p) => [p.lon, p.lat]),
    zones: zoneSet.zones.map((z) => ({ label: z.label, geometry: z.geometry })),
  };
}
