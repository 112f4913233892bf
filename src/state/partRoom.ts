// How many parts a set-up holds: apart from validate.ts, so the part form can check for room
// without loading the readers of saved files and links.
import type { Setup } from './model';
import { DataError } from './read';

/** Most parts one set-up may hold: enough for a drive train, small enough to fit a share link. */
export const MAX_PARTS = 20;

/** Throws DataError when a set-up has no room for one more part (it holds MAX_PARTS). */
export function requirePartRoom(s: Setup): void {
  if (s.parts.length >= MAX_PARTS) {
    throw new DataError(
      'parts',
      `A set-up holds at most ${MAX_PARTS} parts; remove one before adding another.`,
    );
  }
}
