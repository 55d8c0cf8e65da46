// Zone proposals recomputed from a stored check by the engine's own frame and zone functions: its density
// surface or quadrat cells, re-thresholded, merged, buffered and clipped. Nothing is stored here (zone-sets.ts does that).
import type { Feature, MultiPolygon, Polygon } from 'geojson';
import type { Actor } from '../auth/passport.ts';
import { findCheckInOrganisation } from '../queries/pattern-checks.ts';
import { findPestInOrganisation } from '../queries/pests.ts';
import { badRequest, conflict, notFound } from '../errors.ts';
import { findVisibleField } from './fields.ts';
import { fieldBoundary, sightingsByIds } from './check-runner.ts';
import { storedDensityValues } from './check-density.ts';
import { createPlanarField } from '../../shared/analysis/field-geometry.ts';
import { planarFrame, zoneFeature } from '../../shared/analysis/planar-frame.ts';
import { boundaryCentroid, utmProjectionFor } from '../../shared/analysis/projection.ts';
import {
  DEFAULT_MARGIN_M,
  DEFAULT_MIN_ZONE_AREA_M2,
  densityThresholdPerHa,
  zonesFromDensity,
  zonesFromQuadrat,
  type PlanarZone,
} from '../../shared/analysis/zones.ts';
import type { DensityResult } from '../../shared/analysis/density.ts';
import type { QuadratResult } from '../../shared/analysis/quadrat.ts';
import type { ProposedZoneProperties, ZoneProposalRequest, ZoneProposalResponse } from '../../shared/schemas/zones.ts';

/** The field in the engine's own planar frame (UTM of the centroid, origin at the south-west corner), as analyse() uses. */
function fieldFrame(boundary: MultiPolygon) {
  const [lon, lat] = boundaryCentroid(boundary.coordinates);
  const frame = planarFrame(boundary.coordinates, utmProjectionFor(lon, lat));
  return { ...frame, field: createPlanarField(frame.local) };
}

export async function findCheck(actor: Actor, checkId: string) {
  const check = await findCheckInOrganisation(actor.organisationId, checkId);
  if (!check) throw notFound('That pattern check');
  await findVisibleField(actor, check.fieldId);
  return check;
}

/** Zones proposed from a stored check: its density surface or quadrat cells, re-thresholded, merged, buffered and clipped by the engine. */
export async function proposeZones(actor: Actor, checkId: string, input: ZoneProposalRequest): Promise<ZoneProposalResponse['zones']> {
  const check = await findCheck(actor, checkId);
  if (check.status !== 'done' || !check.result) throw conflict('This check has not finished yet; propose zones once its result is in.');
  const result = check.result as {
    density: (Omit<DensityResult, 'perHa'> & { perHa?: DensityResult['perHa'] }) | null;
    quadrat: QuadratResult | null;
    area: { boundaryM2: number };
    design?: 'stops' | 'whole-field';
    zones?: { features: Feature<Polygon, ProposedZoneProperties>[]; note: string };
  };
  // A stops-design check drew its zones from abundance among the stops, inside the scouted area: those are its proposal.
  if (
    input.source === 'density' &&
    result.design === 'stops' &&
    result.zones &&
    input.threshold === undefined &&
    input.marginM === undefined &&
    input.minZoneAreaM2 === undefined
  ) {
    return {
      type: 'FeatureCollection',
      features: result.zones.features,
      source: input.source,
      threshold: 0,
      marginM: DEFAULT_MARGIN_M,
      minZoneAreaM2: DEFAULT_MIN_ZONE_AREA_M2,
      note: result.zones.note,
    };
  }
  const boundary = await fieldBoundary(check.fieldId);
  const frame = fieldFrame(boundary);
  const { projection, originX, originY, field } = frame;
  const marginM = input.marginM ?? DEFAULT_MARGIN_M;
  const minZoneAreaM2 = input.minZoneAreaM2 ?? DEFAULT_MIN_ZONE_AREA_M2;
  let planar: PlanarZone[];
  let threshold: number;
  let note: string;
  if (input.source === 'density') {
    const perHa = result.density ? (result.density.perHa ?? (await storedDensityValues(check.id))) : null;
    if (!result.density || !perHa) throw badRequest('This check has no density surface (no sightings inside the field), so it cannot propose density zones.');
    const local = { ...result.density, perHa, originX: result.density.originX - originX, originY: result.density.originY - originY };
    threshold = densityThresholdPerHa(local, input.threshold === undefined ? {} : { densityThresholdPerHa: input.threshold });
    planar = zonesFromDensity(field, local, { densityThresholdPerHa: threshold, marginM, minZoneAreaM2 });
    note = `Density of at least ${threshold.toFixed(1)} sightings per ha, ${marginM} m margin, zones under ${minZoneAreaM2} m² dropped.`;
  } else {
    if (!result.quadrat) throw badRequest('This check has no quadrat counts (fewer than 2 sightings), so it cannot propose quadrat zones.');
    const pest = await findPestInOrganisation(actor.organisationId, check.pestId);
    threshold = input.threshold ?? pest?.actionThreshold ?? 0;
    const grid = { ...result.quadrat.grid, originX: result.quadrat.grid.originX - originX, originY: result.quadrat.grid.originY - originY };
    planar = zonesFromQuadrat(field, { ...result.quadrat, grid }, { actionThreshold: threshold, marginM, minZoneAreaM2 });
    note = `Quadrat cells whose mean count per sighting exceeds ${threshold}${pest ? ` ${pest.countUnit}` : ''}, ${marginM} m margin, zones under ${minZoneAreaM2} m² dropped.`;
  }
  // Sightings inside a zone: the check's own sightings with the pest found (count above 0, or no count).
  const found = (await sightingsByIds(check.sightingIds)).filter((s) => s.count !== 0);
  const located = new Float64Array(found.length * 2);
  found.forEach((s, i) => {
    const [x, y] = projection.forward(s.lon, s.lat);
    located[i * 2] = x - originX;
    located[i * 2 + 1] = y - originY;
  });
  const features: Feature<Polygon, ProposedZoneProperties>[] = planar.map((zone, index) => zoneFeature(frame, zone, index, located, result.area.boundaryM2));
  return { type: 'FeatureCollection', features, source: input.source, threshold, marginM, minZoneAreaM2, note };
}
