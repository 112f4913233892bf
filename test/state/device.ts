// The app's database as the browser holds it, for tests of the store (fake-indexeddb): what a
// device holds before a page loads, and what it holds after.
import { createStore, entries, setMany } from 'idb-keyval';
import type { Machine } from '../../src/state/model';

/** Direct access to the app's database. */
export const raw = () => createStore('trueturn', 'records');

/** A device that already holds these machines (schema 2, one record each, version 1), and no example. */
export async function deviceWith(machines: Machine[]): Promise<void> {
  await setMany(
    [
      ['trueturn/meta', { schema: 2 }],
      ...machines.map((m) => [`trueturn/machine/${m.id}`, { version: 1, machine: m }] as [string, unknown]),
    ],
    raw(),
  );
}

/** Every machine record on the device, by id, as { version, machine }. */
export async function storedRecords(): Promise<Map<string, { version: number; machine: Machine }>> {
  const out = new Map<string, { version: number; machine: Machine }>();
  for (const [key, value] of await entries(raw())) {
    if (typeof key === 'string' && key.startsWith('trueturn/machine/')) {
      out.set(key.slice('trueturn/machine/'.length), value as { version: number; machine: Machine });
    }
  }
  return out;
}

/** The names of the machines on the device, sorted as text. */
export async function storedNames(): Promise<string[]> {
  return [...(await storedRecords()).values()].map((r) => r.machine.name).sort();
}
