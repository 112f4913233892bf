// Kept whole (over 300 lines): the closed forms of every misleading span and the flat span list
// they fill belong to one algorithm (docs/physics.md §4), measured by `npm run bench`.
import { InputError } from '../basics/InputError';
import {
  checkPart,
  checkRange,
  checkSampler,
  type Part,
  type Range,
  type Sampler,
} from '../basics/types';
import { checkLookOptions, type LookOptions } from './lookOptions';
import { gcd } from '../basics/gcd';
import { MAX_WORK_ITEMS, requireWorkable } from '../basics/workLimit';
import { plainNumber } from '../basics/plainNumber';
import { lockCountBound } from './lockRates';

export interface RateBandCause {
  /** Index of the part in the list given. */
  part: number;
  /**
   * How the part misleads at some speed within its tolerance:
   * 'still': q images stand still; 'backward': turns backward or its direction is unclear;
   * 'nearly-still': turns forward slower than the nearly-still threshold; 'images': several
   * images drift (not one image); 'crawl': turns too slowly to see at all, at every rate.
   */
  kind: 'still' | 'backward' | 'crawl' | 'nearly-still' | 'images';
  /** Image count for 'still' and 'images' (1 otherwise). */
  images: number;
}

export interface RateBand {
  fromHz: number;
  toHz: number;
  /** docs/physics.md §4: every part, at every speed within its tolerance, is seen moving its true way. */
  safe: boolean;
  /**
   * What the band promises, in a few words: for a safe band whether every part is seen at its
   * true speed or turning forward (slower, but its true way) at a readable speed; for a
   * misleading one that some part can look still, slow, doubled or backward.
   */
  promise: string;
  reason: string;
  /** For a misleading band: which parts mislead and how (distinct, by part then kind then image count). */
  causes: RateBandCause[];
}

export type RateBandOptions = Partial<LookOptions> & { sampler?: Sampler };

/**
 * Splits a rate range into bands that are safe or misleading for all parts together
 * (docs/physics.md §4). A rate is safe when, for every speed within each part's tolerance,
 * apparentMotion shows the part faithfully ('true'), or turning forward as one image at the
 * nearly-still threshold or faster (default 6 rpm); anything else misleads: still, nearly
 * still, backward, direction unclear, or several images. A part that is not turning misleads
 * nobody and is left out. Band edges come from closed forms, never a grid, so no lock inside a
 * tolerance band can be stepped over. With F± = n|f|(1 ± u), D = n·stillHz, N = n·nearlyStillHz,
 * U = unclearStep, g = groupSpacingsPerS:
 * - a lock p/q (q = 1 always; q ≤ maxImages under a flash) is still for s ∈ [(F₋ − D)·q/p, (F₊ + D)·q/p];
 * - in bin k = round(n·f/s) ≥ 1 one image is safe only while k + N/s ≤ n·f/s < k + U, so it
 *   misleads for s ∈ [(F₋ − N)/k, F₊/c_k] with c_1 = 0.5, c_k = k − 1 + U: the lower edge is the
 *   rate at which the slowest speed within tolerance creeps forward at exactly N/n rev/s, the
 *   margin a safe band keeps from every lock;
 * - under a flash, q ≥ 2 images drift (creep under g of their spacings per second) near each
 *   p/q while the view is not faithful: s ∈ ((q·F₋ − g)/p, (q·F₊ + g)/p), clipped to where
 *   p is the nearest whole number to q·n·f/s and s ≤ 2·F₊;
 * - a part at or below the still threshold (F₋ ≤ D) misleads at every rate.
 * Below the rate where a part's bins start to touch (bin K with K·(F₊ − F₋ + N) ≥ (F₋ − N)·U)
 * every rate misleads for that part; there the reason names only its backward look.
 * Under 'frames' every rate above 2·n·|f|·(1+u) is therefore safe; under a flash the
 * multi-image locks stay misleading at any rate.
 *
 * Units: rev/s, Hz. Throws InputError for an empty part list, a bad part or range, an
 * unknown sampler or bad look options.
 *
 * @example
 * // One mark at 10 rev/s, camera 1–100 frames/s: only above 20 frames/s is every view faithful.
 * rateBands([{ speedHz: 10, symmetry: 1 }], { minHz: 1, maxHz: 100 }, { sampler: 'frames' }).at(-1)
 * // { fromHz: 20, toHz: 100, safe: true, promise: 'Seen at its true speed', … }
 */
export function rateBands(parts: Part[], range: Range, opts?: RateBandOptions): RateBand[] {
  if (!Array.isArray(parts) || parts.length === 0) {
    throw new InputError('parts', 'Give at least one part to check rates against.');
  }
  const checked = parts.map((p, i) => checkPart(p, `part ${i + 1}`));
  const { minHz, maxHz } = checkRange(range);
  const sampler = checkSampler(opts?.sampler);
  const look = checkLookOptions(opts);

  const spans = new SpanList(minHz, maxHz);
  checked.forEach((part, index) => addMisleadingSpans(part, index, sampler, look, spans));
  // Above this every part is faithful at every speed within its tolerance.
  const faithfulFromHz = Math.max(
    ...checked.map((p) => 2 * p.symmetry * Math.abs(p.speedHz) * (1 + p.tolerance)),
  );
  return toBands(spans, minHz, maxHz, faithfulFromHz, Math.max(look.nearlyStillHz, look.stillHz));
}

/** Cause codes pack (part, kind, images) into one number so spans live in flat arrays. */
const CRAWL = 0;
const BACKWARD = 1;
const STILL = 2;
const NEARLY = 3;
const IMAGES = 4;
const KINDS: RateBandCause['kind'][] = ['crawl', 'backward', 'still', 'nearly-still', 'images'];
const code = (part: number, kind: number, images = 1) => part * 10_000 + kind * 100 + images;

/** Misleading spans clipped to the range, in flat growable arrays (thousands per call). */
class SpanList {
  from = new Float64Array(1024);
  to = new Float64Array(1024);
  cause = new Int32Array(1024);
  length = 0;
  constructor(
    readonly minHz: number,
    readonly maxHz: number,
  ) {}
  push(from: number, to: number, cause: number): void {
    const a = from > this.minHz ? from : this.minHz;
    const b = to < this.maxHz ? to : this.maxHz;
    if (a > b) return;
    if (this.length === this.from.length) this.grow();
    this.from[this.length] = a;
    this.to[this.length] = b;
    this.cause[this.length] = cause;
    this.length++;
  }
  private grow(): void {
    const size = this.from.length * 2;
    const from = new Float64Array(size);
    const to = new Float64Array(size);
    const cause = new Int32Array(size);
    from.set(this.from);
    to.set(this.to);
    cause.set(this.cause);
    Object.assign(this, { from, to, cause });
  }
}

function addMisleadingSpans(
  part: Required<Part>,
  index: number,
  sampler: Sampler,
  look: LookOptions,
  spans: SpanList,
): void {
  const F = part.symmetry * Math.abs(part.speedHz);
  if (F === 0) return;
  const lo = F * (1 - part.tolerance);
  const hi = F * (1 + part.tolerance);
  const D = part.symmetry * look.stillHz;
  // Nearly still is never below still (lookOptions).
  const N = part.symmetry * Math.max(look.nearlyStillHz, look.stillHz);
  const { minHz, maxHz } = spans;

  if (lo <= D) {
    spans.push(minHz, maxHz, code(index, CRAWL));
    return;
  }

  // One image misleads in bin k ≥ 1 for s ∈ [(lo − N)/k, upper(k)]: nearly still or still
  // below hi/k, backward or unclear from lo/k.
  const U = look.unclearStep;
  const upper = (k: number) => hi / (k === 1 ? 0.5 : k - 1 + U);
  // From bin K on, each bin's cover reaches the next bin's (hi/c_{k+1} ≥ (lo − N)/k ⇔
  // k·(hi − lo + N) ≥ (lo − N)·U), so every rate up to upper(K) misleads: one span replaces
  // thousands of slow-rate ones. N > 0 keeps K finite.
  const K = Math.max(2, Math.ceil(((lo - N) * U) / (hi - lo + N)));
  const floorHz = upper(K);
  if (floorHz > minHz) spans.push(minHz, floorHz, code(index, BACKWARD));
  const kFirst = Math.max(1, Math.floor((lo - N) / maxHz));
  const kLast = Math.min(K, Math.ceil(hi / minHz + 1));
  const qMax = sampler === 'flash' ? look.maxImages : 1;
  const bottom = Math.max(minHz, floorHz);
  const g = look.groupSpacingsPerS;
  // The highest pattern rate whose locks can reach the range: still or drifting as a group.
  const top = hi + Math.max(D, g);
  // Spans are flat numbers, not objects, so ten times the list limit still runs in ~0.1 s.
  requireWorkable(
    kLast -
      kFirst +
      1 +
      lockCountBound({ lowHz: top, highHz: top }, { minHz: bottom, maxHz: Infinity }, qMax),
    'rate range',
    'lock-in and backward spans',
    'raise the lowest rate or narrow the range',
    10 * MAX_WORK_ITEMS,
  );
  for (let k = kFirst; k <= kLast; k++) {
    spans.push((lo - N) / k, hi / k, code(index, NEARLY));
    spans.push(lo / k, upper(k), code(index, BACKWARD));
  }
  // Inside bin k's one-image cover nothing more can mislead: a lock there adds no rate.
  const covered = (from: number, to: number, k: number) =>
    k >= kFirst && k <= kLast && k >= 1 && from >= (lo - N) / k && to <= upper(k);

  // Locks p/q: still while (p/q)·s lies within D of some speed in [lo, hi].
  for (let q = 1; q <= qMax; q++) {
    const pFirst = Math.max(1, Math.floor(((lo - Math.max(D, g)) * q) / maxHz));
    const pLast = Math.ceil((top * q) / bottom);
    for (let p = pFirst; p <= pLast; p++) {
      if (q > 1 && gcd(p, q) !== 1) continue;
      const k = Math.round(p / q);
      const from = ((lo - D) * q) / p;
      const to = ((hi + D) * q) / p;
      if (q === 1 || !covered(from, to, k)) spans.push(from, to, code(index, STILL, q));
      if (q > 1) {
        // q images drift (not one image) while |q·n·f − p·s| < g, p is the nearest whole
        // number to q·n·f/s and the view is not faithful (n·f/s ≥ ½): apparentMotion's rule.
        if (2 * p + 1 < q) continue;
        const creepFrom = Math.max((q * lo - g) / p, (q * lo) / (p + 0.5));
        let creepTo = Math.min((q * hi + g) / p, (q * hi) / (p - 0.5), 2 * hi);
        if (2 * p < q) creepTo = Math.min(creepTo, (2 * g) / (q - 2 * p));
        if (creepFrom < creepTo && !covered(creepFrom, creepTo, k)) {
          spans.push(creepFrom, creepTo, code(index, IMAGES, q));
        }
      }
    }
  }
}

function toBands(
  spans: SpanList,
  minHz: number,
  maxHz: number,
  faithfulFromHz: number,
  nearlyStillHz: number,
): RateBand[] {
  const order = new Uint32Array(spans.length);
  for (let i = 0; i < order.length; i++) order[i] = i;
  const { from, to, cause } = spans;
  order.sort((a, b) => from[a] - from[b]);

  const safe = (fromHz: number, toHz: number) =>
    safeBand(fromHz, toHz, fromHz >= faithfulFromHz, nearlyStillHz);
  const bands: RateBand[] = [];
  let cursor = minHz;
  let i = 0;
  while (i < order.length) {
    const start = from[order[i]];
    let end = to[order[i]];
    const codes = new Set<number>();
    while (i < order.length && from[order[i]] <= end) {
      const j = order[i];
      if (to[j] > end) end = to[j];
      codes.add(cause[j]);
      i++;
    }
    if (start > cursor) bands.push(safe(cursor, start));
    const causes = [...codes].sort((a, b) => a - b).map(decode);
    bands.push({
      fromHz: start,
      toHz: end,
      safe: false,
      promise: 'Can look still, nearly still, doubled or backward',
      reason: describeCauses(causes, nearlyStillHz),
      causes,
    });
    cursor = end;
  }
  if (cursor < maxHz || bands.length === 0) bands.push(safe(cursor, maxHz));
  return bands;
}

function decode(value: number): RateBandCause {
  const part = Math.floor(value / 10_000);
  const kind = Math.floor((value % 10_000) / 100);
  return { part, kind: KINDS[kind], images: value % 100 };
}

function safeBand(
  fromHz: number,
  toHz: number,
  faithful: boolean,
  nearlyStillHz: number,
): RateBand {
  return faithful
    ? {
        fromHz,
        toHz,
        safe: true,
        promise: 'Seen at its true speed',
        reason: 'Every part is seen turning at its true speed and in its true direction.',
        causes: [],
      }
    : {
        fromHz,
        toHz,
        safe: true,
        promise: 'Seen turning its true way',
        reason:
          'Every part is seen turning its true way: at its true speed, or forward as one image ' +
          `at ${rpmWords(nearlyStillHz)} or faster (slower than it really turns).`,
        causes: [],
      };
}

const MAX_CAUSES_IN_REASON = 4;

function describeCauses(causes: RateBandCause[], nearlyStillHz: number): string {
  const words = causes.slice(0, MAX_CAUSES_IN_REASON).map((c) => {
    const who = `part ${c.part + 1}`;
    switch (c.kind) {
      case 'crawl':
        return `${who} turns too slowly to see moving`;
      case 'backward':
        return `${who} looks backward or its direction is unclear`;
      case 'nearly-still':
        return `${who} can creep forward slower than ${rpmWords(nearlyStillHz)} (nearly still)`;
      case 'images':
        return `${who} shows ${c.images} images drifting`;
      case 'still':
        return c.images === 1
          ? `${who} looks still`
          : `${who} shows ${c.images} images standing still`;
    }
  });
  const more =
    causes.length > MAX_CAUSES_IN_REASON
      ? `; and ${causes.length - MAX_CAUSES_IN_REASON} more`
      : '';
  const text = words.join('; ') + more;
  return text.charAt(0).toUpperCase() + text.slice(1) + '.';
}

/** A speed in rev/s as rpm in words: "6 rpm". */
function rpmWords(hz: number): string {
  return `${plainNumber(hz * 60)} rpm`;
}
