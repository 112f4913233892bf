// Trueturn's own file for moving saved machines between devices (docs/file-format.md):
//   { "format": "trueturn-machines", "version": 2, "exportedAt": ISO time, "machines": [...] }
// Reading is strict: any file that is not exactly this shape is refused with a message, and
// nothing of a refused file is used. Older versions are upgraded step by step through
// `migrations` before the strict check.

import type { Machine } from './model';
import { machineV1toV2 } from './upgrade';
import {
  DataError,
  describe,
  pathTo,
  readList,
  readRecord,
  validateIsoTime,
  validateMachine,
} from './validate';

/** The `format` value that marks a Trueturn machines file. */
export const FILE_FORMAT_NAME = 'trueturn-machines';
/** The version this app writes, and the newest it reads. */
export const FILE_FORMAT_VERSION = 2;
/** Largest file accepted, in bytes of UTF-8 (1 MiB). */
export const MAX_FILE_BYTES = 1024 * 1024;
/** Most machines one file (and the saved list) may hold. */
export const MAX_MACHINES = 500;

/**
 * Upgrades, by the version they read: `migrations[v]` takes a parsed file of version v and
 * returns the same content as version v + 1. Each one checks the shape it reads and builds
 * fresh objects; the strict check of the current version runs afterwards on the result.
 *
 * Version 0 was a draft that never shipped in a release; it is kept so the upgrade path is
 * exercised by tests (docs/file-format.md, "Older versions"). Its machines had one `savedAt`
 * time instead of `createdAt`/`updatedAt`, `notes` could be left out, and the file had no
 * `exportedAt`. Version 1 machines were a named set-up with notes; version 2 adds the site, the
 * report header (assessed by, assessed on) and every tool's inputs (upgrade.ts).
 */
export const migrations: Readonly<Record<number, (file: unknown) => unknown>> = {
  0: (file: unknown): unknown => {
    const f = readRecord(file, 'file', ['format', 'version', 'machines']);
    const list = readList(f.machines, 'machines', 0, MAX_MACHINES, 'machines');
    const machines = list.map((x, i) => {
      const path = `machine ${i + 1}`;
      const m = readRecord(x, path, ['id', 'name', 'setup', 'savedAt'], ['notes']);
      return {
        id: m.id,
        name: m.name,
        setup: m.setup,
        createdAt: m.savedAt,
        updatedAt: m.savedAt,
        notes: 'notes' in m ? m.notes : '',
      };
    });
    // The draft did not record when a file was made; the newest machine time stands in for it.
    const times = machines
      .map((m) => m.updatedAt)
      .filter((t): t is string => typeof t === 'string' && Number.isFinite(Date.parse(t)));
    const exportedAt = times.length > 0 ? times.sort().at(-1) : new Date(0).toISOString();
    return { format: f.format, version: 1, exportedAt, machines };
  },
  1: (file: unknown): unknown => {
    const f = readRecord(file, 'file', ['format', 'version', 'exportedAt', 'machines']);
    const list = readList(f.machines, 'machines', 0, MAX_MACHINES, 'machines');
    const machines = list.map((m, i) => machineV1toV2(m, `machine ${i + 1}`));
    return { format: f.format, version: 2, exportedAt: f.exportedAt, machines };
  },
};

/** Oldest version this app can still read through `migrations`. */
export const OLDEST_READABLE_VERSION = Math.min(
  FILE_FORMAT_VERSION,
  ...Object.keys(migrations).map(Number),
);

/**
 * The given machines as a machines file (pretty-printed JSON, version FILE_FORMAT_VERSION).
 * Each machine is checked and copied field by field first, so the file holds nothing else.
 * If the pretty file would be larger than MAX_FILE_BYTES it is written without indentation.
 * Throws DataError if a machine is invalid, or if even the compact file could not be read back
 * (too many machines or too large): export fewer machines at a time.
 */
export function exportMachinesJson(machines: readonly Machine[], exportedAt = new Date()): string {
  if (machines.length > MAX_MACHINES) {
    throw new DataError(
      'machines',
      `A file holds at most ${MAX_MACHINES} machines; choose fewer (${machines.length} chosen).`,
    );
  }
  const file = {
    format: FILE_FORMAT_NAME,
    version: FILE_FORMAT_VERSION,
    exportedAt: exportedAt.toISOString(),
    machines: machines.map((m, i) => validateMachine(m, `machine ${i + 1}`)),
  };
  const pretty = JSON.stringify(file, null, 2) + '\n';
  if (utf8Bytes(pretty) <= MAX_FILE_BYTES) return pretty;
  const compact = JSON.stringify(file) + '\n';
  if (utf8Bytes(compact) <= MAX_FILE_BYTES) return compact;
  throw new DataError(
    'machines',
    `These machines make a file over ${formatMiB(MAX_FILE_BYTES)}, too large to import again; export fewer at a time.`,
  );
}

/** Result of reading a machines file: the checked machines, or why the file was refused. */
export type ParseMachinesResult = { ok: true; machines: Machine[] } | { ok: false; error: string };

/**
 * Reads a machines file. Never throws: a refused file gives `{ ok: false, error }` with a
 * message for the user, and nothing from it is kept. Accepts versions OLDEST_READABLE_VERSION
 * to FILE_FORMAT_VERSION (older ones are upgraded).
 */
export function parseMachinesFile(text: string): ParseMachinesResult {
  try {
    return { ok: true, machines: readMachinesFile(text) };
  } catch (e) {
    if (e instanceof DataError) return { ok: false, error: e.message };
    // Anything else is a fault of ours, not of the file; still refuse the file rather than crash.
    return { ok: false, error: `This file could not be read (${String(e)}).` };
  }
}

function readMachinesFile(text: string): Machine[] {
  if (typeof text !== 'string') throw new DataError('file', 'The file could not be read as text.');
  // A UTF-16 code unit takes at least one byte in UTF-8, so a long string is too big outright.
  if (text.length > MAX_FILE_BYTES || utf8Bytes(text) > MAX_FILE_BYTES) {
    throw new DataError(
      'file',
      `This file is larger than ${formatMiB(MAX_FILE_BYTES)}; a Trueturn machines file is never that big.`,
    );
  }
  let parsed: unknown;
  try {
    // A byte-order mark is harmless but not JSON; some editors add one.
    parsed = JSON.parse(text.replace(/^\uFEFF/, ''));
  } catch {
    throw new DataError('file', 'This is not a Trueturn machines file: it is not valid JSON text.');
  }

  const head = readHead(parsed);
  let current: unknown = parsed;
  for (let v = head.version; v < FILE_FORMAT_VERSION; v++) {
    const upgrade = migrations[v];
    if (!upgrade) throw new DataError('version', unreadableVersion(head.version));
    current = upgrade(current);
  }

  const f = readRecord(current, 'file', ['format', 'version', 'exportedAt', 'machines']);
  const list = readList(f.machines, 'machines', 0, MAX_MACHINES, 'machines');
  const machines = list.map((m, i) => validateMachine(m, `machine ${i + 1}`));
  validateIsoTime(f.exportedAt, 'exportedAt');
  const seen = new Set<string>();
  machines.forEach((m, i) => {
    if (seen.has(m.id)) {
      throw new DataError(
        pathTo(`machine ${i + 1}`, 'id'),
        `machine ${i + 1} has the same id as an earlier machine in the file.`,
      );
    }
    seen.add(m.id);
  });
  return machines;
}

/** Checks the format name and version before anything else, so a foreign file gets a plain answer. */
function readHead(parsed: unknown): { version: number } {
  if (typeof parsed !== 'object' || parsed === null || Array.isArray(parsed)) {
    throw new DataError(
      'file',
      'This is not a Trueturn machines file: it holds no "format" field.',
    );
  }
  const format = Object.getOwnPropertyDescriptor(parsed, 'format')?.value;
  if (format !== FILE_FORMAT_NAME) {
    throw new DataError(
      'format',
      `This is not a Trueturn machines file: "format" should be "${FILE_FORMAT_NAME}" (got ${describe(format)}).`,
    );
  }
  const version: unknown = Object.getOwnPropertyDescriptor(parsed, 'version')?.value;
  if (typeof version !== 'number' || !Number.isInteger(version)) {
    throw new DataError(
      'version',
      `The file's "version" must be a whole number (got ${describe(version)}).`,
    );
  }
  if (version > FILE_FORMAT_VERSION || version < OLDEST_READABLE_VERSION) {
    throw new DataError('version', unreadableVersion(version));
  }
  return { version };
}

function unreadableVersion(version: number): string {
  const reads =
    OLDEST_READABLE_VERSION === FILE_FORMAT_VERSION
      ? `version ${FILE_FORMAT_VERSION}`
      : `versions ${OLDEST_READABLE_VERSION} to ${FILE_FORMAT_VERSION}`;
  const hint =
    version > FILE_FORMAT_VERSION
      ? ' It was made by a newer Trueturn: update this app, then import it again.'
      : '';
  return `This file is machines-file version ${version}; this app reads ${reads}.${hint}`;
}

/** Size of a text in UTF-8 bytes. */
export function utf8Bytes(text: string): number {
  return new TextEncoder().encode(text).length;
}

function formatMiB(bytes: number): string {
  return `${bytes / (1024 * 1024)} MB`;
}
