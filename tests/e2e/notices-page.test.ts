// The adviser's notices in the browser: sending asks first and shows who gets the notice (one contact left out, one
// address added for this notice), the real mail catcher then holds mail for exactly those, and the Notices page lists
// every notice with each copy's state and narrows to a state.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, startTestServer, type TestServer } from '../helpers/browser.ts';
import { signedIn, testApp, type Client } from '../helpers/http.ts';
import { makeOrganisation, TEST_PASSWORD, type TestOrganisation } from '../helpers/org.ts';
import { messagesTo, noticeLinkToken, waitForMessage } from '../helpers/mailbox.ts';
import { acceptProposedZones, addContacts, makeCheckedField, type ScoutedCheck } from '../helpers/zones.ts';

let server: TestServer;
let browser: Browser;
let org: TestOrganisation;
let adviser: Client;
let scouted: ScoutedCheck;
let zoneSetId: string;
let ada: string;
let ben: string;
let fay: string;
let acknowledgedId: string;
let draftId: string;

async function signIn(page: Page, email: string) {
  await page.goto(`${server.url}/sign-in`);
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password').fill(TEST_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('button', { name: 'Sign out' }).waitFor();
}

const writeNotice = async () =>
  (
    await adviser
      .post('/api/notices', { fieldId: scouted.field.id, zoneSetId, recommendation: 'Spot-spray both zones this week; leave the rest untreated.' })
      .expect(201)
  ).body.notice.id as string;

/** The messages at the catcher for an address that belong to one notice (our Message-ID names the notice). */
const ofNotice = async (address: string, noticeId: string) => (await messagesTo(address)).filter((m) => m.messageId?.startsWith(`<notice-${noticeId}.`));

beforeAll(async () => {
  [server, browser, org] = await Promise.all([startTestServer({ workers: true }), launchBrowser(), makeOrganisation('Notices page')]);
  adviser = await signedIn(org.users.adviser.email);
  scouted = await makeCheckedField(org, adviser, { fieldName: 'Wheat Close' });
  zoneSetId = (await acceptProposedZones(adviser, scouted)).id;
  const tag = org.id.slice(0, 8);
  [ada, ben, fay] = [`ada-${tag}@farm.example`, `ben-${tag}@farm.example`, `fay-${tag}@consult.example`];
  await addContacts(scouted.field.farmId, [
    { name: 'Ada Furrow', email: ada },
    { name: 'Ben Headland', email: ben },
  ]);
  // A notice sent to both contacts, which Ada acknowledges from her e-mailed link.
  acknowledgedId = await writeNotice();
  await adviser.post(`/api/notices/${acknowledgedId}/send`).expect(202);
  const [mail] = await waitForMessage(ada, 1, 30_000);
  await request(testApp())
    .post(`/api/notice-links/${noticeLinkToken(mail)}/acknowledge`)
    .expect(200);
  draftId = await writeNotice();
});

afterAll(async () => {
  await browser?.close();
  await server?.close();
});

describe('notices in the browser', () => {
  it('asks before sending, shows who gets the notice, and sends to exactly the recipients chosen', async () => {
    const page = await browser.newPage({ viewport: { width: 1300, height: 1000 } });
    await signIn(page, org.users.adviser.email);
    await page.goto(`${server.url}/notices/${draftId}`);
    await page.getByRole('button', { name: 'Send the notice' }).click();

    const dialog = page.getByRole('dialog', { name: 'Send this notice?' });
    const adaBox = dialog.getByRole('checkbox', { name: new RegExp(ada) });
    const benBox = dialog.getByRole('checkbox', { name: new RegExp(ben) });
    expect(await adaBox.isChecked()).toBe(true);
    expect(await benBox.isChecked()).toBe(true);
    await dialog.getByRole('button', { name: 'Send to 2 recipients' }).waitFor();
    // Nothing has gone out while the question is open.
    expect(await page.getByTestId('notice-status').textContent()).toBe('Draft, not sent');

    await benBox.uncheck();
    await dialog.getByText('left out of this notice').waitFor();
    // An address that is not one is refused beside its box, and nothing is added.
    await dialog.getByLabel('Name').fill('Fay Agronomist');
    await dialog.getByLabel('E-mail').fill('fay-at-consult');
    await dialog.getByRole('button', { name: 'Add', exact: true }).click();
    await dialog.getByText(/valid e-mail address/).waitFor();
    await dialog.getByLabel('E-mail').fill(fay);
    await dialog.getByRole('button', { name: 'Add', exact: true }).click();
    await dialog.getByRole('list', { name: 'Addresses added for this notice' }).getByText(fay).waitFor();
    await dialog.getByRole('button', { name: 'Send to 2 recipients' }).click();

    const recipients = page.getByRole('table', { name: 'Recipients of this notice' });
    await recipients.locator(`tr[data-recipient="${fay}"]`).getByText('Added for this notice only').waitFor();
    await recipients.locator(`tr[data-recipient="${ada}"]`).waitFor();
    expect(await recipients.locator(`tr[data-recipient="${ben}"]`).count()).toBe(0);

    // The catcher: one message each for Ada and Fay, none for Ben, once both copies were accepted.
    await page.getByTestId('notice-status').getByText('Sent to every contact').waitFor({ timeout: 30_000 });
    expect(await ofNotice(ada, draftId)).toHaveLength(1);
    expect(await ofNotice(fay, draftId)).toHaveLength(1);
    expect(await ofNotice(ben, draftId)).toHaveLength(0);
  }, 120_000);

  it('lists every notice with each copy’s state on the Notices page, and narrows to a state', async () => {
    const page = await browser.newPage({ viewport: { width: 1300, height: 1000 } });
    await signIn(page, org.users.adviser.email);
    await page.getByRole('navigation').getByRole('link', { name: 'Notices' }).click();
    await page.getByRole('heading', { level: 1, name: 'Notices' }).waitFor();
    const table = page.getByRole('table', { name: 'Zone notices' });
    const rows = table.locator('tbody tr');
    await expect.poll(() => rows.count()).toBe(2);

    const acknowledgedRow = table.locator(`tr[data-notice="${acknowledgedId}"]`);
    await acknowledgedRow.locator(`li[data-recipient="${ada}"]`).getByText('acknowledged', { exact: true }).waitFor();
    await acknowledgedRow.locator(`li[data-recipient="${ben}"]`).getByText('sent', { exact: true }).waitFor();
    await table.locator(`tr[data-notice="${draftId}"] li[data-recipient="${fay}"]`).getByText('added for this notice').waitFor();

    // Narrowed to notices someone has acknowledged: only the first one, and the address says so.
    await page.getByLabel('State').selectOption('acknowledged');
    await page.waitForURL(/state=acknowledged/);
    await expect.poll(() => rows.count()).toBe(1);
    expect(await rows.first().getAttribute('data-notice')).toBe(acknowledgedId);

    // A date range after today leaves nothing.
    const nextYear = new Date().getFullYear() + 1;
    await page.getByLabel('From').fill(`${nextYear}-01-01`);
    await page.getByText('No notice matches').waitFor();
    await page.getByLabel('From').fill('');
    await expect.poll(() => rows.count()).toBe(1);

    // Each row links to its notice.
    await rows
      .first()
      .getByRole('link', { name: /Wheat Close/ })
      .click();
    await page.waitForURL(new RegExp(`/notices/${acknowledgedId}$`));
    await page.getByRole('table', { name: 'Recipients of this notice' }).waitFor();
  }, 120_000);
});
