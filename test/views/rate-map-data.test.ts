import { describe, expect, it } from 'vitest';
import { lockRates, rateMapSeries } from '../../src/core';
import {
  partsKey,
  placeMarkers,
  rateForKey,
  speedAxisLimitRpm,
  toChartColumns,
} from '../../src/views/RateMap/chart-data';

describe('toChartColumns', () => {
  it('turns every NaN gap of the core into null and keeps every number as it is', () => {
    const series = rateMapSeries(
      [{ speedHz: 10, symmetry: 3 }],
      { minHz: 5, maxHz: 100 },
      { points: 20 },
    );
    const [rates, speeds] = toChartColumns(series);
    expect(rates).toBe(series.rates);
    const source = series.apparentRpm[0];
    expect(speeds).toHaveLength(source.length);
    let gaps = 0;
    source.forEach((v, i) => {
      if (Number.isNaN(v)) {
        gaps++;
        expect(speeds[i]).toBeNull();
      } else expect(speeds[i]).toBe(v);
    });
    expect(gaps).toBeGreaterThan(0);
  });
});

describe('speedAxisLimitRpm', () => {
  it('leaves 8 % above the fastest true speed, which no apparent speed exceeds', () => {
    expect(
      speedAxisLimitRpm([
        { speedHz: 30, symmetry: 6 },
        { speedHz: -40, symmetry: 1 },
      ]),
    ).toBeCloseTo(2400 * 1.08, 9);
  });
  it('still gives a usable axis when nothing turns', () => {
    expect(speedAxisLimitRpm([{ speedHz: 0, symmetry: 2 }])).toBe(1);
  });
});

describe('placeMarkers', () => {
  const locks = lockRates({ speedHz: 10, symmetry: 1 }, { minHz: 5, maxHz: 40 });
  const xOf = (rateHz: number) => rateHz * 10; // 10 px a Hz

  it('keeps every marker when they lie far enough apart', () => {
    const placed = placeMarkers([locks], (r) => r * 1000, 0, 1e6, 1);
    expect(placed.map((m) => m.images)).toEqual(locks.map((l) => l.images));
  });

  it('keeps one marker per clash, the one with fewer images, and drops those outside the plot', () => {
    const placed = placeMarkers([locks], xOf, 60, 1000, 40);
    expect(placed.every((m) => m.x >= 60)).toBe(true);
    for (let i = 1; i < placed.length; i++)
      expect(placed[i].x - placed[i - 1].x).toBeGreaterThanOrEqual(40 - 1e-9);
    // 10 Hz (10 rev/s, one image) beats the 2-image lock at 6.67 Hz… and the one at 20 Hz wins its clash too.
    expect(placed.find((m) => Math.abs(m.x - 100) < 1e-9)?.images).toBe(1);
    expect(placed.find((m) => Math.abs(m.x - 200) < 1e-9)?.images).toBe(2);
  });
});

describe('rateForKey', () => {
  const range = { minHz: 1, maxHz: 101 };
  it('moves by 1 % of the span for an arrow and 10 % for a Page key on a linear axis', () => {
    expect(rateForKey('ArrowRight', 50, range, false)).toBeCloseTo(51, 12);
    expect(rateForKey('ArrowDown', 50, range, false)).toBeCloseTo(49, 12);
    expect(rateForKey('PageUp', 50, range, false)).toBeCloseTo(60, 12);
  });
  it('moves by 1 % of the ratio on a log axis', () => {
    expect(rateForKey('ArrowRight', 10, { minHz: 1, maxHz: 100 }, true)).toBeCloseTo(
      10 * Math.pow(100, 0.01),
      12,
    );
  });
  it('stops at the ends, goes to them with Home and End, and ignores other keys', () => {
    expect(rateForKey('PageUp', 100, range, false)).toBe(101);
    expect(rateForKey('Home', 50, range, false)).toBe(1);
    expect(rateForKey('End', 50, range, false)).toBe(101);
    expect(rateForKey('a', 50, range, false)).toBeNull();
  });
});

describe('partsKey', () => {
  it('is equal for equal parts and differs when a number changes', () => {
    const a = [{ speedHz: 10, symmetry: 2 }];
    expect(partsKey(a)).toBe(partsKey([{ speedHz: 10, symmetry: 2, tolerance: 0 }]));
    expect(partsKey(a)).not.toBe(partsKey([{ speedHz: 10, symmetry: 3 }]));
  });
});
