// Text a person edits in a field that also follows a value held elsewhere (the set-up).
import { useCallback, useRef, useState } from 'preact/hooks';

export interface FollowingText {
  /** What the field shows. */
  text: string;
  /** The refusal of the typed text, or null when it is good (or was rewritten from outside). */
  message: string | null;
  /** A keystroke: the field now shows `text`, with its refusal if any. */
  edit: (text: string, message: string | null) => void;
}

/**
 * The field's text, rewritten in the same render when the value held elsewhere changes (a
 * tapped suggestion, an opened machine, a unit switch), unless the text already says that value.
 * Done while rendering, not in an effect, so the field and every result computed from the value
 * never disagree on screen, not even for one painted frame.
 *
 * `outsideKey` names the held value (its numbers, its unit): a new key is an outside change.
 * `saysHeld(text)` tells whether typed text already reads as the held value; `heldText()`
 * writes the held value as text.
 */
export function useFollowingText(
  outsideKey: string,
  saysHeld: (text: string) => boolean,
  heldText: () => string,
): FollowingText {
  const [, rerender] = useState(0);
  const field = useRef<{ key: string; text: string; message: string | null } | null>(null);
  if (field.current === null) {
    field.current = { key: outsideKey, text: heldText(), message: null };
  } else if (field.current.key !== outsideKey) {
    const keep = saysHeld(field.current.text);
    field.current = keep
      ? { ...field.current, key: outsideKey }
      : { key: outsideKey, text: heldText(), message: null };
  }
  const edit = useCallback((text: string, message: string | null) => {
    field.current = { ...field.current!, text, message };
    rerender((n) => n + 1);
  }, []);
  return { text: field.current.text, message: field.current.message, edit };
}
