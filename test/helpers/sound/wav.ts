/**
 * WAV files for tests: 16-bit PCM, mono, as Chromium's fake microphone
 * (--use-file-for-fake-audio-capture=/abs/path.wav) and decodeAudioData both read. Layout per
 * the RIFF WAVE format (Microsoft & IBM, "Multimedia Programming Interface and Data
 * Specifications 1.0", 1991): "RIFF" size "WAVE", a 16-byte "fmt " chunk (format 1 = PCM,
 * channels, sample rate, byte rate, block align, bits per sample), then "data" and the
 * little-endian samples.
 */
import { writeFileSync } from 'node:fs';

/** The bytes of a 16-bit mono PCM WAV file holding `samples` (full scale ±1; beyond it clipped). */
export function wavBytes(samples: ArrayLike<number>, sampleRateHz: number): Uint8Array {
  const dataBytes = samples.length * 2;
  const bytes = new Uint8Array(44 + dataBytes);
  const view = new DataView(bytes.buffer);
  const text = (offset: number, s: string) => {
    for (let i = 0; i < s.length; i++) bytes[offset + i] = s.charCodeAt(i);
  };
  text(0, 'RIFF');
  view.setUint32(4, 36 + dataBytes, true);
  text(8, 'WAVE');
  text(12, 'fmt ');
  view.setUint32(16, 16, true); // fmt chunk size
  view.setUint16(20, 1, true); // PCM
  view.setUint16(22, 1, true); // mono
  view.setUint32(24, sampleRateHz, true);
  view.setUint32(28, sampleRateHz * 2, true); // byte rate
  view.setUint16(32, 2, true); // block align
  view.setUint16(34, 16, true); // bits per sample
  text(36, 'data');
  view.setUint32(40, dataBytes, true);
  for (let i = 0; i < samples.length; i++) {
    const x = Math.max(-1, Math.min(1, samples[i]));
    view.setInt16(44 + 2 * i, Math.round(x * 32767), true);
  }
  return bytes;
}

/** Writes `samples` to `path` as a 16-bit mono PCM WAV file. */
export function writeWav(path: string, samples: ArrayLike<number>, sampleRateHz: number): void {
  writeFileSync(path, wavBytes(samples, sampleRateHz));
}

/** Reads back a file written by wavBytes (16-bit mono PCM only): its rate and samples (±1). */
export function readWav(bytes: Uint8Array): { sampleRateHz: number; samples: Float32Array } {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const tag = (offset: number) => String.fromCharCode(...bytes.subarray(offset, offset + 4));
  if (tag(0) !== 'RIFF' || tag(8) !== 'WAVE' || tag(12) !== 'fmt ' || tag(36) !== 'data') {
    throw new Error('not a canonical 16-bit PCM WAV file');
  }
  const count = view.getUint32(40, true) / 2;
  const samples = new Float32Array(count);
  for (let i = 0; i < count; i++) samples[i] = view.getInt16(44 + 2 * i, true) / 32767;
  return { sampleRateHz: view.getUint32(24, true), samples };
}
