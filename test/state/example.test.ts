import { describe, expect, it } from 'vitest';
import { apparentMotion, beltSpeedHz, motorSpeedHz, synchronousSpeedHz } from '../../src/core';
import { createExampleMachine, EXAMPLE_MACHINE_NAME, exampleSetup } from '../../src/state/example';
import { validateMachine, validateSetup } from '../../src/state/validate';

const NOW = '2025-05-01T07:00:00.000Z';

describe('the first-run example machine', () => {
  it('passes the same strict checks as any saved machine', () => {
    const m = createExampleMachine('example-1', NOW);
    expect(validateMachine(m)).toEqual(m);
    expect(m).toMatchObject({
      id: 'example-1',
      name: EXAMPLE_MACHINE_NAME,
      createdAt: NOW,
      updatedAt: NOW,
    });
  });

  it('has a 4-pole 50 Hz motor at the typical full-load 1450 rpm', () => {
    const motor = exampleSetup.parts[0];
    // Synchronous speed 120·50/4 = 1500 rpm (IEC 60034-1 / NEMA MG 1 table, docs/physics.md).
    expect(synchronousSpeedHz(motor.motor!.mainsHz, motor.motor!.poles) * 60).toBeCloseTo(1500, 9);
    // Typical full-load speed of a 4-pole 50 Hz motor: 1450 rpm (Engineering ToolBox table, docs/physics.md).
    expect(motor.speedRpm).toBeCloseTo(1450, 6);
    expect(motorSpeedHz(50, 4, motor.motor!.slipPercent / 100) * 60).toBeCloseTo(motor.speedRpm, 6);
  });

  it('drives the fan through the belt ratio: 1450 · 140/200 = 1015 rpm', () => {
    const [motor, fan] = exampleSetup.parts;
    // Belt drive without slip, f2 = f1·D1/D2 (docs/physics.md §8); 1450 × 0.7 = 1015 by hand.
    expect(fan.speedRpm).toBeCloseTo(1015, 6);
    expect(beltSpeedHz(motor.speedRpm / 60, 0.14, 0.2) * 60).toBeCloseTo(fan.speedRpm, 9);
    expect(exampleSetup.parts[exampleSetup.activePart]).toBe(fan);
  });

  it('sets the strobe to one flash per fan turn, inside its range, which shows the blades still', () => {
    const fan = exampleSetup.parts[exampleSetup.activePart];
    const { rateFpm, minFpm, maxFpm } = exampleSetup.strobe;
    expect(rateFpm).toBe(1015);
    expect(rateFpm).toBeGreaterThanOrEqual(minFpm);
    expect(rateFpm).toBeLessThanOrEqual(maxFpm);
    // The fan runs 0.35 rpm faster than the flashes, which the eye reads as nearly still.
    const seen = apparentMotion(
      { speedHz: fan.speedRpm / 60, symmetry: fan.features },
      rateFpm / 60,
    );
    expect(Math.abs(seen.apparentHz * 60)).toBeLessThan(1);
  });

  it('says it is invented and carries the lock-out caution in its notes', () => {
    const m = createExampleMachine('example-1', NOW);
    expect(m.notes).toMatch(/invented/);
    expect(m.notes).toMatch(/still turning: isolate and lock out/);
  });

  it('gives each caller its own copy, so editing it never changes the template', () => {
    const m = createExampleMachine('example-1', NOW);
    m.setup.parts[1].features = 3;
    expect(exampleSetup.parts[1].features).toBe(8);
    expect(validateSetup(createExampleMachine('e', NOW).setup)).toEqual(exampleSetup);
  });
});
