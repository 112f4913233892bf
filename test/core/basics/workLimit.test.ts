import { describe, expect, it } from 'vitest';
import {
  findSpeed,
  InputError,
  lockRates,
  rateBands,
  ratesForApparent,
  MAX_WORK_ITEMS,
} from '../../../src/core';
import { requireWorkable } from '../../../src/core/basics/workLimit';

// The limit is a judgement (see workLimit.ts): these checks make sure a mistyped speed or range
// gets a message instead of freezing the page, and that ordinary ranges stay well inside it.
describe('requireWorkable', () => {
  it('returns the count when it is within the limit', () => {
    expect(requireWorkable(10, 'rate range', 'rates', 'narrow it')).toBe(10);
  });
  it('throws an InputError naming the field and the advice when the count is over the limit', () => {
    expect(() => requireWorkable(MAX_WORK_ITEMS + 1, 'rate range', 'rates', 'narrow it')).toThrow(
      InputError,
    );
    expect(() => requireWorkable(MAX_WORK_ITEMS + 1, 'rate range', 'rates', 'narrow it')).toThrow(
      /rate range.*narrow it/,
    );
  });
  it('throws for a count that is not a number at all', () => {
    expect(() => requireWorkable(Number.NaN, 'rate range', 'rates', 'narrow it')).toThrow(
      InputError,
    );
  });
});

describe('list-producing functions refuse work they cannot finish', () => {
  it('lockRates refuses a 100 kHz pattern over 0.5–1000 Hz (millions of locks) with a message', () => {
    expect(() => lockRates({ speedHz: 1e5, symmetry: 1 }, { minHz: 0.5, maxHz: 1000 })).toThrow(
      /rate range/,
    );
  });
  it('ratesForApparent refuses to list every sub-multiple of a 1 MHz pattern from 0.001 Hz', () => {
    expect(() =>
      ratesForApparent({ speedHz: 1e6, symmetry: 1 }, 0, { minHz: 0.001, maxHz: 10 }),
    ).toThrow(InputError);
  });
  it('findSpeed refuses an expected range whose top would mean billions of hypotheses', () => {
    expect(() => findSpeed([{ rateHz: 10, images: 1 }], 1, { minHz: 1, maxHz: 1e10 })).toThrow(
      /expected speed range/,
    );
  });
  it('rateBands refuses an absurdly wide range for an untoleranced fast part', () => {
    expect(() => rateBands([{ speedHz: 1e7, symmetry: 100 }], { minHz: 1e-6, maxHz: 1e3 })).toThrow(
      InputError,
    );
  });
  it('an ordinary strobe case stays well inside the limit', () => {
    // A 6-blade fan at 1780 rpm over a strobe's 30–12 000 flashes per minute (0.5–200 Hz).
    expect(
      lockRates({ speedHz: 1780 / 60, symmetry: 6, tolerance: 0.01 }, { minHz: 0.5, maxHz: 200 })
        .length,
    ).toBeLessThan(MAX_WORK_ITEMS / 10);
    expect(
      rateBands([{ speedHz: 1780 / 60, symmetry: 6 }], { minHz: 0.5, maxHz: 200 }).length,
    ).toBeGreaterThan(1);
  });
});
