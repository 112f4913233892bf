// The check screen's verdict: what the viewer reads of the part, and how far to trust it, as
// codes and numbers (src/words/check.ts says it in words).
import type { ApparentMotion, Look, Part } from '../../core';

/** What the viewer reads, as the check screen's headline sorts it. */
export type VerdictKind =
  'true' | 'steady' | 'creeping' | 'forward' | 'backward' | 'still' | 'images' | 'unclear';

/** How far the viewer can trust what they see. */
export type Trust = 'trust' | 'caution' | 'danger';

export interface Verdict {
  kind: VerdictKind;
  /** The core's look at the nominal speed ('still' for a group of images standing still). */
  look: Look;
  trust: Trust;
  /** Images seen at once (1 for a single image). */
  images: number;
  /** Speed the viewer sees, rpm, signed like the true speed (+ = forward). */
  apparentRpm: number;
  trueRpm: number;
}

/** Apparent speeds up to this are a creep an inspector can follow, rpm (a judgement). */
export const CREEP_LIMIT_RPM = 60;

/**
 * The verdict from the core's reading of the part (docs/physics.md §2–3). Several images that
 * creep as a group read as images: the eye follows the group, so its drift sets the direction
 * seen, whatever the single-image step says (§3). Superimposed images never show the true
 * motion, so they are always to be distrusted.
 */
export function verdictOf(
  motion: ApparentMotion,
  part: Required<Part>,
  steadyLight = false,
): Verdict {
  const trueRpm = part.speedHz * 60;
  if (steadyLight) {
    return {
      kind: 'steady',
      look: 'true',
      trust: 'trust',
      images: 1,
      apparentRpm: trueRpm,
      trueRpm,
    };
  }
  const images = motion.images;
  const apparentRpm = (images > 1 ? motion.driftHz : motion.apparentHz) * 60;
  const base = { look: motion.look, images, apparentRpm, trueRpm };
  if (images > 1) return { ...base, kind: 'images', trust: 'danger' };
  switch (motion.look) {
    case 'true':
      return { ...base, kind: 'true', trust: 'trust' };
    case 'forward': {
      const creeping = Math.abs(apparentRpm) <= CREEP_LIMIT_RPM;
      return { ...base, kind: creeping ? 'creeping' : 'forward', trust: 'caution' };
    }
    default:
      return { ...base, kind: motion.look, trust: 'danger' };
  }
}

/**
 * An aliased view (docs/physics.md §4): every view that is not the true motion with one image.
 * A sampler below the pattern's Nyquist rate (not faithful) always aliases; above it, several
 * superimposed images (one mark at 10 rev/s under 30.5 flashes/s shows three) are not the true
 * motion either.
 */
export function isAliased(motion: ApparentMotion): boolean {
  return !motion.faithful || motion.images > 1 || motion.look !== 'true';
}
