// What a number field and a number-list field share: the look (label, input, unit, message,
// hint) and the test of whether typed text still says the value held.
import type { ComponentChildren } from 'preact';
import { useLayoutEffect } from 'preact/hooks';
import { readField } from '../fields';
import { useFollowingText } from '../followingText';
import { reportFieldProblem } from '../../state/fieldProblems';
import style from './style.module.css';

/** Equal, or equal but for floating-point noise (a value read back from its own text). */
export function sameNumber(a: number, b: number): boolean {
  return a === b || Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b));
}

/**
 * The text of a field that holds a value read from it (one number, or a list): every keystroke
 * is read; good text goes to `onGood` (when it says another value than the one held), bad text
 * keeps its refusal beside the field and the value as it was. Text rewritten from outside
 * follows the held value unless it already says it (useFollowingText).
 * `key` names the held value, `same` compares two values, `heldText` writes the held value.
 */
export function useCheckedText<T extends number | readonly number[]>(
  held: T,
  key: string,
  read: (text: string) => T,
  same: (a: T, b: T) => boolean,
  heldText: () => string,
  onGood: (value: T) => void,
  maxChars?: number,
): { text: string; message: string | null; onInput: (event: Event) => void } {
  const { text, message, edit } = useFollowingText(
    key,
    (shown) => {
      const reading = readField(shown, read, maxChars);
      return reading.ok && same(reading.value, held);
    },
    heldText,
  );
  const onInput = (event: Event) => {
    const next = (event.currentTarget as HTMLInputElement).value;
    const reading = readField(next, read, maxChars);
    edit(next, reading.ok ? null : reading.message);
    if (reading.ok && !same(reading.value, held)) onGood(reading.value);
  };
  return { text, message, onInput };
}

interface Props {
  /** Unique id: the input's id, and the root of its message's and hint's ids. */
  id: string;
  label: ComponentChildren;
  text: string;
  onInput: (event: Event) => void;
  /** The refusal of the typed text, shown under the field; null when the text is good. */
  message: string | null;
  /** "decimal" for one number (a phone's number pad), "text" for a list with spaces and units. */
  inputMode: 'decimal' | 'text';
  unit?: ComponentChildren;
  hint?: ComponentChildren;
  disabled?: boolean;
  /**
   * The field's name where a result says "fix …" (src/state/fieldProblems.ts): the label when
   * it is plain text, unless the label alone is ambiguous on its page ("Speed" of which part).
   */
  name?: string;
}

/**
 * Keeps the page's list of refused fields (src/state/fieldProblems.ts) in step with a field:
 * listed under `id` with its `name` while `message` says its text is refused, gone when the
 * text is good again, is rewritten from outside, or the field leaves the page. A layout effect
 * runs before the browser paints, so no painted frame shows a result that this field's refused
 * text has already made stale.
 */
export function useReportedProblem(id: string, name: string, message: string | null): void {
  useLayoutEffect(() => {
    reportFieldProblem(id, message ? { label: name, message } : null);
  }, [id, name, message]);
  useLayoutEffect(() => () => reportFieldProblem(id, null), [id]);
}

/**
 * A labelled text input with its unit, its refusal message and a help line, tied by aria.
 * While its text is refused it says so in the page's list of refused fields, so every result
 * worked out from its last good value can be withdrawn; the entry goes when the text is good
 * again, is rewritten from outside, or the field leaves the page.
 */
export function TextField({
  id,
  label,
  text,
  onInput,
  message,
  inputMode,
  unit,
  hint,
  disabled,
  name,
}: Props) {
  useReportedProblem(id, name ?? (typeof label === 'string' ? label : id), message);
  const messageId = `${id}-message`;
  const hintId = `${id}-hint`;
  const describedBy =
    [message ? messageId : '', hint ? hintId : ''].filter(Boolean).join(' ') || undefined;
  return (
    <div class={style.field}>
      <label class={style.label} for={id}>
        {label}
      </label>
      <div class={style.row}>
        <div class={style.control}>
          <div class={style.box}>
            <input
              id={id}
              class={style.input}
              type="text"
              inputMode={inputMode}
              autoComplete="off"
              spellcheck={false}
              value={text}
              onInput={onInput}
              aria-invalid={message ? 'true' : undefined}
              aria-describedby={describedBy}
              disabled={disabled}
            />
          </div>
        </div>
        {unit !== undefined && <span class={style.unit}>{unit}</span>}
      </div>
      {message && (
        <p id={messageId} class={style.message} role="alert">
          {message}
        </p>
      )}
      {hint && (
        <p id={hintId} class={style.hint}>
          {hint}
        </p>
      )}
    </div>
  );
}
