// The zone editor keeps the adviser's hand edits: while the zones are the engine's own, a changed margin
// re-proposes them at once; after a hand edit, a new proposal waits until the adviser takes it or keeps their edits.
// Leaving with edits not accepted asks first; after Accept the table shows the zones as stored, each held against
// the threshold; a stored version opens by its link; the map's tools are named in plain words.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { booleanPointInPolygon } from '@turf/turf';
import { mean } from 'simple-statistics';
import { launchBrowser, startTestServer, type TestServer } from '../helpers/browser.ts';
import { signedIn } from '../helpers/http.ts';
import { makeOrganisation, TEST_PASSWORD, type TestOrganisation } from '../helpers/org.ts';
import { makeCheckedField, storedZones, type ScoutedCheck } from '../helpers/zones.ts';

let server: TestServer;
let browser: Browser;
let org: TestOrganisation;
let scouted: ScoutedCheck;

beforeAll(async () => {
  [server, browser, org] = await Promise.all([startTestServer({ workers: true }), launchBrowser(), makeOrganisation('Zone editor')]);
  scouted = await makeCheckedField(org, await signedIn(org.users.adviser.email), { fieldName: 'Cedar strip' });
});

afterAll(async () => {
  await browser?.close();
  await server?.close();
});

async function openEditor(page: Page, search = `checkId=${scouted.checkId}`) {
  await page.goto(`${server.url}/sign-in`);
  await page.getByLabel('E-mail address').fill(org.users.adviser.email);
  await page.getByLabel('Password').fill(TEST_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('button', { name: 'Sign out' }).waitFor();
  await showEditor(page, search);
}

/** Whether the page asks the browser to confirm before the tab closes (a cancelled beforeunload event). */
const asksBeforeUnload = (page: Page) =>
  page.evaluate(() => {
    const event = new Event('beforeunload', { cancelable: true });
    window.dispatchEvent(event);
    return event.defaultPrevented;
  });

async function showEditor(page: Page, search: string) {
  await page.goto(`${server.url}/fields/${scouted.field.id}/zones?${search}`);
  await page.getByRole('heading', { name: /Treatment zones · Cedar strip/ }).waitFor();
  await page.getByRole('table', { name: 'Treatment zones being edited' }).locator('tbody tr').first().waitFor();
}

describe('zone editor and new proposals', () => {
  it('re-proposes untouched zones at once, and after a hand edit asks before replacing them', async () => {
    const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    try {
      await openEditor(page);
      const rows = page.getByRole('table', { name: 'Treatment zones being edited' }).locator('tbody tr');
      const treated = page.getByTestId('total-treated');
      const choice = page.getByRole('alert').filter({ hasText: 'A new proposal is ready' });
      const settled = () => page.getByText('Updating the proposal…').waitFor({ state: 'hidden' });

      // No hand edits yet: a wider margin replaces the zones straight away.
      const treatedBefore = await treated.textContent();
      await page.getByLabel('Margin (m)').fill('12');
      await expect.poll(() => treated.textContent(), { timeout: 30_000 }).not.toBe(treatedBefore);
      await settled();
      expect(await choice.count()).toBe(0);

      // A hand edit: one zone deleted from the table.
      const proposed = await rows.count();
      await rows
        .first()
        .getByRole('button', { name: /^Delete / })
        .click();
      await expect.poll(() => rows.count()).toBe(proposed - 1);

      // A new margin now waits; keeping the edits leaves the table as it was.
      await page.getByLabel('Margin (m)').fill('18');
      await choice.waitFor({ timeout: 30_000 });
      expect(await rows.count()).toBe(proposed - 1);
      await choice.getByRole('button', { name: 'Keep my edits' }).click();
      await choice.waitFor({ state: 'hidden' });
      expect(await rows.count()).toBe(proposed - 1);

      // Another change, and this time the new proposal is taken: its zones replace the edited ones.
      await page.getByLabel('Margin (m)').fill('6');
      await choice.waitFor({ timeout: 30_000 });
      const offered = Number((await choice.textContent())?.match(/\((\d+) zones?\)/)?.[1]);
      expect(offered).toBeGreaterThan(0);
      await choice.getByRole('button', { name: 'Use the new proposal' }).click();
      await choice.waitFor({ state: 'hidden' });
      await expect.poll(() => rows.count()).toBe(offered);
    } finally {
      await page.close();
    }
  });
});

describe('zone editor, leaving and accepting', () => {
  it('asks before leaving with edits not accepted, in the app and when the tab closes', async () => {
    const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    const rows = page.getByRole('table', { name: 'Treatment zones being edited' }).locator('tbody tr');
    await openEditor(page);
    const editorUrl = page.url();
    const proposed = await rows.count();
    await rows
      .first()
      .getByRole('button', { name: /^Delete / })
      .click();
    await expect.poll(() => rows.count()).toBe(proposed - 1);

    // A link inside the app: the question comes first; staying keeps the edits.
    const question = page.getByRole('dialog', { name: 'Leave without accepting your zones?' });
    await page.getByRole('link', { name: /· Cedar strip/ }).click();
    await question.waitFor();
    await question.getByRole('button', { name: 'Keep it' }).click();
    await question.waitFor({ state: 'hidden' });
    expect(page.url()).toBe(editorUrl);
    expect(await rows.count()).toBe(proposed - 1);

    // Closing or reloading the tab: the page asks the browser for its own leave-page question. (Headless Chromium
    // does not draw that question, so the test reads whether the page asked for it.)
    expect(await asksBeforeUnload(page)).toBe(true);
    await page.close();
  });

  it('after Accept shows the zones as stored, each with its stops’ mean count against the threshold, and leaves without asking', async () => {
    const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    try {
      const rows = page.getByRole('table', { name: 'Treatment zones being edited' }).locator('tbody tr');
      await openEditor(page);
      await rows
        .first()
        .getByRole('button', { name: /^Delete / })
        .click();
      await page.getByRole('button', { name: 'Accept zones' }).click();
      await page.getByText(/Stored as version \d+/).waitFor();
      const zoneSetId = new URL((await page.getByRole('link', { name: 'Write the notice' }).first().getAttribute('href'))!, server.url).searchParams.get(
        'zoneSetId',
      )!;
      const stored = await storedZones(zoneSetId);
      await expect.poll(() => page.getByRole('cell', { name: 'As stored' }).count()).toBe(stored.length);
      expect(await rows.count()).toBe(stored.length);

      // Each stored zone's mean count over the invented stops inside it (empty stops as 0), by turf and simple-statistics.
      for (const [i, zone] of stored.entries()) {
        const inside = scouted.points.filter((p) => booleanPointInPolygon([p.lon, p.lat], JSON.parse(zone.geometry))).map((p) => p.count as number);
        const row = rows.nth(i);
        expect(await row.getByRole('cell').first().textContent()).toBe(zone.label);
        const cell = row.locator('[data-standing]');
        const expected = mean(inside);
        expect(await cell.getAttribute('data-standing')).toBe(expected >= 5 ? 'at-or-above' : 'below');
        expect(await cell.textContent()).toContain(`${expected.toFixed(2)} — ${expected >= 5 ? 'at or above' : 'below'} 5`);
        expect(await cell.textContent()).toContain(`${inside.length} stop`);
      }

      // Accepted: leaving asks nothing.
      expect(await asksBeforeUnload(page)).toBe(false);
      await page.getByRole('link', { name: /· Cedar strip/ }).click();
      await page.waitForURL(`${server.url}/fields/${scouted.field.id}`);
      expect(await page.getByRole('dialog', { name: 'Leave without accepting your zones?' }).count()).toBe(0);

      // The stored version opens by its link, as stored.
      await showEditor(page, `checkId=${scouted.checkId}&zoneSet=${zoneSetId}`);
      await expect.poll(() => page.getByRole('cell', { name: 'As stored' }).count()).toBe(stored.length);
    } finally {
      await page.close();
    }
  });

  it('names the map’s tools in plain words', async () => {
    const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    try {
      await openEditor(page);
      for (const name of ['Draw a shape corner by corner', 'Draw a rectangle', 'Move corners', 'Move a whole shape', 'Remove a shape'])
        expect(await page.getByRole('button', { name, exact: true }).count(), name).toBe(1);
      await page.getByRole('button', { name: 'Draw a shape corner by corner', exact: true }).click();
      await page.getByRole('button', { name: 'Stop drawing' }).waitFor();
    } finally {
      await page.close();
    }
  });
});
