// The app with a keyboard alone (WCAG 2.1.1 Keyboard, 2.4.7 Focus Visible), in a real Chromium:
// on every screen, and in each mode that brings more controls, Tab reaches every control and
// each shows a focus indicator when it has focus; the check screen's main actions work from the
// keyboard (choose a sampler with the arrow keys, type a speed, take a suggested rate with
// Enter or Space, move the rate with the rate map's arrow keys, open and switch screens).
import { afterEach, describe, expect, inject, test } from 'vitest';
import type { Page } from 'playwright-core';
import { openApp, openBrowser, type Session } from './browser';
import { focusIndicator } from './accessibility';
import { TOURS } from './every-screen';

let session: Session | undefined;

afterEach(async () => {
  await session?.close();
  session = undefined;
});

/** More key presses than any screen has stops. */
const MAX_STOPS = 400;

/**
 * Marks every control Tab should reach: focusable, shown, not disabled or inert, and for a group
 * of radio buttons only the one Tab stops at (the checked one, or the first when none is).
 * Returns how many there are.
 */
function markControls(page: Page): Promise<number> {
  return page.evaluate(() => {
    for (const el of document.querySelectorAll('[data-kb]')) el.removeAttribute('data-kb');
    const all = [
      ...document.querySelectorAll<HTMLElement>(
        'a[href], button, input, select, textarea, summary, [tabindex]',
      ),
    ];
    const controls = all.filter((el) => {
      if ((el as HTMLButtonElement).disabled || el.tabIndex < 0) return false;
      if (el.closest('[inert], [hidden]')) return false;
      // Inside a closed disclosure only its summary can be reached (the rest opens with it).
      const details = el.closest('details');
      if (details && !details.open && el !== details.querySelector(':scope > summary')) {
        return false;
      }
      if (el.getClientRects().length === 0 || getComputedStyle(el).visibility === 'hidden') {
        return false;
      }
      if (el instanceof HTMLInputElement && el.type === 'radio') {
        const group = all.filter(
          (r) => r instanceof HTMLInputElement && r.type === 'radio' && r.name === el.name,
        ) as HTMLInputElement[];
        const stop = group.find((r) => r.checked) ?? group[0];
        return stop === el;
      }
      return true;
    });
    controls.forEach((el, i) => el.setAttribute('data-kb', String(i)));
    return controls.length;
  });
}

/** A control, described for a message. */
function describeFocus(page: Page): Promise<string> {
  return page.evaluate(() => {
    const el = document.activeElement as HTMLElement | null;
    if (!el) return 'nothing';
    const name =
      el.getAttribute('aria-label') ??
      (el as HTMLInputElement).labels?.[0]?.innerText ??
      el.innerText ??
      '';
    return `${el.tagName.toLowerCase()}${el.id ? `#${el.id}` : ''} "${name.trim().slice(0, 40)}"`;
  });
}

/**
 * Tabs from the top of the page round to where it started; returns the marked controls never
 * reached, and the reached ones that showed no focus indicator.
 */
async function tabRound(
  page: Page,
): Promise<{ total: number; missed: string[]; unmarked: string[] }> {
  const total = await markControls(page);
  await page.evaluate(() => {
    (document.activeElement as HTMLElement | null)?.blur();
    window.scrollTo(0, 0);
  });
  const reached = new Set<string>();
  const unmarked: string[] = [];
  let first: string | null = null;
  for (let i = 0; i < MAX_STOPS; i++) {
    await page.keyboard.press('Tab');
    const mark = await page.evaluate(() => document.activeElement?.getAttribute('data-kb') ?? null);
    if (mark === null) continue;
    if (mark === first) break;
    first ??= mark;
    reached.add(mark);
    if ((await focusIndicator(page)) === null) unmarked.push(await describeFocus(page));
  }
  const missed = await page.evaluate(
    (seen) =>
      [...document.querySelectorAll<HTMLElement>('[data-kb]')]
        .filter((el) => !seen.includes(el.getAttribute('data-kb')!))
        .map(
          (el) =>
            `${el.tagName.toLowerCase()}${el.id ? `#${el.id}` : ''} "${(el.getAttribute('aria-label') ?? el.innerText ?? '').trim().slice(0, 40)}"`,
        ),
    [...reached],
  );
  return { total, missed, unmarked };
}

/**
 * Presses `key` until the focused element matches `selector` (and, given, has `name` in its
 * words); fails when it never does.
 */
async function tabTo(
  page: Page,
  selector: string,
  name?: RegExp,
  key: 'Tab' | 'Shift+Tab' = 'Tab',
): Promise<void> {
  for (let i = 0; i < MAX_STOPS; i++) {
    await page.keyboard.press(key);
    const found = await page.evaluate(
      ({ selector, source }) => {
        const el = document.activeElement as HTMLElement | null;
        if (!el?.matches(selector)) return false;
        const words = el.getAttribute('aria-label') ?? el.innerText ?? '';
        return source === null || new RegExp(source).test(words);
      },
      { selector, source: name?.source ?? null },
    );
    if (found) {
      expect(await focusIndicator(page), `focus indicator on ${selector}`).not.toBeNull();
      return;
    }
  }
  throw new Error(`${key} never reached ${selector} ${name ?? ''}`);
}

/**
 * After an action has settled, focus is on a control that shows its focus indicator, never
 * dropped to the page body (a screen reader user would be sent back to the top).
 */
async function expectFocusHeld(page: Page, after: string): Promise<void> {
  // The control that had focus may be gone (a part removed): focus moves on once the list has
  // re-rendered, so wait for where it settles rather than reading it once.
  await expect
    .poll(
      () =>
        page.evaluate(() => {
          const el = document.activeElement;
          return !el || el === document.body || el === document.documentElement ? null : el.tagName;
        }),
      { message: `focus after ${after}` },
    )
    .not.toBeNull();
  await expect
    .poll(() => focusIndicator(page), { message: `focus indicator after ${after}` })
    .not.toBeNull();
}

describe('the keyboard alone', () => {
  test('reaches every control of every screen and mode by Tab, each with a visible focus indicator', async () => {
    session = await openBrowser({ width: 390, height: 844 });
    const { page } = session;
    await openApp(page, inject('baseUrl'));
    await page.getByTestId('rate-map').waitFor();
    const problems: string[] = [];
    for (const tour of TOURS) {
      for (const step of tour.steps) {
        await step.go(page);
        const { total, missed, unmarked } = await tabRound(page);
        expect(total, `${step.name}: controls`).toBeGreaterThan(5);
        if (missed.length > 0) problems.push(`${step.name}: never reached ${missed.join(', ')}`);
        if (unmarked.length > 0) {
          problems.push(`${step.name}: no focus indicator on ${unmarked.join(', ')}`);
        }
      }
    }
    expect(problems).toEqual([]);
  });

  test('works the check screen: a sampler by arrow keys, a speed typed, a suggested rate by Enter and Space, the rate map by arrow keys', async () => {
    session = await openBrowser({ width: 390, height: 844 });
    const { page } = session;
    await openApp(page, inject('baseUrl'));
    await page.getByTestId('rate-map').waitFor();
    const flashRate = page.getByLabel('Flash rate', { exact: true });

    // The sampler: one stop for the group, the arrow keys choose.
    await tabTo(page, 'input[name="sampler-kind"]:checked');
    await page.keyboard.press('ArrowRight');
    await page.getByLabel('Frame rate', { exact: true }).waitFor();
    expect(await page.getByRole('radio', { name: 'Camera', exact: true }).isChecked()).toBe(true);
    await expectFocusHeld(page, 'choosing Camera');
    await page.keyboard.press('ArrowRight');
    await page.getByLabel('Modulation (percent flicker)', { exact: true }).waitFor();
    await page.keyboard.press('ArrowLeft');
    await page.keyboard.press('ArrowLeft');
    await flashRate.waitFor();
    expect(await page.getByRole('radio', { name: 'Strobe', exact: true }).isChecked()).toBe(true);
    await expectFocusHeld(page, 'choosing Strobe again');

    // A speed, typed: Wikipedia, "Stroboscopic effect": 60 rev/s under 61 flashes/s turns backward.
    await tabTo(page, '#speed', undefined, 'Shift+Tab');
    await page.keyboard.press('ControlOrMeta+A');
    await page.keyboard.type('3600');
    await tabTo(page, '#features');
    await page.keyboard.press('ControlOrMeta+A');
    await page.keyboard.type('1');
    await tabTo(page, '#flash-rate');
    await page.keyboard.press('ControlOrMeta+A');
    await page.keyboard.type('3660');
    await expect.poll(() => page.getByTestId('verdict').innerText()).toMatch(/^Turning backward/);
    await expectFocusHeld(page, 'typing a flash rate');

    // A suggested rate, taken with Enter: the single-image rate freezes it.
    await tabTo(page, '[data-testid="lock-list"] button', /^3,600 fpm\s+1 image/);
    await page.keyboard.press('Enter');
    await expect.poll(() => flashRate.inputValue()).toBe('3600');
    await expect.poll(() => page.getByTestId('verdict').innerText()).toMatch(/^Looks still/);
    await expectFocusHeld(page, 'taking a suggested rate with Enter');
    // ... and with Space: the next lock-in rate up.
    await tabTo(page, '[data-testid="lock-list"] button:not([aria-current])');
    const taken = (await page.evaluate(
      () => document.activeElement!.querySelector('span')!.textContent,
    ))!;
    await page.keyboard.press('Space');
    await expect.poll(() => flashRate.inputValue()).toBe(taken.replace(/[^\d.]/g, ''));
    await expectFocusHeld(page, 'taking a suggested rate with Space');

    // The rate map: arrow keys move the rate, Home and End go to the ends of the strobe's range.
    await tabTo(page, '[role="slider"][data-testid="rate-map"]', undefined, 'Shift+Tab');
    const slider = page.getByTestId('rate-map');
    const before = Number(await slider.getAttribute('aria-valuenow'));
    await page.keyboard.press('ArrowRight');
    await expect
      .poll(async () => Number(await slider.getAttribute('aria-valuenow')))
      .toBeGreaterThan(before);
    await page.keyboard.press('Home');
    const min = await slider.getAttribute('aria-valuemin');
    await expect.poll(() => slider.getAttribute('aria-valuenow')).toBe(min);
    await expect.poll(() => flashRate.inputValue()).toBe(min);
    await expectFocusHeld(page, 'moving the rate map with Home');
  });

  test('opens a tool screen and switches between screens from the tab bar with Enter and Space', async () => {
    session = await openBrowser({ width: 390, height: 844 });
    const { page } = session;
    await openApp(page, inject('baseUrl'));
    await tabTo(page, 'nav button', /Lighting/);
    await page.keyboard.press('Enter');
    await page.getByTestId('lighting-screen').waitFor();
    await expect.poll(() => page.locator('h1').innerText()).toBe('Lighting check');
    await expectFocusHeld(page, 'opening Lighting');
    // Focus stays on the tab bar: the next tab is a Tab away.
    await tabTo(page, 'nav button', /Camera/);
    await page.keyboard.press('Space');
    await page.getByTestId('camera-screen').waitFor();
    await expect
      .poll(() =>
        page.getByRole('button', { name: 'Camera', exact: true }).getAttribute('aria-current'),
      )
      .toBe('page');
    await expectFocusHeld(page, 'opening Camera');
    await tabTo(page, 'nav button', /Check/, 'Shift+Tab');
    await page.keyboard.press('Enter');
    await page.getByTestId('verdict').waitFor();
    await expect.poll(() => page.locator('h1').innerText()).toBe('Check what the viewer sees');
    await expectFocusHeld(page, 'opening Check');
  });

  test('works the tools: a part added, edited and removed under the lighting, a part of the whole machine added and removed', async () => {
    session = await openBrowser({ width: 390, height: 844 });
    const { page } = session;
    await openApp(page, inject('baseUrl'));

    // Lighting: the shared parts list grows by Enter, a typed speed shows in it, Space removes.
    await tabTo(page, 'nav button', /Lighting/);
    await page.keyboard.press('Enter');
    await page.getByTestId('lighting-screen').waitFor();
    const parts = page.getByTestId('parts-list').locator('li');
    const partsBefore = await parts.count();
    await tabTo(page, 'button', /^Add a part$/);
    await page.keyboard.press('Enter');
    await expect.poll(() => parts.count()).toBe(partsBefore + 1);
    await expectFocusHeld(page, 'adding a part');
    await tabTo(page, '#speed');
    await page.keyboard.press('ControlOrMeta+A');
    await page.keyboard.type('1234');
    await expect.poll(() => parts.last().innerText()).toMatch(/1,234 rpm/);
    await expectFocusHeld(page, 'typing a speed');
    await tabTo(page, 'button', /^Remove the chosen part$/, 'Shift+Tab');
    await page.keyboard.press('Space');
    await expect.poll(() => parts.count()).toBe(partsBefore);
    await expect.poll(() => page.getByTestId('parts-list').innerText()).not.toMatch(/1,234 rpm/);
    await expectFocusHeld(page, 'removing a part');

    // Whole machine: a part driven by the first, added by Enter and removed by Space.
    await tabTo(page, 'nav button', /Whole machine/);
    await page.keyboard.press('Enter');
    const cards = page.locator('[data-testid^="chain-part-"]');
    await cards.first().waitFor();
    const cardsBefore = await cards.count();
    await tabTo(page, 'button', /^Add part$/);
    await page.keyboard.press('Enter');
    await expect.poll(() => cards.count()).toBe(cardsBefore + 1);
    await expectFocusHeld(page, 'adding a part to the machine');
    await tabTo(page, 'button', /^Remove this part/, 'Shift+Tab');
    await page.keyboard.press('Space');
    await expect.poll(() => cards.count()).toBe(cardsBefore);
    await expectFocusHeld(page, 'removing a part of the machine');
  });
});
