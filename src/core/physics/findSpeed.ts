import { InputError, requirePositive, requireWhole, requireBetween } from '../basics/InputError';
import { checkRange, MAX_IMAGES_LIMIT, MAX_SYMMETRY, type Look, type Range } from '../basics/types';
import { apparentMotion } from './apparentMotion';
import { gcd } from '../basics/gcd';
import { mostTellingRate } from './tellingRate';
import { requireWorkable } from '../basics/workLimit';

/** A strobe reading: at rateHz the technician saw `images` images standing still. */
export interface StrobeReading {
  rateHz: number;
  images: number;
}

export interface SpeedCandidate {
  /** A speed (rev/s, ≥ 0: a strobe cannot tell direction) that explains every reading. */
  speedHz: number;
  /** Inside the expected range, when one was given. */
  expected: boolean;
  /** Largest relative disagreement between the readings for this speed. */
  misfit: number;
  /** For each reading, the lock p/q it implies (n·f/rate = p/q). */
  locks: Array<{ p: number; q: number }>;
}

export interface Prediction {
  speedHz: number;
  images: number;
  look: Look;
}

export interface SpeedFinding {
  /** Consistent speeds, likeliest first. Empty when the readings contradict each other. */
  candidates: SpeedCandidate[];
  /** The next flash rate to try, Hz. */
  nextRateHz?: number;
  /** 'separate': the top candidates look different there; 'confirm': one candidate left, check it. */
  nextPurpose?: 'separate' | 'confirm';
  /** What each of the leading candidates would show at nextRateHz. */
  predictions?: Prediction[];
}

export interface FindSpeedOptions {
  /** Relative slack between a reading and a lock (reading error, speed drift). Default 0.003. */
  matchTolerance?: number;
  /** Without an expected range, candidates go up to this multiple of the highest reading. Default 8. */
  maxMultiple?: number;
  /**
   * The strobe's own range: the next rate is searched over all of it. Default: from a third of
   * the slowest compared candidate's pattern rate to three times the fastest one's.
   */
  rateRange?: Range;
  /** false: leave the next rate out (a caller that chooses its own). Default true. */
  proposeNext?: boolean;
}

/**
 * Keeps the list readable: nobody tests more than a few dozen hypotheses at a machine. Speeds
 * inside an expected range are never dropped for it; this caps only those outside.
 */
const MAX_CANDIDATES = 40;
/** Candidates compared when choosing the next rate. */
const COMPARED = 8;
/**
 * Most possible speeds tested inside an expected range, every one returned: beyond this the
 * range is far too wide for the readings to settle anything at a machine (a judgement).
 */
const MAX_EXPECTED_TESTS = 10_000;

/**
 * The true speeds consistent with a set of strobe readings (docs/physics.md §7). A reading of q
 * images standing still at rate F means n·f = (p/q)·F for some whole p ≥ 1 with gcd(p, q) = 1.
 * Every speed satisfying all readings (within matchTolerance) is returned, ranked: inside the
 * expected range first, then slowest first: coming down from high rates, the first single
 * image is at n·f, so a faster candidate means a higher lock was passed unseen. Two adjacent
 * single-image rates F1 > F2 give n·f = F1·F2/(F1 − F2).
 * With an expected range, every speed inside it is enumerated directly (p from
 * ⌈q·n·min/F⌉ to ⌊q·n·max/F⌋ for the base reading F with q images) and all of them are
 * returned; speeds outside it follow, up to MAX_CANDIDATES in all.
 * The next rate is searched over the strobe's whole range (mostTellingRate): the rate whose
 * predicted views tell the leading candidate from every other, else the most pairs apart; with
 * one candidate left, twice its single-image rate confirms it (two images if it is right).
 * No next rate when no rate in the range tells any two candidates apart.
 *
 * Units: rates in Hz, speeds in rev/s. Throws InputError for no readings, a rate ≤ 0, an image
 * count not a whole number in 1…64, a bad symmetry, an empty or inverted expected range, or an
 * expected range holding more possible speeds than can be listed.
 *
 * @example
 * // Single images at 30 and 20 flashes/s, one mark: 30·20/(30 − 20) = 60 rev/s.
 * findSpeed([{ rateHz: 30, images: 1 }, { rateHz: 20, images: 1 }], 1).candidates[0].speedHz // 60
 */
export function findSpeed(
  observations: StrobeReading[],
  symmetry: number,
  expect?: Range,
  opts?: FindSpeedOptions,
): SpeedFinding {
  if (!Array.isArray(observations) || observations.length === 0) {
    throw new InputError(
      'readings',
      'Add at least one reading: a flash rate and the number of images that stood still.',
    );
  }
  const readings = observations.map((o, i) => ({
    rateHz: requirePositive(o?.rateHz, `rate of reading ${i + 1}`),
    images: requireWhole(o?.images, `images in reading ${i + 1}`, 1, MAX_IMAGES_LIMIT),
  }));
  const n = requireWhole(symmetry, 'features (blades, spokes)', 1, MAX_SYMMETRY);
  const expected = expect === undefined ? undefined : checkRange(expect, 'expected speed range');
  const tol = requireBetween(opts?.matchTolerance ?? 0.003, 'match tolerance', 0, 0.1);
  const maxMultiple = requireWhole(opts?.maxMultiple ?? 8, 'largest multiple', 1, 1000);
  const rateRange =
    opts?.rateRange === undefined ? undefined : checkRange(opts.rateRange, 'strobe range');

  // Candidates come from the reading with the widest lock spacing F/q (fewest hypotheses):
  // n·f = (p/q)·F for whole p ≥ 1 coprime to q.
  const base = readings.reduce((a, b) => (b.rateHz / b.images > a.rateHz / a.images ? b : a));
  const highest = Math.max(...readings.map((r) => r.rateHz));
  const pOf = (patternHz: number) => (patternHz * base.images) / base.rateHz;
  const candidateAt = (p: number): SpeedCandidate | undefined => {
    if (gcd(p, base.images) !== 1) return undefined;
    const fit = explain((p / base.images) * base.rateHz, readings, tol);
    if (!fit) return undefined;
    const speedHz = fit.patternHz / n;
    return {
      speedHz,
      expected: expected
        ? speedHz >= expected.minHz * (1 - tol) && speedHz <= expected.maxHz * (1 + tol)
        : false,
      misfit: fit.misfit,
      locks: fit.locks,
    };
  };

  // docs/physics.md §7: inside an expected range, every p from ⌈q·n·min/F⌉ to ⌊q·n·max/F⌋, all kept.
  const inside: SpeedCandidate[] = [];
  let pIn = { first: 1, last: 0 };
  if (expected) {
    pIn = {
      first: Math.max(1, Math.ceil(pOf(n * expected.minHz * (1 - tol)))),
      last: Math.floor(pOf(n * expected.maxHz * (1 + tol))),
    };
    requireWorkable(
      pIn.last - pIn.first + 1,
      'expected speed range',
      'possible speeds to test',
      'narrow it or add a faster reading',
      MAX_EXPECTED_TESTS,
    );
    for (let p = pIn.first; p <= pIn.last; p++) {
      const c = candidateAt(p);
      if (c?.expected) inside.push(c);
    }
  }
  // Outside it (or without one), slowest first up to maxMultiple times the highest reading.
  const outside: SpeedCandidate[] = [];
  const pLast = Math.floor(pOf(highest * maxMultiple));
  requireWorkable(pLast, 'readings', 'possible speeds to test', 'add a faster reading');
  const room = Math.max(0, MAX_CANDIDATES - inside.length);
  for (let p = 1; p <= pLast && outside.length < room; p++) {
    if (p >= pIn.first && p <= pIn.last) continue;
    const c = candidateAt(p);
    if (c && !c.expected) outside.push(c);
  }
  const ranked = [...inside, ...outside];
  if (opts?.proposeNext === false) return { candidates: ranked };
  return { candidates: ranked, ...nextRate(ranked, n, readings, rateRange, tol) };
}

/** Does pattern frequency G explain every reading? Returns the refined G and the locks. */
function explain(G: number, readings: StrobeReading[], tol: number) {
  const locks: Array<{ p: number; q: number }> = [];
  const implied: number[] = [];
  for (const r of readings) {
    const x = (G * r.images) / r.rateHz;
    const p = Math.round(x);
    if (p < 1 || Math.abs(x - p) > tol * x || gcd(p, r.images) !== 1) return undefined;
    locks.push({ p, q: r.images });
    implied.push((p / r.images) * r.rateHz);
  }
  const patternHz = implied.reduce((a, b) => a + b, 0) / implied.length;
  const misfit = Math.max(...implied.map((v) => Math.abs(v - patternHz) / patternHz));
  return { patternHz, misfit, locks };
}

function nextRate(
  candidates: SpeedCandidate[],
  n: number,
  readings: StrobeReading[],
  rateRange: Range | undefined,
  tol: number,
): Pick<SpeedFinding, 'nextRateHz' | 'nextPurpose' | 'predictions'> {
  if (candidates.length === 0) return {};
  const leading = candidates.slice(0, COMPARED);
  const patterns = leading.map((c) => c.speedHz * n);
  const range = rateRange ?? {
    minHz: Math.min(...patterns) / 3,
    maxHz: Math.max(...patterns) * 3,
  };
  const inRange = (s: number) => s >= range.minHz * (1 - 1e-9) && s <= range.maxHz * (1 + 1e-9);
  const tried = (s: number) => readings.some((r) => Math.abs(r.rateHz - s) <= 1e-6 * s);
  const predict = (s: number): Prediction[] =>
    leading.map((c) => {
      const m = apparentMotion({ speedHz: c.speedHz, symmetry: n }, s);
      return { speedHz: c.speedHz, images: m.images, look: m.look };
    });

  if (leading.length === 1) {
    const G = patterns[0];
    const confirm = [2 * G, G, G / 2].find((s) => inRange(s) && !tried(s));
    if (confirm === undefined) return {};
    return { nextRateHz: confirm, nextPurpose: 'confirm', predictions: predict(confirm) };
  }
  const best = mostTellingRate(patterns, n, range, tried, tol);
  return best
    ? { nextRateHz: best.rateHz, nextPurpose: 'separate', predictions: predict(best.rateHz) }
    : {};
}
