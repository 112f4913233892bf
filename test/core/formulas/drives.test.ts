import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  beltSpeedHz,
  gearSpeedHz,
  motorSpeedHz,
  slipFromSpeed,
  synchronousSpeedHz,
  tyreDiameterM,
  wheelSpeedHz,
} from '../../../src/core/formulas/drives';
import {
  anyFinite,
  anyPositive,
  bad,
  expectInputError,
  finiteOrInputError,
  notNumbers,
} from '../expectInputError';

describe('synchronousSpeedHz', () => {
  // Synchronous speed table, IEC 60034-1 / NEMA MG 1: 120·fm/P rpm.
  it.each([
    [2, 3600],
    [4, 1800],
    [6, 1200],
    [8, 900],
  ])('turns a %i-pole motor on 60 Hz mains at %i rpm', (poles, rpm) => {
    expect(synchronousSpeedHz(60, poles) * 60).toBeCloseTo(rpm, 9);
  });

  it.each([
    [2, 3000],
    [4, 1500],
    [6, 1000],
    [8, 750],
  ])('turns a %i-pole motor on 50 Hz mains at %i rpm', (poles, rpm) => {
    expect(synchronousSpeedHz(50, poles) * 60).toBeCloseTo(rpm, 9);
  });

  it('gives 30 rev/s for 4 poles at 60 Hz (doc example)', () => {
    expect(synchronousSpeedHz(60, 4)).toBe(30);
  });

  it('refuses an odd number of poles: they come in pairs', () => {
    expectInputError(() => synchronousSpeedHz(50, 3), 'poles', 'pairs');
  });

  it('rejects poles that are not a whole number of at least 2, and mains not above zero', () => {
    for (const poles of [0, 1, 1.5, -2])
      expectInputError(() => synchronousSpeedHz(50, poles), 'poles');
    expectInputError(() => synchronousSpeedHz(0, 4), 'mains frequency');
    expectInputError(() => synchronousSpeedHz(-50, 4), 'mains frequency');
    for (const v of notNumbers) {
      expectInputError(() => synchronousSpeedHz(bad(v), 4), 'mains frequency');
      expectInputError(() => synchronousSpeedHz(50, bad(v)), 'poles');
    }
  });
});

describe('motorSpeedHz and slipFromSpeed', () => {
  // Typical full-load speeds (Engineering ToolBox tables): 60 Hz 3500/1770/1170/870 rpm,
  // 50 Hz 2900/1450/960/720 rpm for 2/4/6/8 poles; slip σ = 1 − f/f_sync.
  it.each([
    [60, 2, 3500, 3600],
    [60, 4, 1770, 1800],
    [60, 6, 1170, 1200],
    [60, 8, 870, 900],
    [50, 2, 2900, 3000],
    [50, 4, 1450, 1500],
    [50, 6, 960, 1000],
    [50, 8, 720, 750],
  ])(
    'finds the slip of a %i Hz %i-pole motor running at %i rpm (synchronous %i rpm)',
    (mains, poles, rpm, syncRpm) => {
      const slip = slipFromSpeed(rpm / 60, mains, poles);
      expect(slip).toBeCloseTo((syncRpm - rpm) / syncRpm, 12);
      expect(slip).toBeGreaterThan(0.015); // full-load slip of these motors: 1.7 % to 4 %
      expect(slip).toBeLessThan(0.041);
      expect(motorSpeedHz(mains, poles, slip) * 60).toBeCloseTo(rpm, 9);
    },
  );

  it('states the literal results of its doc examples', () => {
    expect(motorSpeedHz(50, 4, 1 / 30)).toBe(24.166666666666668); // 1450 rpm
    expect(slipFromSpeed(29.5, 60, 4)).toBe(0.01666666666666672); // 1770 vs 1800 rpm: 1/60
  });

  it('runs at synchronous speed with no slip and stands still with full slip', () => {
    expect(motorSpeedHz(60, 2, 0)).toBe(60);
    expect(motorSpeedHz(60, 2, 1)).toBe(0);
  });

  it('rejects slip outside 0 to 1 and negative speeds', () => {
    expectInputError(() => motorSpeedHz(50, 4, -0.01), 'slip');
    expectInputError(() => motorSpeedHz(50, 4, 1.01), 'slip');
    expectInputError(() => slipFromSpeed(-1, 50, 4), 'speed');
    for (const v of notNumbers) {
      expectInputError(() => motorSpeedHz(50, 4, bad(v)), 'slip');
      expectInputError(() => slipFromSpeed(bad(v), 50, 4), 'speed');
    }
  });
});

describe('beltSpeedHz and gearSpeedHz', () => {
  it('drives a 250 mm pulley from a 100 mm one at 30 rev/s at 12 rev/s (doc example: f2 = f1·D1/D2)', () => {
    expect(beltSpeedHz(30, 0.1, 0.25)).toBe(12);
    expect(beltSpeedHz(-30, 0.1, 0.25)).toBeCloseTo(-12, 12); // an open belt keeps the direction
  });

  it('turns a 60-tooth gear meshed with a 20-tooth one at 30 rev/s at 10 rev/s the other way (doc example)', () => {
    expect(gearSpeedHz(30, 20, 60)).toBe(-10); // f2 = −f1·z1/z2
    expect(gearSpeedHz(-10, 60, 20)).toBe(30);
  });

  it('rejects pulley diameters not above zero and tooth counts that are not whole numbers of at least 1', () => {
    expectInputError(() => beltSpeedHz(30, 0, 0.25), 'driver pulley diameter');
    expectInputError(() => beltSpeedHz(30, 0.1, -0.25), 'driven pulley diameter');
    for (const z of [0, 1.5, -2]) {
      expectInputError(() => gearSpeedHz(30, z, 60), 'driver teeth');
      expectInputError(() => gearSpeedHz(30, 20, z), 'driven teeth');
    }
    for (const v of notNumbers) {
      expectInputError(() => beltSpeedHz(bad(v), 0.1, 0.25), 'driver speed');
      expectInputError(() => beltSpeedHz(30, bad(v), 0.25), 'driver pulley diameter');
      expectInputError(() => gearSpeedHz(bad(v), 20, 60), 'driver speed');
    }
  });
});

describe('tyreDiameterM', () => {
  // ISO 4000-1 / ETRTO designation W/AR R d: D = d·25.4 mm + 2·W·AR/100 mm (arithmetic of the size).
  it('gives 0.6319 m for 205/55R16: 406.4 mm rim + 2 × 112.75 mm sidewall (doc example)', () => {
    expect(tyreDiameterM('205/55R16')).toBe(0.6319);
  });

  it.each([
    ['195/65R15', 0.6345], // 381 + 2 × 126.75
    ['225/45ZR17', 0.6343], // 431.8 + 2 × 101.25
    ['175/70R13', 0.5752], // 330.2 + 2 × 122.5
    ['315/80R22.5', 1.0755], // 571.5 + 2 × 252
    ['205/55 R16 91V', 0.6319], // load index and speed symbol after the size
    [' 205 / 55 r16 ', 0.6319], // spaces and lower case
  ])('reads %s as %f m', (size, metres) => {
    expect(tyreDiameterM(size)).toBeCloseTo(metres, 10);
  });

  it.each([
    [''],
    ['205/55'],
    ['R16'],
    ['205/55R'],
    ['205/55R165'],
    ['205/55R7'],
    ['205/5R16'],
    ['big wheel'],
    ['205-55-16'],
  ])('rejects %j as not a tyre size', (size) => {
    expectInputError(() => tyreDiameterM(size), 'tyre size');
  });

  it.each([['20/55R16'], ['205/55R40'], ['999/55R16']])(
    'rejects %s as outside real tyre sizes',
    (size) => {
      expectInputError(() => tyreDiameterM(size), 'tyre size', 'outside real tyre sizes');
    },
  );

  it.each([[205], [null], [undefined], [NaN]])('rejects %s, which is not text', (size) => {
    expectInputError(() => tyreDiameterM(bad(size)), 'tyre size');
  });
});

describe('wheelSpeedHz', () => {
  it('turns a 205/55R16 wheel at 13.99 rev/s at 100 km/h (f = v/(π·D))', () => {
    // 27.78 m/s / (π × 0.6319 m) = 13.9926 rev/s; the doc example's literal result.
    expect(wheelSpeedHz(100 / 3.6, 0.6319)).toBe(13.992627445613348);
    expect(wheelSpeedHz(100 / 3.6, tyreDiameterM('205/55R16'))).toBeCloseTo(13.9926, 4);
  });

  it('rejects a wheel diameter not above zero and a ground speed that is not a number', () => {
    expectInputError(() => wheelSpeedHz(10, 0), 'wheel diameter');
    for (const v of notNumbers) {
      expectInputError(() => wheelSpeedHz(bad(v), 0.6), 'ground speed');
      expectInputError(() => wheelSpeedHz(10, bad(v)), 'wheel diameter');
    }
  });
});

describe('drives: never NaN or Infinity', () => {
  it('returns a finite number or throws InputError for any finite input', () => {
    fc.assert(
      fc.property(
        anyFinite(),
        anyPositive(),
        anyPositive(),
        fc.integer({ min: 1, max: 1000 }),
        fc.integer({ min: 1, max: 100_000 }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (f, a, b, poles, teeth, slip) =>
          finiteOrInputError(() => synchronousSpeedHz(a, poles)) &&
          finiteOrInputError(() => motorSpeedHz(a, poles, slip)) &&
          finiteOrInputError(() => slipFromSpeed(Math.abs(f), a, poles)) &&
          finiteOrInputError(() => beltSpeedHz(f, a, b)) &&
          finiteOrInputError(() => gearSpeedHz(f, teeth, 1)) &&
          finiteOrInputError(() => wheelSpeedHz(f, b)),
      ),
      { numRuns: 500 },
    );
  });

  it('turns an overflowing result into an InputError naming the input to check', () => {
    expectInputError(() => gearSpeedHz(1e308, 100_000, 1), 'driver speed');
    expectInputError(() => wheelSpeedHz(1e300, 1e-300), 'ground speed');
    expectInputError(() => synchronousSpeedHz(1.7e308, 2), 'mains frequency');
  });
});
