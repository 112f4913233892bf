// What the check screen shows above its results, as flags that change only when they flip: the
// parts that read them re-render then, not on every keystroke.
import { computed } from '@preact/signals';
import { check, checkProblem, type CheckAnswer } from '../../state/check';
import { computedSame, sameItems } from '../../state/computedSame';
import { problemsAmong } from '../../state/fieldProblems';
import { VERDICT_FIELDS } from './field-ids';

/** The verdict is withdrawn: a field it reads is refused, or the core refused the set-up. */
export const verdictWithdrawn = computed(
  () => problemsAmong(VERDICT_FIELDS).length > 0 || checkProblem.value !== undefined,
);

/**
 * Whether the screen gives the stillness caution for `answer`: for an aliased view, and while
 * the verdict is withdrawn (nothing then says the view is true). Reads the withdrawal signal.
 */
export function screenGivesSafetyFor(answer: CheckAnswer): boolean {
  return answer.showSafety || verdictWithdrawn.value;
}

/** The screen shows the stillness caution for the set-up on screen. */
export const screenShowsSafety = computed(() => screenGivesSafetyFor(check.value));

/** The screen shows the caution about flashing light. */
export const screenShowsFlashing = computed(() => check.value.showPhotosensitivity);

/** The check's notes; the same list (the same object) for as long as they stay the same. */
export const checkNotes = computedSame(() => check.value.notes, sameItems);
