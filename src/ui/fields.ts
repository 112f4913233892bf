// Reading what a person types into a field. Every reader takes the raw text and returns the
// value in the set-up's own units (rpm, flashes per minute, percent, ms…) or throws the
// core's InputError with a message fit to show beside the field. Numbers are read by the
// core's parseNumber/parseQuantity, so "1,780", "29,97" and "1780 rpm" all work.
import { InputError, MAX_SYMMETRY, parseNumber, parseQuantity } from '../core';
import { MAX_RATE_HZ, MAX_SPEED_RPM, type SpeedUnit } from '../state/model';

/** What reading a field gave: a value (a number, or a list of them), or the message to show beside it. */
export type FieldReading<T = number> = { ok: true; value: T } | { ok: false; message: string };

/** Longest text a field for one number takes: room for any number written with spaces and a unit. */
export const MAX_NUMBER_CHARS = 64;
/** Longest text a field for a list of numbers takes (lists hold at most a dozen or so values). */
export const MAX_LIST_CHARS = 1000;

/**
 * Runs a reader and turns its InputError into a message; any other error is a bug and rethrows.
 * Text longer than `maxChars` characters is refused before the reader sees it: no number needs
 * more, and a page of pasted text gets a plain answer rather than a quote of itself.
 */
export function readField<T extends number | readonly number[]>(
  text: string,
  reader: (text: string) => T,
  maxChars = MAX_NUMBER_CHARS,
): FieldReading<T> {
  if (longerThan(text, maxChars)) {
    return {
      ok: false,
      message: `Too long: type at most ${maxChars.toLocaleString('en-US')} characters.`,
    };
  }
  try {
    const value = reader(text);
    const numbers: readonly number[] = typeof value === 'number' ? [value] : value;
    if (!numbers.every(Number.isFinite))
      return { ok: false, message: 'This gives no usable number.' };
    return { ok: true, value };
  } catch (error) {
    if (error instanceof InputError) return { ok: false, message: sentence(error.message) };
    throw error;
  }
}

/** More than `max` characters (code points, so "µ" or an emoji counts once); stops counting past it. */
function longerThan(text: string, max: number): boolean {
  if (typeof text !== 'string' || text.length <= max) return false;
  let count = 0;
  for (const _char of text) if (++count > max) return true;
  return false;
}

/** The text with its first letter in capitals, to open a message with a field's name. */
export function sentence(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

function within(value: number, min: number, max: number, what: string, unit = ''): number {
  if (value < min || value > max) {
    const u = unit ? ` ${unit}` : '';
    throw new InputError(what, `${sentence(what)} must be from ${min}${u} to ${max}${u}.`);
  }
  return value;
}

function above(value: number, min: number, max: number, what: string, unit = ''): number {
  if (value <= min || value > max) {
    const u = unit ? ` ${unit}` : '';
    throw new InputError(
      what,
      `${sentence(what)} must be above ${min}${u} and at most ${max}${u}.`,
    );
  }
  return value;
}

const SPEED_UNIT_WORD: Record<SpeedUnit, string> = { rpm: 'rpm', Hz: 'hz', 'rad/s': 'rad/s' };

/** Signed speed typed in `unit` (or with its own unit word) → rpm. */
export function readSpeedRpm(text: string, unit: SpeedUnit): number {
  const hz = parseQuantity(text, 'speed', SPEED_UNIT_WORD[unit], 'speed');
  // Through rev/s and back, "2000" rpm comes out as 2000.0000000000002; 15 significant digits
  // (more than anyone types, fewer than a double holds) give back the number typed, which is
  // what a saved machine, a share link and a CSV should carry.
  const rpm = Number((hz * 60).toPrecision(15));
  return within(rpm, -MAX_SPEED_RPM, MAX_SPEED_RPM, 'speed', 'rpm');
}

/** Text that stands for a plain number: an optional sign, digits with grouping or a decimal mark, nothing else. */
const BARE_NUMBER = /^[+\-−]?[\d\s.,'\u00a0\u202f]+$/;

/**
 * A whole number from min to max, such as "6" or "6 blades": trailing words are allowed only
 * when `words` matches them. parseNumber ignores whatever follows the number, so the rest is
 * checked here: "1/0" or "12abc" is not a whole number. `words` matches the word at the end
 * only, with no leading \s* (the spaces are trimmed here): an expression that starts with an
 * open-ended repeat is retried at every position and takes time in the square of the length.
 * @example readWhole('6 blades', 'features', 1, 100, /blades?$/i) // 6
 */
export function readWhole(
  text: string,
  what: string,
  min: number,
  max: number,
  words?: RegExp,
): number {
  const trimmed = typeof text === 'string' ? text.trim() : '';
  const bare = words ? trimmed.replace(words, '').trim() : trimmed;
  if (bare !== '' && !BARE_NUMBER.test(bare)) {
    throw new InputError(what, `"${trimmed.slice(0, 24)}" is not a whole number.`);
  }
  const n = parseNumber(bare === '' ? text : bare, what);
  if (!Number.isInteger(n) || n < min || n > max) {
    throw new InputError(what, `${sentence(what)} must be a whole number from ${min} to ${max}.`);
  }
  return n;
}

/** Identical features on the part: blades, spokes, jaws, bolts. */
export function readFeatures(text: string): number {
  const words = /(blades?|spokes?|jaws?|bolts?|marks?|features?|teeth|tooth)$/i;
  return readWhole(text, 'features', 1, Math.min(MAX_SYMMETRY, 10_000), words);
}

/** Speed tolerance, ± percent. */
export function readTolerancePercent(text: string): number {
  return within(parseQuantity(text, 'percent', '%', 'tolerance'), 0, 50, 'tolerance', '%');
}

/** Motor poles: an even whole number. */
export function readPoles(text: string): number {
  const poles = readWhole(text, 'poles', 2, 200, /poles?$/i);
  if (poles % 2 !== 0)
    throw new InputError('poles', 'Poles come in pairs: give an even number such as 2, 4 or 6.');
  return poles;
}

/** How far a speed may lie from a nameplate's, ± percent: more than 0, at most 50 (beyond it the nameplate says nothing). */
export function readPlusMinusPercent(text: string): number {
  const v = within(parseQuantity(text, 'percent', '%', '±'), 0, 50, '±', '%');
  if (v === 0) throw new InputError('±', 'Give how far off the speed may be: more than 0 %.');
  return v;
}

/** Motor slip, percent of synchronous speed. */
export function readSlipPercent(text: string): number {
  return within(parseQuantity(text, 'percent', '%', 'slip'), 0, 50, 'slip', '%');
}

/** Camera frame rate, frames per second. */
export function readFrameRate(text: string): number {
  return above(
    parseQuantity(text, 'rate', 'fps', 'frame rate'),
    0,
    MAX_RATE_HZ,
    'frame rate',
    'frames/s',
  );
}

/** Shutter angle, degrees. */
export function readShutterAngle(text: string): number {
  return above(parseQuantity(text, 'angle', '°', 'shutter angle'), 0, 360, 'shutter angle', '°');
}

/**
 * Exposure time, seconds. A bare number of 1 or more means 1/x s, as cameras show it
 * ("500" = 1/500 s); a bare fraction below 1 is seconds ("0.004"); "1/500", "2 ms" and
 * "0.004 s" are read as written.
 */
export function readExposureSeconds(text: string): number {
  // One character class, anchored: no nested repeats to backtrack over (\s* beside [\d\s]+ was cubic).
  const bare = /^[\d.,\s]+$/.test(text);
  let seconds: number;
  if (bare) {
    const x = parseNumber(text, 'exposure');
    if (x <= 0)
      throw new InputError('exposure', 'Exposure must be longer than zero: type 500 for 1/500 s.');
    seconds = x >= 1 ? 1 / x : x;
  } else {
    seconds = parseQuantity(text, 'time', 's', 'exposure');
  }
  if (seconds < 1e-6 || seconds > 1) {
    throw new InputError(
      'exposure',
      'Exposure must lie between 1/1,000,000 s and 1 s: type 500 for 1/500 s.',
    );
  }
  return seconds;
}

/** Rolling-shutter readout, ms (0 = a global shutter). */
export function readReadoutMs(text: string): number {
  return within(
    parseQuantity(text, 'time', 'ms', 'readout time') * 1000,
    0,
    1000,
    'readout time',
    'ms',
  );
}

/** A flash rate typed in flashes per minute or Hz (or with its own unit word) → flashes per minute. */
export function readFlashRateFpm(text: string, unit: 'fpm' | 'Hz', what = 'flash rate'): number {
  const hz = parseQuantity(text, 'rate', unit === 'fpm' ? 'fpm' : 'hz', what);
  return above(hz * 60, 0, MAX_RATE_HZ * 60, what, 'flashes/min');
}

/** A lighting flicker frequency, Hz. */
export function readFlickerHz(text: string): number {
  return above(
    parseQuantity(text, 'rate', 'hz', 'flicker frequency'),
    0,
    MAX_RATE_HZ,
    'flicker frequency',
    'Hz',
  );
}

/** Percent flicker (modulation depth), 0–100. */
export function readModulationPercent(text: string): number {
  return within(parseQuantity(text, 'percent', '%', 'modulation'), 0, 100, 'modulation', '%');
}

/** A PWM light's duty cycle, percent: above 0 and below 100 (at either end the light would not switch). */
export function readDutyPercent(text: string): number {
  const duty = parseQuantity(text, 'percent', '%', 'duty cycle');
  if (!(duty > 0 && duty < 100)) {
    throw new InputError('duty cycle', 'Duty cycle must be above 0 % and below 100 %.');
  }
  return duty;
}

/** Wanted slow forward creep, rpm (a positive number). */
export function readCreepRpm(text: string): number {
  const hz = parseQuantity(text, 'speed', 'rpm', 'creep');
  return above(hz * 60, 0, 10_000, 'creep', 'rpm');
}
