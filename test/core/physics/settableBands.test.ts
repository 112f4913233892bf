import { describe, expect, it } from 'vitest';
import {
  DEFAULT_SETTING_STEP_HZ,
  isSettableBand,
  settingStepHz,
} from '../../../src/core/physics/settableBands';
import { bad, expectInputError } from '../expectInputError';

describe('the setting step (docs/physics.md §4)', () => {
  it('is 1 flash per minute for a strobe and 0.01 frames/s for a camera by default', () => {
    // docs/physics.md §4: "default 1 flash per minute for strobes, 0.01 frames/s for cameras".
    expect(DEFAULT_SETTING_STEP_HZ.flash * 60).toBeCloseTo(1, 12);
    expect(DEFAULT_SETTING_STEP_HZ.frames).toBe(0.01);
    expect(settingStepHz('flash')).toBe(1 / 60);
    expect(settingStepHz(undefined)).toBe(1 / 60);
    expect(settingStepHz('frames', 0.001)).toBe(0.001);
  });

  it('refuses a step that is not a number above zero, and an unknown sampler', () => {
    expectInputError(() => settingStepHz('flash', 0), 'setting step');
    expectInputError(() => settingStepHz('flash', bad('1 fpm')), 'setting step');
    expectInputError(() => settingStepHz(bad('eye')), 'sampler');
  });
});

describe('isSettableBand: a band a person can set, that does what it says (docs/physics.md §4)', () => {
  const fpm = 1 / 60;

  it('refuses the reported sliver 6060.7–6060.8 flashes/min: a tenth of a step', () => {
    expect(isSettableBand({ fromHz: 6060.7 / 60, toHz: 6060.8 / 60 }, fpm)).toBe(false);
  });

  it('accepts a band one step wide or wider, the step itself up to rounding', () => {
    expect(isSettableBand({ fromHz: 6060 / 60, toHz: 6061 / 60 }, fpm)).toBe(true);
    expect(isSettableBand({ fromHz: 29.97, toHz: 29.98 }, 0.01)).toBe(true);
    expect(isSettableBand({ fromHz: 29.97, toHz: 29.979 }, 0.01)).toBe(false);
  });

  it('refuses a freeze band that misses the nominal lock, however wide', () => {
    // A chuck's lock at 6000 flashes/min; a band 6001–6060 flashes/min freezes it only at one
    // end of its tolerance: at the nominal speed it turns backward there.
    const band = { fromHz: 6001 / 60, toHz: 6060 / 60 };
    expect(isSettableBand(band, fpm, 100)).toBe(false);
    expect(isSettableBand({ fromHz: 5990 / 60, toHz: 6060 / 60 }, fpm, 100)).toBe(true);
    // A lock exactly on an edge is inside.
    expect(isSettableBand({ fromHz: 100, toHz: 6060 / 60 }, fpm, 100)).toBe(true);
  });

  it('refuses a band that is not one, with a message', () => {
    expectInputError(() => isSettableBand({ fromHz: 2, toHz: 1 }, fpm), 'band');
    expectInputError(
      () => isSettableBand(bad({ fromHz: NaN, toHz: 1 }), fpm),
      'lowest rate of the band',
    );
    expectInputError(() => isSettableBand(bad(null), fpm), 'lowest rate of the band');
    expectInputError(() => isSettableBand({ fromHz: 1, toHz: 2 }, -1), 'setting step');
    expectInputError(() => isSettableBand({ fromHz: 1, toHz: 2 }, fpm, Infinity), 'lock-in rate');
  });
});
