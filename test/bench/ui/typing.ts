// Typing a speed on the check screen, in real Chromium at phone size (390×844): key presses
// through playwright into the "Speed" field, each measured from its keydown to the next frame
// (key-probe.ts), with the CPU slowed through CDP when asked (4× ≈ a mid-range phone).
// The page is a phone's (touch, mobile viewport) and the field is tapped, not clicked: a click
// leaves the mouse pointer resting on the page, and the browser then tests what it hovers after
// every layout, before the next frame's callbacks (a paint-property update and a hit test in
// each key's frame, about 2 to 5 ms at 4× in our traces), work a phone never does.
// For the same reason the field's text is selected directly (the field's own select()), not
// with Control+A: on a touch page that key makes Chromium open its touch selection menu, a
// contextmenu event and hit tests in the key's own task (about 20 to 45 ms at 4× in our
// traces), browser work no person typing on a phone sets off. The selection is paced like a
// key (it used to be followed by the first digit at once).
import type { CDPSession, Page } from 'playwright-core';
import { openApp, openBrowser } from '../../browser/browser';
import { installKeyProbe, type ProbeRecords } from './key-probe';

/** The step that selects the field's whole text, so the next key types over it. */
const SELECT_ALL = 'select all';

/**
 * What a technician types: clear and type 1780, correct it to 1750, clear and type 1765, fix
 * the last digit to 1760, clear and type 1790, take back three digits and type 1800. Every
 * step but select-all changes the field: 24 measured keys. Each passing value (1, 17, 176 …)
 * is a speed the screen works out in full, as it would for a person.
 */
export const KEY_STEPS: readonly string[] = [
  ...[SELECT_ALL, '1', '7', '8', '0'],
  ...['Backspace', 'Backspace', '5', '0'],
  ...[SELECT_ALL, '1', '7', '6', '5'],
  ...['Backspace', '0'],
  ...[SELECT_ALL, '1', '7', '9', '0'],
  ...['Backspace', 'Backspace', 'Backspace', '8', '0', '0'],
];
export const MEASURED_KEYS = KEY_STEPS.filter((k) => k !== SELECT_ALL).length;

/** The Speed field's text after each measured key, starting from the app's own value. */
export function textsAfterKeys(): string[] {
  const texts: string[] = [];
  let text = '';
  let selected = false;
  for (const key of KEY_STEPS) {
    if (key === SELECT_ALL) {
      selected = true;
      continue;
    }
    if (key === 'Backspace') text = selected ? '' : text.slice(0, -1);
    else text = (selected ? '' : text) + key;
    selected = false;
    texts.push(text);
  }
  return texts;
}

/** Keys come no faster than one per 150 ms from keydown to keydown (a quick typist); selecting the text is paced the same. */
const KEY_GAP_MS = 150;
const KEY_TIMEOUT_MS = 15_000;

export interface TypingFigures {
  cpuSlowdown: number;
  /** keydown → the next animation-frame callback after the update (the budgeted figure). */
  keyToRafMs: number[];
  /** keydown → that frame's style, layout and paint done on the main thread. */
  keyToFrameDoneMs: number[];
  /** Event Timing duration of each key's keydown, null when under 16 ms (not reported). */
  eventTimingMs: Array<number | null>;
  /** Every long task (≥ 50 ms) while typing. */
  longTasksMs: number[];
  /** For each long task, the measured key (1-based) pressed last before it began; 0: before the first. */
  longTaskKeys: number[];
  finalText: string;
}

/** Points where `bench:ui --profile` starts and stops its recordings. */
export interface TypingHooks {
  /** The page is still blank. */
  beforeLoad?(page: Page, cdp: CDPSession): Promise<void>;
  /** Start-up is over; the CPU slowdown is set and the first key comes next. */
  beforeTyping?(page: Page, cdp: CDPSession): Promise<void>;
  /** The last key's frame is done; the CPU is still slowed. */
  afterTyping?(page: Page, cdp: CDPSession): Promise<void>;
}

export async function typingRun(
  baseUrl: string,
  cpuSlowdown: number,
  hooks: TypingHooks = {},
): Promise<TypingFigures> {
  const session = await openBrowser({ width: 390, height: 844, touch: true });
  try {
    const { page } = session;
    const cdp = await page.context().newCDPSession(page);
    await hooks.beforeLoad?.(page, cdp);
    await openApp(page, baseUrl);
    await settle(page);
    const field = page.getByLabel('Speed', { exact: true });
    await field.tap();

    await cdp.send('Emulation.setCPUThrottlingRate', { rate: cpuSlowdown });
    await page.evaluate(installKeyProbe);
    await hooks.beforeTyping?.(page, cdp);

    let measured = 0;
    for (const key of KEY_STEPS) {
      if (key === SELECT_ALL) {
        await field.evaluate((input: HTMLInputElement) => input.select());
        await page.evaluate((gap) => window.__trueturnKeyProbe!.pause(gap), KEY_GAP_MS);
        continue;
      }
      await page.keyboard.press(key);
      measured += 1;
      await page.evaluate(
        ([count, gap, timeout]) => window.__trueturnKeyProbe!.waitFor(count, gap, timeout),
        [measured, KEY_GAP_MS, KEY_TIMEOUT_MS] as const,
      );
    }
    const records: ProbeRecords = await page.evaluate(() => window.__trueturnKeyProbe!.finish());
    await hooks.afterTyping?.(page, cdp);
    await cdp.send('Emulation.setCPUThrottlingRate', { rate: 1 });
    const finalText = await field.inputValue();
    const expected = textsAfterKeys().at(-1);
    if (finalText !== expected) {
      throw new Error(`the Speed field shows "${finalText}" after typing, not "${expected}"`);
    }
    if (records.samples.length !== MEASURED_KEYS) {
      throw new Error(`${records.samples.length} keys measured, ${MEASURED_KEYS} pressed`);
    }
    return {
      cpuSlowdown,
      keyToRafMs: records.samples.map((s) => s.rafMs - s.keydownMs),
      keyToFrameDoneMs: records.samples.map((s) => s.frameDoneMs - s.keydownMs),
      eventTimingMs: records.samples.map(
        (s) =>
          records.eventTimings.find((e) => Math.abs(e.startMs - s.keydownMs) < 1)?.durationMs ??
          null,
      ),
      longTasksMs: records.longTasks.map((t) => t.durationMs),
      longTaskKeys: records.longTasks.map(
        (t) => records.samples.filter((s) => s.keydownMs <= t.startMs + 1).length,
      ),
      finalText,
    };
  } finally {
    await session.close();
  }
}

/**
 * Waits until start-up is over, as a person would before typing: the page has loaded, the
 * network is quiet (the widgets, the field tools and the service worker's precache are
 * fetched) and the main thread has had an idle moment since.
 */
async function settle(page: Page): Promise<void> {
  await page.waitForLoadState('load');
  await page.waitForLoadState('networkidle');
  await page.evaluate(() => new Promise((r) => requestIdleCallback(() => r(null))));
}
