// WCAG 2.2 SC 2.4.11 Focus Not Obscured (Minimum), on a phone (390 × 844) and a desktop:
// tabbing forward and backward through every focusable element, no focused element may sit
// under the check screen's sticky verdict (or anything else stuck to the screen), in the strobe,
// camera and lighting modes and with the verdict withdrawn; the tool screens are walked too.
import { afterEach, describe, expect, inject, test, vi } from 'vitest';
import type { Page } from 'playwright-core';
import { openApp, openBrowser, SIZES, typeInto, type Session } from './browser';
import { focusStop, type FocusStop } from './accessibility';

let session: Session | undefined;

afterEach(async () => {
  await session?.close();
  session = undefined;
});

/** More key presses than any screen has stops: a walk that never comes round is a failure. */
const MAX_STOPS = 400;

interface Walk {
  /** Stops visited, each once. */
  stops: number;
  /** The stops that were covered, and by what. */
  covered: string[];
}

/**
 * Presses `key` from the top of the page until focus comes back to the first element it
 * reached, checking each stop as it is reached (after the browser has scrolled it into view).
 */
async function walk(page: Page, key: 'Tab' | 'Shift+Tab'): Promise<Walk> {
  await page.evaluate(() => {
    (document.activeElement as HTMLElement | null)?.blur();
    for (const el of document.querySelectorAll('[data-walk-stop]'))
      el.removeAttribute('data-walk-stop');
    window.scrollTo(0, 0);
  });
  const covered: string[] = [];
  let stops = 0;
  for (let i = 0; i < MAX_STOPS; i++) {
    await page.keyboard.press(key);
    // Mark the element: meeting a marked one again means the walk has come round.
    const seen = await page.evaluate(() => {
      const el = document.activeElement as HTMLElement | null;
      if (!el || el === document.body) return 'none';
      if (el.hasAttribute('data-walk-stop')) return 'again';
      el.setAttribute('data-walk-stop', '');
      return 'new';
    });
    if (seen === 'again') return { stops, covered };
    if (seen === 'none') continue;
    stops++;
    const stop = await settledStop(page);
    if (stop?.covered) covered.push(`${key} to ${stop.name}: ${stop.covered}`);
  }
  throw new Error(`${key} did not come round within ${MAX_STOPS} presses`);
}

/**
 * The focus stop once the browser has brought it into view: Chromium may scroll a focused
 * control into view in the frame after the key press, so a stop that reads covered is read again
 * until it is not, or until it has stayed covered for a second (then it counts as covered).
 */
async function settledStop(page: Page): Promise<FocusStop | null> {
  let stop = await focusStop(page);
  if (!stop?.covered) return stop;
  try {
    await vi.waitFor(
      async () => {
        stop = await focusStop(page);
        if (stop?.covered) throw new Error(stop.covered);
      },
      { timeout: 1000, interval: 50 },
    );
  } catch {
    // Still covered once settled: reported by the caller.
  }
  return stop;
}

/** Walks both ways; fails listing every covered stop, with the count each way. */
async function expectNoStopCovered(page: Page, where: string): Promise<void> {
  const covered: string[] = [];
  const counts: string[] = [];
  for (const key of ['Tab', 'Shift+Tab'] as const) {
    const w = await walk(page, key);
    expect(w.stops, `${where}: stops reached by ${key}`).toBeGreaterThan(10);
    covered.push(...w.covered);
    counts.push(`${w.covered.length} of ${w.stops} stops covered by ${key}`);
  }
  expect(covered, `${where}: ${counts.join(', ')}`).toEqual([]);
}

describe('focus never hides under the sticky verdict', () => {
  for (const size of SIZES) {
    test(`on the check screen with a strobe, a camera and the lighting, and with the verdict withdrawn, on a ${size.name}`, async () => {
      session = await openBrowser({ width: size.width, height: size.height });
      const { page } = session;
      await openApp(page, inject('baseUrl'));
      // The widgets below the entries are part of the walk: wait for them to be drawn.
      await page.getByTestId('rate-map').waitFor();
      await expectNoStopCovered(page, `strobe, ${size.name}`);
      await page.getByRole('radio', { name: 'Camera', exact: true }).check();
      await page.getByLabel('Frame rate', { exact: true }).waitFor();
      await expectNoStopCovered(page, `camera, ${size.name}`);
      await page.getByRole('radio', { name: 'Lighting', exact: true }).check();
      await page.getByLabel('Modulation (percent flicker)', { exact: true }).waitFor();
      await expectNoStopCovered(page, `lighting, ${size.name}`);
      // Withdrawn, the verdict grows (the field's message and a button to fix it).
      await page.getByRole('radio', { name: 'Strobe', exact: true }).check();
      await typeInto(page, 'Speed', 'abc');
      await page.getByTestId('withdrawn').first().waitFor();
      await expectNoStopCovered(page, `verdict withdrawn, ${size.name}`);
    });
  }

  test('nor under anything stuck to the screen on the tool screens, on a phone', async () => {
    session = await openBrowser({ width: 390, height: 844 });
    const { page } = session;
    await openApp(page, inject('baseUrl'));
    for (const [tab, shows] of [
      ['Machines', 'machine-list'],
      ['Lighting', 'lighting-screen'],
      ['Camera', 'camera-screen'],
      ['Logger', 'logger-screen'],
      ['Speed finder', 'speed-finder-screen'],
      ['Whole machine', 'whole-machine-screen'],
    ] as const) {
      await page.getByRole('button', { name: tab, exact: true }).click();
      await page.getByTestId(shows).waitFor();
      await expectNoStopCovered(page, tab);
    }
  });
});
