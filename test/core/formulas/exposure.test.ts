import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  blurDegrees,
  blurPitches,
  exposureFromShutterAngle,
  flashArcBlurM,
  rollingSkewDegrees,
  shutterAngleFromExposure,
} from '../../../src/core/formulas/exposure';
import {
  anyFinite,
  bad,
  expectInputError,
  finiteOrInputError,
  notNumbers,
} from '../expectInputError';

describe('exposureFromShutterAngle', () => {
  it('gives 1/48 s for 180° at 24 frames/s (the cinema rule)', () => {
    // Shutter angle at 24 frames/s: 180° = 1/48 s (docs/physics.md §13).
    expect(exposureFromShutterAngle(180, 24)).toBeCloseTo(1 / 48, 15);
    expect(exposureFromShutterAngle(180, 24)).toBe(0.020833333333333332); // doc block literal
  });

  it('gives 1/50 s for 172.8° and 1/60 s for 144° at 24 frames/s', () => {
    // Shutter angle at 24 frames/s: 172.8° = 1/50 s, 144° = 1/60 s (docs/physics.md §13).
    expect(exposureFromShutterAngle(172.8, 24)).toBeCloseTo(1 / 50, 15);
    expect(exposureFromShutterAngle(144, 24)).toBeCloseTo(1 / 60, 15);
  });

  it('gives the whole frame time for 360°', () => {
    expect(exposureFromShutterAngle(360, 30000 / 1001)).toBeCloseTo(1001 / 30000, 15); // SMPTE ST 12-1 rate
  });

  it('rejects angles outside (0°, 360°] and rates not above zero', () => {
    expectInputError(() => exposureFromShutterAngle(0, 24), 'shutter angle');
    expectInputError(() => exposureFromShutterAngle(-90, 24), 'shutter angle');
    expectInputError(() => exposureFromShutterAngle(361, 24), 'shutter angle', 'at most 360');
    expectInputError(() => exposureFromShutterAngle(180, 0), 'frame rate');
    expectInputError(() => exposureFromShutterAngle(180, -24), 'frame rate');
    for (const v of notNumbers) {
      expectInputError(() => exposureFromShutterAngle(bad(v), 24), 'shutter angle');
      expectInputError(() => exposureFromShutterAngle(180, bad(v)), 'frame rate');
    }
  });
});

describe('shutterAngleFromExposure', () => {
  it('gives 172.8° for 1/50 s at 24 frames/s (doc example) and 180° for 1/48 s', () => {
    expect(shutterAngleFromExposure(1 / 50, 24)).toBe(172.8); // doc block literal
    expect(shutterAngleFromExposure(1 / 48, 24)).toBeCloseTo(180, 12);
    expect(shutterAngleFromExposure(1 / 60, 24)).toBeCloseTo(144, 12);
  });

  it('undoes exposureFromShutterAngle', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.1, max: 360, noNaN: true }),
        fc.double({ min: 1, max: 1000, noNaN: true }),
        (a, s) => {
          return (
            Math.abs(shutterAngleFromExposure(exposureFromShutterAngle(a, s), s) - a) <= 1e-9 * a
          );
        },
      ),
    );
  });

  it('refuses an exposure longer than one frame', () => {
    expectInputError(
      () => shutterAngleFromExposure(1 / 20, 24),
      'exposure',
      'longer than one frame',
    );
  });

  it('rejects exposures and rates not above zero', () => {
    expectInputError(() => shutterAngleFromExposure(0, 24), 'exposure');
    expectInputError(() => shutterAngleFromExposure(1 / 50, 0), 'frame rate');
    for (const v of notNumbers) {
      expectInputError(() => shutterAngleFromExposure(bad(v), 24), 'exposure');
      expectInputError(() => shutterAngleFromExposure(1 / 50, bad(v)), 'frame rate');
    }
  });
});

describe('blurDegrees and blurPitches', () => {
  it('turns 10.8° in 1/1000 s at 30 rev/s (doc example: 360·|f|·t)', () => {
    // docs/physics.md §5: blur 360·|f|·t degrees = 360 × 30 × 0.001.
    expect(blurDegrees(30, 1 / 1000)).toBe(10.8);
    expect(blurDegrees(-30, 1 / 1000)).toBe(10.8); // direction does not matter
  });

  it('smears a 6-blade fan at 30 rev/s over exactly one pitch in 1/180 s (doc example)', () => {
    // docs/physics.md §5: n·|f|·t pitches = 6 × 30 / 180.
    expect(blurPitches(30, 6, 1 / 180)).toBe(1);
    expect(blurPitches(30, 6, 1 / 180)).toBeCloseTo((blurDegrees(30, 1 / 180) * 6) / 360, 12);
  });

  it('gives no blur for a zero exposure or a part at rest', () => {
    expect(blurDegrees(30, 0)).toBe(0);
    expect(blurDegrees(0, 1)).toBe(0);
    expect(blurPitches(0, 3, 1)).toBe(0);
  });

  it('rejects bad speeds, exposures and feature counts', () => {
    expectInputError(() => blurDegrees(30, -0.001), 'exposure', 'negative');
    expectInputError(() => blurPitches(30, 6, -1), 'exposure');
    for (const n of [0, 1.5, -2])
      expectInputError(() => blurPitches(30, n, 0.01), 'features (blades, spokes)');
    for (const v of notNumbers) {
      expectInputError(() => blurDegrees(bad(v), 0.001), 'speed');
      expectInputError(() => blurDegrees(30, bad(v)), 'exposure');
      expectInputError(() => blurPitches(bad(v), 6, 0.001), 'speed');
      expectInputError(() => blurPitches(30, bad(v), 0.001), 'features (blades, spokes)');
      expectInputError(() => blurPitches(30, 6, bad(v)), 'exposure');
    }
  });
});

describe('flashArcBlurM', () => {
  it('moves a point 0.1 m out 2π·R·|f|·t = 0.314 mm during a 10 µs flash at 50 rev/s (doc example)', () => {
    // docs/physics.md §5: arc blur 2π·R·|f|·t.
    expect(flashArcBlurM(50, 0.1, 10e-6)).toBe(0.00031415926535897936);
    expect(flashArcBlurM(-50, 0.1, 10e-6)).toBeCloseTo(Math.PI * 1e-4, 15);
  });

  it('rejects negative radii and durations and non-numbers', () => {
    expectInputError(() => flashArcBlurM(50, -0.1, 1e-5), 'radius');
    expectInputError(() => flashArcBlurM(50, 0.1, -1e-5), 'flash duration');
    for (const v of notNumbers) {
      expectInputError(() => flashArcBlurM(bad(v), 0.1, 1e-5), 'speed');
      expectInputError(() => flashArcBlurM(50, bad(v), 1e-5), 'radius');
      expectInputError(() => flashArcBlurM(50, 0.1, bad(v)), 'flash duration');
    }
  });
});

describe('rollingSkewDegrees', () => {
  it('turns a part at 10 rev/s by 108° while a phone reads a frame in 30 ms', () => {
    // docs/physics.md §5: 360·|f|·T; phone readout typically 22–33 ms at 30 frames/s (Ringaby & Forssén, IJCV 2011).
    expect(rollingSkewDegrees(10, 0.03)).toBe(108); // doc block literal
    expect(rollingSkewDegrees(10, 0.022)).toBeCloseTo(79.2, 12);
    expect(rollingSkewDegrees(10, 0.033)).toBeCloseTo(118.8, 12);
  });

  it('rejects a negative readout time and non-numbers', () => {
    expectInputError(() => rollingSkewDegrees(10, -0.03), 'readout time');
    for (const v of notNumbers) {
      expectInputError(() => rollingSkewDegrees(bad(v), 0.03), 'speed');
      expectInputError(() => rollingSkewDegrees(10, bad(v)), 'readout time');
    }
  });
});

describe('exposure: never NaN or Infinity', () => {
  it('returns a finite number or throws InputError for any finite input', () => {
    fc.assert(
      fc.property(
        anyFinite(),
        anyFinite(),
        anyFinite(),
        fc.integer({ min: 1, max: 100_000 }),
        (a, b, c, n) => {
          return (
            finiteOrInputError(() => blurDegrees(a, b)) &&
            finiteOrInputError(() => blurPitches(a, n, b)) &&
            finiteOrInputError(() => exposureFromShutterAngle(a, b)) &&
            finiteOrInputError(() => shutterAngleFromExposure(a, b)) &&
            finiteOrInputError(() => flashArcBlurM(a, b, c)) &&
            finiteOrInputError(() => rollingSkewDegrees(a, b))
          );
        },
      ),
      { numRuns: 500 },
    );
  });

  it('turns an overflowing product into an InputError', () => {
    expectInputError(() => blurDegrees(1e300, 1e300), 'speed');
    expectInputError(() => exposureFromShutterAngle(360, Number.MIN_VALUE), 'frame rate');
    expectInputError(() => rollingSkewDegrees(1e308, 1e308), 'speed');
  });
});
