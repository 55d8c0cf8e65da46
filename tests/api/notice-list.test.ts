// The adviser's list of every notice (GET /api/notices/overview): each copy's state as the grower's actions and the
// real mail catcher left it, the filters (farm, field, state, date range), the pages (limit + cursor, with a stated
// maximum), and no way into another organisation's notices.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { sequelize } from '../../server/db.ts';
import { startWorkers } from '../../server/jobs/workers.ts';
import { stopQueue } from '../../server/jobs/queue.ts';
import '../../server/jobs/all-workers.ts';
import { closeSimulationPool } from '../../server/services/check-runner.ts';
import { setNoticeRetryPolicy } from '../../server/services/notice-sending.ts';
import { NOTICE_PAGE_MAX } from '../../shared/schemas/notices.ts';
import { noticeLinkToken, waitForMessage } from '../helpers/mailbox.ts';
import { signedIn, testApp, type Client } from '../helpers/http.ts';
import { makeOrganisation, type TestOrganisation } from '../helpers/org.ts';
import { acceptProposedZones, addContacts, makeCheckedField, type ScoutedCheck } from '../helpers/zones.ts';

let org: TestOrganisation;
let adviser: Client;
let admin: Client;
let outsider: Client;
let north: ScoutedCheck;
let south: ScoutedCheck;
let tag: string;
const ids = { acknowledged: '', unread: '', draft: '', southSent: '' };

interface Entry {
  id: string;
  farmId: string;
  fieldId: string;
  status: string;
  recipients: Array<{ email: string; state: string }>;
}

async function writeNotice(field: ScoutedCheck) {
  const zoneSetId = (await acceptProposedZones(adviser, field)).id;
  return (
    await adviser
      .post('/api/notices', { fieldId: field.field.id, zoneSetId, recommendation: 'Spot-spray the zones this week; leave the rest untreated.' })
      .expect(201)
  ).body.notice.id as string;
}

async function sendAndWait(noticeId: string) {
  await adviser.post(`/api/notices/${noticeId}/send`).expect(202);
  const started = Date.now();
  while ((await adviser.get(`/api/notices/${noticeId}`).expect(200)).body.notice.status !== 'sent') {
    if (Date.now() - started > 30_000) throw new Error('the notice was not sent in time');
    await new Promise((r) => setTimeout(r, 200));
  }
}

const list = async (client: Client, query = '') =>
  (await client.get(`/api/notices/overview${query}`).expect(200)).body as { notices: Entry[]; nextCursor: string | null; limit: number };
const listedIds = async (query = '') => (await list(adviser, query)).notices.map((n) => n.id);

beforeAll(async () => {
  org = await makeOrganisation('Notice list');
  const other = await makeOrganisation('Notice list other');
  adviser = await signedIn(org.users.adviser.email);
  admin = await signedIn(org.users.admin.email);
  outsider = await signedIn(other.users.adviser.email);
  tag = org.id.slice(0, 8);
  // Each field lies on a farm of its own.
  north = await makeCheckedField(org, adviser, { seed: 11 });
  south = await makeCheckedField(org, adviser, { seed: 5 });
  await addContacts(north.field.farmId, [{ name: 'Ada Furrow', email: `ada-${tag}@farm.example` }]);
  await addContacts(south.field.farmId, [{ name: 'Ben Headland', email: `ben-${tag}@farm.example` }]);
  setNoticeRetryPolicy({ retryDelay: 1 });
  await startWorkers();

  ids.acknowledged = await writeNotice(north);
  await sendAndWait(ids.acknowledged);
  const [mail] = await waitForMessage(`ada-${tag}@farm.example`, 1, 20_000);
  await request(testApp())
    .post(`/api/notice-links/${noticeLinkToken(mail)}/acknowledge`)
    .expect(200);
  ids.unread = await writeNotice(north);
  await sendAndWait(ids.unread);
  ids.southSent = await writeNotice(south);
  await sendAndWait(ids.southSent);
  ids.draft = await writeNotice(south);
  // A draft of another organisation, which no filter here may ever show.
  const theirs = await makeCheckedField(other, outsider, { seed: 9 });
  const theirZones = (await acceptProposedZones(outsider, theirs)).id;
  await outsider.post('/api/notices', { fieldId: theirs.field.id, zoneSetId: theirZones, recommendation: 'Spot-spray the zones this week.' }).expect(201);
});

afterAll(async () => {
  await stopQueue();
  await closeSimulationPool();
});

describe('the list of notices', () => {
  it('lists every notice of the organisation, newest first, with each copy’s state', async () => {
    const { notices } = await list(adviser);
    expect(notices.map((n) => n.id)).toEqual([ids.draft, ids.southSent, ids.unread, ids.acknowledged]);
    const byId = Object.fromEntries(notices.map((n) => [n.id, n]));
    expect(byId[ids.acknowledged].recipients).toMatchObject([{ email: `ada-${tag}@farm.example`, state: 'acknowledged' }]);
    // Accepted by the mail catcher, not opened yet.
    expect(byId[ids.unread].recipients).toMatchObject([{ email: `ada-${tag}@farm.example`, state: 'sent' }]);
    expect(byId[ids.draft]).toMatchObject({ status: 'draft', recipients: [] });
    // The admin sees the same list.
    expect((await list(admin)).notices.map((n) => n.id)).toEqual(notices.map((n) => n.id));
  });

  it('narrows to a state: not acknowledged, acknowledged, accepted and not opened, drafts', async () => {
    expect(await listedIds('?state=not-acknowledged')).toEqual([ids.southSent, ids.unread]);
    expect(await listedIds('?state=acknowledged')).toEqual([ids.acknowledged]);
    expect(await listedIds('?state=accepted')).toEqual([ids.southSent, ids.unread]);
    expect(await listedIds('?state=draft')).toEqual([ids.draft]);
    expect(await listedIds('?state=failed')).toEqual([]);
  });

  it('narrows to a farm, a field, and both with a state', async () => {
    expect(await listedIds(`?farmId=${south.field.farmId}`)).toEqual([ids.draft, ids.southSent]);
    expect(await listedIds(`?fieldId=${north.field.id}`)).toEqual([ids.unread, ids.acknowledged]);
    expect(await listedIds(`?fieldId=${north.field.id}&state=not-acknowledged`)).toEqual([ids.unread]);
  });

  it('narrows to a date range: from inclusive, before exclusive', async () => {
    await sequelize.query("UPDATE notices SET sent_at = '2026-06-01T10:00:00Z' WHERE id = :id", { replacements: { id: ids.acknowledged } });
    const range = (from: string, before: string) => `?from=${encodeURIComponent(from)}&before=${encodeURIComponent(before)}`;
    expect(await listedIds(range('2026-06-01T00:00:00+02:00', '2026-06-02T00:00:00+02:00'))).toEqual([ids.acknowledged]);
    expect(await listedIds(range('2026-06-01T10:00:00Z', '2026-06-01T10:00:01Z'))).toEqual([ids.acknowledged]);
    expect(await listedIds(range('2026-05-01T00:00:00Z', '2026-06-01T10:00:00Z'))).toEqual([]);
    const reversed = await adviser.get(`/api/notices/overview${range('2026-06-02T00:00:00Z', '2026-06-01T00:00:00Z')}`);
    expect(reversed.status).toBe(400);
    expect(reversed.body.error.message).toMatch(/must come after its start/);
    expect((await adviser.get('/api/notices/overview?from=yesterday')).status).toBe(400);
  });
});

describe('a field’s notices (GET /api/notices?fieldId=)', () => {
  it('gives each notice of the field with the same names and copies as the notice on its own, and none of another field', async () => {
    const listed = (await adviser.get(`/api/notices?fieldId=${north.field.id}`).expect(200)).body.notices as Array<{ id: string }>;
    expect(listed.map((n) => n.id)).toEqual([ids.unread, ids.acknowledged]);
    for (const notice of listed) expect(notice).toEqual((await adviser.get(`/api/notices/${notice.id}`).expect(200)).body.notice);
    expect((await outsider.get(`/api/notices?fieldId=${north.field.id}`)).status).toBe(404);
  });
});

describe('pages', () => {
  it('walks the whole list a page at a time, without repeats or gaps', async () => {
    const all = await listedIds();
    const seen: string[] = [];
    let cursor: string | null = null;
    let pages = 0;
    do {
      const page: { notices: Entry[]; nextCursor: string | null; limit: number } = await list(adviser, `?limit=1${cursor ? `&cursor=${cursor}` : ''}`);
      expect(page.limit).toBe(1);
      expect(page.notices.length).toBeLessThanOrEqual(1);
      seen.push(...page.notices.map((n) => n.id));
      cursor = page.nextCursor;
      pages++;
    } while (cursor && pages < 10);
    expect(seen).toEqual(all);
    expect(pages).toBe(all.length);
  });

  it(`refuses a page larger than ${NOTICE_PAGE_MAX}, an empty one and a made-up cursor`, async () => {
    const large = await adviser.get(`/api/notices/overview?limit=${NOTICE_PAGE_MAX + 1}`);
    expect(large.status).toBe(400);
    expect(large.body.error.message).toContain(`at most ${NOTICE_PAGE_MAX}`);
    expect((await adviser.get('/api/notices/overview?limit=0')).status).toBe(400);
    const forged = await adviser.get(`/api/notices/overview?cursor=${Buffer.from("['x'; DROP TABLE notices]").toString('base64url')}`);
    expect(forged.status).toBe(400);
    expect(forged.body.error.message).toMatch(/start again from the first page/);
    // The right shape, but no such day: refused as a cursor, never handed to the database.
    const noSuchDay = Buffer.from(JSON.stringify(['2026-02-30 10:00:00+00', ids.draft])).toString('base64url');
    expect((await adviser.get(`/api/notices/overview?cursor=${noSuchDay}`)).status).toBe(400);
  });
});

describe('another organisation and other roles', () => {
  it('lists none of these notices to another organisation, and finds none of its farms or fields', async () => {
    const theirs = await list(outsider);
    expect(theirs.notices).toHaveLength(1);
    expect(theirs.notices.some((n) => Object.values(ids).includes(n.id))).toBe(false);
    expect((await outsider.get(`/api/notices/overview?farmId=${north.field.farmId}`)).status).toBe(404);
    expect((await outsider.get(`/api/notices/overview?fieldId=${north.field.id}`)).status).toBe(404);
  });

  it('refuses scouts and growers', async () => {
    for (const role of ['scout', 'grower'] as const) expect((await (await signedIn(org.users[role].email)).get('/api/notices/overview')).status).toBe(403);
  });
});
