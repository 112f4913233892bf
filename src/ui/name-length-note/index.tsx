import { MAX_NAME_CHARS } from '../../state/validate';
import style from './style.module.css';

interface Props {
  /** The note's id, for the name field's aria-describedby (see nameNoteId). */
  id: string;
  /** The name as the field holds it now. */
  name: string;
}

/** The id of the note under the name field with id `inputId`. */
export const nameNoteId = (inputId: string): string => `${inputId}-length`;

/** True when a name field is full: its maxLength (UTF-16 units, as the browser counts) is reached. */
export const nameIsFull = (name: string): boolean => name.length >= MAX_NAME_CHARS;

/**
 * Says that a name field is full. The field's maxLength makes the browser drop the rest of a
 * longer paste without a word; this tells why the name stops where it does.
 */
export function NameLengthNote({ id, name }: Props) {
  if (!nameIsFull(name)) return null;
  return (
    <p id={id} class={style.note} role="status">
      A name holds at most {MAX_NAME_CHARS} characters; anything longer is cut there.
    </p>
  );
}
