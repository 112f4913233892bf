import { describe, expect, test } from 'vitest';
import {
  readCreepRpm,
  readExposureSeconds,
  readFeatures,
  readField,
  readFlashRateFpm,
  readFlickerHz,
  readFrameRate,
  readModulationPercent,
  readPoles,
  readReadoutMs,
  readShutterAngle,
  readSlipPercent,
  readSpeedRpm,
  readTolerancePercent,
} from '../../src/ui/fields';

function message(text: string, reader: (t: string) => number): string {
  const r = readField(text, reader);
  if (r.ok) throw new Error(`expected "${text}" to be refused, got ${r.value}`);
  return r.message;
}

function value(text: string, reader: (t: string) => number): number {
  const r = readField(text, reader);
  if (!r.ok) throw new Error(`expected "${text}" to be read, got "${r.message}"`);
  return r.value;
}

describe('reading the speed', () => {
  test('reads rpm, Hz and rad/s into rpm', () => {
    expect(value('1780', (t) => readSpeedRpm(t, 'rpm'))).toBe(1780);
    expect(value('1,780', (t) => readSpeedRpm(t, 'rpm'))).toBe(1780);
    // Exactly as typed, not 2000.0000000000002 (2000 / 60 · 60 in binary floating point).
    expect(value('2000', (t) => readSpeedRpm(t, 'rpm'))).toBe(2000);
    expect(value('29.7 Hz', (t) => readSpeedRpm(t, 'rpm'))).toBe(1782);
    expect(value('30', (t) => readSpeedRpm(t, 'Hz'))).toBe(1800);
    expect(value(String(2 * Math.PI), (t) => readSpeedRpm(t, 'rad/s'))).toBeCloseTo(60, 9);
  });

  test('a unit typed with the number wins over the chosen unit', () => {
    expect(value('30 Hz', (t) => readSpeedRpm(t, 'rpm'))).toBe(1800);
  });

  test('keeps a negative sign for the other direction', () => {
    expect(value('-1200', (t) => readSpeedRpm(t, 'rpm'))).toBe(-1200);
  });

  test('refuses empty text, words and absurd speeds with a message', () => {
    expect(message('', (t) => readSpeedRpm(t, 'rpm'))).toMatch(/empty/);
    expect(message('fast', (t) => readSpeedRpm(t, 'rpm'))).toMatch(/not a number/);
    expect(message('5e9', (t) => readSpeedRpm(t, 'rpm'))).toMatch(/speed must be from/i);
    expect(message('1780 furlongs', (t) => readSpeedRpm(t, 'rpm'))).toMatch(/not a unit/);
  });
});

describe('reading whole counts', () => {
  test('features must be a whole number of at least 1', () => {
    expect(value('6', readFeatures)).toBe(6);
    expect(message('0', readFeatures)).toMatch(/whole number from 1/);
    expect(message('2.5', readFeatures)).toMatch(/whole number/);
  });

  test('a count may carry its word, but nothing else after it', () => {
    expect(value('6 blades', readFeatures)).toBe(6);
    expect(value('12 spokes', readFeatures)).toBe(12);
    expect(value('4 poles', readPoles)).toBe(4);
    expect(message('1/0', readFeatures)).toMatch(/not a whole number/);
    expect(message('12abc', readFeatures)).toMatch(/not a whole number/);
    expect(message('4x', readPoles)).toMatch(/not a whole number/);
  });

  test('poles must be even', () => {
    expect(value('4', readPoles)).toBe(4);
    expect(message('3', readPoles)).toMatch(/pairs/);
  });
});

describe('reading percentages', () => {
  test('tolerance, slip and modulation stay within their ranges', () => {
    expect(value('1.5', readTolerancePercent)).toBe(1.5);
    expect(value('2 %', readTolerancePercent)).toBe(2);
    expect(message('60', readTolerancePercent)).toMatch(/from 0 % to 50 %/);
    expect(value('3', readSlipPercent)).toBe(3);
    expect(message('-1', readSlipPercent)).toMatch(/slip/i);
    expect(value('100', readModulationPercent)).toBe(100);
    expect(message('101', readModulationPercent)).toMatch(/modulation/i);
  });
});

describe('reading camera settings', () => {
  test('frame rate must be above zero', () => {
    expect(value('29.97', readFrameRate)).toBe(29.97);
    expect(value('29,97', readFrameRate)).toBe(29.97);
    expect(message('0', readFrameRate)).toMatch(/above 0/);
  });

  test('shutter angle lies in (0, 360]', () => {
    expect(value('180', readShutterAngle)).toBe(180);
    expect(message('400', readShutterAngle)).toMatch(/at most 360/);
  });

  test('exposure reads 500 as 1/500 s, and "1/500" or "2 ms" as written', () => {
    expect(value('500', readExposureSeconds)).toBeCloseTo(1 / 500, 15);
    expect(value('1/500', readExposureSeconds)).toBeCloseTo(1 / 500, 15);
    expect(value('2 ms', readExposureSeconds)).toBeCloseTo(0.002, 15);
    expect(value('0.004', readExposureSeconds)).toBeCloseTo(0.004, 15);
    expect(message('0', readExposureSeconds)).toMatch(/longer than zero/);
    expect(message('5 s', readExposureSeconds)).toMatch(/between/);
  });

  test('readout time is read in ms, 0 for a global shutter', () => {
    expect(value('25', readReadoutMs)).toBe(25);
    expect(value('0', readReadoutMs)).toBe(0);
    expect(value('0.03 s', readReadoutMs)).toBeCloseTo(30, 9);
    expect(message('2000', readReadoutMs)).toMatch(/readout/i);
  });
});

describe('reading flash and flicker rates', () => {
  test('flash rates read in fpm or Hz into flashes per minute', () => {
    expect(value('1770', (t) => readFlashRateFpm(t, 'fpm'))).toBe(1770);
    expect(value('29.5', (t) => readFlashRateFpm(t, 'Hz'))).toBe(1770);
    expect(value('60 Hz', (t) => readFlashRateFpm(t, 'fpm'))).toBe(3600);
    expect(message('-5', (t) => readFlashRateFpm(t, 'fpm'))).toMatch(/above 0/);
  });

  test('flicker frequency must be above zero', () => {
    expect(value('300', readFlickerHz)).toBe(300);
    expect(message('0', readFlickerHz)).toMatch(/above 0/);
  });

  test('creep must be a positive speed', () => {
    expect(value('2', readCreepRpm)).toBe(2);
    expect(message('0', readCreepRpm)).toMatch(/above 0/);
  });
});

describe('readField', () => {
  test('turns every kind of garbage into a message, never a NaN value', () => {
    const readers = [
      (t: string) => readSpeedRpm(t, 'rpm'),
      readFeatures,
      readTolerancePercent,
      readFrameRate,
      readShutterAngle,
      readExposureSeconds,
      readReadoutMs,
      (t: string) => readFlashRateFpm(t, 'fpm'),
      readFlickerHz,
      readModulationPercent,
      readCreepRpm,
      readPoles,
      readSlipPercent,
    ];
    for (const reader of readers) {
      for (const garbage of [
        '',
        '   ',
        'abc',
        'NaN',
        'Infinity',
        '1e999',
        '<b>1</b>',
        '--1',
        '1..2',
        '1780 1800',
        '2½ 3',
      ]) {
        const r = readField(garbage, reader);
        expect(r.ok, `"${garbage}"`).toBe(false);
        if (!r.ok) {
          expect(r.message.length).toBeGreaterThan(5);
          // The message may quote what was typed, but must not produce NaN or Infinity itself.
          expect(r.message.replace(`"${garbage.trim().slice(0, 24)}"`, '')).not.toMatch(
            /NaN|Infinity/,
          );
        }
      }
    }
  });

  test('refuses two numbers in one field and reads a fraction sign as its value', () => {
    // "1780 1800" once read as 17,801,800 rpm; "2½" as 2.
    const twice = readField('1780 1800', (t: string) => readSpeedRpm(t, 'rpm'));
    expect(twice.ok).toBe(false);
    if (!twice.ok) expect(twice.message).toMatch(/one number/);
    expect(readField('2½', (t: string) => readSpeedRpm(t, 'rpm'))).toEqual({
      ok: true,
      value: 2.5,
    });
    expect(readField('1 780', (t: string) => readSpeedRpm(t, 'rpm'))).toEqual({
      ok: true,
      value: 1780,
    });
  });

  test('lets errors that are not input errors through', () => {
    expect(() =>
      readField('1', () => {
        throw new TypeError('bug');
      }),
    ).toThrow(TypeError);
  });
});
