import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import {
  formatExposure,
  formatNumber,
  formatPercent,
  formatPrecise,
  formatRpmWithDirection,
  NO_VALUE,
  numberForField,
} from '../../src/words/format';
import { formatRate, formatRateSpan } from '../../src/words/rates';

/** The reference: the browser's own en-US number formatting (ECMA-402 Intl.NumberFormat). */
function intlText(value: number, decimals: number): string {
  const text = new Intl.NumberFormat('en-US', { maximumFractionDigits: decimals }).format(value);
  return /^-0(\.0*)?$/.test(text) ? '0' : text;
}

describe('formatNumber', () => {
  test('writes what Intl.NumberFormat en-US writes, for any finite number and decimals 0–6', () => {
    // Reference library: ECMA-402 Intl.NumberFormat, as built into Node. Halfway cases of the
    // exact binary value (0.125, 2.5, 1,234.5) and values that only look halfway (1.005) both
    // round the same way in each.
    for (const [v, d] of [
      [0.125, 2],
      [2.5, 0],
      [-2.5, 0],
      [1234.5, 0],
      [1.005, 2],
      [999.95, 1],
      [999999.5, 0],
      [-0.0004, 3],
      [1e21, 0],
      [123456789012345680000, 2],
    ] as const) {
      expect(formatNumber(v, d), `${v} to ${d}`).toBe(intlText(v, d));
    }
    fc.assert(
      fc.property(
        fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e22, max: 1e22 }),
        fc.integer({ min: 0, max: 6 }),
        (v, d) => formatNumber(v, d) === intlText(v, d),
      ),
      { numRuns: 20_000 },
    );
    fc.assert(
      fc.property(
        fc.integer({ min: -10_000_000, max: 10_000_000 }),
        fc.integer({ min: 0, max: 4 }),
        (n, d) => {
          const v = n / 1000;
          return (
            formatNumber(v, d) === intlText(v, d) && formatNumber(v) === intlText(v, decimalsOf(v))
          );
        },
      ),
      { numRuns: 20_000 },
    );
  });

  test('groups thousands and keeps about four significant figures', () => {
    expect(formatNumber(1770)).toBe('1,770');
    expect(formatNumber(123.456)).toBe('123.5');
    expect(formatNumber(12.3456)).toBe('12.35');
    expect(formatNumber(0.012345)).toBe('0.0123');
  });

  test('drops trailing zeros', () => {
    expect(formatNumber(2.5)).toBe('2.5');
    expect(formatNumber(3)).toBe('3');
  });

  test('shows NaN, Infinity and non-numbers as a dash, never as words', () => {
    for (const bad of [
      NaN,
      Infinity,
      -Infinity,
      undefined as unknown as number,
      'x' as unknown as number,
    ]) {
      expect(formatNumber(bad)).toBe(NO_VALUE);
    }
  });

  test('never shows minus zero', () => {
    expect(formatNumber(-0)).toBe('0');
    expect(formatNumber(-0.00001)).toBe('0');
  });

  test('uses the decimals it is given', () => {
    expect(formatNumber(1.23456, 2)).toBe('1.23');
  });
});

describe('formatPrecise', () => {
  test('keeps five significant figures for rates set on a dial', () => {
    expect(formatPrecise(1769.64)).toBe('1,769.6');
    // 24000/1001 frames/s (SMPTE ST 12-1) reads as 23.976.
    expect(formatPrecise(24000 / 1001)).toBe('23.976');
    expect(formatPrecise(120000 / 1001)).toBe('119.88');
    expect(formatPrecise(0)).toBe('0');
    expect(formatPrecise(NaN)).toBe(NO_VALUE);
  });
});

describe('numberForField', () => {
  test('writes a value that reads back the same, without grouping', () => {
    expect(numberForField(12000)).toBe('12000');
    expect(numberForField(30000 / 1001)).toBe('29.97003');
    expect(numberForField(0.25)).toBe('0.25');
    expect(numberForField(-1770)).toBe('-1770');
  });

  test('leaves a field empty rather than printing NaN or Infinity', () => {
    expect(numberForField(NaN)).toBe('');
    expect(numberForField(Infinity)).toBe('');
  });
});

describe('formatRpmWithDirection', () => {
  test('says forward when the apparent speed has the sign of the true speed', () => {
    expect(formatRpmWithDirection(12.25, 1)).toBe('12.25 rpm forward');
    expect(formatRpmWithDirection(-12.25, -1)).toBe('12.25 rpm forward');
  });

  test('says backward when the signs differ', () => {
    expect(formatRpmWithDirection(-60, 1)).toBe('60 rpm backward');
  });

  test('gives no direction to zero', () => {
    expect(formatRpmWithDirection(0, 1)).toBe('0 rpm');
    expect(formatRpmWithDirection(-0.00001, 1)).toBe('0 rpm');
  });

  test('shows a dash for a speed that is not a number', () => {
    expect(formatRpmWithDirection(NaN, 1)).toBe(NO_VALUE);
  });
});

describe('formatPercent and formatExposure', () => {
  test('write percent with its sign and exposure as 1/x s', () => {
    expect(formatPercent(1.5)).toBe('1.5 %');
    expect(formatPercent(NaN)).toBe(NO_VALUE);
    // Shutter angle at 24 frames/s: 180° = 1/48 s (docs/physics.md §13).
    expect(formatExposure(180 / 360 / 24)).toBe('1/48 s');
    expect(formatExposure(2)).toBe('2 s');
    expect(formatExposure(0)).toBe(NO_VALUE);
  });
});

describe("rates in each sampler's unit", () => {
  test('a strobe shows flashes per minute or Hz, a camera fps, lighting Hz', () => {
    expect(formatRate(29.5, 'strobe', 'fpm')).toBe('1,770 fpm');
    expect(formatRate(29.5, 'strobe', 'Hz')).toBe('29.5 Hz');
    expect(formatRate(30000 / 1001, 'camera', 'fpm')).toBe('29.97 fps');
    expect(formatRate(100, 'lighting', 'fpm')).toBe('100 Hz');
    expect(formatRate(NaN, 'camera', 'fpm')).toBe(NO_VALUE);
  });

  test('a band shows both ends in one unit', () => {
    expect(formatRateSpan(29, 30, 'strobe', 'fpm')).toBe('1,740 – 1,800 fpm');
  });
});

/** The decimals formatNumber picks itself: about four significant figures. */
function decimalsOf(v: number): number {
  const abs = Math.abs(v);
  return abs >= 1000 ? 0 : abs >= 100 ? 1 : abs >= 10 ? 2 : abs >= 1 ? 3 : 4;
}
