// A computed view that calls the core can be refused (InputError). The screens then keep the
// last result the core accepted and show the refusal beside it, so bad input never blanks a
// screen or loses what was on it.
import { computed, type ReadonlySignal } from '@preact/signals';
import { InputError } from '../core';

/** What a core call gave: its result, or the core's refusal in words. */
export type Outcome<T> = { ok: true; result: T } | { ok: false; message: string };

/** Runs `work`, turning the core's InputError into a refusal; any other error is a bug and rethrows. */
export function attempt<T>(work: () => T): Outcome<T> {
  try {
    return { ok: true, result: work() };
  } catch (error) {
    if (error instanceof InputError) return { ok: false, message: error.message };
    throw error;
  }
}

/** The result on screen and the refusal to show beside it. */
export interface KeptResult<T> {
  /** The newest result the core accepted (undefined until one was). */
  result: ReadonlySignal<T | undefined>;
  /** The core's refusal of the current input, if any. */
  problem: ReadonlySignal<string | undefined>;
}

/**
 * Follows `work` (a function of signals) and keeps its last accepted result.
 * @example const kept = keepLastGood(() => loggerPlan(...)); kept.result.value // the plan
 */
export function keepLastGood<T>(work: () => T): KeptResult<T> {
  const outcome = computed<Outcome<T>>(() => attempt(work));
  let lastGood: T | undefined;
  const result = computed<T | undefined>(() => {
    const o = outcome.value;
    if (o.ok) lastGood = o.result;
    return lastGood;
  });
  const problem = computed<string | undefined>(() => {
    const o = outcome.value;
    return o.ok ? undefined : o.message;
  });
  return { result, problem };
}
