import {
  InputError,
  requireFinite,
  requireFiniteResult,
  requireNonNegative,
  requirePositive,
  requireWhole,
} from '../basics/InputError';

/**
 * Where a component lands after sampling (docs/physics.md §9): |f − fs·round(f/fs)|, in [0, fs/2].
 * Source: the alias relation of any DSP text (Shannon 1949 for the Nyquist limit).
 * Throws InputError for a negative or non-finite signal frequency, or a sample rate ≤ 0.
 * @example foldedHz(20, 18) // 2 (common practice: 20 Hz sampled at 18/s looks like 2 Hz)
 */
export function foldedHz(signalHz: number, sampleHz: number): number {
  const f = requireNonNegative(signalHz, 'signal frequency');
  const fs = requirePositive(sampleHz, 'sample rate');
  // f mod fs is exact in floating point, so the fold stays in [0, fs/2] even when f/fs is huge.
  const r = f % fs;
  return Math.min(r, fs - r);
}

/**
 * Gain of an order-m Butterworth low-pass (m = 1: an RC stage) in dB, ≤ 0
 * (docs/physics.md §9): 20·log10(1/sqrt(1 + (f/fc)^(2m))).
 * Source: Butterworth 1930; any filter handbook (−3.01 dB at fc, −20·m dB/decade beyond).
 * @example lowPassGainDb(1000, 100, 2) // -40.00043427276863
 */
export function lowPassGainDb(signalHz: number, cutoffHz: number, order: number): number {
  const f = Math.abs(requireFinite(signalHz, 'signal frequency'));
  const fc = requirePositive(cutoffHz, 'cutoff frequency');
  const m = requireWhole(order, 'filter order', 1, 20);
  if (f === 0) return 0;
  // Far above the cutoff (f/fc)^(2m) can overflow; there 1 + x^(2m) ≈ x^(2m) to 1e-30.
  const decades = 2 * m * (Math.log10(f) - Math.log10(fc));
  return decades > 30 ? -10 * decades : -10 * Math.log10(1 + Math.pow(f / fc, 2 * m));
}

/**
 * Cutoff of a first-order RC low-pass: fc = 1/(2πRC).
 * @example rcCutoffHz(1000, 1e-6) // 159.15494309189535
 */
export function rcCutoffHz(resistanceOhm: number, capacitanceF: number): number {
  const R = requirePositive(resistanceOhm, 'resistance');
  const C = requirePositive(capacitanceF, 'capacitance');
  return requireFiniteResult(1 / (2 * Math.PI * R * C), 'resistance');
}

/**
 * Ideal converter dynamic range (SNR of a full-scale sine with quantisation noise):
 * 6.02·bits + 1.76 dB (Bennett 1948; e.g. Analog Devices tutorial MT-001).
 * @example converterRangeDb(16) // 98.08
 */
export function converterRangeDb(bits: number): number {
  const b = requireWhole(bits, 'converter bits', 1, 64);
  return 6.02 * b + 1.76;
}

/**
 * Lowest order of Butterworth filter with cutoff fc that attenuates f by at least `needDb`.
 * Returns undefined when f is not above fc (no order can do it).
 * @example orderForAttenuation(1000, 100, 40) // 2 (order 2 gives 40.0004 dB)
 */
export function orderForAttenuation(
  signalHz: number,
  cutoffHz: number,
  needDb: number,
): number | undefined {
  const f = requirePositive(signalHz, 'signal frequency');
  const fc = requirePositive(cutoffHz, 'cutoff frequency');
  const need = requireNonNegative(needDb, 'attenuation needed');
  if (f <= fc) return need === 0 ? 1 : undefined;
  for (let m = 1; m <= 20; m++) if (-lowPassGainDb(f, fc, m) >= need) return m;
  return undefined;
}

/**
 * Sample rates loggers and converters commonly offer, per decade (common practice): the 1-2-5
 * series, the 2.56·bandwidth family of vibration analysers (1.28, 2.56, 5.12, 6.4) and the
 * 48 kHz audio family (1.2, 2.4, 4.8, 9.6), with 1.6, 3.2 and 8 for the binary steps.
 */
const NICE_MANTISSAS = [
  100, 120, 125, 128, 160, 200, 240, 250, 256, 320, 400, 480, 500, 512, 640, 800, 960,
];

/**
 * The smallest nice sample rate at or above hz (see NICE_MANTISSAS; exact decimal values).
 * Units: Hz. Throws InputError for a rate ≤ 0 or not a number.
 * @example niceSampleRateHz(1297) // 1600
 * Source: common practice (the rates loggers, vibration analysers and audio converters offer).
 */
export function niceSampleRateHz(hz: number): number {
  const f = requirePositive(hz, 'sample rate');
  let exponent = Math.floor(Math.log10(f)) - 2;
  for (;;) {
    for (const m of NICE_MANTISSAS) {
      const candidate = exponent >= 0 ? m * 10 ** exponent : m / 10 ** -exponent;
      if (!Number.isFinite(candidate)) {
        throw new InputError('sample rate', `${f} Hz is too large a sample rate.`);
      }
      if (candidate >= f * (1 - 1e-12)) return candidate;
    }
    exponent++;
  }
}
