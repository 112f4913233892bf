// The frame rates cameras offer, for the camera planner's presets (docs/physics.md §13).
/** A frame rate cameras offer, with its exact value. */
export interface StandardFrameRate {
  /** As printed on cameras: '29.97'. */
  label: string;
  /** Exact frames per second (29.97 is 30000/1001). */
  hz: number;
  source: string;
}

const BT709 = 'ITU-R BT.709 picture rates; SMPTE ST 12-1 time code rates for the /1.001 family';

/**
 * Frame rates to offer as presets, ascending. The /1.001 rates are exact fractions, not the
 * rounded labels. 120 and 240 are the high-speed modes of phones and action cameras (common practice).
 * @example standardFrameRates[3] // { label: '29.97', hz: 29.97002997002997 (30000/1001), source: … }
 * Sources: ITU-R BT.709 (60, 50, 30, 25, 24 and each divided by 1.001); SMPTE ST 12-1.
 */
export const standardFrameRates: readonly StandardFrameRate[] = Object.freeze([
  { label: '23.976', hz: 24000 / 1001, source: BT709 },
  { label: '24', hz: 24, source: BT709 },
  { label: '25', hz: 25, source: BT709 },
  { label: '29.97', hz: 30000 / 1001, source: BT709 },
  { label: '30', hz: 30, source: BT709 },
  { label: '50', hz: 50, source: BT709 },
  { label: '59.94', hz: 60000 / 1001, source: BT709 },
  { label: '60', hz: 60, source: BT709 },
  { label: '120', hz: 120, source: 'common practice (high-speed video modes)' },
  { label: '240', hz: 240, source: 'common practice (high-speed video modes)' },
]);
