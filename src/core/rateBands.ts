import { InputError } from './InputError';
import { checkPart, checkRange, checkSampler, type Part, type Range, type Sampler } from './types';
import { checkLookOptions, type LookOptions } from './lookOptions';
import { gcd } from './gcd';
import { MAX_WORK_ITEMS, requireWorkable } from './workLimit';

export interface RateBandCause {
  /** Index of the part in the list given. */
  part: number;
  /** 'still': q images stand still; 'backward': turns backward or direction unclear; 'crawl': turns too slowly to see at all. */
  kind: 'still' | 'backward' | 'crawl';
  /** Image count for 'still' (1 otherwise). */
  images: number;
}

export interface RateBand {
  fromHz: number;
  toHz: number;
  safe: boolean;
  reason: string;
  /** For a misleading band: which parts mislead and how (distinct, by part then image count). */
  causes: RateBandCause[];
}

export type RateBandOptions = Partial<LookOptions> & { sampler?: Sampler };

/**
 * Splits a rate range into bands that are safe or misleading for all parts together
 * (physics.md §4). A rate is misleading when, for some speed within a part's tolerance,
 * apparentMotion reads 'still', 'backward' or 'unclear' (a part that is not turning at all
 * misleads nobody and is left out). Band edges come from closed forms, never a grid, so no
 * lock inside a tolerance band can be stepped over:
 * - a lock p/q (q = 1 always; q ≤ maxImages under a flash) is still for
 *   s ∈ ((F₋ − D)·q/p, (F₊ + D)·q/p), with F± = n|f|(1 ± u) and D = n·stillHz;
 * - single-image backward or unclear for s ∈ (F₋/k, F₊/c_k], c_1 = 0.5, c_k = k − 1 + unclearStep;
 * - a part slower than the still threshold (F₋ < D) misleads at every rate.
 * Below the rate where a part's spans start to touch (bin K with K·(F₊ − F₋ + D) ≥ (F₋ − D)·unclearStep)
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
 * // { fromHz: 20, toHz: 100, safe: true, … }
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
  return toBands(spans, minHz, maxHz);
}

/** Cause codes pack (part, kind, images) into one number so spans live in flat arrays. */
const CRAWL = 0;
const BACKWARD = 1;
const still = (images: number) => 1 + images;

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
  const code = (kind: number) => index * 1000 + kind;
  const { minHz, maxHz } = spans;

  if (lo < D) {
    spans.push(minHz, maxHz, code(CRAWL));
    return;
  }

  // Single-image backward or unclear, bin k = round(n·f/s) ≥ 1: s ∈ (lo/k, hi/c_k].
  const U = look.unclearStep;
  const upper = (k: number) => hi / (k === 1 ? 0.5 : k - 1 + U);
  // From bin K on, each bin's still-or-backward cover ((lo − D)/k, hi/c_k] reaches the next bin's
  // (hi/c_{k+1} ≥ (lo − D)/k ⇔ k·(hi − lo + D) ≥ (lo − D)·U), so every rate up to upper(K)
  // misleads: one span replaces thousands of slow-rate ones. D > 0 keeps K finite.
  const K = Math.max(2, Math.ceil(((lo - D) * U) / (hi - lo + D)));
  const floorHz = upper(K);
  if (floorHz > minHz) spans.push(minHz, floorHz, code(BACKWARD));
  const kFirst = Math.max(1, Math.floor(lo / maxHz));
  const kLast = Math.min(K, Math.ceil(hi / minHz + 1));
  const qMax = sampler === 'flash' ? look.maxImages : 1;
  const bottom = Math.max(minHz, floorHz);
  // Spans are flat numbers, not objects, so ten times the list limit still runs in ~0.1 s.
  requireWorkable(
    kLast - kFirst + 1 + (((hi + D) / bottom) * qMax * (qMax + 1)) / 2,
    'rate range',
    'lock-in and backward spans',
    'raise the lowest rate or narrow the range',
    10 * MAX_WORK_ITEMS,
  );
  for (let k = kFirst; k <= kLast; k++) spans.push(lo / k, upper(k), code(BACKWARD));

  // Locks p/q: still while (p/q)·s lies within D of some speed in [lo, hi].
  for (let q = 1; q <= qMax; q++) {
    const pFirst = Math.max(1, Math.floor(((lo - D) * q) / maxHz));
    const pLast = Math.ceil(((hi + D) * q) / bottom);
    for (let p = pFirst; p <= pLast; p++) {
      if (q > 1 && gcd(p, q) !== 1) continue;
      const from = ((lo - D) * q) / p;
      const to = ((hi + D) * q) / p;
      // A multi-image lock wholly inside its bin's backward-or-unclear span adds no misleading
      // rate (that band's reason then names the backward look); skipping it halves the work.
      const k = Math.round(p / q);
      if (q > 1 && k >= 1 && from > lo / k && to <= upper(k)) continue;
      spans.push(from, to, code(still(q)));
    }
  }
}

function toBands(spans: SpanList, minHz: number, maxHz: number): RateBand[] {
  const order = new Uint32Array(spans.length);
  for (let i = 0; i < order.length; i++) order[i] = i;
  const { from, to, cause } = spans;
  order.sort((a, b) => from[a] - from[b]);

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
    if (start > cursor) bands.push(safeBand(cursor, start));
    const causes = [...codes].sort((a, b) => a - b).map(decode);
    bands.push({ fromHz: start, toHz: end, safe: false, reason: describeCauses(causes), causes });
    cursor = end;
  }
  if (cursor < maxHz || bands.length === 0) bands.push(safeBand(cursor, maxHz));
  return bands;
}

function decode(code: number): RateBandCause {
  const part = Math.floor(code / 1000);
  const kind = code % 1000;
  if (kind === CRAWL) return { part, kind: 'crawl', images: 1 };
  if (kind === BACKWARD) return { part, kind: 'backward', images: 1 };
  return { part, kind: 'still', images: kind - 1 };
}

function safeBand(fromHz: number, toHz: number): RateBand {
  return {
    fromHz,
    toHz,
    safe: true,
    reason: 'Every part shows its true direction of turning.',
    causes: [],
  };
}

const MAX_CAUSES_IN_REASON = 4;

function describeCauses(causes: RateBandCause[]): string {
  const words = causes.slice(0, MAX_CAUSES_IN_REASON).map((c) => {
    const who = `part ${c.part + 1}`;
    if (c.kind === 'crawl') return `${who} turns too slowly to see moving`;
    if (c.kind === 'backward') return `${who} looks backward or its direction is unclear`;
    return c.images === 1 ? `${who} looks still` : `${who} shows ${c.images} images standing still`;
  });
  const more =
    causes.length > MAX_CAUSES_IN_REASON
      ? `; and ${causes.length - MAX_CAUSES_IN_REASON} more`
      : '';
  const text = words.join('; ') + more;
  return text.charAt(0).toUpperCase() + text.slice(1) + '.';
}
