/**
 * A brute-force stroboscope for the tests (no test cases here).
 *
 * It replays where a turning pattern stands at each sample, with exact fractions (BigInt),
 * and reads the view off that replay the way docs/physics.md §2–§3 says an observer does:
 * - each feature is matched to the nearest feature of the next sample (the perceived step);
 * - the view is faithful when that nearest feature is the very feature that moved there;
 * - under a flash, flashes q apart form a group of q images; the group looks still when its
 *   members come back to (almost) the same place, slower than the still threshold.
 *
 * It shares no code and no closed form with src/core: the core computes round(n·f/s) and
 * friends in floating point; this replays positions and compares them. Every double is an
 * exact binary fraction, so the replay sees exactly the numbers the core is given, and its
 * answer is the exact answer for those numbers.
 */

// ---------------------------------------------------------------- exact fractions

/** num/den with den > 0. Not kept in lowest terms: every comparison cross-multiplies. */
export interface Fraction {
  readonly num: bigint;
  readonly den: bigint;
}

export function frac(num: bigint | number, den: bigint | number = 1n): Fraction {
  let n = BigInt(num);
  let d = BigInt(den);
  if (d === 0n) throw new Error('simulator: zero denominator');
  if (d < 0n) {
    n = -n;
    d = -d;
  }
  return { num: n, den: d };
}

/** The exact value of a finite double: doubling is exact until the value is a whole number. */
export function exactValue(x: number): Fraction {
  if (!Number.isFinite(x)) throw new Error(`simulator: ${x} is not a finite number`);
  let v = x;
  let den = 1n;
  while (!Number.isInteger(v)) {
    v *= 2;
    den *= 2n;
  }
  return { num: BigInt(v), den };
}

export const plus = (a: Fraction, b: Fraction): Fraction => ({
  num: a.num * b.den + b.num * a.den,
  den: a.den * b.den,
});
export const minus = (a: Fraction, b: Fraction): Fraction => ({
  num: a.num * b.den - b.num * a.den,
  den: a.den * b.den,
});
export const times = (a: Fraction, b: Fraction): Fraction => ({
  num: a.num * b.num,
  den: a.den * b.den,
});
export const over = (a: Fraction, b: Fraction): Fraction => frac(a.num * b.den, a.den * b.num);
export const negate = (a: Fraction): Fraction => ({ num: -a.num, den: a.den });
export const absolute = (a: Fraction): Fraction => ({
  num: a.num < 0n ? -a.num : a.num,
  den: a.den,
});
export const signOf = (a: Fraction): -1 | 0 | 1 => (a.num > 0n ? 1 : a.num < 0n ? -1 : 0);
export const compare = (a: Fraction, b: Fraction): -1 | 0 | 1 => signOf(minus(a, b));

/** Nearest double, to a couple of units in the last place (ample for test tolerances). */
export function toNumber(a: Fraction): number {
  let { num, den } = a;
  // Exact values of tiny doubles have denominators up to 2^1074: drop the same number of
  // low bits from both parts so that each converts to a finite double.
  const excess = Math.max(bitLength(num), bitLength(den)) - 1000;
  if (excess > 0) {
    num >>= BigInt(excess);
    den >>= BigInt(excess);
  }
  if (den === 0n) throw new Error('simulator: fraction too large to show as a number');
  // Whole part and remainder separately, so that whole numbers convert exactly.
  const whole = num / den;
  const value = Number(whole) + Number(num - whole * den) / Number(den);
  if (!Number.isFinite(value)) throw new Error('simulator: fraction too large to show as a number');
  return value;
}

function bitLength(x: bigint): number {
  return (x < 0n ? -x : x).toString(16).length * 4;
}

/** a mod m in [0, m), m > 0. */
function modulo(a: bigint, m: bigint): bigint {
  const r = a % m;
  return r < 0n ? r + m : r;
}

// ---------------------------------------------------------------- what the eye tolerates

export type Sampler = 'flash' | 'frames';
export type Look = 'true' | 'forward' | 'backward' | 'still' | 'unclear';

/** The observer's thresholds, exact. */
export interface Eye {
  /** Drift slower than this (rev/s) looks still. */
  stillHz: Fraction;
  /** A step of at least this many pitches per sample: direction unclear. */
  unclearStep: Fraction;
  /** Largest group of images looked for. */
  maxImages: number;
  /** A creeping group of q images is still seen as q images below this many image spacings per second. */
  groupSpacingsPerS: Fraction;
  /** An aliased view seen moving slower than this (rev/s) is nearly still (docs/physics.md §4). */
  nearlyStillHz: Fraction;
}

/**
 * The defaults documented in docs/physics.md §2–§4 and src/core/physics/lookOptions.ts: still at or below
 * 0.25 rpm = 1/240 rev/s, direction unclear from 0.45 pitch per sample, up to 8 images,
 * a creeping group still counted as images below 1 image spacing per second, nearly still
 * below 6 rpm = 1/10 rev/s.
 */
export const documentedEye: Eye = Object.freeze({
  stillHz: frac(1, 240),
  unclearStep: frac(45, 100),
  maxImages: 8,
  groupSpacingsPerS: frac(1),
  nearlyStillHz: frac(1, 10),
});

/** Thresholds given as doubles (as the core receives them), taken exactly. */
export function eyeFrom(o: {
  stillHz: number;
  unclearStep: number;
  maxImages: number;
  groupSpacingsPerS: number;
  nearlyStillHz: number;
}): Eye {
  return {
    stillHz: exactValue(o.stillHz),
    unclearStep: exactValue(o.unclearStep),
    maxImages: o.maxImages,
    groupSpacingsPerS: exactValue(o.groupSpacingsPerS),
    nearlyStillHz: exactValue(o.nearlyStillHz),
  };
}

// ---------------------------------------------------------------- the replay

/** A part (speed rev/s, signed; symmetry features) seen by a sampler at a rate (Hz). */
export interface Scene {
  speedHz: Fraction;
  symmetry: number;
  rateHz: Fraction;
  sampler: Sampler;
}

/** A scene given in doubles, taken exactly. */
export function sceneOf(
  speedHz: number,
  symmetry: number,
  rateHz: number,
  sampler: Sampler = 'flash',
): Scene {
  return { speedHz: exactValue(speedHz), symmetry, rateHz: exactValue(rateHz), sampler };
}

/** A move from one position to the nearest feature of a later sample, in Q-ths of a pitch. */
interface Match {
  move: bigint;
  /** Two features were equally near (exactly half a pitch away): the eye cannot choose. */
  tie: boolean;
}

/**
 * Positions of the pattern at successive samples t_j = j/s, modulo one pitch.
 * The mark travels f/s rev per sample, i.e. n·f/s = P/Q pitches; at sample j the pattern's
 * phase is (j·P mod Q)/Q of a pitch, exactly.
 */
export class PatternReplay {
  readonly P: bigint;
  readonly Q: bigint;

  constructor(readonly scene: Scene) {
    const { speedHz: f, symmetry: n, rateHz: s } = scene;
    if (!Number.isInteger(n) || n < 1)
      throw new Error('simulator: symmetry must be a whole number ≥ 1');
    if (signOf(s) <= 0) throw new Error('simulator: rate must be > 0');
    const travel = over(times(frac(n), f), s); // pitches travelled by the pattern per sample
    this.P = travel.num;
    this.Q = travel.den;
  }

  /** Phase of the pattern at sample j, in Q-ths of a pitch, in [0, Q). */
  position(j: number): bigint {
    return modulo(BigInt(j) * this.P, this.Q);
  }

  /**
   * The eye's match: from a feature at `from`, the nearest of the features at `to` + i pitches
   * (i any whole number; only i ∈ {−1, 0, 1} can be nearest since both lie in [0, Q)).
   */
  match(from: bigint, to: bigint): Match {
    const Q = this.Q;
    const candidates = [to - Q - from, to - from, to + Q - from];
    const size = (x: bigint) => (x < 0n ? -x : x);
    candidates.sort((a, b) => (size(a) < size(b) ? -1 : size(a) > size(b) ? 1 : 0));
    return { move: candidates[0], tie: size(candidates[0]) === size(candidates[1]) };
  }

  /** The perceived step between samples j and j + 1; the same for every j (checked over a few). */
  perceivedStep(): Match {
    const first = this.match(this.position(0), this.position(1));
    for (let j = 1; j < 4; j++) {
      const next = this.match(this.position(j), this.position(j + 1));
      if (next.move !== first.move && !(first.tie && next.tie))
        throw new Error('simulator: uneven replay');
    }
    return first;
  }

  /** Where the group made of every q-th flash has moved after one cycle of q flashes. */
  groupMove(q: number): Match {
    return this.match(this.position(1), this.position(1 + q));
  }

  /** The q-image group's drift, rev/s: its move (pitches → rev) over the q/s seconds of a cycle. */
  groupDriftHz(q: number): Fraction {
    const { symmetry: n, rateHz: s } = this.scene;
    return frac(this.groupMove(q).move * s.num, this.Q * BigInt(n) * BigInt(q) * s.den);
  }

  /**
   * How many of its own spacings (1/q pitch) the q-image group creeps per second:
   * it moves |move|/Q pitch = |move|·q/Q spacings per cycle, and there are s/q cycles per second.
   */
  groupCreepSpacingsPerS(q: number): Fraction {
    const move = this.groupMove(q).move;
    const s = this.scene.rateHz;
    return frac((move < 0n ? -move : move) * s.num, this.Q * s.den);
  }

  /**
   * The q flashes of a cycle land on q distinct places, not on fewer places visited twice:
   * if they repeated after a proper divisor d of q, the d-cycle would already carry the
   * q-cycle's move in proportion (move_d·q = move_q·d).
   */
  groupIsDistinct(q: number): boolean {
    const moveQ = this.groupMove(q).move;
    for (let d = 1; d < q; d++) {
      if (q % d === 0 && this.groupMove(d).move * BigInt(q) === moveQ * BigInt(d)) return false;
    }
    return true;
  }

  /** The q-image group: whole pitches per cycle (|p|, from the replayed move) and its drift. */
  group(q: number): { p: bigint; q: number; driftHz: Fraction } {
    const p = (BigInt(q) * this.P - this.groupMove(q).move) / this.Q; // exact: whole pitches
    return { p: p < 0n ? -p : p, q, driftHz: this.groupDriftHz(q) };
  }

  /** Number of distinct places the pattern takes over the first `flashes` samples. */
  distinctPositions(flashes: number): number {
    const seen = new Set<bigint>();
    for (let j = 0; j < flashes; j++) seen.add(this.position(j));
    return seen.size;
  }
}

/** What the replay shows, exactly. */
export interface ReplayView {
  /** Pitches the pattern truly travels per sample (unwrapped). */
  ratio: Fraction;
  /** Perceived step per sample, pitches (nearest-neighbour match). */
  step: Fraction;
  /** The step is exactly half a pitch: either sign is as near. */
  stepIsTie: boolean;
  /** Whole pitches the eye sees skipped per sample: ratio − step, a whole number. */
  wholePitches: bigint;
  /** Signed apparent speed, rev/s, from the perceived step. */
  apparentHz: Fraction;
  /** The nearest feature is the very feature that moved there. */
  faithful: boolean;
  /** Images seen at once (flash: the still or creeping group; frames: always 1). */
  images: number;
  look: Look;
  /**
   * Aliased (look not 'true') and seen moving slower than the nearly-still threshold: the
   * reported group's drift (the single image's apparent speed when q = 1). Still is nearly still.
   */
  nearlyStill: boolean;
  /**
   * The group reported: the still or creeping group of q images, else the single image (q = 1).
   * Its flashes land p whole pitches on per cycle of q (p/q is the lock), and it drifts at
   * driftHz rev/s (the single image: its apparent speed).
   */
  group: { p: bigint; q: number; driftHz: Fraction };
}

/**
 * Replays the scene and reads the look with the precedence of docs/physics.md §2:
 * a still group of q ≤ maxImages images (frames: q = 1 only) reads 'still'; otherwise a
 * faithful view reads 'true'; otherwise the single-image step reads 'unclear' (≥ unclearStep
 * pitch), 'forward' (same sign as the speed) or 'backward'.
 */
export function replay(scene: Scene, eye: Eye = documentedEye): ReplayView {
  return read(scene, eye);
}

function read(scene: Scene, eye: Eye): ReplayView {
  const film = new PatternReplay(scene);
  const { symmetry: n, rateHz: s, speedHz: f } = scene;
  const Q = film.Q;

  const first = film.perceivedStep();
  const step = frac(first.move, Q);
  const apparentHz = frac(first.move * s.num, Q * BigInt(n) * s.den);
  // The physical feature travels P (in Q-ths of a pitch); faithful when the eye picks exactly it.
  const faithful = !first.tie && first.move === film.P;
  const wholePitches = (film.P - first.move) / Q; // exact: the match moves by whole pitches
  const base = {
    ratio: frac(film.P, Q),
    step,
    stepIsTie: first.tie,
    wholePitches,
    apparentHz,
    faithful,
  };

  // docs/physics.md §3: of the groups whose drift is at or below the still threshold, the one with
  // the smallest drift stands still; ties go to the smaller q (a group of 2q flashes near p/q
  // drifts exactly as the group of q, so it never beats it).
  const stillUpTo = scene.sampler === 'flash' ? eye.maxImages : 1;
  let still: { q: number; drift: Fraction } | undefined;
  for (let q = 1; q <= stillUpTo; q++) {
    const drift = absolute(film.groupDriftHz(q));
    if (compare(drift, eye.stillHz) <= 0 && (!still || compare(drift, still.drift) < 0)) {
      still = { q, drift };
    }
  }
  if (still) {
    return {
      ...base,
      images: still.q,
      look: 'still',
      nearlyStill: true,
      group: film.group(still.q),
    };
  }

  let images = 1;
  let group = { p: wholePitches < 0n ? -wholePitches : wholePitches, q: 1, driftHz: apparentHz };
  if (scene.sampler === 'flash') {
    for (let q = 2; q <= eye.maxImages; q++) {
      if (
        compare(film.groupCreepSpacingsPerS(q), eye.groupSpacingsPerS) < 0 &&
        film.groupIsDistinct(q)
      ) {
        images = q;
        group = film.group(q);
        break;
      }
    }
  }
  if (faithful) return { ...base, images, group, look: 'true', nearlyStill: false };
  // The nearest double of max(nearlyStillHz, stillHz): nothing slower than still is "nearly" still.
  const nearlyBelow =
    compare(eye.nearlyStillHz, eye.stillHz) >= 0 ? eye.nearlyStillHz : eye.stillHz;
  const nearlyStill = compare(absolute(group.driftHz), nearlyBelow) < 0;
  if (compare(absolute(step), eye.unclearStep) >= 0) {
    return { ...base, images, group, look: 'unclear', nearlyStill };
  }
  const look = signOf(step) === signOf(f) ? 'forward' : 'backward';
  return { ...base, images, group, look, nearlyStill };
}

/**
 * docs/physics.md §4's safe view: faithful, or forward with one image at or above the nearly-still
 * threshold. Everything else (still, nearly still, backward, unclear, several images) misleads.
 */
export function safeView(view: ReplayView): boolean {
  return (
    view.look === 'true' || (view.look === 'forward' && view.images === 1 && !view.nearlyStill)
  );
}
