// Typed garbage in every field: each gets a message beside it, the set-up stays as it was, the
// verdict (if the field feeds it) is withdrawn and the lists are marked not current until the
// text is good again, and nothing on screen ever reads NaN or Infinity.
import { afterEach, describe, expect, inject, test } from 'vitest';
import type { Page } from 'playwright-core';
import { GARBAGE, openApp, openBrowser, shownText, type Session } from './browser';

let session: Session | undefined;

afterEach(async () => {
  await session?.close();
  session = undefined;
});

/** Besides the shared garbage: nothing, blanks, and digits of another script. */
const TYPED = [...GARBAGE, '', '   ', '١٢٣'];

/** Fields the verdict reads: garbage in one withdraws the verdict (docs/physics.md §10); the others leave it. */
const VERDICT_LABELS = new Set([
  'Speed',
  'Blades or marks',
  'Flash rate',
  'Poles',
  'Slip',
  'Frame rate',
  'Shutter angle',
  'Exposure time',
  'Flicker frequency',
  'Modulation (percent flicker)',
]);

async function checkFields(page: Page, labels: string[]) {
  for (const label of labels) {
    const field = page.getByLabel(label, { exact: true });
    const good = await field.inputValue();
    const verdict = await page.getByTestId('verdict').innerText();
    const seen = await page.getByTestId('apparent-speed').innerText();
    for (const text of TYPED) {
      await field.fill(text);
      expect(await field.getAttribute('aria-invalid'), `${label}: "${text}"`).toBe('true');
      const messageId = (await field.getAttribute('aria-describedby'))!.split(' ')[0];
      const message = await page.locator(`[id="${messageId}"]`).innerText();
      expect(message.length, `${label}: "${text}"`).toBeGreaterThan(5);
      if (VERDICT_LABELS.has(label)) {
        await expect
          .poll(() => page.getByTestId('verdict').innerText(), { message: `${label}: "${text}"` })
          .toBe(`No verdict until ${label} is fixed`);
        expect(await page.getByTestId('apparent-speed').count()).toBe(0);
      } else {
        // Lists read this field, the verdict does not: it stands, the lists are marked.
        expect(await page.getByTestId('verdict').innerText()).toBe(verdict);
        expect(await page.getByTestId('apparent-speed').innerText()).toBe(seen);
        expect(await page.getByTestId('not-current').count()).toBeGreaterThan(0);
      }
      expect(await shownText(page), `${label}: "${text}"`).not.toMatch(/NaN|Infinity/);
    }
    await field.fill(good);
    expect(await field.getAttribute('aria-invalid')).toBeNull();
    await expect
      .poll(() => page.getByTestId('verdict').innerText(), { message: label })
      .toBe(verdict);
    expect(await page.getByTestId('not-current').count()).toBe(0);
  }
}

describe('typed garbage', () => {
  test('every field of the part, the strobe and the creep refuses it beside the field', async () => {
    session = await openBrowser();
    const { page } = session;
    await openApp(page, inject('baseUrl'));
    await checkFields(page, [
      'Speed',
      'Blades or marks',
      'Tolerance',
      'Flash rate',
      'Lowest rate',
      'Highest rate',
      'Creep speed wanted',
    ]);
    await page.getByLabel('Speed from an induction motor').check();
    await checkFields(page, ['Poles', 'Slip']);
    expect(await page.locator('script:not([src])').count()).toBe(0);
  });

  test('every camera and lighting field refuses it beside the field', async () => {
    session = await openBrowser();
    const { page } = session;
    await openApp(page, inject('baseUrl'));
    await page.getByRole('radio', { name: 'Camera' }).check();
    await checkFields(page, ['Frame rate', 'Shutter angle', 'Rolling readout time']);
    await page.getByRole('radio', { name: 'As a time' }).check();
    await checkFields(page, ['Exposure time']);
    await page.getByRole('radio', { name: 'Lighting' }).check();
    await page.getByRole('radio', { name: 'Other' }).check();
    await checkFields(page, ['Flicker frequency', 'Modulation (percent flicker)']);
  });
});
