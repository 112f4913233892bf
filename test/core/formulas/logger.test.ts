import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  converterRangeDb,
  foldedHz,
  lowPassGainDb,
  orderForAttenuation,
  rcCutoffHz,
} from '../../../src/core/formulas/logger';
import {
  anyFinite,
  anyPositive,
  bad,
  expectInputError,
  finiteOrInputError,
  notNumbers,
} from '../expectInputError';

describe('foldedHz', () => {
  it('folds 20 Hz sampled at 18 or at 22 per second to 2 Hz', () => {
    // Common practice: a 20 Hz signal sampled at 18 or 22 samples/s looks like 2 Hz. Doc example.
    expect(foldedHz(20, 18)).toBe(2);
    expect(foldedHz(20, 22)).toBe(2);
  });

  it('shows nothing above 500 Hz at 1000 samples per second', () => {
    // Common practice: 1000 samples/s show nothing above 500 Hz (Shannon 1949).
    expect(foldedHz(499, 1000)).toBe(499);
    expect(foldedHz(500, 1000)).toBe(500);
    expect(foldedHz(501, 1000)).toBe(499);
    expect(foldedHz(1000, 1000)).toBe(0);
    expect(foldedHz(1250, 1000)).toBe(250);
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1e7, noNaN: true }), (f) => foldedHz(f, 1000) <= 500),
    );
  });

  it('folds a component and its aliases f + k·fs to the same place (any DSP text)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 1000, noNaN: true }),
        fc.double({ min: 1, max: 1000, noNaN: true }),
        fc.integer({ min: 1, max: 50 }),
        (f, fs, k) => Math.abs(foldedHz(f + k * fs, fs) - foldedHz(f, fs)) <= 1e-9 * (f + k * fs),
      ),
    );
  });

  it('stays within [0, fs/2] even when the signal is far above the sample rate', () => {
    fc.assert(
      fc.property(anyPositive(), anyPositive(), (f, fs) => {
        const folded = foldedHz(f, fs);
        return folded >= 0 && folded <= fs / 2;
      }),
      { numRuns: 500 },
    );
  });

  it('lands the blade pass of a fictional six-blade fan at 29.5 rev/s (177 Hz) at 23 Hz on a 200/s logger', () => {
    // Invented example: the cooling fan of a fictional test bench; 6 × 29.5 = 177, 200 − 177 = 23.
    expect(foldedHz(6 * 29.5, 200)).toBeCloseTo(23, 12);
  });

  it('rejects a negative signal frequency and a sample rate not above zero', () => {
    expectInputError(() => foldedHz(-1, 100), 'signal frequency');
    expectInputError(() => foldedHz(20, 0), 'sample rate');
    for (const v of notNumbers) {
      expectInputError(() => foldedHz(bad(v), 100), 'signal frequency');
      expectInputError(() => foldedHz(20, bad(v)), 'sample rate');
    }
  });
});

describe('lowPassGainDb', () => {
  it('is −3.01 dB at the cutoff for every order (any filter handbook)', () => {
    for (let m = 1; m <= 8; m++) expect(lowPassGainDb(100, 100, m)).toBeCloseTo(-3.0103, 4);
  });

  it('falls 20·m dB per decade far above the cutoff (any filter handbook)', () => {
    for (let m = 1; m <= 8; m++) {
      const decade = lowPassGainDb(1e4, 1, m) - lowPassGainDb(1e5, 1, m);
      expect(decade, `order ${m}`).toBeCloseTo(20 * m, 6);
    }
  });

  it('states the literal result of its doc example: order 2, one decade above, −40.0004 dB', () => {
    expect(lowPassGainDb(1000, 100, 2)).toBe(-40.00043427276863);
  });

  it('passes DC and treats a negative frequency like a positive one', () => {
    expect(lowPassGainDb(0, 100, 3)).toBe(0);
    expect(lowPassGainDb(-250, 100, 3)).toBe(lowPassGainDb(250, 100, 3));
  });

  it('never gains and never rises with frequency', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 1e6, noNaN: true }),
        fc.double({ min: 0, max: 1e6, noNaN: true }),
        fc.double({ min: 1e-3, max: 1e5, noNaN: true }),
        fc.integer({ min: 1, max: 20 }),
        (a, b, cutoff, m) => {
          const [low, high] = a <= b ? [a, b] : [b, a];
          const gLow = lowPassGainDb(low, cutoff, m);
          return gLow <= 0 && lowPassGainDb(high, cutoff, m) <= gLow + 1e-12;
        },
      ),
    );
  });

  it('rejects an order that is not a whole number from 1 to 20 and a cutoff not above zero', () => {
    for (const m of [0, 1.5, -2, 21])
      expectInputError(() => lowPassGainDb(100, 10, m), 'filter order');
    expectInputError(() => lowPassGainDb(100, 0, 2), 'cutoff frequency');
    for (const v of notNumbers) {
      expectInputError(() => lowPassGainDb(bad(v), 10, 2), 'signal frequency');
      expectInputError(() => lowPassGainDb(100, bad(v), 2), 'cutoff frequency');
      expectInputError(() => lowPassGainDb(100, 10, bad(v)), 'filter order');
    }
  });
});

describe('rcCutoffHz', () => {
  it('is 1/(2πRC): 1 kΩ with 1 µF cuts off at 159.15 Hz (doc example)', () => {
    expect(rcCutoffHz(1000, 1e-6)).toBe(159.15494309189535);
    expect(rcCutoffHz(1000, 1e-6)).toBeCloseTo(1000 / (2 * Math.PI), 9);
  });

  it('rejects resistances and capacitances not above zero', () => {
    expectInputError(() => rcCutoffHz(0, 1e-6), 'resistance');
    expectInputError(() => rcCutoffHz(1000, -1e-6), 'capacitance');
    for (const v of notNumbers) {
      expectInputError(() => rcCutoffHz(bad(v), 1e-6), 'resistance');
      expectInputError(() => rcCutoffHz(1000, bad(v)), 'capacitance');
    }
  });
});

describe('converterRangeDb', () => {
  it('gives 98.08 dB for 16 bits: 6.02·bits + 1.76 dB (Bennett 1948; Analog Devices MT-001)', () => {
    expect(converterRangeDb(16)).toBe(98.08);
    expect(converterRangeDb(12)).toBeCloseTo(74.0, 10); // same formula: 72.24 + 1.76
    expect(converterRangeDb(24)).toBeCloseTo(146.24, 10);
  });

  it('rejects bit counts that are not whole numbers from 1 to 64', () => {
    for (const bits of [0, 1.5, -16, 65])
      expectInputError(() => converterRangeDb(bits), 'converter bits');
    for (const v of notNumbers) expectInputError(() => converterRangeDb(bad(v)), 'converter bits');
  });
});

describe('orderForAttenuation', () => {
  it('needs order 2 for 40 dB one decade above the cutoff (doc example)', () => {
    expect(orderForAttenuation(1000, 100, 40)).toBe(2); // order 1 gives only 20.04 dB
  });

  it('needs order 5 to push a component one decade up below a 16-bit converter’s 98.08 dB', () => {
    // 20 dB per order per decade: order 4 gives 80 dB, order 5 gives 100 dB.
    expect(orderForAttenuation(1000, 100, converterRangeDb(16))).toBe(5);
  });

  it('finds no order when the component is not above the cutoff', () => {
    expect(orderForAttenuation(100, 100, 3)).toBeUndefined();
    expect(orderForAttenuation(50, 100, 0)).toBe(1);
  });

  it('finds no order above 20 when the attenuation asked is out of reach', () => {
    expect(orderForAttenuation(200, 100, 1000)).toBeUndefined();
  });

  it('rejects frequencies not above zero and a negative attenuation', () => {
    expectInputError(() => orderForAttenuation(0, 100, 40), 'signal frequency');
    expectInputError(() => orderForAttenuation(1000, 0, 40), 'cutoff frequency');
    expectInputError(() => orderForAttenuation(1000, 100, -1), 'attenuation needed');
    for (const v of notNumbers)
      expectInputError(() => orderForAttenuation(1000, 100, bad(v)), 'attenuation needed');
  });
});

describe('logger: never NaN or Infinity', () => {
  it('returns finite numbers (or nothing, where documented) or throws InputError for any finite input', () => {
    fc.assert(
      fc.property(anyFinite(), anyFinite(), fc.integer({ min: 1, max: 20 }), (a, b, m) => {
        return (
          finiteOrInputError(() => foldedHz(a, b)) &&
          finiteOrInputError(() => lowPassGainDb(a, b, m)) &&
          finiteOrInputError(() => rcCutoffHz(a, b)) &&
          finiteOrInputError(() => orderForAttenuation(a, b, Math.abs(a)))
        );
      }),
      { numRuns: 500 },
    );
  });

  it('keeps the gain finite however far apart signal and cutoff are', () => {
    expect(lowPassGainDb(1e300, 1e-300, 20)).toBeCloseTo(-240000, 6); // 2·20·600 decades × 10 dB
    expectInputError(() => rcCutoffHz(1e-200, 1e-200), 'resistance');
  });
});
