// Choosing who gets a zone notice when it is sent: a contact left out gets no e-mail at the real local mail catcher,
// an address added for this notice gets one, exactly the chosen copies are stored, and a choice naming anything
// outside the notice's farm (another farm's contact, another organisation's, an invalid address) is refused
// before anything is stored or sent.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../server/db.ts';
import { startWorkers } from '../../server/jobs/workers.ts';
import { stopQueue } from '../../server/jobs/queue.ts';
import '../../server/jobs/all-workers.ts';
import { closeSimulationPool } from '../../server/services/check-runner.ts';
import { setNoticeRetryPolicy } from '../../server/services/notice-sending.ts';
import { messagesTo, waitForMessage } from '../helpers/mailbox.ts';
import { signedIn, type Client } from '../helpers/http.ts';
import { makeOrganisation, type TestOrganisation } from '../helpers/org.ts';
import { acceptProposedZones, addContacts, makeCheckedField, type ScoutedCheck } from '../helpers/zones.ts';

let org: TestOrganisation;
let adviser: Client;
let outsider: Client;
let scouted: ScoutedCheck;
let zoneSetId: string;
let tag: string;
/** The farm's contacts as the API lists them, with their ids. */
let contacts: Array<{ id: string; name: string; email: string }>;
let otherFarmContactId: string;
let otherOrganisationContactId: string;

beforeAll(async () => {
  org = await makeOrganisation('Recipient choice');
  const other = await makeOrganisation('Recipient choice other');
  adviser = await signedIn(org.users.adviser.email);
  outsider = await signedIn(other.users.adviser.email);
  scouted = await makeCheckedField(org, adviser);
  zoneSetId = (await acceptProposedZones(adviser, scouted)).id;
  tag = org.id.slice(0, 8);
  await addContacts(scouted.field.farmId, [
    { name: 'Ada Furrow', email: `ada-${tag}@farm.example` },
    { name: 'Ben Headland', email: `ben-${tag}@farm.example` },
    { name: 'Cal Tramline', email: `cal-${tag}@farm.example` },
  ]);
  contacts = (await adviser.get(`/api/farms/${scouted.field.farmId}`).expect(200)).body.farm.contacts;
  // A contact on another farm of the same organisation, and one in another organisation.
  const secondField = await makeCheckedField(org, adviser, { seed: 5 });
  await addContacts(secondField.field.farmId, [{ name: 'Dot Elsewhere', email: `dot-${tag}@farm.example` }]);
  otherFarmContactId = (await adviser.get(`/api/farms/${secondField.field.farmId}`).expect(200)).body.farm.contacts[0].id;
  const theirs = await makeCheckedField(other, outsider, { seed: 9 });
  await addContacts(theirs.field.farmId, [{ name: 'Eve Outside', email: `eve-${tag}@farm.example` }]);
  otherOrganisationContactId = (await outsider.get(`/api/farms/${theirs.field.farmId}`).expect(200)).body.farm.contacts[0].id;
  setNoticeRetryPolicy({ retryDelay: 1 });
  await startWorkers();
});

afterAll(async () => {
  await stopQueue();
  await closeSimulationPool();
});

const contact = (first: string) => contacts.find((c) => c.name.startsWith(first))!;

async function draft() {
  return (
    await adviser
      .post('/api/notices', { fieldId: scouted.field.id, zoneSetId, recommendation: 'Spot-spray the two zones this week; leave the rest untreated.' })
      .expect(201)
  ).body.notice.id as string;
}

const storedCopies = (noticeId: string) =>
  sequelize.query<{ email: string; contact_name: string; added_for_notice: boolean; message_id: string }>(
    'SELECT email, contact_name, added_for_notice, message_id FROM notice_recipients WHERE notice_id = :noticeId ORDER BY email',
    { replacements: { noticeId }, type: QueryTypes.SELECT },
  );

/** The messages the catcher holds for an address that belong to one notice (our Message-ID names the notice). */
const ofNotice = async (address: string, noticeId: string) => (await messagesTo(address)).filter((m) => m.messageId?.startsWith(`<notice-${noticeId}.`));

async function waitUntilSent(noticeId: string) {
  const started = Date.now();
  for (;;) {
    const view = (await adviser.get(`/api/notices/${noticeId}`).expect(200)).body.notice;
    if (view.status === 'sent') return view;
    if (Date.now() - started > 30_000) throw new Error(`notice still ${view.status}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

describe('sending to the recipients the adviser chose', () => {
  it('sends nothing to a contact left out, one e-mail to an added address, and stores exactly the chosen copies', async () => {
    const noticeId = await draft();
    const added = { name: 'Fay Agronomist', email: `  Fay-${tag}@Consult.Example ` };
    const res = await adviser.post(`/api/notices/${noticeId}/send`, {
      recipients: { contactIds: [contact('Ada').id, contact('Ben').id], added: [added] },
    });
    expect(res.status).toBe(202);
    const view = await waitUntilSent(noticeId);

    const fay = `fay-${tag}@consult.example`;
    const copies = await storedCopies(noticeId);
    expect(copies.map((c) => [c.email, c.added_for_notice])).toEqual([
      [contact('Ada').email, false],
      [contact('Ben').email, false],
      [fay, true],
    ]);
    expect(view.recipients.find((r: { email: string }) => r.email === fay)).toMatchObject({ name: 'Fay Agronomist', addedForNotice: true, delivery: 'sent' });

    // Each chosen address holds exactly this notice's one message at the catcher, by its Message-ID.
    for (const copy of copies) {
      const [first] = await waitForMessage(copy.email, 1, 20_000);
      expect(first.messageId).toBe(copy.message_id);
      expect(await ofNotice(copy.email, noticeId)).toHaveLength(1);
    }
    // The contact left out: no copy stored and, once every chosen copy was accepted, no message at the catcher.
    expect(copies.some((c) => c.email === contact('Cal').email)).toBe(false);
    expect(await ofNotice(contact('Cal').email, noticeId)).toHaveLength(0);
    // The farm's contact list is as it was: the added address was for this notice only.
    const farm = (await adviser.get(`/api/farms/${scouted.field.farmId}`).expect(200)).body.farm;
    expect(farm.contacts.map((c: { email: string }) => c.email).sort()).toEqual(contacts.map((c) => c.email).sort());
  });

  it('still sends to every contact of the farm when the body names no recipients', async () => {
    const noticeId = await draft();
    await adviser.post(`/api/notices/${noticeId}/send`).expect(202);
    expect((await storedCopies(noticeId)).map((c) => c.email)).toEqual(contacts.map((c) => c.email).sort());
  });
});

describe('a recipient choice that names anything outside the farm is refused, and nothing is stored', () => {
  const refusedWith = async (recipients: unknown, message: RegExp, field?: string) => {
    const noticeId = await draft();
    const res = await adviser.post(`/api/notices/${noticeId}/send`, { recipients });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(message);
    if (field) expect(Object.keys(res.body.error.fields ?? {})).toContain(field);
    expect(await storedCopies(noticeId)).toEqual([]);
    expect((await adviser.get(`/api/notices/${noticeId}`).expect(200)).body.notice.status).toBe('draft');
  };

  it('refuses a contact of another farm of the same organisation', async () => {
    await refusedWith({ contactIds: [contact('Ada').id, otherFarmContactId] }, /not a contact of this farm/);
  });

  it('refuses a contact of another organisation', async () => {
    await refusedWith({ contactIds: [otherOrganisationContactId] }, /not a contact of this farm/);
  });

  it('refuses an added address that is not an e-mail address, saying which', async () => {
    await refusedWith(
      { contactIds: [contact('Ada').id], added: [{ name: 'Typo', email: 'fay-at-consult' }] },
      /valid e-mail address/,
      'recipients.added.0.email',
    );
  });

  it('refuses an empty choice', async () => {
    await refusedWith({ contactIds: [], added: [] }, /at least one recipient/);
  });

  it('refuses adding the address of one of the farm’s contacts as a stranger', async () => {
    await refusedWith({ contactIds: [], added: [{ name: 'Cal again', email: contact('Cal').email }] }, /already a contact of this farm/);
  });

  it('refuses fields it does not know', async () => {
    await refusedWith({ contactIds: [contact('Ada').id], bcc: ['someone@example.com'] }, /./);
  });
});

describe('another organisation', () => {
  it('cannot send the notice, with or without a recipient choice of its own', async () => {
    const noticeId = await draft();
    const theirs = { contactIds: [otherOrganisationContactId], added: [{ name: 'Grab', email: `grab-${tag}@elsewhere.example` }] };
    expect((await outsider.post(`/api/notices/${noticeId}/send`, { recipients: theirs })).status).toBe(404);
    expect((await outsider.post(`/api/notices/${noticeId}/send`)).status).toBe(404);
    expect(await storedCopies(noticeId)).toEqual([]);
    expect(await messagesTo(`grab-${tag}@elsewhere.example`)).toHaveLength(0);
  });
});
