// A prop a component is handed either as a plain value or as a signal to follow. Handed a
// signal, only the small part that reads it re-renders when it changes: a flag that flips on a
// keystroke (whether the screen shows its own stillness caution) then costs that keystroke the
// caution, not the whole chart, preview or report bar around it.
import { Signal, type ReadonlySignal } from '@preact/signals';

export type Live<T> = T | ReadonlySignal<T>;

/** The value now. Read while a component renders, a signal subscribes that component alone. */
export function readLive<T>(value: Live<T>): T {
  return value instanceof Signal ? (value as ReadonlySignal<T>).value : (value as T);
}
