// The field-tool screens, bundled as one chunk that loads after the first paint (see app.tsx):
// the check and machines screens are what a phone at the machine needs first.
export { LightingScreen } from './LightingScreen';
export { CameraPlanScreen } from './CameraPlanScreen';
export { LoggerScreen } from './LoggerScreen';
export { SpeedFinderScreen } from './SpeedFinderScreen';
export { MachineChainScreen } from './MachineChainScreen';
