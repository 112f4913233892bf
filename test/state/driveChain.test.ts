// Drive links and wheels in a set-up: how saved data carries them (validate.ts, file-format.md),
// and how the whole-machine screen turns them into speeds (state/chain.ts).
// Invented test data: the conveyor of a fictional sawmill, a motor, a belt, a gearbox, a drum.
import { describe, expect, test } from 'vitest';
import {
  beltSpeedHz,
  driveChain,
  gearSpeedHz,
  InputError,
  motorSpeedHz,
  tyreDiameterM,
  wheelSpeedHz,
} from '../../src/core';
import {
  deriveParts,
  withChainSpeeds,
  withDrive,
  withDrivenPart,
  withoutPart,
  withSpeedSource,
  wheelSpeedRpm,
  withWheel,
} from '../../src/state/driveChain';
import { setupWithDerivedSpeed } from '../../src/state/derivedSpeed';
import { defaultSetup, type Setup } from '../../src/state/model';
import { replaceSetup, setMotor, setSpeedRpm, setup } from '../../src/state/setup';
import { DataError, MAX_PARTS, validateSetup } from '../../src/state/validate';
import { bent } from './fixtures';
import { beltDriven, motorPart } from '../helpers/setups';

/** Motor (4 poles, 50 Hz, 3 % slip) → belt 100 → 250 mm → gearbox input → gear 20 → 60 teeth → drum. */
function conveyor(): Setup {
  const s = structuredClone(defaultSetup);
  s.parts = [
    motorPart(),
    beltDriven('Gearbox input', 0, 1, 2),
    {
      name: 'Drum',
      speedRpm: 0,
      features: 8,
      tolerancePercent: 0,
      drive: { from: 1, kind: 'gear', driverTeeth: 20, drivenTeeth: 60 },
    },
  ];
  return s;
}

describe('saved set-ups carry drives and wheels', () => {
  test('a set-up with a belt, a gear pair, a shaft and a wheel passes the checks unchanged', () => {
    const s = conveyor();
    s.parts.push({
      name: 'Drum bolts',
      speedRpm: 0,
      features: 12,
      tolerancePercent: 0,
      drive: { from: 2, kind: 'shaft' },
    });
    s.parts.push({
      name: 'Cart wheel',
      speedRpm: 0,
      features: 5,
      tolerancePercent: 2,
      wheel: { groundSpeed: 12, unit: 'mph', tyreSize: '185/65R15' },
    });
    expect(validateSetup(s)).toEqual(s);
  });

  test('a drive must come from an earlier part, counted from 0', () => {
    const later = bent(conveyor(), (c) => (c.parts[1].drive.from = 1));
    expect(() => validateSetup(later)).toThrow(
      /set-up › parts › 2 › drive › from must pick an earlier part: a whole number from 0 to 0 \(got 1\)/,
    );
    const first = bent(
      conveyor(),
      (c) => (c.parts[0] = { ...c.parts[1], drive: { from: 0, kind: 'shaft' } }),
    );
    expect(() => validateSetup(first)).toThrow(/the first part cannot be driven by another part/);
    const fraction = bent(conveyor(), (c) => (c.parts[2].drive.from = 0.5));
    expect(() => validateSetup(fraction)).toThrow(DataError);
  });

  test('each drive kind has exactly its own fields, within their ranges', () => {
    expect(() => validateSetup(bent(conveyor(), (c) => (c.parts[1].drive.kind = 'chain')))).toThrow(
      /kind must be one of "belt", "gear", "shaft"/,
    );
    expect(() =>
      validateSetup(bent(conveyor(), (c) => (c.parts[1].drive.driverTeeth = 20))),
    ).toThrow(/does not know: "driverTeeth"/);
    expect(() => validateSetup(bent(conveyor(), (c) => delete c.parts[1].drive.drivenMm))).toThrow(
      /drivenMm is missing/,
    );
    expect(() => validateSetup(bent(conveyor(), (c) => (c.parts[1].drive.driverMm = 0)))).toThrow(
      /driverMm must be a number above 0/,
    );
    expect(() =>
      validateSetup(bent(conveyor(), (c) => (c.parts[1].drive.slipPercent = 25))),
    ).toThrow(/slipPercent must be a number from 0 to 20/);
    expect(() =>
      validateSetup(bent(conveyor(), (c) => (c.parts[2].drive.drivenTeeth = 2.5))),
    ).toThrow(/drivenTeeth must be a whole number/);
    expect(() =>
      validateSetup(
        bent(conveyor(), (c) => (c.parts[2].drive = { from: 1, kind: 'shaft', driverMm: 1 })),
      ),
    ).toThrow(/does not know: "driverMm"/);
  });

  test('a wheel needs a ground speed in km/h or mph and a tyre size as text', () => {
    const wheel = (w: unknown) =>
      bent(
        conveyor(),
        (c) =>
          (c.parts[0] = { name: 'Wheel', speedRpm: 0, features: 5, tolerancePercent: 0, wheel: w }),
      );
    expect(() =>
      validateSetup(wheel({ groundSpeed: 50, unit: 'm/s', tyreSize: '205/55R16' })),
    ).toThrow(/unit must be one of "km\/h", "mph"/);
    expect(() =>
      validateSetup(wheel({ groundSpeed: 5000, unit: 'km/h', tyreSize: '205/55R16' })),
    ).toThrow(/groundSpeed must be a number from -1000 to 1000/);
    expect(() => validateSetup(wheel({ groundSpeed: 50, unit: 'km/h', tyreSize: '' }))).toThrow(
      /tyreSize must not be blank/,
    );
    expect(() => validateSetup(wheel({ groundSpeed: 50, unit: 'km/h', tyreSize: 1 }))).toThrow(
      /tyreSize must be text/,
    );
  });

  test('a part takes its speed from one source only', () => {
    const both = bent(
      conveyor(),
      (c) => (c.parts[1].motor = { mainsHz: 50, poles: 4, slipPercent: 3 }),
    );
    expect(() => validateSetup(both)).toThrow(
      /takes its speed from one source only, not from motor and drive/,
    );
  });
});

describe('speeds along the drives', () => {
  test('each part gets the band its chain gives, as the core computes it', () => {
    const parts = deriveParts(conveyor());
    // The same chain straight through the core: docs/physics.md §8 (motor 120·fm/P, belt D1/D2, gears z1/z2).
    const core = driveChain({
      root: { kind: 'fixed', speedHz: motorSpeedHz(50, 4, 0.03), tolerance: 0.01 },
      parts: [
        { name: 'Motor', symmetry: 1 },
        {
          name: 'Gearbox input',
          symmetry: 1,
          link: { kind: 'belt', driverDiameterM: 0.1, drivenDiameterM: 0.25, slipPercent: 2 },
        },
        { name: 'Drum', symmetry: 8, link: { kind: 'gear', driverTeeth: 20, drivenTeeth: 60 } },
      ],
    });
    parts.forEach((p, i) => {
      expect(p.speedHz).toBeCloseTo(core[i].speedHz, 12);
      expect(p.tolerance).toBeCloseTo(core[i].tolerance, 12);
      expect(p.index).toBe(i);
    });
    // Without slip the drum turns at 1455 · 100/250 · 20/60 = 194 rpm, the other way (external mesh).
    expect(gearSpeedHz(beltSpeedHz(1455 / 60, 0.1, 0.25), 20, 60) * 60).toBeCloseTo(-194, 9);
    expect(parts[2].highHz * 60).toBeCloseTo(194 * 1.01, 9);
    expect(parts[2].speedHz).toBeLessThan(0);
    expect(parts.map((p) => p.source)).toEqual(['motor', 'drive', 'drive']);
  });

  test('writing the speeds back gives every driven part its speed and tolerance in rpm and percent', () => {
    const s = withChainSpeeds(conveyor());
    const parts = deriveParts(conveyor());
    expect(s.parts[2].speedRpm).toBeCloseTo(parts[2].speedHz * 60, 9);
    expect(s.parts[2].tolerancePercent).toBeCloseTo(parts[2].tolerance * 100, 9);
    // The motor keeps what the set-up already held.
    expect(s.parts[0]).toEqual(conveyor().parts[0]);
    expect(validateSetup(s)).toEqual(s);
  });

  test('separate chains in one set-up are worked out separately', () => {
    const s = conveyor();
    s.parts.push({
      name: 'Cart wheel',
      speedRpm: 0,
      features: 5,
      tolerancePercent: 0,
      wheel: { groundSpeed: 100, unit: 'km/h', tyreSize: '205/55R16' },
    });
    s.parts.push({
      name: 'Hub bolts',
      speedRpm: 0,
      features: 5,
      tolerancePercent: 0,
      drive: { from: 3, kind: 'shaft' },
    });
    // The wheel's road speed gives its speed only when applied (one tap), which the chain then carries.
    expect(deriveParts(s)[3].speedHz).toBe(0);
    const rpm = wheelSpeedRpm(s.parts[3].wheel!);
    const parts = deriveParts(
      setupWithDerivedSpeed(s, 3, { speedRpm: rpm, origin: { method: 'road-speed' } }),
    );
    // Core doc example: 100 km/h on a 205/55R16 (ISO 4000-1 diameter 0.6319 m) = 13.9926 rev/s.
    expect(tyreDiameterM('205/55R16')).toBeCloseTo(0.6319, 9);
    expect(parts[3].speedHz).toBeCloseTo(wheelSpeedHz(100 / 3.6, 0.6319), 9);
    expect(parts[3].speedHz).toBeCloseTo(13.992627445613348, 9);
    expect(parts[4].speedHz).toBeCloseTo(parts[3].speedHz, 12);
    expect(parts[2].speedHz).toBeCloseTo(deriveParts(conveyor())[2].speedHz, 12);
  });

  test('a chain the core refuses throws its InputError, naming the part', () => {
    const s = withDrive(conveyor(), 1, {
      from: 0,
      kind: 'belt',
      driverMm: 100,
      drivenMm: 250,
      slipPercent: 20,
    });
    s.parts[0].tolerancePercent = 45;
    expect(() => deriveParts(s)).toThrow(InputError);
    expect(() => deriveParts(s)).toThrow(/Gearbox input is uncertain by more than ±50 %/);
    const broken = conveyor();
    broken.parts[1] = { ...broken.parts[1], drive: { from: 5, kind: 'shaft' } };
    expect(() => deriveParts(broken)).toThrow(
      /Gearbox input is driven by a part that is not before it/,
    );
  });

  test('a part geared up beyond a million rpm is refused rather than written', () => {
    const s = withDrive(conveyor(), 2, {
      from: 1,
      kind: 'gear',
      driverTeeth: 100_000,
      drivenTeeth: 1,
    });
    expect(() => withChainSpeeds(s)).toThrow(/Drum would turn at more than 1,000,000 rpm/);
  });
});

describe('editing the chain', () => {
  test('a new part starts on the same shaft as its driver; the set-up holds at most MAX_PARTS', () => {
    const s = withDrivenPart(conveyor(), 2);
    expect(s.parts[3]).toMatchObject({
      name: 'Part 4',
      features: 1,
      drive: { from: 2, kind: 'shaft' },
    });
    let full = conveyor();
    while (full.parts.length < MAX_PARTS) full = withDrivenPart(full, 0);
    expect(() => withDrivenPart(full, 0)).toThrow(`A set-up holds at most ${MAX_PARTS} parts`);
  });

  test('changing where a speed comes from keeps one source, and the first part cannot be driven', () => {
    const typed = withSpeedSource(conveyor(), 1, 'typed');
    expect(typed.parts[1].drive).toBeUndefined();
    const wheel = withSpeedSource(conveyor(), 0, 'wheel');
    expect(wheel.parts[0].motor).toBeUndefined();
    expect(wheel.parts[0].wheel).toEqual({ groundSpeed: 50, unit: 'km/h', tyreSize: '205/55R16' });
    expect(() => withSpeedSource(conveyor(), 0, 'drive')).toThrow(/first part cannot be driven/);
    const motor = withSpeedSource(withSpeedSource(conveyor(), 2, 'typed'), 2, 'motor');
    // Default motor: 4 poles on 50 Hz at 3 % slip = 1455 rpm (IEC 60034-1 synchronous 1500 rpm).
    expect(motor.parts[2].speedRpm).toBeCloseTo(1455, 9);
    expect(
      withWheel(conveyor(), 1, { groundSpeed: 3, unit: 'km/h', tyreSize: '155/80R13' }).parts[1]
        .drive,
    ).toBeUndefined();
  });

  test('removing a driver leaves the parts it drove at the speed they had, and renumbers later drives', () => {
    const before = withChainSpeeds(conveyor());
    const s = withoutPart(conveyor(), 1);
    expect(s.parts.map((p) => p.name)).toEqual(['Motor', 'Drum']);
    expect(s.parts[1].drive).toBeUndefined();
    expect(s.parts[1].speedRpm).toBeCloseTo(before.parts[2].speedRpm, 9);
    expect(s.parts[1].tolerancePercent).toBeCloseTo(before.parts[2].tolerancePercent, 9);
    const t = withoutPart(withDrivenPart(conveyor(), 2), 0);
    expect(t.parts[2].drive).toEqual({ from: 1, kind: 'shaft' });
    expect(() => withoutPart({ ...conveyor(), parts: [conveyor().parts[0]] }, 0)).toThrow(
      /at least one part/,
    );
    expect(validateSetup(t)).toEqual(t);
  });
});

describe('the check screen’s own speed fields', () => {
  test('a speed typed for a driven part makes it a typed speed, so the set-up stays one source per part', () => {
    replaceSetup({ ...conveyor(), activePart: 1 });
    setSpeedRpm(600);
    expect(setup.value.parts[1]).toEqual({
      name: 'Gearbox input',
      speedRpm: 600,
      features: 1,
      tolerancePercent: 0,
    });
    expect(validateSetup(setup.value)).toEqual(setup.value);
    // The drum is still driven from it, now from 600 rpm: 600 · 20/60 = 200 rpm, reversed.
    expect(deriveParts(setup.value)[2].speedHz * 60).toBeCloseTo(-200, 9);
  });

  test('a motor chosen for a driven part or a wheel replaces the drive or the wheel', () => {
    replaceSetup({ ...conveyor(), activePart: 2 });
    setMotor({ mainsHz: 60, poles: 6, slipPercent: 2 });
    expect(setup.value.parts[2].drive).toBeUndefined();
    // IEC 60034-1: 6 poles on 60 Hz = 1200 rpm synchronous; 2 % slip: 1176 rpm, the drum's direction kept.
    expect(setup.value.parts[2].speedRpm).toBeCloseTo(1176, 9);
    replaceSetup(withSpeedSource(conveyor(), 0, 'wheel'));
    setMotor({ mainsHz: 50, poles: 4, slipPercent: 3 });
    expect(setup.value.parts[0].wheel).toBeUndefined();
    expect(validateSetup(setup.value)).toEqual(setup.value);
  });
});
