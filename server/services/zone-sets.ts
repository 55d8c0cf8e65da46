// Accepted, versioned zone sets stored in PostGIS: clipped to the field, slivers dropped, areas on the ellipsoid.
import { QueryTypes, type Transaction } from 'sequelize';
import type { MultiPolygon, Polygon } from 'geojson';
import { sequelize } from '../db.ts';
import type { Actor } from '../auth/passport.ts';
import { Pest } from '../models/pest.ts';
import { ZoneSet } from '../models/zone-set.ts';
import { badRequest, notFound } from '../errors.ts';
import { recordAudit } from './audit.ts';
import { findVisibleField } from './fields.ts';
import { visibleFieldIds } from './scope.ts';
import { DEFAULT_MIN_ZONE_AREA_M2 } from '../../shared/analysis/zones.ts';
import { runInAnalysisThread } from './analysis-pool.ts';
import { BoundaryError } from '../../shared/boundary/boundary-faults.ts';
import { toAcres, toHectares } from '../../shared/units/area.ts';
import type { ZoneSetCreateRequest, ZoneSetView, ZoneView } from '../../shared/schemas/zones.ts';
import { liveSighting } from '../queries/sightings.ts';
import { findCheck } from './zone-proposals.ts';

const asMultiPolygon = (geometry: Polygon | MultiPolygon): MultiPolygon => ({
  type: 'MultiPolygon',
  coordinates: (geometry.type === 'Polygon' ? [geometry.coordinates] : geometry.coordinates).map((p) => p.map((r) => r.map(([x, y]) => [x, y]))),
});

/** The shape checks of a field boundary (on an analysis thread), except its size limits: a zone's size is judged after clipping. */
async function validateZoneShape(geometry: MultiPolygon, label: string) {
  try {
    await runInAnalysisThread({ kind: 'boundary', input: { boundary: geometry } });
  } catch (error) {
    if (error instanceof BoundaryError && (error.fault.code === 'area-too-small' || error.fault.code === 'area-too-large')) return;
    if (error instanceof BoundaryError) throw badRequest(`${label}: ${error.message}`, { zones: `${label}: ${error.message}` });
    throw error;
  }
}

interface ClippedZone {
  label: string;
  geojson: string;
  areaM2: number;
}

/** Clips each zone to the field in PostGIS and drops parts under the minimum area, with a sentence for each change. */
async function clipToField(fieldId: string, zones: Array<{ label: string; geometry: MultiPolygon }>, minAreaM2: number, transaction: Transaction) {
  const adjustments: string[] = [];
  const kept: ClippedZone[] = [];
  for (const zone of zones) {
    const [row] = await sequelize.query<{
      valid: boolean;
      reason: string;
      drawn_m2: number;
      parts_m2: number[] | null;
      kept: string | null;
      kept_m2: number | null;
    }>(
      `WITH z AS (SELECT ST_SetSRID(ST_GeomFromGeoJSON(:geojson), 4326) AS g),
            clipped AS (
              SELECT (ST_Dump(ST_CollectionExtract(ST_Intersection(z.g, f.boundary), 3))).geom AS part FROM z, fields f
               WHERE f.id = :fieldId AND ST_IsValid(z.g)),
            measured AS (SELECT part, ST_Area(part::geography, true) AS m2 FROM clipped)
       SELECT ST_IsValid(z.g) AS valid, ST_IsValidReason(z.g) AS reason,
              CASE WHEN ST_IsValid(z.g) THEN ST_Area(z.g::geography, true) ELSE 0 END AS drawn_m2,
              (SELECT array_agg(m2) FROM measured) AS parts_m2,
              (SELECT ST_AsGeoJSON(ST_Multi(ST_Union(part))) FROM measured WHERE m2 >= :minArea) AS kept,
              (SELECT ST_Area(ST_Union(part)::geography, true) FROM measured WHERE m2 >= :minArea) AS kept_m2
         FROM z`,
      { replacements: { geojson: JSON.stringify(zone.geometry), fieldId, minArea: minAreaM2 }, type: QueryTypes.SELECT, transaction },
    );
    if (!row.valid)
      throw badRequest(`${zone.label} is not a valid polygon (${row.reason}); redraw it so its edges do not cross.`, {
        zones: `${zone.label} is not a valid polygon.`,
      });
    const parts = row.parts_m2 ?? [];
    if (parts.length === 0) {
      adjustments.push(`${zone.label} lies wholly outside the field, so it was left out.`);
      continue;
    }
    const slivers = parts.filter((m2) => m2 < minAreaM2);
    if (!row.kept || !row.kept_m2) {
      adjustments.push(
        `${zone.label} covers under ${minAreaM2} m² inside the field (${parts.reduce((a, b) => a + b, 0).toFixed(0)} m²), too small to treat on its own, so it was left out.`,
      );
      continue;
    }
    if (row.drawn_m2 - row.kept_m2 > row.drawn_m2 * 0.001) {
      const reason = slivers.length ? `; ${slivers.length} sliver${slivers.length === 1 ? '' : 's'} under ${minAreaM2} m² dropped` : '';
      adjustments.push(
        `${zone.label} reached outside the field and was clipped to the boundary (${toHectares(row.drawn_m2).toFixed(2)} ha drawn, ${toHectares(row.kept_m2).toFixed(2)} ha kept${reason}).`,
      );
    }
    kept.push({ label: zone.label, geojson: row.kept, areaM2: row.kept_m2 });
  }
  return { kept, adjustments };
}

/** Stores the adviser's zones as the field's new accepted version for the pest; the previous one is superseded. */
export async function createZoneSet(actor: Actor, fieldId: string, input: ZoneSetCreateRequest) {
  await findVisibleField(actor, fieldId);
  const pest = await Pest.findOne({ where: { id: input.pestId, organisationId: actor.organisationId } });
  if (!pest) throw badRequest('Choose one of your own pest library entries for these zones.', { pestId: 'That pest is not in your library.' });
  let sightingIds: string[] | null = null;
  if (input.checkId) {
    const check = await findCheck(actor, input.checkId);
    if (check.fieldId !== fieldId || check.pestId !== input.pestId)
      throw badRequest('That check is for another field or pest; attach the check these zones came from.', {
        checkId: 'That check is for another field or pest.',
      });
    sightingIds = check.sightingIds;
  }
  const drawn: Array<{ label: string; geometry: MultiPolygon }> = [];
  for (const [index, feature] of input.zones.features.entries()) {
    const label = feature.properties?.label ?? `Zone ${index + 1}`;
    const geometry = asMultiPolygon(feature.geometry as Polygon | MultiPolygon);
    await validateZoneShape(geometry, label);
    drawn.push({ label, geometry });
  }
  const result = await sequelize.transaction(async (transaction) => {
    const { kept, adjustments } = await clipToField(fieldId, drawn, DEFAULT_MIN_ZONE_AREA_M2, transaction);
    if (kept.length === 0) throw badRequest(`No zone is left inside the field: ${adjustments.join(' ')}`, { zones: adjustments.join(' ') });
    // Lock the field so two acceptances at once cannot take the same version number.
    await sequelize.query('SELECT id FROM fields WHERE id = :fieldId FOR UPDATE', { replacements: { fieldId }, transaction });
    const [{ next }] = await sequelize.query<{ next: number }>(
      'SELECT COALESCE(MAX(version), 0) + 1 AS next FROM zone_sets WHERE field_id = :fieldId AND pest_id = :pestId',
      {
        replacements: { fieldId, pestId: pest.id },
        type: QueryTypes.SELECT,
        transaction,
      },
    );
    await ZoneSet.update({ status: 'superseded' }, { where: { fieldId, pestId: pest.id, status: 'accepted' }, transaction });
    const zoneSet = await ZoneSet.create(
      {
        organisationId: actor.organisationId,
        fieldId,
        checkId: input.checkId ?? null,
        pestId: pest.id,
        version: next,
        status: 'accepted',
        createdBy: actor.id,
        acceptedAt: new Date(),
      },
      { transaction },
    );
    for (const [index, zone] of kept.entries()) {
      await sequelize.query(
        `INSERT INTO zones (zone_set_id, position, label, geometry, share_of_field, sightings_inside)
         SELECT :zoneSetId, :position, :label, g, LEAST(1, ST_Area(g::geography, true) / NULLIF(f.area_m2, 0)),
                (SELECT count(*) FROM sightings s
                  WHERE s.field_id = f.id AND s.pest_id = :pestId AND ${liveSighting('s')}
                    AND (s.count IS NULL OR s.count > 0) AND ST_Covers(g, s.position)
                    AND (CAST(:ids AS uuid[]) IS NULL OR s.id = ANY(CAST(:ids AS uuid[]))))
           FROM (SELECT ST_SetSRID(ST_GeomFromGeoJSON(:geojson), 4326) AS g) z, fields f WHERE f.id = :fieldId`,
        {
          replacements: {
            zoneSetId: zoneSet.id,
            position: index + 1,
            label: zone.label,
            geojson: zone.geojson,
            fieldId,
            pestId: pest.id,
            ids: sightingIds ? `{${sightingIds.join(',')}}` : null,
          },
          transaction,
        },
      );
    }
    await recordAudit(
      actor,
      'accept',
      'zone-set',
      zoneSet.id,
      { fieldId, pestId: pest.id, version: next, zones: kept.length, checkId: input.checkId ?? null },
      transaction,
    );
    return { id: zoneSet.id, adjustments };
  });
  return { zoneSet: await getZoneSet(actor, result.id), adjustments: result.adjustments };
}

interface ZoneSetRow {
  id: string;
  field_id: string;
  pest_id: string;
  pest_name: string;
  check_id: string | null;
  version: number;
  status: ZoneSetView['status'];
  created_by: string;
  created_by_name: string;
  created_at: Date;
  accepted_at: Date | null;
  field_name: string;
  field_area_m2: number;
  treated_m2: number | null;
  zone_count: number;
}

const zoneSetColumns = `zs.id, zs.field_id, zs.pest_id, p.name AS pest_name, zs.check_id, zs.version, zs.status, zs.created_by,
  u.name AS created_by_name, zs.created_at, zs.accepted_at, f.name AS field_name, f.area_m2 AS field_area_m2,
  (SELECT ST_Area(ST_Union(z.geometry)::geography, true) FROM zones z WHERE z.zone_set_id = zs.id) AS treated_m2,
  (SELECT count(*) FROM zones z WHERE z.zone_set_id = zs.id)::int AS zone_count`;
const zoneSetFrom = `zone_sets zs JOIN pests p ON p.id = zs.pest_id JOIN users u ON u.id = zs.created_by JOIN fields f ON f.id = zs.field_id`;

function summary(row: ZoneSetRow) {
  // Overlapping zones are treated once: the total is the area of their union.
  const totalTreatedM2 = row.treated_m2 ?? 0;
  return {
    id: row.id,
    fieldId: row.field_id,
    fieldName: row.field_name,
    pestId: row.pest_id,
    pestName: row.pest_name,
    checkId: row.check_id,
    version: row.version,
    status: row.status,
    createdBy: { id: row.created_by, name: row.created_by_name },
    createdAt: row.created_at.toISOString(),
    acceptedAt: row.accepted_at ? row.accepted_at.toISOString() : null,
    fieldAreaM2: row.field_area_m2,
    totalTreatedM2,
    untreatedShare: row.field_area_m2 > 0 ? Math.max(0, 1 - totalTreatedM2 / row.field_area_m2) : 0,
    zoneCount: row.zone_count,
  };
}

/** The zones of one set, outer rings counter-clockwise as RFC 7946 and KML 2.2 ask. */
export async function zonesOf(zoneSetId: string): Promise<ZoneView[]> {
  const rows = await sequelize.query<{ id: string; label: string; area_m2: number; share_of_field: number; sightings_inside: number; geometry: string }>(
    `SELECT id, label, area_m2, share_of_field, sightings_inside, ST_AsGeoJSON(ST_ForcePolygonCCW(geometry), 9) AS geometry
       FROM zones WHERE zone_set_id = :zoneSetId ORDER BY position`,
    { replacements: { zoneSetId }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({
    id: r.id,
    label: r.label,
    areaM2: r.area_m2,
    areaHa: toHectares(r.area_m2),
    areaAc: toAcres(r.area_m2),
    shareOfField: r.share_of_field,
    sightingsInside: r.sightings_inside,
    geometry: JSON.parse(r.geometry) as MultiPolygon,
  }));
}

export async function listZoneSets(actor: Actor, fieldId: string) {
  await findVisibleField(actor, fieldId);
  const rows = await sequelize.query<ZoneSetRow>(
    `SELECT ${zoneSetColumns} FROM ${zoneSetFrom} WHERE zs.field_id = :fieldId AND zs.organisation_id = :org ORDER BY p.name, zs.version DESC`,
    {
      replacements: { fieldId, org: actor.organisationId },
      type: QueryTypes.SELECT,
    },
  );
  return rows.map(summary);
}

/** A zone set of an organisation with its zones, for work that runs without a signed-in person (mail jobs). */
export async function zoneSetInOrganisation(organisationId: string, id: string): Promise<ZoneSetView | null> {
  const [row] = await sequelize.query<ZoneSetRow>(`SELECT ${zoneSetColumns} FROM ${zoneSetFrom} WHERE zs.id = :id AND zs.organisation_id = :org`, {
    replacements: { id, org: organisationId },
    type: QueryTypes.SELECT,
  });
  if (!row) return null;
  const { zoneCount: _count, ...view } = summary(row);
  return { ...view, zones: await zonesOf(id) };
}

/** One zone set the actor may see, with its zones; another organisation's id finds nothing. */
export async function getZoneSet(actor: Actor, id: string): Promise<ZoneSetView> {
  const zoneSet = await zoneSetInOrganisation(actor.organisationId, id);
  const visible = zoneSet ? await visibleFieldIds(actor) : null;
  if (!zoneSet || (visible && !visible.includes(zoneSet.fieldId))) throw notFound('That zone set');
  return zoneSet;
}
