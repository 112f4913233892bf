// @vitest-environment happy-dom
// docs/physics.md §10 on the tool screens: while an entry a tool's answer reads is refused, the answer
// is withdrawn where it stood and its results are marked not current; a draft entry the answer
// does not read (the speed finder's next reading, not yet added) leaves the answer standing.
import 'fake-indexeddb/auto';
import { cleanup, fireEvent, render, screen, within } from '@testing-library/preact';
import { afterEach, beforeAll, beforeEach, describe, expect, test } from 'vitest';
import { App } from '../../src/app/app';
import { toolScreens } from '../../src/app/screen-list';
import { openScreen } from '../../src/state/navigation';
import { defaultSetup } from '../../src/state/model';
import { clearReadings, defaultExpectation, expectation } from '../../src/state/speedFinder';
import { replaceSetup } from '../../src/state/setup';
import { startSession } from '../../src/state/session';
import { field, type } from '../helpers/screen-queries';

beforeAll(async () => {
  await startSession();
  await toolScreens.load();
});

beforeEach(() => {
  replaceSetup(defaultSetup);
  clearReadings();
  expectation.value = { ...defaultExpectation };
});

afterEach(cleanup);

describe('a tool’s answer while its entries are refused', () => {
  test('the speed finder withdraws its step while the part’s blade count is refused, and brings it back', () => {
    openScreen('speed-finder');
    render(<App />);
    const step = screen.getByTestId('finder-instruction').textContent;
    type('Blades or marks on the part', 'six');
    expect(screen.getByTestId('withdrawn').textContent).toMatch(
      /^No answer until Blades or marks on the part is fixed/,
    );
    expect(screen.getByTestId('finder-instruction').closest('[hidden]')).not.toBeNull();
    fireEvent.click(
      within(screen.getByTestId('withdrawn')).getByRole('button', {
        name: 'Fix Blades or marks on the part',
      }),
    );
    expect(document.activeElement).toBe(field('Blades or marks on the part'));
    type('Blades or marks on the part', '6');
    expect(screen.queryByTestId('withdrawn')).toBeNull();
    expect(screen.getByTestId('finder-instruction').textContent).toBe(step);
  });

  test('the speed finder keeps its step while only the next reading, not yet added, is refused', () => {
    openScreen('speed-finder');
    render(<App />);
    type('Rate where it stood still', 'fast');
    expect(field('Rate where it stood still').getAttribute('aria-invalid')).toBe('true');
    expect(screen.queryByTestId('withdrawn')).toBeNull();
  });

  test('the lighting check withdraws its verdict while the PWM duty is refused', () => {
    openScreen('lighting');
    render(<App />);
    fireEvent.click(screen.getByLabelText('PWM (on–off)'));
    type('Duty cycle', '100');
    expect(field('Duty cycle').getAttribute('aria-invalid')).toBe('true');
    expect(screen.getByTestId('withdrawn').textContent).toMatch(
      /^No answer until Duty cycle is fixed/,
    );
    expect(screen.getAllByTestId('not-current')[0].textContent).toMatch(/fix Duty cycle/);
  });
});
