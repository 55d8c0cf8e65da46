// An adviser opens the demo's patchy field, runs a pattern check, reads a Clustered verdict with its figures
// and the L-function chart, switches the area basis and sees the figures change, and exports the table as CSV.
import fs from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { QueryTypes } from 'sequelize';
import { launchBrowser, startTestServer, type TestServer } from '../helpers/browser.ts';
import { addSightings, makeWalk, type StopPoint } from '../helpers/sightings.ts';
import type { TestOrganisation } from '../helpers/org.ts';
import { sequelize } from '../../server/db.ts';
import { seedDemo, type DemoIds } from '../../scripts/seed/seed-demo.ts';
import { DEMO_PASSWORD, demoFields, demoUsers } from '../../scripts/seed/demo-scenario.ts';
import { createRandom } from '../../shared/analysis/random.ts';
import type { CheckStopsResponse, CheckView } from '../../shared/schemas/checks.ts';
import type { AnalysisResult } from '../../shared/analysis/analyse.ts';

const PEST = 'Soybean aphid';
/** Fewer than this and the demo seed has not placed its aphid sightings yet; the test adds three patches. */
const ENOUGH_SIGHTINGS = 30;

let server: TestServer;
let browser: Browser;
let demo: DemoIds;

async function placedSightings(fieldId: string, pestId: string) {
  const [row] = await sequelize.query<{ n: number }>(
    "SELECT count(*)::int AS n FROM sightings WHERE field_id = :fieldId AND pest_id = :pestId AND status = 'placed' AND deleted_at IS NULL AND (count IS NULL OR count > 0)",
    { replacements: { fieldId, pestId }, type: QueryTypes.SELECT },
  );
  return row.n;
}

/** Three tight patches of aphids inside the patchy field's south-west block (clear of its pond). */
async function addPatches(ids: DemoIds) {
  const [lon0, lat0] = demoFields.find((f) => f.key === 'patchy')!.boundary.coordinates[0][0][0];
  const perMetreLon = 1 / (111_320 * Math.cos((lat0 * Math.PI) / 180));
  const perMetreLat = 1 / 111_320;
  const random = createRandom('field-review-e2e');
  const points: StopPoint[] = [];
  for (const [cx, cy] of [
    [120, 110],
    [640, 390],
    [600, 100],
  ]) {
    for (let i = 0; i < 20; i++) {
      const angle = 2 * Math.PI * random();
      const radius = 25 * Math.sqrt(random());
      points.push({
        lon: lon0 + (cx + radius * Math.cos(angle)) * perMetreLon,
        lat: lat0 + (cy + radius * Math.sin(angle)) * perMetreLat,
        count: 5 + Math.round(30 * random()),
      });
    }
  }
  const org = { id: ids.organisationId, users: { scout: { id: ids.users.scout } } } as unknown as TestOrganisation;
  const walkId = await makeWalk(org, ids.fields.patchy, '2026-07-08');
  await addSightings(org, { fieldId: ids.fields.patchy, walkId, pestId: ids.pests[PEST] }, points);
}

beforeAll(async () => {
  [server, browser] = await Promise.all([startTestServer(), launchBrowser()]);
  demo = (await seedDemo()).ids;
  expect(demo.fields.patchy, 'the demo seed names its patchy field').toMatch(/^[0-9a-f-]{36}$/);
  expect(demo.pests[PEST], 'the demo pest library holds soybean aphid').toMatch(/^[0-9a-f-]{36}$/);
  if ((await placedSightings(demo.fields.patchy, demo.pests[PEST])) < ENOUGH_SIGHTINGS) await addPatches(demo);
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

const figure = (page: Page, name: string) => page.locator(`[data-figure="${name}"]`).first();

async function storedCheck(page: Page): Promise<AnalysisResult> {
  const checkId = new URL(page.url()).searchParams.get('check');
  expect(checkId).toBeTruthy();
  const response = await page.request.get(`${server.url}/api/checks/${checkId}`);
  expect(response.status()).toBe(200);
  const { check } = (await response.json()) as { check: CheckView };
  return check.result as unknown as AnalysisResult;
}

/** Splits CSV text into records by RFC 4180 §2 (quoted fields may hold commas, CRLF and doubled quotes). */
function parseCsv(text: string): string[][] {
  const records: string[][] = [];
  let record: string[] = [];
  let field = '';
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const c = text[i];
    if (quoted) {
      if (c === '"' && text[i + 1] === '"') {
        field += '"';
        i++;
      } else if (c === '"') quoted = false;
      else field += c;
    } else if (c === '"') quoted = true;
    else if (c === ',') {
      record.push(field);
      field = '';
    } else if (c === '\r' && text[i + 1] === '\n') {
      record.push(field);
      records.push(record);
      record = [];
      field = '';
      i++;
    } else field += c;
  }
  if (field !== '' || record.length) records.push([...record, field]);
  return records;
}

describe('field review in the browser', () => {
  it('shows a Clustered verdict with its figures and chart, changes with the area basis, and exports the filtered rows', async () => {
    const page = await browser.newPage({ viewport: { width: 1400, height: 1000 }, acceptDownloads: true });
    const gridRequests: string[] = [];
    page.on('request', (request) => {
      if (/\/api\/checks\/[^/]+\/density$/.test(new URL(request.url()).pathname)) gridRequests.push(request.url());
    });
    await signInAsAdviser(page);

    await page.goto(`${server.url}/fields/${demo.fields.patchy}/review?pest=${demo.pests[PEST]}`);
    await page.getByRole('heading', { name: /review/ }).waitFor();
    // Sightings are drawn on Leaflet's canvas renderer, not as one SVG element each.
    await page.locator('.leaflet-overlay-pane canvas').first().waitFor();

    // Fewer simulations keep the check inline (no background worker in this journey).
    await page.getByLabel('Simulations').fill('199');
    await page.getByRole('button', { name: 'Run check' }).click();
    await page.locator('[data-verdict]').waitFor({ timeout: 60_000 });
    expect(await page.locator('[data-verdict]').getAttribute('data-verdict')).toBe('clustered');
    await expect.poll(() => page.getByLabel('Spread: Clustered').count()).toBe(1);
    // Engine version and projection code stay behind a disclosure until asked for.
    const technical = page.locator('[data-technical-details]');
    expect(await technical.getByText(/Engine version/).isVisible()).toBe(false);
    await technical.locator('summary').click();
    expect(await technical.getByText(/Engine version .*projection EPSG:\d+/).isVisible()).toBe(true);
    // The design and the one primary test come first, in plain words; the rest of the field is drawn as not scouted.
    expect(await page.locator('[data-design]').getAttribute('data-design')).toBe('stops');
    expect(await page.locator('[data-primary-test]').textContent()).toMatch(/more bunched among the places the scout stopped.*relabellings/);
    await expect.poll(() => page.getByLabel('Not scouted').isChecked()).toBe(true);
    expect(await page.getByText(/Not scouted \([0-9.]+ ha/).count()).toBe(1);

    const boundaryResult = await storedCheck(page);
    const shownR = await figure(page, 'R').textContent();
    // The page formats the engine's stored figures and computes none of its own.
    expect(shownR).toBe(boundaryResult.nearestNeighbour!.R.toFixed(3));
    expect(await figure(page, 'z').textContent()).toBe(boundaryResult.nearestNeighbour!.z.toFixed(2));
    expect(await figure(page, 'p').textContent()).toMatch(/^(< 0\.001|0\.\d{3})$/);
    expect(Number(shownR)).toBeLessThan(1);
    // recharts draws the L-function chart as SVG, with the observed line and the envelope.
    const chart = page.locator('[data-chart="l-function"] svg.recharts-surface[role="application"]');
    await chart.waitFor();
    expect(await page.locator('[data-chart="l-function"] .recharts-line').count()).toBeGreaterThanOrEqual(2);

    // The density grid is not part of the check's answer: it is fetched once the density layer is switched on.
    expect(gridRequests).toHaveLength(0);
    await page.getByRole('checkbox', { name: 'Density surface' }).check();
    await page.locator('img.density-surface').waitFor({ timeout: 30_000 });
    expect(gridRequests).toHaveLength(1);

    await page.getByLabel('Area basis').selectOption('bbox');
    await page.getByRole('button', { name: 'Run check' }).click();
    await page.locator('[data-figure="area-basis"]', { hasText: 'Bounding rectangle' }).waitFor({ timeout: 60_000 });
    const bboxResult = await storedCheck(page);
    expect(bboxResult.area.basis).toBe('bbox');
    const bboxR = await figure(page, 'R').textContent();
    expect(bboxR).toBe(bboxResult.nearestNeighbour!.R.toFixed(3));
    expect(bboxR).not.toBe(shownR);

    const table = page.getByRole('table', { name: /Sightings in/ });
    await table.waitFor();
    const matching = Number(await page.locator('[data-filtered-count]').getAttribute('data-filtered-count'));
    expect(matching).toBeGreaterThan(0);
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: /^Export CSV/ }).click()]);
    const text = fs.readFileSync((await download.path())!, 'utf8');
    const records = parseCsv(text);
    expect(records[0]).toContain('sighting_id');
    const rows = records.slice(1);
    expect(rows).toHaveLength(matching);
    expect(rows.every((r) => r.length === records[0].length)).toBe(true);
    await page.close();
  });

  it("fetches each stop's Gi* figures only when their table is opened, hot stops first, and points at a stop on the map", async () => {
    const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    const stopRequests: string[] = [];
    page.on('request', (request) => {
      if (/\/api\/checks\/[^/]+\/stops$/.test(new URL(request.url()).pathname)) stopRequests.push(request.url());
    });
    await signInAsAdviser(page);
    // The field's latest check (the one the journey above ran) opens by itself.
    await page.goto(`${server.url}/fields/${demo.fields.patchy}/review?pest=${demo.pests[PEST]}`);
    await page.locator('[data-verdict]').waitFor({ timeout: 60_000 });
    await expect.poll(() => new URL(page.url()).searchParams.get('check')).toBeTruthy();
    const checkId = new URL(page.url()).searchParams.get('check')!;

    const disclosure = page.locator('details', { has: page.getByText('Each stop’s figures (Gi*)') });
    await disclosure.waitFor();
    expect(stopRequests).toHaveLength(0);
    await disclosure.locator('summary').click();
    const table = page.getByRole('table', { name: "Each stop's Gi* figures" });
    await table.waitFor();
    expect(stopRequests).toHaveLength(1);

    const stored = (await (await page.request.get(`${server.url}/api/checks/${checkId}/stops`)).json()) as CheckStopsResponse;
    const hot = stored.giStar.filter((s) => s.hot);
    const cold = stored.giStar.filter((s) => s.cold);
    expect(await page.locator('[data-stop-tally]').textContent()).toContain(
      `${stored.giStar.length} stops with a count: ${hot.length} hot, ${cold.length} cold`,
    );
    // Three tight, heavy patches: some stops stand out as hot (Getis & Ord 1992: a high z where high counts sit together).
    expect(hot.length).toBeGreaterThan(0);
    const readings = await table.locator('[data-stop-reading]').evaluateAll((cells) => cells.map((c) => c.getAttribute('data-stop-reading')));
    expect(readings).toHaveLength(Math.min(25, stored.giStar.length));
    expect(readings.slice(0, Math.min(25, hot.length)).every((r) => r === 'hot')).toBe(true);
    // The first row is the hot stop with the largest z, written as the engine stored it.
    const largest = Math.max(...hot.map((s) => s.z));
    expect(await table.locator('tbody tr').first().locator('td').nth(2).textContent()).toBe(largest.toFixed(2));

    if (stored.giStar.length > 25) {
      await page.getByRole('button', { name: /^Show \d+ more of/ }).click();
      await expect.poll(() => table.locator('[data-stop-reading]').count()).toBe(Math.min(50, stored.giStar.length));
    }

    const inView = () =>
      page.locator('[data-review-map-frame]').evaluate((el) => {
        const box = el.getBoundingClientRect();
        return box.top < window.innerHeight && box.bottom > 0;
      });
    const showOnMap = table.getByRole('button', { name: 'Show on map' }).first();
    await showOnMap.scrollIntoViewIfNeeded();
    expect(await inView()).toBe(false);
    await showOnMap.click();
    await expect.poll(inView, { timeout: 5000 }).toBe(true);
    await page.close();
  });
});
