// Pure helpers between the core's rate-map columns and the chart: gaps, limits, markers, keys.
import type { LockRate, Part, Range, RateBand, RateMapSeries } from '../../core';

/** Chart columns: the rates, then one column of apparent rpm per part with null for a gap. */
export type ChartColumns = [Float64Array, ...Array<Array<number | null>>];

/**
 * The core marks a gap with NaN (rateMapSeries); the chart library marks it with null. This is
 * the one place that converts.
 */
export function toChartColumns(series: RateMapSeries): ChartColumns {
  const columns: ChartColumns = [series.rates];
  for (const speeds of series.apparentRpm) {
    const column = new Array<number | null>(speeds.length);
    for (let i = 0; i < speeds.length; i++) column[i] = Number.isNaN(speeds[i]) ? null : speeds[i];
    columns.push(column);
  }
  return columns;
}

/**
 * Half-height of the speed axis, rpm: the fastest part's true speed plus a margin. No apparent
 * speed is ever larger (|a| ≤ s/2n < |f| while aliased, = |f| when faithful).
 * @example speedAxisLimitRpm([{ speedHz: 30, symmetry: 6 }]) // 1944 (1800 rpm and 8 %)
 */
export function speedAxisLimitRpm(parts: readonly Part[]): number {
  let fastest = 0;
  for (const p of parts)
    if (Number.isFinite(p.speedHz)) fastest = Math.max(fastest, Math.abs(p.speedHz) * 60);
  return fastest > 0 ? fastest * 1.08 : 1;
}

/**
 * Where the speed axis turns from linear to logarithmic, rpm: a power of ten near a hundredth of
 * the axis limit. The axis maps a speed v to asinh(v / this), so apparent speeds from a few rpm
 * to the true speed all stay readable (on a linear axis the slow teeth at low rates, which are
 * s/2n high, would lie flat on the zero line), and their sign shows at every rate.
 * @example speedLinearWithinRpm(1944) // 10
 */
export function speedLinearWithinRpm(limitRpm: number): number {
  const limit = Number.isFinite(limitRpm) && limitRpm > 0 ? limitRpm : 1;
  return Math.pow(10, Math.round(Math.log10(limit / 100)));
}

/**
 * Ticks of the speed axis, rpm: zero and ± each power of ten from ten times the linear part up
 * to the limit. The linear part's own edge is left out: on the asinh axis it sits too close to
 * zero for two labels.
 * @example speedTicksRpm(1944, 10) // [-1000, -100, 0, 100, 1000]
 */
export function speedTicksRpm(limitRpm: number, linearRpm: number): number[] {
  const above: number[] = [];
  for (let v = linearRpm * 10; v <= limitRpm * (1 + 1e-9) && above.length < 12; v *= 10)
    above.push(v);
  return [...above.map((v) => -v).reverse(), 0, ...above];
}

/**
 * The misleading bands as spans of whole canvas pixels to shade, [left, right) in rate order,
 * merged where they touch or overlap so a see-through fill is never laid twice on a pixel (that
 * showed as dark stripes where bands met). Edges go outward to whole pixels: a pixel that is
 * partly misleading is shaded, so no safe sliver narrower than a pixel looks safe. `xOf` maps a
 * rate to a pixel, increasing; spans are clipped to [left, right].
 */
export function misleadingSpansPx(
  bands: readonly RateBand[],
  xOf: (rateHz: number) => number,
  left: number,
  right: number,
): Array<[number, number]> {
  const spans: Array<[number, number]> = [];
  for (const band of bands) {
    if (band.safe) continue;
    const x0 = xOf(band.fromHz);
    const x1 = xOf(band.toHz);
    if (!(x1 >= left && x0 <= right)) continue; // off the plot
    // At least one pixel: a misleading band is never too narrow to show.
    const from = Math.max(left, Math.floor(x0));
    const to = Math.min(right, Math.max(from + 1, Math.ceil(x1)));
    if (to <= from) continue;
    const last = spans[spans.length - 1];
    if (last && from <= last[1]) last[1] = Math.max(last[1], to);
    else spans.push([from, to]);
  }
  return spans;
}

/** A lock marker placed on the chart: where, which part, how many images. */
export interface PlacedMarker {
  x: number;
  part: number;
  images: number;
}

/**
 * The lock markers worth drawing: those inside [left, right] (canvas pixels), at most one per
 * `minGap` pixels for each part, the one with fewer images winning a clash (a single still
 * image is the strongest illusion). `xOf` maps a rate to a pixel.
 */
export function placeMarkers(
  locks: readonly (readonly LockRate[])[],
  xOf: (rateHz: number) => number,
  left: number,
  right: number,
  minGap: number,
): PlacedMarker[] {
  const out: PlacedMarker[] = [];
  locks.forEach((partLocks, part) => {
    let last: PlacedMarker | null = null;
    for (const lock of partLocks) {
      const x = xOf(lock.rateHz);
      if (!(x >= left && x <= right)) continue;
      if (last && x - last.x < minGap) {
        if (lock.images < last.images) {
          last.x = x;
          last.images = lock.images;
        }
        continue;
      }
      last = { x, part, images: lock.images };
      out.push(last);
    }
  });
  return out;
}

/**
 * The rate after a key press on the map: arrows move 1 % of the range's span (of its ratio on a
 * log axis), Page keys ten times as far, Home and End to the ends. null for other keys.
 * @example rateForKey('ArrowRight', 50, { minHz: 0, maxHz: 100 }, false) // 51
 */
export function rateForKey(key: string, rateHz: number, range: Range, log: boolean): number | null {
  const steps: Record<string, number> = {
    ArrowRight: 1,
    ArrowUp: 1,
    ArrowLeft: -1,
    ArrowDown: -1,
    PageUp: 10,
    PageDown: -10,
  };
  let next: number;
  if (key === 'Home') next = range.minHz;
  else if (key === 'End') next = range.maxHz;
  else if (key in steps) {
    const from = Number.isFinite(rateHz) ? rateHz : range.minHz;
    next = log
      ? from * Math.pow(range.maxHz / range.minHz, steps[key] / 100)
      : from + ((range.maxHz - range.minHz) * steps[key]) / 100;
  } else return null;
  return Math.min(range.maxHz, Math.max(range.minHz, next));
}

/**
 * How much of the rate axis lies below the highest rate from which every part's sawtooth is
 * drawn tooth by tooth (rateMapSeries' resolvedFromHz), as a share of its width: 0 when all of
 * it is. Measured as the axis shows it, in rate or in log(rate).
 * @example unresolvedShare([10], { minHz: 1, maxHz: 100 }, true) // 0.5
 */
export function unresolvedShare(
  resolvedFromHz: readonly number[],
  range: Range,
  log: boolean,
): number {
  const from = Math.min(range.maxHz, Math.max(range.minHz, ...resolvedFromHz));
  const share = log
    ? Math.log(from / range.minHz) / Math.log(range.maxHz / range.minHz)
    : (from - range.minHz) / (range.maxHz - range.minHz);
  return Number.isFinite(share) ? Math.max(0, share) : 0;
}

/** m·10^k without the float dust of the product (2·0.1 is 0.2, not 0.20000000000000004). */
function mantissaTimesPower(m: number, k: number): number {
  return Number((m * Math.pow(10, k)).toPrecision(12));
}

/** 1, 2 or 5 times a power of ten, the smallest at least `raw`. */
function niceStep(raw: number): number {
  const power = Math.pow(10, Math.floor(Math.log10(raw)));
  for (const m of [1, 2, 5, 10]) if (m * power >= raw * (1 - 1e-9)) return m * power;
  return 10 * power;
}

/**
 * Rates for the labelled ticks of the rate axis, Hz, ascending: round numbers in the unit the
 * axis shows (`unitPerHz` of that unit make one Hz: 60 for flashes per minute), no two closer
 * than `minGapPx` on a `widthPx` wide axis. A log axis takes 1, 2 and 5 times the powers of
 * ten if they fit, else 1 and 3, else the powers alone, else every second or third power; a
 * linear axis (or a log axis too short to hold two round values) steps by 1, 2 or 5 times a
 * power of ten.
 * @example rateTicksHz({ minHz: 25, maxHz: 3000 }, true, 1, 300) // [100, 1000]
 */
export function rateTicksHz(
  range: Range,
  log: boolean,
  unitPerHz: number,
  widthPx: number,
  minGapPx = 56,
): number[] {
  const lo = range.minHz * unitPerHz;
  const hi = range.maxHz * unitPerHz;
  if (!(lo > 0 && hi > lo && Number.isFinite(hi))) return [];
  const inside = (v: number) => v >= lo * (1 - 1e-12) && v <= hi * (1 + 1e-12);
  let ticks: number[] = [];
  if (log) {
    const first = Math.floor(Math.log10(lo));
    const last = Math.ceil(Math.log10(hi));
    const pxPerDecade = widthPx / Math.log10(hi / lo);
    // Each series with the narrowest gap between its neighbours, in decades: 2→5 is wider than
    // 1→2 (log 2), 1→3 narrower than 3→10 (log 3), then whole powers, then every n-th power.
    const series: Array<{ mantissas: number[]; every: number; gap: number }> = [
      { mantissas: [1, 2, 5], every: 1, gap: Math.log10(2) },
      { mantissas: [1, 3], every: 1, gap: Math.log10(3) },
    ];
    for (let every = 1; every <= 12; every++) series.push({ mantissas: [1], every, gap: every });
    const fits = series.find((c) => c.gap * pxPerDecade >= minGapPx) ?? series[series.length - 1];
    for (let k = first; k <= last; k++) {
      if (k % fits.every !== 0) continue;
      for (const m of fits.mantissas) {
        const v = mantissaTimesPower(m, k);
        if (inside(v)) ticks.push(v);
      }
    }
  }
  if (ticks.length < 2) {
    // The smallest round step that leaves minGapPx between neighbours.
    const step = niceStep(((hi - lo) * minGapPx) / Math.max(widthPx, minGapPx));
    ticks = [];
    for (let i = Math.ceil(lo / step - 1e-9); i * step <= hi * (1 + 1e-12); i++)
      ticks.push(Number((i * step).toPrecision(12)));
  }
  return ticks.map((v) => v / unitPerHz);
}

/** A key that changes whenever the parts' numbers do, so equal parts reuse a computed map. */
export function partsKey(parts: readonly Part[]): string {
  return parts.map((p) => `${p.speedHz}/${p.symmetry}/${p.tolerance ?? 0}`).join(';');
}
