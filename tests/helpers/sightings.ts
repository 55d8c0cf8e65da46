// Fields, walks and sightings written straight into the tables, so check and threshold tests control every
// position and count. Other suites may use it: makeScoutedField() gives a field with one walk of sightings.
import crypto from 'node:crypto';
import type { Polygon } from 'geojson';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../server/db.ts';
import type { TestOrganisation } from './org.ts';

/** An invented rectangular field in open farmland, about 420 m × 330 m. */
export const TEST_FIELD_CORNER = { lon: -96.6, lat: 41.2 };
export const TEST_FIELD_SIZE = { lon: 0.005, lat: 0.003 };

export function rectangleBoundary(corner = TEST_FIELD_CORNER, size = TEST_FIELD_SIZE): Polygon {
  const { lon, lat } = corner;
  return {
    type: 'Polygon',
    coordinates: [
      [
        [lon, lat],
        [lon + size.lon, lat],
        [lon + size.lon, lat + size.lat],
        [lon, lat + size.lat],
        [lon, lat],
      ],
    ],
  };
}

const tag = () => crypto.randomBytes(3).toString('hex');

async function insertReturningId(sql: string, replacements: Record<string, unknown>) {
  const [row] = await sequelize.query<{ id: string }>(sql, { replacements, type: QueryTypes.SELECT });
  return row.id;
}

export async function makeField(org: TestOrganisation, boundary: Polygon = rectangleBoundary(), name = `Field ${tag()}`) {
  const farmId = await insertReturningId('INSERT INTO farms (organisation_id, name) VALUES (:org, :name) RETURNING id', { org: org.id, name: `Farm ${tag()}` });
  const id = await insertReturningId(
    `INSERT INTO fields (organisation_id, farm_id, name, crop, season, boundary)
     VALUES (:org, :farmId, :name, 'soybean', 2026, ST_Multi(ST_SetSRID(ST_GeomFromGeoJSON(:geojson), 4326))) RETURNING id`,
    { org: org.id, farmId, name, geojson: JSON.stringify(boundary) },
  );
  return { id, farmId, name, boundary };
}

export interface PestRule {
  actionThreshold?: number;
  thresholdBasis?: 'mean' | 'incidence';
  countUnit?: string;
}

export async function makePest(org: TestOrganisation, rule: PestRule = {}) {
  const name = `Test aphid ${tag()}`;
  const id = await insertReturningId(
    `INSERT INTO pests (organisation_id, name, kind, count_unit, action_threshold, threshold_basis, threshold_source)
     VALUES (:org, :name, 'insect', :unit, :threshold, :basis, 'Test threshold, not agronomic advice') RETURNING id`,
    { org: org.id, name, unit: rule.countUnit ?? 'aphids per plant', threshold: rule.actionThreshold ?? 2, basis: rule.thresholdBasis ?? 'mean' },
  );
  return { id, name };
}

/** A walk by the organisation's scout; walkedOn as YYYY-MM-DD. */
export async function makeWalk(org: TestOrganisation, fieldId: string, walkedOn = '2026-07-01') {
  return insertReturningId('INSERT INTO walks (organisation_id, field_id, scout_id, walked_on) VALUES (:org, :fieldId, :scout, :walkedOn) RETURNING id', {
    org: org.id,
    fieldId,
    scout: org.users.scout.id,
    walkedOn,
  });
}

export interface StopPoint {
  lon: number;
  lat: number;
  /** 0 for an empty stop, null for a sighting without a count. */
  count: number | null;
}

/** Placed sightings of one pest on one walk; returns their ids in the order given. */
export async function addSightings(org: TestOrganisation, where: { fieldId: string; walkId: string; pestId: string }, points: StopPoint[]) {
  if (points.length === 0) return [];
  const rows = await sequelize.query<{ id: string }>(
    `INSERT INTO sightings (organisation_id, field_id, walk_id, pest_id, count, position, position_source, status, created_by, observed_at)
     SELECT :org, :fieldId, :walkId, :pestId, p.count, ST_SetSRID(ST_MakePoint(p.lon, p.lat), 4326), 'device', 'placed', :scout, now()
       FROM unnest(CAST(:lons AS float8[]), CAST(:lats AS float8[]), CAST(:counts AS float8[])) WITH ORDINALITY AS p(lon, lat, count, k)
      ORDER BY p.k
     RETURNING id`,
    {
      replacements: {
        org: org.id,
        ...where,
        scout: org.users.scout.id,
        lons: `{${points.map((p) => p.lon).join(',')}}`,
        lats: `{${points.map((p) => p.lat).join(',')}}`,
        counts: `{${points.map((p) => (p.count === null ? 'NULL' : p.count)).join(',')}}`,
      },
      type: QueryTypes.SELECT,
    },
  );
  return rows.map((r) => r.id);
}

/** Points from parallel lon/lat/count lists. */
export const stopsFrom = (lons: number[], lats: number[], counts: Array<number | null>): StopPoint[] =>
  lons.map((lon, i) => ({ lon, lat: lats[i], count: counts[i] ?? null }));

/** A field with one walk and its sightings, for suites that need a scouted field in one call. */
export async function makeScoutedField(org: TestOrganisation, points: StopPoint[], options: { pest?: PestRule; walkedOn?: string; boundary?: Polygon } = {}) {
  const field = await makeField(org, options.boundary);
  const pest = await makePest(org, options.pest);
  const walkId = await makeWalk(org, field.id, options.walkedOn);
  const sightingIds = await addSightings(org, { fieldId: field.id, walkId, pestId: pest.id }, points);
  return { field, pest, walkId, sightingIds };
}
