// A scout on a phone removes a wrong photo of their own from the walk (after a confirmation) and restores it.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { signedIn } from '../helpers/http.ts';
import type { TestOrganisation } from '../helpers/org.ts';
import { organisationWithAssignedField } from '../helpers/assigned-field.ts';
import { TEST_FIELD_CORNER } from '../helpers/sightings.ts';
import { makeJpeg, uploadPhotos } from '../helpers/photos.ts';
import { launchBrowser, startTestServer, type TestServer } from '../helpers/browser.ts';
import { scoutPhone, signInOnPhone } from '../helpers/scout-phone.ts';

const settle = { timeout: 30_000, interval: 200 };
const insideA = { lon: TEST_FIELD_CORNER.lon + 0.001, lat: TEST_FIELD_CORNER.lat + 0.0008 };
const insideB = { lon: TEST_FIELD_CORNER.lon + 0.0041, lat: TEST_FIELD_CORNER.lat + 0.0024 };

let server: TestServer;
let browser: Browser;
let org: TestOrganisation;
let pest: { id: string; name: string };

beforeAll(async () => {
  server = await startTestServer();
  browser = await launchBrowser();
  ({ org, pest } = await organisationWithAssignedField('Scout removal', 'Mill Strip'));
});

afterAll(async () => {
  await browser?.close();
  await server?.close();
});

const rows = (page: Page) => page.getByRole('list', { name: 'Sightings on this walk' }).getByRole('listitem');
const removedRows = (page: Page) => page.getByRole('list', { name: 'Removed from this walk' }).getByRole('listitem');
const counts = (page: Page) => rows(page).getByTestId('sighting-count').allTextContents();

describe('scout removing a wrong photo', () => {
  it('removes their own sighting after confirming, sees it under Removed, and restores it', async () => {
    const scout = await signedIn(org.users.scout.email);
    const photos = [
      { bytes: await makeJpeg({ gps: insideA, dateTimeOriginal: '2026:11:17 09:00:00', offsetTimeOriginal: '+00:00', markSeed: 201 }) },
      { bytes: await makeJpeg({ gps: insideB, dateTimeOriginal: '2026:11:17 09:05:00', offsetTimeOriginal: '+00:00', markSeed: 202 }) },
    ];
    const sent = await uploadPhotos(scout, photos, { pestId: pest.id, counts: JSON.stringify([2, 9]) }).expect(200);
    const walkId = sent.body.results[0].walkId as string;

    const context = await scoutPhone(browser);
    try {
      const page = await signInOnPhone(context, server.url, org.users.scout.email);
      await page.goto(`${server.url}/scout/walks/${walkId}`);
      await expect.poll(() => counts(page), settle).toEqual(['Count 2', 'Count 9']);

      const wrong = rows(page).filter({ hasText: 'Count 9' });
      await wrong.getByRole('button', { name: `Remove the sighting: ${pest.name}` }).tap();
      const dialog = page.getByRole('dialog', { name: 'Remove this sighting?' });
      await dialog.waitFor();
      // "Keep it" leaves everything as it was.
      await dialog.getByRole('button', { name: 'Keep it' }).tap();
      await expect.poll(() => dialog.isVisible(), settle).toBe(false);
      expect(await counts(page)).toEqual(['Count 2', 'Count 9']);

      await wrong.getByRole('button', { name: `Remove the sighting: ${pest.name}` }).tap();
      await dialog.getByRole('button', { name: 'Remove' }).tap();
      await expect.poll(() => counts(page), settle).toEqual(['Count 2']);
      await expect.poll(() => removedRows(page).allTextContents(), settle).toEqual([expect.stringContaining('Count 9')]);
      const onServer = (await scout.get(`/api/walks/${walkId}`).expect(200)).body;
      expect(onServer.sightings).toHaveLength(1);

      await removedRows(page)
        .getByRole('button', { name: `Restore the sighting: ${pest.name}` })
        .tap();
      await expect.poll(() => counts(page), settle).toEqual(['Count 2', 'Count 9']);
      await expect.poll(() => removedRows(page).count(), settle).toBe(0);
      expect((await scout.get(`/api/walks/${walkId}`).expect(200)).body.sightings).toHaveLength(2);
    } finally {
      await context.close();
    }
  });
});
