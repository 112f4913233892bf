// A computed signal whose value stays the very same object while each new result equals the
// last: what reads it re-renders when the result really changes, not each time it is worked out
// afresh (a new array of the same notes, a part that differs only in what its reader leaves out).
import { computed, type ReadonlySignal } from '@preact/signals';

export function computedSame<T>(
  compute: () => T,
  same: (before: T, now: T) => boolean,
): ReadonlySignal<T> {
  let last: { value: T } | null = null;
  return computed(() => {
    const now = compute();
    if (last === null || !same(last.value, now)) last = { value: now };
    return last.value;
  });
}

/** Same length and the same items, in order (Object.is). */
export function sameItems<T>(a: readonly T[], b: readonly T[]): boolean {
  return a.length === b.length && a.every((item, i) => Object.is(item, b[i]));
}

/** The same keys, each with the same value (Object.is). */
export function sameFields<T extends object>(a: T, b: T): boolean {
  const keys = Object.keys(a) as Array<keyof T>;
  return keys.length === Object.keys(b).length && keys.every((k) => Object.is(a[k], b[k]));
}
