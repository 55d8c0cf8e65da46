// The bad-input catalogue: boundaries, photos, forms and query parameters that a person (or a broken client)
// might send, each with the sentence that tells them what to fix, its error code, and proof nothing stored changed
// (row counts of the main tables and the upload folder's listing, before and after).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import type request from 'supertest';
import { sequelize } from '../../server/db.ts';
import { stopQueue } from '../../server/jobs/queue.ts';
import { closeSimulationPool } from '../../server/services/check-runner.ts';
import type { Client } from '../helpers/http.ts';
import { signedIn } from '../helpers/http.ts';
import { degreeRectangle, utmRectangle } from '../helpers/boundary-shapes.ts';
import { createFarm, uniqueName } from '../helpers/farm-records.ts';
import { insideField, makeJpeg, scoutingSetUp, uploadedFiles, uploadPhotos, type ScoutingSetUp } from '../helpers/photos.ts';

interface World extends ScoutingSetUp {
  adviser: Client;
  farmId: string;
  walkId: string;
  sightingId: string;
  jpeg: Buffer;
}

interface BadInput {
  what: string;
  send: (w: World) => request.Test | Promise<request.Response>;
  status: number;
  /** The error code, or for a photo the outcome of its line in the upload answer. */
  code: string;
  message: RegExp;
}

const TABLES = [
  'organisations',
  'users',
  'farms',
  'farm_contacts',
  'fields',
  'field_assignments',
  'pests',
  'walks',
  'sightings',
  'photos',
  'pattern_checks',
  'zone_sets',
  'zones',
  'notices',
  'notice_recipients',
  'audit_log',
];

async function snapshot() {
  const [counts] = await sequelize.query<Record<string, number>>(`SELECT ${TABLES.map((t) => `(SELECT count(*)::int FROM ${t}) AS ${t}`).join(', ')}`, {
    type: QueryTypes.SELECT,
  });
  return { counts, files: uploadedFiles() };
}

/** A field whose boundary is a GeometryCollection holding a GeometryCollection … `depth` times, written as JSON text
 * directly (the test client's own serialiser would run out of stack on it before the server saw it). */
function fieldWithNestedCollections(w: World, depth: number) {
  const boundary = '{"type":"GeometryCollection","geometries":['.repeat(depth) + ']}'.repeat(depth);
  const body = `{"farmId":"${w.farmId}","name":"${uniqueName('Catalogue')}","crop":"maize","season":2026,"boundary":${boundary}}`;
  return w.admin.agent.post('/api/fields').set('x-csrf-token', w.admin.csrf).set('Content-Type', 'application/json').send(body);
}

const field = (w: World, boundary: unknown, extra: Record<string, unknown> = {}) =>
  w.admin.post('/api/fields', { farmId: w.farmId, name: uniqueName('Catalogue'), crop: 'maize', season: 2026, boundary, ...extra });
const upload = (w: World, bytes: Buffer, fields: Record<string, string | number | undefined> = {}, name = 'photo.jpg') =>
  uploadPhotos(w.scout, [{ bytes, name }], { pestId: w.pest.id, fieldId: w.field.id, ...fields });
const lon = -93.62;
const lat = 42.03;
const square = utmRectangle(lon, lat, 300, 300).coordinates[0];
const [sw, se, ne, nw] = square;

const catalogue: BadInput[] = [
  // Boundaries
  {
    what: 'a boundary that is a Point',
    send: (w) => field(w, { type: 'Point', coordinates: [lon, lat] }),
    status: 400,
    code: 'boundary_not-polygon',
    message: /Point, not a polygon/,
  },
  {
    what: 'a ring that is not closed',
    send: (w) => field(w, { type: 'Polygon', coordinates: [[sw, se, ne, nw]] }),
    status: 400,
    code: 'boundary_ring-not-closed',
    message: /not closed/,
  },
  {
    what: 'a ring of two corners',
    send: (w) => field(w, { type: 'Polygon', coordinates: [[sw, ne, sw]] }),
    status: 400,
    code: 'boundary_ring-too-short',
    message: /fewer than 4 positions/,
  },
  {
    what: 'a bow-tie boundary',
    send: (w) => field(w, { type: 'Polygon', coordinates: [[sw, ne, se, nw, sw]] }),
    status: 400,
    code: 'boundary_self-intersecting',
    message: /crosses itself/,
  },
  {
    what: 'a longitude beyond 180°',
    send: (w) => field(w, degreeRectangle(179.999, 10, 0.004, 0.004)),
    status: 400,
    code: 'boundary_out-of-range',
    message: /outside WGS 84/,
  },
  {
    what: 'swapped latitude and longitude',
    send: (w) => field(w, { type: 'Polygon', coordinates: [square.map(([x, y]) => [y, x])] }),
    status: 400,
    code: 'boundary_swapped-coordinates',
    message: /look swapped/,
  },
  {
    what: 'a 20 m square field',
    send: (w) => field(w, utmRectangle(lon, lat, 20, 20)),
    status: 400,
    code: 'boundary_area-too-small',
    message: /under the 0\.05 ha/,
  },
  {
    what: 'a 1° square field',
    send: (w) => field(w, degreeRectangle(-94, 42, 1, 1)),
    status: 400,
    code: 'boundary_area-too-large',
    message: /over the 5,000 ha/,
  },
  {
    what: 'coordinates one bracket level short',
    send: (w) => field(w, { type: 'Polygon', coordinates: square }),
    status: 400,
    code: 'boundary_unparseable',
    message: /check the brackets/,
  },
  {
    what: 'a boundary file of plain text',
    send: (w) => field(w, undefined, { boundaryFile: 'the north field by the creek' }),
    status: 400,
    code: 'boundary_unparseable',
    message: /could not be read/,
  },
  {
    what: 'a truncated KML file',
    send: (w) => field(w, undefined, { boundaryFile: '<kml xmlns="http://www.opengis.net/kml/2.2"><Document><Placemark><Polygon><outerBoundaryIs>' }),
    status: 400,
    code: 'boundary_unparseable',
    message: /KML file could not be read/,
  },
  { what: 'a field with no boundary at all', send: (w) => field(w, undefined), status: 400, code: 'boundary_not-polygon', message: /Add a boundary/ },
  {
    what: 'a boundary with text for a coordinate',
    send: (w) => field(w, { type: 'Polygon', coordinates: [[sw, ['east', 'north'], ne, sw]] }),
    status: 400,
    code: 'boundary_unparseable',
    message: /position that is not a pair of numbers/,
  },
  {
    what: 'zones that are not a FeatureCollection',
    send: (w) => w.adviser.post(`/api/fields/${w.field.id}/zone-sets`, { pestId: w.pest.id, zones: { type: 'Feature' } }),
    status: 400,
    code: 'invalid',
    message: /FeatureCollection/,
  },
  {
    what: 'a zone set with no zones',
    send: (w) => w.adviser.post(`/api/fields/${w.field.id}/zone-sets`, { pestId: w.pest.id, zones: { type: 'FeatureCollection', features: [] } }),
    status: 400,
    code: 'invalid',
    message: /at least one zone/,
  },

  // Photos
  { what: 'an empty photo file', send: (w) => upload(w, Buffer.alloc(0)), status: 200, code: 'rejected', message: /empty \(0 bytes\)/ },
  {
    what: 'a text file named .jpg',
    send: (w) => upload(w, Buffer.from('these are my field notes, not a photo')),
    status: 200,
    code: 'rejected',
    message: /whatever its name says; send a JPEG/,
  },
  {
    what: 'a PDF named .jpg',
    send: (w) => upload(w, Buffer.from('%PDF-1.7\n1 0 obj\n<<>>\nendobj\n')),
    status: 200,
    code: 'rejected',
    message: /whatever its name says/,
  },
  {
    what: 'a JPEG cut off halfway',
    send: (w) => upload(w, w.jpeg.subarray(0, Math.floor(w.jpeg.length / 2))),
    status: 200,
    code: 'rejected',
    message: /incomplete/,
  },
  {
    what: 'a photo taken outside the field',
    send: async (w) => upload(w, await makeJpeg({ gps: { lon: -58.0, lat: -34.0 } })),
    status: 200,
    code: 'outside',
    message: /outside .*nothing was kept/,
  },
  {
    what: 'a photo with no pest chosen',
    send: (w) => upload(w, w.jpeg, { pestId: undefined }),
    status: 400,
    code: 'invalid',
    message: /Choose the pest for these photos/,
  },
  { what: 'a photo with a negative count', send: (w) => upload(w, w.jpeg, { count: -3 }), status: 400, code: 'invalid', message: /cannot be negative/ },
  {
    what: 'a photo with a count that is not a number',
    send: (w) => upload(w, w.jpeg, { count: 'lots' }),
    status: 400,
    code: 'invalid',
    message: /must be a number/,
  },
  {
    what: 'per-photo counts that are not JSON',
    send: (w) => upload(w, w.jpeg, { counts: '[1, 2' }),
    status: 400,
    code: 'invalid',
    message: /JSON list of numbers/,
  },
  {
    what: 'two counts for one photo',
    send: (w) => upload(w, w.jpeg, { counts: '[1, 2]' }),
    status: 400,
    code: 'invalid',
    message: /one count per photo: 1 photos but 2 counts/i,
  },
  {
    what: 'an upload with no photo',
    send: (w) => w.scout.agent.post('/api/photos').set('x-csrf-token', w.scout.csrf).field('pestId', w.pest.id),
    status: 400,
    code: 'invalid',
    message: /Choose at least one photo/,
  },
  {
    what: 'photos in the wrong form part',
    send: (w) => w.scout.agent.post('/api/photos').set('x-csrf-token', w.scout.csrf).field('pestId', w.pest.id).attach('picture', w.jpeg, 'a.jpg'),
    status: 400,
    code: 'invalid',
    message: /in the “photos” part/,
  },
  {
    what: '21 photos in one upload',
    send: (w) =>
      uploadPhotos(
        w.scout,
        Array.from({ length: 21 }, () => ({ bytes: Buffer.from([0xff, 0xd8, 0xff]) })),
        { pestId: w.pest.id },
      ),
    status: 413,
    code: 'too_large',
    message: /at most 20 photos at a time/,
  },
  {
    what: 'a pest from no library',
    send: (w) => upload(w, w.jpeg, { pestId: '00000000-0000-4000-8000-000000000000' }),
    status: 400,
    code: 'invalid',
    message: /pest library/,
  },

  // Forms
  {
    what: 'a farm without a name',
    send: (w) => w.admin.post('/api/farms', { name: '  ', contacts: [] }),
    status: 400,
    code: 'invalid',
    message: /Enter the farm name/,
  },
  {
    what: 'a farm contact with a bad e-mail',
    send: (w) => w.admin.post('/api/farms', { name: uniqueName('Farm'), contacts: [{ name: 'Ada', email: 'ada-at-farm' }] }),
    status: 400,
    code: 'invalid',
    message: /valid e-mail address/,
  },
  {
    what: 'two contacts with one e-mail',
    send: (w) =>
      w.admin.post('/api/farms', {
        name: uniqueName('Farm'),
        contacts: [
          { name: 'A', email: 'same@farm.example' },
          { name: 'B', email: 'same@farm.example' },
        ],
      }),
    status: 400,
    code: 'invalid',
    message: /different e-mail address/,
  },
  {
    what: 'a field season of 1850',
    send: (w) => field(w, utmRectangle(lon, lat, 300, 300), { season: 1850 }),
    status: 400,
    code: 'invalid',
    message: /season from 1990 on/,
  },
  {
    what: 'a pest of an unknown kind',
    send: (w) =>
      w.admin.post('/api/pests', { name: uniqueName('Pest'), kind: 'mammal', countUnit: 'per m²', actionThreshold: 1, thresholdSource: 'Catalogue test' }),
    status: 400,
    code: 'invalid',
    message: /insect, disease or weed/,
  },
  {
    what: 'a negative action threshold',
    send: (w) =>
      w.admin.post('/api/pests', { name: uniqueName('Pest'), kind: 'weed', countUnit: 'per m²', actionThreshold: -1, thresholdSource: 'Catalogue test' }),
    status: 400,
    code: 'invalid',
    message: /cannot be negative/,
  },
  {
    what: 'a pest threshold without its source',
    send: (w) => w.admin.post('/api/pests', { name: uniqueName('Pest'), kind: 'weed', countUnit: 'per m²', actionThreshold: 1, thresholdSource: 'x' }),
    status: 400,
    code: 'invalid',
    message: /where the threshold comes from/,
  },
  {
    what: 'an invitation with an unknown role',
    send: (w) => w.admin.post('/api/users', { name: 'Someone', email: `someone-${Date.now()}@test.example`, role: 'owner' }),
    status: 400,
    code: 'invalid',
    message: /Choose a role: admin, adviser, scout or grower/,
  },
  {
    what: 'a walk on 30 February',
    send: (w) => w.scout.post('/api/walks', { fieldId: w.field.id, walkedOn: '2026-02-30' }),
    status: 400,
    code: 'invalid',
    message: /not a real calendar date/,
  },
  {
    what: 'walk notes over 4000 characters',
    send: (w) => w.scout.patch(`/api/walks/${w.walkId}`, { notes: 'n'.repeat(4001) }),
    status: 400,
    code: 'invalid',
    message: /under 4000 characters/,
  },
  {
    what: 'an empty stop outside the field',
    send: (w) => w.scout.post(`/api/walks/${w.walkId}/stops`, { pestId: w.pest.id, lon: -60, lat: -34, accuracyM: 5 }),
    status: 400,
    code: 'invalid',
    message: /walk into the field/,
  },
  {
    what: 'an empty stop at latitude 95',
    send: (w) => w.scout.post(`/api/walks/${w.walkId}/stops`, { pestId: w.pest.id, lon: -58.9, lat: 95, accuracyM: 5 }),
    status: 400,
    code: 'invalid',
    message: /Latitude must lie between −90 and 90/,
  },
  {
    what: 'a pin outside the field',
    send: (w) => w.scout.patch(`/api/sightings/${w.sightingId}`, { position: { lon: -60, lat: -34 } }),
    status: 400,
    code: 'invalid',
    message: /outside .*inside the field boundary/,
  },
  {
    what: 'a check whose window ends before it starts',
    send: (w) => w.adviser.post('/api/checks', { fieldId: w.field.id, pestId: w.pest.id, from: '2026-08-01', to: '2026-07-01' }),
    status: 400,
    code: 'invalid',
    message: /from date must not be after its to date/,
  },
  {
    what: 'a check with negative simulations',
    send: (w) => w.adviser.post('/api/checks', { fieldId: w.field.id, pestId: w.pest.id, options: { simulations: -5 } }),
    status: 400,
    code: 'invalid_option',
    message: /Option "simulations"/,
  },
  {
    what: 'a check option that does not exist',
    send: (w) => w.adviser.post('/api/checks', { fieldId: w.field.id, pestId: w.pest.id, options: { colour: 'red' } }),
    status: 400,
    code: 'invalid_option',
    message: /"colour" is not a check option/,
  },
  {
    what: 'a notice recommendation of one word',
    send: (w) => w.adviser.post('/api/notices', { fieldId: w.field.id, zoneSetId: w.field.id, recommendation: 'Spray' }),
    status: 400,
    code: 'invalid',
    message: /at least a sentence/,
  },
  {
    what: 'a body that is not JSON',
    send: (w) => w.admin.agent.post('/api/farms').set('x-csrf-token', w.admin.csrf).set('Content-Type', 'application/json').send('{"name": "Broken'),
    status: 400,
    code: 'invalid',
    message: /not valid JSON/,
  },
  {
    what: 'a set-password link cut short',
    send: (w) => w.admin.post('/api/auth/set-password', { token: 'abc', password: 'a-long-enough-password' }),
    status: 400,
    code: 'invalid',
    message: /link is incomplete/,
  },

  // Query parameters
  { what: 'a field id that is not an id', send: (w) => w.admin.get('/api/fields/north-forty'), status: 400, code: 'invalid', message: /field id is not valid/ },
  { what: 'a farm filter that is not an id', send: (w) => w.admin.get('/api/fields?farmId=42'), status: 400, code: 'invalid', message: /farm id is not valid/ },
  { what: 'sightings without a field', send: (w) => w.adviser.get('/api/sightings'), status: 400, code: 'invalid', message: /Choose a field \(or a walk\)/ },
  {
    what: 'a check window from date that is not a date',
    send: (w) => w.adviser.post('/api/checks', { fieldId: w.field.id, pestId: w.pest.id, from: 'x' }),
    status: 400,
    code: 'invalid',
    message: /from date as YYYY-MM-DD/,
  },
  // 30 February exists in no year (Gregorian calendar; ISO 8601 dates).
  {
    what: 'a check window on 30 February',
    send: (w) => w.adviser.post('/api/checks', { fieldId: w.field.id, pestId: w.pest.id, from: '2026-02-30' }),
    status: 400,
    code: 'invalid',
    message: /from date is not a real calendar date/,
  },
  {
    what: 'a re-scout date of "soon"',
    send: (w) =>
      w.adviser.post('/api/notices', { fieldId: w.field.id, zoneSetId: w.field.id, recommendation: 'Spot-spray the patches this week.', rescoutOn: 'soon' }),
    status: 400,
    code: 'invalid',
    message: /re-scout date as YYYY-MM-DD/,
  },
  {
    what: 'a walk on 30 February',
    send: (w) => w.scout.post('/api/walks', { fieldId: w.field.id, walkedOn: '2026-02-30' }),
    status: 400,
    code: 'invalid',
    message: /walk date is not a real calendar date/,
  },
  {
    what: 'a sighting date filter on 30 February',
    send: (w) => w.adviser.get(`/api/sightings?fieldId=${w.field.id}&from=2026-02-30`),
    status: 400,
    code: 'invalid',
    message: /not a real calendar date/,
  },
  {
    what: 'a boundary of GeometryCollections nested 50,000 deep',
    send: (w) => fieldWithNestedCollections(w, 50_000),
    status: 400,
    code: 'boundary_unparseable',
    message: /nests collections more than 16 levels deep/,
  },
  {
    what: 'a sighting date filter in the wrong format',
    send: (w) => w.adviser.get(`/api/sightings?fieldId=${w.field.id}&from=01/07/2026`),
    status: 400,
    code: 'invalid',
    message: /YYYY-MM-DD|date/,
  },
  {
    what: 'includeInactive that is not true or false',
    send: (w) => w.admin.get('/api/pests?includeInactive=yes'),
    status: 400,
    code: 'invalid',
    message: /includeInactive to true or false/,
  },
  {
    what: 'a mailbox message number that is not a number',
    send: (w) => w.admin.get('/api/mailbox/first'),
    status: 400,
    code: 'invalid',
    message: /message number is not valid/,
  },
  {
    what: 'a check id that is not an id',
    send: (w) => w.adviser.get('/api/checks/latest'),
    status: 400,
    code: 'invalid',
    message: /pattern check id is not valid/,
  },
  {
    what: 'a zone set id that is not an id',
    send: (w) => w.adviser.get('/api/zone-sets/1/export.geojson'),
    status: 400,
    code: 'invalid',
    message: /zone set id is not valid/,
  },
  {
    what: 'a history pest filter that is not an id',
    send: (w) => w.adviser.get(`/api/fields/${w.field.id}/history?pestId=aphid`),
    status: 400,
    code: 'invalid',
    message: /pest id is not valid/,
  },
  { what: 'a route that does not exist', send: (w) => w.admin.get('/api/tractors'), status: 404, code: 'not_found', message: /That API route was not found/ },
];

let world: World;

beforeAll(async () => {
  const set = await scoutingSetUp();
  const adviser = await signedIn(set.org.users.adviser.email);
  const farmId = (await createFarm(set.admin)).id;
  const walk = await set.scout.post('/api/walks', { fieldId: set.field.id, walkedOn: '2026-07-01' }).expect(201);
  const stop = await set.scout.post(`/api/walks/${walk.body.walk.id}/stops`, { pestId: set.pest.id, ...insideField(), accuracyM: 4 }).expect(201);
  world = { ...set, adviser, farmId, walkId: walk.body.walk.id, sightingId: stop.body.sighting.id, jpeg: await makeJpeg({ gps: insideField(0.4, 0.4) }) };
});

afterAll(async () => {
  await stopQueue();
  await closeSimulationPool();
});

describe('bad input catalogue', () => {
  it(`holds at least 40 bad inputs (${catalogue.length})`, () => {
    expect(catalogue.length).toBeGreaterThanOrEqual(40);
  });

  it.each(catalogue.map((c) => [c.what, c] as const))('%s: a clear message, and nothing stored changes', async (_what, entry) => {
    const before = await snapshot();
    const res = await entry.send(world);
    const answer =
      res.status === 200 && res.body.results ? { code: res.body.results[0].outcome, message: res.body.results[0].message } : (res.body.error ?? {});
    expect({ status: res.status, code: answer.code }, JSON.stringify(res.body).slice(0, 300)).toEqual({ status: entry.status, code: entry.code });
    expect(answer.message).toMatch(entry.message);
    // A sentence for a person: a capital letter first, at least a few words, ending in a full stop.
    expect(answer.message).toMatch(/^[A-Z“"].{15,}[.)]$/);
    expect(await snapshot()).toEqual(before);
  });
});
