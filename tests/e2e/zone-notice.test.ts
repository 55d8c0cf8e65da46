// The loop from a clustered pest to the grower, in the browser: the adviser accepts the proposed zones and
// sends a notice, the mailbox shows it, the grower opens the e-mailed link and acknowledges, and the
// adviser's status page then says "acknowledged".
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { area as turfArea } from '@turf/turf';
import type { FeatureCollection, MultiPolygon } from 'geojson';
import { launchBrowser, startTestServer, type TestServer } from '../helpers/browser.ts';
import { signedIn, type Client } from '../helpers/http.ts';
import { makeOrganisation, TEST_PASSWORD, type TestOrganisation } from '../helpers/org.ts';
import { waitForMessage } from '../helpers/mailbox.ts';
import { addContacts, linkGrower, makeCheckedField, type ScoutedCheck } from '../helpers/zones.ts';
import { NOTICE_CAUTIONS } from '../../shared/notices/cautions.ts';

// International acre (international yard and pound agreement, 1959): 1 ac = 4046.8564224 m²; 1 ha = 10 000 m².
const M2_PER_ACRE = 4046.8564224;
const M2_PER_HA = 10_000;

let server: TestServer;
let browser: Browser;
let org: TestOrganisation;
let adviser: Client;
let scouted: ScoutedCheck;
// The grower contact is the grower's own account, so the signed-in grower sees their own copy's state.
let contact: { name: string; email: string };
const shots = process.env.PATCHWISE_SCREENSHOTS;

async function shot(page: Page, name: string) {
  if (!shots) return;
  fs.mkdirSync(shots, { recursive: true });
  await page.screenshot({ path: path.join(shots, `${name}.png`), fullPage: true });
}

async function signIn(page: Page, email: string) {
  await page.goto(`${server.url}/sign-in`);
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password').fill(TEST_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  // Every signed-in page has the sign-out button (a grower's single page has no navigation bar).
  await page.getByRole('button', { name: 'Sign out' }).waitFor();
}

const number = (text: string | null) => Number((text ?? '').replace(/[^\d.]/g, ''));

beforeAll(async () => {
  [server, browser, org] = await Promise.all([startTestServer({ workers: true }), launchBrowser(), makeOrganisation('Zone notice')]);
  adviser = await signedIn(org.users.adviser.email);
  scouted = await makeCheckedField(org, adviser, { fieldName: 'Long meadow' });
  contact = { name: org.users.grower.name, email: org.users.grower.email };
  await addContacts(scouted.field.farmId, [contact]);
  await linkGrower(scouted.field.farmId, org.users.grower.id);
});

afterAll(async () => {
  await browser?.close();
  // Stops the job queue and the simulation pool with the web server.
  await server?.close();
});

describe('zone notice in the browser', () => {
  it('goes from accepted zones to a sent notice that the grower acknowledges and the adviser sees acknowledged', async () => {
    const adviserPage = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    await signIn(adviserPage, org.users.adviser.email);

    // Zone editor: the engine's proposal from the clustered check.
    await adviserPage.goto(`${server.url}/fields/${scouted.field.id}/zones?checkId=${scouted.checkId}`);
    await adviserPage.getByRole('heading', { name: /Treatment zones · Long meadow/ }).waitFor();
    const zoneRows = adviserPage.getByRole('table', { name: 'Treatment zones being edited' }).locator('tbody tr');
    await zoneRows.first().waitFor();
    expect(await zoneRows.count()).toBeGreaterThanOrEqual(1);
    // Zones are drawn as vector paths on the map beside the boundary.
    expect(await adviserPage.locator('.leaflet-overlay-pane svg path').count()).toBeGreaterThanOrEqual(2);
    // Each row's hectares and acres agree through the international acre.
    const firstCells = zoneRows.first().locator('td');
    const ha = number(await firstCells.nth(1).textContent());
    const ac = number(await firstCells.nth(2).textContent());
    expect(ha).toBeGreaterThan(0);
    expect(ac).toBeCloseTo((ha * M2_PER_HA) / M2_PER_ACRE, 1);
    await shot(adviserPage, '1-zone-editor');

    // A wider margin gives a new proposal with more treated area (each zone is buffered further).
    const total = adviserPage.getByTestId('total-treated').locator('[data-unit="ha"]');
    const before = number(await total.textContent());
    await adviserPage.getByLabel('Margin (m)').fill('25');
    await adviserPage.waitForFunction(
      (old) => Number(document.querySelector('[data-testid="total-treated"] [data-unit="ha"]')?.textContent?.replace(/[^\d.]/g, '')) > old,
      before,
    );
    expect(number(await total.textContent())).toBeGreaterThan(before);
    const proposed = await zoneRows.count();

    // A zone drawn by hand in the empty north-west corner of the field joins the table, and deleting it there removes it.
    const field = (await adviserPage.locator('.leaflet-overlay-pane svg path').first().boundingBox())!;
    await adviserPage.locator('[title="Draw a rectangle"]').click();
    await adviserPage.mouse.click(field.x + field.width * 0.08, field.y + field.height * 0.1);
    await adviserPage.mouse.click(field.x + field.width * 0.3, field.y + field.height * 0.3);
    await adviserPage.getByRole('cell', { name: /Drawn by hand/ }).waitFor();
    expect(await zoneRows.count()).toBe(proposed + 1);
    await shot(adviserPage, '1b-zone-drawn');
    await adviserPage.getByRole('button', { name: `Delete Zone ${proposed + 1}` }).click();
    await adviserPage.getByRole('cell', { name: /Drawn by hand/ }).waitFor({ state: 'detached' });
    expect(await zoneRows.count()).toBe(proposed);

    await adviserPage.getByRole('button', { name: 'Accept zones' }).click();
    await adviserPage.getByText(/Stored as version 1/).waitFor();
    await adviserPage.getByRole('list', { name: 'Zone versions' }).getByRole('link', { name: 'GeoJSON' }).waitFor();

    // Compose, preview and send.
    await adviserPage.getByRole('link', { name: 'Write the notice' }).first().click();
    await adviserPage
      .getByLabel('Recommendation')
      .fill('Spot-treat zones 1 and 2 only, following the product label; leave the rest of the field untreated. Re-scout the whole field in seven days.');
    await adviserPage.getByLabel('Re-scout on').fill('2026-07-12');
    await adviserPage.getByRole('button', { name: 'Save and preview' }).click();
    await adviserPage.getByTestId('preview-subject').waitFor();
    const preview = adviserPage.frameLocator('iframe[title^="Preview"]');
    await preview.getByText(NOTICE_CAUTIONS[0]).waitFor();
    await shot(adviserPage, '2-notice-preview');
    await adviserPage.getByRole('button', { name: 'Send the notice' }).click();
    // The confirmation lists the farm's one contact, ticked.
    const confirm = adviserPage.getByRole('dialog', { name: 'Send this notice?' });
    expect(await confirm.getByRole('checkbox', { name: new RegExp(contact.email) }).isChecked()).toBe(true);
    await confirm.getByRole('button', { name: 'Send to 1 recipient' }).click();
    const state = adviserPage.locator(`tr[data-recipient="${contact.email}"] [data-testid="recipient-state"]`);
    await state.getByText(/^(queued|sending|sent)$/).waitFor();

    // The admin's mailbox lists the message to the grower contact.
    const [message] = await waitForMessage(contact.email, 1, 20_000);
    const adminPage = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    await signIn(adminPage, org.users.admin.email);
    await adminPage.goto(`${server.url}/admin/mailbox`);
    const listed = adminPage
      .getByRole('list', { name: 'Messages' })
      .getByRole('link')
      .filter({ hasText: `To ${contact.email}` });
    await listed.waitFor();
    expect(await listed.textContent()).toContain(message.subject ?? '');
    await listed.click();
    await adminPage.getByRole('heading', { name: message.subject ?? '' }).waitFor();
    await shot(adminPage, '3-mailbox');

    // The grower opens the link from the message, signed out.
    const link = /https?:\/\/\S+\/n\/[A-Za-z0-9._-]+/.exec(message.text ?? '')?.[0];
    expect(link, 'notice link in the text part').toBeTruthy();
    const growerContext = await browser.newContext({ viewport: { width: 900, height: 1000 } });
    const growerPage = await growerContext.newPage();
    // The link carries the configured public address; the test server listens on a port of its own.
    await growerPage.goto(`${server.url}${new URL(link!).pathname}`);
    await growerPage.getByRole('heading', { level: 1, name: /on Long meadow/ }).waitFor();
    for (const caution of NOTICE_CAUTIONS) await growerPage.getByText(caution).waitFor();
    await growerPage.getByText(/Spot-treat zones 1 and 2 only/).waitFor();
    // The page reports its own opening once it has loaded (the GET records nothing): the adviser sees "opened".
    await adviserPage.reload();
    await state.getByText('opened', { exact: true }).waitFor();

    // The zone table's hectares match turf's area of the GeoJSON attachment (turf 7 `area`, spherical; the
    // server measures on the ellipsoid, so the two agree to well under 1 %).
    const attachment = message.attachments.find((a) => a.filename?.endsWith('.geojson'));
    expect(attachment, 'GeoJSON attachment').toBeTruthy();
    const zones = JSON.parse(attachment!.content.toString('utf8')) as FeatureCollection<MultiPolygon>;
    const tableRows = growerPage.getByRole('table', { name: 'Treatment zones' }).locator('tbody tr');
    expect(await tableRows.count()).toBe(zones.features.length);
    for (const [i, zone] of zones.features.entries()) {
      const shownHa = number(await tableRows.nth(i).locator('td').nth(0).textContent());
      expect(Math.abs(shownHa - turfArea(zone) / M2_PER_HA)).toBeLessThanOrEqual(Math.max(0.01, (turfArea(zone) / M2_PER_HA) * 0.01));
    }
    // The page leads with the decision: the zones, the area and the share left untreated, before the map and the statistics.
    const decision = growerPage.getByTestId('decision');
    for (const zone of zones.features) await decision.getByText(new RegExp((zone.properties as { label: string }).label)).waitFor();
    await decision.getByText(/% of the field is left untreated/).waitFor();
    const headings = await growerPage.getByRole('heading', { level: 2 }).allTextContents();
    expect(headings.indexOf('The decision')).toBe(0);
    expect(headings.indexOf('How we know')).toBeGreaterThan(headings.indexOf('Where the zones are'));
    // The statistics sit behind a disclosure: hidden until the grower opens it.
    const figure = growerPage.getByText(/Clark–Evans R =/);
    expect(await figure.isVisible()).toBe(false);
    await growerPage.getByText('The figures behind the check').click();
    await figure.waitFor();
    await growerPage
      .getByRole('list', { name: 'Counts in each zone' })
      .getByText(/the action threshold of/)
      .first()
      .waitFor();

    // Every zone is labelled on the live map, and no label box covers a sighting dot.
    const labelBoxes = await growerPage.locator('.leaflet-marker-icon.zone-label').evaluateAll((els) => els.map((el) => el.getBoundingClientRect().toJSON()));
    expect(labelBoxes).toHaveLength(zones.features.length);
    const dotBoxes = await growerPage
      .locator('.leaflet-overlay-pane path.leaflet-interactive, .leaflet-overlay-pane path')
      .evaluateAll((els) => els.filter((el) => el.getAttribute('fill') === '#352d25').map((el) => el.getBoundingClientRect().toJSON()));
    expect(dotBoxes.length).toBeGreaterThan(0);
    for (const label of labelBoxes)
      for (const dot of dotBoxes) {
        const overlaps = label.left < dot.right && dot.left < label.right && label.top < dot.bottom && dot.top < label.bottom;
        expect(overlaps, `label ${JSON.stringify(label)} over dot ${JSON.stringify(dot)}`).toBe(false);
      }
    await shot(growerPage, '4-notice-page');
    await growerPage.emulateMedia({ media: 'print' });
    expect(await growerPage.getByRole('button', { name: 'Acknowledge' }).isVisible()).toBe(false);
    // On paper the app's header is left out and the map image (with its own labels) stands in for the live map.
    expect(await growerPage.locator('header').filter({ hasText: 'Patchwise' }).isVisible()).toBe(false);
    expect(await growerPage.getByRole('img', { name: /Map of Long meadow/ }).isVisible()).toBe(true);
    await growerPage.getByText(NOTICE_CAUTIONS[0]).waitFor();
    await shot(growerPage, '5-notice-page-print');
    await growerPage.emulateMedia({ media: 'screen' });

    // On a phone (390 px) the zone table scrolls inside its own frame; the page itself does not scroll sideways.
    await growerPage.setViewportSize({ width: 390, height: 844 });
    const table = growerPage.getByRole('region', { name: /Treatment zones/ });
    const frame = await table.evaluate((el) => ({ client: el.clientWidth, scroll: el.scrollWidth }));
    expect(frame.client).toBeLessThanOrEqual(390);
    expect(await growerPage.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    const cue = growerPage.locator('[data-scroll-cue]');
    if (frame.scroll > frame.client) {
      // Columns out of sight are announced in words, and the zone's name stays in view while the rest slides.
      await expect.poll(() => cue.textContent()).toMatch(/More columns to the right/);
      await table.focus();
      await growerPage.keyboard.press('ArrowRight');
      await growerPage.waitForFunction(() => (document.querySelector('[role="region"][aria-label^="Treatment zones"]')?.scrollLeft ?? 0) > 0);
      await table.evaluate((el) => el.scrollTo({ left: el.scrollWidth }));
      await expect.poll(() => cue.textContent()).toMatch(/Swipe back for the first columns/);
      const zoneName = table.getByRole('rowheader').first();
      const [nameBox, frameBox] = [await zoneName.boundingBox(), await table.boundingBox()];
      expect(nameBox!.x).toBeGreaterThanOrEqual(frameBox!.x - 1);
    } else {
      expect(await cue.count()).toBe(0);
    }
    await table.scrollIntoViewIfNeeded();
    await shot(growerPage, '5b-notice-phone');
    await growerPage.setViewportSize({ width: 900, height: 1000 });

    await growerPage.getByRole('button', { name: 'Acknowledge' }).click();
    await growerPage.getByText(/Acknowledged on/).waitFor();
    // A second acknowledgement (a reload and the page's own state) changes nothing.
    await growerPage.reload();
    await growerPage.getByText(/Acknowledged on/).waitFor();
    expect(await growerPage.getByRole('button', { name: 'Acknowledge' }).count()).toBe(0);
    await shot(growerPage, '6-acknowledged');

    // The grower asks a question from the same page; it waits there for the adviser's answer.
    const question = 'Does zone 2 take in the wet corner by the gate?';
    await growerPage.getByLabel('Ask a question or leave a comment').fill(question);
    await growerPage.getByRole('button', { name: /^Send to / }).click();
    await growerPage.getByRole('list', { name: 'Your questions' }).getByText(question).waitFor();

    // The adviser's status page now says acknowledged.
    await adviserPage.reload();
    await state.getByText('acknowledged', { exact: true }).waitFor();
    await shot(adviserPage, '7-notice-status');
    // …lists the grower's question, and the adviser answers it there; the grower's page shows the answer.
    const asked = adviserPage.getByRole('list', { name: 'Grower questions' });
    await asked.getByText(question).waitFor();
    await asked.getByLabel(/^Answer /).fill('Yes: the east half of zone 2 is the wet corner.');
    await asked.getByRole('button', { name: 'Send the answer' }).click();
    await asked.getByText(/^Answered by /).waitFor();
    await growerPage.reload();
    await growerPage.getByText('Yes: the east half of zone 2 is the wet corner.').waitFor();

    // The grower, signed in, sees the notice among their farm's notices with its state.
    const growerHome = await browser.newPage({ viewport: { width: 900, height: 900 } });
    await signIn(growerHome, org.users.grower.email);
    await growerHome
      .getByRole('list', { name: 'Zone notices' })
      .getByText(/Acknowledged/)
      .waitFor();
    await shot(growerHome, '8-grower-home');
    // …and opens it from there, no token needed: the same notice, already acknowledged through the link.
    await growerHome
      .getByRole('list', { name: 'Zone notices' })
      .getByRole('link', { name: /on Long meadow/ })
      .click();
    await growerHome.waitForURL(/\/grower\/notices\/[0-9a-f-]{36}$/);
    await growerHome.getByRole('heading', { level: 1, name: /on Long meadow/ }).waitFor();
    await growerHome.getByText(/Spot-treat zones 1 and 2 only/).waitFor();
    await growerHome.getByText(NOTICE_CAUTIONS[0]).waitFor();
    await growerHome.getByText(/Acknowledged on/).waitFor();
    expect(await growerHome.getByRole('table', { name: 'Treatment zones' }).locator('tbody tr').count()).toBe(zones.features.length);
    // Printing from inside the app leaves out its header and navigation.
    await growerHome.emulateMedia({ media: 'print' });
    expect(await growerHome.getByRole('button', { name: 'Sign out' }).isVisible()).toBe(false);
    expect(await growerHome.getByRole('heading', { level: 1, name: /on Long meadow/ }).isVisible()).toBe(true);
    await growerHome.emulateMedia({ media: 'screen' });
    await shot(growerHome, '9-grower-notice');
  }, 180_000);

  it('shows a calm explanation instead of a notice for a link that does not open one', async () => {
    const page = await browser.newPage();
    await page.goto(`${server.url}/n/00000000-0000-4000-8000-000000000000.${'x'.repeat(43)}`);
    await page.getByRole('heading', { name: 'This notice link does not open a notice' }).waitFor();
    expect(await page.getByRole('button', { name: 'Acknowledge' }).count()).toBe(0);
  });
});
