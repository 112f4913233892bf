import { describe, expect, it } from 'vitest';
import { plainNumber } from '../../../src/core/basics/plainNumber';

describe('plainNumber: numbers for sentences', () => {
  it('writes whole numbers from 100 up and three significant figures below (doc examples)', () => {
    expect(plainNumber(1770.4)).toBe('1770');
    expect(plainNumber(3540)).toBe('3540');
    expect(plainNumber(29.4999)).toBe('29.5');
    expect(plainNumber(0.041666)).toBe('0.0417');
    expect(plainNumber(98.08)).toBe('98.1');
    expect(plainNumber(-264.2857)).toBe('-264');
  });

  it('never writes an exponent, a minus zero, NaN or Infinity', () => {
    expect(plainNumber(1e-7)).toBe('0.0000001');
    expect(plainNumber(-0)).toBe('0');
    expect(plainNumber(-0.00001)).toBe('-0.00001');
    expect(plainNumber(1e21)).toBe('1000000000000000000000');
    expect(plainNumber(NaN)).toBe('?');
    expect(plainNumber(Infinity)).toBe('?');
  });
});
