// What the screen shows under its answer follows the set-up on screen a paint or two later. A
// keystroke re-renders the field and the answer at once and paints them; the lists catch up in
// a task of their own after that paint, and the pictures (the rate map and the preview) after
// the next, so typing on a slow phone is held up by none of them and no task grows long. While
// they are behind, `listsBehind` and `picturesBehind` say so, and the screen keeps taps off the
// lists (src/screens/check/results-guard.tsx).
import { computed, effect, signal, type ReadonlySignal } from '@preact/signals';
import { defaultSetup, type Setup } from '../model';
import { keepLastGood } from '../outcome';
import { afterNextPaint } from '../afterNextPaint';
import { setup } from '../setup';
import { computeCheckAnswer, type CheckAnswer } from './compute';

/** A set-up that follows `source` one paint later, whether it is behind the screen's, and its answer. */
function followAfterPaint(source: ReadonlySignal<Setup>) {
  const shown = signal<Setup>(source.peek());
  let catchingUp = false;
  effect(() => {
    if (source.value === shown.peek() || catchingUp) return;
    catchingUp = true;
    afterNextPaint(() => {
      catchingUp = false;
      shown.value = source.peek();
    });
  });
  const kept = keepLastGood(() => computeCheckAnswer(shown.value));
  return {
    shown: shown as ReadonlySignal<Setup>,
    behind: computed(() => shown.value !== setup.value),
    // The last answer the core accepted; the default set-up's until the first one was.
    answer: computed<CheckAnswer>(() => kept.result.value ?? computeCheckAnswer(defaultSetup)),
  };
}

const lists = followAfterPaint(setup);
const pictures = followAfterPaint(lists.shown);

/** The set-up the lists show. */
export const listedSetup = lists.shown;
/** True from a change of the set-up until the lists show it. */
export const listsBehind = lists.behind;
/** The answer for the listed set-up, for what the lists draw from. */
export const listedAnswer = lists.answer;

/** The set-up the rate map and the preview show. */
export const picturedSetup = pictures.shown;
/** True from a change of the set-up until the pictures show it. */
export const picturesBehind = pictures.behind;
/** The answer for the pictured set-up. */
export const picturedAnswer = pictures.answer;
