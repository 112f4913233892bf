import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { driveChain, type ChainSpec } from '../../../src/core/plans/driveChain';
import { apparentMotion } from '../../../src/core/physics/apparentMotion';
import { anyFinite, bad, expectInputError, finiteOrInputError } from '../expectInputError';

// IEC 60034-1 / NEMA MG 1: a 4-pole motor on 50 Hz is 1500 rpm synchronous; Engineering ToolBox
// gives 1450 rpm as its typical full-load speed, a slip of 1/30.
const motor50 = { kind: 'motor' as const, mainsHz: 50, poles: 4, minSlip: 0, maxSlip: 1 / 30 };
const belt = { kind: 'belt' as const, driverDiameterM: 0.1, drivenDiameterM: 0.25 };

describe('driveChain: speeds along the drives', () => {
  it('gives a motor the band from full-load to synchronous speed, reported at its middle', () => {
    const [m] = driveChain({ root: motor50, parts: [{ name: 'motor', symmetry: 1 }] });
    expect(m.lowHz * 60).toBeCloseTo(1450, 9);
    expect(m.highHz * 60).toBeCloseTo(1500, 9);
    expect(m.speedHz * 60).toBeCloseTo(1475, 9);
    expect(m.tolerance).toBeCloseTo(25 / 1475, 12);
  });

  it('turns the fan of a 100 mm to 250 mm belt at 0.4 times the motor, with the same relative tolerance', () => {
    // Belt drive D1·n1 = D2·n2 (docs/physics.md §8): 1450–1500 rpm × 0.4 = 580–600 rpm.
    const [m, fan] = driveChain({
      root: motor50,
      parts: [
        { name: 'motor', symmetry: 1 },
        { name: 'fan', symmetry: 6, link: belt },
      ],
    });
    expect(fan.lowHz * 60).toBeCloseTo(580, 9);
    expect(fan.highHz * 60).toBeCloseTo(600, 9);
    expect(fan.ratioToRoot).toBeCloseTo(0.4, 15);
    expect(fan.tolerance).toBeCloseTo(m.tolerance, 12);
    expect(fan.symmetry).toBe(6);
  });

  it('matches its doc example', () => {
    const fan = driveChain({
      root: motor50,
      parts: [
        { name: 'motor', symmetry: 1 },
        { name: 'fan', symmetry: 6, link: belt },
      ],
    })[1];
    expect(fan.name).toBe('fan');
    expect(fan.lowHz).toBeCloseTo(9.666666666666666, 12);
    expect(fan.highHz).toBeCloseTo(10, 12);
    expect(fan.speedHz).toBeCloseTo(9.833333333333333, 12);
    expect(fan.tolerance).toBeCloseTo(0.01694915254237288, 12);
  });

  it('lowers only the bottom of the band for belt slip, so relative tolerances add to first order', () => {
    // A known 1000 rpm ± 1 %, a 1:1 belt with up to 2 % slip: [990·0.98, 1010] = [970.2, 1010] rpm,
    // middle 990.1 rpm, half-width 19.9 rpm: ±2.01 %, about 1 % + 2 %/2.
    const [, driven] = driveChain({
      root: { kind: 'fixed', speedHz: 1000 / 60, tolerance: 0.01 },
      parts: [
        { name: 'driver', symmetry: 1 },
        {
          name: 'driven',
          symmetry: 1,
          link: { kind: 'belt', driverDiameterM: 0.2, drivenDiameterM: 0.2, slipPercent: 2 },
        },
      ],
    });
    expect(driven.lowHz * 60).toBeCloseTo(970.2, 9);
    expect(driven.highHz * 60).toBeCloseTo(1010, 9);
    expect(driven.speedHz * 60).toBeCloseTo(990.1, 9);
    expect(driven.tolerance).toBeCloseTo(19.9 / 990.1, 12);
  });

  it('reverses the direction through an external gear mesh and keeps it through an internal one', () => {
    // Gears z1·n1 = z2·n2 (docs/physics.md §8): 20 → 60 teeth turns a third as fast.
    const spec: ChainSpec = {
      root: { kind: 'fixed', speedHz: 30, tolerance: 0.01 },
      parts: [
        { name: 'pinion', symmetry: 20 },
        { name: 'wheel', symmetry: 60, link: { kind: 'gear', driverTeeth: 20, drivenTeeth: 60 } },
        {
          name: 'ring',
          symmetry: 60,
          link: { kind: 'gear', driverTeeth: 20, drivenTeeth: 60, internal: true },
          from: 0,
        },
      ],
    };
    const [pinion, wheel, ring] = driveChain(spec);
    expect(wheel.speedHz).toBeCloseTo(-10, 12);
    expect(wheel.ratioToRoot).toBeCloseTo(-1 / 3, 15);
    expect(wheel.tolerance).toBeCloseTo(pinion.tolerance, 12);
    expect(ring.speedHz).toBeCloseTo(10, 12);
    expect(ring.ratioToRoot).toBeCloseTo(1 / 3, 15);
  });

  it('reverses the direction through a crossed belt and passes the speed along a shaft unchanged', () => {
    const [, crossed, same] = driveChain({
      root: { kind: 'fixed', speedHz: 10 },
      parts: [
        { name: 'driver', symmetry: 1 },
        { name: 'crossed', symmetry: 1, link: { ...belt, crossed: true } },
        { name: 'same shaft', symmetry: 4, link: { kind: 'shaft' } },
      ],
    });
    expect(crossed.speedHz).toBeCloseTo(-4, 12);
    expect(same.speedHz).toBeCloseTo(-4, 12);
    expect(same.tolerance).toBe(0);
  });

  it('turns a 205/55R16 wheel at 100 km/h 13.99 times a second', () => {
    // ISO 4000-1 arithmetic: D = 16·25.4 + 2·205·0.55 = 631.9 mm; f = v/(π·D) = (100/3.6)/(π·0.6319).
    const [wheel] = driveChain({
      root: { kind: 'wheel', groundSpeedMps: 100 / 3.6, tyreSize: '205/55R16', tolerance: 0.02 },
      parts: [{ name: 'wheel', symmetry: 5 }],
    });
    expect(wheel.speedHz).toBeCloseTo(100 / 3.6 / (Math.PI * 0.6319), 12);
    expect(wheel.speedHz).toBeCloseTo(13.993, 3);
    expect(wheel.tolerance).toBeCloseTo(0.02, 12);
  });

  it('takes a wheel diameter in metres when no tyre size is given, and rolls backward at a negative ground speed', () => {
    const [wheel] = driveChain({
      root: { kind: 'wheel', groundSpeedMps: -Math.PI, diameterM: 0.5 },
      parts: [{ name: 'w', symmetry: 1 }],
    });
    expect(wheel.speedHz).toBeCloseTo(-2, 12);
  });

  it('lets several parts be driven by the same earlier part', () => {
    const parts = driveChain({
      root: { kind: 'fixed', speedHz: 25 },
      parts: [
        { name: 'motor', symmetry: 1 },
        { name: 'fan', symmetry: 6, link: belt },
        {
          name: 'pump',
          symmetry: 5,
          link: { kind: 'belt', driverDiameterM: 0.1, drivenDiameterM: 0.2 },
          from: 0,
        },
      ],
    });
    expect(parts.map((p) => p.speedHz)).toEqual([25, 10, 12.5]);
  });

  it('gives parts that the look computations accept directly', () => {
    const chain = driveChain({
      root: motor50,
      parts: [
        { name: 'motor', symmetry: 1 },
        { name: 'fan', symmetry: 6, link: belt },
      ],
    });
    for (const part of chain) expect(() => apparentMotion(part, 50)).not.toThrow();
  });

  it('names unnamed parts by their place in the chain', () => {
    const [p] = driveChain({
      root: { kind: 'fixed', speedHz: 1 },
      parts: [{ name: ' ', symmetry: 1 }],
    });
    expect(p.name).toBe('part 1');
  });

  it('reports a part that is not turning as still with no tolerance', () => {
    const [p] = driveChain({
      root: { kind: 'fixed', speedHz: 0, tolerance: 0.1 },
      parts: [{ name: 'idle', symmetry: 3 }],
    });
    expect(p).toMatchObject({ speedHz: 0, tolerance: 0, lowHz: 0, highHz: 0 });
  });
});

describe('driveChain: bad input', () => {
  const first = { name: 'motor', symmetry: 1 };

  it('rejects a missing chain and an empty part list', () => {
    expectInputError(() => driveChain(bad(null)), 'drive chain', 'speed');
    expectInputError(() => driveChain({ root: motor50, parts: [] }), 'parts', 'part');
  });

  it('rejects an unknown first speed and a wheel without a size', () => {
    expectInputError(
      () => driveChain({ root: bad({ kind: 'turbine' }), parts: [first] }),
      'first speed',
    );
    expectInputError(() => driveChain({ root: bad(undefined), parts: [first] }), 'first speed');
    expectInputError(
      () => driveChain({ root: { kind: 'wheel', groundSpeedMps: 10 }, parts: [first] }),
      'wheel diameter',
    );
    expectInputError(
      () =>
        driveChain({
          root: { kind: 'wheel', groundSpeedMps: 10, tyreSize: 'big' },
          parts: [first],
        }),
      'tyre size',
    );
  });

  it('rejects slips out of order and tolerances outside 0 to 50 %', () => {
    expectInputError(
      () => driveChain({ root: { ...motor50, minSlip: 0.05, maxSlip: 0.01 }, parts: [first] }),
      'slip',
    );
    expectInputError(
      () => driveChain({ root: { kind: 'fixed', speedHz: 1, tolerance: 0.6 }, parts: [first] }),
      'speed tolerance',
    );
    expectInputError(
      () => driveChain({ root: { kind: 'fixed', speedHz: NaN }, parts: [first] }),
      'speed',
    );
  });

  it('rejects a part without a link, an unknown link, and a driver that is not an earlier part', () => {
    expectInputError(
      () => driveChain({ root: motor50, parts: [first, { name: 'fan', symmetry: 6 }] }),
      'link of fan',
      'fan is driven',
    );
    expectInputError(
      () =>
        driveChain({
          root: motor50,
          parts: [first, { name: 'fan', symmetry: 6, link: bad({ kind: 'chain' }) }],
        }),
      'link of fan',
      'fan must be driven',
    );
    expectInputError(
      () =>
        driveChain({
          root: motor50,
          parts: [first, { name: 'fan', symmetry: 6, link: belt, from: 1 }],
        }),
      'part driving fan',
    );
    expectInputError(
      () =>
        driveChain({
          root: motor50,
          parts: [first, { name: 'fan', symmetry: 6, link: belt, from: -1 }],
        }),
      'part driving fan',
    );
  });

  it('rejects bad diameters, teeth, slip and feature counts', () => {
    const chain = (link: unknown, symmetry = 6) =>
      driveChain({ root: motor50, parts: [first, { name: 'fan', symmetry, link: bad(link) }] });
    expectInputError(() => chain({ ...belt, drivenDiameterM: 0 }), 'driven pulley diameter');
    expectInputError(() => chain({ ...belt, slipPercent: 30 }), 'belt slip of fan (percent)');
    expectInputError(
      () => chain({ kind: 'gear', driverTeeth: 20.5, drivenTeeth: 60 }),
      'driver teeth',
    );
    expectInputError(() => chain(belt, 0), 'features of fan');
    expectInputError(() => driveChain({ root: motor50, parts: [bad('motor')] }), 'part 1');
  });

  it('refuses a band wider than ±50 % after the drives', () => {
    // ±50 % then 20 % slip: [0.5·0.8, 1.5] is ±58 % about its middle.
    expectInputError(
      () =>
        driveChain({
          root: { kind: 'fixed', speedHz: 10, tolerance: 0.5 },
          parts: [first, { name: 'fan', symmetry: 1, link: { ...belt, slipPercent: 20 } }],
        }),
      'tolerance of fan',
      '50 %',
    );
  });
});

describe('driveChain: never NaN or Infinity', () => {
  it('returns finite numbers or throws InputError for any numbers at all', () => {
    fc.assert(
      fc.property(
        anyFinite(),
        anyFinite(),
        anyFinite(),
        anyFinite(),
        anyFinite(),
        (speed, tol, d1, d2, slip) =>
          finiteOrInputError(() =>
            driveChain({
              root: {
                kind: 'fixed',
                speedHz: speed,
                tolerance: Math.abs(tol) < 1 ? Math.abs(tol) : tol,
              },
              parts: [
                { name: 'a', symmetry: 1 },
                {
                  name: 'b',
                  symmetry: 3,
                  link: {
                    kind: 'belt',
                    driverDiameterM: d1,
                    drivenDiameterM: d2,
                    slipPercent: slip,
                  },
                },
                {
                  name: 'c',
                  symmetry: 5,
                  link: { kind: 'gear', driverTeeth: 100_000, drivenTeeth: 1 },
                },
              ],
            }),
          ),
      ),
      { seed: 1949, numRuns: 1000 },
    );
  });
});
