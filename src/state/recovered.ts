// Data set aside because it could not be read (store/records.ts): listed on the Machines screen,
// downloadable as it was found, and restorable — every machine in it that passes the checks now
// (after the same upgrades as a file) is added to the list; the rest stays set aside.
import { signal } from '@preact/signals';
import { addMachines, newId, type ImportResult } from './machines';
import { blankHeader, defaultToolInputs, type Machine } from './model';
import { listRecovered, removeRecovered, type RecoveredRecord } from './store';
import { machineV1toV2 } from './upgrade';
import { validateContent, validateMachine, validateSetup } from './validate';

/** What is set aside on this device, oldest first (read when the Machines screen opens). */
export const recovered = signal<RecoveredRecord[]>([]);

/** Reads the set-aside records again. */
export async function refreshRecovered(): Promise<void> {
  recovered.value = await listRecovered();
}

const stamp = () => new Date().toISOString();

/** One value as a machine, trying each layout it may have been saved in; null when none fits. */
function asMachine(value: unknown, label: string): Machine | null {
  const tries: Array<() => Machine> = [
    () => validateMachine(value),
    () => validateMachine((value as { machine?: unknown }).machine),
    () => validateMachine(machineV1toV2(value, label)),
    () => {
      const content = validateContent((value as { work?: { content?: unknown } }).work?.content);
      return {
        ...content,
        name: content.name.trim() || label,
        id: newId(),
        createdAt: stamp(),
        updatedAt: stamp(),
      };
    },
    () => ({
      ...blankHeader(label),
      setup: validateSetup(value),
      tools: defaultToolInputs(),
      id: newId(),
      createdAt: stamp(),
      updatedAt: stamp(),
    }),
  ];
  for (const attempt of tries) {
    try {
      return attempt();
    } catch {
      // Not this layout: try the next.
    }
  }
  return null;
}

/** Every machine a set-aside record still holds that passes the checks, and how many items do not. */
export function machinesIn(record: RecoveredRecord): { machines: Machine[]; unreadable: number } {
  const machines: Machine[] = [];
  let unreadable = 0;
  const label = `Recovered ${record.savedAt.slice(0, 10)}`;
  for (const value of Object.values(record.records)) {
    const items = Array.isArray(value) ? value : [value];
    for (const item of items) {
      const m = asMachine(item, label);
      if (m) machines.push(m);
      else unreadable += 1;
    }
  }
  return { machines, unreadable };
}

/** Outcome of a restore: what was added, and whether the record could be removed. */
export type RestoreResult = (ImportResult & { unreadable: number }) | { ok: false; error: string };

/**
 * Adds the readable machines of a set-aside record to the list (names that clash get
 * "(restored)"). The record is removed only when everything in it was restored.
 */
export async function restoreRecovered(record: RecoveredRecord): Promise<RestoreResult> {
  const { machines, unreadable } = machinesIn(record);
  if (machines.length === 0) {
    return {
      ok: false,
      error:
        'Nothing in it can be read as a machine yet; it stays set aside. Download it to keep a copy.',
    };
  }
  const added = await addMachines(machines, 'restored');
  if (added.ok && unreadable === 0 && !added.held) await removeRecovered(record.key);
  await refreshRecovered();
  return added.ok ? { ...added, unreadable } : added;
}
