// @vitest-environment happy-dom
import 'fake-indexeddb/auto';
import {
  cleanup,
  configure,
  fireEvent,
  render,
  screen,
  waitFor,
  within,
} from '@testing-library/preact';
import { afterEach, beforeAll, beforeEach, describe, expect, test } from 'vitest';
import { App } from '../../src/app/app';
import { toolScreens } from '../../src/app/screen-list';
import { results } from '../../src/screens/check/lazy-results';
import { currentScreen, openScreen } from '../../src/state/navigation';
import { EXAMPLE_MACHINE_NAME, exampleSetup } from '../../src/state/example';
import { exportAll, machines } from '../../src/state/machines';
import { defaultSetup } from '../../src/state/model';
import { replaceSetup, setup } from '../../src/state/setup';
import { openMachineId, startSession } from '../../src/state/session';

beforeAll(async () => {
  await startSession();
  // The Machines screen loads after the first paint, with the field tools.
  await toolScreens.load();
  // Keeping a machine sits with the check screen's lists, which load after the first paint.
  await results.load();
});

beforeEach(() => {
  replaceSetup(defaultSetup);
  openScreen('check');
  render(<App />);
});

afterEach(cleanup);

// Saving goes through (fake) IndexedDB; on a busy shared machine that can take over a second.
configure({ asyncUtilTimeout: 5000 });

function names(): string[] {
  return within(screen.getByTestId('machine-list'))
    .getAllByRole('heading', { level: 3 })
    .map((h) => h.textContent ?? '');
}

function rowOf(name: string): HTMLElement {
  const heading = within(screen.getByTestId('machine-list')).getByRole('heading', {
    level: 3,
    name,
  });
  return heading.closest('article') as HTMLElement;
}

async function saveAs(name: string) {
  fireEvent.input(screen.getByLabelText('Machine name'), { target: { value: name } });
  fireEvent.click(screen.getByRole('button', { name: 'Save as new machine' }));
  await waitFor(() => expect(machines.value.some((m) => m.name === name.trim())).toBe(true));
  // And the panel shows the machine as the one open (under load its render can lag the store).
  await waitFor(() => expect(document.body.textContent).toContain(`Opened from ${name.trim()}`));
}

describe('saved machines', () => {
  test('a first run finds the example machine', () => {
    fireEvent.click(screen.getByRole('button', { name: 'Machines' }));
    expect(names()).toContain(EXAMPLE_MACHINE_NAME);
  });

  test('saving the current set-up adds a named machine that reopens it', async () => {
    fireEvent.input(screen.getByLabelText('Speed'), { target: { value: '2400' } });
    await saveAs('Press 4 flywheel');
    fireEvent.click(screen.getByRole('button', { name: 'Machines' }));
    expect(names()).toContain('Press 4 flywheel');
    replaceSetup(defaultSetup);
    fireEvent.click(within(rowOf('Press 4 flywheel')).getByRole('button', { name: 'Open' }));
    expect(currentScreen.value).toBe('check');
    expect(setup.value.parts[0].speedRpm).toBe(2400);
    expect(screen.getByText('Opened from', { exact: false }).textContent).toContain(
      'Press 4 flywheel',
    );
  });

  test('a name already used is refused with a message and nothing is added', async () => {
    const count = machines.value.length;
    fireEvent.input(screen.getByLabelText('Machine name'), {
      target: { value: EXAMPLE_MACHINE_NAME },
    });
    fireEvent.click(screen.getByRole('button', { name: 'Save as new machine' }));
    await waitFor(() => expect(screen.getByRole('alert').textContent).toMatch(/already saved/));
    expect(machines.value.length).toBe(count);
  });

  test('changes can be saved back to the machine they were opened from', async () => {
    await saveAs('Mixer shaft');
    const id = openMachineId.value!;
    fireEvent.input(screen.getByLabelText('Blades or marks'), { target: { value: '3' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save changes to this machine' }));
    await waitFor(() =>
      expect(machines.value.find((m) => m.id === id)?.setup.parts[0].features).toBe(3),
    );
  });

  test('saving changes with the name field emptied says so in words and changes nothing', async () => {
    await saveAs('Pelleter die');
    const id = openMachineId.value!;
    fireEvent.input(screen.getByLabelText('Machine name'), { target: { value: '  ' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save changes to this machine' }));
    expect(screen.getByTestId('keep-outcome').textContent).toBe(
      'The machine name is empty: type a name above (it was "Pelleter die"), then save.',
    );
    expect(machines.value.find((m) => m.id === id)?.name).toBe('Pelleter die');
  });

  test('rename, duplicate, delete and undo', async () => {
    await saveAs('Conveyor idler');
    fireEvent.click(screen.getByRole('button', { name: 'Machines' }));

    fireEvent.click(within(rowOf('Conveyor idler')).getByRole('button', { name: 'Rename' }));
    fireEvent.input(screen.getByLabelText('New name'), {
      target: { value: 'Conveyor tail idler' },
    });
    fireEvent.click(screen.getByRole('button', { name: 'Save name' }));
    await waitFor(() =>
      expect(
        within(rowOf('Conveyor tail idler')).queryByRole('button', { name: 'Duplicate' }),
      ).not.toBeNull(),
    );
    expect(names()).not.toContain('Conveyor idler');

    fireEvent.click(
      within(rowOf('Conveyor tail idler')).getByRole('button', { name: 'Duplicate' }),
    );
    await waitFor(() => expect(names()).toContain('Conveyor tail idler copy'));

    fireEvent.click(
      within(rowOf('Conveyor tail idler copy')).getByRole('button', { name: 'Delete' }),
    );
    await waitFor(() => expect(names()).not.toContain('Conveyor tail idler copy'));
    expect(screen.getByTestId('undo-bar').textContent).toContain('Conveyor tail idler copy');
    fireEvent.click(within(screen.getByTestId('undo-bar')).getByRole('button', { name: 'Undo' }));
    await waitFor(() => expect(names()).toContain('Conveyor tail idler copy'));
  });

  test('a blank new name is refused beside the field', async () => {
    fireEvent.click(screen.getByRole('button', { name: 'Machines' }));
    fireEvent.click(within(rowOf(EXAMPLE_MACHINE_NAME)).getByRole('button', { name: 'Rename' }));
    fireEvent.input(screen.getByLabelText('New name'), { target: { value: '   ' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save name' }));
    await waitFor(() => expect(screen.getByRole('alert').textContent).toMatch(/blank/));
    expect(names()).toContain(EXAMPLE_MACHINE_NAME);
  });

  test('a bad import file is refused with a message and changes nothing', async () => {
    fireEvent.click(screen.getByRole('button', { name: 'Machines' }));
    const before = machines.value;
    const input = screen.getByTestId('import-file') as HTMLInputElement;
    const file = new File(['{"format":"something else"'], 'machines.json', {
      type: 'application/json',
    });
    Object.defineProperty(input, 'files', { value: [file], configurable: true });
    fireEvent.change(input);
    await waitFor(() =>
      expect(screen.getByTestId('machines-outcome').textContent).toMatch(/Nothing was imported/),
    );
    expect(machines.value).toBe(before);
  });

  test('an import file over 1 MB is refused by its size, unread, and changes nothing', async () => {
    fireEvent.click(screen.getByRole('button', { name: 'Machines' }));
    const before = machines.value;
    const input = screen.getByTestId('import-file') as HTMLInputElement;
    let reads = 0;
    const big = {
      name: 'film.mp4',
      size: 200 * 1024 * 1024,
      text: () => {
        reads++;
        return Promise.reject(new Error('a 200 MB file must not be read'));
      },
    };
    Object.defineProperty(input, 'files', { value: [big], configurable: true });
    fireEvent.change(input);
    await waitFor(() =>
      expect(screen.getByTestId('machines-outcome').textContent).toBe(
        'Nothing was imported. This file is larger than 1 MB; a Trueturn machines file is never that big.',
      ),
    );
    expect(reads).toBe(0);
    expect(machines.value).toBe(before);
  });

  test('an exported file imports back, renamed where names clash', async () => {
    fireEvent.click(screen.getByRole('button', { name: 'Machines' }));
    const count = machines.value.length;
    const input = screen.getByTestId('import-file') as HTMLInputElement;
    const file = new File([exportAll()], 'machines.json', { type: 'application/json' });
    Object.defineProperty(input, 'files', { value: [file], configurable: true });
    fireEvent.change(input);
    await waitFor(() =>
      expect(screen.getByTestId('machines-outcome').textContent).toMatch(
        new RegExp(`Imported ${count} machines`),
      ),
    );
    expect(machines.value.length).toBe(2 * count);
    expect(names()).toContain(`${EXAMPLE_MACHINE_NAME} (imported)`);
  });

  test('names and notes are shown as text, never as markup', async () => {
    await saveAs('<img src=x onerror="globalThis.__hit=1">');
    fireEvent.click(screen.getByRole('button', { name: 'Machines' }));
    expect(names()).toContain('<img src=x onerror="globalThis.__hit=1">');
    expect(screen.getByTestId('machine-list').querySelector('img')).toBeNull();
    expect((globalThis as { __hit?: number }).__hit).toBeUndefined();
  });

  test('the example machine opens the invented cooler fan', () => {
    fireEvent.click(screen.getByRole('button', { name: 'Machines' }));
    fireEvent.click(within(rowOf(EXAMPLE_MACHINE_NAME)).getByRole('button', { name: 'Open' }));
    expect(setup.value).toEqual(exampleSetup);
  });

  test('Rename puts focus in the name field; Save name and Cancel bring it back to that Rename button', async () => {
    await saveAs('Kiln 7 booster fan');
    fireEvent.click(screen.getByRole('button', { name: 'Machines' }));
    const renameButton = () =>
      within(rowOf('Kiln 7 booster fan')).getByRole('button', { name: 'Rename' });
    fireEvent.click(renameButton());
    await waitFor(() => expect(document.activeElement).toBe(screen.getByLabelText('New name')));
    fireEvent.click(screen.getByRole('button', { name: 'Cancel' }));
    await waitFor(() => expect(document.activeElement).toBe(renameButton()));

    fireEvent.click(renameButton());
    await waitFor(() => expect(document.activeElement).toBe(screen.getByLabelText('New name')));
    const placeBefore = names().indexOf('Kiln 7 booster fan');
    // A new name that moves the machine to another place in the (sorted) list.
    fireEvent.input(screen.getByLabelText('New name'), { target: { value: 'Aa kiln 7 booster' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save name' }));
    await waitFor(() =>
      expect(document.activeElement).toBe(
        within(rowOf('Aa kiln 7 booster')).getByRole('button', { name: 'Rename' }),
      ),
    );
    expect(names().indexOf('Aa kiln 7 booster')).toBeLessThan(placeBefore);
  });

  test('after Delete focus goes to the next machine, or to Undo when the last one went', async () => {
    await saveAs('Zz focus one');
    await saveAs('Zz focus two');
    fireEvent.click(screen.getByRole('button', { name: 'Machines' }));
    expect(names().slice(-2)).toEqual(['Zz focus one', 'Zz focus two']);
    fireEvent.click(within(rowOf('Zz focus one')).getByRole('button', { name: 'Delete' }));
    await waitFor(() => expect(document.activeElement).toBe(rowOf('Zz focus two')));
    expect(document.activeElement?.getAttribute('aria-labelledby')).toBeTruthy();

    fireEvent.click(within(rowOf('Zz focus two')).getByRole('button', { name: 'Delete' }));
    await waitFor(() =>
      expect(document.activeElement).toBe(
        within(screen.getByTestId('undo-bar')).getByRole('button', { name: 'Undo' }),
      ),
    );
    // Undo brings it back and focus goes with it.
    fireEvent.click(within(screen.getByTestId('undo-bar')).getByRole('button', { name: 'Undo' }));
    await waitFor(() =>
      expect(document.activeElement).toBe(
        within(rowOf('Zz focus two')).getByRole('button', { name: 'Open' }),
      ),
    );
  });

  test('with the list emptied, closing the undo bar puts focus on the list heading, never the page', async () => {
    fireEvent.click(screen.getByRole('button', { name: 'Machines' }));
    while (machines.value.length > 0) {
      const count = machines.value.length;
      const first = within(screen.getByTestId('machine-list')).getAllByRole('article')[0];
      fireEvent.click(within(first).getByRole('button', { name: 'Delete' }));
      await waitFor(() => expect(machines.value.length).toBe(count - 1));
      // Focus is on the next machine, or on Undo after the last one: never the page.
      await waitFor(() => expect(document.activeElement).not.toBe(document.body));
    }
    const undo = within(screen.getByTestId('undo-bar')).getByRole('button', { name: 'Undo' });
    await waitFor(() => expect(document.activeElement).toBe(undo));
    fireEvent.click(within(screen.getByTestId('undo-bar')).getByRole('button', { name: 'Close' }));
    await waitFor(() =>
      expect(document.activeElement).toBe(
        screen.getByRole('heading', { name: 'Saved machines', level: 2 }),
      ),
    );
    expect(screen.getByText(/No machines saved yet/)).toBeTruthy();
  });
});
