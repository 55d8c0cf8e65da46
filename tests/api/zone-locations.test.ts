// Each zone of a notice carries what an applicator finds it by: its centre and its distance and compass direction
// from the nearest field corner, in the notice material (and so the snapshot), the e-mail and the notice page.
// Expected values are worked by hand below on the test's rectangle field, without turf.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Polygon } from 'geojson';
import { stopQueue } from '../../server/jobs/queue.ts';
import { noticeMaterial } from '../../server/services/notice-material.ts';
import { compassPoint } from '../../server/services/zone-locations.ts';
import { signedIn, type Client } from '../helpers/http.ts';
import { makeOrganisation, type TestOrganisation } from '../helpers/org.ts';
import { makeField, makePest } from '../helpers/sightings.ts';
import { addContacts } from '../helpers/zones.ts';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../server/db.ts';

let org: TestOrganisation;
let adviser: Client;
let noticeId: string;
let farmId: string;

/** A small square (0.0004° × 0.0003°) around a centre, so the centre is its centroid by symmetry. */
const square = (lon: number, lat: number): Polygon => ({
  type: 'Polygon',
  coordinates: [
    [
      [lon - 0.0002, lat - 0.00015],
      [lon + 0.0002, lat - 0.00015],
      [lon + 0.0002, lat + 0.00015],
      [lon - 0.0002, lat + 0.00015],
      [lon - 0.0002, lat - 0.00015],
    ],
  ],
});

// The field is the helpers' rectangle: corners (-96.6, 41.2), (-96.595, 41.2), (-96.595, 41.203), (-96.6, 41.203).
// Worked by hand on a sphere of radius R = 6 371 008.8 m (the IUGG mean Earth radius) with the equirectangular
// approximation x = R·Δλ·cos φm, y = R·Δφ (good to well under a millimetre at 100 m), bearing = atan2(x, y):
// Zone A, centre (-96.599, 41.2005), nearest corner the south-west one (-96.6, 41.2):
//   y = R × 0.0005° × π/180 = 6 371 008.8 × 8.72665e-6 = 55.60 m; φm = 41.20025°, cos φm = 0.752412;
//   x = R × 0.001° × π/180 × 0.752412 = 6 371 008.8 × 1.745329e-5 × 0.752412 = 83.66 m;
//   d = √(83.66² + 55.60²) = 100.45 m; bearing = atan2(83.66, 55.60) = 56.39°, which is NE.
// Zone B, centre (-96.596, 41.2024), nearest corner the north-east one (-96.595, 41.203) (the south-east one is 267 m):
//   y = −R × 0.0006° × π/180 = −66.72 m; φm = 41.2027°, cos φm = 0.752384; x = −83.66 m;
//   d = √(83.66² + 66.72²) = 107.01 m; bearing = 180° + atan(83.66 / 66.72) = 180° + 51.43° = 231.43°, which is SW.
const expected = [
  {
    label: 'North-east of the gate',
    centre: { lon: -96.599, lat: 41.2005 },
    corner: { lon: -96.6, lat: 41.2 },
    distanceM: 100.45,
    bearingDeg: 56.39,
    direction: 'NE',
  },
  {
    label: 'By the far corner',
    centre: { lon: -96.596, lat: 41.2024 },
    corner: { lon: -96.595, lat: 41.203 },
    distanceM: 107.01,
    bearingDeg: 231.43,
    direction: 'SW',
  },
];

beforeAll(async () => {
  org = await makeOrganisation('Zone locations');
  adviser = await signedIn(org.users.adviser.email);
  const field = await makeField(org);
  farmId = field.farmId;
  const pest = await makePest(org);
  const zones = {
    type: 'FeatureCollection',
    features: expected.map((z) => ({ type: 'Feature', properties: { label: z.label }, geometry: square(z.centre.lon, z.centre.lat) })),
  };
  const zoneSet = (await adviser.post(`/api/fields/${field.id}/zone-sets`, { pestId: pest.id, zones }).expect(201)).body.zoneSet;
  noticeId = (await adviser.post('/api/notices', { fieldId: field.id, zoneSetId: zoneSet.id, recommendation: 'Spot-spray both zones this week.' }).expect(201))
    .body.notice.id;
});

afterAll(async () => {
  await stopQueue();
});

describe('where each zone of a notice is', () => {
  it('gives each zone its centre and its distance and direction from the nearest field corner, as worked by hand', async () => {
    const { content } = await noticeMaterial(noticeId);
    expect(content.zones.map((z) => z.label)).toEqual(expected.map((z) => z.label));
    content.zones.forEach((zone, i) => {
      const want = expected[i];
      expect(zone.location!.centre.lon).toBeCloseTo(want.centre.lon, 7);
      expect(zone.location!.centre.lat).toBeCloseTo(want.centre.lat, 7);
      expect(zone.location!.nearestCorner).toEqual(want.corner);
      expect(Math.abs(zone.location!.distanceM - want.distanceM)).toBeLessThan(0.05);
      expect(Math.abs(zone.location!.bearingDeg - want.bearingDeg)).toBeLessThan(0.05);
      expect(zone.location!.direction).toBe(want.direction);
    });
  });

  it('writes the location into the e-mail’s zone table, in both parts', async () => {
    const { text, html } = (await adviser.get(`/api/notices/${noticeId}/preview`).expect(200)).body;
    expect(text).toContain('North-east of the gate: ');
    expect(text).toContain('; centre 41.20050, -96.59900, 100 m NE of the field corner at 41.20000, -96.60000');
    expect(text).toContain('; centre 41.20240, -96.59600, 107 m SW of the field corner at 41.20300, -96.59500');
    expect(html).toContain('>Centre (lat, lon)</th>');
    expect(html).toContain('>41.20050, -96.59900</td>');
    expect(html).toContain('>100 m NE of the field corner at 41.20000, -96.60000</td>');
  });

  it('keeps the locations in the snapshot stored when the notice is sent', async () => {
    await addContacts(farmId, [{ name: 'Dot Furrow', email: `dot-${org.id.slice(0, 8)}@farm.example` }]);
    await adviser.post(`/api/notices/${noticeId}/send`).expect(202);
    const [row] = await sequelize.query<{ locations: Array<{ distanceM: number; direction: string }> }>(
      `SELECT jsonb_path_query_array(material, '$.content.zones[*].location') AS locations FROM notices WHERE id = :noticeId`,
      { replacements: { noticeId }, type: QueryTypes.SELECT },
    );
    expect(row.locations.map((l) => l.direction)).toEqual(expected.map((z) => z.direction));
    row.locations.forEach((l, i) => expect(Math.abs(l.distanceM - expected[i].distanceM)).toBeLessThan(0.05));
  });

  it.each([
    [0, 'N'],
    [22.4, 'N'],
    [22.6, 'NE'],
    [90, 'E'],
    [180, 'S'],
    [231.43, 'SW'],
    [337.6, 'N'],
    [359.9, 'N'],
    [-45, 'NW'],
  ])('names a bearing of %s° %s on the eight-point compass (45° sectors centred on each point)', (degrees, word) => {
    expect(compassPoint(degrees)).toBe(word);
  });
});
