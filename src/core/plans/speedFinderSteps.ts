// Kept whole (over 300 lines): the guide's shapes, the procedure and the ranking of candidates
// are one procedure (docs/physics.md §7); half the file is the documented shape of its result.
import { InputError, requireBetween, requirePositive, requireWhole } from '../basics/InputError';
import { checkRange, MAX_IMAGES_LIMIT, MAX_SYMMETRY, type Look, type Range } from '../basics/types';
import { findSpeed, type StrobeReading } from '../physics/findSpeed';
import { mostTellingRate } from '../physics/tellingRate';
import { apparentMotion } from '../physics/apparentMotion';
import { motorSpeedHz } from '../formulas/drives';
import { hzToFpm, hzToRpm } from '../formulas/units';
import { cautionCodes, type CautionCode } from './cautions';

/** Where the technician is in the usual strobe procedure (docs/physics.md §7). */
export type SpeedFinderStage =
  /** No reading yet: set the start rate and come down. */
  | 'start'
  /** Images stood still, but no single image yet: keep coming down. */
  | 'come-down'
  /** A first single image: check it at twice (or two-thirds of) that rate, where two images must stand. */
  | 'confirm'
  /** Several speeds still fit: try a rate where they look different. */
  | 'separate'
  /** One speed fits the procedure: read it off and save it. */
  | 'done'
  /** The readings fit no single speed. */
  | 'conflict';

/** What the technician should see at the rate to try, if the part turns at a candidate speed. */
export interface StepPrediction {
  images: number;
  look: Look;
  /** Signed apparent speed, rpm (0 when images stand still; a group's drift when several show). */
  apparentRpm: number;
}

export interface StepCandidate {
  /** A speed that explains every reading, rev/s (≥ 0: a strobe cannot tell direction). */
  speedHz: number;
  /** The same in rpm, for the table. */
  rpm: number;
  /** Inside the expected range (false when none was given). */
  expected: boolean;
  /** The procedure rules it out: coming down from the start rate, its first single image lies above the one recorded. */
  ruledOut: boolean;
  /** The one the procedure points to: the first candidate not ruled out. */
  likeliest: boolean;
  /** Coming down from the top of the sweep, the rate at which this speed first stands still as a single image, Hz. */
  firstSingleHz: number;
  /** What it would show at the rate to try now (absent when there is none). */
  atNextRate?: StepPrediction;
}

/** How the two-image check went: seen as predicted, tried without two images, or beyond the strobe. */
export type CheckState = 'passed' | 'failed' | 'no-room';

/**
 * What the next instruction says, as codes and numbers (src/words/speedFinder.ts writes it out).
 * Speeds in rev/s, rates in Hz.
 */
export type StepGuide =
  | {
      stage: 'start';
      /** Where the start rate lies: the strobe's top, or just above the expected speed. */
      from: 'strobe-top' | 'above-expected';
      /** The expected speed lies above the strobe's top rate: the first single image is a fraction of it. */
      expectedAboveStrobe: boolean;
      symmetry: number;
    }
  | { stage: 'conflict' }
  | {
      stage: 'come-down';
      /** The lowest rate tried so far. */
      fromHz: number;
      /** The likeliest speed. */
      leadHz: number;
      /** Where the likeliest speed's next single image lies, below the lowest rate tried. */
      nextSingleHz: number;
      /** That rate is below the strobe's range. */
      belowStrobe: boolean;
    }
  | {
      stage: 'confirm';
      /** What the check rate is: twice or two thirds of the single-image rate read, or of the likeliest speed's own. */
      basis: 'twice-reading' | 'two-thirds-reading' | 'twice-lead' | 'two-thirds-lead';
      firstSingleHz: number;
      leadHz: number;
      symmetry: number;
    }
  | {
      stage: 'separate';
      /** The likeliest speeds compared, with what each shows at the rate to try. */
      compared: Array<{ speedHz: number; view: StepPrediction }>;
      /** How many speeds still fit (the compared ones are the likeliest of them). */
      rivals: number;
      /** Something is expected to stand still or drift slowly there, so it can be recorded as a reading. */
      standing: boolean;
      /** The rate tells the likeliest speed from every other. */
      separatesTop: boolean;
    }
  | {
      stage: 'done';
      speedHz: number;
      firstSingleHz: number;
      /** The two-image check's rate, when the strobe's range holds one. */
      confirmHz?: number;
      check: CheckState;
      /** Speeds still in the running besides the one found: inside the expected range (or all), and outside it. */
      othersAlike: number;
      othersOutside: number;
      /** An expected range was given and the speed found lies outside it. */
      outsideExpected: boolean;
      symmetry: number;
    };

export interface SpeedFinderStep {
  stage: SpeedFinderStage;
  /** The next instruction, as codes and numbers. */
  guide: StepGuide;
  /** The rate to set now, Hz (absent when done or in conflict). */
  rateHz?: number;
  /** The same in flashes per minute. */
  rateFpm?: number;
  /** Every consistent speed, likeliest first (empty before the first reading or on a conflict). */
  candidates: StepCandidate[];
  /** The speed found, rev/s, once the stage is 'done'. */
  speedHz?: number;
  /** The rate the procedure assumes the technician came down from, Hz. */
  sweptFromHz: number;
  /** Safety cautions that apply (docs/physics.md §10). */
  cautions: CautionCode[];
}

export interface SpeedFinderInput {
  /** Readings so far: at rateHz, `images` images stood still (1 = a single image). May be empty. */
  readings: StrobeReading[];
  /** Identical features on the part (1 = a single reflective mark, which the procedure prefers). */
  symmetry: number;
  /** The strobe's own range of rates, Hz. */
  strobeRange: Range;
  /** Expected speed range, rev/s (nameplate, or motorExpectedRange). */
  expect?: Range;
}

export interface SpeedFinderOptions {
  /**
   * The rate the technician started coming down from, Hz. Default: the start rate this
   * procedure proposes (the top of the strobe's range, or just above the expected speed).
   */
  sweptFromHz?: number;
  /** How far above the expected pattern rate to start, relative. Default 0.1 (a judgement). */
  startMargin?: number;
  /** Relative slack between a reading and a lock, passed to findSpeed. Default 0.003 (docs/physics.md §12). */
  matchTolerance?: number;
}

/** Candidates whose predicted views are compared when choosing a rate that separates them (as findSpeed). */
const COMPARED = 8;
/**
 * A group of images, or one image drifting slower than this, can be brought to a stop with a
 * small change of rate, and so recorded as a reading, rpm: the creep a person can follow (a
 * judgement, as tellingRate's).
 */
const SLOW_DRIFT_RPM = 60;

/**
 * The usual strobe procedure, one step at a time (docs/physics.md §7): start at the top of the
 * strobe's range (or just above the expected speed) and come down until a single image stands
 * still for the first time; that rate F1 is the pattern rate n·f. Confirm at 2·F1, where
 * exactly two images must stand still (at 2/3·F1 when 2·F1 is beyond the strobe; r = 3/2 shows
 * two images too). Coming down from the start rate, a faster speed would have stood still as a
 * single image above F1 first, so it is ruled out; what is left is the speed found. When
 * several speeds are still left (an expected range, a sweep that did not start high enough),
 * the next rate is the most telling one over the strobe's whole range (mostTellingRate), and
 * the guide, the table's predictions and the rate all come from apparentMotion at that one
 * rate, so they agree. The instruction comes as a guide of codes and numbers.
 * Built on findSpeed (every consistent speed) and apparentMotion (what each shows).
 *
 * Units: rates in Hz, speeds in rev/s.
 * Throws InputError for a bad reading, a symmetry that is not a whole number ≥ 1, an empty or
 * inverted strobe or expected range, or bad options.
 *
 * @example
 * // A 4-pole motor on 60 Hz at its typical full-load 1770 rpm (Engineering ToolBox) with one mark:
 * // single image first at 1770 flashes/min, two images at 3540.
 * speedFinderSteps({ readings: [{ rateHz: 29.5, images: 1 }, { rateHz: 59, images: 2 }],
 *   symmetry: 1, strobeRange: { minHz: 0.5, maxHz: 200 } }).speedHz // 29.5 (1770 rpm)
 *
 * Source: docs/physics.md §7 (two adjacent single images, the double image at twice the rate);
 * the sweep from the top down is common practice.
 */
export function speedFinderSteps(
  input: SpeedFinderInput,
  opts?: SpeedFinderOptions,
): SpeedFinderStep {
  if (typeof input !== 'object' || input === null) {
    throw new InputError(
      'speed finder',
      'Give the readings, the features on the part and the strobe range.',
    );
  }
  if (!Array.isArray(input.readings)) {
    throw new InputError(
      'readings',
      'readings must be a list (it may be empty before the first one).',
    );
  }
  const n = requireWhole(input.symmetry, 'features (blades, spokes)', 1, MAX_SYMMETRY);
  const strobe = checkRange(input.strobeRange, 'strobe range');
  const expect =
    input.expect === undefined ? undefined : checkRange(input.expect, 'expected speed range');
  const margin = requireBetween(opts?.startMargin ?? 0.1, 'start margin', 0, 1);
  const tol = requireBetween(opts?.matchTolerance ?? 0.003, 'match tolerance', 0, 0.1);
  const readings = input.readings.map((r, i) => ({
    rateHz: requirePositive(r?.rateHz, `rate of reading ${i + 1}`),
    images: requireWhole(r?.images, `images in reading ${i + 1}`, 1, MAX_IMAGES_LIMIT),
  }));

  const startHz = startRate(strobe, expect, n, margin);
  const sweptFromHz =
    opts?.sweptFromHz === undefined
      ? startHz
      : requirePositive(opts.sweptFromHz, 'rate you started from');
  const base = { sweptFromHz, candidates: [] as StepCandidate[] };
  // The technician watches every rate from the start rate down to the lowest one used; before
  // the first single image the sweep may go down to the strobe's lowest rate.
  const cautionsFor = (rates: number[], open: boolean) =>
    cautionCodes({
      apparentStillness: true,
      flashSweepHz: {
        minHz: Math.min(...rates, open ? strobe.minHz : Infinity),
        maxHz: Math.max(...rates),
      },
    });
  const usedRates = [sweptFromHz, ...readings.map((r) => r.rateHz)];

  if (readings.length === 0) {
    return {
      ...base,
      stage: 'start',
      ...rate(startHz),
      guide: {
        stage: 'start',
        from: expect && startHz < strobe.maxHz ? 'above-expected' : 'strobe-top',
        expectedAboveStrobe: expect !== undefined && n * expect.minHz > strobe.maxHz,
        symmetry: n,
      },
      cautions: cautionsFor(usedRates, true),
    };
  }

  const finding = findSpeed(readings, n, expect, { matchTolerance: tol, proposeNext: false });
  if (finding.candidates.length === 0) {
    return {
      ...base,
      stage: 'conflict',
      guide: { stage: 'conflict' },
      cautions: cautionsFor(usedRates, false),
    };
  }

  const singles = readings.filter((r) => r.images === 1).map((r) => r.rateHz);
  const firstSingleHz = singles.length > 0 ? Math.max(...singles) : undefined;
  const table = rankCandidates(finding.candidates, {
    n,
    firstSingleHz,
    sweepTopHz: Math.max(sweptFromHz, firstSingleHz ?? 0),
    tol,
  });
  const live = table.filter((c) => !c.ruledOut);
  const lead = live[0];
  const tried = (s: number) => readings.some((r) => Math.abs(r.rateHz - s) <= tol * s);
  const inRange = (s: number) => s >= strobe.minHz * (1 - 1e-9) && s <= strobe.maxHz * (1 + 1e-9);

  let plan: { guide: StepGuide; rateHz?: number };
  if (firstSingleHz === undefined) {
    plan = comeDown(lead, n, readings, strobe);
  } else {
    // The two-image check for the likeliest speed: n·f/s = ½ or 3/2 (docs/physics.md §3), that is
    // twice (or two thirds of) its pattern rate, the first single image when the sweep found it.
    const leadHz = n * lead.speedHz;
    const confirmHz = [2 * leadHz, (2 / 3) * leadHz].find(inRange);
    const check: CheckState =
      confirmHz === undefined
        ? 'no-room'
        : readings.some((r) => r.images === 2 && Math.abs(r.rateHz - confirmHz) <= tol * confirmHz)
          ? 'passed'
          : 'failed';
    // With an expected range, only the speeds inside it compete; otherwise all that are left.
    const inside = live.filter((c) => c.expected);
    const rivals = expect && inside.length > 0 ? inside : live;
    const last = (): { guide: StepGuide } => ({
      guide: {
        stage: 'done',
        speedHz: lead.speedHz,
        firstSingleHz,
        ...(confirmHz === undefined ? {} : { confirmHz }),
        check,
        othersAlike: rivals.length - 1,
        othersOutside: live.length - rivals.length,
        outsideExpected: expect !== undefined && !lead.expected,
        symmetry: n,
      },
    });
    if (rivals.length > 1) {
      // Several speeds are left: the most telling rate, not a check that assumes one of them.
      plan = separate(rivals, n, strobe, tried, tol) ?? last();
    } else if (confirmHz !== undefined && !tried(confirmHz)) {
      plan = confirm(lead, n, firstSingleHz, confirmHz);
    } else {
      plan = last();
    }
  }

  const candidates = table.map((c) =>
    plan.rateHz === undefined ? c : { ...c, atNextRate: predict(c.speedHz, n, plan.rateHz) },
  );
  if (plan.rateHz !== undefined) usedRates.push(plan.rateHz);
  return {
    sweptFromHz,
    stage: plan.guide.stage,
    guide: plan.guide,
    ...(plan.rateHz === undefined ? {} : rate(plan.rateHz)),
    ...(plan.guide.stage === 'done' ? { speedHz: plan.guide.speedHz } : {}),
    candidates,
    cautions: cautionsFor(usedRates, firstSingleHz === undefined),
  };
}

/**
 * Expected speed range of an induction motor from its nameplate data (docs/physics.md §8): from
 * (1 − maxSlip)·2·fm/P (loaded) to (1 − minSlip)·2·fm/P rev/s (unloaded: near synchronous).
 * Default slip 0 to 0.05: common practice; the typical full-load speeds of Engineering
 * ToolBox's table (e.g. 1770 of 1800 rpm, 960 of 1000 rpm) are 1.7 % to 4 % slip.
 * Throws InputError for mains ≤ 0, poles not an even whole number ≥ 2, or slips outside
 * 0…0.5 or not in order.
 * @example motorExpectedRange(50, 4) // { minHz: 23.75, maxHz: 25 } (1425 to 1500 rpm)
 * Sources: IEC 60034-1 / NEMA MG 1 (synchronous speed 120·fm/P); Engineering ToolBox (typical speeds).
 */
export function motorExpectedRange(
  mainsHz: number,
  poles: number,
  slip?: { min: number; max: number },
): Range {
  const min = requireBetween(slip?.min ?? 0, 'smallest slip', 0, 0.5);
  const max = requireBetween(slip?.max ?? 0.05, 'largest slip', 0, 0.5);
  if (!(min < max)) {
    throw new InputError(
      'slip',
      `The slip range is empty: the smallest slip (${min}) must be below the largest (${max}).`,
    );
  }
  return { minHz: motorSpeedHz(mainsHz, poles, max), maxHz: motorSpeedHz(mainsHz, poles, min) };
}

function startRate(strobe: Range, expect: Range | undefined, n: number, margin: number): number {
  if (!expect) return strobe.maxHz;
  const wanted = n * expect.maxHz * (1 + margin);
  return Math.min(strobe.maxHz, Math.max(strobe.minHz, wanted));
}

function rate(rateHz: number) {
  return { rateHz, rateFpm: hzToFpm(rateHz) };
}

/** How the candidates are ranked: the readings' first single image and the top of the sweep. */
interface Sweep {
  n: number;
  firstSingleHz: number | undefined;
  sweepTopHz: number;
  tol: number;
}

function rankCandidates(
  found: Array<{ speedHz: number; expected: boolean; misfit: number }>,
  sweep: Sweep,
): StepCandidate[] {
  const { n, firstSingleHz, sweepTopHz, tol } = sweep;
  const rows = found.map((c): StepCandidate => {
    const G = n * c.speedHz;
    // Coming down from the sweep top, the first single image of this speed is at G/k, the
    // highest sub-multiple not above the top.
    const firstSeenHz = G / Math.max(1, Math.ceil((G / sweepTopHz) * (1 - 1e-12)));
    return {
      speedHz: c.speedHz,
      rpm: hzToRpm(c.speedHz),
      expected: c.expected,
      ruledOut: firstSingleHz !== undefined && firstSeenHz > firstSingleHz * (1 + tol),
      likeliest: false,
      firstSingleHz: firstSeenHz,
    };
  });
  // A sweep that rules out everything did not happen as assumed: rank on the readings alone.
  const keep = rows.every((r) => r.ruledOut) ? rows.map((r) => ({ ...r, ruledOut: false })) : rows;
  const ranked = [...keep.filter((r) => !r.ruledOut), ...keep.filter((r) => r.ruledOut)];
  if (ranked.length > 0) ranked[0] = { ...ranked[0], likeliest: true };
  return ranked;
}

function comeDown(
  lead: StepCandidate,
  n: number,
  readings: StrobeReading[],
  strobe: Range,
): { guide: StepGuide; rateHz?: number } {
  const lowestHz = Math.min(...readings.map((r) => r.rateHz));
  const G = n * lead.speedHz;
  // The likeliest speed's next single image below the lowest rate tried.
  const nextHz = G / (Math.floor(G / lowestHz + 1e-9) + 1);
  const belowStrobe = nextHz < strobe.minHz;
  const guide: StepGuide = {
    stage: 'come-down',
    fromHz: lowestHz,
    leadHz: lead.speedHz,
    nextSingleHz: nextHz,
    belowStrobe,
  };
  return belowStrobe ? { guide } : { guide, rateHz: nextHz };
}

function confirm(
  lead: StepCandidate,
  n: number,
  firstSingleHz: number,
  confirmHz: number,
): { guide: StepGuide; rateHz: number } {
  const near = (a: number, b: number) => Math.abs(a - b) <= 1e-9 * b;
  const basis = near(confirmHz, 2 * firstSingleHz)
    ? 'twice-reading'
    : near(confirmHz, (2 / 3) * firstSingleHz)
      ? 'two-thirds-reading'
      : confirmHz > n * lead.speedHz
        ? 'twice-lead'
        : 'two-thirds-lead';
  return {
    rateHz: confirmHz,
    guide: { stage: 'confirm', basis, firstSingleHz, leadHz: lead.speedHz, symmetry: n },
  };
}

function separate(
  rivals: StepCandidate[],
  n: number,
  strobe: Range,
  tried: (s: number) => boolean,
  tol: number,
): { guide: StepGuide; rateHz: number } | undefined {
  const compared = rivals.slice(0, COMPARED);
  // docs/physics.md §7: the most telling rate over the strobe's whole range.
  const best = mostTellingRate(
    compared.map((c) => n * c.speedHz),
    n,
    strobe,
    tried,
    tol,
  );
  if (!best) return undefined;
  const views = compared.map((c) => ({
    speedHz: c.speedHz,
    view: predict(c.speedHz, n, best.rateHz),
  }));
  return {
    rateHz: best.rateHz,
    guide: {
      stage: 'separate',
      compared: views,
      rivals: rivals.length,
      standing: views.some(
        ({ view }) =>
          view.look === 'still' || view.images > 1 || Math.abs(view.apparentRpm) < SLOW_DRIFT_RPM,
      ),
      separatesTop: best.separatesTop,
    },
  };
}

function predict(speedHz: number, n: number, rateHz: number): StepPrediction {
  const m = apparentMotion({ speedHz, symmetry: n }, rateHz, { sampler: 'flash' });
  // A group of images drifts at driftHz; a single image steps at apparentHz.
  const apparentRpm = m.look === 'still' ? 0 : hzToRpm(m.images > 1 ? m.driftHz : m.apparentHz);
  return { images: m.images, look: m.look, apparentRpm };
}
