import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { rateBands, type RateBand } from '../../src/core/rateBands';
import { apparentMotion } from '../../src/core/apparentMotion';
import { lockRates } from '../../src/core/lockRates';
import type { Part, Sampler } from '../../src/core/types';
import { bad, expectInputError, finiteOrInputError } from './expectInputError';

/** The band holding rate s well inside it (not within a hair of an edge), if any. */
function bandInside(bands: RateBand[], s: number): RateBand | undefined {
  return bands.find((b) => s > b.fromHz * (1 + 1e-9) && s < b.toHz * (1 - 1e-9));
}

/** What apparentMotion says: does this rate mislead about this part? */
function misleads(part: Part, s: number, sampler: Sampler): boolean {
  const look = apparentMotion(part, s, { sampler }).look;
  return look === 'still' || look === 'backward' || look === 'unclear';
}

/** The bands start at minHz, end at maxHz, each begins where the last ended, and none runs backwards. */
function contiguousCover(bands: RateBand[], minHz: number, maxHz: number): boolean {
  return (
    bands.length > 0 &&
    bands[0].fromHz === minHz &&
    bands.at(-1)!.toHz === maxHz &&
    bands.every((b, i) => b.toHz >= b.fromHz && (i === 0 || b.fromHz === bands[i - 1].toHz))
  );
}

describe('rateBands: the camera case', () => {
  it('calls every frame rate above 20 safe for one mark at 10 rev/s (doc example)', () => {
    // Doc block: one mark at 10 rev/s, camera 1–100 frames/s: faithful above 2·n·|f| = 20 (Shannon 1949).
    const last = rateBands(
      [{ speedHz: 10, symmetry: 1 }],
      { minHz: 1, maxHz: 100 },
      { sampler: 'frames' },
    ).at(-1);
    expect(last).toMatchObject({ fromHz: 20, toHz: 100, safe: true });
  });

  it('calls every frame rate above 2·n·|f|·(1 + u) safe, and the rate just below it misleading', () => {
    // physics.md §4: for frames every rate > 2·n·|f|·(1+u) is safe. 3 blades, 10 rev/s, ±5 %: 63 frames/s.
    const bands = rateBands(
      [{ speedHz: 10, symmetry: 3, tolerance: 0.05 }],
      { minHz: 1, maxHz: 200 },
      { sampler: 'frames' },
    );
    const last = bands.at(-1)!;
    expect(last.safe).toBe(true);
    expect(last.fromHz).toBeCloseTo(63, 9);
    expect(bands.at(-2)!.safe).toBe(false);
  });

  it('names the misleading look in the reason and the causes', () => {
    const bands = rateBands(
      [{ speedHz: 10, symmetry: 1 }],
      { minHz: 1, maxHz: 100 },
      { sampler: 'frames' },
    );
    const band = bandInside(bands, 15)!; // r = 0.667: backward; the band runs on down to the freeze at r = 1
    expect(band.safe).toBe(false);
    expect(band.reason).toBe(
      'Part 1 looks backward or its direction is unclear; part 1 looks still.',
    );
    expect(band.causes).toEqual([
      { part: 0, kind: 'backward', images: 1 },
      { part: 0, kind: 'still', images: 1 },
    ]);
    expect(band.fromHz).toBeLessThanOrEqual(10);
    expect(band.toHz).toBe(20);
  });
});

describe('rateBands: the strobe case', () => {
  it('keeps multi-image locks misleading at any rate under a flash, however high', () => {
    // physics.md §4: for a flash the multi-image locks stay misleading at any rate.
    const part = { speedHz: 10, symmetry: 1 };
    const flash = rateBands([part], { minHz: 1, maxHz: 200 }, { sampler: 'flash' });
    for (const q of [3, 4, 5, 6, 7, 8]) {
      const band = flash.find((b) => b.fromHz < 10 * q && b.toHz > 10 * q)!;
      expect(band.safe, `${10 * q} flashes/s`).toBe(false);
      expect(band.causes).toContainEqual({ part: 0, kind: 'still', images: q });
      expect(band.reason).toContain(`shows ${q} images standing still`);
    }
    // Nine images are past the default count of 8; on camera frames none of these rates misleads.
    expect(bandInside(flash, 90)!.safe).toBe(true);
    const frames = rateBands([part], { minHz: 1, maxHz: 200 }, { sampler: 'frames' });
    for (const s of [30, 40, 80]) expect(bandInside(frames, s)!.safe).toBe(true);
  });

  it('never steps over a lock inside a wide tolerance band', () => {
    // physics.md §4: report bands, not points; a lock inside a tolerance band must never be stepped over.
    const part = { speedHz: 24.5, symmetry: 6, tolerance: 0.2 };
    const range = { minHz: 5, maxHz: 1500 };
    const bands = rateBands([part], range, { sampler: 'flash' });
    const locks = lockRates(part, range);
    expect(locks.length).toBeGreaterThan(10);
    for (const lock of locks) {
      const low = Math.max(lock.lowHz, range.minHz);
      const high = Math.min(lock.highHz, range.maxHz);
      const crossing = bands.filter((b) => b.safe && b.toHz > low && b.fromHz < high);
      expect(crossing, `lock ${lock.p}/${lock.q} at ${lock.rateHz} Hz`).toEqual([]);
    }
  });
});

describe('rateBands: special parts', () => {
  it('calls every rate misleading for a part slower than the still threshold', () => {
    const bands = rateBands([{ speedHz: 0.001, symmetry: 1 }], { minHz: 1, maxHz: 100 });
    expect(bands).toHaveLength(1);
    expect(bands[0]).toMatchObject({ fromHz: 1, toHz: 100, safe: false });
    expect(bands[0].causes).toEqual([{ part: 0, kind: 'crawl', images: 1 }]);
    expect(bands[0].reason).toBe('Part 1 turns too slowly to see moving.');
  });

  it('leaves a part that is not turning out: it misleads nobody', () => {
    const bands = rateBands([{ speedHz: 0, symmetry: 4 }], { minHz: 1, maxHz: 100 });
    expect(bands).toEqual([
      {
        fromHz: 1,
        toHz: 100,
        safe: true,
        reason: 'Every part shows its true direction of turning.',
        causes: [],
      },
    ]);
  });

  it('numbers the parts in its reasons as they were given', () => {
    const parts = [
      { speedHz: 0, symmetry: 1 },
      { speedHz: 0.001, symmetry: 1 },
    ];
    expect(rateBands(parts, { minHz: 1, maxHz: 2 })[0].reason).toBe(
      'Part 2 turns too slowly to see moving.',
    );
  });
});

describe('rateBands: relations that hold for every input', () => {
  const partArb = fc.record({
    speedHz: fc.double({ min: -100, max: 100, noNaN: true }).filter((f) => Math.abs(f) > 0.05),
    symmetry: fc.integer({ min: 1, max: 12 }),
  });
  const samplerArb = fc.constantFrom<Sampler>('flash', 'frames');

  it('splits the range into contiguous bands that cover it end to end', () => {
    fc.assert(
      fc.property(
        fc.array(partArb, { minLength: 1, maxLength: 3 }),
        fc.double({ min: 0, max: 0.2, noNaN: true }),
        fc.double({ min: 0.5, max: 100, noNaN: true }),
        fc.double({ min: 1.5, max: 50, noNaN: true }),
        samplerArb,
        (parts, tolerance, minHz, span, sampler) => {
          const maxHz = minHz * span;
          const bands = rateBands(
            parts.map((p) => ({ ...p, tolerance })),
            { minHz, maxHz },
            { sampler },
          );
          // Neighbours differ: two safe bands never touch (misleading ones merge when they touch).
          const alternating = bands.every((b, i) => i === 0 || !(b.safe && bands[i - 1].safe));
          return contiguousCover(bands, minHz, maxHz) && alternating;
        },
      ),
      { numRuns: 150 },
    );
  });

  it('agrees with apparentMotion at every rate well inside a band, for exact speeds', () => {
    fc.assert(
      fc.property(
        fc.array(partArb, { minLength: 1, maxLength: 3 }),
        fc.double({ min: 0.5, max: 50, noNaN: true }),
        fc.double({ min: 1.5, max: 40, noNaN: true }),
        samplerArb,
        fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 5, maxLength: 5 }),
        (parts, minHz, span, sampler, where) => {
          const maxHz = minHz * span;
          const bands = rateBands(parts, { minHz, maxHz }, { sampler });
          return where.every((w) => {
            const s = minHz + w * (maxHz - minHz);
            const band = bandInside(bands, s);
            if (!band) return true; // on an edge: either answer is honest
            return band.safe === !parts.some((p) => misleads(p, s, sampler));
          });
        },
      ),
      { numRuns: 300 },
    );
  });

  it('calls a rate safe only when every speed within the tolerance shows its true direction', () => {
    fc.assert(
      fc.property(
        partArb,
        fc.double({ min: 0.001, max: 0.1, noNaN: true }),
        fc.double({ min: 0.5, max: 50, noNaN: true }),
        samplerArb,
        fc.double({ min: 0, max: 1, noNaN: true }),
        (part, tolerance, minHz, sampler, w) => {
          const maxHz = minHz * 30;
          const bands = rateBands([{ ...part, tolerance }], { minHz, maxHz }, { sampler });
          const s = minHz + w * (maxHz - minHz);
          const band = bandInside(bands, s);
          if (!band || !band.safe) return true;
          return [-1, -0.5, 0, 0.5, 1].every(
            (x) => !misleads({ ...part, speedHz: part.speedHz * (1 + x * tolerance) }, s, sampler),
          );
        },
      ),
      { numRuns: 300 },
    );
  });

  it('never returns NaN or Infinity for plausible machines and ranges', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -1e4, max: 1e4, noNaN: true }),
        fc.integer({ min: 1, max: 100 }),
        fc.double({ min: 0, max: 0.5, noNaN: true }),
        fc.double({ min: 0.01, max: 100, noNaN: true }),
        samplerArb,
        (speedHz, symmetry, tolerance, lowestOverPattern, sampler) => {
          const minHz = Math.max(1e-3, symmetry * Math.abs(speedHz) * lowestOverPattern);
          return finiteOrInputError(() =>
            rateBands(
              [{ speedHz, symmetry, tolerance }],
              { minHz, maxHz: minHz * 10 },
              { sampler },
            ),
          );
        },
      ),
    );
  });
});

describe('rateBands: bad input', () => {
  const part = { speedHz: 10, symmetry: 1 };
  const range = { minHz: 1, maxHz: 100 };

  it('rejects an empty or missing part list', () => {
    expectInputError(() => rateBands([], range), 'parts', 'part');
    expectInputError(() => rateBands(bad(undefined), range), 'parts', 'part');
    expectInputError(() => rateBands(bad(part), range), 'parts', 'part');
  });

  it('rejects a bad part anywhere in the list', () => {
    expectInputError(() => rateBands([part, bad(null)], range), 'part 2');
    expectInputError(() => rateBands([part, bad({ speedHz: NaN, symmetry: 1 })], range), 'speed');
    for (const symmetry of [0, 1.5, -2]) {
      expectInputError(
        () => rateBands([bad({ speedHz: 10, symmetry })], range),
        'features (blades, spokes)',
      );
    }
    expectInputError(() => rateBands([bad({ speedHz: '10', symmetry: 1 })], range), 'speed');
    expectInputError(() => rateBands([bad({ speedHz: Infinity, symmetry: 1 })], range), 'speed');
  });

  it('rejects an empty, inverted or non-positive range', () => {
    expectInputError(() => rateBands([part], { minHz: 5, maxHz: 5 }), 'rate range', 'empty');
    expectInputError(() => rateBands([part], { minHz: 50, maxHz: 5 }), 'rate range');
    expectInputError(() => rateBands([part], { minHz: -1, maxHz: 5 }), 'lowest rate');
    expectInputError(() => rateBands([part], bad({ minHz: 1, maxHz: null })), 'highest rate');
  });

  it('rejects an unknown sampler and bad look options', () => {
    expectInputError(() => rateBands([part], range, bad({ sampler: 'eye' })), 'sampler');
    expectInputError(() => rateBands([part], range, { maxImages: 0 }), 'largest image count');
    expectInputError(() => rateBands([part], range, { stillHz: 0 }), 'still threshold');
  });
});
