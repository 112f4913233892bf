// Kept whole (over 300 lines): opening, upgrading, the write queue and its fault handling share
// one state (the backend, what is pending, what was seen); split, each part would reach into
// the others.
//
// The store: saved machines as one record each, with a version that grows by one at every
// write, and the working copy. Its one job is to get every change onto the device without ever
// losing a machine:
// - Several tabs: a change is written only over the version it was made from; when another
//   tab wrote the machine meanwhile, both are kept (this tab's as a copy) and the listener hears
//   of it. A BroadcastChannel tells other tabs to read the machines again.
// - Saved data cleared while open: the next write finds the meta record gone, writes back
//   everything this tab holds, and says so.
// - Writes refused (storage full): reads still work; changes are held in this tab and written,
//   all together, as soon as a write succeeds again (retried by itself); status says why.
// - No storage at all: a map for this tab, and the status says so.
// - Unreadable records are set aside under a recovered key, never deleted or overwritten.
import { signal } from '@preact/signals';
import { newId } from '../ids';
import type { Machine } from '../model';
import { deviceBackend, memoryBackend, type Backend, type Tx } from './backend';
import {
  KEYS,
  SCHEMA_VERSION,
  asRecovered,
  machineKey,
  readSchema,
  readStoredMachine,
  readWork,
  recoveredEntry,
  upgradeSchema1,
  type RecoveredRecord,
  type StoredMachine,
  type WorkRecord,
} from './records';
import {
  StorageUnavailable,
  persistence,
  reasonFor,
  reportStorageProblem,
  storageMessage,
  storageStatus,
} from './status';

export * from './status';
export type { RecoveredRecord, StoredMachine, WorkRecord } from './records';

/** How long opening the database may take before the app gives up and works in memory, ms. */
export const OPEN_TIMEOUT_MS = 5000;
/** Waits between tries while the device refuses writes, ms (the last repeats). */
export const RETRY_MS = [1000, 2000, 4000, 8000];
/** Name of the channel tabs of this app tell each other about changes on. */
export const CHANNEL_NAME = 'trueturn';

/** A change of one machine: its new content (null: delete it), made from version `base` (null: new). */
export interface Change {
  id: string;
  machine: Machine | null;
  base: number | null;
}

/** What became of a change. */
export type Outcome =
  | { kind: 'saved'; version: number }
  /** The browser offers no storage: kept in this tab only, lost when it closes. */
  | { kind: 'tabOnly'; version: number }
  | { kind: 'deleted' }
  /** Not on the device yet: kept in this tab, written when the device takes writes again. */
  | { kind: 'held' }
  /** Another tab wrote the machine meanwhile: theirs stays, this tab's was saved as `copy`. */
  | { kind: 'copied'; theirs: StoredMachine; copy: StoredMachine }
  /** Another tab deleted it meanwhile: this tab's change brought it back. */
  | { kind: 'restored'; version: number }
  /** A delete of a machine another tab changed meanwhile: theirs was kept. */
  | { kind: 'kept'; theirs: StoredMachine };

/** What the layer above provides and hears. */
export interface StoreListener {
  /** Every machine this tab holds, to write back when saved data was cleared. */
  held(): StoredMachine[];
  /** A change (perhaps held earlier) reached the device, with what became of it. */
  settled(id: string, outcome: Outcome): void;
  /** Another tab changed saved machines. */
  remoteChange(): void;
}

/** Ids of machines whose latest change is held in this tab, not yet on the device. */
export const heldIds = signal<ReadonlySet<string>>(new Set());

let backend: Backend = memoryBackend();
let opening: Promise<void> | null = null;
let firstRun = false;
/** The meta record was seen on the device (so its absence later means the data was cleared). */
let metaSeen = false;
/** Schema 1 data upgraded in memory while the device refused the upgrade's write. */
let heldUpgrade: { machines: StoredMachine[]; work: WorkRecord | null } | null = null;
let rawPuts: Array<[string, unknown]> = [];
let rawDeletes: string[] = [];
let pending = new Map<string, Change>();
let pendingWork: WorkRecord | undefined;
let listener: StoreListener | null = null;
let channel: BroadcastChannel | null = null;

export function listen(l: StoreListener): void {
  listener = l;
}

/**
 * Opens saved data once per page (later calls return the same promise). Never rejects: storage
 * that cannot be used means memory mode, with the reason in `storageStatus`.
 */
export function openStore(options: { timeoutMs?: number } = {}): Promise<void> {
  opening ??= open(options.timeoutMs ?? OPEN_TIMEOUT_MS);
  return opening;
}

async function open(timeoutMs: number): Promise<void> {
  if (!globalThis.indexedDB) {
    useMemory('Saving is off: this browser offers no storage to this page.');
    return;
  }
  const device = deviceBackend(() => undefined);
  let found: { meta: unknown; keys: string[]; list: unknown; current: unknown };
  try {
    found = await withTimeout(
      device.read(async (tx) => ({
        meta: await tx.get(KEYS.meta),
        keys: await tx.keys(),
        list: await tx.get(KEYS.oldMachines),
        current: await tx.get(KEYS.oldCurrentSetup),
      })),
      timeoutMs,
    );
  } catch (e) {
    useMemory(`Saving is off: ${reasonFor(e)}.`);
    return;
  }
  backend = device;
  const { meta } = found;
  firstRun = meta === undefined && found.keys.length === 0;
  metaSeen = meta !== undefined;
  let schema: number;
  try {
    schema =
      meta === undefined ? (found.list !== undefined ? 1 : SCHEMA_VERSION) : readSchema(meta);
  } catch {
    // An unreadable meta record: keep everything aside and start afresh.
    const all = await device.read(async (tx) => {
      const out: Record<string, unknown> = {};
      for (const key of found.keys) {
        if (!key.startsWith(KEYS.recoveredPrefix)) out[key] = await tx.get(key);
      }
      return out;
    });
    rawPuts.push(
      recoveredEntry('The saved data on this device was not in a form Trueturn can read.', all),
    );
    rawDeletes.push(...Object.keys(all));
    reportStorageProblem(
      'The saved data on this device was not in a form Trueturn can read; it was set aside (Machines screen) and saving starts afresh.',
    );
    schema = SCHEMA_VERSION;
  }
  if (schema > SCHEMA_VERSION) {
    useMemory(
      'Saved data on this device was written by a newer version of Trueturn, so this version leaves it untouched. Reload the page to get the newer version.',
    );
    return;
  }
  if (schema === 1) upgradeFrom1(found.list, found.current);
  rawPuts.push([KEYS.meta, { schema: SCHEMA_VERSION }]);
  channel = openChannel();
  // Writing the meta record proves the device takes writes (some private windows and full
  // disks open a database, then refuse every write); reads go on either way.
  await flush();
  void askPersistence();
}

function upgradeFrom1(list: unknown, current: unknown): void {
  const up = upgradeSchema1(list, current);
  for (const stored of up.machines) rawPuts.push([machineKey(stored.machine.id), stored]);
  if (up.work) rawPuts.push([KEYS.work, { work: up.work }]);
  if (Object.keys(up.bad).length > 0) {
    rawPuts.push(recoveredEntry(up.problems.join(' '), up.bad));
    reportStorageProblem(
      `Some data saved by an earlier version could not be read (${up.problems[0].replace(/\.$/, '')}); it was set aside on the Machines screen.`,
    );
  }
  rawDeletes.push(KEYS.oldMachines, KEYS.oldCurrentSetup);
  heldUpgrade = { machines: up.machines, work: up.work };
}

async function askPersistence(): Promise<void> {
  const storage = globalThis.navigator?.storage;
  if (!storage || typeof storage.persist !== 'function') return;
  try {
    const already = typeof storage.persisted === 'function' && (await storage.persisted());
    persistence.value = already || (await storage.persist()) ? 'granted' : 'refused';
  } catch {
    persistence.value = 'refused';
  }
}

function useMemory(reason: string): void {
  backend = memoryBackend();
  firstRun = true;
  storageStatus.value = {
    mode: 'memory',
    reason: `${reason} Changes are kept only until this tab is closed; export your machines to keep them.`,
  };
}

function openChannel(): BroadcastChannel | null {
  if (typeof BroadcastChannel !== 'function') return null;
  const c = new BroadcastChannel(CHANNEL_NAME);
  c.onmessage = () => listener?.remoteChange();
  // Outside a browser (Node's channel) a channel would keep the process alive.
  (c as { unref?: () => void }).unref?.();
  return c;
}

/** What is on the device: every readable machine, the working copy, and whether this is a first run. */
export interface Loaded {
  machines: StoredMachine[];
  work: WorkRecord | null;
  firstRun: boolean;
  /** False when the device could not be read at all just now. */
  read: boolean;
}

/** Reads every saved machine and the working copy; unreadable records are set aside. Never rejects. */
export async function loadAll(): Promise<Loaded> {
  await openStore();
  if (heldUpgrade) return { ...structuredClone(heldUpgrade), firstRun: false, read: true };
  try {
    const found = await backend.read(async (tx) => {
      const good: StoredMachine[] = [];
      const bad: Record<string, unknown> = {};
      const problems: string[] = [];
      for (const key of await tx.keys()) {
        if (!key.startsWith(KEYS.machinePrefix)) continue;
        const value = await tx.get(key);
        try {
          good.push(readStoredMachine(value, key.slice(KEYS.machinePrefix.length)));
        } catch (e) {
          bad[key] = value;
          problems.push(e instanceof Error ? e.message : String(e));
        }
      }
      const rawWork = await tx.get(KEYS.work);
      let work: WorkRecord | null = null;
      if (rawWork !== undefined) {
        try {
          work = readWork((rawWork as { work?: unknown } | null)?.work);
        } catch (e) {
          bad[KEYS.work] = rawWork;
          problems.push(e instanceof Error ? e.message : String(e));
        }
      }
      return { good, bad, problems, work };
    });
    if (found.problems.length > 0) await setAside(found.bad, found.problems);
    return { machines: found.good, work: found.work, firstRun, read: true };
  } catch (e) {
    reportStorageProblem(
      `Saved machines could not be read just now (${reasonFor(e)}); reload the page to try again.`,
    );
    return { machines: [], work: null, firstRun: false, read: false };
  }
}

async function setAside(bad: Record<string, unknown>, problems: string[]): Promise<void> {
  const count = Object.keys(bad).length;
  const what = count === 1 ? '1 saved record' : `${count} saved records`;
  try {
    await backend.write(async (tx) => {
      const [key, entry] = recoveredEntry(problems.join(' '), bad);
      tx.put(key, entry);
      for (const k of Object.keys(bad)) tx.delete(k);
    });
    reportStorageProblem(
      `${what} could not be read (${problems[0].replace(/\.$/, '')}); set aside on the Machines screen, where it can be downloaded or restored.`,
    );
  } catch (e) {
    reportStorageProblem(`${what} could not be read and were left untouched (${reasonFor(e)}).`);
  }
}

/**
 * Queues changes of machines and writes them with everything else held. Resolves, per change in
 * order, with what became of it at this try ('held' when the device refused; the listener hears
 * the final outcome once it is written).
 */
export async function commit(changes: readonly Change[]): Promise<Outcome[]> {
  for (const change of changes) {
    const earlier = pending.get(change.id);
    pending.set(change.id, { ...change, base: earlier ? earlier.base : change.base });
  }
  updateHeld();
  const results = await flush();
  return changes.map((c) => results.get(c.id) ?? { kind: 'held' });
}

/** Queues the working copy; written with the next flush. */
export function queueWork(work: WorkRecord): void {
  pendingWork = structuredClone(work);
  latestWork = pendingWork;
}

/** The working copy last queued, written back when saved data was cleared. */
let latestWork: WorkRecord | null = null;

let writing: Promise<Map<string, Outcome>> = Promise.resolve(new Map());
/** Saved data was found cleared by a write that could not write everything back itself. */
let writeBackDue = false;
let retryTimer: ReturnType<typeof setTimeout> | undefined;
let failures = 0;

/** Writes everything held now, after any write already under way. Never rejects. */
export function flush(): Promise<Map<string, Outcome>> {
  writing = writing.then(writeHeld, writeHeld);
  return writing;
}

async function writeHeld(): Promise<Map<string, Outcome>> {
  const results = new Map<string, Outcome>();
  if (pending.size === 0 && pendingWork === undefined && rawPuts.length === 0 && !writeBackDue) {
    return results;
  }
  const batch = pending;
  const work = pendingWork;
  const puts = rawPuts;
  const deletes = rawDeletes;
  pending = new Map();
  pendingWork = undefined;
  rawPuts = [];
  rawDeletes = [];
  let cleared = false;
  let clearedUnseen = false;
  try {
    await backend.write(async (tx) => {
      // Read before anything is written: a meta record gone means saved data was cleared.
      const metaRead = tx.get(KEYS.meta);
      // A write refused below aborts the read too; the refusal is what gets reported.
      metaRead.catch(() => undefined);
      // Writes that depend on no read are queued at once, in this same task: when the page is
      // being left (pagehide) nothing after this point may run, and they must still land.
      for (const key of deletes) tx.delete(key);
      for (const [key, value] of puts) tx.put(key, value);
      if (work) tx.put(KEYS.work, { work });
      tx.put(KEYS.meta, { schema: SCHEMA_VERSION });
      const blind = batch.size === 0 && !writeBackDue;
      if (blind) tx.commit();
      const meta = await metaRead;
      const gone = meta === undefined && metaSeen && backend.kind === 'device';
      if (blind) {
        // Too late to write back in this transaction: the next one does.
        clearedUnseen = gone;
        return;
      }
      if (gone || writeBackDue) {
        cleared = true;
        await writeBack(tx, batch);
      }
      for (const change of batch.values()) {
        const outcome = await write(tx, change, cleared);
        const tabOnly = backend.kind === 'memory' && outcome.kind === 'saved';
        results.set(change.id, tabOnly ? { kind: 'tabOnly', version: outcome.version } : outcome);
      }
    });
  } catch (e) {
    // Nothing of this try reached the device: hold it all again, under anything newer.
    for (const [id, change] of batch) {
      const newer = pending.get(id);
      pending.set(id, newer ? { ...newer, base: change.base } : change);
    }
    pendingWork ??= work;
    rawPuts = [...puts, ...rawPuts];
    rawDeletes = [...deletes, ...rawDeletes];
    updateHeld();
    refused(e);
    return new Map();
  }
  metaSeen = true;
  heldUpgrade = null;
  if (cleared) writeBackDue = false;
  if (clearedUnseen) {
    writeBackDue = true;
    void flush();
  }
  // Changes made while this write was under way were made from the version it wrote.
  for (const [id, outcome] of results) {
    const next = pending.get(id);
    const version = 'version' in outcome ? outcome.version : null;
    if (next && next.base === batch.get(id)?.base) pending.set(id, { ...next, base: version });
  }
  updateHeld();
  const wasFailing = storageStatus.peek().mode === 'failing';
  if (backend.kind === 'device') storageStatus.value = { mode: 'saved' };
  failures = 0;
  clearTimeout(retryTimer);
  retryTimer = undefined;
  if (wasFailing) {
    reportStorageProblem(
      'Saving works again: every change held in this tab is now on this device.',
    );
  }
  if (cleared) {
    const count = listener?.held().length ?? 0;
    reportStorageProblem(
      `Saved data on this device was cleared while Trueturn was open (by the browser's settings or another page). Everything this tab held was written back: ${count === 1 ? '1 machine' : `${count} machines`} and the set-up on screen.`,
    );
  }
  for (const [id, outcome] of results) listener?.settled(id, outcome);
  if (results.size > 0 || cleared) channel?.postMessage({ type: 'machines' });
  return results;
}

/**
 * Writes one change over the version it was made from, or keeps both. After the data was
 * cleared, nothing was changed by another tab: the change is simply written back.
 */
async function write(tx: Tx, change: Change, cleared: boolean): Promise<Outcome> {
  const key = machineKey(change.id);
  const raw = await tx.get(key);
  let stored: StoredMachine | null = null;
  if (raw !== undefined) {
    try {
      stored = readStoredMachine(raw, change.id);
    } catch {
      // An unreadable record is never written over: keep it aside with the change.
      const [rkey, entry] = recoveredEntry(
        'A saved machine could not be read when it was changed.',
        { [key]: raw },
      );
      tx.put(rkey, entry);
    }
  }
  const storedVersion = stored?.version ?? null;
  if (change.machine === null) {
    if (stored === null) {
      tx.delete(key);
      return { kind: 'deleted' };
    }
    if (storedVersion === change.base) {
      tx.delete(key);
      return { kind: 'deleted' };
    }
    return { kind: 'kept', theirs: stored };
  }
  if (storedVersion === change.base || (stored === null && cleared)) {
    const version = (change.base ?? 0) + 1;
    tx.put(key, { version, machine: change.machine });
    return { kind: 'saved', version };
  }
  if (stored === null) {
    const version = (change.base ?? 0) + 1;
    tx.put(key, { version, machine: change.machine });
    return { kind: 'restored', version };
  }
  const copy: StoredMachine = {
    version: 1,
    machine: { ...change.machine, id: newId(), name: copyName(change.machine.name) },
  };
  tx.put(machineKey(copy.machine.id), copy);
  return { kind: 'copied', theirs: stored, copy };
}

/** The name a conflicting change is kept under ("Fan (kept copy)", within the longest name). */
function copyName(name: string): string {
  const end = ' (kept copy)';
  return (
    [...name]
      .slice(0, 80 - end.length)
      .join('')
      .trimEnd() + end
  );
}

async function writeBack(tx: Tx, batch: Map<string, Change>): Promise<void> {
  for (const stored of listener?.held() ?? []) {
    if (batch.has(stored.machine.id)) continue;
    if ((await tx.get(machineKey(stored.machine.id))) === undefined) {
      tx.put(machineKey(stored.machine.id), stored);
    }
  }
  if (latestWork) tx.put(KEYS.work, { work: latestWork });
}

function refused(e: unknown): void {
  if (backend.kind === 'memory') return;
  storageStatus.value = {
    mode: 'failing',
    reason: `Not saved on this device: ${reasonFor(e)}. Every change is kept in this tab and saved by itself once the device takes it again; export your machines to be safe.`,
  };
  const wait = RETRY_MS[Math.min(failures, RETRY_MS.length - 1)];
  failures += 1;
  clearTimeout(retryTimer);
  retryTimer = setTimeout(() => void flush(), wait);
}

function updateHeld(): void {
  const ids = new Set(pending.keys());
  const now = heldIds.peek();
  if (ids.size !== now.size || [...ids].some((id) => !now.has(id))) heldIds.value = ids;
}

/** Every record set aside so far, oldest first. */
export async function listRecovered(): Promise<RecoveredRecord[]> {
  await openStore();
  try {
    return await backend.read(async (tx) => {
      const out: RecoveredRecord[] = [];
      const keys = (await tx.keys()).filter((k) => k.startsWith(KEYS.recoveredPrefix)).sort();
      for (const key of keys) {
        const r = asRecovered(await tx.get(key));
        if (r) out.push(r);
      }
      return out;
    });
  } catch {
    return [];
  }
}

/** Removes a set-aside record once its machines were restored. Resolves false when the device refused. */
export async function removeRecovered(key: string): Promise<boolean> {
  if (!key.startsWith(KEYS.recoveredPrefix)) return false;
  try {
    await backend.write(async (tx) => tx.delete(key));
    return true;
  } catch (e) {
    refused(e);
    return false;
  }
}

function withTimeout<T>(promise: Promise<T>, ms: number): Promise<T> {
  return new Promise((resolve, reject) => {
    const timer = setTimeout(
      () =>
        reject(
          new StorageUnavailable(
            'saved data did not open in time (another Trueturn tab may be holding it)',
          ),
        ),
      ms,
    );
    promise.then(
      (v) => {
        clearTimeout(timer);
        resolve(v);
      },
      (e: unknown) => {
        clearTimeout(timer);
        reject(e);
      },
    );
  });
}

/** Clears the message (the user closed it). */
export function dismissStorageMessage(): void {
  storageMessage.value = null;
}
