// What the whole-machine screen lists for its sampler's range: rates that freeze the chosen part
// while no other part looks still, and rates at which no part looks still (docs/physics.md §4,
// several parts), over the top of the range that can be listed at once.
import {
  defaultLookOptions,
  freezeRates,
  lockCountBound,
  noStillRates,
  type FreezeBand,
  type Range,
  type Sampler,
} from '../core';
import { check } from './check';
import { deriveParts, type DerivedPart } from './driveChain';
import { activeIndex } from './model';
import { keepLastGood } from './outcome';
import { setup } from './setup';

/** What the whole-machine screen lists for a sampler's range (docs/physics.md §4, several parts). */
export interface WholeMachineRates {
  /** The part to freeze (its index in the set-up). */
  target: number;
  /** The sampler's range. */
  range: Range;
  /** The part of it the bands cover: its top, from where listing every still span stays quick. */
  listed: Range | null;
  sampler: Sampler;
  /** Bands that freeze the target as a single image while no other part looks still, ascending. */
  freeze: FreezeBand[];
  /** Bands where no part looks still, ascending. */
  noStill: Array<{ fromHz: number; toHz: number }>;
}

/**
 * Still spans worked out per keystroke at most: enough for a dozen fast parts over a strobe's
 * whole range, few enough to answer at once on a phone (a judgement).
 */
export const MAX_LISTED_SPANS = 100_000;

/**
 * The top of `range` in which listing every part's still spans stays within `budget`: the
 * bottom is raised until the locks of all parts (the core's lockCountBound, docs/physics.md §3)
 * fit. Null when even the top rate is too costly.
 * @example listedRange([{ speedHz: 29.5, symmetry: 6 }], { minHz: 0.5, maxHz: 200 }, 'frames', 1e5) // { minHz: 0.5, maxHz: 200 }
 */
export function listedRange(
  parts: ReadonlyArray<{ speedHz: number; symmetry: number; tolerance?: number }>,
  range: Range,
  sampler: Sampler,
  budget = MAX_LISTED_SPANS,
): Range | null {
  const q = sampler === 'flash' ? defaultLookOptions.maxImages : 1;
  // Locks per 1/Hz of span, for the fastest pattern rate of every part summed: the count over
  // [min, max] is this times (1/min − 1/max), which the bottom below solves for the budget.
  const fastestHz = parts.reduce(
    (sum, p) => sum + p.symmetry * Math.abs(p.speedHz) * (1 + (p.tolerance ?? 0)),
    0,
  );
  const perInverseHz = lockCountBound(
    { lowHz: fastestHz, highHz: fastestHz },
    { minHz: 1, maxHz: Infinity },
    q,
  );
  if (perInverseHz === 0) return range;
  const lowest = 1 / (budget / perInverseHz + 1 / range.maxHz);
  const minHz = Math.max(range.minHz, lowest);
  return minHz < range.maxHz ? { minHz, maxHz: range.maxHz } : null;
}

/**
 * Freeze bands for parts[target] and the bands where no part looks still, over the top of the
 * range that can be listed quickly (listedRange).
 * Throws the core's InputError for a target that is not a part, or bad parts or range.
 */
export function wholeMachineRatesFor(
  parts: readonly DerivedPart[],
  target: number,
  range: Range,
  sampler: Sampler,
): WholeMachineRates {
  const list = [...parts];
  const listed = listedRange(list, range, sampler);
  return {
    target,
    range,
    listed,
    sampler,
    freeze: listed ? freezeRates(list, target, listed, { sampler }) : [],
    noStill: listed ? noStillRates(list, listed, { sampler }) : [],
  };
}

/** The rate tables for the current set-up: its chosen part, its sampler and that sampler's range. */
export const wholeMachineRates = keepLastGood(() => {
  const s = setup.value;
  const r = check.value;
  return wholeMachineRatesFor(deriveParts(s), activeIndex(s), r.range, r.sampler);
});
