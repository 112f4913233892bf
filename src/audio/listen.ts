// Records a few seconds from the microphone, as raw as the browser allows: echo cancellation,
// noise suppression and automatic gain control are turned off (they bend and pump the very
// tones the speed is read from). Samples come through an AudioWorklet into one buffer of
// fixed size; nothing is stored or sent anywhere.
import workletUrl from './recorderWorklet.ts?worker&url';
import { checkRecording } from './checkRecording';
import { microphoneError, SoundCaptureError, type SoundRecording } from './captureError';

/** Longest recording offered, s: the analysis reads at most 10 s, and a phone's memory stays small. */
export const MAX_LISTEN_S = 30;

export interface ListenOptions {
  /** Seconds to record. Default 4; at most MAX_LISTEN_S. */
  seconds?: number;
  /** Called as samples arrive: seconds recorded so far, and the total asked for. */
  onProgress?: (recordedS: number, totalS: number) => void;
  /** Where microphones come from (default navigator.mediaDevices). */
  mediaDevices?: MediaDevices;
}

export interface ListeningSession {
  /** The recording, once the time is up or stop() is called; rejects with a SoundCaptureError. */
  recording: Promise<SoundRecording>;
  /** Ends early, keeping what was recorded. */
  stop(): void;
  /** Ends and discards: `recording` rejects with 'cancelled'. */
  cancel(): void;
}

/**
 * Starts recording (call it from the Listen button's handler: browsers start audio only on a
 * user's action). The microphone is released as soon as the recording ends, however it ends.
 */
export function startListening(opts: ListenOptions = {}): ListeningSession {
  const seconds = Math.min(MAX_LISTEN_S, Math.max(0.5, opts.seconds ?? 4));
  // Set by stop() or cancel(), read by the recording as it goes.
  const asked: { to?: 'stop' | 'cancel'; wake?: () => void } = {};
  const request = (what: 'stop' | 'cancel') => {
    asked.to ??= what;
    asked.wake?.();
  };
  const wasCancelled = () => asked.to === 'cancel';

  const recording = (async (): Promise<SoundRecording> => {
    const devices = opts.mediaDevices ?? globalThis.navigator?.mediaDevices;
    if (!devices?.getUserMedia || typeof AudioWorkletNode === 'undefined') {
      throw new SoundCaptureError(
        'no-audio-support',
        'This browser cannot record sound here (it needs a secure page and audio worklets). Record with the phone’s own recorder and open the file here.',
      );
    }
    let stream: MediaStream;
    try {
      stream = await devices.getUserMedia({
        audio: { echoCancellation: false, noiseSuppression: false, autoGainControl: false },
        video: false,
      });
    } catch (error) {
      throw microphoneError(error);
    }
    const context = new AudioContext();
    try {
      if (wasCancelled()) throw cancelled();
      await context.resume();
      await context.audioWorklet.addModule(workletUrl);
      const source = context.createMediaStreamSource(stream);
      const node = new AudioWorkletNode(context, 'trueturn-recorder', {
        numberOfInputs: 1,
        numberOfOutputs: 1,
        outputChannelCount: [1],
      });
      // A silent path to the output keeps the graph pulling samples through the recorder.
      const mute = context.createGain();
      mute.gain.value = 0;
      source.connect(node).connect(mute).connect(context.destination);

      const rateHz = context.sampleRate;
      const buffer = new Float32Array(Math.ceil(seconds * rateHz));
      let filled = 0;
      await new Promise<void>((done) => {
        asked.wake = done;
        node.port.onmessage = (event: MessageEvent<Float32Array>) => {
          const chunk = event.data;
          const take = Math.min(chunk.length, buffer.length - filled);
          buffer.set(chunk.subarray(0, take), filled);
          filled += take;
          opts.onProgress?.(filled / rateHz, seconds);
          if (filled >= buffer.length) done();
        };
        if (asked.to) done();
      });
      node.port.onmessage = null;
      node.port.postMessage('stop');
      source.disconnect();
      if (wasCancelled()) throw cancelled();
      const samples = buffer.slice(0, filled);
      return checkRecording({ samples, sampleRateHz: rateHz, durationS: filled / rateHz });
    } catch (error) {
      if (error instanceof SoundCaptureError) throw error;
      throw new SoundCaptureError(
        'no-audio-support',
        'Recording could not start in this browser. Record with the phone’s own recorder and open the file here.',
      );
    } finally {
      for (const track of stream.getTracks()) track.stop();
      void context.close();
    }
  })();

  return { recording, stop: () => request('stop'), cancel: () => request('cancel') };
}

function cancelled(): SoundCaptureError {
  return new SoundCaptureError('cancelled', 'Recording stopped; nothing was kept.');
}
