// @vitest-environment happy-dom
import { signal } from '@preact/signals';
import { cleanup, render, screen, waitFor } from '@testing-library/preact';
import { afterEach, describe, expect, test } from 'vitest';
import { readLive, type Live } from '../../src/ui/live';

afterEach(cleanup);

let outerRenders = 0;
function Flag({ on }: { on: Live<boolean> }) {
  return <p data-testid="flag">{readLive(on) ? 'on' : 'off'}</p>;
}
function Outer({ on }: { on: Live<boolean> }) {
  outerRenders++;
  return <Flag on={on} />;
}

describe('readLive', () => {
  test('reads a plain value as it is', () => {
    render(<Outer on={true} />);
    expect(screen.getByTestId('flag').textContent).toBe('on');
  });

  test('follows a signal in the component that reads it, not in the one that hands it over', async () => {
    const on = signal(false);
    outerRenders = 0;
    render(<Outer on={on} />);
    expect(screen.getByTestId('flag').textContent).toBe('off');
    on.value = true;
    await waitFor(() => expect(screen.getByTestId('flag').textContent).toBe('on'));
    on.value = false;
    await waitFor(() => expect(screen.getByTestId('flag').textContent).toBe('off'));
    expect(outerRenders).toBe(1);
  });
});
