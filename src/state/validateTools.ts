// Strict checks of what the tools keep with a machine (model/tools.ts) and of a derived
// speed's origin (model/origin.ts), for saved records, files and share links. Each tool's inputs
// may be left out of a file (the tool then starts afresh); what is there is checked whole.
import {
  DataError,
  aboveZero,
  between,
  oneOf,
  pathTo,
  plainText,
  readList,
  readRecord,
  validateIsoTime,
  whole,
} from './read';
import {
  MAX_ORIGIN_DETAILS,
  ORIGIN_METHODS,
  defaultToolInputs,
  type CameraPlanInputs,
  type Expectation,
  type LoggerInputs,
  type OriginDetail,
  type SpeedFinderInputs,
  type SpeedOrigin,
  type ToolInputs,
} from './model';

/** Most readings, rates or tones a tool keeps: far beyond a day at one machine. */
export const MAX_TOOL_LIST = 100;

const DETAIL_KEY = /^[A-Za-z]{1,30}$/;

/** Where a derived speed came from: a known method, a few named numbers or words, and when. */
export function originFrom(x: unknown, path: string): SpeedOrigin {
  const r = readRecord(x, path, ['method', 'detail', 'at']);
  const detailPath = pathTo(path, 'detail');
  if (typeof r.detail !== 'object' || r.detail === null || Array.isArray(r.detail)) {
    throw new DataError(detailPath, `${detailPath} must be a group of fields {…}.`);
  }
  const keys = Object.keys(r.detail);
  if (keys.length > MAX_ORIGIN_DETAILS || !keys.every((k) => DETAIL_KEY.test(k))) {
    throw new DataError(
      detailPath,
      `${detailPath} holds at most ${MAX_ORIGIN_DETAILS} fields named with letters only.`,
    );
  }
  const raw = readRecord(r.detail, detailPath, [], keys);
  const detail: OriginDetail = {};
  for (const key of keys) {
    const value = raw[key];
    const at = pathTo(detailPath, key);
    detail[key] =
      typeof value === 'number' ? between(value, at, -1e9, 1e9) : plainText(value, at, 0, 80);
  }
  return {
    method: oneOf(r.method, pathTo(path, 'method'), ORIGIN_METHODS),
    detail,
    at: validateIsoTime(r.at, pathTo(path, 'at')),
  };
}

function numbers(
  x: unknown,
  path: string,
  read: (v: unknown, p: string) => number,
  min = 0,
): number[] {
  return readList(x, path, min, MAX_TOOL_LIST, 'values').map((v, i) => read(v, pathTo(path, i)));
}

const positive = (max: number) => (v: unknown, p: string) => aboveZero(v, p, max);

function expectationFrom(x: unknown, path: string): Expectation {
  const r = readRecord(x, path, [
    'mode',
    'nameplateRpm',
    'plusMinusPercent',
    'fromRpm',
    'toRpm',
    'mainsHz',
    'poles',
    'minSlipPercent',
    'maxSlipPercent',
  ]);
  return {
    mode: oneOf(r.mode, pathTo(path, 'mode'), ['none', 'nameplate', 'rpm', 'motor'] as const),
    nameplateRpm: between(r.nameplateRpm, pathTo(path, 'nameplateRpm'), 0, 1e7),
    plusMinusPercent: between(r.plusMinusPercent, pathTo(path, 'plusMinusPercent'), 0, 50),
    fromRpm: between(r.fromRpm, pathTo(path, 'fromRpm'), 0, 1e7),
    toRpm: between(r.toRpm, pathTo(path, 'toRpm'), 0, 1e7),
    mainsHz: oneOf(r.mainsHz, pathTo(path, 'mainsHz'), [50, 60] as const),
    poles: whole(r.poles, pathTo(path, 'poles'), 2, 1000),
    minSlipPercent: between(r.minSlipPercent, pathTo(path, 'minSlipPercent'), 0, 100),
    maxSlipPercent: between(r.maxSlipPercent, pathTo(path, 'maxSlipPercent'), 0, 100),
  };
}

function finderFrom(x: unknown, path: string): SpeedFinderInputs {
  const r = readRecord(x, path, ['partKind', 'readings', 'features', 'expectation']);
  const readingsPath = pathTo(path, 'readings');
  const readings = readList(r.readings, readingsPath, 0, MAX_TOOL_LIST, 'readings').map(
    (item, i) => {
      const at = pathTo(readingsPath, i);
      const reading = readRecord(item, at, ['rateFpm', 'images']);
      return {
        rateFpm: aboveZero(reading.rateFpm, pathTo(at, 'rateFpm'), 6e7),
        images: whole(reading.images, pathTo(at, 'images'), 1, 1000),
      };
    },
  );
  return {
    partKind: oneOf(r.partKind, pathTo(path, 'partKind'), ['fan', 'gear', 'other'] as const),
    readings,
    features: r.features === null ? null : whole(r.features, pathTo(path, 'features'), 1, 100_000),
    expectation: expectationFrom(r.expectation, pathTo(path, 'expectation')),
  };
}

function cameraFrom(x: unknown, path: string): CameraPlanInputs {
  const r = readRecord(x, path, [
    'standardLabels',
    'otherRatesHz',
    'shutterAnglesDeg',
    'exposuresS',
    'readoutMs',
    'goal',
  ]);
  const labelsPath = pathTo(path, 'standardLabels');
  return {
    standardLabels: readList(r.standardLabels, labelsPath, 0, MAX_TOOL_LIST, 'labels').map((v, i) =>
      plainText(v, pathTo(labelsPath, i), 1, 20),
    ),
    otherRatesHz: numbers(r.otherRatesHz, pathTo(path, 'otherRatesHz'), positive(1e6)),
    shutterAnglesDeg: numbers(r.shutterAnglesDeg, pathTo(path, 'shutterAnglesDeg'), positive(360)),
    exposuresS: numbers(r.exposuresS, pathTo(path, 'exposuresS'), positive(60)),
    readoutMs: between(r.readoutMs, pathTo(path, 'readoutMs'), 0, 1000),
    goal: oneOf(r.goal, pathTo(path, 'goal'), ['freeze', 'creep', 'natural', 'honest'] as const),
  };
}

const LOGGER_KEYS = [
  'harmonics',
  'blades',
  'gearTeeth',
  'extraTonesHz',
  'sampleHz',
  'filterKind',
  'rcGiven',
  'rcCutoffHz',
  'resistanceOhm',
  'capacitanceF',
  'order',
  'cutoffHz',
  'bits',
];

function loggerFrom(x: unknown, path: string): LoggerInputs {
  const r = readRecord(x, path, LOGGER_KEYS);
  const count = (v: unknown, p: string) => whole(v, p, 1, 100_000);
  return {
    harmonics: whole(r.harmonics, pathTo(path, 'harmonics'), 0, 1000),
    blades: r.blades === null ? null : numbers(r.blades, pathTo(path, 'blades'), count),
    gearTeeth: numbers(r.gearTeeth, pathTo(path, 'gearTeeth'), count),
    extraTonesHz: numbers(r.extraTonesHz, pathTo(path, 'extraTonesHz'), positive(1e9)),
    sampleHz: aboveZero(r.sampleHz, pathTo(path, 'sampleHz'), 1e9),
    filterKind: oneOf(r.filterKind, pathTo(path, 'filterKind'), [
      'none',
      'rc',
      'butterworth',
    ] as const),
    rcGiven: oneOf(r.rcGiven, pathTo(path, 'rcGiven'), ['cutoff', 'parts'] as const),
    rcCutoffHz: aboveZero(r.rcCutoffHz, pathTo(path, 'rcCutoffHz'), 1e9),
    resistanceOhm: aboveZero(r.resistanceOhm, pathTo(path, 'resistanceOhm'), 1e12),
    capacitanceF: aboveZero(r.capacitanceF, pathTo(path, 'capacitanceF'), 1),
    order: whole(r.order, pathTo(path, 'order'), 1, 100),
    cutoffHz: aboveZero(r.cutoffHz, pathTo(path, 'cutoffHz'), 1e9),
    bits: whole(r.bits, pathTo(path, 'bits'), 1, 64),
  };
}

/**
 * Every tool's inputs for a machine. A tool left out of the record starts from its defaults;
 * a tool that is there is checked whole.
 */
export function toolsFrom(x: unknown, path: string): ToolInputs {
  const r = readRecord(x, path, [], ['speedFinder', 'camera', 'logger']);
  const tools = defaultToolInputs();
  if ('speedFinder' in r)
    tools.speedFinder = finderFrom(r.speedFinder, pathTo(path, 'speedFinder'));
  if ('camera' in r) tools.camera = cameraFrom(r.camera, pathTo(path, 'camera'));
  if ('logger' in r) tools.logger = loggerFrom(r.logger, pathTo(path, 'logger'));
  return tools;
}
