// The camera planner's entries (what the camera can do, the goal) and its ranked settings,
// from the core's cameraPlan (physics.md §2–§5). The part is the set-up's chosen part; "Open
// in check" copies a setting into the set-up's camera.
import { batch, computed, signal } from '@preact/signals';
import {
  cameraPlan,
  lockRates,
  ratesForApparent,
  standardFrameRates,
  type CameraAbilities,
  type CameraGoal,
  type CameraPlan,
  type CameraSetting,
  type CautionContext,
  type Part,
} from '../core';
import { keepLastGood } from './outcome';
import { CAMERA_RANGE, corePart } from './check';
import {
  setExposureSeconds,
  setFrameRate,
  setReadoutMs,
  setSamplerKind,
  setShutterAngle,
  setup,
} from './setup';

export type GoalKind = CameraGoal['kind'];

/** What the planner starts with: a phone's usual video modes (common practice). */
export const defaultCameraEntries = {
  /** Labels of standardFrameRates ticked: the rates a phone's video settings offer. */
  standardLabels: ['24', '25', '30', '60', '120', '240'],
  /** Frame rates typed in besides the standard ones, frames/s. */
  otherRatesHz: [] as number[],
  /** 180° is the cinema rule; a phone's automatic exposure often runs near it indoors. */
  shutterAnglesDeg: [180],
  /** Shutter speeds a phone's manual mode offers, seconds (1/500 … 1/4000 s). */
  exposuresS: [1 / 500, 1 / 1000, 1 / 2000, 1 / 4000],
  /** Typical phone readout, ms: Ringaby & Forssén, IJCV 2011, measured 22–33 ms at 30 frames/s. */
  readoutMs: 25,
  goal: 'freeze' as GoalKind,
};

export const standardLabelsOn = signal<string[]>([...defaultCameraEntries.standardLabels]);
export const otherRatesHz = signal<number[]>([...defaultCameraEntries.otherRatesHz]);
export const shutterAnglesDeg = signal<number[]>([...defaultCameraEntries.shutterAnglesDeg]);
export const exposuresS = signal<number[]>([...defaultCameraEntries.exposuresS]);
export const planReadoutMs = signal<number>(defaultCameraEntries.readoutMs);
export const goalKind = signal<GoalKind>(defaultCameraEntries.goal);

/** Puts the planner back to its starting entries (tests, and a fresh start). */
export function resetCameraEntries(): void {
  batch(() => {
    standardLabelsOn.value = [...defaultCameraEntries.standardLabels];
    otherRatesHz.value = [...defaultCameraEntries.otherRatesHz];
    shutterAnglesDeg.value = [...defaultCameraEntries.shutterAnglesDeg];
    exposuresS.value = [...defaultCameraEntries.exposuresS];
    planReadoutMs.value = defaultCameraEntries.readoutMs;
    goalKind.value = defaultCameraEntries.goal;
  });
}

/** Ticks or unticks a standard frame rate by its label. */
export function toggleStandardRate(label: string, on: boolean): void {
  const now = standardLabelsOn.value.filter((l) => l !== label);
  standardLabelsOn.value = on ? [...now, label] : now;
}

/** Every frame rate offered, ascending, without repeats (to a part in a billion). */
export function frameRatesOf(labels: readonly string[], others: readonly number[]): number[] {
  const rates = [
    ...standardFrameRates.filter((r) => labels.includes(r.label)).map((r) => r.hz),
    ...others,
  ].sort((a, b) => a - b);
  return rates.filter((r, i) => i === 0 || Math.abs(r - rates[i - 1]) > 1e-9 * r);
}

/** The goal for the core; the creep speed comes from the set-up (rpm → rev/s). */
export function goalOf(kind: GoalKind, creepRpm: number): CameraGoal {
  return kind === 'creep' ? { kind, creepHz: creepRpm / 60 } : { kind };
}

export const abilities = computed<CameraAbilities>(() => ({
  frameRatesHz: frameRatesOf(standardLabelsOn.value, otherRatesHz.value),
  shutterAnglesDeg: shutterAnglesDeg.value,
  exposuresS: exposuresS.value,
  readoutS: planReadoutMs.value / 1000,
}));

/** The ranked settings for the current entries and part, kept at the last good plan. */
export const cameraPlanning = keepLastGood<CameraPlan>(() =>
  cameraPlan(abilities.value, corePart(setup.value), goalOf(goalKind.value, setup.value.creepRpm)),
);

/** Cautions of a plan (physics.md §10): freezing, or any setting that can mislead. */
export function cameraCautions(plan: CameraPlan, kind: GoalKind): CautionContext {
  const all = [...plan.settings, ...plan.nearMisses];
  return {
    apparentStillness: kind === 'freeze' || all.some((s) => s.misleading || s.look === 'still'),
  };
}

/**
 * Copies a setting into the set-up's camera (frame rate, exposure, readout) and looks at the
 * part with the camera. The exposure keeps the form it was offered in: a shutter angle from the
 * angle list, else a time.
 */
export function applyCameraSetting(
  setting: CameraSetting,
  anglesDeg: readonly number[],
  readoutMs: number,
): void {
  const fromAngle = anglesDeg.some((a) => Math.abs(a - setting.shutterAngle) <= 1e-9 * a);
  batch(() => {
    setFrameRate(setting.frameRate);
    if (fromAngle) setShutterAngle(setting.shutterAngle);
    else setExposureSeconds(setting.exposureS);
    setReadoutMs(readoutMs);
    setSamplerKind('camera');
  });
}

/**
 * Why nothing reached the goal, in plain words, with the frame rates or exposures that would:
 * freeze needs n·|f|/k (lockRates, one image); a creep needs ratesForApparent; a natural disc
 * needs an exposure of at least one pitch, 1/(n·|f|) s; nothing misleading needs a rate above
 * 2·n·|f|·(1 + u) or that disc. Returns numbers for the screen to format.
 */
export function whyNoneReach(
  part: Required<Part>,
  goal: CameraGoal,
): { kind: GoalKind; ratesHz: number[]; minExposureS: number; faithfulAboveHz: number } {
  const patternHz = part.symmetry * Math.abs(part.speedHz);
  const minExposureS = patternHz > 0 ? 1 / patternHz : Infinity;
  const faithfulAboveHz = 2 * patternHz * (1 + part.tolerance);
  let ratesHz: number[] = [];
  if (patternHz > 0 && goal.kind === 'freeze') {
    ratesHz = lockRates({ ...part, tolerance: 0 }, CAMERA_RANGE, { maxImages: 1 })
      .map((l) => l.rateHz)
      .sort((a, b) => b - a);
  } else if (patternHz > 0 && goal.kind === 'creep') {
    const wanted = Math.sign(part.speedHz || 1) * goal.creepHz;
    ratesHz = ratesForApparent(part, wanted, CAMERA_RANGE, { sampler: 'frames' })
      .map((r) => r.rateHz)
      .sort((a, b) => b - a);
  }
  return { kind: goal.kind, ratesHz: ratesHz.slice(0, 4), minExposureS, faithfulAboveHz };
}
