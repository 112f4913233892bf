// The speed finder's by-sound state (src/state/soundSpeed.ts): getting the sound (idle →
// listening → analysing → a result, or a problem), stopping early, every capture problem kept
// without losing what was heard before, the speeds heard for the part as set, their join with
// a strobe reading, and applyHeardSpeed (the speed, its precision as the tolerance, the origin).
// The sound is generated (test/helpers/sound): a 6-blade fan at 1750 rpm, blade pass
// f = n·rpm/60 = 175 Hz (common practice), on a 50 Hz site. The capture is a fake at the
// SoundCapture seam; the core is the real one.
import 'fake-indexeddb/auto';
import { effect } from '@preact/signals';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import * as core from '../../src/core';
import {
  MAX_SOUND_FILE_BYTES,
  SoundCaptureError,
  type ListenOptions,
  type SoundCaptureProblem,
  type SoundRecording,
} from '../../src/audio';
import { defaultSetup } from '../../src/state/model';
import { replaceSetup, setup, activePart } from '../../src/state/setup';
import {
  analyseFile,
  analyseKept,
  applyHeardSpeed,
  cancelListening,
  forgetSound,
  heardCandidates,
  heardSound,
  listen,
  LISTEN_S,
  listenStatus,
  soundCore,
  soundJoin,
  soundSpeeds,
  stopListening,
  type ListenStatus,
  type SoundCapture,
} from '../../src/state/soundSpeed';
import {
  addReading,
  clearReadings,
  defaultExpectation,
  expectation,
  finderFeatures,
  toleranceFromPrecision,
} from '../../src/state/speedFinder';
import { savedSpeedLines } from '../../src/words/speedFinder';
import { fanAt1750Rpm } from '../helpers/sound/machineSound';

const RATE_HZ = 48_000;
const fan = (seconds = LISTEN_S): SoundRecording => ({
  samples: fanAt1750Rpm(RATE_HZ, seconds),
  sampleRateHz: RATE_HZ,
  durationS: seconds,
});

/** A microphone the test drives: it reports progress, and ends when told. */
class FakeMicrophone implements SoundCapture {
  limits = { maxFileBytes: MAX_SOUND_FILE_BYTES, maxRecordingS: core.MAX_RECORDING_S };
  opts?: ListenOptions;
  stopped = 0;
  cancelled = 0;
  private finish?: (r: SoundRecording) => void;
  private fail?: (e: unknown) => void;
  /** What decodeFile gives: a recording, or an error to reject with. */
  file: SoundRecording | Error = fan();

  listen(opts: ListenOptions) {
    this.opts = opts;
    const recording = new Promise<SoundRecording>((resolve, reject) => {
      this.finish = resolve;
      this.fail = reject;
    });
    return {
      recording,
      stop: () => {
        this.stopped++;
      },
      cancel: () => {
        this.cancelled++;
        this.fail?.(new SoundCaptureError('cancelled', 'cancelled'));
      },
    };
  }
  decodeFile(): Promise<SoundRecording> {
    return this.file instanceof Error ? Promise.reject(this.file) : Promise.resolve(this.file);
  }
  progress(s: number) {
    this.opts?.onProgress?.(s, LISTEN_S);
  }
  end(r: SoundRecording) {
    this.finish?.(r);
  }
  refuse(e: unknown) {
    this.fail?.(e);
  }
}

/** Every status the state passes through, in order. */
function watchStatus(): { kinds: string[]; stop: () => void } {
  const kinds: string[] = [];
  const stop = effect(() => {
    const s: ListenStatus = listenStatus.value;
    if (kinds.at(-1) !== s.kind) kinds.push(s.kind);
  });
  return { kinds, stop };
}

/** Lets the promises settle: the fake's answer, then the state's handlers. */
const settle = () => new Promise<void>((r) => setTimeout(r, 0));

let mic: FakeMicrophone;

beforeEach(() => {
  soundCore.value = core;
  replaceSetup(defaultSetup);
  finderFeatures.value = null;
  expectation.value = { ...defaultExpectation };
  clearReadings();
  forgetSound();
  listenStatus.value = { kind: 'idle' };
  mic = new FakeMicrophone();
});

afterEach(() => cancelListening());

describe('getting the sound', () => {
  it('goes idle → listening → analysing → idle, with the fan’s speed heard', async () => {
    const seen = watchStatus();
    listen(mic);
    expect(listenStatus.value).toEqual({ kind: 'listening', recordedS: 0, totalS: LISTEN_S });
    mic.progress(1.5);
    expect(listenStatus.value).toEqual({ kind: 'listening', recordedS: 1.5, totalS: LISTEN_S });
    mic.end(fan());
    await settle();
    seen.stop();
    expect(seen.kinds).toEqual(['idle', 'listening', 'analysing', 'idle']);
    expect(heardSound.value?.source).toBe('microphone');
    const leader = soundSpeeds.result.value!.candidates[0]!;
    // 6 blades, 175 Hz blade pass: 1750 rpm, inside its stated precision (within 2 rpm, the
    // issue's bar for the browser check).
    expect(Math.abs(leader.speedHz * 60 - 1750)).toBeLessThanOrEqual(
      Math.max(2, leader.precisionHz * 60),
    );
    // Nothing of the samples is kept: only the spectrum.
    expect(Object.keys(heardSound.value!)).not.toContain('samples');
    expect(Object.values(heardSound.value!).some((v) => v instanceof Float32Array)).toBe(false);
  });

  it('stops early when asked and reads what was recorded so far', async () => {
    listen(mic);
    mic.progress(2);
    stopListening();
    expect(mic.stopped).toBe(1);
    mic.end(fan(2));
    await settle();
    expect(listenStatus.value.kind).toBe('idle');
    expect(heardSound.value!.spectrum.durationS).toBeCloseTo(2, 3);
  });

  it('drops a recording when listening is cancelled, keeping what was heard before', async () => {
    listen(mic);
    mic.end(fan());
    await settle();
    const before = heardSound.value;
    listen(mic);
    cancelListening();
    await settle();
    expect(mic.cancelled).toBe(1);
    expect(listenStatus.value.kind).toBe('idle');
    expect(heardSound.value).toBe(before);
  });

  const problems: SoundCaptureProblem[] = [
    'mic-unavailable',
    'mic-refused',
    'mic-absent',
    'mic-busy',
    'no-audio-support',
    'too-short',
    'silence',
    'clipping',
    'not-audio',
    'file-too-large',
    'file-too-long',
  ];

  it.each(problems)('keeps the problem %s, and loses nothing heard before', async (code) => {
    listen(mic);
    mic.end(fan());
    await settle();
    const before = heardSound.value;
    expect(before).not.toBeNull();
    listen(mic);
    mic.refuse(new SoundCaptureError(code, 'from the capture'));
    await settle();
    expect(listenStatus.value).toEqual({ kind: 'problem', code });
    expect(heardSound.value).toBe(before);
  });

  it('keeps a clipped recording, and analyses it when asked', async () => {
    listen(mic);
    mic.refuse(new SoundCaptureError('clipping', 'clipped', fan()));
    await settle();
    const status = listenStatus.value;
    expect(status.kind === 'problem' && status.kept?.from.source).toBe('microphone');
    expect(heardSound.value).toBeNull();
    analyseKept();
    expect(listenStatus.value.kind).toBe('idle');
    expect(soundSpeeds.result.value!.candidates[0]!.speedHz * 60).toBeCloseTo(1750, 0);
  });

  it('says so, in the browser’s stead, when something other than a capture problem fails', async () => {
    listen(mic);
    mic.refuse(new TypeError('worklet gone'));
    await settle();
    expect(listenStatus.value).toEqual({
      kind: 'problem',
      code: 'unreadable',
      message: 'The sound could not be read in this browser.',
    });
  });

  it('reads a picked file, naming it, and refuses a recording the core cannot read', async () => {
    const seen = watchStatus();
    await analyseFile(mic, new File([], 'fan.wav'));
    seen.stop();
    expect(seen.kinds).toEqual(['idle', 'analysing', 'idle']);
    expect(heardSound.value).toMatchObject({ source: 'file', fileName: 'fan.wav' });
    const before = heardSound.value;

    // A sample rate of 0: the core's InputError, in its own words, and nothing lost.
    mic.file = { samples: new Float32Array(10), sampleRateHz: 0, durationS: 1 };
    await analyseFile(mic, new File([], 'broken.wav'));
    const status = listenStatus.value;
    expect(status.kind === 'problem' && status.code).toBe('unreadable');
    expect(status.kind === 'problem' && status.message).toMatch(/sample rate/i);
    expect(heardSound.value).toBe(before);

    mic.file = new SoundCaptureError('not-audio', 'not audio');
    await analyseFile(mic, new File(['text'], 'notes.txt'));
    expect(listenStatus.value).toEqual({ kind: 'problem', code: 'not-audio' });
    expect(heardSound.value).toBe(before);
  });
});

describe('the speeds heard and the strobe', () => {
  async function hearFan() {
    await analyseFile(mic, new File([], 'fan.wav'));
  }

  it('follow the part: a wrong count of blades moves the speeds, the right one brings 1750 back', async () => {
    await hearFan();
    finderFeatures.value = 3;
    // 175 Hz from 3 blades would be 3500 rpm.
    expect(soundSpeeds.result.value!.candidates.map((c) => Math.round(c.speedHz * 60))).toContain(
      3500,
    );
    finderFeatures.value = 6;
    expect(soundSpeeds.result.value!.candidates[0]!.speedHz * 60).toBeCloseTo(1750, 0);
  });

  it('narrow the strobe’s whole multiples to one with a single reading', async () => {
    await hearFan();
    expect(soundJoin.result.value!.status).toBe('sound-only');
    // A single image at 1750 flashes/min: 1750 rpm and its whole multiples fit (docs/physics.md §7).
    addReading(1750, 1);
    expect(soundJoin.result.value!.status).toBe('one');
    const rows = heardCandidates.value!;
    expect(rows.length).toBeGreaterThan(1);
    expect(rows[0]!.lead).toBe(true);
    expect(rows[0]!.speedHz * 60).toBeCloseTo(1750, 0);
    expect(rows.filter((r) => r.lead)).toHaveLength(1);
  });
});

describe('applyHeardSpeed', () => {
  it('gives the part the speed, its precision as the tolerance, and hands the origin back', async () => {
    const heardAtMs = Date.UTC(2025, 11, 12, 12);
    const speedHz = 1749.4 / 60;
    const precisionHz = 0.02 / 60;
    const saved = await applyHeardSpeed(speedHz, { method: 'sound', precisionHz, heardAtMs });
    expect(activePart.value.speedRpm).toBeCloseTo(1749.4, 6);
    // 0.02 / 1749.4 = 0.00114 %, up to two figures: 0.0012 % (worked by hand).
    expect(activePart.value.tolerancePercent).toBe(0.0012);
    expect(toleranceFromPrecision(speedHz, precisionHz)).toBe(0.0012);
    expect(saved.origin).toEqual({
      method: 'sound',
      precisionHz,
      heardAtMs,
      tolerancePercent: 0.0012,
    });
    expect(saved.machineName).toBeNull();
    const lines = savedSpeedLines(saved);
    expect(lines).toContain('Speed found by sound, 12 Dec, ±0.0012 %.');
    expect(lines.join(' ')).not.toMatch(/NaN|Infinity/);
  });

  it('changes nothing when the machine to save to is gone', async () => {
    const before = setup.value;
    await expect(
      applyHeardSpeed(29, { method: 'sound', precisionHz: 0.01, heardAtMs: 0 }, { kind: 'open' }),
    ).rejects.toThrow();
    expect(setup.value).toBe(before);
  });
});
