// A signed-in grower opens the zone notices of their own farms from their home, without the e-mailed token:
// the same page content the link opens, the map image, and an acknowledgement of their own copy.
import crypto from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '../../server/db.ts';
import { stopQueue } from '../../server/jobs/queue.ts';
import { closeSimulationPool } from '../../server/services/check-runner.ts';
import { issueNoticeToken } from '../../server/services/notice-links.ts';
import { anonymous, signedIn, type Client } from '../helpers/http.ts';
import { makeOrganisation, type TestOrganisation } from '../helpers/org.ts';
import { acceptProposedZones, linkGrower, makeCheckedField } from '../helpers/zones.ts';

let org: TestOrganisation;
let adviser: Client;
let scout: Client;
let grower: Client;
/** Sent to the grower's own address (and one other contact), on a farm linked to the grower. */
let ownNotice: string;
let ownCopyToken: string;
/** On the same linked farm, but sent only to another contact. */
let othersNotice: string;
/** A draft on the linked farm: not sent, so not the grower's to see. */
let draftNotice: string;
/** Sent, on a farm of the same organisation that is not linked to the grower. */
let unlinkedFarmNotice: string;
/** Sent, in another organisation. */
let foreignNotice: string;

const recommendation = 'Spot-spray the two zones within five days; re-scout the rest next week.';

/** A copy as the notice worker leaves it once the SMTP server has accepted it. */
async function addSentCopy(noticeId: string, name: string, email: string) {
  const id = crypto.randomUUID();
  await sequelize.query(
    `INSERT INTO notice_recipients (id, notice_id, contact_name, email, status, attempts, message_id, smtp_accepted_at)
     VALUES (:id, :noticeId, :name, :email, 'sent', 1, :messageId, now())`,
    { replacements: { id, noticeId, name, email, messageId: `<grower-test-${id}@test.example>` } },
  );
  return id;
}

async function draft(client: Client, scouted: Awaited<ReturnType<typeof makeCheckedField>>, zoneSetId: string) {
  return (await client.post('/api/notices', { fieldId: scouted.field.id, zoneSetId, recommendation }).expect(201)).body.notice.id as string;
}

async function markSent(noticeId: string) {
  await sequelize.query(`UPDATE notices SET status = 'sent', sent_at = now() WHERE id = :noticeId`, { replacements: { noticeId } });
}

beforeAll(async () => {
  org = await makeOrganisation('Grower notices');
  const other = await makeOrganisation('Grower notices other');
  adviser = await signedIn(org.users.adviser.email);
  scout = await signedIn(org.users.scout.email);
  grower = await signedIn(org.users.grower.email);
  const otherAdviser = await signedIn(other.users.adviser.email);
  const tag = org.id.slice(0, 8);

  const linked = await makeCheckedField(org, adviser, { seed: 31 });
  await linkGrower(linked.field.farmId, org.users.grower.id);
  const linkedZones = await acceptProposedZones(adviser, linked);
  ownNotice = await draft(adviser, linked, linkedZones.id);
  const ownCopy = await addSentCopy(ownNotice, 'The grower', org.users.grower.email);
  await addSentCopy(ownNotice, 'Ada Furrow', `ada-${tag}@farm.example`);
  await markSent(ownNotice);
  ownCopyToken = await issueNoticeToken(ownCopy);
  othersNotice = await draft(adviser, linked, linkedZones.id);
  await addSentCopy(othersNotice, 'Ada Furrow', `ada-${tag}@farm.example`);
  await markSent(othersNotice);
  draftNotice = await draft(adviser, linked, linkedZones.id);

  const unlinked = await makeCheckedField(org, adviser, { seed: 32 });
  unlinkedFarmNotice = await draft(adviser, unlinked, (await acceptProposedZones(adviser, unlinked)).id);
  await addSentCopy(unlinkedFarmNotice, 'The grower', org.users.grower.email);
  await markSent(unlinkedFarmNotice);

  const foreign = await makeCheckedField(other, otherAdviser, { seed: 33 });
  foreignNotice = await draft(otherAdviser, foreign, (await acceptProposedZones(otherAdviser, foreign)).id);
  await addSentCopy(foreignNotice, 'The grower', org.users.grower.email);
  await markSent(foreignNotice);
  // A stray link row across organisations must still open nothing: the notice's organisation decides.
  await linkGrower(foreign.field.farmId, org.users.grower.id);
});

afterAll(async () => {
  await stopQueue();
  await closeSimulationPool();
});

describe('a grower opening a notice from their home', () => {
  it('counts the page’s report of its opening, not the GET, as the grower opening their own copy', async () => {
    const myCopy = async () => (await grower.get('/api/grower/notices').expect(200)).body.notices.find((n: { id: string }) => n.id === ownNotice).myCopy;
    expect((await myCopy()).openedAt).toBeNull();
    await grower.get(`/api/grower/notices/${ownNotice}`).expect(200);
    expect((await myCopy()).openedAt).toBeNull();
    const opened = await grower.post(`/api/grower/notices/${ownNotice}/opened`).expect(200);
    expect(opened.body.alreadyOpened).toBe(false);
    expect(await myCopy()).toMatchObject({ state: 'opened', openedAt: opened.body.openedAt, acknowledgedAt: null });
    const again = await grower.post(`/api/grower/notices/${ownNotice}/opened`).expect(200);
    expect(again.body).toEqual({ openedAt: opened.body.openedAt, alreadyOpened: true });
  });

  it('records nothing when the grower opens a notice that went to the farm’s other contacts', async () => {
    const res = await grower.post(`/api/grower/notices/${othersNotice}/opened`).expect(200);
    expect(res.body).toEqual({ openedAt: null, alreadyOpened: false });
    const recipients = (await adviser.get(`/api/notices/${othersNotice}`).expect(200)).body.notice.recipients;
    expect(recipients.every((r: { openedAt: string | null }) => r.openedAt === null)).toBe(true);
  });

  it('shows the grower their own notice with the same content the e-mailed link opens', async () => {
    const mine = await grower.get(`/api/grower/notices/${ownNotice}`).expect(200);
    const viaLink = await (await anonymous()).get(`/api/notice-links/${ownCopyToken}`).expect(200);
    const { mapPath: myMap, zoneFiles: myFiles, ...myContent } = mine.body.notice;
    const { mapPath: linkMap, zoneFiles: linkFiles, ...linkContent } = viaLink.body.notice;
    expect(myContent).toEqual(linkContent);
    expect(myContent.recipientName).toBe('The grower');
    expect(myMap).toBe(`/api/grower/notices/${ownNotice}/map.png`);
    expect(linkMap).not.toBe(myMap);
    expect(myFiles.taskData).toBe(`/api/grower/notices/${ownNotice}/zones.taskdata.zip`);
    expect(linkFiles.taskData).not.toBe(myFiles.taskData);
  });

  it('serves the notice map as a PNG image', async () => {
    const png = await grower.get(`/api/grower/notices/${ownNotice}/map.png`).buffer(true).expect(200);
    expect(png.headers['content-type']).toBe('image/png');
    // The eight-byte PNG signature (PNG specification, W3C / ISO 15948, section 5.2).
    expect([...(png.body as Buffer).subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
  });

  it('opens a notice addressed to the farm’s other contacts too, under the grower’s own name', async () => {
    const res = await grower.get(`/api/grower/notices/${othersNotice}`).expect(200);
    expect(res.body.notice.recipientName).toBe(org.users.grower.name);
    expect(res.body.notice.acknowledgedAt).toBeNull();
  });

  it.each([
    ['a notice on a farm not linked to the grower', () => unlinkedFarmNotice],
    ["another organisation's notice", () => foreignNotice],
    ['a draft that was never sent', () => draftNotice],
    ['an id that matches no notice', () => crypto.randomUUID()],
  ])('answers 404 for %s', async (_label, id) => {
    for (const url of [`/api/grower/notices/${id()}`, `/api/grower/notices/${id()}/map.png`]) expect((await grower.get(url)).status, url).toBe(404);
    expect((await grower.post(`/api/grower/notices/${id()}/acknowledge`)).status).toBe(404);
    expect((await grower.post(`/api/grower/notices/${id()}/opened`)).status).toBe(404);
  });

  it('refuses a notice id that is not an id, saying so', async () => {
    const res = await grower.get('/api/grower/notices/not-an-id').expect(400);
    expect(res.body.error.message).toMatch(/notice id is not valid/);
  });
});

describe('a grower acknowledging a notice from their home', () => {
  it('acknowledges their own copy once, and a second press changes nothing', async () => {
    const first = await grower.post(`/api/grower/notices/${ownNotice}/acknowledge`).expect(200);
    expect(first.body.alreadyAcknowledged).toBe(false);
    const second = await grower.post(`/api/grower/notices/${ownNotice}/acknowledge`).expect(200);
    expect(second.body).toEqual({ acknowledgedAt: first.body.acknowledgedAt, alreadyAcknowledged: true });

    const page = await grower.get(`/api/grower/notices/${ownNotice}`).expect(200);
    expect(page.body.notice.acknowledgedAt).toBe(first.body.acknowledgedAt);
    const states = (await adviser.get(`/api/notices/${ownNotice}`).expect(200)).body.notice.recipients.map((r: { email: string; state: string }) => [
      r.email,
      r.state,
    ]);
    expect(states).toEqual(
      expect.arrayContaining([
        [org.users.grower.email, 'acknowledged'],
        [`ada-${org.id.slice(0, 8)}@farm.example`, 'sent'],
      ]),
    );
  });

  it("answers 409 when the grower holds no copy, saying the notice went to the farm's contacts", async () => {
    const res = await grower.post(`/api/grower/notices/${othersNotice}/acknowledge`).expect(409);
    expect(res.body.error.message).toMatch(/addressed to the farm's contacts/);
    const recipients = (await adviser.get(`/api/notices/${othersNotice}`).expect(200)).body.notice.recipients;
    expect(recipients.every((r: { acknowledgedAt: string | null }) => r.acknowledgedAt === null)).toBe(true);
  });
});

describe('who may use the grower notice routes', () => {
  it.each([
    ['a scout', () => scout],
    ['an adviser', () => adviser],
  ])('refuses %s by role', async (_label, client) => {
    expect((await client().get(`/api/grower/notices/${ownNotice}`)).status).toBe(403);
    expect((await client().get(`/api/grower/notices/${ownNotice}/map.png`)).status).toBe(403);
    expect((await client().post(`/api/grower/notices/${ownNotice}/acknowledge`)).status).toBe(403);
    expect((await client().post(`/api/grower/notices/${ownNotice}/opened`)).status).toBe(403);
  });

  it('asks a visitor who is not signed in to sign in', async () => {
    expect((await (await anonymous()).get(`/api/grower/notices/${ownNotice}`)).status).toBe(401);
  });
});
