// The rate map drawn with uPlot. Loaded lazily (with uPlot and its stylesheet) so the first
// screen stays small: RateMap/index.tsx imports this module with import().
import uPlot from 'uplot';
import 'uplot/dist/uPlot.min.css';
import type { Range, RateMapSeries } from '../../core';
import { placeMarkers, toChartColumns } from './chart-data';

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
  /** Tick label for a speed in rpm. */
  speedTick: (rpm: number) => string;
  /** Called with the rate under a tap or drag, Hz, already inside the range. */
  onPick: (rateHz: number) => void;
}

export interface RateChart {
  /** New data (parts, range or sampler changed); the cursor moves to `rateHz`. */
  update(series: RateMapSeries, rateHz: number, speedLimitRpm: number): void;
  /** Moves the current-rate cursor; redraws without rebuilding the lines. */
  setRate(rateHz: number): void;
  resize(width: number, height: number): void;
  destroy(): void;
}

/** A tap within this many CSS pixels of a lock marker picks the lock's exact rate. */
const SNAP_PX = 6;
/** Markers of one part closer than this (CSS pixels) are drawn as one. */
const MARKER_GAP_PX = 5;

/** Builds the chart inside `holder`. */
export function createRateChart(
  holder: HTMLElement,
  options: RateChartOptions,
  series: RateMapSeries,
  rateHz: number,
): RateChart {
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
      y: { range: () => [-current.speedLimitRpm, current.speedLimitRpm] },
    },
    axes: [
      {
        stroke: colours.inkSoft,
        grid: { stroke: colours.grid, width: 1 },
        ticks: { stroke: colours.grid },
        label: options.rateTitle,
        labelFont: '600 13px system-ui, sans-serif',
        font: '12px system-ui, sans-serif',
        // A log axis hides some ticks by passing null for them.
        values: (_u, splits) =>
          splits.map((v) => (v === null || v === undefined ? '' : options.rateTick(v))),
      },
      {
        stroke: colours.inkSoft,
        grid: { stroke: colours.grid, width: 1 },
        ticks: { stroke: colours.grid },
        label: 'Apparent speed, rpm',
        labelFont: '600 13px system-ui, sans-serif',
        font: '12px system-ui, sans-serif',
        size: 64,
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
      drawClear: [(u: uPlot) => shadeMisleading(u, current.series, colours)],
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

  return {
    update(next, nextRate, speedLimitRpm) {
      current = { series: next, rateHz: nextRate, speedLimitRpm };
      plot.setData(toChartColumns(next) as uPlot.AlignedData);
    },
    setRate(nextRate) {
      if (nextRate === current.rateHz) return;
      current = { ...current, rateHz: nextRate };
      plot.redraw(false, false);
    },
    resize(width, height) {
      if (width > 0 && height > 0 && (width !== plot.width || height !== plot.height))
        plot.setSize({ width, height });
    },
    destroy() {
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

/** Misleading bands shaded behind everything, the full height of the plot. */
function shadeMisleading(u: uPlot, series: RateMapSeries, colours: ChartColours): void {
  const { ctx, bbox } = u;
  ctx.save();
  ctx.fillStyle = colours.misleading;
  for (const band of series.bands) {
    if (band.safe) continue;
    const x0 = u.valToPos(band.fromHz, 'x', true);
    const x1 = u.valToPos(band.toHz, 'x', true);
    const left = Math.max(bbox.left, Math.min(x0, x1));
    const right = Math.min(bbox.left + bbox.width, Math.max(x0, x1));
    if (right < left) continue;
    ctx.fillRect(left, bbox.top, Math.max(1, right - left), bbox.height);
  }
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
  ctx.font = font(11);
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
