import { HANN_NOISE_BANDWIDTH_BINS } from './window';

/**
 * Reading lines out of an averaged power spectrum: the noise floor under them, the local
 * maxima that stand clear of it, and each line's frequency between bins.
 */

/** A line found in the spectrum. */
export interface SpectrumPeak {
  /** Frequency, Hz, between bins: the centroid of the line's span (see findPeaks). */
  hz: number;
  /** Index of the strongest bin. */
  bin: number;
  /** Line level in dB relative to a full-scale sine (its whole span, wherever it fell between bins). */
  levelDb: number;
  /** How far the strongest bin stands above the noise floor, dB. */
  prominenceDb: number;
  /** Width of the line's span (bins within 30 dB of the strongest), Hz: 3–5 bins for a steady line, more for one whose speed drifted. */
  widthHz: number;
}

/** Prominence from which a local maximum counts as a line (a judgement: noise averaged over two or more segments stays below it). */
export const LINE_PROMINENCE_DB = 10;
/** A line's span reaches down to this ratio below its strongest bin (30 dB). */
const SPAN_RATIO = 1000;
/**
 * A valley this far (6 dB) below the maxima on both sides ends a line's span: the ripples of a
 * drifting line, where averaged segments saw it up to two bins apart, dip about 3 dB; two lines
 * four bins apart dip well over 10 dB between them.
 */
const VALLEY_RATIO = 4;
/**
 * Lines more than this below the loudest bin are rounding, not sound: samples carry at most
 * 24 bits (144 dB), and arithmetic on them a little less (a judgement).
 */
const DYNAMIC_RANGE_DB = 120;
/** Most lines kept, strongest first: more than any machine shows, and it bounds the tone finder's work. */
export const MAX_PEAKS = 400;
/** Narrowest block (bins) over which the noise floor is taken. */
const MIN_FLOOR_BLOCK = 24;
/** Block width as a share of the block's frequency, so the floor follows a sloping (pink) noise. */
const FLOOR_BLOCK_SHARE = 0.05;

/**
 * The noise floor under each bin in [firstBin, lastBin]: the median power of blocks of bins
 * (a line fills 4 of a block's 24 or more bins, so the median ignores it), interpolated
 * linearly in dB between block centres. Bins outside the span keep the nearest block's value.
 */
export function noiseFloor(power: Float64Array, firstBin: number, lastBin: number): Float64Array {
  const centres: number[] = [];
  const mediansDb: number[] = [];
  let scratch = new Float64Array(0);
  for (let start = firstBin; start <= lastBin;) {
    const width = Math.max(MIN_FLOOR_BLOCK, Math.round(FLOOR_BLOCK_SHARE * start));
    const end = Math.min(lastBin + 1, start + width);
    const count = end - start;
    if (scratch.length < count) scratch = new Float64Array(count);
    const block = scratch.subarray(0, count);
    block.set(power.subarray(start, end));
    block.sort();
    const median =
      count % 2 ? block[(count - 1) / 2] : (block[count / 2 - 1] + block[count / 2]) / 2;
    centres.push((start + end - 1) / 2);
    mediansDb.push(10 * Math.log10(Math.max(median, TINY_POWER)));
    start = end;
  }
  const floor = new Float64Array(power.length);
  let b = 0;
  for (let k = 0; k < power.length; k++) {
    while (b < centres.length - 2 && k > centres[b + 1]) b++;
    let db: number;
    if (centres.length === 1 || k <= centres[0]) db = mediansDb[0];
    else if (k >= centres[centres.length - 1]) db = mediansDb[mediansDb.length - 1];
    else {
      const t = (k - centres[b]) / (centres[b + 1] - centres[b]);
      db = mediansDb[b] + t * (mediansDb[b + 1] - mediansDb[b]);
    }
    floor[k] = 10 ** (db / 10);
  }
  return floor;
}

/** A power below anything a recording can hold (−300 dB): keeps logarithms finite on silence. */
export const TINY_POWER = 1e-30;

/**
 * The lines of `power` between bins firstBin and lastBin, at most MAX_PEAKS (the strongest),
 * in order of frequency. A line is a local maximum at least LINE_PROMINENCE_DB above `floor`
 * (and within 120 dB of the loudest bin),
 * with the bins around it down to 30 dB below it (or to twice the floor, or to a valley
 * 6 dB below the maxima on both sides): a steady line fills 3–5 such bins (the Hann main lobe, ±2 bins to its nulls, Harris 1978). Lesser maxima
 * inside that span are ripples of the same line, not lines: a line whose speed drifted is
 * smeared over more bins, with ripples where the averaged segments saw it at different
 * frequencies.
 *
 * Frequency between bins: the power-weighted centroid of the span, floor removed (the energy
 * barycentre correction for discrete spectra; its noise behaviour under the Hann window is
 * analysed by K. Ding, C. Zheng & Z. Yang, Journal of Mechanical Engineering, 2010,
 * doi:10.3901/JME.2010.05.043). For a steady line under the Hann window the centroid of the
 * whole main lobe is the line's frequency; cut at 30 dB it is off by under 0.001 bin
 * (test/core/sound/peaks.test.ts). For a line whose speed drifted it is the mean frequency
 * over the recording: the first moment of the power spectrum is the time average of the
 * instantaneous frequency (L. Cohen, "Time-frequency distributions — a review", Proc. IEEE
 * 77(7), 1989). Level: the span's power over the window's noise bandwidth (1.5 bins).
 */
export function findPeaks(
  power: Float64Array,
  floor: Float64Array,
  binHz: number,
  firstBin: number,
  lastBin: number,
): SpectrumPeak[] {
  const minRatio = 10 ** (LINE_PROMINENCE_DB / 10);
  const lo = Math.max(1, firstBin);
  const hi = Math.min(power.length - 2, lastBin);
  let loudest = 0;
  for (let k = lo; k <= hi; k++) loudest = Math.max(loudest, power[k]);
  const quietest = loudest * 10 ** (-DYNAMIC_RANGE_DB / 10);
  const maxima: number[] = [];
  for (let k = lo; k <= hi; k++) {
    const p = power[k];
    if (p > power[k - 1] && p >= power[k + 1] && p >= minRatio * floor[k] && p >= quietest)
      maxima.push(k);
  }
  maxima.sort((a, b) => power[b] - power[a]);
  const claimed = new Uint8Array(power.length);
  const peaks: SpectrumPeak[] = [];
  for (const k of maxima) {
    if (claimed[k]) continue;
    const p = power[k];
    // Out from the peak while the bins stay within 30 dB of it and above twice the floor, and
    // not past a valley 6 dB below the maxima on both sides of it (beyond it rises another line).
    const inSpan = (from: number, to: number) => {
      if (power[to] < p / SPAN_RATIO || power[to] < 2 * floor[to]) return false;
      if (power[to] <= power[from]) return true;
      let top = to;
      const step = to - from;
      while (top + step >= lo && top + step <= hi && power[top + step] >= power[top]) top += step;
      return power[from] * VALLEY_RATIO >= Math.min(p, power[top]);
    };
    let left = k;
    while (left > lo && inSpan(left, left - 1)) left--;
    let right = k;
    while (right < hi && inSpan(right, right + 1)) right++;
    for (let j = left; j <= right; j++) claimed[j] = 1;
    let sum = 0;
    let moment = 0;
    for (let j = left; j <= right; j++) {
      const excess = Math.max(0, power[j] - floor[j]);
      sum += excess;
      moment += excess * j;
    }
    peaks.push({
      hz: (moment / sum) * binHz,
      bin: k,
      widthHz: (right - left + 1) * binHz,
      levelDb: 10 * Math.log10(Math.max(sum / HANN_NOISE_BANDWIDTH_BINS, TINY_POWER)),
      prominenceDb: 10 * Math.log10(p / Math.max(floor[k], TINY_POWER)),
    });
    if (peaks.length >= MAX_PEAKS) break;
  }
  return peaks.sort((a, b) => a.hz - b.hz);
}
