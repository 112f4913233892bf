// The check screen's state: its result for the set-up on screen, as signals. A refused set-up
// leaves the last good result on screen (keepLastGood) and says why beside it.
import { computed } from '@preact/signals';
import { defaultSetup } from '../model';
import { keepLastGood } from '../outcome';
import { setup } from '../setup';
import { computeCheck, type CheckResult } from './compute';

export * from './compute';
export * from './nearby';
export * from './verdict';

const kept = keepLastGood(() => computeCheck(setup.value));

/** The newest result the core accepted; the default set-up's until the first one was. */
export const check = computed<CheckResult>(() => kept.result.value ?? computeCheck(defaultSetup));

/** The core's refusal of the current set-up, if any (shown above the results). */
export const checkProblem = kept.problem;
