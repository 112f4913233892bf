// @vitest-environment happy-dom
// What a screen reader hears of the verdict while someone types (WCAG 4.1.3 Status Messages):
// the verdict's polite live region says the settled answer once typing pauses, not each value
// passed on the way (1, 17, 178, 1780), while the verdict on screen follows every keystroke.
// Fake timers stand for the typist's pace; the region is read after every keystroke and pause.
import 'fake-indexeddb/auto';
import { act, cleanup, fireEvent, render, screen, within } from '@testing-library/preact';
import { afterEach, beforeAll, beforeEach, describe, expect, test, vi } from 'vitest';
import { App } from '../../../src/app/app';
import { openScreen } from '../../../src/state/navigation';
import { defaultSetup } from '../../../src/state/model';
import { flashUnit, replaceSetup, speedUnit } from '../../../src/state/setup';
import { startSession } from '../../../src/state/session';
import { SETTLE_MS } from '../../../src/ui/settled-status';

/** A brisk typist: a key every 150 ms, well inside the pause that counts as done. */
const KEY_GAP_MS = 150;

beforeAll(async () => {
  await startSession();
});

beforeEach(() => {
  vi.useFakeTimers();
  replaceSetup(defaultSetup);
  speedUnit.value = 'rpm';
  flashUnit.value = 'fpm';
  openScreen('check');
  render(<App />);
});

afterEach(() => {
  cleanup();
  vi.useRealTimers();
});

/** The verdict panel's live region. */
function liveRegion(): HTMLElement {
  return within(screen.getByRole('region', { name: 'What you will see' })).getByRole('status');
}

/** Every text the live region takes, in order, each change once (an empty region included). */
function listen(): { texts: string[]; note: () => void; heard: () => string[] } {
  const texts = [liveRegion().textContent ?? ''];
  return {
    texts,
    note: () => {
      const now = liveRegion().textContent ?? '';
      if (now !== texts[texts.length - 1]) texts.push(now);
    },
    /** What a screen reader says: each change to a text with words in it. */
    heard: () => texts.slice(1).filter((t) => t.trim() !== ''),
  };
}

function wait(ms: number, ears: { note: () => void }): void {
  act(() => {
    vi.advanceTimersByTime(ms);
  });
  ears.note();
}

/** Clears the field, then types `text` a key at a time, as a person does. */
function typeKeyByKey(label: string, text: string, ears: { note: () => void }): void {
  const field = screen.getByLabelText(label, { exact: true }) as HTMLInputElement;
  for (let i = 0; i <= text.length; i++) {
    fireEvent.input(field, { target: { value: text.slice(0, i) } });
    ears.note();
    if (i < text.length) wait(KEY_GAP_MS, ears);
  }
}

/** The visible verdict, headline and speeds, as the live region says it. */
function shownVerdict(): string {
  return screen.getByTestId('verdict').textContent ?? '';
}

describe('the verdict read out while typing', () => {
  test('typing 1780, pausing, then 1750 is read out twice: once for each settled speed', () => {
    const ears = listen();
    typeKeyByKey('Speed', '1780', ears);
    wait(SETTLE_MS + 300, ears);
    const at1780 = shownVerdict();
    expect(liveRegion().textContent).toBe(at1780);
    typeKeyByKey('Speed', '1750', ears);
    wait(SETTLE_MS + 300, ears);
    const at1750 = shownVerdict();
    expect(at1750).not.toBe(at1780);
    expect(ears.heard()).toEqual([at1780, at1750]);
  });

  test('while typing the region is empty, so it never holds a verdict for a value no longer typed', () => {
    const ears = listen();
    const before = liveRegion().textContent;
    expect(before).toBe(shownVerdict());
    fireEvent.input(screen.getByLabelText('Speed', { exact: true }), { target: { value: '17' } });
    // On screen at once; in the region not yet.
    expect(shownVerdict()).not.toBe(before);
    expect(liveRegion().textContent).toBe('');
    wait(SETTLE_MS - 1, ears);
    expect(liveRegion().textContent).toBe('');
    wait(1, ears);
    expect(liveRegion().textContent).toBe(shownVerdict());
  });

  test('a withdrawn verdict is read out once, with the field to fix and its message', () => {
    const ears = listen();
    typeKeyByKey('Speed', 'abc', ears);
    wait(SETTLE_MS + 300, ears);
    const heard = ears.heard();
    expect(heard).toHaveLength(1);
    expect(heard[0]).toMatch(/^No verdict until Speed is fixed\. Speed: .+/);
  });

  test('a speed typed back to the one read out last is read out again once typing pauses, not at once', () => {
    const ears = listen();
    const first = liveRegion().textContent;
    typeKeyByKey('Speed', '1771', ears);
    fireEvent.input(screen.getByLabelText('Speed', { exact: true }), {
      target: { value: '1770' },
    });
    ears.note();
    expect(shownVerdict()).toBe(first);
    expect(liveRegion().textContent).toBe('');
    wait(SETTLE_MS, ears);
    expect(ears.heard()).toEqual([first]);
  });
});
