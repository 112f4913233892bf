// Every tool's inputs belong to the machine on screen and come back after an offline reload:
// the check screen's set-up and report header, the speed finder's readings and expectation, the
// camera plan, the logger's set-up, the lighting's supply, waveform and modulation, and the
// whole machine's links. Each value is typed as a person would, the test waits until the working
// copy on the device holds it, stops the server, reloads from the service worker and reads every
// field back. This test runs its own preview server so stopping it disturbs no other test.
import { afterEach, describe, expect, inject, test } from 'vitest';
import type { Locator, Page } from 'playwright-core';
import type { MachineContent } from '../../src/state/model';
import { openApp, openBrowser, storedWork, type Session, reloadApp } from './browser';
import { startPreview, type PreviewServer } from './server';

let session: Session | undefined;
let server: PreviewServer | undefined;

afterEach(async () => {
  await session?.close();
  await server?.stop();
  session = undefined;
  server = undefined;
});

/** One input: a text field (typed), a radio button or checkbox (on or off), or a select (an option's value). */
interface Input {
  label: string;
  kind: 'text' | 'radio' | 'checkbox' | 'select';
  /** Text to type, "on"/"off", or the option's value. */
  value: string;
  /** The test id of the element the input is inside (a part's card on the whole-machine screen). */
  within?: string;
}

/** A screen and its inputs, in the order a person fills them (a choice before the field it brings). */
interface ScreenInputs {
  tab: string;
  /** Done once, before the inputs are first filled: adding a part. */
  setUp?: (page: Page) => Promise<void>;
  /** Done at every visit, to bring the inputs on screen: opening the report header. */
  show?: (page: Page) => Promise<void>;
  inputs: Input[];
}

const text = (label: string, value: string, within?: string): Input => ({
  label,
  kind: 'text',
  value,
  within,
});
const on = (label: string, within?: string): Input => ({
  label,
  kind: 'radio',
  value: 'on',
  within,
});

const SCREENS: ScreenInputs[] = [
  {
    tab: 'Check',
    show: (page) => page.locator('summary', { hasText: 'Report header' }).click(),
    inputs: [
      text('Machine name', 'Kiln 5 exhaust fan'),
      text('Site', 'Harrowgate Tile Works, kiln hall'),
      text('Assessed by', 'R. Okafor'),
      text('Speed', '2400'),
      text('Blades or marks', '5'),
      text('Tolerance', '2'),
      text('Creep speed wanted', '3'),
      on('Camera'),
      text('Frame rate', '100'),
    ],
  },
  {
    tab: 'Speed finder',
    inputs: [
      text('Blades or marks on the part', '6'),
      on('A range in rpm'),
      text('From', '200'),
      text('To', '400'),
    ],
  },
  {
    tab: 'Camera',
    inputs: [
      { label: '24', kind: 'checkbox', value: 'off' },
      text('Other frame rates', '100 200'),
      text('Shutter angles', '90 180'),
      text('Shutter speeds', '1/250 1/1000'),
      text('Rolling readout time', '12'),
      on('Slow forward turn'),
    ],
  },
  {
    tab: 'Logger',
    inputs: [
      text('Shaft harmonics', '3'),
      text('Blade counts', '5 7'),
      text('Gear teeth', '17'),
      text('Other tones', '50 100'),
      text('Sample rate', '2000'),
      text('Converter bits', '12'),
      on('Butterworth'),
      text('Order', '6'),
      text('Cutoff', '400'),
    ],
  },
  {
    tab: 'Lighting',
    inputs: [
      on('60 Hz'),
      on('Other'),
      text('Flicker frequency', '240'),
      on('PWM (on–off)'),
      text('Duty cycle', '25'),
      text('Modulation (percent flicker)', '80'),
    ],
  },
  {
    tab: 'Whole machine',
    // A second part, linked to the first by a belt (the whole machine's links live on its parts).
    setUp: (page) => page.getByRole('button', { name: 'Add part', exact: true }).click(),
    inputs: [
      text('Name', 'Drum', 'chain-part-1'),
      on('Belt', 'chain-part-1'),
      text('Driver pulley', '100', 'chain-part-1'),
      text('Driven pulley', '250', 'chain-part-1'),
      text('Belt slip', '2', 'chain-part-1'),
    ],
  },
];

function locate(page: Page, input: Input): Locator {
  const scope = input.within ? page.getByTestId(input.within) : page;
  if (input.kind === 'radio') return scope.getByRole('radio', { name: input.label, exact: true });
  if (input.kind === 'checkbox') {
    return scope.getByRole('checkbox', { name: input.label, exact: true });
  }
  return scope.getByLabel(input.label, { exact: true });
}

async function enter(page: Page, input: Input): Promise<void> {
  const field = locate(page, input);
  if (input.kind === 'text') {
    await field.fill('');
    await field.pressSequentially(input.value);
    // Taken, not refused: a refused value would be kept on screen but not in the machine.
    expect(await field.getAttribute('aria-invalid'), input.label).not.toBe('true');
  } else if (input.kind === 'select') {
    await field.selectOption(input.value);
  } else {
    await field.setChecked(input.value === 'on');
  }
}

async function read(page: Page, input: Input): Promise<string> {
  const field = locate(page, input);
  if (input.kind === 'radio' || input.kind === 'checkbox') {
    return (await field.isChecked()) ? 'on' : 'off';
  }
  return field.inputValue();
}

async function openTab(page: Page, tab: string): Promise<void> {
  await page.getByRole('button', { name: tab, exact: true }).click();
}

/**
 * The part of the working copy on the device that this test types, field by field (undefined
 * before anything is stored). It must come to equal TYPED: a reload before that would lose the
 * last inputs; the page writes a moment after typing stops. On a miss, the diff names the field.
 */
function storedInputs(c: MachineContent | undefined) {
  if (!c) return undefined;
  const [fan, drum] = c.setup.parts;
  const { speedFinder, camera, logger } = c.tools;
  const { lighting } = c.setup;
  const reading = speedFinder.readings[0];
  const drive = drum?.drive;
  return {
    name: c.name,
    site: c.site,
    assessedBy: c.assessedBy,
    fan: { speedRpm: fan.speedRpm, features: fan.features, tolerancePercent: fan.tolerancePercent },
    creepRpm: c.setup.creepRpm,
    samplerKind: c.setup.samplerKind,
    frameRate: c.setup.camera.frameRate,
    activePart: c.setup.activePart,
    readings: speedFinder.readings.length,
    reading: { rateFpm: reading?.rateFpm, images: reading?.images },
    finderFeatures: speedFinder.features,
    expectation: {
      mode: speedFinder.expectation.mode,
      fromRpm: speedFinder.expectation.fromRpm,
      toRpm: speedFinder.expectation.toRpm,
    },
    camera: {
      has24: camera.standardLabels.includes('24'),
      otherRatesHz: camera.otherRatesHz.join(' '),
      shutterAnglesDeg: camera.shutterAnglesDeg.join(' '),
      exposuresS: camera.exposuresS.join(' '),
      readoutMs: camera.readoutMs,
      goal: camera.goal,
    },
    logger: {
      harmonics: logger.harmonics,
      blades: logger.blades?.join(' '),
      gearTeeth: logger.gearTeeth.join(' '),
      extraTonesHz: logger.extraTonesHz.join(' '),
      sampleHz: logger.sampleHz,
      bits: logger.bits,
      filterKind: logger.filterKind,
      order: logger.order,
      cutoffHz: logger.cutoffHz,
    },
    lighting: {
      mainsHz: lighting.mainsHz,
      flicker: lighting.flicker,
      customHz: lighting.customHz,
      waveform: lighting.waveform,
      dutyPercent: lighting.dutyPercent,
      modulationPercent: lighting.modulationPercent,
    },
    drum: {
      name: drum?.name,
      drive:
        drive?.kind === 'belt'
          ? {
              kind: drive.kind,
              from: drive.from,
              driverMm: drive.driverMm,
              drivenMm: drive.drivenMm,
              slipPercent: drive.slipPercent,
            }
          : drive?.kind,
    },
  };
}

/** What this test types into every tool, as storedInputs reads it back. */
const TYPED: ReturnType<typeof storedInputs> = {
  name: 'Kiln 5 exhaust fan',
  site: 'Harrowgate Tile Works, kiln hall',
  assessedBy: 'R. Okafor',
  fan: { speedRpm: 2400, features: 5, tolerancePercent: 2 },
  creepRpm: 3,
  samplerKind: 'camera',
  frameRate: 100,
  activePart: 0,
  readings: 1,
  reading: { rateFpm: 1780, images: 1 },
  finderFeatures: 6,
  expectation: { mode: 'rpm', fromRpm: 200, toRpm: 400 },
  camera: {
    has24: false,
    otherRatesHz: '100 200',
    shutterAnglesDeg: '90 180',
    exposuresS: `${1 / 250} ${1 / 1000}`,
    readoutMs: 12,
    goal: 'creep',
  },
  logger: {
    harmonics: 3,
    blades: '5 7',
    gearTeeth: '17',
    extraTonesHz: '50 100',
    sampleHz: 2000,
    bits: 12,
    filterKind: 'butterworth',
    order: 6,
    cutoffHz: 400,
  },
  lighting: {
    mainsHz: 60,
    flicker: 'custom',
    customHz: 240,
    waveform: 'rectangular',
    dutyPercent: 25,
    modulationPercent: 80,
  },
  drum: {
    name: 'Drum',
    drive: { kind: 'belt', from: 0, driverMm: 100, drivenMm: 250, slipPercent: 2 },
  },
};

describe('every tool’s inputs after an offline reload', () => {
  test('the set-up, readings, camera plan, logger set-up, lighting and links all come back', async () => {
    server = await startPreview(inject('distDir'));
    session = await openBrowser();
    const { page } = session;
    await openApp(page, server.url);
    // registerType 'prompt' without clientsClaim leaves the first visit uncontrolled: wait until
    // the worker is active, then reload once so it controls the page (as offline.test.ts does).
    await page.evaluate(async () => {
      await navigator.serviceWorker.ready;
    });
    await reloadApp(page);
    await page.waitForFunction(() => navigator.serviceWorker.controller !== null);
    await page.getByTestId('verdict').waitFor();

    for (const screen of SCREENS) {
      await openTab(page, screen.tab);
      await screen.setUp?.(page);
      await screen.show?.(page);
      for (const input of screen.inputs) await enter(page, input);
      if (screen.tab === 'Speed finder') {
        // One reading recorded at the strobe: a single image at 1780 flashes/min.
        await page.getByLabel('Rate where it stood still', { exact: true }).fill('1780');
        await page.getByLabel('Images standing still', { exact: true }).selectOption('1');
        await page.getByRole('button', { name: 'Add reading' }).click();
        await page.getByLabel('Reading 1: rate', { exact: true }).waitFor();
      }
    }
    // Adding the drum chose it; the fan is the part the check screen works on again.
    await openTab(page, 'Logger');
    await page.getByLabel('Shaft of', { exact: true }).selectOption('0');

    // What each screen shows now, read the same way as after the reload.
    const before = new Map<string, string>();
    for (const screen of SCREENS) {
      await openTab(page, screen.tab);
      await screen.show?.(page);
      for (const input of screen.inputs) {
        before.set(`${screen.tab} › ${input.label}`, await read(page, input));
      }
    }
    await expect
      .poll(async () => storedInputs(await storedWork(page)), { timeout: 20_000 })
      .toEqual(TYPED);

    await server.stop();
    // The server is really gone: a direct request fails.
    await expect(fetch(server.url)).rejects.toThrow();
    await reloadApp(page);
    await page.getByTestId('verdict').waitFor();

    // The page paints at once; the working copy arrives from storage a moment later.
    await expect
      .poll(() => page.getByLabel('Machine name', { exact: true }).inputValue())
      .toBe('Kiln 5 exhaust fan');
    for (const screen of SCREENS) {
      await openTab(page, screen.tab);
      await screen.show?.(page);
      for (const input of screen.inputs) {
        const where = `${screen.tab} › ${input.label}`;
        await expect.poll(() => read(page, input), { message: where }).toBe(before.get(where));
      }
      if (screen.tab === 'Speed finder') {
        expect(await page.getByLabel('Reading 1: rate', { exact: true }).inputValue()).toBe('1780');
        expect(await page.getByLabel('Reading 1: images', { exact: true }).inputValue()).toBe('1');
      }
    }
    expect(await page.getByTestId('screen-load-failed').count()).toBe(0);
  });
});
