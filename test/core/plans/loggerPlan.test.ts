import { describe, expect, it } from 'vitest';
import FFT from 'fft.js';
import fc from 'fast-check';
import { loggerPlan } from '../../../src/core/plans/loggerPlan';
import { niceSampleRateHz } from '../../../src/core/formulas/logger';
import { lowPassGainDb } from '../../../src/core/formulas/logger';
import { anyFinite, bad, expectInputError, finiteOrInputError } from '../expectInputError';

const SEED = 1949;
const none = { kind: 'none' as const };
/** Half power, the Butterworth response at its cutoff: 10·log10(2) = 3.0103 dB. */
const HALF_POWER_DB = 10 * Math.log10(2);

describe('loggerPlan: where each component lands', () => {
  it('folds a 20 Hz shaft sampled 18 times a second to 2 Hz', () => {
    // Common practice (docs/physics.md §13): 20 Hz sampled at 18 or 22 samples/s looks like 2 Hz.
    const plan = loggerPlan({ tones: { shaftHz: 20 }, sampleHz: 18, filter: none, bits: 12 });
    expect(plan.components[0]).toMatchObject({
      source: 'shaft',
      count: 1,
      hz: 20,
      aliases: true,
      pass: false,
    });
    expect(plan.components[0].foldedHz).toBeCloseTo(2, 12);
    expect(
      loggerPlan({ tones: { shaftHz: 20 }, sampleHz: 22, filter: none, bits: 12 }).components[0]
        .foldedHz,
    ).toBeCloseTo(2, 12);
  });

  it('shows nothing above 500 Hz at 1000 samples a second: a 750 Hz tone lands at 250 Hz', () => {
    // Common practice (docs/physics.md §13): 1000 samples/s show nothing above 500 Hz.
    const plan = loggerPlan({
      tones: { shaftHz: 25, extraTones: [{ label: 'bearing tone', hz: 750 }] },
      sampleHz: 1000,
      filter: none,
      bits: 16,
    });
    expect(plan.nyquistHz).toBe(500);
    const tone = plan.components.find((c) => c.label === 'bearing tone');
    expect(tone).toMatchObject({ source: 'tone', count: 1 });
    expect(tone).toMatchObject({
      hz: 750,
      foldedHz: 250,
      aliases: true,
      neededDb: 98.08,
      pass: false,
    });
  });

  it('lists blade pass and gear mesh at n·f and z·f', () => {
    const plan = loggerPlan({
      tones: { shaftHz: 25, harmonics: 2, blades: [7], gearTeeth: [23] },
      sampleHz: 5000,
      filter: none,
      bits: 12,
    });
    expect(plan.components.map((c) => [c.source, c.count, c.hz])).toEqual([
      ['shaft', 1, 25],
      ['shaft', 2, 50],
      ['blades', 7, 175],
      ['teeth', 23, 575],
    ]);
  });

  it('puts the folded gear mesh where an FFT of the sampled signal finds it', () => {
    // Independent check (docs/physics.md §13): sample cos(2π·575·t) at 512/s for 1 s, take a 512-point FFT
    // (fft.js, a general-purpose FFT from the registry); the peak bin is the folded frequency.
    const fs = 512;
    const plan = loggerPlan({
      tones: { shaftHz: 25, gearTeeth: [23] },
      sampleHz: fs,
      filter: none,
      bits: 12,
    });
    const mesh = plan.components[1];
    expect(mesh.foldedHz).toBeCloseTo(63, 9);
    const fft = new FFT(fs);
    const input = Array.from({ length: fs }, (_, k) => Math.cos((2 * Math.PI * 575 * k) / fs));
    const out = fft.createComplexArray() as number[];
    fft.realTransform(out, input);
    let peak = 0;
    let best = -1;
    for (let bin = 0; bin <= fs / 2; bin++) {
      const power = out[2 * bin] ** 2 + out[2 * bin + 1] ** 2;
      if (power > best) {
        best = power;
        peak = bin;
      }
    }
    expect(peak).toBe(Math.round(mesh.foldedHz)); // bins are 1 Hz wide
  });

  it('needs 6.02·bits + 1.76 dB against an alias and gives an RC filter −3.01 dB at its cutoff', () => {
    // Analog Devices MT-001: 16 bits = 98.08 dB. Butterworth / RC: −10·log10(2) dB at fc = 1/(2πRC).
    const fcHz = 1 / (2 * Math.PI * 1000 * 1e-6); // 1 kΩ, 1 µF: 159.15 Hz
    const plan = loggerPlan({
      tones: { shaftHz: fcHz },
      sampleHz: 1000,
      filter: { kind: 'rc', resistanceOhm: 1000, capacitanceF: 1e-6 },
      bits: 16,
    });
    expect(plan.rangeDb).toBeCloseTo(98.08, 12);
    expect(plan.cutoffHz).toBeCloseTo(159.15494309189535, 9);
    expect(plan.order).toBe(1);
    expect(plan.components[0].gainDb).toBeCloseTo(-HALF_POWER_DB, 9);
    expect(plan.components[0].pass).toBe(true);
  });

  it('passes a component at a Butterworth cutoff and fails one just beyond it', () => {
    // Order 4, fc 100 Hz: −3.01 dB at 100 Hz; at 101 Hz −10·log10(1 + 1.01^8) = −3.187 dB.
    const filter = { kind: 'butterworth' as const, order: 4, cutoffHz: 100 };
    expect(
      loggerPlan({ tones: { shaftHz: 100 }, sampleHz: 1000, filter: filter, bits: 12 })
        .components[0].pass,
    ).toBe(true);
    const beyond = loggerPlan({ tones: { shaftHz: 101 }, sampleHz: 1000, filter: filter, bits: 12 })
      .components[0];
    expect(beyond.gainDb).toBeCloseTo(-10 * Math.log10(1 + Math.pow(1.01, 8)), 12);
    expect(beyond.pass).toBe(false);
  });

  it('says plainly that filtering after the converter cannot remove an alias, and flags a missing filter', () => {
    const plan = loggerPlan({
      tones: { shaftHz: 25, harmonics: 10 },
      sampleHz: 1000,
      filter: none,
      bits: 16,
    });
    expect(plan.notes).toEqual(['no-filter', 'guard-short', 'alias-after-converter']);
    // Nothing listed aliases, but content from fs − fmax = 750 Hz up folds onto 0–250 Hz unfiltered.
    expect(plan.components.every((c) => !c.aliases && c.pass)).toBe(true);
    expect(plan.guard).toEqual({ hz: 750, attenuationDb: 0, enough: false });
    expect(plan.allPass).toBe(false);
  });
});

describe('loggerPlan: the proposal', () => {
  it('proposes 1600 samples/s and an order-8 Butterworth for harmonics to 250 Hz at 16 bits (doc example)', () => {
    const { proposal } = loggerPlan({
      tones: { shaftHz: 25, harmonics: 10 },
      sampleHz: 1000,
      filter: none,
      bits: 16,
    });
    expect(proposal).toMatchObject({ sampleHz: 1600, order: 8 });
    expect(proposal?.cutoffHz).toBeCloseTo(299.2, 1);
    expect(proposal?.droopDb).toBeCloseTo(0.238, 3);
    expect(proposal?.aliasRejectionDb).toBeCloseTo(104.7, 1);
    expect(proposal?.highestHz).toBe(250);
  });

  it('passes every check when its own proposal is used', () => {
    const tones = { shaftHz: 25, harmonics: 4, blades: [7], gearTeeth: [23] };
    const { proposal } = loggerPlan({ tones: tones, sampleHz: 500, filter: none, bits: 12 });
    if (!proposal) throw new Error('expected a proposal');
    const again = loggerPlan({
      tones: tones,
      sampleHz: proposal.sampleHz,
      filter: { kind: 'butterworth', order: proposal.order, cutoffHz: proposal.cutoffHz },
      bits: 12,
    });
    expect(again.allPass).toBe(true);
    expect(again.guard.enough).toBe(true);
  });

  it('meets the droop and the converter range, at the smallest nice rate and the lowest order that can', () => {
    // Checked against lowPassGainDb alone: for each order the best cutoff is the lowest that keeps
    // the droop (found by bisection), and a rate works when that cutoff buries fs − fmax.
    const NICE = [
      100, 120, 125, 128, 160, 200, 240, 250, 256, 320, 400, 480, 500, 512, 640, 800, 960,
    ];
    const niceBelow = (hz: number) => {
      let best = 0;
      for (let e = -3; e <= 7; e++)
        for (const m of NICE) {
          const r = e >= 0 ? m * 10 ** e : m / 10 ** -e;
          if (r < hz * (1 - 1e-12) && r > best) best = r;
        }
      return best;
    };
    const bestCutoff = (fmax: number, order: number, droopDb: number) => {
      let lo = fmax / 1e3;
      let hi = fmax * 1e3;
      for (let i = 0; i < 200; i++) {
        const mid = Math.sqrt(lo * hi);
        if (-lowPassGainDb(fmax, mid, order) > droopDb) lo = mid;
        else hi = mid;
      }
      return hi;
    };
    const works = (fs: number, fmax: number, order: number, droopDb: number, rangeDb: number) =>
      -lowPassGainDb(fs - fmax, bestCutoff(fmax, order, droopDb), order) >= rangeDb * (1 - 1e-9);
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 500, noNaN: true }),
        fc.integer({ min: 1, max: 20 }),
        fc.integer({ min: 8, max: 24 }),
        fc.double({ min: 0.1, max: 3, noNaN: true }),
        (shaftHz, harmonics, bits, droop) => {
          const plan = loggerPlan(
            { tones: { shaftHz, harmonics }, sampleHz: 100, filter: none, bits: bits },
            {
              passbandDroopDb: droop,
            },
          );
          const p = plan.proposal;
          if (!p) throw new Error('expected a proposal');
          const fmax = shaftHz * harmonics;
          expect(niceSampleRateHz(p.sampleHz)).toBe(p.sampleHz);
          expect(-lowPassGainDb(fmax, p.cutoffHz, p.order)).toBeLessThanOrEqual(droop * (1 + 1e-9));
          expect(-lowPassGainDb(p.sampleHz - fmax, p.cutoffHz, p.order)).toBeGreaterThanOrEqual(
            plan.rangeDb * (1 - 1e-9),
          );
          const below = niceBelow(p.sampleHz);
          for (let m = 1; m <= 8; m++)
            expect(works(below, fmax, m, droop, plan.rangeDb), `order ${m} at ${below} Hz`).toBe(
              false,
            );
          if (p.order > 1)
            expect(works(p.sampleHz, fmax, p.order - 1, droop, plan.rangeDb)).toBe(false);
          return true;
        },
      ),
      { seed: SEED, numRuns: 200 },
    );
  });

  it('proposes nothing, and says why, when the fastest rate allowed is too slow', () => {
    const plan = loggerPlan(
      { tones: { shaftHz: 25, harmonics: 10 }, sampleHz: 1000, filter: none, bits: 16 },
      { maxSampleHz: 1000 },
    );
    expect(plan.proposal).toBeUndefined();
    expect(plan.notes).toContain('no-proposal');
    expect(plan.maxOrder).toBe(8);
  });
});

describe('niceSampleRateHz', () => {
  it('rounds up to the rates loggers commonly offer', () => {
    expect(niceSampleRateHz(1000)).toBe(1000);
    expect(niceSampleRateHz(1297)).toBe(1600);
    expect(niceSampleRateHz(2500)).toBe(2500);
    expect(niceSampleRateHz(2501)).toBe(2560); // 2.56 × 1 kHz bandwidth, the vibration-analyser family
    expect(niceSampleRateHz(44100)).toBe(48000);
    expect(niceSampleRateHz(9.7)).toBe(10);
    expect(niceSampleRateHz(0.05)).toBe(0.05);
  });

  it('rejects a rate at or below zero', () => {
    expectInputError(() => niceSampleRateHz(0), 'sample rate');
  });
});

describe('loggerPlan: bad input', () => {
  const tones = { shaftHz: 25 };

  it('rejects a missing machine, a shaft speed at or below zero, and counts that are not whole', () => {
    expectInputError(
      () => loggerPlan({ tones: bad(null), sampleHz: 1000, filter: none, bits: 16 }),
      'machine',
      'shaft speed',
    );
    expectInputError(
      () => loggerPlan({ tones: { shaftHz: 0 }, sampleHz: 1000, filter: none, bits: 16 }),
      'shaft speed',
    );
    expectInputError(
      () =>
        loggerPlan({ tones: { ...tones, harmonics: 0 }, sampleHz: 1000, filter: none, bits: 16 }),
      'harmonics',
    );
    expectInputError(
      () =>
        loggerPlan({ tones: { ...tones, blades: [6.5] }, sampleHz: 1000, filter: none, bits: 16 }),
      'blade count 1',
    );
    expectInputError(
      () =>
        loggerPlan({
          tones: { ...tones, gearTeeth: bad(23) },
          sampleHz: 1000,
          filter: none,
          bits: 16,
        }),
      'tooth counts',
      'list',
    );
    expectInputError(
      () =>
        loggerPlan({
          tones: { ...tones, extraTones: [{ label: 'x', hz: -5 }] },
          sampleHz: 1000,
          filter: none,
          bits: 16,
        }),
      'added tone 1',
    );
  });

  it('rejects a sample rate at or below zero and bits outside 1 to 64', () => {
    expectInputError(
      () => loggerPlan({ tones: tones, sampleHz: 0, filter: none, bits: 16 }),
      'sample rate',
    );
    expectInputError(
      () => loggerPlan({ tones: tones, sampleHz: 1000, filter: none, bits: 0 }),
      'converter bits',
    );
    expectInputError(
      () => loggerPlan({ tones: tones, sampleHz: 1000, filter: none, bits: 12.5 }),
      'converter bits',
    );
  });

  it('rejects an unknown filter, a cutoff at or below zero, an order outside 1 to 20 and a bad RC', () => {
    expectInputError(
      () => loggerPlan({ tones: tones, sampleHz: 1000, filter: bad({ kind: 'bessel' }), bits: 16 }),
      'filter',
    );
    expectInputError(
      () =>
        loggerPlan({
          tones: tones,
          sampleHz: 1000,
          filter: { kind: 'butterworth', order: 4, cutoffHz: 0 },
          bits: 16,
        }),
      'cutoff frequency',
    );
    expectInputError(
      () =>
        loggerPlan({
          tones: tones,
          sampleHz: 1000,
          filter: { kind: 'butterworth', order: 30, cutoffHz: 100 },
          bits: 16,
        }),
      'filter order',
    );
    expectInputError(
      () =>
        loggerPlan({
          tones: tones,
          sampleHz: 1000,
          filter: { kind: 'rc', resistanceOhm: 1000 },
          bits: 16,
        }),
      'capacitance',
    );
  });

  it('rejects bad options', () => {
    expectInputError(
      () =>
        loggerPlan(
          { tones: tones, sampleHz: 1000, filter: none, bits: 16 },
          { passbandDroopDb: 6 },
        ),
      'passband loss allowed (dB)',
    );
    expectInputError(
      () => loggerPlan({ tones: tones, sampleHz: 1000, filter: none, bits: 16 }, { maxOrder: 0 }),
      'highest filter order',
    );
    expectInputError(
      () =>
        loggerPlan({ tones: tones, sampleHz: 1000, filter: none, bits: 16 }, { maxSampleHz: -1 }),
      'fastest sample rate',
    );
  });
});

describe('loggerPlan: never NaN or Infinity', () => {
  it('returns finite numbers or throws InputError for any tones, rate, filter and bits', () => {
    fc.assert(
      fc.property(
        anyFinite(),
        fc.integer({ min: 1, max: 200 }),
        fc.array(fc.integer({ min: 1, max: 1000 }), { maxLength: 2 }),
        anyFinite(),
        fc.oneof(
          fc.constant({ kind: 'none' as const }),
          anyFinite().map((cutoffHz) => ({ kind: 'rc' as const, cutoffHz })),
          fc.record({
            kind: fc.constant('butterworth' as const),
            order: fc.integer({ min: 1, max: 20 }),
            cutoffHz: anyFinite(),
          }),
        ),
        fc.integer({ min: 1, max: 64 }),
        (shaftHz, harmonics, blades, sampleHz, filter, bits) =>
          finiteOrInputError(() =>
            loggerPlan({
              tones: { shaftHz, harmonics, blades },
              sampleHz: sampleHz,
              filter: filter,
              bits: bits,
            }),
          ),
      ),
      { seed: SEED, numRuns: 500 },
    );
  });
});
