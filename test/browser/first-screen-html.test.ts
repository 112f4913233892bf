// The built page holds its first screen as HTML (scripts/prerender.ts): it paints the verdict
// and the stillness caution before any script runs, cannot be typed into until the script has
// taken it over, and the script's first render keeps those elements rather than drawing anew.
import { afterEach, describe, expect, inject, test } from 'vitest';
import { STILLNESS_CAUTION } from '../../src/words/cautions';
import { openApp, openBrowser, typeInto, type Session } from './browser';

let session: Session | undefined;

afterEach(async () => {
  await session?.close();
  session = undefined;
});

describe('the first screen in the built HTML', () => {
  test('shows the verdict, the starting machine and the stillness caution with no script, and takes no input', async () => {
    session = await openBrowser({ javaScript: false });
    const { page } = session;
    await page.goto(inject('baseUrl'));
    await expect.poll(() => page.getByTestId('verdict').innerText()).toMatch(/Looks still/);
    expect(await page.getByTestId('true-speed').innerText()).toBe('1,770 rpm');
    await expect.poll(() => page.getByText(STILLNESS_CAUTION).count()).toBe(1);
    expect(await page.getByLabel('Speed', { exact: true }).inputValue()).toBe('1770');
    // Inert until the script takes over: a tap cannot focus the field.
    expect(await page.locator('#app').getAttribute('inert')).toBe('');
    await page.getByLabel('Speed', { exact: true }).click({ force: true });
    expect(await page.evaluate(() => document.activeElement?.id ?? '')).not.toBe('speed');
  });

  test('is taken over by the script: the same caution element, one verdict, and a field that answers', async () => {
    session = await openBrowser();
    const { page } = session;
    // Marks the caution's paragraph as the HTML parser made it, before any script of the page.
    await page.addInitScript(() => {
      document.addEventListener('DOMContentLoaded', () => {
        const text = document.querySelector('#app aside p');
        if (text) (window as unknown as { parsedCaution: Element }).parsedCaution = text;
      });
    });
    await openApp(page, inject('baseUrl'));
    expect(await page.locator('#app').getAttribute('inert')).toBeNull();
    expect(await page.getByTestId('verdict').count()).toBe(1);
    const kept = await page.evaluate(() => {
      const parsed = (window as unknown as { parsedCaution?: Element }).parsedCaution;
      return parsed !== undefined && parsed.isConnected && parsed.textContent;
    });
    expect(kept).toContain('still turning at full speed');
    await typeInto(page, 'Speed', '2900');
    await expect.poll(() => page.getByTestId('true-speed').innerText()).toBe('2,900 rpm');
  });
});
