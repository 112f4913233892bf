// The parts of the current set-up as a list: choose which one the screens work on, add one,
// remove one, rename one. The per-field setters of the chosen part live in setup.ts; these
// only change the list, and every change goes through the same checks as a saved file.
import { editChain, withoutPart } from './driveChain';
import { activePartOf, newPartLike } from './model';
import { setup } from './setup';
import { DataError, MAX_NAME_CHARS, requirePartRoom, validateSetup } from './validate';

/** Makes part `index` the one the screens work on. Ignores an index outside the list. */
export function selectPart(index: number): void {
  const s = setup.value;
  if (!Number.isInteger(index) || index < 0 || index >= s.parts.length || index === s.activePart)
    return;
  setup.value = { ...s, activePart: index };
}

/**
 * Adds a part after the others and chooses it. It starts as a single mark on the same shaft
 * speed and tolerance as the chosen part, which the user then edits.
 * Throws DataError, changing nothing, when the set-up already holds MAX_PARTS parts.
 */
export function addPart(): void {
  const s = setup.value;
  requirePartRoom(s);
  const part = newPartLike(s.parts, activePartOf(s));
  setup.value = { ...s, parts: [...s.parts, part], activePart: s.parts.length };
}

/**
 * Removes part `index`, as the whole-machine screen does (chain.ts withoutPart): parts it drove
 * keep the speed they had as a typed speed, later drives follow their driver's new place, and
 * the chosen part stays chosen (or its neighbour, when it was the one removed).
 * Throws DataError, changing nothing, for the last remaining part or an unknown index.
 */
export function removePart(index: number): void {
  editChain((s) => withoutPart(s, index));
}

/**
 * Renames part `index`. Throws DataError, changing nothing, for a name a saved file would
 * refuse (too long, control or direction characters) or an unknown index.
 */
export function renamePart(index: number, name: string): void {
  const s = setup.value;
  if (!Number.isInteger(index) || index < 0 || index >= s.parts.length) {
    throw new DataError('parts', 'That part is no longer in the list.');
  }
  const chars = [...name].length;
  if (chars > MAX_NAME_CHARS) {
    throw new DataError(
      'name',
      `A part's name holds at most ${MAX_NAME_CHARS} characters (this one has ${chars}).`,
    );
  }
  const next = { ...s, parts: s.parts.map((p, i) => (i === index ? { ...p, name } : p)) };
  try {
    validateSetup(next);
  } catch (error) {
    if (!(error instanceof DataError)) throw error;
    throw new DataError(
      'name',
      "A part's name must be plain text on one line, without control or direction characters.",
    );
  }
  setup.value = next;
}
