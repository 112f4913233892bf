import 'fake-indexeddb/auto';
import { IDBFactory } from 'fake-indexeddb';
import { createStore, get, keys, set, setMany } from 'idb-keyval';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { sampleMachine, sampleSetup } from './fixtures';

type StorageModule = typeof import('../../src/state/storage');

const META = 'trueturn/meta';
const MACHINES = 'trueturn/machines';
const CURRENT = 'trueturn/current-setup';

/** A fresh, empty browser database for each test. */
beforeEach(() => {
  globalThis.indexedDB = new IDBFactory() as unknown as typeof globalThis.indexedDB;
});

afterEach(() => {
  vi.restoreAllMocks();
  vi.useRealTimers();
});

/** The storage module as a new page load sees it: fresh module state, same database. */
async function pageLoad(): Promise<StorageModule> {
  vi.resetModules();
  return import('../../src/state/storage');
}

/** Direct access to the app's database, as the browser holds it. */
const raw = () => createStore('trueturn', 'records');

describe('openStore on a working browser', () => {
  it('starts in memory mode until opened, then reports saved mode and writes the schema', async () => {
    const s = await pageLoad();
    expect(s.storageStatus.value).toEqual({
      mode: 'memory',
      reason: 'Saved data is still being opened.',
    });
    expect(await s.openStore()).toEqual({ mode: 'saved' });
    expect(s.storageStatus.value).toEqual({ mode: 'saved' });
    expect(await get(META, raw())).toEqual({ schema: 1 });
    expect(s.storageMessage.value).toBeNull();
  });

  it('tells a first run (nothing ever saved) apart from an empty list', async () => {
    const s = await pageLoad();
    expect(await s.readSavedMachines()).toBeNull();
    await s.writeSavedMachines([]);
    expect(await s.readSavedMachines()).toEqual([]);
  });

  it('keeps machines and the current set-up across page loads', async () => {
    const first = await pageLoad();
    const machines = [sampleMachine(), sampleMachine({ id: 'machine-2', name: 'Second' })];
    expect(await first.writeSavedMachines(machines)).toBe(true);
    expect(await first.saveCurrentSetup(sampleSetup())).toBe(true);

    const second = await pageLoad();
    expect(await second.readSavedMachines()).toEqual(machines);
    expect(await second.loadCurrentSetup()).toEqual(sampleSetup());
    expect(second.storageStatus.value).toEqual({ mode: 'saved' });
  });

  it('returns null when no current set-up was saved', async () => {
    const s = await pageLoad();
    expect(await s.loadCurrentSetup()).toBeNull();
  });

  it('refuses to save an invalid current set-up, says why, and keeps the last good one', async () => {
    const s = await pageLoad();
    await s.saveCurrentSetup(sampleSetup());
    const bad = sampleSetup();
    bad.camera.frameRate = -1;
    expect(await s.saveCurrentSetup(bad)).toBe(false);
    expect(s.storageMessage.value).toBe(
      'The current set-up was not saved: set-up › camera › frameRate must be a number above 0 and at most 1000000 (got -1).',
    );
    expect(await s.loadCurrentSetup()).toEqual(sampleSetup());
  });

  it('refuses to write an invalid machine list rather than store it', async () => {
    const s = await pageLoad();
    const bad = sampleMachine({ name: '' });
    await expect(s.writeSavedMachines([bad])).rejects.toMatchObject({
      name: 'DataError',
      message: 'machine › name must not be blank.',
    });
    expect(await get(MACHINES, raw())).toBeUndefined();
  });
});

describe('openStore when the browser cannot save', () => {
  it('works in memory when the browser offers no IndexedDB', async () => {
    delete (globalThis as { indexedDB?: unknown }).indexedDB;
    const s = await pageLoad();
    const status = await s.openStore();
    expect(status.mode).toBe('memory');
    expect(status.reason).toBe(
      'Saving is off: this browser offers no storage to this page. Changes are kept only until this tab is closed; export your machines to keep them.',
    );
    expect(await s.writeSavedMachines([sampleMachine()])).toBe(false);
    expect(await s.readSavedMachines()).toEqual([sampleMachine()]);
    expect(await s.saveCurrentSetup(sampleSetup())).toBe(false);
    expect(await s.loadCurrentSetup()).toEqual(sampleSetup());

    // A new page load in the same (storage-less) browser starts empty: memory is per page.
    const again = await pageLoad();
    expect(await again.readSavedMachines()).toBeNull();
  });

  it('works in memory when opening the database throws (private window, storage blocked)', async () => {
    vi.spyOn(globalThis.indexedDB, 'open').mockImplementation(() => {
      throw new DOMException('blocked', 'SecurityError');
    });
    const s = await pageLoad();
    expect((await s.openStore()).reason).toBe(
      'Saving is off: this browser does not let this page save (a private window, or storage blocked in settings). Changes are kept only until this tab is closed; export your machines to keep them.',
    );
    await s.writeSavedMachines([sampleMachine()]);
    expect(await s.readSavedMachines()).toEqual([sampleMachine()]);
  });

  it('works in memory when the database never finishes opening', async () => {
    vi.useFakeTimers({ toFake: ['setTimeout', 'clearTimeout'] });
    // An open request whose events never fire, as when another tab blocks the database.
    vi.spyOn(globalThis.indexedDB, 'open').mockImplementation(() => ({}) as IDBOpenDBRequest);
    const s = await pageLoad();
    const opening = s.openStore();
    await vi.advanceTimersByTimeAsync(s.OPEN_TIMEOUT_MS);
    expect((await opening).reason).toMatch(
      /^Saving is off: saved data did not open in time \(another Trueturn tab may be holding it\)\./,
    );
  });

  it('works in memory when the database opens but refuses every write', async () => {
    vi.spyOn(globalThis.IDBObjectStore.prototype, 'put').mockImplementation(() => {
      throw new DOMException('full', 'QuotaExceededError');
    });
    const s = await pageLoad();
    expect((await s.openStore()).reason).toMatch(
      /^Saving is off: the storage on this device is full\./,
    );
  });

  it('keeps a change in memory and says so when a write fails mid-session, touching nothing saved', async () => {
    const s = await pageLoad();
    await s.writeSavedMachines([sampleMachine()]);
    const put = vi.spyOn(globalThis.IDBObjectStore.prototype, 'put').mockImplementation(() => {
      throw new DOMException('full', 'QuotaExceededError');
    });
    const two = [sampleMachine(), sampleMachine({ id: 'machine-2', name: 'Second' })];
    expect(await s.writeSavedMachines(two)).toBe(false);
    expect(s.storageStatus.value.mode).toBe('memory');
    expect(s.storageMessage.value).toBe(
      'The last change could not be saved on this device (the storage on this device is full). It is kept until this tab is closed; export your machines to keep them.',
    );
    expect(await s.readSavedMachines()).toEqual(two);
    put.mockRestore();
    expect(await get(MACHINES, raw())).toEqual([sampleMachine()]);
  });

  it('stops saving when a read fails mid-session, so nothing unread can be overwritten', async () => {
    const s = await pageLoad();
    await s.writeSavedMachines([sampleMachine()]);
    vi.spyOn(globalThis.IDBObjectStore.prototype, 'get').mockImplementation(() => {
      throw new DOMException('gone', 'UnknownError');
    });
    expect(await s.readSavedMachines()).toEqual([]);
    expect(s.storageStatus.value.mode).toBe('memory');
    expect(s.storageMessage.value).toBe(
      'Saved data could not be read just now; reload the page to try again.',
    );
    vi.restoreAllMocks();
    await s.writeSavedMachines([]);
    expect(await get(MACHINES, raw())).toEqual([sampleMachine()]);
  });
});

describe('unreadable saved data', () => {
  it('keeps the readable machines and sets the others aside with a copy', async () => {
    const good = sampleMachine();
    const bad = { ...sampleMachine({ id: 'machine-2' }), name: 42 };
    const twin = sampleMachine({ name: 'Same id' });
    await setMany(
      [
        [META, { schema: 1 }],
        [MACHINES, [good, bad, twin]],
      ],
      raw(),
    );

    const s = await pageLoad();
    expect(await s.readSavedMachines()).toEqual([good]);
    expect(s.storageMessage.value).toBe(
      '2 saved machines could not be read (saved machine 2 › name must be text (got 42)); it was set aside and a copy kept on this device.',
    );
    const recovered = await s.listRecovered();
    expect(recovered).toHaveLength(1);
    expect(recovered[0].records[MACHINES]).toEqual([bad, twin]);
    expect(recovered[0].key.startsWith('trueturn/recovered/')).toBe(true);
    expect(await get(MACHINES, raw())).toEqual([good]);

    // The next page load finds a clean list and sets nothing aside again.
    const next = await pageLoad();
    expect(await next.readSavedMachines()).toEqual([good]);
    expect(next.storageMessage.value).toBeNull();
    expect(await next.listRecovered()).toHaveLength(1);
  });

  it('sets aside a machines record that is not a list, and does not treat it as a first run', async () => {
    await setMany(
      [
        [META, { schema: 1 }],
        [MACHINES, { oops: true }],
      ],
      raw(),
    );
    const s = await pageLoad();
    expect(await s.readSavedMachines()).toEqual([]);
    expect(s.storageMessage.value).toBe(
      'The saved list of machines could not be read; it was set aside and a copy kept on this device.',
    );
    expect((await s.listRecovered())[0].records[MACHINES]).toEqual({ oops: true });
  });

  it('sets aside an unreadable current set-up and returns null', async () => {
    const s = await pageLoad();
    await s.openStore();
    await set(CURRENT, { parts: 'fan' }, raw());
    expect(await s.loadCurrentSetup()).toBeNull();
    expect(s.storageMessage.value).toBe(
      'The set-up you last worked on could not be read; it was set aside and a copy kept on this device.',
    );
    expect(await get(CURRENT, raw())).toBeUndefined();
    expect((await s.listRecovered())[0].records[CURRENT]).toEqual({ parts: 'fan' });
  });

  it('sets aside everything when the meta record cannot be read, then saves afresh', async () => {
    await setMany(
      [
        [META, { schema: 'one' }],
        [MACHINES, [sampleMachine()]],
        [CURRENT, sampleSetup()],
      ],
      raw(),
    );
    const s = await pageLoad();
    expect(await s.openStore()).toEqual({ mode: 'saved' });
    expect(s.storageMessage.value).toBe(
      'The saved data on this device was not in a form Trueturn can read. A copy was kept on this device and saving starts afresh.',
    );
    const [copy] = await s.listRecovered();
    expect(copy.records).toEqual({
      [META]: { schema: 'one' },
      [MACHINES]: [sampleMachine()],
      [CURRENT]: sampleSetup(),
    });
    expect(await s.readSavedMachines()).toEqual([]);
    expect(await get(META, raw())).toEqual({ schema: 1 });
  });

  it('never reuses a recovered key', async () => {
    const s = await pageLoad();
    await s.openStore();
    await set(CURRENT, 'bad 1', raw());
    await s.loadCurrentSetup();
    await set(CURRENT, 'bad 2', raw());
    await s.loadCurrentSetup();
    const recovered = await s.listRecovered();
    expect(recovered.map((r) => r.records[CURRENT])).toEqual(['bad 1', 'bad 2']);
  });
});

describe('schema versions', () => {
  it('leaves data from a newer version untouched and works in memory', async () => {
    const newer = { machines: { format: 'something new' } };
    await setMany(
      [
        [META, { schema: 2 }],
        [MACHINES, newer],
      ],
      raw(),
    );
    const s = await pageLoad();
    const status = await s.openStore();
    expect(status.mode).toBe('memory');
    expect(status.reason).toMatch(
      /^Saved data on this device was written by a newer version of Trueturn/,
    );
    await s.writeSavedMachines([sampleMachine()]);
    expect(await get(META, raw())).toEqual({ schema: 2 });
    expect(await get(MACHINES, raw())).toEqual(newer);
  });

  it('upgrades schema 0 (no meta record, machines kept by id) to a list', async () => {
    // Schema 0 is the draft layout described beside `upgrades` in storage.ts.
    const a = sampleMachine({ id: 'b-second', name: 'B' });
    const b = sampleMachine({ id: 'a-first', name: 'A' });
    await setMany(
      [
        [MACHINES, { 'b-second': a, 'a-first': b }],
        [CURRENT, sampleSetup()],
      ],
      raw(),
    );

    const s = await pageLoad();
    expect(await s.openStore()).toEqual({ mode: 'saved' });
    expect(await get(META, raw())).toEqual({ schema: 1 });
    expect(await s.readSavedMachines()).toEqual([b, a]);
    expect(await s.loadCurrentSetup()).toEqual(sampleSetup());
    expect(s.storageMessage.value).toBeNull();
  });

  it('treats a database with no records at all as a first run, not as a problem', async () => {
    const s = await pageLoad();
    await s.openStore();
    expect(await keys(raw())).toEqual([META]);
    expect(s.storageMessage.value).toBeNull();
  });

  it('sets schema 0 data aside when it does not have the schema 0 layout', async () => {
    await set(MACHINES, 'not a map', raw());
    const s = await pageLoad();
    expect(await s.openStore()).toEqual({ mode: 'saved' });
    expect(s.storageMessage.value).toBe(
      'Saved machines from an older version of Trueturn could not be upgraded; a copy was kept on this device.',
    );
    expect((await s.listRecovered())[0].records[MACHINES]).toBe('not a map');
    expect(await s.readSavedMachines()).toEqual([]);
  });

  it('has an upgrade for every schema below the current one, each a pure function', async () => {
    const s = await pageLoad();
    for (let v = 0; v < s.SCHEMA_VERSION; v++) expect(typeof s.upgrades[v]).toBe('function');
    const input = { machines: { x: 1 }, currentSetup: 'kept' };
    expect(s.upgrades[0](input)).toEqual({ machines: [1], currentSetup: 'kept' });
    expect(input).toEqual({ machines: { x: 1 }, currentSetup: 'kept' });
    expect(s.upgrades[0]({ machines: undefined, currentSetup: undefined })).toEqual({
      machines: undefined,
      currentSetup: undefined,
    });
    expect(() => s.upgrades[0]({ machines: [1], currentSetup: undefined })).toThrow(
      'the saved machines are not in the layout of schema 0.',
    );
  });
});
