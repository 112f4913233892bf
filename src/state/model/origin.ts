// Where a part's speed came from when a tool worked it out and the user applied it: a wheel's
// road speed, a belt or gear from another part, a speed found with the strobe or by sound, a
// motor's nameplate. The words for each live in src/words/origin.ts.

/** How a speed was worked out. */
export const ORIGIN_METHODS = [
  'road-speed',
  'belt',
  'gear',
  'shaft',
  'strobe',
  'sound',
  'nameplate',
] as const;

export type OriginMethod = (typeof ORIGIN_METHODS)[number];

/**
 * The numbers and names behind a derived speed, by method (all optional, so an older or newer
 * detail never blocks a file): road-speed { groundSpeed, unit, tyreSize }; belt { fromPart,
 * driverMm, drivenMm }; gear { fromPart, driverTeeth, drivenTeeth }; shaft { fromPart };
 * strobe { features }; sound { features, precisionPercent, confirmedBy: 'strobe' when a strobe
 * reading confirmed it }; nameplate { rpm }.
 */
export type OriginDetail = Record<string, number | string>;

/** Where a speed came from, and when it was applied (ISO 8601). */
export interface SpeedOrigin {
  method: OriginMethod;
  detail: OriginDetail;
  at: string;
}

/** Most detail entries an origin keeps (a saved file refuses more). */
export const MAX_ORIGIN_DETAILS = 8;
