import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  apparentMotion,
  foldedHz,
  lockRates,
  rateBands,
  rateMapSeries,
  type Part,
  type RateMapSeries,
} from '../../../src/core';
import { bad, expectInputError } from '../expectInputError';

// An invented set of parts on a fictional bottling-line conveyor: drive motor shaft mark,
// 6-blade cooling fan, 8-spoke pulley, 3-jaw chuck.
const lineParts: Part[] = [
  { speedHz: 1470 / 60, symmetry: 1, tolerance: 0.01 },
  { speedHz: 980 / 60, symmetry: 6, tolerance: 0.02 },
  { speedHz: -590 / 60, symmetry: 8 },
  { speedHz: 2950 / 60, symmetry: 3, tolerance: 0.01 },
];

/** Indices where part j's column holds the gap of an alias edge: finite limits at the same rate on both sides. */
function edgeGaps(map: RateMapSeries, j: number): number[] {
  const out: number[] = [];
  const y = map.apparentRpm[j];
  for (let i = 1; i + 1 < y.length; i++) {
    const between = map.rates[i - 1] === map.rates[i] && map.rates[i + 1] === map.rates[i];
    if (between && Number.isNaN(y[i]) && Number.isFinite(y[i - 1]) && Number.isFinite(y[i + 1]))
      out.push(i);
  }
  return out;
}

/**
 * Number of alias edges n·|f|/(k + ½) strictly between rates a < b, an edge within rounding
 * (1e-12, relative) of either end counting as at that end.
 */
function edgesBetween(part: Part, a: number, b: number): number {
  const F = part.symmetry * Math.abs(part.speedHz);
  const high = (F / a) * (1 - 1e-12) - 0.5;
  const low = (F / b) * (1 + 1e-12) - 0.5;
  return Math.max(0, Math.ceil(high) - 1 - Math.floor(low));
}

describe('rateMapSeries', () => {
  it('reads the Wikipedia disc: 60 rev/s under 61 flashes/s seems to turn backwards at 1 rev/s', () => {
    // Wikipedia, "Stroboscopic effect": 60 rev/s at 61 flashes/s → backwards at 1 rev/s (−60 rpm).
    const map = rateMapSeries(
      [{ speedHz: 60, symmetry: 1 }],
      { minHz: 61, maxHz: 200 },
      { points: 2 },
    );
    expect(map.rates[0]).toBe(61);
    expect(map.apparentRpm[0][0]).toBeCloseTo(-60, 9);
    // Above twice the speed (120 flashes/s) the disc shows its true 3600 rpm.
    expect(map.apparentRpm[0][map.rates.length - 1]).toBeCloseTo(3600, 9);
  });

  it('gives every column the same length, rates that never go down, and only numbers or gaps', () => {
    for (const log of [false, true]) {
      const map = rateMapSeries(lineParts, { minHz: 1, maxHz: 500 }, { points: 700, log });
      expect(map.apparentRpm).toHaveLength(lineParts.length);
      for (const column of map.apparentRpm) {
        expect(column).toHaveLength(map.rates.length);
        for (const v of column) expect(Number.isNaN(v) || Number.isFinite(v)).toBe(true);
      }
      for (let i = 1; i < map.rates.length; i++)
        expect(map.rates[i]).toBeGreaterThanOrEqual(map.rates[i - 1]);
      expect(map.rates[0]).toBe(1);
      expect(map.rates[map.rates.length - 1]).toBe(500);
    }
  });

  it('grows its columns when a step holds more edges and locks than usual', () => {
    // Six parts with one edge (F/1.5) and one single-image lock (F/2) each inside one 20–40 Hz step.
    const crowd: Part[] = [44, 45, 46, 47, 48, 49].map((F) => ({ speedHz: F, symmetry: 1 }));
    const map = rateMapSeries(crowd, { minHz: 20, maxHz: 40 }, { points: 2 });
    expect(map.rates).toHaveLength(2 + crowd.length * 4);
    crowd.forEach((part, j) => {
      expect(edgeGaps(map, j)).toHaveLength(1);
      const lock = map.rates.indexOf(part.speedHz / 2);
      expect(Math.abs(map.apparentRpm[j][lock])).toBeLessThan(1e-9);
    });
  });

  it('agrees with apparentMotion at every rate it holds, bit for bit, edges aside', () => {
    for (const log of [false, true]) {
      const map = rateMapSeries(lineParts, { minHz: 2, maxHz: 400 }, { points: 900, log });
      lineParts.forEach((part, j) => {
        // At an edge's own rate (to rounding) the map holds both limits; apparentMotion gives one.
        const edges = edgeGaps(map, j).map((i) => map.rates[i]);
        const atEdge = (rate: number) => edges.some((e) => Math.abs(rate - e) <= 1e-12 * e);
        map.rates.forEach((rate, i) => {
          const y = map.apparentRpm[j][i];
          if (Number.isNaN(y) || atEdge(rate)) return;
          expect(y).toBe(apparentMotion(part, rate).apparentHz * 60);
        });
      });
    }
  });

  it('agrees in size with the textbook alias formula |n·f − s·round(n·f/s)| at random rates', () => {
    // Alias (folding) formula of any DSP text, here through foldedHz: |a| = folded(n·|f|, s)/n.
    fc.assert(
      fc.property(
        fc.double({ min: 0.5, max: 200, noNaN: true }),
        fc.integer({ min: 1, max: 12 }),
        fc.double({ min: 1, max: 300, noNaN: true }),
        (speedHz, symmetry, top) => {
          const map = rateMapSeries(
            [{ speedHz, symmetry }],
            { minHz: 1, maxHz: 1 + top },
            { points: 50 },
          );
          map.rates.forEach((rate, i) => {
            const y = map.apparentRpm[0][i];
            if (Number.isNaN(y)) return;
            expect(Math.abs(y)).toBeCloseTo(
              (foldedHz(symmetry * speedHz, rate) / symmetry) * 60,
              6,
            );
          });
        },
      ),
      { numRuns: 60 },
    );
  });

  it('breaks each part’s line exactly at its alias edges n·|f|/(k + ½), with the limits from both sides', () => {
    const map = rateMapSeries(lineParts, { minHz: 5, maxHz: 400 }, { points: 2000 });
    lineParts.forEach((part, j) => {
      const F = part.symmetry * Math.abs(part.speedHz);
      const gaps = edgeGaps(map, j);
      expect(gaps.length).toBeGreaterThan(3);
      for (const i of gaps) {
        const rate = map.rates[i];
        const k = F / rate - 0.5;
        expect(Math.abs(k - Math.round(k))).toBeLessThan(1e-9);
        // Just below and just above the edge, apparentMotion gives the two ends of the jump.
        const below = apparentMotion(part, rate * (1 - 1e-12)).apparentHz * 60;
        const above = apparentMotion(part, rate * (1 + 1e-12)).apparentHz * 60;
        expect(map.apparentRpm[j][i - 1]).toBeCloseTo(below, 6);
        expect(map.apparentRpm[j][i + 1]).toBeCloseTo(above, 6);
        expect(Math.abs(above - below)).toBeCloseTo((rate / part.symmetry) * 60, 6);
      }
    });
  });

  it('never joins two points of a part across one of its alias edges, so no jump is drawn as a line', () => {
    for (const log of [false, true]) {
      const map = rateMapSeries(lineParts, { minHz: 1, maxHz: 600 }, { points: 400, log });
      lineParts.forEach((part, j) => {
        const y = map.apparentRpm[j];
        for (let i = 0; i + 1 < y.length; i++) {
          if (Number.isNaN(y[i]) || Number.isNaN(y[i + 1])) continue;
          const a = map.rates[i];
          const b = map.rates[i + 1];
          if (a === b) continue;
          expect(edgesBetween(part, a, b)).toBe(0);
        }
      });
    }
  });

  it('breaks the line at an edge that falls exactly on a grid rate, leaving no jump drawn there', () => {
    // 3 blades at 10 rev/s: pattern 30 Hz, edges at 30/(k + ½) = 60, 20, 12 … Hz; a 5 Hz grid
    // from 5 to 100 Hz lands exactly on 20 and 60.
    for (const speedHz of [10, -10]) {
      const part = { speedHz, symmetry: 3 };
      const map = rateMapSeries([part], { minHz: 5, maxHz: 100 }, { points: 20 });
      for (const edge of [20, 60]) {
        const at = map.rates.indexOf(edge);
        const run = [...map.apparentRpm[0].slice(at, at + 4)];
        // The grid point reads the speed just below the edge; then the break, then just above.
        const half = Math.sign(speedHz) * (edge / 3 / 2) * 60;
        expect(run[0]).toBeCloseTo(-half, 9);
        expect(run[1]).toBeCloseTo(-half, 9);
        expect(run[2]).toBeNaN();
        expect(run[3]).toBeCloseTo(half, 9);
        expect([...map.rates.slice(at, at + 4)]).toEqual([edge, edge, edge, edge]);
      }
    }
  });

  it('puts the single-image lock rates into the rates, where the line crosses zero exactly', () => {
    const map = rateMapSeries(lineParts, { minHz: 3, maxHz: 300 }, { points: 500, log: true });
    lineParts.forEach((part, j) => {
      const singles = map.locks[j].filter((l) => l.images === 1);
      expect(singles.length).toBeGreaterThan(2);
      for (const lock of singles) {
        const i = map.rates.indexOf(lock.rateHz);
        expect(i).toBeGreaterThanOrEqual(0);
        expect(Math.abs(map.apparentRpm[j][i])).toBeLessThan(1e-9);
      }
    });
  });

  it('marks exactly lockRates’ locks above the crowding point, with their image counts', () => {
    const range = { minHz: 2, maxHz: 250 };
    for (const sampler of ['flash', 'frames'] as const) {
      const map = rateMapSeries(lineParts, range, { points: 2000, sampler });
      lineParts.forEach((part, j) => {
        const expected = lockRates(part, range, { maxImages: sampler === 'flash' ? 8 : 1 });
        const marked = map.locks[j];
        expect(marked.length).toBeGreaterThan(0);
        // Every marker is one of lockRates' locks, image count included…
        for (const lock of marked) expect(expected).toContainEqual(lock);
        // …and none is missing above the lowest multi-image marker (or above the lowest marker for a camera).
        const floor = Math.min(
          ...marked.filter((l) => l.images > 1 || sampler === 'frames').map((l) => l.rateHz),
        );
        expect(marked.filter((l) => l.rateHz >= floor)).toEqual(
          expected.filter((l) => l.rateHz >= floor),
        );
        if (sampler === 'frames') expect(marked.every((l) => l.images === 1)).toBe(true);
      });
    }
  });

  it('keeps all of lockRates’ locks when the range is narrow enough to show them', () => {
    // A 6-blade fan at 980 rpm: pattern 98 Hz, around its single-image lock and the 2-image one at 196 Hz.
    const part = lineParts[1];
    const range = { minHz: 80, maxHz: 220 };
    const map = rateMapSeries([part], range, { points: 2000 });
    expect(map.locks[0]).toEqual(lockRates(part, range));
    expect(map.locks[0].map((l) => l.images)).toContain(2);
  });

  it('returns rateBands’ bands for all the parts together', () => {
    const range = { minHz: 1, maxHz: 500 };
    for (const sampler of ['flash', 'frames'] as const) {
      expect(rateMapSeries(lineParts, range, { sampler }).bands).toEqual(
        rateBands(lineParts, range, { sampler }),
      );
    }
  });

  it('scatters a part where its teeth are finer than the grid, and says from which rate they are resolved', () => {
    // 24 blades at 245 rpm: pattern 98 Hz; on a 100-point linear grid over 1–500 Hz the teeth
    // below about sqrt(98·5) ≈ 22 Hz are narrower than the 5 Hz grid step.
    const part: Part = { speedHz: 245 / 60, symmetry: 24 };
    const map = rateMapSeries([part], { minHz: 1, maxHz: 500 }, { points: 100 });
    const from = map.resolvedFromHz[0];
    expect(from).toBeGreaterThan(10);
    expect(from).toBeLessThan(40);
    const y = map.apparentRpm[0];
    for (let i = 0; i + 1 < y.length; i++) {
      const a = map.rates[i];
      const b = map.rates[i + 1];
      if (b > from) break;
      // Below the resolved rate, neighbours are never joined across a crowd of edges.
      if (!Number.isNaN(y[i]) && !Number.isNaN(y[i + 1]) && a !== b)
        expect(edgesBetween(part, a, b)).toBe(0);
    }
    // On a log grid the same part is resolved all the way down.
    expect(
      rateMapSeries([part], { minHz: 1, maxHz: 500 }, { points: 2000, log: true })
        .resolvedFromHz[0],
    ).toBe(1);
  });

  it('shows a part that is not turning as still at every rate, with no lock markers', () => {
    const map = rateMapSeries(
      [{ speedHz: 0, symmetry: 4 }],
      { minHz: 1, maxHz: 100 },
      { points: 50 },
    );
    expect([...map.apparentRpm[0]].every((v) => v === 0)).toBe(true);
    expect(map.locks[0]).toEqual([]);
    expect(map.rates).toHaveLength(50);
  });

  it('spaces the grid evenly in log(rate) when asked', () => {
    const map = rateMapSeries(
      [{ speedHz: 0, symmetry: 1 }],
      { minHz: 1, maxHz: 1000 },
      { points: 4, log: true },
    );
    expect([...map.rates].map((r) => Math.round(r * 1e9) / 1e9)).toEqual([1, 10, 100, 1000]);
  });

  it('refuses bad input with an InputError naming the field', () => {
    const range = { minHz: 1, maxHz: 100 };
    const part = { speedHz: 10, symmetry: 2 };
    expectInputError(() => rateMapSeries([part], range, { points: 1 }), 'points');
    expectInputError(() => rateMapSeries([part], range, { points: 2.5 }), 'points');
    expectInputError(() => rateMapSeries([part], range, { points: 1e6 }), 'points');
    expectInputError(() => rateMapSeries([part], range, { points: bad(NaN) }), 'points');
    expectInputError(() => rateMapSeries([part], range, { log: bad('yes') }), 'log', 'logarithmic');
    expectInputError(() => rateMapSeries([], range), 'parts', 'part');
    expectInputError(() => rateMapSeries([part], { minHz: 100, maxHz: 1 }), 'rate range', 'lowest');
    expectInputError(() => rateMapSeries([{ speedHz: NaN, symmetry: 2 }], range), 'speed');
    expectInputError(() => rateMapSeries([part], range, { sampler: bad('video') }), 'sampler');
  });
});
