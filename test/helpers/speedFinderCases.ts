// Steps of the strobe procedure the speed-finder tests share: the core's guide and table are
// checked in test/core/plans, their words in test/words, on the same readings.
import { motorExpectedRange, speedFinderSteps } from '../../src/core';

/** A strobe covering 30 to 12 000 flashes per minute (common practice for hand-held strobes). */
export const strobe = { minHz: 0.5, maxHz: 200 };

/**
 * IEC 60034-1 / NEMA MG 1: a 4-pole motor on 60 Hz runs below 1800 rpm synchronous; Engineering
 * ToolBox lists 1770 rpm as its typical full-load speed: 29.5 rev/s, a single mark freezing
 * first at 1770 flashes per minute.
 */
export const F1 = 29.5;

/** The expected range of that motor's nameplate (4 poles on 60 Hz, 0–5 % slip). */
const motor = () => motorExpectedRange(60, 4);

export const steps = {
  /** No reading, no expected speed: start at the top of the strobe. */
  fromTop: () => speedFinderSteps({ readings: [], symmetry: 1, strobeRange: strobe }),
  /** No reading, the motor expected: start just above it. */
  aboveExpected: () =>
    speedFinderSteps({ readings: [], symmetry: 1, strobeRange: strobe, expect: motor() }),
  /** A first single image at 1770 flashes/min, the motor expected: check at twice the rate. */
  firstSingle: () =>
    speedFinderSteps({
      readings: [{ rateHz: F1, images: 1 }],
      symmetry: 1,
      strobeRange: strobe,
      expect: motor(),
    }),
  /** The same first single image with no speed expected: faster speeds are ruled out. */
  firstSingleAlone: () =>
    speedFinderSteps({ readings: [{ rateHz: F1, images: 1 }], symmetry: 1, strobeRange: strobe }),
  /** The single image, then the double image at twice the rate: done. */
  confirmed: () =>
    speedFinderSteps({
      readings: [
        { rateHz: F1, images: 1 },
        { rateHz: 2 * F1, images: 2 },
      ],
      symmetry: 1,
      strobeRange: strobe,
      expect: motor(),
    }),
  /** A strobe up to 40 Hz: twice the single-image rate is beyond it, two thirds is not. */
  twoThirds: () =>
    speedFinderSteps({
      readings: [{ rateHz: F1, images: 1 }],
      symmetry: 1,
      strobeRange: { minHz: 1, maxHz: 40 },
      expect: motor(),
    }),
  /** A double image first: keep coming down. */
  afterDouble: () =>
    speedFinderSteps({
      readings: [{ rateHz: 2 * F1, images: 2 }],
      symmetry: 1,
      strobeRange: strobe,
    }),
  /**
   * Came down from 25 Hz only: 1200 and 3600 rpm both fit a single image at 20 Hz and two at
   * 40 Hz; at 30 Hz 1200 rpm shows three images (r = 2/3) and 3600 rpm one (r = 2), docs/physics.md §3.
   */
  twoLeft: () =>
    speedFinderSteps(
      {
        readings: [
          { rateHz: 20, images: 1 },
          { rateHz: 40, images: 2 },
        ],
        symmetry: 1,
        strobeRange: strobe,
        expect: { minHz: 15, maxHz: 65 },
      },
      { sweptFromHz: 25 },
    ),
  /** A 6-blade fan at 1770 rpm: the pattern repeats 6·29.5 = 177 times a second. */
  sixBlades: () =>
    speedFinderSteps({
      readings: [
        { rateHz: 177, images: 1 },
        { rateHz: 354, images: 2 },
      ],
      symmetry: 6,
      strobeRange: { minHz: 0.5, maxHz: 400 },
    }),
  /** One rate read as a single image and as two: no speed fits. */
  conflict: () =>
    speedFinderSteps({
      readings: [
        { rateHz: 30, images: 1 },
        { rateHz: 30, images: 2 },
      ],
      symmetry: 1,
      strobeRange: strobe,
    }),
};
