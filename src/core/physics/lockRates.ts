import {
  InputError,
  requireFiniteResult,
  requireNonNegative,
  requirePositive,
  requireWhole,
} from '../basics/InputError';
import { checkPart, checkRange, MAX_IMAGES_LIMIT, type Part, type Range } from '../basics/types';
import { gcd } from '../basics/gcd';
import { requireWorkable } from '../basics/workLimit';

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
 * Every rate in the range at which the part's pattern locks to p/q (docs/physics.md §3):
 * s = n·|f|·q/p with p ≥ 1, 1 ≤ q ≤ maxImages, gcd(p, q) = 1, ascending by rate.
 * q = 1 are the single-image rates (the highest is s = n·|f|); q ≥ 2 show q images under a flash.
 * Each lock's tolerance band is [n|f|(1−u)·q/p, n|f|(1+u)·q/p]. A part that is not turning
 * has no lock-in rates (it looks still at every rate, and truly is).
 *
 * Units: rev/s for the speed, Hz for rates. Throws InputError for a bad part, an empty,
 * inverted or non-positive range, maxImages not a whole number in 1…64, a range holding
 * more than MAX_WORK_ITEMS locks (counted exactly: only p coprime to q), or one so far below
 * the pattern rate that p passes 2^53 and can no longer be counted exactly.
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
  // (smallest head first) yields ascending order without a sort. p lives in plain arrays, not a
  // 32-bit typed array: small p stay fast integers, large ones exact doubles up to 2^53.
  const nextP: number[] = new Array<number>(maxImages + 1).fill(0);
  const firstP: number[] = new Array<number>(maxImages + 1).fill(0);
  const head = new Float64Array(maxImages + 1); // rate at nextP[q], Infinity when exhausted
  let count = 0;
  for (let q = 1; q <= maxImages; q++) {
    firstP[q] = Math.max(1, Math.ceil((patternHz * q) / hi)); // s = F·q/p ≤ hi
    const last = Math.floor((patternHz * q) / lo); // s ≥ lo
    if (!(last <= Number.MAX_SAFE_INTEGER)) {
      throw new InputError(
        'rate range',
        'The lowest rate is so far below the pattern rate that the lock-in rates cannot be ' +
          'counted exactly: raise the lowest rate.',
      );
    }
    count += coprimeCount(firstP[q], last, q);
    nextP[q] = last + 1;
  }
  // The whole count first, so that a refusal gives it right.
  requireWorkable(
    count,
    'rate range',
    'lock-in rates',
    'raise the lowest rate or narrow the range',
  );
  for (let q = 1; q <= maxImages; q++) head[q] = nextHead(q);
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

/**
 * How many lock-in rates with up to `maxImages` images at most lie in `range`, for a pattern
 * rate n·|f| anywhere from lowHz to highHz (a part within its tolerance): for each image count
 * q the locks s = n·|f|·q/p in [min, max] number about q·(highHz/min − lowHz/max), so all
 * image counts together (highHz/min − lowHz/max)·q(q + 1)/2. The one estimate of the work a
 * list of locks, still spans or bands costs, made before the work starts (lockRates itself
 * counts exactly). A range open at the top (maxHz = Infinity) counts from its bottom up.
 * Units: Hz. Throws InputError for a pattern rate that is not a number ≥ 0 with low ≤ high, a
 * lowest rate that is not above zero, a highest rate below the lowest, an image count that is
 * not a whole number in 1…64, or a count too large to be a number.
 * @example lockCountBound({ lowHz: 178, highHz: 178 }, { minHz: 1, maxHz: 10_000 }, 8) // 6407.36 (a 6-blade fan at 1780 rpm)
 */
export function lockCountBound(
  pattern: { lowHz: number; highHz: number },
  range: Range,
  maxImages: number,
): number {
  const lowHz = requireNonNegative(pattern?.lowHz, 'lowest pattern rate');
  const highHz = requireNonNegative(pattern?.highHz, 'highest pattern rate');
  const minHz = requirePositive(range?.minHz, 'lowest rate');
  const maxHz =
    range?.maxHz === Infinity ? Infinity : requirePositive(range?.maxHz, 'highest rate');
  if (!(lowHz <= highHz && minHz <= maxHz)) {
    throw new InputError(
      'rate range',
      'The pattern rates and the rate range run from low to high.',
    );
  }
  const q = requireWhole(maxImages, 'largest image count', 1, MAX_IMAGES_LIMIT);
  return requireFiniteResult(
    Math.max(0, highHz / minHz - lowHz / maxHz) * ((q * (q + 1)) / 2),
    'rate range',
  );
}

/**
 * How many whole numbers in [a, b] have no factor in common with q (inclusion–exclusion over
 * the prime factors of q): the locks p/q in lowest terms with p in that span.
 * @example coprimeCount(1, 10, 6) // 3 (1, 5, 7)
 */
export function coprimeCount(a: number, b: number, q: number): number {
  if (b < a) return 0;
  const primes: number[] = [];
  let rest = q;
  for (let d = 2; d * d <= rest; d++) {
    if (rest % d === 0) {
      primes.push(d);
      while (rest % d === 0) rest /= d;
    }
  }
  if (rest > 1) primes.push(rest);
  let total = 0;
  // Every product of distinct primes of q, with the sign of inclusion–exclusion.
  for (let mask = 0; mask < 1 << primes.length; mask++) {
    let d = 1;
    let sign = 1;
    for (let i = 0; i < primes.length; i++) {
      if (mask & (1 << i)) {
        d *= primes[i];
        sign = -sign;
      }
    }
    total += sign * (Math.floor(b / d) - Math.floor((a - 1) / d));
  }
  return total;
}
