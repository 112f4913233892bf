/**
 * Lines read from the spectrum: where they are between bins, and what is one line.
 * Sources: the energy barycentre (centroid) correction for discrete spectra (K. Ding, C. Zheng
 * & Z. Yang, Journal of Mechanical Engineering, 2010, doi:10.3901/JME.2010.05.043); the mean
 * frequency of a drifting tone as the first moment of its power spectrum (L. Cohen,
 * "Time-frequency distributions — a review", Proc. IEEE 77(7), 1989); pink noise's power
 * falling 3.01 dB per octave (power ∝ 1/f, common practice).
 */
import { describe, expect, it } from 'vitest';
import { soundSpectrum, type SoundSpectrum } from '../../../src/core';
import { machineSound, noiseOf, seededRandom } from '../../helpers/sound/machineSound';

const strongest = (s: SoundSpectrum) => s.peaks.reduce((a, b) => (b.levelDb > a.levelDb ? b : a));

describe('a line between bins', () => {
  it('is placed within 0.001 bin for a steady tone, wherever it falls', () => {
    const fs = 48_000;
    const length = 4 * fs;
    const bin = soundSpectrum(new Float32Array(length).fill(0.01), fs).binHz;
    let worstBins = 0;
    for (let i = 0; i <= 20; i++) {
      const hz = (400 + i / 20) * bin;
      const tone = Float64Array.from(
        { length },
        (_, j) => 0.5 * Math.cos((2 * Math.PI * hz * j) / fs + i),
      );
      const s = soundSpectrum(tone, fs);
      worstBins = Math.max(worstBins, Math.abs(strongest(s).hz - hz) / bin);
    }
    console.log(`steady tone, 21 offsets across a bin: worst error ${worstBins.toFixed(5)} bin`);
    expect(worstBins).toBeLessThan(0.001);
  });

  it('reads its level as the tone’s amplitude, wherever it falls (within 0.05 dB)', () => {
    const fs = 44_100;
    const length = 3 * fs;
    const bin = soundSpectrum(new Float32Array(length).fill(0.01), fs).binHz;
    for (const offset of [0, 0.25, 0.5]) {
      const hz = (321 + offset) * bin;
      const tone = Float64Array.from(
        { length },
        (_, j) => 0.25 * Math.sin((2 * Math.PI * hz * j) / fs),
      );
      expect(strongest(soundSpectrum(tone, fs)).levelDb).toBeCloseTo(20 * Math.log10(0.25), 1);
    }
  });

  it('is the mean frequency of a tone whose speed drifted ±0.2 % (within 0.005 %)', () => {
    for (const [fs, hz] of [
      [48_000, 175],
      [44_100, 1200],
      [48_000, 3900],
    ]) {
      for (const drift of [-0.002, 0.002]) {
        const x = machineSound(
          {
            sampleRateHz: fs,
            durationS: 4,
            speedHz: hz,
            drift,
            lines: [{ order: 1, amplitude: 0.4, phase: 1 }],
          },
          seededRandom(7),
        );
        const s = soundSpectrum(x, fs);
        expect(s.peaks).toHaveLength(1); // ripples of the smeared line are not lines
        expect(Math.abs(s.peaks[0].hz - hz) / hz).toBeLessThan(0.00005);
      }
    }
  });

  it('stays apart from another line four bins away', () => {
    const fs = 48_000;
    const length = 4 * fs;
    const bin = soundSpectrum(new Float32Array(length).fill(0.01), fs).binHz;
    const a = 500.3 * bin;
    const b = a + 4 * bin;
    const x = Float64Array.from(
      { length },
      (_, j) =>
        0.3 * Math.sin((2 * Math.PI * a * j) / fs) + 0.2 * Math.sin((2 * Math.PI * b * j) / fs + 1),
    );
    const hz = soundSpectrum(x, fs).peaks.map((p) => p.hz);
    expect(hz).toHaveLength(2);
    expect(Math.abs(hz[0] - a)).toBeLessThan(0.05 * bin);
    expect(Math.abs(hz[1] - b)).toBeLessThan(0.05 * bin);
  });
});

describe('a 4 s recording', () => {
  it('gives a tone to better than 0.05 % in white noise 10 dB down, steady or drifting ±0.2 %', () => {
    const random = seededRandom(405);
    const rows: Array<{ fs: number; toneHz: number; drift: string; errorPct: number }> = [];
    for (let i = 0; i < 60; i++) {
      const fs = i % 2 ? 44_100 : 48_000;
      const toneHz = 30 * (5000 / 30) ** random();
      const drift = i % 3 === 0 ? 0 : (random() * 2 - 1) * 0.002;
      const x = machineSound(
        {
          sampleRateHz: fs,
          durationS: 4,
          speedHz: toneHz,
          drift,
          lines: [{ order: 1, amplitude: 0.3, phase: random() * 6.28 }],
          noise: { colour: 'white', snrDb: 10 },
        },
        random,
      );
      const s = soundSpectrum(x, fs);
      rows.push({
        fs,
        toneHz: +toneHz.toFixed(2),
        drift: `${(drift * 100).toFixed(3)} %`,
        errorPct: +((Math.abs(strongest(s).hz - toneHz) / toneHz) * 100).toFixed(5),
      });
    }
    rows.sort((a, b) => b.errorPct - a.errorPct);
    console.log('Tone from 4 s, 10 dB white noise: the ten worst of 60');
    console.table(rows.slice(0, 10));
    expect(rows[0].errorPct).toBeLessThan(0.05);
  });
});

describe('the noise floor', () => {
  it('falls 3 dB per octave under pink noise (12 ± 1.5 dB from 200 Hz to 3.2 kHz)', () => {
    const fs = 48_000;
    const x = noiseOf('pink', 6 * fs, seededRandom(11));
    const s = soundSpectrum(x, fs);
    const floorDb = (hz: number) => 10 * Math.log10(s.floor[Math.round(hz / s.binHz)]);
    expect(floorDb(200) - floorDb(3200)).toBeGreaterThan(12.04 - 1.5);
    expect(floorDb(200) - floorDb(3200)).toBeLessThan(12.04 + 1.5);
    expect(s.peaks).toHaveLength(0); // noise alone holds no line
  });

  it('is flat under white noise (within 1 dB from 100 Hz to 10 kHz)', () => {
    const fs = 44_100;
    const x = noiseOf('white', 4 * fs, seededRandom(12));
    const s = soundSpectrum(x, fs);
    const floorDb = (hz: number) => 10 * Math.log10(s.floor[Math.round(hz / s.binHz)]);
    for (const hz of [300, 1000, 3000, 10_000])
      expect(Math.abs(floorDb(hz) - floorDb(100))).toBeLessThan(1);
    expect(s.peaks).toHaveLength(0);
  });
});
