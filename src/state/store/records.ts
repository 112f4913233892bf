// The records the app keeps on the device (all keys start with "trueturn/"), schema 2:
//   trueturn/meta                   { schema: 2 }
//   trueturn/machine/<id>           { version, machine }   one record per saved machine
//   trueturn/work                   { work }                the working copy on screen
//   trueturn/recovered/<time>-<n>   a record that could not be read, kept as it was found
// Schema 1 (before per-machine records) kept every machine in one list, "trueturn/machines",
// and the set-up on screen in "trueturn/current-setup"; upgradeSchema1 turns those into the
// records above.
import { blankHeader, defaultToolInputs, type Machine, type MachineContent } from '../model';
import { DataError, readRecord } from '../read';
import { machineV1toV2 } from '../upgrade';
import { validateContent, validateMachine, validateSetup } from '../validate';

export const SCHEMA_VERSION = 2;

export const KEYS = {
  meta: 'trueturn/meta',
  machinePrefix: 'trueturn/machine/',
  work: 'trueturn/work',
  recoveredPrefix: 'trueturn/recovered/',
  /** Schema 1 only. */
  oldMachines: 'trueturn/machines',
  oldCurrentSetup: 'trueturn/current-setup',
} as const;

export const machineKey = (id: string): string => `${KEYS.machinePrefix}${id}`;

/** A saved machine as stored: its content and how many times it was written. */
export interface StoredMachine {
  version: number;
  machine: Machine;
}

/** The working copy: what is on screen, and the saved machine (and its version) it came from. */
export interface WorkRecord {
  openId: string | null;
  /** The version of the open machine when it was opened or last saved from here. */
  baseVersion: number | null;
  content: MachineContent;
}

/** A record put aside because it could not be read, with when and why. */
export interface RecoveredRecord {
  key: string;
  savedAt: string;
  reason: string;
  /** The unreadable records as they were found, by their original key. */
  records: Record<string, unknown>;
}

/** The schema number of a meta record; DataError for anything else. */
export function readSchema(meta: unknown): number {
  const r = readRecord(meta, 'meta', ['schema']);
  if (typeof r.schema !== 'number' || !Number.isInteger(r.schema) || r.schema < 1) {
    throw new DataError('meta › schema', 'meta › schema must be a whole number from 1.');
  }
  return r.schema;
}

/** A stored machine record, checked. DataError names what is wrong. */
export function readStoredMachine(x: unknown, id: string): StoredMachine {
  const r = readRecord(x, `saved machine ${id}`, ['version', 'machine']);
  if (typeof r.version !== 'number' || !Number.isInteger(r.version) || r.version < 1) {
    throw new DataError('version', `saved machine ${id} has no valid version number.`);
  }
  const machine = validateMachine(r.machine, `saved machine "${describeName(r.machine)}"`);
  if (machine.id !== id) {
    throw new DataError('id', `saved machine ${id} holds a machine with another id.`);
  }
  return { version: r.version, machine };
}

/** The working copy record, checked. */
export function readWork(x: unknown): WorkRecord {
  const r = readRecord(x, 'working copy', ['openId', 'baseVersion', 'content']);
  const openId =
    typeof r.openId === 'string' && /^[A-Za-z0-9_-]{1,100}$/.test(r.openId) ? r.openId : null;
  const baseVersion =
    typeof r.baseVersion === 'number' && Number.isInteger(r.baseVersion) && r.baseVersion >= 1
      ? r.baseVersion
      : null;
  return {
    openId,
    baseVersion: openId === null ? null : baseVersion,
    content: validateContent(r.content, 'working copy'),
  };
}

function describeName(x: unknown): string {
  const name = typeof x === 'object' && x !== null ? (x as { name?: unknown }).name : undefined;
  return typeof name === 'string' ? [...name].slice(0, 40).join('') : 'without a name';
}

/** What schema 1 held, turned into schema 2 records; unreadable parts come back in `bad`. */
export interface Schema1Upgrade {
  machines: StoredMachine[];
  work: WorkRecord | null;
  bad: Record<string, unknown>;
  problems: string[];
}

/** Turns schema 1's list and current set-up into schema 2 records, keeping what cannot be read aside. */
export function upgradeSchema1(list: unknown, currentSetup: unknown): Schema1Upgrade {
  const out: Schema1Upgrade = { machines: [], work: null, bad: {}, problems: [] };
  const badMachines: unknown[] = [];
  if (list !== undefined && !Array.isArray(list)) {
    out.bad[KEYS.oldMachines] = list;
    out.problems.push('The list of saved machines was not a list.');
  } else if (Array.isArray(list)) {
    const ids = new Set<string>();
    list.forEach((item: unknown, i) => {
      try {
        const machine = validateMachine(
          machineV1toV2(item, `saved machine ${i + 1}`),
          `saved machine ${i + 1}`,
        );
        if (ids.has(machine.id))
          throw new DataError('id', `saved machine ${i + 1} repeats the id of another machine.`);
        ids.add(machine.id);
        out.machines.push({ version: 1, machine });
      } catch (e) {
        badMachines.push(item);
        out.problems.push(e instanceof Error ? e.message : String(e));
      }
    });
    if (badMachines.length > 0) out.bad[KEYS.oldMachines] = badMachines;
  }
  if (currentSetup !== undefined) {
    try {
      const setup = validateSetup(currentSetup, 'last set-up');
      out.work = {
        openId: null,
        baseVersion: null,
        content: { ...blankHeader(), setup, tools: defaultToolInputs() },
      };
    } catch (e) {
      out.bad[KEYS.oldCurrentSetup] = currentSetup;
      out.problems.push(e instanceof Error ? e.message : String(e));
    }
  }
  return out;
}

let recoveredCount = 0;

/** A record that keeps unreadable records under a key of its own, never reused. */
export function recoveredEntry(
  reason: string,
  records: Record<string, unknown>,
): [string, RecoveredRecord] {
  const savedAt = new Date().toISOString();
  recoveredCount += 1;
  const key = `${KEYS.recoveredPrefix}${savedAt}-${recoveredCount}-${Math.random().toString(36).slice(2, 8)}`;
  return [key, { key, savedAt, reason, records }];
}

/** Our own recovered record, or null for anything else found under the prefix. */
export function asRecovered(value: unknown): RecoveredRecord | null {
  if (typeof value !== 'object' || value === null) return null;
  const r = value as Partial<RecoveredRecord>;
  return typeof r.key === 'string' &&
    typeof r.savedAt === 'string' &&
    typeof r.reason === 'string' &&
    typeof r.records === 'object' &&
    r.records !== null
    ? (value as RecoveredRecord)
    : null;
}
