// @vitest-environment happy-dom
// Each tool's answer is read out by a polite live region (WCAG 4.1.3 Status Messages): its
// headline once typing pauses, not each value passed on the way; a withdrawn answer once, with
// the field to fix. Fake timers stand for the typist's pace.
import 'fake-indexeddb/auto';
import { act, cleanup, fireEvent, render, screen } from '@testing-library/preact';
import { afterEach, beforeAll, beforeEach, describe, expect, test, vi } from 'vitest';
import { App } from '../../src/app/app';
import { toolScreens } from '../../src/app/screen-list';
import { openScreen } from '../../src/state/navigation';
import { defaultSetup } from '../../src/state/model';
import { replaceSetup } from '../../src/state/setup';
import { startSession } from '../../src/state/session';
import { clearReadings, defaultExpectation, expectation } from '../../src/state/speedFinder';
import { SETTLE_MS } from '../../src/ui/settled-status';

/** A brisk typist: a key every 150 ms, well inside the pause that counts as done. */
const KEY_GAP_MS = 150;

beforeAll(async () => {
  await startSession();
  await toolScreens.load();
});

beforeEach(() => {
  vi.useFakeTimers();
  replaceSetup(defaultSetup);
  clearReadings();
  expectation.value = { ...defaultExpectation };
});

afterEach(() => {
  cleanup();
  vi.useRealTimers();
});

/** What the tool's live regions hold: the polite one, and the assertive one kept for a hazard. */
function status(): string {
  return ['tool-status', 'tool-status-urgent']
    .map((id) => screen.queryByTestId(id)?.textContent ?? '')
    .join('');
}

/** Clears `label`'s field and types `text` a key at a time; returns every text the status took. */
function typeKeyByKey(label: string, text: string): string[] {
  const field = screen.getAllByLabelText(label, { exact: true })[0] as HTMLInputElement;
  const texts = [status()];
  const note = () => {
    if (status() !== texts[texts.length - 1]) texts.push(status());
  };
  for (let i = 0; i <= text.length; i++) {
    fireEvent.input(field, { target: { value: text.slice(0, i) } });
    note();
    act(() => {
      vi.advanceTimersByTime(i < text.length ? KEY_GAP_MS : SETTLE_MS + 300);
    });
    note();
  }
  return texts;
}

/** What a screen reader says: each change to a text with words in it, after the first. */
function heard(texts: string[]): string[] {
  return texts.slice(1).filter((t) => t.trim() !== '');
}

const TOOLS = [
  // Lighting: from a hazard (said as an alert) to 0 % modulation, steady light under which
  // nothing looks still (docs/physics.md §6), said politely.
  {
    id: 'lighting',
    headline: 'lighting-headline',
    field: 'Modulation (percent flicker)',
    typed: '0',
  },
  { id: 'camera', headline: 'plan-headline', field: 'Other frame rates', typed: '59 88.5' },
  { id: 'logger', headline: 'logger-headline', field: 'Sample rate', typed: '18' },
  {
    id: 'speed-finder',
    headline: 'finder-instruction',
    field: 'Blades or marks on the part',
    typed: '12',
  },
  { id: 'whole-machine', headline: 'chain-speed-0', field: 'Speed', typed: '2950' },
] as const;

describe('each tool reads its answer out once typing pauses', () => {
  for (const tool of TOOLS) {
    test(`the ${tool.id} screen: the headline on opening, then once for "${tool.typed}" typed key by key`, () => {
      openScreen(tool.id);
      render(<App />);
      expect(screen.getByTestId('tool-status').getAttribute('aria-live')).toBe('polite');
      expect(status()).toContain(screen.getByTestId(tool.headline).textContent);
      const texts = typeKeyByKey(tool.field, tool.typed);
      expect(heard(texts)).toHaveLength(1);
      expect(status()).toContain(screen.getByTestId(tool.headline).textContent);
    });
  }

  test('a withdrawn answer is read out once, naming the field to fix', () => {
    openScreen('logger');
    render(<App />);
    const texts = typeKeyByKey('Sample rate', 'fast');
    expect(heard(texts)).toEqual([
      expect.stringMatching(/^No answer until Sample rate is fixed\./),
    ]);
  });
});
