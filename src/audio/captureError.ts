/** What went wrong while getting sound, as a code (for the screen's logic) and a message (for people). */
export type SoundCaptureProblem =
  | 'mic-unavailable'
  | 'mic-refused'
  | 'mic-absent'
  | 'mic-busy'
  | 'no-audio-support'
  | 'too-short'
  | 'silence'
  | 'clipping'
  | 'cancelled'
  | 'not-audio'
  | 'file-too-large'
  | 'file-too-long';

/** A recording: mono samples (full scale ±1) at their rate. Never stored: it lives until analysed. */
export interface SoundRecording {
  samples: Float32Array;
  sampleRateHz: number;
  durationS: number;
}

/**
 * The one error the sound capture throws. `recording` is kept for 'clipping', so the screen can
 * still offer to analyse it (clipping adds lines at the same multiples, and the result says so).
 */
export class SoundCaptureError extends Error {
  readonly code: SoundCaptureProblem;
  readonly recording?: SoundRecording;
  constructor(code: SoundCaptureProblem, message: string, recording?: SoundRecording) {
    super(message);
    this.name = 'SoundCaptureError';
    this.code = code;
    this.recording = recording;
  }
}

const FILE_ROUTE = 'You can also record with the phone’s own recorder and open the file here.';

/** The capture error for a failed getUserMedia call (its DOMException names, per Media Capture and Streams). */
export function microphoneError(error: unknown): SoundCaptureError {
  const name = (error as { name?: unknown } | null)?.name;
  switch (name) {
    case 'NotAllowedError':
    case 'SecurityError':
      return new SoundCaptureError(
        'mic-refused',
        `The microphone was refused. Allow it for this app in the browser’s site settings and try again. ${FILE_ROUTE}`,
      );
    case 'NotFoundError':
    case 'OverconstrainedError':
      return new SoundCaptureError('mic-absent', `No microphone was found. ${FILE_ROUTE}`);
    case 'NotReadableError':
    case 'AbortError':
      return new SoundCaptureError(
        'mic-busy',
        `The microphone is in use by another app or could not be started. Close it and try again. ${FILE_ROUTE}`,
      );
    default:
      return new SoundCaptureError(
        'mic-unavailable',
        `The microphone could not be opened. ${FILE_ROUTE}`,
      );
  }
}
