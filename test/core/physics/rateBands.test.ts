import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { rateBands, type RateBand } from '../../../src/core/physics/rateBands';
import { apparentMotion } from '../../../src/core/physics/apparentMotion';
import { lockRates } from '../../../src/core/physics/lockRates';
import type { Part, Sampler } from '../../../src/core/basics/types';
import { bad, expectInputError, finiteOrInputError } from '../expectInputError';

/** The band holding rate s well inside it (not within a hair of an edge), if any. */
function bandInside(bands: RateBand[], s: number): RateBand | undefined {
  return bands.find((b) => s > b.fromHz * (1 + 1e-9) && s < b.toHz * (1 - 1e-9));
}

/**
 * What apparentMotion says: does this rate mislead about this part? docs/physics.md §4: safe is
 * faithful, or forward as one image at the nearly-still threshold (6 rpm) or faster.
 */
function misleads(part: Part, s: number, sampler: Sampler): boolean {
  const m = apparentMotion(part, s, { sampler });
  return !(m.look === 'true' || (m.look === 'forward' && m.images === 1 && !m.nearlyStill));
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
    // docs/physics.md §4: for frames every rate > 2·n·|f|·(1+u) is safe. 3 blades, 10 rev/s, ±5 %: 63 frames/s.
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
    const band = bandInside(bands, 15)!; // r = 0.667: backward; the band runs on down past the freeze at r = 1
    expect(band.safe).toBe(false);
    expect(band.reason).toBe(
      'Part 1 looks backward or its direction is unclear; part 1 looks still; part 1 can creep ' +
        'forward slower than 6 rpm (nearly still).',
    );
    expect(band.causes).toEqual([
      { part: 0, kind: 'backward', images: 1 },
      { part: 0, kind: 'still', images: 1 },
      { part: 0, kind: 'nearly-still', images: 1 },
    ]);
    // docs/physics.md §4: the margin below the freeze at 10 frames/s ends where the mark creeps
    // forward at 6 rpm = 0.1 rev/s: 10 − 0.1 = 9.9 frames/s.
    expect(band.fromHz).toBeCloseTo(9.9, 12);
    expect(band.toHz).toBe(20);
    expect(band.promise).toBe('Can look still, nearly still, doubled or backward');
  });
});

describe('rateBands: the strobe case', () => {
  it('keeps multi-image locks misleading at any rate under a flash, however high', () => {
    // docs/physics.md §4: for a flash the multi-image locks stay misleading at any rate.
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
    // docs/physics.md §4: report bands, not points; a lock inside a tolerance band must never be stepped over.
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

describe('rateBands: the nearly-still margin (docs/physics.md §4)', () => {
  // Reported case: a 3-jaw chuck at 2000 rpm ±1 % under a strobe.
  const chuck = { speedHz: 2000 / 60, symmetry: 3, tolerance: 0.01 };
  const strobe = { minHz: 30 / 60, maxHz: 12000 / 60 };

  it('a 3-jaw chuck at 2000 rpm ±1 % is not safe at 5939 flashes/min, where at 1980 rpm it creeps at 0.33 rpm', () => {
    const bands = rateBands([chuck], strobe, { sampler: 'flash' });
    const at = bands.find((b) => b.fromHz <= 5939 / 60 && 5939 / 60 <= b.toHz)!;
    expect(at.safe).toBe(false);
    expect(at.causes).toContainEqual({ part: 0, kind: 'nearly-still', images: 1 });
    // At 1980 rpm (inside ±1 %): 3·33/98.983 = 1.000168 pitches a flash, a forward creep of
    // 0.000168·98.983/3 rev/s = 0.33 rpm (docs/physics.md §2): below 6 rpm, nearly still.
    const seen = apparentMotion({ speedHz: 1980 / 60, symmetry: 3 }, 5939 / 60);
    expect(seen.look).toBe('forward');
    expect(seen.apparentHz * 60).toBeCloseTo(1 / 3, 9);
    expect(seen.nearlyStill).toBe(true);
  });

  it('keeps the safe band below the 100 flashes/s lock until the slowest speed creeps forward at 6 rpm', () => {
    // docs/physics.md §4: the edge is where the apparent speed at the worst speed within tolerance
    // falls to the threshold: s = n·|f|·(1 − u) − n·0.1 rev/s = 99 − 0.3 = 98.7 flashes/s (5922 fpm).
    const bands = rateBands([chuck], { minHz: 90, maxHz: 99.5 }, { sampler: 'flash' });
    const safeBelow = bands.filter((b) => b.safe).at(-1)!;
    expect(safeBelow.toHz).toBeCloseTo(98.7, 12);
    expect(safeBelow.promise).toBe('Seen turning its true way');
    expect(safeBelow.reason).toBe(
      'Every part is seen turning its true way: at its true speed, or forward as one image at ' +
        '6 rpm or faster (slower than it really turns).',
    );
    // Just inside the safe band the slowest speed creeps forward at just over 6 rpm; just outside, under it.
    const slowest = { speedHz: 1980 / 60, symmetry: 3 };
    expect(apparentMotion(slowest, 98.7 * (1 - 1e-9))).toMatchObject({
      look: 'forward',
      nearlyStill: false,
    });
    expect(apparentMotion(slowest, 98.7 * (1 + 1e-9))).toMatchObject({
      look: 'forward',
      nearlyStill: true,
    });
  });

  it('takes the nearly-still threshold from the options', () => {
    // With 1 rpm instead of 6: the edge moves to 99 − 3/60 = 98.95 flashes/s.
    const bands = rateBands([chuck], { minHz: 90, maxHz: 99.5 }, { nearlyStillHz: 1 / 60 });
    expect(bands.filter((b) => b.safe).at(-1)!.toHz).toBeCloseTo(98.95, 12);
    expectInputError(
      () => rateBands([chuck], strobe, { nearlyStillHz: 0 }),
      'nearly-still threshold',
    );
  });

  it('calls a flash rate where several images drift misleading: not one image', () => {
    // One mark at 10 rev/s under 7.6 flashes/s: near the lock 4/3 three images creep as a group
    // (|3·10 − 4·7.6| = 0.4 image spacings a second, under 1: apparentMotion counts 3 images).
    const mark = { speedHz: 10, symmetry: 1 };
    const seen = apparentMotion(mark, 7.6);
    expect([seen.images, seen.look]).toEqual([3, 'forward']);
    const band = rateBands([mark], { minHz: 5, maxHz: 9 }).find(
      (b) => b.fromHz <= 7.6 && 7.6 <= b.toHz,
    )!;
    expect(band.safe).toBe(false);
    expect(band.causes).toContainEqual({ part: 0, kind: 'images', images: 3 });
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
        promise: 'Seen at its true speed',
        reason: 'Every part is seen turning at its true speed and in its true direction.',
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

  it('calls a rate safe only when every speed within the tolerance is seen moving its true way, at 6 rpm or more', () => {
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
