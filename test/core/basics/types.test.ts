import { describe, expect, it } from 'vitest';
import {
  checkPart,
  checkRange,
  checkSampler,
  MAX_IMAGES_LIMIT,
  MAX_SYMMETRY,
} from '../../../src/core/basics/types';
import { bad, expectInputError, notNumbers } from '../expectInputError';

describe('checkPart', () => {
  it('fills in a zero tolerance and keeps a signed speed', () => {
    expect(checkPart({ speedHz: -60, symmetry: 3 })).toEqual({
      speedHz: -60,
      symmetry: 3,
      tolerance: 0,
    });
    expect(checkPart({ speedHz: 29.5, symmetry: 1, tolerance: 0.02 })).toEqual({
      speedHz: 29.5,
      symmetry: 1,
      tolerance: 0.02,
    });
  });

  it('accepts a part that is not turning', () => {
    expect(checkPart({ speedHz: 0, symmetry: 1 }).speedHz).toBe(0);
  });

  it.each(notNumbers.map((v) => [v]))('rejects a speed of %s', (speedHz) => {
    expectInputError(() => checkPart(bad({ speedHz, symmetry: 1 })), 'speed');
  });

  it.each([[0], [1.5], [-2], [MAX_SYMMETRY + 1]])(
    'rejects a feature count of %s: it must be a whole number of at least 1',
    (symmetry) => {
      const error = expectInputError(
        () => checkPart(bad({ speedHz: 10, symmetry })),
        'features (blades, spokes)',
      );
      expect(error.message).toContain('whole number');
    },
  );

  it.each(notNumbers.map((v) => [v]))('rejects a feature count of %s', (symmetry) => {
    expectInputError(() => checkPart(bad({ speedHz: 10, symmetry })), 'features (blades, spokes)');
  });

  it('accepts the largest feature count and no more', () => {
    expect(checkPart({ speedHz: 1, symmetry: MAX_SYMMETRY }).symmetry).toBe(MAX_SYMMETRY);
  });

  it.each([[-0.01], [0.51], [NaN], ['0.02'], [null]])(
    'rejects a tolerance of %s (allowed 0 to 0.5)',
    (tolerance) => {
      expectInputError(
        () => checkPart(bad({ speedHz: 10, symmetry: 1, tolerance })),
        'speed tolerance',
      );
    },
  );

  it.each([[null], [undefined], [3], ['part'], [true]])(
    'rejects %s as a part, naming the field given',
    (part) => {
      expectInputError(() => checkPart(bad(part), 'part 2'), 'part 2');
    },
  );
});

describe('checkRange', () => {
  it('returns a valid range unchanged', () => {
    expect(checkRange({ minHz: 20, maxHz: 30 })).toEqual({ minHz: 20, maxHz: 30 });
  });

  it('rejects an empty range whose two ends are equal', () => {
    expectInputError(() => checkRange({ minHz: 24, maxHz: 24 }), 'rate range', 'empty');
  });

  it('rejects an inverted range', () => {
    expectInputError(() => checkRange({ minHz: 30, maxHz: 20 }), 'rate range', 'lowest');
  });

  it.each([[0], [-5], ...notNumbers.map((v) => [v])])('rejects a lowest rate of %s', (minHz) => {
    expectInputError(() => checkRange(bad({ minHz, maxHz: 30 })), 'lowest rate');
  });

  it.each([[0], [-5], ...notNumbers.map((v) => [v])])('rejects a highest rate of %s', (maxHz) => {
    expectInputError(() => checkRange(bad({ minHz: 1, maxHz })), 'highest rate');
  });

  it('names its ends after the field it is given', () => {
    expectInputError(
      () => checkRange(bad({ minHz: -1, maxHz: 5 }), 'expected speed range'),
      'lowest expected speed',
    );
  });

  it.each([[null], [undefined], [5], ['20-30']])('rejects %s as a range', (range) => {
    expectInputError(() => checkRange(bad(range)), 'rate range');
  });
});

describe('checkSampler', () => {
  it("defaults to 'flash' and accepts the two kinds", () => {
    expect(checkSampler(undefined)).toBe('flash');
    expect(checkSampler('flash')).toBe('flash');
    expect(checkSampler('frames')).toBe('frames');
  });

  it.each([['camera'], ['Flash'], [null], [1]])('rejects %s as a sampler', (sampler) => {
    expectInputError(() => checkSampler(sampler), 'sampler');
  });
});

describe('limits', () => {
  it('keep image counts countable and feature counts beyond any real part', () => {
    expect(MAX_IMAGES_LIMIT).toBe(64);
    expect(MAX_SYMMETRY).toBe(100_000);
  });
});
