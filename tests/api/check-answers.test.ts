import { describe, expect, it } from 'vitest';
import { makeOrganisation } from '../helpers/org.ts';
import { signedIn } from '../helpers/http.ts';
import { makeScoutedField, TEST_FIELD_CORNER, TEST_FIELD_SIZE, type StopPoint } from '../helpers/sightings.ts';
import { createRandom } from '../../shared/analysis/random.ts';

// Invented sightings spread over the test field; only the transport of the stored answer is under test here.
function spreadStops(seed: number, n: number): StopPoint[] {
  const random = createRandom(seed);
  return Array.from({ length: n }, () => ({
    lon: TEST_FIELD_CORNER.lon + TEST_FIELD_SIZE.lon * (0.05 + 0.9 * random()),
    lat: TEST_FIELD_CORNER.lat + TEST_FIELD_SIZE.lat * (0.05 + 0.9 * random()),
    count: 1 + Math.floor(random() * 5),
  }));
}

describe('reading a stored check', () => {
  it('answers a repeat read with 304 when the adviser already has the stored answer', async () => {
    const org = await makeOrganisation();
    const adviser = await signedIn(org.users.adviser.email);
    const { field, pest } = await makeScoutedField(org, spreadStops(5, 30));
    const run = await adviser.post('/api/checks', { fieldId: field.id, pestId: pest.id, options: { simulations: 49, seed: 2 } }).expect(201);

    const first = await adviser.get(`/api/checks/${run.body.check.id}`).expect(200);
    const etag = first.headers.etag;
    expect(etag).toBeTruthy();
    const again = await adviser.get(`/api/checks/${run.body.check.id}`).set('If-None-Match', etag);
    expect(again.status).toBe(304);
    expect(first.body.check.result).toEqual(run.body.check.result);
  });

  it('sends the same answer gzipped and plain', async () => {
    const org = await makeOrganisation();
    const adviser = await signedIn(org.users.adviser.email);
    const { field, pest } = await makeScoutedField(org, spreadStops(8, 30));
    const run = await adviser.post('/api/checks', { fieldId: field.id, pestId: pest.id, options: { simulations: 49, seed: 4 } }).expect(201);
    const url = `/api/checks/${run.body.check.id}`;

    const raw = (res: import('supertest').Response) => res.body as Buffer;
    const buffer = (req: import('supertest').Test) =>
      req.buffer(true).parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      });
    const gzipped = await buffer(adviser.get(url).set('Accept-Encoding', 'gzip')).expect(200);
    const plain = await buffer(adviser.get(url).set('Accept-Encoding', 'identity')).expect(200);
    expect(gzipped.headers['content-encoding']).toBe('gzip');
    expect(plain.headers['content-encoding']).toBeUndefined();
    // superagent unpacks the gzip stream itself, so equal bytes here mean the gzipped answer unpacks to the plain one.
    expect(raw(gzipped).equals(raw(plain))).toBe(true);
    expect(JSON.parse(raw(plain).toString('utf8')).check.id).toBe(run.body.check.id);
  });
});
