// A scouted field with two invented aphid patches, its stored pattern check (through POST /api/checks),
// grower contacts on its farm and, when asked, an accepted zone set: the starting point of zone and notice tests.
import crypto from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../server/db.ts';
import { createRandom } from '../../shared/analysis/random.ts';
import type { Client } from './http.ts';
import type { TestOrganisation } from './org.ts';
import { addSightings, makeField, makePest, makeWalk, TEST_FIELD_CORNER, TEST_FIELD_SIZE, type StopPoint } from './sightings.ts';

/**
 * Two tight patches of counted sightings in the invented field (clustered by construction), each followed by
 * 24 empty stops on a grid over the field, so each of the two walks records where it found nothing.
 */
export function patchyStops(seed: number, perPatch = 18): StopPoint[] {
  const random = createRandom(seed);
  const centres = [
    [TEST_FIELD_CORNER.lon + TEST_FIELD_SIZE.lon * 0.25, TEST_FIELD_CORNER.lat + TEST_FIELD_SIZE.lat * 0.3],
    [TEST_FIELD_CORNER.lon + TEST_FIELD_SIZE.lon * 0.72, TEST_FIELD_CORNER.lat + TEST_FIELD_SIZE.lat * 0.7],
  ];
  // Each walk's empty stops on a 6 × 4 grid over the whole field, the second walk's offset by a quarter cell.
  const empty = (k: number, walk: number) => ({
    lon: TEST_FIELD_CORNER.lon + (TEST_FIELD_SIZE.lon * ((k % 6) + 0.35 + 0.3 * walk)) / 6,
    lat: TEST_FIELD_CORNER.lat + (TEST_FIELD_SIZE.lat * (Math.floor(k / 6) + 0.35 + 0.3 * walk)) / 4,
    count: 0,
  });
  return centres.flatMap(([lon, lat], patch) => [
    ...Array.from({ length: perPatch }, () => ({
      lon: lon + (random() - 0.5) * 0.0004,
      lat: lat + (random() - 0.5) * 0.0003,
      count: 3 + Math.floor(random() * 6),
    })),
    ...Array.from({ length: 24 }, (_, k) => empty(k, patch)),
  ]);
}

export interface ScoutedCheck {
  field: { id: string; farmId: string; name: string };
  pest: { id: string; name: string };
  checkId: string;
  check: { result: Record<string, unknown>; sightingCount: number };
  sightingIds: string[];
  points: StopPoint[];
}

/** A field (name as given), two walks of patchy sightings and a finished check run by the adviser. */
export async function makeCheckedField(org: TestOrganisation, adviser: Client, options: { fieldName?: string; seed?: number } = {}): Promise<ScoutedCheck> {
  const field = await makeField(org, undefined, options.fieldName ?? `Field ${crypto.randomBytes(3).toString('hex')}`);
  const pest = await makePest(org, { actionThreshold: 5 });
  const points = patchyStops(options.seed ?? 11);
  const half = Math.floor(points.length / 2);
  const firstWalk = await makeWalk(org, field.id, '2026-07-01');
  const secondWalk = await makeWalk(org, field.id, '2026-07-03');
  const sightingIds = [
    ...(await addSightings(org, { fieldId: field.id, walkId: firstWalk, pestId: pest.id }, points.slice(0, half))),
    ...(await addSightings(org, { fieldId: field.id, walkId: secondWalk, pestId: pest.id }, points.slice(half))),
  ];
  const res = await adviser.post('/api/checks', { fieldId: field.id, pestId: pest.id, options: { simulations: 99, seed: 5 } });
  if (res.status !== 201 || res.body.check.status !== 'done') throw new Error(`check not run: ${res.status} ${JSON.stringify(res.body).slice(0, 300)}`);
  return { field, pest, checkId: res.body.check.id, check: res.body.check, sightingIds, points };
}

/** Grower contacts on a farm, written straight into the table. */
export async function addContacts(farmId: string, contacts: Array<{ name: string; email: string }>) {
  for (const c of contacts) {
    await sequelize.query('INSERT INTO farm_contacts (farm_id, name, email) VALUES (:farmId, :name, :email)', { replacements: { farmId, ...c } });
  }
}

export async function linkGrower(farmId: string, userId: string) {
  await sequelize.query('INSERT INTO farm_growers (farm_id, user_id) VALUES (:farmId, :userId) ON CONFLICT DO NOTHING', { replacements: { farmId, userId } });
}

/** The stored zones of a set, straight from the table (area by the database trigger). */
export function storedZones(zoneSetId: string) {
  return sequelize.query<{ id: string; label: string; area_m2: number; share_of_field: number; sightings_inside: number; geometry: string }>(
    'SELECT id, label, area_m2, share_of_field, sightings_inside, ST_AsGeoJSON(geometry) AS geometry FROM zones WHERE zone_set_id = :zoneSetId ORDER BY position',
    { replacements: { zoneSetId }, type: QueryTypes.SELECT },
  );
}

/** Proposes density zones from the check and accepts them unchanged. */
export async function acceptProposedZones(adviser: Client, scouted: ScoutedCheck) {
  const proposal = await adviser.post(`/api/checks/${scouted.checkId}/zone-proposal`, { source: 'density' });
  if (proposal.status !== 200 || proposal.body.zones.features.length === 0)
    throw new Error(`no zones proposed: ${proposal.status} ${JSON.stringify(proposal.body).slice(0, 300)}`);
  const res = await adviser.post(`/api/fields/${scouted.field.id}/zone-sets`, {
    checkId: scouted.checkId,
    pestId: scouted.pest.id,
    zones: proposal.body.zones,
  });
  if (res.status !== 201) throw new Error(`zones not accepted: ${res.status} ${JSON.stringify(res.body).slice(0, 300)}`);
  return res.body.zoneSet as {
    id: string;
    version: number;
    zones: Array<{
      id: string;
      label: string;
      areaM2: number;
      areaHa: number;
      areaAc: number;
      shareOfField: number;
      sightingsInside: number;
      geometry: { type: 'MultiPolygon'; coordinates: number[][][][] };
    }>;
    totalTreatedM2: number;
    untreatedShare: number;
    fieldAreaM2: number;
  };
}
