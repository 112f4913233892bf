// The lighting check of the current set-up: its lamp (mains, flicker, modulation) against every
// part, by the core's lightingCheck (docs/physics.md §6).
import {
  lightingCheck,
  type CautionContext,
  type Lamp,
  type LightingCheck,
  type LitPart,
} from '../core';
import { type Setup, corePartOf } from './model';
import { keepLastGood } from './outcome';
import { lightWaveOf, setup } from './setup';

/** The set-up's lighting as the core's lamp. */
export function lampOf(s: Setup): Lamp {
  const l = s.lighting;
  return {
    mainsHz: l.mainsHz,
    flicker: l.flicker === 'custom' ? l.customHz : l.flicker,
    modulationPercent: l.modulationPercent,
    waveform: lightWaveOf(l),
  };
}

/** Every part of the set-up in core units (rev/s, relative tolerance), with its name. */
export function litPartsOf(s: Setup): LitPart[] {
  return s.parts.map((p) => ({ name: p.name, ...corePartOf(p) }));
}

/**
 * The cautions a lighting result calls for (docs/physics.md §4, §10): stillness that is not real when
 * a flickering light shows any part other than as it truly turns (still, slowed, several images,
 * backward, unclear); the seizure range for the flicker rate.
 */
export function lightingCautions(result: LightingCheck, modulationPercent: number): CautionContext {
  return {
    apparentStillness: result.parts.some((p) => p.aliased),
    flashRatesHz: modulationPercent > 0 ? [result.flickerHz] : [],
  };
}

/** The check of the current set-up, kept at its last good value when the core refuses one. */
export const lighting = keepLastGood(() =>
  lightingCheck(lampOf(setup.value), litPartsOf(setup.value)),
);
