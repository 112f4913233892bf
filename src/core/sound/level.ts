import { InputError, requireWhole } from '../basics/InputError';

/** Loudness and health of a recording, from its samples (full scale = ±1). */
export interface RecordingLevel {
  /** Largest |sample|. */
  peak: number;
  /** Root-mean-square level, dB relative to full scale (a full-scale sine reads −3.01 dB; silence −400, never −Infinity). */
  rmsDbfs: number;
  /** Share of samples at or within 0.1 % of full scale. */
  fullScaleFraction: number;
  /** Nothing heard: the RMS level is below one step of a 16-bit converter (−90.3 dBFS). */
  silent: boolean;
  /** At least 0.1 % of the samples sit at full scale: the converter was overdriven. */
  clipped: boolean;
}

/** One step of a 16-bit converter relative to full scale: 20·log10(1/32768) = −90.3 dB. */
export const SILENCE_DBFS = 20 * Math.log10(1 / 32768);
/** Share of full-scale samples from which a recording counts as clipped (a judgement). */
export const CLIPPED_FRACTION = 0.001;
/** Largest |sample| accepted: audio is scaled to ±1, and a little over it after processing; a thousand times over is not audio. */
const MAX_SAMPLE = 1000;
/** |x| from which a sample counts as full scale. */
const FULL_SCALE = 0.999;

/**
 * The level of samples[from…to) (a recording scaled to ±1, as the Web Audio API delivers it),
 * and whether it is silent or clipped. Throws InputError naming the first sample that is not a
 * number or lies beyond ±1000, so that no NaN or overflow reaches the spectrum.
 * @example recordingLevel(new Float32Array([0.5, -0.5])).rmsDbfs // -6.02…
 */
export function recordingLevel(samples: ArrayLike<number>, from = 0, to?: number): RecordingLevel {
  if (typeof samples !== 'object' || samples === null || !Number.isSafeInteger(samples.length)) {
    throw new InputError(
      'recording',
      'The recording holds no samples: record again or pick a file.',
    );
  }
  requireWhole(from, 'first sample', 0, samples.length);
  const end = requireWhole(to ?? samples.length, 'last sample', from, samples.length);
  let peak = 0;
  let sumSquares = 0;
  let fullScale = 0;
  for (let i = from; i < end; i++) {
    const x = samples[i];
    if (typeof x !== 'number' || !(Math.abs(x) <= MAX_SAMPLE)) {
      throw new InputError(
        'recording',
        `The recording is damaged: sample ${i + 1} is ${typeof x === 'number' && Number.isFinite(x) ? 'far beyond full scale' : 'not a number'}. Record again or pick another file.`,
      );
    }
    const a = Math.abs(x);
    if (a > peak) peak = a;
    if (a >= FULL_SCALE) fullScale++;
    sumSquares += x * x;
  }
  const count = Math.max(1, end - from);
  const rms = Math.sqrt(sumSquares / count);
  const rmsDbfs = rms > 0 ? Math.max(-400, 20 * Math.log10(rms)) : -400;
  const fullScaleFraction = fullScale / count;
  return {
    peak,
    rmsDbfs,
    fullScaleFraction,
    silent: rmsDbfs < SILENCE_DBFS,
    clipped: fullScaleFraction >= CLIPPED_FRACTION,
  };
}
