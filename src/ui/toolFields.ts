// Readers for the field tools' entries that fields.ts does not cover: lists of numbers, the
// data logger's sample rate, filter and converter, and component values for an RC stage. Like
// fields.ts, each takes the raw text and returns the value in the planner's units (Hz, s, Ω, F,
// whole counts) or throws the core's InputError with a message fit to show beside the field.
import { InputError, parseNumber, parseQuantity } from '../core';
import { readWhole, sentence as capital } from './fields';

export { readWhole };

/** Highest frequency the logger tools accept, Hz: far above any data logger or vibration sensor. */
export const MAX_LOGGER_HZ = 1e9;

function frequency(text: string, what: string): number {
  const hz = parseQuantity(text, 'rate', 'hz', what);
  if (!(hz > 0) || hz > MAX_LOGGER_HZ) {
    throw new InputError(what, `${capital(what)} must be above 0 Hz and at most 1,000,000,000 Hz.`);
  }
  return hz;
}

/** A data logger's sample rate, samples per second (Hz; "2 kHz" works). */
export const readSampleRateHz = (text: string): number => frequency(text, 'sample rate');

/** A filter cutoff, Hz. */
export const readCutoffHz = (text: string): number => frequency(text, 'cutoff frequency');

/** A tone the user adds, Hz. */
export const readToneHz = (text: string): number => frequency(text, 'tone');

/** Shaft harmonics to include: 1× … N×. */
export const readHarmonics = (text: string): number =>
  readWhole(text, 'harmonics', 1, 200, /[×x]$/i);

/** Blade count of a fan or impeller. */
export const readBladeCount = (text: string): number =>
  readWhole(text, 'blade count', 1, 1000, /blades?$/i);

/** Tooth count of a gear. */
export const readTeeth = (text: string): number =>
  readWhole(text, 'tooth count', 1, 100_000, /(teeth|tooth)$/i);

/** Butterworth filter order (poles). */
export const readFilterOrder = (text: string): number => readWhole(text, 'filter order', 1, 20);

/** Converter resolution, bits. */
export const readBits = (text: string): number =>
  readWhole(text, 'converter bits', 1, 64, /bits?$/i);

/** A number with an optional SI-prefixed unit after it, read with `units` (lower-case keys, "" = the bare number's unit). */
function withUnit(
  text: string,
  what: string,
  units: Record<string, number>,
  min: number,
  max: number,
  say: string,
  span: string,
): number {
  if (typeof text !== 'string' || text.trim() === '')
    throw new InputError(what, `${capital(what)} is empty: type a number.`);
  const m = splitUnit(text.trim());
  const unit = (m?.unit ?? '').toLowerCase();
  const factor = units[unit];
  if (!m || factor === undefined) {
    throw new InputError(
      what,
      `"${text.trim().slice(0, 24)}" is not a ${what}; type it as ${say}.`,
    );
  }
  const value = parseNumber(m.number, what) * factor;
  if (!(value >= min && value <= max)) {
    throw new InputError(what, `${capital(what)} must lie between ${span}.`);
  }
  return value;
}

/**
 * Text up to its last digit, and the unit word after it (no spaces, digits, points or commas
 * inside it), in one pass from the end; null when there is no digit, or the unit is not one
 * word. Reads what /^(.*?\d)\s*([^\d\s.,]*)\s*$/u matched, without its backtracking.
 * @example splitUnit('2.2 kΩ') // { number: '2.2', unit: 'kΩ' }
 */
function splitUnit(text: string): { number: string; unit: string } | null {
  let last = text.length - 1;
  while (last >= 0 && !(text[last] >= '0' && text[last] <= '9')) last--;
  if (last < 0) return null;
  const number = text.slice(0, last + 1);
  const unit = text.slice(last + 1).trim();
  // "." in the former expression stopped at line breaks; \s, "." and "," cannot be in a unit.
  if (/[\n\r\u2028\u2029]/.test(number) || /[\s.,]/.test(unit)) return null;
  return { number, unit };
}

const OHMS: Record<string, number> = {
  '': 1,
  ω: 1,
  ohm: 1,
  ohms: 1,
  k: 1e3,
  kω: 1e3,
  kohm: 1e3,
  m: 1e6,
  mω: 1e6,
  mohm: 1e6,
};

/** Resistance in ohms: "10000", "10k", "10 kΩ", "2.2M". */
export function readResistanceOhm(text: string): number {
  return withUnit(text, 'resistance', OHMS, 1e-3, 1e12, '10k or 2200 Ω', '1 mΩ and 1,000 GΩ');
}

const FARADS: Record<string, number> = {
  '': 1e-9,
  nf: 1e-9,
  n: 1e-9,
  pf: 1e-12,
  p: 1e-12,
  µf: 1e-6,
  μf: 1e-6,
  uf: 1e-6,
  µ: 1e-6,
  μ: 1e-6,
  u: 1e-6,
  mf: 1e-3,
  f: 1,
};

/** Capacitance in farads; a bare number is in nF ("100" = 100 nF); "4.7 µF", "470p" work too. */
export function readCapacitanceF(text: string): number {
  return withUnit(
    text,
    'capacitance',
    FARADS,
    1e-15,
    1,
    '100 nF, 4.7 µF or 470 pF',
    '0.001 pF and 1 F',
  );
}

/**
 * Splits a typed list into its items: spaces or semicolons separate them, and so does a comma
 * followed by a space ("48, 100"); a comma inside a number stays part of it ("29,97"). A word
 * after a number is its unit and stays with it ("50 Hz 2 kHz" is two items). Past `most` items
 * it stops, keeping one more item to tell a list that is too long.
 * @example splitList('24; 29,97  60, 120') // ['24', '29,97', '60', '120']
 * @example splitList('50 Hz 2 kHz') // ['50 Hz', '2 kHz']
 */
export function splitList(text: string, most = Infinity): string[] {
  if (typeof text !== 'string') return [];
  // The words of each item, joined once at the end (a long run of words stays cheap).
  const items: string[][] = [];
  // A word runs until a space or semicolon, or a comma with a space after it; each character
  // is looked at once. Stops once past `most` items, so a pasted page is not cut up whole.
  const word = /(?:[^\s;,]|,(?!\s))+/g;
  const trimmed = text.trim();
  for (let m = word.exec(trimmed); m !== null && items.length <= most; m = word.exec(trimmed)) {
    const token = m[0];
    if (startsAsUnit(token) && items.length > 0) items[items.length - 1].push(token);
    else items.push([token]);
  }
  return items.map((words) => words.join(' '));
}

/** True unless the token starts like a number: a digit, a sign, a point or a comma. */
function startsAsUnit(token: string): boolean {
  const c = token[0];
  return !((c >= '0' && c <= '9') || c === '+' || c === '-' || c === '−' || c === '.' || c === ',');
}

/**
 * Reads every item of a list with `readOne`; a bad item is named by its place in the list.
 * An empty list is allowed when `min` is 0. Throws InputError for more than `max` items.
 * @example readList('500 1000', readExposureSeconds, 'shutter speeds', 0, 12) // [0.002, 0.001]
 */
export function readList(
  text: string,
  readOne: (item: string) => number,
  what: string,
  min: number,
  max: number,
): number[] {
  const items = splitList(text, max);
  if (items.length < min) {
    throw new InputError(
      what,
      min === 1
        ? `Give at least one value for ${what}.`
        : `Give at least ${min} values for ${what}.`,
    );
  }
  if (items.length > max) throw new InputError(what, `At most ${max} values for ${what}.`);
  return items.map((item, i) => {
    try {
      return readOne(item);
    } catch (error) {
      if (error instanceof InputError) {
        throw new InputError(what, `Item ${i + 1} ("${item.slice(0, 16)}"): ${error.message}`);
      }
      throw error;
    }
  });
}
