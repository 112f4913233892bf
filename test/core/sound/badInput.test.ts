/**
 * Bad input to the sound core: a clear InputError naming the field, or a clear "no tone"
 * result; never NaN or Infinity, never another error (the core's contract, DEVELOPERS.md).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  joinSoundWithStrobe,
  soundSpectrum,
  speedsFromSound,
  type SoundSpeedCandidate,
} from '../../../src/core';
import { bad, expectInputError, finiteOrInputError, notNumbers } from '../expectInputError';
import { fanAt1750Rpm } from '../../helpers/sound/machineSound';

const FS = 48_000;
const fanSpectrum = soundSpectrum(fanAt1750Rpm(FS, 4), FS);

describe('soundSpectrum refuses', () => {
  it('an empty or too short recording', () => {
    expect(
      expectInputError(() => soundSpectrum(new Float32Array(0), FS), 'recording').message,
    ).toMatch(/empty/);
    expect(
      expectInputError(() => soundSpectrum(new Float32Array(0.2 * FS), FS), 'recording').message,
    ).toMatch(/0\.20 s long; at least 0\.5 s/);
  });

  it('a recording that is not a list of numbers', () => {
    for (const v of [null, undefined, 3, 'samples', {}])
      expectInputError(() => soundSpectrum(bad(v), FS), 'recording');
  });

  it('a sample that is not a number, or far beyond full scale, naming it', () => {
    for (const v of [NaN, Infinity, -Infinity, 1e6]) {
      const x = new Float64Array(FS);
      x[1234] = v;
      expect(expectInputError(() => soundSpectrum(x, FS), 'recording').message).toMatch(
        /sample 1235/,
      );
    }
    expectInputError(
      () => soundSpectrum(bad(Array.from({ length: FS }, (_, i) => (i === 9 ? '0.1' : 0))), FS),
      'recording',
    );
  });

  it('a sample rate that is no sample rate', () => {
    for (const rate of [...notNumbers, 0, -48_000, 100, 3999, 384_001, 1e9]) {
      expectInputError(() => soundSpectrum(new Float32Array(FS), bad(rate)), 'sample rate');
    }
  });

  it('a two-hour recording, before reading a sample of it', () => {
    // A list that only claims its length: nothing is read when the length alone is too much.
    const twoHours = { length: 2 * 3600 * FS } as ArrayLike<number>;
    const error = expectInputError(() => soundSpectrum(twoHours, FS), 'recording');
    expect(error.message).toMatch(/2 h 0 min long; up to 10 minutes/);
  });

  it('options out of range', () => {
    const x = new Float32Array(FS);
    expectInputError(() => soundSpectrum(x, FS, { segmentS: 0 }), 'segment length');
    expectInputError(
      () => soundSpectrum(x, FS, { maxAnalysedS: 1000 }),
      'longest stretch analysed',
    );
    expectInputError(() => soundSpectrum(x, FS, { minToneHz: -1 }), 'lowest frequency');
    expectInputError(() => soundSpectrum(x, FS, { maxToneHz: 30_000 }), 'highest frequency');
  });
});

describe('silence and clipping', () => {
  it('a silent recording gives a spectrum with no lines and "silent", all numbers finite', () => {
    const s = soundSpectrum(new Float32Array(2 * FS), FS);
    expect(s.level.silent).toBe(true);
    expect(s.peaks).toEqual([]);
    expect(finiteOrInputError(() => s)).toBe(true);
    expect(speedsFromSound(s, { symmetry: 6 })).toMatchObject({ candidates: [], noTone: 'silent' });
  });

  it('a square wave at full scale reads as clipped', () => {
    const x = Float32Array.from({ length: FS }, (_, i) =>
      Math.sin((2 * Math.PI * 100 * i) / FS) >= 0 ? 1 : -1,
    );
    expect(soundSpectrum(x, FS).level.clipped).toBe(true);
  });
});

describe('speedsFromSound refuses', () => {
  it('a missing spectrum', () => {
    for (const v of [null, undefined, {}, { power: [1, 2], binHz: 1 }]) {
      expectInputError(() => speedsFromSound(bad(v), { symmetry: 6 }), 'spectrum');
    }
  });

  it('a feature count that is not a whole number ≥ 1', () => {
    for (const n of [...notNumbers, 0, -3, 2.5]) {
      expectInputError(
        () => speedsFromSound(fanSpectrum, { symmetry: bad(n) }),
        'features (blades, teeth)',
      );
    }
  });

  it('an empty or inverted expected range, and a mains frequency other than 50 or 60 Hz', () => {
    expectInputError(
      () => speedsFromSound(fanSpectrum, { symmetry: 6, expect: { minHz: 30, maxHz: 20 } }),
      'expected speed range',
    );
    expectInputError(
      () => speedsFromSound(fanSpectrum, { symmetry: 6, expect: { minHz: 0, maxHz: 20 } }),
      'lowest expected speed',
    );
    expectInputError(
      () => speedsFromSound(fanSpectrum, { symmetry: 6, mainsHz: bad(55) }),
      'mains',
    );
  });

  it('an expected range too wide to search at a fine resolution, with advice', () => {
    const fine = soundSpectrum(fanAt1750Rpm(FS, 40), FS, { segmentS: 10, maxAnalysedS: 40 });
    const error = expectInputError(
      () => speedsFromSound(fine, { symmetry: 10_000, expect: { minHz: 1e-4, maxHz: 1e6 } }),
      'expected speed range',
    );
    expect(error.message).toMatch(/narrow the expected speed range/);
  });
});

describe('joinSoundWithStrobe refuses', () => {
  const sound = speedsFromSound(fanSpectrum, { symmetry: 6 }).candidates;
  it('a missing sound estimate, a bad symmetry, bad strobe candidates or range', () => {
    expectInputError(() => joinSoundWithStrobe(bad(null), [], { symmetry: 6 }), 'sound');
    expectInputError(
      () => joinSoundWithStrobe(sound, [], { symmetry: bad(0) }),
      'features (blades, teeth)',
    );
    expectInputError(
      () => joinSoundWithStrobe(sound, [{ speedHz: NaN }], { symmetry: 6 }),
      'speed of strobe candidate 1',
    );
    expectInputError(
      () => joinSoundWithStrobe(sound, [], { symmetry: 6, rateRange: { minHz: 5, maxHz: 1 } }),
      'strobe range',
    );
    expectInputError(
      () => joinSoundWithStrobe(sound, [], { symmetry: 6, strobeTolerance: 2 }),
      'strobe tolerance',
    );
    const broken = [{ ...sound[0], speedHz: -1 }] as SoundSpeedCandidate[];
    expectInputError(
      () => joinSoundWithStrobe(broken, [], { symmetry: 6 }),
      'speed of sound candidate 1',
    );
  });
});

describe('any recording', () => {
  it('gives finite numbers or an InputError, never NaN (random samples, rates and options)', () => {
    fc.assert(
      fc.property(
        fc.float32Array({ minLength: 0, maxLength: 6000 }),
        fc.oneof(fc.constantFrom(4000, 8000, 11_025), fc.double({ min: -1e6, max: 1e6 })),
        fc.integer({ min: -2, max: 50 }),
        (samples, rate, symmetry) =>
          finiteOrInputError(() => {
            const s = soundSpectrum(samples, rate, {
              segmentS: 0.25,
              minToneHz: 20,
              maxToneHz: 1000,
            });
            return [s, speedsFromSound(s, { symmetry })];
          }),
      ),
      { numRuns: 200, seed: 12 },
    );
  });
});
