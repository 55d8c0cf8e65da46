// A scout on a phone finishes a walk and sees its summary (stops, found, empty and the route walked), the field
// list marks the field whose walk today is finished, and every list of walks (the field hub's, the scout's) marks it.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { length, lineString } from '@turf/turf';
import { signedIn, type Client } from '../helpers/http.ts';
import { addUser, TEST_PASSWORD, type TestOrganisation } from '../helpers/org.ts';
import { organisationWithAssignedField } from '../helpers/assigned-field.ts';
import { createFarm, createField } from '../helpers/farm-records.ts';
import { makeWalk, rectangleBoundary, TEST_FIELD_CORNER } from '../helpers/sightings.ts';
import { makeJpeg, uploadPhotos } from '../helpers/photos.ts';
import { launchBrowser, startTestServer, type TestServer } from '../helpers/browser.ts';
import { scoutPhone, signInOnPhone, startTodaysWalk } from '../helpers/scout-phone.ts';

const settle = { timeout: 30_000, interval: 200 };
// Inside the 0.005° × 0.003° test rectangle, at least 60 m apart, in the order they were made.
const at = (fx: number, fy: number) => ({ lon: TEST_FIELD_CORNER.lon + 0.005 * fx, lat: TEST_FIELD_CORNER.lat + 0.003 * fy });
const route = [
  { kind: 'photo', time: '07:30', ...at(0.15, 0.2) },
  { kind: 'stop', time: '07:36', ...at(0.45, 0.25) },
  { kind: 'stop', time: '07:41', ...at(0.8, 0.3) },
  { kind: 'photo', time: '07:47', ...at(0.75, 0.75) },
  { kind: 'stop', time: '07:52', ...at(0.3, 0.8) },
] as const;

let server: TestServer;
let browser: Browser;
let org: TestOrganisation;
let pest: { id: string; name: string };
let fieldId: string;

beforeAll(async () => {
  server = await startTestServer();
  browser = await launchBrowser();
  ({ org, pest, fieldId } = await organisationWithAssignedField('Scout finish', 'Creek Bottom'));
});

afterAll(async () => {
  await browser?.close();
  await server?.close();
});

/** A walk recorded through the API as the phone would send it: photos with their EXIF time, stops with theirs. */
async function recordedWalk(scout: Client, walkedOn: string) {
  const walk = (await scout.post('/api/walks', { fieldId, walkedOn }).expect(201)).body.walk as { id: string };
  const photos = route.filter((r) => r.kind === 'photo');
  const files = await Promise.all(
    photos.map(async (p, i) => ({
      bytes: await makeJpeg({ gps: p, dateTimeOriginal: `${walkedOn.replaceAll('-', ':')} ${p.time}:00`, offsetTimeOriginal: '+00:00', markSeed: 140 + i }),
    })),
  );
  await uploadPhotos(scout, files, { pestId: pest.id, walkId: walk.id, count: 3 }).expect(200);
  for (const stop of route.filter((r) => r.kind === 'stop')) {
    await scout
      .post(`/api/walks/${walk.id}/stops`, { pestId: pest.id, lon: stop.lon, lat: stop.lat, accuracyM: 4, observedAt: `${walkedOn}T${stop.time}:00Z` })
      .expect(201);
  }
  return walk.id;
}

async function openWalk(context: BrowserContext, walkId: string): Promise<Page> {
  const page = await signInOnPhone(context, server.url, org.users.scout.email);
  await page.goto(`${server.url}/scout/walks/${walkId}`);
  await page.getByLabel('Pest').waitFor();
  return page;
}

const phone = () => scoutPhone(browser);

// The organisation's default way of writing times (en-GB, Europe/London), through the browser's own Intl (ECMA-402).
const shortTime = (iso: string) => new Intl.DateTimeFormat('en-GB', { timeStyle: 'short', timeZone: 'Europe/London' }).format(new Date(iso));

async function adviserPage(): Promise<Page> {
  const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
  await page.goto(`${server.url}/sign-in`);
  await page.getByLabel('E-mail address').fill(org.users.adviser.email);
  await page.getByLabel('Password').fill(TEST_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: 'Needs your attention' }).waitFor();
  return page;
}

describe('scout finishing a walk', () => {
  it('sees stops, found, empty and the route length of the walk', async () => {
    const walkId = await recordedWalk(await signedIn(org.users.scout.email), '2026-11-18');
    const context = await phone();
    try {
      const page = await openWalk(context, walkId);
      await page.getByRole('button', { name: 'Finish walk' }).tap();
      const figure = (testId: string) => page.getByTestId(testId).textContent();
      await expect.poll(() => figure('summary-stops'), settle).toBe('5');
      expect(await figure('summary-found')).toBe('2');
      expect(await figure('summary-empty')).toBe('3');
      // turf `length` over the same stops in time order, rounded to the metre as shown under a kilometre.
      const metres = length(lineString(route.map((r) => [r.lon, r.lat])), { units: 'meters' });
      expect(metres).toBeLessThan(1000);
      expect(await figure('summary-route')).toBe(`${Math.round(metres)} m`);
      expect(await figure('summary-evenness')).toMatch(/^The stops reached \d+ % of the field's \d+ m squares/);
    } finally {
      await context.close();
    }
  });

  it("needs a connection to finish, then marks the field of today's finished walk on the field list with the time", async () => {
    const context = await phone();
    try {
      const page = await signInOnPhone(context, server.url, org.users.scout.email);
      const walkId = await startTodaysWalk(page, server.url, fieldId);
      await page.getByLabel('Pest').waitFor();

      await context.setOffline(true);
      const finish = page.getByRole('button', { name: 'Finish walk' });
      await expect.poll(() => finish.isDisabled(), settle).toBe(true);
      expect(await page.locator('[data-finish-needs-connection]').textContent()).toMatch(/needs a connection/);
      await context.setOffline(false);
      await expect.poll(() => finish.isDisabled(), settle).toBe(false);
      await finish.tap();
      await page.locator('[data-walk-finished]').waitFor();

      const scout = await signedIn(org.users.scout.email);
      const { finishedAt } = (await scout.get(`/api/walks/${walkId}`).expect(200)).body.walk as { finishedAt: string };
      expect(finishedAt).not.toBeNull();
      const time = shortTime(finishedAt);

      await page.goto(`${server.url}/scout/fields`);
      const field = page.getByRole('link', { name: /Creek Bottom/ });
      await expect.poll(() => field.locator('[data-field-finished]').textContent(), settle).toBe(`Finished at ${time}`);
    } finally {
      await context.close();
    }
  });

  it('marks the walk the scout finished with its time on the field hub and the scout’s walk list, today’s open walk as in progress, an older open one not at all', async () => {
    const admin = await signedIn(org.users.admin.email);
    const acre = (await createField(admin, (await createFarm(admin)).id, rectangleBoundary(), { name: 'Long Acre' })).id;
    const otherScout = await addUser(org, 'scout');
    for (const userId of [org.users.scout.id, otherScout.id]) await admin.post(`/api/fields/${acre}/scouts`, { userId }).expect(204);
    const older = await makeWalk(org, acre, '2026-11-10');

    const context = await phone();
    const desk = await adviserPage();
    try {
      const page = await signInOnPhone(context, server.url, org.users.scout.email);
      const walkId = await startTodaysWalk(page, server.url, acre);
      await page.getByRole('button', { name: 'Finish walk' }).tap();
      await page.locator('[data-walk-finished]').waitFor();
      const scout = await signedIn(org.users.scout.email);
      const { finishedAt, walkedOn } = (await scout.get(`/api/walks/${walkId}`).expect(200)).body.walk as { finishedAt: string; walkedOn: string };
      // Another scout on the same field the same day (the phone's day), not finished.
      const open = (await (await signedIn(otherScout.email)).post('/api/walks', { fieldId: acre, walkedOn }).expect(201)).body.walk.id as string;

      await desk.goto(`${server.url}/fields/${acre}`);
      const mark = (id: string) => desk.locator(`[data-walk="${id}"] [data-walk-finished]`);
      await expect.poll(() => mark(walkId).textContent(), settle).toBe(`Finished at ${shortTime(finishedAt)}`);
      expect(await mark(open).textContent()).toBe('In progress');
      expect(await mark(older).textContent()).toBe('');

      await page.goto(`${server.url}/scout/fields/${acre}`);
      const listed = (id: string) => page.locator(`a[href="/scout/walks/${id}"]`);
      await expect.poll(() => listed(walkId).locator('[data-walk-finish]').textContent(), settle).toBe(`Finished at ${shortTime(finishedAt)}`);
      expect(await listed(open).locator('[data-walk-finish]').textContent()).toBe('In progress');
      await listed(older).waitFor();
      expect(await listed(older).locator('[data-walk-finish]').count()).toBe(0);
    } finally {
      await desk.close();
      await context.close();
    }
  });
});
