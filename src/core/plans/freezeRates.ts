import { InputError, requireWhole } from '../basics/InputError';
import {
  checkPart,
  checkRange,
  checkSampler,
  type Part,
  type Range,
  type Sampler,
} from '../basics/types';
import { checkLookOptions, type LookOptions } from '../physics/lookOptions';
import { lockCountBound, lockRates } from '../physics/lockRates';
import { isSettableBand, settingStepHz } from '../physics/settableBands';

export type StillRateOptions = Partial<LookOptions> & {
  sampler?: Sampler;
  /**
   * Smallest change of rate a person can set, Hz (freezeRates, noStillRates): bands narrower
   * than this are not offered. Default: 1 flash per minute under a flash, 0.01 frames/s on camera.
   */
  settingStepHz?: number;
};

/** A span of rates where one part can look still. */
export interface StillSpan {
  fromHz: number;
  toHz: number;
  /** Index of the part in the list given. */
  part: number;
  /** Images standing still (q of the lock p/q). */
  images: number;
  /** p of the lock p/q: s ≈ n·|f|·q/p. 0: the part turns slower than the still threshold, so it looks still at every rate. */
  p: number;
  /** Below this span's top, this part's locks for speeds within its tolerance overlap: some lock lies at every rate. */
  dense: boolean;
}

/** A band of rates that freezes the chosen part as a single image while no other part looks still. */
export interface FreezeBand {
  fromHz: number;
  toHz: number;
  /** The lock order: the part freezes near s = n·|f|/p (p = 1 is the highest single-image rate). */
  p: number;
  /** The single-image rate for the nominal speed, n·|f|/p, Hz (0 when p = 0). */
  lockRateHz: number;
  /** Inside a dense region (see StillSpan.dense): the exact rate depends on the actual speed. */
  dense: boolean;
}

/**
 * Every span of rates in the range where some part can look still (docs/physics.md §3, §4): for a
 * lock p/q (q = 1 always; q ≤ maxImages under a flash) the part is still while its pattern
 * rate comes within D = n·stillHz of (p/q)·s for some speed in its tolerance, i.e. for
 * s ∈ ((F₋ − D)·q/p, (F₊ + D)·q/p), F± = n|f|(1 ± u): the locks of lockRates widened by the
 * still threshold (the same closed form as rateBands; no grid). Where consecutive single-image
 * spans overlap (p ≥ (1 − w)/(2w), w = u + D/(n|f|)) they are joined into one dense span.
 * A part slower than the threshold looks still everywhere (p = 0); a part not turning is left out.
 * Sorted by fromHz.
 *
 * Units: rev/s, Hz. Throws InputError for an empty part list, a bad part or range, an unknown
 * sampler or bad look options.
 *
 * @example
 * // Wikipedia, "Stroboscopic effect": a 12-spoke wheel at 2 rev/s looks still at 24 frames/s.
 * stillRates([{ speedHz: 2, symmetry: 12 }], { minHz: 20, maxHz: 30 }, { sampler: 'frames' })
 * // [{ fromHz: 23.95, toHz: 24.05, part: 0, images: 1, p: 1, dense: false }] (D = 12 · 0.25 rpm = 0.05 Hz)
 */
export function stillRates(parts: Part[], range: Range, opts?: StillRateOptions): StillSpan[] {
  const { checked, minHz, maxHz, qMax, look } = checkAll(parts, range, opts);
  const out: StillSpan[] = [];
  checked.forEach((part, index) =>
    addStillSpans(part, index, { minHz, maxHz, qMax, stillHz: look.stillHz }, out),
  );
  return out.sort((a, b) => a.fromHz - b.fromHz || a.part - b.part || a.images - b.images);
}

/**
 * Bands of rates that freeze parts[target] as a single image while no other part looks still
 * (docs/physics.md §4, several parts): the target's single-image still spans minus every other
 * part's still spans (any image count under a flash). Ascending by rate. The band is where the
 * freeze can be found: within it, the exact rate depends on the part's actual speed.
 * Only bands a person can set and that do what they say are offered (isSettableBand): each
 * contains the lock for the target's nominal speed, n·|f|/p, and is at least one setting step
 * wide. A piece of a still span that another part's stillness cut off from the nominal lock
 * would freeze the part only at one end of its tolerance (at the nominal speed it turns
 * slowly or backward): it is left out, as is any sliver.
 *
 * Units: rev/s, Hz. Throws InputError for an empty part list, a target that is not the index
 * (from 0) of a part, a bad part or range, an unknown sampler or bad look options.
 *
 * @example
 * // A 12-spoke wheel at 2 rev/s and a 5-spoke wheel at 3 rev/s on camera (20–30 frames/s):
 * // the first freezes near 24 frames/s, where the second does not look still.
 * freezeRates([{ speedHz: 2, symmetry: 12 }, { speedHz: 3, symmetry: 5 }], 0, { minHz: 20, maxHz: 30 }, { sampler: 'frames' })
 * // [{ fromHz: 23.95, toHz: 24.05, p: 1, lockRateHz: 24, dense: false }]
 */
export function freezeRates(
  parts: Part[],
  target: number,
  range: Range,
  opts?: StillRateOptions,
): FreezeBand[] {
  const { checked, minHz, maxHz, qMax, look, stepHz } = checkAll(parts, range, opts);
  const t = requireWhole(target, 'part to freeze', 0, checked.length - 1);
  const own: StillSpan[] = [];
  const search = { minHz, maxHz, qMax, stillHz: look.stillHz };
  addStillSpans(checked[t], t, { ...search, qMax: 1 }, own);
  const others: StillSpan[] = [];
  checked.forEach((part, index) => {
    if (index !== t) addStillSpans(part, index, search, others);
  });
  const blocked = union(others);
  const patternHz = checked[t].symmetry * Math.abs(checked[t].speedHz);
  const out: FreezeBand[] = [];
  for (const span of own.sort((a, b) => a.fromHz - b.fromHz)) {
    for (const [fromHz, toHz] of subtract([span.fromHz, span.toHz], blocked)) {
      // In a dense span the locks n·|f|/p of every p ≥ span.p lie side by side: a piece holds
      // the nominal lock of the smallest p whose lock is not above the piece's top.
      const p =
        span.p === 0 || !span.dense
          ? span.p
          : Math.max(span.p, Math.ceil((patternHz / toHz) * (1 - 1e-12)));
      const lockRateHz = p === 0 ? 0 : patternHz / p;
      const band = { fromHz, toHz, p, lockRateHz, dense: span.dense };
      // A part slower than the still threshold (p = 0) looks still at every rate: no lock to hold.
      if (isSettableBand(band, stepHz, p === 0 ? undefined : lockRateHz)) out.push(band);
    }
  }
  return out;
}

/**
 * Bands of rates at which no part looks still (docs/physics.md §4): the range minus every part's
 * still spans. Parts may still look slow or backward there (see rateBands for that).
 * Ascending by rate. Bands narrower than one setting step are not offered (isSettableBand).
 *
 * Units: rev/s, Hz. Throws InputError as stillRates does.
 *
 * @example
 * // One mark at 20 rev/s on camera, 15–25 frames/s: it looks still only within 0.25 rpm of 20 frames/s.
 * noStillRates([{ speedHz: 20, symmetry: 1 }], { minHz: 15, maxHz: 25 }, { sampler: 'frames' })
 * // [{ fromHz: 15, toHz: 19.995833… }, { fromHz: 20.004166…, toHz: 25 }]
 */
export function noStillRates(
  parts: Part[],
  range: Range,
  opts?: StillRateOptions,
): Array<{ fromHz: number; toHz: number }> {
  const { minHz, maxHz, stepHz } = checkAll(parts, range, opts);
  const spans = stillRates(parts, range, opts);
  return subtract([minHz, maxHz], union(spans))
    .map(([fromHz, toHz]) => ({ fromHz, toHz }))
    .filter((band) => isSettableBand(band, stepHz));
}

function checkAll(parts: Part[], range: Range, opts: StillRateOptions | undefined) {
  if (!Array.isArray(parts) || parts.length === 0) {
    throw new InputError('parts', 'Give at least one part to check rates against.');
  }
  const checked = parts.map((p, i) => checkPart(p, `part ${i + 1}`));
  const { minHz, maxHz } = checkRange(range);
  const sampler = checkSampler(opts?.sampler);
  const look = checkLookOptions(opts);
  // On camera only a single image freezes; under a flash q superimposed images stand still.
  const qMax = sampler === 'flash' ? look.maxImages : 1;
  const stepHz = settingStepHz(sampler, opts?.settingStepHz);
  return { checked, minHz, maxHz, qMax, look, stepHz };
}

/** More still spans than this for one part would take seconds to list and mean nothing on a chart. */
const MAX_SPANS_PER_PART = 1_000_000;

/** Where still spans are looked for: the rate range, the image counts and the still threshold. */
interface SpanSearch {
  minHz: number;
  maxHz: number;
  /** Largest image count that stands still (1 on camera). */
  qMax: number;
  stillHz: number;
}

function addStillSpans(
  part: Required<Part>,
  index: number,
  search: SpanSearch,
  out: StillSpan[],
): void {
  const { minHz, maxHz, qMax, stillHz } = search;
  const F = part.symmetry * Math.abs(part.speedHz);
  if (F === 0) return; // not turning: it looks still because it is
  const D = part.symmetry * stillHz;
  const push = (fromHz: number, toHz: number, images: number, p: number, dense: boolean) => {
    const a = Math.max(fromHz, minHz);
    const b = Math.min(toHz, maxHz);
    if (a < b) out.push({ fromHz: a, toHz: b, part: index, images, p, dense });
  };
  if (F * (1 - part.tolerance) <= D) {
    push(minHz, maxHz, 1, 0, true);
    return;
  }
  // Each lock's still span is its rate times (1 ± w): (F(1−u) − D)·q/p = (F·q/p)·(1 − u − D/F).
  const w = part.tolerance + D / F;
  // Single-image spans p and p + 1 overlap from p ≥ P0: below the top of span P0 all rates are still.
  const P0 = Math.max(1, Math.ceil((1 - w) / (2 * w)));
  const floorHz = (F / P0) * (1 + w);
  if (floorHz > minHz) push(minHz, floorHz, 1, P0, true);
  const queryMin = Math.max(minHz, floorHz) / (1 + w);
  const queryMax = maxHz / (1 - w);
  if (!(queryMin < queryMax)) return;
  // Locks F·q/p in [queryMin, queryMax]: about F·(1/queryMin − 1/queryMax)·q per image count q.
  const expected = lockCountBound(
    { lowHz: F, highHz: F },
    { minHz: queryMin, maxHz: queryMax },
    qMax,
  );
  if (!(expected <= MAX_SPANS_PER_PART)) {
    throw new InputError(
      'rate range',
      `Part ${index + 1} turns too fast for rates this low: it would stand still at millions of rates. ` +
        'Raise the lowest rate, or count fewer images.',
    );
  }
  for (const lock of lockRates(part, { minHz: queryMin, maxHz: queryMax }, { maxImages: qMax })) {
    push(lock.rateHz * (1 - w), lock.rateHz * (1 + w), lock.q, lock.p, false);
  }
}

/** Merges open spans into disjoint [from, to] pairs, ascending. */
function union(spans: Array<{ fromHz: number; toHz: number }>): Array<[number, number]> {
  const sorted = [...spans].sort((a, b) => a.fromHz - b.fromHz);
  const out: Array<[number, number]> = [];
  for (const s of sorted) {
    const last = out[out.length - 1];
    if (last && s.fromHz <= last[1]) last[1] = Math.max(last[1], s.toHz);
    else out.push([s.fromHz, s.toHz]);
  }
  return out;
}

/** [from, to] minus disjoint ascending blocks; the pieces left, each of positive width. */
function subtract(
  span: [number, number],
  blocks: Array<[number, number]>,
): Array<[number, number]> {
  const out: Array<[number, number]> = [];
  let cursor = span[0];
  for (const [a, b] of blocks) {
    if (b <= cursor) continue;
    if (a >= span[1]) break;
    if (a > cursor) out.push([cursor, Math.min(a, span[1])]);
    cursor = Math.max(cursor, b);
    if (cursor >= span[1]) break;
  }
  if (cursor < span[1]) out.push([cursor, span[1]]);
  return out;
}
