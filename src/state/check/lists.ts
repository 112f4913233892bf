// The lists under the check screen's answer: the rates to try (locks and creep) and the bands
// that show the part's true way. They cost more than the answer and are not needed for its
// first paint, so they live apart: only the later results chunk imports this module, and its
// signals follow the set-up one paint behind the answer (listed.ts).
import { computed } from '@preact/signals';
import { defaultSetup, type Setup } from '../model';
import { keepLastGood } from '../outcome';
import { computeCheckAnswer, type CheckAnswer } from './compute';
import { listedAnswer, listedSetup } from './listed';
import {
  bandSummary,
  creepRates,
  nearbyLocks,
  type BandSummary,
  type CreepMissing,
  type CreepRate,
  type SuggestedRate,
} from './nearby';

export interface CheckLists {
  locks: SuggestedRate[];
  /** Some lock-in rates near the current one freeze the part over too narrow a band to set and hold, and are left out. */
  narrowLocksLeftOut: boolean;
  creep: CreepRate[];
  creepRpm: number;
  /** Why no creep rate is offered, when none is. */
  creepMissing?: CreepMissing;
  bands: BandSummary;
}

/** Everything the check screen shows for a set-up: the answer and the lists under it. */
export type CheckResult = CheckAnswer & CheckLists;

/** The lists for a set-up and its answer (from computeCheckAnswer). Throws the core's InputError. */
export function computeCheckLists(s: Setup, answer: CheckAnswer): CheckLists {
  const { part, rateHz, range, sampler } = answer;
  const creep = creepRates(part, s.creepRpm, rateHz, range, sampler);
  const { locks, narrowLeftOut } = nearbyLocks(part, rateHz, range, sampler);
  return {
    locks,
    narrowLocksLeftOut: narrowLeftOut,
    creep: creep.rates,
    creepRpm: s.creepRpm,
    ...(creep.missing === undefined ? {} : { creepMissing: creep.missing }),
    bands: bandSummary(part, rateHz, range, sampler),
  };
}

/** Everything the check screen shows for a set-up. Throws the core's InputError for a set-up it refuses. */
export function computeCheck(s: Setup): CheckResult {
  const answer = computeCheckAnswer(s);
  return { ...answer, ...computeCheckLists(s, answer) };
}

const kept = keepLastGood(() => {
  const s = listedSetup.value;
  return computeCheckLists(s, computeCheckAnswer(s));
});

/** The core's refusal of the listed set-up's lists, if any (they are then marked not current). */
export const listsProblem = kept.problem;

/**
 * What the lists show: the listed set-up's answer and lists, each the last the core accepted
 * (a refused set-up is marked not current by the screen, from the refusals of the set-up on
 * screen, which come at once).
 */
export const listedCheck = computed<CheckResult>(() => {
  const lists = kept.result.value;
  const answer = listedAnswer.value;
  // Until the core accepted one set-up: the default set-up's, as for the answer (index.ts).
  return lists ? { ...answer, ...lists } : computeCheck(defaultSetup);
});
