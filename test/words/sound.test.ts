// The speed by sound in words (src/words/sound.ts, src/words/soundStep.ts): every confidence,
// every reason no speed was heard, every capture problem, what a speed was heard as, its
// precision in rpm and percent, the hum, the origin note, and the step once a strobe reading
// joins the sound. Speeds come from the core run on a generated fan sound (test/helpers/sound),
// so the sentences are checked against what the core really gives.
import { describe, expect, it } from 'vitest';
import {
  joinSoundWithStrobe,
  MAX_RECORDING_S,
  soundSpectrum,
  speedFinderSteps,
  speedsFromSound,
  type SoundConfidence,
  type SoundSpeedCandidate,
} from '../../src/core';
import { MAX_SOUND_FILE_BYTES, type SoundCaptureProblem } from '../../src/audio';
import { toleranceFromPrecision } from '../../src/state/speedFinder';
import {
  captureProblemWords,
  CONFIDENCE_WORDS,
  dayWords,
  heardAsWords,
  heardFromWords,
  humWords,
  noToneWords,
  heardOriginWords,
  soundSpeedWords,
  speedFigures,
  type NoToneReason,
} from '../../src/words/sound';
import {
  heardNote,
  heardStatus,
  SOUND_STAGE_TITLES,
  soundStageOf,
  soundStepInstruction,
  strobeViewWords,
} from '../../src/words/soundStep';
import { fanAt1750Rpm } from '../helpers/sound/machineSound';

const LIMITS = { maxFileBytes: MAX_SOUND_FILE_BYTES, maxRecordingS: MAX_RECORDING_S };
const BAD = /NaN|Infinity|undefined|null|\[object/;

/** The speeds the core finds in 4 s of the generated 6-blade fan at 1750 rpm (50 Hz site). */
function fanSpeeds() {
  const spectrum = soundSpectrum(fanAt1750Rpm(48_000, 4), 48_000);
  return speedsFromSound(spectrum, { symmetry: 6 });
}

describe('how sure a speed is', () => {
  const all: SoundConfidence[] = ['clear', 'likely', 'tied', 'possible', 'faint'];

  it('has a label and a sentence for every confidence the core gives', () => {
    for (const c of all) {
      const { label, meaning } = CONFIDENCE_WORDS[c];
      expect(label).toMatch(/^[A-Z][a-z]+$/);
      expect(meaning.length).toBeGreaterThan(30);
      expect(meaning).not.toMatch(BAD);
    }
    // Every key is a confidence the core defines, no more.
    expect(Object.keys(CONFIDENCE_WORDS).sort()).toEqual([...all].sort());
  });

  it('names the faint threshold the core uses (16 dB above the noise, speedsFromSound)', () => {
    expect(CONFIDENCE_WORDS.faint.meaning).toMatch(/16 dB above the noise/);
  });

  it('says a tie cannot be chosen by sound alone, and how it is settled', () => {
    expect(CONFIDENCE_WORDS.tied.meaning).toMatch(/cannot choose/);
    expect(CONFIDENCE_WORDS.tied.meaning).toMatch(/strobe reading/);
  });
});

describe('why no speed was heard', () => {
  const reasons: NoToneReason[] = ['silent', 'no-lines', 'hum-only', 'no-match'];

  it('gives a sentence with what to do next for every reason', () => {
    for (const r of reasons) {
      const text = noToneWords(r, { minHz: 2, maxHz: 250 });
      expect(text).not.toMatch(BAD);
      expect(text).toMatch(/listen again|hold the phone|Check/i);
    }
  });

  it('names the speeds searched in rpm (120 to 15,000 rpm for 2 to 250 rev/s)', () => {
    expect(noToneWords('no-match', { minHz: 2, maxHz: 250 })).toMatch(/between 120 and 15,000 rpm/);
  });
});

describe('what went wrong while getting the sound', () => {
  const codes: SoundCaptureProblem[] = [
    'mic-unavailable',
    'mic-refused',
    'mic-absent',
    'mic-busy',
    'no-audio-support',
    'too-short',
    'silence',
    'clipping',
    'cancelled',
    'not-audio',
    'file-too-large',
    'file-too-long',
  ];

  it('has a clear sentence for every code, with no stray values', () => {
    const seen = new Set<string>();
    for (const code of codes) {
      const text = captureProblemWords(code, LIMITS);
      expect(text, code).not.toMatch(BAD);
      expect(text.length, code).toBeGreaterThan(30);
      seen.add(text);
    }
    // Each code says something of its own.
    expect(seen.size).toBe(codes.length);
  });

  it('points every microphone problem to the file route', () => {
    for (const code of codes.filter((c) => c.startsWith('mic-') || c === 'no-audio-support')) {
      expect(captureProblemWords(code, LIMITS), code).toMatch(/Analyse a recording/);
    }
  });

  it('names the file limits in units a person reads (16 MB, 10 minutes)', () => {
    expect(captureProblemWords('file-too-large', LIMITS)).toMatch(/larger than 16 MB/);
    expect(captureProblemWords('file-too-long', LIMITS)).toMatch(/longer than 10 minutes/);
  });
});

describe('a speed heard', () => {
  const found = fanSpeeds();
  const leader = found.candidates[0]!;

  it('is the fan’s speed, heard as its blade-pass tone with harmonics (f = n·rpm/60, common practice)', () => {
    // 6 blades at 1750 rpm: blade pass 6 × 1750 / 60 = 175 Hz.
    expect(leader.speedHz * 60).toBeCloseTo(1750, 0);
    const said = heardAsWords(leader, 'fan');
    // The generated fan has lines at 6, 12 and 18 × f and a faint shaft line; the 18th sits
    // under the pink noise in 4 s, so the core explains 175 Hz, 350 Hz and the shaft line.
    expect(said).toBe('blade-pass tone at 175 Hz, with a harmonic and a shaft line');
    expect(heardAsWords(leader, 'gear')).toMatch(/^gear-mesh tone at 175 Hz/);
  });

  it('reads a shaft-line speed as such', () => {
    const shaft: SoundSpeedCandidate = {
      ...leader,
      basis: 'shaft',
      toneHz: 29.17,
      lines: [
        { hz: 29.17, order: 1, kind: 'shaft', levelDb: -30, prominenceDb: 20 },
        { hz: 58.33, order: 2, kind: 'shaft', levelDb: -40, prominenceDb: 18 },
      ],
    };
    expect(heardAsWords(shaft, 'fan')).toBe('shaft line at 29.17 Hz, with one more');
  });

  it('shows its precision in rpm and in percent, the percent being the tolerance the part gets', () => {
    const figures = speedFigures(leader);
    const plusMinusRpm = Number(figures.plusMinus);
    // Never tighter than measured: the rounded figure is at least the precision, within 10 %.
    expect(plusMinusRpm).toBeGreaterThanOrEqual(leader.precisionHz * 60 - 1e-9);
    expect(plusMinusRpm).toBeLessThanOrEqual(leader.precisionHz * 60 * 1.1 + 0.01);
    expect(Number(figures.percent)).toBe(
      toleranceFromPrecision(leader.speedHz, leader.precisionHz),
    );
    expect(soundSpeedWords(leader)).toBe(
      `${figures.rpm} rpm ± ${figures.plusMinus} rpm (±${figures.percent} %)`,
    );
  });

  it('rounds a worked example: 29.1572 rev/s ± 0.00132 rev/s', () => {
    // 0.00132 × 60 = 0.0792 rpm, up to two figures 0.080 → "0.08"; 100 × 0.00132 / 29.1572 =
    // 0.004527 %, up to two figures 0.0046 % (worked by hand).
    expect(speedFigures({ speedHz: 29.1572, precisionHz: 0.00132 })).toEqual({
      rpm: '1,749.43',
      plusMinus: '0.08',
      percent: '0.0046',
    });
    expect(soundSpeedWords({ speedHz: 29.1667, precisionHz: 0.5 })).toBe(
      '1,750 rpm ± 30 rpm (±1.8 %)',
    );
  });

  it('never shows NaN or Infinity, whatever the precision', () => {
    for (const precisionHz of [0, Number.NaN, Number.POSITIVE_INFINITY, 1e-12, 1e6]) {
      expect(soundSpeedWords({ speedHz: 29.1667, precisionHz })).not.toMatch(BAD);
    }
    expect(soundSpeedWords({ speedHz: Number.NaN, precisionHz: 0.01 })).not.toMatch(BAD);
  });

  it('marks mains hum as such', () => {
    expect(humWords({ hz: 100, mainsHz: 50, harmonic: 2 })).toBe('Mains hum at 100 Hz (2 × 50 Hz)');
    expect(humWords({ hz: 60, mainsHz: 60, harmonic: 1 })).toBe(
      'Mains hum at 60 Hz (the 60 Hz supply)',
    );
    // The generated fan has 100 Hz hum, and the core sets it aside.
    expect(found.hum.map((h) => humWords(h))).toContain('Mains hum at 100 Hz (2 × 50 Hz)');
  });

  it('says where the sound came from and how much of it was read', () => {
    const spectrum = { durationS: 4, analysedS: 4 };
    expect(heardFromWords({ source: 'microphone', spectrum })).toBe('4 s from the microphone');
    expect(
      heardFromWords({
        source: 'file',
        fileName: 'fan.m4a',
        spectrum: { durationS: 300, analysedS: 10 },
      }),
    ).toBe('5 minutes from “fan.m4a” (its middle 10 s read)');
  });

  it('notes where an applied speed came from: "by sound, 12 Dec, ±0.035 %"', () => {
    const heardAtMs = Date.UTC(2025, 11, 12, 12);
    expect(dayWords(heardAtMs)).toBe('12 Dec');
    expect(heardOriginWords({ method: 'sound', precisionHz: 0.01, heardAtMs }, 0.035)).toBe(
      'by sound, 12 Dec, ±0.035 %',
    );
    expect(
      heardOriginWords({ method: 'sound-and-strobe', precisionHz: 0.01, heardAtMs }, 0.035),
    ).toBe('by sound, confirmed by strobe, 12 Dec, ±0.035 %');
  });
});

describe('the step once a speed was heard', () => {
  const speeds = fanSpeeds();
  const leader = speeds.candidates[0]!;
  const STROBE = { minHz: 0.5, maxHz: 200 };

  it('asks for one strobe reading at the rate that confirms the heard speed', () => {
    const join = joinSoundWithStrobe(speeds.candidates, undefined, {
      symmetry: 6,
      rateRange: STROBE,
    });
    expect(soundStageOf(join)).toBe('sound-confirm');
    const say = soundStepInstruction(join, leader, 0);
    expect(say).toMatch(
      /^By sound the part turns at 1,75\d(\.\d+)? rpm ± [\d.]+ rpm \(±[\d.]+ %\)/,
    );
    expect(say).toMatch(/Set [\d,.]+ flashes\/min: at that speed/);
    expect(say).not.toMatch(BAD);
  });

  it('narrows the strobe’s whole-multiple ambiguity to the heard speed with one reading', () => {
    // One reading: a single image standing still at 1750 flashes/min. The strobe alone allows
    // 1750 rpm and its whole multiples (docs/physics.md §7); the sound picks 1750.
    const step = speedFinderSteps({
      symmetry: 6,
      strobeRange: STROBE,
      readings: [{ rateHz: 1750 / 60, images: 1 }],
    });
    expect(step.candidates.length).toBeGreaterThan(1);
    const join = joinSoundWithStrobe(speeds.candidates, step.candidates, {
      symmetry: 6,
      rateRange: STROBE,
    });
    expect(join.status).toBe('one');
    expect(soundStageOf(join)).toBe('sound-agrees');
    expect(SOUND_STAGE_TITLES['sound-agrees']).toMatch(/agree/);
    const say = soundStepInstruction(join, leader, 1);
    expect(say).toMatch(/^The part turns at 1,75\d(\.\d+)? rpm ± /);
    expect(say).toMatch(/the sound and the strobe reading agree/);
  });

  it('says so when no speed heard fits the readings', () => {
    // 1000 flashes/min with one image fits 1000 rpm and its multiples, none near 1750 rpm.
    const step = speedFinderSteps({
      symmetry: 6,
      strobeRange: STROBE,
      readings: [{ rateHz: 1000 / 60, images: 1 }],
    });
    const join = joinSoundWithStrobe(speeds.candidates, step.candidates, {
      symmetry: 6,
      rateRange: STROBE,
    });
    expect(soundStageOf(join)).toBe('sound-disagrees');
    expect(soundStepInstruction(join, leader, 1)).toMatch(
      /^No speed heard fits the strobe reading/,
    );
  });

  it('words what a speed shows under the flash', () => {
    expect(strobeViewWords({ images: 1, look: 'still' })).toBe('a single image stands still');
    expect(strobeViewWords({ images: 2, look: 'still' })).toBe('2 images stand still');
    expect(strobeViewWords({ images: 1, look: 'backward' })).toBe('it seems to turn backward');
  });

  it('tells a candidate’s standing and why', () => {
    expect(heardStatus({ lead: true, heard: {} })).toBe('Likeliest: heard and seen');
    expect(heardStatus({ lead: false, heard: {} })).toBe('Fits, and heard');
    expect(heardStatus({ lead: false })).toBe('Fits the readings, not heard');
    expect(
      heardNote({ heard: { speedHz: 1750 / 60, precisionHz: 0.01, soundConfidence: 'clear' } }),
    ).toBe('Heard at 1,750 rpm ± 0.6 rpm (±0.035 %) (clear).');
    expect(heardNote({})).toMatch(/no line of the sound fits it/);
  });
});
