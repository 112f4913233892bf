import { InputError, requireFinite, requireFiniteResult as finite } from './InputError';

// Conversions at the edges (physics.md: the core works in rev/s, Hz, s, m). Exact factors.

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
 * "-3", "+2.5", "1e3", with an optional unit after it ("1780 rpm"), which is ignored here
 * (see parseQuantity). A comma followed by exactly three digits and no decimal point is a
 * thousands separator, unless only zeros stand before it ("0,125" is 0.125); otherwise a
 * lone comma is the decimal mark. When both marks appear, the last one is the decimal mark.
 * Throws InputError naming `field` for empty text or text that is not a number.
 * @example parseNumber('1,780 rpm') // 1780
 */
export function parseNumber(text: string, field = 'value'): number {
  return splitNumber(text, field).value;
}

const NUMBER =
  /^\s*([+\-−]?)\s*((?:\d[\d\s\u00a0\u202f.,']*)?\d|\d*[.,]\d+)(?:[eE]([+-]?\d+))?\s*(.*?)\s*$/u;

function splitNumber(text: string, field: string): { value: number; unit: string } {
  if (typeof text !== 'string') throw new InputError(field, `${field} must be typed as text.`);
  if (text.trim() === '') throw new InputError(field, `${field} is empty: type a number.`);
  const m = NUMBER.exec(text);
  if (!m) throw new InputError(field, `"${text.slice(0, 24)}" is not a number for ${field}.`);
  const sign = m[1] === '-' || m[1] === '−' ? -1 : 1;
  const digits = normaliseDigits(m[2], text, field);
  const exponent = m[3] ? Number(m[3]) : 0;
  const value = sign * Number(digits) * Math.pow(10, exponent);
  if (!Number.isFinite(value))
    throw new InputError(field, `"${text.slice(0, 24)}" is too large for ${field}.`);
  return { value, unit: m[4] };
}

function normaliseDigits(raw: string, text: string, field: string): string {
  const s = raw.replace(/[\s\u00a0\u202f']/g, '');
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
  if (!/^\d*\.?\d+$|^\d+\.?$/.test(out))
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
 * without a unit takes `defaultUnit`. "1/250" in a time field reads as 1/250 s.
 * Throws InputError for text that is not a number or a unit that does not fit the kind.
 * @example parseQuantity('1,780 rpm', 'speed', 'rpm') // 29.666666666666668 (rev/s)
 */
export function parseQuantity(
  text: string,
  kind: QuantityKind,
  defaultUnit: string,
  field: string = kind,
): number {
  const table = UNITS[kind];
  if (kind === 'time' && typeof text === 'string') {
    const frac = /^\s*1\s*\/\s*(\d+(?:[.,]\d+)?)\s*(s)?\s*$/i.exec(text);
    if (frac) {
      const under = parseNumber(frac[1], field);
      if (under === 0) {
        throw new InputError(
          field,
          `${field}: 1/${frac[1]} is not a time; the number under the line must be above zero.`,
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
      `"${unit}" is not a unit for ${field}; use ${Object.keys(table).join(', ')}.`,
    );
  }
  return finite(value * factor, field);
}

/** Unit words a kind accepts, for help text. */
export function unitsFor(kind: QuantityKind): string[] {
  return Object.keys(UNITS[kind]);
}
