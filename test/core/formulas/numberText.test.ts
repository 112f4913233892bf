// The number scanners (src/core/numberText.ts) against the regular expressions they replace,
// and the core's text readers on hostile text of 10,000 and 100,000 characters. No timing here
// (speed is measured in `npm run bench`): a reader that backtracked would not finish these
// cases at all, and the scanners' character reads are counted to show each reads its text a
// fixed number of times, not once per start position.
import fc from 'fast-check';
import { afterEach, describe, expect, it } from 'vitest';
import {
  isPlainDecimal,
  scanFraction,
  scanNumber,
  scanOneOver,
} from '../../../src/core/formulas/numberText';
import { tyreDiameterM } from '../../../src/core/formulas/drives';
import { parseNumber, parseQuantity, type QuantityKind } from '../../../src/core/formulas/units';
import { InputError } from '../../../src/core/basics/InputError';
import { inputErrorOf } from '../expectInputError';

// The expressions units.ts used before the scanners, kept here as the reference for short text
// only: on long text they backtrack for seconds to hours.
const FORMER_NUMBER =
  /^\s*([+\-−]?)\s*((?:\d[\d\s\u00a0\u202f.,']*)?\d|\d*[.,]\d+)(?:[eE]([+-]?\d+))?\s*(.*?)\s*$/u;
const FORMER_FRACTION = /^\s*([+\-−]?)\s*(\d*)\s*([¼½¾⅓⅔⅕⅖⅗⅘⅙⅚⅛⅜⅝⅞])\s*(.*?)\s*$/u;
const FORMER_ONE_OVER = /^\s*1\s*\/\s*(\d+(?:[.,]\d+)?)\s*(s)?\s*$/i;
const FORMER_PLAIN = /^\d*\.?\d+$|^\d+\.?$/;

/** Short text built from the characters that matter to the readers, line breaks included. */
const shortText = fc.string({
  unit: fc.constantFrom(
    ..."0123456789 \u00a0\u202f\t\n\u2028.,'+-−eEsSrpm/½¼x".split(''),
    '\u3000',
    '\ufeff',
  ),
  maxLength: 14,
});
const runs = { seed: 1101, numRuns: 4000 };

describe('the number scanners read exactly what the former expressions matched', () => {
  it('a number with its sign, digits, exponent and what follows', () => {
    fc.assert(
      fc.property(shortText, (text) => {
        const m = FORMER_NUMBER.exec(text);
        const want = m && { sign: m[1], digits: m[2], exponent: m[3] ?? '', rest: m[4] };
        expect(scanNumber(text)).toEqual(want);
      }),
      runs,
    );
  });

  it('a number written with a fraction sign', () => {
    fc.assert(
      fc.property(shortText, (text) => {
        const m = FORMER_FRACTION.exec(text);
        const want = m && { sign: m[1], whole: m[2], fraction: m[3], rest: m[4] };
        expect(scanFraction(text)).toEqual(want);
      }),
      runs,
    );
  });

  it('a time written as one over a number of seconds', () => {
    const oneOver = fc.oneof(
      shortText,
      shortText.map((t) => `1/${t}`),
      shortText.map((t) => ` 1 / ${t}`),
    );
    fc.assert(
      fc.property(oneOver, (text) => {
        expect(scanOneOver(text)).toBe(FORMER_ONE_OVER.exec(text)?.[1] ?? null);
      }),
      runs,
    );
  });

  it('a plain decimal of digits and at most one point', () => {
    const digitsAndPoints = fc.string({ unit: fc.constantFrom('1', '0', '.', ','), maxLength: 8 });
    fc.assert(
      fc.property(fc.oneof(digitsAndPoints, shortText), (text) => {
        expect(isPlainDecimal(text)).toBe(FORMER_PLAIN.test(text));
      }),
      runs,
    );
  });
});

/** Hostile text of length n: the shapes that made the former expressions backtrack. */
function hostile(n: number): Array<[string, string]> {
  const fill = (unit: string, tail = '') =>
    unit.repeat(Math.ceil((n - tail.length) / unit.length)).slice(0, n - tail.length) + tail;
  return [
    ['spaces then a letter', fill(' ', 'x')],
    ['a digit, spaces, a letter', '1' + fill(' ', 'x').slice(1)],
    ['digits then a letter', fill('1', 'x')],
    ['digits and spaces', fill('1 ')],
    ['"1e" repeated', fill('1e')],
    ['"1," repeated', fill('1,')],
    ['", " repeated', fill(', ')],
    ['"1." repeated', fill('1.')],
    ['no-break spaces then a fraction sign and a letter', fill('\u00a0', '½x')],
    ['"1/" then spaces and a letter', '1/' + fill(' ', 'x').slice(2)],
    ['"1/1" then spaces and a digit', '1/1' + fill(' ', '1').slice(3)],
    ['minus signs', fill('−')],
    ['digits, then letters across a line break', fill('9', 'x\ny')],
  ];
}

/** Counts String.prototype.charCodeAt calls (the scanners read every character through it) while `run` runs. */
function countReads(run: () => unknown): number {
  const original = String.prototype.charCodeAt;
  let reads = 0;
  String.prototype.charCodeAt = function (this: string, index: number) {
    reads++;
    return original.call(this, index);
  };
  try {
    run();
  } catch (error) {
    if (!(error instanceof InputError)) throw error;
  } finally {
    String.prototype.charCodeAt = original;
  }
  return reads;
}

afterEach(() => {
  // A failed count must not leave the counter in place for the next test.
  expect(String.prototype.charCodeAt.name).toBe('charCodeAt');
});

/** The outcome of reading: the number, or the InputError's message; anything else is thrown on. */
function outcome(run: () => number): number | string {
  try {
    return run();
  } catch (error) {
    if (error instanceof InputError) return error.message;
    throw error;
  }
}

const KINDS: Array<[QuantityKind, string]> = [
  ['speed', 'rpm'],
  ['rate', 'fpm'],
  ['time', 's'],
  ['length', 'mm'],
  ['groundSpeed', 'km/h'],
  ['angle', '°'],
  ['percent', '%'],
];

describe.each([10_000, 100_000])('on %d characters of hostile text', (n) => {
  const cases = hostile(n);

  it('every case is really that long', () => {
    for (const [name, text] of cases) expect(text.length, name).toBe(n);
  });

  it.each(cases)('parseNumber refuses %s with a short message, or reads it', (_name, text) => {
    const result = outcome(() => parseNumber(text, 'speed'));
    if (typeof result === 'number') expect(Number.isFinite(result)).toBe(true);
    else expect(result.length).toBeLessThan(200);
  });

  it.each(cases)(
    'parseQuantity gives a finite number or a short message for %s, in every kind',
    (_name, text) => {
      for (const [kind, unit] of KINDS) {
        const result = outcome(() => parseQuantity(text, kind, unit, kind));
        if (typeof result === 'number') expect(Number.isFinite(result), kind).toBe(true);
        else expect(result.length, kind).toBeLessThan(200);
      }
    },
  );

  it.each(cases)('the scanners read each character of %s at most four times', (_name, text) => {
    const reads = countReads(() => parseQuantity(text, 'time', 's', 'exposure'));
    expect(reads).toBeGreaterThan(0);
    expect(reads).toBeLessThanOrEqual(4 * n + 16);
  });

  it('tells what is wrong with each shape', () => {
    const said = (text: string) => inputErrorOf(() => parseNumber(text, 'speed')).message;
    const byName = Object.fromEntries(cases);
    expect(said(byName['spaces then a letter'])).toMatch(/is not a number for speed/);
    // A letter after the number is its unit: parseNumber ignores it, parseQuantity weighs it.
    expect(parseNumber(byName['a digit, spaces, a letter'])).toBe(1);
    expect(
      inputErrorOf(() => parseQuantity(byName['a digit, spaces, a letter'], 'speed', 'rpm'))
        .message,
    ).toBe('"x" is not a unit for speed; use rpm, r/min, rev/min, hz, rev/s, rps, r/s, rad/s.');
    expect(said(byName['digits then a letter'])).toMatch(/is too large for speed/);
    expect(said(byName['digits and spaces'])).toMatch(/more than one number/);
    expect(said(byName['"1e" repeated'])).toMatch(/more than one number/);
    expect(said(byName['"1," repeated'])).toMatch(/is not a number/);
    expect(said(byName['", " repeated'])).toMatch(/is not a number/);
    expect(said(byName['"1." repeated'])).toMatch(/is not a number/);
    expect(said(byName['minus signs'])).toMatch(/is not a number/);
    expect(said(byName['digits, then letters across a line break'])).toMatch(/is not a number/);
    // The fraction sign is read; the letter after it is its unit, which parseNumber ignores.
    expect(parseNumber(byName['no-break spaces then a fraction sign and a letter'])).toBe(0.5);
    expect(
      inputErrorOf(() =>
        parseQuantity(byName['"1/" then spaces and a letter'], 'time', 's', 'exposure'),
      ).message,
    ).toMatch(/is not a unit for exposure/);
    expect(
      inputErrorOf(() =>
        parseQuantity(byName['"1/1" then spaces and a digit'], 'time', 's', 'exposure'),
      ).message,
    ).toMatch(/more than one number/);
  });

  it('an over-long unit is quoted short in the message', () => {
    const message = inputErrorOf(() => parseQuantity('5 ' + 'q'.repeat(n), 'speed', 'rpm')).message;
    expect(message).toBe(
      `"${'q'.repeat(24)}" is not a unit for speed; use rpm, r/min, rev/min, hz, rev/s, rps, r/s, rad/s.`,
    );
  });

  it.each(cases)('tyreDiameterM refuses %s as a tyre size', (_name, text) => {
    const error = inputErrorOf(() => tyreDiameterM(text));
    expect(error.field).toBe('tyre size');
    expect(error.message.length).toBeLessThan(200);
  });

  it('tyreDiameterM still reads a real size followed by a long tail of spaces', () => {
    expect(tyreDiameterM('205/55R16' + ' '.repeat(n))).toBe(0.6319);
  });
});
