import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  freezeRates,
  noStillRates,
  stillRates,
  type StillSpan,
} from '../../../src/core/plans/freezeRates';
import { apparentMotion } from '../../../src/core/physics/apparentMotion';
import { driveChain } from '../../../src/core/plans/driveChain';
import { defaultLookOptions } from '../../../src/core/physics/lookOptions';
import type { Part, Sampler } from '../../../src/core/basics/types';
import {
  anyFinite,
  anyPositive,
  bad,
  expectInputError,
  finiteOrInputError,
} from '../expectInputError';

const SEED = 1949; // fixed so that any failure reproduces
const stillHz = defaultLookOptions.stillHz; // 0.25 rpm, the still threshold of lookOptions
const wheel = { speedHz: 2, symmetry: 12 }; // Wikipedia, "Stroboscopic effect": 12 spokes at 2 rev/s

const inside = (spans: Array<{ fromHz: number; toHz: number }>, s: number) =>
  spans.some((x) => x.fromHz < s && s < x.toHz);
/** Rates this close to a span edge are left out of the brute-force checks (round-off decides them). */
const nearEdge = (spans: Array<{ fromHz: number; toHz: number }>, s: number) =>
  spans.some((x) => Math.abs(x.fromHz - s) < 1e-9 * s || Math.abs(x.toHz - s) < 1e-9 * s);

describe('stillRates: where parts can look still', () => {
  it('puts the 12-spoke wheel at 2 rev/s still around 24 frames/s, widened by the still threshold', () => {
    // Wikipedia, "Stroboscopic effect". Width: D = n·stillHz = 12·0.25 rpm = 0.05 Hz either side.
    const spans = stillRates([wheel], { minHz: 20, maxHz: 30 }, { sampler: 'frames' });
    expect(spans).toHaveLength(1);
    expect(spans[0]).toMatchObject({ part: 0, images: 1, p: 1, dense: false });
    expect(spans[0].fromHz).toBeCloseTo(23.95, 12);
    expect(spans[0].toHz).toBeCloseTo(24.05, 12);
  });

  it('adds the multi-image locks under a flash, at s = n·|f|·q/p', () => {
    // docs/physics.md §3, worked by hand: 24·q/p in 20–30 Hz with q ≤ 8 (as in lockRates' own test).
    const spans = stillRates([wheel], { minHz: 20, maxHz: 30 });
    expect(spans.map((s) => [s.p, s.images])).toEqual([
      [6, 5],
      [7, 6],
      [8, 7],
      [9, 8],
      [1, 1],
      [7, 8],
      [6, 7],
      [5, 6],
      [4, 5],
    ]);
  });

  it('agrees with apparentMotion at every rate for parts of exact speed: still inside a span, not outside', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.2, max: 60, noNaN: true }),
        fc.integer({ min: 1, max: 12 }),
        fc.constantFrom<Sampler>('flash', 'frames'),
        fc.double({ min: 2, max: 200, noNaN: true }),
        (speedHz, symmetry, sampler, rateHz) => {
          const part = { speedHz, symmetry };
          const spans = stillRates([part], { minHz: 2, maxHz: 200 }, { sampler });
          if (nearEdge(spans, rateHz)) return true;
          const m = apparentMotion(part, rateHz, { sampler });
          const holding = spans.filter((x) => x.fromHz < rateHz && rateHz < x.toHz);
          expect(m.look === 'still').toBe(holding.length > 0);
          // docs/physics.md §3: of the groups standing still, the one with the smallest drift
          // |n·f − (p/q)·s| is seen (ties to the smaller q).
          const drift = (x: StillSpan) => Math.abs(symmetry * speedHz - (x.p * rateHz) / x.images);
          const seen = [...holding].sort((a, b) => drift(a) - drift(b) || a.images - b.images)[0];
          if (seen) expect(m.images).toBe(seen.images);
          return true;
        },
      ),
      { seed: SEED, numRuns: 500 },
    );
  });

  it('has, at every rate inside a span, a speed within the tolerance that looks still there', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 60, noNaN: true }),
        fc.integer({ min: 1, max: 8 }),
        fc.double({ min: 0.001, max: 0.05, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (speedHz, symmetry, tolerance, where) => {
          const part = { speedHz, symmetry, tolerance };
          const spans = stillRates([part], { minHz: 0.5, maxHz: 300 });
          const span = spans[Math.floor(where * spans.length) % spans.length];
          const s = (span.fromHz + span.toHz) / 2;
          const F = symmetry * speedHz;
          // The lock order there: p·s/q nearest the band (dense spans are single-image locks).
          const p = span.dense ? Math.max(1, Math.round(F / s)) : span.p;
          const lockSpeed = (p * s) / (span.images * symmetry);
          const speed = Math.min(
            Math.max(lockSpeed, speedHz * (1 - tolerance)),
            speedHz * (1 + tolerance),
          );
          expect(apparentMotion({ speedHz: speed, symmetry }, s).look).toBe('still');
          return true;
        },
      ),
      { seed: SEED, numRuns: 300 },
    );
  });

  it('joins the overlapping single-image spans of a toleranced part below one rate into a dense span', () => {
    // One mark at 30 rev/s ± 1 %: w = 0.01 + D/F, spans p and p+1 overlap from p ≥ (1 − w)/(2w) = 48.8,
    // so every rate below 30/49·(1 + w) = 0.618 Hz is still for some speed in the band.
    const w = 0.01 + stillHz / 30;
    const spans = stillRates(
      [{ speedHz: 30, symmetry: 1, tolerance: 0.01 }],
      { minHz: 0.1, maxHz: 100 },
      { sampler: 'frames' },
    );
    expect(spans[0]).toMatchObject({ fromHz: 0.1, p: 49, dense: true });
    expect(spans[0].toHz).toBeCloseTo((30 / 49) * (1 + w), 12);
    expect(spans[0].toHz).toBeCloseTo(0.618, 3);
    // Brute force: every rate below it has a whole p with p·s inside (F₋ − D, F₊ + D).
    for (let s = 0.1; s < spans[0].toHz; s += 0.001) {
      const p = Math.ceil((30 * 0.99 - stillHz) / s);
      expect(p * s, `${s} Hz`).toBeLessThan(30 * 1.01 + stillHz);
    }
  });

  it('shows a part slower than the still threshold as still everywhere, and leaves out one that is not turning', () => {
    // 0.1 rpm is below the 0.25 rpm threshold: the lock p = 0 (apparentMotion's p for r < 0.5).
    expect(stillRates([{ speedHz: 0.1 / 60, symmetry: 1 }], { minHz: 1, maxHz: 10 })).toEqual([
      { fromHz: 1, toHz: 10, part: 0, images: 1, p: 0, dense: true },
    ]);
    expect(stillRates([{ speedHz: 0, symmetry: 4 }], { minHz: 1, maxHz: 10 })).toEqual([]);
  });
});

describe('freezeRates: freeze one part while no other looks still', () => {
  it('freezes the 12-spoke wheel near 24 frames/s while a 5-spoke wheel at 3 rev/s does not look still (doc example)', () => {
    const bands = freezeRates(
      [wheel, { speedHz: 3, symmetry: 5 }],
      0,
      { minHz: 20, maxHz: 30 },
      { sampler: 'frames' },
    );
    expect(bands).toHaveLength(1);
    expect(bands[0]).toMatchObject({ p: 1, lockRateHz: 24, dense: false });
    expect(bands[0].fromHz).toBeCloseTo(23.95, 12);
    expect(bands[0].toHz).toBeCloseTo(24.05, 12);
  });

  it('cuts out the rates where another part stands still', () => {
    // Part 2 (one mark at 24.02 rev/s) stands still from 24.02 − D to 24.02 + D, D = 0.25 rpm:
    // the wheel's band loses its top.
    const other = { speedHz: 24.02, symmetry: 1 };
    const [band] = freezeRates([wheel, other], 0, { minHz: 20, maxHz: 30 }, { sampler: 'frames' });
    expect(band.fromHz).toBeCloseTo(23.95, 12);
    expect(band.toHz).toBeCloseTo(24.02 - stillHz, 12);
  });

  it('finds where a belt-driven fan freezes while its motor does not look still', () => {
    // A motor measured at 1450 rpm ± 0.2 % drives a 6-blade fan through a 100 mm → 250 mm belt:
    // 580 rpm, pattern 6·580/60 = 58 Hz. Under a strobe with up to 2 images counted the motor's
    // mark (24.17 Hz) locks at 24.17·q/p, none of them near 58 Hz.
    const chain = driveChain({
      root: { kind: 'fixed', speedHz: 1450 / 60, tolerance: 0.002 },
      parts: [
        { name: 'motor', symmetry: 1 },
        {
          name: 'fan',
          symmetry: 6,
          link: { kind: 'belt', driverDiameterM: 0.1, drivenDiameterM: 0.25 },
        },
      ],
    });
    const bands = freezeRates(chain, 1, { minHz: 30, maxHz: 100 }, { maxImages: 2 });
    const top = bands[bands.length - 1];
    expect(top.p).toBe(1);
    expect(top.lockRateHz).toBeCloseTo(58, 12);
    expect(top.fromHz).toBeLessThan(58);
    expect(top.toHz).toBeGreaterThan(58);
    expect(apparentMotion(chain[1], 58).look).toBe('still');
    expect(apparentMotion(chain[0], 58, { maxImages: 2 }).look).not.toBe('still');
  });

  it('gives the target’s single-image spans minus every other part’s still spans, each piece that holds its nominal lock and is a step wide', () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.record({
            speedHz: fc.double({ min: 1, max: 40, noNaN: true }),
            symmetry: fc.integer({ min: 1, max: 8 }),
            tolerance: fc.double({ min: 0, max: 0.02, noNaN: true }),
          }),
          { minLength: 2, maxLength: 4 },
        ),
        fc.constantFrom<Sampler>('flash', 'frames'),
        fc.array(fc.double({ min: 5, max: 120, noNaN: true }), { minLength: 20, maxLength: 20 }),
        (parts: Part[], sampler, rates) => {
          const range = { minHz: 5, maxHz: 120 };
          const step = sampler === 'flash' ? 1 / 60 : 0.01; // docs/physics.md §4 default steps
          const bands = freezeRates(parts, 0, range, { sampler });
          const own = stillRates([parts[0]], range, { sampler: 'frames' }); // single images only
          const others = stillRates(parts.slice(1), range, { sampler });
          const F = parts[0].symmetry * Math.abs(parts[0].speedHz);
          for (let i = 1; i < bands.length; i++)
            expect(bands[i].fromHz).toBeGreaterThanOrEqual(bands[i - 1].toHz);
          for (const b of bands) {
            // docs/physics.md §4: contains the nominal lock, at least one setting step wide.
            expect(b.lockRateHz).toBeCloseTo(F / b.p, 9);
            expect(b.fromHz).toBeLessThanOrEqual(b.lockRateHz);
            expect(b.toHz).toBeGreaterThanOrEqual(b.lockRateHz);
            expect(b.toHz - b.fromHz).toBeGreaterThanOrEqual(step * (1 - 1e-9));
          }
          for (const s of rates) {
            if (nearEdge([...bands, ...own, ...others], s)) continue;
            const free = inside(own, s) && !inside(others, s);
            if (inside(bands, s)) expect(free, `${s} Hz`).toBe(true);
            else if (free) {
              // The piece of own − others around s: left out only when it misses its nominal
              // lock or is narrower than a step.
              const span = own.find((x) => x.fromHz < s && s < x.toHz)!;
              const from = Math.max(
                span.fromHz,
                ...others.filter((x) => x.toHz <= s).map((x) => x.toHz),
              );
              const to = Math.min(
                span.toHz,
                ...others.filter((x) => x.fromHz >= s).map((x) => x.fromHz),
              );
              const p = span.dense ? Math.max(span.p, Math.ceil(F / to)) : span.p;
              const holdsLock = from <= F / p && F / p <= to;
              expect(
                holdsLock && to - from >= step * (1 + 1e-9),
                `${s} Hz in [${from}, ${to}]`,
              ).toBe(false);
            }
          }
          return true;
        },
      ),
      { seed: SEED, numRuns: 200 },
    );
  });

  it('does not offer the piece of a 3-jaw chuck’s still span cut off from its nominal lock: at 2000 rpm it would show the chuck turning backward', () => {
    // Reported case, whole machine: a 3-jaw chuck at 2000 rpm ±1 % (lock 100 flashes/s) beside a
    // 6-blade fan at 990 rpm ±1 % (lock 99 flashes/s, still up to 99.99 + 6·0.25/60 = 100.015).
    // The chuck is still for some speed in its tolerance up to 101 + 3·0.25/60 = 101.0125 flashes/s,
    // but the piece above the fan's span misses 100 flashes/s: at the nominal 2000 rpm the chuck
    // turns backward there (n·f/s = 100/100.5 < 1, docs/physics.md §2).
    const chuck = { speedHz: 2000 / 60, symmetry: 3, tolerance: 0.01 };
    const fan = { speedHz: 990 / 60, symmetry: 6, tolerance: 0.01 };
    const range = { minHz: 90, maxHz: 110 };
    const spans = stillRates([chuck], range, { sampler: 'frames' });
    const fanSpans = stillRates([fan], range);
    expect(spans.find((x) => x.p === 1)!.toHz).toBeCloseTo(101.0125, 9);
    expect(fanSpans.find((x) => x.p === 1 && x.images === 1)!.toHz).toBeCloseTo(100.015, 9);
    expect(apparentMotion(chuck, 100.5).look).toBe('backward');
    expect(freezeRates([fan, chuck], 1, range)).toEqual([]);
  });

  it('does not offer a sliver narrower than one flash per minute, even round the nominal lock', () => {
    // One mark at 1800 rpm exactly (docs/physics.md §4: default step 1 flash/min): its still span is
    // 1800 ± 0.25 flashes/min wide (the still threshold), half a step: not settable on the dial.
    const mark = { speedHz: 30, symmetry: 1 };
    const range = { minHz: 25, maxHz: 35 };
    expect(stillRates([mark], range, { sampler: 'frames' })).toHaveLength(1);
    expect(freezeRates([mark], 0, range)).toEqual([]);
    // A finer dial (0.1 flash per minute) can hold it.
    const fine = freezeRates([mark], 0, range, { settingStepHz: 0.1 / 60 });
    expect(fine).toHaveLength(1);
    expect(fine[0].lockRateHz).toBe(30);
    // A camera steps by 0.01 frames/s: the 0.0083 frames/s span is a sliver there too.
    expect(freezeRates([mark], 0, range, { sampler: 'frames' })).toEqual([]);
  });

  it('reports lock order 0 for a target slower than the still threshold', () => {
    // The other part (one mark at 10 rev/s) freezes on camera only at 10/p ≤ 10 frames/s, below the range.
    const bands = freezeRates(
      [
        { speedHz: 0.001, symmetry: 1 },
        { speedHz: 10, symmetry: 1 },
      ],
      0,
      { minHz: 11, maxHz: 20 },
      { sampler: 'frames' },
    );
    expect(bands).toEqual([{ fromHz: 11, toHz: 20, p: 0, lockRateHz: 0, dense: true }]);
  });
});

describe('noStillRates: rates at which no part looks still', () => {
  it('leaves out only the rates within 0.25 rpm of the lock (doc example)', () => {
    const bands = noStillRates(
      [{ speedHz: 20, symmetry: 1 }],
      { minHz: 15, maxHz: 25 },
      { sampler: 'frames' },
    );
    expect(bands).toHaveLength(2);
    expect(bands[0].fromHz).toBe(15);
    expect(bands[0].toHz).toBeCloseTo(20 - stillHz, 12);
    expect(bands[1].fromHz).toBeCloseTo(20 + stillHz, 12);
    expect(bands[1].toHz).toBe(25);
  });

  it('is the complement of the still spans, less the gaps narrower than one setting step', () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.record({
            speedHz: fc.double({ min: 0.5, max: 40, noNaN: true }),
            symmetry: fc.integer({ min: 1, max: 8 }),
            tolerance: fc.double({ min: 0, max: 0.02, noNaN: true }),
          }),
          { minLength: 1, maxLength: 3 },
        ),
        fc.array(fc.double({ min: 5, max: 150, noNaN: true }), { minLength: 20, maxLength: 20 }),
        (parts: Part[], rates) => {
          const range = { minHz: 5, maxHz: 150 };
          const step = 1 / 60; // docs/physics.md §4: one flash per minute
          const free = noStillRates(parts, range);
          const spans: StillSpan[] = stillRates(parts, range);
          for (const b of free) expect(b.toHz - b.fromHz).toBeGreaterThanOrEqual(step * (1 - 1e-9));
          for (const s of rates) {
            if (nearEdge([...free, ...spans], s)) continue;
            if (inside(spans, s)) {
              expect(inside(free, s), `${s} Hz`).toBe(false);
              continue;
            }
            const from = Math.max(
              range.minHz,
              ...spans.filter((x) => x.toHz <= s).map((x) => x.toHz),
            );
            const to = Math.min(
              range.maxHz,
              ...spans.filter((x) => x.fromHz >= s).map((x) => x.fromHz),
            );
            expect(inside(free, s), `${s} Hz in a gap of ${to - from} Hz`).toBe(to - from >= step);
          }
          return true;
        },
      ),
      { seed: SEED, numRuns: 100 },
    );
  });

  it('returns the whole range when nothing can look still in it', () => {
    // One mark at 10 rev/s on camera between 15 and 19 frames/s: its single-image locks are 10/p ≤ 10.
    expect(
      noStillRates([{ speedHz: 10, symmetry: 1 }], { minHz: 15, maxHz: 19 }, { sampler: 'frames' }),
    ).toEqual([{ fromHz: 15, toHz: 19 }]);
  });
});

describe('stillRates, freezeRates, noStillRates: bad input', () => {
  const range = { minHz: 1, maxHz: 10 };

  it('rejects an empty part list and a bad part', () => {
    expectInputError(() => stillRates([], range), 'parts', 'part');
    expectInputError(() => noStillRates(bad('fan'), range), 'parts', 'part');
    expectInputError(() => freezeRates([{ speedHz: NaN, symmetry: 1 }], 0, range), 'speed');
    expectInputError(
      () => stillRates([{ speedHz: 1, symmetry: 0 }], range),
      'features (blades, spokes)',
    );
  });

  it('rejects a target that is not the index of a part', () => {
    expectInputError(() => freezeRates([wheel], 1, range), 'part to freeze');
    expectInputError(() => freezeRates([wheel], -1, range), 'part to freeze');
    expectInputError(() => freezeRates([wheel], 0.5, range), 'part to freeze');
  });

  it('rejects an inverted range, an unknown sampler and bad look options', () => {
    expectInputError(() => stillRates([wheel], { minHz: 10, maxHz: 1 }), 'rate range', 'empty');
    expectInputError(() => freezeRates([wheel], 0, range, { sampler: bad('video') }), 'sampler');
    expectInputError(() => noStillRates([wheel], range, { maxImages: 0 }), 'largest image count');
    expectInputError(() => freezeRates([wheel], 0, range, { settingStepHz: 0 }), 'setting step');
  });
});

describe('stillRates, freezeRates, noStillRates: never NaN or Infinity, never a hang', () => {
  it('returns finite bands or throws InputError for any speeds and ranges', () => {
    fc.assert(
      fc.property(
        anyFinite(),
        fc.integer({ min: 1, max: 1000 }),
        anyPositive(),
        anyPositive(),
        (speedHz, symmetry, a, b) => {
          const range = { minHz: Math.min(a, b), maxHz: Math.max(a, b) };
          const parts = [
            { speedHz, symmetry },
            { speedHz: 25, symmetry: 6, tolerance: 0.01 },
          ];
          return (
            finiteOrInputError(() => stillRates(parts, range)) &&
            finiteOrInputError(() => freezeRates(parts, 0, range)) &&
            finiteOrInputError(() => noStillRates(parts, range, { sampler: 'frames' }))
          );
        },
      ),
      { seed: SEED, numRuns: 300 },
    );
  });

  it('refuses, with a message, a part so fast that it would stand still at millions of low rates', () => {
    expectInputError(
      () => stillRates([{ speedHz: 1e6, symmetry: 1 }], { minHz: 0.01, maxHz: 10 }),
      'rate range',
      'raise the lowest rate',
    );
  });
});
