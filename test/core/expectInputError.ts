// Shared checks for the core's bad-input contract (DEVELOPERS.md, "The core's public face"): bad input throws InputError,
// an Error whose `field` says which input is wrong and whose message names it.
import { expect } from 'vitest';
import fc from 'fast-check';
import { InputError } from '../../src/core/basics/InputError';

/** Lets a test pass input of the wrong type on purpose. */
export const bad = (value: unknown): never => value as never;

/** Values that are not usable numbers: NaN, ±Infinity, text, nothing, objects. */
export const notNumbers: readonly unknown[] = [
  NaN,
  Infinity,
  -Infinity,
  '3',
  'abc',
  null,
  undefined,
  {},
  [],
  true,
];

/** Runs `run`, which must throw an InputError, and returns that error. */
export function inputErrorOf(run: () => unknown): InputError {
  let thrown: unknown;
  try {
    run();
  } catch (error) {
    thrown = error;
  }
  if (thrown === undefined) throw new Error('expected an InputError, but nothing was thrown');
  if (!(thrown instanceof InputError)) throw thrown;
  return thrown;
}

/**
 * `run` throws an InputError (an Error) for field `field`, and the message names it: it
 * contains `word` (by default the field itself), ignoring case.
 */
export function expectInputError(
  run: () => unknown,
  field: string,
  word: string = field,
): InputError {
  const error = inputErrorOf(run);
  expect(error).toBeInstanceOf(Error);
  expect(error.name).toBe('InputError');
  expect(error.field).toBe(field);
  expect(error.message.toLowerCase()).toContain(word.toLowerCase());
  return error;
}

/** Finite doubles over the whole range, both signs, subnormals and −0 included. */
export const anyFinite = (): fc.Arbitrary<number> =>
  fc.double({ noNaN: true, noDefaultInfinity: true });

/** Positive finite doubles over the whole range. */
export const anyPositive = (): fc.Arbitrary<number> =>
  fc.double({ min: Number.MIN_VALUE, noNaN: true, noDefaultInfinity: true });

/**
 * `compute` either returns only finite numbers (every number found in its result, however
 * nested) or throws InputError: never NaN or Infinity, never another error.
 */
export function finiteOrInputError(compute: () => unknown): boolean {
  let result: unknown;
  try {
    result = compute();
  } catch (error) {
    if (error instanceof InputError) return true;
    throw error;
  }
  return allNumbersFinite(result);
}

function allNumbersFinite(value: unknown): boolean {
  if (typeof value === 'number') return Number.isFinite(value);
  if (Array.isArray(value)) return value.every(allNumbersFinite);
  if (typeof value === 'object' && value !== null)
    return Object.values(value).every(allNumbersFinite);
  return true;
}

/** Relative difference |a − b| / max(|a|, |b|, tiny). */
export function relativeError(a: number, b: number): number {
  return Math.abs(a - b) / Math.max(Math.abs(a), Math.abs(b), 1e-300);
}
