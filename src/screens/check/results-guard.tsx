// Wrappers for what the check screen works out from its entries.
import { effect, type ReadonlySignal } from '@preact/signals';
import { useEffect, useRef } from 'preact/hooks';
import type { ComponentChildren } from 'preact';
import { checkProblem, listsBehind } from '../../state/check';
import { problemsAmong } from '../../state/fieldProblems';
import { NotCurrent } from '../../ui/not-current';
import { RESULT_FIELDS } from './field-ids';
import style from './style.module.css';

/**
 * Results worked out from the entries, marked not current while one is refused. Reads only the
 * refusals: the results inside follow the check result themselves.
 */
export function ResultsGuard({
  refusal,
  children,
}: {
  /** A refusal of these results alone (the lists'), beside the answer's. */
  refusal?: string;
  children: ComponentChildren;
}) {
  return (
    <NotCurrent problems={problemsAmong(RESULT_FIELDS)} refusal={checkProblem.value ?? refusal}>
      {children}
    </NotCurrent>
  );
}

/**
 * Results that follow the entries a paint behind (src/state/check/listed.ts): from a keystroke
 * until they catch up they are marked (data-behind) and a tap on them does nothing, so nothing acts on a
 * rate worked out for the set-up before. The refusals above them come at once (ResultsGuard).
 * The tap is stopped here rather than with a style: a style that changes on every keystroke
 * would restyle every list under it twice a key.
 */
export function Following({
  behind: following = listsBehind,
  keepTaps = false,
  children,
}: {
  /** Whether what is inside is behind the entries (default: the lists'). */
  behind?: ReadonlySignal<boolean>;
  /**
   * Let taps through while behind: for the pictures, whose taps act on the rate axis (which
   * only the sampler's range changes) and on the playback, never on a rate listed for the
   * set-up before.
   */
  keepTaps?: boolean;
  children: ComponentChildren;
}) {
  // Marked straight on the element as the flag flips, by a plain effect (useSignalEffect would
  // wait for the next frame): a re-render for it would cost each keystroke a render of every
  // wrapper, twice.
  const ref = useRef<HTMLDivElement>(null);
  useEffect(
    () =>
      effect(() => {
        const behind = following.value;
        const element = ref.current;
        if (!element) return;
        if (behind) element.dataset.behind = 'true';
        else delete element.dataset.behind;
      }),
    [following],
  );
  return (
    <div
      ref={ref}
      class={style.following}
      onClickCapture={(event) => {
        if (!keepTaps && following.peek()) ignore(event);
      }}
    >
      {children}
    </div>
  );
}

function ignore(event: Event): void {
  event.preventDefault();
  event.stopPropagation();
}
