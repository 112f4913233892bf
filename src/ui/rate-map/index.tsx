import { useEffect, useLayoutEffect, useMemo, useRef, useState } from 'preact/hooks';
import { InputError, rateMapSeries, type Part, type Range, type RateMapSeries } from '../../core';
import type { SamplerKind } from '../../state/model';
import { formatNumber } from '../../words/format';
import { formatRate, rateNumber, rateUnit, type FlashUnit } from '../../words/rates';
import { partsKey, rateForKey, speedAxisLimitRpm, unresolvedShare } from './chart-data';
import type { ChartColours, RateChart } from './chart';
import { STILLNESS_CAUTION } from '../../words/cautions';
import { cssColours, useColourScheme } from '../chartTheme';
import { lazyModule } from '../lazyModule';
import { readLive, type Live } from '../live';
import { useSeen } from '../seen';
import style from './style.module.css';

export interface Props {
  /** The parts, in the core's units (rev/s, feature count, relative tolerance), with a name to show. */
  parts: ReadonlyArray<Part & { name?: string }>;
  /** The sampler's range of rates, Hz. */
  range: Range;
  /** The current rate, Hz: drawn as the cursor. */
  rateHz: number;
  /** Called with a rate inside the range, Hz, when the chart is tapped, dragged or keyed. */
  onRateChange: (rateHz: number) => void;
  /**
   * The rate set right now, Hz, where the map may be drawn a paint behind it (the check screen):
   * a key steps from it, so quick presses lose no step. Default: `rateHz`.
   */
  currentRateHz?: () => number;
  /** Which sampler: decides the locks and bands (camera frames or flashes) and the rate's unit. */
  samplerKind: SamplerKind;
  /** Strobe rates in flashes per minute or Hz. Default 'fpm'. */
  flashUnit?: FlashUnit;
  /** Start with a logarithmic rate axis. Default: logarithmic when the range spans more than 20:1. */
  logAxis?: boolean;
  /**
   * Show the stillness caution of docs/physics.md §10 under the map (default true); the map marks
   * rates where parts look still. Pass false only where the screen shows it right beside; a signal
   * where that changes as the entries do (only the caution follows it).
   */
  showCautions?: Live<boolean>;
  class?: string;
}

/** Grid rates across the range: more than the widest chart has pixels. */
const MAP_POINTS = 2000;
/** The crowded low end is worth a note once it takes more than this share of the axis (a few pixels). */
const NOTE_SHARE = 0.01;

/** uPlot and its stylesheet, loaded after the first paint (the first screen stays small). */
const chartCode = lazyModule(() => import('./chart'));

/**
 * The rate map: every part's apparent speed against the sampler's rate over its range, the
 * alias sawtooth with breaks at its edges, lock-in rates marked with their image counts,
 * misleading bands shaded, the current rate as a cursor. Tap or drag to set the rate.
 * uPlot and its stylesheet load after the first paint.
 */
export function RateMap(props: Props) {
  const {
    parts,
    range,
    rateHz,
    onRateChange,
    currentRateHz,
    samplerKind,
    flashUnit = 'fpm',
    showCautions = true,
    class: extra,
  } = props;
  const [log, setLog] = useState(() => props.logAxis ?? range.maxHz / range.minHz > 20);
  const [drawFailed, setDrawFailed] = useState(false);
  const scheme = useColourScheme();
  const rootRef = useRef<HTMLDivElement>(null);
  const holderRef = useRef<HTMLDivElement>(null);
  const chart = useRef<RateChart | null>(null);
  /** The worked-out map the chart shows. */
  const drawnFrom = useRef<Computed | null>(null);
  // Drawn once it comes near the screen: below the fold on a phone, it costs the page's opening
  // nothing (its box holds its size meanwhile: .plot in style.module.css). uPlot is fetched at
  // once, so a page printed before the map was near the screen still gets its chart; loading it
  // is cheap since it no longer builds Intl formatters as it loads
  // (scripts/lazy-uplot-formatters.ts).
  const seen = useSeen(rootRef);
  const { module: chartModule, failed: loadFailed } = chartCode.use();
  const latest = useRef({ onRateChange, rateHz });
  latest.current = { onRateChange, rateHz };

  const sampler = samplerKind === 'camera' ? 'frames' : 'flash';
  const key = partsKey(parts);
  // Everything the series is worked out from; `key` stands for the parts' numbers, so a new
  // array with the same parts reuses the map.
  const inputsKey = `${key}|${range.minHz}|${range.maxHz}|${log}|${sampler}`;
  // Worked out as the map renders, and only once it has come near the screen: a map below the
  // fold costs a keystroke nothing. A screen that renders it on every keystroke hands it its
  // parts a paint later (the check screen: src/state/check/listed.ts; the whole machine:
  // useAfterPaint), so the series and its drawing never hold up the key that changed them.
  const computed = useMemo(
    () => (seen.near ? computeMap(parts, range, log, sampler, key) : null),
    [seen.near, inputsKey],
  );
  const series = computed !== null && 'series' in computed ? computed.series : null;

  // The chart itself: rebuilt when the axis kind or the unit changes, resized with its box.
  // Made a task after the series when the map scrolls near (each alone a shorter wait for a tap
  // or key than both together); at once, in a layout effect, for a page about to be printed, so
  // the printout has it.
  const hasSeries = series !== null;
  useLayoutEffect(() => {
    const holder = holderRef.current;
    const root = rootRef.current;
    if (!seen.later || !chartModule || !holder || !root || !series) return;
    if (computed === null || !('limit' in computed)) return;
    const unit = rateUnit(samplerKind, flashUnit);
    const size = chartSize(holder);
    let made: RateChart;
    try {
      made = chartModule.createRateChart(
        holder,
        {
          ...size,
          // The axis and range the series was worked out for (it follows a frame later).
          log: computed.log,
          range: computed.range,
          speedLimitRpm: computed.limit,
          colours: readColours(root),
          rateTitle: `${samplerKind === 'camera' ? 'Frame rate' : samplerKind === 'strobe' ? 'Flash rate' : 'Flicker'}, ${unit}`,
          rateTick: (hz) => formatNumber(rateNumber(hz, samplerKind, flashUnit)),
          unitPerHz: rateNumber(1, samplerKind, flashUnit),
          speedTick: (rpm) => formatNumber(rpm),
          onPick: (hz) => latest.current.onRateChange(hz),
        },
        series,
        latest.current.rateHz,
      );
    } catch {
      setDrawFailed(true);
      return;
    }
    setDrawFailed(false);
    chart.current = made;
    drawnFrom.current = computed;
    markDrawn(holder, computed.log, computed.partsKey);
    const observer =
      typeof ResizeObserver === 'function'
        ? new ResizeObserver(() => made.resize(chartSize(holder).width, chartSize(holder).height))
        : null;
    observer?.observe(holder);
    return () => {
      observer?.disconnect();
      made.destroy();
      chart.current = null;
      drawnFrom.current = null;
      markDrawn(holder, null, null);
    };
    // Data and rate changes go through update() and setRate() below, without a rebuild.
  }, [
    seen.later,
    chartModule,
    computed?.log,
    samplerKind,
    flashUnit,
    hasSeries,
    computed?.range.minHz,
    computed?.range.maxHz,
    scheme,
  ]);

  // New data is drawn in the task that rendered it, before the browser paints: no frame of its
  // own that a keystroke could have to wait behind.
  useLayoutEffect(() => {
    const holder = holderRef.current;
    if (!series || computed === null || !('limit' in computed) || !chart.current || !holder) return;
    if (drawnFrom.current === computed) return;
    drawnFrom.current = computed;
    chart.current.update(series, latest.current.rateHz, computed.limit);
    markDrawn(holder, computed.log, computed.partsKey);
  }, [computed]);

  useEffect(() => {
    chart.current?.setRate(rateHz);
  }, [rateHz]);

  const onKey = (event: KeyboardEvent) => {
    const next = rateForKey(event.key, currentRateHz?.() ?? rateHz, range, log);
    if (next === null) return;
    event.preventDefault();
    onRateChange(next);
  };

  const unit = rateUnit(samplerKind, flashUnit);

  return (
    <div ref={rootRef} class={`${style.rateMap} ${extra ?? ''}`}>
      <div class={style.toolbar}>
        <label class={style.toggle}>
          <input
            type="checkbox"
            checked={log}
            onChange={(e) => setLog((e.target as HTMLInputElement).checked)}
          />
          <span>Logarithmic rate axis</span>
        </label>
      </div>
      {computed !== null && 'error' in computed ? (
        <p class={style.problem} role="alert">
          {computed.error}
        </p>
      ) : (
        <div
          class={style.chart}
          role="slider"
          tabIndex={0}
          aria-label={`Rate map: tap, drag or use the arrow keys to set the rate (${unit})`}
          aria-valuemin={rateNumber(range.minHz, samplerKind, flashUnit)}
          aria-valuemax={rateNumber(range.maxHz, samplerKind, flashUnit)}
          aria-valuenow={
            Number.isFinite(rateHz) ? rateNumber(rateHz, samplerKind, flashUnit) : undefined
          }
          aria-valuetext={formatRate(rateHz, samplerKind, flashUnit)}
          onKeyDown={onKey}
          data-testid="rate-map"
        >
          <div ref={holderRef} class={style.plot} />
          {(!chartModule || drawFailed) && (
            <p class={style.loading}>
              {drawFailed
                ? 'This browser cannot draw the rate map.'
                : loadFailed
                  ? 'The rate map could not be loaded: reload the page to try again.'
                  : 'Drawing the rate map…'}
            </p>
          )}
        </div>
      )}
      <ul class={style.legend}>
        {parts.map((p, j) => (
          <li key={j}>
            <span
              class={style.swatch}
              style={{ background: `var(--ratemap-part-${(j % 6) + 1})` }}
              aria-hidden="true"
            />
            {p.name || `Part ${j + 1}`}
          </li>
        ))}
        <li>
          <span class={`${style.swatch} ${style.misleadingSwatch}`} aria-hidden="true" />
          Can look still, nearly still, doubled or backward
        </li>
        <li>
          <span class={style.dot} aria-hidden="true" />
          Looks still (a number: images standing still)
        </li>
      </ul>
      {series &&
        computed !== null &&
        unresolvedShare(series.resolvedFromHz, computed.range, computed.log) > NOTE_SHARE && (
          <p class={style.note}>
            Below {formatRate(Math.max(...series.resolvedFromHz), samplerKind, flashUnit)} the
            sawtooth has more teeth than the map has room for: speeds there show as scattered dots,
            and lock markers are left out.
          </p>
        )}
      <MapCaution show={showCautions} />
    </div>
  );
}

/** The stillness caution under the map, when the map is to give it. */
function MapCaution({ show }: { show: Live<boolean> }) {
  return readLive(show) ? <p class={style.caution}>{STILLNESS_CAUTION}</p> : null;
}

type Computed = { inputsKey: string; log: boolean; partsKey: string; range: Range } & (
  { series: RateMapSeries; limit: number } | { error: string }
);

/** The map's series and speed-axis limit for these inputs, or the reason it cannot be drawn. */
function computeMap(
  parts: Props['parts'],
  range: Range,
  log: boolean,
  sampler: 'frames' | 'flash',
  partsKey: string,
): Computed {
  const inputsKey = `${partsKey}|${range.minHz}|${range.maxHz}|${log}|${sampler}`;
  try {
    return {
      inputsKey,
      log,
      partsKey,
      range,
      series: rateMapSeries([...parts], range, { points: MAP_POINTS, log, sampler }),
      limit: speedAxisLimitRpm(parts),
    };
  } catch (error) {
    return {
      inputsKey,
      log,
      partsKey,
      range,
      error:
        error instanceof InputError
          ? error.message
          : 'The rate map cannot be drawn for these settings.',
    };
  }
}

/**
 * Says on the plot's box what the chart on it shows now (its axis and the parts' numbers), or
 * removes it while no chart is drawn. The chart is drawn after the page paints, so a reader that
 * needs the drawn chart (a test, a tap on a lock marker) waits for these, not for time. Written
 * straight to the element: a re-render for each drawing would cost every keystroke a frame.
 */
function markDrawn(holder: HTMLElement, log: boolean | null, partsKey: string | null): void {
  if (log === null || partsKey === null) {
    delete holder.dataset.axis;
    delete holder.dataset.parts;
  } else {
    holder.dataset.axis = log ? 'log' : 'linear';
    holder.dataset.parts = partsKey;
  }
}

/** The chart's size for its box: full width; shorter on a phone. */
function chartSize(holder: HTMLElement): { width: number; height: number } {
  const width = Math.max(240, Math.floor(holder.clientWidth));
  // Keep in step with .plot in style.module.css, which holds this size before the chart loads.
  const height = Math.round(Math.min(380, Math.max(260, width * 0.62)));
  return { width, height };
}

/** Chart colours from the custom properties the stylesheet sets on the widget. */
function readColours(root: Element): ChartColours {
  const get = cssColours(root);
  return {
    parts: [1, 2, 3, 4, 5, 6].map((i) => get(`--ratemap-part-${i}`, '#0d3b4f')),
    ink: get('--ratemap-ink', '#0f1d24'),
    inkSoft: get('--ratemap-ink-soft', '#3b4b53'),
    grid: get('--ratemap-grid', '#e3ddd0'),
    misleading: get('--ratemap-misleading', 'rgba(176, 21, 27, 0.12)'),
    cursor: get('--ratemap-cursor', '#c46a00'),
    markerRing: get('--ratemap-marker-ring', '#ffffff'),
  };
}
