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

import {
  DataError,
  MAX_NAME_CHARS,
  MAX_NOTES_CHARS,
  aboveZero,
  between,
  finite,
  oneOf,
  pathTo,
  plainText,
  readList,
  readRecord,
  validateIsoTime,
  whole,
  describe,
} from './read';
import { originFrom, toolsFrom } from './validateTools';
import {
  PART_KINDS,
  type CameraSpec,
  type LightingSpec,
  type Machine,
  type MachineContent,
  type PartDrive,
  type PartSpec,
  type Setup,
  type StrobeSpec,
  type WheelSpec,
} from './model';
import { MAX_PARTS } from './partRoom';

export { MAX_PARTS, requirePartRoom } from './partRoom';

const ID = /^[A-Za-z0-9_-]{1,100}$/;

function partFrom(x: unknown, path: string, index: number): PartSpec {
  const r = readRecord(
    x,
    path,
    ['name', 'speedRpm', 'features', 'tolerancePercent'],
    ['kind', 'motor', 'drive', 'wheel', 'origin'],
  );
  const part: PartSpec = {
    name: plainText(r.name, pathTo(path, 'name'), 0, MAX_NAME_CHARS),
    // Older data has no kind; it reads as 'other' (kindOf) and is written without one.
    ...('kind' in r ? { kind: oneOf(r.kind, pathTo(path, 'kind'), PART_KINDS) } : {}),
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
  if ('origin' in r) part.origin = originFrom(r.origin, pathTo(path, 'origin'));
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

/** The fields of a machine's content (machine.ts), and of a saved machine besides. */
const CONTENT_KEYS = ['name', 'site', 'notes', 'assessedBy', 'assessedOn', 'setup', 'tools'];
const MACHINE_KEYS = ['id', ...CONTENT_KEYS, 'createdAt', 'updatedAt'];

const DAY = /^\d{4}-\d{2}-\d{2}$/;

/** A day as YYYY-MM-DD, or '' for none. */
function dayFrom(x: unknown, path: string): string {
  if (x === '') return '';
  if (typeof x !== 'string' || !DAY.test(x) || !Number.isFinite(Date.parse(`${x}T00:00:00Z`))) {
    throw new DataError(
      path,
      `${path} must be a day such as "2025-03-12", or empty (got ${describe(x)}).`,
    );
  }
  return x;
}

/** A machine's content read from a record whose other keys the caller has checked. */
function contentFrom(r: Record<string, unknown>, path: string, nameMin: 0 | 1): MachineContent {
  return {
    name: plainText(r.name, pathTo(path, 'name'), nameMin, MAX_NAME_CHARS),
    site: plainText(r.site, pathTo(path, 'site'), 0, MAX_NAME_CHARS),
    notes: plainText(r.notes, pathTo(path, 'notes'), 0, MAX_NOTES_CHARS, true),
    assessedBy: plainText(r.assessedBy, pathTo(path, 'assessedBy'), 0, MAX_NAME_CHARS),
    assessedOn: dayFrom(r.assessedOn, pathTo(path, 'assessedOn')),
    setup: setupFrom(r.setup, pathTo(path, 'setup'), path),
    tools: toolsFrom(r.tools, pathTo(path, 'tools')),
  };
}

/**
 * Checks a saved machine from outside (a file, a stored record) and returns a fresh copy.
 * `path` names it in messages (default "machine"); the set-up's fields are named directly
 * under it ("machine 3 › parts › 1 › features").
 * Throws DataError naming the first bad field.
 */
export function validateMachine(x: unknown, path = 'machine'): Machine {
  const r = readRecord(x, path, MACHINE_KEYS);
  const idPath = pathTo(path, 'id');
  if (typeof r.id !== 'string' || !ID.test(r.id)) {
    throw new DataError(
      idPath,
      `${idPath} must be 1 to 100 letters, digits, "-" or "_" (got ${describe(r.id)}).`,
    );
  }
  const content = contentFrom(r, path, 1);
  return {
    id: r.id,
    ...content,
    createdAt: validateIsoTime(r.createdAt, pathTo(path, 'createdAt')),
    updatedAt: validateIsoTime(r.updatedAt, pathTo(path, 'updatedAt')),
  };
}

/**
 * Checks a machine's content from outside (a share link, the working copy kept for the next
 * visit): as a saved machine, but without id or times, and its name may still be blank.
 * Throws DataError naming the first bad field.
 */
export function validateContent(x: unknown, path = 'machine'): MachineContent {
  return contentFrom(readRecord(x, path, CONTENT_KEYS), path, 0);
}

/**
 * Checks a name the user typed for a machine and returns it without surrounding spaces.
 * Throws DataError ("name must not be blank", too long, control characters).
 * @example validateMachineName('  Cooler fan ') // 'Cooler fan'
 */
export function validateMachineName(x: unknown, path = 'name'): string {
  return plainText(typeof x === 'string' ? x.trim() : x, path, 1, MAX_NAME_CHARS);
}

export {
  DataError,
  MAX_NAME_CHARS,
  MAX_NOTES_CHARS,
  describe,
  pathTo,
  readList,
  readRecord,
  validateIsoTime,
} from './read';
