import { apparentMotion, type ApparentMotion } from './apparentMotion';
import { gcd } from '../basics/gcd';
import type { Range } from '../basics/types';

/**
 * A single image drifting slower than this (rev/s) reads as "about still": which way it drifts
 * hangs on the exact speed, which is what is being looked for. 1 rev/s = 60 rpm, the creep a
 * person can follow (a judgement).
 */
const SLOW_HZ = 1;
/** Rates tried besides the simple multiples: locks of the top candidate, and a grid. */
const MAX_LOCK_TRIALS = 96;
const GRID_TRIALS = 96;
/** Simple multiples of a candidate's pattern rate a technician would try first. */
const MULTIPLES = [2, 1, 1 / 2, 2 / 3, 3 / 2, 3, 1 / 3, 4, 1 / 4];
/** Round numbers of flashes per minute, coarsest first, that a proposed rate moves to when it tells as much there. */
const ROUND_STEPS_FPM = [100, 10, 1];

/**
 * What a technician tells apart at a glance under a flash: the image count when several
 * images show; else a single image standing or drifting slowly, or one turning forward
 * (faithfully or slower than real: by eye both are a mark running forward), backward, or with
 * no clear direction.
 */
export function viewKey(m: ApparentMotion): string {
  if (m.images > 1) return `${m.images} images`;
  if (m.look === 'still' || Math.abs(m.apparentHz) < SLOW_HZ) return 'one image, slow';
  return m.look === 'true' ? 'one image, forward' : `one image, ${m.look}`;
}

/** A view in which something stands (or nearly stands) still: a reading can be taken there. */
function standsStill(key: string | undefined): boolean {
  return (key !== undefined && !key.startsWith('one image, ')) || key === 'one image, slow';
}

/**
 * The view of a part whose pattern rate is patternHz (to a relative uncertainty `spread`) at a
 * flash rate, or undefined when it changes within that uncertainty: a prediction that holds
 * only for the exact speed cannot tell one candidate from another at the machine.
 */
export function robustView(
  patternHz: number,
  symmetry: number,
  rateHz: number,
  spread: number,
  exactKey?: string,
): string | undefined {
  const at = (factor: number) =>
    viewKey(
      apparentMotion({ speedHz: (patternHz * factor) / symmetry, symmetry }, rateHz, {
        sampler: 'flash',
      }),
    );
  const key = exactKey ?? at(1);
  return spread === 0 || (at(1 - spread) === key && at(1 + spread) === key) ? key : undefined;
}

export interface TellingRate {
  rateHz: number;
  /** The robust view of each candidate there (undefined: it depends on the exact speed). */
  views: Array<string | undefined>;
  /** The first candidate's view differs from every other's. */
  separatesTop: boolean;
  /** Pairs of candidates whose views differ. */
  pairsTold: number;
  /** Candidates whose view stands (or nearly stands) still, so that it can be recorded as a reading. */
  standing: number;
}

/**
 * The most telling flash rate in a strobe's range for candidate pattern rates (docs/physics.md §7),
 * the first of them the likeliest: the rate whose predicted views (image count, look,
 * direction; robustView) tell the likeliest from every other, and after that tell the most
 * pairs apart (the most even split); on a tie, the one where more candidates show images
 * standing (a view the technician can record as a reading). Tried: simple multiples of each candidate's pattern rate
 * (2, 1, ½, ⅔, 3/2, 3, ⅓, 4, ¼: what a technician would try first, preferred on a tie), the
 * likeliest's locks q/p with q ≤ 4, and a grid across the whole range, highest first.
 * Rates for which `tried` is true are skipped. The rate found moves to the roundest whole
 * number of flashes per minute nearby (100, 10 or 1) where every view stays the same, so that
 * it can be set on a dial. Undefined when no rate tells any two apart.
 * Units: Hz. The inputs are checked by the callers.
 * @example mostTellingRate([60, 120], 1, { minHz: 1, maxHz: 200 }, () => false, 0.003)?.rateHz // 120
 */
export function mostTellingRate(
  patternsHz: readonly number[],
  symmetry: number,
  range: Range,
  tried: (rateHz: number) => boolean,
  spread: number,
): TellingRate | undefined {
  const count = patternsHz.length;
  if (count < 2) return undefined;
  const allPairs = (count * (count - 1)) / 2;
  let best: TellingRate | undefined;
  for (const rateHz of trialRates(patternsHz, range)) {
    if (tried(rateHz)) continue;
    // Exact views first: robustness can only tell fewer pairs apart, so skip the rate early.
    const exact = patternsHz.map((G) => robustView(G, symmetry, rateHz, 0));
    if (best && !beats(score(exact), best)) continue;
    const views = patternsHz.map((G, i) =>
      spread === 0 ? exact[i] : robustView(G, symmetry, rateHz, spread, exact[i]),
    );
    const s = score(views);
    if (s.pairsTold > 0 && (!best || beats(s, best))) {
      best = { rateHz, views, ...s };
      if (best.separatesTop && best.pairsTold === allPairs && best.standing === count) break;
    }
  }
  return best && roundOff(best, { patternsHz, symmetry, range, tried, spread });
}

/** The best rate moved to a round number of flashes per minute where it tells the same. */
function roundOff(
  best: TellingRate,
  search: {
    patternsHz: readonly number[];
    symmetry: number;
    range: Range;
    tried: (rateHz: number) => boolean;
    spread: number;
  },
): TellingRate {
  const { patternsHz, symmetry, range, tried, spread } = search;
  for (const step of ROUND_STEPS_FPM) {
    const rateHz = (Math.round((best.rateHz * 60) / step) * step) / 60;
    if (!(rateHz >= range.minHz && rateHz <= range.maxHz) || tried(rateHz)) continue;
    const same = patternsHz.every(
      (G, i) => robustView(G, symmetry, rateHz, spread) === best.views[i],
    );
    if (same) return { ...best, rateHz };
  }
  return best;
}

type Score = Pick<TellingRate, 'separatesTop' | 'pairsTold' | 'standing'>;

function score(views: Array<string | undefined>): Score {
  let pairsTold = 0;
  const standing = views.filter(standsStill).length;
  let separatesTop = views[0] !== undefined;
  for (let i = 0; i < views.length; i++) {
    for (let j = i + 1; j < views.length; j++) {
      const told = views[i] !== undefined && views[j] !== undefined && views[i] !== views[j];
      if (told) pairsTold++;
      else if (i === 0) separatesTop = false;
    }
  }
  return { separatesTop, pairsTold, standing };
}

function beats(a: Score, b: Score): boolean {
  if (a.separatesTop !== b.separatesTop) return a.separatesTop;
  if (a.pairsTold !== b.pairsTold) return a.pairsTold > b.pairsTold;
  return a.standing > b.standing;
}

/** The rates to try, in order of preference, inside the range. */
function trialRates(patternsHz: readonly number[], range: Range): number[] {
  const { minHz, maxHz } = range;
  const inside = (s: number) =>
    Number.isFinite(s) && s >= minHz * (1 - 1e-9) && s <= maxHz * (1 + 1e-9);
  const out: number[] = [];
  for (const G of patternsHz) for (const m of MULTIPLES) if (inside(G * m)) out.push(G * m);
  // The likeliest's locks G·q/p, q ≤ 4, from the top of the range down.
  const top = patternsHz[0];
  let locks = 0;
  for (let p = Math.max(1, Math.floor(top / maxHz)); locks < MAX_LOCK_TRIALS; p++) {
    if (top * 4 < p * minHz) break;
    for (let q = 1; q <= 4 && locks < MAX_LOCK_TRIALS; q++) {
      const s = (top * q) / p;
      if (gcd(p, q) === 1 && inside(s)) {
        out.push(s);
        locks++;
      }
    }
  }
  const ratio = maxHz / minHz;
  for (let i = GRID_TRIALS; i >= 1; i--) out.push(minHz * Math.pow(ratio, (i - 0.5) / GRID_TRIALS));
  return out;
}
