import { InputError, requirePositive, requireWhole, requireBetween } from '../basics/InputError';
import { MAX_IMAGES_LIMIT } from '../basics/types';

/** How an observer's eye reads a sampled part. Every field is a judgement, documented here. */
export interface LookOptions {
  /**
   * Apparent speeds below this read as "looks still" (rev/s). Default 0.25 rpm, about
   * 1.5 degrees per second: slower drift is hard to notice in the few seconds a person
   * looks (a judgement, not a published figure).
   */
  stillHz: number;
  /**
   * A step of at least this many pitches per sample (up to 0.5) is too close to half a
   * pitch for direction to be told. Default 0.45 (docs/physics.md §2).
   */
  unclearStep: number;
  /** Largest image count looked for in a lock (docs/physics.md §3). Default 8. */
  maxImages: number;
  /**
   * Under a flash, a group of q images that drifts less than this many of its own spacings
   * per second is still seen as q separate images (a judgement). Default 1.
   */
  groupSpacingsPerS: number;
  /**
   * An aliased view whose apparent speed is below this (rev/s) reads as *nearly still*
   * (docs/physics.md §4). Default 6 rpm = 0.1 rev/s: one turn in 10 s or longer. A part creeping
   * that slowly gives a person at the machine the same false sense that it has stopped as
   * one standing still (a judgement, not a published figure). A value below stillHz acts
   * as stillHz: nothing slower than still can be "nearly" still.
   */
  nearlyStillHz: number;
}

export const defaultLookOptions: Readonly<LookOptions> = Object.freeze({
  stillHz: 0.25 / 60,
  unclearStep: 0.45,
  maxImages: 8,
  groupSpacingsPerS: 1,
  nearlyStillHz: 6 / 60,
});

/**
 * Relative slack of every threshold comparison (docs/physics.md §2): a value equal to a threshold
 * up to this share of the numbers compared counts as equal, so a decimal input lands where
 * the user meant it (3000.25 rpm at 50 frames/s drifts exactly 0.25 rpm: still). 2^-42,
 * about 2.3e-13: a thousand times the rounding of one subtraction, yet below 2^-40 (1e-12).
 */
export const THRESHOLD_SLACK = 2 ** -42;

/** Fills in and validates look options. Throws InputError. */
export function checkLookOptions(opts: Partial<LookOptions> | undefined): Readonly<LookOptions> {
  if (opts !== undefined && (typeof opts !== 'object' || opts === null)) {
    throw new InputError('options', 'options must be an object.');
  }
  // Hot path (apparentMotion per pixel column, per chart point): no look option given.
  if (
    opts === undefined ||
    (opts.stillHz === undefined &&
      opts.unclearStep === undefined &&
      opts.maxImages === undefined &&
      opts.groupSpacingsPerS === undefined &&
      opts.nearlyStillHz === undefined)
  ) {
    return defaultLookOptions;
  }
  const o = { ...defaultLookOptions, ...stripUndefined(opts) };
  return {
    stillHz: requirePositive(o.stillHz, 'still threshold'),
    unclearStep: requireBetween(o.unclearStep, 'unclear step', 0, 0.5),
    maxImages: requireWhole(o.maxImages, 'largest image count', 1, MAX_IMAGES_LIMIT),
    groupSpacingsPerS: requirePositive(o.groupSpacingsPerS, 'image group spacing'),
    nearlyStillHz: requirePositive(o.nearlyStillHz, 'nearly-still threshold'),
  };
}

function stripUndefined<T extends object>(o: T): Partial<T> {
  const out: Partial<T> = {};
  for (const key of Object.keys(o) as Array<keyof T>) {
    if (o[key] !== undefined) out[key] = o[key];
  }
  return out;
}
