/**
 * The core's central relations (docs/physics.md §2–§4) checked against an independent,
 * brute-force replay (./simulator.ts): positions of the pattern at each sample, in exact
 * fractions, read by nearest-neighbour matching and by grouping flashes. Thousands of
 * random cases per property (fast-check), with a fixed seed so that any failure reproduces.
 *
 * Floating point: the replay is exact for the doubles the core is given; the core rounds.
 * Numbers must agree to a few units in the last place. A discrete answer (faithful, images,
 * look, the lock p/q) must agree with the exact replay at the given rate, or with the replay at a rate or a
 * threshold at most 2^-40 (about 1e-12) relative away: only a decision boundary closer than
 * that may fall either way.
 */
import fc from 'fast-check';
import { describe, expect, it, vi } from 'vitest';
import {
  apparentMotion,
  defaultLookOptions,
  freezeRates,
  lockRates,
  rateBands,
  ratesForApparent,
  type ApparentMotion,
  type LookOptions,
  type Part,
  type Range,
  type Sampler,
} from '../../src/core';
import {
  PatternReplay,
  absolute,
  compare,
  documentedEye,
  exactValue,
  eyeFrom,
  frac,
  minus,
  safeView,
  over,
  plus,
  replay,
  signOf,
  times,
  toNumber,
  type Eye,
  type Fraction,
  type ReplayView,
  type Scene,
} from './simulator';

/** Fixed so that a failing case reproduces; fast-check prints the shrunk counterexample. */
const SEED = 1949;
const RUNS = 1000;
const settings = { numRuns: RUNS, seed: SEED };
// A thousand cases per property on a shared 2-core machine can pass Vitest's default 5 s per
// test when the machine is busy; this only stops a hung run, it measures nothing.
vi.setConfig({ testTimeout: 60_000 });

// ------------------------------------------------------------------ small helpers

/** The next double above / below a positive finite x (IEEE 754 bit patterns are ordered). */
const bits = new DataView(new ArrayBuffer(8));
function nextUp(x: number): number {
  bits.setFloat64(0, x);
  bits.setBigUint64(0, bits.getBigUint64(0) + 1n);
  return bits.getFloat64(0);
}
function nextDown(x: number): number {
  bits.setFloat64(0, x);
  bits.setBigUint64(0, bits.getBigUint64(0) - 1n);
  return bits.getFloat64(0);
}

function greatestCommonDivisor(a: number, b: number): number {
  return b === 0 ? a : greatestCommonDivisor(b, a % b);
}

/** floor and ceiling of a fraction. */
function floorOf(x: Fraction): bigint {
  const q = x.num / x.den; // truncates toward zero
  return x.num < 0n && q * x.den !== x.num ? q - 1n : q;
}
const ceilOf = (x: Fraction): bigint => -floorOf({ num: -x.num, den: x.den });

/** x and y equal up to whole periods (a step of +½ pitch and one of −½ are the same match). */
function sameModulo(x: number, y: number, period: number, tolerance: number): boolean {
  const d = x - y;
  return Math.abs(d - period * Math.round(d / period)) <= tolerance;
}

/**
 * Exact relative nudges of ±2^-40, ±2^-46 and ±2^-52 (about 1e-12 down to one unit in the last
 * place): a boundary can sit closer to the case than the coarse nudge, and be jumped over.
 */
const NUDGES: Fraction[] = [40n, 46n, 52n].flatMap((k) => [
  frac(2n ** k - 1n, 2n ** k),
  frac(2n ** k + 1n, 2n ** k),
]);
const ONE = frac(1);
/**
 * Inputs of the replay to nudge: the rate, the still threshold, the unclear step, the
 * nearly-still threshold, or rate and still together.
 */
interface Perturbation {
  rate: Fraction;
  still: Fraction;
  unclear: Fraction;
  nearly: Fraction;
}
const PERTURBATIONS: Perturbation[] = [
  ...NUDGES.map((rate) => ({ rate, still: ONE, unclear: ONE, nearly: ONE })),
  ...NUDGES.map((still) => ({ rate: ONE, still, unclear: ONE, nearly: ONE })),
  ...NUDGES.map((unclear) => ({ rate: ONE, still: ONE, unclear, nearly: ONE })),
  ...NUDGES.map((nearly) => ({ rate: ONE, still: ONE, unclear: ONE, nearly })),
  ...NUDGES.flatMap((rate) => NUDGES.map((still) => ({ rate, still, unclear: ONE, nearly: ONE }))),
];

function sceneAt(part: Part, rate: Fraction, sampler: Sampler): Scene {
  return { speedHz: exactValue(part.speedHz), symmetry: part.symmetry, rateHz: rate, sampler };
}

/** Numeric fields against the exact replay, to a few units in the last place. */
function numericDifferences(
  core: ApparentMotion,
  view: ReplayView,
  part: Part,
  rateHz: number,
): string[] {
  const out: string[] = [];
  const ratio = toNumber(view.ratio);
  const stepTolerance = 16 * Number.EPSILON * Math.max(1, Math.abs(ratio));
  if (Math.abs(core.ratio - ratio) > 4 * Number.EPSILON * Math.abs(ratio))
    out.push(`ratio ${core.ratio} vs ${ratio}`);
  if (!(Math.abs(core.step) <= 0.5)) out.push(`step ${core.step} outside [-0.5, 0.5]`);
  const step = toNumber(view.step);
  if (!sameModulo(core.step, step, 1, stepTolerance)) out.push(`step ${core.step} vs ${step}`);
  const apparent = toNumber(view.apparentHz);
  const perStep = rateHz / part.symmetry; // rev/s per pitch per sample
  const apparentTolerance = stepTolerance * perStep + 4 * Number.EPSILON * Math.abs(apparent);
  if (!sameModulo(core.apparentHz, apparent, perStep, apparentTolerance)) {
    out.push(`apparentHz ${core.apparentHz} vs ${apparent}`);
  }
  return out;
}

function discreteDifferences(core: ApparentMotion, view: ReplayView): string[] {
  const out: string[] = [];
  if (core.faithful !== view.faithful) out.push(`faithful ${core.faithful} vs ${view.faithful}`);
  if (core.images !== view.images) out.push(`images ${core.images} vs ${view.images}`);
  if (core.look !== view.look) out.push(`look ${core.look} vs ${view.look}`);
  if (core.nearlyStill !== view.nearlyStill)
    out.push(`nearlyStill ${core.nearlyStill} vs ${view.nearlyStill}`);
  // The group reported (still, creeping, or the single image): its lock p/q. A single image
  // exactly half a pitch on has two nearest whole pitches, so p may be either.
  const halfPitch = core.q === 1 && view.group.q === 1 && Math.abs(core.step) === 0.5;
  const pOff = BigInt(core.p) - view.group.p;
  const pAgrees = pOff === 0n || (halfPitch && (pOff === 1n || pOff === -1n));
  if (out.length === 0 && (core.q !== view.group.q || !pAgrees)) {
    out.push(`group ${core.p}/${core.q} vs ${view.group.p}/${view.group.q}`);
  }
  return out;
}

/** The reported group's drift (rev/s) against the replay's, when both report the same group. */
function driftDifference(
  core: ApparentMotion,
  view: ReplayView,
  part: Part,
  rateHz: number,
): string[] {
  if (core.q !== view.group.q) return [];
  const drift = toNumber(view.group.driftHz);
  // n·f − (p/q)·s cancels: allow a few units in the last place of its larger term, over n.
  const scale = Math.max(Math.abs(part.speedHz), ((core.p / core.q) * rateHz) / part.symmetry);
  const tolerance = 16 * Number.EPSILON * scale;
  // A group half a pitch on drifts as well one way as the other: equal up to whole pitches per cycle.
  const period = rateHz / (part.symmetry * core.q);
  return sameModulo(core.driftHz, drift, period, tolerance)
    ? []
    : [`driftHz ${core.driftHz} vs ${drift}`];
}

/**
 * apparentMotion agrees with the replay: numbers with the exact replay; discrete answers with
 * the exact replay, or, for a case on a decision boundary, with the replay at a rate or a
 * threshold nudged by at most 2^-40 relative. `strict`: with the exact replay only, for inputs
 * the core computes without rounding across a boundary (whole-number locks).
 */
function expectAgreement(
  part: Part,
  rateHz: number,
  sampler: Sampler,
  look?: Partial<LookOptions>,
  { strict = false } = {},
): ApparentMotion {
  const core = apparentMotion(part, rateHz, { ...look, sampler });
  const eye = look ? eyeFrom({ ...defaultLookOptions, ...look }) : documentedEye;
  const rate = exactValue(rateHz);
  const exact = replay(sceneAt(part, rate, sampler), eye);
  const problems = numericDifferences(core, exact, part, rateHz);
  const discrete = discreteDifferences(core, exact);
  const explained =
    discrete.length === 0 ||
    (!strict &&
      PERTURBATIONS.some((n) => {
        const nudgedEye = {
          ...eye,
          stillHz: times(eye.stillHz, n.still),
          unclearStep: times(eye.unclearStep, n.unclear),
          nearlyStillHz: times(eye.nearlyStillHz, n.nearly),
        };
        return (
          discreteDifferences(core, replay(sceneAt(part, times(rate, n.rate), sampler), nudgedEye))
            .length === 0
        );
      }));
  if (!explained) problems.push(...discrete);
  if (discrete.length === 0) problems.push(...driftDifference(core, exact, part, rateHz));
  expect(
    problems,
    `speed ${part.speedHz} rev/s, ${part.symmetry} features, ${sampler} at ${rateHz} Hz`,
  ).toEqual([]);
  return core;
}

// ------------------------------------------------------------------ arbitraries

const logUniform = (lo: number, hi: number) =>
  fc.double({ min: Math.log10(lo), max: Math.log10(hi), noNaN: true }).map((e) => 10 ** e);
const symmetryArb = fc.oneof(
  fc.constantFrom(1, 2, 3, 4, 5, 6, 8, 12, 24, 60),
  fc.integer({ min: 1, max: 60 }),
);
/** Signed speeds from 0.001 to 2000 rev/s (0.06 rpm to 120 000 rpm). */
const speedArb = fc
  .tuple(fc.boolean(), logUniform(0.001, 2000))
  .map(([backward, v]) => (backward ? -v : v));
const samplerArb = fc.constantFrom<Sampler>('flash', 'frames');
const toleranceArb = fc.oneof(
  fc.constant(0),
  fc.constant(0.1),
  fc.double({ min: 0, max: 0.1, noNaN: true }),
);
/** Film and video rates, with the 1000/1001 ones of SMPTE ST 12-1 / ITU-R BT.709. */
const FILM_RATES = [24000 / 1001, 24, 25, 30000 / 1001, 30, 50, 60000 / 1001, 60, 100, 120];

/** How a rate is placed against a lock p/q: exactly, at the neighbouring doubles, ±1e-9, or a bit off. */
type Placement = 'exact' | 'next-up' | 'next-down' | 'plus-1e-9' | 'minus-1e-9' | 'off';
function place(lockHz: number, how: Placement, off: number): number {
  switch (how) {
    case 'exact':
      return lockHz;
    case 'next-up':
      return nextUp(lockHz);
    case 'next-down':
      return nextDown(lockHz);
    case 'plus-1e-9':
      return lockHz * (1 + 1e-9);
    case 'minus-1e-9':
      return lockHz * (1 - 1e-9);
    case 'off':
      return lockHz * (1 + off);
  }
}
const placementArb = fc.constantFrom<Placement>(
  'exact',
  'next-up',
  'next-down',
  'plus-1e-9',
  'minus-1e-9',
  'off',
);
const offArb = fc.tuple(fc.boolean(), logUniform(1e-8, 3e-2)).map(([down, v]) => (down ? -v : v));

/**
 * A part and a rate: generic, a film rate, placed at or next to a lock p/q (q up to 12, beyond
 * the 8 looked for), or placed a relative `edge` away from one of the look's decision
 * boundaries (documented thresholds): the unclear step, the still threshold of a p/q group,
 * the creep limit of a q-image group, the nearly-still threshold, the Nyquist rate.
 */
const sceneArb = fc.record({
  speedHz: speedArb,
  symmetry: symmetryArb,
  sampler: samplerArb,
  kind: fc.constantFrom(
    'generic',
    'film',
    'lock',
    'lock',
    'unclear-edge',
    'still-edge',
    'creep-edge',
    'nearly-edge',
    'nyquist-edge',
  ),
  genericRate: logUniform(0.05, 1e5),
  filmRate: fc.constantFrom(...FILM_RATES),
  p: fc.integer({ min: 1, max: 24 }),
  q: fc.integer({ min: 1, max: 12 }),
  k: fc.integer({ min: 1, max: 20 }),
  above: fc.boolean(),
  placement: placementArb,
  off: offArb,
  edge: fc.tuple(fc.boolean(), logUniform(1e-14, 3e-2)).map(([down, v]) => (down ? -v : v)),
});
type SceneCase = typeof sceneArb extends fc.Arbitrary<infer T> ? T : never;
function rateOf(c: SceneCase): number {
  const F = c.symmetry * Math.abs(c.speedHz); // pattern frequency, Hz
  const side = c.above ? 1 : -1;
  switch (c.kind) {
    case 'generic':
      return c.genericRate;
    case 'film':
      return c.filmRate;
    case 'lock':
      return place((F * c.q) / c.p, c.placement, c.off);
    case 'unclear-edge': // r = k ± 0.45·(1 + edge)
      return F / (c.k + side * defaultLookOptions.unclearStep * (1 + c.edge));
    case 'still-edge': {
      // the p/q group drifts at ±stillHz·(1 + edge): n·f − (p/q)·s = ±n·stillHz·(1 + edge)
      const rate =
        (c.q * (F + side * c.symmetry * defaultLookOptions.stillHz * (1 + c.edge))) / c.p;
      return rate > 0 ? rate : c.genericRate;
    }
    case 'creep-edge': {
      // the q-image group creeps ±groupSpacingsPerS·(1 + edge) spacings/s: |q·n·f − p·s| = that
      const q = Math.max(2, Math.min(8, c.q));
      const rate = (q * F + side * defaultLookOptions.groupSpacingsPerS * (1 + c.edge)) / c.p;
      return rate > 0 ? rate : c.genericRate;
    }
    case 'nearly-edge': {
      // one image seen at ±nearlyStillHz·(1 + edge): n·f − k·s = ±n·nearlyStillHz·(1 + edge)
      const rate = (F + side * c.symmetry * defaultLookOptions.nearlyStillHz * (1 + c.edge)) / c.k;
      return rate > 0 ? rate : c.genericRate;
    }
    default: // 'nyquist-edge'
      return 2 * F * (1 + c.edge);
  }
}

// ------------------------------------------------------------------ the simulator itself

describe('the brute-force replay', () => {
  it('uses the documented look thresholds of the core', () => {
    // docs/physics.md §2: 0.25 rpm, 0.45 pitch; §3: 8 images; lookOptions.ts: 1 spacing per second.
    expect(toNumber(documentedEye.stillHz)).toBeCloseTo(defaultLookOptions.stillHz, 15);
    expect(toNumber(documentedEye.unclearStep)).toBe(defaultLookOptions.unclearStep);
    expect(documentedEye.maxImages).toBe(defaultLookOptions.maxImages);
    expect(toNumber(documentedEye.groupSpacingsPerS)).toBe(defaultLookOptions.groupSpacingsPerS);
  });

  it('reproduces the published stroboscope examples', () => {
    // Wikipedia, "Stroboscopic effect": a disc at 60 rev/s lit at 61 flashes/s seems to turn
    // backwards at 1 rev/s; at 59 flashes/s forwards at 1 rev/s.
    const at61 = replay({ speedHz: frac(60), symmetry: 1, rateHz: frac(61), sampler: 'flash' });
    expect(toNumber(at61.apparentHz)).toBe(-1);
    expect(at61.look).toBe('backward');
    const at59 = replay({ speedHz: frac(60), symmetry: 1, rateHz: frac(59), sampler: 'flash' });
    expect(toNumber(at59.apparentHz)).toBe(1);
    expect(at59.look).toBe('forward');
    // Same source: a 12-spoke wheel at 2 rev/s filmed at 24 frames/s seems still.
    const wheel = replay({ speedHz: frac(2), symmetry: 12, rateHz: frac(24), sampler: 'frames' });
    expect(wheel.look).toBe('still');
    expect(wheel.images).toBe(1);
    // docs/physics.md §2: exactly half a turn per flash is two images standing still.
    const half = replay({ speedHz: frac(10), symmetry: 1, rateHz: frac(20), sampler: 'flash' });
    expect([half.look, half.images, half.stepIsTie, half.faithful]).toEqual([
      'still',
      2,
      true,
      false,
    ]);
  });

  it('matches nearest features the same way over the full circle of features', () => {
    // The replay works modulo one pitch; rendering all n features in revolutions and taking
    // the nearest by circular distance must give the same step.
    fc.assert(
      fc.property(speedArb, symmetryArb, logUniform(0.05, 1e5), (speedHz, symmetry, rateHz) => {
        const scene = sceneAt({ speedHz, symmetry }, exactValue(rateHz), 'flash');
        const view = replay(scene);
        const turn = over(scene.speedHz, scene.rateHz); // rev per sample, unwrapped
        const startRev = frac(0);
        let best: Fraction | undefined;
        for (let i = 0; i < symmetry; i++) {
          // feature i after one sample, as a signed circular distance from the start in (−½, ½] rev
          const at = plus(turn, frac(i, symmetry));
          let d = minus(at, startRev);
          d = minus(d, frac(floorOf(plus(d, frac(1, 2)))));
          if (best === undefined || compare(absolute(d), absolute(best)) < 0) best = d;
        }
        const stepRev = over(view.step, frac(symmetry));
        if (view.stepIsTie) expect(compare(absolute(best!), absolute(stepRev))).toBe(0);
        else expect(compare(best!, stepRev)).toBe(0);
      }),
      { ...settings, numRuns: 300 },
    );
  });
});

// ------------------------------------------------------------------ apparentMotion

describe('apparentMotion agrees with the replay', () => {
  it('for random parts and rates, at and next to locks, under a flash and in frames', () => {
    fc.assert(
      fc.property(sceneArb, (c) => {
        expectAgreement({ speedHz: c.speedHz, symmetry: c.symmetry }, rateOf(c), c.sampler);
      }),
      settings,
    );
  });

  it('for 1000/1001 frame rates against speeds near their locks', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(24000 / 1001, 30000 / 1001, 60000 / 1001),
        symmetryArb,
        fc.integer({ min: 1, max: 12 }),
        fc.integer({ min: 1, max: 12 }),
        fc.boolean(),
        placementArb,
        offArb,
        samplerArb,
        (rateHz, symmetry, p, q, backward, placement, off, sampler) => {
          // speed at which the pattern locks to p/q at this rate, then placed as for rates
          const speed = place((rateHz * p) / (q * symmetry), placement, off);
          expectAgreement({ speedHz: backward ? -speed : speed, symmetry }, rateHz, sampler);
        },
      ),
      settings,
    );
  });

  it('with any look options the core accepts', () => {
    const lookArb = fc.record({
      stillHz: logUniform(1e-4, 0.2),
      unclearStep: fc.double({ min: 0.3, max: 0.5, noNaN: true }),
      maxImages: fc.integer({ min: 1, max: 12 }),
      groupSpacingsPerS: logUniform(0.2, 5),
      nearlyStillHz: logUniform(1e-3, 1),
    });
    fc.assert(
      fc.property(sceneArb, lookArb, (c, look) => {
        expectAgreement({ speedHz: c.speedHz, symmetry: c.symmetry }, rateOf(c), c.sampler, look);
      }),
      settings,
    );
  });

  it('counts q images standing still under a flash when n·f/s is exactly p/q, and only q = 1 freezes frames', () => {
    // docs/physics.md §3: at r = p/q the pattern occupies q distinct positions and repeats every q
    // samples. Integer speed and rate make r exact: s = n·q·m/2^k, f = ±p·m/2^k.
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 40 }),
        fc.integer({ min: 1, max: 12 }),
        fc.integer({ min: 1, max: 60 }),
        fc.integer({ min: 0, max: 6 }),
        symmetryArb,
        fc.boolean(),
        (p0, q0, m, k, symmetry, backward) => {
          const g = greatestCommonDivisor(p0, q0);
          const [p, q] = [p0 / g, q0 / g];
          const rateHz = (symmetry * q * m) / 2 ** k;
          const speed = (p * m) / 2 ** k;
          const part = { speedHz: backward ? -speed : speed, symmetry };
          const film = new PatternReplay(sceneAt(part, exactValue(rateHz), 'flash'));
          // Replay many flashes: exactly q places, and the pattern is back after q flashes.
          expect(film.distinctPositions(12 * q + 7)).toBe(q);
          expect(film.position(q)).toBe(film.position(0));

          // Here n·f and p·s/q are exact in binary and r = p/q rounds without crossing ½ or a
          // still threshold, so even r = ½ exactly (s = 2·n·|f|: not faithful) must agree strictly.
          const flash = expectAgreement(part, rateHz, 'flash', undefined, { strict: true });
          const frames = expectAgreement(part, rateHz, 'frames', undefined, { strict: true });
          // No other group can look still once the rate is above n·96·stillHz (a lock with
          // q' ≤ 8 differs from p/q, q ≤ 12, by at least 1/96 pitch per sample): then the
          // flash shows exactly q images when q ≤ 8, and nothing still beyond.
          if (rateHz > symmetry * 96 * defaultLookOptions.stillHz) {
            if (q <= 8) expect([flash.look, flash.images]).toEqual(['still', q]);
            else expect(flash.look).not.toBe('still');
            expect(frames.look === 'still').toBe(q === 1);
            expect(frames.images).toBe(1);
          }
        },
      ),
      settings,
    );
  });
});

// ------------------------------------------------------------------ lockRates

const lockCaseArb = fc.record({
  speedHz: speedArb,
  symmetry: symmetryArb,
  tolerance: toleranceArb,
  lowFactor: logUniform(0.05, 4),
  span: logUniform(1.01, 30),
  maxImages: fc.integer({ min: 1, max: 12 }),
});

describe('lockRates agrees with the replay', () => {
  it('lists only rates at which the replay shows that many images standing still', () => {
    fc.assert(
      fc.property(lockCaseArb, (c) => {
        const part = { speedHz: c.speedHz, symmetry: c.symmetry, tolerance: c.tolerance };
        const F = c.symmetry * Math.abs(c.speedHz);
        const range = { minHz: F * c.lowFactor, maxHz: F * c.lowFactor * c.span };
        const eye = { ...documentedEye, maxImages: c.maxImages };
        const locks = lockRates(part, range, { maxImages: c.maxImages });
        const problems: string[] = [];
        const check = (ok: boolean, what: string) => {
          if (!ok) problems.push(what);
        };
        for (let i = 1; i < locks.length; i++) {
          check(locks[i].rateHz >= locks[i - 1].rateHz, `not ascending at ${locks[i].rateHz} Hz`);
        }
        // Replay a spread of at most 16 of them, the first and last included.
        const every = Math.max(1, Math.ceil(locks.length / 16));
        for (let i = 0; i < locks.length; i++) {
          if (i % every !== 0 && i !== locks.length - 1) continue;
          const lock = locks[i];
          const at = `lock ${lock.p}/${lock.q} at ${lock.rateHz} Hz`;
          check(lock.images === lock.q && lock.q <= c.maxImages, `${at}: ${lock.images} images`);
          check(
            lock.rateHz >= range.minHz * (1 - 1e-12) && lock.rateHz <= range.maxHz * (1 + 1e-12),
            `${at}: outside the range`,
          );
          const scene = sceneAt(part, exactValue(lock.rateHz), 'flash');
          const film = new PatternReplay(scene);
          check(
            compare(absolute(film.groupDriftHz(lock.q)), eye.stillHz) < 0,
            `${at}: group drifts`,
          );
          check(film.groupIsDistinct(lock.q), `${at}: fewer than q distinct images`);
          const view = replay(scene, eye);
          check(view.look === 'still', `${at}: looks ${view.look}`);
          // Above n·q²·stillHz no smaller group can stand still as well: exactly q images.
          if (lock.rateHz > c.symmetry * c.maxImages ** 2 * defaultLookOptions.stillHz) {
            check(view.images === lock.q, `${at}: replay shows ${view.images} images`);
          }
          // The band ends are the lock for the slowest and fastest speed within tolerance.
          for (const [rateHz, factor] of [
            [lock.lowHz, 1 - c.tolerance],
            [lock.highHz, 1 + c.tolerance],
          ] as const) {
            const speed = times(exactValue(c.speedHz), exactValue(factor));
            const end = new PatternReplay({
              speedHz: speed,
              symmetry: c.symmetry,
              rateHz: exactValue(rateHz),
              sampler: 'flash',
            });
            check(
              compare(absolute(end.groupDriftHz(lock.q)), eye.stillHz) < 0,
              `${at}: band end ${rateHz} Hz is not the lock at speed ×${factor}`,
            );
          }
        }
        expect(problems).toEqual([]);
      }),
      settings,
    );
  });

  it('shows, in apparentMotion and in the exact replay, the image count it lists at every lock', () => {
    // docs/physics.md §3: "The image count that apparentMotion reports must equal the one lockRates
    // lists." At each listed rate the replay (smallest drift among the still groups, ties to
    // the smaller q) must show q images standing still, and so must apparentMotion.
    fc.assert(
      fc.property(lockCaseArb, (c) => {
        const part = { speedHz: c.speedHz, symmetry: c.symmetry, tolerance: c.tolerance };
        const F = c.symmetry * Math.abs(c.speedHz);
        const range = { minHz: F * c.lowFactor, maxHz: F * c.lowFactor * c.span };
        const eye = { ...documentedEye, maxImages: c.maxImages };
        const locks = lockRates(part, range, { maxImages: c.maxImages });
        // Every lock of small lists; a spread of 200 of longer ones, the first and last included.
        const every = Math.max(1, Math.ceil(locks.length / 200));
        const problems: string[] = [];
        locks.forEach((lock, i) => {
          if (i % every !== 0 && i !== locks.length - 1) return;
          const view = replay(sceneAt(part, exactValue(lock.rateHz), 'flash'), eye);
          const core = apparentMotion(part, lock.rateHz, { maxImages: c.maxImages });
          if (view.look !== 'still' || view.images !== lock.q || core.images !== lock.q) {
            problems.push(
              `lock ${lock.p}/${lock.q} at ${lock.rateHz} Hz: replay ${view.images} (${view.look}), ` +
                `apparentMotion ${core.images} (${core.look})`,
            );
          }
        });
        expect(problems, `${c.symmetry} features at ${c.speedHz} rev/s`).toEqual([]);
      }),
      { ...settings, numRuns: 3000 },
    );
  });

  it('misses no lock with q ≤ maxImages in the range (every p/q scanned exactly)', () => {
    fc.assert(
      fc.property(lockCaseArb, (c) => {
        const part = { speedHz: c.speedHz, symmetry: c.symmetry, tolerance: c.tolerance };
        const F = c.symmetry * Math.abs(c.speedHz);
        const range = { minHz: F * c.lowFactor, maxHz: F * c.lowFactor * c.span };
        const locks = lockRates(part, range, { maxImages: c.maxImages });
        const exactF = times(frac(c.symmetry), absolute(exactValue(c.speedHz)));
        const inside = {
          lo: times(exactValue(range.minHz), exactValue(1 + 1e-12)),
          hi: times(exactValue(range.maxHz), exactValue(1 - 1e-12)),
        };
        const nearEdge = {
          lo: times(exactValue(range.minHz), exactValue(1 - 1e-12)),
          hi: times(exactValue(range.maxHz), exactValue(1 + 1e-12)),
        };
        let surely = 0;
        let maybe = 0;
        for (let q = 1; q <= c.maxImages; q++) {
          for (let p = 1; ; p++) {
            const rate = over(times(exactF, frac(q)), frac(p)); // the lock's own definition, r = p/q
            if (compare(rate, nearEdge.lo) < 0) break;
            if (compare(rate, nearEdge.hi) > 0) continue;
            // A lock with q images only if its q flashes land on q distinct places (p/q in lowest terms).
            const film = new PatternReplay({
              speedHz: exactValue(c.speedHz),
              symmetry: c.symmetry,
              rateHz: rate,
              sampler: 'flash',
            });
            if (!film.groupIsDistinct(q)) continue;
            expect(film.groupMove(q).move).toBe(0n);
            const strictlyInside = compare(rate, inside.lo) >= 0 && compare(rate, inside.hi) <= 0;
            if (strictlyInside) surely++;
            else maybe++;
            const rateHz = toNumber(rate);
            const listed = locks.some(
              (l) => l.q === q && l.p === p && Math.abs(l.rateHz - rateHz) <= 1e-12 * rateHz,
            );
            if (strictlyInside) expect(listed, `lock ${p}/${q} at ${rateHz} Hz missing`).toBe(true);
          }
        }
        expect(locks.length).toBeGreaterThanOrEqual(surely);
        expect(locks.length).toBeLessThanOrEqual(surely + maybe);
      }),
      settings,
    );
  });

  it('includes locks that fall exactly on either end of the range', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 2000 }),
        symmetryArb,
        fc.tuple(fc.integer({ min: 1, max: 9 }), fc.integer({ min: 1, max: 8 })),
        fc.tuple(fc.integer({ min: 10, max: 30 }), fc.integer({ min: 1, max: 8 })),
        (speedHz, symmetry, [p1, q1], [p2, q2]) => {
          const [g1, g2] = [greatestCommonDivisor(p1, q1), greatestCommonDivisor(p2, q2)];
          const top = { p: p1 / g1, q: q1 / g1 };
          const bottom = { p: p2 / g2, q: q2 / g2 };
          const F = symmetry * speedHz;
          const range = { minHz: (F * bottom.q) / bottom.p, maxHz: (F * top.q) / top.p };
          fc.pre(range.minHz < range.maxHz);
          const locks = lockRates({ speedHz, symmetry }, range);
          expect(locks[0]).toMatchObject({ p: bottom.p, q: bottom.q });
          expect(locks.at(-1)).toMatchObject({ p: top.p, q: top.q });
        },
      ),
      settings,
    );
  });
});

// ------------------------------------------------------------------ ratesForApparent

describe('ratesForApparent agrees with the replay', () => {
  const apparentCaseArb = fc.record({
    speedHz: speedArb,
    symmetry: symmetryArb,
    wanted: fc.oneof(
      fc.constant(0),
      fc.tuple(fc.boolean(), logUniform(1e-4, 0.6)).map(([neg, x]) => (neg ? -x : x)), // share of the speed
    ),
    raw: fc.tuple(fc.boolean(), logUniform(1e-3, 5)).map(([neg, x]) => (neg ? -x : x)),
    useRaw: fc.boolean(),
    lowFactor: logUniform(0.01, 2),
    span: logUniform(1.01, 40),
    sampler: samplerArb,
  });
  function setUp(c: typeof apparentCaseArb extends fc.Arbitrary<infer T> ? T : never) {
    const apparentHz = c.useRaw ? c.raw : c.wanted * c.speedHz;
    const gap = c.symmetry * Math.abs(c.speedHz - apparentHz);
    fc.pre(gap > 0);
    const range: Range = { minHz: gap * c.lowFactor, maxHz: gap * c.lowFactor * c.span };
    return { part: { speedHz: c.speedHz, symmetry: c.symmetry }, apparentHz, range };
  }
  /** docs/physics.md §4: the look that shows the wanted motion (a = 0: still). */
  const wantedLook = (speedHz: number, apparentHz: number) =>
    apparentHz === 0
      ? 'still'
      : Math.sign(apparentHz) === Math.sign(speedHz)
        ? 'forward'
        : 'backward';
  /** The replay shows one image with the wanted look, its direction clear. */
  const oneImageLooks = (view: ReplayView, look: string) =>
    !view.stepIsTie && view.images === 1 && view.look === look;

  it('returns only rates at which the replay shows one image moving as wanted, for the sampler', () => {
    fc.assert(
      fc.property(apparentCaseArb, (c) => {
        const { part, apparentHz, range } = setUp(c);
        const rates = ratesForApparent(part, apparentHz, range, { sampler: c.sampler });
        const look = wantedLook(part.speedHz, apparentHz);
        for (let i = 0; i < rates.length; i++) {
          const { rateHz, k } = rates[i];
          if (i > 0) expect(rateHz).toBeGreaterThan(rates[i - 1].rateHz);
          expect(rateHz).toBeGreaterThanOrEqual(range.minHz * (1 - 1e-12));
          expect(rateHz).toBeLessThanOrEqual(range.maxHz * (1 + 1e-12));
          const view = replay(sceneAt(part, exactValue(rateHz), c.sampler));
          expect(view.stepIsTie).toBe(false);
          // docs/physics.md §4: one image (no group of several stands still or drifts), a clear direction.
          expect([view.images, view.look], `${c.sampler} at ${rateHz} Hz`).toEqual([1, look]);
          const seen = toNumber(view.apparentHz);
          expect(Math.abs(seen - apparentHz)).toBeLessThanOrEqual(
            1e-12 * (Math.abs(part.speedHz) + Math.abs(apparentHz)),
          );
          // k: whole pitches skipped per sample, as the replay saw them
          expect(view.wholePitches < 0n ? -view.wholePitches : view.wholePitches).toBe(BigInt(k));
        }
      }),
      settings,
    );
  });

  it('reproduces every rate it returns in apparentMotion: one image, the wanted motion', () => {
    fc.assert(
      fc.property(apparentCaseArb, (c) => {
        const { part, apparentHz, range } = setUp(c);
        const look = wantedLook(part.speedHz, apparentHz);
        for (const { rateHz } of ratesForApparent(part, apparentHz, range, {
          sampler: c.sampler,
        })) {
          const seen = apparentMotion(part, rateHz, { sampler: c.sampler });
          expect([seen.images, seen.look], `${c.sampler} at ${rateHz} Hz`).toEqual([1, look]);
          if (look !== 'still') {
            expect(Math.abs(seen.apparentHz - apparentHz)).toBeLessThanOrEqual(
              1e-9 * (Math.abs(part.speedHz) + Math.abs(apparentHz)),
            );
          }
        }
      }),
      { ...settings, numRuns: 3000 },
    );
  });

  it('misses no rate in the range at which the replay shows one image moving as wanted', () => {
    fc.assert(
      fc.property(apparentCaseArb, (c) => {
        const { part, apparentHz, range } = setUp(c);
        const rates = ratesForApparent(part, apparentHz, range, { sampler: c.sampler });
        const look = wantedLook(part.speedHz, apparentHz);
        const f = exactValue(part.speedHz);
        const a = exactValue(apparentHz);
        const gap = times(frac(part.symmetry), absolute(minus(f, a)));
        const inside = {
          lo: times(exactValue(range.minHz), exactValue(1 + 1e-12)),
          hi: times(exactValue(range.maxHz), exactValue(1 - 1e-12)),
        };
        let found = 0;
        let edge = 0;
        // A sampler whose period lets the pattern cover its true travel minus the wanted travel
        // in K whole pitches: s = n·|f − a|/K. Keep those where the replay really shows it.
        for (let K = 1; ; K++) {
          const rate = over(gap, frac(K));
          if (compare(rate, inside.lo) < 0) break;
          if (compare(rate, inside.hi) > 0) continue;
          const rateHz = toNumber(rate);
          // The core is given the double nearest the rate: a threshold within a hair of it may
          // fall either way there (see the note at the top).
          const atDouble = replay(sceneAt(part, exactValue(rateHz), c.sampler));
          const exact = replay(sceneAt(part, rate, c.sampler));
          if (!oneImageLooks(exact, look) || compare(exact.apparentHz, a) !== 0) continue;
          if (!oneImageLooks(atDouble, look)) {
            edge++;
            continue;
          }
          found++;
          expect(
            rates.some((r) => r.k === K && Math.abs(r.rateHz - rateHz) <= 1e-12 * rateHz),
            `rate ${rateHz} Hz (K = ${K}) missing`,
          ).toBe(true);
        }
        expect(rates.length).toBeGreaterThanOrEqual(found);
        // at most one more at each end of the range, and those a hair from a threshold
        expect(rates.length).toBeLessThanOrEqual(found + edge + 2);
      }),
      settings,
    );
  });
});

// ------------------------------------------------------------------ rateBands

/** Points of the fine scan across a tolerance interval. */
const SCAN = 16;

/**
 * Speeds worth trying for a part at one rate: both ends of the tolerance interval, the
 * critical points inside it (every lock p/q, where a group stands still; k − ¼ pitch per
 * sample, inside each bin where one image turns backward or its direction is unclear;
 * docs/physics.md §2–§3), then a fine scan. Any misleading stretch of speeds that overlaps the
 * interval contains one of its critical points or one of its ends: around each whole k the
 * stretch from k − 1 + unclearStep (unclear, backward, still) to k plus the nearly-still
 * margin holds the lock k/1; a group of q images drifting (not one image) holds its lock p/q.
 */
function* speedsToTry(part: Required<Part>, rate: Fraction, qMax: number): Generator<Fraction> {
  const f = exactValue(part.speedHz);
  const u = exactValue(part.tolerance);
  const low = times(f, minus(frac(1), u));
  const high = times(f, plus(frac(1), u));
  yield low;
  if (part.tolerance === 0) return;
  yield high;
  const sign = frac(signOf(f));
  const n = frac(part.symmetry);
  const ratioOf = (speed: Fraction) => over(times(n, absolute(speed)), rate);
  const speedOf = (ratio: Fraction) => times(sign, over(times(ratio, rate), n));
  const [rLow, rHigh] = [ratioOf(low), ratioOf(high)];
  for (let q = 1; q <= qMax; q++) {
    for (let p = ceilOf(times(rLow, frac(q))); p <= floorOf(times(rHigh, frac(q))); p++)
      yield speedOf(frac(p, q));
  }
  const quarter = frac(1, 4);
  let k = ceilOf(plus(rLow, quarter));
  if (k < 1n) k = 1n;
  for (; k <= floorOf(plus(rHigh, quarter)); k++) yield speedOf(minus(frac(k), quarter));
  for (let i = 1; i < SCAN; i++) yield plus(low, times(minus(high, low), frac(i, SCAN)));
}

/**
 * For each part, a speed within its tolerance that the replay shows misleadingly at this rate,
 * if any: docs/physics.md §4, anything but faithful or forward as one image at the nearly-still
 * threshold or faster (safeView).
 */
function misleadingViews(parts: Array<Required<Part>>, rate: Fraction, sampler: Sampler, eye: Eye) {
  const qMax = sampler === 'flash' ? eye.maxImages : 1;
  return parts.map((part) => {
    for (const speed of speedsToTry(part, rate, qMax)) {
      const view = replay({ speedHz: speed, symmetry: part.symmetry, rateHz: rate, sampler }, eye);
      if (!safeView(view)) {
        const look = view.nearlyStill && view.look === 'forward' ? 'nearly still' : view.look;
        return {
          speedHz: toNumber(speed),
          look: view.images > 1 ? `${view.images} images, ${look}` : look,
        };
      }
    }
    return undefined;
  });
}

/** A speed within some part's tolerance that the replay shows misleadingly at this rate, if any. */
function misleadingView(parts: Array<Required<Part>>, rate: Fraction, sampler: Sampler, eye: Eye) {
  return misleadingViews(parts, rate, sampler, eye).find((v) => v !== undefined);
}

/** Relative distance kept from a band's edges. */
const EDGE_MARGIN = 1e-9;

describe('rateBands agrees with the replay', () => {
  const partArb = fc.record({ speedHz: speedArb, symmetry: symmetryArb, tolerance: toleranceArb });
  const bandCaseArb = fc.record({
    parts: fc.array(partArb, { minLength: 1, maxLength: 3 }),
    sampler: samplerArb,
    lowFactor: logUniform(1e-3, 3),
    span: logUniform(1.05, 20),
    picks: fc.array(fc.double({ min: 0, max: 1, noNaN: true, maxExcluded: true }), {
      minLength: 2,
      maxLength: 2,
    }),
    spot: fc.double({ min: 0, max: 1, noNaN: true }),
  });

  it('labels bands truly: every speed within tolerance is seen faithfully or forward at 6 rpm or more as one image in a safe band; some speed misleads in a misleading one', () => {
    fc.assert(
      fc.property(bandCaseArb, (c) => {
        const F = c.parts[0].symmetry * Math.abs(c.parts[0].speedHz);
        const range = { minHz: F * c.lowFactor, maxHz: F * c.lowFactor * c.span };
        const bands = rateBands(c.parts, range, { sampler: c.sampler });

        // The bands tile the range without gap or overlap.
        expect(bands[0].fromHz).toBe(range.minHz);
        expect(bands.at(-1)!.toHz).toBe(range.maxHz);
        for (let i = 1; i < bands.length; i++) expect(bands[i].fromHz).toBe(bands[i - 1].toHz);

        for (const pick of c.picks) {
          const band = bands[Math.floor(pick * bands.length)];
          const lower = band.fromHz * (1 + EDGE_MARGIN);
          const upper = band.toHz * (1 - EDGE_MARGIN);
          if (!(lower < upper)) continue;
          const nearEdge =
            pick * bands.length - Math.floor(pick * bands.length) < 0.5 ? lower : upper;
          for (const rateHz of [nearEdge, lower + (upper - lower) * c.spot]) {
            const parts = c.parts.map((p) => ({ ...p }));
            const views = misleadingViews(parts, exactValue(rateHz), c.sampler, documentedEye);
            const where = `${c.sampler} at ${rateHz} Hz in band [${band.fromHz}, ${band.toHz}] (${band.reason})`;
            if (band.safe)
              expect(views, `safe band misleads: ${where}`).toEqual(parts.map(() => undefined));
            else {
              expect(
                views.some((v) => v !== undefined),
                `misleading band shows nothing misleading: ${where}`,
              ).toBe(true);
              // Every part that misleads here is named among the band's causes.
              const named = new Set(band.causes.map((cause) => cause.part));
              views.forEach((v, i) => {
                if (v)
                  expect(
                    named.has(i),
                    `part ${i + 1} misleads (${v.look}) but is not named: ${where}`,
                  ).toBe(true);
              });
            }
          }
        }
      }),
      settings,
    );
  });

  it('finds every camera rate above 2·n·|f|·(1 + u) safe, and every flash rate n·|f|·q misleading', () => {
    fc.assert(
      fc.property(partArb, fc.integer({ min: 2, max: 8 }), (part, q) => {
        const F = part.symmetry * Math.abs(part.speedHz);
        const nyquist = 2 * F * (1 + part.tolerance);
        // A part whose slowest speed within tolerance is below the still threshold looks still
        // at every rate (§2 precedence), faithful or not: §4's "every rate above Nyquist is safe"
        // holds for the others. Both sides are checked.
        if (
          Math.abs(part.speedHz) * (1 - part.tolerance) <
          defaultLookOptions.stillHz * (1 + 1e-9)
        ) {
          const crawl = rateBands(
            [part],
            { minHz: nyquist * (1 + EDGE_MARGIN), maxHz: nyquist * 10 },
            { sampler: 'frames' },
          );
          expect(crawl.map((b) => b.safe)).toEqual([false]);
          expect(
            misleadingView([part], exactValue(nyquist * 3), 'frames', documentedEye),
          ).toBeDefined();
          return;
        }
        const above = rateBands(
          [part],
          { minHz: nyquist * (1 + EDGE_MARGIN), maxHz: nyquist * 10 },
          { sampler: 'frames' },
        );
        expect(above.map((b) => b.safe)).toEqual([true]);
        expect(
          misleadingView([part], exactValue(nyquist * 3), 'frames', documentedEye),
        ).toBeUndefined();

        // docs/physics.md §4: under a flash the multi-image locks stay misleading at any rate.
        const lockHz = F * q;
        const flash = rateBands(
          [part],
          { minHz: lockHz / 2, maxHz: lockHz * 2 },
          { sampler: 'flash' },
        );
        const band = flash.find((b) => b.fromHz <= lockHz && lockHz <= b.toHz)!;
        expect(band.safe).toBe(false);
        expect(misleadingView([part], exactValue(lockHz), 'flash', documentedEye)).toBeDefined();
      }),
      settings,
    );
  });
});

// ------------------------------------------------------------------ freezeRates

describe('freezeRates agrees with the replay', () => {
  const partArb = fc.record({
    speedHz: speedArb.filter((f) => Math.abs(f) > 0.01),
    symmetry: symmetryArb,
    tolerance: toleranceArb,
  });
  const machineArb = fc.record({
    parts: fc.array(partArb, { minLength: 1, maxLength: 3 }),
    sampler: samplerArb,
    lowFactor: logUniform(0.05, 3),
    span: logUniform(1.05, 10),
  });

  it('offers only bands that hold the nominal lock, a setting step wide, where the replay freezes the part and no other part stands still', () => {
    // docs/physics.md §4: a suggested freeze band contains the part's nominal lock and is at least
    // one setting step wide (1 flash/min, 0.01 frames/s).
    fc.assert(
      fc.property(machineArb, (c) => {
        const F = c.parts[0].symmetry * Math.abs(c.parts[0].speedHz);
        const range = { minHz: F * c.lowFactor, maxHz: F * c.lowFactor * c.span };
        let bands;
        try {
          bands = freezeRates(c.parts, 0, range, { sampler: c.sampler });
        } catch (error) {
          // Too many still spans to list (a fast part over a wide range) is refused with a message.
          if ((error as Error).name === 'InputError') return;
          throw error;
        }
        const step = c.sampler === 'flash' ? 1 / 60 : 0.01;
        for (const band of bands) {
          const where = `${c.sampler} band [${band.fromHz}, ${band.toHz}]`;
          expect(band.toHz - band.fromHz, where).toBeGreaterThanOrEqual(step * (1 - 1e-9));
          if (band.p === 0) continue; // a part at or below the still threshold: still everywhere
          expect(band.lockRateHz, where).toBeGreaterThanOrEqual(band.fromHz * (1 - 1e-12));
          expect(band.lockRateHz, where).toBeLessThanOrEqual(band.toHz * (1 + 1e-12));
          // At the nominal lock the replay shows the part at its nominal speed as one still image.
          const rate = exactValue(band.lockRateHz);
          const target = replay(sceneAt(c.parts[0], rate, c.sampler));
          expect([target.look, target.images], where).toEqual(['still', 1]);
          // No other part, at its nominal speed, stands still there.
          c.parts.slice(1).forEach((part, i) => {
            const other = replay(sceneAt(part, rate, c.sampler));
            expect(other.look, `${where}: part ${i + 2}`).not.toBe('still');
          });
        }
      }),
      settings,
    );
  });
});
