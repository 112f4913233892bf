// The lighting check, camera plan and data logger screens in a real Chromium at phone size,
// against the built app: what the screens show must be what the core computes; typed garbage
// gets a message and loses nothing; the table saves as CSV; the printed page carries the
// machine, the date and the cautions. Screenshots go to test-output/screenshots/.
import { afterEach, describe, expect, inject, test } from 'vitest';
import type { Page } from 'playwright-core';
import { mkdirSync, readFileSync } from 'node:fs';
import { cameraPlan, lightingCheck, loggerPlan, lockRates } from '../../src/core';
import { formatPrecise, numberForField, preciseNumber } from '../../src/words/format';
import { safetyCautions } from '../../src/words/cautions';
import { lookWords } from '../../src/words/look';
import { lightingSummary } from '../../src/words/lighting';
import { ALIAS_AFTER_CONVERTER_NOTE, componentLabel } from '../../src/words/logger';
import { defaultCameraEntries, frameRatesOf } from '../../src/state/cameraPlanning';
import { EXAMPLE_MACHINE_NAME, exampleSetup } from '../../src/state/example';
import { lampOf, lightingCautions, litPartsOf } from '../../src/state/lighting';
import { type Setup, activeCorePart } from '../../src/state/model';
import { defaultLoggerEntries, tonesOf } from '../../src/state/loggerPlanning';
import {
  GARBAGE,
  openApp,
  openBrowser,
  printedHeaderLines,
  shownText,
  splitReportCsv,
  typeInto,
  type Session,
} from './browser';

let session: Session | undefined;

afterEach(async () => {
  await session?.close();
  session = undefined;
});

const shots = 'test-output/screenshots';

/** Opens the first-run example machine (a fictional plant) and then the tab `tab`. */
async function openExampleOn(page: Page, tab: string): Promise<void> {
  await openApp(page, inject('baseUrl'));
  await page.getByRole('button', { name: 'Machines', exact: true }).click();
  const row = page.locator('article', {
    has: page.getByRole('heading', { name: EXAMPLE_MACHINE_NAME }),
  });
  await row.getByRole('button', { name: 'Open' }).click();
  await page.getByTestId('verdict').waitFor();
  await page.getByRole('button', { name: tab, exact: true }).click();
}

/**
 * Types each garbage text into each field: the field is marked, a message stands beside it, the
 * answer is withdrawn where it stood and names the field to fix (docs/physics.md §10), and nothing
 * reads NaN or Infinity. Then the good text goes back, and so does the answer as it was.
 */
async function refuseGarbage(page: Page, labels: string[], watched: string) {
  const before = await page.getByTestId(watched).innerText();
  for (const label of labels) {
    const field = page.getByLabel(label, { exact: true });
    const good = await field.inputValue();
    for (const text of GARBAGE) {
      await field.fill(text);
      expect(await field.getAttribute('aria-invalid'), `${label}: "${text}"`).toBe('true');
      const messageId = (await field.getAttribute('aria-describedby'))!.split(' ')[0];
      expect(
        (await page.locator(`[id="${messageId}"]`).innerText()).length,
        `${label}: "${text}"`,
      ).toBeGreaterThan(5);
      expect(await field.inputValue(), 'the typed text stays').toBe(text);
      await expect
        .poll(async () => (await page.getByTestId('withdrawn').innerText()).split('\n')[0], {
          message: `${label}: "${text}"`,
        })
        .toBe(`No answer until ${label} is fixed`);
      expect(await withdrawnOrStale(page, watched), `${label}: "${text}"`).toBe(true);
      expect(await shownText(page), `${label}: "${text}"`).not.toMatch(/NaN|Infinity/);
    }
    await field.fill(good);
    expect(await field.getAttribute('aria-invalid'), label).toBeNull();
    await expect.poll(() => page.getByTestId(watched).innerText(), { message: label }).toBe(before);
    expect(await page.getByTestId('withdrawn').count(), label).toBe(0);
  }
}

/** The element is out of the answer: hidden behind a withdrawn answer, or inside results marked not current. */
function withdrawnOrStale(page: Page, testId: string): Promise<boolean> {
  return page
    .getByTestId(testId)
    .evaluate(
      (e) => e.closest('[hidden]') !== null || e.closest('[data-current="false"]') !== null,
    );
}

/**
 * Clicks "Save table (CSV)" and returns the file's name and its table lines, after checking the
 * report head above the table: the tool's title, the machine and every caution of the printout.
 */
async function saveCsv(
  page: Page,
  title: string,
  cautions: string[],
): Promise<{ name: string; lines: string[] }> {
  const [download] = await Promise.all([
    page.waitForEvent('download'),
    page.getByRole('button', { name: 'Save table (CSV)' }).click(),
  ]);
  const { head, table } = splitReportCsv(readFileSync(await download.path(), 'utf8'));
  expect(head[0]).toEqual(['Report', title]);
  expect(head).toContainEqual(['Machine', EXAMPLE_MACHINE_NAME]);
  expect(head.filter(([label]) => label === 'Caution').map(([, line]) => line)).toEqual(cautions);
  return { name: download.suggestedFilename(), lines: table };
}

/**
 * Print emulation: the tab bar and buttons go, the report header shows the tool, the machine,
 * today's date and every caution that applies. Writes a screenshot of the printed page.
 */
async function checkPrint(page: Page, title: string, cautions: string[], file: string) {
  // A browser lays a printout out at the paper's width, whatever the screen: A4 is 794 CSS px wide at 96 dpi.
  const screenSize = page.viewportSize()!;
  await page.setViewportSize({ width: 794, height: 1123 });
  await page.emulateMedia({ media: 'print' });
  expect(await page.getByText(`Trueturn · ${title}`).isVisible()).toBe(true);
  const header = page.locator('header', { hasText: `Trueturn · ${title}` });
  const text = await header.innerText();
  expect((await printedHeaderLines(page)).Machine).toBe(EXAMPLE_MACHINE_NAME);
  expect(text).toMatch(/Printed /);
  expect(text).toContain(String(new Date().getFullYear()));
  const items = header.locator('li');
  expect(await items.allInnerTexts()).toEqual(cautions);
  for (let i = 0; i < cautions.length; i++) expect(await items.nth(i).isVisible()).toBe(true);
  expect(await page.getByRole('navigation', { name: 'Screens' }).isVisible()).toBe(false);
  expect(await page.getByRole('button', { name: 'Print report' }).isVisible()).toBe(false);
  // The report header comes before the tool's answer on paper.
  const headerTop = await header.evaluate((e) => e.getBoundingClientRect().top);
  const answerTop = await page
    .locator('main section')
    .first()
    .evaluate((e) => e.getBoundingClientRect().top);
  expect(headerTop).toBeLessThan(answerTop);
  await page.screenshot({ path: `${shots}/${file}`, fullPage: true });
  await page.emulateMedia({ media: 'screen' });
  await page.setViewportSize(screenSize);
}

/** A phone screenshot from the top of the page, or with the element of `testId` at the top. */
async function phoneShot(page: Page, file: string, testId?: string) {
  if (testId) await page.getByTestId(testId).evaluate((e) => e.scrollIntoView({ block: 'start' }));
  else await page.evaluate(() => window.scrollTo(0, 0));
  await page.screenshot({ path: `${shots}/${file}` });
}

/** The example set-up after the lighting flow adds a chuck (a new part starts with the chosen part's tolerance). */
function withChuck(s: Setup): Setup {
  const tolerancePercent = s.parts[s.activePart].tolerancePercent;
  return {
    ...structuredClone(s),
    parts: [...s.parts, { name: 'Chuck', speedRpm: 3000, features: 2, tolerancePercent }],
    activePart: s.parts.length,
  };
}

describe('the field tools in a real browser, at phone size', () => {
  test('lighting check: each part under the lamps as the core finds it, a hazard shouted, garbage refused, CSV and print', async () => {
    mkdirSync(shots, { recursive: true });
    session = await openBrowser({ width: 390, height: 844 });
    const { page } = session;
    await openExampleOn(page, 'Lighting');

    // The fictional cooler fan under 100 Hz flicker at 30 %: the core's own verdict and words.
    const first = lightingCheck(lampOf(exampleSetup), litPartsOf(exampleSetup));
    await expect
      .poll(() => page.getByTestId('lighting-summary').innerText())
      .toBe(lightingSummary(first));
    const table = page.getByTestId('lighting-table');
    const rows = table.locator('tbody tr');
    expect(await rows.count()).toBe(exampleSetup.parts.length);
    for (let i = 0; i < first.parts.length; i++) {
      const p = first.parts[i];
      const text = await rows.nth(i).innerText();
      expect(text).toContain(p.name);
      expect(text).toContain(lookWords(p.look, p.look === 'still' ? p.images : 1, p.apparentRpm));
    }
    expect(await page.getByTestId('flicker-risk').innerText()).toBe('Above the low-risk line');

    // A two-jaw chuck at 3000 rpm (a 2-pole motor on 50 Hz, IEC 60034-1) added here looks still: a hazard.
    await page.getByRole('button', { name: 'Add a part' }).click();
    await typeInto(page, 'Name of the chosen part', 'Chuck');
    await typeInto(page, 'Speed', '3000');
    await typeInto(page, 'Blades or marks', '2');
    const second = lightingCheck(
      lampOf(withChuck(exampleSetup)),
      litPartsOf(withChuck(exampleSetup)),
    );
    expect(second.parts[2].worstLook).toBe('still');
    await expect
      .poll(() => page.getByTestId('lighting-summary').innerText())
      .toBe(lightingSummary(second));
    expect(await page.getByTestId('lighting-hazard').isVisible()).toBe(true);
    expect(await rows.nth(2).getByTestId('hazard-flag').innerText()).toBe('HAZARD');
    expect(await page.getByTestId('safety-notice').isVisible()).toBe(true);
    await phoneShot(page, 'field-tools-b-lighting-phone.png');
    await phoneShot(page, 'field-tools-b-lighting-table-phone.png', 'lighting-table');

    await refuseGarbage(
      page,
      ['Modulation (percent flicker)', 'Speed', 'Blades or marks', 'Tolerance'],
      'lighting-summary',
    );
    await page.screenshot({
      path: `${shots}/field-tools-b-lighting-phone-full.png`,
      fullPage: true,
    });
    expect(
      await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth),
    ).toBeLessThanOrEqual(0);

    const lightingLines = safetyCautions(lightingCautions(second, 30));
    const csv = await saveCsv(page, 'Lighting check', lightingLines);
    expect(csv.name).toMatch(
      /^lighting-check-example-cooler-fan-pellet-line-2-\d{4}-\d{2}-\d{2}\.csv$/,
    );
    const lines = csv.lines;
    expect(lines).toHaveLength(second.parts.length + 2);
    expect(
      lines[0].startsWith(
        'part,speed (rpm),blades or marks,tolerance (± %),flicker (Hz),modulation (%),IEEE 1789 class',
      ),
    ).toBe(true);
    const chuck = withChuck(exampleSetup).parts[2];
    expect(lines[3].startsWith(`Chuck,3000,2,${chuck.tolerancePercent},100,30,elevated,`)).toBe(
      true,
    );
    expect(lines[3]).toContain(',still,');
    expect(lines[3]).toContain(',hazard,');

    await checkPrint(page, 'Lighting check', lightingLines, 'field-tools-b-lighting-print.png');
  });

  test('camera plan: near misses when nothing freezes, a typed rate that does, "Open in check", garbage refused, CSV and print', async () => {
    mkdirSync(shots, { recursive: true });
    session = await openBrowser({ width: 390, height: 844 });
    const { page } = session;
    await openExampleOn(page, 'Camera');

    // The fictional cooler fan: 8 blades at 1015 rpm. No phone frame rate freezes it.
    const camera = {
      frameRatesHz: frameRatesOf(defaultCameraEntries.standardLabels, []),
      shutterAnglesDeg: defaultCameraEntries.shutterAnglesDeg,
      exposuresS: defaultCameraEntries.exposuresS,
      readoutS: defaultCameraEntries.readoutMs / 1000,
    };
    const part = activeCorePart(exampleSetup);
    const none = cameraPlan(camera, part, { kind: 'freeze' });
    expect(none.settings).toHaveLength(0);
    await expect
      .poll(() => page.getByTestId('plan-headline').innerText())
      .toBe('No setting of this camera reaches the goal');
    const rows = page.getByTestId('plan-table').locator('tbody tr');
    expect(await rows.count()).toBe(none.nearMisses.length);
    expect(await rows.first().innerText()).toContain(
      `${formatPrecise(none.nearMisses[0].frameRate)} fps`,
    );
    // The single-image rates of docs/physics.md §3, n·|f|/p, are named as the way out.
    const freezing = lockRates(
      { ...part, tolerance: 0 },
      { minHz: 1, maxHz: 1000 },
      { maxImages: 1 },
    ).map((l) => l.rateHz);
    const top = Math.max(...freezing);
    expect(await page.getByTestId('plan-none').innerText()).toContain(`${formatPrecise(top)} fps`);
    await phoneShot(page, 'field-tools-b-camera-none-phone.png');

    // A camera that offers that rate, with a global shutter, freezes the fan (a phone's 25 ms
    // readout turns it 360·16.9·0.025 = 152°, over three blade pitches: broken, docs/physics.md §5).
    await typeInto(page, 'Other frame rates', numberForField(top));
    await typeInto(page, 'Rolling readout time', '0');
    const typed = Number(numberForField(top));
    const reached = cameraPlan(
      { ...camera, frameRatesHz: [...camera.frameRatesHz, typed], readoutS: 0 },
      part,
      { kind: 'freeze' },
    );
    expect(reached.settings.length).toBeGreaterThan(0);
    await expect
      .poll(() => page.getByTestId('plan-headline').innerText())
      .toMatch(/^\d+ settings? reach(es)? the goal$/);
    expect(await rows.count()).toBe(reached.settings.length);
    const best = await rows.first().innerText();
    expect(best).toContain(`${formatPrecise(reached.settings[0].frameRate)} fps`);
    expect(best).toContain('Looks still');
    expect(await page.getByTestId('safety-notice').isVisible()).toBe(true);
    await phoneShot(page, 'field-tools-b-camera-phone.png');
    await phoneShot(page, 'field-tools-b-camera-table-phone.png', 'plan-table');

    await refuseGarbage(
      page,
      ['Other frame rates', 'Shutter angles', 'Shutter speeds', 'Rolling readout time'],
      'plan-headline',
    );
    await page.screenshot({ path: `${shots}/field-tools-b-camera-phone-full.png`, fullPage: true });
    expect(
      await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth),
    ).toBeLessThanOrEqual(0);

    const csv = await saveCsv(page, 'Camera plan', safetyCautions({ apparentStillness: true }));
    expect(csv.name).toMatch(
      /^camera-plan-example-cooler-fan-pellet-line-2-\d{4}-\d{2}-\d{2}\.csv$/,
    );
    const lines = csv.lines;
    expect(lines).toHaveLength(reached.settings.length + 2);
    expect(
      // Rounded as on screen: the rate to five significant figures, the exposure to four.
      lines[1].startsWith(
        `1,${preciseNumber(reached.settings[0].frameRate)},${Number(reached.settings[0].exposureS.toPrecision(4))},`,
      ),
    ).toBe(true);

    await checkPrint(
      page,
      'Camera plan',
      safetyCautions({ apparentStillness: true }),
      'field-tools-b-camera-print.png',
    );

    // "Open in check" puts that setting on the check screen, where the camera view is.
    await rows.first().getByRole('button', { name: 'Open in check' }).click();
    await page.getByTestId('verdict').waitFor();
    await expect.poll(() => page.getByRole('radio', { name: 'Camera' }).isChecked()).toBe(true);
    await expect
      .poll(() => page.getByLabel('Frame rate', { exact: true }).inputValue())
      .toBe(numberForField(reached.settings[0].frameRate));
    await expect.poll(() => page.getByTestId('verdict').innerText()).toMatch(/^Looks still/);
  });

  test('data logger: where each component lands as the core finds it, the alias statement, the proposal applied, garbage refused, CSV and print', async () => {
    mkdirSync(shots, { recursive: true });
    session = await openBrowser({ width: 390, height: 844 });
    const { page } = session;
    await openExampleOn(page, 'Logger');

    const fan = exampleSetup.parts[exampleSetup.activePart];
    const tones = (harmonicsCount: number) =>
      tonesOf(fan, { harmonics: harmonicsCount, blades: null, gearTeeth: [], extraTonesHz: [] });
    const atFirst = loggerPlan({
      tones: tones(defaultLoggerEntries.harmonics),
      sampleHz: 1000,
      filter: { kind: 'none' },
      bits: 16,
    });
    const rows = page.getByTestId('logger-table').locator('tbody tr');
    await expect.poll(() => rows.count()).toBe(atFirst.components.length);
    for (let i = 0; i < atFirst.components.length; i++) {
      const c = atFirst.components[i];
      const text = await rows.nth(i).innerText();
      expect(text).toContain(componentLabel(c));
      expect(text).toContain(`${formatPrecise(c.foldedHz)} Hz`);
    }
    expect(await page.getByTestId('alias-note').innerText()).toBe(ALIAS_AFTER_CONVERTER_NOTE);

    // At 200 samples/s the 8-blade pass (135.3 Hz) is above 100 Hz and folds to 200 − 135.3 = 64.7 Hz.
    await typeInto(page, 'Sample rate', '200');
    const slow = loggerPlan({
      tones: tones(defaultLoggerEntries.harmonics),
      sampleHz: 200,
      filter: { kind: 'none' },
      bits: 16,
    });
    const pass = slow.components.find((c) => c.source === 'blades')!;
    expect(pass.foldedHz).toBeCloseTo(200 - (8 * fan.speedRpm) / 60, 9);
    const bladeRow = rows.filter({ hasText: 'blade pass (8 blades)' });
    await expect.poll(() => bladeRow.innerText()).toContain(`${formatPrecise(pass.foldedHz)} Hz`);
    expect(await bladeRow.innerText()).toContain('Yes: a false tone');
    expect(await bladeRow.getByTestId('component-result').innerText()).toBe('Fail');
    expect(await page.getByTestId('logger-headline').innerText()).toBe(
      'False tones will reach the record',
    );
    await phoneShot(page, 'field-tools-b-logger-alias-phone.png');
    await phoneShot(page, 'field-tools-b-logger-table-phone.png', 'logger-table');

    // The proposal, taken with one tap, makes the record clean.
    expect(slow.proposal).toBeDefined();
    await page.getByRole('button', { name: 'Use this sample rate and filter' }).click();
    await expect
      .poll(() => page.getByTestId('logger-headline').innerText())
      .toBe('The record is clean');
    await expect
      .poll(() => page.getByLabel('Sample rate', { exact: true }).inputValue())
      .toBe(numberForField(slow.proposal!.sampleHz));
    await expect
      .poll(() => page.getByLabel('Order', { exact: true }).inputValue())
      .toBe(String(slow.proposal!.order));
    const clean = loggerPlan({
      tones: tones(defaultLoggerEntries.harmonics),
      sampleHz: slow.proposal!.sampleHz,
      filter: {
        kind: 'butterworth',
        order: slow.proposal!.order,
        cutoffHz: slow.proposal!.cutoffHz,
      },
      bits: 16,
    });
    expect(clean.allPass).toBe(true);
    await phoneShot(page, 'field-tools-b-logger-phone.png');

    await refuseGarbage(
      page,
      [
        'Sample rate',
        'Converter bits',
        'Shaft harmonics',
        'Blade counts',
        'Gear teeth',
        'Other tones',
        'Order',
        'Cutoff',
      ],
      'logger-table',
    );
    await page.screenshot({ path: `${shots}/field-tools-b-logger-phone-full.png`, fullPage: true });
    expect(
      await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth),
    ).toBeLessThanOrEqual(0);

    const csv = await saveCsv(page, 'Data logger plan', safetyCautions({}));
    expect(csv.name).toMatch(
      /^data-logger-plan-example-cooler-fan-pellet-line-2-\d{4}-\d{2}-\d{2}\.csv$/,
    );
    const lines = csv.lines;
    expect(lines).toHaveLength(clean.components.length + 2);
    expect(
      // Rounded as on screen (five significant figures).
      lines[1].startsWith(
        `1× shaft,${preciseNumber(clean.components[0].hz)},${preciseNumber(slow.proposal!.sampleHz)},`,
      ),
    ).toBe(true);

    await checkPrint(
      page,
      'Data logger plan',
      safetyCautions({}),
      'field-tools-b-logger-print.png',
    );
  });
});
