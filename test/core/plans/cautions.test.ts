import { describe, expect, it } from 'vitest';
import { cautionCodes, cautionFlags } from '../../../src/core/plans/cautions';
import { expectInputError } from '../expectInputError';

describe('cautionCodes: docs/physics.md §10', () => {
  it('always carries the planning-aid caution', () => {
    expect(cautionCodes()).toEqual(['planning-aid']);
  });

  it('adds the lockout caution first when a part may look still, slow or backward', () => {
    expect(cautionCodes({ apparentStillness: true })).toEqual(['stillness', 'planning-aid']);
  });

  it('adds the seizure caution for flashing between 3 and 60 a second, ends included', () => {
    // docs/physics.md §10; WCAG 2.x success criterion 2.3.1 (three flashes a second).
    const seizure = (ctx: Parameters<typeof cautionCodes>[0]) =>
      cautionCodes(ctx).includes('flashing');
    expect(seizure({ flashRatesHz: [3] })).toBe(true);
    expect(seizure({ flashRatesHz: [60] })).toBe(true);
    expect(seizure({ flashRatesHz: [2.9, 60.1] })).toBe(false);
    expect(seizure({ flashRatesHz: [100] })).toBe(false);
    // A sweep from 200 down to 1 passes through the whole range.
    expect(seizure({ flashSweepHz: { minHz: 1, maxHz: 200 } })).toBe(true);
    expect(seizure({ flashSweepHz: { minHz: 61, maxHz: 200 } })).toBe(false);
  });

  it('orders the cautions most important first', () => {
    expect(cautionCodes({ apparentStillness: true, flashRatesHz: [10] })).toEqual([
      'stillness',
      'flashing',
      'planning-aid',
    ]);
  });

  it('agrees with cautionFlags, the rule the on-screen caution boxes follow', () => {
    for (const context of [{}, { apparentStillness: true }, { flashRatesHz: [30] }]) {
      const flags = cautionFlags(context);
      const codes = cautionCodes(context);
      expect(codes.includes('stillness')).toBe(flags.safety);
      expect(codes.includes('flashing')).toBe(flags.photosensitivity);
    }
  });

  it('rejects flash rates that are not numbers', () => {
    expectInputError(() => cautionCodes({ flashRatesHz: [NaN] }), 'flash rate 1');
    expectInputError(
      () => cautionCodes({ flashSweepHz: { minHz: 1, maxHz: Infinity } }),
      'highest rate of the sweep',
    );
  });
});
