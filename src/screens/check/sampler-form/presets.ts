// Frame-rate presets offered for a camera. Values are exact: the 1001-divided rates are
// the SMPTE ST 12-1 / ITU-R BT.709 rates 24000/1001, 30000/1001, 60000/1001 and 120000/1001.

export interface FrameRatePreset {
  label: string;
  fps: number;
  group: 'Cinema' | 'Broadcast' | 'High speed';
}

export const FRAME_RATE_PRESETS: readonly FrameRatePreset[] = [
  { label: '23.976 (24000/1001)', fps: 24000 / 1001, group: 'Cinema' },
  { label: '24', fps: 24, group: 'Cinema' },
  { label: '48', fps: 48, group: 'Cinema' },
  { label: '25', fps: 25, group: 'Broadcast' },
  { label: '29.97 (30000/1001)', fps: 30000 / 1001, group: 'Broadcast' },
  { label: '30', fps: 30, group: 'Broadcast' },
  { label: '50', fps: 50, group: 'Broadcast' },
  { label: '59.94 (60000/1001)', fps: 60000 / 1001, group: 'Broadcast' },
  { label: '60', fps: 60, group: 'Broadcast' },
  { label: '100', fps: 100, group: 'High speed' },
  { label: '119.88 (120000/1001)', fps: 120000 / 1001, group: 'High speed' },
  { label: '120', fps: 120, group: 'High speed' },
  { label: '240', fps: 240, group: 'High speed' },
  { label: '480', fps: 480, group: 'High speed' },
  { label: '960', fps: 960, group: 'High speed' },
];

/** The preset equal to a frame rate (to a part in a billion), if any. */
export function presetFor(fps: number): FrameRatePreset | undefined {
  return FRAME_RATE_PRESETS.find((p) => Math.abs(p.fps - fps) <= 1e-9 * p.fps);
}
