// axe-core (WCAG 2.0, 2.1 and 2.2, levels A and AA) over every screen of the built app, in
// light and dark, after every choice that brings more on screen (the check screen's strobe,
// camera and lighting modes among them), and in the states where answers are withdrawn or
// marked not current. Any violation fails the test, listed rule by rule, element by element.
import { afterEach, describe, expect, inject, test } from 'vitest';
import type { Page } from 'playwright-core';
import { openApp, openBrowser, SIZES, typeInto, type Session } from './browser';
import { axeViolations, describeViolations } from './accessibility';
import { TOURS } from './every-screen';

let session: Session | undefined;

afterEach(async () => {
  await session?.close();
  session = undefined;
});

/** States the tours do not reach: a withdrawn verdict, a not-current list, a withdrawn tool answer. */
const STATES: Array<{ name: string; go: (page: Page) => Promise<void> }> = [
  {
    name: 'the check screen with a strobe',
    go: async (page) => {
      await page.getByRole('button', { name: 'Check', exact: true }).click();
      await page.getByRole('radio', { name: 'Strobe', exact: true }).check();
      await page.getByLabel('Flash rate', { exact: true }).waitFor();
    },
  },
  {
    // Wikipedia, "Stroboscopic effect": 60 rev/s under 61 flashes/s seems to turn backward.
    name: 'the check screen with a verdict of danger (turning backward)',
    go: async (page) => {
      await typeInto(page, 'Speed', '3600');
      await typeInto(page, 'Blades or marks', '1');
      await typeInto(page, 'Flash rate', '3660');
      await expect.poll(() => page.getByTestId('verdict').innerText()).toMatch(/^Turning backward/);
    },
  },
  {
    name: 'the check screen with a verdict of caution (creeping forward)',
    go: async (page) => {
      await typeInto(page, 'Flash rate', '3540');
      await expect.poll(() => page.getByTestId('verdict').innerText()).toMatch(/^Creeping forward/);
    },
  },
  {
    name: 'the check screen with its verdict withdrawn',
    go: async (page) => {
      await typeInto(page, 'Speed', 'abc');
      await page.getByTestId('withdrawn').first().waitFor();
    },
  },
  {
    name: 'the check screen with its lists not current',
    go: async (page) => {
      await typeInto(page, 'Speed', '1770');
      await page.getByTestId('withdrawn').waitFor({ state: 'detached' });
      await typeInto(page, 'Tolerance', 'abc');
      await page.getByTestId('not-current').first().waitFor();
    },
  },
  {
    name: 'the lighting screen with its answer withdrawn',
    go: async (page) => {
      await typeInto(page, 'Tolerance', '2');
      await page.getByTestId('not-current').first().waitFor({ state: 'detached' });
      await page.getByRole('button', { name: 'Lighting', exact: true }).click();
      await typeInto(page, 'Modulation (percent flicker)', 'abc');
      await page.getByTestId('withdrawn').first().waitFor();
    },
  },
  {
    name: 'the lighting screen answering again',
    go: async (page) => {
      await typeInto(page, 'Modulation (percent flicker)', '30');
      await page.getByTestId('withdrawn').first().waitFor({ state: 'detached' });
    },
  },
];

/** Runs axe after each state is reached; returns every violation, described. */
async function auditStates(
  page: Page,
  states: Array<{ name: string; go: (page: Page) => Promise<void> }>,
): Promise<string[]> {
  const found: string[] = [];
  for (const state of states) {
    await state.go(page);
    const violations = await axeViolations(page);
    if (violations.length > 0) found.push(describeViolations(state.name, violations));
  }
  return found;
}

describe('axe-core finds no WCAG 2.2 A or AA violation', () => {
  for (const size of SIZES) {
    for (const scheme of ['light', 'dark'] as const) {
      test(`on every screen, in every mode of the check screen and with answers withdrawn or not current, in ${scheme}, on a ${size.name}`, async () => {
        session = await openBrowser({
          width: size.width,
          height: size.height,
          colorScheme: scheme,
        });
        const { page } = session;
        await openApp(page, inject('baseUrl'));
        const states = [
          ...STATES,
          ...TOURS.flatMap((tour) => tour.steps.map((s) => ({ name: s.name, go: s.go }))),
        ];
        const found = await auditStates(page, states);
        expect(found.join('\n\n'), `${found.length} of ${states.length} states fail`).toBe('');
      });
    }
  }
});
