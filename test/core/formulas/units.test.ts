import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  fpmToHz,
  hzToFpm,
  hzToRadPerS,
  hzToRpm,
  inToM,
  kmhToMps,
  mmToM,
  mphToMps,
  mpsToKmh,
  mpsToMph,
  mToIn,
  mToMm,
  parseNumber,
  parseQuantity,
  radPerSToHz,
  rpmToHz,
  unitsFor,
} from '../../../src/core/formulas/units';
import {
  anyFinite,
  bad,
  expectInputError,
  finiteOrInputError,
  inputErrorOf,
  notNumbers,
} from '../expectInputError';

describe('unit conversions', () => {
  it('use the international inch of exactly 25.4 mm (international yard and pound agreement, 1959)', () => {
    expect(inToM(1)).toBe(0.0254);
    expect(mToIn(0.0254)).toBe(1);
    expect(mmToM(25.4)).toBe(0.0254);
    expect(mToMm(0.0254)).toBe(25.4);
  });

  it('use the international mile of exactly 1609.344 m: 1 mph = 0.44704 m/s', () => {
    expect(mphToMps(1)).toBe(0.44704); // 1609.344 m / 3600 s
    expect(mpsToMph(0.44704)).toBe(1);
    expect(mphToMps(60)).toBeCloseTo(26.8224, 12);
  });

  it('convert km/h, rpm, flashes per minute and rad/s exactly as their doc examples state', () => {
    expect(kmhToMps(36)).toBe(10);
    expect(mpsToKmh(10)).toBe(36);
    expect(rpmToHz(1800)).toBe(30);
    expect(hzToRpm(30)).toBe(1800);
    expect(fpmToHz(3600)).toBe(60);
    expect(hzToFpm(60)).toBe(3600);
    expect(radPerSToHz(2 * Math.PI)).toBe(1);
    expect(hzToRadPerS(1)).toBe(6.283185307179586);
  });

  it('come back to where they started', () => {
    const pairs: Array<[(x: number) => number, (x: number) => number]> = [
      [rpmToHz, hzToRpm],
      [radPerSToHz, hzToRadPerS],
      [fpmToHz, hzToFpm],
      [kmhToMps, mpsToKmh],
      [mphToMps, mpsToMph],
      [mmToM, mToMm],
      [inToM, mToIn],
    ];
    fc.assert(
      fc.property(fc.double({ min: -1e9, max: 1e9, noNaN: true }), (x) =>
        pairs.every(
          ([there, back]) => Math.abs(back(there(x)) - x) <= 1e-12 * Math.max(1, Math.abs(x)),
        ),
      ),
    );
  });

  it('reject anything that is not a finite number, naming the quantity', () => {
    const named: Array<[(x: number) => number, string]> = [
      [rpmToHz, 'speed'],
      [hzToRpm, 'speed'],
      [radPerSToHz, 'speed'],
      [hzToRadPerS, 'speed'],
      [fpmToHz, 'flash rate'],
      [hzToFpm, 'flash rate'],
      [kmhToMps, 'ground speed'],
      [mpsToKmh, 'ground speed'],
      [mphToMps, 'ground speed'],
      [mpsToMph, 'ground speed'],
      [mmToM, 'length'],
      [mToMm, 'length'],
      [inToM, 'length'],
      [mToIn, 'length'],
    ];
    for (const [convert, field] of named) {
      for (const v of notNumbers) expectInputError(() => convert(bad(v)), field);
    }
  });

  it('never return NaN or Infinity: an overflowing conversion throws InputError', () => {
    const all = [
      rpmToHz,
      hzToRpm,
      radPerSToHz,
      hzToRadPerS,
      fpmToHz,
      hzToFpm,
      kmhToMps,
      mpsToKmh,
      mphToMps,
      mpsToMph,
      mmToM,
      mToMm,
      inToM,
      mToIn,
    ];
    fc.assert(
      fc.property(anyFinite(), (x) => all.every((convert) => finiteOrInputError(() => convert(x)))),
    );
    expectInputError(() => hzToRpm(1.7e308), 'speed');
    expectInputError(() => mToIn(1.7e308), 'length');
  });
});

describe('parseNumber', () => {
  it.each([
    ['1780', 1780],
    ['1,780', 1780], // comma then three digits: thousands
    ['1,780 rpm', 1780], // doc example; the unit is ignored here
    ['1780 rpm', 1780],
    ['29.97', 29.97],
    ['29,97', 29.97], // a lone comma before two digits: decimal mark
    ['1 780', 1780],
    ['1\u00a0780', 1780], // no-break space
    ['1\u202f780', 1780], // narrow no-break space
    ["1'780", 1780],
    ['1.780,5', 1780.5], // both marks: the last is the decimal mark
    ['1,780.5', 1780.5],
    ['1.234.567', 1234567],
    ['0,125', 0.125], // a group of only zeros cannot stand before a thousands separator
    ['.5', 0.5],
    ['-3', -3],
    ['\u22124', -4], // the minus sign U+2212
    ['+2.5', 2.5],
    ['1e3', 1000],
    ['2.5E-3', 0.0025],
    ['  42  ', 42],
    ['5', 5],
  ])('reads %j as %d', (text, value) => {
    expect(parseNumber(text)).toBeCloseTo(value, 12);
  });

  it('reads numbers as browsers print them in English, French and Swedish', () => {
    const locales = ['en-US', 'fr-FR', 'sv-SE'];
    fc.assert(
      fc.property(
        fc.double({ min: -1e9, max: 1e9, noNaN: true }),
        fc.constantFrom(...locales),
        (x, locale) => {
          const text = x.toLocaleString(locale, {
            maximumFractionDigits: 2,
            minimumFractionDigits: 2,
          });
          return (
            Math.abs(parseNumber(text) - Math.round(x * 100) / 100) <=
            1e-6 * Math.max(1, Math.abs(x))
          );
        },
      ),
    );
  });

  it('reads back any number JavaScript prints without an exponent', () => {
    fc.assert(
      fc.property(fc.double({ min: -1e15, max: 1e15, noNaN: true }), (x) => {
        fc.pre(!String(x).includes('e'));
        return parseNumber(String(x)) === x || (x === 0 && parseNumber(String(x)) === 0);
      }),
    );
  });

  it.each([['abc'], ['12.5.3x'], ['1,2,3'], ['1,7,80'], ['rpm'], ['--3'], ['1e400'], ['.'], [',']])(
    'rejects %j with an InputError naming the field',
    (text) => {
      const error = expectInputError(() => parseNumber(text, 'speed'), 'speed');
      expect(error.message).toContain('speed');
    },
  );

  it('says a field is empty when nothing is typed', () => {
    expectInputError(() => parseNumber('', 'rate'), 'rate', 'empty');
    expectInputError(() => parseNumber('   ', 'rate'), 'rate', 'empty');
  });

  it('rejects input that is not text', () => {
    for (const v of [3, null, undefined, {}, NaN])
      expectInputError(() => parseNumber(bad(v), 'rate'), 'rate', 'text');
  });

  it('names the default field "value" when none is given', () => {
    expect(inputErrorOf(() => parseNumber('abc')).field).toBe('value');
  });
});

describe('parseQuantity', () => {
  it('reads "1,780 rpm" as a speed of 29.666… rev/s (doc example)', () => {
    expect(parseQuantity('1,780 rpm', 'speed', 'rpm')).toBe(29.666666666666668);
  });

  it.each([
    ['1780 rpm', 'speed', 'rpm', 1780 / 60],
    ['1780', 'speed', 'rpm', 1780 / 60], // no unit: the default unit
    ['29.5 rev/s', 'speed', 'rpm', 29.5],
    ['6.283185307179586 rad/s', 'speed', 'rpm', 1],
    ['29.97 fps', 'rate', 'hz', 29.97],
    ['29,97', 'rate', 'fps', 29.97],
    ['3600 fpm', 'rate', 'hz', 60],
    ['3 600 flashes/min', 'rate', 'hz', 60],
    ['1.2 kHz', 'rate', 'hz', 1200],
    ['1/250', 'time', 's', 1 / 250], // a shutter time as photographers write it
    ['1/250 s', 'time', 'ms', 1 / 250],
    ['1/29,97', 'time', 's', 1 / 29.97],
    ['4 ms', 'time', 's', 0.004],
    ['250 µs', 'time', 's', 0.00025],
    ['25.4 mm', 'length', 'm', 0.0254],
    ['1 in', 'length', 'mm', 0.0254],
    ['16"', 'length', 'mm', 0.4064],
    ['100 km/h', 'groundSpeed', 'm/s', 100 / 3.6],
    ['60 mph', 'groundSpeed', 'km/h', 26.8224],
    ['172.8°', 'angle', 'deg', 172.8],
    ['5 %', 'percent', '%', 5],
  ] as const)('reads %j (%s, default %s) as %d in core units', (text, kind, unit, value) => {
    expect(parseQuantity(text, kind, unit)).toBeCloseTo(value, 12);
  });

  it('rejects a unit that does not fit the kind, listing the units it takes', () => {
    const error = expectInputError(
      () => parseQuantity('10 mm', 'speed', 'rpm', 'motor speed'),
      'motor speed',
    );
    expect(error.message).toContain('rpm');
    expectInputError(() => parseQuantity('1780 furlongs', 'speed', 'rpm'), 'speed');
  });

  it.each([['abc'], [''], ['1,2,3 s'], ['1/0'], ['1/0 s'], ['fast']])(
    'rejects %j in a time field, naming the field',
    (text) => {
      const error = expectInputError(
        () => parseQuantity(text, 'time', 's', 'exposure'),
        'exposure',
      );
      expect(error.message).toContain('exposure');
    },
  );

  it('turns a quantity too large for its unit into an InputError', () => {
    expectInputError(() => parseQuantity('1e307 kHz', 'rate', 'hz'), 'rate');
  });

  it('lists the units a kind accepts, for help text', () => {
    expect(unitsFor('time')).toEqual(expect.arrayContaining(['s', 'ms', 'µs']));
    expect(unitsFor('speed')).toEqual(expect.arrayContaining(['rpm', 'rev/s', 'rad/s']));
    expect(unitsFor('groundSpeed')).toEqual(expect.arrayContaining(['km/h', 'mph', 'm/s']));
  });

  it('never returns NaN or Infinity for any text', () => {
    fc.assert(
      fc.property(
        fc.string({ maxLength: 16 }),
        fc.constantFrom('speed', 'rate', 'time', 'length'),
        (text, kind) => {
          const unit = unitsFor(kind)[0];
          return finiteOrInputError(() => parseQuantity(text, kind, unit));
        },
      ),
      { numRuns: 500 },
    );
  });
});
