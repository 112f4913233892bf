// The sound capture module's decisions that need no browser (src/audio): which error a failed
// microphone request becomes (DOMException names of the Media Capture and Streams
// specification, W3C), and which recordings are fit to analyse. Its browser half is driven in
// real Chromium by test/browser/sound-capture.test.ts.
import { describe, expect, it } from 'vitest';
import { checkRecording, microphoneError, SoundCaptureError } from '../../src/audio';

const recording = (samples: Float32Array, sampleRateHz = 48_000) => ({
  samples,
  sampleRateHz,
  durationS: samples.length / sampleRateHz,
});
const tone = (amplitude: number, seconds: number) =>
  Float32Array.from({ length: seconds * 48_000 }, (_, i) => amplitude * Math.sin(i / 10));

function captureErrorOf(run: () => unknown): SoundCaptureError {
  try {
    run();
  } catch (error) {
    if (error instanceof SoundCaptureError) return error;
    throw error;
  }
  throw new Error('expected a SoundCaptureError, but nothing was thrown');
}

describe('microphoneError', () => {
  it('tells refused, absent, busy and other microphones apart, each pointing to the file route', () => {
    const cases: Array<[string, string]> = [
      ['NotAllowedError', 'mic-refused'],
      ['SecurityError', 'mic-refused'],
      ['NotFoundError', 'mic-absent'],
      ['OverconstrainedError', 'mic-absent'],
      ['NotReadableError', 'mic-busy'],
      ['AbortError', 'mic-busy'],
      ['TypeError', 'mic-unavailable'],
    ];
    for (const [name, code] of cases) {
      const error = microphoneError(Object.assign(new Error('x'), { name }));
      expect(error).toBeInstanceOf(SoundCaptureError);
      expect(error.code).toBe(code);
      expect(error.message).toMatch(/open the file here/);
    }
    expect(microphoneError(undefined).code).toBe('mic-unavailable');
  });
});

describe('checkRecording', () => {
  it('passes a recording with sound and headroom', () => {
    const r = recording(tone(0.3, 2));
    expect(checkRecording(r)).toBe(r);
  });

  it('refuses a recording shorter than half a second', () => {
    expect(captureErrorOf(() => checkRecording(recording(tone(0.3, 0.25)))).code).toBe('too-short');
  });

  it('calls a muted microphone silent', () => {
    const error = captureErrorOf(() => checkRecording(recording(new Float32Array(96_000))));
    expect(error.code).toBe('silence');
    expect(error.message).toMatch(/Nothing was heard/);
  });

  it('calls an overdriven recording clipped, and keeps it so it can be analysed anyway', () => {
    const loud = recording(tone(3, 2).map((v) => Math.max(-1, Math.min(1, v))));
    const error = captureErrorOf(() => checkRecording(loud));
    expect(error.code).toBe('clipping');
    expect(error.recording).toBe(loud);
  });
});
