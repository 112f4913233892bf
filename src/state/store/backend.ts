// Where records physically go: the browser's IndexedDB (opened through idb-keyval's request
// helper, with our own connection so a connection the browser closes — site data cleared,
// the database deleted from another page — is noticed and opened again), or a map for this tab
// only when the browser offers no storage. Every write runs in one transaction: all or nothing.
import { promisifyRequest } from 'idb-keyval';

/** Name of the IndexedDB database. */
export const DB_NAME = 'trueturn';
/** Name of the one object store inside it. */
export const STORE_NAME = 'records';

/**
 * What a transaction may do: reads awaited in turn, writes queued in order. Every request is
 * made when the call is made, so requests run in the order of the calls.
 */
export interface Tx {
  get(key: string): Promise<unknown>;
  keys(): Promise<string[]>;
  put(key: string, value: unknown): void;
  delete(key: string): void;
  /**
   * No more requests: the browser commits what was queued without waiting for this page to read
   * the answers, so the writes land even when the page is being left (pagehide).
   */
  commit(): void;
}

export interface Backend {
  readonly kind: 'device' | 'memory';
  /** Runs `work` in one read-only transaction. */
  read<T>(work: (tx: Tx) => Promise<T>): Promise<T>;
  /** Runs `work` in one read-write transaction; anything it throws undoes every write. */
  write<T>(work: (tx: Tx) => Promise<T>): Promise<T>;
}

/** The real database. `onLost` hears when the browser closed the connection under us. */
export function deviceBackend(onLost: () => void): Backend {
  let connection: Promise<IDBDatabase> | null = null;

  const connect = (): Promise<IDBDatabase> => {
    if (connection) return connection;
    const request = indexedDB.open(DB_NAME);
    request.onupgradeneeded = () => {
      if (!request.result.objectStoreNames.contains(STORE_NAME)) {
        request.result.createObjectStore(STORE_NAME);
      }
    };
    const opened = promisifyRequest(request).then((db) => {
      const lost = () => {
        if (connection === opened) connection = null;
        onLost();
      };
      // Another page deleting the database waits for us to let go: let go, and open again on
      // the next use (which finds the database gone and writes back what this tab holds).
      db.onversionchange = () => {
        db.close();
        lost();
      };
      db.onclose = lost;
      return db;
    });
    opened.catch(() => {
      if (connection === opened) connection = null;
    });
    connection = opened;
    return opened;
  };

  async function transaction(mode: IDBTransactionMode): Promise<IDBTransaction> {
    const db = await connect();
    try {
      return db.transaction(STORE_NAME, mode);
    } catch (error) {
      // A connection closed by the browser refuses new transactions: open a new one, once.
      if (!isClosed(error)) throw error;
      connection = null;
      onLost();
      return (await connect()).transaction(STORE_NAME, mode);
    }
  }

  async function run<T>(mode: IDBTransactionMode, work: (tx: Tx) => Promise<T>): Promise<T> {
    const tx = await transaction(mode);
    const store = tx.objectStore(STORE_NAME);
    const done = new Promise<void>((resolve, reject) => {
      tx.oncomplete = () => resolve();
      tx.onabort = tx.onerror = () => reject(tx.error ?? new DOMException('Aborted', 'AbortError'));
    });
    let result: T;
    try {
      result = await work({
        get: (key) => promisifyRequest(store.get(key)),
        keys: () =>
          promisifyRequest(store.getAllKeys()).then((keys) =>
            keys.filter((k): k is string => typeof k === 'string'),
          ),
        put: (key, value) => void store.put(value, key),
        delete: (key) => void store.delete(key),
        commit: () => {
          // Older browsers commit by themselves once the page stops making requests.
          if (typeof tx.commit === 'function') tx.commit();
        },
      });
    } catch (error) {
      done.catch(() => undefined);
      try {
        tx.abort();
      } catch {
        // Already finished or aborted by the browser.
      }
      throw error;
    }
    await done;
    return result;
  }

  return {
    kind: 'device',
    read: (work) => run('readonly', work),
    write: (work) => run('readwrite', work),
  };
}

function isClosed(error: unknown): boolean {
  return error instanceof DOMException && error.name === 'InvalidStateError';
}

/** Records kept for this tab only. Writes apply together once `work` has finished. */
export function memoryBackend(): Backend {
  const map = new Map<string, unknown>();
  async function run<T>(work: (tx: Tx) => Promise<T>, writable: boolean): Promise<T> {
    const puts: Array<[string, unknown]> = [];
    const deletes: string[] = [];
    const result = await work({
      get: async (key) => (map.has(key) ? structuredClone(map.get(key)) : undefined),
      keys: async () => [...map.keys()],
      put: (key, value) => {
        if (!writable) throw new DOMException('Read-only transaction', 'ReadOnlyError');
        puts.push([key, structuredClone(value)]);
      },
      delete: (key) => {
        if (!writable) throw new DOMException('Read-only transaction', 'ReadOnlyError');
        deletes.push(key);
      },
      commit: () => undefined,
    });
    for (const [key, value] of puts) map.set(key, value);
    for (const key of deletes) map.delete(key);
    return result;
  }
  return { kind: 'memory', read: (work) => run(work, false), write: (work) => run(work, true) };
}
