import { describe, expect, it } from 'vitest';
import {
  checkLookOptions,
  defaultLookOptions,
  THRESHOLD_SLACK,
} from '../../../src/core/physics/lookOptions';
import { bad, expectInputError } from '../expectInputError';

describe('defaultLookOptions', () => {
  it('reads drift below 0.25 rpm as still (a documented judgement, docs/physics.md §2)', () => {
    expect(defaultLookOptions.stillHz * 60).toBeCloseTo(0.25, 12);
    // 0.25 rpm is 1.5 degrees per second (docs/physics.md §2).
    expect(defaultLookOptions.stillHz * 360).toBeCloseTo(1.5, 12);
  });

  it('calls a step of 0.45 pitch or more unclear and counts up to 8 images (docs/physics.md §2, §3)', () => {
    expect(defaultLookOptions.unclearStep).toBe(0.45);
    expect(defaultLookOptions.maxImages).toBe(8);
    expect(defaultLookOptions.groupSpacingsPerS).toBe(1);
  });

  it('reads an aliased view slower than 6 rpm as nearly still: one turn in 10 s or longer (a documented judgement, docs/physics.md §4)', () => {
    expect(defaultLookOptions.nearlyStillHz * 60).toBeCloseTo(6, 12);
    expect(1 / defaultLookOptions.nearlyStillHz).toBeCloseTo(10, 12); // seconds a turn
  });

  it('compares thresholds with a relative slack below 1e-12 but far above one rounding (docs/physics.md §2)', () => {
    expect(THRESHOLD_SLACK).toBeLessThan(1e-12);
    expect(THRESHOLD_SLACK).toBeGreaterThan(100 * Number.EPSILON);
  });

  it('cannot be changed by a caller', () => {
    expect(Object.isFrozen(defaultLookOptions)).toBe(true);
  });
});

describe('checkLookOptions', () => {
  it('gives the defaults when nothing or only unrelated keys are given', () => {
    expect(checkLookOptions(undefined)).toEqual(defaultLookOptions);
    expect(checkLookOptions({})).toEqual(defaultLookOptions);
    expect(checkLookOptions(bad({ sampler: 'frames' }))).toEqual(defaultLookOptions);
  });

  it('fills in the options not given and keeps those given', () => {
    expect(checkLookOptions({ maxImages: 3, stillHz: undefined })).toEqual({
      ...defaultLookOptions,
      maxImages: 3,
    });
    expect(checkLookOptions({ unclearStep: 0.4, groupSpacingsPerS: 2 })).toEqual({
      ...defaultLookOptions,
      unclearStep: 0.4,
      groupSpacingsPerS: 2,
    });
  });

  it.each([[0], [-1], [NaN], ['0.1']])('rejects a still threshold of %s', (stillHz) => {
    expectInputError(() => checkLookOptions(bad({ stillHz })), 'still threshold');
  });

  it.each([[-0.1], [0.51], [Infinity]])(
    'rejects an unclear step of %s (allowed 0 to 0.5)',
    (unclearStep) => {
      expectInputError(() => checkLookOptions(bad({ unclearStep })), 'unclear step');
    },
  );

  it.each([[0], [1.5], [-2], [65]])(
    'rejects a largest image count of %s (allowed 1 to 64)',
    (maxImages) => {
      expectInputError(() => checkLookOptions(bad({ maxImages })), 'largest image count');
    },
  );

  it.each([[0], [-1], [NaN], ['6 rpm']])(
    'rejects a nearly-still threshold of %s',
    (nearlyStillHz) => {
      expectInputError(() => checkLookOptions(bad({ nearlyStillHz })), 'nearly-still threshold');
    },
  );

  it.each([[0], [-1], [null]])('rejects an image group spacing of %s', (groupSpacingsPerS) => {
    expectInputError(() => checkLookOptions(bad({ groupSpacingsPerS })), 'image group spacing');
  });

  it.each([[null], ['fast'], [3]])('rejects %s as options', (opts) => {
    expectInputError(() => checkLookOptions(bad(opts)), 'options');
  });
});
