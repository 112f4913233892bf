import {
  InputError,
  requireBetween,
  requireNonNegative,
  requirePositive,
  requireWhole,
} from '../basics/InputError';
import { apparentMotion } from '../physics/apparentMotion';
import { checkRange, MAX_SYMMETRY, type Look, type Range } from '../basics/types';
import {
  CLEAR_SHARE,
  TIED_SHARE,
  type SoundConfidence,
  type SoundSpeedCandidate,
} from './speedsFromSound';

export interface SoundStrobeOptions {
  /** Features of the part (blades, teeth): the n both methods use. */
  symmetry: number;
  /** The strobe's range, Hz: the next rate is chosen inside it. */
  rateRange?: Range;
  /**
   * Relative slack of a strobe candidate (how far from the still point a reading may have
   * been taken). Default 0.003, the strobe speed finder's own match tolerance.
   */
  strobeTolerance?: number;
}

/** A speed that both the sound and the strobe readings allow. */
export interface SoundStrobeMatch {
  /** The sound's value, rev/s (the more precise of the two), and its precision, ± rev/s. */
  speedHz: number;
  precisionHz: number;
  /** The strobe candidate it agrees with, rev/s. */
  strobeSpeedHz: number;
  soundConfidence: SoundConfidence;
}

/** What a candidate speed would show at the proposed rate (apparentMotion, under a flash). */
export interface StrobeView {
  speedHz: number;
  images: number;
  look: Look;
}

export interface SoundStrobeJoin {
  /**
   * 'sound-only': no strobe readings yet; 'one': exactly one speed agrees with both;
   * 'several': more than one does; 'disagree': none does (a reading, or the sound, is of
   * something else); 'no-sound': the sound gave no speed.
   */
  status: 'sound-only' | 'one' | 'several' | 'disagree' | 'no-sound';
  /** The speed to take, rev/s: the one both agree on, or the sound's leader when no other speed scored 90 % of it. */
  speedHz?: number;
  precisionHz?: number;
  /** Speeds both allow, the sound's ranking first. */
  matches: SoundStrobeMatch[];
  /** The flash rate to try next, Hz, and why: to confirm one speed, or to tell several apart. */
  nextRateHz?: number;
  nextPurpose?: 'confirm' | 'separate';
  /** What the speed to confirm (first) and each other speed still open would show at nextRateHz. */
  views?: StrobeView[];
}

/** Default slack of a strobe candidate: the strobe speed finder's match tolerance. */
const STROBE_TOLERANCE = 0.003;

/**
 * Joins a sound estimate with the strobe's candidates. A frozen single image at rate F only
 * says n·f = k·F for some whole k (docs/physics.md §7): the strobe's candidates are spaced by whole
 * multiples. The sound gives f to a fraction of a per cent but can mistake a subharmonic for
 * the speed; the two together leave the speeds both allow (within twice the sound's precision
 * plus the strobe's slack).
 *
 * One speed stands when no other speed both allow scored 60 % of it by sound (the threshold
 * of a 'clear' sound leader); otherwise several stay open.
 *
 * Then the next rate: the speed to confirm is the best-ranked speed both allow (or the sound's
 * leader); the others still open are the other matches (for one speed: every other strobe
 * candidate), or, with no readings yet, the sound's candidates that scored 60 % of its leader. Tried in order: s = n·f (one image standing still: the plain confirmation),
 * 2·n·f (two images), n·f/2 (one image), 3·n·f (three images), n·f/3; the first, inside the
 * strobe's range, where apparentMotion shows the speed to confirm differently from every other
 * speed still open. (At n·f a speed 2f also shows one still image, so n·f confirms alone but
 * does not separate f from 2f; 2·n·f does.) When none separates all, the one that separates
 * most.
 *
 * Throws InputError for a bad symmetry, a strobe candidate that is not a speed > 0, an empty
 * or inverted strobe range, or a tolerance outside 0…0.1.
 *
 * @example
 * // A 6-blade fan heard at 29.17 rev/s (1750 rpm); one image at 58.33 flashes/s allows 9.72,
 * // 19.44, 29.17, 38.89… rev/s; only 29.17 agrees. Proposed: 350 flashes/s, two images still
 * // (at 175 a speed of 58.33 rev/s would show one image too).
 * joinSoundWithStrobe(sound.candidates, findSpeed([{ rateHz: 58.33, images: 1 }], 6).candidates, { symmetry: 6 })
 */
export function joinSoundWithStrobe(
  sound: readonly SoundSpeedCandidate[],
  strobe: ReadonlyArray<{ speedHz: number }> | undefined,
  opts: SoundStrobeOptions,
): SoundStrobeJoin {
  if (!Array.isArray(sound)) {
    throw new InputError('sound', 'The sound estimate is missing: analyse a recording first.');
  }
  if (typeof opts !== 'object' || opts === null) {
    throw new InputError('options', 'Say how many features (blades, teeth) the part has.');
  }
  const n = requireWhole(opts.symmetry, 'features (blades, teeth)', 1, MAX_SYMMETRY);
  const rateRange =
    opts.rateRange === undefined ? undefined : checkRange(opts.rateRange, 'strobe range');
  const tol = requireBetween(opts.strobeTolerance ?? STROBE_TOLERANCE, 'strobe tolerance', 0, 0.1);
  const heard = sound.map((c, i) => ({
    ...c,
    speedHz: requirePositive(c?.speedHz, `speed of sound candidate ${i + 1}`),
    precisionHz: requireNonNegative(c?.precisionHz, `precision of sound candidate ${i + 1}`),
  }));
  if (strobe !== undefined && !Array.isArray(strobe)) {
    throw new InputError('strobe', 'The strobe candidates must be a list (or left out).');
  }
  const seen = (strobe ?? []).map((c, i) =>
    requirePositive(c?.speedHz, `speed of strobe candidate ${i + 1}`),
  );

  if (heard.length === 0) return { status: 'no-sound', matches: [] };
  if (seen.length === 0) {
    // Open besides the leader: the speeds that keep it from being clear (60 % of its score).
    const [lead, ...rest] = heard;
    const open = rest.filter((c) => c.score >= CLEAR_SHARE * lead.score).map((c) => c.speedHz);
    const settled = !rest.some((c) => c.score >= TIED_SHARE * lead.score);
    return {
      status: 'sound-only',
      ...(settled ? { speedHz: lead.speedHz, precisionHz: lead.precisionHz } : {}),
      matches: [],
      ...nextRate(lead.speedHz, open, n, rateRange, settled),
    };
  }

  const paired: Array<{ match: SoundStrobeMatch; score: number }> = [];
  for (const c of heard) {
    for (const s of seen) {
      if (Math.abs(s - c.speedHz) <= 2 * c.precisionHz + tol * s) {
        paired.push({
          match: {
            speedHz: c.speedHz,
            precisionHz: c.precisionHz,
            strobeSpeedHz: s,
            soundConfidence: c.confidence,
          },
          score: c.score,
        });
      }
    }
  }
  if (paired.length === 0) {
    // Nothing agrees: confirm the sound's leader directly, apart from every strobe candidate.
    return {
      status: 'disagree',
      matches: [],
      ...nextRate(heard[0].speedHz, seen, n, rateRange, false),
    };
  }
  paired.sort((a, b) => b.score - a.score);
  const matches = paired.map((p) => p.match);
  const [lead, ...others] = matches;
  // One speed when no other that both allow scored 60 % of it by sound.
  if (others.length === 0 || paired[1].score < CLEAR_SHARE * paired[0].score) {
    // Confirm it, and make sure the other strobe candidates would look different there.
    return {
      status: 'one',
      speedHz: lead.speedHz,
      precisionHz: lead.precisionHz,
      matches,
      ...nextRate(
        lead.speedHz,
        seen.filter((s) => s !== lead.strobeSpeedHz),
        n,
        rateRange,
        true,
      ),
    };
  }
  return {
    status: 'several',
    matches,
    ...nextRate(
      lead.speedHz,
      others.map((m) => m.speedHz),
      n,
      rateRange,
      false,
    ),
  };
}

/** Candidates compared when choosing a rate: more would not change which rate a person tries. */
const COMPARED = 12;

/**
 * The rate that shows `speedHz` apart from every other speed still open (see above). Its
 * purpose is 'confirm' when `settled` (one speed stands, the others are only checked against),
 * 'separate' otherwise.
 */
function nextRate(
  speedHz: number,
  open: number[],
  n: number,
  rateRange: Range | undefined,
  settled: boolean,
): Pick<SoundStrobeJoin, 'nextRateHz' | 'nextPurpose' | 'views'> {
  const purpose = settled ? 'confirm' : 'separate';
  const others = open.slice(0, COMPARED);
  const G = n * speedHz;
  const inRange = (s: number) => !rateRange || (s >= rateRange.minHz && s <= rateRange.maxHz);
  const view = (f: number, rateHz: number): StrobeView => {
    const m = apparentMotion({ speedHz: f, symmetry: n }, rateHz);
    return { speedHz: f, images: m.images, look: m.look };
  };
  const key = (v: StrobeView) => `${v.look}:${v.images}`;
  let best: { rateHz: number; views: StrobeView[]; split: number } | undefined;
  for (const rateHz of [G, 2 * G, G / 2, 3 * G, G / 3]) {
    if (!inRange(rateHz)) continue;
    const views = [speedHz, ...others].map((f) => view(f, rateHz));
    const lead = key(views[0]);
    const split = views.slice(1).filter((v) => key(v) !== lead).length;
    if (split === others.length) {
      return { nextRateHz: rateHz, nextPurpose: purpose, views };
    }
    if (!best || split > best.split) best = { rateHz, views, split };
  }
  return best ? { nextRateHz: best.rateHz, nextPurpose: purpose, views: best.views } : {};
}
