/**
 * Recordings above 48 kHz are low-pass filtered (windowed sinc, Blackman window) and
 * decimated before analysis. The Blackman window method's stopband lies about 74 dB down
 * (A. V. Oppenheim & R. W. Schafer, Discrete-Time Signal Processing, window-method table;
 * from memory): a tone that would fold onto the band must come out at least 70 dB down.
 */
import { describe, expect, it } from 'vitest';
import { soundSpectrum } from '../../../src/core';

describe('decimation of fast recordings', () => {
  it('keeps a 1 kHz tone exact and folds a 40 kHz tone at least 70 dB down (96 kHz → 48 kHz)', () => {
    const fs = 96_000;
    const x = Float64Array.from(
      { length: 4 * fs },
      (_, i) =>
        0.4 * Math.sin((2 * Math.PI * 1000.3 * i) / fs) +
        0.4 * Math.sin((2 * Math.PI * 40_000 * i) / fs),
    );
    const s = soundSpectrum(x, fs);
    expect(s.sampleRateHz).toBe(48_000);
    const tone = s.peaks.find((p) => Math.abs(p.hz - 1000.3) < 1)!;
    expect(tone.hz).toBeCloseTo(1000.3, 2);
    expect(tone.levelDb).toBeCloseTo(20 * Math.log10(0.4), 1);
    // 40 kHz folds to 48 − 40 = 8 kHz.
    const folded = 10 * Math.log10(s.power[Math.round(8000 / s.binHz)]);
    expect(tone.levelDb - folded).toBeGreaterThan(70);
  });

  it('decimates 192 kHz by 4 and 50 kHz by 2', () => {
    expect(soundSpectrum(new Float32Array(192_000), 192_000).sampleRateHz).toBe(48_000);
    expect(soundSpectrum(new Float32Array(50_000), 50_000).sampleRateHz).toBe(25_000);
    expect(soundSpectrum(new Float32Array(48_000), 48_000).sampleRateHz).toBe(48_000);
  });
});
