// The lists that grow with a season read a page at a time (limit + an opaque keyset cursor): the sightings of a field,
// its walks and its checks. Joined, the pages give the whole list once, in order; a forged cursor or an oversized page
// is refused with a sentence; a cursor carried to another field or organisation reads nothing of the first.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../server/db.ts';
import { stopQueue } from '../../server/jobs/queue.ts';
import { SIGHTING_PAGE } from '../../shared/schemas/sightings.ts';
import { WALK_PAGE } from '../../shared/schemas/walks.ts';
import { CHECK_PAGE } from '../../shared/schemas/checks.ts';
import { signedIn, type Client } from '../helpers/http.ts';
import { makeOrganisation, type TestOrganisation } from '../helpers/org.ts';
import { addSightings, makeField, makePest, makeWalk, stopsFrom, TEST_FIELD_CORNER } from '../helpers/sightings.ts';

let org: TestOrganisation;
let adviser: Client;
let outsider: Client;

/** Every row of a paged list, page by page at `limit`, with the number of pages it took. */
async function readPages<Row>(client: Client, path: string, key: string, limit: number) {
  const rows: Row[] = [];
  let cursor: string | null = null;
  let pages = 0;
  do {
    const separator = path.includes('?') ? '&' : '?';
    const res = await client.get(`${path}${separator}limit=${limit}${cursor ? `&cursor=${cursor}` : ''}`).expect(200);
    const page = res.body as Record<string, Row[]> & { limit: number; nextCursor: string | null };
    expect(page.limit).toBe(limit);
    expect(page[key].length).toBeLessThanOrEqual(limit);
    rows.push(...page[key]);
    cursor = page.nextCursor;
    pages++;
  } while (cursor && pages < 50);
  return { rows, pages };
}

const forgedCursors = [
  Buffer.from("['x'; DROP TABLE sightings]").toString('base64url'),
  'not base64 at all!',
  // The right shape, but no such day.
  Buffer.from(JSON.stringify(['2026-02-30', 'infinity', '2026-07-01 10:00:00+00', '00000000-0000-4000-8000-000000000000'])).toString('base64url'),
];

beforeAll(async () => {
  org = await makeOrganisation('List pages');
  const other = await makeOrganisation('List pages other');
  adviser = await signedIn(org.users.adviser.email);
  outsider = await signedIn(other.users.admin.email);
});

afterAll(async () => {
  await stopQueue();
});

describe('sightings of a field', () => {
  interface Listed {
    id: string;
    walkedOn: string;
    observedAt: string | null;
  }
  let fieldId: string;
  let otherFieldId: string;
  const made: string[] = [];

  beforeAll(async () => {
    const field = await makeField(org);
    const pest = await makePest(org);
    fieldId = field.id;
    // Two walks; each insert shares one observed time (the statement's), so the ties fall to the later parts of the key.
    const points = (n: number) =>
      stopsFrom(
        Array.from({ length: n }, (_, i) => TEST_FIELD_CORNER.lon + 0.0004 * (i + 1)),
        Array(n).fill(TEST_FIELD_CORNER.lat + 0.001),
        Array(n).fill(1),
      );
    const later = await makeWalk(org, field.id, '2026-07-08');
    const earlier = await makeWalk(org, field.id, '2026-07-01');
    made.push(...(await addSightings(org, { fieldId, walkId: later, pestId: pest.id }, points(5))));
    made.push(...(await addSightings(org, { fieldId, walkId: earlier, pestId: pest.id }, points(6))));
    // A sighting without a time sorts after the timed ones of its walk day.
    await sequelize.query('UPDATE sightings SET observed_at = NULL WHERE id = :id', { replacements: { id: made[6] } });
    const other = await makeField(org);
    otherFieldId = other.id;
    await addSightings(org, { fieldId: other.id, walkId: await makeWalk(org, other.id, '2026-07-02'), pestId: pest.id }, points(3));
  });

  it('joins its pages into the whole list once each, in walk-day then time order', async () => {
    const whole = (await adviser.get(`/api/sightings?fieldId=${fieldId}&limit=${SIGHTING_PAGE.max}`).expect(200)).body;
    expect(whole.nextCursor).toBeNull();
    const { rows, pages } = await readPages<Listed>(adviser, `/api/sightings?fieldId=${fieldId}`, 'sightings', 4);
    expect(pages).toBe(3);
    expect(rows.map((s) => s.id)).toEqual(whole.sightings.map((s: Listed) => s.id));
    expect(new Set(rows.map((s) => s.id)).size).toBe(made.length);
    expect([...rows.map((s) => s.id)].sort()).toEqual([...made].sort());
    expect(rows.map((s) => s.walkedOn)).toEqual([...Array(6).fill('2026-07-01'), ...Array(5).fill('2026-07-08')]);
    expect(rows[5].id).toBe(made[6]);
    expect(rows[5].observedAt).toBeNull();
  });

  it('answers a page of the default size without a limit', async () => {
    const res = await adviser.get(`/api/sightings?fieldId=${fieldId}`).expect(200);
    expect(res.body.limit).toBe(SIGHTING_PAGE.default);
  });

  it(`refuses a page larger than ${SIGHTING_PAGE.max}, an empty one and a forged cursor, each with a sentence`, async () => {
    const large = await adviser.get(`/api/sightings?fieldId=${fieldId}&limit=${SIGHTING_PAGE.max + 1}`);
    expect(large.status).toBe(400);
    expect(large.body.error.message).toContain(`at most ${SIGHTING_PAGE.max} sightings`);
    expect((await adviser.get(`/api/sightings?fieldId=${fieldId}&limit=0`)).status).toBe(400);
    expect((await adviser.get(`/api/sightings?fieldId=${fieldId}&limit=two`)).status).toBe(400);
    for (const cursor of forgedCursors) {
      const forged = await adviser.get(`/api/sightings?fieldId=${fieldId}&cursor=${encodeURIComponent(cursor)}`);
      expect(forged.status).toBe(400);
      expect(forged.body.error.message).toMatch(/start again from the first page/);
    }
  });

  it('reads nothing of this field through its cursor on another field or in another organisation', async () => {
    const first = (await adviser.get(`/api/sightings?fieldId=${fieldId}&limit=2`).expect(200)).body;
    const elsewhere = (await adviser.get(`/api/sightings?fieldId=${otherFieldId}&cursor=${first.nextCursor}`).expect(200)).body;
    expect(elsewhere.sightings.length).toBeGreaterThan(0);
    expect(elsewhere.sightings.every((s: { fieldId: string }) => s.fieldId === otherFieldId)).toBe(true);
    const theirs = (await outsider.get(`/api/sightings?fieldId=${fieldId}&cursor=${first.nextCursor}`).expect(200)).body;
    expect(theirs.sightings).toEqual([]);
    expect(theirs.nextCursor).toBeNull();
  });
});

describe('walks of a field', () => {
  interface Listed {
    id: string;
    fieldId: string;
    walkedOn: string;
  }
  let fieldId: string;
  let otherFieldId: string;
  const made: string[] = [];

  beforeAll(async () => {
    fieldId = (await makeField(org)).id;
    for (const day of ['2026-06-03', '2026-06-17', '2026-06-10', '2026-07-01', '2026-06-24']) made.push(await makeWalk(org, fieldId, day));
    // Three people on one day in one statement: one day and one creation time, so only the id orders them.
    const sameDay = await sequelize.query<{ id: string }>(
      `INSERT INTO walks (organisation_id, field_id, scout_id, walked_on) SELECT :org, :fieldId, unnest(CAST(:people AS uuid[])), '2026-06-10' RETURNING id`,
      { replacements: { org: org.id, fieldId, people: `{${[org.users.adviser.id, org.users.admin.id].join(',')}}` }, type: QueryTypes.SELECT },
    );
    made.push(...sameDay.map((r) => r.id));
    otherFieldId = (await makeField(org)).id;
    await makeWalk(org, otherFieldId, '2026-06-05');
  });

  it('joins its pages into the whole list once each, newest day first', async () => {
    const whole = (await adviser.get(`/api/walks?fieldId=${fieldId}&limit=${WALK_PAGE.max}`).expect(200)).body;
    expect(whole.nextCursor).toBeNull();
    const { rows, pages } = await readPages<Listed>(adviser, `/api/walks?fieldId=${fieldId}`, 'walks', 2);
    expect(pages).toBe(4);
    expect(rows.map((w) => w.id)).toEqual(whole.walks.map((w: Listed) => w.id));
    expect([...rows.map((w) => w.id)].sort()).toEqual([...made].sort());
    expect(rows.map((w) => w.walkedOn)).toEqual(['2026-07-01', '2026-06-24', '2026-06-17', '2026-06-10', '2026-06-10', '2026-06-10', '2026-06-03']);
  });

  it(`refuses a page larger than ${WALK_PAGE.max} and a forged cursor, each with a sentence`, async () => {
    const large = await adviser.get(`/api/walks?fieldId=${fieldId}&limit=${WALK_PAGE.max + 1}`);
    expect(large.status).toBe(400);
    expect(large.body.error.message).toContain(`at most ${WALK_PAGE.max} walks`);
    const forged = await adviser.get(`/api/walks?fieldId=${fieldId}&cursor=${encodeURIComponent(forgedCursors[0])}`);
    expect(forged.status).toBe(400);
    expect(forged.body.error.message).toMatch(/start again from the first page/);
    // A sightings cursor has four parts; a walk's has three.
    const sightingsCursor = Buffer.from(JSON.stringify(['2026-06-10', 'infinity', '2026-07-01 10:00:00+00', made[0]])).toString('base64url');
    expect((await adviser.get(`/api/walks?fieldId=${fieldId}&cursor=${sightingsCursor}`)).status).toBe(400);
  });

  it('reads nothing of this field through its cursor on another field or in another organisation', async () => {
    const first = (await adviser.get(`/api/walks?fieldId=${fieldId}&limit=1`).expect(200)).body;
    const elsewhere = (await adviser.get(`/api/walks?fieldId=${otherFieldId}&cursor=${first.nextCursor}`).expect(200)).body;
    expect(elsewhere.walks.map((w: Listed) => w.fieldId)).toEqual([otherFieldId]);
    const theirs = (await outsider.get(`/api/walks?fieldId=${fieldId}&cursor=${first.nextCursor}`).expect(200)).body;
    expect(theirs.walks).toEqual([]);
  });
});

describe('walks of one day or a window of days', () => {
  interface Listed {
    id: string;
    fieldId: string;
    walkedOn: string;
  }
  const day = '2026-08-12';
  let assigned: string;
  let unassigned: string;
  let dayOnAssigned: string[];
  let dayOnUnassigned: string;
  let scout: Client;
  const ids = (walks: Listed[]) => walks.map((w) => w.id).sort();

  beforeAll(async () => {
    assigned = (await makeField(org)).id;
    unassigned = (await makeField(org)).id;
    const admin = await signedIn(org.users.admin.email);
    await admin.post(`/api/fields/${assigned}/scouts`, { userId: org.users.scout.id }).expect(204);
    scout = await signedIn(org.users.scout.email);
    // The day's walks on the scout's field: theirs and two desk users' in one statement (one creation time, ids order them).
    const sameDay = await sequelize.query<{ id: string }>(
      `INSERT INTO walks (organisation_id, field_id, scout_id, walked_on) SELECT :org, :fieldId, unnest(CAST(:people AS uuid[])), :day RETURNING id`,
      { replacements: { org: org.id, fieldId: assigned, day, people: `{${[org.users.adviser.id, org.users.admin.id].join(',')}}` }, type: QueryTypes.SELECT },
    );
    dayOnAssigned = [await makeWalk(org, assigned, day), ...sameDay.map((r) => r.id)];
    dayOnUnassigned = await makeWalk(org, unassigned, day);
    // The days either side, and the same day in another organisation.
    await makeWalk(org, assigned, '2026-08-11');
    await makeWalk(org, assigned, '2026-08-13');
    const elsewhere = await makeOrganisation('List pages one day elsewhere');
    await makeWalk(elsewhere, (await makeField(elsewhere)).id, day);
  });

  it('gives a scout exactly that day’s walks on the fields assigned to them', async () => {
    const res = (await scout.get(`/api/walks?walkedOn=${day}`).expect(200)).body;
    expect(ids(res.walks)).toEqual([...dayOnAssigned].sort());
    expect(res.nextCursor).toBeNull();
  });

  it('gives a desk user that day’s walks on every field of their organisation, and nothing of another organisation’s', async () => {
    const res = (await adviser.get(`/api/walks?walkedOn=${day}&limit=${WALK_PAGE.max}`).expect(200)).body;
    expect(ids(res.walks)).toEqual([...dayOnAssigned, dayOnUnassigned].sort());
    expect(res.walks.every((w: Listed) => w.walkedOn === day)).toBe(true);
    expect((await outsider.get(`/api/walks?walkedOn=${day}`).expect(200)).body.walks).toEqual([]);
  });

  it('pages through one day with the cursor, each walk once, newest first', async () => {
    const whole = (await adviser.get(`/api/walks?fieldId=${assigned}&walkedOn=${day}`).expect(200)).body.walks as Listed[];
    const { rows, pages } = await readPages<Listed>(adviser, `/api/walks?fieldId=${assigned}&walkedOn=${day}`, 'walks', 1);
    expect(pages).toBe(3);
    expect(rows.map((w) => w.id)).toEqual(whole.map((w) => w.id));
    expect(ids(rows)).toEqual([...dayOnAssigned].sort());
  });

  it('reads a window of days with both ends included, and with one end open', async () => {
    const window = (await adviser.get(`/api/walks?fieldId=${assigned}&from=2026-08-12&to=2026-08-13`).expect(200)).body.walks as Listed[];
    expect(window.map((w) => w.walkedOn)).toEqual(['2026-08-13', day, day, day]);
    const until = (await adviser.get(`/api/walks?fieldId=${assigned}&to=2026-08-11`).expect(200)).body.walks as Listed[];
    expect(until.map((w) => w.walkedOn)).toEqual(['2026-08-11']);
  });

  it('refuses a day that is not YYYY-MM-DD or does not exist, both a day and a window, and a window run backwards, each with a sentence', async () => {
    const shape = await adviser.get('/api/walks?walkedOn=today');
    expect(shape.status).toBe(400);
    expect(shape.body.error.message).toMatch(/YYYY-MM-DD/);
    const missing = await adviser.get('/api/walks?walkedOn=2026-02-30');
    expect(missing.status).toBe(400);
    expect(missing.body.error.message).toMatch(/not a real calendar date/);
    const both = await adviser.get(`/api/walks?walkedOn=${day}&from=${day}`);
    expect(both.status).toBe(400);
    expect(both.body.error.message).toMatch(/one day .* or of a window/);
    const backwards = await adviser.get('/api/walks?from=2026-08-13&to=2026-08-12');
    expect(backwards.status).toBe(400);
    expect(backwards.body.error.message).toMatch(/comes after its last day/);
  });
});

describe('checks of a field', () => {
  interface Listed {
    id: string;
    fieldId: string;
    pestId: string;
    createdAt: string;
  }
  let fieldId: string;
  let otherFieldId: string;
  let aphid: string;
  let mite: string;
  const made: string[] = [];

  /** Queued checks written straight into the table (no run needed to be listed), `at` the creation time of each. */
  async function storeChecks(field: string, pestId: string, at: string[]) {
    const rows = await sequelize.query<{ id: string }>(
      `INSERT INTO pattern_checks (organisation_id, field_id, pest_id, options, options_hash, sighting_ids, sightings_hash, engine_version, created_by, created_at)
       SELECT :org, :field, :pestId, CAST('{"simulations": 99}' AS jsonb), encode(sha256(convert_to(t.at || t.k || :field || :pestId, 'UTF8')), 'hex'), '{}',
              repeat('0', 64), 'test', :adviser, CAST(t.at AS timestamptz)
         FROM unnest(CAST(:at AS text[])) WITH ORDINALITY AS t(at, k)
       RETURNING id`,
      { replacements: { org: org.id, field, pestId, adviser: org.users.adviser.id, at: `{${at.map((a) => `"${a}"`).join(',')}}` }, type: QueryTypes.SELECT },
    );
    return rows.map((r) => r.id);
  }

  beforeAll(async () => {
    fieldId = (await makeField(org)).id;
    aphid = (await makePest(org)).id;
    mite = (await makePest(org)).id;
    made.push(...(await storeChecks(fieldId, aphid, ['2026-07-01 08:00:00+00', '2026-07-03 08:00:00+00', '2026-07-05 08:00:00.000001+00'])));
    // Two run in the same instant: only their ids order them.
    made.push(...(await storeChecks(fieldId, mite, ['2026-07-04 08:00:00+00', '2026-07-04 08:00:00+00', '2026-07-05 08:00:00+00'])));
    otherFieldId = (await makeField(org)).id;
    await storeChecks(otherFieldId, aphid, ['2026-07-02 08:00:00+00']);
  });

  it('joins its pages into the whole list once each, newest first', async () => {
    const whole = (await adviser.get(`/api/fields/${fieldId}/checks?limit=${CHECK_PAGE.max}`).expect(200)).body;
    expect(whole.nextCursor).toBeNull();
    const { rows, pages } = await readPages<Listed>(adviser, `/api/fields/${fieldId}/checks`, 'checks', 4);
    expect(pages).toBe(2);
    expect(rows.map((c) => c.id)).toEqual(whole.checks.map((c: Listed) => c.id));
    expect([...rows.map((c) => c.id)].sort()).toEqual([...made].sort());
    // Microseconds count: the check at .000001 comes before the one at the whole second.
    expect(rows[0].id).toBe(made[2]);
    expect(rows[1].id).toBe(made[5]);
    const times = rows.map((c) => Date.parse(c.createdAt));
    expect(times).toEqual([...times].sort((a, b) => b - a));
  });

  it('pages one pest’s checks alone', async () => {
    const { rows } = await readPages<Listed>(adviser, `/api/fields/${fieldId}/checks?pestId=${mite}`, 'checks', 1);
    expect([...rows.map((c) => c.id)].sort()).toEqual([...made.slice(3)].sort());
    expect(rows.every((c) => c.pestId === mite)).toBe(true);
  });

  it(`refuses a page larger than ${CHECK_PAGE.max} and a forged cursor, each with a sentence`, async () => {
    const large = await adviser.get(`/api/fields/${fieldId}/checks?limit=${CHECK_PAGE.max + 1}`);
    expect(large.status).toBe(400);
    expect(large.body.error.message).toContain(`at most ${CHECK_PAGE.max} checks`);
    for (const cursor of forgedCursors) {
      const forged = await adviser.get(`/api/fields/${fieldId}/checks?cursor=${encodeURIComponent(cursor)}`);
      expect(forged.status).toBe(400);
      expect(forged.body.error.message).toMatch(/start again from the first page/);
    }
  });

  it('reads nothing of this field through its cursor on another field, and refuses another organisation', async () => {
    const first = (await adviser.get(`/api/fields/${fieldId}/checks?limit=1`).expect(200)).body;
    const elsewhere = (await adviser.get(`/api/fields/${otherFieldId}/checks?cursor=${first.nextCursor}`).expect(200)).body;
    expect(elsewhere.checks.map((c: Listed) => c.fieldId)).toEqual([otherFieldId]);
    expect((await outsider.get(`/api/fields/${fieldId}/checks?cursor=${first.nextCursor}`)).status).toBe(404);
  });
});
