import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { ratesForApparent } from '../../../src/core/physics/ratesForApparent';
import { apparentMotion } from '../../../src/core/physics/apparentMotion';
import { lockRates } from '../../../src/core/physics/lockRates';
import { bad, expectInputError, finiteOrInputError, notNumbers } from '../expectInputError';

const oneMark = (speedHz: number) => ({ speedHz, symmetry: 1 });

describe('ratesForApparent: worked examples', () => {
  it('finds 29.5 flashes/s to make one mark at 30 rev/s creep forward at 0.5 rev/s', () => {
    // docs/physics.md §4 example check: f = 30, n = 1, a = 0.5 → s = 29.5. Doc block example.
    expect(ratesForApparent(oneMark(30), 0.5, { minHz: 20, maxHz: 40 })).toEqual([
      { rateHz: 29.5, k: 1 },
    ]);
  });

  it('finds 30.5 flashes/s to make the same mark creep backward at 0.5 rev/s', () => {
    // s = n·|f − a|/k = |30 − (−0.5)|/1 (docs/physics.md §4).
    const rates = ratesForApparent(oneMark(30), -0.5, { minHz: 20, maxHz: 40 });
    expect(rates).toEqual([{ rateHz: 30.5, k: 1 }]);
    const seen = apparentMotion(oneMark(30), rates[0].rateHz);
    expect(seen.apparentHz).toBeCloseTo(-0.5, 12);
    expect(seen.look).toBe('backward');
  });

  it('lists every sub-multiple k that is still valid on camera, ascending by rate', () => {
    // a = 0.5: valid while |k·0.5/29.5| < 0.5, i.e. k ≤ 29; rates 29.5/k.
    const rates = ratesForApparent(
      oneMark(30),
      0.5,
      { minHz: 1, maxHz: 40 },
      { sampler: 'frames' },
    );
    // k = 27…29 step 0.458, 0.475, 0.492 pitch per frame: direction unclear (docs/physics.md §2).
    expect(rates.map((r) => r.k)).toEqual(Array.from({ length: 26 }, (_, i) => 26 - i));
    for (const { rateHz, k } of rates) {
      expect(rateHz).toBeCloseTo(29.5 / k, 12);
      expect(apparentMotion(oneMark(30), rateHz, { sampler: 'frames' }).apparentHz).toBeCloseTo(
        0.5,
        9,
      );
    }
  });

  it('scales the rate by the number of features', () => {
    // 12 spokes at 2 rev/s made to creep at 0.05 rev/s (3 rpm): s = 12·1.95 = 23.4.
    const rates = ratesForApparent({ speedHz: 2, symmetry: 12 }, 0.05, { minHz: 20, maxHz: 30 });
    expect(rates).toHaveLength(1);
    expect(rates[0].rateHz).toBeCloseTo(23.4, 12);
    expect(apparentMotion({ speedHz: 2, symmetry: 12 }, rates[0].rateHz).apparentHz).toBeCloseTo(
      0.05,
      12,
    );
  });

  it('works for a part turning in the negative direction', () => {
    const part = oneMark(-10);
    const rates = ratesForApparent(part, 1, { minHz: 1, maxHz: 100 });
    expect(rates.length).toBeGreaterThan(0);
    for (const { rateHz } of rates) {
      const seen = apparentMotion(part, rateHz);
      expect(seen.apparentHz).toBeCloseTo(1, 9);
      // +1 rev/s against a speed of −10: turning backward, as one image (docs/physics.md §4).
      expect([seen.look, seen.images]).toEqual(['backward', 1]);
    }
  });

  it('under a flash, drops the sub-multiples where several images show (docs/physics.md §4)', () => {
    // docs/physics.md §4: keep only rates where the flash shows ONE image moving as wanted. Under a
    // flash the slow sub-multiples of 29.5 flashes/s put one mark at 30 rev/s close to a p/q
    // with q ≥ 2 (k = 22: 30·22/29.5 = 22.37 ≈ 179/8, eight images standing still).
    const flash = ratesForApparent(oneMark(30), 0.5, { minHz: 1, maxHz: 40 });
    const frames = ratesForApparent(
      oneMark(30),
      0.5,
      { minHz: 1, maxHz: 40 },
      { sampler: 'frames' },
    );
    expect(flash.length).toBeGreaterThan(0);
    expect(flash.length).toBeLessThan(frames.length);
    for (const { rateHz } of frames) {
      const seen = apparentMotion(oneMark(30), rateHz);
      const kept = flash.some((r) => r.rateHz === rateHz);
      expect(kept, `${rateHz} flashes/s: ${seen.images} images, ${seen.look}`).toBe(
        seen.images === 1 && seen.look === 'forward',
      );
    }
    const at22 = apparentMotion(oneMark(30), 29.5 / 22);
    expect([at22.look, at22.images]).toEqual(['still', 8]);
  });
});

describe('ratesForApparent: the validity limit |k·a/(f − a)| < 0.5', () => {
  it('offers no rate for an apparent speed the aliasing cannot produce', () => {
    // f = 10, a = 4: k = 1 gives |4/6| ≥ 0.5; at s = 6 the part is really seen at −2 rev/s.
    expect(ratesForApparent(oneMark(10), 4, { minHz: 1, maxHz: 100 })).toEqual([]);
    expect(apparentMotion(oneMark(10), 6).apparentHz).toBeCloseTo(-2, 12);
  });

  it('stops just before the half-pitch step: k = 2 for a = 2 at 10 rev/s would give −2, not 2', () => {
    expect(
      ratesForApparent(oneMark(10), 2, { minHz: 1, maxHz: 100 }, { sampler: 'frames' }),
    ).toEqual([{ rateHz: 8, k: 1 }]);
    // Under a flash 8 flashes/s is the lock 5/4 (10/8 = 1.25): four images stand still, so
    // no rate shows one image creeping at 2 rev/s (docs/physics.md §3, §4).
    expect(ratesForApparent(oneMark(10), 2, { minHz: 1, maxHz: 100 })).toEqual([]);
    expect(apparentMotion(oneMark(10), 8)).toMatchObject({ look: 'still', images: 4 });
    expect(apparentMotion(oneMark(10), 4, { sampler: 'frames' }).apparentHz).toBeCloseTo(-2, 12);
  });

  it('gives the single-image lock-in rates for an apparent speed of zero', () => {
    const part = { speedHz: 24.5, symmetry: 6 };
    const range = { minHz: 2, maxHz: 400 };
    const still = ratesForApparent(part, 0, range).map((r) => r.rateHz);
    const locks = lockRates(part, range, { maxImages: 1 }).map((l) => l.rateHz);
    expect(still).toHaveLength(locks.length);
    still.forEach((s, i) => expect(s).toBeCloseTo(locks[i], 9));
  });

  it('gives nothing for an apparent speed equal to the true speed, or for a part at rest', () => {
    expect(ratesForApparent(oneMark(30), 30, { minHz: 1, maxHz: 1000 })).toEqual([]);
    expect(ratesForApparent(oneMark(0), 0, { minHz: 1, maxHz: 1000 })).toEqual([]);
  });

  it('only returns rates at which apparentMotion sees the wanted speed, ascending, inside the range', () => {
    const input = fc.record({
      speedHz: fc.double({ min: -300, max: 300, noNaN: true }),
      symmetry: fc.integer({ min: 1, max: 24 }),
      apparentHz: fc.double({ min: -5, max: 5, noNaN: true }),
      lowestOverPattern: fc.double({ min: 0.02, max: 5, noNaN: true }), // keeps the list short
      span: fc.double({ min: 1.1, max: 50, noNaN: true }),
    });
    fc.assert(
      fc.property(input, ({ speedHz, symmetry, apparentHz, lowestOverPattern, span }) => {
        const minHz = Math.max(0.01, symmetry * Math.abs(speedHz) * lowestOverPattern);
        const maxHz = minHz * span;
        const rates = ratesForApparent({ speedHz, symmetry }, apparentHz, { minHz, maxHz });
        return rates.every(({ rateHz }, i) => {
          const seen = apparentMotion({ speedHz, symmetry }, rateHz, {
            sampler: 'frames',
          }).apparentHz;
          return (
            rateHz >= minHz * (1 - 1e-12) &&
            rateHz <= maxHz * (1 + 1e-12) &&
            (i === 0 || rateHz > rates[i - 1].rateHz) &&
            Math.abs(seen - apparentHz) <= 1e-9 * (1 + Math.abs(speedHz) * symmetry)
          );
        });
      }),
      { numRuns: 300 },
    );
  });

  it('never returns NaN or Infinity for plausible machines and ranges', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -1e4, max: 1e4, noNaN: true }),
        fc.integer({ min: 1, max: 100 }),
        fc.double({ min: -1e4, max: 1e4, noNaN: true }),
        fc.double({ min: 0.01, max: 100, noNaN: true }),
        (speedHz, symmetry, apparentHz, lowestOverPattern) => {
          const minHz = Math.max(
            1e-3,
            symmetry * Math.abs(speedHz - apparentHz) * lowestOverPattern,
          );
          return finiteOrInputError(() =>
            ratesForApparent({ speedHz, symmetry }, apparentHz, { minHz, maxHz: minHz * 3 }),
          );
        },
      ),
    );
  });
});

describe('ratesForApparent: only rates that really show the wanted motion (docs/physics.md §4)', () => {
  // Reported case: a 6-blade fan at 1780 rpm, wanted 0.5 rev/s backward, strobe 30–12000 flashes/min.
  const fan = { speedHz: 1780 / 60, symmetry: 6 };
  const strobe = { minHz: 0.5, maxHz: 200 };

  it('a 6-blade fan at 1780 rpm made to turn backward at 0.5 rev/s gets only rates showing one image turning backward', () => {
    const rates = ratesForApparent(fan, -0.5, strobe);
    expect(rates.length).toBeGreaterThan(0);
    for (const { rateHz } of rates) {
      const seen = apparentMotion(fan, rateHz, { sampler: 'flash' });
      // docs/physics.md §4: one image, a clear direction, the wanted motion.
      expect([seen.images, seen.look], `${rateHz} flashes/s`).toEqual([1, 'backward']);
      expect(seen.apparentHz).toBeCloseTo(-0.5, 9);
    }
    // s = n·|f − a|/k (docs/physics.md §4): 6·(29.667 + 0.5)/20 = 9.05 flashes/s is the lock 20/3,
    // three images standing still there: not offered.
    expect(apparentMotion(fan, 9.05)).toMatchObject({ look: 'still', images: 3 });
    expect(rates.some((r) => r.k === 20)).toBe(false);
  });

  it('on camera keeps every rate where the single frame-to-frame step shows the motion', () => {
    const rates = ratesForApparent(fan, -0.5, strobe, { sampler: 'frames' });
    const flash = ratesForApparent(fan, -0.5, strobe, { sampler: 'flash' });
    expect(rates.length).toBeGreaterThan(flash.length);
    for (const { rateHz } of rates) {
      expect(apparentMotion(fan, rateHz, { sampler: 'frames' })).toMatchObject({
        images: 1,
        look: 'backward',
      });
    }
  });

  it('never offers a rate where the direction is unclear', () => {
    // One mark at 30 rev/s, wanted 0.5 rev/s forward: k = 27…29 pass the validity limit
    // |k·a/(f − a)| < 0.5 but step 0.458–0.492 pitch per sample, direction unclear from 0.45
    // (docs/physics.md §2); every rate kept has |step| < 0.45.
    for (const sampler of ['flash', 'frames'] as const) {
      for (const { rateHz } of ratesForApparent(
        oneMark(30),
        0.5,
        { minHz: 1, maxHz: 40 },
        { sampler },
      )) {
        const seen = apparentMotion(oneMark(30), rateHz, { sampler });
        expect(seen.look).toBe('forward');
        expect(Math.abs(seen.step)).toBeLessThan(0.45);
      }
    }
  });

  it('gives nothing for a wanted speed at or below the still threshold: it would look still, not turn', () => {
    // 0.2 rpm is below the 0.25 rpm still threshold (docs/physics.md §2).
    expect(ratesForApparent(oneMark(30), 0.2 / 60, { minHz: 20, maxHz: 40 })).toEqual([]);
  });
});

describe('ratesForApparent: bad input', () => {
  const range = { minHz: 20, maxHz: 40 };

  it('rejects an unknown sampler', () => {
    expectInputError(
      () => ratesForApparent(oneMark(30), 0.5, range, bad({ sampler: 'video' })),
      'sampler',
    );
  });

  it.each(notNumbers.map((v) => [v]))('rejects a wanted apparent speed of %s', (a) => {
    expectInputError(() => ratesForApparent(oneMark(30), bad(a), range), 'wanted apparent speed');
  });

  it.each(notNumbers.map((v) => [v]))('rejects a speed of %s', (speedHz) => {
    expectInputError(() => ratesForApparent(bad({ speedHz, symmetry: 1 }), 0.5, range), 'speed');
  });

  it.each([[0], [1.5], [-2]])('rejects a feature count of %s', (symmetry) => {
    expectInputError(
      () => ratesForApparent(bad({ speedHz: 30, symmetry }), 0.5, range),
      'features (blades, spokes)',
    );
  });

  it('rejects an empty, inverted or non-positive range', () => {
    expectInputError(
      () => ratesForApparent(oneMark(30), 0.5, { minHz: 30, maxHz: 30 }),
      'rate range',
      'empty',
    );
    expectInputError(
      () => ratesForApparent(oneMark(30), 0.5, { minHz: 40, maxHz: 20 }),
      'rate range',
    );
    expectInputError(
      () => ratesForApparent(oneMark(30), 0.5, { minHz: 0, maxHz: 20 }),
      'lowest rate',
    );
    expectInputError(() => ratesForApparent(oneMark(30), 0.5, bad({ minHz: 1 })), 'highest rate');
  });
});
