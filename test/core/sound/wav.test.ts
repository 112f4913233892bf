/**
 * The WAV test helper (test/helpers/sound/wav.ts) that feeds Chromium's fake microphone: its header
 * against the RIFF WAVE layout (Microsoft & IBM, "Multimedia Programming Interface and Data
 * Specifications 1.0", 1991), and the fan read back through the sound core.
 */
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { soundSpectrum, speedsFromSound } from '../../../src/core';
import { fanAt1750Rpm } from '../../helpers/sound/machineSound';
import { readWav, wavBytes, writeWav } from '../../helpers/sound/wav';

describe('wavBytes', () => {
  it('writes the canonical 44-byte header of 16-bit mono PCM', () => {
    const bytes = wavBytes(new Float32Array([0, 0.25, -0.25, 1, -1]), 44_100);
    const view = new DataView(bytes.buffer);
    const tag = (o: number) => String.fromCharCode(...bytes.subarray(o, o + 4));
    expect([tag(0), tag(8), tag(12), tag(36)]).toEqual(['RIFF', 'WAVE', 'fmt ', 'data']);
    expect(view.getUint32(4, true)).toBe(bytes.length - 8); // RIFF size: file less 8 bytes
    expect(view.getUint32(16, true)).toBe(16); // fmt chunk size for PCM
    expect(view.getUint16(20, true)).toBe(1); // format tag 1 = PCM
    expect(view.getUint16(22, true)).toBe(1); // channels
    expect(view.getUint32(24, true)).toBe(44_100);
    expect(view.getUint32(28, true)).toBe(88_200); // byte rate = rate · block align
    expect(view.getUint16(32, true)).toBe(2); // block align = channels · bytes per sample
    expect(view.getUint16(34, true)).toBe(16);
    expect(view.getUint32(40, true)).toBe(10);
    expect([1, 2, 3, 4].map((i) => view.getInt16(44 + 2 * i, true))).toEqual([
      8192, -8192, 32767, -32767,
    ]);
  });

  it('round-trips the fan to within one step, and the sound core still hears 1750 rpm', () => {
    const dir = mkdtempSync(join(tmpdir(), 'trueturn-wav-'));
    try {
      const path = join(dir, 'fan.wav');
      const fan = fanAt1750Rpm(48_000, 4);
      writeWav(path, fan, 48_000);
      const back = readWav(new Uint8Array(readFileSync(path)));
      expect(back.sampleRateHz).toBe(48_000);
      expect(back.samples.length).toBe(fan.length);
      let worst = 0;
      for (let i = 0; i < fan.length; i++)
        worst = Math.max(worst, Math.abs(back.samples[i] - fan[i]));
      expect(worst).toBeLessThanOrEqual(0.5 / 32767 + 1e-7);
      const r = speedsFromSound(soundSpectrum(back.samples, back.sampleRateHz), { symmetry: 6 });
      expect(Math.abs(r.candidates[0].speedHz * 60 - 1750)).toBeLessThan(2);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
