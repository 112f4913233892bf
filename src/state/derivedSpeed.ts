// The one action that applies a speed a tool worked out to a part of the machine on screen: a
// wheel's road speed, a belt or gear from another part, a speed found with the strobe or by
// sound. The part takes the speed as its own and says where it came from (words/origin.ts);
// parts it drives follow along their drives. Nothing else writes a derived speed into a part.
import { InputError } from '../core';
import { withChainSpeeds } from './driveChain';
import { withDerivedSpeed, type OriginDetail, type OriginMethod, type Setup } from './model';
import { setup } from './setup';
import { DataError } from './read';

/** A speed worked out by a tool, with how. `at` defaults to now. */
export interface DerivedSpeedInput {
  speedRpm: number;
  tolerancePercent?: number;
  features?: number;
  origin: { method: OriginMethod; detail?: OriginDetail; at?: string };
}

/**
 * The set-up with part `index` at the derived speed (its origin recorded) and the parts it
 * drives following it. A chain the core refuses keeps the applied speed and its drives as they
 * were (the whole-machine screen says why). Throws DataError for an unknown part or a speed
 * that is not a finite number.
 */
export function setupWithDerivedSpeed(s: Setup, index: number, input: DerivedSpeedInput): Setup {
  if (!Number.isFinite(input.speedRpm)) {
    throw new DataError('speed', 'The speed worked out is not a number; nothing was changed.');
  }
  const next = withDerivedSpeed(s, index, {
    speedRpm: input.speedRpm,
    tolerancePercent: input.tolerancePercent,
    features: input.features,
    origin: {
      method: input.origin.method,
      detail: { ...(input.origin.detail ?? {}) },
      at: input.origin.at ?? new Date().toISOString(),
    },
  });
  if (!next) throw new DataError('parts', 'That part is no longer in the list.');
  try {
    return withChainSpeeds(next);
  } catch (error) {
    if (!(error instanceof InputError)) throw error;
    return next;
  }
}

/**
 * Applies a derived speed to part `index` of the machine on screen (one tap in a tool) and
 * returns the set-up it made. Throws DataError, changing nothing, as setupWithDerivedSpeed.
 */
export function applyDerivedSpeed(index: number, input: DerivedSpeedInput): Setup {
  const next = setupWithDerivedSpeed(setup.peek(), index, input);
  setup.value = next;
  return next;
}
