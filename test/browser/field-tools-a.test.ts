// The speed finder and the whole-machine screens in a real Chromium at phone size (390 × 844):
// the usual strobe procedure step by step, a motor → belt → fan chain, typed garbage, and
// screenshots written to test-output/screenshots for a person to look at.
//
// The scenario is invented: the extract fan of kiln 3 at the (fictional) Harrowgate Tile Works,
// six blades on a belt from a 4-pole motor on 50 Hz mains.
import { afterEach, describe, expect, inject, test } from 'vitest';
import { mkdirSync } from 'node:fs';
import type { Page } from 'playwright-core';
import { beltSpeedHz, driveChain, freezeRates, motorSpeedHz } from '../../src/core';
import { formatNumber } from '../../src/words/format';
import { formatRate } from '../../src/words/rates';
import { freezeRateToSet } from '../../src/screens/whole-machine/band-lists';
import { openApp, openBrowser, printedHeaderLines, typeInto, type Session } from './browser';

let session: Session | undefined;

afterEach(async () => {
  await session?.close();
  session = undefined;
});

const shots = 'test-output/screenshots';
const GARBAGE = ['abc', '', 'NaN', '-Infinity', '1e999', '<b>1</b>', '1/0', '12abc', '--5'];

/** Visible text without what the user typed back in quotes. */
async function shownText(page: Page): Promise<string> {
  return (await page.locator('body').innerText()).replace(/"[^"]*"/g, '');
}

/** The whole page as phone-screen-high slices (name-1.png, name-2.png, …), each readable at full size. */
async function shootPage(page: Page, name: string): Promise<void> {
  const height = await page.evaluate(() => document.documentElement.scrollHeight);
  const viewport = page.viewportSize()!;
  for (let i = 0; i * viewport.height < height; i++) {
    const y = i * viewport.height;
    await page.screenshot({
      path: `${shots}/${name}-${i + 1}.png`,
      fullPage: true,
      clip: { x: 0, y, width: viewport.width, height: Math.min(viewport.height, height - y) },
    });
  }
}

/** The page as printed: the report header names the tool and machine and carries the cautions; no buttons. */
async function checkPrinted(
  page: Page,
  title: string,
  machine: string | null,
  name: string,
): Promise<void> {
  await page.emulateMedia({ media: 'print' });
  const header = page.locator('header[data-print="only"]');
  expect(await header.isVisible()).toBe(true);
  const text = await header.innerText();
  expect(text).toContain(`Trueturn · ${title}`);
  if (machine) expect((await printedHeaderLines(page)).Machine).toBe(machine);
  expect(text).toMatch(/Printed /);
  expect(text).toMatch(/still turning at full speed/);
  expect(text).toMatch(/Flashing between about 3 and 60 times a second/);
  expect(await page.getByRole('button', { name: 'Print report' }).isVisible()).toBe(false);
  await shootPage(page, name);
  await page.emulateMedia({ media: 'screen' });
}

async function noSidewaysScroll(page: Page): Promise<number> {
  return page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
}

/**
 * Types each garbage text into the field: a message beside it, nothing reads NaN. `unchanged`
 * keeps its text; with `withdrawn`, the screen's answer is withdrawn and `unchanged` says it is
 * not current while the text is refused (docs/physics.md §10), and both come back as they were once
 * the good text is back.
 */
async function refusesGarbage(
  page: Page,
  field: ReturnType<Page['getByLabel']>,
  unchanged: ReturnType<Page['getByTestId']>,
  withdrawn = false,
) {
  const good = await field.inputValue();
  const before = await unchanged.innerText();
  for (const text of GARBAGE) {
    await field.fill(text);
    expect(await field.getAttribute('aria-invalid'), `"${text}"`).toBe('true');
    const messageId = (await field.getAttribute('aria-describedby'))!.split(' ')[0];
    expect(
      (await page.locator(`[id="${messageId}"]`).innerText()).length,
      `"${text}"`,
    ).toBeGreaterThan(5);
    if (withdrawn) {
      await expect
        .poll(() => page.getByTestId('withdrawn').innerText(), { message: `"${text}"` })
        .toMatch(/^No answer until /);
      // Hidden behind the withdrawn answer, in results marked not current, or saying so itself.
      expect(
        await unchanged.evaluate(
          (e) =>
            e.closest('[hidden]') !== null ||
            e.closest('[data-current="false"]') !== null ||
            /^Not current: fix /.test(e.textContent ?? ''),
        ),
        `"${text}"`,
      ).toBe(true);
    } else {
      expect(await unchanged.innerText(), `"${text}"`).toBe(before);
    }
    expect(await shownText(page), `"${text}"`).not.toMatch(/NaN|Infinity/);
  }
  await field.fill(good);
  expect(await field.getAttribute('aria-invalid')).toBeNull();
  await expect.poll(() => unchanged.innerText()).toBe(before);
}

describe('the speed finder at phone size', () => {
  test('walks start high → first single image at 1780 fpm → two images at 3560 fpm → speed saved to a new machine', async () => {
    mkdirSync(shots, { recursive: true });
    session = await openBrowser({ width: 390, height: 844 });
    const { page } = session;
    await openApp(page, inject('baseUrl'));
    await page.getByRole('button', { name: 'Speed finder' }).click();
    const instruction = page.getByTestId('finder-instruction');

    // Before any reading: start at the top of the strobe's range (12,000 fpm by default).
    await expect
      .poll(() => instruction.innerText())
      .toMatch(/^Set the strobe to 12000 flashes\/min/);
    expect(await page.getByTestId('safety-notice').isVisible()).toBe(true);
    expect(await page.getByTestId('photosensitivity-notice').isVisible()).toBe(true);
    await page.screenshot({ path: `${shots}/speed-finder-start-phone.png` });

    // Six blades (the Check screen's default fan has six).
    expect(await page.getByLabel('Blades or marks on the part').inputValue()).toBe('6');

    // Coming down from 12,000 fpm, the first single image stands at 1780 fpm. The count seen is
    // always chosen by the technician (docs/physics.md §7: never filled in from a prediction).
    await typeInto(page, 'Rate where it stood still', '1780');
    expect(await page.getByLabel('Images standing still', { exact: true }).inputValue()).toBe('');
    await page.getByLabel('Images standing still', { exact: true }).selectOption('1');
    await page.getByRole('button', { name: 'Add reading' }).click();
    await expect
      .poll(() => instruction.innerText())
      .toMatch(/^Now set 3560 flashes\/min \(twice the single-image rate 1780/);
    expect(await page.getByTestId('finder-rate').innerText()).toBe('3,560 fpm');
    // 1780 fpm / 6 blades = 296.7 rpm, the likeliest; faster speeds would have stood still higher up.
    const table = page.getByTestId('candidate-table');
    expect(await table.locator('tbody tr').first().innerText()).toMatch(
      /296\.7 rpm[\s\S]*Likeliest[\s\S]*2 images stand still/,
    );
    await shootPage(page, 'speed-finder-confirm-phone');

    // Garbage in the next reading's rate adds nothing and says why.
    await typeInto(page, 'Rate where it stood still', 'fast');
    await page.getByRole('button', { name: 'Add reading' }).click();
    expect(await page.getByTestId('reading-refused').isVisible()).toBe(true);
    expect(await page.getByTestId('reading-list').locator('li').count()).toBe(1);
    // Garbage in a recorded reading withdraws the step until it is fixed (docs/physics.md §10); then it is back as it was.
    await refusesGarbage(
      page,
      page.getByLabel('Reading 1: rate', { exact: true }),
      page.getByTestId('finder-instruction'),
      true,
    );

    // The proposed rate goes to the Check screen's strobe.
    await page.getByRole('button', { name: /^Use 3,560 fpm on the Check screen's strobe/ }).click();
    await expect
      .poll(() => page.getByRole('status').filter({ hasText: 'now flashes at 3,560 fpm' }).count())
      .toBe(1);

    // At 3560 fpm the technician sees two images standing still: confirmed.
    await typeInto(page, 'Rate where it stood still', '3560');
    await page.getByLabel('Images standing still', { exact: true }).selectOption('2');
    await page.getByRole('button', { name: 'Add reading' }).click();
    await expect
      .poll(() => instruction.innerText())
      .toMatch(
        /^The part turns at 297 rpm \(single image at 1780 flashes\/min, confirmed by the two images\)/,
      );
    expect(await page.getByTestId('found-speed').innerText()).toBe(`${formatNumber(1780 / 6)} rpm`);

    // An expected range typed as garbage is refused beside its field.
    await page.getByRole('radio', { name: 'A range in rpm' }).check();
    await refusesGarbage(
      page,
      page.getByLabel('From', { exact: true }),
      page.getByTestId('finder-instruction'),
      true,
    );
    await page.getByRole('radio', { name: 'Not known' }).check();

    // Saved to a new machine, in words.
    await page.getByLabel("New machine's name").fill('Extract fan, kiln 3');
    await page.getByRole('button', { name: 'Save speed to a new machine' }).click();
    const outcome = page.getByTestId('save-outcome');
    await expect
      .poll(() => outcome.innerText())
      .toMatch(/Fan: speed 1,770 rpm → 296\.7 rpm\.[\s\S]*Saved to "Extract fan, kiln 3"\./);
    expect(await shownText(page)).not.toMatch(/NaN|Infinity/);
    expect(await noSidewaysScroll(page)).toBeLessThanOrEqual(0);
    await shootPage(page, 'speed-finder-done-phone');
    await checkPrinted(page, 'Speed finder', 'Extract fan, kiln 3', 'speed-finder-print');
    // On a desktop: entries on the left, the step and results on the right, nothing sideways.
    await page.setViewportSize({ width: 1280, height: 800 });
    expect(await noSidewaysScroll(page)).toBeLessThanOrEqual(0);
    await page.screenshot({ path: `${shots}/speed-finder-desktop.png` });
    await page.setViewportSize({ width: 390, height: 844 });

    // The Check screen now shows the speed found.
    await page.getByRole('button', { name: 'Check', exact: true }).click();
    await expect.poll(() => page.getByTestId('true-speed').innerText()).toBe('296.7 rpm');
  });
});

describe('the whole machine at phone size', () => {
  test('a motor drives a 6-blade fan by a belt: speeds carried along, freeze bands tapped onto the Check screen', async () => {
    mkdirSync(shots, { recursive: true });
    session = await openBrowser({ width: 390, height: 844 });
    const { page } = session;
    await openApp(page, inject('baseUrl'));
    await page.getByRole('button', { name: 'Whole machine' }).click();
    const first = page.getByTestId('chain-part-0');

    // Part 1: the motor, 4 poles on 50 Hz at 3 % slip (the set-up's motor defaults), one key mark.
    await first.getByLabel('Name', { exact: true }).fill('Motor');
    await typeInto(page, 'Blades or marks', '1');
    await first.getByRole('radio', { name: 'Motor' }).check();
    const motorRpm = motorSpeedHz(50, 4, 0.03) * 60;
    await expect
      .poll(() => page.getByTestId('chain-speed-0').innerText())
      .toMatch(new RegExp(`^${formatNumber(motorRpm)} rpm`));

    // Part 2: the fan on a 100 mm → 250 mm belt.
    await page.getByRole('button', { name: 'Add part' }).click();
    const second = page.getByTestId('chain-part-1');
    await second.getByLabel('Name', { exact: true }).fill('Fan');
    await second.getByLabel('Blades or marks', { exact: true }).fill('6');
    await second.getByRole('radio', { name: 'Belt' }).check();
    await second.getByLabel('Driver pulley', { exact: true }).fill('100');
    await second.getByLabel('Driven pulley', { exact: true }).fill('250');
    const fanHz = beltSpeedHz(motorSpeedHz(50, 4, 0.03), 0.1, 0.25);
    const speeds = page.getByTestId('chain-speed-1');
    await expect
      .poll(() => speeds.innerText())
      .toMatch(new RegExp(`^${formatNumber(fanHz * 60)} rpm ± 1 %`));

    // Garbage in a pulley leaves the fan's speed as it was.
    await refusesGarbage(page, second.getByLabel('Driver pulley', { exact: true }), speeds, true);

    // Freeze the fan while the motor's mark does not stand still.
    await page.getByLabel('Part to freeze').selectOption('1');
    const freeze = page.getByTestId('freeze-table');
    await freeze.waitFor();
    const parts = driveChain({
      root: { kind: 'fixed', speedHz: motorSpeedHz(50, 4, 0.03), tolerance: 0.01 },
      parts: [
        { name: 'Motor', symmetry: 1 },
        {
          name: 'Fan',
          symmetry: 6,
          link: { kind: 'belt', driverDiameterM: 0.1, drivenDiameterM: 0.25 },
        },
      ],
    });
    const bands = freezeRates(parts, 1, { minHz: 0.5, maxHz: 200 });
    expect(bands.length).toBeGreaterThan(0);
    const top = bands.reduce((a, b) => (b.fromHz > a.fromHz ? b : a));
    const firstRow = freeze.locator('tbody tr').first();
    expect(await firstRow.innerText()).toContain('one pitch between flashes');
    expect(await firstRow.getByRole('button').innerText()).toBe(
      formatRate(freezeRateToSet(top), 'strobe', 'fpm'),
    );
    await firstRow.getByRole('button').click();
    await expect
      .poll(() => page.getByTestId('chain-applied').innerText())
      .toMatch(/^The Check screen now uses/);
    expect(await page.getByTestId('chain-speed-table').innerText()).toMatch(
      /Fan[\s\S]*Looks still/,
    );

    // The rate map draws every part (once it comes near the screen).
    await page.getByTestId('rate-map').scrollIntoViewIfNeeded();
    await page.getByTestId('rate-map').locator('canvas').first().waitFor();
    expect(await page.locator('[id="chain-map-title"]').isVisible()).toBe(true);
    expect(await shownText(page)).not.toMatch(/NaN|Infinity/);
    expect(await noSidewaysScroll(page)).toBeLessThanOrEqual(0);
    await shootPage(page, 'whole-machine-phone');
    await checkPrinted(page, 'Whole machine', null, 'whole-machine-print');
    await page.setViewportSize({ width: 1280, height: 800 });
    expect(await noSidewaysScroll(page)).toBeLessThanOrEqual(0);
    await page.screenshot({ path: `${shots}/whole-machine-desktop.png` });
    await page.setViewportSize({ width: 390, height: 844 });

    // The Check screen shows the fan (the part chosen) at the chain's speed, standing still.
    await page.getByRole('button', { name: 'Check', exact: true }).click();
    await expect.poll(() => page.getByTestId('verdict').innerText()).toMatch(/^Looks still/);
    expect(await page.getByTestId('true-speed').innerText()).toBe(
      `${formatNumber(fanHz * 60)} rpm`,
    );
  });
});
