import { MIN_RECORDING_S, recordingLevel } from '../core';
import { SoundCaptureError, type SoundRecording } from './captureError';

/**
 * A recording fit to analyse, or the SoundCaptureError saying why not: too short, silent (a
 * muted or absent microphone), or clipped (too loud for the converter; the recording is kept
 * in the error so that it can still be analysed).
 */
export function checkRecording(recording: SoundRecording): SoundRecording {
  if (recording.durationS < MIN_RECORDING_S) {
    throw new SoundCaptureError(
      'too-short',
      `Only ${recording.durationS.toFixed(1)} s was recorded; at least ${MIN_RECORDING_S} s is needed (4 s is best).`,
    );
  }
  const level = recordingLevel(recording.samples);
  if (level.silent) {
    throw new SoundCaptureError(
      'silence',
      'Nothing was heard: the recording is silent. Check that the microphone is not covered or muted, and hold the phone nearer the machine.',
    );
  }
  if (level.clipped) {
    throw new SoundCaptureError(
      'clipping',
      'The sound was too loud for the microphone (the recording is clipped). Hold the phone a little farther from the machine and try again, or analyse it anyway.',
      recording,
    );
  }
  return recording;
}
