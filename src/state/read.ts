// The strict readers every check of outside data is built from (a saved record, an imported
// file, a share link): plain groups of fields, lists, numbers in range, plain text, times. Each
// refuses anything unexpected with a DataError naming where the problem is. Results are always
// fresh values, never the input itself, so nothing hidden in the input survives a check.

/** Refused outside data. `path` says where ("machine 3 › parts › 1 › features"). */
export class DataError extends Error {
  readonly path: string;
  constructor(path: string, message: string) {
    super(message);
    this.name = 'DataError';
    this.path = path;
  }
}

/** Longest name of a machine or part, in characters. */
export const MAX_NAME_CHARS = 80;
/** Longest crew note of a machine, in characters. */
export const MAX_NOTES_CHARS = 2000;

/** Keys that could reach an object's prototype if some later code copied the data carelessly. */
const HOSTILE_KEYS: ReadonlySet<string> = new Set(['__proto__', 'constructor', 'prototype']);

/** Joins a path and a field name: "machine 3" + "parts" → "machine 3 › parts". */
export function pathTo(path: string, field: string | number): string {
  return typeof field === 'number' ? `${path} › ${field + 1}` : `${path} › ${field}`;
}

/**
 * Reads `x` as a plain group of fields holding exactly the `required` keys and any of the
 * `optional` ones. Returns the own values in a prototype-free record (read it, never return it).
 * Throws DataError for anything else: not an object, an array, an unknown, hostile or missing key,
 * an accessor instead of a plain value.
 * @example readRecord({ a: 1 }, 'file', ['a']).a // 1
 */
export function readRecord(
  x: unknown,
  path: string,
  required: readonly string[],
  optional: readonly string[] = [],
): Record<string, unknown> {
  if (typeof x !== 'object' || x === null || Array.isArray(x)) {
    throw new DataError(path, `${path} must be a group of fields {…} (got ${describe(x)}).`);
  }
  const proto: unknown = Object.getPrototypeOf(x);
  if (proto !== Object.prototype && proto !== null) {
    throw new DataError(path, `${path} must be a plain group of fields.`);
  }
  const out: Record<string, unknown> = Object.create(null) as Record<string, unknown>;
  for (const key of Reflect.ownKeys(x)) {
    if (typeof key !== 'string') throw new DataError(path, `${path} holds a field without a name.`);
    if (HOSTILE_KEYS.has(key)) {
      throw new DataError(
        path,
        `${path} contains a field called "${key}", which is never allowed in Trueturn data.`,
      );
    }
    if (!required.includes(key) && !optional.includes(key)) {
      throw new DataError(path, `${path} has a field this app does not know: ${quoteKey(key)}.`);
    }
    const d = Object.getOwnPropertyDescriptor(x, key);
    if (!d || !('value' in d)) throw new DataError(path, `${path} › ${key} must be plain data.`);
    // An optional field stored as undefined (possible in a browser store) counts as absent.
    if (d.value === undefined && optional.includes(key)) continue;
    out[key] = d.value;
  }
  for (const key of required) {
    if (!(key in out)) throw new DataError(pathTo(path, key), `${pathTo(path, key)} is missing.`);
  }
  return out;
}

/**
 * Reads `x` as a list of `min` to `max` items and returns a fresh array of them.
 * `what` names the items in the message ("parts", "machines").
 * @example readList([1, 2], 'set-up › parts', 1, 20, 'parts') // [1, 2]
 */
export function readList(
  x: unknown,
  path: string,
  min: number,
  max: number,
  what: string,
): unknown[] {
  if (!Array.isArray(x) || Object.getPrototypeOf(x) !== Array.prototype) {
    throw new DataError(path, `${path} must be a list […] (got ${describe(x)}).`);
  }
  if (x.length < min || x.length > max) {
    throw new DataError(path, `${path} must hold ${min} to ${max} ${what} (it holds ${x.length}).`);
  }
  const out: unknown[] = [];
  for (let i = 0; i < x.length; i++) {
    const d = Object.getOwnPropertyDescriptor(x, i);
    if (!d || !('value' in d))
      throw new DataError(pathTo(path, i), `${pathTo(path, i)} is missing.`);
    out.push(d.value);
  }
  return out;
}

/** A finite number, or DataError. */
export function finite(x: unknown, path: string): number {
  if (typeof x !== 'number' || !Number.isFinite(x)) {
    throw new DataError(path, `${path} must be a number (got ${describe(x)}).`);
  }
  return x;
}

/** A finite number in [min, max]. */
export function between(x: unknown, path: string, min: number, max: number): number {
  const v = finite(x, path);
  if (v < min || v > max) {
    throw new DataError(path, `${path} must be a number from ${min} to ${max} (got ${v}).`);
  }
  return v;
}

/** A finite number in (0, max]. */
export function aboveZero(x: unknown, path: string, max: number): number {
  const v = finite(x, path);
  if (v <= 0 || v > max) {
    throw new DataError(path, `${path} must be a number above 0 and at most ${max} (got ${v}).`);
  }
  return v;
}

/** A whole number in [min, max]. */
export function whole(x: unknown, path: string, min: number, max: number): number {
  const v = finite(x, path);
  if (!Number.isInteger(v) || v < min || v > max) {
    throw new DataError(path, `${path} must be a whole number from ${min} to ${max} (got ${v}).`);
  }
  return v;
}

/** One of the listed values. */
export function oneOf<T extends string | number>(
  x: unknown,
  path: string,
  allowed: readonly T[],
): T {
  const found = allowed.find((a) => a === x);
  if (found === undefined) {
    const list = allowed.map((a) => (typeof a === 'string' ? `"${a}"` : String(a))).join(', ');
    throw new DataError(path, `${path} must be one of ${list} (got ${describe(x)}).`);
  }
  return found;
}

// Characters refused in names and notes: control characters (line breaks are allowed in notes
// only), unpaired surrogates (not valid text, they would not survive UTF-8), the direction
// overrides that can make text display differently from what it holds, and line/paragraph
// separators.
const FORBIDDEN_IN_NAME = /[\p{Cc}\p{Cs}\u2028\u2029\u202A-\u202E\u2066-\u2069]/u;
const FORBIDDEN_IN_NOTES = /[\p{Cs}\u2028\u2029\u202A-\u202E\u2066-\u2069]|(?![\t\n\r])\p{Cc}/u;

/** Plain text of at most `maxChars` characters; `minChars` 1 also refuses a blank name. */
export function plainText(
  x: unknown,
  path: string,
  minChars: 0 | 1,
  maxChars: number,
  allowLineBreaks = false,
): string {
  if (typeof x !== 'string')
    throw new DataError(path, `${path} must be text (got ${describe(x)}).`);
  if (minChars === 1 && x.trim() === '') throw new DataError(path, `${path} must not be blank.`);
  const chars = [...x].length;
  if (chars > maxChars) {
    throw new DataError(path, `${path} must be at most ${maxChars} characters (it has ${chars}).`);
  }
  if ((allowLineBreaks ? FORBIDDEN_IN_NOTES : FORBIDDEN_IN_NAME).test(x)) {
    const what = allowLineBreaks ? 'plain text' : 'plain text on one line';
    throw new DataError(path, `${path} must be ${what}, without control or direction characters.`);
  }
  return x;
}

const ISO_TIME = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d{1,9})?)?(Z|[+-]\d{2}:\d{2})$/;

/**
 * An ISO 8601 date and time with a zone, e.g. "2025-03-12T08:30:00.000Z", or DataError.
 * @example validateIsoTime('2025-03-12T08:30:00Z', 'exportedAt') // '2025-03-12T08:30:00Z'
 */
export function validateIsoTime(x: unknown, path: string): string {
  if (
    typeof x !== 'string' ||
    x.length > 40 ||
    !ISO_TIME.test(x) ||
    !Number.isFinite(Date.parse(x))
  ) {
    throw new DataError(
      path,
      `${path} must be a date and time such as "2025-03-12T08:30:00Z" (got ${describe(x)}).`,
    );
  }
  return x;
}

/** A short, safe description of a value for a message; never the whole of a long text. */
export function describe(x: unknown): string {
  if (x === null) return 'null';
  if (x === undefined) return 'nothing';
  if (typeof x === 'string') {
    const chars = [...x];
    const shown = chars.slice(0, 20).join('');
    return `the text ${JSON.stringify(shown)}${chars.length > 20 ? '…' : ''}`;
  }
  if (typeof x === 'number') return String(x);
  if (typeof x === 'boolean') return String(x);
  if (Array.isArray(x)) return 'a list';
  if (typeof x === 'object') return 'a group of fields';
  return `a ${typeof x}`;
}

function quoteKey(key: string): string {
  const chars = [...key];
  return JSON.stringify(chars.slice(0, 40).join('')) + (chars.length > 40 ? '…' : '');
}
