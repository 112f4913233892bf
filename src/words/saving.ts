// What a save did, in words: never "Saved" for a change that is not on the device.
import type { Outcome } from '../state/store';

/** A message for the user and whether it reports a problem. */
export interface SaveWords {
  kind: 'done' | 'problem';
  text: string;
}

/**
 * The words for a save's outcome. `done` is what a save that reached the device says
 * ('Saved as "Fan".'); the others say what really happened.
 * @example saveWords('Fan', { kind: 'saved', version: 1 }, 'Saved as "Fan".') // { kind: 'done', text: 'Saved as "Fan".' }
 */
export function saveWords(name: string, outcome: Outcome, done: string): SaveWords {
  switch (outcome.kind) {
    case 'saved':
    case 'deleted':
      return { kind: 'done', text: done };
    case 'tabOnly':
      return {
        kind: 'problem',
        text: `Kept in this tab only as "${name}": this browser offers no storage, so it is lost when the tab closes. Export your machines to keep them.`,
      };
    case 'held':
      return {
        kind: 'problem',
        text: `Not saved on this device yet: "${name}" is kept in this tab and will be saved by itself once the device takes writes again. Export your machines to be safe.`,
      };
    case 'copied':
      return {
        kind: 'problem',
        text: `Another tab saved "${outcome.theirs.machine.name}" meanwhile: both are kept, this one as "${outcome.copy.machine.name}".`,
      };
    case 'restored':
      return {
        kind: 'problem',
        text: `"${name}" had been deleted in another tab; it was saved again from here.`,
      };
    case 'kept':
      return {
        kind: 'problem',
        text: `"${outcome.theirs.machine.name}" was changed in another tab, so it was kept.`,
      };
  }
}
