// The public face of the core must match its contract (DEVELOPERS.md, "The core's public face"): every name exported, results shaped as
// documented, bad input throwing InputError (an Error) that names the field.
import { describe, expect, it } from 'vitest';
import * as core from '../../src/core';
import { bad, inputErrorOf } from './expectInputError';

// Every function the contract lists, by name.
const documentedFunctions = [
  'apparentMotion',
  'lockRates',
  'ratesForApparent',
  'rateBands',
  'findSpeed',
  'blurDegrees',
  'exposureFromShutterAngle',
  'rollingSkewDegrees',
  'flickerRisk',
  'synchronousSpeedHz',
  'tyreDiameterM',
  'foldedHz',
  'lowPassGainDb',
] as const;

describe('core index', () => {
  it.each(documentedFunctions.map((name) => [name]))('exports %s as a function', (name) => {
    expect(typeof core[name]).toBe('function');
  });

  it('exports InputError, a subclass of Error', () => {
    expect(typeof core.InputError).toBe('function');
    const error = new core.InputError('rate', 'rate must be greater than zero.');
    expect(error).toBeInstanceOf(Error);
    expect(error.name).toBe('InputError');
    expect(error.field).toBe('rate');
  });

  it('throws the exported InputError class, so callers can catch it by type', () => {
    const error = inputErrorOf(() => core.apparentMotion({ speedHz: 60, symmetry: 1 }, 0));
    expect(error).toBeInstanceOf(core.InputError);
    expect(error).toBeInstanceOf(Error);
    expect(error.message).toContain('rate');
  });

  it('exports the default look options and limits', () => {
    expect(core.defaultLookOptions).toMatchObject({ unclearStep: 0.45, maxImages: 8 });
    expect(core.MAX_IMAGES_LIMIT).toBeGreaterThanOrEqual(8);
    expect(core.MAX_SYMMETRY).toBeGreaterThanOrEqual(100);
  });
});

describe('core index: result shapes of the contract', () => {
  const fan = { speedHz: 10, symmetry: 3 };

  it('apparentMotion gives ratio, step, apparentHz, faithful, images and look', () => {
    const m = core.apparentMotion(fan, 61);
    expect(m).toEqual(
      expect.objectContaining({
        ratio: expect.any(Number),
        step: expect.any(Number),
        apparentHz: expect.any(Number),
        faithful: expect.any(Boolean),
        images: expect.any(Number),
        look: expect.stringMatching(/^(true|forward|backward|still|unclear)$/),
        nearlyStill: expect.any(Boolean),
      }),
    );
    // Default sampler 'flash' (the contract): r = 1/2 shows two images standing still only under a flash.
    expect(core.apparentMotion(fan, 60).images).toBe(2);
    expect(core.apparentMotion(fan, 60, { sampler: 'frames' }).images).toBe(1);
  });

  it('lockRates gives rateHz, images, p, q, lowHz and highHz, ascending by rate', () => {
    const locks = core.lockRates(fan, { minHz: 5, maxHz: 100 });
    expect(locks.length).toBeGreaterThan(1);
    for (const l of locks) {
      expect(Object.keys(l)).toEqual(
        expect.arrayContaining(['rateHz', 'images', 'p', 'q', 'lowHz', 'highHz']),
      );
    }
    expect(locks.map((l) => l.rateHz)).toEqual(
      [...locks.map((l) => l.rateHz)].sort((a, b) => a - b),
    );
  });

  it('ratesForApparent gives rateHz and k, ascending by rate, and takes the sampler', () => {
    const rates = core.ratesForApparent(
      { speedHz: 30, symmetry: 1 },
      0.5,
      { minHz: 1, maxHz: 40 },
      { sampler: 'frames' },
    );
    expect(rates[0]).toEqual({ rateHz: expect.any(Number), k: expect.any(Number) });
    expect(rates.map((r) => r.rateHz)).toEqual(
      [...rates.map((r) => r.rateHz)].sort((a, b) => a - b),
    );
  });

  it('rateBands gives fromHz, toHz, safe and reason for the parts together, and takes nearlyStillHz', () => {
    const bands = core.rateBands(
      [fan, { speedHz: 24.5, symmetry: 1 }],
      { minHz: 1, maxHz: 200 },
      { sampler: 'flash', nearlyStillHz: 0.1 },
    );
    for (const b of bands) {
      expect(b).toEqual(
        expect.objectContaining({
          fromHz: expect.any(Number),
          toHz: expect.any(Number),
          safe: expect.any(Boolean),
          reason: expect.any(String),
        }),
      );
    }
  });

  it('findSpeed gives candidates with speedHz and an optional next rate', () => {
    const found = core.findSpeed(
      [
        { rateHz: 30, images: 1 },
        { rateHz: 20, images: 1 },
      ],
      1,
    );
    expect(found.candidates[0]).toEqual(expect.objectContaining({ speedHz: 60 }));
    expect(typeof found.nextRateHz).toBe('number');
    const inStrobe = core.findSpeed(
      [
        { rateHz: 30, images: 1 },
        { rateHz: 20, images: 1 },
      ],
      1,
      undefined,
      { rateRange: { minHz: 1, maxHz: 35 } },
    );
    expect(inStrobe.nextRateHz).toBeLessThanOrEqual(35);
    expect(
      core.findSpeed([{ rateHz: 30, images: 1 }], 1, { minHz: 20, maxHz: 40 }).candidates[0]
        .speedHz,
    ).toBe(30);
  });

  it('the single-number functions give the documented examples', () => {
    expect(core.blurDegrees(30, 1 / 1000)).toBe(10.8);
    expect(core.exposureFromShutterAngle(180, 24)).toBeCloseTo(1 / 48, 15);
    expect(core.rollingSkewDegrees(10, 0.03)).toBe(108);
    expect(core.flickerRisk(120, 5)).toBe('low-risk');
    expect(core.synchronousSpeedHz(60, 4)).toBe(30);
    expect(core.tyreDiameterM('205/55R16')).toBe(0.6319); // the contract's example: '205/55R16' → 0.6319
    expect(core.foldedHz(20, 18)).toBe(2);
    expect(core.lowPassGainDb(100, 100, 1)).toBeCloseTo(-3.0103, 4);
  });
});

describe('core index: bad input throws InputError for every documented function', () => {
  const part = { speedHz: 10, symmetry: 1 };
  const range = { minHz: 1, maxHz: 100 };
  const calls: Array<[string, () => unknown]> = [
    ['apparentMotion', () => core.apparentMotion(part, bad('fast'))],
    ['lockRates', () => core.lockRates(bad({ speedHz: 10, symmetry: 0 }), range)],
    ['ratesForApparent', () => core.ratesForApparent(part, bad(null), range)],
    ['rateBands', () => core.rateBands([part], { minHz: 50, maxHz: 5 })],
    ['findSpeed', () => core.findSpeed([{ rateHz: -1, images: 1 }], 1)],
    ['blurDegrees', () => core.blurDegrees(bad(undefined), 0.001)],
    ['exposureFromShutterAngle', () => core.exposureFromShutterAngle(180, 0)],
    ['rollingSkewDegrees', () => core.rollingSkewDegrees(Infinity, 0.03)],
    ['flickerRisk', () => core.flickerRisk(NaN, 5)],
    ['synchronousSpeedHz', () => core.synchronousSpeedHz(50, 1.5)],
    ['tyreDiameterM', () => core.tyreDiameterM('205/55')],
    ['foldedHz', () => core.foldedHz(20, -18)],
    ['lowPassGainDb', () => core.lowPassGainDb(100, 10, 0)],
  ];

  it('covers every documented function', () => {
    expect(calls.map(([name]) => name).sort()).toEqual([...documentedFunctions].sort());
  });

  it.each(calls)('%s throws an InputError whose message names its field', (_name, call) => {
    const error = inputErrorOf(call);
    expect(error).toBeInstanceOf(Error);
    expect(error.field.length).toBeGreaterThan(0);
    const firstWord = error.field.split(' ')[0].toLowerCase();
    expect(error.message.toLowerCase()).toContain(firstWord);
  });
});
