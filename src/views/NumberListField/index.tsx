import type { ComponentChildren } from 'preact';
import { useEffect, useState } from 'preact/hooks';
import { InputError } from '../../core';
// The same look as a single number field.
import style from '../NumberField/style.module.css';

interface Props {
  /** Unique id: the input's id, and the root of its message's id. */
  id: string;
  label: ComponentChildren;
  /** The values held now. */
  values: readonly number[];
  /** How one value is written in the field. */
  toText: (value: number) => string;
  /** Reads the whole typed list, throwing the core's InputError for bad text (see lib/toolFields readList). */
  read: (text: string) => number[];
  /** Called with each good list as it is typed. */
  onValues: (values: number[]) => void;
  unit?: ComponentChildren;
  hint?: ComponentChildren;
}

function sameList(a: readonly number[], b: readonly number[]): boolean {
  return (
    a.length === b.length &&
    a.every(
      (x, i) => x === b[i] || Math.abs(x - b[i]) <= 1e-9 * Math.max(Math.abs(x), Math.abs(b[i])),
    )
  );
}

type Reading = { ok: true; values: number[] } | { ok: false; message: string };

function readText(text: string, read: (text: string) => number[]): Reading {
  try {
    const values = read(text);
    if (!values.every(Number.isFinite))
      return { ok: false, message: 'This gives no usable number.' };
    return { ok: true, values };
  } catch (error) {
    if (error instanceof InputError)
      return { ok: false, message: error.message.charAt(0).toUpperCase() + error.message.slice(1) };
    throw error;
  }
}

/**
 * A field holding a list of numbers ("24 25 30"), checked at every keystroke like a single
 * number field: a good list goes straight through, bad text gets a message beside the field and
 * leaves the list (and the results) as they were.
 */
export function NumberListField({ id, label, values, toText, read, onValues, unit, hint }: Props) {
  const [text, setText] = useState(() => values.map(toText).join(' '));
  const [message, setMessage] = useState<string | null>(null);

  useEffect(() => {
    const reading = readText(text, read);
    if (!(reading.ok && sameList(reading.values, values))) {
      setText(values.map(toText).join(' '));
      setMessage(null);
    }
    // Only an outside change of the list rewrites the text, never a keystroke. Keyed on the
    // numbers, not the array, which a caller may rebuild at every render.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [values.join(' ')]);

  const onInput = (event: Event) => {
    const next = (event.currentTarget as HTMLInputElement).value;
    setText(next);
    const reading = readText(next, read);
    if (reading.ok) {
      setMessage(null);
      if (!sameList(reading.values, values)) onValues(reading.values);
    } else {
      setMessage(reading.message);
    }
  };

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
        <input
          id={id}
          class={style.input}
          type="text"
          inputMode="text"
          autoComplete="off"
          spellcheck={false}
          value={text}
          onInput={onInput}
          aria-invalid={message ? 'true' : undefined}
          aria-describedby={describedBy}
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
