// fft.js 4.0.4 (registry package, MIT): chosen because it is small (one file, about 15 kB, no
// dependencies), has a radix-4 transform with a real-input path (about a quarter faster than
// the complex one, which is all a recording needs), is kept working on current engines (last
// release 2020, no open defects touching the transform), is typed, and is faster than a
// transform of our own would be: 65 536 real points in under a millisecond here.
import FFT from 'fft.js';
import { InputError, requireBetween } from '../basics/InputError';
import { hannWindow } from './window';
import { decimate } from './decimate';
import { recordingLevel, type RecordingLevel } from './level';
import { findPeaks, noiseFloor, type SpectrumPeak } from './peaks';

/** Sample rates accepted, Hz: from telephone-band recorders to studio files. */
export const MIN_SAMPLE_RATE_HZ = 4000;
export const MAX_SAMPLE_RATE_HZ = 384_000;
/** Highest rate analysed: faster recordings are decimated to at most this (no machine tone the finder reads lies above 12 kHz). */
export const ANALYSIS_RATE_LIMIT_HZ = 48_000;
/** Shortest recording that holds a usable spectrum, s. */
export const MIN_RECORDING_S = 0.5;
/** Longest recording accepted, s (10 minutes): past it the recording is refused, not read. */
export const MAX_RECORDING_S = 600;

export interface SoundSpectrumOptions {
  /** Length of one Welch segment, s, rounded up to a power of two of samples. Default 1. */
  segmentS?: number;
  /** Most seconds analysed; a longer recording is analysed over its middle. Default 10. */
  maxAnalysedS?: number;
  /** Lowest frequency read, Hz (phone microphones fall off below it). Default 20. */
  minToneHz?: number;
  /** Highest frequency read, Hz. Default 12 000, or 45 % of the analysis rate if lower. */
  maxToneHz?: number;
}

/** A Welch-averaged spectrum of a recording, with its noise floor and lines. */
export interface SoundSpectrum {
  /** Rate of the analysed samples, Hz (the recording's, or lower after decimation). */
  sampleRateHz: number;
  /** Bin spacing Δf = fs/N, Hz. */
  binHz: number;
  /** Samples per segment, N (a power of two). */
  segmentLength: number;
  /** Segments averaged (Hann window, 50 % overlap). */
  segments: number;
  /** Length of the whole recording, s. */
  durationS: number;
  /** Where the analysed stretch starts, s, and how long it is, s. */
  fromS: number;
  analysedS: number;
  /** Frequencies read, Hz. */
  minToneHz: number;
  maxToneHz: number;
  /**
   * Power per bin k (frequency k·binHz), for k = 0 … the bin just above maxToneHz. Scaled so
   * that a sine of amplitude A on a bin centre reads A² (a full-scale sine = 1 = 0 dB).
   */
  power: Float64Array;
  /** Noise floor under each bin, same scale. */
  floor: Float64Array;
  /** Lines standing clear of the floor, by frequency. */
  peaks: SpectrumPeak[];
  /** Level of the analysed stretch: silent, clipped. */
  level: RecordingLevel;
}

const transforms = new Map<number, FFT>();
function transformOf(size: number): FFT {
  let t = transforms.get(size);
  if (!t) {
    t = new FFT(size);
    transforms.set(size, t);
  }
  return t;
}

/**
 * The averaged spectrum of a recording (Welch's method: P. D. Welch, "The use of fast Fourier
 * transform for the estimation of power spectra", IEEE Trans. Audio Electroacoust. AU-15(2),
 * 1967): Hann-windowed segments of N samples, half overlapping, transformed and their powers
 * averaged. Bin spacing Δf = fs/N; each line's frequency is then interpolated between bins
 * (in peaks.ts).
 *
 * Work is bounded: at most maxAnalysedS seconds (the middle of a longer recording) at no more
 * than 48 kHz (faster recordings are decimated first).
 *
 * Throws InputError for samples that are not a list of numbers, a sample that is not a number,
 * a recording shorter than 0.5 s or longer than 10 minutes, a sample rate outside
 * 4 kHz–384 kHz, or options out of range. A silent recording gives a spectrum with no lines
 * and level.silent set.
 *
 * @example
 * // 4 s of a 175 Hz tone at 48 kHz: bins of 48000/65536 = 0.732 Hz, the line at 175.000 Hz.
 * soundSpectrum(tone, 48000).peaks[0].hz // 175.000…
 */
export function soundSpectrum(
  samples: ArrayLike<number>,
  sampleRateHz: number,
  opts: SoundSpectrumOptions = {},
): SoundSpectrum {
  if (
    samples === null ||
    typeof samples !== 'object' ||
    typeof (samples as { length?: unknown }).length !== 'number'
  ) {
    throw new InputError('recording', 'The recording must be a list of samples.');
  }
  const fs = requireBetween(sampleRateHz, 'sample rate', MIN_SAMPLE_RATE_HZ, MAX_SAMPLE_RATE_HZ);
  const segmentS = requireBetween(opts.segmentS ?? 1, 'segment length', 0.05, 10);
  const maxAnalysedS = requireBetween(opts.maxAnalysedS ?? 10, 'longest stretch analysed', 1, 60);
  const total = samples.length;
  const durationS = total / fs;
  if (durationS < MIN_RECORDING_S) {
    throw new InputError(
      'recording',
      total === 0
        ? 'The recording is empty: record again for a few seconds.'
        : `The recording is ${durationS.toFixed(2)} s long; at least ${MIN_RECORDING_S} s is needed (4 s is best).`,
    );
  }
  if (durationS > MAX_RECORDING_S) {
    throw new InputError(
      'recording',
      `The recording is ${describeDuration(durationS)} long; up to ${MAX_RECORDING_S / 60} minutes can be read. ` +
        'Trim it to a stretch where the machine runs steadily.',
    );
  }

  const factor = Math.ceil(fs / ANALYSIS_RATE_LIMIT_HZ);
  const rateHz = fs / factor;
  const minToneHz = requireBetween(opts.minToneHz ?? 20, 'lowest frequency', 1, rateHz * 0.45);
  const maxToneHz = requireBetween(
    opts.maxToneHz ?? Math.min(12_000, rateHz * 0.45),
    'highest frequency',
    minToneHz * 2,
    rateHz * 0.45,
  );

  // The analysed stretch: the whole recording, or its middle maxAnalysedS seconds.
  const keep = Math.min(total, Math.round(maxAnalysedS * fs));
  const from = Math.floor((total - keep) / 2);
  const to = from + keep;
  const level = recordingLevel(samples, from, to);
  const x: ArrayLike<number> =
    factor > 1 ? decimate(samples, from, to, factor, fs, maxToneHz) : samples;
  const start = factor > 1 ? 0 : from;
  const count = factor > 1 ? x.length : keep;

  // Segment length: a power of two of about segmentS seconds, no longer than the stretch.
  let size = 2 ** Math.ceil(Math.log2(segmentS * rateHz));
  while (size > count) size /= 2;
  // Segments half overlapping (a little more where the length is not a whole number of
  // hops), spread evenly from the first sample to the last, so every part of the recording
  // weighs the same and a drifting speed averages to its mean.
  const segments = Math.ceil((count - size) / (size / 2)) + 1;
  const starts = Array.from({ length: segments }, (_, i) =>
    segments === 1 ? 0 : Math.round((i * (count - size)) / (segments - 1)),
  );

  const binHz = rateHz / size;
  const lastBin = Math.min(size / 2, Math.ceil(maxToneHz / binHz) + 1);
  const power = new Float64Array(lastBin + 1);
  const window = hannWindow(size);
  const fft = transformOf(size);
  const frame = new Float64Array(size);
  const out = fft.createComplexArray() as number[];
  for (const s of starts) {
    for (let j = 0; j < size; j++) frame[j] = x[start + s + j] * window[j];
    fft.realTransform(out, frame);
    for (let k = 0; k <= lastBin; k++) power[k] += out[2 * k] ** 2 + out[2 * k + 1] ** 2;
  }
  // (2·|X|/Σw)² per segment: a sine of amplitude A on a bin centre reads A².
  const windowSum = size / 2;
  const scale = 4 / (windowSum * windowSum) / starts.length;
  for (let k = 0; k <= lastBin; k++) power[k] *= scale;

  const firstBin = Math.max(1, Math.floor(minToneHz / binHz));
  const floor = noiseFloor(power, firstBin, lastBin);
  const peaks = level.silent
    ? []
    : findPeaks(
        power,
        floor,
        binHz,
        firstBin,
        Math.min(lastBin - 1, Math.floor(maxToneHz / binHz)),
      );
  return {
    sampleRateHz: rateHz,
    binHz,
    segmentLength: size,
    segments: starts.length,
    durationS,
    fromS: from / fs,
    analysedS: keep / fs,
    minToneHz,
    maxToneHz,
    power,
    floor,
    peaks,
    level,
  };
}

function describeDuration(seconds: number): string {
  const minutes = Math.round(seconds / 60);
  if (minutes < 60) return `${minutes} minutes`;
  return `${Math.floor(minutes / 60)} h ${minutes % 60} min`;
}
