/**
 * The Hann window, in its "DFT-even" (periodic) form w[j] = 0.5 − 0.5·cos(2πj/N), j = 0…N−1:
 * the form F. J. Harris recommends for spectral analysis ("On the use of windows for harmonic
 * analysis with the discrete Fourier transform", Proc. IEEE 66(1), 1978). A line leaks into
 * a main lobe ±2 bins wide (4 bins null to null); its highest sidelobe is −31.5 dB (Harris's
 * Table 1 rounds it to −32 dB) and the sidelobes fall by 18 dB per octave, so a strong hum
 * line barely touches a machine line a few bins away. test/core/sound/window.test.ts checks
 * these figures on the window below.
 */

/** Sum of the window divided by N (Harris 1978, Table 1: 0.50). */
export const HANN_COHERENT_GAIN = 0.5;
/** Equivalent noise bandwidth in bins (Harris 1978, Table 1: 1.50). */
export const HANN_NOISE_BANDWIDTH_BINS = 1.5;

const cache = new Map<number, Float64Array>();

/** The periodic Hann window of length `length` (kept, since the same lengths recur). */
export function hannWindow(length: number): Float64Array {
  let w = cache.get(length);
  if (!w) {
    w = new Float64Array(length);
    for (let j = 0; j < length; j++) w[j] = 0.5 - 0.5 * Math.cos((2 * Math.PI * j) / length);
    if (cache.size > 8) cache.clear();
    cache.set(length, w);
  }
  return w;
}
