// What the app really holds on the device (its IndexedDB, read from inside the page as another
// script of the site would), and the storage faults the fault tests put the page through. Each
// read opens its own connection and closes it at once, so it never blocks a deletion.
import type { BrowserContext, Page } from 'playwright-core';

/** One saved machine as the device holds it ("trueturn/machine/<id>", src/state/store/records.ts). */
export interface DiskMachine {
  id: string;
  version: number;
  name: string;
  notes: string;
  speedRpm: number;
}

/** Every record on the device by key, or null when the app's database does not exist. */
export function diskRecords(page: Page): Promise<Record<string, unknown> | null> {
  return page.evaluate(async () => {
    // Opening a database that does not exist would create it empty, under the app's feet.
    const names = (await indexedDB.databases()).map((d) => d.name);
    if (!names.includes('trueturn')) return null;
    return new Promise<Record<string, unknown> | null>((done, fail) => {
      const open = indexedDB.open('trueturn');
      open.onerror = () => fail(open.error);
      open.onsuccess = () => {
        const db = open.result;
        if (!db.objectStoreNames.contains('records')) {
          db.close();
          return done(null);
        }
        const store = db.transaction('records', 'readonly').objectStore('records');
        const keys = store.getAllKeys();
        const values = store.getAll();
        values.onsuccess = () => {
          db.close();
          const out: Record<string, unknown> = {};
          keys.result.forEach((k, i) => (out[String(k)] = values.result[i]));
          done(out);
        };
        values.onerror = () => fail(values.error);
      };
    });
  });
}

/** The saved machines on the device, sorted by name (then id). */
export async function diskMachines(page: Page): Promise<DiskMachine[]> {
  const records = (await diskRecords(page)) ?? {};
  const out: DiskMachine[] = [];
  for (const [key, value] of Object.entries(records)) {
    if (!key.startsWith('trueturn/machine/')) continue;
    const r = value as {
      version: number;
      machine: {
        id: string;
        name: string;
        notes: string;
        setup: { parts: Array<{ speedRpm: number }> };
      };
    };
    out.push({
      id: r.machine.id,
      version: r.version,
      name: r.machine.name,
      notes: r.machine.notes,
      speedRpm: r.machine.setup.parts[0].speedRpm,
    });
  }
  return out.sort((a, b) => a.name.localeCompare(b.name) || a.id.localeCompare(b.id));
}

/** The names of the saved machines on the device, sorted. */
export async function diskNames(page: Page): Promise<string[]> {
  return (await diskMachines(page)).map((m) => m.name);
}

/** The working copy on the device ("trueturn/work"): the first part's speed and the name typed. */
export async function diskWork(
  page: Page,
): Promise<{ name: string; speedRpm: number; openId: string | null } | undefined> {
  const r = (await diskRecords(page))?.['trueturn/work'] as
    | {
        work: {
          openId: string | null;
          content: { name: string; setup: { parts: Array<{ speedRpm: number }> } };
        };
      }
    | undefined;
  if (!r) return undefined;
  return {
    name: r.work.content.name,
    speedRpm: r.work.content.setup.parts[0].speedRpm,
    openId: r.work.openId,
  };
}

/**
 * A device that runs out of space, as Chromium reports it: every request of a read-write
 * transaction succeeds, then the transaction aborts at commit with a QuotaExceededError (reads
 * work as ever), while `window.__diskFull` is true. The abort comes once the page has no request
 * of that transaction left to wait for, so the page's own code runs exactly as on a full disk.
 */
export function fullDiskScript(startFull: boolean): void {
  const w = window as unknown as { __diskFull: boolean; __refusedWrites: number };
  // A reload keeps the state the test last set (setDiskFull), as a real disk would.
  const kept = sessionStorage.getItem('test-disk-full');
  w.__diskFull = kept === null ? startFull : kept === '1';
  w.__refusedWrites = 0;
  const waiting = new WeakMap<IDBTransaction, number>();
  const doomed = new WeakSet<IDBTransaction>();
  const quota = () => new DOMException('The quota has been exceeded.', 'QuotaExceededError');

  // After each request of the page, an extra read queued behind it: when that read returns and
  // the page queued nothing more, the transaction is at its commit, and fails there.
  const atCommit = (tx: IDBTransaction, store: IDBObjectStore) => {
    const probe = realGet.call(store, '__probe__');
    probe.addEventListener('success', () => {
      if ((waiting.get(tx) ?? 0) > 0) return atCommit(tx, store);
      Object.defineProperty(tx, 'error', { get: quota });
      w.__refusedWrites += 1;
      tx.abort();
    });
  };

  const track = <A extends unknown[]>(
    real: (this: IDBObjectStore, ...args: A) => IDBRequest,
    writes: boolean,
  ) =>
    function (this: IDBObjectStore, ...args: A): IDBRequest {
      const tx = this.transaction;
      const request = real.apply(this, args);
      if (tx.mode === 'readonly') return request;
      waiting.set(tx, (waiting.get(tx) ?? 0) + 1);
      const settle = () => waiting.set(tx, (waiting.get(tx) ?? 1) - 1);
      request.addEventListener('success', settle);
      request.addEventListener('error', settle);
      if (writes && w.__diskFull && !doomed.has(tx)) {
        doomed.add(tx);
        atCommit(tx, this);
      }
      return request;
    };

  // A page that commits by itself (IDBTransaction.commit) meets the same refusal at the commit.
  const realCommit = IDBTransaction.prototype.commit;
  IDBTransaction.prototype.commit = function (this: IDBTransaction) {
    if (!doomed.has(this)) realCommit.call(this);
  };

  const proto = IDBObjectStore.prototype;
  const realGet = proto.get;
  proto.get = track(realGet, false);
  proto.getAllKeys = track(proto.getAllKeys, false);
  proto.put = track(proto.put, true);
  proto.delete = track(proto.delete, true);
}

/** Makes the device take writes again (true) or refuse them (false); see fullDiskScript. */
export function setDiskFull(page: Page, full: boolean): Promise<void> {
  return page.evaluate((f) => {
    (window as unknown as { __diskFull: boolean }).__diskFull = f;
    sessionStorage.setItem('test-disk-full', f ? '1' : '0');
  }, full);
}

/** How many write transactions the full device refused in this page so far. */
export function refusedWrites(page: Page): Promise<number> {
  return page.evaluate(() => (window as unknown as { __refusedWrites: number }).__refusedWrites);
}

/** A browser that offers the page no IndexedDB at all (some locked-down or private set-ups). */
export function noIndexedDbScript(): void {
  Object.defineProperty(window, 'indexedDB', { value: undefined, configurable: true });
}

/**
 * A browser that answers navigator.storage.persist() with `granted`, and counts the asks in
 * `window.__persistAsked`.
 */
export function persistAnswerScript(granted: boolean): void {
  const w = window as unknown as { __persistAsked: number };
  w.__persistAsked = 0;
  const storage = navigator.storage;
  Object.defineProperty(storage, 'persisted', { value: async () => false, configurable: true });
  Object.defineProperty(storage, 'persist', {
    value: async () => {
      w.__persistAsked += 1;
      return granted;
    },
    configurable: true,
  });
}

/**
 * Clears the site's data as the browser's settings do (Chrome DevTools Protocol
 * Storage.clearDataForOrigin): every database of the origin is deleted, its connections closed.
 */
export async function clearSiteData(context: BrowserContext, page: Page): Promise<void> {
  const cdp = await context.newCDPSession(page);
  const origin = new URL(page.url()).origin;
  await cdp.send('Storage.clearDataForOrigin', { origin, storageTypes: 'all' });
  await cdp.detach();
}

/** Deletes the app's database from another page of the site, as another script could. */
export function deleteDatabaseFrom(page: Page): Promise<void> {
  return page.evaluate(
    () =>
      new Promise<void>((done, fail) => {
        const request = indexedDB.deleteDatabase('trueturn');
        request.onsuccess = () => done();
        request.onerror = () => fail(request.error);
      }),
  );
}
