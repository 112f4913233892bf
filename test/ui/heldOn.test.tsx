// @vitest-environment happy-dom
// useHeldOn: on at once, off only once the changes have stood still for the hold.
import { signal } from '@preact/signals';
import { act, cleanup, render, screen } from '@testing-library/preact';
import { afterEach, beforeEach, describe, expect, test, vi } from 'vitest';
import { useHeldOn } from '../../src/ui/heldOn';

const HOLD_MS = 700;
const flag = signal(false);
const changes = signal(0);
let renders = 0;

function Probe() {
  renders++;
  const shown = useHeldOn(flag, changes, HOLD_MS);
  return <p data-testid="probe">{shown.value ? 'shown' : 'hidden'}</p>;
}

const shown = () => screen.getByTestId('probe').textContent;

/** A change of the entries with the flag at `on`, as one keystroke makes it. */
function key(on: boolean) {
  act(() => {
    flag.value = on;
    changes.value++;
  });
}

beforeEach(() => {
  vi.useFakeTimers();
  flag.value = false;
  changes.value = 0;
  renders = 0;
});
afterEach(() => {
  cleanup();
  vi.useRealTimers();
});

describe('useHeldOn', () => {
  test('follows the flag at once when it comes on', () => {
    render(<Probe />);
    act(() => void vi.runAllTimers());
    expect(shown()).toBe('hidden');
    key(true);
    expect(shown()).toBe('shown');
  });

  test('stays on while the changes keep coming, and goes off once they have stood for the hold', () => {
    flag.value = true;
    render(<Probe />);
    act(() => void vi.runAllTimers());
    expect(shown()).toBe('shown');
    // Keys 150 ms apart with the flag off: each starts the wait again.
    for (let i = 0; i < 8; i++) {
      key(false);
      act(() => void vi.advanceTimersByTime(150));
      expect(shown()).toBe('shown');
    }
    act(() => void vi.advanceTimersByTime(HOLD_MS - 150 - 1));
    expect(shown()).toBe('shown');
    act(() => void vi.advanceTimersByTime(1));
    expect(shown()).toBe('hidden');
  });

  test('a flag back on during the hold keeps it on for good', () => {
    flag.value = true;
    render(<Probe />);
    act(() => void vi.runAllTimers());
    key(false);
    act(() => void vi.advanceTimersByTime(300));
    key(true);
    act(() => void vi.advanceTimersByTime(10 * HOLD_MS));
    expect(shown()).toBe('shown');
  });

  test('re-renders its component only when what it shows flips', () => {
    flag.value = true;
    render(<Probe />);
    act(() => void vi.runAllTimers());
    const before = renders;
    for (let i = 0; i < 5; i++) key(i % 2 === 0);
    expect(renders).toBe(before);
    act(() => void vi.advanceTimersByTime(HOLD_MS));
    // The last key left the flag on (i = 4): nothing flipped.
    expect(shown()).toBe('shown');
    expect(renders).toBe(before);
  });
});
