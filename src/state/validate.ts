// Kept whole (over 300 lines): one reader per saved shape, all with the same helpers, so every
// limit of the file format (docs/file-format.md) is written once, here.
// Strict checks for data that comes from outside the running app: a saved record, an imported
// file, a share link. Every field is checked; anything unexpected is refused with a message a
// technician can act on, naming where the problem is ("machine 3 › parts › 1 › features …").
//
// Paths use the field names of the file format (docs/file-format.md). List positions in a path
// count from 1, as people count: "parts › 1" is the first part.
//
// Results are always built from fresh object literals, never by spreading or assigning the
// input, so nothing hidden in the input (prototype tricks, extra fields) survives the check.

import type {
  CameraSpec,
  LightingSpec,
  Machine,
  PartDrive,
  PartSpec,
  Setup,
  StrobeSpec,
  WheelSpec,
} from './model';

/** Refused outside data. `path` says where ("machine 3 › parts › 1 › features"). */
export class DataError extends Error {
  readonly path: string;
  constructor(path: string, message: string) {
    super(message);
    this.name = 'DataError';
    this.path = path;
  }
}

/** Most parts one set-up may hold: enough for a drive train, small enough to fit a share link. */
export const MAX_PARTS = 20;

/** Throws DataError when a set-up has no room for one more part (it holds MAX_PARTS). */
export function requirePartRoom(s: Setup): void {
  if (s.parts.length >= MAX_PARTS) {
    throw new DataError(
      'parts',
      `A set-up holds at most ${MAX_PARTS} parts; remove one before adding another.`,
    );
  }
}
/** Longest name of a machine or part, in characters. */
export const MAX_NAME_CHARS = 80;
/** Longest crew note of a machine, in characters. */
export const MAX_NOTES_CHARS = 2000;

/** Keys that could reach an object's prototype if some later code copied the data carelessly. */
const HOSTILE_KEYS: ReadonlySet<string> = new Set(['__proto__', 'constructor', 'prototype']);

/** Joins a path and a field name: "machine 3" + "parts" → "machine 3 › parts". */
export function pathTo(path: string, field: string | number): string {
  return typeof field === 'number' ? `${path} › ${field + 1}` : `${path} › ${field}`;
}

/**
 * Reads `x` as a plain group of fields holding exactly the `required` keys and any of the
 * `optional` ones. Returns the own values in a prototype-free record (read it, never return it).
 * Throws DataError for anything else: not an object, an array, an unknown, hostile or missing key,
 * an accessor instead of a plain value.
 * @example readRecord({ a: 1 }, 'file', ['a']).a // 1
 */
export function readRecord(
  x: unknown,
  path: string,
  required: readonly string[],
  optional: readonly string[] = [],
): Record<string, unknown> {
  if (typeof x !== 'object' || x === null || Array.isArray(x)) {
    throw new DataError(path, `${path} must be a group of fields {…} (got ${describe(x)}).`);
  }
  const proto: unknown = Object.getPrototypeOf(x);
  if (proto !== Object.prototype && proto !== null) {
    throw new DataError(path, `${path} must be a plain group of fields.`);
  }
  const out: Record<string, unknown> = Object.create(null) as Record<string, unknown>;
  for (const key of Reflect.ownKeys(x)) {
    if (typeof key !== 'string') throw new DataError(path, `${path} holds a field without a name.`);
    if (HOSTILE_KEYS.has(key)) {
      throw new DataError(
        path,
        `${path} contains a field called "${key}", which is never allowed in Trueturn data.`,
      );
    }
    if (!required.includes(key) && !optional.includes(key)) {
      throw new DataError(path, `${path} has a field this app does not know: ${quoteKey(key)}.`);
    }
    const d = Object.getOwnPropertyDescriptor(x, key);
    if (!d || !('value' in d)) throw new DataError(path, `${path} › ${key} must be plain data.`);
    // An optional field stored as undefined (possible in a browser store) counts as absent.
    if (d.value === undefined && optional.includes(key)) continue;
    out[key] = d.value;
  }
  for (const key of required) {
    if (!(key in out)) throw new DataError(pathTo(path, key), `${pathTo(path, key)} is missing.`);
  }
  return out;
}

/**
 * Reads `x` as a list of `min` to `max` items and returns a fresh array of them.
 * `what` names the items in the message ("parts", "machines").
 * @example readList([1, 2], 'set-up › parts', 1, 20, 'parts') // [1, 2]
 */
export function readList(
  x: unknown,
  path: string,
  min: number,
  max: number,
  what: string,
): unknown[] {
  if (!Array.isArray(x) || Object.getPrototypeOf(x) !== Array.prototype) {
    throw new DataError(path, `${path} must be a list […] (got ${describe(x)}).`);
  }
  if (x.length < min || x.length > max) {
    throw new DataError(path, `${path} must hold ${min} to ${max} ${what} (it holds ${x.length}).`);
  }
  const out: unknown[] = [];
  for (let i = 0; i < x.length; i++) {
    const d = Object.getOwnPropertyDescriptor(x, i);
    if (!d || !('value' in d))
      throw new DataError(pathTo(path, i), `${pathTo(path, i)} is missing.`);
    out.push(d.value);
  }
  return out;
}

/** A finite number, or DataError. */
function finite(x: unknown, path: string): number {
  if (typeof x !== 'number' || !Number.isFinite(x)) {
    throw new DataError(path, `${path} must be a number (got ${describe(x)}).`);
  }
  return x;
}

/** A finite number in [min, max]. */
function between(x: unknown, path: string, min: number, max: number): number {
  const v = finite(x, path);
  if (v < min || v > max) {
    throw new DataError(path, `${path} must be a number from ${min} to ${max} (got ${v}).`);
  }
  return v;
}

/** A finite number in (0, max]. */
function aboveZero(x: unknown, path: string, max: number): number {
  const v = finite(x, path);
  if (v <= 0 || v > max) {
    throw new DataError(path, `${path} must be a number above 0 and at most ${max} (got ${v}).`);
  }
  return v;
}

/** A whole number in [min, max]. */
function whole(x: unknown, path: string, min: number, max: number): number {
  const v = finite(x, path);
  if (!Number.isInteger(v) || v < min || v > max) {
    throw new DataError(path, `${path} must be a whole number from ${min} to ${max} (got ${v}).`);
  }
  return v;
}

/** One of the listed values. */
function oneOf<T extends string | number>(x: unknown, path: string, allowed: readonly T[]): T {
  const found = allowed.find((a) => a === x);
  if (found === undefined) {
    const list = allowed.map((a) => (typeof a === 'string' ? `"${a}"` : String(a))).join(', ');
    throw new DataError(path, `${path} must be one of ${list} (got ${describe(x)}).`);
  }
  return found;
}

// Characters refused in names and notes: control characters (line breaks are allowed in notes
// only), unpaired surrogates (not valid text, they would not survive UTF-8), the direction
// overrides that can make text display differently from what it holds, and line/paragraph
// separators.
const FORBIDDEN_IN_NAME = /[\p{Cc}\p{Cs}\u2028\u2029\u202A-\u202E\u2066-\u2069]/u;
const FORBIDDEN_IN_NOTES = /[\p{Cs}\u2028\u2029\u202A-\u202E\u2066-\u2069]|(?![\t\n\r])\p{Cc}/u;

/** Plain text of at most `maxChars` characters; `minChars` 1 also refuses a blank name. */
function plainText(
  x: unknown,
  path: string,
  minChars: 0 | 1,
  maxChars: number,
  allowLineBreaks = false,
): string {
  if (typeof x !== 'string')
    throw new DataError(path, `${path} must be text (got ${describe(x)}).`);
  if (minChars === 1 && x.trim() === '') throw new DataError(path, `${path} must not be blank.`);
  const chars = [...x].length;
  if (chars > maxChars) {
    throw new DataError(path, `${path} must be at most ${maxChars} characters (it has ${chars}).`);
  }
  if ((allowLineBreaks ? FORBIDDEN_IN_NOTES : FORBIDDEN_IN_NAME).test(x)) {
    const what = allowLineBreaks ? 'plain text' : 'plain text on one line';
    throw new DataError(path, `${path} must be ${what}, without control or direction characters.`);
  }
  return x;
}

const ISO_TIME = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d{1,9})?)?(Z|[+-]\d{2}:\d{2})$/;

/**
 * An ISO 8601 date and time with a zone, e.g. "2025-03-12T08:30:00.000Z", or DataError.
 * @example validateIsoTime('2025-03-12T08:30:00Z', 'exportedAt') // '2025-03-12T08:30:00Z'
 */
export function validateIsoTime(x: unknown, path: string): string {
  if (
    typeof x !== 'string' ||
    x.length > 40 ||
    !ISO_TIME.test(x) ||
    !Number.isFinite(Date.parse(x))
  ) {
    throw new DataError(
      path,
      `${path} must be a date and time such as "2025-03-12T08:30:00Z" (got ${describe(x)}).`,
    );
  }
  return x;
}

const ID = /^[A-Za-z0-9_-]{1,100}$/;

function partFrom(x: unknown, path: string, index: number): PartSpec {
  const r = readRecord(
    x,
    path,
    ['name', 'speedRpm', 'features', 'tolerancePercent'],
    ['motor', 'drive', 'wheel'],
  );
  const part: PartSpec = {
    name: plainText(r.name, pathTo(path, 'name'), 0, MAX_NAME_CHARS),
    speedRpm: between(r.speedRpm, pathTo(path, 'speedRpm'), -1e7, 1e7),
    features: whole(r.features, pathTo(path, 'features'), 1, 100_000),
    tolerancePercent: between(r.tolerancePercent, pathTo(path, 'tolerancePercent'), 0, 50),
  };
  if ('motor' in r) {
    const mp = pathTo(path, 'motor');
    const m = readRecord(r.motor, mp, ['mainsHz', 'poles', 'slipPercent']);
    const poles = whole(m.poles, pathTo(mp, 'poles'), 2, 1000);
    if (poles % 2 !== 0) {
      throw new DataError(
        pathTo(mp, 'poles'),
        `${pathTo(mp, 'poles')} must be even: poles come in pairs (got ${poles}).`,
      );
    }
    part.motor = {
      mainsHz: oneOf(m.mainsHz, pathTo(mp, 'mainsHz'), [50, 60]),
      poles,
      slipPercent: between(m.slipPercent, pathTo(mp, 'slipPercent'), 0, 100),
    };
  }
  if ('drive' in r) part.drive = driveFrom(r.drive, pathTo(path, 'drive'), index);
  if ('wheel' in r) part.wheel = wheelFrom(r.wheel, pathTo(path, 'wheel'));
  const sources = ['motor', 'drive', 'wheel'].filter((key) => key in r);
  if (sources.length > 1) {
    throw new DataError(
      path,
      `${path} takes its speed from one source only, not from ${sources.join(' and ')}.`,
    );
  }
  return part;
}

/** A drive from an earlier part; `index` is the driven part's own place in the list, from 0. */
function driveFrom(x: unknown, path: string, index: number): PartDrive {
  const head = readRecord(
    x,
    path,
    ['from', 'kind'],
    ['driverMm', 'drivenMm', 'slipPercent', 'driverTeeth', 'drivenTeeth'],
  );
  const kind = oneOf(head.kind, pathTo(path, 'kind'), ['belt', 'gear', 'shaft'] as const);
  const fromPath = pathTo(path, 'from');
  const from = finite(head.from, fromPath);
  if (!Number.isInteger(from) || from < 0 || from >= index) {
    // Counted from 0 like activePart; a drive from a later part could loop back on itself.
    throw new DataError(
      fromPath,
      index === 0
        ? `${fromPath}: the first part cannot be driven by another part (got ${from}).`
        : `${fromPath} must pick an earlier part: a whole number from 0 to ${index - 1} (got ${from}).`,
    );
  }
  if (kind === 'belt') {
    const b = readRecord(x, path, ['from', 'kind', 'driverMm', 'drivenMm', 'slipPercent']);
    return {
      from,
      kind,
      driverMm: aboveZero(b.driverMm, pathTo(path, 'driverMm'), 100_000),
      drivenMm: aboveZero(b.drivenMm, pathTo(path, 'drivenMm'), 100_000),
      slipPercent: between(b.slipPercent, pathTo(path, 'slipPercent'), 0, 20),
    };
  }
  if (kind === 'gear') {
    const g = readRecord(x, path, ['from', 'kind', 'driverTeeth', 'drivenTeeth']);
    return {
      from,
      kind,
      driverTeeth: whole(g.driverTeeth, pathTo(path, 'driverTeeth'), 1, 100_000),
      drivenTeeth: whole(g.drivenTeeth, pathTo(path, 'drivenTeeth'), 1, 100_000),
    };
  }
  readRecord(x, path, ['from', 'kind']);
  return { from, kind };
}

function wheelFrom(x: unknown, path: string): WheelSpec {
  const r = readRecord(x, path, ['groundSpeed', 'unit', 'tyreSize']);
  return {
    groundSpeed: between(r.groundSpeed, pathTo(path, 'groundSpeed'), -1000, 1000),
    unit: oneOf(r.unit, pathTo(path, 'unit'), ['km/h', 'mph'] as const),
    tyreSize: plainText(r.tyreSize, pathTo(path, 'tyreSize'), 1, 40),
  };
}

function cameraFrom(x: unknown, path: string): CameraSpec {
  const r = readRecord(x, path, ['frameRate', 'exposure', 'readoutMs']);
  const ep = pathTo(path, 'exposure');
  const modeOnly = readRecord(r.exposure, ep, ['mode'], ['angleDeg', 'seconds']);
  const mode = oneOf(modeOnly.mode, pathTo(ep, 'mode'), ['angle', 'time']);
  let exposure: CameraSpec['exposure'];
  if (mode === 'angle') {
    const e = readRecord(r.exposure, ep, ['mode', 'angleDeg']);
    exposure = { mode: 'angle', angleDeg: aboveZero(e.angleDeg, pathTo(ep, 'angleDeg'), 360) };
  } else {
    const e = readRecord(r.exposure, ep, ['mode', 'seconds']);
    // Up to a minute: far beyond any frame period, yet it keeps nonsense out.
    exposure = { mode: 'time', seconds: aboveZero(e.seconds, pathTo(ep, 'seconds'), 60) };
  }
  return {
    frameRate: aboveZero(r.frameRate, pathTo(path, 'frameRate'), 1e6),
    exposure,
    readoutMs: between(r.readoutMs, pathTo(path, 'readoutMs'), 0, 1000),
  };
}

/** Flash rates up to a million flashes per second, the same ceiling as camera frame rates. */
const MAX_FPM = 6e7;

function strobeFrom(x: unknown, path: string): StrobeSpec {
  const r = readRecord(x, path, ['rateFpm', 'minFpm', 'maxFpm']);
  const strobe: StrobeSpec = {
    rateFpm: aboveZero(r.rateFpm, pathTo(path, 'rateFpm'), MAX_FPM),
    minFpm: aboveZero(r.minFpm, pathTo(path, 'minFpm'), MAX_FPM),
    maxFpm: aboveZero(r.maxFpm, pathTo(path, 'maxFpm'), MAX_FPM),
  };
  if (strobe.minFpm >= strobe.maxFpm) {
    throw new DataError(
      pathTo(path, 'maxFpm'),
      `${pathTo(path, 'maxFpm')} must be above minFpm (got ${strobe.minFpm} to ${strobe.maxFpm}).`,
    );
  }
  return strobe;
}

function lightingFrom(x: unknown, path: string): LightingSpec {
  const r = readRecord(
    x,
    path,
    ['mainsHz', 'flicker', 'customHz', 'modulationPercent'],
    ['waveform', 'dutyPercent'],
  );
  const lighting: LightingSpec = {
    mainsHz: oneOf(r.mainsHz, pathTo(path, 'mainsHz'), [50, 60] as const),
    flicker: oneOf(r.flicker, pathTo(path, 'flicker'), ['double', 'mains', 'custom'] as const),
    customHz: aboveZero(r.customHz, pathTo(path, 'customHz'), 1e6),
    modulationPercent: between(r.modulationPercent, pathTo(path, 'modulationPercent'), 0, 100),
  };
  // Both are newer than the first file format: absent, the light is a sine (as it was then).
  if ('waveform' in r) {
    lighting.waveform = oneOf(r.waveform, pathTo(path, 'waveform'), [
      'sine',
      'rectangular',
      'rectified',
    ] as const);
  }
  if ('dutyPercent' in r) {
    const dutyPath = pathTo(path, 'dutyPercent');
    const duty = between(r.dutyPercent, dutyPath, 0, 100);
    if (duty === 0 || duty === 100) {
      throw new DataError(
        dutyPath,
        `${dutyPath} must lie between 0 and 100, ends not included (got ${duty}).`,
      );
    }
    lighting.dutyPercent = duty;
  }
  return lighting;
}

const SETUP_KEYS = [
  'parts',
  'activePart',
  'samplerKind',
  'camera',
  'strobe',
  'lighting',
  'creepRpm',
];

/** `ownPath` names the set-up itself; its fields are named under `fieldPath`. */
function setupFrom(x: unknown, ownPath: string, fieldPath: string): Setup {
  const r = readRecord(x, ownPath, SETUP_KEYS);
  const partsPath = pathTo(fieldPath, 'parts');
  const parts = readList(r.parts, partsPath, 1, MAX_PARTS, 'parts').map((p, i) =>
    partFrom(p, pathTo(partsPath, i), i),
  );
  const activePath = pathTo(fieldPath, 'activePart');
  const activePart = finite(r.activePart, activePath);
  if (!Number.isInteger(activePart) || activePart < 0 || activePart >= parts.length) {
    // activePart counts from 0 like the list index in the file; say so plainly.
    throw new DataError(
      activePath,
      `${activePath} must pick one of the ${parts.length} parts: a whole number from 0 to ${parts.length - 1} (got ${activePart}).`,
    );
  }
  return {
    parts,
    activePart,
    samplerKind: oneOf(r.samplerKind, pathTo(fieldPath, 'samplerKind'), [
      'camera',
      'strobe',
      'lighting',
    ] as const),
    camera: cameraFrom(r.camera, pathTo(fieldPath, 'camera')),
    strobe: strobeFrom(r.strobe, pathTo(fieldPath, 'strobe')),
    lighting: lightingFrom(r.lighting, pathTo(fieldPath, 'lighting')),
    creepRpm: between(r.creepRpm, pathTo(fieldPath, 'creepRpm'), -1e7, 1e7),
  };
}

/**
 * Checks a set-up from outside (a link, a stored record) and returns a fresh copy.
 * `path` names it in messages (default "set-up").
 * Throws DataError naming the first bad field.
 * @example validateSetup(defaultSetup).parts[0].features // 6
 */
export function validateSetup(x: unknown, path = 'set-up'): Setup {
  return setupFrom(x, path, path);
}

/**
 * Checks a saved machine from outside (a file, a stored record) and returns a fresh copy.
 * `path` names it in messages (default "machine"); the set-up's fields are named directly
 * under it ("machine 3 › parts › 1 › features").
 * Throws DataError naming the first bad field.
 */
export function validateMachine(x: unknown, path = 'machine'): Machine {
  const r = readRecord(x, path, ['id', 'name', 'setup', 'createdAt', 'updatedAt', 'notes']);
  const idPath = pathTo(path, 'id');
  if (typeof r.id !== 'string' || !ID.test(r.id)) {
    throw new DataError(
      idPath,
      `${idPath} must be 1 to 100 letters, digits, "-" or "_" (got ${describe(r.id)}).`,
    );
  }
  return {
    id: r.id,
    name: plainText(r.name, pathTo(path, 'name'), 1, MAX_NAME_CHARS),
    setup: setupFrom(r.setup, pathTo(path, 'setup'), path),
    createdAt: validateIsoTime(r.createdAt, pathTo(path, 'createdAt')),
    updatedAt: validateIsoTime(r.updatedAt, pathTo(path, 'updatedAt')),
    notes: plainText(r.notes, pathTo(path, 'notes'), 0, MAX_NOTES_CHARS, true),
  };
}

/**
 * Checks a name the user typed for a machine and returns it without surrounding spaces.
 * Throws DataError ("name must not be blank", too long, control characters).
 * @example validateMachineName('  Cooler fan ') // 'Cooler fan'
 */
export function validateMachineName(x: unknown, path = 'name'): string {
  return plainText(typeof x === 'string' ? x.trim() : x, path, 1, MAX_NAME_CHARS);
}

/** A short, safe description of a value for a message; never the whole of a long text. */
export function describe(x: unknown): string {
  if (x === null) return 'null';
  if (x === undefined) return 'nothing';
  if (typeof x === 'string') {
    const chars = [...x];
    const shown = chars.slice(0, 20).join('');
    return `the text ${JSON.stringify(shown)}${chars.length > 20 ? '…' : ''}`;
  }
  if (typeof x === 'number') return String(x);
  if (typeof x === 'boolean') return String(x);
  if (Array.isArray(x)) return 'a list';
  if (typeof x === 'object') return 'a group of fields';
  return `a ${typeof x}`;
}

function quoteKey(key: string): string {
  const chars = [...key];
  return JSON.stringify(chars.slice(0, 40).join('')) + (chars.length > 40 ? '…' : '');
}
