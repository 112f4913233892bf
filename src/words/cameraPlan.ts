// The camera plan in words, from the core's codes and numbers (src/core/plans/cameraPlan.ts): what
// each setting looks like, which condition of the goal it fails, and what would lift it.
import type { CameraCondition, CameraPlan, CameraSetting } from '../core';
import { formatExposure, formatNumber, formatPrecise } from './format';
import { lookPhrase, lookWords } from './look';

export type GoalKind = CameraPlan['goal'];

export const GOAL_WORDS: Record<GoalKind, string> = {
  freeze: 'the part stands still with sharp features',
  creep: 'the part turns slowly forward',
  natural: 'a smoothly blurred disc, as the eye sees a fast part',
  honest: 'nothing misleading: never still, nearly still, backward or of unclear direction',
};

/** The condition's name as a person would say it. */
export const CONDITION_NAMES: Record<CameraCondition, string> = {
  look: 'Look',
  sharpness: 'Sharpness',
  blur: 'Blur',
  smoothness: 'Smoothness',
  bend: 'Rolling shutter',
};

/** What the condition asks for, per goal. */
const LOOK_WANTED: Record<GoalKind, string> = {
  freeze: 'one image standing still',
  creep: 'a slow forward turn near the one wanted, at every speed within the tolerance',
  natural: '',
  honest: 'nothing misleading at any speed within the tolerance',
};

/** The Looks column: an even disc shows no look at all; otherwise the core's look. */
export function settingLook(s: CameraSetting): string {
  return s.evenDisc ? 'Even disc' : lookWords(s.look, 1, s.apparentRpm);
}

function pitches(p: number): string {
  return `${formatNumber(p)} ${p === 1 ? 'pitch' : 'pitches'}`;
}

/**
 * What the setting shows, in a few sentences: the look, the blur, the bend, the readout, and
 * which conditions of the goal it fails.
 * @example settingWords(setting, plan) // "Looks still. Blur 9° (0.05 pitches): over the 2° kept sharp. …"
 */
export function settingWords(s: CameraSetting, plan: CameraPlan): string {
  const words: string[] = [];
  if (s.evenDisc) {
    words.push(`Blur of ${pitches(s.blurPitches)} smears the features into an even disc.`);
    if (s.misleading)
      words.push(
        `The faint pattern left (contrast ${formatNumber(s.residualContrast, 2)}) ${faintLook(s)}.`,
      );
  } else {
    words.push(`${lookWords(s.look, 1, s.apparentRpm)}.`);
    if (s.misleading && s.look !== 'still')
      words.push('Within the speed tolerance it can look still, nearly still or backward.');
    if (s.driftsWithinTolerance)
      words.push('Freezes only at the nominal speed; within the tolerance it drifts.');
    words.push(
      s.blurPitches >= 1
        ? `Blur ${pitches(s.blurPitches)}, yet the pattern still shows (contrast ${formatNumber(s.residualContrast, 2)}).`
        : `Blur ${formatNumber(s.blurDegrees)}° (${pitches(s.blurPitches)}).`,
    );
    if (s.skewDegrees > 0)
      words.push(
        s.skewPitches >= 1
          ? `The rolling shutter turns it ${formatNumber(s.skewDegrees)}° (${pitches(s.skewPitches)}) while the frame is read: the features break into pieces.`
          : `The rolling shutter bends the features by ${formatNumber(s.skewDegrees)}°.`,
      );
  }
  if (s.readoutLongerThanFrame)
    words.push(
      `The readout is longer than a frame (${formatNumber(1000 / s.frameRate)} ms): at this rate the camera must read faster or crop, so the bend given here is not what it will do.`,
    );
  if (s.blocks.length > 0)
    words.push(`Fails: ${s.blocks.map((c) => blockWords(c, s, plan)).join('; ')}.`);
  return words.join(' ');
}

function faintLook(s: CameraSetting): string {
  return s.look === 'backward' || s.look === 'still'
    ? lookPhrase(s.look, 1)
    : 'can look still or backward within the tolerance';
}

/** Why one setting fails one condition, in a short phrase with its numbers. */
export function blockWords(c: CameraCondition, s: CameraSetting, plan: CameraPlan): string {
  const n = plan.needs;
  switch (c) {
    case 'look':
      return `the look (${plan.goal === 'honest' && !s.evenDisc ? 'it misleads' : settingLook(s).toLowerCase()}; the goal needs ${LOOK_WANTED[plan.goal]})`;
    case 'sharpness':
      return `sharpness (${formatExposure(s.exposureS)} blurs ${formatNumber(s.blurDegrees)}°; needs ${formatExposure(n.sharpExposureS)} or shorter)`;
    case 'blur':
      return `blur (${pitches(s.blurPitches)}; an even disc needs ${formatExposure(n.discExposureS)} or longer)`;
    case 'smoothness':
      return `smoothness (the pattern keeps ${formatNumber(s.residualContrast, 2)} of its contrast)`;
    case 'bend':
      return `rolling shutter (${formatNumber(s.skewDegrees)}° while a frame is read: broken into pieces)`;
  }
}

/** One line of the plan's summary: a condition of the goal, how many settings meet it, what would lift it. */
export interface ConditionLine {
  condition: CameraCondition;
  /** Settings of the camera that meet it. */
  met: number;
  text: string;
}

/**
 * For each condition of the goal: met by how many of the camera's settings, and, where none
 * meets it, what blocks the goal and what would lift it (faster shutter, ND filter, another
 * rate, another camera).
 */
export function conditionLines(plan: CameraPlan, readoutMs: number): ConditionLine[] {
  return plan.conditions.map((condition) => {
    const met = plan.met[condition] ?? 0;
    const status =
      met === 0
        ? 'no setting of this camera meets it'
        : met === plan.weighed
          ? 'every setting meets it'
          : `${met} of ${plan.weighed} settings meet it`;
    const lift = met === plan.weighed ? '' : ` ${liftWords(condition, plan, readoutMs)}`;
    return {
      condition,
      met,
      text: `${CONDITION_NAMES[condition]}: ${status}.${lift}`,
    };
  });
}

/** What would lift a condition, in words, from the plan's needs. */
export function liftWords(c: CameraCondition, plan: CameraPlan, readoutMs: number): string {
  const n = plan.needs;
  const span = `${formatPrecise(plan.span.minHz)} and ${formatPrecise(plan.span.maxHz)} fps`;
  switch (c) {
    case 'look':
      if (plan.goal === 'freeze') {
        if (n.lookRateCount === 0)
          return `To stand still, a frame rate must go into the pattern's ${formatNumber(n.patternHz)} passes a second a whole number of times; none lies between ${span}.`;
        const offered = n.lookRates.filter((r) => r.offered).map((r) => rateText(r.rateHz));
        return (
          `It stands still at every rate that goes into the pattern's ${formatNumber(n.patternHz)} passes a second a whole number of times; between ${span}: ${rateList(
            n.lookRates.map((r) => r.rateHz),
            n.lookRateCount,
          )}. ` +
          (offered.length > 0
            ? `The camera offers ${offered.join(', ')}.`
            : 'The camera offers none of them: add one under "Other frame rates" if it can run at it.')
        );
      }
      if (plan.goal === 'creep') {
        if (n.lookRateCount === 0)
          return `No frame rate between ${span} shows that slow forward turn.`;
        const offered = n.lookRates.filter((r) => r.offered).map((r) => rateText(r.rateHz));
        return (
          `That slow forward turn shows at ${rateList(
            n.lookRates.map((r) => r.rateHz),
            n.lookRateCount,
          )}. ` +
          (offered.length > 0
            ? `The camera offers ${offered.join(', ')}.`
            : 'The camera offers none of them.')
        );
      }
      return `Every rate above ${rateText(n.faithfulAboveHz)} shows the true motion; at lower rates the part can look still, nearly still or backward. A long exposure that smears it into an even disc shows no misleading look either (the natural-blur goal).`;
    case 'sharpness':
      return plan.goal === 'creep'
        ? `The features stay apart with an exposure of ${formatExposure(n.sharpExposureS)} or shorter; the shortest on offer is ${formatExposure(n.shortestExposureS)}. A faster shutter (with more light) lifts this.`
        : `Sharp features need an exposure of ${formatExposure(n.sharpExposureS)} or shorter; the shortest on offer is ${formatExposure(n.shortestExposureS)}. A faster shutter (with more light) lifts this.`;
    case 'blur':
      return `An even disc needs an exposure of ${formatExposure(n.discExposureS)} or longer (one pitch of blur); the longest on offer is ${formatExposure(n.longestExposureS)}. A slower shutter or a wider shutter angle lifts this, with an ND filter so the picture is not over-exposed${n.discExposureS * plan.span.minHz > 1 ? `; a frame at ${formatPrecise(plan.span.minHz)} fps is shorter than that, so it also needs a frame rate of ${rateText(n.patternHz)} or lower` : ''}.`;
    case 'smoothness': {
      // Whole pitches that still fit in a frame at the camera's slowest rate.
      const whole = [1, 2, 3, 4]
        .map((k) => k * n.discExposureS)
        .filter((t) => t * plan.span.minHz <= 1 + 1e-9);
      return whole.length > 0
        ? `The pattern fades fully at an exposure of a whole number of pitches: ${whole.map(formatExposure).join(', ')}.`
        : `The pattern fades fully at an exposure of a whole number of pitches, ${formatExposure(n.discExposureS)} or more: longer than a frame at ${formatPrecise(plan.span.minHz)} fps, so it needs a frame rate of ${rateText(n.patternHz)} or lower.`;
    }
    case 'bend':
      return `During the ${formatNumber(readoutMs)} ms readout the part turns more than a pitch, breaking the features into pieces. It needs a readout of ${formatNumber(n.bendReadoutS * 1000)} ms or shorter: a camera with a faster readout or a global shutter.`;
  }
}

function rateText(hz: number): string {
  return `${formatPrecise(hz)} fps`;
}

/** Every rate, highest first, with a note when more exist than are listed. */
function rateList(ratesHz: number[], count: number): string {
  const listed = ratesHz.map(rateText).join(', ');
  return count > ratesHz.length ? `${listed} and ${count - ratesHz.length} slower` : listed;
}

/** What would lift a condition, in a few words for the answer at the top. */
function shortLift(c: CameraCondition, plan: CameraPlan): string {
  const n = plan.needs;
  switch (c) {
    case 'look':
      // Rates the camera does not offer are named as what the goal needs, never as a setting:
      // only the person knows whether the camera can run at them.
      if (plan.goal === 'honest') return `a frame rate above ${rateText(n.faithfulAboveHz)}`;
      return n.lookRateCount > 0
        ? `a frame rate this camera does not offer, such as ${n.lookRates
            .slice(0, 3)
            .map((r) => rateText(r.rateHz))
            .join(', ')} (add it under Other frame rates if the camera can run at it)`
        : 'a frame rate outside this camera’s span';
    case 'sharpness':
      return `${formatExposure(n.sharpExposureS)} or shorter: a faster shutter, more light`;
    case 'blur':
      return `${formatExposure(n.discExposureS)} or longer: a slower shutter with an ND filter`;
    case 'smoothness':
      return `an exposure of a whole number of pitches, such as ${formatExposure(n.discExposureS)}`;
    case 'bend':
      return `a readout of ${formatNumber(n.bendReadoutS * 1000)} ms or shorter: a global shutter`;
  }
}

/**
 * Which conditions block the goal, for the answer at the top: those no setting of the camera
 * meets; or, when each is met by some setting but none meets all, those the closest setting fails.
 * @example blockedLines(plan) // ["Sharpness: needs 1/18,000 s or shorter: a faster shutter, more light", …]
 */
export function blockedLines(plan: CameraPlan): string[] {
  const none = plan.conditions.filter((c) => (plan.met[c] ?? 0) === 0);
  const blocking = none.length > 0 ? none : (plan.nearMisses[0]?.blocks ?? []);
  return blocking.map((c) => `${CONDITION_NAMES[c]}: needs ${shortLift(c, plan)}`);
}
