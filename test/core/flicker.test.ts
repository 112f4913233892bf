import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  flickerLimits,
  flickerRisk,
  percentFlicker,
  svm,
  svmThreshold,
} from '../../src/core/flicker';
import {
  anyFinite,
  bad,
  expectInputError,
  finiteOrInputError,
  notNumbers,
} from './expectInputError';

// IEEE Std 1789-2015 recommended-practice lines (physics.md §6): low risk 0.025·f below 90 Hz,
// 0.08·f from 90 to 1250 Hz, no limit above; no observable effect 0.01·f below 90 Hz, 0.0333·f
// from 90 to 3000 Hz, no limit above. flicker.ts documents: 90 Hz belongs to the upper segment,
// 1250 Hz and 3000 Hz still carry their line, and a modulation on a line counts on the lower-risk side.

describe('flickerLimits: the IEEE Std 1789-2015 lines', () => {
  it('allows 0.025·f and 0.01·f percent below 90 Hz', () => {
    expect(flickerLimits(10).lowRiskPercent).toBeCloseTo(0.25, 12); // 0.025 × 10
    expect(flickerLimits(10).noEffectPercent).toBeCloseTo(0.1, 12); // 0.01 × 10
    expect(flickerLimits(60).lowRiskPercent).toBeCloseTo(1.5, 12);
    expect(flickerLimits(60).noEffectPercent).toBeCloseTo(0.6, 12);
  });

  it('puts 90 Hz on the upper segment: 0.08·f and 0.0333·f, while 89.9 Hz keeps the lower lines', () => {
    expect(flickerLimits(90).lowRiskPercent).toBeCloseTo(7.2, 12); // 0.08 × 90
    expect(flickerLimits(90).noEffectPercent).toBeCloseTo(2.997, 12); // 0.0333 × 90
    expect(flickerLimits(89.9).lowRiskPercent).toBeCloseTo(2.2475, 12); // 0.025 × 89.9
    expect(flickerLimits(89.9).noEffectPercent).toBeCloseTo(0.899, 12); // 0.01 × 89.9
  });

  it('gives the mains flicker rates 100 Hz and 120 Hz their 0.08·f and 0.0333·f lines', () => {
    // physics.md §6: mains at 50 or 60 Hz usually flickers at 100 or 120 Hz.
    expect(flickerLimits(100)).toEqual({
      lowRiskPercent: expect.closeTo(8, 12),
      noEffectPercent: expect.closeTo(3.33, 12),
    });
    expect(flickerLimits(120)).toEqual({
      lowRiskPercent: expect.closeTo(9.6, 12),
      noEffectPercent: expect.closeTo(3.996, 12),
    });
  });

  it('keeps the low-risk line at 1250 Hz (0.08 × 1250 = 100 %) and lifts it above', () => {
    expect(flickerLimits(1249).lowRiskPercent).toBeCloseTo(99.92, 12);
    expect(flickerLimits(1250).lowRiskPercent).toBeCloseTo(100, 12);
    expect(flickerLimits(1251).lowRiskPercent).toBe(100);
  });

  it('keeps the no-effect line at 3000 Hz (0.0333 × 3000 = 99.9 %) and lifts it just above', () => {
    expect(flickerLimits(3000).noEffectPercent).toBeCloseTo(99.9, 12);
    expect(flickerLimits(3000.5).noEffectPercent).toBe(100);
  });

  it('never allows more than 100 % and never less than zero', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-6, max: 1e6, noNaN: true }), (f) => {
        const { lowRiskPercent, noEffectPercent } = flickerLimits(f);
        return noEffectPercent >= 0 && noEffectPercent <= lowRiskPercent && lowRiskPercent <= 100;
      }),
    );
  });
});

describe('flickerRisk', () => {
  it('calls 5 % at 120 Hz low risk: above the 4 % no-effect line, below the 9.6 % low-risk line (doc example)', () => {
    expect(flickerRisk(120, 5)).toBe('low-risk');
  });

  it('counts a modulation exactly on a line on the lower-risk side, and just above it on the higher', () => {
    expect(flickerRisk(120, 3.996)).toBe('no-effect');
    expect(flickerRisk(120, 4.0)).toBe('low-risk');
    expect(flickerRisk(120, 9.6)).toBe('low-risk');
    expect(flickerRisk(120, 9.61)).toBe('elevated');
    expect(flickerRisk(60, 0.6)).toBe('no-effect');
    expect(flickerRisk(60, 1.5)).toBe('low-risk');
    expect(flickerRisk(60, 1.51)).toBe('elevated');
  });

  it('judges the same modulation differently on either side of 90 Hz', () => {
    expect(flickerRisk(90, 7.2)).toBe('low-risk'); // on the 0.08·f line
    expect(flickerRisk(89.9, 7.2)).toBe('elevated'); // far above 0.025·f = 2.2475
    expect(flickerRisk(90, 2.997)).toBe('no-effect'); // on the 0.0333·f line
    expect(flickerRisk(89.9, 2.997)).toBe('elevated');
  });

  it('judges full modulation at and beyond 1250 Hz and 3000 Hz', () => {
    expect(flickerRisk(1250, 100)).toBe('low-risk');
    expect(flickerRisk(1249, 100)).toBe('elevated');
    expect(flickerRisk(3000, 99.9)).toBe('no-effect');
    expect(flickerRisk(3000, 100)).toBe('low-risk');
    expect(flickerRisk(3001, 100)).toBe('no-effect');
  });

  it('calls steady light (no modulation) no-effect at any frequency', () => {
    expect(flickerRisk(0.5, 0)).toBe('no-effect');
    expect(flickerRisk(100, 0)).toBe('no-effect');
  });

  it('rejects a frequency not above zero and a modulation outside 0 to 100 %', () => {
    expectInputError(() => flickerRisk(0, 5), 'flicker frequency');
    expectInputError(() => flickerRisk(-100, 5), 'flicker frequency');
    expectInputError(() => flickerRisk(100, -1), 'modulation (percent flicker)');
    expectInputError(() => flickerRisk(100, 101), 'modulation (percent flicker)');
    for (const v of notNumbers) {
      expectInputError(() => flickerRisk(bad(v), 5), 'flicker frequency');
      expectInputError(() => flickerRisk(100, bad(v)), 'modulation (percent flicker)');
      expectInputError(() => flickerLimits(bad(v)), 'flicker frequency');
    }
  });
});

describe('percentFlicker', () => {
  it('is 100·(Lmax − Lmin)/(Lmax + Lmin): 150 and 50 give 50 % (doc example)', () => {
    // IES definition of percent flicker, as used by IEEE Std 1789-2015 (physics.md §6).
    expect(percentFlicker(150, 50)).toBe(50);
    expect(percentFlicker(1, 0)).toBe(100);
    expect(percentFlicker(7, 7)).toBe(0);
    expect(percentFlicker(110, 90)).toBeCloseTo(10, 12);
  });

  it('rejects a lowest level above the highest, negative levels and non-numbers', () => {
    expectInputError(() => percentFlicker(50, 150), 'lowest light level');
    expectInputError(() => percentFlicker(50, -1), 'lowest light level');
    expectInputError(() => percentFlicker(0, 0), 'highest light level');
    for (const v of notNumbers) {
      expectInputError(() => percentFlicker(bad(v), 1), 'highest light level');
      expectInputError(() => percentFlicker(10, bad(v)), 'lowest light level');
    }
  });
});

describe('svm: stroboscopic visibility measure', () => {
  // The threshold T(f) = 2.865e-5·f^1.543 + 0.225 is the one physics.md §6 gives for CIE TN 006:2016.
  it('computes the threshold physics.md §6 gives: T(100 Hz) = 0.2599 (worked by hand)', () => {
    expect(svmThreshold(100)).toBeCloseTo(0.259924, 6);
    expect(svmThreshold(1000)).toBeCloseTo(1.444339, 6);
    expect(svmThreshold(1)).toBeCloseTo(0.22502865, 10);
  });

  it('is 1, the visibility threshold, for a single component at C = T(f)', () => {
    for (const f of [50, 100, 120, 300, 1000, 2000]) {
      expect(svm([{ frequencyHz: f, amplitude: svmThreshold(f) }]), `${f} Hz`).toBeCloseTo(1, 12);
    }
  });

  it('states the literal result of its doc example: 26 % at 100 Hz is just above the threshold', () => {
    expect(svm([{ frequencyHz: 100, amplitude: 0.26 }])).toBe(1.000292193008748);
  });

  it('combines components with the Minkowski exponent 3.7', () => {
    // (Σ (C/T)^3.7)^(1/3.7): two components each at threshold give 2^(1/3.7) = 1.2060.
    const atThreshold = (f: number) => ({ frequencyHz: f, amplitude: svmThreshold(f) });
    expect(svm([atThreshold(100), atThreshold(300)])).toBeCloseTo(1.206034, 6);
    // One at threshold and one at half of it: (1 + 0.5^3.7)^(1/3.7) = 1.0202.
    expect(
      svm([atThreshold(100), { frequencyHz: 300, amplitude: svmThreshold(300) / 2 }]),
    ).toBeCloseTo(1.020237, 6);
  });

  it('falls as the frequency rises for the same amplitude', () => {
    expect(svm([{ frequencyHz: 100, amplitude: 0.3 }])).toBeGreaterThan(
      svm([{ frequencyHz: 1000, amplitude: 0.3 }]),
    );
  });

  it('is zero for steady light', () => {
    expect(svm([{ frequencyHz: 100, amplitude: 0 }])).toBe(0);
  });

  it('rejects no components, frequencies not above zero and amplitudes outside 0 to 10', () => {
    expectInputError(() => svm([]), 'light components', 'component');
    expectInputError(() => svm(bad(undefined)), 'light components', 'component');
    expectInputError(() => svm([{ frequencyHz: 0, amplitude: 0.1 }]), 'frequency of component 1');
    expectInputError(
      () =>
        svm([
          { frequencyHz: 100, amplitude: 0.1 },
          { frequencyHz: 100, amplitude: -0.1 },
        ]),
      'amplitude of component 2',
    );
    expectInputError(() => svm([{ frequencyHz: 100, amplitude: 11 }]), 'amplitude of component 1');
    expectInputError(() => svm([bad(null)]), 'frequency of component 1');
    for (const v of notNumbers) expectInputError(() => svmThreshold(bad(v)), 'flicker frequency');
  });
});

describe('flicker: never NaN or Infinity', () => {
  it('returns finite numbers or throws InputError for any finite input', () => {
    fc.assert(
      fc.property(anyFinite(), anyFinite(), anyFinite(), (a, b, c) => {
        return (
          finiteOrInputError(() => flickerLimits(a)) &&
          finiteOrInputError(() => flickerRisk(a, b)) &&
          finiteOrInputError(() => percentFlicker(a, b)) &&
          finiteOrInputError(() => svmThreshold(a)) &&
          finiteOrInputError(() =>
            svm([
              { frequencyHz: a, amplitude: b },
              { frequencyHz: c, amplitude: 1 },
            ]),
          )
        );
      }),
      { numRuns: 500 },
    );
  });

  it('copes with light levels near the largest number', () => {
    expect(percentFlicker(Number.MAX_VALUE, Number.MAX_VALUE / 2)).toBeCloseTo(100 / 3, 9);
  });
});
