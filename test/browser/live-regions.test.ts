// What a screen reader is given to say while someone types, in a real Chromium: every change
// of the verdict's live region is recorded (a MutationObserver in the page) while a speed is
// typed key by key; the region must say the settled verdict once typing pauses, never the values
// passed on the way. The page's clock is Playwright's, so a slow machine cannot turn a quick
// keystroke into a pause; the test waits for the settled text, not for time.
import { afterEach, describe, expect, inject, test } from 'vitest';
import type { Page } from 'playwright-core';
import { openApp, openBrowser, typeInto, type Session } from './browser';

let session: Session | undefined;

afterEach(async () => {
  await session?.close();
  session = undefined;
});

/** Longer than the pause after which the answer is read out (SETTLE_MS in src/ui/settled-status). */
const PAUSE_MS = 1000;

/** Starts recording every text the live region `testId` takes. */
async function listen(page: Page, testId: string): Promise<void> {
  await page.evaluate((id) => {
    const read = () => document.querySelector(`[data-testid="${id}"]`)?.textContent ?? null;
    const texts: Array<string | null> = [read()];
    (window as unknown as { heardTexts: typeof texts }).heardTexts = texts;
    new MutationObserver(() => {
      const now = read();
      if (now !== texts[texts.length - 1]) texts.push(now);
    }).observe(document.body, { subtree: true, childList: true, characterData: true });
  }, testId);
}

/** What a screen reader was given to say since `listen`: each change to a text with words in it. */
function heard(page: Page): Promise<string[]> {
  return page.evaluate(() =>
    (window as unknown as { heardTexts: Array<string | null> }).heardTexts
      .slice(1)
      .filter((t): t is string => t !== null && t.trim() !== ''),
  );
}

/** Lets the page's clock run past the pause, then waits until the region says what is shown. */
async function pauseUntilSaid(page: Page, region: string, shown: string): Promise<string> {
  await page.clock.runFor(PAUSE_MS);
  const text = await page.getByTestId(shown).textContent();
  await expect.poll(() => page.getByTestId(region).textContent()).toBe(text);
  return text!;
}

describe('live regions while typing', () => {
  test('typing 1780, pausing, then 1750 key by key gives the verdict’s live region two things to say: the two settled verdicts', async () => {
    session = await openBrowser({ width: 390, height: 844 });
    const { page } = session;
    await openApp(page, inject('baseUrl'));
    await page.clock.install();
    await listen(page, 'verdict-status');
    await typeInto(page, 'Speed', '1780');
    // On screen at once, key by key; in the live region nothing yet.
    await expect.poll(() => page.getByTestId('true-speed').textContent()).toBe('1,780 rpm');
    expect(await page.getByTestId('verdict-status').textContent()).toBe('');
    const at1780 = await pauseUntilSaid(page, 'verdict-status', 'verdict');
    await typeInto(page, 'Speed', '1750');
    await expect.poll(() => page.getByTestId('true-speed').textContent()).toBe('1,750 rpm');
    const at1750 = await pauseUntilSaid(page, 'verdict-status', 'verdict');
    expect(at1750).not.toBe(at1780);
    expect(await heard(page)).toEqual([at1780, at1750]);
  });

  test('a verdict withdrawn by a letter typed into the speed is said once, naming the field', async () => {
    session = await openBrowser({ width: 390, height: 844 });
    const { page } = session;
    await openApp(page, inject('baseUrl'));
    await page.clock.install();
    await listen(page, 'verdict-status');
    await typeInto(page, 'Speed', '17x0');
    await page.getByTestId('withdrawn').waitFor();
    await page.clock.runFor(PAUSE_MS);
    await expect
      .poll(() => page.getByTestId('verdict-status').textContent())
      .toMatch(/^No verdict until Speed is fixed\. Speed: /);
    expect(await heard(page)).toHaveLength(1);
  });

  test('a tool’s answer is said once typing pauses: the logger’s headline after a sample rate typed key by key', async () => {
    session = await openBrowser({ width: 390, height: 844 });
    const { page } = session;
    await openApp(page, inject('baseUrl'));
    await page.getByRole('button', { name: 'Logger', exact: true }).click();
    await page.getByTestId('logger-screen').waitFor();
    await page.clock.install();
    await listen(page, 'tool-status');
    await typeInto(page, 'Sample rate', '18');
    await expect.poll(() => page.getByTestId('logger-headline').textContent()).toBeTruthy();
    await page.clock.runFor(PAUSE_MS);
    const headline = await page.getByTestId('logger-headline').textContent();
    await expect.poll(() => page.getByTestId('tool-status').textContent()).toBe(`${headline}.`);
    expect(await heard(page)).toEqual([`${headline}.`]);
  });
});
