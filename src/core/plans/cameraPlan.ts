// A camera's settings weighed for a goal (docs/physics.md §2–§5): the plan's shapes and the
// planner; each setting is weighed in cameraSetting.ts, what would lift a condition in cameraNeeds.ts.
import { InputError, requireNonNegative, requirePositive } from '../basics/InputError';
import { checkPart, type Look, type Part, type Range } from '../basics/types';
import { checkLookOptions, type LookOptions } from '../physics/lookOptions';
import { exposureFromShutterAngle, shutterAngleFromExposure } from '../formulas/exposure';
import { cautionCodes, type CautionCode } from './cautions';
import { needsOf } from './cameraNeeds';
import { evaluate, type Combo, type Limits, type PlanContext } from './cameraSetting';

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
 * 'natural': a smoothly blurred disc, as the eye sees a fast part;
 * 'honest': whatever it shows, nothing misleading (never still, nearly still, backward or unclear).
 */
export type CameraGoal =
  | { kind: 'freeze' }
  | { kind: 'creep'; creepHz: number }
  | { kind: 'natural' }
  | { kind: 'honest' };

/**
 * One condition a goal sets; a setting reaches the goal only when every condition of the goal
 * holds (see cameraPlan for which goal sets which):
 * 'look': the look the goal needs (freeze: one image standing still; creep: forward near the
 *   creep wanted at every speed within the tolerance; honest: nothing misleading at any speed
 *   within the tolerance);
 * 'sharpness': the exposure is short enough (freeze: blur ≤ sharpBlurDeg; creep: blur ≤
 *   creepBlurPitches of a pitch, so the features stay apart);
 * 'blur': the exposure is long enough to blur at least one pitch (natural);
 * 'smoothness': the blur leaves at most maxResidualContrast of the pattern (natural);
 * 'bend': the rolling shutter turns the part less than maxBendPitches while a frame is read
 *   (for nothing misleading, an even disc has nothing left to bend).
 */
export type CameraCondition = 'look' | 'sharpness' | 'blur' | 'smoothness' | 'bend';

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
  /** For some speed within the tolerance it misleads (rateBands at this rate, sampler 'frames'). */
  misleading: boolean;
  /** Still at the nominal speed but not at both ends of the tolerance: it drifts there. */
  driftsWithinTolerance: boolean;
  blurDegrees: number;
  blurPitches: number;
  /** Rolling-shutter bend across the frame, degrees and pitches. */
  skewDegrees: number;
  skewPitches: number;
  /** Contrast of the pattern left after the exposure's blur, 0…1 (|sin(πb)/(πb)|, b = blur in pitches). */
  residualContrast: number;
  /** Blurred at least one pitch, with at most maxResidualContrast of the pattern left: an even disc. */
  evenDisc: boolean;
  /** The readout takes longer than a frame: the camera cannot read whole frames at this rate as given. */
  readoutLongerThanFrame: boolean;
  /** The goal's conditions this setting fails, in the order of CameraPlan.conditions (empty: it reaches the goal). */
  blocks: CameraCondition[];
  /** It reaches the goal: every condition of the goal holds. */
  reaches: boolean;
  /** 0…100, higher is better for the goal among settings alike in reaching it (see cameraPlan). */
  score: number;
}

/** A frame rate that shows the look the goal needs, and whether the camera offers it. */
export interface LookRate {
  rateHz: number;
  offered: boolean;
}

/** What would lift each condition of the goal, as numbers (the screen says it in words). */
export interface CameraNeeds {
  /** Pattern frequency n·|f|, Hz. */
  patternHz: number;
  /**
   * Frame rates within the camera's own span that show the look: freeze, every sub-multiple
   * n·|f|/k (docs/physics.md §3); creep, the rates of ratesForApparent that show it. Highest first,
   * at most MAX_LOOK_RATES of them; empty for the other goals.
   */
  lookRates: LookRate[];
  /** How many such rates lie in the span (lookRates may hold fewer). */
  lookRateCount: number;
  /** Every rate above this shows the true motion at every speed within the tolerance: 2·n·|f|·(1+u). */
  faithfulAboveHz: number;
  /** Longest exposure that meets the goal's sharpness, s (1 s for a part that does not turn: any will do). */
  sharpExposureS: number;
  /** Shortest exposure that blurs one pitch, s: 1/(n·|f|). */
  discExposureS: number;
  /** Longest readout that keeps the bend under the limit, s: maxBendPitches/(n·|f|). */
  bendReadoutS: number;
  /** Shortest and longest exposure the camera offers at any of its rates, s. */
  shortestExposureS: number;
  longestExposureS: number;
}

export interface CameraPlan {
  goal: CameraGoal['kind'];
  /** The goal's conditions, in the order blocks are listed. */
  conditions: CameraCondition[];
  /** For each condition of the goal, how many of the camera's settings meet it. */
  met: Partial<Record<CameraCondition, number>>;
  /** How many settings were weighed (every frame rate with every exposure that fits in a frame). */
  weighed: number;
  /** The camera's own span of frame rates: its lowest and highest. */
  span: Range;
  needs: CameraNeeds;
  /** Settings that reach the goal, best first. */
  settings: CameraSetting[];
  /** The best of the rest, up to five: fewest conditions failed first, then by score. */
  nearMisses: CameraSetting[];
  /** Safety cautions that apply (docs/physics.md §10). */
  cautions: CautionCode[];
}

export interface CameraPlanOptions extends Partial<LookOptions> {
  /** Blur up to this many degrees of turn keeps features sharp enough to inspect a frozen part. Default 2° (a judgement). */
  sharpBlurDeg?: number;
  /** Blur up to this share of a pitch keeps features apart, so a slow turn can be followed. Default 0.5 (a judgement). */
  creepBlurPitches?: number;
  /** A pattern left with at most this contrast after blur reads as a smooth disc. Default 0.1 (a judgement). */
  maxResidualContrast?: number;
  /**
   * Rolling-shutter bend, in pitches, at which the features break into pieces. Default 1:
   * docs/physics.md §5, straight blades bend and, past a pitch, break into pieces.
   */
  maxBendPitches?: number;
}

/** The best of the rest offered as near misses. */
const NEAR_MISSES = 5;

const GOAL_CONDITIONS: Record<CameraGoal['kind'], CameraCondition[]> = {
  freeze: ['look', 'sharpness', 'bend'],
  creep: ['look', 'sharpness', 'bend'],
  natural: ['blur', 'smoothness'],
  honest: ['look', 'bend'],
};

/**
 * Weighs the camera's settings (every frame rate with every shutter angle or exposure that fits
 * in a frame) for a goal (docs/physics.md §2–§5). For each: the look (apparentMotion, 'frames'),
 * whether any speed within the tolerance misleads (rateBands at that rate), blur (blurDegrees,
 * blurPitches), rolling-shutter bend (rollingSkewDegrees) and the pattern contrast left by the
 * blur: an exposure t averages the pattern over b = n·|f|·t pitches, which scales its
 * fundamental by sin(πb)/(πb) (a box filter in time), so at whole pitches the disc is even.
 *
 * A setting reaches the goal only when every condition of the goal holds (CameraCondition):
 * - freeze: look (one image still at the nominal speed), sharpness (blur ≤ sharpBlurDeg), bend;
 * - creep: look (forward at both ends of the tolerance with no wrap between them, apparent
 *   speed within a factor of 3 of the one wanted), sharpness (blur ≤ creepBlurPitches), bend;
 * - natural: blur (at least one pitch) and smoothness (residual contrast ≤ maxResidualContrast);
 * - honest: look (nothing misleading at any speed within the tolerance) and bend (or an even disc).
 * Settings that reach the goal are ranked by score; the rest never rank above them and are
 * offered as near misses, fewest conditions failed first. Score (0…100) multiplies factors in
 * (0, 1], each a documented judgement:
 * - freeze: stillness 1/(1 + |apparent rpm|) · sharpness 1/(1 + blur°/sharpBlurDeg) · straightness;
 * - creep: closeness 1/(1 + |ln(a/wanted)|) · clarity 1/(1 + 4·blur pitches) · straightness;
 * - natural: min(1, blur pitches) · (1 − residual contrast), halved when the faint pattern left misleads;
 * - honest: 1 (true speed), 0.8 (slower forward), 0.2 (misleading) · straightness;
 * straightness is 1/(1 + bend in pitches), and 1 for an even disc (nothing left to bend).
 * With the settings comes what would lift each condition (CameraNeeds): the frame rates in the
 * camera's span that show the look, the longest sharp exposure, the shortest exposure that
 * blurs a pitch, the longest readout within the bend limit.
 *
 * Units: frames/s, seconds, degrees, rev/s; apparent speeds in rpm. Throws InputError for no
 * frame rates, a rate ≤ 0, no shutter angles or exposures, an angle outside (0, 360], an
 * exposure ≤ 0, none that fits in a frame, a negative readout, a bad part, an unknown goal, a
 * creep ≤ 0, bad options, or a frame rate at which over a million features pass per frame.
 *
 * @example
 * // Wikipedia, "Stroboscopic effect": a 12-spoke wheel at 2 rev/s filmed at 24 frames/s looks still.
 * cameraPlan({ frameRatesHz: [24, 25, 30], exposuresS: [1 / 1000], readoutS: 0 },
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
  const limits: Limits = {
    sharpBlurDeg: requirePositive(opts?.sharpBlurDeg ?? 2, 'sharp blur limit'),
    creepBlurPitches: requirePositive(opts?.creepBlurPitches ?? 0.5, 'creep blur limit'),
    maxResidual: requirePositive(opts?.maxResidualContrast ?? 0.1, 'smooth disc contrast'),
    maxBendPitches: requirePositive(opts?.maxBendPitches ?? 1, 'bend limit'),
  };
  const look = checkLookOptions(opts);
  const combos = settingsOf(camera);
  const readoutS = requireNonNegative(camera.readoutS, 'readout time');
  const conditions = GOAL_CONDITIONS[g.kind];

  const context: PlanContext = { part: p, goal: g, conditions, readoutS, look, limits };
  const all = combos.map((combo) => evaluate(combo, context));
  const byScore = (a: CameraSetting, b: CameraSetting) =>
    b.score - a.score || b.frameRate - a.frameRate || a.exposureS - b.exposureS;
  const settings = all.filter((s) => s.reaches).sort(byScore);
  const nearMisses = all
    .filter((s) => !s.reaches)
    .sort((a, b) => a.blocks.length - b.blocks.length || byScore(a, b))
    .slice(0, NEAR_MISSES);
  const met: Partial<Record<CameraCondition, number>> = {};
  for (const c of conditions) met[c] = all.filter((s) => !s.blocks.includes(c)).length;
  const rates = combos.map((c) => c.frameRate);
  const span = { minHz: Math.min(...rates), maxHz: Math.max(...rates) };

  return {
    goal: g.kind,
    conditions,
    met,
    weighed: all.length,
    span,
    needs: needsOf(context, span, combos),
    settings,
    nearMisses,
    // docs/physics.md §4 and §10: freezing or creeping is aliased by intent; any other setting that
    // is not the true motion is aliased too.
    cautions: cautionCodes({
      apparentStillness:
        g.kind === 'freeze' || g.kind === 'creep' || all.some((s) => s.look !== 'true'),
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

function settingsOf(camera: CameraAbilities): Combo[] {
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
  const out: Combo[] = [];
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
