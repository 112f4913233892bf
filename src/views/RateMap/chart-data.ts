// Pure helpers between the core's rate-map columns and the chart: gaps, limits, markers, keys.
import type { LockRate, Part, Range, RateMapSeries } from '../../core';

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

/** A key that changes whenever the parts' numbers do, so equal parts reuse a computed map. */
export function partsKey(parts: readonly Part[]): string {
  return parts.map((p) => `${p.speedHz}/${p.symmetry}/${p.tolerance ?? 0}`).join(';');
}
