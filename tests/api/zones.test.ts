// Treatment zones: proposals recomputed from a stored check, accepted zone sets clipped to the field and
// versioned, exports in GeoJSON (RFC 7946) and KML (OGC KML 2.2), and who may do what.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  area as turfArea,
  booleanClockwise,
  booleanPointInPolygon,
  difference,
  featureCollection,
  intersect,
  polygon as turfPolygon,
  multiPolygon as turfMultiPolygon,
} from '@turf/turf';
import { kml as kmlToGeoJson } from '@tmcw/togeojson';
import { DOMParser } from '@xmldom/xmldom';
import type { MultiPolygon, Polygon, Position } from 'geojson';
import { signedIn, type Client } from '../helpers/http.ts';
import { makeOrganisation, type TestOrganisation } from '../helpers/org.ts';
import { rectangleBoundary, TEST_FIELD_CORNER, TEST_FIELD_SIZE } from '../helpers/sightings.ts';
import { acceptProposedZones, makeCheckedField, storedZones, type ScoutedCheck } from '../helpers/zones.ts';
import { stopQueue } from '../../server/jobs/queue.ts';
import { closeSimulationPool } from '../../server/services/check-runner.ts';

let org: TestOrganisation;
let other: TestOrganisation;
let adviser: Client;
let scout: Client;
let grower: Client;
let outsider: Client;
let scouted: ScoutedCheck;

beforeAll(async () => {
  org = await makeOrganisation('Zones');
  other = await makeOrganisation('Zones other');
  adviser = await signedIn(org.users.adviser.email);
  scout = await signedIn(org.users.scout.email);
  grower = await signedIn(org.users.grower.email);
  outsider = await signedIn(other.users.adviser.email);
  scouted = await makeCheckedField(org, adviser);
});

afterAll(async () => {
  await closeSimulationPool();
  await stopQueue();
});

const field = () => rectangleBoundary();
const { lon, lat } = TEST_FIELD_CORNER;
const { lon: dLon, lat: dLat } = TEST_FIELD_SIZE;
const box = (x0: number, y0: number, x1: number, y1: number): Polygon => ({
  type: 'Polygon',
  coordinates: [
    [
      [x0, y0],
      [x1, y0],
      [x1, y1],
      [x0, y1],
      [x0, y0],
    ],
  ],
});
const zonesBody = (geometries: Array<Polygon | MultiPolygon>, labels: string[] = []) => ({
  pestId: scouted.pest.id,
  zones: {
    type: 'FeatureCollection',
    features: geometries.map((geometry, i) => ({ type: 'Feature', properties: labels[i] ? { label: labels[i] } : {}, geometry })),
  },
});

describe('zone proposals', () => {
  it('recomputes from the stored check the very zones the full check proposed', async () => {
    const res = await adviser.post(`/api/checks/${scouted.checkId}/zone-proposal`, { source: 'density' }).expect(200);
    const stored = (scouted.check.result as { zones: { features: Array<{ properties: { areaM2: number; sightings: number } }> } }).zones;
    expect(res.body.zones.features.length).toBe(stored.features.length);
    expect(res.body.zones.features.length).toBeGreaterThan(0);
    res.body.zones.features.forEach((zone: { properties: { areaM2: number; sightings: number } }, i: number) => {
      expect(zone.properties.areaM2).toBeCloseTo(stored.features[i].properties.areaM2, 6);
      expect(zone.properties.sightings).toBe(stored.features[i].properties.sightings);
    });
  });

  it('gives each zone an area that turf measures alike, inside the field, with the sightings turf counts inside it', async () => {
    const res = await adviser.post(`/api/checks/${scouted.checkId}/zone-proposal`, { source: 'density', marginM: 5 }).expect(200);
    for (const zone of res.body.zones.features as Array<{
      geometry: Polygon;
      properties: { areaM2: number; areaHa: number; areaAc: number; sightings: number };
    }>) {
      // The engine measures in UTM; turf on the sphere. UTM's scale factor stays within 0.9996–1.001 here (Snyder 1987, §8), so areas agree within 0.5 %.
      expect(Math.abs(zone.properties.areaM2 - turfArea(zone.geometry)) / turfArea(zone.geometry)).toBeLessThan(0.005);
      expect(zone.properties.areaHa).toBeCloseTo(zone.properties.areaM2 / 10_000, 9);
      // International acre, NIST Handbook 44 Appendix C: 4046.8564224 m².
      expect(zone.properties.areaAc).toBeCloseTo(zone.properties.areaM2 / 4046.8564224, 9);
      const outside = difference(featureCollection([turfPolygon(zone.geometry.coordinates), turfPolygon(field().coordinates)]));
      expect(outside ? turfArea(outside) : 0).toBeLessThan(1);
      const inside = scouted.points.filter((p) => p.count !== 0 && booleanPointInPolygon([p.lon, p.lat], zone.geometry)).length;
      expect(zone.properties.sightings).toBe(inside);
    }
  });

  it('grows the zones with a wider margin and shrinks them with a higher density threshold', async () => {
    const total = (body: { zones: { features: Array<{ properties: { areaM2: number } }> } }) =>
      body.zones.features.reduce((s, z) => s + z.properties.areaM2, 0);
    const narrow = (await adviser.post(`/api/checks/${scouted.checkId}/zone-proposal`, { source: 'density', marginM: 0 }).expect(200)).body;
    const wide = (await adviser.post(`/api/checks/${scouted.checkId}/zone-proposal`, { source: 'density', marginM: 25 }).expect(200)).body;
    expect(total(wide)).toBeGreaterThan(total(narrow));
    const low = (
      await adviser.post(`/api/checks/${scouted.checkId}/zone-proposal`, { source: 'density', threshold: narrow.zones.threshold * 0.5, marginM: 0 }).expect(200)
    ).body;
    const high = (
      await adviser.post(`/api/checks/${scouted.checkId}/zone-proposal`, { source: 'density', threshold: narrow.zones.threshold * 1.5, marginM: 0 }).expect(200)
    ).body;
    expect(total(low)).toBeGreaterThan(total(high));
  });

  it('proposes quadrat zones only where cell counts exceed the threshold', async () => {
    const below = (await adviser.post(`/api/checks/${scouted.checkId}/zone-proposal`, { source: 'quadrat', threshold: 1 }).expect(200)).body;
    expect(below.zones.features.length).toBeGreaterThan(0);
    // Every invented count is at most 8, so no cell's mean count per sighting can exceed 100.
    const above = (await adviser.post(`/api/checks/${scouted.checkId}/zone-proposal`, { source: 'quadrat', threshold: 100 }).expect(200)).body;
    expect(above.zones.features).toEqual([]);
  });

  it('refuses a bad source or a negative margin with a sentence', async () => {
    const res = await adviser.post(`/api/checks/${scouted.checkId}/zone-proposal`, { source: 'guess' });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/density or quadrat/);
    const margin = await adviser.post(`/api/checks/${scouted.checkId}/zone-proposal`, { source: 'density', marginM: -3 });
    expect(margin.status).toBe(400);
    expect(margin.body.error.message).toMatch(/margin cannot be negative/);
  });
});

describe('zone sets', () => {
  it('stores accepted zones with the ellipsoidal area, share of field and sightings, and totals the treated area', async () => {
    const zoneSet = await acceptProposedZones(adviser, scouted);
    const rows = await storedZones(zoneSet.id);
    expect(rows.length).toBe(zoneSet.zones.length);
    for (const [i, row] of rows.entries()) {
      const geometry = JSON.parse(row.geometry) as MultiPolygon;
      // PostGIS measures on the WGS 84 ellipsoid, turf on a sphere of radius 6,371,008.8 m: within 0.5 %.
      expect(Math.abs(row.area_m2 - turfArea(geometry)) / row.area_m2).toBeLessThan(0.005);
      expect(zoneSet.zones[i].areaM2).toBeCloseTo(row.area_m2, 6);
      expect(zoneSet.zones[i].shareOfField).toBeCloseTo(row.area_m2 / zoneSet.fieldAreaM2, 9);
      const inside = scouted.points.filter((p) => p.count !== 0 && booleanPointInPolygon([p.lon, p.lat], geometry)).length;
      expect(zoneSet.zones[i].sightingsInside).toBe(inside);
    }
    const sum = rows.reduce((s, r) => s + r.area_m2, 0);
    expect(zoneSet.totalTreatedM2).toBeCloseTo(sum, 3);
    expect(zoneSet.untreatedShare).toBeCloseTo(1 - sum / zoneSet.fieldAreaM2, 9);
  });

  it('numbers each acceptance as a new version and supersedes the previous one', async () => {
    const first = (
      await adviser
        .post(`/api/fields/${scouted.field.id}/zone-sets`, zonesBody([box(lon + dLon * 0.1, lat + dLat * 0.1, lon + dLon * 0.3, lat + dLat * 0.4)]))
        .expect(201)
    ).body.zoneSet;
    const second = (
      await adviser
        .post(
          `/api/fields/${scouted.field.id}/zone-sets`,
          zonesBody([box(lon + dLon * 0.5, lat + dLat * 0.5, lon + dLon * 0.8, lat + dLat * 0.8)], ['North patch']),
        )
        .expect(201)
    ).body.zoneSet;
    expect(second.version).toBe(first.version + 1);
    expect(second.zones[0].label).toBe('North patch');
    expect((await adviser.get(`/api/zone-sets/${first.id}`).expect(200)).body.zoneSet.status).toBe('superseded');
    expect((await adviser.get(`/api/zone-sets/${second.id}`).expect(200)).body.zoneSet.status).toBe('accepted');
    const list = (await adviser.get(`/api/fields/${scouted.field.id}/zone-sets`).expect(200)).body.zoneSets;
    expect(list.filter((s: { status: string }) => s.status === 'accepted')).toHaveLength(1);
    expect(list.map((s: { version: number }) => s.version)).toEqual(expect.arrayContaining([first.version, second.version]));
  });

  it('clips a zone that reaches outside the field and says so', async () => {
    const drawn = box(lon + dLon * 0.8, lat + dLat * 0.2, lon + dLon * 1.3, lat + dLat * 0.6);
    const res = await adviser.post(`/api/fields/${scouted.field.id}/zone-sets`, zonesBody([drawn])).expect(201);
    expect(res.body.adjustments.join(' ')).toMatch(/reached outside the field and was clipped/);
    const [row] = await storedZones(res.body.zoneSet.id);
    const expected = intersect(featureCollection([turfPolygon(drawn.coordinates), turfPolygon(field().coordinates)]));
    expect(Math.abs(row.area_m2 - turfArea(expected!)) / row.area_m2).toBeLessThan(0.005);
  });

  it('refuses zones that lie wholly outside the field, or only as a sliver inside it, with a sentence', async () => {
    const outside = await adviser.post(
      `/api/fields/${scouted.field.id}/zone-sets`,
      zonesBody([box(lon + dLon * 1.5, lat, lon + dLon * 1.8, lat + dLat * 0.3)], ['Road verge']),
    );
    expect(outside.status).toBe(400);
    expect(outside.body.error.message).toMatch(/Road verge lies wholly outside the field/);
    // A strip overlapping the field's east edge by about 1 m (0.00001° of longitude ≈ 0.84 m here).
    const sliver = await adviser.post(
      `/api/fields/${scouted.field.id}/zone-sets`,
      zonesBody([box(lon + dLon - 0.00001, lat + dLat * 0.2, lon + dLon * 1.2, lat + dLat * 0.6)]),
    );
    expect(sliver.status).toBe(400);
    expect(sliver.body.error.message).toMatch(/under 500 m² inside the field/);
  });

  it('refuses a zone that crosses itself or is not a polygon', async () => {
    const bowTie: Polygon = {
      type: 'Polygon',
      coordinates: [
        [
          [lon + dLon * 0.1, lat + dLat * 0.1],
          [lon + dLon * 0.4, lat + dLat * 0.4],
          [lon + dLon * 0.4, lat + dLat * 0.1],
          [lon + dLon * 0.1, lat + dLat * 0.4],
          [lon + dLon * 0.1, lat + dLat * 0.1],
        ],
      ],
    };
    const crossed = await adviser.post(`/api/fields/${scouted.field.id}/zone-sets`, zonesBody([bowTie]));
    expect(crossed.status).toBe(400);
    expect(crossed.body.error.message).toMatch(/Zone 1: .*crosses itself/);
    const point = await adviser.post(`/api/fields/${scouted.field.id}/zone-sets`, {
      pestId: scouted.pest.id,
      zones: { type: 'FeatureCollection', features: [{ type: 'Feature', properties: {}, geometry: { type: 'Point', coordinates: [lon, lat] } }] },
    });
    expect(point.status).toBe(400);
    expect(point.body.error.message).toMatch(/Polygon or MultiPolygon/);
  });
});

describe('zone exports', () => {
  let zoneSet: Awaited<ReturnType<typeof acceptProposedZones>>;
  beforeAll(async () => {
    zoneSet = await acceptProposedZones(adviser, scouted);
  });

  const positionOk = (p: Position) => p.length === 2 && p[0] >= -180 && p[0] <= 180 && p[1] >= -90 && p[1] <= 90;

  it('exports GeoJSON as RFC 7946 asks, with the stored areas', async () => {
    const res = await adviser.get(`/api/zone-sets/${zoneSet.id}/export.geojson`).expect(200);
    expect(res.headers['content-type']).toMatch(/application\/geo\+json/);
    const collection = JSON.parse(res.text);
    // RFC 7946 §3.3 FeatureCollection, §4 no "crs" member, §3.1.7 MultiPolygon, §3.1.6 closed rings of ≥ 4 positions, exterior counter-clockwise.
    expect(collection.type).toBe('FeatureCollection');
    expect(collection.crs).toBeUndefined();
    const rows = await storedZones(zoneSet.id);
    expect(collection.features).toHaveLength(rows.length);
    collection.features.forEach((feature: { type: string; geometry: MultiPolygon; properties: { areaM2: number; label: string } }, i: number) => {
      expect(feature.type).toBe('Feature');
      expect(feature.geometry.type).toBe('MultiPolygon');
      for (const polygon of feature.geometry.coordinates) {
        polygon.forEach((ring, r) => {
          expect(ring.length).toBeGreaterThanOrEqual(4);
          expect(ring[0]).toEqual(ring[ring.length - 1]);
          expect(ring.every(positionOk)).toBe(true);
          expect(booleanClockwise(ring)).toBe(r !== 0);
        });
      }
      expect(feature.properties.label).toBe(rows[i].label);
      expect(feature.properties.areaM2).toBeCloseTo(rows[i].area_m2, 6);
      expect(Math.abs(turfArea(feature.geometry) - rows[i].area_m2) / rows[i].area_m2).toBeLessThan(0.005);
    });
  });

  it('exports KML 2.2 that reads back (togeojson) to the same zones and coordinates', async () => {
    const res = await adviser.get(`/api/zone-sets/${zoneSet.id}/export.kml`).expect(200);
    expect(res.headers['content-type']).toMatch(/kml/);
    const document = new DOMParser().parseFromString(res.text, 'text/xml');
    const back = kmlToGeoJson(document as never);
    const geojson = JSON.parse((await adviser.get(`/api/zone-sets/${zoneSet.id}/export.geojson`).expect(200)).text);
    expect(back.features).toHaveLength(geojson.features.length);
    back.features.forEach((feature, i) => {
      expect(feature.properties?.name).toBe(geojson.features[i].properties.label);
      const polygons =
        feature.geometry?.type === 'Polygon'
          ? [feature.geometry.coordinates]
          : feature.geometry?.type === 'MultiPolygon'
            ? feature.geometry.coordinates
            : (feature.geometry as { geometries: Polygon[] }).geometries.map((g) => g.coordinates);
      const expected = geojson.features[i].geometry.coordinates as number[][][][];
      expect(polygons.length).toBe(expected.length);
      polygons.forEach((polygon, p) =>
        polygon.forEach((ring, r) =>
          ring.forEach((position, k) => {
            expect(position[0]).toBeCloseTo(expected[p][r][k][0], 9);
            expect(position[1]).toBeCloseTo(expected[p][r][k][1], 9);
          }),
        ),
      );
      expect(Math.abs(turfArea(turfMultiPolygon(polygons)) - geojson.features[i].properties.areaM2) / geojson.features[i].properties.areaM2).toBeLessThan(
        0.005,
      );
    });
  });
});

describe('zone access', () => {
  it('answers 404 to another organisation for zone sets, exports, proposals and fields', async () => {
    const zoneSet = await acceptProposedZones(adviser, scouted);
    for (const url of [
      `/api/zone-sets/${zoneSet.id}`,
      `/api/zone-sets/${zoneSet.id}/export.geojson`,
      `/api/zone-sets/${zoneSet.id}/export.kml`,
      `/api/fields/${scouted.field.id}/zone-sets`,
    ]) {
      expect((await outsider.get(url)).status, url).toBe(404);
    }
    expect((await outsider.post(`/api/checks/${scouted.checkId}/zone-proposal`, { source: 'density' })).status).toBe(404);
    expect(
      (
        await outsider.post(
          `/api/fields/${scouted.field.id}/zone-sets`,
          zonesBody([box(lon + dLon * 0.1, lat + dLat * 0.1, lon + dLon * 0.3, lat + dLat * 0.4)]),
        )
      ).status,
    ).toBe(404);
  });

  it('refuses scouts and growers the adviser’s zone work, and scouts the zone sets', async () => {
    const body = zonesBody([box(lon + dLon * 0.1, lat + dLat * 0.1, lon + dLon * 0.3, lat + dLat * 0.4)]);
    for (const client of [scout, grower]) {
      expect((await client.post(`/api/checks/${scouted.checkId}/zone-proposal`, { source: 'density' })).status).toBe(403);
      expect((await client.post(`/api/fields/${scouted.field.id}/zone-sets`, body)).status).toBe(403);
    }
    expect((await scout.get(`/api/fields/${scouted.field.id}/zone-sets`)).status).toBe(403);
    // The grower is not linked to this farm: the field is not theirs to see.
    expect((await grower.get(`/api/fields/${scouted.field.id}/zone-sets`)).status).toBe(404);
  });
});
