/**
 * The published relations behind the spectrum, each checked against its source:
 * - bin spacing Δf = fs/N and the DFT itself (the definition X_k = Σ x_j·e^(−2πijk/N), any DSP
 *   text, e.g. A. V. Oppenheim & R. W. Schafer, Discrete-Time Signal Processing), against a
 *   brute-force sum;
 * - the Hann window's main lobe (±2 bins, 4 bins null to null), highest sidelobe (−31.5 dB;
 *   Harris's Table 1 rounds it to −32), coherent gain (0.50), equivalent noise bandwidth (1.50
 *   bins) and scalloping loss (1.42 dB): F. J. Harris, "On the use of windows for harmonic
 *   analysis with the discrete Fourier transform", Proc. IEEE 66(1), 1978, Table 1.
 */
import FFT from 'fft.js';
import { describe, expect, it } from 'vitest';
import { soundSpectrum } from '../../../src/core';
import {
  hannWindow,
  HANN_COHERENT_GAIN,
  HANN_NOISE_BANDWIDTH_BINS,
} from '../../../src/core/sound/window';

/** |W(ν)| of the window, ν in bins of the unpadded length, from a zero-padded transform. */
function windowResponse(length: number, pad: number): number[] {
  const size = length * pad;
  const fft = new FFT(size);
  const input = new Float64Array(size);
  input.set(hannWindow(length));
  const out = fft.createComplexArray() as number[];
  fft.realTransform(out, input);
  return Array.from({ length: size / 2 }, (_, k) => Math.hypot(out[2 * k], out[2 * k + 1]));
}

describe('the Hann window (Harris 1978, Table 1)', () => {
  const PAD = 64; // 1/64 bin resolution
  const response = windowResponse(64, PAD);
  const db = (k: number) => 20 * Math.log10(response[k] / response[0]);

  it('has its first null 2 bins from the centre: a main lobe 4 bins wide, null to null', () => {
    let k = 1;
    while (response[k + 1] < response[k]) k++;
    expect(k / PAD).toBeCloseTo(2, 6);
    expect(db(k)).toBeLessThan(-120);
  });

  it('has its highest sidelobe 31.5 dB down', () => {
    const highest = Math.max(
      ...response.slice(2 * PAD + 1, 20 * PAD).map((_, i) => db(2 * PAD + 1 + i)),
    );
    expect(highest).toBeCloseTo(-31.47, 1);
  });

  it('loses 1.42 dB for a line halfway between bins (scalloping loss)', () => {
    expect(db(PAD / 2)).toBeCloseTo(-1.42, 2);
  });

  it('has a coherent gain of 0.50 and a noise bandwidth of 1.50 bins', () => {
    const w = hannWindow(4096);
    const sum = w.reduce((a, b) => a + b, 0);
    const sumSquares = w.reduce((a, b) => a + b * b, 0);
    expect(sum / w.length).toBeCloseTo(HANN_COHERENT_GAIN, 12);
    expect((w.length * sumSquares) / (sum * sum)).toBeCloseTo(HANN_NOISE_BANDWIDTH_BINS, 12);
  });
});

describe('the spectrum’s bins', () => {
  it('are fs/N apart, and a sine on bin k reads A² at bin k (Δf = fs/N)', () => {
    for (const fs of [8000, 44100, 48000]) {
      const length = 4 * fs;
      const s1 = soundSpectrum(new Float32Array(length).fill(0.1), fs); // a constant: no lines
      expect(s1.binHz).toBe(fs / s1.segmentLength);
      const k = 300;
      const hz = k * s1.binHz;
      const tone = Float64Array.from(
        { length },
        (_, j) => 0.5 * Math.sin((2 * Math.PI * hz * j) / fs),
      );
      const s = soundSpectrum(tone, fs);
      expect(s.binHz).toBe(fs / s.segmentLength);
      const strongest = s.peaks.reduce((a, b) => (b.levelDb > a.levelDb ? b : a));
      expect(strongest.bin).toBe(k);
      expect(strongest.hz).toBeCloseTo(hz, 6);
      expect(s.power[k]).toBeCloseTo(0.25, 6);
    }
  });

  it('match a brute-force DFT of the windowed segment', () => {
    const fs = 8000;
    const size = 4096;
    const x = Float64Array.from(
      { length: size },
      (_, j) =>
        0.3 * Math.sin(0.37 * j) + 0.2 * Math.cos(1.9 * j + 0.4) + 0.05 * Math.sin(0.011 * j * j),
    );
    // One segment: the recording is exactly one segment long.
    const s = soundSpectrum(x, fs, { segmentS: size / fs, minToneHz: 1, maxToneHz: 0.45 * fs });
    expect(s.segmentLength).toBe(size);
    expect(s.segments).toBe(1);
    const w = hannWindow(size);
    for (const k of [3, 100, 241, 1000, 1500]) {
      let re = 0;
      let im = 0;
      for (let j = 0; j < size; j++) {
        re += x[j] * w[j] * Math.cos((2 * Math.PI * j * k) / size);
        im -= x[j] * w[j] * Math.sin((2 * Math.PI * j * k) / size);
      }
      const expected = (2 / (size / 2)) ** 2 * (re * re + im * im);
      expect(s.power[k]).toBeCloseTo(expected, 12);
    }
  });
});
