// Sound in: the microphone (startListening) or a picked file (decodeSoundFile), both giving a
// checked SoundRecording or a SoundCaptureError. No UI here.
export { startListening, MAX_LISTEN_S, type ListenOptions, type ListeningSession } from './listen';
export { decodeSoundFile, MAX_SOUND_FILE_BYTES, type DecodeOptions } from './decodeFile';
export { checkRecording } from './checkRecording';
export {
  SoundCaptureError,
  microphoneError,
  type SoundCaptureProblem,
  type SoundRecording,
} from './captureError';
