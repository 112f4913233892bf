import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { coprimeCount, lockRates } from '../../../src/core/physics/lockRates';
import { gcd } from '../../../src/core/basics/gcd';
import { apparentMotion } from '../../../src/core/physics/apparentMotion';
import { bad, expectInputError, finiteOrInputError, notNumbers } from '../expectInputError';

const wheel = { speedHz: 2, symmetry: 12 }; // Wikipedia, "Stroboscopic effect": 12 spokes at 2 rev/s

describe('lockRates: published cases', () => {
  it('lists 24 per second as the one single-image rate of a 12-spoke wheel at 2 rev/s between 20 and 30', () => {
    // Wikipedia, "Stroboscopic effect": the wheel filmed at 24 frames/s seems still. Doc block example.
    expect(lockRates(wheel, { minHz: 20, maxHz: 30 }, { maxImages: 1 })).toEqual([
      { rateHz: 24, images: 1, p: 1, q: 1, lowHz: 24, highHz: 24 },
    ]);
  });

  it('adds the multi-image locks p/q between 20 and 30 when up to 8 images are counted', () => {
    // docs/physics.md §3: s = n·|f|·q/p = 24·q/p, gcd(p, q) = 1, q ≤ 8; worked by hand.
    const found = lockRates(wheel, { minHz: 20, maxHz: 30 }).map((l) => [l.p, l.q]);
    expect(found).toEqual([
      [6, 5], // 24·5/6 = 20 (the lower range end, included)
      [7, 6], // 20.571…
      [8, 7], // 21
      [9, 8], // 21.333…
      [1, 1], // 24
      [7, 8], // 27.428…
      [6, 7], // 28
      [5, 6], // 28.8
      [4, 5], // 30 (the upper range end, included)
    ]);
  });

  it('shows exactly the locks it lists: at each rate apparentMotion sees q images standing still', () => {
    for (const lock of lockRates({ speedHz: 10, symmetry: 3 }, { minHz: 5, maxHz: 200 })) {
      const m = apparentMotion({ speedHz: 10, symmetry: 3 }, lock.rateHz);
      expect(m.look, `${lock.rateHz} Hz`).toBe('still');
      expect(m.images, `${lock.rateHz} Hz`).toBe(lock.images);
    }
  });
});

describe('lockRates: structure of docs/physics.md §3', () => {
  it('gives the sub-multiples n·|f|/p as single images and the multiples q·n·|f| as q images', () => {
    const locks = lockRates({ speedHz: 10, symmetry: 1 }, { minHz: 1, maxHz: 100 });
    const single = locks.filter((l) => l.q === 1).map((l) => l.rateHz);
    expect(single).toEqual([1, 10 / 9, 1.25, 10 / 7, 10 / 6, 2, 2.5, 10 / 3, 5, 10]);
    const multiples = locks.filter((l) => l.p === 1).map((l) => [l.rateHz, l.images]);
    expect(multiples).toEqual([
      [10, 1],
      [20, 2],
      [30, 3],
      [40, 4],
      [50, 5],
      [60, 6],
      [70, 7],
      [80, 8],
    ]);
  });

  it('places the highest single-image rate at n·|f|', () => {
    // docs/physics.md §3: the highest rate that gives one single image is s = n·|f|.
    const locks = lockRates({ speedHz: 29.5, symmetry: 6 }, { minHz: 1, maxHz: 2000 });
    const highestSingle = Math.max(...locks.filter((l) => l.images === 1).map((l) => l.rateHz));
    expect(highestSingle).toBeCloseTo(6 * 29.5, 9);
  });

  it('ignores the direction of turning', () => {
    const range = { minHz: 1, maxHz: 500 };
    expect(lockRates({ speedHz: -29.5, symmetry: 6 }, range)).toEqual(
      lockRates({ speedHz: 29.5, symmetry: 6 }, range),
    );
  });

  it('has no lock-in rates for a part that is not turning', () => {
    expect(lockRates({ speedHz: 0, symmetry: 4 }, { minHz: 1, maxHz: 100 })).toEqual([]);
  });

  it('matches a brute-force list of every reduced p/q, ascending, inside the range ends', () => {
    const arbitrary = fc.record({
      speedHz: fc.double({ min: -200, max: 200, noNaN: true }).filter((f) => Math.abs(f) > 0.01),
      symmetry: fc.integer({ min: 1, max: 12 }),
      lowestOverPattern: fc.double({ min: 0.02, max: 20, noNaN: true }), // keeps the list short
      span: fc.double({ min: 1.01, max: 20, noNaN: true }),
      maxImages: fc.integer({ min: 1, max: 8 }),
    });
    fc.assert(
      fc.property(arbitrary, ({ speedHz, symmetry, lowestOverPattern, span, maxImages }) => {
        const F = symmetry * Math.abs(speedHz);
        const minHz = F * lowestOverPattern;
        const maxHz = minHz * span;
        const got = lockRates({ speedHz, symmetry }, { minHz, maxHz }, { maxImages });
        const want: Array<[number, number]> = [];
        for (let q = 1; q <= maxImages; q++) {
          for (let p = 1; (F * q) / p >= minHz * (1 - 1e-9); p++) {
            const s = (F * q) / p;
            if (s <= maxHz * (1 + 1e-9) && reduced(p, q) === 1) want.push([p, q]);
          }
        }
        want.sort((a, b) => (F * a[1]) / a[0] - (F * b[1]) / b[0] || a[1] - b[1]);
        expect(got.map((l) => [l.p, l.q])).toEqual(want);
        for (let i = 0; i < got.length; i++) {
          const l = got[i];
          expect(l.rateHz).toBeCloseTo((F * l.q) / l.p, 9);
          expect(l.images).toBe(l.q);
          if (i > 0) expect(l.rateHz).toBeGreaterThanOrEqual(got[i - 1].rateHz);
        }
      }),
      { numRuns: 100 },
    );
  });
});

describe('lockRates: range ends and tolerance bands', () => {
  it('includes a lock that falls exactly on either end of the range', () => {
    expect(
      lockRates(wheel, { minHz: 24, maxHz: 25 }, { maxImages: 1 }).map((l) => l.rateHz),
    ).toEqual([24]);
    expect(
      lockRates(wheel, { minHz: 23, maxHz: 24 }, { maxImages: 1 }).map((l) => l.rateHz),
    ).toEqual([24]);
  });

  it('leaves out a lock just outside the range', () => {
    expect(lockRates(wheel, { minHz: 24.001, maxHz: 25 }, { maxImages: 1 })).toEqual([]);
    expect(lockRates(wheel, { minHz: 23, maxHz: 23.999 }, { maxImages: 1 })).toEqual([]);
  });

  it('spreads each lock into the band [n|f|(1−u)·q/p, n|f|(1+u)·q/p] for a tolerance u', () => {
    // docs/physics.md §3: a speed tolerance ±u turns each lock-in rate into a band.
    const locks = lockRates(
      { speedHz: 24.5, symmetry: 1, tolerance: 0.03 },
      { minHz: 5, maxHz: 100 },
    );
    expect(locks.length).toBeGreaterThan(0);
    for (const l of locks) {
      expect(l.lowHz).toBeCloseTo(24.5 * 0.97 * (l.q / l.p), 9);
      expect(l.highHz).toBeCloseTo(24.5 * 1.03 * (l.q / l.p), 9);
      expect(l.lowHz).toBeLessThan(l.rateHz);
      expect(l.highHz).toBeGreaterThan(l.rateHz);
    }
  });

  it('never returns NaN or Infinity for plausible machines and ranges', () => {
    // Kept to sizes where the list stays short; extreme ratios make the list itself huge.
    fc.assert(
      fc.property(
        fc.double({ min: -1e4, max: 1e4, noNaN: true }),
        fc.integer({ min: 1, max: 100 }),
        fc.double({ min: 0, max: 0.5, noNaN: true }),
        fc.double({ min: 0.01, max: 100, noNaN: true }),
        (speedHz, symmetry, tolerance, lowestOverPattern) => {
          const minHz = Math.max(1e-3, symmetry * Math.abs(speedHz) * lowestOverPattern);
          return finiteOrInputError(() =>
            lockRates({ speedHz, symmetry, tolerance }, { minHz, maxHz: minHz * 1.5 }),
          );
        },
      ),
    );
  });
});

describe('lockRates: large numbers', () => {
  /** The locks p/q of a range by brute force over p (docs/physics.md §3's definition), for checking. */
  function bruteForce(F: number, minHz: number, maxHz: number, maxImages: number) {
    const out: Array<{ p: number; q: number }> = [];
    for (let q = 1; q <= maxImages; q++) {
      for (let p = Math.ceil((F * q) / maxHz); p <= Math.floor((F * q) / minHz); p++) {
        if (gcd(p, q) === 1) out.push({ p, q });
      }
    }
    return out;
  }

  it('keeps p exact beyond 32-bit integers: 5e9 pattern pitches a second seen near 1 flash/s', () => {
    // n·|f| = 5e9 Hz; s = F/p in [1, 1 + 1e-9] for p = 4 999 999 995 … 5 000 000 000 (above 2^31).
    const locks = lockRates(
      { speedHz: 5e9, symmetry: 1 },
      { minHz: 1, maxHz: 1 + 1e-9 },
      { maxImages: 1 },
    );
    expect(locks.map((l) => l.p)).toEqual([
      5e9, 4999999999, 4999999998, 4999999997, 4999999996, 4999999995,
    ]);
    expect(locks[0].rateHz).toBe(1);
    for (const l of locks) expect(l.rateHz).toBeCloseTo(5e9 / l.p, 15);
    // Every image count up to 8, against a brute-force count.
    const all = lockRates({ speedHz: 5e9, symmetry: 1 }, { minHz: 1, maxHz: 1 + 1e-9 });
    const expected = bruteForce(5e9, 1, 1 + 1e-9, 8);
    expect(all.map((l) => `${l.p}/${l.q}`).sort()).toEqual(
      expected.map((l) => `${l.p}/${l.q}`).sort(),
    );
  });

  it('lists a large range whose locks in lowest terms fit the limit: 154 000 of them, counted exactly', () => {
    // One mark at 7000 rev/s over 0.5–1 flash/s: p from 7000·q to 14 000·q, only p coprime to q.
    // The old count took every p (252 000, over the 200 000 limit) and refused the range.
    const locks = lockRates({ speedHz: 7000, symmetry: 1 }, { minHz: 0.5, maxHz: 1 });
    const expected = bruteForce(7000, 0.5, 1, 8).length;
    expect(locks.length).toBe(expected);
    expect(expected).toBeGreaterThan(150_000);
    expect(expected).toBeLessThan(200_000);
  });

  it('says how many locks a refused range holds, all image counts together', () => {
    // 7000·22 locks a second of 1/s span; twice the span is past the 200 000 limit.
    const error = expectInputError(
      () => lockRates({ speedHz: 14000, symmetry: 1 }, { minHz: 0.5, maxHz: 1 }),
      'rate range',
    );
    const total = [1, 2, 3, 4, 5, 6, 7, 8].reduce(
      (n, q) => n + coprimeCount(14000 * q, 28000 * q, q),
      0,
    );
    expect(error.message).toContain(`about ${total.toLocaleString('en')} lock-in rates`);
  });

  it('counts the whole numbers coprime to q in a span by inclusion–exclusion, as a brute force does', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 5000 }),
        fc.integer({ min: 0, max: 500 }),
        fc.integer({ min: 1, max: 64 }),
        (a, span, q) => {
          let n = 0;
          for (let p = a; p <= a + span; p++) if (gcd(p, q) === 1) n++;
          expect(coprimeCount(a, a + span, q)).toBe(n);
        },
      ),
      { seed: 1949, numRuns: 300 },
    );
  });

  it('refuses, with a message, a range so low that p passes 2^53 and cannot be counted exactly', () => {
    expectInputError(
      () => lockRates({ speedHz: 1e12, symmetry: 1000 }, { minHz: 1e-6, maxHz: 1.0000001e-6 }),
      'rate range',
      'raise the lowest rate',
    );
  });
});

describe('lockRates: bad input', () => {
  const range = { minHz: 20, maxHz: 30 };

  it.each(notNumbers.map((v) => [v]))('rejects a speed of %s', (speedHz) => {
    expectInputError(() => lockRates(bad({ speedHz, symmetry: 12 }), range), 'speed');
  });

  it.each([[0], [1.5], [-2]])('rejects a feature count of %s', (symmetry) => {
    expectInputError(
      () => lockRates(bad({ speedHz: 2, symmetry }), range),
      'features (blades, spokes)',
    );
  });

  it('rejects an empty, inverted or non-positive range', () => {
    expectInputError(() => lockRates(wheel, { minHz: 24, maxHz: 24 }), 'rate range', 'empty');
    expectInputError(() => lockRates(wheel, { minHz: 30, maxHz: 20 }), 'rate range');
    expectInputError(() => lockRates(wheel, { minHz: 0, maxHz: 20 }), 'lowest rate');
    expectInputError(() => lockRates(wheel, { minHz: -5, maxHz: 20 }), 'lowest rate');
    expectInputError(() => lockRates(wheel, bad({ minHz: 20, maxHz: 'fast' })), 'highest rate');
    expectInputError(() => lockRates(wheel, bad({ minHz: NaN, maxHz: 30 })), 'lowest rate');
    expectInputError(() => lockRates(wheel, bad({ minHz: 1, maxHz: Infinity })), 'highest rate');
    expectInputError(() => lockRates(wheel, bad(null)), 'rate range');
  });

  it.each([[0], [65], [1.5], [NaN]])('rejects a largest image count of %s', (maxImages) => {
    expectInputError(() => lockRates(wheel, range, { maxImages }), 'largest image count');
  });

  it('rejects a tolerance outside 0 to 0.5', () => {
    expectInputError(() => lockRates({ ...wheel, tolerance: 0.6 }, range), 'speed tolerance');
  });
});

/** Greatest common divisor, written out here so the test does not lean on the core's gcd. */
function reduced(a: number, b: number): number {
  return b === 0 ? a : reduced(b, a % b);
}
