import { describe, expect, it } from 'vitest';
import {
  InputError,
  requireBetween,
  requireFinite,
  requireFiniteResult,
  requireNonNegative,
  requirePositive,
  requireWhole,
} from '../../../src/core/basics/InputError';
import { bad, expectInputError, notNumbers } from '../expectInputError';

describe('InputError', () => {
  it('is an Error named InputError that carries the field it is about', () => {
    const error = new InputError('speed', 'speed must be a number.');
    expect(error).toBeInstanceOf(Error);
    expect(error).toBeInstanceOf(InputError);
    expect(error.name).toBe('InputError');
    expect(error.field).toBe('speed');
    expect(error.message).toBe('speed must be a number.');
  });

  it('can be caught as an ordinary Error by code that knows nothing of the core', () => {
    const caught = (() => {
      try {
        throw new InputError('rate', 'rate must be greater than zero.');
      } catch (error) {
        return error instanceof Error ? error.message : 'not an Error';
      }
    })();
    expect(caught).toBe('rate must be greater than zero.');
  });
});

describe('requireFinite', () => {
  it('passes finite numbers through unchanged, the doc example included', () => {
    expect(requireFinite(3, 'speed')).toBe(3); // doc block: requireFinite(3, 'speed') // 3
    expect(requireFinite(-2.5, 'speed')).toBe(-2.5);
    expect(requireFinite(0, 'speed')).toBe(0);
    expect(requireFinite(Number.MAX_VALUE, 'speed')).toBe(Number.MAX_VALUE);
  });

  it.each(notNumbers.map((v) => [v]))('rejects %s naming the field', (value) => {
    expectInputError(() => requireFinite(value, 'speed'), 'speed');
  });

  it('quotes text it rejects so the technician sees what was typed', () => {
    const error = expectInputError(() => requireFinite('fast', 'speed'), 'speed');
    expect(error.message).toContain('"fast"');
  });
});

describe('requirePositive', () => {
  it('passes numbers above zero, however small', () => {
    expect(requirePositive(Number.MIN_VALUE, 'rate')).toBe(Number.MIN_VALUE);
    expect(requirePositive(61, 'rate')).toBe(61);
  });

  it.each([[0], [-0], [-1], [-Number.MIN_VALUE]])(
    'rejects %s as not greater than zero',
    (value) => {
      const error = expectInputError(() => requirePositive(value, 'rate'), 'rate');
      expect(error.message).toContain('greater than zero');
    },
  );

  it.each(notNumbers.map((v) => [v]))('rejects %s naming the field', (value) => {
    expectInputError(() => requirePositive(value, 'rate'), 'rate');
  });
});

describe('requireNonNegative', () => {
  it('passes zero and positive numbers', () => {
    expect(requireNonNegative(0, 'exposure')).toBe(0);
    expect(requireNonNegative(0.001, 'exposure')).toBe(0.001);
  });

  it('rejects negative numbers and non-numbers', () => {
    expectInputError(() => requireNonNegative(-0.001, 'exposure'), 'exposure', 'negative');
    for (const value of notNumbers)
      expectInputError(() => requireNonNegative(value, 'exposure'), 'exposure');
  });
});

describe('requireWhole', () => {
  it('passes whole numbers inside the bounds, ends included', () => {
    expect(requireWhole(1, 'blades', 1, 8)).toBe(1);
    expect(requireWhole(8, 'blades', 1, 8)).toBe(8);
    expect(requireWhole(1e6, 'blades', 1)).toBe(1e6);
  });

  it.each([[0], [1.5], [-2], [9]])('rejects %s for a field that takes 1 to 8', (value) => {
    const error = expectInputError(() => requireWhole(value, 'blades', 1, 8), 'blades');
    expect(error.message).toContain('whole number');
    expect(error.message).toContain('at most 8');
  });

  it('says no upper bound when there is none', () => {
    const error = expectInputError(() => requireWhole(0, 'blades', 1), 'blades');
    expect(error.message).not.toContain('at most');
  });

  it('rejects non-numbers', () => {
    for (const value of notNumbers)
      expectInputError(() => requireWhole(value, 'blades', 1), 'blades');
  });
});

describe('requireBetween', () => {
  it('passes numbers in the closed interval', () => {
    expect(requireBetween(0, 'slip', 0, 1)).toBe(0);
    expect(requireBetween(1, 'slip', 0, 1)).toBe(1);
    expect(requireBetween(0.03, 'slip', 0, 1)).toBe(0.03);
  });

  it('rejects numbers outside it and non-numbers', () => {
    expectInputError(() => requireBetween(1.01, 'slip', 0, 1), 'slip', 'between 0 and 1');
    expectInputError(() => requireBetween(-0.01, 'slip', 0, 1), 'slip');
    for (const value of notNumbers)
      expectInputError(() => requireBetween(value, 'slip', 0, 1), 'slip');
  });
});

describe('requireFiniteResult', () => {
  it('passes a finite result through, the doc example included', () => {
    expect(requireFiniteResult(2 * 30, 'speed')).toBe(60); // doc block example
  });

  it('turns an overflowed result into an InputError naming the field to check', () => {
    expectInputError(() => requireFiniteResult(1e308 * 10, 'speed'), 'speed');
    expectInputError(() => requireFiniteResult(-1e308 * 10, 'speed'), 'speed');
    expectInputError(() => requireFiniteResult(bad(NaN), 'rate'), 'rate');
  });
});
