// The app's database as the browser holds it, for tests of the store (fake-indexeddb): what a
// device holds before a page loads, and what it holds after. Each helper opens the database and
// closes it again, as another page would, so it never blocks a deletion.
import type { Machine } from '../../src/state/model';

async function withDb<T>(
  work: (store: IDBObjectStore) => IDBRequest<T> | void,
  mode: IDBTransactionMode,
): Promise<T | undefined> {
  const db = await new Promise<IDBDatabase>((done, fail) => {
    const open = indexedDB.open('trueturn');
    open.onupgradeneeded = () => {
      if (!open.result.objectStoreNames.contains('records'))
        open.result.createObjectStore('records');
    };
    open.onsuccess = () => done(open.result);
    open.onerror = () => fail(open.error);
  });
  try {
    return await new Promise<T | undefined>((done, fail) => {
      const tx = db.transaction('records', mode);
      const request = work(tx.objectStore('records'));
      tx.oncomplete = () => done(request ? request.result : undefined);
      tx.onerror = tx.onabort = () => fail(tx.error);
    });
  } finally {
    db.close();
  }
}

/** Puts records on the device. */
export function putRecords(records: Array<[string, unknown]>): Promise<unknown> {
  return withDb((store) => {
    for (const [key, value] of records) store.put(value, key);
  }, 'readwrite');
}

/** One record on the device, or undefined. */
export function getRecord(key: string): Promise<unknown> {
  return withDb((store) => store.get(key), 'readonly');
}

/** Every key on the device. */
export async function recordKeys(): Promise<string[]> {
  return ((await withDb((store) => store.getAllKeys(), 'readonly')) ?? []) as string[];
}

/** A device that already holds these machines (schema 2, one record each, version 1), and no example. */
export async function deviceWith(machines: Machine[]): Promise<void> {
  await putRecords([
    ['trueturn/meta', { schema: 2 }],
    ...machines.map(
      (m) => [`trueturn/machine/${m.id}`, { version: 1, machine: m }] as [string, unknown],
    ),
  ]);
}

/** Every machine record on the device, by id, as { version, machine }. */
export async function storedRecords(): Promise<Map<string, { version: number; machine: Machine }>> {
  const out = new Map<string, { version: number; machine: Machine }>();
  for (const key of await recordKeys()) {
    if (key.startsWith('trueturn/machine/')) {
      out.set(
        key.slice('trueturn/machine/'.length),
        (await getRecord(key)) as { version: number; machine: Machine },
      );
    }
  }
  return out;
}

/** The names of the machines on the device, sorted as text. */
export async function storedNames(): Promise<string[]> {
  return [...(await storedRecords()).values()].map((r) => r.machine.name).sort();
}
