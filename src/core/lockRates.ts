import { requireWhole } from './InputError';
import { checkPart, checkRange, MAX_IMAGES_LIMIT, type Part, type Range } from './types';
import { gcd } from './gcd';
import { requireWorkable } from './workLimit';

export interface LockRate {
  /** The lock-in rate for the nominal speed, Hz. */
  rateHz: number;
  /** Images seen standing still under a flash: q. */
  images: number;
  /** The lock is r = n·|f|/s = p/q in lowest terms. */
  p: number;
  q: number;
  /** The rate band the lock wanders over for speeds within the tolerance, Hz. */
  lowHz: number;
  highHz: number;
}

/** Slack for deciding that a computed rate equal to a range end lies inside the range. */
const EDGE = 1e-12;

/**
 * Every rate in the range at which the part's pattern locks to p/q (physics.md §3):
 * s = n·|f|·q/p with p ≥ 1, 1 ≤ q ≤ maxImages, gcd(p, q) = 1, ascending by rate.
 * q = 1 are the single-image rates (the highest is s = n·|f|); q ≥ 2 show q images under a flash.
 * Each lock's tolerance band is [n|f|(1−u)·q/p, n|f|(1+u)·q/p]. A part that is not turning
 * has no lock-in rates (it looks still at every rate, and truly is).
 *
 * Units: rev/s for the speed, Hz for rates. Throws InputError for a bad part, an empty,
 * inverted or non-positive range, maxImages not a whole number in 1…64, or a range holding
 * more than MAX_WORK_ITEMS locks.
 *
 * @example
 * // Wikipedia, "Stroboscopic effect": a 12-spoke wheel at 2 rev/s looks still at 24 frames/s.
 * lockRates({ speedHz: 2, symmetry: 12 }, { minHz: 20, maxHz: 30 }, { maxImages: 1 })
 * // [{ rateHz: 24, images: 1, p: 1, q: 1, lowHz: 24, highHz: 24 }]
 */
export function lockRates(part: Part, range: Range, opts?: { maxImages?: number }): LockRate[] {
  const { speedHz, symmetry, tolerance } = checkPart(part);
  const { minHz, maxHz } = checkRange(range);
  const maxImages = requireWhole(opts?.maxImages ?? 8, 'largest image count', 1, MAX_IMAGES_LIMIT);
  const patternHz = symmetry * Math.abs(speedHz);
  if (patternHz === 0) return [];

  const lo = minHz * (1 - EDGE);
  const hi = maxHz * (1 + EDGE);
  // For each image count q the rates F·q/p rise as p falls; merging the maxImages streams
  // (smallest head first) yields ascending order without a sort.
  const nextP = new Int32Array(maxImages + 1);
  const firstP = new Int32Array(maxImages + 1);
  const head = new Float64Array(maxImages + 1); // rate at nextP[q], Infinity when exhausted
  let count = 0;
  for (let q = 1; q <= maxImages; q++) {
    firstP[q] = Math.max(1, Math.ceil((patternHz * q) / hi)); // s = F·q/p ≤ hi
    const last = Math.floor((patternHz * q) / lo); // s ≥ lo
    count += Math.max(0, last - firstP[q] + 1);
    requireWorkable(
      count,
      'rate range',
      'lock-in rates',
      'raise the lowest rate or narrow the range',
    );
    nextP[q] = last + 1;
    head[q] = nextHead(q);
  }
  const out: LockRate[] = [];
  for (;;) {
    let q = 0;
    let rateHz = Infinity;
    for (let qq = 1; qq <= maxImages; qq++) {
      if (head[qq] < rateHz) {
        rateHz = head[qq];
        q = qq;
      }
    }
    if (q === 0) break;
    const p = nextP[q];
    head[q] = nextHead(q);
    if (rateHz < lo || rateHz > hi) continue;
    out.push({
      rateHz,
      images: q,
      p,
      q,
      lowHz: rateHz * (1 - tolerance),
      highHz: rateHz * (1 + tolerance),
    });
  }
  return out;

  /** Steps stream q to its next p coprime to q; returns that lock's rate, or Infinity when done. */
  function nextHead(q: number): number {
    let p = nextP[q] - 1;
    while (p >= firstP[q] && q > 1 && gcd(p, q) !== 1) p--;
    nextP[q] = p;
    return p >= firstP[q] ? (patternHz * q) / p : Infinity;
  }
}
