// @vitest-environment happy-dom
// The chart library draws on a real canvas, which happy-dom lacks: the uPlot adapter is
// replaced by a recorder here; the real chart is checked in Chromium by the browser tests.
import { signal } from '@preact/signals';
import type { ComponentProps } from 'preact';
import { cleanup, fireEvent, render, screen, waitFor } from '@testing-library/preact';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { RateChart, RateChartOptions } from '../../../src/ui/rate-map/chart';
import type { RateMapSeries } from '../../../src/core';
import { reportIntersections } from '../../helpers/intersection';

interface Made {
  options: RateChartOptions;
  series: RateMapSeries;
  rateHz: number;
  chart: RateChart & { rates: number[]; updates: number; destroyed: boolean };
}
const made: Made[] = [];
/** When set, the next chart fails as it would in a browser with no 2D canvas. */
let noCanvas = false;

vi.mock('../../../src/ui/rate-map/chart', () => ({
  createRateChart: (
    _holder: HTMLElement,
    options: RateChartOptions,
    series: RateMapSeries,
    rateHz: number,
  ) => {
    if (noCanvas) throw new Error('This browser gives no 2D canvas to draw the rate map on.');
    const chart = {
      rates: [] as number[],
      updates: 0,
      destroyed: false,
      update() {
        chart.updates++;
      },
      setRate(r: number) {
        chart.rates.push(r);
      },
      resize() {},
      destroy() {
        chart.destroyed = true;
      },
    };
    made.push({ options, series, rateHz, chart });
    return chart;
  },
}));

const { RateMap } = await import('../../../src/ui/rate-map');

// A fictional bottling line: a 6-blade fan and a 4-spoke pulley under a strobe.
const parts = [
  { name: 'Cooling fan', speedHz: 1780 / 60, symmetry: 6 },
  { name: 'Drive pulley', speedHz: 980 / 60, symmetry: 4 },
];
const range = { minHz: 1, maxHz: 1000 };

beforeEach(() => {
  // The rate map draws once it is near the screen.
  reportIntersections();
  made.length = 0;
  noCanvas = false;
});
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

/** The map of the two test parts under a strobe at 88 Hz, with `props` over those. */
function strobeMap(props: Partial<ComponentProps<typeof RateMap>> = {}) {
  return (
    <RateMap
      parts={parts}
      range={range}
      rateHz={88}
      onRateChange={() => {}}
      samplerKind="strobe"
      {...props}
    />
  );
}

describe('RateMap', () => {
  it('loads the chart with every part’s column, the range and the current rate, on a log axis for a wide range', async () => {
    render(strobeMap());
    await waitFor(() => expect(made).toHaveLength(1));
    const { options, series, rateHz } = made[0];
    expect(series.apparentRpm).toHaveLength(2);
    expect(options.log).toBe(true);
    expect(options.range).toEqual(range);
    expect(options.rateTitle).toBe('Flash rate, fpm');
    expect(options.rateTick(10)).toBe('600');
    expect(rateHz).toBe(88);
    expect(screen.getByText('Cooling fan')).toBeTruthy();
    expect(screen.getByText('Drive pulley')).toBeTruthy();
  });

  it('draws nothing while it is off screen: a map below the fold costs the page’s opening nothing', async () => {
    reportIntersections(false);
    render(strobeMap());
    // The chart's code has loaded (the legend is up) and still nothing is drawn.
    await screen.findByText('Cooling fan');
    for (let i = 0; i < 5; i++) await new Promise((resolve) => setTimeout(resolve, 10));
    expect(made).toHaveLength(0);
  });

  it('hands a tapped rate to onRateChange and moves the cursor when the rate comes back', async () => {
    const picked: number[] = [];
    const { rerender } = render(
      <RateMap
        parts={parts}
        range={range}
        rateHz={88}
        onRateChange={(r) => picked.push(r)}
        samplerKind="strobe"
      />,
    );
    await waitFor(() => expect(made).toHaveLength(1));
    made[0].options.onPick(123.4);
    expect(picked).toEqual([123.4]);
    rerender(
      <RateMap
        parts={parts}
        range={range}
        rateHz={123.4}
        onRateChange={(r) => picked.push(r)}
        samplerKind="strobe"
      />,
    );
    expect(made[0].chart.rates).toContain(123.4);
    expect(made).toHaveLength(1);
  });

  it('rebuilds the chart on a linear axis when the log axis is turned off', async () => {
    render(strobeMap());
    await waitFor(() => expect(made).toHaveLength(1));
    fireEvent.click(screen.getByLabelText('Logarithmic rate axis'));
    await waitFor(() => expect(made).toHaveLength(2));
    expect(made[0].chart.destroyed).toBe(true);
    expect(made[1].options.log).toBe(false);
  });

  it('sets the rate from the keyboard, as a slider in the sampler’s unit', async () => {
    const picked: number[] = [];
    render(
      <RateMap
        parts={parts}
        range={{ minHz: 20, maxHz: 120 }}
        rateHz={30}
        onRateChange={(r) => picked.push(r)}
        samplerKind="camera"
      />,
    );
    const slider = screen.getByRole('slider');
    expect(slider.getAttribute('aria-valuetext')).toBe('30 fps');
    fireEvent.keyDown(slider, { key: 'ArrowRight' });
    expect(picked[0]).toBeCloseTo(31, 12); // 1 % of the 100 fps span, linear for a 6:1 range
  });

  it('steps a key from the rate set now when it is drawn behind it: quick presses lose no step', () => {
    const picked: number[] = [];
    let now = 30;
    render(
      <RateMap
        parts={parts}
        range={{ minHz: 20, maxHz: 120 }}
        rateHz={30}
        currentRateHz={() => now}
        onRateChange={(r) => {
          picked.push(r);
          now = r;
        }}
        samplerKind="camera"
      />,
    );
    const slider = screen.getByRole('slider');
    // Two presses before the map is drawn again: its rateHz is still 30.
    fireEvent.keyDown(slider, { key: 'ArrowRight' });
    fireEvent.keyDown(slider, { key: 'ArrowRight' });
    expect(picked[0]).toBeCloseTo(31, 12);
    expect(picked[1]).toBeCloseTo(32, 12);
  });

  it('says so, and keeps the legend, where the browser cannot draw the chart', async () => {
    noCanvas = true;
    render(strobeMap());
    await waitFor(() =>
      expect(screen.getByText('This browser cannot draw the rate map.')).toBeTruthy(),
    );
    expect(made).toHaveLength(0);
    expect(screen.getByText('Cooling fan')).toBeTruthy();
  });

  it('says what is wrong with an empty range instead of drawing', async () => {
    render(
      <RateMap
        parts={parts}
        range={{ minHz: 100, maxHz: 10 }}
        rateHz={50}
        onRateChange={() => {}}
        samplerKind="strobe"
      />,
    );
    // Worked out once the map is near the screen, as it is here.
    expect((await screen.findByRole('alert')).textContent).toMatch(/range is empty/);
    expect(screen.queryByRole('slider')).toBeNull();
  });

  it('warns that parts looking still are still turning, unless the screen shows it beside the map', () => {
    const { rerender } = render(strobeMap());
    expect(screen.getByText(/still turning at full speed/)).toBeTruthy();
    rerender(strobeMap({ showCautions: false }));
    expect(screen.queryByText(/still turning at full speed/)).toBeNull();
  });

  it('follows a caution flag handed over as a signal, without drawing the map again', async () => {
    const give = signal(false);
    render(strobeMap({ showCautions: give }));
    await waitFor(() => expect(made).toHaveLength(1));
    expect(screen.queryByText(/still turning at full speed/)).toBeNull();
    const drawn = { updates: made[0].chart.updates, made: made.length };
    give.value = true;
    await waitFor(() => expect(screen.getByText(/still turning at full speed/)).toBeTruthy());
    give.value = false;
    await waitFor(() => expect(screen.queryByText(/still turning at full speed/)).toBeNull());
    // The chart itself was neither made again nor handed its data again.
    expect(made).toHaveLength(drawn.made);
    expect(made[0].chart.updates).toBe(drawn.updates);
  });
});
