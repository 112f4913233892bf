// What would lift each condition of a camera goal (docs/physics.md §3–§5): the frame rates in
// the camera's span that show the look, the longest sharp exposure, the shortest that blurs a
// pitch, the longest readout within the bend limit.
import { InputError } from '../basics/InputError';
import type { Range } from '../basics/types';
import { apparentMotion } from '../physics/apparentMotion';
import { lockCountBound } from '../physics/lockRates';
import { ratesForApparent } from '../physics/ratesForApparent';
import { hzToRpm } from '../formulas/units';
import type { CameraNeeds } from './cameraPlan';
import {
  creepLookHolds,
  SAME_RATE,
  type ApparentMotionOpts,
  type Combo,
  type PlanContext,
} from './cameraSetting';

/** Most look rates returned: more than anyone reads, far more than a camera offers. */
export const MAX_LOOK_RATES = 200;
/** Most creep candidates weighed for the list of look rates. */
const MAX_LOOK_WORK = 10_000;

/** What would lift each condition: rates that show the look, and the exposure and readout limits. */
export function needsOf(context: PlanContext, span: Range, combos: Combo[]): CameraNeeds {
  const { part, goal, limits, look } = context;
  const offeredHz = combos.map((c) => c.frameRate);
  const speed = Math.abs(part.speedHz);
  const patternHz = part.symmetry * speed;
  const exposures = combos.map((c) => c.exposureS);
  const offered = (hz: number) => offeredHz.some((r) => Math.abs(r - hz) <= SAME_RATE * hz);
  const creepPatternHz = goal.kind === 'creep' ? part.symmetry * (speed + goal.creepHz) : 0;
  let candidates: number[] = [];
  let count = 0;
  if (patternHz > 0 && goal.kind === 'freeze') {
    // Every sub-multiple n·|f|/k within the span (docs/physics.md §3, q = 1).
    const kFirst = Math.max(1, Math.ceil((patternHz / span.maxHz) * (1 - 1e-12)));
    const kLast = Math.floor((patternHz / span.minHz) * (1 + 1e-12));
    count = Math.max(0, kLast - kFirst + 1);
    for (let k = kFirst; k <= kLast && candidates.length < MAX_LOOK_RATES; k++)
      candidates.push(patternHz / k);
  } else if (
    patternHz > 0 &&
    goal.kind === 'creep' &&
    // More candidates than anyone reads (a fast gear against a slow span): list none.
    // The creep rates n·|f − a|/k lie like the single-image locks of the rate n·(|f| + a).
    lockCountBound({ lowHz: creepPatternHz, highHz: creepPatternHz }, span, 1) <= MAX_LOOK_WORK
  ) {
    const wanted = Math.sign(part.speedHz || 1) * goal.creepHz;
    const range = { minHz: span.minHz * (1 - SAME_RATE), maxHz: span.maxHz * (1 + SAME_RATE) };
    const opts: ApparentMotionOpts = { ...look, sampler: 'frames' };
    // Only rates where the camera really shows that creep (docs/physics.md §4).
    candidates = ratesForApparent(part, wanted, range, { sampler: 'frames' })
      .map((r) => r.rateHz)
      .filter((hz) =>
        creepLookHolds(
          part,
          hz,
          hzToRpm(apparentMotion(part, hz, opts).apparentHz),
          hzToRpm(wanted),
          opts,
        ),
      )
      .sort((a, b) => b - a);
    count = candidates.length;
    candidates = candidates.slice(0, MAX_LOOK_RATES);
  }
  // A part that does not turn blurs and bends nothing: any exposure or readout will do.
  const perPitchS = patternHz > 0 ? 1 / patternHz : 1;
  const sharpExposureS =
    goal.kind === 'creep'
      ? limits.creepBlurPitches * perPitchS
      : speed > 0
        ? limits.sharpBlurDeg / (360 * speed)
        : 1;
  if (![sharpExposureS, perPitchS].every(Number.isFinite)) {
    throw new InputError(
      'speed',
      'The speed is too slow to plan exposures for: check its units (rpm or rev/s).',
    );
  }
  return {
    patternHz,
    lookRates: candidates.map((rateHz) => ({ rateHz, offered: offered(rateHz) })),
    lookRateCount: count,
    faithfulAboveHz: 2 * patternHz * (1 + part.tolerance),
    sharpExposureS,
    discExposureS: perPitchS,
    bendReadoutS: limits.maxBendPitches * perPitchS,
    shortestExposureS: Math.min(...exposures),
    longestExposureS: Math.max(...exposures),
  };
}
