// The Notices page's "from" and "to" days are the organisation's calendar days, read in its time zone, not in the zone of
// the adviser's computer. The organisation keeps America/Chicago; the browser runs in Pacific/Auckland, 17 hours ahead,
// so a filter built on the browser's midnight would pick the wrong notices. Offsets from the IANA tz database rules:
// 23:30 CDT (UTC−5, US daylight time from the second Sunday of March) on 1 July 2026 is 04:30 UTC on 2 July.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { sequelize } from '../../server/db.ts';
import { launchBrowser, startTestServer, type TestServer } from '../helpers/browser.ts';
import { signedIn } from '../helpers/http.ts';
import { makeOrganisation, TEST_PASSWORD, type TestOrganisation } from '../helpers/org.ts';
import { acceptProposedZones, addContacts, makeCheckedField } from '../helpers/zones.ts';

let server: TestServer;
let browser: Browser;
let context: BrowserContext;
let org: TestOrganisation;
let noticeId: string;
const SENT_AT = '2026-07-02T04:30:00.000Z'; // 23:30 on 1 July 2026 in Chicago (CDT, UTC−5)

async function signIn(page: Page, email: string) {
  await page.goto(`${server.url}/sign-in`);
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password').fill(TEST_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('button', { name: 'Sign out' }).waitFor();
}

beforeAll(async () => {
  [server, browser, org] = await Promise.all([startTestServer({ workers: true }), launchBrowser(), makeOrganisation('Notice days')]);
  const [admin, adviser] = await Promise.all([signedIn(org.users.admin.email), signedIn(org.users.adviser.email)]);
  await admin.put('/api/config/date-format', { locale: 'en-US', timeZone: 'America/Chicago' }).expect(200);
  const scouted = await makeCheckedField(org, adviser, { fieldName: 'Late meadow' });
  await addContacts(scouted.field.farmId, [{ name: 'Late contact', email: `late-${org.id.slice(0, 8)}@farm.example` }]);
  const zoneSet = await acceptProposedZones(adviser, scouted);
  const drafted = await adviser.post('/api/notices', { fieldId: scouted.field.id, zoneSetId: zoneSet.id, recommendation: 'Spot-spray the zones.' }).expect(201);
  noticeId = drafted.body.notice.id;
  await adviser.post(`/api/notices/${noticeId}/send`).expect(202);
  // The send just happened; the test needs it late on a known evening.
  await sequelize.query('UPDATE notices SET sent_at = :at WHERE id = :id', { replacements: { at: SENT_AT, id: noticeId } });
  context = await browser.newContext({ viewport: { width: 1300, height: 1000 }, timezoneId: 'Pacific/Auckland' });
});

afterAll(async () => {
  await context?.close();
  await browser?.close();
  await server?.close();
});

describe('the Notices page’s days', () => {
  it('counts a notice sent at 23:30 in the organisation’s zone on 1 July as sent on 1 July, not 2 July', async () => {
    const page = await context.newPage();
    await signIn(page, org.users.adviser.email);
    // The browser really is in Auckland: there it is already the afternoon of 2 July (NZST, UTC+12).
    expect(await page.evaluate((at) => new Date(at).getDate(), SENT_AT)).toBe(2);

    const rows = page.getByRole('table', { name: 'Zone notices' }).locator('tbody tr');
    await page.goto(`${server.url}/notices?from=2026-07-01`);
    await expect.poll(() => rows.count()).toBe(1);
    expect(await rows.first().getAttribute('data-notice')).toBe(noticeId);
    // Written as Chicago's day in US order (ECMA-402 Intl.DateTimeFormat, en-US long date).
    const chicagoDay = new Intl.DateTimeFormat('en-US', { dateStyle: 'long', timeZone: 'America/Chicago' }).format(new Date(SENT_AT));
    await rows.first().getByText(`Sent ${chicagoDay}`).waitFor();

    await page.getByLabel('From').fill('2026-07-02');
    await page.getByText('No notice matches').waitFor();

    // "To 1 July" takes in the whole of Chicago's 1 July, its last half hour too; "to 30 June" leaves it out.
    await page.goto(`${server.url}/notices?to=2026-07-01`);
    await expect.poll(() => rows.count()).toBe(1);
    await page.goto(`${server.url}/notices?to=2026-06-30`);
    await page.getByText('No notice matches').waitFor();
    await page.getByText('as days in the America/Chicago time zone').waitFor();
    await page.close();
  }, 120_000);
});
