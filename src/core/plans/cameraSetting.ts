// One camera setting weighed for a goal (docs/physics.md §2–§5): its look, whether any speed
// within the tolerance misleads, blur, rolling-shutter bend, what is left of the pattern, which
// conditions of the goal it fails, and its score.
import { InputError } from '../basics/InputError';
import type { Part } from '../basics/types';
import { plainNumber } from '../basics/plainNumber';
import type { LookOptions } from '../physics/lookOptions';
import { apparentMotion } from '../physics/apparentMotion';
import { rateBands } from '../physics/rateBands';
import { blurDegrees, blurPitches, rollingSkewDegrees } from '../formulas/exposure';
import { hzToRpm } from '../formulas/units';
import type { CameraCondition, CameraGoal, CameraSetting } from './cameraPlan';

/**
 * Beyond this many features passing per frame the look hangs on the speed's 7th digit, which
 * nobody knows; rateBands' work also grows with it.
 */
const MAX_PITCHES_PER_FRAME = 1e6;
/** A creep within this factor of the one wanted counts as reaching it (a judgement). */
const CREEP_FACTOR = 3;
/** Creep clarity 1/(1 + 4·blur in pitches): half at a quarter pitch (a judgement). */
const CREEP_BLUR_WEIGHT = 4;
/** Two frame rates this close are the same setting. */
export const SAME_RATE = 1e-9;

/** The goal's judgements, as given in the plan's options. */
export interface Limits {
  sharpBlurDeg: number;
  creepBlurPitches: number;
  maxResidual: number;
  maxBendPitches: number;
}

/** What every setting of one plan is weighed against: the part, the goal and its judgements. */
export interface PlanContext {
  part: Required<Part>;
  goal: CameraGoal;
  conditions: CameraCondition[];
  readoutS: number;
  look: LookOptions;
  limits: Limits;
}

/** One setting of the camera: a frame rate with one exposure. */
export interface Combo {
  frameRate: number;
  exposureS: number;
  shutterAngle: number;
}

/** The creep look (docs/physics.md §2): forward at both tolerance ends, the same whole k between them (no wrap), near the creep wanted. */
export function creepLookHolds(
  part: Required<Part>,
  frameRate: number,
  nominalRpm: number,
  wantedRpm: number,
  opts: ApparentMotionOpts,
): boolean {
  const ratio = wantedRpm === 0 ? 0 : nominalRpm / wantedRpm;
  if (!(ratio >= 1 / CREEP_FACTOR && ratio <= CREEP_FACTOR)) return false;
  const ends = [part.speedHz * (1 - part.tolerance), part.speedHz * (1 + part.tolerance)].map(
    (speedHz) => apparentMotion({ ...part, speedHz }, frameRate, opts),
  );
  const sameK = Math.round(ends[0].ratio) === Math.round(ends[1].ratio);
  return sameK && ends.every((m) => m.look === 'forward' || m.look === 'true');
}

export type ApparentMotionOpts = LookOptions & { sampler: 'frames' };

export function evaluate(combo: Combo, context: PlanContext): CameraSetting {
  const { frameRate, exposureS, shutterAngle } = combo;
  const { part, goal, conditions, readoutS, look, limits } = context;
  const opts: ApparentMotionOpts = { ...look, sampler: 'frames' };
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
  const endMotions = [part.speedHz * (1 - part.tolerance), part.speedHz * (1 + part.tolerance)].map(
    (speedHz) => apparentMotion({ ...part, speedHz }, frameRate, opts),
  );
  const ends = endMotions.map((e) => (e.look === 'still' ? 0 : hzToRpm(e.apparentHz)));
  const apparentRpmRange: [number, number] = [Math.min(...ends), Math.max(...ends)];
  // A creep is the slow forward turn asked for: only still, backward or unclear views spoil it
  // (the nearly-still margin of safe bands would refuse every creep).
  const bands = rateBands(
    [part],
    { minHz: frameRate * (1 - SAME_RATE), maxHz: frameRate * (1 + SAME_RATE) },
    goal.kind === 'creep' ? { ...opts, nearlyStillHz: look.stillHz } : opts,
  );
  const misleading = bands.some((b) => !b.safe);
  const blurDeg = blurDegrees(part.speedHz, exposureS);
  const blurP = blurPitches(part.speedHz, part.symmetry, exposureS);
  const skewDeg = rollingSkewDegrees(part.speedHz, readoutS);
  const skewP = (skewDeg * part.symmetry) / 360;
  const residualContrast =
    blurP === 0 ? 1 : Math.abs(Math.sin(Math.PI * blurP) / (Math.PI * blurP));
  const evenDisc = blurP >= 1 && residualContrast <= limits.maxResidual;
  if (![apparentRpm, ...ends, blurDeg, blurP, skewDeg, residualContrast].every(Number.isFinite)) {
    throw new InputError(
      'speed',
      'The speed, frame rates or exposures are too large to plan with.',
    );
  }

  const wantedRpm =
    goal.kind === 'creep' ? Math.sign(part.speedHz || 1) * hzToRpm(goal.creepHz) : 0;
  const holds: Record<CameraCondition, () => boolean> = {
    look: () =>
      goal.kind === 'freeze'
        ? m.look === 'still' && m.images === 1
        : goal.kind === 'creep'
          ? creepLookHolds(part, frameRate, apparentRpm, wantedRpm, opts)
          : !misleading,
    sharpness: () =>
      goal.kind === 'creep' ? blurP <= limits.creepBlurPitches : blurDeg <= limits.sharpBlurDeg,
    blur: () => blurP >= 1,
    smoothness: () => residualContrast <= limits.maxResidual,
    // For nothing misleading, an even disc has no features left for the rolling shutter to
    // bend; a freeze or creep needs the features themselves whole.
    bend: () => skewP < limits.maxBendPitches || (goal.kind === 'honest' && evenDisc),
  };
  const blocks = conditions.filter((c) => !holds[c]());

  const straight = evenDisc ? 1 : 1 / (1 + skewP);
  let factor: number;
  switch (goal.kind) {
    case 'freeze':
      factor =
        (1 / (1 + Math.abs(apparentRpm))) * (1 / (1 + blurDeg / limits.sharpBlurDeg)) * straight;
      break;
    case 'creep': {
      const ratio = apparentRpm === 0 ? 0 : apparentRpm / wantedRpm;
      // A creep is seen while the features stay apart: clarity falls with blur in pitches.
      const clarity = 1 / (1 + CREEP_BLUR_WEIGHT * blurP);
      factor = (ratio > 0 ? 1 / (1 + Math.abs(Math.log(ratio))) : 0.01) * clarity * straight;
      break;
    }
    case 'natural':
      factor = Math.min(1, blurP) * (1 - residualContrast) * (misleading ? 0.5 : 1);
      break;
    default:
      factor = (misleading ? 0.2 : m.look === 'true' ? 1 : 0.8) * straight;
  }
  const stillEnds = endMotions.every((e) => e.look === 'still');
  return {
    frameRate,
    exposureS,
    shutterAngle,
    look: m.look,
    apparentRpm,
    apparentRpmRange,
    misleading,
    driftsWithinTolerance: m.look === 'still' && part.tolerance > 0 && !stillEnds,
    blurDegrees: blurDeg,
    blurPitches: blurP,
    skewDegrees: skewDeg,
    skewPitches: skewP,
    residualContrast,
    evenDisc,
    readoutLongerThanFrame: readoutS * frameRate > 1 + SAME_RATE,
    blocks,
    reaches: blocks.length === 0,
    score: Math.max(0, Math.min(100, 100 * factor)),
  };
}
