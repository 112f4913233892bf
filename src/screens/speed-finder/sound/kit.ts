// The sound method's code: the open by-sound panel (listening, files, the speeds heard), the
// core's sound functions (and fft.js under them) and the capture (src/audio). Imported by
// load.ts only, with one dynamic import, when the by-sound panel first opens: none of it is in
// the first paint or in the tool screens' chunk. Nothing outside this chunk may import the
// modules it gathers (open-sound, listen-controls, sound-result, capture) except for their types.
export { OpenSound } from './open-sound';
export { phoneCapture } from './capture';
export { joinSoundWithStrobe, soundSpectrum, speedsFromSound } from '../../../core';
