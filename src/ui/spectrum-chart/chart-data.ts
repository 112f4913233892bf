// The spectrum chart's numbers, apart from uPlot so they can be tested without a canvas: the
// curve thinned to what a screen can show, its level range, the frequency ticks, and the marks
// (the tone and its harmonic comb, the shaft lines, mains hum).
import type { HumLine, SoundSpeedCandidate } from '../../core';

/** Frequencies shown, Hz. */
export interface Band {
  minHz: number;
  maxHz: number;
}

/** A line the chart marks: the part's comb (found or only expected there), or hum. */
export interface CombMark {
  hz: number;
  /** Multiple of the speed: k·n for the k-th harmonic of the pattern tone, m for a shaft line. */
  order: number;
  kind: 'pattern' | 'shaft';
  /** A line was found there (false: the comb expects one, none stands out). */
  found: boolean;
  /** Its label: "1×", "2×"… for the pattern tone and its harmonics, "shaft" for a shaft line. */
  label: string;
}

/** A mains hum line, and the part's comb line it hides when they fall together. */
export type HumMark = Pick<HumLine, 'hz' | 'harmonic' | 'mainsHz'> & {
  /** The label of the comb line within a hum line's masked lobe ("2×"): it could be either. */
  onComb?: string;
};

export interface SpectrumMarks {
  /** The tone the speed was read from (the leading speed's strongest line), Hz. */
  toneHz?: number;
  comb: CombMark[];
  hum: HumMark[];
}

/**
 * Bins either side of a hum line that the tone finder leaves out (the Hann window's main lobe,
 * ±2 bins; core/sound/hum.ts): a comb line there can be neither confirmed nor ruled out.
 */
const HUM_LOBE_BINS = 2;

/** Pattern harmonics marked: those the tone finder sums (docs/physics.md §11.6). */
const COMB_HARMONICS = 8;

/**
 * The marks for the leading speed: its pattern comb k·n·f (k = 1…8) inside the band, each
 * marked found when the speed explains a line there, its shaft lines found, and the hum, each
 * hum line naming the comb line it falls on (within HUM_LOBE_BINS of binHz), if any.
 * @example spectrumMarks(undefined, 6, [], { minHz: 20, maxHz: 12000 }, 0.5) // { comb: [], hum: [] }
 */
export function spectrumMarks(
  leader: SoundSpeedCandidate | undefined,
  symmetry: number,
  hum: ReadonlyArray<Pick<HumLine, 'hz' | 'harmonic' | 'mainsHz'>>,
  band: Band,
  binHz: number,
): SpectrumMarks {
  const inBand = (hz: number) => hz >= band.minHz && hz <= band.maxHz;
  const humMarks = hum
    .filter((h) => inBand(h.hz))
    .map(({ hz, harmonic, mainsHz }) => ({ hz, harmonic, mainsHz }));
  if (!leader) return { comb: [], hum: humMarks };
  const foundOrders = new Map(leader.lines.map((l) => [l.order, l.hz]));
  const comb: CombMark[] = [];
  for (let k = 1; k <= COMB_HARMONICS; k++) {
    const order = k * symmetry;
    const hz = foundOrders.get(order) ?? order * leader.speedHz;
    if (inBand(hz)) {
      comb.push({ hz, order, kind: 'pattern', found: foundOrders.has(order), label: `${k}×` });
    }
  }
  for (const line of leader.lines) {
    if (line.kind === 'shaft' && inBand(line.hz)) {
      comb.push({ hz: line.hz, order: line.order, kind: 'shaft', found: true, label: 'shaft' });
    }
  }
  comb.sort((a, b) => a.hz - b.hz);
  const near = HUM_LOBE_BINS * Math.max(0, binHz);
  const humOnComb = humMarks.map((h): HumMark => {
    const under = comb.find((c) => c.kind === 'pattern' && Math.abs(c.hz - h.hz) <= near);
    return under ? { ...h, onComb: under.label } : h;
  });
  return { toneHz: leader.toneHz, comb, hum: humOnComb };
}

/** Lowest level drawn, dB: a bin of no power is shown here rather than as −∞. */
const FLOOR_DB = -200;

/**
 * The spectrum as (frequency, level) points for a logarithmic frequency axis: the band is cut
 * into `points` equal steps of log-frequency and each keeps its loudest bin, so no line is lost
 * to thinning and the low end is not crowded. Levels in dB (10·log10 of the power, a full-scale
 * sine = 0 dB).
 */
export function spectrumColumns(
  power: ArrayLike<number>,
  binHz: number,
  band: Band,
  points: number,
): { hz: number[]; db: number[] } {
  const hz: number[] = [];
  const db: number[] = [];
  const first = Math.max(1, Math.ceil(band.minHz / binHz));
  const last = Math.min(power.length - 1, Math.floor(band.maxHz / binHz));
  if (!(binHz > 0) || last < first || points < 1) return { hz, db };
  const ratio = (last + 1) / first;
  let from = first;
  for (let i = 1; i <= points && from <= last; i++) {
    const to = Math.min(last + 1, Math.max(from + 1, Math.round(first * ratio ** (i / points))));
    let best = from;
    for (let k = from + 1; k < to; k++) if (power[k] > power[best]) best = k;
    hz.push(best * binHz);
    db.push(Math.max(FLOOR_DB, 10 * Math.log10(Math.max(power[best], 1e-30))));
    from = to;
  }
  return { hz, db };
}

/**
 * The level axis: from about 100 dB below the loudest point (or the quietest, if nearer) to a
 * little above it, on round tens.
 * @example levelRangeDb([-20, -60, -95]) // [-100, -10]
 */
export function levelRangeDb(db: readonly number[]): [number, number] {
  if (db.length === 0) return [-100, 0];
  let top = -Infinity;
  let bottom = Infinity;
  for (const v of db) {
    if (v > top) top = v;
    if (v < bottom) bottom = v;
  }
  const high = Math.ceil((top + 5) / 10) * 10;
  const low = Math.floor(Math.max(bottom, high - 100) / 10) * 10;
  return [low, high > low ? high : low + 10];
}

/** Round frequencies for a log axis: 1, 2, 5 per decade. */
const STEPS = [1, 2, 5];

/**
 * Tick frequencies inside the band, Hz: 1, 2 and 5 per decade.
 * @example frequencyTicksHz({ minHz: 20, maxHz: 12000 }) // [20, 50, 100, 200, 500, 1000, 2000, 5000, 10000]
 */
export function frequencyTicksHz(band: Band): number[] {
  const ticks: number[] = [];
  if (!(band.minHz > 0 && band.maxHz > band.minHz)) return ticks;
  for (let decade = Math.floor(Math.log10(band.minHz)); 10 ** decade <= band.maxHz; decade++) {
    for (const step of STEPS) {
      const hz = step * 10 ** decade;
      if (hz >= band.minHz * (1 - 1e-9) && hz <= band.maxHz * (1 + 1e-9)) ticks.push(hz);
    }
  }
  return ticks;
}

/**
 * A frequency tick's label: "500", "1k", "12k".
 * @example frequencyTickText(2000) // "2k"
 */
export function frequencyTickText(hz: number): string {
  return hz >= 1000 ? `${Number((hz / 1000).toPrecision(3))}k` : String(Number(hz.toPrecision(3)));
}
