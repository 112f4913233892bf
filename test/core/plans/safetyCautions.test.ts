import { describe, expect, it } from 'vitest';
import { safetyCautions } from '../../../src/core/plans/safetyCautions';
import { expectInputError } from '../expectInputError';

describe('safetyCautions: physics.md §10', () => {
  it('always carries the planning-aid caution', () => {
    const [only] = safetyCautions();
    expect(safetyCautions()).toHaveLength(1);
    expect(only).toMatch(/planning aid/);
  });

  it('adds the lockout caution first when a part may look still, slow or backward', () => {
    // OSHA 29 CFR 1910.147 and ISO 14118 are named in the text.
    const [first] = safetyCautions({ apparentStillness: true });
    expect(first).toMatch(/still turning/);
    expect(first).toMatch(/OSHA 29 CFR 1910\.147/);
    expect(first).toMatch(/ISO 14118/);
  });

  it('adds the seizure caution for flashing between 3 and 60 a second, ends included', () => {
    // physics.md §10; WCAG 2.x success criterion 2.3.1 (three flashes a second).
    const seizure = (ctx: Parameters<typeof safetyCautions>[0]) =>
      safetyCautions(ctx).some((c) => /photosensitive epilepsy/.test(c));
    expect(seizure({ flashRatesHz: [3] })).toBe(true);
    expect(seizure({ flashRatesHz: [60] })).toBe(true);
    expect(seizure({ flashRatesHz: [2.9, 60.1] })).toBe(false);
    expect(seizure({ flashRatesHz: [100] })).toBe(false);
    // A sweep from 200 down to 1 passes through the whole range.
    expect(seizure({ flashSweepHz: { minHz: 1, maxHz: 200 } })).toBe(true);
    expect(seizure({ flashSweepHz: { minHz: 61, maxHz: 200 } })).toBe(false);
  });

  it('rejects flash rates that are not numbers', () => {
    expectInputError(() => safetyCautions({ flashRatesHz: [NaN] }), 'flash rate 1');
    expectInputError(
      () => safetyCautions({ flashSweepHz: { minHz: 1, maxHz: Infinity } }),
      'highest rate of the sweep',
    );
  });
});
