// The recording end of the microphone chain. Runs in the AudioWorkletGlobalScope, loaded by
// listen.ts through Vite's `?worker&url` import: bundled as its own file, served from the app's
// origin (no blob: or data: URL). It copies the input, mixed to mono, into chunks and posts
// each full chunk (its buffer transferred, not copied) to the main thread; 'stop' posts the
// last partial chunk and ends processing.

// The AudioWorkletGlobalScope is not in TypeScript's libraries: the little used here.
declare class AudioWorkletProcessor {
  readonly port: MessagePort;
}
declare function registerProcessor(
  name: string,
  processor: new () => AudioWorkletProcessor & { process(inputs: Float32Array[][]): boolean },
): void;

/** Samples per message: about 85 ms at 48 kHz, so progress moves smoothly without flooding the port. */
const CHUNK = 4096;

class TrueturnRecorder extends AudioWorkletProcessor {
  private chunk = new Float32Array(CHUNK);
  private filled = 0;
  private stopped = false;

  constructor() {
    super();
    this.port.onmessage = (event: MessageEvent) => {
      if (event.data === 'stop' && !this.stopped) {
        this.stopped = true;
        this.post(this.filled);
      }
    };
  }

  process(inputs: Float32Array[][]): boolean {
    if (this.stopped) return false;
    const channels = inputs[0] ?? [];
    const frames = channels[0]?.length ?? 0;
    for (let i = 0; i < frames; i++) {
      let sum = 0;
      for (const channel of channels) sum += channel[i];
      this.chunk[this.filled++] = sum / channels.length;
      if (this.filled === CHUNK) this.post(CHUNK);
    }
    return true;
  }

  private post(count: number): void {
    const full = this.chunk.subarray(0, count).slice();
    this.port.postMessage(full, [full.buffer]);
    this.filled = 0;
  }
}

registerProcessor('trueturn-recorder', TrueturnRecorder);
