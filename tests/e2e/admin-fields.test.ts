// An admin signs in, creates a farm, uploads a field boundary as a GeoJSON file, and sees the field
// on its map with the area in hectares and acres.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { area as turfArea, polygon as turfPolygon } from '@turf/turf';
import { launchBrowser, startTestServer, type TestServer } from '../helpers/browser.ts';
import { makeOrganisation, TEST_PASSWORD, type TestOrganisation } from '../helpers/org.ts';

// An invented quarter-section-sized field in open farmland, longitude first (RFC 7946).
const boundary = turfPolygon([
  [
    [-96.7512, 40.8121],
    [-96.7431, 40.8123],
    [-96.7429, 40.8069],
    [-96.7468, 40.8062],
    [-96.7513, 40.8071],
    [-96.7512, 40.8121],
  ],
]);

let server: TestServer;
let browser: Browser;
let org: TestOrganisation;
let boundaryFile: string;

beforeAll(async () => {
  [server, browser, org] = await Promise.all([startTestServer(), launchBrowser(), makeOrganisation('Browser')]);
  boundaryFile = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'patchwise-e2e-')), 'north-paddock.geojson');
  fs.writeFileSync(boundaryFile, JSON.stringify({ type: 'FeatureCollection', features: [boundary] }));
});

afterAll(async () => {
  await browser?.close();
  await server?.close();
  if (boundaryFile) fs.rmSync(path.dirname(boundaryFile), { recursive: true, force: true });
});

async function signInAsAdmin(page: Page) {
  await page.goto(`${server.url}/sign-in`);
  await page.getByLabel('E-mail address').fill(org.users.admin.email);
  await page.getByLabel('Password').fill(TEST_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: 'Overview' }).waitFor();
}

const parseNumber = (text: string | null) => Number((text ?? '').replace(/[^\d.]/g, ''));

describe('admin fields in the browser', () => {
  it('creates a farm and a field from an uploaded GeoJSON file and shows its boundary and area', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });

    await signInAsAdmin(page);

    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Farms' }).click();
    await page.getByRole('button', { name: 'New farm' }).click();
    await page.getByLabel('Farm name').fill('Hollow Creek');
    await page.getByRole('button', { name: 'Add a contact' }).click();
    await page.getByLabel('Contact 1 name').fill('Mara Hollow');
    await page.getByLabel('Contact 1 e-mail').fill('mara@hollow-creek.example');
    await page.getByRole('button', { name: 'Create farm' }).click();
    await page.getByRole('heading', { name: 'Hollow Creek' }).waitFor();

    await page.getByRole('link', { name: 'Add a field' }).click();
    await page.getByLabel('Field name').fill('North paddock');
    await page.getByLabel('Crop').fill('soybean');
    await page.getByLabel('Season').fill('2026');
    await page.getByLabel('Boundary file').setInputFiles(boundaryFile);
    await page.getByRole('button', { name: 'Save field' }).click();

    await page.getByRole('heading', { name: 'North paddock' }).waitFor();
    // Leaflet draws vector layers as SVG paths in its overlay pane.
    const outline = page.locator('.leaflet-overlay-pane svg path');
    await outline.first().waitFor();
    expect(await outline.count()).toBe(1);
    expect((await outline.first().getAttribute('d'))?.length ?? 0).toBeGreaterThan(10);

    const facts = page.getByRole('definition').filter({ has: page.locator('[data-unit="ha"]') });
    const hectares = parseNumber(await facts.locator('[data-unit="ha"]').textContent());
    const acres = parseNumber(await facts.locator('[data-unit="ac"]').textContent());
    // Reference: turf's `area` (@turf/turf 7) of the same polygon; the server stores PostGIS's
    // ellipsoidal area, so the two agree to well under 0.5 %.
    const expectedM2 = turfArea(boundary);
    expect(Math.abs(hectares * 10_000 - expectedM2) / expectedM2).toBeLessThan(0.005);
    // International acre, 4046.8564224 m² (NIST Handbook 44, Appendix C).
    expect(Math.abs(acres * 4046.8564224 - expectedM2) / expectedM2).toBeLessThan(0.005);

    await page.close();
  });

  it('deletes a farm only once its fields are gone, saying why when it still has one', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    await signInAsAdmin(page);

    await page.goto(`${server.url}/admin/farms`);
    await page
      .getByRole('link', { name: /Hollow Creek/ })
      .first()
      .click();
    await page.getByRole('heading', { name: 'Hollow Creek' }).waitFor();
    await page.getByRole('button', { name: 'Delete farm' }).click();
    await page.getByRole('dialog').getByRole('button', { name: 'Delete farm' }).click();
    await page.getByText('Hollow Creek still has 1 field; delete it first, then the farm.').waitFor();

    await page.getByRole('button', { name: 'Delete North paddock' }).click();
    await page.getByRole('dialog').getByRole('button', { name: 'Delete field' }).click();
    await page.getByText('This farm has no fields yet').waitFor();
    await page.getByRole('button', { name: 'Delete farm' }).click();
    await page.getByRole('dialog').getByRole('button', { name: 'Delete farm' }).click();
    await page.getByRole('heading', { name: 'Farms' }).waitFor();
    await expect.poll(() => page.getByRole('link', { name: /Hollow Creek/ }).count()).toBe(0);
    await page.close();
  });
});
