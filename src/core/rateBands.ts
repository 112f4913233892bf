import { InputError } from './InputError';
import { checkPart, checkRange, checkSampler, type Part, type Range, type Sampler } from './types';
import { checkLookOptions, type LookOptions } from './lookOptions';
import { gcd } from './gcd';

export interface RateBandCause {
  /** Index of the part in the list given. */
  part: number;
  /** 'still': q images stand still; 'backward': turns backward or direction unclear; 'crawl': turns too slowly to see at all. */
  kind: 'still' | 'backward' | 'crawl';
  /** Image count for 'still'. */
  images: number;
}

export interface RateBand {
  fromHz: number;
  toHz: number;
  safe: boolean;
  reason: string;
  /** For a misleading band: which parts mislead and how (distinct, in part order). */
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

  const spans: Span[] = [];
  checked.forEach((part, index) => misleadingSpans(part, index, minHz, maxHz, sampler, look, spans));
  spans.sort((a, b) => a.from - b.from);
  return toBands(spans, minHz, maxHz);
}

interface Span {
  from: number;
  to: number;
  cause: RateBandCause;
}

function misleadingSpans(
  part: Required<Part>,
  index: number,
  minHz: number,
  maxHz: number,
  sampler: Sampler,
  look: LookOptions,
  out: Span[],
): void {
  const F = part.symmetry * Math.abs(part.speedHz);
  if (F === 0) return;
  const lo = F * (1 - part.tolerance);
  const hi = F * (1 + part.tolerance);
  const D = part.symmetry * look.stillHz;
  const push = (from: number, to: number, cause: RateBandCause) => {
    const a = Math.max(from, minHz);
    const b = Math.min(to, maxHz);
    if (a < b || (a === b && from <= a && a <= to)) out.push({ from: a, to: b, cause });
  };

  if (lo < D) {
    push(minHz, maxHz, { part: index, kind: 'crawl', images: 1 });
    return;
  }

  // Locks p/q: still while (p/q)·s lies within D of some speed in [lo, hi].
  const qMax = sampler === 'flash' ? look.maxImages : 1;
  for (let q = 1; q <= qMax; q++) {
    const pFirst = Math.max(1, Math.floor(((lo - D) * q) / maxHz));
    const pLast = Math.ceil(((hi + D) * q) / minHz);
    for (let p = pFirst; p <= pLast; p++) {
      if (q > 1 && gcd(p, q) !== 1) continue;
      push(((lo - D) * q) / p, ((hi + D) * q) / p, { part: index, kind: 'still', images: q });
    }
  }

  // Single-image backward or unclear, bin k = round(n·f/s) ≥ 1.
  const kFirst = Math.max(1, Math.floor(lo / maxHz));
  const kLast = Math.ceil(hi / minHz + 1);
  for (let k = kFirst; k <= kLast; k++) {
    const c = k === 1 ? 0.5 : k - 1 + look.unclearStep;
    push(lo / k, hi / c, { part: index, kind: 'backward', images: 1 });
  }
}

function toBands(spans: Span[], minHz: number, maxHz: number): RateBand[] {
  const bands: RateBand[] = [];
  let cursor = minHz;
  let i = 0;
  while (i < spans.length) {
    const from = spans[i].from;
    let to = spans[i].to;
    const causes: RateBandCause[] = [];
    while (i < spans.length && spans[i].from <= to) {
      to = Math.max(to, spans[i].to);
      addCause(causes, spans[i].cause);
      i++;
    }
    if (from > cursor) bands.push(safeBand(cursor, from));
    causes.sort((a, b) => a.part - b.part || a.images - b.images);
    bands.push({ fromHz: from, toHz: to, safe: false, reason: describeCauses(causes), causes });
    cursor = to;
  }
  if (cursor < maxHz || bands.length === 0) bands.push(safeBand(cursor, maxHz));
  return bands;
}

function safeBand(fromHz: number, toHz: number): RateBand {
  return { fromHz, toHz, safe: true, reason: 'Every part shows its true direction of turning.', causes: [] };
}

function addCause(causes: RateBandCause[], c: RateBandCause): void {
  if (!causes.some((x) => x.part === c.part && x.kind === c.kind && x.images === c.images)) causes.push(c);
}

const MAX_CAUSES_IN_REASON = 4;

function describeCauses(causes: RateBandCause[]): string {
  const words = causes.slice(0, MAX_CAUSES_IN_REASON).map((c) => {
    const who = `part ${c.part + 1}`;
    if (c.kind === 'crawl') return `${who} turns too slowly to see moving`;
    if (c.kind === 'backward') return `${who} looks backward or its direction is unclear`;
    return c.images === 1 ? `${who} looks still` : `${who} shows ${c.images} images standing still`;
  });
  const more = causes.length > MAX_CAUSES_IN_REASON ? `; and ${causes.length - MAX_CAUSES_IN_REASON} more` : '';
  const text = words.join('; ') + more;
  return text.charAt(0).toUpperCase() + text.slice(1) + '.';
}
