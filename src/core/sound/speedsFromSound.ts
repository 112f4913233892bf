// Kept whole (over 300 lines): the harmonic sum, the candidates it yields and their ranking share
// one set of line and spectrum invariants (docs/physics.md §11.6); split, each piece would need
// the others' internals.
import { InputError, requireWhole } from '../basics/InputError';
import { checkRange, MAX_SYMMETRY, type Range } from '../basics/types';
import { requireWorkable } from '../basics/workLimit';
import { findHum, type HumLine } from './hum';
import type { SpectrumPeak } from './peaks';
import type { SoundSpectrum } from './spectrum';

export interface SpeedsFromSoundOptions {
  /** Identical, equally spaced features: blades of a fan or impeller, teeth of a gear (n). */
  symmetry: number;
  /** Speeds to search, rev/s. Default DEFAULT_SOUND_SPEED_RANGE. */
  expect?: Range;
  /** The site's mains supply, Hz, when known; otherwise hum from either is looked for. */
  mainsHz?: 50 | 60;
}

/**
 * How sure a candidate is, as a code (the UI words it):
 * - 'clear': the leader, two or more lines agree, and no other speed scores 60 % as well;
 * - 'likely': the leader, but another speed scores 60–90 % as well, or it rests on one line;
 * - 'tied': another speed scores at least 90 % as well: the sound alone cannot choose;
 * - 'possible': fits clearly worse than the leader, kept because it still explains lines;
 * - 'faint': its strongest line stands less than 16 dB above the noise.
 */
export type SoundConfidence = 'clear' | 'likely' | 'tied' | 'possible' | 'faint';

/** A line of the spectrum explained by a candidate speed f. */
export interface SoundLine {
  hz: number;
  /** hz ≈ order · f (shaft orders: a pattern line k·n·f has order k·n). */
  order: number;
  /** 'pattern': a multiple of n·f (blade pass, gear mesh); 'shaft': a multiple of f that is not. */
  kind: 'pattern' | 'shaft';
  levelDb: number;
  prominenceDb: number;
}

export interface SoundSpeedCandidate {
  /** Speed, rev/s. */
  speedHz: number;
  /** ± rev/s, about two standard errors of the fit through the lines. */
  precisionHz: number;
  /** Which lines carry the evidence: the pattern tone n·f and its multiples, or shaft lines. */
  basis: 'pattern' | 'shaft';
  /** The strongest line explained, Hz. */
  toneHz: number;
  /** Every line explained, by frequency. */
  lines: SoundLine[];
  /** Harmonic-sum score relative to the leader's (1 for the leader). */
  score: number;
  confidence: SoundConfidence;
}

export interface SoundSpeeds {
  /** Every plausible speed, best first. Empty when no tone was found (see noTone). */
  candidates: SoundSpeedCandidate[];
  /** Lines set aside as mains hum. */
  hum: HumLine[];
  /** Speeds searched, rev/s. */
  searchedHz: Range;
  /** Why there is no candidate: nothing heard, no line above the noise, only hum, or lines that fit no speed in the range. */
  noTone?: 'silent' | 'no-lines' | 'hum-only' | 'no-match';
  /** The recording reached full scale: distortion may add lines (the same multiples, and sums of them). */
  clipped: boolean;
}

/** Speeds searched when none is expected, rev/s: 120 to 15 000 rpm (a judgement covering fans, pumps, motors and gearboxes). */
export const DEFAULT_SOUND_SPEED_RANGE: Readonly<Range> = Object.freeze({ minHz: 2, maxHz: 250 });

/** Pattern harmonics k·n·f summed. */
const PATTERN_HARMONICS = 8;
/** Shaft orders summed (those that are not multiples of n). */
const SHAFT_ORDERS = 4;
/**
 * Weight of the j-th harmonic, h^(j−1) with h = 0.84: the compression of subharmonic
 * summation (D. J. Hermes, "Measurement of pitch by subharmonic summation", J. Acoust. Soc.
 * Am. 83(1), 1988; value from memory). A line weighs more in the comb of its true
 * fundamental than in any subharmonic's, so the true speed outscores f/2, f/3….
 */
const HARMONIC_DECAY = 0.84;
/** Shaft lines count half as much as pattern lines: the user told us n, and n·f is the tone a bladed or toothed part sings. */
const SHAFT_WEIGHT = 0.5;
/**
 * Evidence of a predicted line: its amplitude less twice the noise floor's amplitude there.
 * Amplitude, not decibels or signal-to-noise ratio, so that the loudest line (usually the
 * pattern tone) outweighs faint ones in every comb that claims it, whatever the colour of the
 * noise; noise alone scores about −0.5 floor amplitudes, so a predicted line that is absent
 * counts a little against.
 */
const ABSENT_FLOORS = 2;
/** Share of the next present harmonic's amplitude a hole in a blade-pass series costs (a judgement). */
const HOLE_SHARE = 0.5;
/** Share of its amplitude a line halfway or a third of the way between blade-pass lines costs when the comb leaves it unexplained (a judgement). */
const UNEXPLAINED_SHARE = 0.5;
/** How close (bins) to such a fraction a line must sit to count. */
const FRACTION_BINS = 1.5;
/** Seeds kept for refinement: local maxima scoring at least this share of the best. */
const SEED_SHARE = 0.2;
const MAX_SEEDS = 40;
/** Candidates kept: scoring at least this share of the leader's, and at most this many. */
const PLAUSIBLE_SHARE = 0.4;
const MAX_CANDIDATES = 8;
/** Another candidate at or above this share of a candidate's score ties with it. */
export const TIED_SHARE = 0.9;
/** The leader is 'clear' when the runner-up scores below this share. */
export const CLEAR_SHARE = 0.6;
/** A candidate whose strongest line stands less than this above the floor is 'faint'. */
const FAINT_DB = 16;
/** Two candidates closer than this (relative) are one. */
const SAME_SPEED = 0.001;
/** Most speeds tested in the harmonic sum. */
const MAX_GRID_POINTS = 2_000_000;

/**
 * Line-frequency uncertainty used to weight the fit, in bins: a floor for what the
 * interpolation leaves (Welch averaging of a slowly drifting line) plus the noise term, which
 * falls as 1/√SNR of the line (the usual Cramér–Rao scaling for a frequency estimate).
 */
const LINE_SIGMA_FLOOR_BINS = 0.005;
const LINE_SIGMA_NOISE_BINS = 0.3;
/** A drifting line's centroid is known to this share of its smear (its width beyond a steady line's). */
const LINE_SIGMA_SMEAR = 0.01;
/** Widest span of a steady line, bins (as in peaks.ts). */
const STEADY_SPAN_BINS = 5;

/**
 * Every plausible speed of a part from the spectrum of its sound (a harmonic sum over
 * candidate speeds). A part with n blades or teeth turning at f sings at the pattern
 * frequency n·f (blade pass, gear mesh: common practice) and its multiples, often with shaft
 * lines at f, 2f… (imbalance, misalignment). For every speed f in the range, the evidence at
 * each predicted line is summed with weights falling by harmonic (subharmonic summation,
 * Hermes 1988): a missing fundamental costs one term, not the answer; predicted lines that are
 * absent count a little against; mains hum lines (see findHum) count neither way.
 * The best local maxima are refined by a weighted least-squares fit of f through the lines
 * they explain (line k at order h_k: f = Σw·h·x / Σw·h²), which also gives the precision.
 *
 * Every speed scoring at least 40 % of the best is returned, ranked, each with a confidence
 * code; where two explain the sound about equally well both are marked 'tied' and the sound
 * alone does not choose.
 *
 * Throws InputError for a spectrum that is not one, a bad symmetry, or an empty or inverted
 * expected range (rev/s).
 *
 * @example
 * // A 6-blade fan at 29.17 rev/s (1750 rpm) singing at 175 Hz:
 * speedsFromSound(soundSpectrum(samples, 48000), { symmetry: 6 }).candidates[0].speedHz // 29.17
 */
export function speedsFromSound(
  spectrum: SoundSpectrum,
  opts: SpeedsFromSoundOptions,
): SoundSpeeds {
  if (
    spectrum === null ||
    typeof spectrum !== 'object' ||
    !(spectrum.power instanceof Float64Array) ||
    !(spectrum.binHz > 0)
  ) {
    throw new InputError('spectrum', 'The spectrum is missing: analyse a recording first.');
  }
  const n = requireWhole(opts?.symmetry, 'features (blades, teeth)', 1, MAX_SYMMETRY);
  const range = checkRange(opts.expect ?? DEFAULT_SOUND_SPEED_RANGE, 'expected speed range');
  const mainsHz = opts.mainsHz;
  if (mainsHz !== undefined && mainsHz !== 50 && mainsHz !== 60) {
    throw new InputError('mains', 'The mains frequency must be 50 or 60 Hz.');
  }
  const hum = findHum(spectrum, mainsHz);
  const base = { hum: hum.lines, searchedHz: range, clipped: spectrum.level.clipped };
  if (spectrum.level.silent) return { ...base, candidates: [], noTone: 'silent' };
  const usable = spectrum.peaks.filter((p) => !hum.mask[p.bin]);
  if (spectrum.peaks.length === 0) return { ...base, candidates: [], noTone: 'no-lines' };
  if (usable.length === 0) return { ...base, candidates: [], noTone: 'hum-only' };

  const comb = new Comb(spectrum, hum.mask, n);
  const seeds = comb.seeds(range);
  const found: SoundSpeedCandidate[] = [];
  for (const seed of seeds) {
    const fit = fitLines(seed, usable, spectrum.binHz, comb);
    if (!fit) continue;
    if (
      fit.speedHz < range.minHz * (1 - SAME_SPEED) ||
      fit.speedHz > range.maxHz * (1 + SAME_SPEED)
    )
      continue;
    const score = comb.lineScore(fit.speedHz, fit.fitted, usable);
    if (!(score > 0)) continue;
    // Two seeds that refine to the same speed are one candidate: keep the better fit.
    const twin = found.findIndex(
      (c) => Math.abs(c.speedHz - fit.speedHz) <= SAME_SPEED * fit.speedHz,
    );
    if (twin >= 0) {
      if (found[twin].score >= score) continue;
      found.splice(twin, 1);
    }
    const { fitted: _fitted, ...candidate } = fit;
    found.push({ ...candidate, score, confidence: 'possible' });
  }
  found.sort((a, b) => b.score - a.score);
  if (found.length === 0) return { ...base, candidates: [], noTone: 'no-match' };
  const top = found[0].score;
  const candidates = found
    .filter((c) => c.score >= PLAUSIBLE_SHARE * top)
    .slice(0, MAX_CANDIDATES)
    .map((c) => ({ ...c, score: c.score / top }));
  rate(candidates);
  return { ...base, candidates };
}

/** Confidence codes, from the relative scores (candidates sorted best first). */
function rate(candidates: SoundSpeedCandidate[]): void {
  const runnerUp = candidates[1]?.score ?? 0;
  candidates.forEach((c, i) => {
    const strongest = Math.max(...c.lines.map((l) => l.prominenceDb));
    if (strongest < FAINT_DB) c.confidence = 'faint';
    else if (i === 0) {
      if (runnerUp >= TIED_SHARE) c.confidence = 'tied';
      else if (runnerUp < CLEAR_SHARE && c.lines.length >= 2) c.confidence = 'clear';
      else c.confidence = 'likely';
    } else c.confidence = c.score >= TIED_SHARE ? 'tied' : 'possible';
  });
}

/** The harmonic sum: evidence per bin and the comb of orders a speed predicts. */
class Comb {
  private readonly evidence: Float64Array;
  private readonly orders: Array<{ order: number; weight: number; kind: 'pattern' | 'shaft' }>;
  private readonly binHz: number;
  private readonly floor: Float64Array;
  private readonly mask: Uint8Array;
  private readonly n: number;
  private readonly lowHz: number;
  private readonly highHz: number;

  constructor(spectrum: SoundSpectrum, mask: Uint8Array, n: number) {
    const { power, floor, binHz } = spectrum;
    this.binHz = binHz;
    this.floor = floor;
    this.mask = mask;
    this.n = n;
    this.lowHz = spectrum.minToneHz;
    this.highHz = spectrum.maxToneHz;
    // Evidence per bin: the largest amplitude within ±1 bin (a line between bins, or a grid
    // point a bin off), less ABSENT_FLOORS floor amplitudes; zero under hum.
    const last = power.length - 1;
    this.evidence = new Float64Array(power.length);
    for (let k = 1; k < last; k++) {
      if (mask[k]) continue;
      const p = Math.max(power[k - 1], power[k], power[k + 1]);
      this.evidence[k] = Math.sqrt(p) - ABSENT_FLOORS * Math.sqrt(floor[k]);
    }
    this.orders = [];
    for (let k = 1; k <= PATTERN_HARMONICS; k++) {
      this.orders.push({ order: k * n, weight: HARMONIC_DECAY ** (k - 1), kind: 'pattern' });
    }
    for (let m = 1; m <= SHAFT_ORDERS; m++) {
      if (m % n === 0) continue;
      this.orders.push({
        order: m,
        weight: SHAFT_WEIGHT * HARMONIC_DECAY ** (m - 1),
        kind: 'shaft',
      });
    }
  }

  /** The comb's orders, for matching lines. */
  get lineOrders() {
    return this.orders;
  }

  /** Harmonic-sum score of speed f (rev/s). */
  score(speedHz: number): number {
    let sum = 0;
    for (const { order, weight } of this.orders) {
      const x = order * speedHz;
      if (x < this.lowHz || x > this.highHz) continue;
      sum += weight * this.evidence[Math.round(x / this.binHz)];
    }
    return sum;
  }

  /**
   * The harmonic sum at a fitted speed, from the lines the fit kept, with two checks that a
   * plain harmonic sum lacks (in the spirit of the two-way mismatch of R. C. Maher & J. W.
   * Beauchamp, "Fundamental frequency estimation of musical signals using a two-way mismatch
   * procedure", J. Acoust. Soc. Am. 95(4), 1994: predicted lines that are missing, and
   * measured lines left unexplained, both count against):
   * - each kept line counts its amplitude less ABSENT_FLOORS floor amplitudes; every other
   *   order in the band counts as absent (at most zero);
   * - a hole in the blade-pass series (a pattern harmonic missing below a present one, the
   *   fundamental included) costs HOLE_SHARE of the next present harmonic's amplitude: a comb
   *   at half the speed finds every other harmonic missing;
   * - a line at a half or a third of the way between the comb's blade-pass lines (below its
   *   first one included), that the comb does not explain, costs UNEXPLAINED_SHARE of its
   *   amplitude: a comb at twice (three times) the speed leaves those lines of the true one
   *   unexplained. Lines elsewhere (another machine's) do not count.
   * Lines under hum are neither.
   */
  lineScore(speedHz: number, lines: FitLine[], peaks: SpectrumPeak[]): number {
    const pattern = lines.filter((l) => l.kind === 'pattern').sort((a, b) => a.order - b.order);
    let sum = 0;
    for (const { order, weight, kind } of this.orders) {
      const x = order * speedHz;
      if (x < this.lowHz || x > this.highHz) continue;
      const line = lines.find((l) => l.order === order);
      if (line) {
        sum += weight * (line.amplitude - ABSENT_FLOORS * Math.sqrt(this.floor[line.bin]));
        continue;
      }
      const bin = Math.round(x / this.binHz);
      if (this.mask[bin]) continue;
      sum += weight * Math.min(0, this.evidence[bin]);
      if (kind !== 'pattern') continue;
      const above = pattern.find((l) => l.order > order);
      if (above) sum -= weight * HOLE_SHARE * above.amplitude;
    }
    if (pattern.length === 0) return sum;
    const toneHz = this.n * speedHz;
    // From below the comb's first line (a line at half of it is the tell-tale of a comb at
    // twice the speed) to one step past its last.
    const lowest = 0.4 * toneHz;
    const highest = pattern[pattern.length - 1].hz + toneHz;
    for (const p of peaks) {
      if (p.hz <= lowest || p.hz >= highest || lines.some((l) => l.hz === p.hz)) continue;
      const ratio = p.hz / toneHz;
      const between = [2, 3].some((d) => {
        const j = Math.round(ratio * d);
        return j % d !== 0 && Math.abs(p.hz - (j / d) * toneHz) <= FRACTION_BINS * this.binHz;
      });
      if (between) sum -= UNEXPLAINED_SHARE * 10 ** (p.levelDb / 20);
    }
    return sum;
  }

  /** Highest order whose line lies in the band at speed f. */
  private topOrder(speedHz: number): number {
    let top = 1;
    for (const { order } of this.orders)
      if (order * speedHz <= this.highHz) top = Math.max(top, order);
    return top;
  }

  /**
   * Local maxima of the score over the range, on a grid fine enough that the highest line
   * in the band moves by at most one bin per step (the evidence spans ±1 bin).
   */
  seeds(range: Range): number[] {
    const maxOrder = Math.max(...this.orders.map((o) => o.order));
    const from = Math.max(range.minHz, this.lowHz / maxOrder);
    const to = Math.min(range.maxHz, this.highHz);
    if (!(from < to)) return [];
    // Grid size: Σ steps ≈ ∫ topOrder(f)/Δf df ≤ (maxOrder/Δf)·(to − from), and ≤ (high/Δf)·ln(to/from).
    const estimate = Math.min(
      (maxOrder / this.binHz) * (to - from),
      (this.highHz / this.binHz) * Math.log(to / from),
    );
    requireWorkable(
      estimate,
      'expected speed range',
      'speeds to test',
      'narrow the expected speed range',
      MAX_GRID_POINTS,
    );
    // The left sum of the steps exceeds that integral by at most the largest order.
    const room = Math.ceil(estimate) + maxOrder + 2;
    const speeds = new Float64Array(room);
    const scores = new Float64Array(room);
    let count = 0;
    let best = -Infinity;
    for (let f = from; f <= to && count < room; f += this.binHz / this.topOrder(f)) {
      speeds[count] = f;
      scores[count] = this.score(f);
      if (scores[count] > best) best = scores[count];
      count++;
    }
    if (!(best > 0)) return [];
    const maxima: Array<{ speedHz: number; score: number }> = [];
    for (let i = 0; i < count; i++) {
      if (i > 0 && scores[i] <= scores[i - 1]) continue;
      let j = i;
      while (j + 1 < count && scores[j + 1] === scores[i]) j++;
      if (j + 1 < count && scores[j + 1] > scores[i]) continue;
      if (scores[i] >= SEED_SHARE * best) {
        maxima.push({ speedHz: speeds[(i + j) >> 1], score: scores[i] });
      }
      i = j;
    }
    return maxima
      .sort((a, b) => b.score - a.score)
      .slice(0, MAX_SEEDS)
      .map((m) => m.speedHz);
  }
}

/** A line matched to a comb order while fitting, with its weight and tolerance. */
interface FitLine extends SoundLine {
  bin: number;
  amplitude: number;
  sigmaHz: number;
}

/**
 * Refines a seed speed by a weighted least-squares fit of x = order·f through the lines it
 * explains: lines are matched to the comb (±2 bins, then ±1.5 bins round the refined comb),
 * and a line whose residual exceeds three of its standard deviations (plus a tenth of a bin)
 * is dropped and the fit repeated, worst first, so that a comb cannot claim lines it only
 * passes near. Undefined when it explains no line.
 */
function fitLines(
  seedHz: number,
  peaks: SpectrumPeak[],
  binHz: number,
  comb: Comb,
): (Omit<SoundSpeedCandidate, 'score' | 'confidence'> & { fitted: FitLine[] }) | undefined {
  let speedHz = seedHz;
  let lines: FitLine[] = [];
  for (const windowBins of [2, 1.5]) {
    lines = matchLines(speedHz, peaks, windowBins * binHz, binHz, comb);
    if (lines.length === 0) return undefined;
    speedHz = leastSquares(lines).speedHz;
  }
  for (;;) {
    const fit = leastSquares(lines);
    speedHz = fit.speedHz;
    let worst = -1;
    let worstExcess = 1;
    lines.forEach((l, i) => {
      const excess = Math.abs(l.hz - l.order * speedHz) / (3 * l.sigmaHz + 0.1 * binHz);
      if (excess > worstExcess) [worst, worstExcess] = [i, excess];
    });
    if (worst < 0) break;
    lines.splice(worst, 1);
    if (lines.length === 0) return undefined;
  }
  const { sxx, chi2 } = leastSquares(lines);
  const scale = lines.length > 1 ? Math.max(1, chi2 / (lines.length - 1)) : 1;
  const precisionHz = 2 * Math.sqrt(scale / sxx);
  const strongest = lines.reduce((a, b) => (b.levelDb > a.levelDb ? b : a));
  const sumOf = (kind: 'pattern' | 'shaft') =>
    lines.filter((l) => l.kind === kind).reduce((sum, l) => sum + l.amplitude, 0);
  return {
    speedHz,
    precisionHz,
    basis: sumOf('pattern') >= sumOf('shaft') ? 'pattern' : 'shaft',
    toneHz: strongest.hz,
    lines: lines
      .map(({ hz, order, kind, levelDb, prominenceDb }) => ({
        hz,
        order,
        kind,
        levelDb,
        prominenceDb,
      }))
      .sort((a, b) => a.hz - b.hz),
    fitted: lines,
  };
}

/** The detected lines nearest each order of the comb at speedHz, within ±window Hz. */
function matchLines(
  speedHz: number,
  peaks: SpectrumPeak[],
  window: number,
  binHz: number,
  comb: Comb,
): FitLine[] {
  const lines: FitLine[] = [];
  for (const { order, kind } of comb.lineOrders) {
    const peak = nearestPeak(peaks, order * speedHz, window);
    if (!peak || lines.some((l) => l.hz === peak.hz)) continue;
    const snr = 10 ** (peak.prominenceDb / 10);
    const smearHz = Math.max(0, peak.widthHz - STEADY_SPAN_BINS * binHz);
    lines.push({
      hz: peak.hz,
      order,
      kind,
      levelDb: peak.levelDb,
      prominenceDb: peak.prominenceDb,
      bin: peak.bin,
      amplitude: 10 ** (peak.levelDb / 20),
      sigmaHz:
        binHz * (LINE_SIGMA_FLOOR_BINS + LINE_SIGMA_NOISE_BINS / Math.sqrt(snr)) +
        LINE_SIGMA_SMEAR * smearHz,
    });
  }
  return lines;
}

/** Weighted least squares of x = order·f, weights 1/σ². */
function leastSquares(lines: FitLine[]): { speedHz: number; sxx: number; chi2: number } {
  let sxy = 0;
  let sxx = 0;
  for (const l of lines) {
    const w = 1 / (l.sigmaHz * l.sigmaHz);
    sxy += w * l.order * l.hz;
    sxx += w * l.order * l.order;
  }
  const speedHz = sxy / sxx;
  let chi2 = 0;
  for (const l of lines) chi2 += ((l.hz - l.order * speedHz) / l.sigmaHz) ** 2;
  return { speedHz, sxx, chi2 };
}

/** The detected line nearest x within ±window Hz (peaks sorted by frequency). */
function nearestPeak(peaks: SpectrumPeak[], x: number, window: number): SpectrumPeak | undefined {
  let lo = 0;
  let hi = peaks.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (peaks[mid].hz < x) lo = mid + 1;
    else hi = mid;
  }
  let best: SpectrumPeak | undefined;
  for (const i of [lo - 1, lo]) {
    const p = peaks[i];
    if (p && Math.abs(p.hz - x) <= window && (!best || Math.abs(p.hz - x) < Math.abs(best.hz - x)))
      best = p;
  }
  return best;
}
