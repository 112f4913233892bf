// What the preview draws: a plain description, checked once per frame. No DOM, no Preact.
import { InputError, MAX_SYMMETRY } from '../core';

/**
 * 'flash': a strobe or flickering light watched live, each flash fading on the eye;
 * 'frames': camera frames, each integrating its exposure, rows read one after another;
 * 'true': the part as it really turns, as the eye sees it over a short window.
 */
export type PreviewSampler = 'flash' | 'frames' | 'true';

/** One frame of the preview, in the core's units (rev/s, Hz, seconds). */
export interface PreviewScene {
  /** Identical, equally spaced blades or spokes; a whole number ≥ 1. Blade 0 is the marked one. */
  features: number;
  /** Signed speed, rev/s. Positive turns clockwise on screen (the reference direction). */
  speedHz: number;
  sampler: PreviewSampler;
  /** Flashes or frames per second. Not used by 'true'. */
  rateHz: number;
  /**
   * 'frames': exposure of one frame; 'flash': duration of one flash;
   * 'true': the window the eye (or the screen's own refresh) integrates over. Seconds, ≥ 0.
   */
  exposureS: number;
  /** 'frames' only: rolling-shutter readout, top row to bottom row, seconds (0 = global shutter). */
  readoutS: number;
  /** The part's clock, seconds. Samples fall at whole multiples of 1/rateHz. */
  timeS: number;
  /**
   * 'flash' only: time constant of the fading image on the eye, seconds of the part's clock.
   * 0 holds each flash's image until the next one, with no trace of earlier flashes.
   */
  fadeS: number;
}

/**
 * Index of the sample (flash or frame) in force at `timeS`: floor(t·s). A time computed as
 * k/s can land a hair below k in floating point; a relative slack of 1e-9 keeps it on k.
 * @example sampleIndexAt(2 / 30, 30) // 2
 */
export function sampleIndexAt(timeS: number, rateHz: number): number {
  const x = timeS * rateHz;
  return Math.floor(x + 1e-9 * Math.max(1, Math.abs(x)));
}

/** Start time of sample `index` at `rateHz`, seconds. @example sampleTimeS(3, 30) // 0.1 */
export function sampleTimeS(index: number, rateHz: number): number {
  return index / rateHz;
}

/** Throws InputError naming the field when the scene cannot be drawn. */
export function checkScene(scene: PreviewScene): void {
  const { features, speedHz, sampler, rateHz, exposureS, readoutS, timeS, fadeS } = scene;
  if (!Number.isInteger(features) || features < 1 || features > MAX_SYMMETRY) {
    throw new InputError(
      'features',
      `features (blades, spokes) must be a whole number from 1 to ${MAX_SYMMETRY}.`,
    );
  }
  if (!Number.isFinite(speedHz)) throw new InputError('speed', 'speed must be a number.');
  if (sampler !== 'flash' && sampler !== 'frames' && sampler !== 'true') {
    throw new InputError('sampler', "sampler must be 'flash', 'frames' or 'true'.");
  }
  if (sampler !== 'true' && !(Number.isFinite(rateHz) && rateHz > 0)) {
    throw new InputError('rate', 'rate must be a number greater than zero.');
  }
  if (!(Number.isFinite(exposureS) && exposureS >= 0))
    throw new InputError('exposure', 'exposure must be zero or more seconds.');
  if (!(Number.isFinite(readoutS) && readoutS >= 0))
    throw new InputError('readout time', 'readout time must be zero or more seconds.');
  if (!Number.isFinite(timeS)) throw new InputError('time', 'time must be a number of seconds.');
  if (!(Number.isFinite(fadeS) && fadeS >= 0))
    throw new InputError('fade', 'fade time must be zero or more seconds.');
}
