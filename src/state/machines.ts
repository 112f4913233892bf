// Kept whole (over 300 lines): every action on the saved list follows the same pattern (check,
// change, wait for the write) around one list signal and one write queue.
// The saved machines, as signals the screens read, and the actions that change them. Every
// action checks its input first (DataError, nothing changed), then updates the list and waits
// until the whole list is written; a storage failure keeps the change in memory and is reported
// through `storageMessage`, so no machine is ever lost to a failed write.

import { signal } from '@preact/signals';
import { createExampleMachine } from './example';
import { exportMachinesJson, MAX_MACHINES, parseMachinesFile } from './fileFormat';
import type { Machine, Setup } from './model';
import { openStore, readSavedMachines, reportStorageProblem, writeSavedMachines } from './storage';
import {
  DataError,
  MAX_NAME_CHARS,
  MAX_NOTES_CHARS,
  validateMachine,
  validateMachineName,
  validateSetup,
} from './validate';

export { storageMessage, storageStatus } from './storage';

/** The saved machines, sorted by name (then by creation time). Replace, never mutate. */
export const machines = signal<Machine[]>([]);

/** The last deleted machine and where it stood in the list, until undone or forgotten. */
export interface DeletedMachine {
  machine: Machine;
  /** Its index in `machines` just before it was deleted. */
  position: number;
}

/**
 * The last deletion that can still be undone (null = none). A new deletion replaces it; the UI
 * calls forgetDeleted() when its undo offer expires.
 */
export const lastDeleted = signal<DeletedMachine | null>(null);

const collator = new Intl.Collator(undefined, { numeric: true, sensitivity: 'base' });

function byName(a: Machine, b: Machine): number {
  return (
    collator.compare(a.name, b.name) ||
    a.createdAt.localeCompare(b.createdAt) ||
    a.id.localeCompare(b.id)
  );
}

function setList(list: readonly Machine[]): void {
  machines.value = [...list].sort(byName);
}

/** Names compare without regard to case or surrounding spaces: "Fan" and " fan" clash. */
function nameKey(name: string): string {
  return name.trim().normalize('NFC').toLowerCase();
}

/**
 * `base`, or `base` with the first free suffix ("Fan copy", "Fan copy 2", …), kept within the
 * longest allowed name by shortening `base`.
 */
export function uniqueName(
  base: string,
  taken: ReadonlySet<string>,
  suffix: (n: number) => string,
): string {
  if (!taken.has(nameKey(base))) return base;
  for (let n = 1; ; n++) {
    const end = suffix(n);
    const room = MAX_NAME_CHARS - [...end].length;
    const candidate = [...base].slice(0, room).join('').trimEnd() + end;
    if (!taken.has(nameKey(candidate))) return candidate;
  }
}

function takenNames(list: readonly Machine[], exceptId?: string): Set<string> {
  return new Set(list.filter((m) => m.id !== exceptId).map((m) => nameKey(m.name)));
}

const nowIso = (): string => new Date().toISOString();

let counter = 0;

/**
 * A new machine id: crypto.randomUUID when the browser offers it (secure pages only), else a
 * random version-4 UUID from crypto.getRandomValues, else time, Math.random and a counter.
 * `source` defaults to the global crypto.
 */
export function newId(
  source: Partial<Pick<Crypto, 'randomUUID' | 'getRandomValues'>> | undefined = globalThis.crypto,
): string {
  if (source && typeof source.randomUUID === 'function') return source.randomUUID();
  if (source && typeof source.getRandomValues === 'function') {
    const b = source.getRandomValues(new Uint8Array(16));
    // RFC 4122 §4.4: version 4 in the high nibble of byte 6, variant 10xx in byte 8.
    b[6] = (b[6] & 0x0f) | 0x40;
    b[8] = (b[8] & 0x3f) | 0x80;
    const hex = [...b].map((x) => x.toString(16).padStart(2, '0')).join('');
    return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-${hex.slice(12, 16)}-${hex.slice(16, 20)}-${hex.slice(20)}`;
  }
  counter += 1;
  return `m-${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 10)}-${counter}`;
}

// Writes go one after another, each with the whole list as it stood when it was made, so the
// last write always holds every change.
let writes: Promise<unknown> = Promise.resolve();
let loaded: Promise<void> | null = null;

function persist(): Promise<boolean> {
  const snapshot = machines.value;
  const done = writes.then(() => writeSavedMachines(snapshot));
  writes = done.catch(() => undefined);
  return done.catch((e: unknown) => {
    reportStorageProblem(
      `The machines could not be saved (${e instanceof Error ? e.message : String(e)}).`,
    );
    return false;
  });
}

/** Loads the list once before the first change, so a change never writes over unloaded machines. */
function ready(): Promise<void> {
  loaded ??= loadMachines();
  return loaded;
}

/**
 * Reads the saved machines into `machines` (again, if called again). On the very first run,
 * when nothing was ever saved here, adds the example machine and saves it. Never rejects.
 */
export function loadMachines(): Promise<void> {
  const run = (async () => {
    try {
      await writes;
      await openStore();
      const saved = await readSavedMachines();
      if (saved === null) {
        setList([createExampleMachine(newId(), nowIso())]);
        await persist();
      } else {
        setList(saved);
      }
    } catch (e) {
      // Not expected (storage reports its own problems); keep whatever list is on screen.
      reportStorageProblem(
        `Saved machines could not be loaded (${e instanceof Error ? e.message : String(e)}).`,
      );
    }
  })();
  loaded = run;
  return run;
}

function find(id: string): Machine {
  const m = machines.value.find((x) => x.id === id);
  if (!m) throw new DataError('id', 'That machine is no longer in the saved list.');
  return m;
}

function requireRoom(adding: number): void {
  if (machines.value.length + adding > MAX_MACHINES) {
    throw new DataError(
      'machines',
      `At most ${MAX_MACHINES} machines can be saved; delete some before adding more.`,
    );
  }
}

function requireFreeName(name: string, exceptId?: string): void {
  if (takenNames(machines.value, exceptId).has(nameKey(name))) {
    throw new DataError(
      'name',
      `A machine called "${name}" is already saved; choose another name.`,
    );
  }
}

/** Replaces one machine in the list by a checked copy of `next`, then saves. */
async function replace(next: Machine): Promise<Machine> {
  const clean = validateMachine(next);
  setList(machines.value.map((m) => (m.id === clean.id ? clean : m)));
  await persist();
  return clean;
}

/**
 * Saves `setup` as a new machine called `name` (surrounding spaces removed) and returns it.
 * Throws DataError, changing nothing, for a blank, too long or already used name, an invalid
 * set-up, or a full list.
 */
export async function saveMachine(name: string, setup: Setup, notes = ''): Promise<Machine> {
  await ready();
  const cleanName = validateMachineName(name);
  requireFreeName(cleanName);
  requireRoom(1);
  const now = nowIso();
  const machine = validateMachine({
    id: newId(),
    name: cleanName,
    setup: validateSetup(setup),
    createdAt: now,
    updatedAt: now,
    notes,
  });
  setList([...machines.value, machine]);
  await persist();
  return machine;
}

/** Stores `setup` in the machine with this id. Throws DataError for an unknown id or bad set-up. */
export async function updateMachine(id: string, setup: Setup): Promise<Machine> {
  await ready();
  const m = find(id);
  return replace({ ...m, setup: validateSetup(setup), updatedAt: nowIso() });
}

/** Renames a machine. Throws DataError for an unknown id, or a blank, too long or used name. */
export async function renameMachine(id: string, name: string): Promise<Machine> {
  await ready();
  const m = find(id);
  const cleanName = validateMachineName(name);
  requireFreeName(cleanName, id);
  return replace({ ...m, name: cleanName, updatedAt: nowIso() });
}

/**
 * Replaces a machine's crew notes (at most MAX_NOTES_CHARS characters, line breaks allowed).
 * Throws DataError for an unknown id or unacceptable text.
 */
export async function setMachineNotes(id: string, notes: string): Promise<Machine> {
  await ready();
  const m = find(id);
  if (typeof notes === 'string' && [...notes].length > MAX_NOTES_CHARS) {
    throw new DataError('notes', `Notes can hold at most ${MAX_NOTES_CHARS} characters.`);
  }
  return replace({ ...m, notes, updatedAt: nowIso() });
}

/** Saves a copy of a machine as "<name> copy" (or "… copy 2", …) and returns the copy. */
export async function duplicateMachine(id: string): Promise<Machine> {
  await ready();
  const m = find(id);
  requireRoom(1);
  const name = uniqueName(m.name, takenNames(machines.value), (n) =>
    n === 1 ? ' copy' : ` copy ${n}`,
  );
  const now = nowIso();
  const copy = validateMachine({ ...m, id: newId(), name, createdAt: now, updatedAt: now });
  setList([...machines.value, copy]);
  await persist();
  return copy;
}

/**
 * Deletes a machine and keeps it in `lastDeleted` so undoDelete() can bring it back.
 * Resolves false when no machine has this id (already deleted).
 */
export async function deleteMachine(id: string): Promise<boolean> {
  await ready();
  const position = machines.value.findIndex((m) => m.id === id);
  if (position < 0) return false;
  lastDeleted.value = { machine: machines.value[position], position };
  setList(machines.value.filter((m) => m.id !== id));
  await persist();
  return true;
}

/**
 * Brings back the last deleted machine (renamed "… (restored)" if its name was taken since)
 * and returns it; null when there is nothing to undo.
 */
export async function undoDelete(): Promise<Machine | null> {
  await ready();
  const deleted = lastDeleted.value;
  if (!deleted) return null;
  const already = machines.value.find((m) => m.id === deleted.machine.id);
  if (already) {
    lastDeleted.value = null;
    return already;
  }
  requireRoom(1);
  lastDeleted.value = null;
  const name = uniqueName(deleted.machine.name, takenNames(machines.value), (n) =>
    n === 1 ? ' (restored)' : ` (restored ${n})`,
  );
  const restored = validateMachine({ ...deleted.machine, name });
  const list = [...machines.value];
  list.splice(Math.min(deleted.position, list.length), 0, restored);
  setList(list);
  await persist();
  return restored;
}

/** Drops the undo offer for the last deletion (the UI's undo time ran out). */
export function forgetDeleted(): void {
  lastDeleted.value = null;
}

/** Outcome of an import: the machines added (with names changed to avoid clashes), or why not. */
export type ImportResult =
  | { ok: true; added: Machine[]; renamed: Array<{ from: string; to: string }> }
  | { ok: false; error: string };

/**
 * Adds every machine of a machines file (see parseMachinesFile), each with a new id; a name
 * already in use becomes "<name> (imported)". All or nothing: a refused file, or one that would
 * take the list over MAX_MACHINES, changes nothing. Never rejects.
 */
export async function importMachines(text: string): Promise<ImportResult> {
  await ready();
  const parsed = parseMachinesFile(text);
  if (!parsed.ok) return parsed;
  const room = MAX_MACHINES - machines.value.length;
  if (parsed.machines.length > room) {
    return {
      ok: false,
      error: `This file holds ${parsed.machines.length} machines but only ${room} more can be saved (at most ${MAX_MACHINES}); nothing was imported.`,
    };
  }
  const taken = takenNames(machines.value);
  const renamed: Array<{ from: string; to: string }> = [];
  const added = parsed.machines.map((m) => {
    const name = uniqueName(m.name, taken, (n) => (n === 1 ? ' (imported)' : ` (imported ${n})`));
    taken.add(nameKey(name));
    if (name !== m.name) renamed.push({ from: m.name, to: name });
    return validateMachine({ ...m, id: newId(), name });
  });
  setList([...machines.value, ...added]);
  await persist();
  return { ok: true, added, renamed };
}

/**
 * All saved machines as a machines file (docs/file-format.md).
 * Throws DataError when they are too many or too large for one file.
 */
export function exportAll(): string {
  return exportMachinesJson(machines.value);
}
