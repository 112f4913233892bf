import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { motorExpectedRange, speedFinderSteps } from '../../../src/core/plans/speedFinderSteps';
import { bad, expectInputError, finiteOrInputError } from '../expectInputError';
import { F1, steps, strobe } from '../../helpers/speedFinderCases';

describe('speedFinderSteps: the usual procedure', () => {
  it('starts at the top of the strobe range when no speed is expected', () => {
    const step = steps.fromTop();
    expect(step.stage).toBe('start');
    expect(step.rateHz).toBe(200);
    expect(step.rateFpm).toBe(12000);
    expect(step.guide).toEqual({
      stage: 'start',
      from: 'strobe-top',
      expectedAboveStrobe: false,
      symmetry: 1,
    });
    expect(step.candidates).toEqual([]);
  });

  it('starts just above the expected speed of a 4-pole motor on 60 Hz', () => {
    // IEC 60034-1 / NEMA MG 1: 1800 rpm synchronous = 30 rev/s; 10 % above is 33 Hz (1980 flashes/min).
    const step = steps.aboveExpected();
    expect(step.rateHz).toBeCloseTo(33, 12);
    expect(step.guide).toMatchObject({ stage: 'start', from: 'above-expected' });
    expect(step.sweptFromHz).toBeCloseTo(33, 12);
  });

  it('asks to confirm the first single image at twice the rate, where two images must stand still', () => {
    const step = steps.firstSingle();
    expect(step.stage).toBe('confirm');
    expect(step.rateHz).toBe(59); // docs/physics.md §7: twice the single-image rate shows a double image
    expect(step.rateFpm).toBe(3540);
    const [lead, twice] = step.candidates;
    expect(lead).toMatchObject({
      speedHz: F1,
      rpm: 1770,
      expected: true,
      likeliest: true,
      ruledOut: false,
    });
    expect(lead.atNextRate).toEqual({ images: 2, look: 'still', apparentRpm: 0 });
    // The speed twice as fast would show a single image there: the check tells them apart.
    expect(twice).toMatchObject({ speedHz: 59, rpm: 3540, expected: false });
    expect(twice.atNextRate).toEqual({ images: 1, look: 'still', apparentRpm: 0 });
    expect(step.guide).toEqual({
      stage: 'confirm',
      basis: 'twice-reading',
      firstSingleHz: F1,
      leadHz: F1,
      symmetry: 1,
    });
  });

  it('finishes with the speed once the double image is seen', () => {
    const step = steps.confirmed();
    expect(step.stage).toBe('done');
    expect(step.speedHz).toBe(F1);
    expect(step.rateHz).toBeUndefined();
    expect(step.guide).toEqual({
      stage: 'done',
      speedHz: F1,
      firstSingleHz: F1,
      confirmHz: 2 * F1,
      check: 'passed',
      othersAlike: 0,
      // 3540, 5310 … rpm fit the readings too, outside the motor's expected range.
      othersOutside: 4,
      outsideExpected: false,
      symmetry: 1,
    });
  });

  it('rules out faster speeds whose single image would have stood still first on the way down', () => {
    // From 12 000 flashes/min down, 3540 rpm freezes as a single image at 3540 before 1770.
    const step = steps.firstSingleAlone();
    const faster = step.candidates.find((c) => c.speedHz === 59);
    expect(faster).toMatchObject({ ruledOut: true, likeliest: false });
    expect(faster?.firstSingleHz).toBe(59); // 3540 flashes/min, passed on the way down
    expect(step.candidates[0]).toMatchObject({ speedHz: F1, likeliest: true });
    expect(step.candidates.filter((c) => !c.ruledOut).map((c) => c.speedHz)).toEqual([F1]);
  });

  it('moves the search up when a single image appears at twice a first single image that was missed, and looks for the most telling rate', () => {
    // Started at 1200 flashes/min (20 Hz), below the true 1770: the first single image was at 885.
    // At twice that, 1770, a single image shows: 885 rpm is out, but 1770, 3540, 5310 … rpm all
    // fit and none would have stood still higher up. The check at 3540 flashes/min would show two
    // images for 1770 and for 5310 rpm alike (r = ½, 3/2), so the next rate is the most telling
    // one over the strobe's range instead (docs/physics.md §7).
    const step = speedFinderSteps(
      {
        readings: [
          { rateHz: F1 / 2, images: 1 },
          { rateHz: F1, images: 1 },
        ],
        symmetry: 1,
        strobeRange: strobe,
      },
      { sweptFromHz: 20 },
    );
    expect(step.candidates.some((c) => c.speedHz === F1 / 2)).toBe(false);
    expect(step.stage).toBe('separate');
    const views = step.candidates
      .filter((c) => !c.ruledOut)
      .map((c) => JSON.stringify(c.atNextRate));
    expect(new Set(views).size).toBeGreaterThan(1);
  });

  it('confirms at two thirds of the rate when twice the rate is beyond the strobe', () => {
    // r = n·f/s = 3/2 is the lock p/q = 3/2: two images stand still (docs/physics.md §3). The motor's
    // expected range (4 poles, 60 Hz) leaves 1770 rpm alone to check.
    const step = steps.twoThirds();
    expect(step.stage).toBe('confirm');
    expect(step.rateHz).toBeCloseTo((2 / 3) * F1, 12);
    expect(step.guide).toMatchObject({ stage: 'confirm', basis: 'two-thirds-reading' });
    expect(step.candidates[0].atNextRate).toMatchObject({ images: 2, look: 'still' });
  });

  it('does not check at twice a single image that is not the likeliest speed’s own: 1500 and 1000 flashes/min', () => {
    // Reported case: single images at 1500 and 1000 flashes/min, one mark. Coming down from
    // 12000, every speed that fits (3000, 6000, 9000, 12000 rpm) would have stood still higher
    // up, so the sweep tells nothing; at 3000 flashes/min all four show one image (r whole), so
    // that rate tells nothing either. The step proposes a rate where they look different.
    const step = speedFinderSteps({
      readings: [
        { rateHz: 25, images: 1 },
        { rateHz: 1000 / 60, images: 1 },
      ],
      symmetry: 1,
      strobeRange: strobe,
    });
    expect(step.candidates.map((c) => c.rpm)).toEqual([3000, 6000, 9000, 12000]);
    expect(step.stage).toBe('separate');
    expect(step.rateFpm).not.toBeCloseTo(3000, 6);
    const texts = step.candidates.map((c) => JSON.stringify(c.atNextRate));
    expect(texts.slice(1)).not.toContain(texts[0]);
  });

  it('keeps coming down after a double image and points at half its rate for the single image', () => {
    const step = steps.afterDouble();
    expect(step.stage).toBe('come-down');
    expect(step.rateHz).toBe(F1);
    expect(step.guide).toEqual({
      stage: 'come-down',
      fromHz: 2 * F1,
      leadHz: F1,
      nextSingleHz: F1,
      belowStrobe: false,
    });
    expect(step.candidates[0].atNextRate).toEqual({ images: 1, look: 'still', apparentRpm: 0 });
  });

  it('proposes a rate that tells apart the speeds still left, with what each shows there', () => {
    // Came down from 25 Hz only: 1200 and 3600 rpm both fit a single image at 20 Hz and two at 40 Hz.
    // At 30 Hz (3/2 of 20 Hz, the first simple multiple not yet tried that tells them apart),
    // 1200 rpm shows three images (r = 2/3) and 3600 rpm a single one (r = 2), docs/physics.md §3.
    const step = steps.twoLeft();
    expect(step.stage).toBe('separate');
    expect(step.rateHz).toBe(30);
    const views = Object.fromEntries(step.candidates.slice(0, 2).map((c) => [c.rpm, c.atNextRate]));
    expect(views).toEqual({
      1200: { images: 3, look: 'still', apparentRpm: 0 },
      3600: { images: 1, look: 'still', apparentRpm: 0 },
    });
    expect(step.guide).toMatchObject({ stage: 'separate', rivals: 2, standing: true });
  });

  it('divides the single-image rate by the number of blades', () => {
    // A 6-blade fan at 1770 rpm: the pattern repeats 6·29.5 = 177 times a second.
    const step = steps.sixBlades();
    expect(step.stage).toBe('done');
    expect(step.speedHz).toBeCloseTo(F1, 12);
    expect(step.guide).toMatchObject({ stage: 'done', symmetry: 6 });
  });

  it('says so when the readings fit no single speed', () => {
    const step = steps.conflict();
    expect(step.stage).toBe('conflict');
    expect(step.candidates).toEqual([]);
    expect(step.rateHz).toBeUndefined();
    expect(step.guide).toEqual({ stage: 'conflict' });
  });

  it('always carries the lockout caution, and the seizure caution when the sweep passes 3–60 flashes a second', () => {
    // docs/physics.md §10; WCAG 2.x success criterion 2.3.1.
    const low = steps.fromTop();
    expect(low.cautions).toEqual(['stillness', 'flashing', 'planning-aid']);
    const high = speedFinderSteps({
      readings: [
        { rateHz: 150, images: 1 },
        { rateHz: 300, images: 2 },
      ],
      symmetry: 1,
      strobeRange: { minHz: 100, maxHz: 400 },
    });
    expect(high.stage).toBe('done');
    expect(high.cautions).toEqual(['stillness', 'planning-aid']);
  });
});

describe('motorExpectedRange: nameplate data to an expected speed', () => {
  it('tops out at the synchronous speeds of the IEC 60034-1 / NEMA MG 1 table', () => {
    // 2/4/6/8 poles: 3600/1800/1200/900 rpm at 60 Hz, 3000/1500/1000/750 rpm at 50 Hz.
    const table: Array<[number, number, number]> = [
      [60, 2, 3600],
      [60, 4, 1800],
      [60, 6, 1200],
      [60, 8, 900],
      [50, 2, 3000],
      [50, 4, 1500],
      [50, 6, 1000],
      [50, 8, 750],
    ];
    for (const [mains, poles, rpm] of table) {
      expect(
        motorExpectedRange(mains, poles).maxHz * 60,
        `${poles} poles at ${mains} Hz`,
      ).toBeCloseTo(rpm, 9);
    }
  });

  it('holds the typical full-load speeds of the Engineering ToolBox tables with the default 0–5 % slip', () => {
    // Engineering ToolBox: 3500/1770/1170/870 rpm at 60 Hz, 2900/1450/960/720 rpm at 50 Hz.
    const typical: Array<[number, number, number]> = [
      [60, 2, 3500],
      [60, 4, 1770],
      [60, 6, 1170],
      [60, 8, 870],
      [50, 2, 2900],
      [50, 4, 1450],
      [50, 6, 960],
      [50, 8, 720],
    ];
    for (const [mains, poles, rpm] of typical) {
      const r = motorExpectedRange(mains, poles);
      expect(rpm / 60, `${poles} poles at ${mains} Hz`).toBeGreaterThanOrEqual(r.minHz);
      expect(rpm / 60, `${poles} poles at ${mains} Hz`).toBeLessThanOrEqual(r.maxHz);
    }
  });

  it('spans the slip range given: 2 to 4 % on a 4-pole 50 Hz motor is 1440 to 1470 rpm', () => {
    // (1 − σ)·120·fm/P: 0.96·1500 = 1440, 0.98·1500 = 1470 (docs/physics.md §8).
    const r = motorExpectedRange(50, 4, { min: 0.02, max: 0.04 });
    expect(r.minHz * 60).toBeCloseTo(1440, 9);
    expect(r.maxHz * 60).toBeCloseTo(1470, 9);
  });

  it('matches its doc example', () => {
    expect(motorExpectedRange(50, 4)).toEqual({ minHz: 23.75, maxHz: 25 });
  });
});

describe('speedFinderSteps and motorExpectedRange: bad input', () => {
  const ok = { readings: [], symmetry: 1, strobeRange: strobe };

  it('rejects a missing input and readings that are not a list', () => {
    expectInputError(() => speedFinderSteps(bad(null)), 'speed finder', 'readings');
    expectInputError(() => speedFinderSteps({ ...ok, readings: bad('29.5') }), 'readings');
  });

  it('rejects a feature count that is not a whole number of at least 1', () => {
    expectInputError(() => speedFinderSteps({ ...ok, symmetry: 0 }), 'features (blades, spokes)');
    expectInputError(() => speedFinderSteps({ ...ok, symmetry: 2.5 }), 'features (blades, spokes)');
  });

  it('rejects an empty or inverted strobe range and expected range', () => {
    expectInputError(
      () => speedFinderSteps({ ...ok, strobeRange: { minHz: 200, maxHz: 0.5 } }),
      'strobe range',
    );
    expectInputError(
      () => speedFinderSteps({ ...ok, expect: { minHz: 30, maxHz: 30 } }),
      'expected speed range',
    );
  });

  it('rejects readings with a rate that is not above zero or an image count that is not whole', () => {
    expectInputError(
      () => speedFinderSteps({ ...ok, readings: [{ rateHz: 0, images: 1 }] }),
      'rate of reading 1',
    );
    expectInputError(
      () => speedFinderSteps({ ...ok, readings: [{ rateHz: 30, images: 1.5 }] }),
      'images in reading 1',
    );
    expectInputError(() => speedFinderSteps({ ...ok, readings: [bad(null)] }), 'rate of reading 1');
  });

  it('rejects bad options', () => {
    expectInputError(() => speedFinderSteps(ok, { sweptFromHz: -1 }), 'rate you started from');
    expectInputError(() => speedFinderSteps(ok, { startMargin: NaN }), 'start margin');
    expectInputError(() => speedFinderSteps(ok, { matchTolerance: 0.5 }), 'match tolerance');
  });

  it('rejects odd poles, mains at or below zero, and slips out of order or above 50 %', () => {
    expectInputError(() => motorExpectedRange(50, 3), 'poles', 'even');
    expectInputError(() => motorExpectedRange(0, 4), 'mains frequency');
    expectInputError(() => motorExpectedRange(50, 4, { min: 0.04, max: 0.02 }), 'slip', 'empty');
    expectInputError(() => motorExpectedRange(50, 4, { min: 0, max: 0.6 }), 'largest slip');
    expectInputError(() => motorExpectedRange(50, 4, { min: NaN, max: 0.05 }), 'smallest slip');
  });
});

describe('speedFinderSteps: never NaN or Infinity', () => {
  it('returns finite numbers or throws InputError for any readings within a strobe’s reach', () => {
    // Rates are kept to what strobes and findSpeed handle (0.01 Hz to 1 MHz); the step adds no limit of its own.
    const rate = fc.double({ min: 0.01, max: 1e6, noNaN: true });
    fc.assert(
      fc.property(
        fc.array(fc.record({ rateHz: rate, images: fc.integer({ min: 1, max: 8 }) }), {
          maxLength: 3,
        }),
        fc.integer({ min: 1, max: 100 }),
        rate,
        rate,
        fc.option(fc.tuple(rate, rate)),
        (readings, symmetry, a, b, expected) =>
          finiteOrInputError(() =>
            speedFinderSteps({
              readings,
              symmetry,
              strobeRange: { minHz: Math.min(a, b), maxHz: Math.max(a, b) },
              ...(expected
                ? { expect: { minHz: Math.min(...expected), maxHz: Math.max(...expected) } }
                : {}),
            }),
          ),
      ),
      { seed: 1949, numRuns: 300 },
    );
  });
});
