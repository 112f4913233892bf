// Hostile and odd input to the core (the contract in DEVELOPERS.md): every exported function
// either returns only finite numbers or throws InputError, an Error that names the field and
// says what to type. Never NaN, never Infinity, never a TypeError or a hang. Seeded, so a
// failure reproduces.
import fc from 'fast-check';
import { describe, expect, it, vi } from 'vitest';
import * as core from '../../src/core';
import { InputError } from '../../src/core';
import { expectInputError, finiteOrInputError } from './expectInputError';

const settings = { seed: 1949, numRuns: 400 };
// Hundreds of cases per function on a shared machine; this only stops a hung run.
vi.setConfig({ testTimeout: 120_000 });

/** Doubles at the edges of the format, and ordinary ones. */
const hostileNumber = fc.oneof(
  fc.constantFrom(0, -0, 5e-324, 1e-320, 1e-300, 1e-12, 0.5, 1, 2, 60, 1e12, 1e300, 1e308, 1.7e308),
  fc.constantFrom(-1, -1e308, NaN, Infinity, -Infinity),
  fc.double({ noNaN: true, noDefaultInfinity: true }),
  fc.double({ min: 1e-3, max: 1e5, noNaN: true }),
);
const positive = fc.oneof(
  fc.constantFrom(5e-324, 1e-320, 1e-300, 1e-9, 0.5, 1, 24, 60, 1000, 1e12, 1e300, 1.7e308),
  fc.double({ min: Number.MIN_VALUE, noNaN: true, noDefaultInfinity: true }),
  fc.double({ min: 0.01, max: 1e4, noNaN: true }),
);
/** Wrongly typed things a caller might pass by mistake. */
const wrongType = fc.constantFrom<unknown>(undefined, null, 'x', '12', '', true, {}, [], [1, 2]);
const anyValue = fc.oneof(hostileNumber, wrongType);

const partArb = fc.oneof(
  fc.record({
    speedHz: hostileNumber,
    symmetry: fc.oneof(fc.integer({ min: 1, max: 100 }), hostileNumber),
    tolerance: fc.oneof(fc.constant(undefined), fc.double({ min: 0, max: 0.5, noNaN: true })),
  }),
  fc.record({ speedHz: anyValue, symmetry: anyValue, tolerance: anyValue }),
  wrongType,
);
const rangeArb = fc.oneof(
  fc.tuple(positive, positive).map(([a, b]) => ({ minHz: Math.min(a, b), maxHz: Math.max(a, b) })),
  fc.record({ minHz: anyValue, maxHz: anyValue }),
  wrongType,
);
const samplerArb = fc.constantFrom<unknown>(undefined, 'flash', 'frames', 'video', 3);
const lookArb = fc.oneof(
  fc.constant(undefined),
  fc.record({ sampler: samplerArb }),
  fc.record({
    sampler: samplerArb,
    stillHz: anyValue,
    nearlyStillHz: anyValue,
    maxImages: anyValue,
  }),
  wrongType,
);

/** Runs `compute`; true when it returned only finite numbers or threw InputError. */
const safe = (compute: () => unknown) => finiteOrInputError(compute);

describe('hostile input: the rate functions', () => {
  it('apparentMotion', () => {
    fc.assert(
      fc.property(partArb, anyValue, lookArb, (part, rate, look) =>
        safe(() => core.apparentMotion(part as never, rate as never, look as never)),
      ),
      settings,
    );
  });

  it('lockRates', () => {
    fc.assert(
      fc.property(partArb, rangeArb, anyValue, (part, range, maxImages) =>
        safe(() => core.lockRates(part as never, range as never, { maxImages } as never)),
      ),
      settings,
    );
  });

  it('ratesForApparent', () => {
    fc.assert(
      fc.property(partArb, anyValue, rangeArb, lookArb, (part, a, range, opts) =>
        safe(() => core.ratesForApparent(part as never, a as never, range as never, opts as never)),
      ),
      settings,
    );
  });

  it('rateBands', () => {
    fc.assert(
      fc.property(fc.array(partArb, { maxLength: 3 }), rangeArb, lookArb, (parts, range, opts) =>
        safe(() => core.rateBands(parts as never, range as never, opts as never)),
      ),
      settings,
    );
  });

  it('stillRates, freezeRates, noStillRates', () => {
    fc.assert(
      fc.property(
        fc.array(partArb, { minLength: 1, maxLength: 3 }),
        rangeArb,
        lookArb,
        anyValue,
        (parts, range, opts, step) => {
          const withStep = { ...(opts as object), settingStepHz: step };
          return (
            safe(() => core.stillRates(parts as never, range as never, opts as never)) &&
            safe(() => core.freezeRates(parts as never, 0, range as never, withStep as never)) &&
            safe(() => core.noStillRates(parts as never, range as never, withStep as never))
          );
        },
      ),
      settings,
    );
  });

  it('rateMapSeries: finite rates; its speeds finite or NaN, the gap its contract names', () => {
    fc.assert(
      fc.property(
        fc.array(partArb, { minLength: 1, maxLength: 2 }),
        rangeArb,
        fc.boolean(),
        (parts, range, log) => {
          let map: core.RateMapSeries;
          try {
            map = core.rateMapSeries(parts as never, range as never, { points: 50, log });
          } catch (error) {
            if (error instanceof InputError) return true;
            throw error;
          }
          expect(Array.from(map.rates).every(Number.isFinite)).toBe(true);
          for (const column of map.apparentRpm) {
            expect(Array.from(column).every((v) => Number.isFinite(v) || Number.isNaN(v))).toBe(
              true,
            );
          }
          return safe(() => ({ locks: map.locks, bands: map.bands, from: map.resolvedFromHz }));
        },
      ),
      settings,
    );
  });

  it('findSpeed and speedFinderSteps', () => {
    const readingArb = fc.oneof(
      fc.record({ rateHz: positive, images: fc.integer({ min: 1, max: 8 }) }),
      fc.record({ rateHz: anyValue, images: anyValue }),
    );
    fc.assert(
      fc.property(
        fc.array(readingArb, { maxLength: 3 }),
        fc.oneof(fc.integer({ min: 1, max: 60 }), anyValue),
        fc.oneof(fc.constant(undefined), rangeArb),
        rangeArb,
        (readings, symmetry, expect, strobe) =>
          safe(() =>
            core.findSpeed(readings as never, symmetry as never, expect as never, {
              rateRange: strobe as never,
            }),
          ) &&
          safe(() =>
            core.speedFinderSteps({
              readings: readings as never,
              symmetry: symmetry as never,
              strobeRange: strobe as never,
              expect: expect as never,
            }),
          ),
      ),
      { ...settings, numRuns: 200 },
    );
  });
});

describe('hostile input: every other exported function', () => {
  // Each function of the core's public face, called with as many hostile arguments as it
  // declares (numbers at the edges of the format, wrong types, parts, ranges, lists).
  const argArb = fc.oneof(anyValue, partArb, rangeArb, fc.array(partArb, { maxLength: 2 }));
  const skip = new Set([
    // Covered above with shaped arguments.
    'apparentMotion',
    'lockRates',
    'ratesForApparent',
    'rateBands',
    'stillRates',
    'freezeRates',
    'noStillRates',
    'rateMapSeries',
    'findSpeed',
    'speedFinderSteps',
    // Not functions of physics: the error class itself, and the number writer for sentences,
    // which writes '?' for a non-number by contract.
    'InputError',
    'plainNumber',
  ]);
  const functions = Object.entries(core).filter(
    ([name, value]) => typeof value === 'function' && !skip.has(name),
  ) as Array<[string, (...args: unknown[]) => unknown]>;

  it('has functions to check', () => {
    expect(functions.length).toBeGreaterThan(30);
  });

  it.each(functions.map(([name, fn]) => [name, fn] as const))('%s', (_name, fn) => {
    fc.assert(
      fc.property(fc.array(argArb, { minLength: fn.length, maxLength: fn.length }), (args) =>
        safe(() => fn(...args)),
      ),
      { ...settings, numRuns: 300 },
    );
  });
});

describe('hostile input: cases met in use', () => {
  it('refuses "1780 1800" typed as a speed: two numbers, not 17,801,800 rpm', () => {
    expectInputError(() => core.parseQuantity('1780 1800', 'speed', 'rpm'), 'speed', 'one number');
    expectInputError(() => core.parseQuantity('1780, 1800', 'speed', 'rpm'), 'speed', 'one number');
    expectInputError(() => core.parseQuantity('1780 rpm 1800', 'speed', 'rpm'), 'speed');
    expectInputError(() => core.parseNumber('1780-1800', 'speed'), 'speed', 'one number');
    // Thousands grouped by spaces still read (ISO 80000-1 groups digits in threes).
    expect(core.parseQuantity('1 780 rpm', 'speed', 'rpm')).toBeCloseTo(1780 / 60, 12);
    expect(core.parseNumber('1 234 567,5')).toBe(1234567.5);
  });

  it('reads "2½" as 2.5, not 2', () => {
    expect(core.parseNumber('2½')).toBe(2.5);
    expect(core.parseQuantity('2½ rev/s', 'speed', 'rpm')).toBe(2.5);
    expect(core.parseNumber('½')).toBe(0.5);
    expect(core.parseNumber('-1¾')).toBe(-1.75);
    expectInputError(() => core.parseNumber('2½ 3'), 'value', 'one number');
  });

  it('refuses a speed of 1e308 rev/s in freezeRates rather than returning Infinity', () => {
    const error = expectInputError(
      () => core.freezeRates([{ speedHz: 1e308, symmetry: 2 }], 0, { minHz: 1, maxHz: 100 }),
      'speed',
    );
    expect(error.message).toMatch(/too large/);
    expect(
      safe(() => core.freezeRates([{ speedHz: 1e308, symmetry: 1 }], 0, { minHz: 1, maxHz: 100 })),
    ).toBe(true);
  });

  it('keeps every rate of the rate map finite for absurd ranges, and refuses a lowest rate the speeds overflow', () => {
    const wide = core.rateMapSeries(
      [{ speedHz: 10, symmetry: 1 }],
      { minHz: 1e-300, maxHz: 1e300 },
      {
        points: 10,
        log: true,
      },
    );
    expect(Array.from(wide.rates).every(Number.isFinite)).toBe(true);
    const top = core.rateMapSeries(
      [{ speedHz: 10, symmetry: 1 }],
      { minHz: 1, maxHz: 1.7e308 },
      {
        points: 10,
      },
    );
    expect(Array.from(top.rates).every(Number.isFinite)).toBe(true);
    expect(top.rates[top.rates.length - 1]).toBe(1.7e308);
    expectInputError(
      () => core.rateMapSeries([{ speedHz: 1, symmetry: 1 }], { minHz: 5e-324, maxHz: 1e-300 }),
      'lowest rate',
    );
  });

  it('throws InputError, not TypeError, for wrongly typed arguments to parseQuantity and cautionCodes', () => {
    expectInputError(
      () => core.parseQuantity('1780', 'bogus' as never, 'rpm', 'speed'),
      'speed',
      'kind',
    );
    expectInputError(() => core.parseQuantity('1780', 'speed', 5 as never), 'speed', 'unit');
    expectInputError(() => core.parseQuantity(1780 as never, 'speed', 'rpm'), 'speed', 'text');
    expectInputError(() => core.cautionCodes(null as never), 'cautions');
    expectInputError(
      () => core.cautionCodes({ flashRatesHz: '5' as never }),
      'flash rates',
      'list',
    );
    expectInputError(() => core.cautionCodes({ flashSweepHz: null as never }), 'sweep');
    expectInputError(() => core.cautionFlags(undefined as never), 'cautions');
  });
});
