// Accessibility of the main pages: axe-core (through @axe-core/playwright) finds no serious or critical
// violation, Tab reaches every button, link and input in document order, and each page's main action works
// from the keyboard alone. The rules are axe-core 4.10's defaults (WCAG 2.0/2.1/2.2 A and AA plus its best
// practices); "serious" and "critical" are axe-core's own impact levels.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { launchBrowser, startTestServer, type TestServer } from '../helpers/browser.ts';
import { signedIn, type Client } from '../helpers/http.ts';
import { makeOrganisation, type TestOrganisation } from '../helpers/org.ts';
import { createFarm, createField, createPest } from '../helpers/farm-records.ts';
import { rectangleBoundary, TEST_FIELD_CORNER } from '../helpers/sightings.ts';
import { acceptProposedZones, addContacts, makeCheckedField, type ScoutedCheck } from '../helpers/zones.ts';
import { noticeLinkToken, waitForMessage } from '../helpers/mailbox.ts';
import { makeJpeg } from '../helpers/photos.ts';
import { findingsTable, focusTop, seriousViolations, tabTo, walkWithTab } from '../helpers/accessibility.ts';
import { expectAccessible, newContext, sendOnePhotoByKeyboard, signInByKeyboard as signInByKeyboardAt } from '../helpers/accessibility-browser.ts';

let server: TestServer;
let browser: Browser;
let org: TestOrganisation;
let admin: Client;
let adviser: Client;
let farm: { id: string; name: string };
let scoutField: { id: string; name: string };
let walkId: string;
let scouted: ScoutedCheck;
let noticeToken: string;
const settle = { timeout: 60_000, interval: 250 };

beforeAll(async () => {
  // Workers on: the notice e-mail goes out through the queue, and heavy checks run there.
  [server, browser, org] = await Promise.all([startTestServer({ workers: true }), launchBrowser(), makeOrganisation('Accessibility')]);
  admin = await signedIn(org.users.admin.email);
  adviser = await signedIn(org.users.adviser.email);

  farm = await createFarm(admin, { name: 'Hazel Ridge' });
  scoutField = await createField(admin, farm.id, rectangleBoundary(), { name: 'Upper Terrace' });
  await createPest(admin, { countUnit: 'aphids per plant' });
  await admin.post(`/api/fields/${scoutField.id}/scouts`, { userId: org.users.scout.id }).expect(204);
  const scout = await signedIn(org.users.scout.email);
  walkId = (await scout.post('/api/walks', { fieldId: scoutField.id, walkedOn: new Date().toISOString().slice(0, 10) })).body.walk.id;

  scouted = await makeCheckedField(org, adviser, { fieldName: 'Lower Bottoms' });
  const zoneSet = await acceptProposedZones(adviser, scouted);
  const contact = { name: 'Tamsin Reed', email: `tamsin-${org.id.slice(0, 8)}@farm.example` };
  await addContacts(scouted.field.farmId, [contact]);
  const notice = await adviser
    .post('/api/notices', {
      fieldId: scouted.field.id,
      zoneSetId: zoneSet.id,
      recommendation: 'Spot-treat the zones only, following the product label; re-scout in a week.',
    })
    .expect(201);
  await adviser.post(`/api/notices/${notice.body.notice.id}/send`).expect(202);
  noticeToken = noticeLinkToken((await waitForMessage(contact.email, 1, 30_000))[0]);
});

afterAll(async () => {
  await browser?.close();
  await server?.close();
});

const desk = () => newContext(browser, 'desk');
const phone = () => newContext(browser, 'phone');
const signInByKeyboard = (page: Page, email: string) => signInByKeyboardAt(page, server.url, email);

async function signedInPage(context: BrowserContext, email: string) {
  const page = await context.newPage();
  await signInByKeyboard(page, email);
  return page;
}

// axe-core and the Tab walks take a while on a 2-core machine.
describe('accessibility', { timeout: 240_000 }, () => {
  it('the checks themselves catch an unlabelled input, a mouse-only control and a control focus skips past', async () => {
    // A context of its own: axe-core finishes its run in a second page of the same context.
    const context = await browser.newContext();
    try {
      const page = await context.newPage();
      await page.setContent(`<!doctype html><html lang="en"><head><title>Broken on purpose</title></head><body><main>
        <h1>Broken on purpose</h1>
        <input type="text">
        <div style="cursor:pointer" onclick="void 0">Save</div>
        <input aria-label="Passed over" onfocus="document.getElementById('reached').focus()">
        <button type="button" id="reached">Reached</button>
      </main></body></html>`);
      expect((await seriousViolations(page)).map((f) => f.rule)).toContain('label');
      const walk = await walkWithTab(page);
      expect(walk.unfocusable).toEqual(['div “Save”']);
      expect(walk.missed).toEqual([expect.stringContaining('Passed over')]);
      expect(walk.reached).toEqual([expect.stringContaining('input[text]'), expect.stringContaining('Reached')]);
    } finally {
      await context.close();
    }
  });

  it('sign-in page: no serious violation, every control reachable, signs in with the keyboard alone', async () => {
    const context = await desk();
    try {
      const page = await context.newPage();
      await page.goto(`${server.url}/sign-in`);
      await page.getByRole('heading', { name: 'Sign in' }).waitFor();
      await expectAccessible(page);
      // A refused sign-in is announced next to the form, and the page stays accessible with it showing.
      await focusTop(page);
      await tabTo(page, page.getByRole('button', { name: 'Sign in' }));
      await page.keyboard.press('Enter');
      await page.locator('[aria-invalid="true"]').first().waitFor();
      expect((await seriousViolations(page)).length, findingsTable(await seriousViolations(page))).toBe(0);
      await signInByKeyboard(page, org.users.admin.email);
      await page.getByRole('heading', { name: 'Overview' }).waitFor();
    } finally {
      await context.close();
    }
  });

  it('scout walk page on a phone: no serious violation, every control reachable, photos chosen and sent and a stop recorded by keyboard', async () => {
    const context = await phone();
    try {
      const page = await signedInPage(context, org.users.scout.email);
      await page.goto(`${server.url}/scout/walks/${walkId}`);
      await page.getByRole('heading', { name: 'Upper Terrace' }).waitFor();
      await page.locator('.leaflet-container').first().waitFor();
      await expectAccessible(page);

      await sendOnePhotoByKeyboard(page, {
        name: 'leaf.jpg',
        buffer: await makeJpeg({ gps: { lon: TEST_FIELD_CORNER.lon + 0.002, lat: TEST_FIELD_CORNER.lat + 0.001 }, markSeed: 7 }),
      });

      await focusTop(page);
      await tabTo(page, page.getByRole('button', { name: 'Nothing found here' }));
      await page.keyboard.press('Space');
      await page.getByText(/Stop recorded/).waitFor({ timeout: 30_000 });
      await expectAccessible(page);
    } finally {
      await context.close();
    }
  });

  it('adviser field review: no serious violation, every control reachable, a check run with the keyboard', async () => {
    const context = await desk();
    try {
      const page = await signedInPage(context, org.users.adviser.email);
      await page.goto(`${server.url}/fields/${scouted.field.id}/review?check=${scouted.checkId}`);
      await page.getByRole('heading', { name: /Lower Bottoms/ }).waitFor();
      await page.getByRole('button', { name: 'Run check' }).waitFor();
      await page.locator('.leaflet-container').first().waitFor();
      await page.getByRole('table').first().waitFor();
      await expectAccessible(page);

      await page.goto(`${server.url}/fields/${scouted.field.id}/review`);
      await page.getByRole('button', { name: 'Run check' }).waitFor();
      await focusTop(page);
      await tabTo(page, page.getByRole('button', { name: 'Run check' }));
      await page.keyboard.press('Enter');
      await page.waitForURL(/[?&]check=[0-9a-f-]{36}/, { timeout: 60_000 });
      await expect.poll(() => page.getByRole('button', { name: 'Run check' }).getAttribute('aria-busy'), settle).toBeNull();
    } finally {
      await context.close();
    }
  });

  it('public notice page: no serious violation, every control reachable, acknowledged with the keyboard', async () => {
    const context = await browser.newContext({ viewport: { width: 900, height: 1000 } });
    try {
      const page = await context.newPage();
      await page.goto(`${server.url}/n/${noticeToken}`);
      await page.getByRole('heading', { level: 1, name: /on Lower Bottoms/ }).waitFor();
      await page.getByRole('table', { name: 'Treatment zones' }).waitFor();
      await expectAccessible(page);

      await focusTop(page);
      await tabTo(page, page.getByRole('button', { name: 'Acknowledge' }));
      await page.keyboard.press('Enter');
      await page.getByText(/Acknowledged on/).waitFor();
      expect(findingsTable(await seriousViolations(page))).toBe('(none)');
    } finally {
      await context.close();
    }
  });

  it('admin farms and fields pages: no serious violation, every control reachable, a farm created and a field opened with the keyboard', async () => {
    const context = await desk();
    try {
      const page = await signedInPage(context, org.users.admin.email);
      await page.goto(`${server.url}/admin/farms`);
      await page.getByRole('heading', { name: 'Farms' }).waitFor();
      await page
        .getByRole('link', { name: /Hazel Ridge/ })
        .first()
        .waitFor();
      await expectAccessible(page);

      await focusTop(page);
      await tabTo(page, page.getByRole('button', { name: 'New farm' }));
      await page.keyboard.press('Enter');
      await tabTo(page, page.getByLabel('Farm name'));
      await page.keyboard.type('Birch Hollow');
      await expectAccessible(page);
      await tabTo(page, page.getByRole('button', { name: 'Create farm' }));
      await page.keyboard.press('Enter');
      await page.getByRole('heading', { name: 'Birch Hollow' }).waitFor();

      await page.goto(`${server.url}/admin/farms/${farm.id}`);
      await page.getByRole('heading', { name: 'Hazel Ridge' }).waitFor();
      await page
        .getByRole('link', { name: /Upper Terrace/ })
        .first()
        .waitFor();
      await expectAccessible(page);
      await focusTop(page);
      await tabTo(page, page.getByRole('link', { name: /Upper Terrace/ }).first());
      await page.keyboard.press('Enter');
      await page.getByRole('heading', { name: 'Upper Terrace' }).waitFor();
      await page.locator('.leaflet-container').first().waitFor();
      await expectAccessible(page);

      await page.goto(`${server.url}/admin/farms/${farm.id}/fields/new`);
      await page.getByLabel('Field name').waitFor();
      await expectAccessible(page);
    } finally {
      await context.close();
    }
  });
});
