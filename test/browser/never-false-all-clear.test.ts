// Never a false all-clear, in a real Chromium against the built app: the lock-out
// caution stands beside every aliased verdict on the first screen of a phone, and a verdict
// whose input has been made invalid is withdrawn where it stands. Screenshots of the screens
// this touches go to test-output/screenshots/.
import { afterEach, describe, expect, inject, test } from 'vitest';
import type { Page } from 'playwright-core';
import { mkdirSync } from 'node:fs';
import { apparentMotion } from '../../src/core';
import { openApp, openBrowser, typeInto, type Session } from './browser';

let session: Session | undefined;

afterEach(async () => {
  await session?.close();
  session = undefined;
});

const shots = 'test-output/screenshots';

/** A fan close to a freeze: 6 blades at 1750 rpm under a strobe at 1748 flashes a minute. */
async function typeCreepCase(page: Page): Promise<void> {
  await typeInto(page, 'Speed', '1750');
  await typeInto(page, 'Blades or marks', '6');
  await typeInto(page, 'Flash rate', '1748');
}

/** Back to the top of the page, the cursor out of the fields: the first screen a person sees. */
async function toTop(page: Page): Promise<void> {
  await page.evaluate(() => {
    (document.activeElement as HTMLElement | null)?.blur();
    window.scrollTo(0, 0);
  });
  await expect.poll(() => page.evaluate(() => window.scrollY)).toBe(0);
}

describe('never a false all-clear', () => {
  test('the creep of 6 blades at 1750 rpm under 1748 flashes/min shows the lock-out caution on the first phone screen, under the verdict', async () => {
    // docs/physics.md §2: a = (1750 − 1748)/60 rev/s = 2 rpm forward; §4: aliased, so §10's caution goes with it.
    const m = apparentMotion({ speedHz: 1750 / 60, symmetry: 6 }, 1748 / 60);
    expect(m.look).toBe('forward');
    expect(m.faithful).toBe(false);
    session = await openBrowser({ width: 390, height: 844 });
    const { page } = session;
    await openApp(page, inject('baseUrl'));
    await typeCreepCase(page);
    const verdict = page.getByTestId('verdict');
    await expect.poll(() => verdict.innerText()).toMatch(/^Creeping forward/);
    expect(await page.getByTestId('apparent-speed').innerText()).toBe('2 rpm forward');
    await toTop(page);

    const caution = page.getByTestId('safety-notice');
    await caution.waitFor();
    expect(await caution.innerText()).toMatch(/isolate and lock out the machine/);
    const panel = page.getByRole('region', { name: 'What you will see' });
    const v = (await panel.boundingBox())!;
    const c = (await caution.boundingBox())!;
    // Inside the 390 × 844 viewport without scrolling, and right under the verdict.
    expect(c.y).toBeGreaterThanOrEqual(0);
    expect(c.y + c.height).toBeLessThanOrEqual(844);
    expect(c.x).toBeGreaterThanOrEqual(0);
    expect(c.x + c.width).toBeLessThanOrEqual(390);
    expect(c.y).toBeGreaterThanOrEqual(v.y + v.height);
    expect(c.y - (v.y + v.height)).toBeLessThan(40);
  });

  test('a speed made invalid withdraws the verdict where it stands: "1750x", and "17OO" typed key by key', async () => {
    session = await openBrowser({ width: 390, height: 844 });
    const { page } = session;
    await openApp(page, inject('baseUrl'));
    await typeCreepCase(page);
    const verdict = page.getByTestId('verdict');
    await expect.poll(() => verdict.innerText()).toMatch(/^Creeping forward/);
    const panel = page.getByRole('region', { name: 'What you will see' });

    // One more key makes the speed unreadable: the verdict goes, in its place, naming the field.
    await page.getByLabel('Speed', { exact: true }).press('End');
    await page.getByLabel('Speed', { exact: true }).press('x');
    expect(await page.getByLabel('Speed', { exact: true }).inputValue()).toBe('1750x');
    await expect.poll(() => verdict.innerText()).toBe('No verdict until Speed is fixed');
    expect(await panel.innerText()).not.toMatch(/Creeping|1,750 rpm|true speed/i);
    expect(await page.getByTestId('apparent-speed').count()).toBe(0);
    // The verdict stays pinned in view while the field is being fixed.
    const v = (await panel.boundingBox())!;
    expect(v.y).toBeGreaterThanOrEqual(0);
    expect(v.y + v.height).toBeLessThanOrEqual(844);
    // Every list worked out from the speed is marked not current and cannot be tapped.
    const locks = page.locator('[data-current="false"]', { has: page.getByTestId('lock-list') });
    // Read as a person would, scrolled to: off screen the browser skips drawing the lists.
    await locks.scrollIntoViewIfNeeded();
    await expect
      .poll(() => locks.getByTestId('not-current').innerText())
      .toMatch(/^Not current: fix Speed/);
    expect(await locks.locator('[inert]').count()).toBe(1);
    await page.screenshot({ path: `${shots}/issue8-withdrawn-phone.png` });
    // "Fix Speed" takes the cursor to the field.
    await panel.getByRole('button', { name: 'Fix Speed' }).click();
    await expect.poll(() => page.evaluate(() => document.activeElement?.id)).toBe('speed');

    // The letter O for a zero, key by key: the keystroke before must not stand for the verdict.
    const field = page.getByLabel('Speed', { exact: true });
    await field.fill('');
    const seen: string[] = [];
    for (const key of ['1', '7', 'O', 'O']) {
      await field.press(key);
      const text = await field.inputValue();
      // Wait for the state this text must give: a verdict for a number, none for the letters.
      const want = /O/.test(text) ? /^No verdict until Speed is fixed$/ : /^(True motion|Looks)/;
      await expect.poll(() => verdict.innerText(), { message: text }).toMatch(want);
      seen.push(`${text}: ${await verdict.innerText()}`);
    }
    expect(seen.slice(2)).toEqual([
      '17O: No verdict until Speed is fixed',
      '17OO: No verdict until Speed is fixed',
    ]);
    expect(await panel.innerText()).not.toMatch(/17 rpm/);
    // Fixed: the verdict comes back for the speed now on screen.
    await typeInto(page, 'Speed', '1700');
    await expect.poll(() => verdict.innerText()).not.toMatch(/^No verdict/);
    expect(await page.getByTestId('true-speed').innerText()).toBe('1,700 rpm');
    expect(await page.getByTestId('not-current').count()).toBe(0);
  });

  for (const size of [
    { name: 'phone', width: 390, height: 844 },
    { name: 'desktop', width: 1280, height: 800 },
  ] as const) {
    for (const scheme of ['light', 'dark'] as const) {
      test(`screens that must never give a false all-clear at ${size.name} size in ${scheme}: creep, withdrawn verdict, camera plan, lighting`, async () => {
        mkdirSync(shots, { recursive: true });
        session = await openBrowser({
          width: size.width,
          height: size.height,
          colorScheme: scheme,
        });
        const { page } = session;
        const shot = (what: string) =>
          page.screenshot({ path: `${shots}/issue8-${what}-${size.name}-${scheme}.png` });
        await openApp(page, inject('baseUrl'));
        await typeCreepCase(page);
        await expect.poll(() => page.getByTestId('verdict').innerText()).toMatch(/^Creeping/);
        await toTop(page);
        await page.getByTestId('safety-notice').waitFor();
        await shot('check-creep');

        await typeInto(page, 'Speed', '1750x');
        await expect.poll(() => page.getByTestId('verdict').innerText()).toMatch(/^No verdict/);
        await toTop(page);
        await shot('check-withdrawn');
        await typeInto(page, 'Speed', '6000');
        await typeInto(page, 'Blades or marks', '2');
        await expect.poll(() => page.getByTestId('verdict').innerText()).not.toMatch(/^No/);

        // A propeller in the camera plan: blur and readout named.
        await page.getByRole('button', { name: 'Camera', exact: true }).click();
        await page.getByTestId('camera-screen').waitFor();
        await typeInto(page, 'Shutter speeds', '500 1000 2000 4000');
        await expect
          .poll(() => page.getByTestId('plan-blocked').innerText())
          .toMatch(/Rolling shutter: needs a readout of 5 ms or shorter/);
        await toTop(page);
        await shot('camera');

        // A PWM lamp in the lighting check.
        await page.getByRole('button', { name: 'Lighting', exact: true }).click();
        await page.getByTestId('lighting-screen').waitFor();
        await page.getByRole('radio', { name: 'PWM (on–off)' }).check();
        await expect.poll(() => page.getByTestId('light-wave').innerText()).toMatch(/^PWM/);
        await toTop(page);
        await shot('lighting');
        expect(
          await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth),
        ).toBeLessThanOrEqual(0);
      });
    }
  }
});
