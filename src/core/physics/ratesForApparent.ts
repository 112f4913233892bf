import { InputError, requireFinite } from '../basics/InputError';
import {
  checkPart,
  checkRange,
  checkSampler,
  type Look,
  type Part,
  type Range,
  type Sampler,
} from '../basics/types';
import { apparentMotion } from './apparentMotion';
import { requireWorkable } from '../basics/workLimit';

/**
 * Rates that show the part turning at a wanted signed apparent speed (docs/physics.md §4):
 * s = n·|f − a|/k for k = 1, 2, …, valid while the single-image step |k·a/(f − a)| < 0.5,
 * ascending by rate. Only rates at which apparentMotion, for the sampler's kind (default
 * 'flash'), really shows that motion are kept: one image (under a flash no group of several
 * images stands still or drifts there) with a clear direction, forward when a has the sign of
 * f and backward otherwise. a = 0 gives the single-image lock-in rates; a wanted speed at or
 * below the still threshold gives none (it would look still, not turn); a = f gives none
 * (every rate above 2·n·|f| shows the true speed, see apparentMotion).
 *
 * Units: rev/s for the speed and the apparent speed, Hz for rates.
 * Throws InputError for a bad part or range, a non-finite apparent speed, or an unknown sampler.
 *
 * @example
 * // docs/physics.md §4 worked check: f = 30 rev/s, one mark, creep forward at 0.5 rev/s.
 * ratesForApparent({ speedHz: 30, symmetry: 1 }, 0.5, { minHz: 20, maxHz: 40 })
 * // [{ rateHz: 29.5, k: 1 }]
 *
 * Source: the alias relation n·a = n·f − k·s (any DSP text) solved for s.
 */
export function ratesForApparent(
  part: Part,
  apparentHz: number,
  range: Range,
  opts?: { sampler?: Sampler },
): Array<{ rateHz: number; k: number }> {
  const { speedHz: f, symmetry: n } = checkPart(part);
  const a = requireFinite(apparentHz, 'wanted apparent speed');
  const { minHz, maxHz } = checkRange(range);
  if (opts !== undefined && (typeof opts !== 'object' || opts === null)) {
    throw new InputError('options', 'options must be an object.');
  }
  const sampler = checkSampler(opts?.sampler);
  const gap = Math.abs(f - a);
  if (gap === 0) return [];
  // The look that shows the wanted motion.
  const wanted: Look = a === 0 ? 'still' : Math.sign(a) === Math.sign(f) ? 'forward' : 'backward';

  // s ∈ [min, max] ⇔ k ∈ [n·gap/max, n·gap/min]; step |k·a|/gap < 0.5 ⇔ k < gap/(2|a|).
  const kFirst = Math.max(1, Math.ceil(((n * gap) / maxHz) * (1 - 1e-12)));
  let kLast = Math.floor(((n * gap) / minHz) * (1 + 1e-12));
  if (a !== 0) kLast = Math.min(kLast, Math.ceil(gap / (2 * Math.abs(a))));
  requireWorkable(
    kLast - kFirst + 1,
    'rate range',
    'rates',
    'raise the lowest rate or narrow the range',
  );
  const out: Array<{ rateHz: number; k: number }> = [];
  for (let k = kLast; k >= kFirst; k--) {
    if (Math.abs((k * a) / gap) >= 0.5) continue;
    const rateHz = (n * gap) / k;
    if (rateHz < minHz * (1 - 1e-12) || rateHz > maxHz * (1 + 1e-12)) continue;
    const seen = apparentMotion(part, rateHz, { sampler });
    if (seen.images !== 1 || seen.look !== wanted) continue;
    out.push({ rateHz, k });
  }
  return out;
}
