import type { ComponentChildren } from 'preact';
import { MAX_LIST_CHARS } from '../fields';
// The same look as a single number field.
import { sameNumber, TextField, useCheckedText } from '../number-field/text-field';

interface Props {
  /** Unique id: the input's id, and the root of its message's id. */
  id: string;
  label: ComponentChildren;
  /** The values held now. */
  values: readonly number[];
  /** How one value is written in the field. */
  toText: (value: number) => string;
  /** Reads the whole typed list, throwing the core's InputError for bad text (see src/ui/toolFields.ts readList). */
  read: (text: string) => number[];
  /** Called with each good list as it is typed. */
  onValues: (values: number[]) => void;
  unit?: ComponentChildren;
  hint?: ComponentChildren;
  /** The field's name in a "fix …" note, when the label alone is ambiguous on its page. */
  name?: string;
}

function sameList(a: readonly number[], b: readonly number[]): boolean {
  return a.length === b.length && a.every((x, i) => sameNumber(x, b[i]));
}

/**
 * A field holding a list of numbers ("24 25 30"), checked at every keystroke like a single
 * number field: a good list goes straight through, bad text gets a message beside the field and
 * leaves the list (and the results) as they were.
 */
export function NumberListField({
  id,
  label,
  values,
  toText,
  read,
  onValues,
  unit,
  hint,
  name,
}: Props) {
  // Keyed on the numbers, not the array, which a caller may rebuild at every render.
  const { text, message, onInput } = useCheckedText<readonly number[]>(
    values,
    values.join(' '),
    read,
    sameList,
    () => values.map(toText).join(' '),
    (list) => onValues([...list]),
    MAX_LIST_CHARS,
  );

  return (
    <TextField
      id={id}
      label={label}
      text={text}
      onInput={onInput}
      message={message}
      inputMode="text"
      unit={unit}
      hint={hint}
      name={name}
    />
  );
}
