import { InputError, requireBetween, requirePositive, requireWhole } from '../basics/InputError';
import { checkRange, MAX_IMAGES_LIMIT, MAX_SYMMETRY, type Look, type Range } from '../basics/types';
import { findSpeed, type StrobeReading } from '../physics/findSpeed';
import { mostTellingRate } from '../physics/tellingRate';
import { apparentMotion, type ApparentMotion } from '../physics/apparentMotion';
import { motorSpeedHz } from '../formulas/drives';
import { hzToFpm, hzToRpm } from '../formulas/units';
import { plainNumber } from '../basics/plainNumber';
import { safetyCautions } from './safetyCautions';

/** Where the technician is in the usual strobe procedure (physics.md §7). */
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
  /** Signed apparent speed, rpm (0 when images stand still). */
  apparentRpm: number;
  /** In plain words: "2 images stand still", "creeps backward at 12 rpm". */
  text: string;
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
  /** Why it is ranked where it is, in plain words. */
  note: string;
  /** What it would show at the rate to try now (absent when there is none). */
  atNextRate?: StepPrediction;
}

export interface SpeedFinderStep {
  stage: SpeedFinderStage;
  /** The next instruction in plain words. */
  instruction: string;
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
  /** Safety cautions that apply (physics.md §10). */
  cautions: string[];
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
  /** Relative slack between a reading and a lock, passed to findSpeed. Default 0.003. */
  matchTolerance?: number;
}

/** Candidates whose predicted views are compared when choosing a rate that separates them (as findSpeed). */
const COMPARED = 8;

/**
 * The usual strobe procedure, one step at a time (physics.md §7): start at the top of the
 * strobe's range (or just above the expected speed) and come down until a single image stands
 * still for the first time; that rate F1 is the pattern rate n·f. Confirm at 2·F1, where
 * exactly two images must stand still (at 2/3·F1 when 2·F1 is beyond the strobe; r = 3/2 shows
 * two images too). Coming down from the start rate, a faster speed would have stood still as a
 * single image above F1 first, so it is ruled out; what is left is the speed found. When
 * several speeds are still left (an expected range, a sweep that did not start high enough),
 * the next rate is the most telling one over the strobe's whole range (mostTellingRate), and
 * the instruction, the table's predictions and the rate all come from apparentMotion at that
 * one rate, so they agree.
 * Built on findSpeed (every consistent speed) and apparentMotion (what each shows).
 *
 * Units: rates in Hz, speeds in rev/s; the words use flashes per minute and rpm.
 * Throws InputError for a bad reading, a symmetry that is not a whole number ≥ 1, an empty or
 * inverted strobe or expected range, or bad options.
 *
 * @example
 * // A 4-pole motor on 60 Hz at its typical full-load 1770 rpm (Engineering ToolBox) with one mark:
 * // single image first at 1770 flashes/min, two images at 3540.
 * speedFinderSteps({ readings: [{ rateHz: 29.5, images: 1 }, { rateHz: 59, images: 2 }],
 *   symmetry: 1, strobeRange: { minHz: 0.5, maxHz: 200 } }).speedHz // 29.5 (1770 rpm)
 *
 * Source: physics.md §7 (two adjacent single images, the double image at twice the rate);
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
    safetyCautions({
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
      instruction: startInstruction(startHz, strobe, expect, n),
      cautions: cautionsFor(usedRates, true),
    };
  }

  const finding = findSpeed(readings, n, expect, { matchTolerance: tol, proposeNext: false });
  if (finding.candidates.length === 0) {
    return {
      ...base,
      stage: 'conflict',
      instruction:
        'These readings fit no single speed. Check each rate and image count (a mark that is not ' +
        'the only one of its kind, or two images read as one, are the usual causes) and remove the doubtful reading.',
      cautions: cautionsFor(usedRates, false),
    };
  }

  const singles = readings.filter((r) => r.images === 1).map((r) => r.rateHz);
  const firstSingleHz = singles.length > 0 ? Math.max(...singles) : undefined;
  const table = rankCandidates(
    finding.candidates,
    n,
    firstSingleHz,
    Math.max(sweptFromHz, firstSingleHz ?? 0),
    tol,
  );
  const live = table.filter((c) => !c.ruledOut);
  const lead = live[0];
  const tried = (s: number) => readings.some((r) => Math.abs(r.rateHz - s) <= tol * s);
  const inRange = (s: number) => s >= strobe.minHz * (1 - 1e-9) && s <= strobe.maxHz * (1 + 1e-9);

  let plan: { stage: SpeedFinderStage; rateHz?: number; instruction: string; speedHz?: number };
  if (firstSingleHz === undefined) {
    plan = comeDown(lead, n, readings, strobe);
  } else {
    // The two-image check for the likeliest speed: n·f/s = ½ or 3/2 (physics.md §3), that is
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
    const last = () =>
      done(lead, n, firstSingleHz, confirmHz, check, expect, rivals.length, live.length);
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
    stage: plan.stage,
    instruction: plan.instruction,
    ...(plan.rateHz === undefined ? {} : rate(plan.rateHz)),
    ...(plan.speedHz === undefined ? {} : { speedHz: plan.speedHz }),
    candidates,
    cautions: cautionsFor(usedRates, firstSingleHz === undefined),
  };
}

/** The two-image check: seen as predicted, tried without two images, or beyond the strobe. */
type CheckState = 'passed' | 'failed' | 'no-room';

/**
 * Expected speed range of an induction motor from its nameplate data (physics.md §8): from
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

const fpm = (hz: number) => `${plainNumber(hzToFpm(hz))} flashes/min`;
const rpm = (hz: number) => `${plainNumber(hzToRpm(hz))} rpm`;

function startInstruction(
  startHz: number,
  strobe: Range,
  expect: Range | undefined,
  n: number,
): string {
  const where = expect
    ? startHz >= strobe.maxHz
      ? "the top of the strobe's range"
      : 'just above the expected speed'
    : "the top of the strobe's range";
  const mark = n === 1 ? 'the mark' : 'the part';
  let text =
    `Set the strobe to ${fpm(startHz)} (${where}) and lower the rate slowly. Several images may stand ` +
    `still on the way down; go on until ${mark} stands still as a single image for the first time, then ` +
    'record that rate with 1 image.';
  if (expect && n * expect.minHz > strobe.maxHz) {
    text +=
      " The expected speed is above the strobe's top rate, so the first single image will be at a " +
      'fraction of the true speed; the steps that follow sort that out.';
  }
  if (n > 1) text += ' A single reflective mark on the part makes the reading unambiguous.';
  return text;
}

function rankCandidates(
  found: Array<{ speedHz: number; expected: boolean; misfit: number }>,
  n: number,
  firstSingleHz: number | undefined,
  sweepTopHz: number,
  tol: number,
): StepCandidate[] {
  const rows = found.map((c) => {
    const G = n * c.speedHz;
    // Coming down from the sweep top, the first single image of this speed is at G/k, the
    // highest sub-multiple not above the top.
    const firstSeenHz = G / Math.max(1, Math.ceil((G / sweepTopHz) * (1 - 1e-12)));
    const ruledOut = firstSingleHz !== undefined && firstSeenHz > firstSingleHz * (1 + tol);
    const note = ruledOut
      ? `Would have stood still as a single image at ${fpm(firstSeenHz)} on the way down.`
      : c.expected
        ? 'Fits every reading and the expected range.'
        : 'Fits every reading.';
    return {
      speedHz: c.speedHz,
      rpm: hzToRpm(c.speedHz),
      expected: c.expected,
      ruledOut,
      likeliest: false,
      note,
    };
  });
  // A sweep that rules out everything did not happen as assumed: rank on the readings alone.
  const keep = rows.every((r) => r.ruledOut) ? rows.map((r) => ({ ...r, ruledOut: false })) : rows;
  const ranked = [...keep.filter((r) => !r.ruledOut), ...keep.filter((r) => r.ruledOut)];
  if (ranked.length > 0) ranked[0] = { ...ranked[0], likeliest: true };
  return ranked;
}

function comeDown(lead: StepCandidate, n: number, readings: StrobeReading[], strobe: Range) {
  const lowestHz = Math.min(...readings.map((r) => r.rateHz));
  const G = n * lead.speedHz;
  // The likeliest speed's next single image below the lowest rate tried.
  const nextHz = G / (Math.floor(G / lowestHz + 1e-9) + 1);
  if (nextHz < strobe.minHz) {
    return {
      stage: 'come-down' as const,
      instruction:
        `Keep lowering the rate from ${fpm(lowestHz)}. If the part turns at ${rpm(lead.speedHz)}, the first ` +
        `single image would be at ${fpm(nextHz)}, below the strobe's lowest rate: record any single image you find.`,
    };
  }
  return {
    stage: 'come-down' as const,
    rateHz: nextHz,
    instruction:
      `Keep lowering the rate from ${fpm(lowestHz)} until a single image stands still. If the part turns at ` +
      `${rpm(lead.speedHz)}, that happens at ${fpm(nextHz)}.`,
  };
}

function confirm(lead: StepCandidate, n: number, firstSingleHz: number, confirmHz: number) {
  const near = (a: number, b: number) => Math.abs(a - b) <= 1e-9 * b;
  const how = near(confirmHz, 2 * firstSingleHz)
    ? `twice the single-image rate ${fpm(firstSingleHz)}`
    : near(confirmHz, (2 / 3) * firstSingleHz)
      ? `two thirds of the single-image rate ${fpm(firstSingleHz)}`
      : confirmHz > n * lead.speedHz
        ? `twice ${fpm(n * lead.speedHz)}, the single-image rate of ${rpm(lead.speedHz)}`
        : `two thirds of ${fpm(n * lead.speedHz)}, the single-image rate of ${rpm(lead.speedHz)}`;
  const look =
    n === 1
      ? 'two marks half a turn apart'
      : `${2 * n} features, evenly spaced (twice the ${n} the part has)`;
  return {
    stage: 'confirm' as const,
    rateHz: confirmHz,
    instruction:
      `Now set ${fpm(confirmHz)} (${how}). If the part turns at ` +
      `${rpm(lead.speedHz)}, ${look} stand still there. Record what you see; a single image there means the ` +
      'part turns faster and the search goes on.',
  };
}

function separate(
  rivals: StepCandidate[],
  n: number,
  strobe: Range,
  tried: (s: number) => boolean,
  tol: number,
): { stage: SpeedFinderStage; rateHz: number; instruction: string } | undefined {
  const compared = rivals.slice(0, COMPARED);
  // physics.md §7: the most telling rate over the strobe's whole range.
  const best = mostTellingRate(
    compared.map((c) => n * c.speedHz),
    n,
    strobe,
    tried,
    tol,
  );
  if (!best) return undefined;
  return {
    stage: 'separate',
    rateHz: best.rateHz,
    instruction: separateInstruction(best.rateHz, compared, rivals.length, n, best.separatesTop),
  };
}

function separateInstruction(
  s: number,
  compared: StepCandidate[],
  rivals: number,
  n: number,
  separatesTop: boolean,
): string {
  const predictions = compared.map((c) => ({ c, view: predict(c.speedHz, n, s) }));
  const views = predictions.map(({ c, view }) => `at ${rpm(c.speedHz)}: ${view.text}`).join('; ');
  const which =
    rivals > compared.length
      ? `the ${compared.length} likeliest of the ${rivals} speeds that still fit`
      : `the ${rivals} speeds that still fit`;
  let text = `Set ${fpm(s)} and compare what you see with ${which} (${views}).`;
  // A group of images, or one image drifting slower than 60 rpm, can be brought to a stop.
  const stands = predictions.some(
    ({ view }) => view.look === 'still' || view.images > 1 || Math.abs(view.apparentRpm) < 60,
  );
  text += stands
    ? ' Where images stand still or drift slowly, small changes of rate stop them: record that rate and how many images.'
    : ' Nothing is expected to stand still there: the way the part seems to move tells the speeds apart.';
  if (!separatesTop) {
    text +=
      " No rate in the strobe's range shows the likeliest speed differently from every other; this one tells the most of them apart.";
  }
  return text;
}

function done(
  lead: StepCandidate,
  n: number,
  firstSingleHz: number,
  confirmHz: number | undefined,
  check: CheckState,
  expect: Range | undefined,
  rivals: number,
  live: number,
) {
  let text = `The part turns at ${rpm(lead.speedHz)} (single image at ${fpm(firstSingleHz)}`;
  text +=
    check === 'passed'
      ? ', confirmed by the two images).'
      : check === 'no-room'
        ? "; the two-image check does not fit in the strobe's range)."
        : `; the check at ${fpm(confirmHz ?? 0)} did not show two images, and this is the speed that fits every reading).`;
  if (rivals > 1) {
    text += ` ${rivals - 1} other ${rivals === 2 ? 'speed' : 'speeds'} in the table fit the readings too and no rate in the strobe's range tells them apart; the one given is the slowest.`;
  } else if (live > rivals) {
    const others = live - rivals;
    text += ` ${others} ${others === 1 ? 'speed' : 'speeds'} outside the expected range fit the readings too (see the table).`;
  }
  if (expect && !lead.expected) {
    text +=
      ' It lies outside the expected range: check the nameplate and the mark, and whether the first ' +
      'single image was missed on the way down.';
  }
  text += ' You can save this speed to the machine.';
  if (n > 1) text += ` (${n} features: the speed is the single-image rate divided by ${n}.)`;
  return { stage: 'done' as const, instruction: text, speedHz: lead.speedHz };
}

function predict(speedHz: number, n: number, rateHz: number): StepPrediction {
  const m = apparentMotion({ speedHz, symmetry: n }, rateHz, { sampler: 'flash' });
  // A group of images drifts at driftHz; a single image steps at apparentHz.
  const apparentRpm = m.look === 'still' ? 0 : hzToRpm(m.images > 1 ? m.driftHz : m.apparentHz);
  return { images: m.images, look: m.look, apparentRpm, text: describeView(m, apparentRpm) };
}

function describeView(m: ApparentMotion, apparentRpm: number): string {
  const speed = `${plainNumber(Math.abs(apparentRpm))} rpm`;
  if (m.look === 'still')
    return m.images === 1 ? 'a single image stands still' : `${m.images} images stand still`;
  if (m.look === 'true')
    return 'moves at its true speed (the rate is above twice the pattern rate)';
  if (m.images > 1) return `${m.images} images drift slowly (${speed})`;
  if (m.look === 'unclear') return 'flickers with no clear direction';
  return `creeps ${m.look} at ${speed}`;
}
