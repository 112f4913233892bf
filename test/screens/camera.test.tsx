// @vitest-environment happy-dom
import 'fake-indexeddb/auto';
import { act, cleanup, fireEvent, render, screen, within } from '@testing-library/preact';
import { afterEach, beforeAll, beforeEach, describe, expect, test } from 'vitest';
import { cameraPlan, exposureFromShutterAngle } from '../../src/core';
import { formatExposure, formatPrecise } from '../../src/words/format';
import { currentScreen, openScreen } from '../../src/state/navigation';
import {
  abilities,
  cameraPlanning,
  exposuresS,
  frameRatesOf,
  goalKind,
  otherRatesHz,
  resetCameraEntries,
  shutterAnglesDeg,
  standardLabelsOn,
} from '../../src/state/cameraPlanning';
import { defaultSetup, type Setup, activeCorePart } from '../../src/state/model';
import { replaceSetup, setup } from '../../src/state/setup';
import { startSession } from '../../src/state/session';
import { CameraScreen } from '../../src/screens/camera';
import { cameraCsv } from '../../src/screens/camera/csv';
import { field, tableRows, type } from '../helpers/screen-queries';

beforeAll(async () => {
  await startSession();
});

beforeEach(() => {
  replaceSetup(defaultSetup);
  resetCameraEntries();
  openScreen('camera');
  render(<CameraScreen />);
});

afterEach(cleanup);

const rows = (): HTMLElement[] => tableRows('plan-table');

/** Wikipedia, "Stroboscopic effect": a 12-spoke wheel at 2 rev/s filmed at 24 frames/s seems still. */
function wheel(): Setup {
  return {
    ...structuredClone(defaultSetup),
    parts: [{ name: 'Wheel', speedRpm: 120, features: 12, tolerancePercent: 0 }],
    activePart: 0,
  };
}

describe('the camera plan screen', () => {
  test('a 12-spoke wheel at 2 rev/s freezes at 24 frames/s, and 24 fps heads the table', () => {
    act(() => replaceSetup(wheel()));
    const plan = cameraPlan(abilities.value, activeCorePart(setup.value), { kind: 'freeze' });
    expect(plan.settings.length).toBeGreaterThan(0);
    expect(plan.settings.every((s) => s.frameRate === 24)).toBe(true);
    expect(screen.getByTestId('plan-headline').textContent).toBe(
      `${plan.settings.length} settings reach the goal`,
    );
    const first = rows()[0];
    expect(first.textContent).toContain('24 fps');
    expect(first.textContent).toContain('Looks still');
    expect(first.textContent).toContain(formatExposure(plan.settings[0].exposureS));
    expect(rows()).toHaveLength(plan.settings.length);
    // Freezing always brings the caution that the part still turns (docs/physics.md §10).
    expect(screen.getByTestId('safety-notice')).toBeTruthy();
  });

  test('"Open in check" sets the camera of the set-up and switches to the check screen', () => {
    act(() => replaceSetup(wheel()));
    const best = cameraPlanning.result.value!.settings[0];
    fireEvent.click(within(rows()[0]).getByRole('button', { name: 'Open in check' }));
    expect(currentScreen.value).toBe('check');
    expect(setup.value.samplerKind).toBe('camera');
    expect(setup.value.camera.frameRate).toBe(24);
    expect(setup.value.camera.readoutMs).toBe(25);
    // The best freeze is the shortest exposure on offer, 1/4000 s, kept as a time.
    expect(best.exposureS).toBe(1 / 4000);
    expect(setup.value.camera.exposure).toEqual({ mode: 'time', seconds: 1 / 4000 });
  });

  test('a setting offered as a shutter angle opens as that angle', () => {
    act(() => replaceSetup(wheel()));
    act(() => {
      exposuresS.value = [];
    });
    fireEvent.click(within(rows()[0]).getByRole('button', { name: 'Open in check' }));
    expect(setup.value.camera.exposure).toEqual({ mode: 'angle', angleDeg: 180 });
  });

  test('when nothing freezes the default fan, the screen says which rates would and lists the near misses', () => {
    // 6 blades at 1770 rpm pass 177 times a second; 177/k fps would freeze it (docs/physics.md §3), none is a camera rate.
    expect(screen.getByTestId('plan-headline').textContent).toBe(
      'No setting of this camera reaches the goal',
    );
    const why = screen.getByTestId('plan-none').textContent!;
    expect(why).toContain('177 passes a second');
    expect(why).toContain(
      `${formatPrecise(177)} fps, ${formatPrecise(88.5)} fps, ${formatPrecise(59)} fps`,
    );
    // Rates the camera does not offer are named as what the goal needs, never offered as a setting.
    expect(screen.getByTestId('plan-blocked').textContent).toContain(
      'Look: needs a frame rate this camera does not offer, such as 177 fps, 88.5 fps, 59 fps',
    );
    const plan = cameraPlanning.result.value!;
    expect(plan.settings).toHaveLength(0);
    expect(rows()).toHaveLength(plan.nearMisses.length);
    // Every setting in the table is one of the camera's own rates.
    for (const s of plan.nearMisses) expect(abilities.value.frameRatesHz).toContain(s.frameRate);
    expect(rows().length).toBeGreaterThan(0);
  });

  test('a custom frame rate that freezes the fan reaches the goal only once blur and readout allow it', () => {
    type('Other frame rates', '59 88.5');
    expect(otherRatesHz.value).toEqual([59, 88.5]);
    // The phone's 25 ms readout turns the fan 360·29.5·0.025 = 265.5°, 4.4 blade pitches: the
    // blades break into pieces (docs/physics.md §5), so nothing freezes yet, and the screen says why.
    expect(screen.getByTestId('plan-headline').textContent).toBe(
      'No setting of this camera reaches the goal',
    );
    expect(rows()[0].textContent).toContain('Looks still');
    expect(screen.getByTestId('plan-none').textContent).toMatch(
      /Rolling shutter: no setting of this camera meets it\. During the 25 ms readout/,
    );
    // A global shutter, and 1/8000 s: 360·29.5/8000 = 1.3° of blur, under the 2° kept sharp.
    type('Rolling readout time', '0');
    type('Shutter speeds', '8000');
    const plan = cameraPlanning.result.value!;
    expect(plan.settings.map((s) => s.frameRate)).toEqual([88.5, 59]);
    expect(screen.getByTestId('plan-headline').textContent).toBe('2 settings reach the goal');
    expect(rows()[0].textContent).toContain('88.5 fps');
    expect(rows()[0].textContent).toContain('Reaches it');
  });

  test('freezing a 2-blade propeller at 6000 rpm with a phone at 180°: every sub-multiple is listed and the blur and readout are named', () => {
    // 200 passes a second; in 24–240 fps the sub-multiples are 200/k, k = 1…8 (docs/physics.md §3).
    act(() =>
      replaceSetup({
        ...structuredClone(defaultSetup),
        parts: [{ name: 'Propeller', speedRpm: 6000, features: 2, tolerancePercent: 0 }],
        activePart: 0,
      }),
    );
    type('Shutter speeds', '');
    const text = screen.getByTestId('plan-none').textContent!;
    expect(text).toContain(
      'between 24 and 240 fps: 200 fps, 100 fps, 66.667 fps, 50 fps, 40 fps, 33.333 fps, 28.571 fps, 25 fps. The camera offers 25 fps.',
    );
    // 180° at 25 fps is 1/50 s; 2° of turn at 100 rev/s needs 1/18,000 s (docs/physics.md §5).
    expect(text).toMatch(
      /Sharpness: no setting of this camera meets it\. Sharp features need an exposure of 1\/18,000 s or shorter/,
    );
    expect(text).toMatch(/a camera with a faster readout or a global shutter/);
    // The answer at the top names both obstacles and what would lift them.
    expect(screen.getByTestId('plan-blocked').textContent).toBe(
      'Sharpness: needs 1/18,000 s or shorter: a faster shutter, more light' +
        'Rolling shutter: needs a readout of 5 ms or shorter: a global shutter',
    );
    // Adding fast shutter speeds does not make it reach: the readout still breaks the blades.
    type('Shutter speeds', '500 1000 2000 4000');
    expect(screen.getByTestId('plan-headline').textContent).toBe(
      'No setting of this camera reaches the goal',
    );
    for (const row of rows()) expect(row.textContent).toMatch(/Fails: .*Rolling shutter/);
  });

  test('the natural-blur goal finds the 180° settings that smear the blades into an even disc', () => {
    fireEvent.click(screen.getByLabelText('Natural blur'));
    expect(goalKind.value).toBe('natural');
    const plan = cameraPlanning.result.value!;
    expect(plan.settings.length).toBeGreaterThan(0);
    // At 24 fps 180° is 1/48 s (cinema rule): 177/48 = 3.7 blade pitches of blur.
    expect(exposureFromShutterAngle(180, 24)).toBeCloseTo(1 / 48, 15);
    expect(plan.settings.every((s) => s.shutterAngle === 180)).toBe(true);
    expect(rows()[0].textContent).toMatch(/even disc/);
  });

  test('the slow-turn goal asks for the wanted speed, shares it with the check screen, and finds a rate that shows it', () => {
    act(() => replaceSetup(wheel()));
    fireEvent.click(screen.getByLabelText('Slow forward turn'));
    type('Slow turn wanted', '2');
    expect(setup.value.creepRpm).toBe(2);
    expect(screen.getByTestId('plan-headline').textContent).toBe(
      'No setting of this camera reaches the goal',
    );
    // docs/physics.md §4: s = n·|f − a|/k = 12 · (2 − 1/30) / k = 23.6/k frames/s shows a 2 rpm
    // forward turn: below the phone's slowest rate, so no rate it offers does.
    expect(screen.getByTestId('plan-none').textContent).toContain(
      'No frame rate between 24 and 240 fps shows that slow forward turn.',
    );
    type('Other frame rates', '23.6');
    expect(screen.getByTestId('plan-headline').textContent).toMatch(
      /^\d+ settings? reach(es)? the goal$/,
    );
    expect(rows()[0].textContent).toContain('23.6 fps');
    expect(rows()[0].textContent).toContain('Turns forward, slower (2 rpm)');
  });

  test('ticking and unticking the standard frame rates changes the rates offered', () => {
    fireEvent.click(screen.getByLabelText('29.97'));
    expect(frameRatesOf(standardLabelsOn.value, [])).toContain(30000 / 1001);
    fireEvent.click(screen.getByLabelText('29.97'));
    expect(frameRatesOf(standardLabelsOn.value, [])).not.toContain(30000 / 1001);
  });

  test('with no frame rate at all the core says so and the last table stays', () => {
    for (const label of ['24', '25', '30', '60', '120'])
      fireEvent.click(screen.getByLabelText(label));
    const before = cameraPlanning.result.value;
    expect(before?.nearMisses.every((s) => s.frameRate === 240)).toBe(true);
    fireEvent.click(screen.getByLabelText('240'));
    // docs/physics.md §10: the answer is withdrawn with the core's words; the table stays, marked not current.
    expect(screen.getByTestId('withdrawn').textContent).toMatch(/at least one frame rate/);
    expect(screen.getByTestId('not-current')).toBeTruthy();
    expect(cameraPlanning.result.value).toBe(before);
    // Kept in place for when the entries are good again, but out of reach of taps and screen readers.
    const kept = screen.getByTestId('not-current').parentElement!;
    expect(kept.querySelectorAll('tr').length).toBeGreaterThan(1);
    expect(kept.querySelector('[inert]')).not.toBeNull();
  });

  test('garbage in a list field gets a message naming the item, and the list stays', () => {
    type('Shutter angles', '180 400');
    expect(field('Shutter angles').getAttribute('aria-invalid')).toBe('true');
    expect(
      screen.getAllByRole('alert').some((a) => /Item 2 \("400"\)/.test(a.textContent ?? '')),
    ).toBe(true);
    expect(shutterAnglesDeg.value).toEqual([180]);
    expect(field('Shutter angles').value).toBe('180 400');
    type('Shutter speeds', '500 fast');
    expect(exposuresS.value).toEqual([1 / 500, 1 / 1000, 1 / 2000, 1 / 4000]);
    type('Rolling readout time', '-3');
    expect(field('Rolling readout time').getAttribute('aria-invalid')).toBe('true');
  });

  test('nothing on screen says NaN or Infinity, whatever is typed', () => {
    for (const text of [
      '',
      'abc',
      'NaN',
      '1e999',
      '-',
      '0',
      '-0',
      '1e-320',
      '99999999999',
      '1/0',
    ]) {
      for (const label of [
        'Other frame rates',
        'Shutter angles',
        'Shutter speeds',
        'Rolling readout time',
      ])
        type(label, text);
      const shown = document.body.textContent!.replace(/"[^"]*"/g, '');
      expect(shown, text).not.toMatch(/NaN|Infinity/);
    }
  });

  test('the CSV lists the near misses when nothing reaches the goal, best first', () => {
    const plan = cameraPlanning.result.value!;
    const lines = cameraCsv(plan).split('\r\n');
    expect(lines[0]).toMatch(/^rank,frame rate \(fps\),exposure \(s\),shutter angle/);
    expect(lines).toHaveLength(plan.nearMisses.length + 2);
    expect(lines[1].startsWith(`1,${plan.nearMisses[0].frameRate},`)).toBe(true);
    // "reaches the goal" says no in words (never true/false), in its own column.
    const header = lines[0].split(',');
    expect(lines[1].split(',')[header.indexOf('reaches the goal')]).toBe('no');
  });
});
