// The check screen's results in words: the verdict's headline, notes about the entries, why a
// suggestion is missing, and what the camera's blur and bend look like. Built from the codes and
// numbers of src/state/check.
import type { Sampler } from '../core';
import type { CameraResult, CheckNote, CreepMissing, CreepRate, Verdict } from '../state/check';
import { formatNumber } from './format';
import { lookPhrase } from './look';
import { settingStepWords } from './rates';

/**
 * The verdict in big words: what the viewer will see.
 * @example verdictHeadline({ kind: 'images', look: 'still', images: 2, … }) // "2 images, standing still"
 */
export function verdictHeadline(v: Verdict): string {
  switch (v.kind) {
    case 'steady':
      return 'Steady light: true motion';
    case 'true':
      return 'True motion';
    case 'still':
      return 'Looks still';
    case 'unclear':
      return 'Direction unclear';
    case 'backward':
      return 'Turning backward';
    case 'creeping':
      return 'Creeping forward';
    case 'forward':
      return 'Forward, slower than real';
    case 'images': {
      if (v.look === 'still') return `${v.images} images, standing still`;
      // The group's drift sets the direction seen (docs/physics.md §3).
      const way = Math.sign(v.apparentRpm) === Math.sign(v.trueRpm) ? 'forward' : 'backward';
      return `${v.images} images, creeping ${way}`;
    }
  }
}

export const CHECK_NOTE_WORDS: Record<CheckNote, string> = {
  'rate-outside-range': "The flash rate lies outside this strobe's own range.",
  'exposure-capped': 'The exposure is longer than one frame; a camera caps it at one frame (360°).',
  'readout-too-long':
    'The readout time is longer than one frame: no camera reads that slowly at this frame rate.',
};

/** Why some lock-in rates near the current one are not suggested (docs/physics.md §4). */
export function narrowLocksWords(sampler: Sampler): string {
  return (
    `Some lock-in rates near here freeze the part over less than ${settingStepWords(sampler)}: too ` +
    'narrow to set and hold, so they are left out. A speed tolerance widens them; the rate map ' +
    'shows every lock.'
  );
}

/** Why no creep rate is offered. */
export function creepMissingWords(missing: CreepMissing, creepRpm: number): string {
  switch (missing) {
    case 'not-turning':
      return 'The part is not turning, so no rate can make it creep.';
    case 'no-creep':
      return 'Give a creep speed above zero.';
    case 'creep-too-fast':
      return 'The creep must be slower than the true speed.';
    case 'too-dense':
      return 'The features pass too often per flash here to pick a creep rate: choose a faster rate.';
    case 'none-in-range':
      return `No rate in the range shows it as one image creeping forward at ${formatNumber(creepRpm)} rpm.`;
  }
}

/** What the blur of one exposure does to the features. */
export const BLUR_WORDS: Record<CameraResult['blurLook'], string> = {
  sharp: 'sharp',
  streaked: 'streaked: edges drawn out along the turn',
  smeared: 'smeared into an even disc: single features cannot be seen',
};

/** What the rolling shutter does to straight blades. */
export const SKEW_WORDS: Record<CameraResult['skewLook'], string> = {
  straight: 'straight',
  bent: 'bent into curves',
  broken: 'broken into pieces: more than one pitch passes during the readout',
};

/** What a creep rate shows: one image creeping forward (what the core offers), else its look. */
export function creepRateWords(c: CreepRate): string {
  return c.images === 1 && c.look === 'forward' ? 'creeping forward' : lookPhrase(c.look, c.images);
}
