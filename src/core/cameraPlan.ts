import { InputError, requireNonNegative, requirePositive } from './InputError';
import { checkPart, type Look, type Part } from './types';
import { checkLookOptions, type LookOptions } from './lookOptions';
import { apparentMotion } from './apparentMotion';
import { rateBands } from './rateBands';
import {
  blurDegrees,
  blurPitches,
  exposureFromShutterAngle,
  rollingSkewDegrees,
  shutterAngleFromExposure,
} from './exposure';
import { hzToRpm } from './units';
import { plainNumber } from './plainNumber';
import { safetyCautions } from './safetyCautions';

/** A frame rate cameras offer, with its exact value. */
export interface StandardFrameRate {
  /** As printed on cameras: '29.97'. */
  label: string;
  /** Exact frames per second (29.97 is 30000/1001). */
  hz: number;
  source: string;
}

const BT709 = 'ITU-R BT.709 picture rates; SMPTE ST 12-1 time code rates for the /1.001 family';

/**
 * Frame rates to offer as presets, ascending. The /1.001 rates are exact fractions, not the
 * rounded labels. 120 and 240 are the high-speed modes of phones and action cameras (common practice).
 * @example standardFrameRates[3] // { label: '29.97', hz: 29.97002997002997 (30000/1001), source: … }
 * Sources: ITU-R BT.709 (60, 50, 30, 25, 24 and each divided by 1.001); SMPTE ST 12-1.
 */
export const standardFrameRates: readonly StandardFrameRate[] = Object.freeze([
  { label: '23.976', hz: 24000 / 1001, source: BT709 },
  { label: '24', hz: 24, source: BT709 },
  { label: '25', hz: 25, source: BT709 },
  { label: '29.97', hz: 30000 / 1001, source: BT709 },
  { label: '30', hz: 30, source: BT709 },
  { label: '50', hz: 50, source: BT709 },
  { label: '59.94', hz: 60000 / 1001, source: BT709 },
  { label: '60', hz: 60, source: BT709 },
  { label: '120', hz: 120, source: 'common practice (high-speed video modes)' },
  { label: '240', hz: 240, source: 'common practice (high-speed video modes)' },
]);

/** What the camera can do. */
export interface CameraAbilities {
  /** Frame rates it offers, frames/s. */
  frameRatesHz: number[];
  /** Shutter angles it offers, degrees (0, 360]. */
  shutterAnglesDeg?: number[];
  /** Exposure times it offers, seconds (1/500 s = 0.002). */
  exposuresS?: number[];
  /** Rolling-shutter readout time, top to bottom, seconds (0: a global shutter). */
  readoutS: number;
}

/**
 * What the video should show:
 * 'freeze': the part stands still, features sharp;
 * 'creep': the part turns slowly forward at about creepHz (rev/s, > 0);
 * 'natural': a smoothly blurred disc, as the eye sees a fast part, with no misleading look;
 * 'honest': whatever it shows, nothing misleading (no still, backward or unclear look).
 */
export type CameraGoal =
  | { kind: 'freeze' }
  | { kind: 'creep'; creepHz: number }
  | { kind: 'natural' }
  | { kind: 'honest' };

export interface CameraSetting {
  frameRate: number;
  exposureS: number;
  shutterAngle: number;
  /** What the part shows at its nominal speed (sampler 'frames'). */
  look: Look;
  /** Signed apparent speed at the nominal speed, rpm (0 when still). */
  apparentRpm: number;
  /** Apparent speeds at the two ends of the part's tolerance, rpm. */
  apparentRpmRange: [number, number];
  /** For some speed within the tolerance it looks still, backward or of unclear direction (rateBands). */
  misleading: boolean;
  blurDegrees: number;
  blurPitches: number;
  /** Rolling-shutter bend across the frame, degrees. */
  skewDegrees: number;
  /** Contrast of the pattern left after the exposure's blur, 0…1 (|sin(πb)/(πb)|, b = blur in pitches). */
  residualContrast: number;
  /** It reaches the goal. */
  reaches: boolean;
  /** 0…100, higher is better for the goal (see cameraPlan). */
  score: number;
  /** Why, in plain words. */
  why: string;
}

export interface CameraPlan {
  /** Settings that reach the goal, best first. */
  settings: CameraSetting[];
  /** When few or none reach it: the best of the rest, up to five. */
  nearMisses: CameraSetting[];
  cautions: string[];
}

export interface CameraPlanOptions extends Partial<LookOptions> {
  /** Blur up to this many degrees keeps features sharp enough to inspect. Default 2° (a judgement). */
  sharpBlurDeg?: number;
  /** A pattern left with at most this contrast after blur reads as a smooth disc. Default 0.1 (a judgement). */
  maxResidualContrast?: number;
}

const NEAR_MISSES = 5;
/**
 * Beyond this many features passing per frame the look hangs on the speed's 7th digit, which
 * nobody knows; rateBands' work also grows with it.
 */
const MAX_PITCHES_PER_FRAME = 1e6;
/** A creep within this factor of the one wanted counts as reaching it (a judgement). */
const CREEP_FACTOR = 3;
/** Creep clarity 1/(1 + 4·blur in pitches): half at a quarter pitch (a judgement). */
const CREEP_BLUR_WEIGHT = 4;

/**
 * Ranks the camera's settings (every frame rate with every shutter angle or exposure that fits
 * in a frame) for a goal (physics.md §2–§5). For each: the look (apparentMotion, 'frames'),
 * whether any speed within the tolerance looks misleading (rateBands at that rate), blur
 * (blurDegrees, blurPitches), rolling-shutter skew (rollingSkewDegrees) and the pattern contrast
 * left by the blur: an exposure t averages the pattern over b = n·|f|·t pitches, which scales
 * its fundamental by sin(πb)/(πb) (a box filter in time), so at whole pitches the disc is even.
 * Reaching the goal:
 * - freeze: still at the nominal speed, blur under one pitch;
 * - creep: forward (or true) for every speed in the tolerance, apparent speed within a factor
 *   of 3 of the one wanted, blur under one pitch;
 * - natural: blur at least one pitch and either nothing misleading or a residual contrast of at
 *   most maxResidualContrast;
 * - honest: nothing misleading, or blurred into an even disc as for natural.
 * Score (0…100) multiplies factors in (0, 1], each a documented judgement:
 * - freeze: stillness 1/(1 + |apparent rpm|) · sharpness 1/(1 + blur°/sharpBlurDeg) · straightness;
 * - creep: closeness 1/(1 + |ln(a/wanted)|) · clarity 1/(1 + 4·blur pitches) · straightness;
 * - natural: min(1, blur pitches) · (1 − residual contrast), · 0.2 when misleading and not even;
 * - honest: 1 (true speed), 0.9 (even disc), 0.8 (slower forward), 0.2 (misleading) · straightness;
 * straightness is 1/(1 + skew°/pitch°), and 1 for an even disc (nothing left to bend).
 *
 * Units: frames/s, seconds, degrees, rev/s; apparent speeds in rpm. Throws InputError for no
 * frame rates, a rate ≤ 0, no shutter angles or exposures, an angle outside (0, 360], an
 * exposure ≤ 0, none that fits in a frame, a negative readout, a bad part, an unknown goal, a
 * creep ≤ 0, or a frame rate at which over a million features pass per frame.
 *
 * @example
 * // Wikipedia, "Stroboscopic effect": a 12-spoke wheel at 2 rev/s filmed at 24 frames/s looks still.
 * cameraPlan({ frameRatesHz: [24, 25, 30], shutterAnglesDeg: [45], readoutS: 0 },
 *   { speedHz: 2, symmetry: 12 }, { kind: 'freeze' }).settings[0].frameRate // 24
 *
 * Sources: shutter angle t = (θ/360)/s (cinema practice: 180° at 24 frames/s = 1/48 s); the
 * temporal box filter of an exposure (sinc response), as in any imaging text.
 */
export function cameraPlan(
  camera: CameraAbilities,
  part: Part,
  goal: CameraGoal,
  opts?: CameraPlanOptions,
): CameraPlan {
  const p = checkPart(part);
  const g = checkGoal(goal);
  const sharpBlurDeg = requirePositive(opts?.sharpBlurDeg ?? 2, 'sharp blur limit');
  const maxResidual = requirePositive(opts?.maxResidualContrast ?? 0.1, 'smooth disc contrast');
  const look = checkLookOptions(opts);
  const combos = settingsOf(camera);
  const readoutS = requireNonNegative(camera.readoutS, 'readout time');

  const all = combos.map(({ frameRate, exposureS, shutterAngle }) =>
    evaluate(p, g, frameRate, exposureS, shutterAngle, readoutS, look, sharpBlurDeg, maxResidual),
  );
  const byScore = (a: CameraSetting, b: CameraSetting) =>
    b.score - a.score || b.frameRate - a.frameRate || a.exposureS - b.exposureS;
  const settings = all.filter((s) => s.reaches).sort(byScore);
  const nearMisses = all
    .filter((s) => !s.reaches)
    .sort(byScore)
    .slice(0, NEAR_MISSES);
  return {
    settings,
    nearMisses,
    cautions: safetyCautions({
      apparentStillness: g.kind === 'freeze' || all.some((s) => s.misleading),
    }),
  };
}

function checkGoal(goal: CameraGoal): CameraGoal {
  if (typeof goal !== 'object' || goal === null) {
    throw new InputError('goal', "The goal must be 'freeze', 'creep', 'natural' or 'honest'.");
  }
  if (goal.kind === 'creep')
    return { kind: 'creep', creepHz: requirePositive(goal.creepHz, 'wanted creep speed') };
  if (goal.kind === 'freeze' || goal.kind === 'natural' || goal.kind === 'honest')
    return { kind: goal.kind };
  throw new InputError('goal', "The goal must be 'freeze', 'creep', 'natural' or 'honest'.");
}

function settingsOf(camera: CameraAbilities) {
  if (typeof camera !== 'object' || camera === null) {
    throw new InputError(
      'camera',
      "Give the camera's frame rates, shutter angles or exposures, and readout time.",
    );
  }
  if (!Array.isArray(camera.frameRatesHz) || camera.frameRatesHz.length === 0) {
    throw new InputError('frame rates', 'Give at least one frame rate.');
  }
  const rates = camera.frameRatesHz.map((r, i) => requirePositive(r, `frame rate ${i + 1}`));
  const angles = listOf(camera.shutterAnglesDeg, 'shutter angles');
  const exposures = listOf(camera.exposuresS, 'exposures').map((t, i) =>
    requirePositive(t, `exposure ${i + 1}`),
  );
  if (angles.length === 0 && exposures.length === 0) {
    throw new InputError('shutter', 'Give at least one shutter angle or exposure time.');
  }
  const seen = new Set<string>();
  const out: Array<{ frameRate: number; exposureS: number; shutterAngle: number }> = [];
  const add = (frameRate: number, exposureS: number, shutterAngle: number) => {
    const key = `${frameRate}|${exposureS.toPrecision(12)}`;
    if (!seen.has(key)) {
      seen.add(key);
      out.push({ frameRate, exposureS, shutterAngle });
    }
  };
  for (const s of rates) {
    angles.forEach((a, i) => {
      if (typeof a !== 'number' || !Number.isFinite(a) || a <= 0 || a > 360) {
        throw new InputError(
          'shutter angle',
          `Shutter angle ${i + 1} must lie above 0° and at most 360° (got ${String(a)}).`,
        );
      }
      add(s, exposureFromShutterAngle(a, s), a);
    });
    // An exposure longer than one frame cannot happen at that rate: skip the pair.
    for (const t of exposures) if (t * s <= 1 + 1e-9) add(s, t, shutterAngleFromExposure(t, s));
  }
  if (out.length === 0) {
    throw new InputError(
      'exposures',
      'None of the exposure times fits within one frame at the frame rates given.',
    );
  }
  return out;
}

function listOf(list: number[] | undefined, field: string): number[] {
  if (list === undefined) return [];
  if (!Array.isArray(list)) throw new InputError(field, `${field} must be a list of numbers.`);
  return list;
}

function evaluate(
  part: Required<Part>,
  goal: CameraGoal,
  frameRate: number,
  exposureS: number,
  shutterAngle: number,
  readoutS: number,
  look: LookOptions,
  sharpBlurDeg: number,
  maxResidual: number,
): CameraSetting {
  const opts = { ...look, sampler: 'frames' as const };
  const pitchesPerFrame =
    (part.symmetry * Math.abs(part.speedHz) * (1 + part.tolerance)) / frameRate;
  if (!(pitchesPerFrame <= MAX_PITCHES_PER_FRAME)) {
    throw new InputError(
      'frame rate',
      `At ${plainNumber(frameRate)} frames/s the part passes over a million features per frame: ` +
        'what it looks like then depends on digits nobody knows. Check the units of the speed and frame rates.',
    );
  }
  const m = apparentMotion(part, frameRate, opts);
  const apparentRpm = m.look === 'still' ? 0 : hzToRpm(m.apparentHz);
  const ends = [part.speedHz * (1 - part.tolerance), part.speedHz * (1 + part.tolerance)].map(
    (speedHz) => {
      const e = apparentMotion({ ...part, speedHz }, frameRate, opts);
      return e.look === 'still' ? 0 : hzToRpm(e.apparentHz);
    },
  );
  const apparentRpmRange: [number, number] = [Math.min(...ends), Math.max(...ends)];
  // A creep is the slow forward turn asked for: only still, backward or unclear views spoil it
  // (the nearly-still margin of safe bands would refuse every creep).
  const bands = rateBands(
    [part],
    { minHz: frameRate * (1 - 1e-9), maxHz: frameRate * (1 + 1e-9) },
    goal.kind === 'creep' ? { ...opts, nearlyStillHz: look.stillHz } : opts,
  );
  const misleading = bands.some((b) => !b.safe);
  const blurDeg = blurDegrees(part.speedHz, exposureS);
  const blurP = blurPitches(part.speedHz, part.symmetry, exposureS);
  const skewDeg = rollingSkewDegrees(part.speedHz, readoutS);
  const residualContrast =
    blurP === 0 ? 1 : Math.abs(Math.sin(Math.PI * blurP) / (Math.PI * blurP));
  const pitchDeg = 360 / part.symmetry;
  const smoothDisc = blurP >= 1 && residualContrast <= maxResidual;
  if (![apparentRpm, ...ends, blurDeg, blurP, skewDeg, residualContrast].every(Number.isFinite)) {
    throw new InputError(
      'speed',
      'The speed, frame rates or exposures are too large to plan with.',
    );
  }

  const sharp = 1 / (1 + blurDeg / sharpBlurDeg);
  // An even disc has no features left for the rolling shutter to bend.
  const straight = smoothDisc ? 1 : 1 / (1 + skewDeg / pitchDeg);
  let reaches: boolean;
  let factor: number;
  switch (goal.kind) {
    case 'freeze':
      reaches = m.look === 'still' && blurP < 1;
      factor = (1 / (1 + Math.abs(apparentRpm))) * sharp * straight;
      break;
    case 'creep': {
      const wanted = Math.sign(part.speedHz || 1) * hzToRpm(goal.creepHz);
      const ratio = apparentRpm === 0 ? 0 : apparentRpm / wanted;
      const forward = (m.look === 'forward' || m.look === 'true') && ratio > 0;
      reaches =
        forward && !misleading && ratio >= 1 / CREEP_FACTOR && ratio <= CREEP_FACTOR && blurP < 1;
      // A creep is seen while the features stay apart: clarity falls with blur in pitches.
      const clarity = 1 / (1 + CREEP_BLUR_WEIGHT * blurP);
      factor = (ratio > 0 ? 1 / (1 + Math.abs(Math.log(ratio))) : 0.01) * clarity * straight;
      break;
    }
    case 'natural':
      reaches = blurP >= 1 && (!misleading || residualContrast <= maxResidual);
      factor = Math.min(1, blurP) * (1 - residualContrast) * (misleading && !smoothDisc ? 0.2 : 1);
      break;
    default: {
      reaches = !misleading || smoothDisc;
      const honesty = misleading ? (smoothDisc ? 0.9 : 0.2) : m.look === 'true' ? 1 : 0.8;
      factor = honesty * straight;
    }
  }
  const score = Math.max(0, Math.min(100, 100 * factor));
  const why = explain(
    part,
    m.look,
    m.images,
    apparentRpm,
    misleading,
    blurDeg,
    blurP,
    pitchDeg,
    skewDeg,
    residualContrast,
    sharpBlurDeg,
    maxResidual,
  );
  return {
    frameRate,
    exposureS,
    shutterAngle,
    look: m.look,
    apparentRpm,
    apparentRpmRange,
    misleading,
    blurDegrees: blurDeg,
    blurPitches: blurP,
    skewDegrees: skewDeg,
    residualContrast,
    reaches,
    score,
    why,
  };
}

function explain(
  part: Required<Part>,
  look: Look,
  images: number,
  apparentRpm: number,
  misleading: boolean,
  blurDeg: number,
  blurP: number,
  pitchDeg: number,
  skewDeg: number,
  residual: number,
  sharpBlurDeg: number,
  maxResidual: number,
): string {
  const words: string[] = [];
  const speed = `${plainNumber(Math.abs(apparentRpm))} rpm`;
  if (blurP >= 1 && residual <= maxResidual) {
    words.push(`Blur of ${plainNumber(blurP)} pitches smears the features into an even disc.`);
  } else {
    if (look === 'still')
      words.push(images > 1 ? `${images} positions alternate.` : 'Looks still.');
    else if (look === 'true') words.push('Shows the true speed and direction.');
    else if (look === 'unclear') words.push('Direction cannot be told.');
    else words.push(`Seems to turn ${look} at ${speed}.`);
    if (blurDeg <= sharpBlurDeg) words.push(`Sharp (blur ${plainNumber(blurDeg)}°).`);
    else if (blurP < 1)
      words.push(
        `Blur ${plainNumber(blurDeg)}° (${plainNumber(blurP)} pitch) softens the features.`,
      );
    else
      words.push(
        `Blur ${plainNumber(blurP)} pitches, but the pattern still shows (contrast ${plainNumber(residual)}).`,
      );
  }
  const even = blurP >= 1 && residual <= maxResidual;
  if (misleading && look !== 'still' && !even)
    words.push('Within the speed tolerance it can look still or backward.');
  if (skewDeg > 0 && !even) {
    words.push(
      skewDeg >= pitchDeg
        ? `Rolling shutter turns it ${plainNumber(skewDeg)}° during readout: the features break up.`
        : `Rolling shutter bends the features by ${plainNumber(skewDeg)}°.`,
    );
  }
  if (part.tolerance > 0 && look === 'still')
    words.push('Freezes only at the nominal speed; within the tolerance it drifts.');
  return words.join(' ');
}
