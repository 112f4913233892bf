// Kept whole (over 300 lines): uPlot's options, hooks and drawing share one chart instance and
// its scales; split, each piece would need the instance's internals.
// The rate map drawn with uPlot. Loaded lazily (with uPlot and its stylesheet) so the first
// screen stays small: RateMap/index.tsx imports this module with import().
import uPlot from 'uplot';
import 'uplot/dist/uPlot.min.css';
import type { Range, RateMapSeries } from '../../core';
import {
  misleadingSpansPx,
  placeMarkers,
  rateTicksHz,
  speedLinearWithinRpm,
  speedTicksRpm,
  toChartColumns,
} from './chart-data';

export interface ChartColours {
  parts: string[];
  ink: string;
  inkSoft: string;
  grid: string;
  misleading: string;
  cursor: string;
  markerRing: string;
}

export interface RateChartOptions {
  width: number;
  height: number;
  log: boolean;
  range: Range;
  /** Half-height of the speed axis, rpm. */
  speedLimitRpm: number;
  colours: ChartColours;
  /** Axis title for the rate, e.g. "Flash rate, fpm". */
  rateTitle: string;
  /** Tick label for a rate in Hz, in the sampler's own unit. */
  rateTick: (rateHz: number) => string;
  /** How many of that unit make one Hz (60 for flashes per minute, else 1): ticks fall on round numbers of it. */
  unitPerHz: number;
  /** Tick label for a speed in rpm. */
  speedTick: (rpm: number) => string;
  /** Called with the rate under a tap or drag, Hz, already inside the range. */
  onPick: (rateHz: number) => void;
}

export interface RateChart {
  /**
   * New data (parts, range or sampler changed); the cursor moves to `rateHz`. Drawn before this
   * task ends (uPlot draws in a microtask).
   */
  update(series: RateMapSeries, rateHz: number, speedLimitRpm: number): void;
  /** Moves the current-rate cursor; redraws in the next frame without rebuilding the lines. */
  setRate(rateHz: number): void;
  resize(width: number, height: number): void;
  destroy(): void;
}

/** A tap within this many CSS pixels of a lock marker picks the lock's exact rate. */
const SNAP_PX = 6;
/** Markers of one part closer than this (CSS pixels) are drawn as one. */
const MARKER_GAP_PX = 5;
/** Axis text, CSS pixels: large enough to read at arm's length on a phone. */
const TICK_FONT = '13px system-ui, sans-serif';
const LABEL_FONT = '600 14px system-ui, sans-serif';
/** Width of the speed axis, CSS pixels: its title and "-1,000". */
const Y_AXIS_PX = 64;

/** Builds the chart inside `holder`. Throws where the browser has no 2D canvas. */
export function createRateChart(
  holder: HTMLElement,
  options: RateChartOptions,
  series: RateMapSeries,
  rateHz: number,
): RateChart {
  // uPlot draws on a 2D canvas and fails later, out of reach of the caller, without one.
  if (!document.createElement('canvas').getContext('2d')) {
    throw new Error('This browser gives no 2D canvas to draw the rate map on.');
  }
  const { colours, range } = options;
  let current = { series, rateHz, speedLimitRpm: options.speedLimitRpm };
  const dpr = () => window.devicePixelRatio || 1;
  const font = (px: number) => `${Math.round(px * dpr())}px system-ui, sans-serif`;

  const opts: uPlot.Options = {
    width: options.width,
    height: options.height,
    legend: { show: false },
    cursor: { show: false, drag: { x: false, y: false, setScale: false } },
    select: { show: false, left: 0, top: 0, width: 0, height: 0 },
    scales: {
      x: {
        time: false,
        distr: options.log ? 3 : 1,
        log: 10,
        range: () => [range.minHz, range.maxHz],
      },
      // asinh: linear near zero, logarithmic beyond (speedLinearWithinRpm says why).
      y: {
        distr: 4,
        asinh: speedLinearWithinRpm(options.speedLimitRpm),
        range: () => [-current.speedLimitRpm, current.speedLimitRpm],
      },
    },
    axes: [
      {
        stroke: colours.inkSoft,
        grid: { stroke: colours.grid, width: 1 },
        ticks: { stroke: colours.grid },
        label: options.rateTitle,
        labelFont: LABEL_FONT,
        font: TICK_FONT,
        // Round numbers in the unit shown, every one labelled: uPlot's own log ticks start from
        // the range's low end (25, 35, … 105 for lighting) and its filter drops some labels.
        splits: (u) => rateTicksHz(range, options.log, options.unitPerHz, u.width - Y_AXIS_PX),
        filter: (_u, splits) => splits,
        values: (_u, splits) =>
          splits.map((v) => (v === null || v === undefined ? '' : options.rateTick(v))),
      },
      {
        stroke: colours.inkSoft,
        grid: { stroke: colours.grid, width: 1 },
        ticks: { stroke: colours.grid },
        label: 'Apparent speed, rpm',
        labelFont: LABEL_FONT,
        font: TICK_FONT,
        size: Y_AXIS_PX,
        // Every tick labelled: uPlot's own filter for asinh axes drops some of these few.
        filter: (_u, splits) => splits,
        splits: (u) =>
          speedTicksRpm(current.speedLimitRpm, u.scales.y.asinh ?? speedLinearWithinRpm(1)),
        values: (_u, splits) =>
          splits.map((v) => (v === null || v === undefined ? '' : options.speedTick(v))),
      },
    ],
    series: [
      {},
      ...series.apparentRpm.map((_, j) => ({
        stroke: colours.parts[j % colours.parts.length],
        width: 2,
        points: { show: false },
        paths: brokenLine,
      })),
    ],
    hooks: {
      // Over the grid, under the lines: the shading tints the grid instead of being cut by it.
      drawAxes: [(u: uPlot) => shadeMisleading(u, current.series, colours)],
      draw: [(u: uPlot) => drawOverlay(u, current.series, current.rateHz, colours, font)],
    },
  };

  const plot = new uPlot(opts, toChartColumns(series) as uPlot.AlignedData, holder);

  // Tap or drag anywhere on the plot to set the rate.
  const over = plot.over;
  over.style.touchAction = 'pan-y';
  over.style.cursor = 'ew-resize';
  let dragging = false;
  // A tap near a lock marker takes the lock's exact rate; a drag follows the finger.
  const pick = (event: PointerEvent, snap: boolean) => {
    const box = over.getBoundingClientRect();
    const x = event.clientX - box.left;
    let rate = plot.posToVal(x, 'x');
    const snapped = snap ? nearestLock(plot, current.series, x) : null;
    if (snapped !== null) rate = snapped;
    if (!Number.isFinite(rate)) return;
    options.onPick(Math.min(range.maxHz, Math.max(range.minHz, rate)));
  };
  const down = (event: PointerEvent) => {
    dragging = true;
    over.setPointerCapture?.(event.pointerId);
    pick(event, true);
  };
  const move = (event: PointerEvent) => {
    if (dragging) pick(event, false);
  };
  const up = () => {
    dragging = false;
  };
  over.addEventListener('pointerdown', down);
  over.addEventListener('pointermove', move);
  over.addEventListener('pointerup', up);
  over.addEventListener('pointercancel', up);

  // New data is drawn at once (the map hands it over in the task that worked it out); the cursor
  // alone, which a drag moves many times a frame, at most once per animation frame.
  let frame = 0;
  const drawRate = () => {
    frame = 0;
    plot.redraw(false, false);
  };

  return {
    update(next, nextRate, speedLimitRpm) {
      current = { series: next, rateHz: nextRate, speedLimitRpm };
      cancelAnimationFrame(frame);
      frame = 0;
      plot.scales.y.asinh = speedLinearWithinRpm(speedLimitRpm);
      plot.setData(toChartColumns(next) as uPlot.AlignedData);
    },
    setRate(nextRate) {
      if (nextRate === current.rateHz) return;
      current = { ...current, rateHz: nextRate };
      frame ||= requestAnimationFrame(drawRate);
    },
    resize(width, height) {
      if (width > 0 && height > 0 && (width !== plot.width || height !== plot.height))
        plot.setSize({ width, height });
    },
    destroy() {
      cancelAnimationFrame(frame);
      over.removeEventListener('pointerdown', down);
      over.removeEventListener('pointermove', move);
      over.removeEventListener('pointerup', up);
      over.removeEventListener('pointercancel', up);
      plot.destroy();
    },
  };
}

/**
 * A line that lifts the pen at every gap (null) instead of joining across it: the alias edges
 * are breaks, not vertical lines. A point with gaps on both sides (where a part's teeth are
 * finer than the grid) is drawn as a short dash so the scatter stays visible.
 */
function brokenLine(u: uPlot, seriesIdx: number, idx0: number, idx1: number): uPlot.Series.Paths {
  const xs = u.data[0];
  const ys = u.data[seriesIdx];
  const stroke = new Path2D();
  const dash = Math.max(1, window.devicePixelRatio || 1);
  let penDown = false;
  for (let i = idx0; i <= idx1; i++) {
    const y = ys[i];
    if (y === null || y === undefined) {
      penDown = false;
      continue;
    }
    const px = u.valToPos(xs[i], 'x', true);
    const py = u.valToPos(y, 'y', true);
    if (penDown) {
      stroke.lineTo(px, py);
      continue;
    }
    const next = i < idx1 ? ys[i + 1] : null;
    if (next === null || next === undefined) {
      stroke.moveTo(px - dash, py);
      stroke.lineTo(px + dash, py);
    } else {
      stroke.moveTo(px, py);
    }
    penDown = true;
  }
  return { stroke, fill: null, clip: null, band: null, flags: 0 };
}

/** Misleading bands shaded the full height of the plot, behind the lines and markers. */
function shadeMisleading(u: uPlot, series: RateMapSeries, colours: ChartColours): void {
  const { ctx, bbox } = u;
  ctx.save();
  ctx.fillStyle = colours.misleading;
  const spans = misleadingSpansPx(
    series.bands,
    (r) => u.valToPos(r, 'x', true),
    bbox.left,
    bbox.left + bbox.width,
  );
  for (const [left, right] of spans) ctx.fillRect(left, bbox.top, right - left, bbox.height);
  ctx.restore();
}

/** The zero line, the lock markers with their image counts, and the current-rate cursor. */
function drawOverlay(
  u: uPlot,
  series: RateMapSeries,
  rateHz: number,
  colours: ChartColours,
  font: (px: number) => string,
): void {
  const { ctx, bbox } = u;
  const dpr = window.devicePixelRatio || 1;
  const zeroY = u.valToPos(0, 'y', true);
  ctx.save();
  ctx.beginPath();
  ctx.rect(bbox.left, bbox.top, bbox.width, bbox.height);
  ctx.clip();

  ctx.strokeStyle = colours.inkSoft;
  ctx.lineWidth = dpr;
  ctx.beginPath();
  ctx.moveTo(bbox.left, zeroY);
  ctx.lineTo(bbox.left + bbox.width, zeroY);
  ctx.stroke();

  const markers = placeMarkers(
    series.locks,
    (r) => u.valToPos(r, 'x', true),
    bbox.left,
    bbox.left + bbox.width,
    MARKER_GAP_PX * dpr,
  );
  ctx.font = font(12);
  ctx.textAlign = 'center';
  ctx.textBaseline = 'bottom';
  let lastLabelX = -Infinity;
  for (const m of markers) {
    const colour = colours.parts[m.part % colours.parts.length];
    ctx.beginPath();
    ctx.arc(m.x, zeroY, (m.images === 1 ? 4 : 3.5) * dpr, 0, 2 * Math.PI);
    ctx.lineWidth = 1.5 * dpr;
    ctx.strokeStyle = m.images === 1 ? colours.markerRing : colour;
    ctx.fillStyle = m.images === 1 ? colour : colours.markerRing;
    ctx.fill();
    ctx.stroke();
    if (m.images > 1 && m.x - lastLabelX >= 14 * dpr) {
      ctx.fillStyle = colour;
      ctx.fillText(String(m.images), m.x, zeroY - 6 * dpr);
      lastLabelX = m.x;
    }
  }

  if (Number.isFinite(rateHz)) {
    const x = u.valToPos(rateHz, 'x', true);
    ctx.strokeStyle = colours.cursor;
    ctx.lineWidth = 2 * dpr;
    ctx.beginPath();
    ctx.moveTo(x, bbox.top);
    ctx.lineTo(x, bbox.top + bbox.height);
    ctx.stroke();
    ctx.fillStyle = colours.cursor;
    ctx.beginPath();
    ctx.moveTo(x - 6 * dpr, bbox.top);
    ctx.lineTo(x + 6 * dpr, bbox.top);
    ctx.lineTo(x, bbox.top + 8 * dpr);
    ctx.closePath();
    ctx.fill();
  }
  ctx.restore();
}

/** The exact rate of the lock marker within SNAP_PX of `x` (CSS pixels), or null. */
function nearestLock(u: uPlot, series: RateMapSeries, x: number): number | null {
  let best: number | null = null;
  let bestDistance = SNAP_PX;
  for (const partLocks of series.locks) {
    for (const lock of partLocks) {
      const d = Math.abs(u.valToPos(lock.rateHz, 'x') - x);
      if (d <= bestDistance) {
        bestDistance = d;
        best = lock.rateHz;
      }
    }
  }
  return best;
}
