// Rates in the words of each sampler: frames per second for a camera, flashes per minute
// (or Hz) for a strobe, Hz for lighting flicker.
import type { Sampler } from '../core';
import type { SamplerKind } from '../state/model';
import { formatPrecise, NO_VALUE } from './format';

export type FlashUnit = 'fpm' | 'Hz';

/** The unit word a sampler's rate is shown in. */
export function rateUnit(kind: SamplerKind, flashUnit: FlashUnit): string {
  if (kind === 'camera') return 'fps';
  if (kind === 'strobe') return flashUnit === 'fpm' ? 'fpm' : 'Hz';
  return 'Hz';
}

/** A rate in Hz as the sampler's own number (frames/s, flashes/min or Hz), without the unit. */
export function rateNumber(rateHz: number, kind: SamplerKind, flashUnit: FlashUnit): number {
  return kind === 'strobe' && flashUnit === 'fpm' ? rateHz * 60 : rateHz;
}

/**
 * A rate in Hz with the sampler's unit.
 * @example formatRate(29.5, 'strobe', 'fpm') // "1,770 fpm"
 * @example formatRate(30000 / 1001, 'camera', 'fpm') // "29.97 fps"
 */
export function formatRate(rateHz: number, kind: SamplerKind, flashUnit: FlashUnit): string {
  if (!Number.isFinite(rateHz)) return NO_VALUE;
  return `${formatPrecise(rateNumber(rateHz, kind, flashUnit))} ${rateUnit(kind, flashUnit)}`;
}

/** A rate band "from – to unit". */
export function formatRateSpan(
  fromHz: number,
  toHz: number,
  kind: SamplerKind,
  flashUnit: FlashUnit,
): string {
  const unit = rateUnit(kind, flashUnit);
  return `${formatPrecise(rateNumber(fromHz, kind, flashUnit))} – ${formatPrecise(rateNumber(toHz, kind, flashUnit))} ${unit}`;
}

/**
 * The smallest change of rate a person can set (docs/physics.md §4, §12), in words: a band
 * offered must be at least this wide.
 * @example settingStepWords('frames') // "0.01 frames/s"
 */
export function settingStepWords(sampler: Sampler): string {
  return sampler === 'frames' ? '0.01 frames/s' : 'one flash per minute';
}
