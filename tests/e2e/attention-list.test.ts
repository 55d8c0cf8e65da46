// The adviser's home in the browser: each field that needs action shows as a line, and its button opens that exact
// check, zone editor or field review; another organisation's fields never show.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { mean } from 'simple-statistics';
import { sequelize } from '../../server/db.ts';
import { launchBrowser, startTestServer, type TestServer } from '../helpers/browser.ts';
import { signedIn } from '../helpers/http.ts';
import { makeOrganisation, TEST_PASSWORD, type TestOrganisation } from '../helpers/org.ts';
import { makeScoutedField, TEST_FIELD_CORNER, TEST_FIELD_SIZE } from '../helpers/sightings.ts';
import { makeCheckedField, type ScoutedCheck } from '../helpers/zones.ts';

let server: TestServer;
let browser: Browser;
let org: TestOrganisation;
let patchy: ScoutedCheck;
let overdueFieldId: string;
let outsiderField: string;

beforeAll(async () => {
  let other: TestOrganisation;
  [server, browser, org, other] = await Promise.all([
    startTestServer(),
    launchBrowser(),
    makeOrganisation('Attention home'),
    makeOrganisation('Attention elsewhere'),
  ]);
  const adviser = await signedIn(org.users.adviser.email);
  patchy = await makeCheckedField(org, adviser, { fieldName: 'Willow bend' });
  // A threshold between the field mean of the invented stops and the check's patchiest zone.
  const fieldMean = mean(patchy.points.map((p) => p.count as number));
  const highestZone = Math.max(
    ...(patchy.check.result.zones as { features: Array<{ properties: { meanCount: number } }> }).features.map((z) => z.properties.meanCount),
  );
  await sequelize.query('UPDATE pests SET action_threshold = :threshold WHERE id = :id', {
    replacements: { id: patchy.pest.id, threshold: (fieldMean + highestZone) / 2 },
  });
  const walkedOn = new Date(Date.now() - 20 * 86_400_000).toISOString().slice(0, 10);
  const stop = { lon: TEST_FIELD_CORNER.lon + TEST_FIELD_SIZE.lon / 2, lat: TEST_FIELD_CORNER.lat + TEST_FIELD_SIZE.lat / 2, count: 1 };
  overdueFieldId = (await makeScoutedField(org, [stop], { walkedOn })).field.id;
  await sequelize.query("UPDATE fields SET name = 'Quarry lane' WHERE id = :id", { replacements: { id: overdueFieldId } });
  outsiderField = (await makeScoutedField(other, [stop], { walkedOn })).field.name;
});

afterAll(async () => {
  await browser?.close();
  await server?.close();
});

describe('the adviser’s attention list in the browser', () => {
  it('shows a patch above threshold and a field due a walk, each opening its own page, and nothing of another organisation', async () => {
    const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    try {
      await page.goto(`${server.url}/sign-in`);
      await page.getByLabel('E-mail address').fill(org.users.adviser.email);
      await page.getByLabel('Password').fill(TEST_PASSWORD);
      await page.getByRole('button', { name: 'Sign in' }).click();
      await page.getByRole('heading', { name: 'Needs your attention' }).waitFor();

      const patchLine = page.locator('[data-attention="patch-above-threshold"]').filter({ hasText: 'Willow bend' });
      await patchLine.waitFor();
      expect(await patchLine.textContent()).toMatch(/above the action threshold .* while the field mean is/);
      const dueLine = page.locator('[data-attention="rescout-due"]').filter({ hasText: 'Quarry lane' });
      expect(await dueLine.textContent()).toMatch(/last walked 20 days ago; .* is due a walk every 7 days/);
      expect(await dueLine.textContent()).toContain('interval not yet confirmed in the pest library');
      expect(await page.getByText(outsiderField).count()).toBe(0);

      await patchLine.getByRole('link', { name: 'Open the zones' }).click();
      await page.waitForURL(`${server.url}/fields/${patchy.field.id}/zones?checkId=${patchy.checkId}`);
      await page.getByRole('heading', { name: /Treatment zones · Willow bend/ }).waitFor();

      await page.goBack();
      await dueLine.getByRole('link', { name: 'Open the field' }).click();
      await page.waitForURL((url) => url.pathname === `/fields/${overdueFieldId}/review`);
      await page.getByRole('heading', { name: /review/ }).waitFor();
    } finally {
      await page.close();
    }
  });
});
