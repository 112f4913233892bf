// The field-tool screens, bundled as one chunk that loads after the first paint (see app.tsx):
// the check and machines screens are what a phone at the machine needs first.
export { LightingScreen } from '../screens/lighting';
export { CameraPlanScreen } from '../screens/camera';
export { LoggerScreen } from '../screens/logger';
export { SpeedFinderScreen } from '../screens/speed-finder';
export { MachineChainScreen } from '../screens/whole-machine';
