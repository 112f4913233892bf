import { describe, expect, it } from 'vitest';
import FFT from 'fft.js';
import fc from 'fast-check';
import {
  flickerLimits,
  flickerRisk,
  lightHarmonics,
  lightSvm,
  percentFlicker,
  svm,
  svmThreshold,
  SVM_MAX_HZ,
  type LightWave,
} from '../../../src/core/formulas/flicker';
import {
  anyFinite,
  bad,
  expectInputError,
  finiteOrInputError,
  notNumbers,
} from '../expectInputError';

// IEEE Std 1789-2015 recommended-practice lines (docs/physics.md §6): low risk 0.025·f below 90 Hz,
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
    // docs/physics.md §6: mains at 50 or 60 Hz usually flickers at 100 or 120 Hz.
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
    // IES definition of percent flicker, as used by IEEE Std 1789-2015 (docs/physics.md §6).
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
  // The threshold T(f) = 2.865e-5·f^1.543 + 0.225 is the power fit of Perz, Vogels, Sekulovski,
  // Wang and Hu, "Stroboscopic effect: contrast threshold function and dependence on illumination
  // level", JOSA A 35(2):309 (2018); the SVM itself is defined in CIE TN 006:2016.
  it('computes the Perz et al. (2018) power fit: T(100 Hz) = 0.2599 (worked by hand)', () => {
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

/**
 * The light's harmonics found by spectrum analysis, independently of the closed forms: one
 * flicker period sampled N times, transformed by fft.js (a general-purpose FFT from the registry;
 * Cooley–Tukey, Math. Comp. 19, 1965); bin m of a real signal holds amplitude 2·|X_m|/N, divided
 * here by the mean (bin 0) to give C_m relative to the mean.
 */
function fftHarmonics(level: (phase: number) => number, count: number): number[] {
  const N = 1 << 16;
  const fft = new FFT(N);
  const input = new Array<number>(N);
  // Midpoint samples: a rectangular edge falls between samples, never on one.
  for (let i = 0; i < N; i++) input[i] = level((i + 0.5) / N);
  const out = fft.createComplexArray() as number[];
  fft.realTransform(out, input);
  const mean = out[0] / N;
  const amps: number[] = [];
  for (let m = 1; m <= count; m++)
    amps.push((2 * Math.hypot(out[2 * m], out[2 * m + 1])) / N / mean);
  return amps;
}

/** Levels normalised so that Lmax + Lmin = 2 (percent flicker M = (Lmax − Lmin)/2). */
const rectangular = (M: number, D: number) => (phase: number) => (phase < D ? 1 + M : 1 - M);
/** B + A·|sin(π·phase)| with Lmin = B, Lmax = B + A and M = A/(2B + A); A = 1. */
const rectified = (M: number) => (phase: number) =>
  (1 - M) / (2 * M) + Math.abs(Math.sin(Math.PI * phase));

describe('lightHarmonics: the light’s Fourier components for its waveform', () => {
  it('gives a sine one component equal to the percent flicker: C1 = M', () => {
    expect(lightHarmonics({ shape: 'sine' }, 100, 30)).toEqual([
      { frequencyHz: 100, amplitude: 0.3 },
    ]);
  });

  it('gives a 50 % square wave from 0 to full a fundamental 4/π times a sine’s, and odd harmonics 4/(mπ)', () => {
    // Fourier series of a rectangular pulse train: C_m = 2·|sin(mπD)|/(mπD) for a 0-to-1 wave.
    const h = lightHarmonics({ shape: 'rectangular', dutyCycle: 0.5 }, 100, 100);
    expect(h[0].amplitude).toBeCloseTo(4 / Math.PI, 12);
    expect(h[0].amplitude / lightHarmonics({ shape: 'sine' }, 100, 100)[0].amplitude).toBeCloseTo(
      4 / Math.PI,
      12,
    );
    expect(h[1].amplitude).toBeCloseTo(0, 12);
    expect(h[2].amplitude).toBeCloseTo(4 / (3 * Math.PI), 12);
    // Up to 2 kHz (CIE TN 006:2016): 20 harmonics of 100 Hz, the last at 2000 Hz.
    expect(h).toHaveLength(20);
    expect(h.at(-1)!.frequencyHz).toBe(SVM_MAX_HZ);
  });

  it('matches an FFT of the rectangular wave for any duty and depth', () => {
    for (const [M, D] of [
      [1, 0.5],
      [1, 0.1],
      [0.3, 0.25],
      [0.8, 0.7],
    ]) {
      const closed = lightHarmonics({ shape: 'rectangular', dutyCycle: D }, 100, 100 * M);
      const found = fftHarmonics(rectangular(M, D), 12);
      for (let m = 0; m < 12; m++)
        expect(closed[m].amplitude, `M ${M}, D ${D}, m ${m + 1}`).toBeCloseTo(found[m], 3);
    }
  });

  it('gives the full-wave rectified sine C_k = 2/(4k² − 1) at 100 % flicker: 2/3, 2/15, 2/35', () => {
    // |sin x| = 2/π − (4/π)·Σ cos(2kx)/(4k² − 1): each term over the mean 2/π.
    const h = lightHarmonics({ shape: 'rectified' }, 100, 100);
    expect(h.slice(0, 3).map((c) => c.amplitude)).toEqual([
      expect.closeTo(2 / 3, 12),
      expect.closeTo(2 / 15, 12),
      expect.closeTo(2 / 35, 12),
    ]);
    expect(h.map((c) => c.frequencyHz).slice(0, 3)).toEqual([100, 200, 300]);
  });

  it('matches an FFT of the rectified wave, smoothed or not', () => {
    for (const M of [1, 0.5, 0.2]) {
      const closed = lightHarmonics({ shape: 'rectified' }, 100, 100 * M);
      const found = fftHarmonics(rectified(M), 8);
      for (let k = 0; k < 8; k++)
        expect(closed[k].amplitude, `M ${M}, k ${k + 1}`).toBeCloseTo(found[k], 6);
    }
  });

  it('keeps percent flicker and waveform consistent: each modelled wave has the percent flicker it was given', () => {
    // Percent flicker 100·(Lmax − Lmin)/(Lmax + Lmin) (IES definition, as in IEEE Std 1789-2015).
    const sampled = (level: (p: number) => number) => {
      let hi = -Infinity;
      let lo = Infinity;
      for (let i = 0; i <= 10000; i++) {
        const v = level(i / 10000);
        hi = Math.max(hi, v);
        lo = Math.min(lo, v);
      }
      return (100 * (hi - lo)) / (hi + lo);
    };
    for (const M of [0.1, 0.5, 1]) {
      expect(sampled(rectangular(M, 0.3))).toBeCloseTo(100 * M, 9);
      expect(sampled(rectified(M))).toBeCloseTo(100 * M, 6);
    }
  });

  it('has nothing for steady light, and nothing above 2 kHz', () => {
    expect(lightHarmonics({ shape: 'rectified' }, 100, 0)).toEqual([]);
    expect(lightHarmonics({ shape: 'sine' }, 2500, 50)).toEqual([]);
    expect(lightSvm({ shape: 'sine' }, 2500, 50)).toBe(0);
    expect(lightSvm({ shape: 'rectangular', dutyCycle: 0.5 }, 100, 0)).toBe(0);
  });

  it('rejects an unknown shape and a duty at or beyond 0 or 100 %', () => {
    expectInputError(
      () => lightHarmonics(bad({ shape: 'triangle' }), 100, 30),
      'light waveform',
      'waveform',
    );
    expectInputError(() => lightHarmonics(bad(null), 100, 30), 'light waveform', 'waveform');
    for (const d of [0, 1, -0.1, 1.5, undefined])
      expectInputError(
        () => lightHarmonics({ shape: 'rectangular', dutyCycle: d } as LightWave, 100, 30),
        'duty cycle',
      );
  });
});

describe('lightSvm: the SVM of a lamp’s waveform', () => {
  it('equals svm of the single component for a sine (the doc example)', () => {
    expect(lightSvm({ shape: 'sine' }, 100, 26)).toBe(svm([{ frequencyHz: 100, amplitude: 0.26 }]));
  });

  it('counts every harmonic up to 2 kHz of a square wave with the Perz et al. (2018) threshold', () => {
    // Written out: C_m = 4/(mπ) for odd m at 50 % duty, T(f) = 2.865e-5·f^1.543 + 0.225, Minkowski 3.7.
    const T = (f: number) => 2.865e-5 * Math.pow(f, 1.543) + 0.225;
    let sum = 0;
    for (let m = 1; m <= 20; m += 2) sum += Math.pow(4 / (m * Math.PI) / T(100 * m), 3.7);
    expect(lightSvm({ shape: 'rectangular', dutyCycle: 0.5 }, 100, 100)).toBeCloseTo(
      Math.pow(sum, 1 / 3.7),
      12,
    );
  });

  it('never gives NaN or Infinity', () => {
    fc.assert(
      fc.property(
        fc.constantFrom('sine', 'rectangular', 'rectified'),
        anyFinite(),
        anyFinite(),
        anyFinite(),
        (shape, duty, f, m) =>
          finiteOrInputError(() => lightSvm({ shape, dutyCycle: duty } as LightWave, f, m)),
      ),
      { seed: 2018, numRuns: 500 },
    );
  });
});
