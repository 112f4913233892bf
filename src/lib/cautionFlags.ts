// Which of the on-screen caution boxes (views/Cautions) a tool's caution context calls for,
// by the same rules as the core's safetyCautions (physics.md §10).
import { SEIZURE_RISK_HIGH_HZ, SEIZURE_RISK_LOW_HZ, type CautionContext } from '../core';

/**
 * @example cautionFlags({ apparentStillness: true, flashRatesHz: [100] }) // { safety: true, photosensitivity: false }
 */
export function cautionFlags(context: CautionContext): {
  safety: boolean;
  photosensitivity: boolean;
} {
  const rates = context.flashRatesHz ?? [];
  const sweep = context.flashSweepHz;
  const inRange = (hz: number) => hz >= SEIZURE_RISK_LOW_HZ && hz <= SEIZURE_RISK_HIGH_HZ;
  return {
    safety: context.apparentStillness === true,
    photosensitivity:
      rates.some(inRange) ||
      (sweep !== undefined &&
        sweep.minHz <= SEIZURE_RISK_HIGH_HZ &&
        sweep.maxHz >= SEIZURE_RISK_LOW_HZ),
  };
}
