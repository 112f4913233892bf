// Readers for a wheel's fields: like src/ui/fields.ts, each takes the raw text and returns the
// value in the set-up's units (km/h or mph; the tyre size as text) or throws the core's
// InputError with a message fit to show beside the field.
import { InputError, mpsToKmh, mpsToMph, parseQuantity, tyreDiameterM } from '../../core';
import type { WheelSpec } from '../../state/model';

/** Fastest ground speed accepted, in either unit (the saved-file limit). */
export const MAX_GROUND_SPEED = 1000;

/** Ground speed in `unit` (signed: backward is negative); "30 mph" in a km/h field is converted. */
export function readGroundSpeed(text: string, unit: WheelSpec['unit']): number {
  const mps = parseQuantity(text, 'groundSpeed', unit, 'ground speed');
  const value = unit === 'mph' ? mpsToMph(mps) : mpsToKmh(mps);
  if (!(Math.abs(value) <= MAX_GROUND_SPEED)) {
    throw new InputError(
      'ground speed',
      `Ground speed must be between −${MAX_GROUND_SPEED} and ${MAX_GROUND_SPEED} ${unit}.`,
    );
  }
  return value;
}

/** An ISO metric tyre size such as 205/55R16, checked by the core; returns it without surrounding spaces. */
export function readTyreSize(text: string): string {
  const size = typeof text === 'string' ? text.trim() : '';
  if (size === '')
    throw new InputError('tyre size', 'Type the tyre size as on its sidewall, e.g. 205/55R16.');
  if ([...size].length > 40)
    throw new InputError('tyre size', 'A tyre size is at most 40 characters, e.g. 205/55R16.');
  tyreDiameterM(size);
  return size;
}
