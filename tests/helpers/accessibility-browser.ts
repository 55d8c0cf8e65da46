// What every accessibility suite does in the browser: a desk or phone context, signing in with the keyboard
// alone, and the one assertion that a page has no serious axe-core finding and a complete Tab order.
import { expect } from 'vitest';
import type { Browser, BrowserContextOptions, FileChooser, Page } from 'playwright-core';
import { TEST_PASSWORD } from './org.ts';
import { TEST_FIELD_CORNER } from './sightings.ts';
import { findingsTable, focusTop, inDocumentOrder, seriousViolations, tabTo, walkWithTab } from './accessibility.ts';

export type Device = 'desk' | 'phone';

/** The phone stands inside the invented test field (tests/helpers/sightings.ts), with location allowed. */
export const PHONE_POSITION = { latitude: TEST_FIELD_CORNER.lat + 0.0015, longitude: TEST_FIELD_CORNER.lon + 0.0025, accuracy: 6 };

/** A desk-sized window, or a phone (touch, high density, location allowed); `storageState` carries a signed-in session. */
export function newContext(browser: Browser, device: Device, storageState?: BrowserContextOptions['storageState']) {
  if (device === 'desk') return browser.newContext({ viewport: { width: 1280, height: 900 }, storageState });
  return browser.newContext({
    viewport: { width: 390, height: 844 },
    deviceScaleFactor: 2,
    isMobile: true,
    hasTouch: true,
    geolocation: PHONE_POSITION,
    permissions: ['geolocation'],
    storageState,
  });
}

/** Signs in with the keyboard only: Tab to each input, type, Enter on the button. */
export async function signInByKeyboard(page: Page, baseUrl: string, email: string) {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByRole('heading', { name: 'Sign in' }).waitFor();
  await focusTop(page);
  await tabTo(page, page.getByLabel('E-mail address'));
  await page.keyboard.type(email);
  await tabTo(page, page.getByLabel('Password'));
  await page.keyboard.type(TEST_PASSWORD);
  await tabTo(page, page.getByRole('button', { name: 'Sign in' }));
  await page.keyboard.press('Enter');
  await page.getByRole('navigation', { name: 'Main' }).waitFor();
}

/** axe-core's serious and critical findings, and every interactive element reached by Tab in order. */
export async function expectAccessible(page: Page) {
  const findings = await seriousViolations(page);
  expect(findings, `axe-core serious/critical violations on ${page.url()}:\n${findingsTable(findings)}`).toEqual([]);
  const walk = await walkWithTab(page);
  expect(walk.expected.length, 'interactive elements on the page').toBeGreaterThan(0);
  expect(walk.missed, `never reached by Tab on ${page.url()}`).toEqual([]);
  expect(walk.unfocusable, `clickable but not focusable on ${page.url()}`).toEqual([]);
  expect(inDocumentOrder(walk), `Tab order on ${page.url()}:\n${walk.reached.join('\n')}`).toBe(true);
}

/**
 * On a scout's upload form: picks the first pest with the arrow key, opens the gallery chooser with Space, sends
 * one photo with Enter, and waits until its row says sent. Returns that row.
 */
export async function sendOnePhotoByKeyboard(page: Page, photo: { name: string; buffer: Buffer }) {
  await focusTop(page);
  await tabTo(page, page.getByLabel('Pest'));
  await page.keyboard.press('ArrowDown');
  await expect.poll(() => page.getByLabel('Pest').inputValue()).not.toBe('');
  // The gallery input opens the file chooser from the keyboard like any button. Seen once on a loaded 2-core
  // machine: no chooser after the first Space; a person would press it again, and so does this.
  await tabTo(page, page.getByTestId('gallery-input'));
  let chooser: FileChooser | null = null;
  for (let attempt = 0; attempt < 3 && !chooser; attempt++) {
    const opened = page.waitForEvent('filechooser', { timeout: 10_000 }).catch(() => null);
    await page.keyboard.press('Space');
    chooser = await opened;
  }
  if (!chooser) throw new Error('The gallery input opened no file chooser after three presses of Space.');
  await chooser.setFiles({ ...photo, mimeType: 'image/jpeg' });
  await tabTo(page, page.getByRole('button', { name: 'Send 1 photo' }));
  await page.keyboard.press('Enter');
  const row = page.getByRole('list', { name: 'Photos in this batch' }).getByRole('listitem').first();
  await expect.poll(() => row.getAttribute('data-upload-state'), { timeout: 60_000, interval: 250 }).toBe('sent');
  return row;
}
