// @vitest-environment happy-dom
// useSeen: near once the element comes within the margin of the viewport, later a task after;
// both at once when the page is about to be printed. The viewport is played by a stand-in
// IntersectionObserver that the test triggers by hand.
import { cleanup, render, screen, waitFor } from '@testing-library/preact';
import { useRef } from 'preact/hooks';
import { afterEach, beforeEach, describe, expect, test, vi } from 'vitest';
import { useSeen } from '../../src/ui/seen';

/** The observers made so far, with a way to report the element in or out of view. */
const observers: Array<{ report(inView: boolean): void; disconnected: boolean }> = [];

class StandInObserver {
  private readonly callback: IntersectionObserverCallback;
  private target: Element | null = null;
  disconnected = false;
  constructor(callback: IntersectionObserverCallback) {
    this.callback = callback;
    observers.push(this);
  }
  observe(target: Element) {
    this.target = target;
  }
  disconnect() {
    this.disconnected = true;
  }
  report(inView: boolean) {
    const entry = { isIntersecting: inView, target: this.target } as IntersectionObserverEntry;
    this.callback([entry], this as unknown as IntersectionObserver);
  }
}

function Probe() {
  const ref = useRef<HTMLDivElement>(null);
  const seen = useSeen(ref);
  return (
    <div ref={ref} data-testid="probe">
      {`${seen.near ? 'near' : 'far'} ${seen.later ? 'later' : 'not-yet'}`}
    </div>
  );
}

const shown = () => screen.getByTestId('probe').textContent;

beforeEach(() => {
  observers.length = 0;
  vi.stubGlobal('IntersectionObserver', StandInObserver);
});
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('useSeen', () => {
  test('stays far while the element is out of view', async () => {
    render(<Probe />);
    await waitFor(() => expect(observers).toHaveLength(1));
    observers[0].report(false);
    await new Promise((r) => setTimeout(r, 0));
    expect(shown()).toBe('far not-yet');
  });

  test('comes near first and "later" only in a task after, then stops watching', async () => {
    render(<Probe />);
    await waitFor(() => expect(observers).toHaveLength(1));
    observers[0].report(true);
    // The render from the observer's callback runs as a microtask, before any timer.
    await Promise.resolve();
    await Promise.resolve();
    expect(shown()).toBe('near not-yet');
    await waitFor(() => expect(shown()).toBe('near later'));
    expect(observers[0].disconnected).toBe(true);
  });

  test('printing brings both at once, before any timer runs', async () => {
    render(<Probe />);
    await waitFor(() => expect(observers).toHaveLength(1));
    window.dispatchEvent(new Event('beforeprint'));
    await Promise.resolve();
    await Promise.resolve();
    expect(shown()).toBe('near later');
  });

  test('without IntersectionObserver, both at once', () => {
    vi.stubGlobal('IntersectionObserver', undefined);
    render(<Probe />);
    expect(shown()).toBe('near later');
  });
});
