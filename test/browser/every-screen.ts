// A walk through every screen of the app and the choices on it that bring more fields on
// screen (camera and lighting modes, motor and wheel, exposure as a time, the report header, RC
// and Butterworth filters, speed-finder readings, belt and gear drives, renaming a machine). Each step ends
// when the field it brings is on screen. Shared by the paste and the security-policy tests.
import type { Page } from 'playwright-core';

export interface Step {
  /** What the step shows, for messages. */
  name: string;
  go: (page: Page) => Promise<void>;
}

export interface Tour {
  /** The tab's name on the tab bar. */
  tab: string;
  steps: Step[];
}

const radio = (page: Page, name: string) => page.getByRole('radio', { name, exact: true });
const field = (page: Page, label: string) => page.getByLabel(label, { exact: true }).first();
const tab = (page: Page, name: string) => page.getByRole('button', { name, exact: true }).click();

/** Opens `name` on the tab bar and waits for a field of that screen. */
function openTab(name: string, shows: string): Step {
  return {
    name: `the ${name} screen`,
    go: async (page) => {
      await tab(page, name);
      await field(page, shows).waitFor();
    },
  };
}

/** Chooses the radio buttons `names` in turn, then waits for the field `shows`. */
function choose(names: string[], shows: string): Step {
  return {
    name: names.join(', '),
    go: async (page) => {
      for (const name of names) await radio(page, name).first().check();
      await field(page, shows).waitFor();
    },
  };
}

export const TOURS: Tour[] = [
  {
    tab: 'Check',
    steps: [
      openTab('Check', 'Speed'),
      {
        name: 'speed from an induction motor',
        go: async (page) => {
          await page.getByLabel('Speed from an induction motor').check();
          await field(page, 'Poles').waitFor();
        },
      },
      choose(['Camera'], 'Frame rate'),
      choose(['As a time'], 'Exposure time'),
      choose(['Lighting', 'Other', 'PWM (on–off)'], 'Duty cycle'),
      {
        // The report header every screen carries (site, machine, assessed by, date, notes).
        name: 'the report header opened',
        go: async (page) => {
          await page.locator('summary', { hasText: 'Report header' }).click();
          await field(page, 'Assessed by').waitFor();
        },
      },
    ],
  },
  {
    tab: 'Lighting',
    steps: [
      openTab('Lighting', 'Modulation (percent flicker)'),
      choose(['Other', 'PWM (on–off)'], 'Duty cycle'),
    ],
  },
  { tab: 'Camera', steps: [openTab('Camera', 'Other frame rates')] },
  {
    tab: 'Logger',
    steps: [
      openTab('Logger', 'Sample rate'),
      choose(['RC'], 'Cutoff'),
      choose(['R and C'], 'Resistance'),
      choose(['Butterworth'], 'Order'),
    ],
  },
  {
    tab: 'Speed finder',
    steps: [
      openTab('Speed finder', 'Rate where it stood still'),
      {
        // Two readings end the steps: each gets a field of its own, and the found speed can be
        // saved to a new machine by name.
        name: 'two readings',
        go: async (page) => {
          for (const [rate, images] of [
            ['1780', '1'],
            ['3560', '2'],
          ]) {
            await field(page, 'Rate where it stood still').fill(rate);
            await field(page, 'Images standing still').selectOption(images);
            await page.getByRole('button', { name: 'Add reading' }).click();
          }
          await field(page, "New machine's name").waitFor();
        },
      },
      choose(['A range in rpm'], 'From'),
      choose(['Motor nameplate'], 'Slip from'),
    ],
  },
  {
    tab: 'Whole machine',
    steps: [
      openTab('Whole machine', 'Name'),
      choose(['Motor'], 'Poles'),
      choose(['Wheel'], 'Tyre size'),
      {
        name: 'a second part, driven by a belt, then by gears',
        go: async (page) => {
          // The new part is the last card.
          await page.getByRole('button', { name: 'Add part', exact: true }).click();
          await radio(page, 'Belt').last().check();
          await page.getByLabel('Driver pulley', { exact: true }).last().waitFor();
          await radio(page, 'Gears').last().check();
          await page.getByLabel('Driver teeth', { exact: true }).last().waitFor();
        },
      },
    ],
  },
  {
    tab: 'Machines',
    steps: [
      {
        name: 'renaming a machine',
        go: async (page) => {
          await tab(page, 'Machines');
          await page.getByRole('button', { name: 'Rename' }).first().click();
          await field(page, 'New name').waitFor();
        },
      },
    ],
  },
];
