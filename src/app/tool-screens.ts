// The field-tool screens, bundled as one chunk that loads after the first paint (see
// screen-list.tsx): the check screen is what a phone at the machine needs first.
export { MachinesScreen } from '../screens/machines';
export { LightingScreen } from '../screens/lighting';
export { CameraScreen } from '../screens/camera';
export { LoggerScreen } from '../screens/logger';
export { SpeedFinderScreen } from '../screens/speed-finder';
export { WholeMachineScreen } from '../screens/whole-machine';
