// The main flow in a real Chromium against the built app: what the screen shows must be what
// the core computes, formatted the way the screen formats it.
import { afterEach, describe, expect, inject, test } from 'vitest';
import { mkdirSync } from 'node:fs';
import {
  apparentMotion,
  blurDegrees,
  blurPitches,
  exposureFromShutterAngle,
  flickerRisk,
  rollingSkewDegrees,
} from '../../src/core';
import { formatNumber, formatRpmWithDirection } from '../../src/words/format';
import { openApp, openBrowser, typeInto, type Session, wholePageScreenshot } from './browser';

let session: Session | undefined;

afterEach(async () => {
  await session?.close();
  session = undefined;
});

const shots = 'test-output/screenshots';

describe('the main flow', () => {
  test('typed values give the verdict and speeds the core computes', async () => {
    session = await openBrowser();
    const { page } = session;
    const requests: string[] = [];
    page.on('request', (r) => requests.push(r.url()));
    await openApp(page, inject('baseUrl'));
    const verdict = page.getByTestId('verdict');

    // Default: a 6-blade fan at 1770 rpm under 1770 fpm: one image per pitch, standing still.
    await expect.poll(() => verdict.innerText()).toMatch(/^Looks still/);
    await expect.poll(() => page.getByTestId('safety-notice').isVisible()).toBe(true);

    // Wikipedia, "Stroboscopic effect": a disc at 60 rev/s lit at 61 flashes/s seems to turn backwards at 1 rev/s.
    await typeInto(page, 'Speed', '3600');
    await typeInto(page, 'Blades or marks', '1');
    await typeInto(page, 'Flash rate', '3660');
    const m = apparentMotion({ speedHz: 60, symmetry: 1 }, 61);
    expect(m.look).toBe('backward');
    await expect.poll(() => verdict.innerText()).toMatch(/^Turning backward/);
    expect(await page.getByTestId('apparent-speed').innerText()).toBe(
      formatRpmWithDirection(m.apparentHz * 60, 1),
    );
    expect(await page.getByTestId('true-speed').innerText()).toBe('3,600 rpm');

    // ... and at 59 flashes/s forwards at 1 rev/s.
    await typeInto(page, 'Flash rate', '3540');
    await expect.poll(() => verdict.innerText()).toMatch(/^Creeping forward/);
    expect(await page.getByTestId('apparent-speed').innerText()).toBe('60 rpm forward');
    // docs/physics.md §4: a creep forward is an aliased view too; the lock-out caution goes with it.
    expect(await page.getByTestId('safety-notice').isVisible()).toBe(true);
    expect(await page.getByTestId('photosensitivity-notice').isVisible()).toBe(true);

    // Tapping the single-image lock-in rate freezes it.
    await page
      .getByTestId('lock-list')
      .getByRole('button', { name: /^3,600 fpm 1 image/ })
      .click();
    await expect.poll(() => verdict.innerText()).toMatch(/^Looks still/);
    await expect
      .poll(() => page.getByLabel('Flash rate', { exact: true }).inputValue())
      .toBe('3600');
    expect(await page.getByTestId('safety-notice').isVisible()).toBe(true);

    // Nothing leaves the origin: no web fonts, analytics or CDNs.
    const origin = new URL(inject('baseUrl')).origin;
    expect(requests.length).toBeGreaterThan(2);
    expect(
      requests.filter(
        (u) => !u.startsWith(origin) && !u.startsWith('data:') && !u.startsWith('blob:'),
      ),
    ).toEqual([]);
  });

  test('printed, the check keeps its rates to try and its bands as text, and drops its controls', async () => {
    session = await openBrowser();
    const { page } = session;
    await openApp(page, inject('baseUrl'));
    // The default fan: 6 blades at 1770 rpm under 1770 fpm.
    const locks = page.getByTestId('lock-list');
    const bands = page.getByTestId('safe-bands');
    // Off-screen result panels are skipped by the browser until near the screen: look at them.
    await locks.scrollIntoViewIfNeeded();
    await expect.poll(() => locks.innerText()).toMatch(/1,770 fpm/);
    const onScreen = { locks: await locks.innerText(), bands: await bands.innerText() };
    // The first visit ends with the notice that the app now works with no network.
    const notice = page.getByTestId('update-notice');
    await expect.poll(() => notice.isVisible(), { timeout: 20_000 }).toBe(true);
    expect(onScreen.bands).toMatch(/fpm/);
    await page.emulateMedia({ media: 'print' });
    // The rates are buttons on screen (a tap sets the rate); on paper they are the text they show.
    expect(await locks.innerText()).toBe(onScreen.locks);
    expect(await bands.innerText()).toBe(onScreen.bands);
    expect(await locks.getByRole('button').first().isVisible()).toBe(true);
    // The controls are not printed.
    expect(await page.getByRole('button', { name: 'Print report' }).isVisible()).toBe(false);
    expect(await page.getByRole('navigation').first().isVisible()).toBe(false);
    // Nor the notice that floats at the foot of the window: it would stand over every page.
    expect(await notice.isVisible()).toBe(false);
    await page.emulateMedia({ media: 'screen' });
  });

  test('each keystroke updates the verdict within the same frame or the next', async () => {
    session = await openBrowser();
    const { page } = session;
    await openApp(page, inject('baseUrl'));
    const typed = ['1', '17', '177', '1771', '1769', '17690', '176900'];
    const { shown, frameMs } = await page.evaluate(async (texts) => {
      const input = document.getElementById('speed') as HTMLInputElement;
      const trueSpeed = document.querySelector('[data-testid="true-speed"]')!;
      const seen: string[] = [];
      const times: number[] = [];
      for (const text of texts) {
        const start = performance.now();
        input.value = text;
        input.dispatchEvent(new Event('input', { bubbles: true }));
        await new Promise((r) => requestAnimationFrame(() => r(null)));
        times.push(performance.now() - start);
        seen.push(trueSpeed.textContent ?? '');
      }
      return { shown: seen, frameMs: times };
    }, typed);
    // The requirement: by the next animation frame after each keystroke the new value is on
    // screen, so nothing debounces or defers the result. How long that frame took depends on the
    // machine (speed is measured in `npm run bench`, not asserted); the figure is printed.
    expect(shown).toEqual(typed.map((t) => `${Number(t).toLocaleString('en-US')} rpm`));
    console.log(`keystroke-to-screen frames: ${frameMs.map((ms) => ms.toFixed(1)).join(', ')} ms`);
  });

  test('a camera shows blur and rolling-shutter bend as the core computes them', async () => {
    session = await openBrowser();
    const { page } = session;
    await openApp(page, inject('baseUrl'));
    await page.getByRole('radio', { name: 'Camera' }).check();
    await page.getByLabel('Frame rate preset').selectOption({ label: '25' });
    await typeInto(page, 'Shutter angle', '90');
    await typeInto(page, 'Rolling readout time', '30');
    const f = 1770 / 60;
    const t = exposureFromShutterAngle(90, 25);
    // Read as a person would, scrolled to: off screen the browser skips drawing the read-out.
    await page.getByTestId('blur').scrollIntoViewIfNeeded();
    await expect
      .poll(() => page.getByTestId('blur').innerText())
      .toBe(
        `${formatNumber(blurDegrees(f, t))}° of turn, ${formatNumber(blurPitches(f, 6, t))} pitches`,
      );
    await expect
      .poll(() => page.getByTestId('skew').innerText())
      .toBe(
        `${formatNumber(rollingSkewDegrees(f, 0.03))}° top to bottom, ${formatNumber((rollingSkewDegrees(f, 0.03) * 6) / 360)} pitches`,
      );
    // A camera's frames are not flashes: no photosensitivity caution (once the screen has stood
    // still: a caution leaves only when typing pauses).
    await expect
      .poll(() => page.getByTestId('photosensitivity-notice').count(), { timeout: 10_000 })
      .toBe(0);
    mkdirSync(shots, { recursive: true });
    await wholePageScreenshot(page, `${shots}/check-phone-camera-full.png`);
  });

  test('lighting shows the flicker risk class the core gives', async () => {
    session = await openBrowser({ width: 1280, height: 800 });
    const { page } = session;
    await openApp(page, inject('baseUrl'));
    await page.getByRole('radio', { name: 'Lighting' }).check();
    await page.getByRole('radio', { name: '60 Hz' }).check();
    await typeInto(page, 'Modulation (percent flicker)', '8');
    // IEEE Std 1789-2015 at 120 Hz: no-effect line 0.0333·120 = 4 %, low-risk line 0.08·120 = 9.6 %.
    expect(flickerRisk(120, 8)).toBe('low-risk');
    await expect
      .poll(() => page.getByTestId('flicker-risk').innerText())
      .toBe('Between the no-effect and low-risk lines');
    mkdirSync(shots, { recursive: true });
    await wholePageScreenshot(page, `${shots}/check-desktop-lighting-full.png`);
  });
});
