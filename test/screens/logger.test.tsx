// @vitest-environment happy-dom
import 'fake-indexeddb/auto';
import { act, cleanup, fireEvent, render, screen, within } from '@testing-library/preact';
import { afterEach, beforeAll, beforeEach, describe, expect, test } from 'vitest';
import { loggerPlan, lowPassGainDb, rcCutoffHz } from '../../src/core';
import { ALIAS_AFTER_CONVERTER_NOTE, proposalWords } from '../../src/words/logger';
import { formatNumber, formatPrecise } from '../../src/words/format';
import {
  bladeCounts,
  filterCutoffHz,
  filterKind,
  filterOrder,
  loggerPlanning,
  resetLoggerEntries,
  sampleHz,
} from '../../src/state/loggerPlanning';
import { defaultSetup, type Setup } from '../../src/state/model';
import { replaceSetup, setSpeedRpm, setup } from '../../src/state/setup';
import { startSession } from '../../src/state/session';
import { LoggerScreen } from '../../src/screens/logger';
import { loggerCsv } from '../../src/screens/logger/csv';
import { field, tableRows, type } from '../helpers/screen-queries';

beforeAll(async () => {
  await startSession();
});

beforeEach(() => {
  replaceSetup(defaultSetup);
  resetLoggerEntries();
  render(<LoggerScreen />);
});

afterEach(cleanup);

const rows = (): HTMLElement[] => tableRows('logger-table');

function rowOf(label: string): HTMLElement {
  const row = rows().find((r) => r.textContent?.startsWith(label));
  if (!row) throw new Error(`no row ${label}`);
  return row;
}

/** A shaft with a single mark (no blade pass) at `rpm`. */
function shaft(rpm: number): Setup {
  return {
    ...structuredClone(defaultSetup),
    parts: [{ name: 'Shaft', speedRpm: rpm, features: 1, tolerancePercent: 0 }],
    activePart: 0,
  };
}

describe('the data logger screen', () => {
  test('20 Hz sampled 18 times a second lands at 2 Hz: an alias with no filter, marked as failing', () => {
    // docs/physics.md, facts of the trade (common practice): a 20 Hz signal sampled at 18/s looks like 2 Hz.
    act(() => replaceSetup(shaft(1200)));
    type('Shaft harmonics', '1');
    type('Sample rate', '18');
    const row = rowOf('1× shaft');
    expect(row.textContent).toContain('20 Hz');
    expect(row.textContent).toContain('2 Hz');
    expect(row.textContent).toContain('Yes: a false tone');
    expect(row.getAttribute('data-state')).toBe('fail');
    expect(within(row).getByTestId('component-result').textContent).toBe('Fail');
    expect(screen.getByTestId('logger-headline').textContent).toBe(
      'False tones will reach the record',
    );
  });

  test('says plainly that filtering after the converter cannot remove an alias', () => {
    expect(screen.getByTestId('alias-note').textContent).toBe(ALIAS_AFTER_CONVERTER_NOTE);
    expect(ALIAS_AFTER_CONVERTER_NOTE).toMatch(
      /^Filtering after the converter cannot remove an alias/,
    );
  });

  test('16 bits resolve 98.08 dB, the attenuation an alias needs', () => {
    // Bennett 1948 / Analog Devices MT-001: 6.02·16 + 1.76 = 98.08 dB.
    expect(screen.getByTestId('logger-facts').textContent).toContain('98.08 dB');
    type('Converter bits', '12');
    // 6.02·12 + 1.76 = 74 dB.
    expect(screen.getByTestId('logger-facts').textContent).toContain('74 dB');
  });

  test('the core doc example: 25 Hz shaft to 10×, 16 bits, 1000 samples/s, no filter; its proposal applied with one tap makes the record clean', () => {
    act(() => replaceSetup(shaft(1500)));
    type('Shaft harmonics', '10');
    const plan = loggerPlan({
      tones: { shaftHz: 25, harmonics: 10 },
      sampleHz: 1000,
      filter: { kind: 'none' },
      bits: 16,
    });
    expect(plan.proposal?.sampleHz).toBe(1600);
    expect(plan.proposal?.order).toBe(8);
    expect(screen.getByTestId('logger-proposal-text').textContent).toBe(proposalWords(plan));
    // Nothing aliases at 1000 samples/s, but nothing stops higher content from folding in.
    expect(rows().every((r) => r.textContent?.includes('No'))).toBe(true);
    // fs − fmax = 1000 − 250 = 750 Hz folds onto the band: said once, in the guard line.
    expect(screen.getByTestId('logger-guard').textContent).toContain('750 Hz or above');
    expect(screen.getByTestId('logger-guard').textContent).toContain('not enough');
    expect(plan.notes).toContain('guard-short');
    expect(screen.getByTestId('logger-notes').textContent).not.toContain('Content at 750 Hz');
    fireEvent.click(screen.getByRole('button', { name: 'Use this sample rate and filter' }));
    expect(sampleHz.value).toBe(1600);
    expect(filterKind.value).toBe('butterworth');
    expect(filterOrder.value).toBe(8);
    expect(filterCutoffHz.value).toBeCloseTo(plan.proposal!.cutoffHz, 9);
    expect(field('Sample rate').value).toBe('1600');
    expect(field('Order').value).toBe('8');
    expect(loggerPlanning.result.value?.allPass).toBe(true);
    expect(screen.getByTestId('logger-headline').textContent).toBe('The record is clean');
    expect(screen.getByTestId('logger-guard').textContent).toContain('enough');
  });

  test('an RC stage given by R and C cuts each component by what the core computes', () => {
    act(() => replaceSetup(shaft(1500)));
    fireEvent.click(screen.getByLabelText('RC'));
    fireEvent.click(screen.getByLabelText('R and C'));
    type('Resistance', '1k');
    type('Capacitance', '1 µF');
    // fc = 1/(2π · 1000 Ω · 1 µF) = 159.15 Hz (first-order RC).
    expect(rcCutoffHz(1000, 1e-6)).toBeCloseTo(159.15494309189535, 12);
    expect(screen.getByTestId('logger-rc-result').textContent).toContain(
      `${formatNumber(159.15494309189535)} Hz`,
    );
    type('Shaft harmonics', '4');
    const row = rowOf('4× shaft');
    expect(row.textContent).toContain(
      `${formatNumber(-lowPassGainDb(100, 159.15494309189535, 1))} dB`,
    );
  });

  test('a Butterworth filter is given by order and cutoff; 40 dB a decade for order 2', () => {
    act(() => replaceSetup(shaft(60_000)));
    type('Shaft harmonics', '1');
    fireEvent.click(screen.getByLabelText('Butterworth'));
    type('Order', '2');
    type('Cutoff', '100');
    // Butterworth 1930: order 2 at ten times the cutoff gives 40.0004 dB (see lowPassGainDb's example).
    expect(rowOf('1× shaft').textContent).toContain(`${formatNumber(40.00043427276863)} dB`);
  });

  test('blade pass and gear mesh join the table; the blade count starts from the part', () => {
    // The default fan: 6 blades at 1770 rpm = 29.5 Hz, so blade pass is 177 Hz.
    expect(bladeCounts.value).toBeNull();
    expect(field('Blade counts').value).toBe('6');
    expect(rowOf('blade pass (6 blades)').textContent).toContain(`${formatPrecise(177)} Hz`);
    type('Gear teeth', '23');
    // Gear mesh 23 · 29.5 = 678.5 Hz, above half of 1000 samples/s: it folds to 1000 − 678.5 = 321.5 Hz.
    const mesh = rowOf('gear mesh (23 teeth)');
    expect(mesh.textContent).toContain('678.5 Hz');
    expect(mesh.textContent).toContain('321.5 Hz');
    type('Other tones', '50 Hz 2 kHz');
    expect(rowOf('added tone 2').textContent).toContain('2,000 Hz');
  });

  test('the shaft speed is read from the chosen part and follows it', () => {
    act(() => setSpeedRpm(3000));
    expect(screen.getByTestId('logger-shaft').textContent).toContain('3,000 rpm');
    expect(rowOf('1× shaft').textContent).toContain('50 Hz');
  });

  test('nothing typed in the logger writes a speed into the machine\u2019s parts', () => {
    const before = setup.value.parts;
    expect(screen.queryByLabelText('Shaft speed')).toBeNull();
    for (const [label, text] of [
      ['Shaft harmonics', '6'],
      ['Blade counts', '5'],
      ['Gear teeth', '23'],
      ['Other tones', '50'],
      ['Sample rate', '2000'],
      ['Converter bits', '12'],
    ] as const) {
      type(label, text);
    }
    expect(setup.value.parts).toEqual(before);
  });

  test('bad text gets a message beside its field and the last good table stays', () => {
    const before = loggerPlanning.result.value;
    for (const [label, text, message] of [
      ['Sample rate', 'fast', /not a number/],
      ['Converter bits', '16.5', /whole number from 1 to 64/],
      ['Shaft harmonics', '0', /whole number from 1 to 200/],
      ['Blade counts', '6 1.5', /Item 2 \("1.5"\): .*whole number/],
      ['Other tones', '-5', /above 0 Hz/],
    ] as const) {
      type(label, text);
      expect(field(label).getAttribute('aria-invalid'), label).toBe('true');
      expect(
        screen.getAllByRole('alert').some((a) => message.test(a.textContent ?? '')),
        label,
      ).toBe(true);
      expect(field(label).value).toBe(text);
    }
    expect(loggerPlanning.result.value).toBe(before);
  });

  test('a shaft that does not turn: the core refuses it and the last table stays with its message', () => {
    const before = loggerPlanning.result.value;
    act(() => setSpeedRpm(0));
    // docs/physics.md §10: the answer is withdrawn with the core's words; the table stays, marked not current.
    expect(screen.getByTestId('withdrawn').textContent).toMatch(/shaft speed/);
    expect(screen.getByTestId('not-current')).toBeTruthy();
    expect(loggerPlanning.result.value).toBe(before);
    // Kept in place for when the entries are good again, but out of reach of taps and screen readers.
    const kept = screen.getByTestId('not-current').parentElement!;
    expect(kept.querySelectorAll('tr').length).toBeGreaterThan(1);
    expect(kept.querySelector('[inert]')).not.toBeNull();
  });

  test('nothing on screen says NaN or Infinity, whatever is typed', () => {
    fireEvent.click(screen.getByLabelText('Butterworth'));
    for (const text of ['', 'abc', 'NaN', '1e999', '-', '0', '-0', '1e-320', '99999999999']) {
      for (const label of [
        'Shaft harmonics',
        'Blade counts',
        'Gear teeth',
        'Other tones',
        'Sample rate',
        'Converter bits',
        'Order',
        'Cutoff',
      ]) {
        type(label, text);
      }
      const shown = document.body.textContent!.replace(/"[^"]*"/g, '');
      expect(shown, text).not.toMatch(/NaN|Infinity/);
    }
  });

  test('the CSV has a row per component with where it lands and whether it passes', () => {
    const plan = loggerPlanning.result.value!;
    const lines = loggerCsv(plan, 1000).split('\r\n');
    expect(lines[0]).toBe(
      'component,frequency (Hz),sample rate (Hz),lands at (Hz),aliased,filter gain (dB),attenuation needed (dB),converter range (dB),pass,in words',
    );
    // Rounded as on screen, yes and no in words (no true/false for a spreadsheet to misread).
    expect(lines[1].startsWith('1× shaft,29.5,1000,29.5,no,0,0,98.08,yes,')).toBe(true);
    expect(lines).toHaveLength(plan.components.length + 2);
  });
});
