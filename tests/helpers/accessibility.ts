// Accessibility checks for browser journeys: axe-core's findings as a readable table, and a Tab walk that
// says which interactive elements the keyboard never reaches.
import { AxeBuilder } from '@axe-core/playwright';
import type { Locator, Page } from 'playwright-core';

export interface AxeFinding {
  impact: string;
  rule: string;
  help: string;
  target: string;
  detail: string;
}

/**
 * axe-core's serious and critical findings on the page as it stands (every rule axe runs by default), and in
 * each sandboxed frame on it (e-mails shown as the recipient sees them) checked as a document of its own.
 */
export async function seriousViolations(page: Page): Promise<AxeFinding[]> {
  await colourTransitionsSettled(page);
  // axe-core cannot run inside a frame sandboxed without scripts, and waits on one for ever; see sandboxedFrameViolations.
  const results = await new AxeBuilder({ page }).exclude('iframe[sandbox]').analyze();
  return [...findingsOf(results.violations), ...(await sandboxedFrameViolations(page))];
}

/**
 * Waits for CSS transitions already running (a button fading from its disabled shade) to end: axe measures contrast on
 * the colour of the moment, and a half-faded button is not what anyone reads. Endless animations (spinners) are left be.
 */
async function colourTransitionsSettled(page: Page): Promise<void> {
  await page.evaluate(async () => {
    const running = document
      .getAnimations()
      .filter((a) => a instanceof CSSTransition && a.playState === 'running')
      .map((a) => a.finished.catch(() => undefined));
    const giveUp = new Promise((resolve) => setTimeout(resolve, 2000));
    await Promise.race([Promise.all(running), giveUp]);
  });
}

/** The content of each sandboxed frame with a srcdoc, loaded as a page of its own in the same context and checked there. */
async function sandboxedFrameViolations(page: Page): Promise<AxeFinding[]> {
  const frames = await page
    .locator('iframe[sandbox][srcdoc]')
    .evaluateAll((all) => all.map((f) => ({ title: f.getAttribute('title') ?? '', html: f.getAttribute('srcdoc') ?? '' })));
  const findings: AxeFinding[] = [];
  for (const frame of frames) {
    const framePage = await page.context().newPage();
    try {
      await framePage.setContent(frame.html);
      const results = await new AxeBuilder({ page: framePage }).analyze();
      findings.push(...findingsOf(results.violations).map((f) => ({ ...f, target: `iframe “${frame.title.slice(0, 24)}” › ${f.target}`.slice(0, 100) })));
    } finally {
      await framePage.close();
    }
  }
  return findings;
}

function findingsOf(violations: Awaited<ReturnType<AxeBuilder['analyze']>>['violations']): AxeFinding[] {
  return violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .flatMap((v) =>
      v.nodes.map((node) => ({
        impact: v.impact ?? '',
        rule: v.id,
        help: v.help,
        target: node.target.map(String).join(' ').slice(0, 80),
        detail: (node.failureSummary ?? '')
          .replace(/\s+/g, ' ')
          .replace(/^Fix (any|all) of the following: /, '')
          .slice(0, 140),
      })),
    );
}

/** A fixed-width table for the failure message, one row per offending element. */
export function findingsTable(findings: AxeFinding[]): string {
  if (findings.length === 0) return '(none)';
  const columns = ['impact', 'rule', 'target', 'detail'] as const;
  const widths = columns.map((c) => Math.max(c.length, ...findings.map((f) => f[c].length)));
  const line = (cells: string[]) => cells.map((cell, i) => cell.padEnd(widths[i])).join(' | ');
  return [line([...columns]), line(widths.map((w) => '-'.repeat(w))), ...findings.map((f) => line(columns.map((c) => f[c])))].join('\n');
}

export interface TabWalk {
  /** Interactive elements on the page that the keyboard should reach, in document order. */
  expected: string[];
  /** Those the Tab key never focused. */
  missed: string[];
  /** Things that look or act clickable (pointer cursor, widget role) but can take no focus at all. */
  unfocusable: string[];
  /** Expected elements in the order Tab first reached them. */
  reached: string[];
}

const INTERACTIVE = 'a[href], button, input:not([type="hidden"]), select, textarea, summary, [tabindex], [contenteditable="true"]';

/**
 * Starts from the top of the document and presses Tab until focus comes back round (or `maxPresses`),
 * recording every focused element. A radio group counts as reached when any of its radios is focused,
 * as the arrow keys move within it.
 */
export async function walkWithTab(page: Page, maxPresses = 400): Promise<TabWalk> {
  const expected = await page.evaluate((selector) => {
    const describe = (el: Element) => {
      const label = (
        el.getAttribute('aria-label') ??
        (el as HTMLElement).innerText ??
        el.getAttribute('title') ??
        (el as HTMLInputElement).labels?.[0]?.innerText ??
        el.getAttribute('name') ??
        ''
      )
        .replace(/\s+/g, ' ')
        .trim()
        .slice(0, 50);
      return `${el.tagName.toLowerCase()}${el.getAttribute('type') ? `[${el.getAttribute('type')}]` : ''} “${label}”`;
    };
    const keys: string[] = [];
    const radioGroups = new Set<string>();
    document.querySelectorAll(selector).forEach((el, i) => {
      const html = el as HTMLElement;
      el.removeAttribute('data-tab-key');
      if (html.tabIndex < 0 || (el as HTMLButtonElement).disabled || el.closest('[inert]')) return;
      if (!html.checkVisibility({ visibilityProperty: true })) return;
      let key = `${i}: ${describe(el)}`;
      if (el instanceof HTMLInputElement && el.type === 'radio' && el.name) {
        key = `radio group “${el.name}”`;
        if (radioGroups.has(key)) {
          el.setAttribute('data-tab-key', key);
          return;
        }
        radioGroups.add(key);
      }
      el.setAttribute('data-tab-key', key);
      keys.push(key);
    });
    return keys;
  }, INTERACTIVE);
  const unfocusable = await page.evaluate((selector) => {
    const widget = '[role="button"], [role="link"], [role="tab"], [role="checkbox"], [role="switch"], [role="menuitem"], [role="option"], [role="radio"]';
    const found: string[] = [];
    for (const el of Array.from(document.body.querySelectorAll<HTMLElement>('*'))) {
      // Native controls, and anything inside one or inside a label (which hands clicks to its control), are covered above.
      if (el.closest(`${selector}, label`)) continue;
      // Features drawn on a map (sightings, zones) are clickable shapes whose content the page lists in text too.
      if (el.closest('.leaflet-container')) continue;
      const pointer = getComputedStyle(el).cursor === 'pointer' && (!el.parentElement || getComputedStyle(el.parentElement).cursor !== 'pointer');
      if ((pointer || el.matches(widget)) && !el.hasAttribute('tabindex') && el.checkVisibility({ visibilityProperty: true })) {
        found.push(
          `${el.tagName.toLowerCase()}${el.getAttribute('role') ? `[role=${el.getAttribute('role')}]` : ''} “${el.innerText.replace(/\s+/g, ' ').trim().slice(0, 50)}”`,
        );
      }
    }
    return found;
  }, INTERACTIVE);
  await focusTop(page);

  const reached: string[] = [];
  let first: string | null = null;
  for (let press = 0; press < maxPresses; press++) {
    await page.keyboard.press('Tab');
    const key = await page.evaluate(() => document.activeElement?.closest('[data-tab-key]')?.getAttribute('data-tab-key') ?? null);
    if (key === null) continue;
    if (first === null) first = key;
    else if (key === first) break;
    if (!reached.includes(key)) reached.push(key);
  }
  return { expected, reached, missed: expected.filter((k) => !reached.includes(k)), unfocusable };
}

/** True when the elements Tab reached came in document order (no positive tabindex, no focus traps). */
export function inDocumentOrder(walk: TabWalk): boolean {
  const positions = walk.reached.filter((k) => walk.expected.includes(k)).map((k) => walk.expected.indexOf(k));
  return positions.every((p, i) => i === 0 || p > positions[i - 1]);
}

/** Presses Tab (from wherever focus is) until the target has focus; fails when it never does. */
export async function tabTo(page: Page, target: Locator, maxPresses = 400): Promise<void> {
  const handle = await target.elementHandle();
  if (!handle) throw new Error('tabTo: the target is not on the page');
  for (let press = 0; press < maxPresses; press++) {
    if (await page.evaluate((el) => document.activeElement === el, handle)) return;
    await page.keyboard.press('Tab');
  }
  throw new Error(`tabTo: ${maxPresses} presses of Tab never focused the target`);
}

/** Moves keyboard focus back to the top of the document, as a fresh page load would. */
export async function focusTop(page: Page): Promise<void> {
  // Focusing the body moves the sequential-navigation starting point there.
  await page.evaluate(() => {
    (document.activeElement as HTMLElement | null)?.blur();
    document.body.setAttribute('tabindex', '-1');
    document.body.focus();
    document.body.removeAttribute('tabindex');
  });
}
