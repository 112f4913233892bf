// The spectrum drawn with uPlot on a logarithmic frequency axis, with the tone, its harmonic
// comb and the hum marked over it. Loaded lazily (with uPlot and its stylesheet) by
// spectrum-chart/index.tsx, as the rate map's chart is.
import uPlot from 'uplot';
import 'uplot/dist/uPlot.min.css';
import { frequencyTicksHz, frequencyTickText, type Band, type SpectrumMarks } from './chart-data';

export interface SpectrumColours {
  curve: string;
  tone: string;
  hum: string;
  ink: string;
  inkSoft: string;
  grid: string;
}

export interface SpectrumChartOptions {
  width: number;
  height: number;
  band: Band;
  levelDb: [number, number];
  colours: SpectrumColours;
}

export interface SpectrumChart {
  update(
    columns: { hz: number[]; db: number[] },
    marks: SpectrumMarks,
    levelDb: [number, number],
  ): void;
  resize(width: number, height: number): void;
  destroy(): void;
}

const TICK_FONT = '13px system-ui, sans-serif';
const LABEL_FONT = '600 14px system-ui, sans-serif';
/** Labels over the marks closer than this (CSS pixels) are left out, not overlapped. */
const LABEL_GAP_PX = 30;
/** Least room between the centres of two frequency labels, px (three or four characters of 12 px text). */
const MIN_TICK_GAP_PX = 32;

/** Builds the chart inside `holder`. Throws where the browser has no 2D canvas. */
export function createSpectrumChart(
  holder: HTMLElement,
  options: SpectrumChartOptions,
  columns: { hz: number[]; db: number[] },
  marks: SpectrumMarks,
): SpectrumChart {
  if (!document.createElement('canvas').getContext('2d')) {
    throw new Error('This browser gives no 2D canvas to draw the spectrum on.');
  }
  const { colours, band } = options;
  let current = { marks, levelDb: options.levelDb };
  const plot = new uPlot(
    {
      width: options.width,
      height: options.height,
      legend: { show: false },
      cursor: { show: false, drag: { x: false, y: false, setScale: false } },
      select: { show: false, left: 0, top: 0, width: 0, height: 0 },
      scales: {
        x: { time: false, distr: 3, log: 10, range: () => [band.minHz, band.maxHz] },
        y: { range: () => current.levelDb },
      },
      axes: [
        {
          stroke: colours.inkSoft,
          grid: { stroke: colours.grid, width: 1 },
          ticks: { stroke: colours.grid },
          label: 'Frequency, Hz',
          labelFont: LABEL_FONT,
          font: TICK_FONT,
          splits: () => frequencyTicksHz(band),
          filter: (_u, splits) => splits,
          values: (u, splits) => {
            // On a narrow chart the 1-2-5 ticks crowd: the decades (100, 1k, 10k) are labelled
            // first, then the others where they leave room; the rest stay blank.
            const at = splits.map((v) => (v == null ? NaN : u.valToPos(v, 'x')));
            const kept: number[] = [];
            const room = (i: number) =>
              kept.every((k) => Math.abs(at[k] - at[i]) >= MIN_TICK_GAP_PX);
            const decade = (v: number) => Math.abs(Math.log10(v) % 1) < 1e-9;
            splits.forEach((v, i) => v != null && decade(v) && room(i) && kept.push(i));
            splits.forEach((v, i) => v != null && !decade(v) && room(i) && kept.push(i));
            return splits.map((v, i) =>
              v != null && kept.includes(i) ? frequencyTickText(v) : '',
            );
          },
        },
        {
          stroke: colours.inkSoft,
          grid: { stroke: colours.grid, width: 1 },
          ticks: { stroke: colours.grid },
          label: 'Level, dB',
          labelFont: LABEL_FONT,
          font: TICK_FONT,
          size: 52,
        },
      ],
      series: [{}, { stroke: colours.curve, width: 1.5, points: { show: false } }],
      hooks: { draw: [(u: uPlot) => drawMarks(u, current.marks, colours)] },
    },
    [columns.hz, columns.db],
    holder,
  );

  return {
    update(nextColumns, nextMarks, levelDb) {
      current = { marks: nextMarks, levelDb };
      plot.setData([nextColumns.hz, nextColumns.db]);
    },
    resize(width, height) {
      if (width > 0 && height > 0 && (width !== plot.width || height !== plot.height))
        plot.setSize({ width, height });
    },
    destroy() {
      plot.destroy();
    },
  };
}

/** Hum dashed in its own colour; the comb in the tone's colour, solid where a line was found. */
function drawMarks(u: uPlot, marks: SpectrumMarks, colours: SpectrumColours): void {
  const { ctx, bbox } = u;
  const dpr = window.devicePixelRatio || 1;
  ctx.save();
  ctx.beginPath();
  ctx.rect(bbox.left, bbox.top, bbox.width, bbox.height);
  ctx.clip();
  ctx.font = `600 ${Math.round(12 * dpr)}px system-ui, sans-serif`;
  ctx.textAlign = 'center';
  ctx.textBaseline = 'top';
  // Labels in two rows (the part's, then hum's); one that would overlap another in its row is left out.
  const labelled: Array<{ at: number; half: number; row: number }> = [];
  const label = (x: number, text: string, colour: string, row: number) => {
    // Kept inside the plot: a line near an edge has its label moved in, not cut.
    const half = ctx.measureText(text).width / 2 + 2 * dpr;
    const at = Math.min(bbox.left + bbox.width - half, Math.max(bbox.left + half, x));
    const gap = (LABEL_GAP_PX * dpr) / 4;
    if (labelled.some((l) => l.row === row && Math.abs(l.at - at) < l.half + half + gap)) return;
    labelled.push({ at, half, row });
    ctx.fillStyle = colour;
    ctx.fillText(text, at, bbox.top + (2 + row * 15) * dpr);
  };
  const line = (x: number, colour: string, width: number, dash: number[]) => {
    ctx.strokeStyle = colour;
    ctx.lineWidth = width * dpr;
    ctx.setLineDash(dash.map((d) => d * dpr));
    ctx.beginPath();
    ctx.moveTo(x, bbox.top + 16 * dpr);
    ctx.lineTo(x, bbox.top + bbox.height);
    ctx.stroke();
  };
  const x = (hz: number) => u.valToPos(hz, 'x', true);

  for (const h of marks.hum) line(x(h.hz), colours.hum, 1.5, [4, 4]);
  for (const c of marks.comb) {
    line(
      x(c.hz),
      colours.tone,
      c.found ? (c.hz === marks.toneHz ? 2.5 : 1.5) : 1,
      c.found ? [] : [2, 4],
    );
  }
  // Labels, most important first: the strongest line, the other lines found, then hum.
  const ranked = [...marks.comb].sort(
    (a, b) => Number(b.hz === marks.toneHz) - Number(a.hz === marks.toneHz),
  );
  for (const c of ranked) if (c.found) label(x(c.hz), c.label, colours.tone, 0);
  for (const h of marks.hum)
    label(x(h.hz), h.onComb ? `hum or ${h.onComb}` : 'hum', colours.hum, 1);
  ctx.restore();
}
