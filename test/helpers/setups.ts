// Set-ups the behaviour tests share (invented machines, in the style of the first-run example).
import { defaultSetup, type PartSpec, type Setup } from '../../src/state/model';

/**
 * A 4-pole induction motor on 50 Hz at 3 % slip: (1 − 0.03)·120·50/4 = 1455 rpm (IEC 60034-1
 * synchronous speed), ±1 %: the first part of the drive-chain set-ups.
 */
export function motorPart(): PartSpec {
  return {
    name: 'Motor',
    speedRpm: 1455,
    features: 1,
    tolerancePercent: 1,
    motor: { mainsHz: 50, poles: 4, slipPercent: 3 },
  };
}

/** A part driven by the part before it through a 100 → 250 mm belt with `slipPercent` slip. */
export function beltDriven(
  name: string,
  speedRpm: number,
  features: number,
  slipPercent: number,
): PartSpec {
  return {
    name,
    speedRpm,
    features,
    tolerancePercent: speedRpm === 0 ? 0 : 1,
    drive: { from: 0, kind: 'belt', driverMm: 100, drivenMm: 250, slipPercent },
  };
}

/** The default set-up with these parts, the first one chosen. */
export function setupOf(parts: PartSpec[]): Setup {
  return { ...structuredClone(defaultSetup), parts, activePart: 0 };
}
