// A flag that comes on at once and goes off only once things have stood still: for cautions
// that typing would otherwise flash in and out (a speed typed key by key passes through values
// that need none, 1, 17, 178, on the way to one that does).
import { computed, effect, signal, type ReadonlySignal } from '@preact/signals';
import { useEffect, useMemo } from 'preact/hooks';

/**
 * True while `flag` is true, and after it turns false until `changes` has stood unchanged for
 * `holdMs`. It only ever shows more than `flag`: it never hides what `flag` shows, and a flag
 * that comes on shows at once. The component re-renders only when the result flips.
 */
export function useHeldOn(
  flag: ReadonlySignal<boolean>,
  changes: ReadonlySignal<unknown>,
  holdMs: number,
): ReadonlySignal<boolean> {
  const state = useMemo(() => {
    const held = signal(flag.peek());
    return { held, shown: computed(() => flag.value || held.value) };
  }, []);
  useEffect(() => {
    let timer: ReturnType<typeof setTimeout> | undefined;
    const stop = effect(() => {
      const on = flag.value;
      // Read for its changes only: each one starts the wait again.
      void changes.value;
      clearTimeout(timer);
      if (on) state.held.value = true;
      else timer = setTimeout(() => (state.held.value = false), holdMs);
    });
    return () => {
      stop();
      clearTimeout(timer);
    };
  }, []);
  return state.shown;
}
