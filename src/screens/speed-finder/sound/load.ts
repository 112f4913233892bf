// The one seam of the sound method's code: a dynamic import, made when the by-sound panel
// opens. The bundler puts kit.ts and all it gathers (the open panel, the core's sound functions,
// fft.js, src/audio) in a chunk of its own; the state gets the functions it needs (soundCore) as
// soon as they arrive, and the phone's microphone and files become where sound comes from.
import { soundCapture, soundCore } from '../../../state/soundSpeed';
import { lazyModule } from '../../../ui/lazyModule';

export type SoundKit = typeof import('./kit');

export const soundKit = lazyModule<SoundKit>(() =>
  import('./kit').then((kit) => {
    soundCore.value = kit;
    soundCapture.value ??= kit.phoneCapture;
    return kit;
  }),
);
