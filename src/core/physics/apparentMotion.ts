import { requireFiniteResult, requirePositive } from '../basics/InputError';
import { checkPart, checkSampler, type Look, type Part, type Sampler } from '../basics/types';
import { checkLookOptions, THRESHOLD_SLACK, type LookOptions } from './lookOptions';
import { gcd } from '../basics/gcd';

export interface ApparentMotion {
  /** n·f/s: pattern pitches travelled between two samples. */
  ratio: number;
  /** Perceived step per sample in pitches, in [-0.5, 0.5]: ratio − round(ratio). */
  step: number;
  /** Signed apparent speed, rev/s, from the single-image step (same sign as the speed = forward). */
  apparentHz: number;
  /** s > 2·n·|f|: the sampler is above the pattern's Nyquist rate and shows the true speed. */
  faithful: boolean;
  /** Image count q seen at once: > 1 only under a flash locked or near-locked to p/q. */
  images: number;
  /** What the viewer reads (docs/physics.md §2 precedence). */
  look: Look;
  /** Lowest-terms p/q of the lock or near-lock found (q = 1 otherwise, p = round(ratio)). */
  p: number;
  q: number;
  /** Signed drift of the q-image group, rev/s (equals apparentHz when q = 1). */
  driftHz: number;
  /**
   * An aliased view (look other than 'true') whose speed seen (the group's drift when
   * several images show, else the single image's apparent speed) is below the nearly-still
   * threshold (docs/physics.md §4; default 6 rpm). Still views are nearly still too. To a person
   * at the machine it is as dangerous as still.
   */
  nearlyStill: boolean;
}

export type ApparentMotionOptions = Partial<LookOptions> & { sampler?: Sampler };

/**
 * What a sampler at `rateHz` shows of a turning part (docs/physics.md §2–§3).
 *
 * ratio r = n·f/s; step e = r − round(r) in [−0.5, 0.5]; apparent speed a = e·s/n rev/s.
 * Precedence: among the groups of q ≤ maxImages images (p/q in lowest terms; under 'frames'
 * only q = 1) whose drift |r − p/q|·s/n is at or below the still threshold, the one with the
 * smallest drift reads 'still' with q images (ties go to the smaller q; an exact lock drifts 0
 * and so reports its own q); otherwise a faithful sampler (s > 2·n·|f|, Nyquist–Shannon) reads
 * 'true'; otherwise |e| ≥ unclearStep reads 'unclear', and the sign of e against the sign of f
 * reads 'forward' or 'backward'. Thresholds are inclusive, with a relative slack of
 * THRESHOLD_SLACK so that decimal inputs land where they were meant.
 *
 * Units: speedHz in rev/s (signed), rateHz in Hz (samples per second).
 * Throws InputError for a non-finite speed, a feature count that is not a whole number ≥ 1,
 * a rate ≤ 0 or non-finite, an unknown sampler, or bad look options.
 *
 * @example
 * // Wikipedia, "Stroboscopic effect": a disc at 60 rev/s under 61 flashes/s turns back at 1 rev/s.
 * apparentMotion({ speedHz: 60, symmetry: 1 }, 61).apparentHz // -1.000000000000001 (1 rev/s backward, to rounding)
 *
 * Sources: Shannon 1949 (sampling theorem); the alias relation n·f − s·round(n·f/s) of any DSP text.
 */
export function apparentMotion(
  part: Part,
  rateHz: number,
  opts?: ApparentMotionOptions,
): ApparentMotion {
  const { speedHz: f, symmetry: n } = checkPart(part);
  const s = requirePositive(rateHz, 'rate');
  const sampler = checkSampler(opts?.sampler);
  const o = checkLookOptions(opts);

  const ratio = requireFiniteResult((n * f) / s, 'rate');
  const k = Math.round(ratio);
  const step = clampHalf(ratio - k);
  const apparentHz = (step * s) / n;
  const faithful = Math.abs(ratio) < 0.5;
  const patternHz = n * f;
  // Below this, a speed seen is nearly still (never below the still threshold itself).
  const nearlyStillHz = Math.max(o.nearlyStillHz, o.stillHz);
  const nearlyStillBelow = nearlyStillHz - THRESHOLD_SLACK * (Math.abs(f) + nearlyStillHz);

  // Lock test (§3): of the q whose group drifts at or below the still threshold, the smallest
  // drift. |r − p/q|·s/n ≤ stillHz  ⇔  |n·f − (p/q)·s| ≤ n·stillHz (pattern-frequency form).
  // A fraction p/q not in lowest terms is the same group as its reduced form: skipped, so that
  // rounding cannot let 3p/3q beat p/q by one unit in the last place.
  const lockQ = sampler === 'flash' ? o.maxImages : 1;
  const stillPatternHz = n * o.stillHz;
  const stillUpTo = stillPatternHz + THRESHOLD_SLACK * (Math.abs(patternHz) + stillPatternHz);
  let lockQFound = 0;
  let lockP = 0;
  let lockDrift = Infinity;
  for (let q = 1; q <= lockQ; q++) {
    const p = Math.round(ratio * q);
    const driftPatternHz = patternHz - (p * s) / q;
    const size = Math.abs(driftPatternHz);
    if (size <= stillUpTo && size < Math.abs(lockDrift) && (q === 1 || gcd(Math.abs(p), q) === 1)) {
      lockQFound = q;
      lockP = p;
      lockDrift = driftPatternHz;
    }
  }
  if (lockQFound > 0) {
    return {
      ratio,
      step,
      apparentHz,
      faithful,
      images: lockQFound,
      look: 'still',
      p: Math.abs(lockP),
      q: lockQFound,
      driftHz: lockDrift / n,
      nearlyStill: true,
    };
  }

  // Near-lock under a flash: the smallest q ≥ 2 whose group creeps by less than
  // groupSpacingsPerS of its own spacing (1/(n·q) rev) per second is seen as q images.
  // This holds above the Nyquist rate too (one mark at 10 rev/s under 30.5 flashes/s shows
  // three marks creeping); the look still follows §2's precedence.
  let images = 1;
  let p = Math.abs(k);
  let q = 1;
  let driftHz = apparentHz;
  if (sampler === 'flash') {
    for (let qq = 2; qq <= o.maxImages; qq++) {
      const pp = Math.round(ratio * qq);
      const drift = (n * f - (pp * s) / qq) / n;
      if (Math.abs(drift) * n * qq < o.groupSpacingsPerS && gcd(Math.abs(pp), qq) === 1) {
        images = qq;
        p = Math.abs(pp);
        q = qq;
        driftHz = drift;
        break;
      }
    }
  }
  // A step of exactly unclearStep from decimal inputs (29 rev/s at 20 frames/s: 1.45 − 1 = 0.45)
  // can land a hair below it in binary; allow for the rounding of the ratio itself.
  const unclearFrom = o.unclearStep - 4 * Number.EPSILON * Math.max(1, Math.abs(ratio));
  const look: Look = faithful
    ? 'true'
    : Math.abs(step) >= unclearFrom
      ? 'unclear'
      : Math.sign(step) === Math.sign(f)
        ? 'forward'
        : 'backward';
  const nearlyStill = look !== 'true' && Math.abs(driftHz) < nearlyStillBelow;
  return { ratio, step, apparentHz, faithful, images, look, p, q, driftHz, nearlyStill };
}

/** Rounding can leave ratio − round(ratio) a hair outside [−0.5, 0.5]; keep the documented range. */
function clampHalf(e: number): number {
  return e > 0.5 ? 0.5 : e < -0.5 ? -0.5 : e;
}
