import type { ComponentChildren } from 'preact';

import { sameNumber, TextField, useCheckedText } from './text-field';

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
  /** The field's name in a "fix …" note, when the label alone is ambiguous on its page. */
  name?: string;
  /** Changes when the unit changes, so the text is rewritten in the new unit. */
  unitKey?: string;
  disabled?: boolean;
}

/**
 * A number field that checks every keystroke: good text goes straight to the set-up, bad
 * text gets a message beside the field and leaves the set-up (and the results) as they were.
 * When the set-up changes from elsewhere (a tapped suggestion, an opened machine), the text
 * follows unless it already says the same value.
 */
export function NumberField({
  id,
  label,
  value,
  toText,
  read,
  onValue,
  unit,
  hint,
  unitKey,
  disabled,
  name,
}: Props) {
  const { text, message, onInput } = useCheckedText(
    value,
    `${value} ${unitKey ?? ''}`,
    read,
    sameNumber,
    () => toText(value),
    onValue,
  );

  return (
    <TextField
      id={id}
      label={label}
      text={text}
      onInput={onInput}
      message={message}
      inputMode="decimal"
      unit={unit}
      hint={hint}
      disabled={disabled}
      name={name}
    />
  );
}
