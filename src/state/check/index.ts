// The check screen's state: its answer for the set-up on screen, as signals. A refused set-up
// leaves the last good answer on screen (keepLastGood) and says why beside it. The lists under
// the answer follow a paint behind (listed.ts, lists.ts).
import { computed } from '@preact/signals';
import { defaultSetup } from '../model';
import { keepLastGood } from '../outcome';
import { setup } from '../setup';
import { computeCheckAnswer, type CheckAnswer } from './compute';

export * from './compute';
export * from './listed';
export * from './verdict';
export type { BandSummary, CreepMissing, CreepRate, Side, SuggestedRate } from './nearby';

const kept = keepLastGood(() => computeCheckAnswer(setup.value));

/** The newest answer the core accepted; the default set-up's until the first one was. */
export const check = computed<CheckAnswer>(
  () => kept.result.value ?? computeCheckAnswer(defaultSetup),
);

/** The core's refusal of the current set-up, if any (shown above the results). */
export const checkProblem = kept.problem;
