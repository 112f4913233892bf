import 'fake-indexeddb/auto';
import { IDBFactory } from 'fake-indexeddb';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { EXAMPLE_MACHINE_NAME, exampleSetup } from '../../src/state/example';
import { FILE_FORMAT_NAME, MAX_MACHINES, parseMachinesFile } from '../../src/state/fileFormat';
import { deviceWith, storedNames, storedRecords } from './device';
import { prototypeIsClean, sampleContent, sampleMachine, sampleSetup } from './fixtures';

type MachinesModule = typeof import('../../src/state/machines');

beforeEach(() => {
  globalThis.indexedDB = new IDBFactory() as unknown as typeof globalThis.indexedDB;
});

afterEach(() => {
  vi.restoreAllMocks();
});

/** The machines module as a new page load sees it (fresh module state, same database), loaded. */
async function pageLoad(): Promise<MachinesModule> {
  vi.resetModules();
  const m = await import('../../src/state/machines');
  await m.loadMachines();
  return m;
}

const names = (m: MachinesModule) => m.machines.value.map((x) => x.name);

/** The error a promise rejects with. */
async function rejection(p: Promise<unknown>): Promise<Error> {
  try {
    await p;
  } catch (e) {
    return e as Error;
  }
  throw new Error('expected the promise to reject');
}

describe('loading', () => {
  it('adds the example machine on the very first run and saves it', async () => {
    const m = await pageLoad();
    expect(names(m)).toEqual([EXAMPLE_MACHINE_NAME]);
    expect(m.machines.value[0].setup).toEqual(exampleSetup);
    expect([...(await storedRecords()).values()]).toEqual([
      { version: 1, machine: m.machines.value[0] },
    ]);
    expect(m.storageStatus.value).toEqual({ mode: 'saved' });
  });

  it('does not bring the example back once the user has deleted it', async () => {
    const first = await pageLoad();
    await first.deleteMachine(first.machines.value[0].id);
    const second = await pageLoad();
    expect(second.machines.value).toEqual([]);
  });

  it('keeps every machine across page loads', async () => {
    const first = await pageLoad();
    const saved = [];
    for (const name of ['Kiln fan', 'Auger 2', 'Auger 10', 'bucket elevator']) {
      saved.push(await first.saveMachine(name, sampleContent()));
    }
    const second = await pageLoad();
    expect(second.machines.value).toEqual(first.machines.value);
    expect(names(second)).toEqual([
      'Auger 2',
      'Auger 10',
      'bucket elevator',
      EXAMPLE_MACHINE_NAME,
      'Kiln fan',
    ]);
    // Calling loadMachines again in the same page reads the same list.
    await second.loadMachines();
    expect(second.machines.value).toEqual(first.machines.value);
  });

  it('loads the saved list before a change, even if the screen forgot to call loadMachines', async () => {
    await deviceWith([sampleMachine()]);
    vi.resetModules();
    const m = await import('../../src/state/machines');
    await m.saveMachine('New one', sampleContent());
    expect(names(m)).toEqual(['Blower, test bay', 'New one']);
    expect(await storedNames()).toEqual(['Blower, test bay', 'New one']);
  });

  it('keeps every change when several are made at once', async () => {
    const m = await pageLoad();
    await Promise.all(['A', 'B', 'C', 'D', 'E'].map((n) => m.saveMachine(n, sampleContent())));
    const again = await pageLoad();
    expect(names(again)).toEqual(['A', 'B', 'C', 'D', 'E', EXAMPLE_MACHINE_NAME]);
  });
});

describe('saving, updating, renaming', () => {
  it('saves a machine under a trimmed name with fresh times and id, and says it is on the device', async () => {
    const m = await pageLoad();
    const result = await m.saveMachine('  Pellet press  ', sampleContent({ notes: 'oil weekly' }));
    expect(result.outcome).toEqual({ kind: 'saved', version: 1 });
    const saved = result.machine;
    expect(saved.name).toBe('Pellet press');
    expect(saved.setup).toEqual(sampleSetup());
    expect(saved.notes).toBe('oil weekly');
    expect(saved.createdAt).toBe(saved.updatedAt);
    expect(Number.isFinite(Date.parse(saved.createdAt))).toBe(true);
    expect(m.machines.value.map((x) => x.id)).toContain(saved.id);
  });

  it('refuses a blank or taken name and an invalid set-up, changing nothing', async () => {
    const m = await pageLoad();
    await m.saveMachine('Pellet press', sampleContent());
    const before = m.machines.value;
    const stored = await storedRecords();
    expect((await rejection(m.saveMachine('  ', sampleContent()))).message).toBe(
      'name must not be blank.',
    );
    expect((await rejection(m.saveMachine('pellet PRESS ', sampleContent()))).message).toBe(
      'A machine called "pellet PRESS" is already saved; choose another name.',
    );
    const bad = sampleSetup();
    bad.strobe.minFpm = 1e5;
    const e = await rejection(m.saveMachine('Other', sampleContent({ setup: bad })));
    expect(e.name).toBe('DataError');
    expect(e.message).toBe('machine › strobe › maxFpm must be above minFpm (got 100000 to 12000).');
    expect(m.machines.value).toBe(before);
    expect(await storedRecords()).toEqual(stored);
  });

  it('refuses a new machine once the list is full', async () => {
    await deviceWith(
      Array.from({ length: MAX_MACHINES }, (_, i) =>
        sampleMachine({ id: `m${i}`, name: `M ${i}` }),
      ),
    );
    const m = await pageLoad();
    expect((await rejection(m.saveMachine('One more', sampleContent()))).message).toBe(
      'At most 500 machines can be saved; delete some before adding more.',
    );
    expect(m.machines.value).toHaveLength(MAX_MACHINES);
  });

  it('updates the set-up of one machine and its time, leaving the others alone', async () => {
    await deviceWith([sampleMachine(), sampleMachine({ id: 'other', name: 'Other' })]);
    const m = await pageLoad();
    const next = sampleSetup();
    next.creepRpm = 5;
    const { machine: updated, outcome } = await m.updateMachine(
      'machine-1',
      sampleContent({ setup: next }),
    );
    expect(outcome).toEqual({ kind: 'saved', version: 2 });
    expect(updated.setup.creepRpm).toBe(5);
    expect(updated.createdAt).toBe(sampleMachine().createdAt);
    expect(Date.parse(updated.updatedAt)).toBeGreaterThan(Date.parse(sampleMachine().updatedAt));
    expect(m.machines.value.find((x) => x.id === 'other')).toEqual(
      sampleMachine({ id: 'other', name: 'Other' }),
    );
    expect(
      (await pageLoad()).machines.value.find((x) => x.id === 'machine-1')?.setup.creepRpm,
    ).toBe(5);
  });

  it('refuses to update or rename a machine that is gone', async () => {
    const m = await pageLoad();
    expect((await rejection(m.updateMachine('nope', sampleContent()))).message).toBe(
      'That machine is no longer in the saved list.',
    );
    expect((await rejection(m.renameMachine('nope', 'X'))).message).toBe(
      'That machine is no longer in the saved list.',
    );
  });

  it('renames a machine, allowing a change of case of its own name but not a taken name', async () => {
    await deviceWith([sampleMachine(), sampleMachine({ id: 'other', name: 'Other' })]);
    const m = await pageLoad();
    expect((await m.renameMachine('machine-1', 'BLOWER, test bay')).machine.name).toBe(
      'BLOWER, test bay',
    );
    expect((await rejection(m.renameMachine('machine-1', 'other'))).message).toBe(
      'A machine called "other" is already saved; choose another name.',
    );
    await m.renameMachine('machine-1', 'Zeta');
    expect(names(m)).toEqual(['Other', 'Zeta']);
  });

  it('replaces the notes of a machine, refusing notes that are too long', async () => {
    await deviceWith([sampleMachine()]);
    const m = await pageLoad();
    expect((await m.setMachineNotes('machine-1', 'belt\nchanged')).machine.notes).toBe(
      'belt\nchanged',
    );
    expect((await rejection(m.setMachineNotes('machine-1', 'x'.repeat(2001)))).message).toBe(
      'Notes can hold at most 2000 characters.',
    );
  });
});

describe('duplicating', () => {
  it('saves a copy called "… copy", then "… copy 2", with the same set-up and a new id', async () => {
    await deviceWith([sampleMachine()]);
    const m = await pageLoad();
    const one = (await m.duplicateMachine('machine-1')).machine;
    const two = (await m.duplicateMachine('machine-1')).machine;
    expect([one.name, two.name]).toEqual(['Blower, test bay copy', 'Blower, test bay copy 2']);
    expect(one.setup).toEqual(sampleMachine().setup);
    expect(one.id).not.toBe('machine-1');
    expect(one.id).not.toBe(two.id);
    expect(names(m)).toEqual([
      'Blower, test bay',
      'Blower, test bay copy',
      'Blower, test bay copy 2',
    ]);
  });

  it('shortens a long name so the copy stays within 80 characters', async () => {
    await deviceWith([sampleMachine({ name: 'L'.repeat(80) })]);
    const m = await pageLoad();
    const copy = (await m.duplicateMachine('machine-1')).machine;
    expect(copy.name).toBe('L'.repeat(75) + ' copy');
  });
});

describe('deleting and undoing', () => {
  it('brings back the deleted machine with its id, set-up and place in the list', async () => {
    await deviceWith([
      sampleMachine({ id: 'a', name: 'A' }),
      sampleMachine({ id: 'b', name: 'B' }),
      sampleMachine({ id: 'c', name: 'C' }),
    ]);
    const m = await pageLoad();
    expect(await m.deleteMachine('b')).toBe(true);
    expect(names(m)).toEqual(['A', 'C']);
    expect(m.lastDeleted.value).toEqual({
      machine: sampleMachine({ id: 'b', name: 'B' }),
      position: 1,
    });
    expect([...(await storedRecords()).keys()].sort()).toEqual(['a', 'c']);

    const back = await m.undoDelete();
    expect(back).toEqual(sampleMachine({ id: 'b', name: 'B' }));
    expect(names(m)).toEqual(['A', 'B', 'C']);
    expect(m.lastDeleted.value).toBeNull();
    expect((await pageLoad()).machines.value.map((x) => x.id)).toEqual(['a', 'b', 'c']);
  });

  it('can undo only the last deletion', async () => {
    await deviceWith([
      sampleMachine({ id: 'a', name: 'A' }),
      sampleMachine({ id: 'b', name: 'B' }),
    ]);
    const m = await pageLoad();
    await m.deleteMachine('a');
    await m.deleteMachine('b');
    expect((await m.undoDelete())?.id).toBe('b');
    expect(await m.undoDelete()).toBeNull();
    expect(names(m)).toEqual(['B']);
  });

  it('has nothing to undo once the offer is forgotten', async () => {
    await deviceWith([sampleMachine()]);
    const m = await pageLoad();
    await m.deleteMachine('machine-1');
    m.forgetDeleted();
    expect(await m.undoDelete()).toBeNull();
    expect(m.machines.value).toEqual([]);
  });

  it('renames the restored machine if its name was taken in the meantime', async () => {
    await deviceWith([sampleMachine()]);
    const m = await pageLoad();
    await m.deleteMachine('machine-1');
    await m.saveMachine('Blower, test bay', sampleContent());
    expect((await m.undoDelete())?.name).toBe('Blower, test bay (restored)');
  });

  it('reports false when deleting a machine that is already gone', async () => {
    const m = await pageLoad();
    expect(await m.deleteMachine('nope')).toBe(false);
    expect(m.lastDeleted.value).toBeNull();
  });
});

describe('import and export', () => {
  function fileWith(machines: unknown[]): string {
    return JSON.stringify({
      format: FILE_FORMAT_NAME,
      version: 2,
      exportedAt: '2025-04-01T10:00:00Z',
      machines,
    });
  }

  it('exports every machine in a file that reads back the same', async () => {
    await deviceWith([
      sampleMachine({ id: 'a', name: 'A' }),
      sampleMachine({ id: 'b', name: 'B' }),
    ]);
    const m = await pageLoad();
    expect(parseMachinesFile(m.exportAll())).toEqual({ ok: true, machines: m.machines.value });
  });

  it('adds imported machines with new ids, renaming those whose names are taken', async () => {
    await deviceWith([sampleMachine({ id: 'a', name: 'Fan' })]);
    const m = await pageLoad();
    const text = fileWith([
      sampleMachine({ id: 'a', name: 'fan' }),
      sampleMachine({ id: 'x', name: 'Fan' }),
      sampleMachine({ id: 'y', name: 'Press' }),
    ]);
    const r = await m.importMachines(text);
    if (!r.ok) throw new Error(r.error);
    expect(r.added.map((x) => x.name)).toEqual(['fan (imported)', 'Fan (imported 2)', 'Press']);
    expect(r.renamed).toEqual([
      { from: 'fan', to: 'fan (imported)' },
      { from: 'Fan', to: 'Fan (imported 2)' },
    ]);
    expect(new Set(m.machines.value.map((x) => x.id)).size).toBe(4);
    expect(r.added.every((x) => x.id !== 'a' && x.id !== 'x' && x.id !== 'y')).toBe(true);
    expect(r.added[2].setup).toEqual(sampleSetup());
    expect(r.added[2].createdAt).toBe(sampleMachine().createdAt);
    // Sorted by the browser's collation, in which a space comes before ")".
    expect(names(await pageLoad())).toEqual(['Fan', 'Fan (imported 2)', 'fan (imported)', 'Press']);
  });

  it('round-trips an export through import as copies', async () => {
    await deviceWith([sampleMachine()]);
    const m = await pageLoad();
    const r = await m.importMachines(m.exportAll());
    expect(r.ok).toBe(true);
    expect(names(m)).toEqual(['Blower, test bay', 'Blower, test bay (imported)']);
  });

  it('changes nothing when the file is bad, hostile or too big for the list', async () => {
    await deviceWith([sampleMachine()]);
    const m = await pageLoad();
    const before = m.machines.value;
    const stored = await storedRecords();
    const good = JSON.parse(JSON.stringify(sampleMachine({ id: 'n', name: 'New' })));
    const bad = { ...good, id: 'm', name: 'Bad', setup: { ...good.setup, creepRpm: 'slow' } };
    const attempts: Array<[string, string]> = [
      ['not json', 'This is not a Trueturn machines file: it is not valid JSON text.'],
      [fileWith([good, bad]), 'machine 2 › creepRpm must be a number (got the text "slow").'],
      [
        fileWith([good]).replace('"id":"n"', '"__proto__":{"polluted":true},"id":"n"'),
        'machine 1 contains a field called "__proto__", which is never allowed in Trueturn data.',
      ],
      [
        fileWith(
          Array.from({ length: MAX_MACHINES }, (_, i) => ({
            ...good,
            id: `n${i}`,
            name: `N ${i}`,
          })),
        ),
        'This holds 500 machines but only 499 more can be saved (at most 500); nothing was added.',
      ],
    ];
    for (const [text, error] of attempts) {
      expect(await m.importMachines(text)).toEqual({ ok: false, error });
    }
    expect(m.machines.value).toBe(before);
    expect(await storedRecords()).toEqual(stored);
    expect(prototypeIsClean()).toBe(true);
  });
});

describe('when the browser cannot save', () => {
  it('works in memory with the example when there is no IndexedDB', async () => {
    delete (globalThis as { indexedDB?: unknown }).indexedDB;
    const m = await pageLoad();
    expect(m.storageStatus.value.mode).toBe('memory');
    expect(names(m)).toEqual([EXAMPLE_MACHINE_NAME]);
    const kept = (await m.saveMachine('Kept for now', sampleContent())).machine;
    await m.deleteMachine(kept.id);
    expect(names(m)).toEqual([EXAMPLE_MACHINE_NAME]);
    expect((await m.undoDelete())?.name).toBe('Kept for now');
    expect(names(m)).toEqual([EXAMPLE_MACHINE_NAME, 'Kept for now']);
  });

  it('keeps a machine in the tab, never says saved, and saves it by itself once writes work again', async () => {
    await deviceWith([sampleMachine()]);
    const m = await pageLoad();
    const put = vi.spyOn(globalThis.IDBObjectStore.prototype, 'put').mockImplementation(() => {
      throw new DOMException('full', 'QuotaExceededError');
    });
    const { machine: saved, outcome } = await m.saveMachine('New', sampleContent());
    expect(outcome).toEqual({ kind: 'held' });
    expect(m.machines.value).toContainEqual(saved);
    expect(m.heldIds.value.has(saved.id)).toBe(true);
    expect(m.storageStatus.value.mode).toBe('failing');
    expect(m.storageStatus.value.reason).toMatch(/the storage on this device is full/);
    // Later changes are held too, and the device keeps what it had.
    await m.renameMachine(saved.id, 'Renamed');
    expect(names(m)).toEqual(['Blower, test bay', 'Renamed']);
    expect(await storedNames()).toEqual(['Blower, test bay']);
    // Space is freed: the next try (on the store's own timer) writes everything held.
    put.mockRestore();
    await vi.waitFor(
      async () => expect(await storedNames()).toEqual(['Blower, test bay', 'Renamed']),
      {
        timeout: 5000,
      },
    );
    expect(m.storageStatus.value).toEqual({ mode: 'saved' });
    expect(m.heldIds.value.size).toBe(0);
  });
});

describe('newId', () => {
  const UUID4 = /^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/;

  it('uses crypto.randomUUID when the browser has it', async () => {
    const { newId } = await import('../../src/state/machines');
    expect(newId({ randomUUID: () => '00000000-0000-4000-8000-000000000000' })).toBe(
      '00000000-0000-4000-8000-000000000000',
    );
    expect(newId()).toMatch(UUID4);
  });

  it('makes a version-4 UUID from random bytes when randomUUID is missing (insecure pages)', async () => {
    const { newId } = await import('../../src/state/machines');
    const allOnes = {
      getRandomValues: <T extends ArrayBufferView | null>(a: T) => (
        new Uint8Array(a!.buffer).fill(0xff),
        a
      ),
    };
    expect(newId(allOnes)).toBe('ffffffff-ffff-4fff-bfff-ffffffffffff');
    const allZeros = { getRandomValues: <T extends ArrayBufferView | null>(a: T) => a };
    expect(newId(allZeros)).toBe('00000000-0000-4000-8000-000000000000');
  });

  it('still makes distinct, valid ids with no crypto at all', async () => {
    const { newId } = await import('../../src/state/machines');
    const ids = Array.from({ length: 50 }, () => newId({}));
    expect(new Set(ids).size).toBe(50);
    for (const id of ids) expect(id).toMatch(/^[A-Za-z0-9_-]{1,100}$/);
  });
});

describe('uniqueName', () => {
  it('keeps a free name and numbers a taken one, ignoring case', async () => {
    const { uniqueName } = await import('../../src/state/machines');
    const suffix = (n: number) => (n === 1 ? ' copy' : ` copy ${n}`);
    expect(uniqueName('Fan', new Set(['press']), suffix)).toBe('Fan');
    expect(uniqueName('Fan', new Set(['fan', 'fan copy']), suffix)).toBe('Fan copy 2');
  });
});
