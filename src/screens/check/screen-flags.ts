// What the check screen shows above its results, as flags that change only when they flip: the
// parts that read them re-render then, not on every keystroke.
import { computed } from '@preact/signals';
import { check, checkProblem } from '../../state/check';
import { problemsAmong } from '../../state/fieldProblems';
import { VERDICT_FIELDS } from './field-ids';

/**
 * The screen shows the stillness caution: for an aliased view, and while the verdict is
 * withdrawn (nothing then says the view is true).
 */
export const screenShowsSafety = computed(
  () =>
    check.value.showSafety ||
    problemsAmong(VERDICT_FIELDS).length > 0 ||
    checkProblem.value !== undefined,
);

/** The screen shows the caution about flashing light. */
export const screenShowsFlashing = computed(() => check.value.showPhotosensitivity);

let lastNotes: readonly string[] = [];
/** The check's notes; the same list (the same object) for as long as they stay the same. */
export const checkNotes = computed(() => {
  const notes = check.value.notes;
  const same = notes.length === lastNotes.length && notes.every((n, i) => n === lastNotes[i]);
  if (!same) lastNotes = notes;
  return lastNotes as typeof notes;
});
