import { InputError, requirePositive } from '../basics/InputError';
import { THRESHOLD_SLACK } from './lookOptions';
import { checkSampler, type Sampler } from '../basics/types';

/**
 * The smallest change a person can make to a sampler's rate, Hz, when none is given
 * (docs/physics.md §4): a strobe's dial steps by 1 flash per minute, a camera's frame rate by
 * 0.01 frames per second (common practice). Lighting flicker is not set at all; it shares
 * the strobe's step, as a flash.
 */
export const DEFAULT_SETTING_STEP_HZ: Readonly<Record<Sampler, number>> = Object.freeze({
  flash: 1 / 60,
  frames: 0.01,
});

/**
 * The setting step to use: the one given (Hz, > 0), or the sampler's default.
 * Throws InputError for a step that is not a number above zero, or an unknown sampler.
 * @example settingStepHz('frames') // 0.01
 */
export function settingStepHz(sampler: Sampler | undefined, stepHz?: number): number {
  const kind = checkSampler(sampler);
  return stepHz === undefined
    ? DEFAULT_SETTING_STEP_HZ[kind]
    : requirePositive(stepHz, 'setting step');
}

/**
 * docs/physics.md §4, the one rule for every suggested band of rates: a person must be able to set
 * it, and it must do what it says. It is at least one setting step wide (so some setting on
 * the dial lies inside it; a sliver is not offered), and a band offered to freeze a part
 * contains that part's lock for its nominal speed (`lockHz`), so the rate suggested freezes
 * the part as it runs, not only at one end of its tolerance.
 * A width equal to the step up to THRESHOLD_SLACK counts as a step.
 * Throws InputError for a band whose ends are not finite with from ≤ to, or a step ≤ 0.
 * @example isSettableBand({ fromHz: 101.0117, toHz: 101.0133 }, 1 / 60) // false (0.1 flashes/min wide)
 */
export function isSettableBand(
  band: { fromHz: number; toHz: number },
  stepHz: number,
  lockHz?: number,
): boolean {
  const step = requirePositive(stepHz, 'setting step');
  const from = requirePositive(band?.fromHz, 'lowest rate of the band');
  const to = requirePositive(band?.toHz, 'highest rate of the band');
  if (!(from <= to)) {
    throw new InputError('band', `A band runs from its lowest rate up (got ${from} to ${to}).`);
  }
  if (to - from < step - THRESHOLD_SLACK * to) return false;
  if (lockHz === undefined) return true;
  const lock = requirePositive(lockHz, 'lock-in rate');
  const slack = THRESHOLD_SLACK * to;
  return lock >= from - slack && lock <= to + slack;
}
