// @vitest-environment happy-dom
import 'fake-indexeddb/auto';
import { act, cleanup, fireEvent, render, screen, within } from '@testing-library/preact';
import { afterEach, beforeAll, beforeEach, describe, expect, test } from 'vitest';
import { flickerLimits, lightingCheck, svm } from '../../src/core';
import { formatNumber, formatPercent } from '../../src/words/format';
import { lampOf, lighting, litPartsOf } from '../../src/state/lighting';
import { defaultSetup, type Setup } from '../../src/state/model';
import { replaceSetup, setup, speedUnit } from '../../src/state/setup';
import { startSession } from '../../src/state/session';
import { LightingScreen, lightingCsv, partRowsOf } from '../../src/screens/lighting';
import { lightingSummary, partWords } from '../../src/words/lighting';
import { field, tableRows, type } from '../helpers/screen-queries';

beforeAll(async () => {
  await startSession();
});

beforeEach(() => {
  replaceSetup(defaultSetup);
  speedUnit.value = 'rpm';
  render(<LightingScreen />);
});

afterEach(cleanup);

const rows = (): HTMLElement[] => tableRows('lighting-table');

/** A set-up with one part and the default lamps (50 Hz mains, flicker at 100 Hz, 30 %). */
function onePart(name: string, speedRpm: number, features: number, tolerancePercent = 0): Setup {
  return {
    ...structuredClone(defaultSetup),
    parts: [{ name, speedRpm, features, tolerancePercent }],
    activePart: 0,
  };
}

describe('the lighting check screen', () => {
  test('the default fan under 100 Hz flicker turns backward where people can see it: a hazard, shouted', () => {
    // docs/physics.md §2: r = 6 · 29.5 / 100 = 1.77, k = 2, e = −0.23 pitch, a = e·s/n = −3.833 rev/s = −230 rpm.
    const expected = lightingCheck(lampOf(setup.value), litPartsOf(setup.value));
    expect(expected.parts[0].look).toBe('backward');
    expect(expected.parts[0].apparentRpm).toBeCloseTo(-230, 9);
    expect(screen.getByTestId('lighting-headline').textContent).toBe(
      'Hazard: a part can look still or backward',
    );
    expect(screen.getByTestId('lighting-summary').textContent).toBe(lightingSummary(expected));
    // Said once, at the top, naming the part; read out as an alert (once typing pauses).
    const shout = screen.getByTestId('lighting-hazard');
    expect(shout.textContent).toContain('Hazard');
    expect(shout.textContent).toContain('Fan');
    const alert = screen.getByTestId('tool-status-urgent');
    expect(alert.getAttribute('role')).toBe('alert');
    expect(alert.textContent).toBe(
      `Hazard: a part can look still or backward. ${lightingSummary(expected)}`,
    );
    expect(screen.getByTestId('tool-status').textContent).toBe('');
    const [row] = rows();
    expect(row.getAttribute('data-state')).toBe('hazard');
    expect(row.textContent).toContain('Turns backward (230 rpm)');
    expect(within(row).getByTestId('hazard-flag').textContent).toBe('HAZARD');
    expect(row.textContent).toContain(partWords(expected.parts[0], expected));
    expect(screen.getByTestId('safety-notice')).toBeTruthy();
    // 100 flashes a second lies above the 3–60 range of docs/physics.md §10.
    expect(screen.queryByTestId('photosensitivity-notice')).toBeNull();
  });

  test('the light shows its IEEE 1789 class with both lines at its frequency and its SVM', () => {
    // IEEE Std 1789-2015 at 100 Hz: no observable effect 0.0333·100 = 3.33 %, low risk 0.08·100 = 8 %.
    const lines = flickerLimits(100);
    expect(lines.noEffectPercent).toBeCloseTo(3.33, 9);
    expect(lines.lowRiskPercent).toBeCloseTo(8, 9);
    const words = screen.getByTestId('flicker-risk').parentElement!.textContent!;
    expect(screen.getByTestId('flicker-risk').textContent).toBe('Above the low-risk line');
    expect(words).toContain(`${formatPercent(lines.noEffectPercent)} (no observable effect)`);
    expect(words).toContain(`${formatPercent(lines.lowRiskPercent)} (low risk)`);
    // CIE TN 006:2016: SVM = C/T(f), T(100) = 2.865e-5·100^1.543 + 0.225.
    const expectedSvm = 0.3 / (2.865e-5 * Math.pow(100, 1.543) + 0.225);
    expect(svm([{ frequencyHz: 100, amplitude: 0.3 }])).toBeCloseTo(expectedSvm, 12);
    expect(screen.getByTestId('svm').textContent).toBe(formatNumber(expectedSvm, 2));
  });

  test('a two-jaw chuck at 3000 rpm under 100 Hz flicker looks still: a hazard', () => {
    // IEC 60034-1: a 2-pole motor on 50 Hz turns at 3000 rpm synchronous; 2 jaws pass 100 times a second.
    act(() => replaceSetup(onePart('Chuck', 3000, 2)));
    expect(rows()[0].textContent).toContain('Looks still');
    expect(within(rows()[0]).getByTestId('hazard-flag')).toBeTruthy();
    expect(screen.getByTestId('safety-notice')).toBeTruthy();
  });

  test('a steady light (0 % modulation) is fine: no hazard, no remedies, and the deferral to local rules still shows', () => {
    type('Modulation (percent flicker)', '0');
    expect(setup.value.lighting.modulationPercent).toBe(0);
    expect(screen.getByTestId('lighting-headline').textContent).toBe(
      'No part looks still or backward',
    );
    expect(screen.queryByTestId('lighting-hazard')).toBeNull();
    expect(screen.queryByTestId('lighting-remedies')).toBeNull();
    expect(screen.getByTestId('local-rules').textContent).toMatch(
      /lighting rules and machinery-safety rules come first/,
    );
    expect(screen.queryByTestId('safety-notice')).toBeNull();
  });

  test('a hazard lists the remedies: high-frequency drivers, other phases, task lighting, local rules', () => {
    const remedies = screen.getByTestId('lighting-remedies').textContent!;
    expect(remedies).toMatch(/high frequency/);
    expect(remedies).toMatch(/different phases of a three-phase/);
    expect(remedies).toMatch(/task lamp on a steady source/);
    expect(remedies).toMatch(/Local lighting rules and machinery-safety rules/);
    // Said once: the separate deferral shows only when there are no remedies.
    expect(screen.queryByTestId('local-rules')).toBeNull();
  });

  test('lamps flickering at the 50 Hz mains itself bring the seizure caution', () => {
    fireEvent.click(screen.getByLabelText('At mains (50 Hz)'));
    expect(lighting.result.value?.flickerHz).toBe(50);
    expect(screen.getByTestId('photosensitivity-notice')).toBeTruthy();
  });

  test('a custom flicker frequency is checked against the lines at that frequency', () => {
    fireEvent.click(screen.getByLabelText('Other'));
    type('Flicker frequency', '1000');
    // IEEE Std 1789-2015 at 1000 Hz: no observable effect up to 0.0333·1000 = 33.3 %, so 30 % lies below that line.
    expect(screen.getByTestId('flicker-risk').textContent).toBe(
      'Below the no-observable-effect line',
    );
  });

  test('parts are added, renamed, edited and removed here, in the shared set-up', () => {
    fireEvent.click(screen.getByRole('button', { name: 'Add a part' }));
    expect(setup.value.parts).toHaveLength(2);
    expect(setup.value.activePart).toBe(1);
    type('Name of the chosen part', 'Drive pulley');
    type('Speed', '3000');
    type('Blades or marks', '2');
    expect(setup.value.parts[1]).toMatchObject({
      name: 'Drive pulley',
      speedRpm: 3000,
      features: 2,
    });
    expect(rows()).toHaveLength(2);
    expect(rows()[1].textContent).toContain('Drive pulley');
    expect(rows()[1].textContent).toContain('Looks still');
    fireEvent.click(screen.getByRole('button', { name: 'Remove the chosen part' }));
    expect(setup.value.parts.map((p) => p.name)).toEqual(['Fan']);
    expect(rows()).toHaveLength(1);
    expect(
      (screen.getByRole('button', { name: 'Remove the chosen part' }) as HTMLButtonElement)
        .disabled,
    ).toBe(true);
  });

  test('choosing a part in the list makes the part form edit it', () => {
    fireEvent.click(screen.getByRole('button', { name: 'Add a part' }));
    const list = screen.getByTestId('parts-list');
    fireEvent.click(within(list).getAllByRole('button')[0]);
    expect(setup.value.activePart).toBe(0);
    expect(field('Speed').value).toBe('1770');
    expect(field('Name of the chosen part').value).toBe('Fan');
  });

  test('bad modulation gets a message beside the field and the result stays', () => {
    const before = lighting.result.value;
    type('Modulation (percent flicker)', '140');
    expect(field('Modulation (percent flicker)').getAttribute('aria-invalid')).toBe('true');
    expect(
      screen.getAllByRole('alert').some((a) => /from 0 % to 100 %/.test(a.textContent ?? '')),
    ).toBe(true);
    expect(setup.value.lighting.modulationPercent).toBe(30);
    expect(lighting.result.value).toBe(before);
    expect(field('Modulation (percent flicker)').value).toBe('140');
  });

  test('a part name with a direction-override character is refused with a message and the typed text stays', () => {
    // U+202E turns the following text right to left: a known way to disguise text.
    type('Name of the chosen part', 'Fan\u202eblade');
    expect(field('Name of the chosen part').getAttribute('aria-invalid')).toBe('true');
    expect(
      screen.getAllByRole('alert').some((a) => /plain text on one line/.test(a.textContent ?? '')),
    ).toBe(true);
    expect(setup.value.parts[0].name).toBe('Fan');
    expect(field('Name of the chosen part').value).toBe('Fan\u202eblade');
  });

  test('nothing on screen says NaN or Infinity, whatever is typed', () => {
    for (const text of ['', 'abc', 'NaN', '1e999', '-', '0', '-0', '1e-320', '99999999999']) {
      for (const label of ['Speed', 'Blades or marks', 'Tolerance', 'Modulation (percent flicker)'])
        type(label, text);
      const shown = document.body.textContent!.replace(/"[^"]*"/g, '');
      expect(shown, text).not.toMatch(/NaN|Infinity/);
    }
  });

  test('the CSV has one row per part with the light figures on each, as RFC 4180 text', () => {
    fireEvent.click(screen.getByRole('button', { name: 'Add a part' }));
    type('Name of the chosen part', 'Pulley, drive side');
    const result = lighting.result.value!;
    const text = lightingCsv(result, partRowsOf(result, setup.value), 30);
    const lines = text.split('\r\n');
    expect(lines[0]).toMatch(/^part,speed \(rpm\),blades or marks/);
    expect(lines[1]).toMatch(/^Fan,1770,6,1,100,30,elevated,/);
    // RFC 4180 §2.6: a field with a comma is quoted.
    expect(lines[2]).toMatch(/^"Pulley, drive side",1770,1,1,100,30,elevated,/);
    expect(lines).toHaveLength(4);
    expect(lines[3]).toBe('');
  });

  test('the report bar offers print and CSV', () => {
    expect(screen.getByRole('button', { name: 'Print report' })).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Save table (CSV)' })).toBeTruthy();
  });

  test('the hazard is said once: one answer box naming it, then the single stillness caution, no third box', () => {
    // The same hazard once stood in three stacked boxes (answer, shout, caution).
    const panel = screen.getByRole('region', { name: 'Under this light' });
    expect([...panel.children].map((e) => e.tagName)).toEqual(['H2', 'DIV']);
    expect(panel.querySelector('[data-testid="lighting-hazard"]')).toBe(panel.children[1]);
    // Boxes on screen; the live regions that read the answer out are not shown.
    const boxes = [
      ...document.querySelectorAll('[data-testid="lighting-hazard"], [role="alert"], aside'),
    ]
      .filter((e) => !e.matches('[data-testid^="tool-status"]'))
      .filter((e) => /hazard|still turning/i.test(e.textContent ?? ''));
    expect(boxes.map((e) => e.getAttribute('data-testid'))).toEqual([
      'lighting-hazard',
      'safety-notice',
    ]);
  });

  test('at 0 % modulation no part looks still: a two-jaw chuck at 3000 rpm shows its true motion', () => {
    // Steady light samples nothing (docs/physics.md §6); at 30 % the same chuck stands still under 100 Hz.
    act(() => replaceSetup(onePart('Chuck', 3000, 2)));
    expect(rows()[0].textContent).toContain('Looks still');
    type('Modulation (percent flicker)', '0');
    expect(rows()[0].textContent).not.toContain('Looks still');
    expect(rows()[0].textContent).toContain('True motion');
    expect(screen.queryByTestId('safety-notice')).toBeNull();
  });

  test('a PWM light flickers 4/π as strongly as a sine of the same percent flicker, and its SVM says so', () => {
    // A 50 % square wave from 0 to full (100 % flicker): C1 = 2·sin(π/2)/(π/2) = 4/π (Fourier
    // series of a rectangular pulse train); the sine's C1 is 1. SVM from the Perz et al. (2018) fit.
    type('Modulation (percent flicker)', '100');
    const sineSvm = Number(screen.getByTestId('svm').textContent);
    fireEvent.click(screen.getByLabelText('PWM (on–off)'));
    expect(setup.value.lighting.waveform).toBe('rectangular');
    expect(field('Duty cycle').value).toBe('50');
    const T = (f: number) => 2.865e-5 * Math.pow(f, 1.543) + 0.225;
    // Odd harmonics 1, 3, 5 … up to 2 kHz, C_m = 4/(mπ) at 50 % duty (even ones vanish).
    let sum = 0;
    for (let m = 1; m * 100 <= 2000; m += 2) sum += Math.pow(4 / (m * Math.PI) / T(100 * m), 3.7);
    expect(screen.getByTestId('svm').textContent).toBe(formatNumber(Math.pow(sum, 1 / 3.7), 2));
    expect(Number(screen.getByTestId('svm').textContent)).toBeGreaterThan(sineSvm * 1.2);
    expect(screen.getByTestId('light-wave').textContent).toContain('swings 127.3 % of the mean');
  });
});
