// The camera planner's entries (what the camera can do, the goal) and its ranked settings,
// from the core's cameraPlan (docs/physics.md §2–§5). The part is the set-up's chosen part; "Open
// in check" copies a setting into the set-up's camera.
import { batch, computed, signal } from '@preact/signals';
import {
  cameraPlan,
  standardFrameRates,
  type CameraAbilities,
  type CameraGoal,
  type CameraPlan,
  type CameraSetting,
  type CautionContext,
} from '../core';
import { activeCorePart } from './model';
import { keepLastGood } from './outcome';
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
  cameraPlan(
    abilities.value,
    activeCorePart(setup.value),
    goalOf(goalKind.value, setup.value.creepRpm),
  ),
);

/**
 * Cautions of a plan (docs/physics.md §4, §10): the stillness caution whenever the plan can show an
 * aliased view (a freeze or creep by intent, or any setting that is not the true motion), as
 * the core's own cautions for the plan say.
 */
export function cameraCautions(plan: CameraPlan): CautionContext {
  return { apparentStillness: plan.cautions.includes('stillness') };
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
