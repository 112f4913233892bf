// @vitest-environment happy-dom
// The speed finder screen: the usual strobe procedure step by step (docs/physics.md §7), the
// candidate table, the proposed rate, saving the speed found, and bad input.
// Invented scenario: a 6-blade extract fan at the (fictional) Harrowgate Tile Works.
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
import { speedFinderSteps } from '../../src/core';
import { App } from '../../src/app/app';
import { toolScreens } from '../../src/app/screen-list';
import { openScreen } from '../../src/state/navigation';
import { machines, saveMachine, versionOf } from '../../src/state/machines';
import { blankHeader, defaultSetup, defaultToolInputs, type Setup } from '../../src/state/model';
import { header, openMachine } from '../../src/state/work';
import { flashUnit, replaceSetup, setup } from '../../src/state/setup';
import { openMachineId, startSession } from '../../src/state/session';
import {
  clearReadings,
  defaultExpectation,
  expectation,
  finderFeatures,
  readings,
  withMeasuredSpeed,
} from '../../src/state/speedFinder';
import { finderCsv } from '../../src/screens/speed-finder/csv';
import { speedChangeWords, stepInstruction } from '../../src/words/speedFinder';
import { field, type } from '../helpers/screen-queries';
import { beltDriven, motorPart, setupOf } from '../helpers/setups';

beforeAll(async () => {
  await startSession();
  // The field tools load after the first paint (app.tsx); load them before rendering.
  await toolScreens.load();
});

beforeEach(() => {
  replaceSetup(defaultSetup);
  openMachineId.value = null;
  header.value = blankHeader();
  clearReadings();
  finderFeatures.value = null;
  expectation.value = { ...defaultExpectation };
  flashUnit.value = 'fpm';
  openScreen('speed-finder');
  render(<App />);
});

afterEach(cleanup);

// Saving goes through (fake) IndexedDB; on a busy shared machine that can take over a second.
configure({ asyncUtilTimeout: 5000 });

/** The default strobe: 30 to 12,000 flashes per minute. */
const STROBE = { minHz: 0.5, maxHz: 200 };

function instruction(): string {
  return screen.getByTestId('finder-instruction').textContent ?? '';
}

/** Records a reading through the add row, as a technician would. */
function record(rateText: string, images: number) {
  type('Rate where it stood still', rateText);
  fireEvent.change(screen.getByLabelText('Images standing still'), {
    target: { value: String(images) },
  });
  fireEvent.click(screen.getByRole('button', { name: 'Add reading' }));
}

function rows(): string[] {
  return within(screen.getByTestId('candidate-table'))
    .getAllByRole('row')
    .slice(1)
    .map((r) => r.textContent ?? '');
}

describe('the speed finder', () => {
  test('before any reading it says to start at the top of the strobe, and both cautions always show', () => {
    const step = speedFinderSteps({ readings: [], symmetry: 6, strobeRange: STROBE });
    expect(instruction()).toBe(stepInstruction(step));
    expect(instruction()).toMatch(
      /^Set the strobe to 12000 flashes\/min \(the top of the strobe's range\)/,
    );
    expect(screen.getByTestId('finder-rate').textContent).toBe('12,000 fpm');
    expect(screen.getByTestId('safety-notice')).toBeTruthy();
    expect(screen.getByTestId('photosensitivity-notice')).toBeTruthy();
  });

  test('the first single image at 1780 fpm proposes the double-image check at 3560 fpm', () => {
    record('1780', 1);
    expect(readings.value).toEqual([{ id: expect.any(Number), rateFpm: 1780, images: 1 }]);
    // docs/physics.md §7: coming down from the top, the first single image is at n·f; twice it shows two images.
    expect(instruction()).toMatch(
      /^Now set 3560 flashes\/min \(twice the single-image rate 1780 flashes\/min\)/,
    );
    expect(screen.getByTestId('finder-rate').textContent).toBe('3,560 fpm');
    const [first, second] = rows();
    // 1780 flashes/min ÷ 6 blades = 296.7 rpm; at 3560 fpm it would show two images.
    expect(first).toBe('296.7 rpmLikeliestFits every reading.2 images stand still');
    // 593.3 rpm would have stood still as a single image at 3560 fpm on the way down.
    expect(second).toMatch(
      /593\.3 rpm.*Ruled out.*3560 flashes\/min on the way down.*a single image stands still/,
    );
    // The next reading's row starts at the proposed rate; the image count is left to the
    // technician, never filled in from the prediction (docs/physics.md §7).
    expect(field('Rate where it stood still').value).toBe('3560');
    expect((screen.getByLabelText('Images standing still') as HTMLSelectElement).value).toBe('');
  });

  test('two images at twice the rate confirm the speed, ready to save', () => {
    record('1780', 1);
    record('3560', 2);
    expect(screen.getByTestId('finder-step').dataset.stage).toBe('done');
    expect(instruction()).toMatch(
      /^The part turns at 297 rpm \(single image at 1780 flashes\/min, confirmed by the two images\)\./,
    );
    expect(screen.getByTestId('found-speed').textContent).toBe('296.7 rpm');
    expect(screen.queryByTestId('finder-rate')).toBeNull();
  });

  test('two adjacent single images give F1·F2/(F1 − F2)', () => {
    type('Blades or marks on the part', '1');
    record('1800', 1);
    record('1200', 1);
    // docs/physics.md §7: 1800 · 1200 / (1800 − 1200) = 3600 flashes/min, one mark: 3600 rpm.
    expect(rows()[0]).toMatch(/^3,600 rpmLikeliest/);
  });

  test('an expected range from a motor nameplate ranks the speeds inside it first', () => {
    type('Blades or marks on the part', '1');
    fireEvent.click(screen.getByLabelText('Motor nameplate'));
    fireEvent.click(screen.getByLabelText('60 Hz'));
    // IEC 60034-1: 4 poles on 60 Hz = 1800 rpm synchronous; slip 0–5 % gives 1710–1800 rpm.
    expect(screen.getByTestId('expected-range').textContent).toBe(
      'Expected 1,710 – 1,800 rpm: speeds inside it rank first.',
    );
    // It starts just above the expected speed: 1800 · 1.1 = 1980 flashes/min.
    expect(instruction()).toMatch(
      /^Set the strobe to 1980 flashes\/min \(just above the expected speed\)/,
    );
    record('1770', 1);
    // A single image at 1770 fpm: 1770 rpm, or 3540 rpm seen every second turn; only 1770 lies in 1710–1800.
    const [first, second] = rows();
    expect(first).toMatch(
      /^1,770 rpmLikeliest \(in the expected range\)Fits every reading and the expected range\./,
    );
    expect(second).toMatch(/^3,540 rpmFitsFits every reading\./);
  });

  test('a rate typed in Hz is kept in flashes per minute', () => {
    fireEvent.click(screen.getByLabelText('Hz'));
    record('29.6667', 1);
    expect(readings.value[0].rateFpm).toBeCloseTo(1780.002, 9);
    expect(screen.getByTestId('finder-rate').textContent).toBe('59.333 Hz');
  });

  test('garbage in a recorded reading is refused beside it and the step stays', () => {
    record('1780', 1);
    const before = instruction();
    for (const text of ['abc', '', '-5', '0', 'NaN', '1e999', '12abc']) {
      type('Reading 1: rate', text);
      expect(field('Reading 1: rate').getAttribute('aria-invalid'), text).toBe('true');
      expect(readings.value[0].rateFpm).toBe(1780);
      expect(instruction()).toBe(before);
      expect(document.body.textContent!.replace(/"[^"]*"/g, '')).not.toMatch(/NaN|Infinity/);
    }
  });

  test('never fills in the images seen from a prediction: a reading added without choosing a count is refused', () => {
    // Reported case: after 1780 fpm with 1 image the count was pre-filled with the prediction 2,
    // so a reading added at 3000 fpm went in as 2 images unseen.
    record('1780', 1);
    expect((screen.getByLabelText('Images standing still') as HTMLSelectElement).value).toBe('');
    type('Rate where it stood still', '3000');
    fireEvent.click(screen.getByRole('button', { name: 'Add reading' }));
    expect(readings.value).toHaveLength(1);
    expect(screen.getByTestId('reading-refused').textContent).toMatch(
      /Choose how many images you saw standing still first; nothing was added/,
    );
    // After a reading is added the count is empty again.
    record('3560', 2);
    expect(readings.value.map((r) => r.images)).toEqual([1, 2]);
    expect((screen.getByLabelText('Images standing still') as HTMLSelectElement).value).toBe('');
  });

  test('the table caption counts the speeds still in the running apart from those the sweep rules out', () => {
    // Reported case: "8 speeds fit every reading" stood above 7 rows marked ruled out.
    record('1780', 1);
    const live = rows().filter((r) => !r.includes('Ruled out')).length;
    const out = rows().filter((r) => r.includes('Ruled out')).length;
    expect(out).toBeGreaterThan(0);
    expect(
      within(screen.getByTestId('candidate-table')).getByText(/^\d+ speeds? fits?/).textContent,
    ).toBe(
      `${live} ${live === 1 ? 'speed fits' : 'speeds fit'} the readings and the sweep; ${out} more ${out === 1 ? 'fits' : 'fit'} the readings but ${out === 1 ? 'is' : 'are'} ruled out; likeliest first`,
    );
  });

  test('garbage in the new reading adds nothing and says so', () => {
    type('Rate where it stood still', 'fast');
    fireEvent.click(screen.getByRole('button', { name: 'Add reading' }));
    expect(readings.value).toEqual([]);
    expect(screen.getByTestId('reading-refused').textContent).toMatch(/nothing was added/);
    expect(field('Rate where it stood still').value).toBe('fast');
  });

  test('a reading can be changed and removed, and the steps follow', () => {
    record('1780', 1);
    fireEvent.change(screen.getByLabelText('Reading 1: images'), { target: { value: '2' } });
    expect(readings.value[0].images).toBe(2);
    expect(screen.getByTestId('finder-step').dataset.stage).toBe('come-down');
    fireEvent.click(screen.getByRole('button', { name: 'Remove reading 1' }));
    expect(readings.value).toEqual([]);
    expect(screen.getByTestId('finder-step').dataset.stage).toBe('start');
  });

  test('readings that fit no single speed say so', () => {
    type('Blades or marks on the part', '1');
    record('1780', 1);
    record('1000', 1);
    expect(screen.getByTestId('finder-step').dataset.stage).toBe('conflict');
    expect(instruction()).toMatch(/^These readings fit no single speed/);
  });

  test('the expected range must not be empty', () => {
    fireEvent.click(screen.getByLabelText('A range in rpm'));
    type('From', '3000');
    expect(field('From').getAttribute('aria-invalid')).toBe('true');
    expect(screen.getByRole('alert').textContent).toMatch(/below the highest/);
    expect(expectation.value.fromRpm).toBe(1593);
  });

  test('the proposed rate goes to the Check screen’s strobe', () => {
    setup.value = { ...setup.value, samplerKind: 'camera' };
    record('1780', 1);
    fireEvent.click(
      screen.getByRole('button', { name: "Use 3,560 fpm on the Check screen's strobe" }),
    );
    expect(setup.value.samplerKind).toBe('strobe');
    expect(setup.value.strobe.rateFpm).toBe(3560);
    // A status of its own, beside the one that reads out the step once typing pauses.
    expect(
      screen.getAllByRole('status').filter((s) => /now flashes at 3,560 fpm/.test(s.textContent!)),
    ).toHaveLength(1);
  });

  test('saving to the open machine changes its part and says what changed', async () => {
    const { machine } = await saveMachine('Extract fan, kiln 3', {
      ...blankHeader(),
      setup: setup.value,
      tools: defaultToolInputs(),
    });
    // Opened from the Machines screen: the working copy carries its name and version.
    openMachine(machine);
    record('1780', 1);
    record('3560', 2);
    fireEvent.click(screen.getByRole('button', { name: 'Save speed to “Extract fan, kiln 3”' }));
    await waitFor(() =>
      expect(screen.getByTestId('save-outcome').textContent).toMatch(
        /Saved to "Extract fan, kiln 3"\./,
      ),
    );
    expect(screen.getByTestId('save-outcome').textContent).toMatch(
      /^Fan: speed 1,770 rpm → 296\.7 rpm\./,
    );
    const saved = machines.value.find((m) => m.id === machine.id)!;
    expect(saved.setup.parts[0].speedRpm).toBeCloseTo(1780 / 6, 9);
    // The part says where its speed came from.
    expect(saved.setup.parts[0].origin?.method).toBe('strobe');
    expect(setup.value.parts[0].speedRpm).toBeCloseTo(1780 / 6, 9);
  });

  test('without an open machine a name is needed; a blank one is refused and nothing changes', async () => {
    record('1780', 1);
    record('3560', 2);
    const count = machines.value.length;
    fireEvent.click(screen.getByRole('button', { name: 'Save speed to a new machine' }));
    await waitFor(() => expect(screen.getByTestId('save-outcome').dataset.kind).toBe('problem'));
    expect(screen.getByTestId('save-outcome').textContent).toMatch(/must not be blank/);
    expect(machines.value.length).toBe(count);
    expect(setup.value.parts[0].speedRpm).toBe(1770);
    fireEvent.click(screen.getByRole('button', { name: 'Use it on the Check screen only' }));
    await waitFor(() =>
      expect(screen.getByTestId('save-outcome').textContent).toMatch(
        /Check screen only \(no machine saved\)/,
      ),
    );
    expect(setup.value.parts[0].speedRpm).toBeCloseTo(1780 / 6, 9);
  });

  test('a speed saved to a new machine opens it by name, so the next speed saves to it too', async () => {
    record('1780', 1);
    record('3560', 2);
    type("New machine's name", 'Kiln 4 extract fan');
    fireEvent.click(screen.getByRole('button', { name: 'Save speed to a new machine' }));
    await waitFor(() =>
      expect(screen.getByTestId('save-outcome').textContent).toMatch(
        /Saved to "Kiln 4 extract fan"\./,
      ),
    );
    expect(header.value.name).toBe('Kiln 4 extract fan');
    const id = openMachineId.value!;
    expect(versionOf(id)).toBe(1);
    fireEvent.click(screen.getByRole('button', { name: 'Save speed to “Kiln 4 extract fan”' }));
    // Written over the first save (version 1 → 2), not refused for a blank name.
    await waitFor(() => expect(versionOf(id)).toBe(2));
    expect(screen.getByTestId('save-outcome').dataset.kind).toBe('done');
    expect(screen.getByTestId('save-outcome').textContent).toMatch(
      /Saved to "Kiln 4 extract fan"\./,
    );
    expect(machines.value.filter((m) => m.name === 'Kiln 4 extract fan').map((m) => m.id)).toEqual([
      id,
    ]);
  });

  test('the CSV holds every candidate and the readings behind them', () => {
    record('1780', 1);
    const step = speedFinderSteps({
      readings: [{ rateHz: 1780 / 60, images: 1 }],
      symmetry: 6,
      strobeRange: STROBE,
    });
    const text = finderCsv(step.candidates, readings.value, step.rateFpm);
    const lines = text.split('\r\n');
    expect(lines[0]).toBe('speed (rpm),status,why,at 3560 flashes/min');
    // Rounded as on screen: 296.7, not 296.6666666666667.
    expect(lines[1]).toBe('296.7,Likeliest,Fits every reading.,2 images stand still');
    expect(lines.length).toBe(step.candidates.length + 5);
    expect(lines.at(-3)).toBe('reading,rate (flashes/min),images standing still');
    expect(lines.at(-2)).toBe('1,1780,1');
  });
});

describe('keeping the speed found', () => {
  /** A 4-pole motor on 50 Hz turning a 6-blade fan through a 100 → 250 mm belt (invented). */
  function beltDrive(): Setup {
    return setupOf([motorPart(), beltDriven('Fan', 582, 6, 0)]);
  }

  test('a measured motor speed replaces the nameplate, and the fan it drives follows', () => {
    const { setup: next, changes } = withMeasuredSpeed(beltDrive(), 1470 / 60, 1);
    expect(next.parts[0]).toEqual({
      name: 'Motor',
      speedRpm: 1470,
      features: 1,
      tolerancePercent: 1,
      origin: { method: 'strobe', detail: { features: 1 }, at: expect.any(String) },
    });
    // Belt: f2 = f1 · D1/D2 (docs/physics.md §8): 1470 · 100/250 = 588 rpm.
    expect(next.parts[1].speedRpm).toBeCloseTo(588, 9);
    expect(changes.map(speedChangeWords)).toEqual([
      'Motor: speed 1,455 rpm → 1,470 rpm.',
      'Motor no longer takes its speed from the motor nameplate.',
      'Fan, driven from it: speed 582 rpm → 588 rpm.',
    ]);
  });

  test('a measured fan speed replaces what the belt gave, keeping its direction and taking the counted blades', () => {
    const s = beltDrive();
    s.activePart = 1;
    s.parts[1].speedRpm = -582;
    const { setup: next, changes } = withMeasuredSpeed(s, 9.9, 3);
    expect(next.parts[1]).toEqual({
      name: 'Fan',
      speedRpm: -594,
      features: 3,
      tolerancePercent: 1,
      origin: { method: 'strobe', detail: { features: 3 }, at: expect.any(String) },
    });
    expect(changes).toContainEqual({ kind: 'leaves-drive', part: 'Fan', driver: 'Motor' });
    expect(changes).toContainEqual({ kind: 'features', part: 'Fan', from: 6, to: 3 });
    expect(changes.map(speedChangeWords)).toContain(
      'Fan is no longer worked out from the drive from Motor.',
    );
    expect(changes.map(speedChangeWords)).toContain('Fan: features 6 → 3.');
  });
});
