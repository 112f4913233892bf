// The check screen's suggestions near the current rate: lock-in rates, creep rates and safe
// bands, each searched in a window around the rate that grows until it holds enough, and never
// further than one keystroke's work allows (docs/physics.md §4).
import {
  apparentMotion,
  defaultLookOptions,
  isSettableBand,
  lockCountBound,
  lockRates,
  rateBands,
  ratesForApparent,
  settingStepHz,
  type ApparentMotion,
  type Part,
  type RateBand,
  type Range,
  type Sampler,
} from '../../core';

/** Where a suggested rate lies against the current one. */
export type Side = 'below' | 'here' | 'above';

/** A rate worth tapping, with what the viewer would see there. */
export interface SuggestedRate {
  rateHz: number;
  images: number;
  /** Rate band the lock wanders over within the speed tolerance (equal to rateHz without tolerance). */
  lowHz: number;
  highHz: number;
  side: Side;
}

export interface CreepRate {
  rateHz: number;
  side: Side;
  look: ApparentMotion['look'];
  images: number;
}

/** Why no creep rate is offered (src/words/check.ts says it in words). */
export type CreepMissing =
  'not-turning' | 'no-creep' | 'creep-too-fast' | 'too-dense' | 'none-in-range';

export interface BandSummary {
  /** Every band in the span searched, ascending. */
  all: RateBand[];
  /** The span the bands cover: the sampler's range, or a window around the rate when the range holds too many locks to list. */
  span: Range;
  partial: boolean;
  /** The band holding the current rate, when the rate lies in the span. */
  current?: RateBand;
  /** Safe bands nearest the current rate, ascending: only bands at least one setting step wide. */
  safeNearby: RateBand[];
  /** Safe bands a person can set (at least one setting step wide), in the span searched. */
  safeCount: number;
}

/**
 * Safe bands narrower than this share of their rate are too narrow to hold a sampler in
 * (speed drift, dial steps); they are listed only when there is nothing wider (a judgement).
 */
export const MIN_USEFUL_BAND = 0.005;
/** Suggested rates shown on each side of the current one. */
export const LOCKS_PER_SIDE = 3;
/** Largest loop the core may run for one keystroke; beyond it, search a window around the rate instead. */
const WORK_LIMIT = 40_000;
/**
 * Rates worth suggesting: a single image (to freeze) or a double image (the check at twice the
 * rate). Nobody sets a strobe on purpose for six superimposed images; the rate map and the
 * bands still show every lock up to the look options' limit (common practice).
 */
const SUGGESTED_MAX_IMAGES = 2;

const look = defaultLookOptions;

function sideOf(rateHz: number, currentHz: number): Side {
  const gap = (rateHz - currentHz) / currentHz;
  return Math.abs(gap) < 1e-9 ? 'here' : gap < 0 ? 'below' : 'above';
}

/** A window [anchor/w, anchor·w] clipped to the range. */
function windowAround(anchorHz: number, w: number, range: Range): Range {
  return { minHz: Math.max(range.minHz, anchorHz / w), maxHz: Math.min(range.maxHz, anchorHz * w) };
}

function clampTo(range: Range, rateHz: number): number {
  return Math.min(range.maxHz, Math.max(range.minHz, rateHz));
}

/** How to search around a rate: the work a span costs, the search itself, and how many to find. */
interface Search<T> {
  cost: (span: Range) => number;
  find: (span: Range) => T[];
  rateOf: (t: T) => number;
  perSide: number;
}

/**
 * Runs `search.find` on windows growing around the anchor until it finds `perSide` results on
 * each side (or the window fills the range, or the next window would cost too much).
 * `searched` is false when even the first window was too costly to search.
 */
function searchAround<T>(
  anchorHz: number,
  range: Range,
  ratio: number,
  search: Search<T>,
): { found: T[]; searched: boolean } {
  const { cost, find, rateOf, perSide } = search;
  let w = 1 + 4 / Math.max(Math.abs(ratio), 1);
  let found: T[] = [];
  let searched = false;
  for (let i = 0; i < 40; i++) {
    const span = windowAround(anchorHz, w, range);
    if (!(span.minHz < span.maxHz) || cost(span) > WORK_LIMIT) break;
    found = find(span);
    searched = true;
    const below = found.filter((t) => rateOf(t) < anchorHz).length;
    const above = found.filter((t) => rateOf(t) > anchorHz).length;
    const lowDone = below >= perSide || span.minHz <= range.minHz;
    const highDone = above >= perSide || span.maxHz >= range.maxHz;
    if (lowDone && highDone) break;
    w = 1 + (w - 1) * 3;
  }
  return { found, searched };
}

/** The `perSide` entries nearest the anchor on each side, plus any right at it, ascending. */
function nearest<T>(items: T[], anchorHz: number, rateOf: (t: T) => number, perSide: number): T[] {
  const below = items
    .filter((t) => rateOf(t) < anchorHz * (1 - 1e-9))
    .sort((a, b) => rateOf(b) - rateOf(a));
  const here = items.filter((t) => Math.abs(rateOf(t) - anchorHz) <= anchorHz * 1e-9);
  const above = items
    .filter((t) => rateOf(t) > anchorHz * (1 + 1e-9))
    .sort((a, b) => rateOf(a) - rateOf(b));
  return [...below.slice(0, perSide).reverse(), ...here, ...above.slice(0, perSide)];
}

/**
 * The lock-in rates nearest the rate, and whether some were left out because the rates that
 * freeze them make too narrow a band to set and hold (docs/physics.md §4).
 */
export function nearbyLocks(
  part: Required<Part>,
  rateHz: number,
  range: Range,
  sampler: Sampler,
): { locks: SuggestedRate[]; narrowLeftOut: boolean } {
  const patternHz = part.symmetry * Math.abs(part.speedHz);
  if (patternHz === 0) return { locks: [], narrowLeftOut: false };
  const maxImages = sampler === 'flash' ? Math.min(look.maxImages, SUGGESTED_MAX_IMAGES) : 1;
  const anchor = clampTo(range, rateHz);
  const pattern = { lowHz: patternHz, highHz: patternHz };
  const { found } = searchAround(anchor, range, patternHz / anchor, {
    cost: (span) => lockCountBound(pattern, span, maxImages) + 1,
    find: (span) => lockRates(part, span, { maxImages }),
    rateOf: (l) => l.rateHz,
    perSide: LOCKS_PER_SIDE,
  });
  // docs/physics.md §4: a lock is offered only when the rates that freeze it (its tolerance band
  // widened by the still threshold, n·stillHz·q/p) make a band a person can set and hold.
  const step = settingStepHz(sampler);
  const stillHz = part.symmetry * look.stillHz;
  const holdable = found.filter((l) =>
    isSettableBand(
      { fromHz: l.lowHz - (stillHz * l.q) / l.p, toHz: l.highHz + (stillHz * l.q) / l.p },
      step,
      l.rateHz,
    ),
  );
  const locks = nearest(holdable, rateHz, (l) => l.rateHz, LOCKS_PER_SIDE).map((l) => ({
    rateHz: l.rateHz,
    images: l.images,
    lowHz: l.lowHz,
    highHz: l.highHz,
    side: sideOf(l.rateHz, rateHz),
  }));
  // Left out only where one of the nearest locks would otherwise have been shown.
  const narrowLeftOut = nearest(found, rateHz, (l) => l.rateHz, LOCKS_PER_SIDE).some(
    (l) => !holdable.includes(l),
  );
  return { locks, narrowLeftOut };
}

/** The rates nearest the rate that show one image creeping forward at creepRpm, or why there are none. */
export function creepRates(
  part: Required<Part>,
  creepRpm: number,
  rateHz: number,
  range: Range,
  sampler: Sampler,
): { rates: CreepRate[]; missing?: CreepMissing } {
  const f = part.speedHz;
  if (f === 0) return { rates: [], missing: 'not-turning' };
  const creepHz = creepRpm / 60;
  if (!(creepHz > 0)) return { rates: [], missing: 'no-creep' };
  if (creepHz >= Math.abs(f)) return { rates: [], missing: 'creep-too-fast' };
  const wanted = Math.sign(f) * creepHz;
  const gapHz = part.symmetry * Math.abs(f - wanted);
  const anchor = clampTo(range, rateHz);
  // The rates n·|f − a|/k lie like the single-image locks of a pattern rate n·|f − a|.
  const gap = { lowHz: gapHz, highHz: gapHz };
  const { found, searched } = searchAround(anchor, range, gapHz / anchor, {
    cost: (span) => lockCountBound(gap, span, 1) + 1,
    // docs/physics.md §4: only rates where this sampler shows one image creeping forward.
    find: (span) => ratesForApparent(part, wanted, span, { sampler }),
    rateOf: (r) => r.rateHz,
    perSide: 1,
  });
  const rates = nearest(found, rateHz, (r) => r.rateHz, 1).map((r) => {
    const m = apparentMotion(part, r.rateHz, { sampler });
    return { rateHz: r.rateHz, side: sideOf(r.rateHz, rateHz), look: m.look, images: m.images };
  });
  if (rates.length > 0) return { rates };
  return { rates, missing: searched ? 'none-in-range' : 'too-dense' };
}

/** The safe and misleading bands around the rate (the whole range when it can be listed at once). */
export function bandSummary(
  part: Required<Part>,
  rateHz: number,
  range: Range,
  sampler: Sampler,
): BandSummary {
  const patternHz = part.symmetry * Math.abs(part.speedHz);
  // rateBands' spans reach the nearly-still margin below a lock and the image-group margin above.
  const belowHz = part.symmetry * Math.max(look.stillHz, look.nearlyStillHz);
  const aboveHz = Math.max(part.symmetry * look.stillHz, look.groupSpacingsPerS);
  const pattern = {
    lowHz: Math.max(0, patternHz * (1 - part.tolerance) - belowHz),
    highHz: patternHz * (1 + part.tolerance) + aboveHz,
  };
  const qMax = sampler === 'flash' ? look.maxImages : 1;
  // The locks of every image count, and one backward span per single-image bin.
  const cost = (span: Range) =>
    lockCountBound(pattern, span, qMax) + lockCountBound(pattern, span, 1) + 1;
  let span = range;
  let partial = false;
  if (patternHz > 0 && cost(span) > WORK_LIMIT) {
    // Too many locks to list over the whole range: shrink a window around the rate until it fits.
    partial = true;
    const anchor = clampTo(range, rateHz);
    let w = Math.max(range.maxHz / anchor, anchor / range.minHz);
    for (let i = 0; i < 60 && cost(windowAround(anchor, w, range)) > WORK_LIMIT; i++)
      w = 1 + (w - 1) / 2;
    span = windowAround(anchor, w, range);
  }
  const fits = span.minHz < span.maxHz && (patternHz === 0 || cost(span) <= WORK_LIMIT);
  const all = fits ? rateBands([part], span, { sampler }) : [];
  const current = all.find((b) => b.fromHz <= rateHz && rateHz <= b.toHz);
  // docs/physics.md §4: a band narrower than one setting step is not offered.
  const step = settingStepHz(sampler);
  const safe = all.filter((b) => b.safe && isSettableBand(b, step));
  const wide = safe.filter(
    (b) => b.toHz - b.fromHz >= MIN_USEFUL_BAND * Math.sqrt(b.fromHz * b.toHz),
  );
  const mid = (b: RateBand) => Math.sqrt(b.fromHz * b.toHz);
  const safeNearby = [...(wide.length > 0 ? wide : safe)]
    .sort((a, b) => Math.abs(Math.log(mid(a) / rateHz)) - Math.abs(Math.log(mid(b) / rateHz)))
    .slice(0, 2 * LOCKS_PER_SIDE)
    .sort((a, b) => a.fromHz - b.fromHz);
  return {
    all,
    span: fits ? span : { minHz: rateHz, maxHz: rateHz },
    partial: partial || !fits,
    current,
    safeNearby,
    safeCount: safe.length,
  };
}
