/**
 * Recording level: RMS of a sine is its amplitude over √2 (−3.01 dB for a full-scale sine;
 * any signals text), a square wave's is its amplitude (0 dB); one step of a 16-bit converter
 * is 20·log10(1/32768) = −90.3 dB (common practice).
 */
import { describe, expect, it } from 'vitest';
import { recordingLevel, SILENCE_DBFS } from '../../../src/core';

const sine = (amplitude: number, count = 48_000) =>
  Float64Array.from(
    { length: count },
    (_, i) => amplitude * Math.sin((2 * Math.PI * 1000 * i) / 48_000),
  );

describe('recordingLevel', () => {
  it('reads a full-scale sine at −3.01 dB RMS and a full-scale square wave at 0 dB', () => {
    expect(recordingLevel(sine(1)).rmsDbfs).toBeCloseTo(-3.0103, 3);
    const square = Float64Array.from({ length: 4800 }, (_, i) => (i % 48 < 24 ? 1 : -1));
    expect(recordingLevel(square).rmsDbfs).toBeCloseTo(0, 9);
    expect(recordingLevel(sine(0.1)).peak).toBeCloseTo(0.1, 6);
  });

  it('calls a recording silent below one step of a 16-bit converter', () => {
    expect(SILENCE_DBFS).toBeCloseTo(-90.309, 3);
    expect(recordingLevel(new Float32Array(1000)).silent).toBe(true);
    expect(recordingLevel(new Float32Array(1000)).rmsDbfs).toBe(-400);
    expect(recordingLevel(sine(0.5 / 32768)).silent).toBe(true); // −93.3 dB
    expect(recordingLevel(sine(2 / 32768)).silent).toBe(false); // −87.3 dB
  });

  it('calls a recording clipped when 0.1 % of its samples sit at full scale', () => {
    expect(recordingLevel(sine(0.9)).clipped).toBe(false);
    const clipped = sine(3).map((v) => Math.max(-1, Math.min(1, v)));
    expect(recordingLevel(clipped).clipped).toBe(true);
    expect(recordingLevel(clipped).fullScaleFraction).toBeGreaterThan(0.5);
    const oneClick = sine(0.3);
    oneClick[100] = 1; // a single sample at full scale is a click, not clipping
    expect(recordingLevel(oneClick).clipped).toBe(false);
  });

  it('reads only the stretch asked for', () => {
    const x = new Float64Array(2000);
    x.fill(0.5, 1000);
    expect(recordingLevel(x, 0, 1000).silent).toBe(true);
    expect(recordingLevel(x, 1000, 2000).rmsDbfs).toBeCloseTo(-6.0206, 3);
  });
});
