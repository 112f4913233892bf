// Hand-written scanners for the number readers in units.ts. Each walks the text once, left to
// right, so reading takes time in proportion to its length whatever is pasted. They replace
// regular expressions whose nested repeats (\s* next to \s*, a digit run next to a digit run)
// made V8 backtrack: 3,000 spaces and a letter took seconds, 10,000 far longer. Each scanner
// accepts exactly what its former expression matched (test/core/numberText.test.ts checks them
// against one another on short text).

/** JavaScript's \s: white space and line terminators (ECMA-262, WhiteSpace and LineTerminator). */
export function isSpace(code: number): boolean {
  return (
    (code >= 0x09 && code <= 0x0d) ||
    code === 0x20 ||
    code === 0xa0 ||
    code === 0x1680 ||
    (code >= 0x2000 && code <= 0x200a) ||
    code === 0x2028 ||
    code === 0x2029 ||
    code === 0x202f ||
    code === 0x205f ||
    code === 0x3000 ||
    code === 0xfeff
  );
}

/** An ASCII digit, as \d reads it. */
export function isDigit(code: number): boolean {
  return code >= 0x30 && code <= 0x39;
}

/** A line terminator, which "." in a regular expression does not match (ECMA-262 LineTerminator). */
function isLineEnd(code: number): boolean {
  return code === 0x0a || code === 0x0d || code === 0x2028 || code === 0x2029;
}

const PLUS = 0x2b;
const HYPHEN_MINUS = 0x2d;
const MINUS_SIGN = 0x2212;
const DOT = 0x2e;
const COMMA = 0x2c;
const APOSTROPHE = 0x27;
const SLASH = 0x2f;

function skipSpaces(text: string, from: number): number {
  let i = from;
  while (i < text.length && isSpace(text.charCodeAt(i))) i++;
  return i;
}

function skipDigits(text: string, from: number): number {
  let i = from;
  while (i < text.length && isDigit(text.charCodeAt(i))) i++;
  return i;
}

/** Leading spaces, an optional sign (+, - or −) and the spaces after it. */
function readSign(text: string): { sign: string; next: number } {
  const i = skipSpaces(text, 0);
  const c = text.charCodeAt(i);
  if (c === PLUS || c === HYPHEN_MINUS || c === MINUS_SIGN) {
    return { sign: text[i], next: skipSpaces(text, i + 1) };
  }
  return { sign: '', next: i };
}

/**
 * What follows a number, without the spaces around it; null when a line break stands inside it
 * (the former expression's "." stopped at line breaks, so such text was not a number).
 */
function trailing(text: string, from: number): string | null {
  const rest = text.slice(from).trim();
  for (let i = 0; i < rest.length; i++) if (isLineEnd(rest.charCodeAt(i))) return null;
  return rest;
}

/** The parts of a typed number: its sign, its digits as typed (with grouping and decimal marks), its power of ten and what follows. */
export interface NumberParts {
  /** "", "+", "-" or "−". */
  sign: string;
  /** Digits with any spaces, apostrophes, points and commas between them, e.g. "1 780,5". */
  digits: string;
  /** The digits of an exponent typed after the number ("3" in "1e3"), or "" for none. */
  exponent: string;
  /** What follows the number (a unit, say), trimmed. */
  rest: string;
}

/**
 * Splits typed text into a number's parts: spaces, a sign, then either a run of digits with
 * spaces, apostrophes, points and commas among them (up to its last digit) or a point or comma
 * followed by digits (".5"); an exponent straight after ("e3", "E-2"); the rest. Null when no
 * number starts the text. The same text as /^\s*([+\-−]?)\s*((?:\d[\d\s\u00a0\u202f.,']*)?\d|
 * \d*[.,]\d+)(?:[eE]([+-]?\d+))?\s*(.*?)\s*$/u matched, in one pass.
 * @example scanNumber('−1 780,5 rpm') // { sign: '−', digits: '1 780,5', exponent: '', rest: 'rpm' }
 */
export function scanNumber(text: string): NumberParts | null {
  const { sign, next: start } = readSign(text);
  const first = text.charCodeAt(start);
  let end: number;
  if (isDigit(first)) {
    // The run may hold digits, spaces and marks; the number ends at the run's last digit.
    let lastDigit = start;
    for (let i = start + 1; i < text.length; i++) {
      const c = text.charCodeAt(i);
      if (isDigit(c)) lastDigit = i;
      else if (!(isSpace(c) || c === DOT || c === COMMA || c === APOSTROPHE)) break;
    }
    end = lastDigit + 1;
  } else if ((first === DOT || first === COMMA) && isDigit(text.charCodeAt(start + 1))) {
    end = skipDigits(text, start + 1);
  } else {
    return null;
  }
  const digits = text.slice(start, end);
  let exponent = '';
  const e = text.charCodeAt(end);
  if (e === 0x65 || e === 0x45) {
    const signed = text.charCodeAt(end + 1) === PLUS || text.charCodeAt(end + 1) === HYPHEN_MINUS;
    const from = end + 1 + (signed ? 1 : 0);
    const to = skipDigits(text, from);
    if (to > from) {
      exponent = text.slice(end + 1, to);
      end = to;
    }
  }
  const rest = trailing(text, end);
  return rest === null ? null : { sign, digits, exponent, rest };
}

/** Unicode fraction signs people type or paste (Unicode "Number Forms" block), by value. */
export const FRACTIONS: Readonly<Record<string, number>> = {
  '¼': 1 / 4,
  '½': 1 / 2,
  '¾': 3 / 4,
  '⅓': 1 / 3,
  '⅔': 2 / 3,
  '⅕': 1 / 5,
  '⅖': 2 / 5,
  '⅗': 3 / 5,
  '⅘': 4 / 5,
  '⅙': 1 / 6,
  '⅚': 5 / 6,
  '⅛': 1 / 8,
  '⅜': 3 / 8,
  '⅝': 5 / 8,
  '⅞': 7 / 8,
};

/** The parts of a number written with a fraction sign: "2½ in" gives sign "", whole "2", fraction "½", rest "in". */
export interface FractionParts {
  sign: string;
  /** The whole number's digits, "" when there is none ("½"). */
  whole: string;
  /** The fraction sign, a key of FRACTIONS. */
  fraction: string;
  rest: string;
}

/**
 * A number written with a fraction sign: spaces, a sign, digits (or none), spaces, the fraction
 * sign, the rest. Null otherwise. The same text as /^\s*([+\-−]?)\s*(\d*)\s*([¼½¾⅓⅔⅕⅖⅗⅘⅙⅚⅛⅜⅝⅞])
 * \s*(.*?)\s*$/u matched, in one pass.
 * @example scanFraction('2 ½ in') // { sign: '', whole: '2', fraction: '½', rest: 'in' }
 */
export function scanFraction(text: string): FractionParts | null {
  const { sign, next: start } = readSign(text);
  const wholeEnd = skipDigits(text, start);
  const at = skipSpaces(text, wholeEnd);
  const fraction = text.charAt(at);
  if (!Object.prototype.hasOwnProperty.call(FRACTIONS, fraction)) return null;
  const rest = trailing(text, at + 1);
  return rest === null ? null : { sign, whole: text.slice(start, wholeEnd), fraction, rest };
}

/**
 * The number under the line of a time written as a fraction of a second, "1/250" or
 * "1 / 29,97 s"; null for any other text. The same text as
 * /^\s*1\s*\/\s*(\d+(?:[.,]\d+)?)\s*(s)?\s*$/i matched, in one pass.
 * @example scanOneOver('1/250 s') // '250'
 */
export function scanOneOver(text: string): string | null {
  let i = skipSpaces(text, 0);
  if (text.charCodeAt(i) !== 0x31) return null;
  i = skipSpaces(text, i + 1);
  if (text.charCodeAt(i) !== SLASH) return null;
  const start = skipSpaces(text, i + 1);
  let end = skipDigits(text, start);
  if (end === start) return null;
  const mark = text.charCodeAt(end);
  if ((mark === DOT || mark === COMMA) && isDigit(text.charCodeAt(end + 1))) {
    end = skipDigits(text, end + 1);
  }
  const rest = text.slice(end).trim();
  return rest === '' || rest === 's' || rest === 'S' ? text.slice(start, end) : null;
}

/** True when `text` holds at least one digit, "." and digits only, with at most one point: "12", "1.5", ".5", "5.". */
export function isPlainDecimal(text: string): boolean {
  let digits = 0;
  let points = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (isDigit(c)) digits++;
    else if (c === DOT) points++;
    else return false;
  }
  return digits > 0 && points <= 1;
}

/** True when a digit stands anywhere in `text`. */
export function hasDigit(text: string): boolean {
  for (let i = 0; i < text.length; i++) if (isDigit(text.charCodeAt(i))) return true;
  return false;
}
