// The zone editor keeps the adviser's hand edits: while the zones are the engine's own, a changed margin
// re-proposes them at once; after a hand edit, a new proposal waits until the adviser takes it or keeps their edits.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, startTestServer, type TestServer } from '../helpers/browser.ts';
import { signedIn } from '../helpers/http.ts';
import { makeOrganisation, TEST_PASSWORD, type TestOrganisation } from '../helpers/org.ts';
import { makeCheckedField, type ScoutedCheck } from '../helpers/zones.ts';

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

async function openEditor(page: Page) {
  await page.goto(`${server.url}/sign-in`);
  await page.getByLabel('E-mail address').fill(org.users.adviser.email);
  await page.getByLabel('Password').fill(TEST_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('button', { name: 'Sign out' }).waitFor();
  await page.goto(`${server.url}/fields/${scouted.field.id}/zones?checkId=${scouted.checkId}`);
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
