// Kept whole (over 300 lines): opening the store, the schema and its upgrades, and the write
// queue share one state (the open store or the memory fallback); split, each part would reach
// into the others.
// Where saved machines and the current set-up live between visits: the browser's IndexedDB
// (through idb-keyval), in a database of our own, with a schema version so later versions of the
// app can upgrade what earlier ones saved. When the browser offers no usable storage (private
// window, storage blocked, disk full) everything keeps working in memory for the session and
// `storageStatus` says so.
//
// Records (all keys start with "trueturn/"):
//   trueturn/meta            { schema: 1 }
//   trueturn/machines        Machine[]           absent until the first machine is saved
//   trueturn/current-setup   Setup               what the check screen showed last
//   trueturn/recovered/<time>-<n>   a record that could not be read, kept as it was found
//
// Nothing unreadable is ever deleted or overwritten without a copy: it is first put aside
// under a "recovered" key, in the same transaction as its replacement, and reported through
// `storageMessage`.

import { signal } from '@preact/signals';
import { createStore, type UseStore } from 'idb-keyval';
import type { Machine, Setup } from './model';
import { DataError, readRecord, validateMachine, validateSetup } from './validate';

/** Name of the IndexedDB database. */
export const DB_NAME = 'trueturn';
/** Name of the one object store inside it. */
export const STORE_NAME = 'records';
/** Keys of the records this app keeps. */
export const KEYS = {
  meta: 'trueturn/meta',
  machines: 'trueturn/machines',
  currentSetup: 'trueturn/current-setup',
  recoveredPrefix: 'trueturn/recovered/',
} as const;
/** Layout version of the records this app writes. */
export const SCHEMA_VERSION = 1;
/** How long opening the database may take before the app gives up and works in memory, ms. */
export const OPEN_TIMEOUT_MS = 5000;

/** Whether changes reach the device ('saved') or last only for this tab ('memory'), and why. */
export interface StorageStatus {
  mode: 'saved' | 'memory';
  /** Why changes are not being saved, in words for the user (memory mode only). */
  reason?: string;
}

/** Current storage mode; 'memory' with a reason until openStore() has succeeded. */
export const storageStatus = signal<StorageStatus>({
  mode: 'memory',
  reason: 'Saved data is still being opened.',
});

/**
 * The latest problem with saved data, for the user (null = nothing to report). Set when a write
 * fails or unreadable data is put aside; the UI clears it by setting it to null.
 */
export const storageMessage = signal<string | null>(null);

/** Adds a message for the user, keeping any earlier one they have not dismissed yet. */
export function reportStorageProblem(message: string): void {
  const earlier = storageMessage.value;
  storageMessage.value = earlier && earlier !== message ? `${earlier} ${message}` : message;
}

/** The records an upgrade works on; `undefined` means the record is absent. */
export interface StoredRecords {
  machines: unknown;
  currentSetup: unknown;
}

/**
 * Layout upgrades, by the schema they read: `upgrades[v]` turns schema-v records into
 * schema v + 1. Pure functions; they throw DataError for a record they cannot read, and
 * openStore() then puts the old records aside. Machine contents are checked later, one by one.
 *
 * Schema 0 was a draft that never shipped: no meta record, and "trueturn/machines" held an
 * object from machine id to machine instead of a list. It is kept so the upgrade path is
 * exercised by tests.
 */
export const upgrades: Readonly<Record<number, (records: StoredRecords) => StoredRecords>> = {
  0: ({ machines, currentSetup }) => {
    if (machines === undefined) return { machines: undefined, currentSetup };
    if (typeof machines !== 'object' || machines === null || Array.isArray(machines)) {
      throw new DataError('machines', 'the saved machines are not in the layout of schema 0.');
    }
    const list: unknown[] = [];
    for (const id of Object.keys(machines).sort()) {
      list.push(Object.getOwnPropertyDescriptor(machines, id)?.value);
    }
    return { machines: list, currentSetup };
  },
};

/** A record put aside because it could not be read, with when and why. */
export interface RecoveredRecord {
  key: string;
  savedAt: string;
  reason: string;
  /** The unreadable records as they were found, by their original key. */
  records: Record<string, unknown>;
}

// --- Backends: the real database, or a map for this tab only --------------------------------

interface Backend {
  get(key: string): Promise<unknown>;
  /** Puts and deletes in one transaction: all happen or none. */
  write(
    puts: ReadonlyArray<readonly [string, unknown]>,
    deletes?: readonly string[],
  ): Promise<void>;
  keys(): Promise<string[]>;
}

function idbBackend(store: UseStore): Backend {
  return {
    get: (key) => store('readonly', (os) => requestResult(os.get(key))),
    write: (puts, deletes = []) =>
      store('readwrite', (os) => {
        for (const [key, value] of puts) os.put(value, key);
        for (const key of deletes) os.delete(key);
        return transactionDone(os.transaction);
      }),
    keys: () =>
      store('readonly', (os) => requestResult(os.getAllKeys())).then((keys) =>
        keys.filter((k): k is string => typeof k === 'string'),
      ),
  };
}

function memoryBackend(): Backend {
  const map = new Map<string, unknown>();
  return {
    get: async (key) => (map.has(key) ? structuredClone(map.get(key)) : undefined),
    write: async (puts, deletes = []) => {
      const copies = puts.map(([k, v]) => [k, structuredClone(v)] as const);
      for (const [k, v] of copies) map.set(k, v);
      for (const k of deletes) map.delete(k);
    },
    keys: async () => [...map.keys()],
  };
}

function requestResult<T>(request: IDBRequest<T>): Promise<T> {
  return new Promise((resolve, reject) => {
    request.onsuccess = () => resolve(request.result);
    request.onerror = () => reject(request.error);
  });
}

function transactionDone(tx: IDBTransaction): Promise<void> {
  return new Promise((resolve, reject) => {
    tx.oncomplete = () => resolve();
    tx.onabort = tx.onerror = () => reject(tx.error ?? new Error('The save was cancelled.'));
  });
}

// --- Opening ------------------------------------------------------------------------------

let backend: Backend = memoryBackend();
let opening: Promise<StorageStatus> | null = null;

/**
 * Opens saved data once per page (later calls return the same promise): detects storage that
 * is unavailable, blocked or full and falls back to memory; upgrades older layouts; puts aside
 * unreadable records. Never rejects. Resolves to the status also held by `storageStatus`.
 */
export function openStore(options: { timeoutMs?: number } = {}): Promise<StorageStatus> {
  opening ??= open(options.timeoutMs ?? OPEN_TIMEOUT_MS);
  return opening;
}

async function open(timeoutMs: number): Promise<StorageStatus> {
  let idb: Backend;
  let meta: unknown;
  try {
    const factory: IDBFactory | undefined = globalThis.indexedDB;
    if (!factory) throw new StorageUnavailable('this browser offers no storage to this page');
    idb = idbBackend(createStore(DB_NAME, STORE_NAME));
    meta = await withTimeout(idb.get(KEYS.meta), timeoutMs);
  } catch (e) {
    return useMemory(`Saving is off: ${reasonFor(e)}.`);
  }

  let schema: number;
  try {
    schema = meta === undefined ? 0 : readSchema(meta);
  } catch {
    return setAsideEverything(
      idb,
      'The saved data on this device was not in a form Trueturn can read.',
    );
  }
  if (schema > SCHEMA_VERSION) {
    return useMemory(
      `Saved data on this device was written by a newer version of Trueturn, so this version leaves it untouched. Reload the page to get the newer version.`,
    );
  }

  try {
    if (schema < SCHEMA_VERSION) {
      await upgradeFrom(idb, schema);
    } else {
      // Rewriting the meta record as it is proves the database accepts writes (some private
      // windows open a database and then refuse every write).
      await idb.write([[KEYS.meta, { schema: SCHEMA_VERSION }]]);
    }
  } catch (e) {
    return useMemory(`Saving is off: ${reasonFor(e)}.`);
  }
  backend = idb;
  storageStatus.value = { mode: 'saved' };
  return storageStatus.value;
}

function readSchema(meta: unknown): number {
  const r = readRecord(meta, 'meta', ['schema']);
  if (typeof r.schema !== 'number' || !Number.isInteger(r.schema) || r.schema < 1) {
    throw new DataError('meta › schema', 'meta › schema must be a whole number from 1.');
  }
  return r.schema;
}

async function upgradeFrom(idb: Backend, schema: number): Promise<void> {
  const found: StoredRecords = {
    machines: await idb.get(KEYS.machines),
    currentSetup: await idb.get(KEYS.currentSetup),
  };
  let records = found;
  try {
    for (let v = schema; v < SCHEMA_VERSION; v++) {
      const upgrade = upgrades[v];
      if (!upgrade) throw new DataError('meta', `no upgrade from schema ${v}`);
      records = upgrade(records);
    }
  } catch (e) {
    if (!(e instanceof DataError)) throw e;
    await idb.write(
      [
        recoveredEntry('Saved data from an older version could not be upgraded.', {
          [KEYS.machines]: found.machines,
          [KEYS.currentSetup]: found.currentSetup,
        }),
        [KEYS.meta, { schema: SCHEMA_VERSION }],
        [KEYS.machines, []],
      ],
      [KEYS.currentSetup],
    );
    reportStorageProblem(
      'Saved machines from an older version of Trueturn could not be upgraded; a copy was kept on this device.',
    );
    return;
  }
  const puts: Array<readonly [string, unknown]> = [[KEYS.meta, { schema: SCHEMA_VERSION }]];
  const deletes: string[] = [];
  for (const [key, value] of [
    [KEYS.machines, records.machines],
    [KEYS.currentSetup, records.currentSetup],
  ] as const) {
    if (value === undefined) deletes.push(key);
    else puts.push([key, value]);
  }
  await idb.write(puts, deletes);
}

/** Unreadable meta record: keep every record we know of aside and start a fresh layout. */
async function setAsideEverything(idb: Backend, reason: string): Promise<StorageStatus> {
  try {
    const records = {
      [KEYS.meta]: await idb.get(KEYS.meta),
      [KEYS.machines]: await idb.get(KEYS.machines),
      [KEYS.currentSetup]: await idb.get(KEYS.currentSetup),
    };
    await idb.write(
      [
        recoveredEntry(reason, records),
        [KEYS.meta, { schema: SCHEMA_VERSION }],
        [KEYS.machines, []],
      ],
      [KEYS.currentSetup],
    );
  } catch (e) {
    return useMemory(`Saving is off: ${reasonFor(e)}.`);
  }
  reportStorageProblem(`${reason} A copy was kept on this device and saving starts afresh.`);
  backend = idb;
  storageStatus.value = { mode: 'saved' };
  return storageStatus.value;
}

/** Switches to memory for the rest of the session, saying why. */
function useMemory(reason: string): StorageStatus {
  backend = memoryBackend();
  storageStatus.value = {
    mode: 'memory',
    reason: `${reason} Changes are kept only until this tab is closed; export your machines to keep them.`,
  };
  return storageStatus.value;
}

class StorageUnavailable extends Error {}

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

/** Why storage failed, in words for the user, from whatever the browser threw (no full stop). */
function reasonFor(e: unknown): string {
  if (e instanceof StorageUnavailable) return e.message;
  const name =
    typeof e === 'object' && e !== null && 'name' in e && typeof e.name === 'string' ? e.name : '';
  if (name === 'QuotaExceededError') return 'the storage on this device is full';
  if (name === 'SecurityError' || name === 'InvalidStateError') {
    return 'this browser does not let this page save (a private window, or storage blocked in settings)';
  }
  return `the browser refused to use saved data${name ? ` (${name})` : ''}`;
}

let recoveredCount = 0;

/** A put that keeps unreadable records under a key of their own, never reused. */
function recoveredEntry(
  reason: string,
  records: Record<string, unknown>,
): readonly [string, RecoveredRecord] {
  const savedAt = new Date().toISOString();
  recoveredCount += 1;
  const key = `${KEYS.recoveredPrefix}${savedAt}-${recoveredCount}-${Math.random().toString(36).slice(2, 8)}`;
  return [key, { key, savedAt, reason, records }];
}

/**
 * Writes through the current backend. When the device refuses (full, storage revoked), switches
 * to memory, keeps the change there so the session loses nothing, and reports the problem.
 * Resolves true when the change reached the device.
 */
async function writeSafely(
  puts: ReadonlyArray<readonly [string, unknown]>,
  deletes: readonly string[] = [],
): Promise<boolean> {
  await openStore();
  try {
    await backend.write(puts, deletes);
    return storageStatus.value.mode === 'saved';
  } catch (e) {
    useMemory(`Saving stopped: ${reasonFor(e)}.`);
    await backend.write(puts, deletes);
    reportStorageProblem(
      `The last change could not be saved on this device (${reasonFor(e)}). It is kept until this tab is closed; export your machines to keep them.`,
    );
    return false;
  }
}

async function readSafely(key: string): Promise<{ ok: true; value: unknown } | { ok: false }> {
  await openStore();
  try {
    return { ok: true, value: await backend.get(key) };
  } catch (e) {
    // Work in memory so nothing written this session can overwrite what could not be read.
    useMemory(`Saving is off: ${reasonFor(e)}.`);
    reportStorageProblem('Saved data could not be read just now; reload the page to try again.');
    return { ok: false };
  }
}

// --- Machines and the current set-up --------------------------------------------------------

/**
 * The saved machines, each checked; null when no machine was ever saved here (first run).
 * Unreadable entries (or an unreadable list) are put aside under a recovered key, the rest are
 * kept, and the problem is reported through storageMessage.
 */
export async function readSavedMachines(): Promise<Machine[] | null> {
  const read = await readSafely(KEYS.machines);
  if (!read.ok) return [];
  const raw = read.value;
  if (raw === undefined) return null;
  if (!Array.isArray(raw)) {
    await putAside(
      'The list of saved machines is not a list.',
      { [KEYS.machines]: raw },
      [[KEYS.machines, []]],
      'The saved list of machines could not be read',
    );
    return [];
  }
  const good: Machine[] = [];
  const bad: unknown[] = [];
  const problems: string[] = [];
  const ids = new Set<string>();
  raw.forEach((item: unknown, i) => {
    try {
      const m = validateMachine(item, `saved machine ${i + 1}`);
      if (ids.has(m.id))
        throw new DataError('id', `saved machine ${i + 1} repeats the id of another machine.`);
      ids.add(m.id);
      good.push(m);
    } catch (e) {
      bad.push(item);
      problems.push(e instanceof Error ? e.message : String(e));
    }
  });
  if (bad.length > 0) {
    const count = bad.length === 1 ? '1 saved machine' : `${bad.length} saved machines`;
    await putAside(
      problems.join(' '),
      { [KEYS.machines]: bad },
      [[KEYS.machines, good]],
      `${count} could not be read (${problems[0].replace(/\.$/, '')})`,
    );
  }
  return good;
}

/**
 * Saves the whole list of machines. Resolves true when it reached the device, false when it is
 * kept in memory only. Rejects with DataError, writing nothing, if a machine is invalid.
 */
export async function writeSavedMachines(machines: readonly Machine[]): Promise<boolean> {
  return writeSafely([[KEYS.machines, machines.map((m) => validateMachine(m))]]);
}

/**
 * Remembers what the check screen shows, so a reload reopens it. Resolves true when saved on
 * the device; false when it is kept in memory only or the set-up was refused (the reason goes
 * to storageMessage).
 */
export async function saveCurrentSetup(setup: Setup): Promise<boolean> {
  let clean: Setup;
  try {
    clean = validateSetup(setup);
  } catch (e) {
    reportStorageProblem(
      `The current set-up was not saved: ${e instanceof Error ? e.message : String(e)}`,
    );
    return false;
  }
  return writeSafely([[KEYS.currentSetup, clean]]);
}

/**
 * The set-up last saved by saveCurrentSetup, checked; null when there is none or it could not be
 * read (then it is put aside and reported).
 */
export async function loadCurrentSetup(): Promise<Setup | null> {
  const read = await readSafely(KEYS.currentSetup);
  if (!read.ok || read.value === undefined) return null;
  try {
    return validateSetup(read.value, 'last set-up');
  } catch (e) {
    await putAside(
      e instanceof Error ? e.message : String(e),
      { [KEYS.currentSetup]: read.value },
      [],
      'The set-up you last worked on could not be read',
      [KEYS.currentSetup],
    );
    return null;
  }
}

/** Every record put aside so far, oldest first (for a "download recovered data" action). */
export async function listRecovered(): Promise<RecoveredRecord[]> {
  await openStore();
  try {
    const keys = (await backend.keys()).filter((k) => k.startsWith(KEYS.recoveredPrefix)).sort();
    const out: RecoveredRecord[] = [];
    for (const key of keys) {
      const value: unknown = await backend.get(key);
      // Our own records; anything else under the prefix is skipped rather than trusted.
      if (typeof value === 'object' && value !== null && 'records' in value && 'reason' in value) {
        out.push(value as RecoveredRecord);
      }
    }
    return out;
  } catch {
    return [];
  }
}

/**
 * Keeps `records` under a recovered key and applies the replacements in one transaction, then
 * reports `what` went wrong. If the device refuses, switches to memory so the unreadable data
 * stays untouched on the device.
 */
async function putAside(
  reason: string,
  records: Record<string, unknown>,
  replacements: ReadonlyArray<readonly [string, unknown]>,
  what: string,
  deletes: readonly string[] = [],
): Promise<void> {
  try {
    await backend.write([recoveredEntry(reason, records), ...replacements], deletes);
    reportStorageProblem(`${what}; it was set aside and a copy kept on this device.`);
  } catch (e) {
    useMemory(`Saving is off: ${reasonFor(e)}.`);
    reportStorageProblem(`${what}; it was left untouched on this device.`);
  }
}
