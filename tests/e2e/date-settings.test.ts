// The admin's dates-and-times screen in the browser: the preview follows the chosen locale and zone before saving, a
// saved change reaches a page that shows dates, a refusal from the server is shown in its own words, and only admins
// get the screen. Expected strings are built with ECMA-402 Intl.DateTimeFormat (CLDR long date and short time patterns)
// for the locale and IANA zone named, as the app must write them; a fresh organisation keeps the demo one untouched.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { sequelize } from '../../server/db.ts';
import { launchBrowser, startTestServer, type TestServer } from '../helpers/browser.ts';
import { signedIn, type Client } from '../helpers/http.ts';
import { makeOrganisation, TEST_PASSWORD, type TestOrganisation } from '../helpers/org.ts';
import { acceptProposedZones, makeCheckedField } from '../helpers/zones.ts';

let server: TestServer;
let browser: Browser;
let org: TestOrganisation;
let adviser: Client;

// The preview's example moment (src/features/admin/components/date-settings-page.tsx) and a notice written at a moment
// that is still 1 July in Chicago (22:30 CDT, UTC−5) but already 2 July in London (04:30 BST, UTC+1).
const EXAMPLE_MOMENT = new Date('2026-07-14T20:30:00Z');
const NOTICE_WRITTEN = new Date('2026-07-02T03:30:00Z');
const longDate = (locale: string, timeZone: string, at: Date) => new Intl.DateTimeFormat(locale, { dateStyle: 'long', timeZone }).format(at);
const longDateTime = (locale: string, timeZone: string, at: Date) =>
  new Intl.DateTimeFormat(locale, { dateStyle: 'long', timeStyle: 'short', timeZone }).format(at);

async function signIn(page: Page, email: string) {
  await page.goto(`${server.url}/sign-in`);
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password').fill(TEST_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('button', { name: 'Sign out' }).waitFor();
}

beforeAll(async () => {
  [server, browser, org] = await Promise.all([startTestServer(), launchBrowser(), makeOrganisation('Date settings')]);
  adviser = await signedIn(org.users.adviser.email);
  const scouted = await makeCheckedField(org, adviser, { fieldName: 'Clock meadow' });
  const zoneSet = await acceptProposedZones(adviser, scouted);
  const draft = await adviser.post('/api/notices', { fieldId: scouted.field.id, zoneSetId: zoneSet.id, recommendation: 'Spot-spray the zones.' }).expect(201);
  await sequelize.query('UPDATE notices SET created_at = :at WHERE id = :id', { replacements: { at: NOTICE_WRITTEN.toISOString(), id: draft.body.notice.id } });
});

afterAll(async () => {
  await browser?.close();
  await server?.close();
});

describe('the dates-and-times screen', () => {
  it('previews en-US in America/Chicago before saving, saves it, and the Notices page then writes dates that way', async () => {
    const page = await browser.newPage({ viewport: { width: 1300, height: 1000 } });
    await signIn(page, org.users.admin.email);
    await page.getByRole('navigation').getByRole('link', { name: 'Dates and times' }).click();
    await page.getByRole('heading', { level: 1, name: 'Dates and times' }).waitFor();

    // A new organisation writes dates in en-GB for Europe/London (shared/dates/format-dates.ts DEFAULT_DATE_FORMAT).
    expect(await page.getByTestId('preview-date').textContent()).toBe(longDate('en-GB', 'Europe/London', EXAMPLE_MOMENT));
    await page.getByLabel('Language and region').selectOption('en-US');
    await page.getByLabel('Time zone').selectOption('America/Chicago');
    expect(await page.getByTestId('preview-date').textContent()).toBe(longDate('en-US', 'America/Chicago', EXAMPLE_MOMENT));
    expect(await page.getByTestId('preview-date-time').textContent()).toBe(longDateTime('en-US', 'America/Chicago', EXAMPLE_MOMENT));
    // Nothing is stored before Save.
    expect((await adviser.get('/api/config').expect(200)).body.dateFormat).toEqual({ locale: 'en-GB', timeZone: 'Europe/London' });

    await page.getByRole('button', { name: 'Save dates and times' }).click();
    await page
      .getByRole('status')
      .getByText(/Saved\. Dates across Patchwise/)
      .waitFor();
    expect((await adviser.get('/api/config').expect(200)).body.dateFormat).toEqual({ locale: 'en-US', timeZone: 'America/Chicago' });

    // Without reloading, the Notices page writes the draft's day as Chicago's, in US order.
    await page.getByRole('navigation').getByRole('link', { name: 'Notices' }).click();
    const row = page.getByRole('table', { name: 'Zone notices' }).locator('tbody tr').first();
    await row.getByText(`Written ${longDate('en-US', 'America/Chicago', NOTICE_WRITTEN)}`).waitFor();
    await page.close();
  }, 120_000);

  it('shows the server’s sentence when it refuses the change, and keeps what was stored', async () => {
    const page = await browser.newPage({ viewport: { width: 1300, height: 1000 } });
    await signIn(page, org.users.admin.email);
    await page.goto(`${server.url}/admin/dates`);
    await page.getByLabel('Time zone').selectOption('Pacific/Auckland');
    // The account loses its admin role while the screen is open: the server refuses the save in its own words.
    await sequelize.query("UPDATE users SET role = 'adviser' WHERE id = :id", { replacements: { id: org.users.admin.id } });
    try {
      await page.getByRole('button', { name: 'Save dates and times' }).click();
      await page.getByRole('alert').getByText('Your role does not allow this.').waitFor();
    } finally {
      await sequelize.query("UPDATE users SET role = 'admin' WHERE id = :id", { replacements: { id: org.users.admin.id } });
    }
    expect((await adviser.get('/api/config').expect(200)).body.dateFormat).toEqual({ locale: 'en-US', timeZone: 'America/Chicago' });
    await page.close();
  }, 60_000);

  it('is not offered to an adviser, and its address tells them it is not for their role', async () => {
    const page = await browser.newPage({ viewport: { width: 1300, height: 1000 } });
    await signIn(page, org.users.adviser.email);
    await page.getByRole('navigation').getByRole('link', { name: 'Notices' }).waitFor();
    expect(await page.getByRole('navigation').getByRole('link', { name: 'Dates and times' }).count()).toBe(0);
    await page.goto(`${server.url}/admin/dates`);
    await page.getByRole('heading', { level: 1, name: 'Not available to your role' }).waitFor();
    expect(await page.getByLabel('Time zone').count()).toBe(0);
    await page.close();
  }, 60_000);
});
