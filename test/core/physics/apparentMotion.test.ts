import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { apparentMotion } from '../../../src/core/physics/apparentMotion';
import { lockRates } from '../../../src/core/physics/lockRates';
import { defaultLookOptions } from '../../../src/core/physics/lookOptions';
import {
  anyFinite,
  anyPositive,
  bad,
  expectInputError,
  finiteOrInputError,
  notNumbers,
} from '../expectInputError';

const oneMark = (speedHz: number) => ({ speedHz, symmetry: 1 });

describe('apparentMotion: published cases', () => {
  it('counts three creeping images above the Nyquist rate, while the look stays true', () => {
    // docs/physics.md §3: near r = 1/3 the pattern occupies three positions; one mark at 10 rev/s
    // under 30.5 flashes/s drifts as a group at 10 − 30.5/3 = −1/6 rev/s. §2's precedence
    // still reads a faithful sampler as 'true'.
    const m = apparentMotion(oneMark(10), 30.5);
    expect(m.faithful).toBe(true);
    expect(m.look).toBe('true');
    expect(m.images).toBe(3);
    expect(m.driftHz).toBeCloseTo(-1 / 6, 12);
    // A camera holds one image per frame: no superimposed images.
    expect(apparentMotion(oneMark(10), 30.5, { sampler: 'frames' }).images).toBe(1);
  });

  it('shows a disc at 60 rev/s under 61 flashes/s turning backwards at 1 rev/s', () => {
    // Wikipedia, "Stroboscopic effect": 60 rev/s lit at 61 flashes/s seems to turn backwards at 1 rev/s.
    const m = apparentMotion(oneMark(60), 61);
    expect(m.apparentHz).toBeCloseTo(-1, 9);
    expect(m.look).toBe('backward');
    expect(m.images).toBe(1);
    expect(m.faithful).toBe(false);
    expect(m.ratio).toBeCloseTo(60 / 61, 12);
    expect(m.step).toBeCloseTo(-1 / 61, 12);
  });

  it('states the literal result of its doc example', () => {
    // Doc block of apparentMotion: 1 rev/s backward, to floating-point rounding.
    expect(apparentMotion({ speedHz: 60, symmetry: 1 }, 61).apparentHz).toBe(-1.000000000000001);
  });

  it('shows the same disc under 59 flashes/s turning forwards at 1 rev/s', () => {
    // Wikipedia, "Stroboscopic effect": at 59 flashes/s it seems to turn forwards at 1 rev/s.
    const m = apparentMotion(oneMark(60), 59);
    expect(m.apparentHz).toBeCloseTo(1, 9);
    expect(m.look).toBe('forward');
  });

  it('shows a 12-spoke wheel at 2 rev/s filmed at 24 frames/s standing still', () => {
    // Wikipedia, "Stroboscopic effect": a 12-spoke wheel at 2 rev/s filmed at 24 frames/s seems still.
    const m = apparentMotion({ speedHz: 2, symmetry: 12 }, 24, { sampler: 'frames' });
    expect(m.look).toBe('still');
    expect(m.images).toBe(1);
    expect(m.ratio).toBe(1);
    expect(m.apparentHz).toBeCloseTo(0, 12);
    expect({ p: m.p, q: m.q }).toEqual({ p: 1, q: 1 });
  });

  it('shows the same wheel still under a strobe at 24 flashes/s too', () => {
    // Wikipedia, "Stroboscopic effect" (same case, flash instead of film).
    expect(apparentMotion({ speedHz: 2, symmetry: 12 }, 24).look).toBe('still');
  });

  it('shows a 20 Hz signal sampled at 18 or at 22 per second as 2 Hz', () => {
    // Common practice: 20 Hz sampled at 18 or 22 samples/s looks like 2 Hz.
    const at18 = apparentMotion(oneMark(20), 18, { sampler: 'frames' });
    const at22 = apparentMotion(oneMark(20), 22, { sampler: 'frames' });
    expect(at18.apparentHz).toBeCloseTo(2, 12);
    expect(at18.look).toBe('forward');
    expect(at22.apparentHz).toBeCloseTo(-2, 12);
    expect(at22.look).toBe('backward');
  });

  it('shows nothing faster than 500 rev/s at 1000 samples per second', () => {
    // Common practice: 1000 samples/s show nothing above 500 Hz (Shannon 1949: half the rate).
    expect(apparentMotion(oneMark(499), 1000, { sampler: 'frames' }).faithful).toBe(true);
    expect(apparentMotion(oneMark(499), 1000, { sampler: 'frames' }).apparentHz).toBeCloseTo(
      499,
      9,
    );
    expect(apparentMotion(oneMark(500), 1000, { sampler: 'frames' }).faithful).toBe(false);
    expect(apparentMotion(oneMark(501), 1000, { sampler: 'frames' }).apparentHz).toBeCloseTo(
      -499,
      9,
    );
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1e5, noNaN: true }), (f) => {
        return Math.abs(apparentMotion(oneMark(f), 1000, { sampler: 'frames' }).apparentHz) <= 500;
      }),
    );
  });

  it('shows a 5-spoke wheel at 5.5 rev/s backward on 30 frames/s video and truly at 60 frames/s', () => {
    // Common practice: standard video runs at 30 frames/s, better cameras at 60.
    // Pattern 5 × 5.5 = 27.5 per second: above 15 (half of 30), below 30 (half of 60).
    const video = apparentMotion({ speedHz: 5.5, symmetry: 5 }, 30, { sampler: 'frames' });
    expect(video.look).toBe('backward');
    expect(video.apparentHz).toBeCloseTo(-0.5, 12); // (27.5 − 30)/5
    const better = apparentMotion({ speedHz: 5.5, symmetry: 5 }, 60, { sampler: 'frames' });
    expect(better.look).toBe('true');
    expect(better.apparentHz).toBeCloseTo(5.5, 12);
  });
});

describe('apparentMotion: the 1000/1001 picture rates', () => {
  // SMPTE ST 12-1 time code rates and ITU-R BT.709 picture rates: 24, 30, 60 each divided by 1.001.
  it('lets a mark at 30 rev/s creep forward at 30/1001 rev/s on 30000/1001 frames/s', () => {
    const m = apparentMotion(oneMark(30), 30000 / 1001, { sampler: 'frames' });
    expect(m.apparentHz).toBeCloseTo(30 / 1001, 12); // 30 − 30000/1001 = 30/1001 (about 1.8 rpm)
    expect(m.look).toBe('forward');
  });

  it('lets a two-blade fan at 30 rev/s creep forward at 30/1001 rev/s on 60000/1001 frames/s', () => {
    const m = apparentMotion({ speedHz: 30, symmetry: 2 }, 60000 / 1001, { sampler: 'frames' });
    expect(m.apparentHz).toBeCloseTo(30 / 1001, 12); // (60 − 60000/1001)/2
    expect(m.look).toBe('forward');
  });

  it('keeps the 12-spoke wheel still on 24000/1001 frames/s: its drift of 2/1001 rev/s is below the threshold', () => {
    const m = apparentMotion({ speedHz: 2, symmetry: 12 }, 24000 / 1001, { sampler: 'frames' });
    expect(m.driftHz).toBeCloseTo(2 / 1001, 12); // (24 − 24000/1001)/12
    expect(m.driftHz).toBeLessThan(defaultLookOptions.stillHz);
    expect(m.look).toBe('still');
  });
});

describe('apparentMotion: precedence of docs/physics.md §2', () => {
  it('shows exactly half a turn per flash as two images standing still', () => {
    const m = apparentMotion(oneMark(10), 20);
    expect(m.look).toBe('still');
    expect(m.images).toBe(2);
    expect({ p: m.p, q: m.q }).toEqual({ p: 1, q: 2 });
  });

  it('shows a three-blade fan at r = 1/2 as six blades: two images of three', () => {
    // docs/physics.md §3: a 3-blade fan shows 6 blades.
    const m = apparentMotion({ speedHz: 10, symmetry: 3 }, 60);
    expect(m.ratio).toBe(0.5);
    expect(m.look).toBe('still');
    expect(m.images).toBe(2);
    expect(m.images * 3).toBe(6);
  });

  it('calls the same half-pitch step unclear on camera frames, where only q = 1 freezes', () => {
    const m = apparentMotion({ speedHz: 10, symmetry: 3 }, 60, { sampler: 'frames' });
    expect(m.look).toBe('unclear');
    expect(m.images).toBe(1);
  });

  it('shows q images standing still under a flash for every lock p/q up to the image limit', () => {
    // docs/physics.md §3: r = p/q in lowest terms gives q superimposed images.
    for (let q = 1; q <= 8; q++) {
      for (let p = 1; p <= 12; p++) {
        if (reduced(p, q) !== 1) continue;
        const m = apparentMotion(oneMark(p), q); // r = p/q exactly
        expect(m.look, `r = ${p}/${q}`).toBe('still');
        expect(m.images, `r = ${p}/${q}`).toBe(q);
        expect({ p: m.p, q: m.q }).toEqual({ p, q });
      }
    }
  });

  it('does not count more images than maxImages allows', () => {
    expect(apparentMotion(oneMark(1), 9).look).not.toBe('still'); // r = 1/9, 9 > 8
    const nine = apparentMotion(oneMark(1), 9, { maxImages: 9 });
    expect(nine.look).toBe('still');
    expect(nine.images).toBe(9);
  });

  it('does not freeze a multi-image lock on camera frames: r = 2/3 reads backward there', () => {
    expect(apparentMotion(oneMark(20), 30).images).toBe(3); // flash: three images stand still
    const frames = apparentMotion(oneMark(20), 30, { sampler: 'frames' });
    expect(frames.look).toBe('backward');
    expect(frames.step).toBeCloseTo(-1 / 3, 12);
  });

  it('reads a faithful sampler as true when nothing locks', () => {
    const m = apparentMotion(oneMark(10), 25.3); // r = 0.395, no p/q with q ≤ 8 near enough
    expect(m.faithful).toBe(true);
    expect(m.look).toBe('true');
    expect(m.apparentHz).toBeCloseTo(10, 9);
    expect(apparentMotion(oneMark(10), 30, { sampler: 'frames' }).look).toBe('true');
  });

  it('reads a part slower than the still threshold as still at any rate, faithful or not', () => {
    const crawl = oneMark(0.001); // 0.06 rpm, below 0.25 rpm
    expect(apparentMotion(crawl, 1000).look).toBe('still');
    expect(apparentMotion(crawl, 1000).faithful).toBe(true);
    expect(apparentMotion(oneMark(0), 50).look).toBe('still');
  });

  it('calls a step of exactly 0.45 pitch unclear and 0.44 pitch a direction', () => {
    // docs/physics.md §2: |e| ≥ 0.45 is "direction unclear" (default).
    expect(apparentMotion(oneMark(29), 20, { sampler: 'frames' }).look).toBe('unclear'); // r = 1.45
    expect(apparentMotion(oneMark(11), 20, { sampler: 'frames' }).look).toBe('unclear'); // r = 0.55
    expect(apparentMotion(oneMark(28.8), 20, { sampler: 'frames' }).look).toBe('forward'); // r = 1.44
    expect(apparentMotion(oneMark(11.2), 20, { sampler: 'frames' }).look).toBe('backward'); // r = 0.56
  });

  it('follows a custom unclear step', () => {
    expect(apparentMotion(oneMark(28.8), 20, { sampler: 'frames', unclearStep: 0.4 }).look).toBe(
      'unclear',
    );
  });

  it('reports a creeping double image near half a turn per flash', () => {
    // r = 10/19.9 = 0.5025: the two-image group drifts at 10 − 19.9/2 = 0.05 rev/s, 0.1 of its spacing per second.
    const m = apparentMotion(oneMark(10), 19.9);
    expect(m.images).toBe(2);
    expect(m.driftHz).toBeCloseTo(0.05, 12);
    expect(m.look).toBe('unclear');
    expect(apparentMotion(oneMark(10), 19.9, { groupSpacingsPerS: 0.05 }).images).toBe(1);
    expect(apparentMotion(oneMark(10), 19.9, { sampler: 'frames' }).images).toBe(1);
  });

  it('takes forward and backward relative to the sign of the speed', () => {
    const mirrored = apparentMotion(oneMark(-60), 61);
    expect(mirrored.apparentHz).toBeCloseTo(1, 9);
    expect(mirrored.look).toBe('backward');
    expect(apparentMotion(oneMark(-60), 59).look).toBe('forward');
  });

  it('follows a custom still threshold', () => {
    const m = apparentMotion(oneMark(30), 30000 / 1001, { sampler: 'frames', stillHz: 0.05 });
    expect(m.look).toBe('still'); // 30/1001 ≈ 0.03 rev/s < 0.05
  });
});

describe('apparentMotion: which group stands still, and nearly still (docs/physics.md §2–§4)', () => {
  const gear = { speedHz: 1780 / 60, symmetry: 60 };

  it('shows a 60-tooth gear at 1780 rpm under 13.92 flashes/s as 8 images, the group with the smallest drift', () => {
    // docs/physics.md §3: 60·29.667/13.92 = 127.8736 pitches a flash. The 8-image group 1023/8
    // drifts |1780 − 1023·13.92/8|/60 = 0.02 rpm, the 7-image group 895/7 drifts
    // |1780 − 895·13.92/7|/60 = 0.229 rpm: both at or below 0.25 rpm, the 8 images stand still.
    const seen = apparentMotion(gear, 13.92);
    expect([seen.look, seen.images, seen.p, seen.q]).toEqual(['still', 8, 1023, 8]);
    expect(Math.abs(seen.driftHz) * 60).toBeCloseTo(0.02, 9);
    // The contract's own figure: 13.9198 flashes/s shows 8 images, not 7.
    expect(apparentMotion(gear, 13.9198)).toMatchObject({ look: 'still', images: 8 });
  });

  it('reports at every lock lockRates lists the image count it lists', () => {
    // docs/physics.md §3: the count apparentMotion reports equals lockRates' (here around 13.92 flashes/s).
    const locks = lockRates(gear, { minHz: 13, maxHz: 15 });
    expect(locks.length).toBeGreaterThan(20);
    for (const lock of locks) {
      expect(apparentMotion(gear, lock.rateHz).images, `${lock.p}/${lock.q}`).toBe(lock.q);
    }
  });

  it('reads a drift equal to the still threshold as still: 3000.25 rpm at 50 frames/s', () => {
    // docs/physics.md §2: thresholds are inclusive with a relative slack of about 1e-12;
    // 3000.25/60 − 50 = 0.25/60 rev/s, exactly the 0.25 rpm threshold.
    for (const sampler of ['frames', 'flash'] as const) {
      expect(apparentMotion({ speedHz: 3000.25 / 60, symmetry: 1 }, 50, { sampler })).toMatchObject(
        {
          look: 'still',
          images: 1,
        },
      );
    }
    // A hair beyond it is forward.
    expect(
      apparentMotion({ speedHz: 3000.26 / 60, symmetry: 1 }, 50, { sampler: 'frames' }).look,
    ).toBe('forward');
  });

  it('marks a forward creep below 6 rpm nearly still, and one at 6 rpm or more not', () => {
    // docs/physics.md §4: nearly still below 6 rpm (one turn in 10 s or longer).
    const mark = { speedHz: 30, symmetry: 1 };
    // 30 rev/s under 29.95 flashes/s: 0.05 rev/s = 3 rpm forward.
    expect(apparentMotion(mark, 29.95)).toMatchObject({ look: 'forward', nearlyStill: true });
    // under 29.8 flashes/s: 0.2 rev/s = 12 rpm forward.
    expect(apparentMotion(mark, 29.8)).toMatchObject({ look: 'forward', nearlyStill: false });
    // exactly 6 rpm (0.1 rev/s at 29.9 flashes/s) is not below the threshold.
    expect(apparentMotion(mark, 29.9)).toMatchObject({ look: 'forward', nearlyStill: false });
    // backward creeps and still views are nearly still too; a faithful view never is.
    expect(apparentMotion(mark, 30.05)).toMatchObject({ look: 'backward', nearlyStill: true });
    expect(apparentMotion(mark, 30)).toMatchObject({ look: 'still', nearlyStill: true });
    expect(apparentMotion({ speedHz: 0.05, symmetry: 1 }, 100)).toMatchObject({
      look: 'true',
      nearlyStill: false,
    });
  });

  it('takes the nearly-still threshold from the options, never below the still threshold', () => {
    const mark = { speedHz: 30, symmetry: 1 };
    expect(apparentMotion(mark, 29.95, { nearlyStillHz: 0.01 }).nearlyStill).toBe(false);
    expect(apparentMotion(mark, 29.8, { nearlyStillHz: 0.5 }).nearlyStill).toBe(true);
    // A nearly-still threshold under the still one acts as the still one.
    const look = { stillHz: 0.1, nearlyStillHz: 0.01 };
    expect(apparentMotion(mark, 29.95, look)).toMatchObject({ look: 'still', nearlyStill: true });
    expect(apparentMotion(mark, 29.85, look)).toMatchObject({
      look: 'forward',
      nearlyStill: false,
    });
  });
});

describe('apparentMotion: relations that hold for every input', () => {
  const part = fc.record({
    speedHz: fc.double({ min: -500, max: 500, noNaN: true }),
    symmetry: fc.integer({ min: 1, max: 60 }),
  });
  const rate = fc.double({ min: 0.5, max: 5000, noNaN: true });

  it('keeps the step in [−0.5, 0.5] and ties ratio, step and apparent speed together', () => {
    fc.assert(
      fc.property(
        part,
        rate,
        fc.constantFrom('flash' as const, 'frames' as const),
        (p, s, sampler) => {
          const m = apparentMotion(p, s, { sampler });
          expect(Math.abs(m.step)).toBeLessThanOrEqual(0.5);
          expect(m.ratio).toBeCloseTo((p.symmetry * p.speedHz) / s, 9);
          expect(m.apparentHz * p.symmetry).toBeCloseTo(m.step * s, 6);
          expect(['true', 'forward', 'backward', 'still', 'unclear']).toContain(m.look);
          expect(m.images).toBeGreaterThanOrEqual(1);
          if (sampler === 'frames') expect(m.images).toBe(1);
        },
      ),
    );
  });

  it('is faithful exactly when the rate is above twice the pattern frequency (Shannon 1949)', () => {
    fc.assert(
      fc.property(part, rate, (p, s) => {
        const patternHz = p.symmetry * Math.abs(p.speedHz);
        fc.pre(Math.abs(2 * patternHz - s) > 1e-9 * s);
        return apparentMotion(p, s).faithful === 2 * patternHz < s;
      }),
    );
  });

  it('cannot tell a speed from its aliases f + m·s/n (any DSP text)', () => {
    fc.assert(
      fc.property(part, rate, fc.integer({ min: -20, max: 20 }), (p, s, m) => {
        const base = apparentMotion(p, s, { sampler: 'frames' });
        fc.pre(Math.abs(base.step) < 0.49);
        const alias = apparentMotion({ ...p, speedHz: p.speedHz + (m * s) / p.symmetry }, s, {
          sampler: 'frames',
        });
        return (
          Math.abs(alias.apparentHz - base.apparentHz) <=
          1e-9 * (s + Math.abs(p.speedHz) * p.symmetry)
        );
      }),
    );
  });

  it('never returns NaN or Infinity, whatever finite numbers it is given', () => {
    fc.assert(
      fc.property(
        anyFinite(),
        fc.integer({ min: 1, max: 100_000 }),
        anyPositive(),
        (speedHz, symmetry, s) =>
          finiteOrInputError(() => apparentMotion({ speedHz, symmetry }, s)),
      ),
      { numRuns: 500 },
    );
  });
});

describe('apparentMotion: bad input', () => {
  it.each(notNumbers.map((v) => [v]))('rejects a speed of %s', (speedHz) => {
    expectInputError(() => apparentMotion(bad({ speedHz, symmetry: 1 }), 61), 'speed');
  });

  it.each([[0], [1.5], [-2], [NaN], ['3']])('rejects a feature count of %s', (symmetry) => {
    expectInputError(
      () => apparentMotion(bad({ speedHz: 60, symmetry }), 61),
      'features (blades, spokes)',
    );
  });

  it.each([[0], [-61], ...notNumbers.map((v) => [v])])('rejects a rate of %s', (rateHz) => {
    expectInputError(() => apparentMotion(oneMark(60), bad(rateHz)), 'rate');
  });

  it.each([[null], [undefined], ['60 rpm']])('rejects %s as a part', (part) => {
    expectInputError(() => apparentMotion(bad(part), 61), 'part');
  });

  it('rejects an unknown sampler and bad look options', () => {
    expectInputError(() => apparentMotion(oneMark(60), 61, bad({ sampler: 'video' })), 'sampler');
    expectInputError(
      () => apparentMotion(oneMark(60), 61, { maxImages: 0 }),
      'largest image count',
    );
    expectInputError(
      () => apparentMotion(oneMark(60), 61, { maxImages: 65 }),
      'largest image count',
    );
    expectInputError(() => apparentMotion(oneMark(60), 61, { stillHz: -1 }), 'still threshold');
    expectInputError(() => apparentMotion(oneMark(60), 61, { unclearStep: 0.6 }), 'unclear step');
    expectInputError(() => apparentMotion(oneMark(60), 61, bad(null)), 'options');
  });

  it('rejects a speed and rate so far apart that the ratio overflows', () => {
    expectInputError(() => apparentMotion(oneMark(1e300), 1e-300), 'rate');
  });
});

/** Greatest common divisor, written out here so the test does not lean on the core's gcd. */
function reduced(a: number, b: number): number {
  return b === 0 ? a : reduced(b, a % b);
}
