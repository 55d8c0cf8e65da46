// A field's stored area (PostGIS trigger, WGS 84 ellipsoid) against turf, against hand computations,
// and the units it is shown in.
import { beforeAll, describe, expect, it } from 'vitest';
import { area as turfArea } from '@turf/turf';
import type { MultiPolygon, Polygon } from 'geojson';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../server/db.ts';
import { signedIn, type Client } from '../helpers/http.ts';
import { makeOrganisation } from '../helpers/org.ts';
import { createFarm, createField } from '../helpers/farm-records.ts';
import { degreeRectangle, TEST_FIELD_ORIGIN, utmRectangle } from '../helpers/boundary-shapes.ts';
import { formatArea, SQUARE_METRES_PER_ACRE, SQUARE_METRES_PER_HECTARE, toAcres, toHectares } from '../../shared/units/area.ts';

// turf's area uses a sphere of radius 6371008.8 m (its `earthRadius`, the IUGG mean radius);
// the database uses the WGS 84 ellipsoid, so the two differ slightly by latitude (about +0.15 % at 42° N).
const TURF_EARTH_RADIUS_M = 6371008.8;
// WGS 84 defining constants (NIMA TR8350.2): semi-major axis a and flattening f.
const WGS84_A = 6378137;
const WGS84_F = 1 / 298.257223563;

const relativeDifference = (a: number, b: number) => Math.abs(a / b - 1);

/**
 * Ellipsoid-to-sphere ratio of a small area at latitude φ: the ellipsoid's area element is M·N·cos φ dφ dλ,
 * the sphere's R²·cos φ dφ dλ, with the meridian radius M = a(1−e²)/(1−e² sin²φ)^{3/2} and the prime-vertical
 * radius N = a/(1−e² sin²φ)^{1/2} (standard geodesy; Snyder 1987, USGS PP 1395, ch. 4).
 */
function ellipsoidToSphereRatio(latDeg: number) {
  const e2 = WGS84_F * (2 - WGS84_F);
  const w2 = 1 - e2 * Math.sin((latDeg * Math.PI) / 180) ** 2;
  const m = (WGS84_A * (1 - e2)) / w2 ** 1.5;
  const n = WGS84_A / Math.sqrt(w2);
  return (m * n) / TURF_EARTH_RADIUS_M ** 2;
}

const { lon, lat } = TEST_FIELD_ORIGIN;
let admin: Client;
let farmId: string;

beforeAll(async () => {
  const org = await makeOrganisation('Area');
  admin = await signedIn(org.users.admin.email);
  farmId = (await createFarm(admin)).id;
});

async function storedArea(fieldId: string) {
  const [row] = await sequelize.query<{ area_m2: number }>('SELECT area_m2 FROM fields WHERE id = :fieldId', {
    replacements: { fieldId },
    type: QueryTypes.SELECT,
  });
  return row.area_m2;
}

describe('stored field area', () => {
  // An irregular five-sided field (invented outline) near 42° N.
  const pentagon: Polygon = {
    type: 'Polygon',
    coordinates: [
      [
        [lon, lat],
        [lon + 0.006, lat - 0.0004],
        [lon + 0.0072, lat + 0.0031],
        [lon + 0.003, lat + 0.0049],
        [lon - 0.0006, lat + 0.0027],
        [lon, lat],
      ],
    ],
  };

  it('agrees with turf.area within 0.5 %', async () => {
    const field = await createField(admin, farmId, pentagon);
    expect(field.areaM2).toBe(await storedArea(field.id));
    expect(relativeDifference(field.areaM2, turfArea(pentagon))).toBeLessThan(0.005);
  });

  it("differs from turf by the ellipsoid-to-sphere ratio at the field's latitude (so it is computed on the ellipsoid)", async () => {
    const field = await createField(admin, farmId, pentagon);
    const expectedRatio = ellipsoidToSphereRatio(lat + 0.002);
    expect(expectedRatio).toBeGreaterThan(1.001);
    expect(relativeDifference(field.areaM2 / turfArea(pentagon), expectedRatio)).toBeLessThan(1e-4);
  });

  it('matches width × height of a 400 m × 250 m rectangle laid on the UTM grid (proj4) within 0.5 %', async () => {
    // Planar area in UTM differs from the true area by the square of the grid scale factor (k ≈ 0.9996 near the
    // central meridian, Snyder 1987), under 0.1 % here.
    const field = await createField(admin, farmId, utmRectangle(lon, lat, 400, 250));
    expect(relativeDifference(field.areaM2, 400 * 250)).toBeLessThan(0.005);
  });

  it('subtracts a hole: 400 m × 250 m less a 100 m × 50 m hole', async () => {
    const outer = utmRectangle(lon, lat, 400, 250).coordinates[0];
    const hole = utmRectangle(lon + 0.001, lat + 0.0005, 100, 50).coordinates[0];
    const field = await createField(admin, farmId, { type: 'Polygon', coordinates: [outer, hole.slice().reverse()] });
    expect(relativeDifference(field.areaM2, 400 * 250 - 100 * 50)).toBeLessThan(0.005);
  });

  it('adds the parts of a multi-part field', async () => {
    const parts: MultiPolygon = {
      type: 'MultiPolygon',
      coordinates: [utmRectangle(lon, lat, 300, 200).coordinates, utmRectangle(lon + 0.01, lat, 150, 100).coordinates],
    };
    const field = await createField(admin, farmId, parts);
    expect(relativeDifference(field.areaM2, 300 * 200 + 150 * 100)).toBeLessThan(0.005);
  });

  it('recomputes the area when the boundary is edited', async () => {
    const field = await createField(admin, farmId, utmRectangle(lon, lat, 400, 250));
    const narrower = utmRectangle(lon, lat, 200, 250);
    const res = await admin.patch(`/api/fields/${field.id}`, { boundary: narrower }).expect(200);
    expect(res.body.field.areaM2).toBe(await storedArea(field.id));
    expect(relativeDifference(res.body.field.areaM2, 200 * 250)).toBeLessThan(0.005);
    expect(relativeDifference(res.body.field.areaM2, turfArea(narrower))).toBeLessThan(0.005);
  });

  it('keeps the area when only the details are edited', async () => {
    const field = await createField(admin, farmId, utmRectangle(lon, lat, 400, 250));
    const res = await admin.patch(`/api/fields/${field.id}`, { name: 'Renamed field', crop: 'oats' }).expect(200);
    expect(res.body.field.areaM2).toBe(field.areaM2);
  });
});

describe('hand computation on the sphere', () => {
  it('turf.area of a 1° × 1° cell equals the spherical-zone formula A = R²·Δλ·(sin φ2 − sin φ1)', () => {
    // Area of a latitude–longitude cell on a sphere: standard spherical geometry (Snyder 1987, USGS PP 1395).
    // turf uses the same sphere, so the two agree to rounding.
    const rad = Math.PI / 180;
    for (const south of [0, 42, 70]) {
      const byFormula = TURF_EARTH_RADIUS_M ** 2 * (1 * rad) * (Math.sin((south + 1) * rad) - Math.sin(south * rad));
      expect(relativeDifference(turfArea(degreeRectangle(-94, south, 1, 1)), byFormula)).toBeLessThan(1e-6);
    }
  });
});

describe('area units', () => {
  it('uses the international acre: 1 ac = 4046.8564224 m² (NIST Handbook 44, Appendix C)', () => {
    expect(SQUARE_METRES_PER_ACRE).toBe(4046.8564224);
    // The same acre from its definition: 43,560 ft² with the international foot of exactly 0.3048 m (NIST HB 44).
    expect(relativeDifference(SQUARE_METRES_PER_ACRE, 43_560 * 0.3048 ** 2)).toBeLessThan(1e-12);
    expect(toAcres(4046.8564224)).toBe(1);
    expect(toHectares(SQUARE_METRES_PER_HECTARE)).toBe(1);
  });

  it('formats an area in hectares and acres', () => {
    // 10 ac = 40,468.564224 m² = 4.0468… ha; 10 ha = 100,000 m² = 24.7105… ac (from the constants above).
    expect(formatArea(10 * 4046.8564224)).toBe('4.05 ha (10.00 ac)');
    expect(formatArea(100_000)).toBe('10.00 ha (24.71 ac)');
  });

  it("formats a stored field's area in hectares and acres", async () => {
    const field = await createField(admin, farmId, utmRectangle(lon, lat, 400, 250));
    const [ha, ac] = /^([\d.]+) ha \(([\d.]+) ac\)$/.exec(formatArea(field.areaM2))!.slice(1).map(Number);
    expect(ha).toBeCloseTo(10, 1);
    expect(ac).toBeCloseTo(100_000 / 4046.8564224, 1);
  });
});
