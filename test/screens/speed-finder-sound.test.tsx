// @vitest-environment happy-dom
// The speed finder's second method, by sound, as a technician uses it: open "By sound", Listen
// (a fake microphone at the SoundCapture seam, fed a generated fan), see the speeds heard,
// apply one with one tap (the part gets the speed, and the precision as its tolerance), then
// record the strobe reading the step proposes and see the step settle on one speed.
// The sound: a 6-blade fan at 1750 rpm, blade pass f = n·rpm/60 = 175 Hz (common practice),
// 100 Hz hum (test/helpers/sound). Method: docs/physics.md §11.
import 'fake-indexeddb/auto';
import { cleanup, configure, fireEvent, render, screen, within } from '@testing-library/preact';
import { afterEach, beforeAll, beforeEach, describe, expect, test } from 'vitest';
import {
  joinSoundWithStrobe,
  MAX_RECORDING_S,
  soundSpectrum,
  speedsFromSound,
} from '../../src/core';
import {
  MAX_SOUND_FILE_BYTES,
  SoundCaptureError,
  type ListenOptions,
  type SoundRecording,
} from '../../src/audio';
import { App } from '../../src/app/app';
import { toolScreens } from '../../src/app/screen-list';
import { openScreen } from '../../src/state/navigation';
import { defaultSetup } from '../../src/state/model';
import { activePart, flashUnit, replaceSetup } from '../../src/state/setup';
import { openMachineId, startSession } from '../../src/state/session';
import {
  cancelListening,
  forgetSound,
  listenStatus,
  soundCapture,
  soundPanelOpen,
  type SoundCapture,
} from '../../src/state/soundSpeed';
import {
  clearReadings,
  defaultExpectation,
  expectation,
  finderFeatures,
  toleranceFromPrecision,
} from '../../src/state/speedFinder';
import { finderCsv } from '../../src/screens/speed-finder/csv';
import { tableRows, type } from '../helpers/screen-queries';
import { fanAt1750Rpm, machineSound, seededRandom } from '../helpers/sound/machineSound';

const RATE_HZ = 48_000;
const fanRecording = (): SoundRecording => ({
  samples: fanAt1750Rpm(RATE_HZ, 4),
  sampleRateHz: RATE_HZ,
  durationS: 4,
});

/** A microphone the test ends when it wants, and files decoded at once. */
const mic = {
  opts: undefined as ListenOptions | undefined,
  finish: undefined as ((r: SoundRecording) => void) | undefined,
  fail: undefined as ((e: unknown) => void) | undefined,
};
const fake: SoundCapture = {
  limits: { maxFileBytes: MAX_SOUND_FILE_BYTES, maxRecordingS: MAX_RECORDING_S },
  listen(opts) {
    mic.opts = opts;
    const recording = new Promise<SoundRecording>((resolve, reject) => {
      mic.finish = resolve;
      mic.fail = reject;
    });
    return {
      recording,
      stop: () => mic.finish?.(fanRecording()),
      cancel: () => mic.fail?.(new SoundCaptureError('cancelled', 'cancelled')),
    };
  },
  decodeFile: () => Promise.resolve(fanRecording()),
};

beforeAll(async () => {
  await startSession();
  await toolScreens.load();
});

beforeEach(() => {
  replaceSetup(defaultSetup);
  openMachineId.value = null;
  clearReadings();
  finderFeatures.value = null;
  expectation.value = { ...defaultExpectation };
  flashUnit.value = 'fpm';
  forgetSound();
  listenStatus.value = { kind: 'idle' };
  soundPanelOpen.value = false;
  soundCapture.value = fake;
  openScreen('speed-finder');
  render(<App />);
});

afterEach(() => {
  cancelListening();
  cleanup();
});

configure({ asyncUtilTimeout: 5000 });

async function openBySound() {
  fireEvent.click(screen.getByRole('button', { name: 'Find the speed by sound' }));
  return screen.findByRole('button', { name: 'Listen (4 s)' });
}

async function listenToTheFan() {
  fireEvent.click(await openBySound());
  await screen.findByTestId('listening');
  expect(screen.getByRole('progressbar', { name: 'Recording' })).toBeTruthy();
  mic.opts?.onProgress?.(2, 4);
  await screen.findByText('2 s', { exact: false });
  mic.finish?.(fanRecording());
  return screen.findByTestId('sound-candidates');
}

describe('the speed finder by sound', () => {
  test('keeps the sound code out until "By sound" is opened, and shows its cautions then', async () => {
    // The stillness caution is on the screen before anything is opened (docs/physics.md §10).
    expect(screen.getAllByTestId('safety-notice')[0].textContent).toMatch(
      /Still turning: do not trust what you see/,
    );
    expect(screen.queryByRole('button', { name: /Listen/ })).toBeNull();
    await openBySound();
    const caution = screen.getByTestId('sound-caution').textContent ?? '';
    expect(caution).toMatch(/guard/i);
    expect(caution).toMatch(/hearing protection/i);
    expect(screen.getByText(/never sent or stored/)).toBeTruthy();
  });

  test('listens, offers 1750 rpm with its precision, and applies it to the part with one tap', async () => {
    const table = await listenToTheFan();
    const leader = screen.getByTestId('sound-leader');
    const rpm = Number(leader.dataset.rpm);
    // The core's own answer for the same sound: the screen shows what it gives.
    const expected = speedsFromSound(soundSpectrum(fanAt1750Rpm(RATE_HZ, 4), RATE_HZ), {
      symmetry: 6,
    }).candidates[0]!;
    expect(rpm).toBeCloseTo(expected.speedHz * 60, 1);
    expect(Math.abs(rpm - 1750)).toBeLessThanOrEqual(2);
    expect(leader.textContent).toMatch(/± [\d.]+ rpm \(±[\d.]+ %\)/);
    expect(table.textContent).not.toMatch(/NaN|Infinity/);
    expect(screen.getByText(/Mains hum at 100 Hz/)).toBeTruthy();

    const first = tableRows('sound-candidates')[0]!;
    fireEvent.click(within(first).getByRole('button', { name: /^Use 1,75\d/ }));
    const applied = await screen.findByTestId('sound-applied');
    await within(applied).findByText(/Speed found by sound, .*, ±[\d.]+ %\./);
    expect(activePart.value.speedRpm).toBeCloseTo(expected.speedHz * 60, 6);
    expect(activePart.value.tolerancePercent).toBe(
      toleranceFromPrecision(expected.speedHz, expected.precisionHz),
    );
  });

  test('narrows the strobe to one speed with the reading the step proposes', async () => {
    await listenToTheFan();
    const step = screen.getByTestId('finder-step');
    expect(step.dataset.stage).toBe('sound-confirm');
    // The rate proposed is the one joinSoundWithStrobe gives for the heard speeds.
    const heard = speedsFromSound(soundSpectrum(fanAt1750Rpm(RATE_HZ, 4), RATE_HZ), {
      symmetry: 6,
    });
    const join = joinSoundWithStrobe(heard.candidates, undefined, {
      symmetry: 6,
      rateRange: { minHz: 30 / 60, maxHz: 12_000 / 60 },
    });
    const fpm = Math.round(join.nextRateHz! * 60);
    expect(screen.getByTestId('finder-rate').textContent?.replace(/,/g, '')).toMatch(
      new RegExp(`^${fpm}(\\.\\d+)? fpm$`),
    );

    // The technician sets that rate and records what stands still, as the step predicted.
    type('Rate where it stood still', String(join.nextRateHz! * 60));
    fireEvent.change(screen.getByLabelText('Images standing still'), {
      target: { value: String(join.views![0]!.images) },
    });
    fireEvent.click(screen.getByRole('button', { name: 'Add reading' }));

    expect(screen.getByTestId('finder-step').dataset.stage).toBe('sound-agrees');
    const rows = tableRows('candidate-table');
    const leads = rows.filter((r) => /Likeliest: heard and seen/.test(r.textContent ?? ''));
    expect(leads).toHaveLength(1);
    expect(leads[0]!.textContent).toMatch(/1,75\d/);
    // Other speeds may be heard too, but only faintly (scored under 60 % of the lead by
    // sound, joinSoundWithStrobe's rule): each is marked possible, none rivals the lead.
    for (const r of rows.filter((r) => /Fits, and heard/.test(r.textContent ?? ''))) {
      expect(r.textContent).toMatch(/\((possible|faint)\)\.$/);
    }
    expect(screen.getByTestId('found-speed').textContent).toMatch(/^1,75\d.* rpm ± /);
  });

  test('shows every tied speed alike, never one big number, when the sound cannot choose', async () => {
    // Two 6-blade fans side by side, equally loud, at 1750 and 1470 rpm (the core's own tie case).
    const line = (order: number, amplitude: number) => ({ order, amplitude, phase: order });
    const twoFans = machineSound(
      {
        sampleRateHz: RATE_HZ,
        durationS: 4,
        speedHz: 1750 / 60,
        lines: [line(6, 1), line(12, 0.4)],
        other: { speedHz: 24.5, lines: [line(6, 1), line(12, 0.4)] },
        noise: { colour: 'white', snrDb: 20 },
      },
      seededRandom(5),
    );
    const decode = fake.decodeFile;
    fake.decodeFile = () =>
      Promise.resolve({ samples: twoFans, sampleRateHz: RATE_HZ, durationS: 4 });
    try {
      fireEvent.click(await openBySound());
      fireEvent.change(screen.getByLabelText('Analyse a recording'), {
        target: { files: [new File([], 'two-fans.wav')] },
      });
      const leader = await screen.findByTestId('sound-leader');
      expect(leader.dataset.confidence).toBe('tied');
      const big = leader.querySelector('p')!.textContent ?? '';
      expect(big).toMatch(/\brpm or \b/);
      expect(big).toMatch(/1,75\d/);
      expect(big).toMatch(/1,47\d/);
      expect(leader.textContent).toMatch(/Tied: Another speed fits the sound just as well/);
    } finally {
      fake.decodeFile = decode;
    }
  });

  test('writes the speeds heard into the CSV, their precision never tighter than measured', () => {
    const heard = speedsFromSound(soundSpectrum(fanAt1750Rpm(RATE_HZ, 4), RATE_HZ), {
      symmetry: 6,
    }).candidates;
    const lines = finderCsv([], [], undefined, { candidates: heard, kind: 'fan' }).split('\r\n');
    const header = lines.indexOf(
      'heard speed (rpm),precision (± rpm),precision (± %),how sure,heard as',
    );
    expect(header).toBeGreaterThan(0);
    heard.forEach((c, i) => {
      const [rpm, plusMinusRpm, plusMinusPercent, sure] = lines[header + 1 + i]!.split(',');
      expect(Number(rpm)).toBeCloseTo(c.speedHz * 60, 2);
      expect(Number(plusMinusRpm)).toBeGreaterThanOrEqual(c.precisionHz * 60);
      expect(Number(plusMinusPercent)).toBeGreaterThanOrEqual((100 * c.precisionHz) / c.speedHz);
      expect(sure).toMatch(/^(Clear|Likely|Tied|Possible|Faint)$/);
    });
  });

  test('says what to do when the microphone is refused, and keeps the file route open', async () => {
    fireEvent.click(await openBySound());
    mic.fail?.(new SoundCaptureError('mic-refused', 'refused'));
    const problem = await screen.findByTestId('sound-problem');
    expect(problem.dataset.code).toBe('mic-refused');
    expect(problem.textContent).toMatch(/Allow it for this page/);
    expect(problem.textContent).toMatch(/Analyse a recording/);
    const input = screen.getByLabelText('Analyse a recording') as HTMLInputElement;
    expect(input.disabled).toBe(false);
    fireEvent.change(input, { target: { files: [new File([], 'fan.wav')] } });
    await screen.findByTestId('sound-candidates');
    expect(screen.getByText(/from “fan.wav”/)).toBeTruthy();
  });
});
