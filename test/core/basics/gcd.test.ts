import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { gcd } from '../../../src/core/basics/gcd';
import { bad, expectInputError } from '../expectInputError';

describe('gcd', () => {
  it('finds the greatest common divisor, the doc example included', () => {
    expect(gcd(12, 18)).toBe(6); // doc block; 12 = 2²·3, 18 = 2·3²
    expect(gcd(18, 12)).toBe(6);
    expect(gcd(7, 13)).toBe(1); // two primes
    expect(gcd(1071, 462)).toBe(21); // worked example of Wikipedia, "Euclidean algorithm" (from memory; 1071 = 3²·7·17, 462 = 2·3·7·11)
  });

  it('treats zero as divisible by everything', () => {
    expect(gcd(0, 5)).toBe(5);
    expect(gcd(5, 0)).toBe(5);
    expect(gcd(0, 0)).toBe(0);
  });

  it('divides both numbers, and nothing larger does (checked by trial division)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 2000 }), fc.integer({ min: 1, max: 2000 }), (a, b) => {
        const g = gcd(a, b);
        if (a % g !== 0 || b % g !== 0) return false;
        for (let d = g + 1; d <= Math.min(a, b); d++) if (a % d === 0 && b % d === 0) return false;
        return true;
      }),
    );
  });

  it.each([
    [NaN, 1],
    [1, NaN],
    [Infinity, 1],
    [1, -Infinity],
    [1.5, 3],
    [-4, 6],
    [4, -6],
    ['4', 6],
    [null, 2],
  ])('rejects gcd(%s, %s) instead of looping or answering a negative number', (a, b) => {
    expectInputError(() => gcd(bad(a), bad(b)), 'whole numbers');
  });
});
