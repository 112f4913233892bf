// Every field reader on hostile text of 10,000 and 100,000 characters: each refuses it with a
// short message (or reads a number it really holds), and readField refuses over-long text before
// any reader sees it. No timing here (speed is measured in `npm run bench`); a reader that
// backtracked would not finish these cases at all.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/core';
import {
  MAX_LIST_CHARS,
  MAX_NUMBER_CHARS,
  readCreepRpm,
  readDutyPercent,
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
import {
  readBits,
  readBladeCount,
  readCapacitanceF,
  readCutoffHz,
  readFilterOrder,
  readHarmonics,
  readList,
  readResistanceOhm,
  readSampleRateHz,
  readTeeth,
  readToneHz,
  splitList,
} from '../../src/ui/toolFields';
import { readBeltSlipPercent, readPulleyMm } from '../../src/screens/whole-machine/fields';
import { readGroundSpeed, readTyreSize } from '../../src/ui/wheel-fields/read';

const READERS: Array<[string, (text: string) => unknown]> = [
  ['speed', (t) => readSpeedRpm(t, 'rpm')],
  ['features', readFeatures],
  ['tolerance', readTolerancePercent],
  ['poles', readPoles],
  ['slip', readSlipPercent],
  ['frame rate', readFrameRate],
  ['shutter angle', readShutterAngle],
  ['exposure', readExposureSeconds],
  ['readout', readReadoutMs],
  ['flash rate', (t) => readFlashRateFpm(t, 'fpm')],
  ['flicker', readFlickerHz],
  ['modulation', readModulationPercent],
  ['duty cycle', readDutyPercent],
  ['creep', readCreepRpm],
  ['sample rate', readSampleRateHz],
  ['cutoff', readCutoffHz],
  ['tone', readToneHz],
  ['harmonics', readHarmonics],
  ['blade count', readBladeCount],
  ['tooth count', readTeeth],
  ['filter order', readFilterOrder],
  ['bits', readBits],
  ['resistance', readResistanceOhm],
  ['capacitance', readCapacitanceF],
  ['pulley', (t) => readPulleyMm(t, 'driver pulley')],
  ['belt slip', readBeltSlipPercent],
  ['ground speed', (t) => readGroundSpeed(t, 'km/h')],
  ['tyre size', readTyreSize],
  ['list of frame rates', (t) => readList(t, readFrameRate, 'frame rates', 0, 12)],
];

/** Hostile text of length n: the shapes that made the former expressions backtrack. */
function hostile(n: number): Array<[string, string]> {
  const fill = (unit: string, tail = '') =>
    unit.repeat(Math.ceil((n - tail.length) / unit.length)).slice(0, n - tail.length) + tail;
  return [
    ['spaces then a letter', fill(' ', 'x')],
    ['a digit, spaces, a letter', '1' + fill(' ', 'x').slice(1)],
    ['a digit, spaces, a unit word', '6' + fill(' ', 'blades').slice(1)],
    ['digits then a letter', fill('1', 'x')],
    ['digits and spaces', fill('1 ')],
    ['"1e" repeated', fill('1e')],
    ['"1," repeated', fill('1,')],
    ['"; " repeated', fill('; ')],
    ['"1." repeated', fill('1.')],
    ['"1/" then spaces and a letter', '1/' + fill(' ', 'x').slice(2)],
    ['a digit then unit letters', '1' + fill('k', 'x').slice(1)],
  ];
}

describe.each([10_000, 100_000])('on %d characters of hostile text', (n) => {
  const cases = hostile(n);

  it.each(READERS)(
    'the %s reader refuses every shape with a short message, or reads the number it holds',
    (_name, read) => {
      for (const [shape, text] of cases) {
        try {
          const value = read(text);
          const numbers = Array.isArray(value) ? value : [value];
          expect(numbers.every(Number.isFinite), shape).toBe(true);
        } catch (error) {
          expect(error, shape).toBeInstanceOf(InputError);
          expect((error as InputError).message.length, shape).toBeLessThan(200);
        }
      }
    },
  );

  it('reads what the long text really holds, and refuses the rest', () => {
    const text = Object.fromEntries(cases);
    expect(readFeatures(text['a digit, spaces, a unit word'])).toBe(6);
    expect(readHarmonics(text['a digit, spaces, a letter'])).toBe(1);
    expect(readList(text['"; " repeated'], readFrameRate, 'frame rates', 0, 12)).toEqual([]);
    expect(() => readList(text['digits and spaces'], readFrameRate, 'frame rates', 0, 12)).toThrow(
      'At most 12 values for frame rates.',
    );
    expect(() => readExposureSeconds(text['spaces then a letter'])).toThrow(
      /is not a number for exposure/,
    );
    expect(() => readResistanceOhm(text['a digit then unit letters'])).toThrow(
      /is not a resistance/,
    );
  });

  it('readField refuses each shape as too long, without calling the reader', () => {
    const calls: string[] = [];
    for (const [, text] of cases) {
      const reading = readField(text, (t) => {
        calls.push(t);
        return 1;
      });
      expect(reading).toEqual({
        ok: false,
        message: `Too long: type at most ${MAX_NUMBER_CHARS} characters.`,
      });
    }
    expect(calls).toEqual([]);
  });

  it('a list field refuses each shape as too long too', () => {
    for (const [, text] of cases) {
      expect(
        readField(text, (t) => readList(t, readFrameRate, 'frame rates', 0, 12), MAX_LIST_CHARS),
      ).toEqual({ ok: false, message: 'Too long: type at most 1,000 characters.' });
    }
  });

  it('splitList cuts repeated separators into their items and nothing else', () => {
    expect(splitList('; '.repeat(n / 2))).toEqual([]);
    // Each comma and space separates; the last comma has no space after it once trimmed.
    expect(splitList(', '.repeat(n / 2))).toEqual([',']);
    expect(splitList('24 '.repeat(n / 3))).toHaveLength(Math.floor(n / 3));
    // A word after a number is its unit: one item, however long the word.
    expect(splitList('50 ' + 'k'.repeat(n))).toEqual([`50 ${'k'.repeat(n)}`]);
  });
});

describe('the length limit of a field', () => {
  it('lets through text of exactly the limit, and counts characters rather than UTF-16 units', () => {
    const at = ' '.repeat(MAX_NUMBER_CHARS - 4) + '1780';
    expect(readField(at, (t) => readSpeedRpm(t, 'rpm'))).toEqual({ ok: true, value: 1780 });
    expect(readField(at + ' ', (t) => readSpeedRpm(t, 'rpm'))).toEqual({
      ok: false,
      message: 'Too long: type at most 64 characters.',
    });
    // 40 emoji are 80 UTF-16 units but 40 characters: the reader, not the limit, refuses them.
    const reading = readField('😀'.repeat(40), (t) => readSpeedRpm(t, 'rpm'));
    expect(reading.ok).toBe(false);
    expect(!reading.ok && reading.message).toMatch(/is not a number for speed/);
  });

  it('leaves short good text as it was read before', () => {
    expect(readField('6 blades', readFeatures)).toEqual({ ok: true, value: 6 });
    expect(readField('4 poles', readPoles)).toEqual({ ok: true, value: 4 });
    expect(readField('3 ×', readHarmonics)).toEqual({ ok: true, value: 3 });
    expect(readField('2.2 kΩ', readResistanceOhm)).toEqual({ ok: true, value: 2200 });
    expect(readField('  1 / 500 s ', readExposureSeconds)).toEqual({ ok: true, value: 0.002 });
    expect(readField('500', readExposureSeconds)).toEqual({ ok: true, value: 0.002 });
  });
});

describe('splitList', () => {
  it('cuts short text exactly as the former split on /\\s*;\\s*|,\\s+|\\s+/ did', () => {
    const former = (text: string): string[] => {
      const out: string[] = [];
      for (const token of text.trim().split(/\s*;\s*|,\s+|\s+/)) {
        if (token === '') continue;
        if (/^[^\d+\-−.,]/u.test(token) && out.length > 0) out[out.length - 1] += ` ${token}`;
        else out.push(token);
      }
      return out;
    };
    const text = fc.string({
      unit: fc.constantFrom(...'12 ;,\t\u00a0.-Hzk'.split('')),
      maxLength: 16,
    });
    fc.assert(
      fc.property(text, (t) => {
        expect(splitList(t)).toEqual(former(t));
      }),
      { seed: 1101, numRuns: 4000 },
    );
  });

  it('stops one item past the most a list may hold', () => {
    expect(splitList('1 2 3 4 5 6', 3)).toEqual(['1', '2', '3', '4']);
    expect(splitList('1 Hz 2 Hz', 3)).toEqual(['1 Hz', '2 Hz']);
  });
});
