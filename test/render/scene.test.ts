import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { InputError } from '../../src/core';
import { checkScene, sampleIndexAt, sampleTimeS, type PreviewScene } from '../../src/render/scene';

const good: PreviewScene = {
  features: 6,
  speedHz: 29.5,
  sampler: 'frames',
  rateHz: 30,
  exposureS: 1 / 500,
  readoutS: 0.03,
  timeS: 1.5,
  fadeS: 0.06,
};

function fieldOf(fn: () => void): string {
  try {
    fn();
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    return (e as InputError).field;
  }
  throw new Error('expected an InputError');
}

describe('sampleIndexAt', () => {
  it('gives back k for the start time of sample k at any rate, despite rounding', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 1_000_000 }),
        fc.double({ min: 0.1, max: 10_000, noNaN: true }),
        (k, rate) => {
          expect(sampleIndexAt(sampleTimeS(k, rate), rate)).toBe(k);
        },
      ),
    );
  });
  it('stays on a sample until the next one starts', () => {
    expect(sampleIndexAt(0.0999, 10)).toBe(0);
    expect(sampleIndexAt(0.1, 10)).toBe(1);
    expect(sampleIndexAt(0.1999, 10)).toBe(1);
  });
});

describe('checkScene', () => {
  it('accepts a well-formed scene', () => {
    expect(() => checkScene(good)).not.toThrow();
  });
  it('names the field of each bad value', () => {
    expect(fieldOf(() => checkScene({ ...good, features: 0 }))).toBe('features');
    expect(fieldOf(() => checkScene({ ...good, features: 2.5 }))).toBe('features');
    expect(fieldOf(() => checkScene({ ...good, speedHz: NaN }))).toBe('speed');
    expect(fieldOf(() => checkScene({ ...good, rateHz: 0 }))).toBe('rate');
    expect(fieldOf(() => checkScene({ ...good, exposureS: -1 }))).toBe('exposure');
    expect(fieldOf(() => checkScene({ ...good, readoutS: Infinity }))).toBe('readout time');
    expect(fieldOf(() => checkScene({ ...good, timeS: NaN }))).toBe('time');
    expect(fieldOf(() => checkScene({ ...good, fadeS: -0.1 }))).toBe('fade');
    expect(fieldOf(() => checkScene({ ...good, sampler: 'video' as never }))).toBe('sampler');
  });
  it('needs no rate to show the part as it really turns', () => {
    expect(() => checkScene({ ...good, sampler: 'true', rateHz: 0 })).not.toThrow();
  });
});
