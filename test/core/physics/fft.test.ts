/**
 * The alias frequency checked by spectrum analysis, independently of any closed form:
 * sample the pattern's signal at the sampler's rate, take its discrete Fourier transform
 * (fft.js, a general-purpose radix-4 FFT from the registry; the DFT as computed by the
 * Cooley–Tukey method, Math. Comp. 19, 1965) and find the strongest bin.
 *
 * By the sampling theorem (Shannon, "Communication in the presence of noise", Proc. IRE 37,
 * 1949) a sampled signal only holds frequencies up to half the sampling rate; a pattern
 * frequency n·f above it shows up folded into [0, s/2]. That folded peak must sit where
 * foldedHz and apparentMotion put it, within one bin width (s/N); within two next to 0 and
 * s/2, where a real line and its mirror image share the window's main lobe.
 */
import FFT from 'fft.js';
import fc from 'fast-check';
import { describe, expect, it, vi } from 'vitest';
import { apparentMotion, foldedHz } from '../../../src/core';

const SEED = 1949; // fixed so that any failure reproduces
const RUNS = 1000;
// A thousand cases per property on a shared 2-core machine can pass Vitest's default 5 s per
// test when the machine is busy; this only stops a hung run, it measures nothing.
vi.setConfig({ testTimeout: 60_000 });
const N = 4096;
const fft = new FFT(N);
/** One bin width, with room for rounding when a line sits exactly a bin from the peak. */
const binHz = (rateHz: number) => (rateHz / N) * (1 + 1e-9);
/**
 * How far the peak of a real signal may sit from a line at `lineHz`: one bin, but two within
 * two bins of 0 or s/2, where the line and its mirror image (−lineHz, or s − lineHz) fall in
 * the same Hann main lobe (±2 bins) and merge into one peak between them.
 */
function allowedHz(lineHz: number, rateHz: number): number {
  const bin = binHz(rateHz);
  return Math.min(lineHz, rateHz / 2 - lineHz) < 2 * bin ? 2 * bin : bin;
}
const spectrum = fft.createComplexArray() as number[];

/**
 * Hann window: keeps the leakage of one line away from the others; main lobe ±2 bins
 * (F. J. Harris, "On the use of windows for harmonic analysis with the discrete Fourier
 * transform", Proc. IEEE 66, 1978).
 */
const hann = Float64Array.from(
  { length: N },
  (_, j) => 0.5 - 0.5 * Math.cos((2 * Math.PI * j) / N),
);

/** Strongest bin of a real signal's one-sided spectrum, in Hz. */
function peakOfReal(signal: number[], rateHz: number): number {
  fft.realTransform(spectrum, signal);
  let best = 0;
  let bestPower = -1;
  for (let k = 0; k <= N / 2; k++) {
    const power = spectrum[2 * k] ** 2 + spectrum[2 * k + 1] ** 2;
    if (power > bestPower) [best, bestPower] = [k, power];
  }
  return (best * rateHz) / N;
}

/** Strongest bin of a complex signal's two-sided spectrum, in Hz, signed (bins above N/2 are negative). */
function peakOfComplex(signal: number[], rateHz: number): number {
  fft.transform(spectrum, signal);
  let best = 0;
  let bestPower = -1;
  for (let k = 0; k < N; k++) {
    const power = spectrum[2 * k] ** 2 + spectrum[2 * k + 1] ** 2;
    if (power > bestPower) [best, bestPower] = [k, power];
  }
  return ((best < N / 2 ? best : best - N) * rateHz) / N;
}

/** Pattern phase (in pitches) at t_j = j/s: the pattern repeats n times per revolution. */
const patternPitches = (speedHz: number, symmetry: number, rateHz: number, j: number) =>
  symmetry * speedHz * (j / rateHz);

/** A pure tone at the pattern frequency, cos(2π·n·f·t), sampled at s and windowed. */
function sampledTone(speedHz: number, symmetry: number, rateHz: number): number[] {
  return Array.from(
    { length: N },
    (_, j) => hann[j] * Math.cos(2 * Math.PI * patternPitches(speedHz, symmetry, rateHz, j)),
  );
}

/**
 * A sharper blade signal: each blade passing gives a pulse exp(κ(cos 2πφ − 1)) (a smooth
 * narrow bump per pitch) with its mean removed. Its harmonics m·n·f decrease with m, as
 * I_m(κ) (the generating function e^(κ·cos θ) = I_0(κ) + 2·Σ I_m(κ)·cos mθ of the modified
 * Bessel functions, Abramowitz & Stegun 9.6.34, cited from memory), so the fundamental stays
 * the strongest line even where harmonics fold on top of it.
 */
const KAPPA = 1.5;
const bladePulse = (pitches: number) => Math.exp(KAPPA * (Math.cos(2 * Math.PI * pitches) - 1));
/** Mean of the pulse over one pitch: equally spaced points are exact to rounding for a smooth periodic function. */
const PULSE_MEAN =
  Array.from({ length: 64 }, (_, m) => bladePulse(m / 64)).reduce((a, b) => a + b) / 64;
function sampledBlades(speedHz: number, symmetry: number, rateHz: number): number[] {
  return Array.from(
    { length: N },
    (_, j) => hann[j] * (bladePulse(patternPitches(speedHz, symmetry, rateHz, j)) - PULSE_MEAN),
  );
}

/** The pattern as a turning pointer, e^(2πi·n·f·t): its spectrum keeps the direction (sign). */
function sampledPointer(speedHz: number, symmetry: number, rateHz: number): number[] {
  const out = new Array<number>(2 * N);
  for (let j = 0; j < N; j++) {
    const angle = 2 * Math.PI * patternPitches(speedHz, symmetry, rateHz, j);
    out[2 * j] = Math.cos(angle);
    out[2 * j + 1] = Math.sin(angle);
  }
  return out;
}

const logUniform = (lo: number, hi: number) =>
  fc.double({ min: Math.log10(lo), max: Math.log10(hi), noNaN: true }).map((e) => 10 ** e);
const caseArb = fc.record({
  speedHz: fc.tuple(fc.boolean(), logUniform(0.01, 2000)).map(([neg, v]) => (neg ? -v : v)),
  symmetry: fc.oneof(fc.constantFrom(1, 2, 3, 5, 12, 60), fc.integer({ min: 1, max: 60 })),
  rateHz: fc.oneof(
    logUniform(1, 1e5),
    fc.constantFrom(24000 / 1001, 30000 / 1001, 60000 / 1001, 100, 120),
  ),
});

describe('the FFT of a sampled pattern', () => {
  it('finds the folded frequencies of the worked examples', () => {
    // Common practice: a 20 Hz signal sampled at 18 or 22 samples/s looks like 2 Hz.
    expect(Math.abs(peakOfReal(sampledTone(20, 1, 18), 18) - 2)).toBeLessThanOrEqual(18 / N);
    expect(Math.abs(peakOfReal(sampledTone(20, 1, 22), 22) - 2)).toBeLessThanOrEqual(22 / N);
    // Common practice: 1000 samples/s show nothing above 500 Hz; 700 Hz folds to 300 Hz.
    expect(Math.abs(peakOfReal(sampledTone(700, 1, 1000), 1000) - 300)).toBeLessThanOrEqual(
      1000 / N,
    );
    // Wikipedia, "Stroboscopic effect": a disc at 60 rev/s under 61 flashes/s turns back at 1 rev/s.
    expect(Math.abs(peakOfComplex(sampledPointer(60, 1, 61), 61) - -1)).toBeLessThanOrEqual(
      61 / N / 2,
    );
  });

  it('peaks where foldedHz and apparentMotion put the alias of a pure tone, within a bin (two beside 0 and s/2)', () => {
    fc.assert(
      fc.property(caseArb, ({ speedHz, symmetry, rateHz }) => {
        const peak = peakOfReal(sampledTone(speedHz, symmetry, rateHz), rateHz);
        const folded = foldedHz(symmetry * Math.abs(speedHz), rateHz);
        expect(Math.abs(peak - folded)).toBeLessThanOrEqual(allowedHz(folded, rateHz));
        const seen = Math.abs(apparentMotion({ speedHz, symmetry }, rateHz).apparentHz) * symmetry;
        expect(Math.abs(peak - seen)).toBeLessThanOrEqual(allowedHz(seen, rateHz));
      }),
      { numRuns: RUNS, seed: SEED },
    );
  });

  it('peaks at the folded fundamental of a blade signal with harmonics, within a bin (two beside 0 and s/2)', () => {
    fc.assert(
      fc.property(caseArb, ({ speedHz, symmetry, rateHz }) => {
        const peak = peakOfReal(sampledBlades(speedHz, symmetry, rateHz), rateHz);
        const folded = foldedHz(symmetry * Math.abs(speedHz), rateHz);
        expect(Math.abs(peak - folded)).toBeLessThanOrEqual(allowedHz(folded, rateHz));
      }),
      { numRuns: RUNS, seed: SEED },
    );
  });

  it('peaks at the signed apparent pattern frequency n·a of a turning pointer, within half a bin', () => {
    // A single complex line with no window: the strongest bin is the nearest one.
    fc.assert(
      fc.property(caseArb, ({ speedHz, symmetry, rateHz }) => {
        const bin = binHz(rateHz);
        const peak = peakOfComplex(sampledPointer(speedHz, symmetry, rateHz), rateHz);
        const seen = apparentMotion({ speedHz, symmetry }, rateHz).apparentHz * symmetry;
        // ±s/2 are the same bin: half a pitch per sample has no direction.
        const wrapped =
          Math.abs(peak - seen) > rateHz / 2
            ? Math.abs(Math.abs(peak - seen) - rateHz)
            : Math.abs(peak - seen);
        expect(wrapped).toBeLessThanOrEqual(bin / 2);
      }),
      { numRuns: RUNS, seed: SEED },
    );
  });
});
