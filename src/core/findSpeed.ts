import { InputError, requirePositive, requireWhole, requireBetween } from './InputError';
import { checkRange, MAX_IMAGES_LIMIT, MAX_SYMMETRY, type Look, type Range } from './types';
import { apparentMotion } from './apparentMotion';
import { gcd } from './gcd';
import { requireWorkable } from './workLimit';

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
  /** The strobe's own range: the next rate is chosen inside it. */
  rateRange?: Range;
}

/** Keeps the list readable: nobody tests more than a few dozen hypotheses at a machine. */
const MAX_CANDIDATES = 40;
/** Candidates compared when choosing the next rate. */
const COMPARED = 6;

/**
 * The true speeds consistent with a set of strobe readings (physics.md §7). A reading of q
 * images standing still at rate F means n·f = (p/q)·F for some whole p ≥ 1 with gcd(p, q) = 1.
 * Every speed satisfying all readings (within matchTolerance) is returned, ranked: inside the
 * expected range first, then slowest first: coming down from high rates, the first single
 * image is at n·f, so a faster candidate means a higher lock was passed unseen. Two adjacent
 * single-image rates F1 > F2 give n·f = F1·F2/(F1 − F2).
 * The next rate proposed is one where the leading candidate's view differs from the others
 * (for example twice its single-image rate: two images if it is right).
 *
 * Units: rates in Hz, speeds in rev/s. Throws InputError for no readings, a rate ≤ 0, an image
 * count not a whole number in 1…64, a bad symmetry, an empty or inverted expected range.
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

  // Candidates come from the reading with the widest lock spacing F/q (fewest hypotheses).
  const base = readings.reduce((a, b) => (b.rateHz / b.images > a.rateHz / a.images ? b : a));
  const highest = Math.max(...readings.map((r) => r.rateHz));
  const ceilingPatternHz = Math.max(
    highest * maxMultiple,
    expected ? n * expected.maxHz * (1 + tol) : 0,
  );

  const candidates: SpeedCandidate[] = [];
  const pLast = Math.floor((ceilingPatternHz * base.images) / base.rateHz);
  requireWorkable(
    pLast,
    'expected speed range',
    'possible speeds to test',
    'lower its top or add a faster reading',
  );
  for (let p = 1; p <= pLast && candidates.length < MAX_CANDIDATES * 4; p++) {
    if (gcd(p, base.images) !== 1) continue;
    const guess = (p / base.images) * base.rateHz;
    const fit = explain(guess, readings, tol);
    if (!fit) continue;
    const speedHz = fit.patternHz / n;
    candidates.push({
      speedHz,
      expected: expected
        ? speedHz >= expected.minHz * (1 - tol) && speedHz <= expected.maxHz * (1 + tol)
        : false,
      misfit: fit.misfit,
      locks: fit.locks,
    });
  }
  candidates.sort((a, b) => Number(b.expected) - Number(a.expected) || a.speedHz - b.speedHz);
  const ranked = candidates.slice(0, MAX_CANDIDATES);
  return { candidates: ranked, ...nextRate(ranked, n, readings, rateRange) };
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
): Pick<SpeedFinding, 'nextRateHz' | 'nextPurpose' | 'predictions'> {
  if (candidates.length === 0) return {};
  const leading = candidates.slice(0, COMPARED);
  const inRange = (s: number) => !rateRange || (s >= rateRange.minHz && s <= rateRange.maxHz);
  const tried = (s: number) => readings.some((r) => Math.abs(r.rateHz - s) <= 1e-6 * s);
  const predict = (s: number): Prediction[] =>
    leading.map((c) => {
      const m = apparentMotion({ speedHz: c.speedHz, symmetry: n }, s);
      return { speedHz: c.speedHz, images: m.images, look: m.look };
    });
  const key = (p: Prediction) => `${p.look}:${p.images}`;

  // Rates that tell the leader from the rest, in the order a technician would try them.
  const proposals: number[] = [];
  for (const c of leading) {
    const G = c.speedHz * n;
    proposals.push(G, 2 * G, G / 2, 3 * G, G / 3);
  }
  let best: { rate: number; predictions: Prediction[]; distinct: number } | undefined;
  for (const rate of proposals) {
    if (!(rate > 0) || !inRange(rate) || tried(rate)) continue;
    const predictions = predict(rate);
    const lead = key(predictions[0]);
    const distinct = new Set(predictions.map(key)).size;
    if (leading.length > 1 && predictions.slice(1).every((p) => key(p) !== lead)) {
      return { nextRateHz: rate, nextPurpose: 'separate', predictions };
    }
    if (!best || distinct > best.distinct) best = { rate, predictions, distinct };
  }
  if (leading.length === 1) {
    const G = leading[0].speedHz * n;
    const confirm =
      [2 * G, G, G / 2].find((s) => inRange(s) && !tried(s)) ??
      (inRange(2 * G) ? 2 * G : undefined);
    if (confirm === undefined) return {};
    return { nextRateHz: confirm, nextPurpose: 'confirm', predictions: predict(confirm) };
  }
  return best
    ? { nextRateHz: best.rate, nextPurpose: 'separate', predictions: best.predictions }
    : {};
}
