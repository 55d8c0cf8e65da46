// Accepted, versioned zone sets stored in PostGIS: clipped to the field, slivers dropped, areas on the ellipsoid.
import type { Transaction } from 'sequelize';
import type { MultiPolygon, Polygon } from 'geojson';
import { sequelize } from '../db.ts';
import type { Actor } from '../auth/passport.ts';
import { findPestInOrganisation } from '../queries/pests.ts';
import { lockField } from '../queries/fields.ts';
import {
  findZoneSetInOrganisation,
  insertZoneSet,
  listZoneSetsOfField,
  nextZoneSetVersion,
  supersedeAcceptedZoneSets,
  type ZoneSetRow,
} from '../queries/zone-sets.ts';
import { clipZoneToField, insertZone, listZonesOfSet } from '../queries/zones.ts';
import { badRequest, notFound } from '../errors.ts';
import { recordAudit } from './audit.ts';
import { findVisibleField } from './fields.ts';
import { visibleFieldIds } from './scope.ts';
import { DEFAULT_MIN_ZONE_AREA_M2 } from '../../shared/analysis/zones.ts';
import { runInAnalysisThread } from './analysis-pool.ts';
import { BoundaryError } from '../../shared/boundary/boundary-faults.ts';
import { toAcres, toHectares } from '../../shared/units/area.ts';
import type { ZoneSetCreateRequest, ZoneSetView, ZoneView } from '../../shared/schemas/zones.ts';
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
    const row = await clipZoneToField(fieldId, zone.geometry, minAreaM2, { transaction });
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
  const pest = await findPestInOrganisation(actor.organisationId, input.pestId);
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
    await lockField(fieldId, { transaction });
    const next = await nextZoneSetVersion(fieldId, pest.id, { transaction });
    await supersedeAcceptedZoneSets(fieldId, pest.id, { transaction });
    const zoneSetId = await insertZoneSet(
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
      await insertZone({ zoneSetId, position: index + 1, label: zone.label, geojson: zone.geojson, fieldId, pestId: pest.id, sightingIds }, { transaction });
    }
    await recordAudit(
      actor,
      'accept',
      'zone-set',
      zoneSetId,
      { fieldId, pestId: pest.id, version: next, zones: kept.length, checkId: input.checkId ?? null },
      transaction,
    );
    return { id: zoneSetId, adjustments };
  });
  return { zoneSet: await getZoneSet(actor, result.id), adjustments: result.adjustments };
}

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
  const rows = await listZonesOfSet(zoneSetId);
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
  const rows = await listZoneSetsOfField(actor.organisationId, fieldId);
  return rows.map(summary);
}

/** A zone set of an organisation with its zones, for work that runs without a signed-in person (mail jobs). */
export async function zoneSetInOrganisation(organisationId: string, id: string): Promise<ZoneSetView | null> {
  const row = await findZoneSetInOrganisation(organisationId, id);
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
