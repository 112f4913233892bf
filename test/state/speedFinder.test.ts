// The speed finder's state that both methods share (src/state/speedFinder.ts): the expected
// speed as a nameplate speed ± %, a heard speed's precision as the part's tolerance, and the
// change a speed with an origin makes to the part, in words.
import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/core';
import { defaultSetup } from '../../src/state/model';
import {
  defaultExpectation,
  expectedRange,
  toleranceFromPrecision,
  withMeasuredSpeed,
} from '../../src/state/speedFinder';
import { speedChangeWords } from '../../src/words/speedFinder';
import { originLine } from '../../src/words/origin';

describe('an expected speed given as a nameplate speed ± %', () => {
  it('spans the speed less and more the share (1500 rpm ± 5 %: 1425 to 1575 rpm, worked by hand)', () => {
    const range = expectedRange({
      ...defaultExpectation,
      mode: 'nameplate',
      nameplateRpm: 1500,
      plusMinusPercent: 5,
    })!;
    expect(range.minHz * 60).toBeCloseTo(1425, 9);
    expect(range.maxHz * 60).toBeCloseTo(1575, 9);
  });

  it('refuses a speed of 0 or a share outside (0, 50] % in words, never a NaN range', () => {
    for (const [nameplateRpm, plusMinusPercent] of [
      [0, 5],
      [1500, 0],
      [1500, 60],
      [Number.NaN, 5],
      [1500, Number.POSITIVE_INFINITY],
    ]) {
      expect(() =>
        expectedRange({ ...defaultExpectation, mode: 'nameplate', nameplateRpm, plusMinusPercent }),
      ).toThrow(InputError);
    }
  });
});

describe('toleranceFromPrecision', () => {
  it('rounds the precision up to two significant figures of a per cent', () => {
    // 100 × 0.01 / 29.1667 = 0.034286 % → 0.035 % (worked by hand).
    expect(toleranceFromPrecision(29.1667, 0.01)).toBe(0.035);
    // 100 × 0.5 / 25 = 2 % exactly stays 2 %.
    expect(toleranceFromPrecision(25, 0.5)).toBe(2);
    // A negative precision or speed reads as its size.
    expect(toleranceFromPrecision(-25, -0.5)).toBe(2);
  });

  it('stays within what a part takes: at most 50 %, and 0 for a precision that is no number', () => {
    expect(toleranceFromPrecision(1, 2)).toBe(50);
    expect(toleranceFromPrecision(29, 0)).toBe(0);
    expect(toleranceFromPrecision(29, Number.NaN)).toBe(0);
    expect(toleranceFromPrecision(0, 0.01)).toBe(0);
  });
});

describe('withMeasuredSpeed with an origin', () => {
  it('gives the part the precision as its tolerance, and says so', () => {
    const { setup, changes } = withMeasuredSpeed(defaultSetup, 1750 / 60, 6, {
      method: 'sound',
      precisionHz: 0.01,
      heardAtMs: 0,
    });
    expect(setup.parts[0]!.tolerancePercent).toBe(0.035);
    const said = changes.map(speedChangeWords);
    expect(said).toContain('Fan: tolerance ±1 % → ±0.035 %.');
    // The part says where its speed came from, and when it was heard.
    expect(setup.parts[0]!.origin).toEqual({
      method: 'sound',
      detail: { features: 6, precisionPercent: 0.035 },
      at: '1970-01-01T00:00:00.000Z',
    });
    expect(originLine(setup.parts[0]!.origin!)).toBe(
      'Speed found by sound, ±0.035 %, applied on 1970-01-01.',
    );
  });

  it('a heard speed confirmed by a strobe reading says so on the part', () => {
    const { setup } = withMeasuredSpeed(defaultSetup, 1750 / 60, 6, {
      method: 'sound-and-strobe',
      precisionHz: 0.01,
      heardAtMs: Date.UTC(2026, 11, 2),
    });
    expect(originLine(setup.parts[0]!.origin!)).toBe(
      'Speed found by sound, confirmed by strobe, ±0.035 %, applied on 2026-12-02.',
    );
  });

  it('keeps the part’s tolerance for a strobe speed, which has no precision of its own', () => {
    const { setup, changes } = withMeasuredSpeed(defaultSetup, 1750 / 60, 6);
    expect(setup.parts[0]!.tolerancePercent).toBe(defaultSetup.parts[0]!.tolerancePercent);
    expect(setup.parts[0]!.origin?.method).toBe('strobe');
    expect(changes.some((c) => c.kind === 'tolerance')).toBe(false);
  });
});
