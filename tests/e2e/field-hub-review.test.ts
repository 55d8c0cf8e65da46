// The adviser's way through one field in the browser: the field page as its hub (walks, latest check, zones,
// notices, what needs attention), and the review opening on the latest check, listing the past ones and
// comparing two side by side with the figures each check's own answer holds.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { mean } from 'simple-statistics';
import { launchBrowser, startTestServer, type TestServer } from '../helpers/browser.ts';
import { signedIn, type Client } from '../helpers/http.ts';
import { makeOrganisation, TEST_PASSWORD, type TestOrganisation } from '../helpers/org.ts';
import { addSightings, makeField, makeWalk, TEST_FIELD_CORNER, TEST_FIELD_SIZE } from '../helpers/sightings.ts';
import { acceptProposedZones, makeCheckedField, type ScoutedCheck } from '../helpers/zones.ts';
import type { CheckView } from '../../shared/schemas/checks.ts';
import type { AnalysisResult } from '../../shared/analysis/analyse.ts';

let server: TestServer;
let browser: Browser;
let org: TestOrganisation;
let adviser: Client;
let scouted: ScoutedCheck;
/** The later check: the first walk only (window to 2026-07-01), run after the check of both walks. */
let firstWalkCheckId: string;
let zoneSetId: string;
let noticeId: string;

const counts = (from: number, to?: number) => scouted.points.slice(from, to).map((p) => p.count as number);
const half = () => Math.floor(scouted.points.length / 2);

beforeAll(async () => {
  [server, browser, org] = await Promise.all([startTestServer(), launchBrowser(), makeOrganisation('Field hub')]);
  adviser = await signedIn(org.users.adviser.email);
  scouted = await makeCheckedField(org, adviser, { fieldName: 'Heron flats' });
  const later = await adviser.post('/api/checks', {
    fieldId: scouted.field.id,
    pestId: scouted.pest.id,
    to: '2026-07-01',
    options: { simulations: 99, seed: 6 },
  });
  expect(later.status).toBe(201);
  firstWalkCheckId = later.body.check.id;
  zoneSetId = (await acceptProposedZones(adviser, scouted)).id;
  const notice = await adviser.post('/api/notices', {
    fieldId: scouted.field.id,
    zoneSetId,
    recommendation: 'Spot-treat the two zones; leave the rest of the field untreated.',
    rescoutOn: '2026-07-14',
  });
  expect(notice.status).toBe(201);
  noticeId = notice.body.notice.id;
});

afterAll(async () => {
  await browser?.close();
  await server?.close();
});

async function adviserPage(): Promise<Page> {
  const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
  await page.goto(`${server.url}/sign-in`);
  await page.getByLabel('E-mail address').fill(org.users.adviser.email);
  await page.getByLabel('Password').fill(TEST_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: 'Needs your attention' }).waitFor();
  return page;
}

async function storedResult(checkId: string): Promise<AnalysisResult> {
  const { check } = (await adviser.get(`/api/checks/${checkId}`).expect(200)).body as { check: CheckView };
  return check.result as AnalysisResult;
}

const cell = (page: Page, row: string, side: 'earlier' | 'later' | 'change') => page.locator(`[data-compare-row="${row}"] [data-side="${side}"]`);

describe('the field review in the browser', () => {
  it('opens on the field’s latest check when the address names none, and lists the past checks newest first', async () => {
    const page = await adviserPage();
    try {
      await page.goto(`${server.url}/fields/${scouted.field.id}/review`);
      await page.waitForURL((url) => url.searchParams.get('check') === firstWalkCheckId);
      const latest = await storedResult(firstWalkCheckId);
      await page.locator('[data-verdict]').waitFor({ timeout: 30_000 });
      expect(await page.locator('[data-verdict]').getAttribute('data-verdict')).toBe(latest.spread.verdict);
      expect(await page.locator('[data-figure="R"]').first().textContent()).toBe(latest.nearestNeighbour!.R.toFixed(3));

      const rows = page.locator('[data-check-row]');
      await rows.first().waitFor();
      expect(await rows.evaluateAll((els) => els.map((e) => e.getAttribute('data-check-row')))).toEqual([firstWalkCheckId, scouted.checkId]);
      // Each row names its window and the days of the walks it took in (the walks the test made, 2026-07-01 and 2026-07-03),
      // written in the organisation's default locale, en-GB (CLDR long date pattern "d MMMM y").
      expect(await rows.nth(0).textContent()).toContain('season start – 1 July 2026');
      expect(await rows.nth(0).textContent()).toContain('1 July 2026');
      expect(await rows.nth(0).textContent()).not.toContain('3 July 2026');
      expect(await rows.nth(1).textContent()).toContain('1 July 2026, 3 July 2026');
      expect(await rows.nth(1).textContent()).toContain('99 simulations');

      // Opening the older one puts its id in the address, so the link can be shared.
      await rows.nth(1).getByRole('link').click();
      await page.waitForURL((url) => url.searchParams.get('check') === scouted.checkId);
      const older = await storedResult(scouted.checkId);
      await expect.poll(() => page.locator('[data-figure="R"]').first().textContent()).toBe(older.nearestNeighbour!.R.toFixed(3));
      expect(await page.locator('[data-check-row][aria-current="true"]').getAttribute('data-check-row')).toBe(scouted.checkId);
    } finally {
      await page.close();
    }
  });

  it('compares two checks side by side with each one’s stored figures, the change between them and both maps', async () => {
    const page = await adviserPage();
    try {
      await page.goto(`${server.url}/fields/${scouted.field.id}/review?check=${scouted.checkId}`);
      const rows = page.locator('[data-check-row]');
      await rows.first().waitFor();
      await rows.nth(0).getByRole('checkbox').check();
      await rows.nth(1).getByRole('checkbox').check();
      await page.getByRole('button', { name: 'Compare the two chosen' }).click();
      await page.waitForURL((url) => url.searchParams.get('check') === firstWalkCheckId && url.searchParams.get('compare') === scouted.checkId);
      await page.locator('[data-comparison]').waitFor();

      // Earlier: both walks; later: the first walk only. Figures as GET /api/checks/:id answers them.
      const earlier = await storedResult(scouted.checkId);
      const later = await storedResult(firstWalkCheckId);
      expect(await cell(page, 'R', 'earlier').textContent()).toBe(earlier.nearestNeighbour!.R.toFixed(3));
      expect(await cell(page, 'R', 'later').textContent()).toBe(later.nearestNeighbour!.R.toFixed(3));
      expect(await cell(page, 'moran-I', 'earlier').textContent()).toBe(earlier.counts!.moran.I.toFixed(3));
      expect(await cell(page, 'moran-I', 'later').textContent()).toBe(later.counts!.moran.I.toFixed(3));
      expect(Number(await cell(page, 'stops', 'earlier').textContent())).toBe(earlier.stops.count);
      expect(Number(await cell(page, 'stops', 'later').textContent())).toBe(later.stops.count);
      expect(Number(await cell(page, 'found', 'later').textContent())).toBe(later.n);
      const zonesHa = (r: AnalysisResult) => r.zones.features.reduce((sum, z) => sum + z.properties.areaM2, 0) / 10_000;
      expect(await cell(page, 'zones-ha', 'earlier').textContent()).toBe(zonesHa(earlier).toFixed(2));
      expect(await cell(page, 'zones-ha', 'later').textContent()).toBe(zonesHa(later).toFixed(2));

      // Sightings taken in, and mean count per stop (empty stops as 0) recomputed from the counts the test inserted (simple-statistics).
      expect(Number(await cell(page, 'sightings', 'earlier').textContent())).toBe(scouted.points.length);
      expect(Number(await cell(page, 'sightings', 'later').textContent())).toBe(half());
      const earlierMean = mean(counts(0));
      const laterMean = mean(counts(0, half()));
      expect(await cell(page, 'mean', 'earlier').textContent()).toBe(earlierMean.toFixed(2));
      expect(await cell(page, 'mean', 'later').textContent()).toBe(laterMean.toFixed(2));

      // The change is the later figure less the earlier one, marked where it differs.
      const sightingsRow = page.locator('[data-compare-row="sightings"]');
      expect(await sightingsRow.getAttribute('data-changed')).toBe('true');
      expect(await cell(page, 'sightings', 'change').textContent()).toContain(`−${scouted.points.length - half()}`);
      const stopChange = later.stops.count - earlier.stops.count;
      expect(await page.locator('[data-compare-row="stops"]').getAttribute('data-changed')).toBe(stopChange === 0 ? 'false' : 'true');
      const rChange = Number((later.nearestNeighbour!.R - earlier.nearestNeighbour!.R).toFixed(3));
      expect(await page.locator('[data-compare-row="R"]').getAttribute('data-changed')).toBe(rChange === 0 ? 'false' : 'true');
      expect(await page.locator('[data-compare-row="threshold"]').getAttribute('data-changed')).toBe('false');

      // Both checks' maps, each with the sightings it took in.
      await expect.poll(() => page.locator('[data-compare-map] .leaflet-container').count(), { timeout: 20_000 }).toBe(2);
      expect(await page.locator(`[data-compare-map="${scouted.checkId}"]`).textContent()).toContain(`${earlier.zones.features.length} proposed zone`);
    } finally {
      await page.close();
    }
  });
});

describe('the field page in the browser', () => {
  it('shows the walks with their counts, the latest check, the current zones, the notices and what needs attention, each link opening its page', async () => {
    // A sighting added after the checks: the field has sightings no check has seen yet.
    const walk = (await adviser.get(`/api/walks?fieldId=${scouted.field.id}`).expect(200)).body.walks.find(
      (w: { walkedOn: string }) => w.walkedOn === '2026-07-03',
    );
    await addSightings(org, { fieldId: scouted.field.id, walkId: walk.id, pestId: scouted.pest.id }, [
      { lon: TEST_FIELD_CORNER.lon + TEST_FIELD_SIZE.lon * 0.5, lat: TEST_FIELD_CORNER.lat + TEST_FIELD_SIZE.lat * 0.5, count: 2 },
    ]);
    const page = await adviserPage();
    try {
      await page.goto(`${server.url}/fields/${scouted.field.id}`);
      await page.getByRole('heading', { name: 'Heron flats' }).waitFor();

      // Walks, newest first, with the found sightings and empty stops the test inserted on each.
      const walks = page.getByRole('table', { name: 'Recent walks' }).locator('tbody tr');
      await walks.first().waitFor();
      const found = (list: number[]) => list.filter((c) => c > 0).length;
      const empty = (list: number[]) => list.filter((c) => c === 0).length;
      const second = [...counts(half()), 2];
      expect(await walks.count()).toBe(2);
      expect(await walks.nth(0).locator('td').first().textContent()).toBe('3 July 2026'); // en-GB, CLDR "d MMMM y"
      expect(Number(await walks.nth(0).locator('[data-walk-sightings]').textContent())).toBe(found(second));
      expect(Number(await walks.nth(0).locator('[data-walk-stops]').textContent())).toBe(empty(second));
      expect(Number(await walks.nth(1).locator('[data-walk-sightings]').textContent())).toBe(found(counts(0, half())));
      expect(Number(await walks.nth(1).locator('[data-walk-stops]').textContent())).toBe(empty(counts(0, half())));

      // The latest check with its verdict as the check's answer holds it.
      const latest = await storedResult(firstWalkCheckId);
      const latestPanel = page.locator(`[data-latest-check="${firstWalkCheckId}"]`);
      await latestPanel.waitFor();
      expect(await latestPanel.locator('[data-latest-verdict]').getAttribute('data-latest-verdict')).toBe(latest.spread.verdict);

      // Current zones and the notice, each with a link that opens its page.
      const zoneLink = page.locator(`[data-zone-set="${zoneSetId}"]`).getByRole('link');
      await zoneLink.waitFor();
      const notice = page.locator(`[data-notice="${noticeId}"]`);
      await notice.waitFor();
      expect(await notice.getAttribute('data-notice-state')).toBe('draft');
      expect(await notice.textContent()).toContain('draft');

      // What needs attention on this field: the stop no check has seen yet, a sighting, named as a stop with its pest.
      const attention = page.getByRole('list', { name: 'Needs attention on this field' });
      await attention.waitFor();
      const unchecked = attention.getByRole('link', {
        name: /^1 stop for .* in Heron flats added or changed since the last pattern check: 1 with .*, 0 empty\.$/,
      });
      expect(await unchecked.count()).toBe(1);

      await zoneLink.click();
      await page.waitForURL((url) => url.pathname === `/fields/${scouted.field.id}/zones` && url.searchParams.get('zoneSet') === zoneSetId);
      await page.goBack();
      await notice.getByRole('link').click();
      await page.waitForURL((url) => url.pathname === `/notices/${noticeId}`);
      await page.goBack();
      await latestPanel.getByRole('link').click();
      await page.waitForURL((url) => url.pathname === `/fields/${scouted.field.id}/review` && url.searchParams.get('check') === firstWalkCheckId);
      await page.locator('[data-verdict]').waitFor({ timeout: 30_000 });
      await page.goBack();
      await unchecked.click();
      await page.waitForURL((url) => url.pathname === `/fields/${scouted.field.id}/review` && url.searchParams.get('pest') === scouted.pest.id);
    } finally {
      await page.close();
    }
  });

  it('shows the first page of walks and loads the next ones on “Show more walks”', async () => {
    const field = await makeField(org, undefined, 'Long meadow');
    const days = ['2026-06-01', '2026-06-04', '2026-06-08', '2026-06-11', '2026-06-15', '2026-06-18', '2026-06-22', '2026-06-25'];
    for (const day of days) await makeWalk(org, field.id, day);
    const page = await adviserPage();
    try {
      await page.goto(`${server.url}/fields/${field.id}`);
      const walks = page.getByRole('table', { name: 'Recent walks' }).locator('tbody tr');
      await walks.first().waitFor();
      // en-GB, CLDR "d MMMM y"; newest first.
      const shown = () => walks.evaluateAll((rows) => rows.map((r) => r.querySelector('td')?.textContent));
      expect(await shown()).toEqual(['25 June 2026', '22 June 2026', '18 June 2026', '15 June 2026', '11 June 2026', '8 June 2026']);
      await page.getByRole('button', { name: 'Show more walks' }).click();
      await expect.poll(() => walks.count()).toBe(days.length);
      expect((await shown()).slice(6)).toEqual(['4 June 2026', '1 June 2026']);
      expect(await page.getByRole('button', { name: 'Show more walks' }).count()).toBe(0);
    } finally {
      await page.close();
    }
  });

  it('names the finished walk in the review’s walk filter with its time, and an older open walk by its day and scout alone', async () => {
    const walks = (await adviser.get(`/api/walks?fieldId=${scouted.field.id}`).expect(200)).body.walks as Array<{
      id: string;
      walkedOn: string;
      scoutName: string;
    }>;
    const later = walks.find((w) => w.walkedOn === '2026-07-03')!;
    const earlier = walks.find((w) => w.walkedOn === '2026-07-01')!;
    const { finishedAt } = (await adviser.post(`/api/walks/${later.id}/finish`, {}).expect(200)).body.walk as { finishedAt: string };
    // The organisation's default way of writing dates and times (en-GB, Europe/London): CLDR "d MMMM y" and the short time, ECMA-402.
    const time = new Intl.DateTimeFormat('en-GB', { timeStyle: 'short', timeZone: 'Europe/London' }).format(new Date(finishedAt));
    const page = await adviserPage();
    try {
      // A window of both walk days: without one the page opens the field's latest check, whose window may hold one walk.
      await page.goto(`${server.url}/fields/${scouted.field.id}/review?pest=${scouted.pest.id}&from=2026-07-01&to=2026-07-03`);
      const walkFilter = page.locator('select', { has: page.locator('option', { hasText: 'Every walk' }) });
      await expect
        .poll(() => walkFilter.locator('option').allTextContents(), { timeout: 15_000 })
        .toEqual(['Every walk', `3 July 2026 · ${later.scoutName} · Finished at ${time}`, `1 July 2026 · ${earlier.scoutName}`]);
    } finally {
      await page.close();
    }
  });
});
