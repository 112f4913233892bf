// Readers for the drive fields of the whole-machine screen that src/ui/fields.ts does not cover:
// pulley diameters and belt slip (ground speed and tyre size: ui/wheel-fields/read.ts). Like fields.ts, each takes the raw
// text and returns the value in the set-up's units (mm, percent, km/h or mph) or throws the
// core's InputError with a message fit to show beside the field.
import { InputError, parseQuantity } from '../../core';
import { sentence } from '../../ui/fields';

/** Largest pulley accepted, mm (the saved-file limit): far beyond any belt drive. */
export const MAX_PULLEY_MM = 100_000;

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
