// Kept whole (over 300 lines): the grid, the exact alias edges and the column builder that
// inserts them share one invariant (each edge inside its grid step, in rate order), and this is
// a hot path measured by `npm run bench`.
import { InputError, requireFiniteResult } from '../basics/InputError';
import { lockRates, type LockRate } from './lockRates';
import { rateBands, type RateBand } from './rateBands';
import { checkLookOptions, type LookOptions } from './lookOptions';
import { checkSampler, type Part, type Range, type Sampler } from '../basics/types';

export interface RateMapOptions extends Partial<LookOptions> {
  /** Rates on the even grid across the range, ends included; breaks and lock points are added. Default 2000. */
  points?: number;
  /** Space the grid evenly in log(rate) instead of rate. Default false. */
  log?: boolean;
  /** Which locks and bands apply (docs/physics.md §3–§4). Default 'flash'. */
  sampler?: Sampler;
}

/** The rate map's data, in columns. */
export interface RateMapSeries {
  /**
   * Sampler rates, Hz, non-decreasing. An alias edge of a part appears three times in a row:
   * the speed just below the edge, a gap, the speed just above.
   */
  rates: Float64Array;
  /**
   * Per part (in the order given), apparent speed in rpm at each rate, signed as the true speed.
   * NaN marks a gap: the chart adapter must turn it into its own gap value (null for uPlot)
   * and must not join the points on either side.
   */
  apparentRpm: Float64Array[];
  /**
   * Per part, its lock-in rates from lockRates, ascending, as far down as markers can be told
   * apart: single images from resolvedFromHz up; several images (up to maxImages under a
   * flash; none for 'frames') from where the closest of them are a grid step apart.
   */
  locks: LockRate[][];
  /** Safe and misleading bands for all parts together (rateBands). */
  bands: RateBand[];
  /**
   * Per part, the rate above which every tooth of its sawtooth is drawn with exact ends. Below
   * it some grid step holds two or more alias edges: there the part's series keeps exact values
   * on the grid, separated by gaps, so it reads as a scatter filling ±rate/(2·features).
   * Equals the range's low end when every tooth is resolved.
   */
  resolvedFromHz: number[];
}

export const defaultRateMapPoints = 2000;
/** Largest grid accepted: more points than any screen has pixels across, several times over. */
export const MAX_RATE_MAP_POINTS = 100_000;

/**
 * The rate map: each part's apparent speed (rpm) against the sampler's rate over a range,
 * as chart columns, with its lock-in rates and the safe and misleading bands (docs/physics.md §2–§4).
 *
 * The apparent speed is apparentMotion's single-image speed a = e·s/n with e = r − round(r),
 * r = n·f/s: a sawtooth in s that jumps where |r| = k + ½, that is at s = n·|f|/(k + ½)
 * (k = 0 is twice the pattern frequency; above it the speed is true). Each such edge inside a
 * grid step is inserted at its exact rate with the limits from both sides and a gap between,
 * so the chart breaks the line instead of drawing a vertical jump. Between edges a tooth is a
 * straight line in s (a = (n·f − k·s)/n), so the grid loses nothing on a linear axis; the
 * single-image lock rates s = n·|f|/p, where the line crosses zero, are inserted too so the
 * line meets each lock marker exactly on a log axis as well.
 *
 * Units: parts in rev/s, rates in Hz, output speeds in rpm (60 × rev/s).
 * Throws InputError for an empty part list, a bad part or range, an unknown sampler, bad look
 * options, or points not a whole number from 2 to 100 000.
 *
 * @example
 * // Wikipedia, "Stroboscopic effect": a disc at 60 rev/s under 61 flashes/s seems to turn
 * // backwards at 1 rev/s (−60 rpm).
 * const map = rateMapSeries([{ speedHz: 60, symmetry: 1 }], { minHz: 61, maxHz: 200 }, { points: 2 });
 * map.rates[0] // 61
 * map.apparentRpm[0][0] // -60.000000000000064 (−60 rpm to rounding)
 * map.apparentRpm[0][map.rates.length - 1] // 3600 (above 120 flashes/s the true speed)
 */
export function rateMapSeries(parts: Part[], range: Range, opts?: RateMapOptions): RateMapSeries {
  const points = opts?.points ?? defaultRateMapPoints;
  if (!Number.isInteger(points) || points < 2 || points > MAX_RATE_MAP_POINTS) {
    throw new InputError(
      'points',
      `The rate map needs a whole number of points from 2 to ${MAX_RATE_MAP_POINTS} (got ${typeof points === 'number' ? points : typeof points}).`,
    );
  }
  const log = opts?.log ?? false;
  if (typeof log !== 'boolean')
    throw new InputError('log', 'The rate axis is either logarithmic (true) or linear (false).');
  const sampler = checkSampler(opts?.sampler);
  const look = checkLookOptions(opts);

  // rateBands checks every part and the range and throws InputError naming the bad one.
  const bands = rateBands(parts, range, { ...look, sampler });
  const { minHz, maxHz } = range;
  // Pitches per sample at the lowest rate must be a number: a part at 10 rev/s seen at
  // 1e-320 Hz would overflow every apparent speed on the map.
  for (const part of parts) {
    requireFiniteResult(
      (part.symmetry * Math.abs(part.speedHz) * (1 + (part.tolerance ?? 0))) / minHz,
      'lowest rate',
    );
  }
  const grid = rateGrid(minHz, maxHz, points, log);
  // Room for the grid and two more entries a step (an edge adds three, a lock one); the
  // columns grow if a map needs more.
  const columns = new SeriesBuilder(parts, grid.length * 3);
  for (let i = 0; i + 1 < grid.length; i++) {
    columns.gridPoint(grid[i]);
    columns.between(grid[i], grid[i + 1], log);
  }
  columns.gridPoint(grid[grid.length - 1]);
  const { rates, apparentRpm, resolvedFromHz } = columns.finish();

  const maxImages = sampler === 'frames' ? 1 : look.maxImages;
  // The ratio of one grid step (log) from logarithms: maxHz/minHz itself can overflow.
  const step = log
    ? Math.expm1((Math.log(maxHz) - Math.log(minHz)) / (points - 1))
    : (maxHz - minHz) / (points - 1);
  const locks = parts.map((part, j) => {
    const from = resolvedFromHz[j];
    if (from >= maxHz) return [];
    // Locks of up to Q images lie 1/Q² apart in n·f/s at the closest, so 1/Q² of a tooth:
    // below `crowd` they come closer than a grid step, and only single images are kept.
    const F = part.symmetry * Math.abs(part.speedHz);
    const spread = F * maxImages * maxImages;
    const crowd = Math.min(maxHz, Math.max(from, log ? spread * step : Math.sqrt(spread * step)));
    const single =
      crowd > from
        ? lockRates(part, { minHz: from, maxHz: crowd }, { maxImages: 1 }).filter(
            (l) => l.rateHz < crowd,
          )
        : [];
    return crowd < maxHz
      ? single.concat(lockRates(part, { minHz: crowd, maxHz }, { maxImages }))
      : single;
  });
  return { rates, apparentRpm, locks, bands, resolvedFromHz };
}

/**
 * `points` rates from minHz to maxHz, both ends exact, evenly spaced in rate or in log(rate).
 * Written so that no intermediate overflows, however far apart the ends (1e-300 to 1e300 Hz).
 */
function rateGrid(minHz: number, maxHz: number, points: number, log: boolean): Float64Array {
  const grid = new Float64Array(points);
  const last = points - 1;
  const logMin = Math.log(minHz);
  const logSpan = Math.log(maxHz) - logMin;
  const ratio = maxHz / minHz;
  for (let i = 0; i <= last; i++) {
    const t = i / last;
    grid[i] = log
      ? Number.isFinite(ratio)
        ? minHz * Math.pow(ratio, t)
        : Math.exp(logMin + logSpan * t)
      : minHz + (maxHz - minHz) * t;
  }
  grid[0] = minHz;
  grid[last] = maxHz;
  return grid;
}

const EDGE = 0;
const LOCK = 1;
const GAP = 2;
const STEP_PLAIN = 0;
const STEP_CROWDED = 1;
const STEP_EDGE_AHEAD = 2;
const STEP_EDGE_PASSED = 3;
/** Events one part can add inside one grid step: one edge and the two locks beside it, or one gap. */
const EVENTS_PER_PART = 3;

/**
 * Appends rates and apparent speeds column by column. Columns grow by doubling and are cut to
 * length at the end; one map is a few thousand entries a part.
 */
class SeriesBuilder {
  private readonly count: number;
  private readonly patternHz: Float64Array;
  private readonly features: Float64Array;
  private readonly speedHz: Float64Array;
  private rates: Float64Array;
  private speeds: Float64Array[];
  private length = 0;
  /** Per part, what the current grid step holds of its edges: one of the STEP_ values. */
  private readonly stepState: Uint8Array;
  /** Per part, the bin k of its one edge in the current step (edge at n·|f|/(k + ½)). */
  private readonly edgeBin: Float64Array;
  private readonly resolvedFromHz: number[];
  /** Events inside the current grid step, kept in rate order. */
  private readonly eventRate: Float64Array;
  private readonly eventKind: Uint8Array;
  private readonly eventPart: Int32Array;
  private events = 0;

  constructor(parts: Part[], capacity: number) {
    this.count = parts.length;
    this.patternHz = Float64Array.from(parts, (p) => p.symmetry * Math.abs(p.speedHz));
    this.features = Float64Array.from(parts, (p) => p.symmetry);
    this.speedHz = Float64Array.from(parts, (p) => p.speedHz);
    this.rates = new Float64Array(capacity);
    this.speeds = parts.map(() => new Float64Array(capacity));
    this.stepState = new Uint8Array(parts.length);
    this.edgeBin = new Float64Array(parts.length);
    this.resolvedFromHz = parts.map(() => -Infinity);
    this.eventRate = new Float64Array(parts.length * EVENTS_PER_PART);
    this.eventKind = new Uint8Array(parts.length * EVENTS_PER_PART);
    this.eventPart = new Int32Array(parts.length * EVENTS_PER_PART);
  }

  /** A grid rate: every part's speed there; on an edge exactly, the speed just below it. */
  gridPoint(rate: number): void {
    const at = this.grow();
    this.rates[at] = rate;
    for (let j = 0; j < this.count; j++) {
      const k = this.patternHz[j] / rate - 0.5;
      this.speeds[j][at] =
        k >= 0 && k === Math.floor(k)
          ? -this.halfJumpRpm(j, rate)
          : apparentRpm(this.speedHz[j], this.features[j], rate);
    }
  }

  /**
   * A rate inside the current grid step: `gapPart` (−1 for none) and crowded parts get a gap;
   * a part with one edge in the step is read on the tooth before or after it, so a rate that
   * ties with its edge in floating point still lands on the right side of the jump.
   */
  private insidePoint(rate: number, gapPart: number): void {
    const at = this.grow();
    this.rates[at] = rate;
    for (let j = 0; j < this.count; j++) {
      const state = this.stepState[j];
      let v: number;
      if (j === gapPart || state === STEP_CROWDED) v = NaN;
      else if (state === STEP_EDGE_AHEAD)
        v = rpmOnTooth(this.speedHz[j], this.features[j], rate, this.edgeBin[j] + 1);
      else if (state === STEP_EDGE_PASSED)
        v = rpmOnTooth(this.speedHz[j], this.features[j], rate, this.edgeBin[j]);
      else v = apparentRpm(this.speedHz[j], this.features[j], rate);
      this.speeds[j][at] = v;
    }
  }

  /** Half the jump at an alias edge, signed as the speed, rpm: s/(2n) rev/s. */
  private halfJumpRpm(j: number, rate: number): number {
    return (Math.sign(this.speedHz[j]) * 0.5 * rate * 60) / this.features[j];
  }

  /**
   * The alias edges in [a, b) and single-image locks in (a, b), in rate order. A part with one
   * edge here gets it exactly; a part with two or more gets one gap, since no chart could show
   * its teeth at this grid step.
   */
  between(a: number, b: number, log: boolean): void {
    this.events = 0;
    for (let j = 0; j < this.count; j++) {
      const F = this.patternHz[j];
      this.stepState[j] = STEP_PLAIN;
      if (F === 0) continue;
      const overA = F / a;
      const overB = F / b;
      // Edges s = F/(k + ½) in [a, b)  ⇔  k in (F/b − ½, F/a − ½].
      const kLow = Math.floor(overB - 0.5) + 1;
      const kHigh = Math.floor(overA - 0.5);
      // Past 2^53 pitches a sample, k + 1 equals k: as crowded as can be.
      if (kHigh > kLow || !(overA < Number.MAX_SAFE_INTEGER)) {
        this.stepState[j] = STEP_CROWDED;
        if (this.resolvedFromHz[j] < b) this.resolvedFromHz[j] = b;
        this.add(log ? Math.sqrt(a) * Math.sqrt(b) : a + (b - a) / 2, GAP, j);
        continue;
      }
      if (kHigh === kLow) {
        this.stepState[j] = STEP_EDGE_AHEAD;
        this.edgeBin[j] = kLow;
        this.add(clamp(F / (kLow + 0.5), a, b), EDGE, j);
      }
      // Single-image locks s = F/p in (a, b)  ⇔  p in (F/b, F/a), p ≥ 1.
      const pHigh = Math.ceil(overA) - 1;
      for (let p = Math.max(1, Math.floor(overB) + 1); p <= pHigh; p++)
        this.add(clamp(F / p, a, b), LOCK, j);
    }
    for (let e = 0; e < this.events; e++)
      this.emit(this.eventRate[e], this.eventKind[e], this.eventPart[e]);
  }

  private add(rate: number, kind: number, part: number): void {
    // Insertion sort: a step holds a handful of events at most.
    let i = this.events++;
    while (i > 0 && this.eventRate[i - 1] > rate) {
      this.eventRate[i] = this.eventRate[i - 1];
      this.eventKind[i] = this.eventKind[i - 1];
      this.eventPart[i] = this.eventPart[i - 1];
      i--;
    }
    this.eventRate[i] = rate;
    this.eventKind[i] = kind;
    this.eventPart[i] = part;
  }

  private emit(rate: number, kind: number, part: number): void {
    if (kind !== EDGE) {
      this.insidePoint(rate, kind === GAP ? part : -1);
      return;
    }
    // Crossing upward in rate, |r| falls through k + ½: the step goes from −½ to +½ (times the
    // sign of the speed), so the speed jumps from −s/2n to +s/2n.
    const half = this.halfJumpRpm(part, rate);
    this.insidePoint(rate, -1);
    this.speeds[part][this.length - 1] = -half;
    this.insidePoint(rate, part);
    this.stepState[part] = STEP_EDGE_PASSED;
    this.insidePoint(rate, -1);
    this.speeds[part][this.length - 1] = half;
  }

  /** Room for one more entry; returns its index. */
  private grow(): number {
    const at = this.length++;
    if (at === this.rates.length) {
      this.rates = resize(this.rates, at * 2);
      this.speeds = this.speeds.map((c) => resize(c, at * 2));
    }
    return at;
  }

  finish(): Pick<RateMapSeries, 'rates' | 'apparentRpm' | 'resolvedFromHz'> {
    const rates = this.rates.slice(0, this.length);
    return {
      rates,
      apparentRpm: this.speeds.map((c) => c.slice(0, this.length)),
      resolvedFromHz: this.resolvedFromHz.map((r) => (r === -Infinity ? rates[0] : r)),
    };
  }
}

/** Apparent speed at rate s, rpm: the expression apparentMotion uses, so the two agree bit for bit. */
function apparentRpm(speedHz: number, features: number, s: number): number {
  const ratio = (features * speedHz) / s;
  let step = ratio - Math.round(ratio);
  if (step > 0.5) step = 0.5;
  else if (step < -0.5) step = -0.5;
  return ((step * s) / features) * 60;
}

/** Apparent speed at rate s on the tooth of bin m (|n·f/s| rounded to m), rpm. */
function rpmOnTooth(speedHz: number, features: number, s: number, m: number): number {
  const ratio = (features * speedHz) / s;
  return (((ratio - Math.sign(speedHz) * m) * s) / features) * 60;
}

function resize(column: Float64Array, size: number): Float64Array {
  const out = new Float64Array(size);
  out.set(column);
  return out;
}

function clamp(v: number, lo: number, hi: number): number {
  return v < lo ? lo : v > hi ? hi : v;
}
