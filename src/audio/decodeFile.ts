// Reads a recording the user picked (any format the browser decodes) into mono samples. The
// file's size is checked before a byte of it is read, and its length after decoding.
import { MAX_RECORDING_S } from '../core';
import { checkRecording } from './checkRecording';
import { SoundCaptureError, type SoundRecording } from './captureError';

/**
 * Largest file read, bytes (16 MB): about 1½ minutes of CD-quality stereo WAV, or a quarter of
 * an hour of a phone recorder's compressed audio; decoding a larger one could exhaust a
 * phone's memory before its length is known (a judgement).
 */
export const MAX_SOUND_FILE_BYTES = 16 * 1024 * 1024;
/** Rate files are decoded to, Hz: the analysis reads at most 48 kHz. */
const DECODE_RATE_HZ = 48_000;

export interface DecodeOptions {
  maxBytes?: number;
  /** Longest recording accepted, s (default the core's limit, 10 minutes). */
  maxSeconds?: number;
}

/** The samples of a sound file, mixed to mono; rejects with a SoundCaptureError. */
export async function decodeSoundFile(
  file: Blob,
  opts: DecodeOptions = {},
): Promise<SoundRecording> {
  const maxBytes = opts.maxBytes ?? MAX_SOUND_FILE_BYTES;
  const maxSeconds = opts.maxSeconds ?? MAX_RECORDING_S;
  if (file.size > maxBytes) {
    throw new SoundCaptureError(
      'file-too-large',
      `The file is ${megabytes(file.size)}; files up to ${megabytes(maxBytes)} can be read. Trim it to a minute or so where the machine runs steadily.`,
    );
  }
  if (file.size === 0) throw notAudio();
  let decoded: AudioBuffer;
  try {
    const context = new OfflineAudioContext(1, 1, DECODE_RATE_HZ);
    decoded = await context.decodeAudioData(await file.arrayBuffer());
  } catch {
    throw notAudio();
  }
  if (decoded.duration > maxSeconds) {
    throw new SoundCaptureError(
      'file-too-long',
      `The recording is ${minutes(decoded.duration)} long; up to ${minutes(maxSeconds)} can be read. Trim it to a stretch where the machine runs steadily.`,
    );
  }
  const samples = new Float32Array(decoded.length);
  for (let c = 0; c < decoded.numberOfChannels; c++) {
    const channel = decoded.getChannelData(c);
    for (let i = 0; i < samples.length; i++) samples[i] += channel[i] / decoded.numberOfChannels;
  }
  return checkRecording({ samples, sampleRateHz: decoded.sampleRate, durationS: decoded.duration });
}

function notAudio(): SoundCaptureError {
  return new SoundCaptureError(
    'not-audio',
    'This file is not a recording this browser can read. Pick an audio file (for example from the phone’s voice recorder).',
  );
}

const megabytes = (bytes: number) => `${(bytes / 1024 / 1024).toFixed(1)} MB`;
const minutes = (s: number) =>
  s < 120
    ? `${Math.round(s)} s`
    : s < 7200
      ? `${Math.round(s / 60)} minutes`
      : `${(s / 3600).toFixed(1)} hours`;
