// The set-up the lists under the answer were worked out for: the set-up on screen, one paint
// later. A keystroke re-renders the field and the answer at once and paints them; the lists,
// the rate map and the preview catch up in a task of their own after that paint, so typing
// on a slow phone is not held up by them. While they are behind, `listsBehind` says so and
// the screen keeps taps off them and marks them busy (src/screens/check).
import { computed, effect, signal } from '@preact/signals';
import { defaultSetup, type Setup } from '../model';
import { keepLastGood } from '../outcome';
import { afterNextPaint } from '../afterNextPaint';
import { setup } from '../setup';
import { computeCheckAnswer, type CheckAnswer } from './compute';

/** The set-up the lists show. */
export const listedSetup = signal<Setup>(setup.peek());

/** True from a change of the set-up until the lists show it. */
export const listsBehind = computed(() => listedSetup.value !== setup.value);

const kept = keepLastGood(() => computeCheckAnswer(listedSetup.value));

/** The answer for the listed set-up (the last the core accepted), for what the lists draw from. */
export const listedAnswer = computed<CheckAnswer>(
  () => kept.result.value ?? computeCheckAnswer(defaultSetup),
);

let catchingUp = false;
effect(() => {
  if (setup.value === listedSetup.peek() || catchingUp) return;
  catchingUp = true;
  afterNextPaint(() => {
    catchingUp = false;
    listedSetup.value = setup.peek();
  });
});
