// The rate map and the preview on the check screen, in a real Chromium against the built app:
// a tap or a drag on the map sets the rate the axis says, the rate field and the verdict follow
// and agree with the core; the preview draws, pauses and steps.
import { afterEach, describe, expect, inject, test } from 'vitest';
import { mkdirSync } from 'node:fs';
import type { Locator, Page } from 'playwright-core';
import { apparentMotion, lockRates, type Part, type Range } from '../../src/core';
import { formatRpmWithDirection } from '../../src/words/format';
import {
  openApp,
  openBrowser,
  typeInto,
  type Session,
  SIZES,
  wholePageScreenshot,
} from './browser';

let session: Session | undefined;

afterEach(async () => {
  await session?.close();
  session = undefined;
});

const shots = 'test-output/screenshots';

// A fictional test rig: one white mark on a shaft at 600 rpm (10 rev/s), ±1 % (the default
// tolerance), under a strobe that runs from 30 to 12,000 flashes a minute (the default range).
const mark: Required<Part> = { speedHz: 10, symmetry: 1, tolerance: 0.01 };
const strobeRange: Range = { minHz: 30 / 60, maxHz: 12000 / 60 };
/** A tap this close to a lock marker takes the lock's rate (src/ui/rate-map/chart.ts). */
const SNAP_PX = 6;

/**
 * The plot area once the chart on it is drawn on `axis` for the test rig's mark (the widget
 * marks its plot box with what the chart shows: src/ui/rate-map). uPlot's overlay takes the
 * taps and spans exactly the plotted rates. The chart is drawn after the page paints, so every
 * measurement and tap goes through this locator, which waits for that drawing.
 */
function plot(page: Page, axis: 'log' | 'linear'): Locator {
  return page
    .getByTestId('rate-map')
    .locator(`[data-axis="${axis}"][data-parts^="${mark.speedHz}/${mark.symmetry}/"] .u-over`);
}

/** The plot area's size in CSS pixels, once drawn on `axis`. */
async function plotSize(
  page: Page,
  axis: 'log' | 'linear',
): Promise<{ width: number; height: number }> {
  const area = plot(page, axis);
  await area.waitFor();
  await area.scrollIntoViewIfNeeded();
  const box = await area.boundingBox();
  if (!box) throw new Error('the rate map has no plot area');
  return { width: box.width, height: box.height };
}

/** Taps the plot `x` CSS pixels from its left edge, halfway up (Playwright waits until it can). */
function tapAt(page: Page, axis: 'log' | 'linear', x: number, height: number): Promise<void> {
  return plot(page, axis).click({ position: { x, y: height / 2 } });
}

/** The rate at `x` CSS pixels from the plot's left edge, as the axis maps it. */
function rateAtX(x: number, width: number, range: Range, log: boolean): number {
  const share = x / width;
  return log
    ? range.minHz * Math.pow(range.maxHz / range.minHz, share)
    : range.minHz + share * (range.maxHz - range.minHz);
}

function xOfRate(rateHz: number, width: number, range: Range, log: boolean): number {
  const share = log
    ? Math.log(rateHz / range.minHz) / Math.log(range.maxHz / range.minHz)
    : (rateHz - range.minHz) / (range.maxHz - range.minHz);
  return share * width;
}

/**
 * Every lock-in rate the map can mark for the part (all image counts the map shows under a
 * flash, up to 8): a superset of its markers, so a tap far from all of them cannot snap.
 */
const allLocks = lockRates(mark, strobeRange, { maxImages: 8 });

/** The first x from `fromShare` of the width on that is at least `gap` px from every lock. */
function clearX(width: number, log: boolean, fromShare: number, gap: number): number {
  const lockXs = allLocks.map((l) => xOfRate(l.rateHz, width, strobeRange, log));
  for (let x = Math.round(width * fromShare); x < width - 2; x++) {
    if (lockXs.every((lx) => Math.abs(lx - x) >= gap)) return x;
  }
  throw new Error('no spot on the axis is clear of lock markers');
}

/** The rate the map holds now, exactly (the slider's value, in flashes per minute). */
async function mapRateHz(page: Page): Promise<number> {
  return Number(await page.getByTestId('rate-map').getAttribute('aria-valuenow')) / 60;
}

async function fieldRateHz(page: Page): Promise<number> {
  return Number(await page.getByLabel('Flash rate', { exact: true }).inputValue()) / 60;
}

/** The headline the screen gives for what the core says the viewer sees (src/state/check.ts words). */
function headlineFor(rateHz: number): RegExp {
  const m = apparentMotion(mark, rateHz);
  if (m.look === 'true') return /^True motion/;
  if (m.look === 'still')
    return m.images > 1 ? new RegExp(`^${m.images} images, standing still`) : /^Looks still/;
  if (m.look === 'unclear') return /direction unclear/i;
  return m.look === 'backward' ? /turning backward/i : /forward/i;
}

/** The verdict and the apparent speed on screen agree with apparentMotion at the map's rate. */
async function expectVerdictAgrees(page: Page): Promise<void> {
  const rateHz = await mapRateHz(page);
  expect(await page.getByTestId('verdict').innerText()).toMatch(headlineFor(rateHz));
  const m = apparentMotion(mark, rateHz);
  if (m.look !== 'unclear') {
    const apparentRpm = (m.images > 1 ? m.driftHz : m.apparentHz) * 60;
    expect(await page.getByTestId('apparent-speed').innerText()).toBe(
      formatRpmWithDirection(apparentRpm, 1),
    );
  }
}

/**
 * The rate field and the map hold the rate under `x`, to within half a pixel of the axis (a
 * pointer lands on fractions of a pixel; the field shows seven significant figures).
 */
async function expectRateNear(page: Page, x: number, width: number, log: boolean): Promise<void> {
  const want = rateAtX(x, width, strobeRange, log);
  const halfPixel = Math.abs(rateAtX(x + 0.5, width, strobeRange, log) - want);
  await expect
    .poll(async () => Math.abs((await fieldRateHz(page)) - want))
    .toBeLessThanOrEqual(halfPixel);
  // The map follows the entries a paint or two later (src/state/check/listed.ts).
  await expect
    .poll(async () => Math.abs((await mapRateHz(page)) - want))
    .toBeLessThanOrEqual(halfPixel);
  // The field shows the rate the set-up holds, to the field's seven significant figures.
  expect(Math.abs((await fieldRateHz(page)) - (await mapRateHz(page)))).toBeLessThanOrEqual(
    (await mapRateHz(page)) * 1e-6,
  );
}

/** Opens the check screen on the test rig and returns the drawn plot's size (log axis). */
async function openRig(page: Page): Promise<{ width: number; height: number }> {
  await openApp(page, inject('baseUrl'));
  await typeInto(page, 'Speed', '600');
  await typeInto(page, 'Blades or marks', '1');
  return plotSize(page, 'log');
}

/** A 32-bit checksum of a canvas's pixels, read in the page. */
function canvasChecksum(page: Page, testId: string): Promise<number> {
  return page.evaluate((id) => {
    const canvas = document.querySelector(`[data-testid="${id}"]`) as HTMLCanvasElement;
    const data = canvas.getContext('2d')!.getImageData(0, 0, canvas.width, canvas.height).data;
    let sum = 0;
    for (let i = 0; i < data.length; i++) sum = (Math.imul(sum, 31) + data[i]) | 0;
    return sum;
  }, testId);
}

/** Lets the page run a few animation frames. */
function frames(page: Page, count: number): Promise<void> {
  return page.evaluate(
    (n) =>
      new Promise<void>((done) => {
        let left = n;
        const next = () => (--left <= 0 ? done() : requestAnimationFrame(next));
        requestAnimationFrame(next);
      }),
    count,
  );
}

describe('the rate map on the check screen', () => {
  test('a tap sets the rate under it; the rate field and the verdict follow and agree with the core', async () => {
    session = await openBrowser({ width: 1280, height: 800 });
    const { page } = session;
    const box = await openRig(page);
    // 30 to 12,000 fpm is a 400:1 range: the map starts on a logarithmic axis.
    expect(await page.getByLabel('Logarithmic rate axis').isChecked()).toBe(true);

    const x = clearX(box.width, true, 0.62, SNAP_PX + 2);
    await tapAt(page, 'log', x, box.height);
    await expectRateNear(page, x, box.width, true);
    await expectVerdictAgrees(page);
  });

  test('a tap beside a lock marker takes the exact lock-in rate: one still image at 600 fpm', async () => {
    session = await openBrowser({ width: 1280, height: 800 });
    const { page } = session;
    const box = await openRig(page);
    const lockX = xOfRate(10, box.width, strobeRange, true);
    const tapX = lockX + 3;
    // The 10 Hz lock must be the nearest marker to the tap for the snap to pick it.
    const nearest = [...allLocks].sort(
      (a, b) =>
        Math.abs(xOfRate(a.rateHz, box.width, strobeRange, true) - tapX) -
        Math.abs(xOfRate(b.rateHz, box.width, strobeRange, true) - tapX),
    )[0];
    expect(nearest.rateHz).toBe(10);
    await tapAt(page, 'log', tapX, box.height);
    await expect
      .poll(() => page.getByLabel('Flash rate', { exact: true }).inputValue())
      .toBe('600');
    await expect.poll(() => mapRateHz(page)).toBeCloseTo(10, 12);
    // docs/physics.md §3: one flash per turn freezes a single mark.
    expect(apparentMotion(mark, 10).look).toBe('still');
    expect(await page.getByTestId('verdict').innerText()).toMatch(/^Looks still/);
    expect(await page.getByTestId('safety-notice').isVisible()).toBe(true);
  });

  test('a drag follows the pointer, and the linear axis maps taps evenly', async () => {
    session = await openBrowser({ width: 1280, height: 800 });
    const { page } = session;
    const box = await openRig(page);

    const from = clearX(box.width, true, 0.3, SNAP_PX + 2);
    const to = clearX(box.width, true, 0.8, 1);
    await plot(page, 'log').hover({ position: { x: from, y: box.height / 2 } });
    // Hovering scrolled the plot into view: the drag's end is measured from where it is now.
    const at = await plot(page, 'log').boundingBox();
    if (!at) throw new Error('the rate map has no plot area');
    await page.mouse.down();
    await page.mouse.move(at.x + to, at.y + box.height / 2, { steps: 8 });
    await page.mouse.up();
    await expectRateNear(page, to, box.width, true);
    await expectVerdictAgrees(page);

    await page.getByLabel('Logarithmic rate axis').uncheck();
    // The chart is rebuilt on the new axis; its plot is measured once that one is drawn.
    const linear = await plotSize(page, 'linear');
    const x = clearX(linear.width, false, 0.5, SNAP_PX + 2);
    await tapAt(page, 'linear', x, linear.height);
    await expectRateNear(page, x, linear.width, false);
    await expectVerdictAgrees(page);
    // Halfway across a linear axis is halfway through the range, about 6,000 fpm, not the
    // geometric middle a log axis puts there (about 600 fpm).
    expect(Math.abs((await mapRateHz(page)) * 60 - 6015)).toBeLessThan(0.1 * 6015);
  });
});

describe('the preview on the check screen', () => {
  test('draws while playing, holds still when paused, and steps one flash at a time', async () => {
    session = await openBrowser({ width: 1280, height: 800 });
    const { page } = session;
    await openApp(page, inject('baseUrl'));
    // Wikipedia, "Stroboscopic effect": a disc at 60 rev/s lit at 59 flashes/s seems to turn
    // forwards at 1 rev/s: the sampled view moves on every display frame.
    await typeInto(page, 'Speed', '3600');
    await typeInto(page, 'Blades or marks', '1');
    await typeInto(page, 'Flash rate', '3540');
    const preview = page.locator('section[aria-label="Preview of the turning part"]');
    await preview.waitFor();
    await preview.scrollIntoViewIfNeeded();
    // The default strobe flashes 29.5 times a second, so the preview opened paused (docs/physics.md §10).
    await preview.getByRole('button', { name: 'Play' }).click();
    await expect
      .poll(() => preview.getByRole('button', { name: 'Pause' }).getAttribute('aria-pressed'))
      .toBe('true');
    // Played in real time it flashes 59 times a second on the screen: its own caution shows.
    expect(await preview.getByText(/photosensitive epilepsy/).isVisible()).toBe(true);

    const first = await canvasChecksum(page, 'preview-sampled');
    await frames(page, 4);
    const second = await canvasChecksum(page, 'preview-sampled');
    expect(second).not.toBe(first);

    await preview.getByRole('button', { name: 'Pause' }).click();
    await frames(page, 2);
    const paused = await canvasChecksum(page, 'preview-sampled');
    await frames(page, 4);
    expect(await canvasChecksum(page, 'preview-sampled')).toBe(paused);

    const counter = preview.getByTestId('preview-counter');
    const countOf = async () =>
      Number(/^Flash ([\d,]+)/.exec(await counter.innerText())![1].replace(/,/g, ''));
    const before = await countOf();
    await preview.getByRole('button', { name: 'Next flash' }).click();
    await expect.poll(countOf).toBe(before + 1);
    // The time shown is the flash's own: count ÷ 59 flashes a second.
    expect(await counter.innerText()).toMatch(
      new RegExp(`· ${((before + 1) / 59).toFixed(3).replace(/0+$/, '').replace(/\.$/, '')} s`),
    );
    expect(await canvasChecksum(page, 'preview-sampled')).not.toBe(paused);
  });
});

describe('screenshots of the check screen with the preview and the rate map', () => {
  for (const size of SIZES) {
    for (const scheme of ['light', 'dark'] as const) {
      test(`the ${size.name} layout in ${scheme} fits the width; written to ${shots}/check-with-views-${size.name}-${scheme}*.png`, async () => {
        mkdirSync(shots, { recursive: true });
        session = await openBrowser({
          width: size.width,
          height: size.height,
          colorScheme: scheme,
        });
        const { page } = session;
        await openApp(page, inject('baseUrl'));
        // The map draws once it comes near the screen: below the fold on a phone.
        await page.getByTestId('rate-map').scrollIntoViewIfNeeded();
        await page.getByTestId('rate-map').locator('canvas').waitFor();
        await page.getByTestId('preview-sampled').waitFor();
        await frames(page, 2);
        const overflow = await page.evaluate(
          () => document.documentElement.scrollWidth - window.innerWidth,
        );
        expect(overflow).toBeLessThanOrEqual(0);
        await wholePageScreenshot(page, `${shots}/check-with-views-${size.name}-${scheme}.png`);
        // Each widget as it looks on screen, scrolled to the middle, clear of the pinned verdict.
        for (const [name, id] of [
          ['map', 'rate-map-title'],
          ['preview', 'preview-title'],
        ] as const) {
          const panel = page.locator(`section[aria-labelledby="${id}"]`);
          await panel.evaluate((e) => e.scrollIntoView({ block: 'center' }));
          await frames(page, 2);
          await page.screenshot({
            path: `${shots}/check-with-views-${size.name}-${scheme}-${name}.png`,
          });
        }
        // The sampled view is drawn: not one flat colour.
        const distinct = await page.evaluate(() => {
          const canvas = document.querySelector(
            '[data-testid="preview-sampled"]',
          ) as HTMLCanvasElement;
          const data = canvas
            .getContext('2d')!
            .getImageData(0, 0, canvas.width, canvas.height).data;
          const seen = new Set<number>();
          for (let i = 0; i < data.length; i += 4)
            seen.add((data[i] << 16) | (data[i + 1] << 8) | data[i + 2]);
          return seen.size;
        });
        expect(distinct).toBeGreaterThan(2);
      });
    }
  }
});
