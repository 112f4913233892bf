// Kept whole (over 300 lines): every action on the saved list follows the same pattern (check,
// change the list, hand the change to the store, hear back) around one list signal.
// The saved machines, as signals the screens read, and the actions that change them. Every
// action checks its input first (DataError, nothing changed), then changes the list on screen
// and hands the change to the store (src/state/store), which writes it over the version it was
// made from. What the store says back (saved, held in this tab, kept as a copy beside another
// tab's change) comes back with the result, so no screen ever says "Saved" for a change that is
// not on the device.

import { batch, signal } from '@preact/signals';
import { createExampleMachine } from './example';
import { exportMachinesJson, MAX_MACHINES, parseMachinesFile } from './fileFormat';
import { newId } from './ids';
import { contentOf, type Machine, type MachineContent } from './model';
import {
  commit,
  heldIds,
  listen,
  loadAll,
  openStore,
  reportStorageProblem,
  type Change,
  type Outcome,
  type StoredMachine,
  type WorkRecord,
} from './store';
import {
  DataError,
  MAX_NAME_CHARS,
  MAX_NOTES_CHARS,
  validateMachine,
  validateMachineName,
} from './validate';

export { heldIds, storageMessage, storageStatus } from './store';
export { newId } from './ids';

/** The saved machines, sorted by name (then by creation time). Replace, never mutate. */
export const machines = signal<Machine[]>([]);

/** The version on the device each listed machine was read or last written as. */
const versions = new Map<string, number>();

/** The version of a listed machine on the device, or null when it is not there (yet). */
export function versionOf(id: string): number | null {
  return versions.get(id) ?? null;
}

/** The last deleted machine and where it stood in the list, until undone or forgotten. */
export interface DeletedMachine {
  machine: Machine;
  /** Its index in `machines` just before it was deleted. */
  position: number;
}

/** The last deletion that can still be undone (null = none). */
export const lastDeleted = signal<DeletedMachine | null>(null);

/**
 * The last time two tabs changed the same machine at once: both were kept, this tab's change
 * as `copy` (the working copy follows it when it was the open machine).
 */
export const lastConflict = signal<{ id: string; copy: Machine } | null>(null);

/** The last change of this tab that reached the device (the working copy follows its version). */
export const lastSettled = signal<{ id: string; version: number } | null>(null);

/** A saving action's result: the machine as saved, and what the store did with it. */
export interface SaveResult {
  machine: Machine;
  outcome: Outcome;
}

// Made on the first sort, not as the session opens: building a collator takes milliseconds on a
// phone.
let collator: Intl.Collator | undefined;

function byName(a: Machine, b: Machine): number {
  collator ??= new Intl.Collator(undefined, { numeric: true, sensitivity: 'base' });
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

listen({
  held: () => machines.peek().map((m) => ({ version: versions.get(m.id) ?? 1, machine: m })),
  settled,
  remoteChange: () => void refresh(),
});

/** What the store finally did with a change (at once, or when a held change reached the device). */
function settled(id: string, outcome: Outcome): void {
  if (outcome.kind === 'saved' || outcome.kind === 'tabOnly' || outcome.kind === 'restored') {
    versions.set(id, outcome.version);
    lastSettled.value = { id, version: outcome.version };
  }
  if (outcome.kind === 'deleted') versions.delete(id);
  if (outcome.kind === 'restored') {
    const name = machines.peek().find((m) => m.id === id)?.name ?? 'A machine';
    reportStorageProblem(
      `"${name}" had been deleted in another tab; your change here brought it back.`,
    );
  }
  if (outcome.kind === 'copied') {
    const { theirs, copy } = outcome;
    versions.set(id, theirs.version);
    versions.set(copy.machine.id, copy.version);
    setList([
      ...machines.peek().filter((m) => m.id !== id && m.id !== copy.machine.id),
      theirs.machine,
      copy.machine,
    ]);
    lastConflict.value = { id, copy: copy.machine };
    reportStorageProblem(
      `Another tab saved "${theirs.machine.name}" while it was changed here: both are kept, this tab's version as "${copy.machine.name}".`,
    );
  }
  if (outcome.kind === 'kept') {
    versions.set(id, outcome.theirs.version);
    setList([...machines.peek().filter((m) => m.id !== id), outcome.theirs.machine]);
    reportStorageProblem(
      `"${outcome.theirs.machine.name}" was changed in another tab, so it was not deleted here.`,
    );
  }
}

async function send(changes: Change[]): Promise<Outcome[]> {
  return commit(changes);
}

let loaded: Promise<void> | null = null;

/** Loads the list once before the first change, so a change never starts from an unread list. */
function ready(): Promise<void> {
  loaded ??= loadMachines();
  return loaded;
}

/**
 * Reads the saved machines into `machines` (again, if called again). On the very first run,
 * when nothing was ever saved on this device, adds the example machine. Never rejects.
 */
export function loadMachines(): Promise<void> {
  const run = (async () => {
    await openStore();
    const found = await loadAll();
    if (!found.read) return;
    if (found.firstRun && found.machines.length === 0 && machines.peek().length === 0) {
      const example = createExampleMachine(newId(), nowIso());
      setList([example]);
      await send([{ id: example.id, machine: example, base: null }]);
      return;
    }
    adopt(found.machines);
  })();
  loaded = run;
  return run;
}

/** Reads the list again after another tab changed it; changes held here stay as they are. */
export async function refresh(): Promise<void> {
  const found = await loadAll();
  if (found.read) adopt(found.machines);
}

/** Takes the machines on the device as the list, keeping this tab's held changes over them. */
function adopt(stored: readonly StoredMachine[]): void {
  const held = heldIds.peek();
  const local = new Map(machines.peek().map((m) => [m.id, m]));
  const list: Machine[] = [];
  const seen = new Set<string>();
  for (const s of stored) {
    seen.add(s.machine.id);
    if (held.has(s.machine.id)) {
      const mine = local.get(s.machine.id);
      if (mine) list.push(mine);
      continue;
    }
    versions.set(s.machine.id, s.version);
    list.push(s.machine);
  }
  for (const id of held) {
    const mine = local.get(id);
    if (mine && !seen.has(id)) list.push(mine);
  }
  for (const id of [...versions.keys()]) if (!seen.has(id) && !held.has(id)) versions.delete(id);
  setList(list);
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

/** Replaces one machine in the list by a checked copy of `next`, made from version `base`. */
async function replace(next: Machine, base: number | null): Promise<SaveResult> {
  const clean = validateMachine(next);
  setList(machines.value.map((m) => (m.id === clean.id ? clean : m)));
  const [outcome] = await send([{ id: clean.id, machine: clean, base }]);
  return { machine: clean, outcome };
}

/**
 * Saves `content` as a new machine called `name` (surrounding spaces removed). Throws
 * DataError, changing nothing, for a blank, too long or already used name, invalid content, or
 * a full list.
 */
export async function saveMachine(name: string, content: MachineContent): Promise<SaveResult> {
  await ready();
  const cleanName = validateMachineName(name);
  requireFreeName(cleanName);
  requireRoom(1);
  const now = nowIso();
  const machine = validateMachine({
    id: newId(),
    ...contentOf(content),
    name: cleanName,
    createdAt: now,
    updatedAt: now,
  });
  setList([...machines.value, machine]);
  const [outcome] = await send([{ id: machine.id, machine, base: null }]);
  return { machine, outcome };
}

/**
 * Stores `content` in the machine with this id, made from version `base` (the version the
 * working copy opened; another tab's save since then keeps both). The name is checked like a
 * rename. Throws DataError for an unknown id, a used name or invalid content.
 */
export async function updateMachine(
  id: string,
  content: MachineContent,
  base: number | null = versionOf(id),
): Promise<SaveResult> {
  await ready();
  const m = find(id);
  const name = validateMachineName(content.name);
  requireFreeName(name, id);
  return replace({ ...m, ...contentOf(content), name, updatedAt: nowIso() }, base);
}

/** Renames a machine. Throws DataError for an unknown id, or a blank, too long or used name. */
export async function renameMachine(id: string, name: string): Promise<SaveResult> {
  await ready();
  const m = find(id);
  const cleanName = validateMachineName(name);
  requireFreeName(cleanName, id);
  return replace({ ...m, name: cleanName, updatedAt: nowIso() }, versionOf(id));
}

/**
 * Replaces a machine's crew notes (at most MAX_NOTES_CHARS characters, line breaks allowed).
 * Throws DataError for an unknown id or unacceptable text.
 */
export async function setMachineNotes(id: string, notes: string): Promise<SaveResult> {
  await ready();
  const m = find(id);
  if (typeof notes === 'string' && [...notes].length > MAX_NOTES_CHARS) {
    throw new DataError('notes', `Notes can hold at most ${MAX_NOTES_CHARS} characters.`);
  }
  return replace({ ...m, notes, updatedAt: nowIso() }, versionOf(id));
}

/** Saves a copy of a machine as "<name> copy" (or "… copy 2", …) and returns the copy. */
export async function duplicateMachine(id: string): Promise<SaveResult> {
  await ready();
  const m = find(id);
  requireRoom(1);
  const name = uniqueName(m.name, takenNames(machines.value), (n) =>
    n === 1 ? ' copy' : ` copy ${n}`,
  );
  const now = nowIso();
  const copy = validateMachine({ ...m, id: newId(), name, createdAt: now, updatedAt: now });
  setList([...machines.value, copy]);
  const [outcome] = await send([{ id: copy.id, machine: copy, base: null }]);
  return { machine: copy, outcome };
}

/**
 * Deletes a machine and keeps it in `lastDeleted` so undoDelete() can bring it back.
 * Resolves false when no machine has this id (already deleted).
 */
export async function deleteMachine(id: string): Promise<boolean> {
  await ready();
  const position = machines.value.findIndex((m) => m.id === id);
  if (position < 0) return false;
  const machine = machines.value[position];
  batch(() => {
    lastDeleted.value = { machine, position };
    setList(machines.value.filter((m) => m.id !== id));
  });
  await send([{ id, machine: null, base: versionOf(id) }]);
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
  await send([{ id: restored.id, machine: restored, base: versionOf(restored.id) }]);
  return restored;
}

/** Drops the undo offer for the last deletion (the UI's undo time ran out). */
export function forgetDeleted(): void {
  lastDeleted.value = null;
}

/** Outcome of an import: the machines added (with names changed to avoid clashes), or why not. */
export type ImportResult =
  | { ok: true; added: Machine[]; renamed: Array<{ from: string; to: string }>; held: boolean }
  | { ok: false; error: string };

/**
 * Adds machines read from a file or a set-aside record (each with a new id); a name already in
 * use becomes "<name> (imported)". All or nothing: too many for the list changes nothing.
 */
export async function addMachines(
  found: readonly Machine[],
  suffix = 'imported',
): Promise<ImportResult> {
  await ready();
  const room = MAX_MACHINES - machines.value.length;
  if (found.length > room) {
    return {
      ok: false,
      error: `This holds ${found.length} machines but only ${room} more can be saved (at most ${MAX_MACHINES}); nothing was added.`,
    };
  }
  const taken = takenNames(machines.value);
  const renamed: Array<{ from: string; to: string }> = [];
  const added = found.map((m) => {
    const name = uniqueName(m.name, taken, (n) => (n === 1 ? ` (${suffix})` : ` (${suffix} ${n})`));
    taken.add(nameKey(name));
    if (name !== m.name) renamed.push({ from: m.name, to: name });
    return validateMachine({ ...m, id: newId(), name });
  });
  setList([...machines.value, ...added]);
  const outcomes = await send(added.map((m) => ({ id: m.id, machine: m, base: null })));
  return { ok: true, added, renamed, held: outcomes.some((o) => o.kind === 'held') };
}

/**
 * Adds every machine of a machines file (see parseMachinesFile). All or nothing: a refused
 * file, or one that would take the list over MAX_MACHINES, changes nothing. Never rejects.
 */
export async function importMachines(text: string): Promise<ImportResult> {
  const parsed = parseMachinesFile(text);
  if (!parsed.ok) return parsed;
  return addMachines(parsed.machines);
}

/**
 * All saved machines as a machines file (docs/file-format.md), from what this tab holds: it
 * works whatever the device does.
 * Throws DataError when they are too many or too large for one file.
 */
export function exportAll(): string {
  return exportMachinesJson(machines.value);
}

export type { WorkRecord };
