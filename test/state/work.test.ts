// @vitest-environment happy-dom
// The working copy is written once typing pauses (src/state/work.ts WORK_SAVE_DELAY_MS), and at
// once when the page is hidden or left, so the last keystroke is never lost. Fake timers stand in
// for the pause; the database is fake-indexeddb.
import 'fake-indexeddb/auto';
import { IDBFactory } from 'fake-indexeddb';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { getRecord, putRecords } from './device';

type WorkModule = typeof import('../../src/state/work');

let stop: (() => void) | undefined;

beforeEach(() => {
  globalThis.indexedDB = new IDBFactory() as unknown as typeof globalThis.indexedDB;
});

afterEach(() => {
  stop?.();
  stop = undefined;
  vi.useRealTimers();
  vi.restoreAllMocks();
});

/** A page with the store open and the working copy kept, timers fake from here on. */
async function page(): Promise<{
  work: WorkModule;
  store: typeof import('../../src/state/store');
}> {
  vi.resetModules();
  const store = await import('../../src/state/store');
  const work = await import('../../src/state/work');
  await store.openStore();
  // Only the debounce's timers are faked: the fake database keeps its own scheduling.
  vi.useFakeTimers({ toFake: ['setTimeout', 'clearTimeout'] });
  stop = work.keepWork();
  return { work, store };
}

/** The machine name in the working copy on the device, once every queued write has landed. */
async function storedName(
  store: typeof import('../../src/state/store'),
): Promise<string | undefined> {
  await store.flush();
  const r = (await getRecord('trueturn/work')) as
    { work: { content: { name: string } } } | undefined;
  return r?.work.content.name;
}

describe('the working copy while typing', () => {
  it('is written once typing pauses, not at every keystroke', async () => {
    const { work, store } = await page();
    for (const name of ['K', 'Ki', 'Kil', 'Kiln']) {
      work.setHeader({ name });
      await vi.advanceTimersByTimeAsync(work.WORK_SAVE_DELAY_MS - 1);
      expect(await storedName(store)).toBeUndefined();
    }
    await vi.advanceTimersByTimeAsync(1);
    expect(await storedName(store)).toBe('Kiln');
  });

  it('is written at once when the page is left (pagehide)', async () => {
    const { work, store } = await page();
    work.setHeader({ name: 'Auger' });
    expect(await storedName(store)).toBeUndefined();
    window.dispatchEvent(new Event('pagehide'));
    expect(await storedName(store)).toBe('Auger');
  });

  it('is written at once when the page is hidden, not when it is shown', async () => {
    const { work, store } = await page();
    let state: DocumentVisibilityState = 'visible';
    vi.spyOn(document, 'visibilityState', 'get').mockImplementation(() => state);
    work.setHeader({ name: 'Dryer' });
    document.dispatchEvent(new Event('visibilitychange'));
    expect(await storedName(store)).toBeUndefined();
    state = 'hidden';
    document.dispatchEvent(new Event('visibilitychange'));
    expect(await storedName(store)).toBe('Dryer');
  });

  it('writes nothing until something changes, and nothing twice', async () => {
    const { work, store } = await page();
    window.dispatchEvent(new Event('pagehide'));
    expect(await storedName(store)).toBeUndefined();
    work.setHeader({ name: 'Mixer' });
    window.dispatchEvent(new Event('pagehide'));
    expect(await storedName(store)).toBe('Mixer');
    // A mark in its place shows whether anything writes the working copy again.
    await putRecords([['trueturn/work', { work: { content: { name: 'mark' } } }]]);
    await vi.advanceTimersByTimeAsync(work.WORK_SAVE_DELAY_MS);
    window.dispatchEvent(new Event('pagehide'));
    expect(await storedName(store)).toBe('mark');
  });
});
