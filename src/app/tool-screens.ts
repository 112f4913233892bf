// The field-tool screens, bundled as one chunk that loads after the first paint (see
// screen-list.tsx): the check and machines screens are what a phone at the machine needs first.
export { LightingScreen } from '../screens/lighting';
export { CameraScreen } from '../screens/camera';
export { LoggerScreen } from '../screens/logger';
export { SpeedFinderScreen } from '../screens/speed-finder';
export { WholeMachineScreen } from '../screens/whole-machine';
