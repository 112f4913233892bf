// Where sound comes from, as the by-sound panel uses it: the microphone (a listening session)
// and picked files. The app uses the phone's own (phoneCapture); the behaviour tests pass a fake.
// Part of the sound method's lazy chunk: outside it, import only its type.
import {
  decodeSoundFile,
  startListening,
  type ListenOptions,
  type ListeningSession,
  type SoundRecording,
} from '../../../audio';

export interface SoundCapture {
  /** Starts listening (from a user's action): a session that ends with a recording or a SoundCaptureError. */
  listen(opts: ListenOptions): ListeningSession;
  /** Decodes a picked file; rejects with a SoundCaptureError. */
  decodeFile(file: Blob): Promise<SoundRecording>;
}

/** The phone's own microphone and the files the user picks. */
export const phoneCapture: SoundCapture = { listen: startListening, decodeFile: decodeSoundFile };
