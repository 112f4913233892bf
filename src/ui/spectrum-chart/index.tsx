import { useEffect, useMemo, useRef, useState } from 'preact/hooks';
import type { SoundSpectrum } from '../../core';
import { formatNumber } from '../../words/format';
import { humWords } from '../../words/sound';
import { cssColours, useColourScheme } from '../chartTheme';
import { lazyModule } from '../lazyModule';
import { levelRangeDb, spectrumColumns, type SpectrumMarks } from './chart-data';
import type { SpectrumChart as Chart, SpectrumColours } from './chart';
import style from './style.module.css';

export interface Props {
  /** What was heard: its power per bin and the band read. */
  spectrum: Pick<SoundSpectrum, 'power' | 'binHz' | 'minToneHz' | 'maxToneHz'>;
  marks: SpectrumMarks;
  /** The name of the comb's first line in words ("blade-pass tone"), for the legend. */
  toneName: string;
}

/** Points drawn: more than the widest chart has pixels. */
const POINTS = 1500;

/** uPlot and its stylesheet, loaded on first use, as the rate map's chart is. */
const chartCode = lazyModule(() => import('./chart'));

/**
 * The spectrum of what was heard on a logarithmic frequency axis, with the tone and its
 * harmonic comb (solid where a line was found, dashed where one is only expected) and mains hum
 * (dashed, its own colour) marked. The legend says the same in words.
 */
export function SpectrumChart({ spectrum, marks, toneName }: Props) {
  const { module: chartModule, failed: loadFailed } = chartCode.use();
  const [drawFailed, setDrawFailed] = useState(false);
  const scheme = useColourScheme();
  const rootRef = useRef<HTMLDivElement>(null);
  const holderRef = useRef<HTMLDivElement>(null);
  const chart = useRef<Chart | null>(null);
  const band = { minHz: spectrum.minToneHz, maxHz: spectrum.maxToneHz };
  const columns = useMemo(
    () => spectrumColumns(spectrum.power, spectrum.binHz, band, POINTS),
    [spectrum.power, spectrum.binHz, band.minHz, band.maxHz],
  );
  const levelDb = useMemo(() => levelRangeDb(columns.db), [columns]);
  const latest = useRef({ marks, levelDb });
  latest.current = { marks, levelDb };

  useEffect(() => {
    const holder = holderRef.current;
    const root = rootRef.current;
    if (!chartModule || !holder || !root) return;
    let made: Chart;
    try {
      made = chartModule.createSpectrumChart(
        holder,
        { ...chartSize(holder), band, levelDb, colours: readColours(root) },
        columns,
        latest.current.marks,
      );
    } catch {
      setDrawFailed(true);
      return;
    }
    setDrawFailed(false);
    chart.current = made;
    markDrawn(holder, marks);
    const observer =
      typeof ResizeObserver === 'function'
        ? new ResizeObserver(() => made.resize(chartSize(holder).width, chartSize(holder).height))
        : null;
    observer?.observe(holder);
    return () => {
      observer?.disconnect();
      made.destroy();
      chart.current = null;
      markDrawn(holder, null);
    };
  }, [chartModule, scheme, band.minHz, band.maxHz]);

  // New sound or new marks (another count of blades): the same chart, new data.
  useEffect(() => {
    if (chart.current && holderRef.current) {
      chart.current.update(columns, marks, levelDb);
      markDrawn(holderRef.current, marks);
    }
  }, [columns, marks]);

  const found = marks.comb.filter((c) => c.found);
  const summary =
    `Spectrum from ${formatNumber(band.minHz)} Hz to ${formatNumber(band.maxHz)} Hz` +
    (marks.toneHz !== undefined ? `; the tone at ${formatNumber(marks.toneHz)} Hz` : '') +
    (found.length > 1 ? ` and ${found.length - 1} more lines of the part` : '') +
    (marks.hum.length
      ? `; mains hum at ${marks.hum.map((h) => `${formatNumber(h.hz)}`).join(', ')} Hz`
      : '');

  return (
    <figure ref={rootRef} class={style.spectrum}>
      <div class={style.chart} data-testid="spectrum-chart">
        <div ref={holderRef} class={style.plot} role="img" aria-label={summary} />
        {(!chartModule || drawFailed) && (
          <p class={style.loading}>
            {drawFailed
              ? 'This browser cannot draw the spectrum; the speeds below do not need it.'
              : loadFailed
                ? 'The spectrum could not be loaded: reload the page to try again.'
                : 'Drawing the spectrum…'}
          </p>
        )}
      </div>
      <figcaption>
        <ul class={style.legend}>
          <li>
            <span class={`${style.swatch} ${style.curve}`} aria-hidden="true" />
            Level of the sound at each frequency
          </li>
          {marks.toneHz !== undefined && (
            <li>
              <span class={`${style.swatch} ${style.tone}`} aria-hidden="true" />
              The {toneName} (1×), its harmonics (2×, 3×…) and shaft lines (“shaft”): solid where a
              line was heard, dotted where one is only expected
            </li>
          )}
          {marks.hum.map((h) => (
            <li key={h.hz}>
              <span class={`${style.swatch} ${style.hum}`} aria-hidden="true" />
              {h.onComb
                ? `${humWords(h)}: also where the ${toneName}'s ${h.onComb} line falls, so it may be either; left out of the count`
                : `${humWords(h)}: not the part`}
            </li>
          ))}
        </ul>
      </figcaption>
    </figure>
  );
}

/** Says on the plot's box what it shows (the tone and the hum), for readers that wait for the drawn chart. */
function markDrawn(holder: HTMLElement, marks: SpectrumMarks | null): void {
  if (!marks) {
    delete holder.dataset.tone;
    delete holder.dataset.hum;
    return;
  }
  holder.dataset.tone = marks.toneHz === undefined ? '' : marks.toneHz.toFixed(2);
  holder.dataset.hum = marks.hum.map((h) => h.hz.toFixed(1)).join(' ');
}

/** The chart's size for its box: full width, shorter on a phone. */
function chartSize(holder: HTMLElement): { width: number; height: number } {
  const width = Math.max(240, Math.floor(holder.clientWidth));
  // Keep in step with .plot in style.module.css, which holds this size before the chart loads.
  const height = Math.round(Math.min(300, Math.max(220, width * 0.55)));
  return { width, height };
}

function readColours(root: Element): SpectrumColours {
  const get = cssColours(root);
  return {
    curve: get('--spectrum-curve', '#0d3b4f'),
    tone: get('--spectrum-tone', '#c46a00'),
    hum: get('--spectrum-hum', '#7a3e9d'),
    ink: get('--spectrum-ink', '#0f1d24'),
    inkSoft: get('--spectrum-ink-soft', '#3b4b53'),
    grid: get('--spectrum-grid', '#e3ddd0'),
  };
}
