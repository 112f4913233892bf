import { InputError, requireFinite, requireFiniteResult as finite } from '../basics/InputError';
import {
  FRACTIONS,
  hasDigit,
  isPlainDecimal,
  scanFraction,
  scanNumber,
  scanOneOver,
} from './numberText';

// Conversions at the edges (docs/physics.md: the core works in rev/s, Hz, s, m). Exact factors.

/** @example rpmToHz(1800) // 30 */
export const rpmToHz = (rpm: number): number => requireFinite(rpm, 'speed') / 60;
/** @example hzToRpm(30) // 1800 */
export const hzToRpm = (hz: number): number => finite(requireFinite(hz, 'speed') * 60, 'speed');
/** @example radPerSToHz(2 * Math.PI) // 1 */
export const radPerSToHz = (w: number): number => requireFinite(w, 'speed') / (2 * Math.PI);
/** @example hzToRadPerS(1) // 6.283185307179586 */
export const hzToRadPerS = (hz: number): number =>
  finite(requireFinite(hz, 'speed') * 2 * Math.PI, 'speed');
/** Flashes per minute to Hz. @example fpmToHz(3600) // 60 */
export const fpmToHz = (fpm: number): number => requireFinite(fpm, 'flash rate') / 60;
/** Hz to flashes per minute. @example hzToFpm(60) // 3600 */
export const hzToFpm = (hz: number): number =>
  finite(requireFinite(hz, 'flash rate') * 60, 'flash rate');
/** @example kmhToMps(36) // 10 */
export const kmhToMps = (kmh: number): number => requireFinite(kmh, 'ground speed') / 3.6;
/** @example mpsToKmh(10) // 36 */
export const mpsToKmh = (mps: number): number =>
  finite(requireFinite(mps, 'ground speed') * 3.6, 'ground speed');
/** International mile (1959): 1609.344 m. @example mphToMps(1) // 0.44704 */
export const mphToMps = (mph: number): number =>
  finite((requireFinite(mph, 'ground speed') * 1609.344) / 3600, 'ground speed');
/** @example mpsToMph(0.44704) // 1 */
export const mpsToMph = (mps: number): number =>
  finite((requireFinite(mps, 'ground speed') * 3600) / 1609.344, 'ground speed');
/** @example mmToM(25.4) // 0.0254 */
export const mmToM = (mm: number): number => requireFinite(mm, 'length') / 1000;
/** @example mToMm(0.0254) // 25.4 */
export const mToMm = (m: number): number => finite(requireFinite(m, 'length') * 1000, 'length');
/** International inch: 25.4 mm exactly. @example inToM(1) // 0.0254 */
export const inToM = (inch: number): number => requireFinite(inch, 'length') * 0.0254;
/** @example mToIn(0.0254) // 1 */
export const mToIn = (m: number): number => finite(requireFinite(m, 'length') / 0.0254, 'length');

/**
 * Reads a number as people type it: "1780", "1,780", "1 780", "29.97", "29,97", "1.780,5",
 * "-3", "+2.5", "1e3", "2½", with an optional unit after it ("1780 rpm"), which is ignored here
 * (see parseQuantity). A comma followed by exactly three digits and no decimal point is a
 * thousands separator, unless only zeros stand before it ("0,125" is 0.125); otherwise a
 * lone comma is the decimal mark. When both marks appear, the last one is the decimal mark.
 * Spaces and apostrophes group thousands only as groups of three digits ("1 780"): two
 * numbers in one field ("1780 1800", "1780, 1800", "1780 rpm 1800") are refused, never run
 * together. A fraction sign after a whole number counts as its fraction ("2½" is 2.5).
 * Throws InputError naming `field` for empty text, text that is not a number, or two numbers.
 * @example parseNumber('1,780 rpm') // 1780
 */
export function parseNumber(text: string, field = 'value'): number {
  return splitNumber(text, field).value;
}

function splitNumber(text: string, field: string): { value: number; unit: string } {
  if (typeof text !== 'string') throw new InputError(field, `${field} must be typed as text.`);
  if (text.trim() === '') throw new InputError(field, `${field} is empty: type a number.`);
  const shown = text.slice(0, 24);
  const twoNumbers = () =>
    new InputError(field, `"${shown}" holds more than one number: type one number for ${field}.`);
  const withFraction = scanFraction(text);
  if (withFraction) {
    const { sign: signText, whole, fraction, rest: unit } = withFraction;
    if (hasDigit(unit)) throw twoNumbers();
    const sign1 = signText === '-' || signText === '−' ? -1 : 1;
    return { value: sign1 * (Number(whole || '0') + FRACTIONS[fraction]), unit };
  }
  const m = scanNumber(text);
  if (!m) throw new InputError(field, `"${shown}" is not a number for ${field}.`);
  // A digit after the number ("1780 rpm 1800", "1780-1800") is a second number.
  if (hasDigit(m.rest)) throw twoNumbers();
  const sign = m.sign === '-' || m.sign === '−' ? -1 : 1;
  const digits = normaliseDigits(m.digits, text, field, twoNumbers);
  const exponent = m.exponent ? Number(m.exponent) : 0;
  const value = sign * Number(digits) * Math.pow(10, exponent);
  if (!Number.isFinite(value)) throw new InputError(field, `"${shown}" is too large for ${field}.`);
  return { value, unit: m.rest };
}

function normaliseDigits(
  raw: string,
  text: string,
  field: string,
  twoNumbers: () => InputError,
): string {
  // Spaces and apostrophes group thousands: 1 to 3 digits, then groups of exactly three (the
  // last may carry the decimals). Anything else is two numbers typed side by side.
  const groups = raw.split(/[\s\u00a0\u202f']+/);
  if (
    groups.length > 1 &&
    !(
      /^\d{1,3}$/.test(groups[0]) &&
      groups.slice(1, -1).every((g) => /^\d{3}$/.test(g)) &&
      /^\d{3}(?:[.,]\d+)?$/.test(groups[groups.length - 1])
    )
  ) {
    throw twoNumbers();
  }
  const s = groups.join('');
  const lastDot = s.lastIndexOf('.');
  const lastComma = s.lastIndexOf(',');
  let out: string;
  if (lastDot >= 0 && lastComma >= 0) {
    const decimal = lastDot > lastComma ? '.' : ',';
    const group = decimal === '.' ? ',' : '.';
    out = s.split(group).join('').replace(decimal, '.');
  } else if (lastComma >= 0) {
    const groups = s.split(',');
    const thousands =
      groups.length > 1 &&
      groups.slice(1).every((g) => g.length === 3) &&
      groups[0].length > 0 &&
      groups[0].length <= 3 &&
      !/^0+$/.test(groups[0]);
    out = thousands ? groups.join('') : groups.length === 2 ? groups.join('.') : '';
  } else {
    const groups = s.split('.');
    out =
      groups.length <= 2 ? s : groups.slice(1).every((g) => g.length === 3) ? groups.join('') : '';
  }
  if (!isPlainDecimal(out))
    throw new InputError(field, `"${text.slice(0, 24)}" is not a number for ${field}.`);
  return out;
}

/** Kinds of quantity a field holds, each with its core unit. */
export type QuantityKind =
  'speed' | 'rate' | 'time' | 'length' | 'groundSpeed' | 'angle' | 'percent';

/** Unit words accepted per kind, and the factor to the core unit (rev/s, Hz, s, m, m/s, degrees, percent). */
const UNITS: Record<QuantityKind, Record<string, number>> = {
  speed: {
    rpm: 1 / 60,
    'r/min': 1 / 60,
    'rev/min': 1 / 60,
    hz: 1,
    'rev/s': 1,
    rps: 1,
    'r/s': 1,
    'rad/s': 1 / (2 * Math.PI),
  },
  rate: {
    hz: 1,
    '/s': 1,
    fps: 1,
    'frames/s': 1,
    fpm: 1 / 60,
    '/min': 1 / 60,
    'flashes/min': 1 / 60,
    khz: 1000,
  },
  time: { s: 1, ms: 1e-3, µs: 1e-6, us: 1e-6 },
  length: { m: 1, mm: 1e-3, cm: 1e-2, in: 0.0254, '"': 0.0254 },
  groundSpeed: { 'm/s': 1, 'km/h': 1 / 3.6, kph: 1 / 3.6, mph: 1609.344 / 3600 },
  angle: { '°': 1, deg: 1 },
  percent: { '%': 1 },
};

/**
 * Reads a number with an optional unit and returns it in the core unit of `kind`; text
 * without a unit takes `defaultUnit`. "1/250" in a time field reads as 1/250 s. Two numbers
 * in one field ("1780 1800") are refused.
 * Throws InputError for text that is not a number, two numbers, a unit that does not fit the
 * kind, or arguments of the wrong type (an unknown kind, a default unit that is not text).
 * @example parseQuantity('1,780 rpm', 'speed', 'rpm') // 29.666666666666668 (rev/s)
 */
export function parseQuantity(
  text: string,
  kind: QuantityKind,
  defaultUnit: string,
  field: string = kind,
): number {
  if (typeof field !== 'string') {
    throw new InputError('field', 'The name of the field must be text.');
  }
  if (typeof kind !== 'string' || !Object.prototype.hasOwnProperty.call(UNITS, kind)) {
    throw new InputError(
      field,
      `${field}: "${typeof kind === 'string' ? kind : typeof kind}" is not a kind of quantity; use ${Object.keys(UNITS).join(', ')}.`,
    );
  }
  if (typeof defaultUnit !== 'string') {
    throw new InputError(field, `${field}: the default unit must be text, e.g. "rpm".`);
  }
  const table = UNITS[kind];
  if (kind === 'time' && typeof text === 'string') {
    const frac = scanOneOver(text);
    if (frac !== null) {
      const under = parseNumber(frac, field);
      if (under === 0) {
        throw new InputError(
          field,
          `${field}: 1/${frac.slice(0, 24)} is not a time; the number under the line must be above zero.`,
        );
      }
      return 1 / under;
    }
  }
  const { value, unit } = splitNumber(text, field);
  const key = (unit || defaultUnit).trim().toLowerCase();
  const factor = table[key] ?? table[key.replace(/\s+/g, '')];
  if (factor === undefined) {
    throw new InputError(
      field,
      `"${unit.slice(0, 24)}" is not a unit for ${field}; use ${Object.keys(table).join(', ')}.`,
    );
  }
  return finite(value * factor, field);
}

/** Unit words a kind accepts, for help text. Throws InputError for an unknown kind. */
export function unitsFor(kind: QuantityKind): string[] {
  if (typeof kind !== 'string' || !Object.prototype.hasOwnProperty.call(UNITS, kind)) {
    throw new InputError(
      'kind',
      `"${typeof kind === 'string' ? kind : typeof kind}" is not a kind of quantity; use ${Object.keys(UNITS).join(', ')}.`,
    );
  }
  return Object.keys(UNITS[kind]);
}
