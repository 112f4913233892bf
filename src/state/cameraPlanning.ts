// The camera planner's entries (what the camera can do, the goal) and its ranked settings,
// from the core's cameraPlan (docs/physics.md §2–§5). The part is the set-up's chosen part; "Open
// in check" copies a setting into the set-up's camera.
import { batch, computed } from '@preact/signals';
import {
  cameraPlan,
  standardFrameRates,
  type CameraAbilities,
  type CameraGoal,
  type CameraPlan,
  type CameraSetting,
  type CautionContext,
} from '../core';
import { activeCorePart, defaultCameraInputs } from './model';
import {
  exposuresS,
  goalKind,
  otherRatesHz,
  planReadoutMs,
  setToolInputs,
  shutterAnglesDeg,
  standardLabelsOn,
  toolInputs,
} from './toolInputs';
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

/** What the planner starts with (model/tools.ts), under the names the screens use. */
export const defaultCameraEntries = {
  ...defaultCameraInputs,
} as const;

export {
  exposuresS,
  goalKind,
  otherRatesHz,
  planReadoutMs,
  shutterAnglesDeg,
  standardLabelsOn,
} from './toolInputs';

/** Puts the planner back to its starting entries (tests, and a fresh start). */
export function resetCameraEntries(): void {
  setToolInputs({ ...toolInputs.peek(), camera: structuredClone(defaultCameraInputs) });
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
