// The per-pixel loops of the preview and the closed-form coverage they call. They share one
// module on purpose: a call across modules in a hot loop can cost a property lookup per call
// under some loaders (Vitest's transform among them), and these run ~10⁶ times a frame.
import type { PixelTables } from './pixelTables';

// Closed-form coverage of a periodic row of blades, the heart of the analytic preview.
//
// Measure angles in pitches (one pitch = 360°/n). Blades occupy [k, k + duty] for every whole
// k. The blade length inside [0, X] is
//     covered(X) = floor(X)·duty + min(X − floor(X), duty),
// so the share of any interval [a, b] that blades cover, which is what a pixel integrates while
// the part sweeps past it during an exposure, is (covered(b) − covered(a)) / (b − a).
// An exposure of a whole number of pitches therefore gives exactly `duty` everywhere: the even
// ring of a long exposure (docs/physics.md §5).

/**
 * Blade length inside [0, x], in pitches, for blades of width `duty` (0…1 pitch) at every whole number.
 * @example coveredUpTo(2.5, 0.25) // 0.75 (two whole blades and a quarter-pitch one)
 */
export function coveredUpTo(x: number, duty: number): number {
  const whole = Math.floor(x);
  const rest = x - whole;
  return whole * duty + (rest < duty ? rest : duty);
}

/**
 * Share (0…1) of the interval [a, b] (pitches, a < b) covered by blades of width `duty`.
 * @example sweptCoverage(0.1, 1.1, 0.3) // 0.3: a sweep of one whole pitch averages to the duty
 */
export function sweptCoverage(a: number, b: number, duty: number): number {
  return (coveredUpTo(b, duty) - coveredUpTo(a, duty)) / (b - a);
}

/**
 * sweptCoverage for a short interval [a, a + length], length ≤ 1 pitch, with one floor
 * instead of two: the interval meets at most the blade it starts in and the next one.
 * This is the inner step of every pixel, so it is kept branch-light.
 * @example shortCoverage(0.9, 0.2, 0.3) // 0.5: [0.9, 1.1] meets the next blade for 0.1 of its 0.2
 */
export function shortCoverage(a: number, length: number, duty: number): number {
  const start = a - Math.floor(a);
  const end = start + length;
  let covered = (end < duty ? end : duty) - start;
  if (covered < 0) covered = 0;
  if (end > 1) {
    const over = end - 1;
    covered += over < duty ? over : duty;
  }
  return covered / length;
}

/**
 * Frames and the true view. Row y's exposure starts at startTurns + readoutTurns·(y + ½)/H
 * and sweeps sweepTurns; each pixel gets the covered share of what passed over it.
 */
export function drawSwept(
  tables: PixelTables,
  words: Int32Array,
  colour: Float64Array,
  n: number,
  duty: number,
  startTurns: number,
  readoutTurns: number,
  sweepTurns: number,
): void {
  const { width, height, angleTurns, pixelTurns, ringWeight, hubWeight } = tables;
  const markDuty = duty / n; // blade 0 alone, in turns: one blade per turn
  const sweep = Math.abs(sweepTurns);
  // The pixel angle u = φ − θ(t) falls from u0 to u0 − sweepTurns over the exposure.
  const back = sweepTurns > 0 ? sweepTurns : 0;
  for (let y = 0; y < height; y++) {
    const rowTurns = startTurns + (readoutTurns * (y + 0.5)) / height;
    const rowStart = rowTurns - Math.floor(rowTurns) + back;
    let i = y * width;
    for (let x = 0; x < width; x++, i++) {
      const ring = ringWeight[i];
      let blade = 0;
      let mark = 0;
      if (ring > 0) {
        let a = angleTurns[i] - rowStart;
        let len = sweep;
        const px = pixelTurns[i];
        if (len < px) {
          a -= (px - len) / 2;
          len = px;
        }
        blade = coverage(a * n, len * n, duty) * ring;
        if (blade > 0) mark = coverage(a, len, markDuty) * ring;
      }
      words[i] = mix(colour, blade, mark, hubWeight[i]);
    }
  }
}

/** The flash preview's pixels: the weighted sum of each flash's coverage. */
export function drawFlashes(
  tables: PixelTables,
  words: Int32Array,
  colour: Float64Array,
  n: number,
  duty: number,
  phase: Float64Array,
  weight: Float64Array,
  count: number,
  sweepTurns: number,
): void {
  const { angleTurns, pixelTurns, ringWeight, hubWeight } = tables;
  const pixels = tables.width * tables.height;
  const markDuty = duty / n;
  const sweep = Math.abs(sweepTurns);
  const back = sweepTurns > 0 ? sweepTurns : 0;
  for (let i = 0; i < pixels; i++) {
    const ring = ringWeight[i];
    let blade = 0;
    let mark = 0;
    if (ring > 0) {
      const px = pixelTurns[i];
      const len = sweep > px ? sweep : px;
      const start = angleTurns[i] - back - (len - sweep) / 2;
      const lenPitches = len * n;
      if (lenPitches <= 1) {
        // The usual case (a flash far shorter than a pitch's travel): the one-floor form.
        for (let j = 0; j < count; j++) {
          const a = start - phase[j];
          const b = shortCoverage(a * n, lenPitches, duty);
          if (b > 0) {
            blade += weight[j] * b;
            mark += weight[j] * shortCoverage(a, len, markDuty);
          }
        }
      } else {
        for (let j = 0; j < count; j++) {
          const a = start - phase[j];
          const b = sweptCoverage(a * n, a * n + lenPitches, duty);
          if (b > 0) {
            blade += weight[j] * b;
            mark += weight[j] * coverage(a, len, markDuty);
          }
        }
      }
      blade *= ring;
      mark *= ring;
    }
    words[i] = mix(colour, blade, mark, hubWeight[i]);
  }
}

/** Share of [a, a + length] (pitches) covered: the one-floor form when the interval is short. */
function coverage(a: number, length: number, duty: number): number {
  return length <= 1 ? shortCoverage(a, length, duty) : sweptCoverage(a, a + length, duty);
}

/**
 * Background, then blades, then the mark over blade 0, then the hub on top; one RGBA word as a
 * signed 32-bit integer, which the engine keeps unboxed (an unsigned one above 2³¹ may not be).
 */
function mix(colour: Float64Array, blade: number, mark: number, hub: number): number {
  const keep = 1 - hub;
  const r = (colour[0] + colour[3] * blade + colour[6] * mark) * keep + colour[9] * hub;
  const g = (colour[1] + colour[4] * blade + colour[7] * mark) * keep + colour[10] * hub;
  const b = (colour[2] + colour[5] * blade + colour[8] * mark) * keep + colour[11] * hub;
  return LITTLE_ENDIAN
    ? 0xff000000 | (((b + 0.5) | 0) << 16) | (((g + 0.5) | 0) << 8) | ((r + 0.5) | 0)
    : (((r + 0.5) | 0) << 24) | (((g + 0.5) | 0) << 16) | (((b + 0.5) | 0) << 8) | 0xff;
}

/** RGBA bytes land in a 32-bit word in the machine's byte order. */
const LITTLE_ENDIAN = new Uint8Array(new Uint32Array([1]).buffer)[0] === 1;
