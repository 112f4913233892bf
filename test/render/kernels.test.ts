import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { coveredUpTo, shortCoverage, sweptCoverage } from '../../src/render/kernels';

/** Independent check: midpoint-rule integral of the blade indicator over [a, b]. */
function bruteCoverage(a: number, b: number, duty: number, steps = 20_000): number {
  let inside = 0;
  for (let k = 0; k < steps; k++) {
    const x = a + ((k + 0.5) / steps) * (b - a);
    if (x - Math.floor(x) < duty) inside++;
  }
  return inside / steps;
}

const interval = fc.record({
  a: fc.double({ min: -5, max: 5, noNaN: true }),
  length: fc.double({ min: 1e-3, max: 4, noNaN: true }),
  duty: fc.double({ min: 0, max: 1, noNaN: true }),
});

describe('coveredUpTo', () => {
  it('counts whole blades and the blade part inside the last pitch', () => {
    expect(coveredUpTo(2.5, 0.25)).toBeCloseTo(0.75, 12);
    expect(coveredUpTo(2.1, 0.25)).toBeCloseTo(0.6, 12);
    expect(coveredUpTo(0, 0.25)).toBe(0);
  });
  it('counts negative positions the same way, so differences hold across zero', () => {
    // Of [−0.8, 0] only [−0.8, −0.75] is blade: 0.05, counted negative.
    expect(coveredUpTo(-0.8, 0.25)).toBeCloseTo(-0.05, 12);
    expect(coveredUpTo(-0.5, 0.25)).toBeCloseTo(0, 12);
  });
});

describe('sweptCoverage', () => {
  it('matches a brute-force integral of the blade pattern over any interval', () => {
    fc.assert(
      fc.property(interval, ({ a, length, duty }) => {
        expect(sweptCoverage(a, a + length, duty)).toBeCloseTo(
          bruteCoverage(a, a + length, duty),
          2,
        );
      }),
      { numRuns: 200 },
    );
  });
  it('gives exactly the duty for a sweep of a whole number of pitches, wherever it starts', () => {
    fc.assert(
      fc.property(interval, fc.integer({ min: 1, max: 6 }), ({ a, duty }, pitches) => {
        expect(sweptCoverage(a, a + pitches, duty)).toBeCloseTo(duty, 9);
      }),
    );
  });
  it('is 1 inside a blade and 0 in a gap for a short interval', () => {
    expect(sweptCoverage(0.1, 0.2, 0.3)).toBeCloseTo(1, 12);
    expect(sweptCoverage(0.5, 0.6, 0.3)).toBe(0);
  });
});

describe('shortCoverage', () => {
  it('agrees with sweptCoverage for every interval up to one pitch long', () => {
    fc.assert(
      fc.property(interval, ({ a, length, duty }) => {
        const l = Math.min(length, 1);
        expect(shortCoverage(a, l, duty)).toBeCloseTo(sweptCoverage(a, a + l, duty), 9);
      }),
      { numRuns: 500 },
    );
  });
  it('counts the part of the next blade an interval reaches into', () => {
    expect(shortCoverage(0.9, 0.2, 0.3)).toBeCloseTo(0.5, 12);
  });
});
