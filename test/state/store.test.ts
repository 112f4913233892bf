// The store (src/state/store): one record per machine with a version, the working copy, and
// every fault a browser can throw at it, on fake-indexeddb. A "page load" is a fresh copy of the
// modules over the same database; two page loads side by side are two tabs.
import 'fake-indexeddb/auto';
import { IDBFactory } from 'fake-indexeddb';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import {
  deviceWith,
  getRecord,
  putRecords,
  recordKeys,
  storedNames,
  storedRecords,
} from './device';
import { sampleContent, sampleMachine, sampleSetup } from './fixtures';

type MachinesModule = typeof import('../../src/state/machines');

beforeEach(() => {
  globalThis.indexedDB = new IDBFactory() as unknown as typeof globalThis.indexedDB;
});

afterEach(() => {
  vi.restoreAllMocks();
  vi.useRealTimers();
});

/** A new page (a tab): fresh module state over the same database, its list loaded. */
async function pageLoad(): Promise<MachinesModule> {
  vi.resetModules();
  const m = await import('../../src/state/machines');
  await m.loadMachines();
  return m;
}

const names = (m: MachinesModule) => m.machines.value.map((x) => x.name);

describe('records on the device', () => {
  it('writes the schema, one record per machine, and a version that grows with each write', async () => {
    await deviceWith([sampleMachine()]);
    const m = await pageLoad();
    expect(await getRecord('trueturn/meta')).toEqual({ schema: 2 });
    expect(m.storageStatus.value).toEqual({ mode: 'saved' });
    await m.renameMachine('machine-1', 'Blower A');
    await m.renameMachine('machine-1', 'Blower B');
    const stored = (await storedRecords()).get('machine-1');
    expect(stored?.version).toBe(3);
    expect(stored?.machine.name).toBe('Blower B');
  });

  it('keeps the working copy for the next visit, every tool included', async () => {
    const m = await pageLoad();
    const store = await import('../../src/state/store');
    const content = sampleContent();
    content.tools.logger.sampleHz = 2500;
    content.tools.speedFinder.readings = [{ rateFpm: 1450, images: 2 }];
    store.queueWork({ openId: null, baseVersion: null, content });
    await store.flush();
    expect(m.storageStatus.value.mode).toBe('saved');
    vi.resetModules();
    const next = await import('../../src/state/store');
    const loaded = await next.loadAll();
    expect(loaded.work?.content).toEqual(content);
  });
});

describe('two tabs', () => {
  it('two tabs saving different machines keep both', async () => {
    const first = await pageLoad();
    const second = await pageLoad();
    await first.saveMachine('Kiln fan', sampleContent());
    await second.saveMachine('Auger', sampleContent());
    expect(await storedNames()).toEqual([
      'Auger',
      'Example: cooler fan, pellet line 2',
      'Kiln fan',
    ]);
    // The other tab hears of it and reads the list again.
    await first.refresh();
    expect(names(first)).toEqual(['Auger', 'Example: cooler fan, pellet line 2', 'Kiln fan']);
  });

  it('two tabs changing the same machine keep both, the later one as a copy, and say so', async () => {
    await deviceWith([sampleMachine()]);
    const first = await pageLoad();
    const second = await pageLoad();
    const a = await first.updateMachine(
      'machine-1',
      sampleContent({ notes: 'from the first tab' }),
    );
    expect(a.outcome).toEqual({ kind: 'saved', version: 2 });
    const b = await second.updateMachine(
      'machine-1',
      sampleContent({ notes: 'from the second tab' }),
    );
    expect(b.outcome.kind).toBe('copied');
    const records = [...(await storedRecords()).values()].map((r) => r.machine);
    expect(records.map((r) => r.notes).sort()).toEqual([
      'from the first tab',
      'from the second tab',
    ]);
    expect(names(second)).toEqual(['Blower, test bay', 'Blower, test bay (kept copy)']);
    expect(second.storageMessage.value).toBe(
      'Another tab saved "Blower, test bay" while it was changed here: both are kept, this tab\'s version as "Blower, test bay (kept copy)".',
    );
  });

  it('a delete of a machine another tab changed meanwhile keeps it', async () => {
    await deviceWith([sampleMachine()]);
    const first = await pageLoad();
    const second = await pageLoad();
    await first.renameMachine('machine-1', 'Changed elsewhere');
    await second.deleteMachine('machine-1');
    expect(await storedNames()).toEqual(['Changed elsewhere']);
    expect(names(second)).toEqual(['Changed elsewhere']);
  });
});

describe('saved data cleared while the app is open', () => {
  it('notices at the next write, writes back every machine it holds, and says so', async () => {
    await deviceWith([sampleMachine(), sampleMachine({ id: 'machine-2', name: 'Second' })]);
    const m = await pageLoad();
    // Another page deletes the database: our connection lets go so the deletion can finish.
    await new Promise<void>((done, fail) => {
      const request = indexedDB.deleteDatabase('trueturn');
      request.onsuccess = () => done();
      request.onerror = () => fail(request.error);
    });
    expect(await recordKeys()).toEqual([]);
    await m.saveMachine('Third', sampleContent());
    expect(await storedNames()).toEqual(['Blower, test bay', 'Second', 'Third']);
    expect(m.storageMessage.value).toMatch(
      /^Saved data on this device was cleared while Trueturn was open .* Everything this tab held was written back: 3 machines/,
    );
  });
});

describe('saved data cleared, then only the working copy written', () => {
  it('the write that finds it cleared is followed by one that writes every machine back', async () => {
    await deviceWith([sampleMachine(), sampleMachine({ id: 'machine-2', name: 'Second' })]);
    const m = await pageLoad();
    const store = await import('../../src/state/store');
    await new Promise<void>((done, fail) => {
      const request = indexedDB.deleteDatabase('trueturn');
      request.onsuccess = () => done();
      request.onerror = () => fail(request.error);
    });
    // The working copy alone is written without waiting on any read (a page being left must
    // keep it), so it cannot write back in the same transaction: the next one does, by itself.
    store.queueWork({ openId: null, baseVersion: null, content: sampleContent() });
    await store.flush();
    // Any later flush runs after the write-back it queued.
    await store.flush();
    expect(await storedNames()).toEqual(['Blower, test bay', 'Second']);
    expect(m.storageMessage.value).toMatch(
      /^Saved data on this device was cleared while Trueturn was open .* Everything this tab held was written back: 2 machines and the set-up on screen\.$/,
    );
    expect(await getRecord('trueturn/work')).toEqual({
      work: { openId: null, baseVersion: null, content: sampleContent() },
    });
  });
});

describe('storage that refuses writes', () => {
  it('at start-up: the saved list is still read from the device, and the example is not forced on it', async () => {
    await deviceWith([sampleMachine()]);
    vi.spyOn(globalThis.IDBObjectStore.prototype, 'put').mockImplementation(() => {
      throw new DOMException('full', 'QuotaExceededError');
    });
    const m = await pageLoad();
    expect(names(m)).toEqual(['Blower, test bay']);
    expect(m.storageStatus.value.mode).toBe('failing');
    expect(m.storageStatus.value.reason).toMatch(
      /^Not saved on this device: the storage on this device is full\./,
    );
  });
});

describe('when the browser offers no storage', () => {
  it('works in memory with the example when there is no IndexedDB', async () => {
    delete (globalThis as { indexedDB?: unknown }).indexedDB;
    const m = await pageLoad();
    expect(m.storageStatus.value.mode).toBe('memory');
    expect(m.storageStatus.value.reason).toBe(
      'Saving is off: this browser offers no storage to this page. Changes are kept only until this tab is closed; export your machines to keep them.',
    );
    expect(names(m)).toEqual(['Example: cooler fan, pellet line 2']);
    await m.saveMachine('Kept for now', sampleContent());
    expect(names(m)).toContain('Kept for now');
  });

  it('works in memory when opening the database throws (private window, storage blocked)', async () => {
    vi.spyOn(globalThis.indexedDB, 'open').mockImplementation(() => {
      throw new DOMException('blocked', 'SecurityError');
    });
    const m = await pageLoad();
    expect(m.storageStatus.value.reason).toMatch(
      /^Saving is off: this browser does not let this page save \(a private window, or storage blocked in settings\)\./,
    );
  });

  it('works in memory when the database never finishes opening', async () => {
    vi.useFakeTimers({ toFake: ['setTimeout', 'clearTimeout'] });
    vi.spyOn(globalThis.indexedDB, 'open').mockImplementation(() => ({}) as IDBOpenDBRequest);
    vi.resetModules();
    const store = await import('../../src/state/store');
    const opening = store.openStore();
    await vi.advanceTimersByTimeAsync(store.OPEN_TIMEOUT_MS);
    await opening;
    expect(store.storageStatus.value.reason).toMatch(
      /^Saving is off: saved data did not open in time \(another Trueturn tab may be holding it\)\./,
    );
  });

  it('leaves data from a newer version untouched and works in memory', async () => {
    await putRecords([
      ['trueturn/meta', { schema: 99 }],
      ['trueturn/machine/x', { anything: 1 }],
    ]);
    const m = await pageLoad();
    expect(m.storageStatus.value.mode).toBe('memory');
    expect(m.storageStatus.value.reason).toMatch(/written by a newer version of Trueturn/);
    expect(await getRecord('trueturn/meta')).toEqual({ schema: 99 });
    expect(await getRecord('trueturn/machine/x')).toEqual({ anything: 1 });
  });
});

describe('unreadable data is set aside, never lost', () => {
  it('keeps the readable machines, sets the others aside, and restores them once they read', async () => {
    await deviceWith([sampleMachine()]);
    const bad = { version: 1, machine: { ...sampleMachine({ id: 'machine-2' }), name: 42 } };
    await putRecords([['trueturn/machine/machine-2', bad]]);
    const m = await pageLoad();
    expect(names(m)).toEqual(['Blower, test bay']);
    expect(m.storageMessage.value).toMatch(
      /^1 saved record could not be read \(saved machine "without a name" › name must be text \(got 42\)\); set aside on the Machines screen/,
    );
    const recovered = await import('../../src/state/recovered');
    await recovered.refreshRecovered();
    expect(recovered.recovered.value).toHaveLength(1);
    expect(recovered.recovered.value[0].records['trueturn/machine/machine-2']).toEqual(bad);
    // Nothing in it reads as a machine, so it stays set aside.
    const r = await recovered.restoreRecovered(recovered.recovered.value[0]);
    expect(r.ok).toBe(false);
    expect(recovered.recovered.value).toHaveLength(1);
  });

  it('restores the machines a set-aside record still holds and removes the record', async () => {
    const store = await import('../../src/state/store');
    await deviceWith([]);
    await putRecords([
      [
        'trueturn/recovered/2026-01-01T00:00:00.000Z-1-abc',
        {
          key: 'trueturn/recovered/2026-01-01T00:00:00.000Z-1-abc',
          savedAt: '2026-01-01T00:00:00.000Z',
          reason: 'test',
          records: { 'trueturn/machines': [sampleMachine({ id: 'old', name: 'Old press' })] },
        },
      ],
    ]);
    const m = await pageLoad();
    const recovered = await import('../../src/state/recovered');
    await recovered.refreshRecovered();
    const r = await recovered.restoreRecovered(recovered.recovered.value[0]);
    expect(r.ok).toBe(true);
    expect(names(m)).toEqual(['Old press']);
    expect(await storedNames()).toEqual(['Old press']);
    expect(recovered.recovered.value).toEqual([]);
    expect(store).toBeDefined();
  });

  it('sets everything aside when the meta record cannot be read, then saves afresh', async () => {
    await putRecords([
      ['trueturn/meta', 'garbage'],
      ['trueturn/machine/a', { version: 1 }],
    ]);
    const m = await pageLoad();
    expect(m.storageStatus.value).toEqual({ mode: 'saved' });
    expect(await getRecord('trueturn/meta')).toEqual({ schema: 2 });
    // The one true cause, not "cleared while open" (the unreadable meta record was removed by
    // the app itself).
    expect(m.storageMessage.value).toBe(
      'The saved data on this device was not in a form Trueturn can read; it was set aside (Machines screen) and saving starts afresh.',
    );
    const recovered = await import('../../src/state/recovered');
    await recovered.refreshRecovered();
    expect(recovered.recovered.value[0].records).toEqual({
      'trueturn/meta': 'garbage',
      'trueturn/machine/a': { version: 1 },
    });
  });
});

describe('schema 1 (one list of machines) upgrades to one record per machine', () => {
  it('moves every readable machine and the last set-up, and sets the rest aside', async () => {
    const v1 = (m: ReturnType<typeof sampleMachine>) => {
      const { site: _s, assessedBy: _a, assessedOn: _o, tools: _t, ...old } = m;
      return old;
    };
    await putRecords([
      ['trueturn/meta', { schema: 1 }],
      [
        'trueturn/machines',
        [v1(sampleMachine()), { ...v1(sampleMachine({ id: 'bad' })), name: 7 }],
      ],
      ['trueturn/current-setup', sampleSetup()],
    ]);
    const m = await pageLoad();
    expect(names(m)).toEqual(['Blower, test bay']);
    const stored = (await storedRecords()).get('machine-1');
    expect(stored).toEqual({ version: 1, machine: sampleMachine() });
    expect(await getRecord('trueturn/machines')).toBeUndefined();
    expect(await getRecord('trueturn/current-setup')).toBeUndefined();
    const work = (await getRecord('trueturn/work')) as { work: { content: { setup: unknown } } };
    expect(work.work.content.setup).toEqual(sampleSetup());
    const recovered = await import('../../src/state/recovered');
    await recovered.refreshRecovered();
    expect(recovered.recovered.value[0].records['trueturn/machines']).toHaveLength(1);
  });
});
