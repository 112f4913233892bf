// @vitest-environment happy-dom
// No IndexedDB at all (as in some private windows): the app says so and keeps working in memory.
import { cleanup, configure, fireEvent, render, screen, waitFor } from '@testing-library/preact';
import { afterEach, beforeAll, describe, expect, test } from 'vitest';
import { App } from '../../src/app/app';
import { toolScreens } from '../../src/app/screen-list';
import { results } from '../../src/screens/check/lazy-results';
import { machines } from '../../src/state/machines';
import { startSession } from '../../src/state/session';

beforeAll(async () => {
  expect(globalThis.indexedDB).toBeUndefined();
  await startSession();
  // The Machines screen loads after the first paint, with the field tools.
  await toolScreens.load();
  // Keeping a machine sits with the check screen's lists, which load after the first paint.
  await results.load();
});

afterEach(cleanup);

// Saving goes through (fake) IndexedDB; on a busy shared machine that can take over a second.
configure({ asyncUtilTimeout: 5000 });

describe('without storage', () => {
  test('a banner says saving is off and changes last only for this tab', () => {
    render(<App />);
    expect(screen.getByTestId('storage-status').textContent).toMatch(
      /Saving is off.*until this tab is closed/,
    );
  });

  test('machines can still be saved, in memory', async () => {
    render(<App />);
    fireEvent.input(screen.getByLabelText('Machine name'), { target: { value: 'Kiln fan' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save as new machine' }));
    await waitFor(() => expect(machines.value.map((m) => m.name)).toContain('Kiln fan'));
    fireEvent.click(screen.getByRole('button', { name: 'Machines' }));
    expect(screen.getByTestId('machine-list').textContent).toContain('Kiln fan');
  });
});
