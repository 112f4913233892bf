// The speed finder's instruction, notes and predictions in words (src/words/speedFinder.ts),
// built from the core's guide: the sentences name the speeds, rates and views of the table.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { plainNumber, speedFinderSteps, type SpeedFinderStep } from '../../src/core';
import { viewWords } from '../../src/words/look';
import { candidateNote, stepInstruction } from '../../src/words/speedFinder';
import { replay, sceneOf } from '../core/simulator';
import { F1, steps } from '../helpers/speedFinderCases';

describe('the speed finder in words, step by step', () => {
  it('starts at the top of the strobe range, a single image in view', () => {
    const say = stepInstruction(steps.fromTop());
    expect(say).toMatch(/^Set the strobe to 12000 flashes\/min \(the top of the strobe's range\)/);
    expect(say).toMatch(/single image/);
  });

  it('starts just above the expected speed of a 4-pole motor on 60 Hz', () => {
    // IEC 60034-1 / NEMA MG 1: 1800 rpm synchronous; 10 % above is 1980 flashes/min.
    expect(stepInstruction(steps.aboveExpected())).toMatch(
      /1980 flashes\/min \(just above the expected speed\)/,
    );
  });

  it('asks for the double image at twice the first single image, naming what each speed shows', () => {
    const step = steps.firstSingle();
    expect(stepInstruction(step)).toMatch(
      /^Now set 3540 flashes\/min \(twice the single-image rate 1770 flashes\/min\)\. If the part turns at 1770 rpm, two marks half a turn apart stand still there\./,
    );
    const [lead, twice] = step.candidates;
    expect(viewWords(lead.atNextRate!)).toBe('2 images stand still');
    expect(viewWords(twice.atNextRate!)).toBe('a single image stands still');
  });

  it('confirms at two thirds of the rate when twice the rate is beyond the strobe', () => {
    expect(stepInstruction(steps.twoThirds())).toMatch(/two thirds of the single-image rate/);
  });

  it('finishes with the speed once the double image is seen', () => {
    expect(stepInstruction(steps.confirmed())).toBe(
      'The part turns at 1770 rpm (single image at 1770 flashes/min, confirmed by the two images).' +
        ' 4 speeds outside the expected range fit the readings too (see the table).' +
        ' You can save this speed to the machine.',
    );
  });

  it('says why a faster speed is ruled out: it would have stood still first on the way down', () => {
    const step = steps.firstSingleAlone();
    const faster = step.candidates.find((c) => c.speedHz === 2 * F1)!;
    expect(candidateNote(faster)).toBe(
      'Would have stood still as a single image at 3540 flashes/min on the way down.',
    );
    expect(candidateNote(step.candidates[0])).toBe('Fits every reading.');
  });

  it('keeps coming down after a double image', () => {
    expect(stepInstruction(steps.afterDouble())).toMatch(
      /^Keep lowering the rate from 3540 flashes\/min/,
    );
  });

  it('proposes a rate that tells the speeds apart, with what each shows there', () => {
    expect(stepInstruction(steps.twoLeft())).toMatch(
      /^Set 1800 flashes\/min and compare what you see with the 2 speeds that still fit \(at 1200 rpm: 3 images stand still; at 3600 rpm: a single image stands still\)/,
    );
  });

  it('divides the single-image rate by the number of blades, and says so', () => {
    expect(stepInstruction(steps.sixBlades())).toMatch(/divided by 6/);
  });

  it('says so when the readings fit no single speed', () => {
    expect(stepInstruction(steps.conflict())).toMatch(/fit no single speed/);
  });
});

describe('the speed finder in words agrees with the table', () => {
  /** Checks one step: every speed the instruction names and every view it states are the table's. */
  function expectConsistent(step: SpeedFinderStep, where: string) {
    const likeliest = step.candidates.find((c) => c.likeliest);
    const live = step.candidates.filter((c) => !c.ruledOut);
    const rpmText = (rpm: number) => `${plainNumber(rpm)} rpm`;
    if (step.stage === 'confirm') {
      // "If the part turns at X rpm, two marks … stand still": X is the likeliest, and the
      // table predicts two images for it at that rate.
      expect(stepInstruction(step), where).toContain(
        `If the part turns at ${rpmText(likeliest!.rpm)},`,
      );
      expect(likeliest!.atNextRate, where).toMatchObject({ images: 2, look: 'still' });
    }
    if (step.stage === 'separate') {
      // Every "at X rpm: view" in the instruction is a live row of the table, with its view.
      const named = [...stepInstruction(step).matchAll(/at ([\d.]+ rpm): /g)].map((m) => m[1]);
      expect(named.length, where).toBeGreaterThan(1);
      for (const rpm of named) {
        const row = live.find((c) => rpmText(c.rpm) === rpm);
        expect(row, `${where}: ${rpm} named but not a live row`).toBeDefined();
        expect(stepInstruction(step), where).toContain(`at ${rpm}: ${viewWords(row!.atNextRate!)}`);
      }
    }
    if (step.stage === 'done') {
      expect(stepInstruction(step), where).toContain(
        `The part turns at ${rpmText(likeliest!.rpm)}`,
      );
      const others = /(\d+) other speeds? in the table fit/.exec(stepInstruction(step));
      if (others) expect(Number(others[1]) + 1, where).toBeLessThanOrEqual(live.length);
    }
    // The likeliest is never a ruled-out row.
    if (likeliest) expect(likeliest.ruledOut, where).toBe(false);
  }

  it('keeps the instruction, the rate and every prediction in the table in step, reading after reading', () => {
    // A technician follows the steps for a part of random true speed: each reading is what the
    // brute-force replay (test/core/simulator.ts) shows at the rate proposed, when images stand still.
    const strobeRange = { minHz: 0.5, maxHz: 200 };
    fc.assert(
      fc.property(
        fc.double({ min: 2, max: 150, noNaN: true }),
        fc.constantFrom(1, 2, 3, 6),
        (speedHz, symmetry) => {
          const G = symmetry * speedHz;
          // Coming down from 200 flashes/s, the first single image is at G/k, the highest under 200.
          const readings = [{ rateHz: G / Math.ceil(G / strobeRange.maxHz), images: 1 }];
          for (let i = 0; i < 5; i++) {
            const step = speedFinderSteps({ readings, symmetry, strobeRange });
            expectConsistent(step, `${speedHz} rev/s, ${symmetry} features, step ${i + 1}`);
            if (step.rateHz === undefined) break;
            const view = replay(sceneOf(speedHz, symmetry, step.rateHz, 'flash'));
            if (view.look !== 'still') break;
            readings.push({ rateHz: step.rateHz, images: view.images });
          }
        },
      ),
      { seed: 1949, numRuns: 200 },
    );
  });

  it('keeps them in step for any two single images a technician records, not only a clean sweep', () => {
    // Single images at G/k1 and G/k2 (any two sub-multiples, as in the reported 1500 and 1000
    // flashes/min): the sweep from the top may rule nothing out; the words must still match.
    const strobeRange = { minHz: 0.5, maxHz: 200 };
    fc.assert(
      fc.property(
        fc.double({ min: 2, max: 150, noNaN: true }),
        fc.constantFrom(1, 2, 3, 6),
        fc.integer({ min: 1, max: 6 }),
        fc.integer({ min: 1, max: 4 }),
        (speedHz, symmetry, k1, gap) => {
          const G = symmetry * speedHz;
          const readings = [k1, k1 + gap].map((k) => ({ rateHz: G / k, images: 1 }));
          fc.pre(
            readings.every((r) => r.rateHz >= strobeRange.minHz && r.rateHz <= strobeRange.maxHz),
          );
          const step = speedFinderSteps({ readings, symmetry, strobeRange });
          expectConsistent(step, `${speedHz} rev/s, ${symmetry} features, k = ${k1}, ${k1 + gap}`);
        },
      ),
      { seed: 1949, numRuns: 300 },
    );
  });
});
