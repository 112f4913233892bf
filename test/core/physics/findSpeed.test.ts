import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { findSpeed } from '../../../src/core/physics/findSpeed';
import { apparentMotion } from '../../../src/core/physics/apparentMotion';
import { replay, sceneOf } from '../simulator';
import {
  anyPositive,
  bad,
  expectInputError,
  finiteOrInputError,
  notNumbers,
} from '../expectInputError';

const single = (rateHz: number) => ({ rateHz, images: 1 });

describe('findSpeed: two adjacent single images', () => {
  it('finds n·f = F1·F2/(F1 − F2): single images at 30 and 20 flashes/s mean 60 rev/s (doc example)', () => {
    // docs/physics.md §7: two adjacent single-image rates F1 > F2 give n·f = F1·F2/(F1 − F2) = 600/10.
    const found = findSpeed([single(30), single(20)], 1);
    expect(found.candidates[0].speedHz).toBe(60); // doc block example
    expect(found.candidates[0].locks).toEqual([
      { p: 2, q: 1 },
      { p: 3, q: 1 },
    ]);
    expect(found.candidates[0].misfit).toBe(0);
  });

  it('keeps the faster whole multiples as less likely candidates, slowest first', () => {
    // Every common multiple of 30 and 20 also fits; by default candidates go up to 8 × 30 = 240.
    expect(findSpeed([single(30), single(20)], 1).candidates.map((c) => c.speedHz)).toEqual([
      60, 120, 180, 240,
    ]);
  });

  it('finds the motor of a fictional pump skid from readings of 1450 and 725 flashes per minute', () => {
    // Invented scenario: a technician at the (fictional) Larchfield water works reads a pump motor.
    // F1·F2/(F1 − F2) = 1450·725/725 = 1450 per minute = 24.1666… rev/s.
    const found = findSpeed([single(1450 / 60), single(725 / 60)], 1);
    expect(found.candidates[0].speedHz).toBeCloseTo(1450 / 60, 9);
  });

  it('finds 120 rev/s from single images at 30 and 24 flashes/s (30·24/6)', () => {
    expect(findSpeed([single(30), single(24)], 1).candidates[0].speedHz).toBeCloseTo(120, 9);
  });

  it('divides the pattern frequency by the number of features', () => {
    // Wikipedia, "Stroboscopic effect": 12 spokes at 2 rev/s freeze at 24 per second (and at 12).
    expect(findSpeed([single(24), single(12)], 12).candidates[0].speedHz).toBeCloseTo(2, 12);
  });

  it('accepts multi-image readings: two images at 120 flashes/s rule out the even multiples of 60', () => {
    // n·f = (p/2)·120 with p odd; candidates run up to 8 × the highest reading, 960.
    const speeds = findSpeed(
      [single(30), single(20), { rateHz: 120, images: 2 }],
      1,
    ).candidates.map((c) => c.speedHz);
    expect(speeds).toEqual([60, 180, 300, 420, 540, 660, 780, 900]);
  });
});

describe('findSpeed: ranking and the next rate', () => {
  it('ranks candidates inside the expected speed range first', () => {
    const found = findSpeed([single(30), single(20)], 1, { minHz: 100, maxHz: 150 });
    expect(found.candidates.map((c) => [c.speedHz, c.expected])).toEqual([
      [120, true],
      [60, false],
      [180, false],
      [240, false],
    ]);
  });

  it('proposes twice the top candidate, where it shows a double image, when that tells the candidates apart', () => {
    // docs/physics.md §7: twice the top candidate's rate shows a double image if it is right.
    const found = findSpeed([single(30), single(20)], 1, undefined, { maxMultiple: 4 });
    expect(found.candidates.map((c) => c.speedHz)).toEqual([60, 120]);
    expect(found.nextRateHz).toBe(120);
    expect(found.nextPurpose).toBe('separate');
    expect(found.predictions).toEqual([
      { speedHz: 60, images: 2, look: 'still' },
      { speedHz: 120, images: 1, look: 'still' },
    ]);
  });

  it('proposes twice the only candidate to confirm it', () => {
    const found = findSpeed([single(30), single(20)], 1, undefined, { maxMultiple: 2 });
    expect(found.candidates.map((c) => c.speedHz)).toEqual([60]);
    expect(found.nextRateHz).toBe(120);
    expect(found.nextPurpose).toBe('confirm');
    expect(found.predictions).toEqual([{ speedHz: 60, images: 2, look: 'still' }]);
  });

  it('proposes a rate where the leading candidate looks different from every other', () => {
    const found = findSpeed([single(30), single(20)], 1);
    expect(found.nextPurpose).toBe('separate');
    const views = found.predictions!.map((p) => `${p.look}:${p.images}`);
    expect(views.slice(1)).not.toContain(views[0]);
    // The predictions are what apparentMotion shows at that rate.
    for (const p of found.predictions!) {
      const m = apparentMotion({ speedHz: p.speedHz, symmetry: 1 }, found.nextRateHz!);
      expect([p.look, p.images]).toEqual([m.look, m.images]);
    }
  });

  it('keeps the next rate inside the strobe range when one is given', () => {
    const found = findSpeed([single(30), single(20)], 1, undefined, {
      rateRange: { minHz: 5, maxHz: 100 },
    });
    expect(found.nextRateHz).toBeGreaterThanOrEqual(5);
    expect(found.nextRateHz).toBeLessThanOrEqual(100);
  });
});

describe('findSpeed: an expected range is enumerated, never capped away (docs/physics.md §7)', () => {
  it('lists every speed of a 60-tooth gear in 29–30 rev/s from one image at 10 flashes/s', () => {
    // Reported case. n·f = k·F with k from ⌈60·29/10⌉ = 174 to ⌊60·30/10⌋ = 180: seven speeds,
    // k/6 rev/s = 29, 29.17, …, 30 (docs/physics.md §7).
    const found = findSpeed([single(10)], 60, { minHz: 29, maxHz: 30 });
    const inside = found.candidates.filter((c) => c.expected);
    expect(inside.map((c) => c.speedHz * 6)).toEqual(
      [174, 175, 176, 177, 178, 179, 180].map((k) => expect.closeTo(k, 9)),
    );
    // They come first; slower speeds outside the range follow.
    expect(found.candidates.slice(0, 7).every((c) => c.expected)).toBe(true);
    expect(found.candidates.length).toBeGreaterThan(7);
    for (const c of inside) {
      expect(apparentMotion({ speedHz: c.speedHz, symmetry: 60 }, 10)).toMatchObject({
        look: 'still',
        images: 1,
      });
    }
  });

  it('returns every speed inside the range even when there are more than the list holds', () => {
    // One mark, a single image at 1 flash/s, expected 10–60 rev/s: k = 10…60, 51 speeds (> 40).
    const found = findSpeed([single(1)], 1, { minHz: 10, maxHz: 60 });
    expect(found.candidates.filter((c) => c.expected)).toHaveLength(51);
  });

  it('refuses, with a message, an expected range holding more speeds than can be tested', () => {
    expectInputError(
      () => findSpeed([single(0.001)], 1000, { minHz: 1, maxHz: 1e6 }),
      'expected speed range',
      'narrow it',
    );
  });
});

describe('findSpeed: the next rate is searched over the whole strobe range (docs/physics.md §7)', () => {
  const strobe = { minHz: 30 / 60, maxHz: 12000 / 60 };

  it('after single images at 1500 and 1000 flashes/min proposes a rate where the candidates look different, not 3000', () => {
    // Reported case: at 3000 flashes/min (50 Hz) every candidate 50, 100, 150, 200 rev/s shows one
    // still image (n·f/s whole), so it tells nothing.
    const found = findSpeed([single(25), single(1000 / 60)], 1, undefined, { rateRange: strobe });
    expect(found.candidates.map((c) => c.speedHz)).toEqual([50, 100, 150, 200]);
    expect(found.nextPurpose).toBe('separate');
    expect(found.nextRateHz).not.toBeCloseTo(50, 9);
    // Brute-force replay (test/core/simulator.ts) of each candidate at the rate proposed: the
    // likeliest (50 rev/s) looks unlike every other.
    const views = found.candidates.map((c) => {
      const v = replay(sceneOf(c.speedHz, 1, found.nextRateHz!, 'flash'));
      return `${v.images}:${v.look}`;
    });
    expect(views.slice(1)).not.toContain(views[0]);
    // Within the strobe's range and a whole number of flashes per minute (settable).
    expect(found.nextRateHz! * 60).toBe(Math.round(found.nextRateHz! * 60));
  });

  it('after single images at 30 and 20 flashes/s finds a rate in a 1–35 Hz strobe that tells 60 rev/s from 120', () => {
    // Reported case: the old search said no rate helps. 24 flashes/s, for one, shows 2 images at
    // 60 rev/s (r = 5/2) and 1 at 120 rev/s (r = 5), docs/physics.md §3.
    expect(replay(sceneOf(60, 1, 24, 'flash')).images).toBe(2);
    expect(replay(sceneOf(120, 1, 24, 'flash')).images).toBe(1);
    const found = findSpeed([single(30), single(20)], 1, undefined, {
      rateRange: { minHz: 1, maxHz: 35 },
    });
    expect(found.nextPurpose).toBe('separate');
    const s = found.nextRateHz!;
    expect(s).toBeGreaterThanOrEqual(1);
    expect(s).toBeLessThanOrEqual(35);
    const at = (speedHz: number) => {
      const v = replay(sceneOf(speedHz, 1, s, 'flash'));
      return `${v.images}:${v.look}`;
    };
    expect(at(60)).not.toBe(at(120));
  });

  it('says no rate helps only when none in the range tells any two candidates apart', () => {
    // A strobe that only reaches 59.9–60.1 flashes/s: 60, 120, 180 and 240 rev/s all show one
    // image drifting slowly there, whichever speed it is.
    const found = findSpeed([single(30), single(20)], 1, undefined, {
      rateRange: { minHz: 59.9, maxHz: 60.1 },
    });
    expect(found.candidates).toHaveLength(4);
    expect(found.nextRateHz).toBeUndefined();
  });

  it('leaves the next rate out when asked to', () => {
    expect(findSpeed([single(30), single(20)], 1, undefined, { proposeNext: false })).toEqual({
      candidates: findSpeed([single(30), single(20)], 1).candidates,
    });
  });
});

describe('findSpeed: inconsistent readings', () => {
  it('finds no speed when one rate is read as a single and as a double image', () => {
    const found = findSpeed([single(30), { rateHz: 30, images: 2 }], 1);
    expect(found.candidates).toEqual([]);
    expect(found.nextRateHz).toBeUndefined();
  });

  it('finds no speed when two single-image rates share no multiple within reach', () => {
    expect(findSpeed([single(30), single(31.7)], 1).candidates).toEqual([]);
  });
});

describe('findSpeed: relations that hold for every input', () => {
  it('always lists the true speed, and every candidate explains every reading', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 200, noNaN: true }),
        fc.integer({ min: 1, max: 6 }),
        fc.integer({ min: 1, max: 4 }),
        (speedHz, symmetry, k) => {
          const F = symmetry * speedHz;
          // Readings a technician gets coming down from high rates: F/k, F/(k + 1), and a double image at 2F.
          const readings = [single(F / k), single(F / (k + 1)), { rateHz: 2 * F, images: 2 }];
          const found = findSpeed(readings, symmetry);
          expect(
            found.candidates.some((c) => Math.abs(c.speedHz - speedHz) <= 1e-9 * speedHz),
          ).toBe(true);
          for (const c of found.candidates) {
            for (const r of readings) {
              const m = apparentMotion({ speedHz: c.speedHz, symmetry }, r.rateHz);
              expect(m.look).toBe('still');
              expect(m.images).toBe(r.images);
            }
          }
        },
      ),
      { numRuns: 200 },
    );
  });

  it('never returns NaN or Infinity, whatever positive rates it is given', () => {
    const reading = fc.record({ rateHz: anyPositive(), images: fc.integer({ min: 1, max: 8 }) });
    fc.assert(
      fc.property(
        fc.array(reading, { minLength: 1, maxLength: 4 }),
        fc.integer({ min: 1, max: 100 }),
        (readings, n) => finiteOrInputError(() => findSpeed(readings, n)),
      ),
      { numRuns: 300 },
    );
  });
});

describe('findSpeed: bad input', () => {
  it('rejects an empty or missing list of readings', () => {
    expectInputError(() => findSpeed([], 1), 'readings', 'reading');
    expectInputError(() => findSpeed(bad(undefined), 1), 'readings', 'reading');
    expectInputError(() => findSpeed(bad(single(30)), 1), 'readings', 'reading');
  });

  it.each([[0], [-30], ...notNumbers.map((v) => [v])])(
    'rejects a reading at a rate of %s',
    (rateHz) => {
      expectInputError(
        () => findSpeed([single(30), bad({ rateHz, images: 1 })], 1),
        'rate of reading 2',
      );
    },
  );

  it.each([[0], [1.5], [-2], [65], [NaN], ['1']])('rejects a reading of %s images', (images) => {
    expectInputError(() => findSpeed([bad({ rateHz: 30, images })], 1), 'images in reading 1');
  });

  it('rejects a reading that is not an object', () => {
    expectInputError(() => findSpeed([bad(null)], 1), 'rate of reading 1');
  });

  it.each([[0], [1.5], [-2], [NaN], [Infinity], ['12'], [null]])(
    'rejects a feature count of %s',
    (symmetry) => {
      expectInputError(() => findSpeed([single(30)], bad(symmetry)), 'features (blades, spokes)');
    },
  );

  it('rejects an empty or inverted expected speed range', () => {
    expectInputError(
      () => findSpeed([single(30)], 1, { minHz: 50, maxHz: 50 }),
      'expected speed range',
      'empty',
    );
    expectInputError(
      () => findSpeed([single(30)], 1, { minHz: 70, maxHz: 50 }),
      'expected speed range',
    );
    expectInputError(
      () => findSpeed([single(30)], 1, { minHz: 0, maxHz: 50 }),
      'lowest expected speed',
    );
  });

  it('rejects bad options', () => {
    expectInputError(
      () => findSpeed([single(30)], 1, undefined, { matchTolerance: 0.2 }),
      'match tolerance',
    );
    expectInputError(
      () => findSpeed([single(30)], 1, undefined, { maxMultiple: 0 }),
      'largest multiple',
    );
    expectInputError(
      () => findSpeed([single(30)], 1, undefined, { rateRange: { minHz: 9, maxHz: 3 } }),
      'strobe range',
    );
  });
});
