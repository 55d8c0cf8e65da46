// What an adviser reads on the review page: threshold intervals that are never negative and say when there are too
// few stops, "Show on map" bringing the map into view, and a photo opening in a viewer with what it shows.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../server/db.ts';
import { launchBrowser, startTestServer, type TestServer } from '../helpers/browser.ts';
import { addSightings, makeWalk } from '../helpers/sightings.ts';
import type { TestOrganisation } from '../helpers/org.ts';
import { seedDemo, type DemoIds } from '../../scripts/seed/seed-demo.ts';
import { DEMO_PASSWORD, demoFields, demoUsers } from '../../scripts/seed/demo-scenario.ts';

const PEST = 'Soybean aphid';
let server: TestServer;
let browser: Browser;
let demo: DemoIds;

beforeAll(async () => {
  [server, browser] = await Promise.all([startTestServer(), launchBrowser()]);
  demo = (await seedDemo()).ids;
  // A short walk of three stops on the sparse field: too few to compare with the threshold.
  const [lon0, lat0] = demoFields.find((f) => f.key === 'sparse')!.boundary.coordinates[0][0][0];
  const org = { id: demo.organisationId, users: { scout: { id: demo.users.scout } } } as unknown as TestOrganisation;
  const walkId = await makeWalk(org, demo.fields.sparse, '2026-08-02');
  await addSightings(
    org,
    { fieldId: demo.fields.sparse, walkId, pestId: demo.pests[PEST] },
    [0, 1, 2].map((i) => ({ lon: lon0 + 0.001 * (i + 1), lat: lat0 + 0.001, count: 0 })),
  );
});

afterAll(async () => {
  await browser?.close();
  await server?.close();
});

async function signInAsAdviser(page: Page) {
  const adviser = demoUsers.find((u) => u.role === 'adviser')!;
  await page.goto(`${server.url}/sign-in`);
  await page.getByLabel('E-mail address').fill(adviser.email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: 'Needs your attention' }).waitFor();
}

const thresholdPanel = (page: Page) => page.locator('section').filter({ has: page.getByRole('heading', { name: 'Against the action threshold' }) });

describe('the demo scenario', () => {
  it('gives every empty stop the time it was recorded on its walk day, as a phone sends it', async () => {
    const rows = await sequelize.query<{ stops: number; onWalkDay: number; distinctTimes: number }>(
      `SELECT count(*)::int AS stops,
              count(*) FILTER (WHERE (s.observed_at AT TIME ZONE 'America/Chicago')::date = w.walked_on)::int AS "onWalkDay",
              count(DISTINCT s.observed_at)::int AS "distinctTimes"
         FROM sightings s JOIN walks w ON w.id = s.walk_id
        WHERE s.organisation_id = :org AND s.photo_id IS NULL AND s.count = 0 AND w.walked_on < '2026-08-01'`,
      { replacements: { org: demo.organisationId }, type: QueryTypes.SELECT },
    );
    expect(rows[0].stops).toBeGreaterThan(0);
    expect(rows[0].onWalkDay).toBe(rows[0].stops);
    expect(rows[0].distinctTimes).toBe(rows[0].stops);
  });
});

describe('the numbers an adviser reads', () => {
  it('shows threshold intervals that never run below zero, names their source and says when there are too few stops', async () => {
    const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    await signInAsAdviser(page);
    for (const field of [demo.fields.patchy, demo.fields.sparse]) {
      await page.goto(`${server.url}/fields/${field}/review?pest=${demo.pests[PEST]}`);
      const panel = thresholdPanel(page);
      await panel.locator('tr[data-threshold-status]').first().waitFor();
      const text = (await panel.textContent()) ?? '';
      // No interval bound shown as a negative number (a hyphen or minus sign straight before a digit after a space or "(").
      expect(text).not.toMatch(/[\s(][−-]\d/);
      expect(text).toContain('Garwood');
    }
    const sparse = thresholdPanel(page);
    expect(await sparse.locator('tr[data-threshold-status="too-few"]').count()).toBeGreaterThanOrEqual(1);
    expect(await sparse.getByText(/Too few stops to call: 3 stops with a count; at least 5 are needed/).count()).toBe(1);
    await page.close();
  });

  it('brings the map into view from the table and opens a photo in a viewer with its pest, count, time and position', async () => {
    const page = await browser.newPage({ viewport: { width: 1400, height: 900 } });
    await signInAsAdviser(page);
    await page.goto(`${server.url}/fields/${demo.fields.patchy}/review?pest=${demo.pests[PEST]}`);
    await page.locator('.leaflet-overlay-pane canvas').first().waitFor();
    // Every row is a stop: the table names its found and empty stops apart, as the database holds them.
    const [stored] = await sequelize.query<{ found: number; empty: number }>(
      `SELECT count(*) FILTER (WHERE NOT (photo_id IS NULL AND count = 0))::int AS found, count(*) FILTER (WHERE photo_id IS NULL AND count = 0)::int AS empty
         FROM sightings WHERE field_id = :fieldId AND status = 'placed' AND deleted_at IS NULL`,
      { replacements: { fieldId: demo.fields.patchy }, type: QueryTypes.SELECT },
    );
    await page.getByText(`of ${stored.found + stored.empty} stops: ${stored.found} with pests, ${stored.empty} empty match`).waitFor();
    const buttons = page.getByRole('button', { name: 'Show on map' });
    await buttons.first().waitFor();
    const inView = () =>
      page.locator('[data-review-map-frame]').evaluate((el) => {
        const box = el.getBoundingClientRect();
        return box.top < window.innerHeight && box.bottom > 0;
      });
    let viewButton = page.getByRole('button', { name: 'View photo' });
    // The table may render again while its later parts arrive (the check, the date format); wait for quiet,
    // and retry a step whose row was replaced under it.
    await page.waitForLoadState('networkidle');
    for (let i = 0; i < 15 && (await viewButton.count()) === 0; i++) {
      const scrolledToRow = async () => {
        try {
          await buttons.nth(i).scrollIntoViewIfNeeded({ timeout: 2000 });
          return (await inView()) ? 'map still in view' : 'row in view, map out of view';
        } catch {
          return 'row replaced while scrolling';
        }
      };
      await expect.poll(scrolledToRow, { timeout: 10_000 }).toBe('row in view, map out of view');
      await buttons.nth(i).click();
      await expect.poll(inView, { timeout: 5000 }).toBe(true);
      viewButton = page.getByRole('button', { name: 'View photo' });
    }
    await viewButton.click();
    const dialog = page.getByRole('dialog', { name: `Photo of ${PEST}` });
    await dialog.waitFor();
    const image = dialog.getByRole('img', { name: `Photo of ${PEST}` });
    await expect.poll(() => image.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth > 0)).toBe(true);
    const caption = (await dialog.textContent()) ?? '';
    expect(caption).toContain(PEST);
    expect(caption).toMatch(/Count\s*\d+/);
    // The organisation's default locale, en-GB: CLDR long date "d MMMM y", then the time "HH:mm".
    expect(caption).toMatch(/Time\s*\d{1,2} [A-Z][a-z]+ 2026,? (at )?\d{2}:\d{2}/);
    expect(caption).toMatch(/Position\s*-?\d+\.\d{6}, -?\d+\.\d{6}/);
    await dialog.getByRole('button', { name: 'Close' }).click();
    await expect.poll(() => dialog.count()).toBe(0);
    await page.close();
  });
});
