// Readers for the drive fields of the whole-machine screen that src/ui/fields.ts does not cover:
// pulley diameters, belt slip, ground speed and tyre size. Like fields.ts, each takes the raw
// text and returns the value in the set-up's units (mm, percent, km/h or mph) or throws the
// core's InputError with a message fit to show beside the field.
import { InputError, mpsToKmh, mpsToMph, parseQuantity, tyreDiameterM } from '../../core';
import { sentence } from '../../ui/fields';
import type { WheelSpec } from '../../state/model';

/** Largest pulley accepted, mm (the saved-file limit): far beyond any belt drive. */
export const MAX_PULLEY_MM = 100_000;
/** Fastest ground speed accepted, in either unit (the saved-file limit). */
export const MAX_GROUND_SPEED = 1000;

/** A pulley diameter: mm by default; "4 in", "0.1 m" work too. */
export function readPulleyMm(text: string, what: string): number {
  const mm = parseQuantity(text, 'length', 'mm', what) * 1000;
  if (!(mm > 0) || mm > MAX_PULLEY_MM) {
    throw new InputError(
      what,
      `${sentence(what)} must be above 0 mm and at most ${MAX_PULLEY_MM.toLocaleString('en-US')} mm.`,
    );
  }
  return mm;
}

/** Belt slip, percent: the driven pulley runs up to this much slower (the core allows 0–20 %). */
export function readBeltSlipPercent(text: string): number {
  const percent = parseQuantity(text, 'percent', '%', 'belt slip');
  if (!(percent >= 0 && percent <= 20))
    throw new InputError('belt slip', 'Belt slip must be from 0 % to 20 %.');
  return percent;
}

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
