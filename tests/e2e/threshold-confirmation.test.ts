// A threshold the admin has not checked against its source is marked "Needs confirming" where the adviser reads it
// against a walk and in the pest library; the admin's Confirm takes the mark away on both.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { signedIn } from '../helpers/http.ts';
import { makeOrganisation, TEST_PASSWORD, type TestOrganisation } from '../helpers/org.ts';
import { createPest } from '../helpers/farm-records.ts';
import { addSightings, makeField, makeWalk, TEST_FIELD_CORNER } from '../helpers/sightings.ts';
import { launchBrowser, startTestServer, type TestServer } from '../helpers/browser.ts';

let server: TestServer;
let browser: Browser;
let org: TestOrganisation;
let field: { id: string };
let pest: { id: string; name: string };

beforeAll(async () => {
  [server, browser] = await Promise.all([startTestServer(), launchBrowser()]);
  org = await makeOrganisation('Threshold mark');
  const admin = await signedIn(org.users.admin.email);
  pest = await createPest(admin, { name: 'Leaf beetle', thresholdSource: 'Figure recalled from memory' });
  field = await makeField(org);
  const walkId = await makeWalk(org, field.id, '2026-07-14');
  const { lon, lat } = TEST_FIELD_CORNER;
  await addSightings(
    org,
    { fieldId: field.id, walkId, pestId: pest.id },
    [0, 1, 2, 3, 4, 5].map((i) => ({ lon: lon + 0.0006 * (i + 1), lat: lat + 0.0012, count: i % 3 })),
  );
});

afterAll(async () => {
  await browser?.close();
  await server?.close();
});

async function signIn(page: Page, email: string) {
  await page.goto(`${server.url}/sign-in`);
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password').fill(TEST_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
}

const thresholdPanel = (page: Page) => page.locator('section').filter({ has: page.getByRole('heading', { name: 'Against the action threshold' }) });

async function openThresholdPanel(page: Page) {
  await page.goto(`${server.url}/fields/${field.id}/review?pest=${pest.id}`);
  const panel = thresholdPanel(page);
  await panel.locator('tr[data-threshold-status]').first().waitFor();
  return panel;
}

describe('a threshold that needs confirming', () => {
  it('is marked for the adviser and in the pest library until the admin confirms it', async () => {
    const adviser = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    const admin = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    try {
      await signIn(adviser, org.users.adviser.email);
      let panel = await openThresholdPanel(adviser);
      await panel.getByText('Needs confirming').first().waitFor();
      expect(await panel.locator('[data-needs-confirming]').textContent()).toContain('has not yet been checked against a published source');

      await signIn(admin, org.users.admin.email);
      await admin.goto(`${server.url}/admin/pests`);
      const row = admin.getByRole('row').filter({ hasText: 'Leaf beetle' });
      await row.locator('[data-needs-confirming]').waitFor();
      await row.getByRole('button', { name: 'Confirm the threshold of Leaf beetle' }).click();
      await expect.poll(() => row.locator('[data-needs-confirming]').count()).toBe(0);
      expect(await row.getByRole('button', { name: 'Confirm the threshold of Leaf beetle' }).count()).toBe(0);

      panel = await openThresholdPanel(adviser);
      expect(await panel.getByText('Needs confirming').count()).toBe(0);
    } finally {
      await adviser.close();
      await admin.close();
    }
  });
});
