import { describe, expect, it } from 'vitest';
import { lockRates, rateMapSeries } from '../../../src/core';
import {
  misleadingSpansPx,
  partsKey,
  placeMarkers,
  rateForKey,
  rateTicksHz,
  speedAxisLimitRpm,
  speedLinearWithinRpm,
  speedTicksRpm,
  toChartColumns,
  unresolvedShare,
} from '../../../src/ui/rate-map/chart-data';

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

describe('the speed axis (asinh: linear near zero, logarithmic beyond)', () => {
  it('turns logarithmic at the power of ten nearest a hundredth of the limit', () => {
    // 1770 rpm and 8 %: 1911.6 rpm, a hundredth 19.1, nearest power of ten (in log terms) 10.
    expect(speedLinearWithinRpm(1770 * 1.08)).toBe(10);
    expect(speedLinearWithinRpm(50_000)).toBe(1000); // 500 lies nearer 1000 than 100 on a log scale
    expect(speedLinearWithinRpm(1)).toBe(0.01);
  });
  it('gives a usable axis for a limit that is not a positive number', () => {
    expect(speedLinearWithinRpm(0)).toBe(0.01);
    expect(speedLinearWithinRpm(Number.NaN)).toBe(0.01);
  });
  it('ticks zero and ± each power of ten from ten times the linear part to the limit, symmetric', () => {
    expect(speedTicksRpm(1944, 10)).toEqual([-1000, -100, 0, 100, 1000]);
    expect(speedTicksRpm(648, 10)).toEqual([-100, 0, 100]);
    // The limit itself counts when it is a power of ten.
    expect(speedTicksRpm(1000, 10)).toEqual([-1000, -100, 0, 100, 1000]);
  });
});

describe('misleadingSpansPx', () => {
  const band = (fromHz: number, toHz: number, safe: boolean) => ({
    fromHz,
    toHz,
    safe,
    promise: '',
    reason: '',
    causes: [],
  });
  const xOf = (rateHz: number) => rateHz * 10; // 10 px a Hz

  it('merges misleading bands that touch, so no pixel is shaded twice', () => {
    const spans = misleadingSpansPx(
      [band(1, 2, false), band(2, 3, false), band(3, 5, true), band(5, 6, false)],
      xOf,
      0,
      100,
    );
    expect(spans).toEqual([
      [10, 30],
      [50, 60],
    ]);
  });
  it('widens edges to whole pixels and gives a band narrower than a pixel one pixel', () => {
    expect(misleadingSpansPx([band(1.01, 1.02, false)], xOf, 0, 100)).toEqual([[10, 11]]);
    // A safe gap of 0.8 px between two misleading bands is shaded over: no pixel of it is wholly safe.
    expect(
      misleadingSpansPx(
        [band(1, 2.01, false), band(2.01, 2.09, true), band(2.09, 3, false)],
        xOf,
        0,
        100,
      ),
    ).toEqual([[10, 30]]);
  });
  it('clips to the plot and leaves out bands beside it', () => {
    expect(
      misleadingSpansPx([band(0, 2, false), band(9, 20, false), band(30, 40, false)], xOf, 5, 100),
    ).toEqual([
      [5, 20],
      [90, 100],
    ]);
  });
});

describe('unresolvedShare', () => {
  it('measures the crowded low end as the axis shows it', () => {
    expect(unresolvedShare([10], { minHz: 1, maxHz: 100 }, true)).toBeCloseTo(0.5, 12);
    expect(unresolvedShare([10], { minHz: 1, maxHz: 100 }, false)).toBeCloseTo(9 / 99, 12);
  });
  it('takes the part resolved last and is zero when every tooth is drawn', () => {
    expect(unresolvedShare([1, 10], { minHz: 1, maxHz: 100 }, true)).toBeCloseTo(0.5, 12);
    expect(unresolvedShare([1, -Infinity], { minHz: 1, maxHz: 100 }, true)).toBe(0);
  });
});

describe('rateTicksHz', () => {
  const shown = (ticks: number[], unitPerHz: number) =>
    ticks.map((hz) => Number((hz * unitPerHz).toPrecision(9)));

  it('puts log ticks on round numbers of the unit shown, not on the low end of the range', () => {
    // Lighting 25 – 3000 Hz: not 25, 35, … 105.
    expect(rateTicksHz({ minHz: 25, maxHz: 3000 }, true, 1, 430)).toEqual([
      50, 100, 200, 500, 1000, 2000,
    ]);
    // A strobe from 100 to 10,000 fpm, shown in fpm.
    expect(shown(rateTicksHz({ minHz: 100 / 60, maxHz: 10000 / 60 }, true, 60, 300), 60)).toEqual([
      100, 300, 1000, 3000, 10000,
    ]);
  });
  it('thins log ticks to fit the width: 1-2-5, then 1-3, then powers, then every other power', () => {
    // 600 px hold 11 ticks, 500 px only 9.
    expect(rateTicksHz({ minHz: 1, maxHz: 1000 }, true, 1, 600)).toEqual([
      1, 2, 5, 10, 20, 50, 100, 200, 500, 1000,
    ]);
    expect(rateTicksHz({ minHz: 1, maxHz: 1000 }, true, 1, 500)).toEqual([
      1, 3, 10, 30, 100, 300, 1000,
    ]);
    expect(rateTicksHz({ minHz: 1, maxHz: 1000 }, true, 1, 200)).toEqual([1, 10, 100, 1000]);
    expect(rateTicksHz({ minHz: 1, maxHz: 1e6 }, true, 1, 200)).toEqual([1, 100, 10000, 1e6]);
  });
  it('steps a linear axis by 1, 2 or 5 times a power of ten', () => {
    expect(shown(rateTicksHz({ minHz: 0.5, maxHz: 200 }, false, 60, 430), 60)).toEqual([
      2000, 4000, 6000, 8000, 10000, 12000,
    ]);
  });
  it('falls back on even steps when a log axis holds fewer than two round powers', () => {
    expect(rateTicksHz({ minHz: 25, maxHz: 30 }, true, 1, 300)).toEqual([25, 26, 27, 28, 29, 30]);
  });
  it('never puts two ticks closer than 56 px, on either axis', () => {
    const range = { minHz: 0.5, maxHz: 200 };
    // From the narrowest plot (a 240 px chart less its 64 px speed axis) to a wide desktop.
    for (const width of [176, 250, 400, 800, 1200])
      for (const log of [true, false]) {
        const x = (hz: number) =>
          log
            ? (width * Math.log(hz / range.minHz)) / Math.log(range.maxHz / range.minHz)
            : (width * (hz - range.minHz)) / (range.maxHz - range.minHz);
        const ticks = rateTicksHz(range, log, 60, width);
        expect(ticks.length).toBeGreaterThanOrEqual(2);
        for (let i = 1; i < ticks.length; i++)
          expect(x(ticks[i]) - x(ticks[i - 1])).toBeGreaterThanOrEqual(56 - 1e-9);
      }
  });
  it('gives no ticks for an empty or inverted range', () => {
    expect(rateTicksHz({ minHz: 10, maxHz: 10 }, true, 1, 300)).toEqual([]);
    expect(rateTicksHz({ minHz: 10, maxHz: 1 }, false, 1, 300)).toEqual([]);
  });
});
