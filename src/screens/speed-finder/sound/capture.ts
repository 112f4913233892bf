// Where sound comes from, as the by-sound panel uses it: the phone's own microphone and picked
// files (the SoundCapture seam of state/soundSpeed.ts; the behaviour tests pass a fake).
// Part of the sound method's lazy chunk: outside it, import only its type.
import { decodeSoundFile, MAX_SOUND_FILE_BYTES, startListening } from '../../../audio';
import { MAX_RECORDING_S } from '../../../core';
import type { SoundCapture } from '../../../state/soundSpeed';

/** The phone's own microphone and the files the user picks. */
export const phoneCapture: SoundCapture = {
  listen: startListening,
  decodeFile: decodeSoundFile,
  limits: { maxFileBytes: MAX_SOUND_FILE_BYTES, maxRecordingS: MAX_RECORDING_S },
};
