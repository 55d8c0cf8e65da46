// Each boundary fault is refused with its own code and a sentence that says what to fix, and stores nothing;
// each accepted form (GeoJSON wrappers, KML) creates a field.
import { beforeAll, describe, expect, it } from 'vitest';
import { area as turfArea, circle as turfCircle } from '@turf/turf';
import type { Polygon } from 'geojson';
import { signedIn, type Client } from '../helpers/http.ts';
import { makeOrganisation, type TestOrganisation } from '../helpers/org.ts';
import { createFarm, fieldCount, uniqueName } from '../helpers/farm-records.ts';
import { degreeRectangle, TEST_FIELD_ORIGIN, utmRectangle } from '../helpers/boundary-shapes.ts';

const { lon, lat } = TEST_FIELD_ORIGIN;
const field = utmRectangle(lon, lat, 400, 250);
const ring = field.coordinates[0];

/** A KML 2.2 document (OGC 07-147r2): Placemark › Polygon › outerBoundaryIs/innerBoundaryIs › LinearRing › coordinates "lon,lat[,alt]". */
function kmlPlacemark(outer: number[][], holes: number[][][] = []) {
  const coords = (r: number[][]) => r.map(([x, y]) => `${x},${y},0`).join(' ');
  const inner = holes.map((h) => `<innerBoundaryIs><LinearRing><coordinates>${coords(h)}</coordinates></LinearRing></innerBoundaryIs>`).join('');
  return `<?xml version="1.0" encoding="UTF-8"?>
<kml xmlns="http://www.opengis.net/kml/2.2">
  <Document>
    <Placemark>
      <name>Test field</name>
      <Polygon>
        <outerBoundaryIs><LinearRing><coordinates>${coords(outer)}</coordinates></LinearRing></outerBoundaryIs>
        ${inner}
      </Polygon>
    </Placemark>
  </Document>
</kml>`;
}

let org: TestOrganisation;
let admin: Client;
let farmId: string;

beforeAll(async () => {
  org = await makeOrganisation('Boundaries');
  admin = await signedIn(org.users.admin.email);
  farmId = (await createFarm(admin)).id;
});

const fieldBody = (boundary: { boundary?: unknown; boundaryFile?: string }) => ({
  farmId,
  name: uniqueName('Boundary test'),
  crop: 'maize',
  season: 2026,
  ...boundary,
});

async function refusal(boundary: { boundary?: unknown; boundaryFile?: string }) {
  const before = await fieldCount(org.id);
  const res = await admin.post('/api/fields', fieldBody(boundary));
  const after = await fieldCount(org.id);
  return { res, stored: after - before };
}

const shift = (r: number[][], dx: number, dy: number) => r.map(([x, y]) => [x + dx, y + dy]);
const [sw, se, ne, nw] = ring;

/** A circle of 400 m radius drawn by turf with this many corners (plus the closing repeat). */
const circleOf = (corners: number) => turfCircle([lon, lat], 0.4, { steps: corners }).geometry;
const crossedCircle = () => {
  const shape = circleOf(19_000);
  const r = shape.coordinates[0];
  [r[7000], r[7001]] = [r[7001], r[7000]];
  return shape;
};

const faults: Array<[string, string, { boundary?: unknown; boundaryFile?: string }, RegExp]> = [
  ['a Point', 'not-polygon', { boundary: { type: 'Point', coordinates: [lon, lat] } }, /Point, not a polygon/],
  ['a LineString', 'not-polygon', { boundary: { type: 'LineString', coordinates: [sw, se, ne] } }, /LineString, not a polygon/],
  ['a ring whose last position does not repeat its first', 'ring-not-closed', { boundary: { type: 'Polygon', coordinates: [[sw, se, ne, nw]] } }, /not closed/],
  ['a ring of only two corners', 'ring-too-short', { boundary: { type: 'Polygon', coordinates: [[sw, ne, sw]] } }, /fewer than 4 positions/],
  ['a bow-tie that crosses itself', 'self-intersecting', { boundary: { type: 'Polygon', coordinates: [[sw, ne, se, nw, sw]] } }, /crosses itself/],
  ['a 19,000-corner circle with two neighbouring corners swapped', 'self-intersecting', { boundary: crossedCircle() }, /crosses itself/],
  [
    'a circle of 20,001 corners, over the limit',
    'too-many-corners',
    { boundary: circleOf(20_001) },
    /^This boundary has 20,001 corners; Patchwise takes at most 20,000 — simplify it .*and upload again\.$/,
  ],
  ['a longitude beyond 180°', 'out-of-range', { boundary: degreeRectangle(179.999, 10, 0.004, 0.004) }, /outside WGS 84/],
  ['a latitude beyond 90° that is not a swap', 'out-of-range', { boundary: degreeRectangle(120, 90.001, 0.004, 0.004) }, /outside WGS 84/],
  [
    'latitude and longitude given the wrong way round',
    'swapped-coordinates',
    { boundary: { type: 'Polygon', coordinates: [ring.map(([x, y]) => [y, x])] } },
    /look swapped/,
  ],
  ['a boundary of 20 m × 20 m (0.04 ha)', 'area-too-small', { boundary: utmRectangle(lon, lat, 20, 20) }, /under the 0\.05 ha/],
  ['a boundary of 1° × 1° (about 900,000 ha)', 'area-too-large', { boundary: degreeRectangle(-94, 42, 1, 1) }, /over the 5,000 ha/],
  ['a Polygon written with one level of brackets too few', 'unparseable', { boundary: { type: 'Polygon', coordinates: ring } }, /check the brackets/],
  ['a MultiPolygon whose parts are not lists of rings', 'unparseable', { boundary: { type: 'MultiPolygon', coordinates: [1, 2] } }, /not a list of rings/],
  ['a file of plain text', 'unparseable', { boundaryFile: 'north field, about 10 ha, by the creek' }, /could not be read/],
  ['a truncated GeoJSON file', 'unparseable', { boundaryFile: JSON.stringify({ type: 'Polygon', coordinates: [ring] }).slice(0, 40) }, /could not be read/],
  ['a broken KML file', 'unparseable', { boundaryFile: kmlPlacemark(ring).slice(0, 200) }, /KML file could not be read/],
  [
    'a hole outside its outline',
    'hole-outside-shell',
    { boundary: { type: 'Polygon', coordinates: [ring, shift(utmRectangle(lon, lat, 50, 50).coordinates[0], 0.02, 0)] } },
    /hole .*outside/i,
  ],
];

describe('boundary faults', () => {
  it.each(faults)('refuses %s with boundary_%s and stores nothing', async (_what, code, boundary, sentence) => {
    const { res, stored } = await refusal(boundary);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe(`boundary_${code}`);
    expect(res.body.error.message).toMatch(sentence);
    expect(res.body.error.message).toMatch(/^[A-Z].{20,}\.$/);
    expect(res.body.error.fields.boundary).toBe(res.body.error.message);
    expect(stored).toBe(0);
  });

  it('refuses a field with no boundary at all and stores nothing', async () => {
    const { res, stored } = await refusal({});
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/Add a boundary/);
    expect(stored).toBe(0);
  });

  it('accepts a 19,000-corner circle, under the corner limit', async () => {
    const res = await admin.post('/api/fields', fieldBody({ boundary: circleOf(19_000) })).expect(201);
    expect(res.body.field.boundary.coordinates[0][0]).toHaveLength(19_001);
  });

  it('keeps longitude and latitude only when positions carry a height', async () => {
    const res = await admin.post('/api/fields', fieldBody({ boundary: { type: 'Polygon', coordinates: [ring.map(([x, y]) => [x, y, 312])] } })).expect(201);
    expect(res.body.field.boundary.coordinates[0][0].every((p: number[]) => p.length === 2)).toBe(true);
  });

  it('refuses two parts that overlap each other (PostGIS validity) and stores nothing', async () => {
    const overlapping = { type: 'MultiPolygon', coordinates: [[ring], [shift(ring, 0.001, 0)]] };
    const { res, stored } = await refusal({ boundary: overlapping });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('boundary_self-intersecting');
    expect(res.body.error.message).toMatch(/not a valid polygon \(Self-intersection near \(/);
    expect(stored).toBe(0);
  });

  it('refuses a faulty boundary on edit and keeps the old one', async () => {
    const created = await admin.post('/api/fields', fieldBody({ boundary: field })).expect(201);
    const res = await admin.patch(`/api/fields/${created.body.field.id}`, { boundary: { type: 'Polygon', coordinates: [[sw, ne, se, nw, sw]] } });
    expect(res.body.error.code).toBe('boundary_self-intersecting');
    const after = await admin.get(`/api/fields/${created.body.field.id}`).expect(200);
    expect(after.body.field.boundary).toEqual(created.body.field.boundary);
  });
});

describe('accepted boundary forms', () => {
  const second = utmRectangle(lon + 0.01, lat, 200, 200);
  const hole = utmRectangle(lon + 0.001, lat + 0.0005, 100, 50).coordinates[0];
  const accepted: Array<[string, { boundary?: unknown; boundaryFile?: string }, number, object]> = [
    ['a Polygon', { boundary: field }, 1, field],
    [
      'a MultiPolygon of two parts',
      { boundary: { type: 'MultiPolygon', coordinates: [field.coordinates, second.coordinates] } },
      2,
      { type: 'MultiPolygon', coordinates: [field.coordinates, second.coordinates] },
    ],
    ['a Feature', { boundary: { type: 'Feature', properties: { name: 'North' }, geometry: field } }, 1, field],
    ['a FeatureCollection', { boundary: { type: 'FeatureCollection', features: [{ type: 'Feature', properties: {}, geometry: field }] } }, 1, field],
    ['a GeoJSON file', { boundaryFile: JSON.stringify({ type: 'Feature', properties: {}, geometry: field }) }, 1, field],
    ['a KML Placemark with a Polygon', { boundaryFile: kmlPlacemark(ring) }, 1, field],
    ['a KML Polygon with a hole', { boundaryFile: kmlPlacemark(ring, [hole]) }, 1, { type: 'Polygon', coordinates: [ring, hole] } satisfies Polygon],
  ];

  it.each(accepted)('creates a field from %s', async (_what, boundary, parts, expectedShape) => {
    const before = await fieldCount(org.id);
    const res = await admin.post('/api/fields', fieldBody(boundary));
    expect(res.status).toBe(201);
    expect(await fieldCount(org.id)).toBe(before + 1);
    expect(res.body.field.boundary.type).toBe('MultiPolygon');
    expect(res.body.field.boundary.coordinates).toHaveLength(parts);
    // Stored area (ellipsoid) against turf's spherical area of what was sent: same outline, holes subtracted.
    expect(Math.abs(res.body.field.areaM2 / turfArea(expectedShape as Polygon) - 1)).toBeLessThan(0.005);
  });
});
