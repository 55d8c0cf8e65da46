// The pest lists follow the field's crop: on a corn field the scout's pest picker and the adviser's pest choice
// on the review page list the corn pests first, under their own heading, and every other pest after.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Locator, Page } from 'playwright-core';
import { signedIn } from '../helpers/http.ts';
import { makeOrganisation, TEST_PASSWORD, type TestOrganisation } from '../helpers/org.ts';
import { createFarm, createField, createPest } from '../helpers/farm-records.ts';
import { addSightings, makeWalk, rectangleBoundary, TEST_FIELD_CORNER } from '../helpers/sightings.ts';
import { launchBrowser, startTestServer, type TestServer } from '../helpers/browser.ts';
import { scoutPhone, signInOnPhone } from '../helpers/scout-phone.ts';

let server: TestServer;
let browser: Browser;
let org: TestOrganisation;
let field: { id: string; name: string };
let weevilId: string;

beforeAll(async () => {
  [server, browser] = await Promise.all([startTestServer(), launchBrowser()]);
  org = await makeOrganisation('Crop lists');
  const admin = await signedIn(org.users.admin.email);
  const farm = await createFarm(admin);
  // The field writes its crop with a capital, the pests in other cases: the match ignores case.
  field = await createField(admin, farm.id, rectangleBoundary(), { name: 'Creek Bottom', crop: 'Corn' });
  await createPest(admin, { name: 'Aphid of beans', crops: ['soybean'] });
  await createPest(admin, { name: 'Beetle of corn', crops: ['corn'] });
  await createPest(admin, { name: 'Armyworm', crops: ['CORN', 'wheat'] });
  weevilId = (await createPest(admin, { name: 'Weevil', crops: [] })).id;
  await admin.post(`/api/fields/${field.id}/scouts`, { userId: org.users.scout.id }).expect(204);
  const walkId = await makeWalk(org, field.id, '2026-07-01');
  await addSightings(org, { fieldId: field.id, walkId, pestId: weevilId }, [
    { lon: TEST_FIELD_CORNER.lon + 0.001, lat: TEST_FIELD_CORNER.lat + 0.001, count: 2 },
  ]);
});

afterAll(async () => {
  await browser?.close();
  await server?.close();
});

/** Each heading of a pest choice with the pest names under it, as the list shows them. */
const groupsOf = (select: Locator) =>
  select
    .locator('optgroup')
    .evaluateAll((groups) =>
      groups.map((g) => ({ heading: g.getAttribute('label'), pests: Array.from(g.querySelectorAll('option')).map((o) => o.textContent) })),
    );

async function signIn(page: Page, email: string) {
  await page.goto(`${server.url}/sign-in`);
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password').fill(TEST_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
}

describe("pest lists that follow the field's crop", () => {
  it("puts the field's crop's pests first in the scout's pest picker", async () => {
    const context = await scoutPhone(browser);
    try {
      const page = await signInOnPhone(context, server.url, org.users.scout.email);
      await page.getByRole('link', { name: 'Walk a field' }).tap();
      await page.getByRole('link', { name: /Creek Bottom/ }).tap();
      await page.getByRole('button', { name: 'Start a walk for today' }).tap();
      await page.waitForURL(/\/scout\/walks\/[0-9a-f-]{36}$/);
      const picker = page.getByLabel('Pest', { exact: true });
      await expect.poll(() => groupsOf(picker)).toHaveLength(2);
      expect(await groupsOf(picker)).toEqual([
        { heading: 'Pests of Corn', pests: ['Armyworm (aphids per plant)', 'Beetle of corn (aphids per plant)'] },
        { heading: 'Other pests', pests: ['Aphid of beans (aphids per plant)', 'Weevil (aphids per plant)'] },
      ]);
    } finally {
      await context.close();
    }
  });

  it("puts the field's crop's pests first in the adviser's pest choice on the review page", async () => {
    const page = await browser.newPage({ viewport: { width: 1400, height: 900 } });
    try {
      await signIn(page, org.users.adviser.email);
      await page.goto(`${server.url}/fields/${field.id}/review`);
      const choice = page.getByLabel('Pest under review');
      await expect.poll(() => groupsOf(choice)).toHaveLength(2);
      expect(await groupsOf(choice)).toEqual([
        { heading: 'Pests of Corn', pests: ['Armyworm', 'Beetle of corn'] },
        { heading: 'Other pests', pests: ['Aphid of beans', 'Weevil'] },
      ]);
    } finally {
      await page.close();
    }
  });

  it("puts the field's crop's pests first where the adviser corrects a sighting's pest in the review table", async () => {
    const page = await browser.newPage({ viewport: { width: 1400, height: 900 } });
    try {
      await signIn(page, org.users.adviser.email);
      await page.goto(`${server.url}/fields/${field.id}/review?pest=${weevilId}&from=2026-06-01&to=2026-07-31`);
      const editor = page.getByLabel('Pest of sighting from 1 July 2026').first();
      await expect.poll(() => groupsOf(editor), { timeout: 15_000 }).toHaveLength(2);
      expect(await groupsOf(editor)).toEqual([
        { heading: 'Pests of Corn', pests: ['Armyworm', 'Beetle of corn'] },
        { heading: 'Other pests', pests: ['Aphid of beans', 'Weevil'] },
      ]);
    } finally {
      await page.close();
    }
  });
});
