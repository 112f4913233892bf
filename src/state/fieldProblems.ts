// Fields whose text cannot be read right now. A result worked out from the last good value of
// such a field is no longer what the user is looking at, so it must be withdrawn where it stands
// (docs/physics.md §10). Every number field reports here under its id; screens ask for the fields
// their answer depends on.
import { signal, type ReadonlySignal } from '@preact/signals';

/** A field whose text is refused: its id (the input's), its name in words, and the refusal. */
export interface FieldProblem {
  id: string;
  /** The field's label, as a person finds it on screen ("Speed", "Flash rate"). */
  label: string;
  message: string;
}

const problems = signal<readonly FieldProblem[]>([]);

/** Every field refused right now, in the order they were first refused. */
export const fieldProblems: ReadonlySignal<readonly FieldProblem[]> = problems;

/**
 * Records that the field `id` holds text it cannot read (`problem`), or no longer does (null).
 * Only a real change writes the signal, so a field re-reporting the same refusal wakes nothing.
 */
export function reportFieldProblem(
  id: string,
  problem: { label: string; message: string } | null,
): void {
  const now = problems.peek();
  const at = now.findIndex((p) => p.id === id);
  if (problem === null) {
    if (at >= 0) problems.value = now.filter((p) => p.id !== id);
    return;
  }
  const entry: FieldProblem = { id, label: problem.label, message: problem.message };
  if (at < 0) {
    problems.value = [...now, entry];
  } else if (now[at].label !== entry.label || now[at].message !== entry.message) {
    problems.value = now.map((p, i) => (i === at ? entry : p));
  }
}

/**
 * The refused fields among `ids`, or every refused field when `ids` is left out (a tool screen
 * whose answer depends on every field it shows: only one screen is on the page at a time).
 * Reads the signal, so a component or computed that calls it follows the fields.
 */
export function problemsAmong(ids?: readonly string[]): FieldProblem[] {
  const all = problems.value;
  return ids === undefined ? [...all] : all.filter((p) => ids.includes(p.id));
}

/** Forgets every refusal (a test's fresh start). */
export function clearFieldProblems(): void {
  problems.value = [];
}
