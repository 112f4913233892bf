/**
 * Integer-factor decimation for recordings above the analysis rate (96 kHz files, say): a
 * linear-phase low-pass FIR (windowed sinc, Blackman window) followed by keeping every
 * factor-th sample. Only the band the tone finder reads, [0, keepHz], must survive; the
 * filter's stopband starts where folding would land on that band (outRate − keepHz), so the
 * transition is wide and the filter short.
 *
 * Filter length: the Blackman window method gives a transition width of about 6/L of the
 * input rate and a stopband about 74 dB down (A. V. Oppenheim & R. W. Schafer, Discrete-Time
 * Signal Processing, window-method table; figures from memory, checked by
 * test/core/sound/decimate.test.ts, which measures the stopband).
 */
export function decimate(
  samples: ArrayLike<number>,
  from: number,
  to: number,
  factor: number,
  inRateHz: number,
  keepHz: number,
): Float64Array {
  const outRateHz = inRateHz / factor;
  const transition = (outRateHz - 2 * keepHz) / inRateHz; // fraction of the input rate
  const taps = Math.ceil(6 / Math.max(transition, 1e-3)) | 1; // odd: a centre tap
  const half = (taps - 1) / 2;
  // Mid-transition between keepHz and outRate − keepHz, in cycles per input sample.
  const cutoff = outRateHz / 2 / inRateHz;
  const h = new Float64Array(taps);
  let sum = 0;
  for (let j = 0; j < taps; j++) {
    const t = j - half;
    const sinc = t === 0 ? 2 * cutoff : Math.sin(2 * Math.PI * cutoff * t) / (Math.PI * t);
    const blackman =
      0.42 -
      0.5 * Math.cos((2 * Math.PI * j) / (taps - 1)) +
      0.08 * Math.cos((4 * Math.PI * j) / (taps - 1));
    h[j] = sinc * blackman;
    sum += h[j];
  }
  for (let j = 0; j < taps; j++) h[j] /= sum; // unit gain at 0 Hz
  const count = Math.floor((to - from) / factor);
  const out = new Float64Array(count);
  for (let i = 0; i < count; i++) {
    const centre = from + i * factor;
    let acc = 0;
    for (let j = 0; j < taps; j++) {
      const k = centre + j - half;
      if (k >= from && k < to) acc += h[j] * samples[k];
    }
    out[i] = acc;
  }
  return out;
}
