import type { ComponentChildren } from 'preact';
import { useEffect, useState } from 'preact/hooks';
import { readField } from '../../lib/fields';
import style from './style.module.css';

interface Props {
  /** Unique id: the input's id, and the root of its message's id. */
  id: string;
  label: ComponentChildren;
  /** The value the set-up holds now, in the set-up's units. */
  value: number;
  /** The text that shows `value` in this field (in the unit currently chosen). */
  toText: (value: number) => string;
  /** Reads typed text into a value, throwing the core's InputError for bad text. */
  read: (text: string) => number;
  /** Called with each good value as it is typed. */
  onValue: (value: number) => void;
  /** A unit word or a unit chooser shown after the input. */
  unit?: ComponentChildren;
  /** A short help line under the field. */
  hint?: ComponentChildren;
  /** Changes when the unit changes, so the text is rewritten in the new unit. */
  unitKey?: string;
  disabled?: boolean;
}

function sameValue(a: number, b: number): boolean {
  return a === b || Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b));
}

/**
 * A number field that checks every keystroke: good text goes straight to the set-up, bad
 * text gets a message beside the field and leaves the set-up (and the results) as they were.
 * When the set-up changes from elsewhere (a tapped suggestion, an opened machine), the text
 * follows unless it already says the same value.
 */
export function NumberField({ id, label, value, toText, read, onValue, unit, hint, unitKey, disabled }: Props) {
  const [text, setText] = useState(() => toText(value));
  const [message, setMessage] = useState<string | null>(null);

  useEffect(() => {
    const reading = readField(text, read);
    if (!(reading.ok && sameValue(reading.value, value))) {
      setText(toText(value));
      setMessage(null);
    }
    // Only an outside change of the value or the unit rewrites the text, never a keystroke.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [value, unitKey]);

  const onInput = (event: Event) => {
    const next = (event.currentTarget as HTMLInputElement).value;
    setText(next);
    const reading = readField(next, read);
    if (reading.ok) {
      setMessage(null);
      if (!sameValue(reading.value, value)) onValue(reading.value);
    } else {
      setMessage(reading.message);
    }
  };

  const messageId = `${id}-message`;
  const hintId = `${id}-hint`;
  const describedBy = [message ? messageId : '', hint ? hintId : ''].filter(Boolean).join(' ') || undefined;
  return (
    <div class={style.field}>
      <label class={style.label} for={id}>
        {label}
      </label>
      <div class={style.row}>
        <input
          id={id}
          class={style.input}
          type="text"
          inputMode="decimal"
          autoComplete="off"
          spellcheck={false}
          value={text}
          onInput={onInput}
          aria-invalid={message ? 'true' : undefined}
          aria-describedby={describedBy}
          disabled={disabled}
        />
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
