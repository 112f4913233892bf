// Each tool's inputs as signals (the screens read and set them), and the same inputs as one
// plain value per tool (model/tools.ts) for the working copy and saved machines. Kept apart from
// the tools' plans so the first screen loads none of their computation.
import { batch, computed, signal } from '@preact/signals';
import {
  defaultCameraInputs,
  defaultExpectation,
  defaultLoggerInputs,
  type CameraGoalKind,
  type CameraPlanInputs,
  type Expectation,
  type FinderPartKind,
  type LoggerFilterKind,
  type LoggerInputs,
  type SpeedFinderInputs,
  type ToolInputs,
} from './model';

// --- Speed finder ---------------------------------------------------------------------------

/** A reading: at rateFpm flashes per minute, `images` images stood still (1 = a single image). */
export interface RecordedReading {
  /** Stable key for the table row. */
  id: number;
  rateFpm: number;
  images: number;
}

export const readings = signal<RecordedReading[]>([]);
/** Features counted on the part; null follows the chosen part of the set-up. */
export const finderFeatures = signal<number | null>(null);
export const expectation = signal<Expectation>({ ...defaultExpectation });
/** What kind of part the finder looks at (blades, teeth or marks). */
export const finderPartKind = signal<FinderPartKind>('fan');

let nextReadingId = 1;

/** A new row key for a reading. */
export function readingId(): number {
  return nextReadingId++;
}

const finderInputs = computed<SpeedFinderInputs>(() => ({
  partKind: finderPartKind.value,
  readings: readings.value.map(({ rateFpm, images }) => ({ rateFpm, images })),
  features: finderFeatures.value,
  expectation: { ...expectation.value },
}));

function setFinderInputs(x: SpeedFinderInputs): void {
  readings.value = x.readings.map((r) => ({ id: readingId(), ...r }));
  finderFeatures.value = x.features;
  finderPartKind.value = x.partKind;
  expectation.value = { ...x.expectation };
}

// --- Camera planner -------------------------------------------------------------------------

export const standardLabelsOn = signal<string[]>([...defaultCameraInputs.standardLabels]);
export const otherRatesHz = signal<number[]>([...defaultCameraInputs.otherRatesHz]);
export const shutterAnglesDeg = signal<number[]>([...defaultCameraInputs.shutterAnglesDeg]);
export const exposuresS = signal<number[]>([...defaultCameraInputs.exposuresS]);
export const planReadoutMs = signal<number>(defaultCameraInputs.readoutMs);
export const goalKind = signal<CameraGoalKind>(defaultCameraInputs.goal);

const cameraInputs = computed<CameraPlanInputs>(() => ({
  standardLabels: [...standardLabelsOn.value],
  otherRatesHz: [...otherRatesHz.value],
  shutterAnglesDeg: [...shutterAnglesDeg.value],
  exposuresS: [...exposuresS.value],
  readoutMs: planReadoutMs.value,
  goal: goalKind.value,
}));

function setCameraInputs(x: CameraPlanInputs): void {
  standardLabelsOn.value = [...x.standardLabels];
  otherRatesHz.value = [...x.otherRatesHz];
  shutterAnglesDeg.value = [...x.shutterAnglesDeg];
  exposuresS.value = [...x.exposuresS];
  planReadoutMs.value = x.readoutMs;
  goalKind.value = x.goal;
}

// --- Data logger ----------------------------------------------------------------------------

const d = defaultLoggerInputs;
export const harmonics = signal(d.harmonics);
export const bladeCounts = signal<number[] | null>(d.blades);
export const gearTeeth = signal<number[]>([...d.gearTeeth]);
export const extraTonesHz = signal<number[]>([...d.extraTonesHz]);
export const sampleHz = signal(d.sampleHz);
export const filterKind = signal<LoggerFilterKind>(d.filterKind);
export const rcGiven = signal<'cutoff' | 'parts'>(d.rcGiven);
export const rcCutoffHz = signal(d.rcCutoffHz);
export const resistanceOhm = signal(d.resistanceOhm);
export const capacitanceF = signal(d.capacitanceF);
export const filterOrder = signal(d.order);
export const filterCutoffHz = signal(d.cutoffHz);
export const converterBits = signal(d.bits);

const loggerInputs = computed<LoggerInputs>(() => ({
  harmonics: harmonics.value,
  blades: bladeCounts.value === null ? null : [...bladeCounts.value],
  gearTeeth: [...gearTeeth.value],
  extraTonesHz: [...extraTonesHz.value],
  sampleHz: sampleHz.value,
  filterKind: filterKind.value,
  rcGiven: rcGiven.value,
  rcCutoffHz: rcCutoffHz.value,
  resistanceOhm: resistanceOhm.value,
  capacitanceF: capacitanceF.value,
  order: filterOrder.value,
  cutoffHz: filterCutoffHz.value,
  bits: converterBits.value,
}));

function setLoggerInputs(x: LoggerInputs): void {
  harmonics.value = x.harmonics;
  bladeCounts.value = x.blades === null ? null : [...x.blades];
  gearTeeth.value = [...x.gearTeeth];
  extraTonesHz.value = [...x.extraTonesHz];
  sampleHz.value = x.sampleHz;
  filterKind.value = x.filterKind;
  rcGiven.value = x.rcGiven;
  rcCutoffHz.value = x.rcCutoffHz;
  resistanceOhm.value = x.resistanceOhm;
  capacitanceF.value = x.capacitanceF;
  filterOrder.value = x.order;
  filterCutoffHz.value = x.cutoffHz;
  converterBits.value = x.bits;
}

// --- Together -------------------------------------------------------------------------------

/** Every tool's inputs now, as one plain value. */
export const toolInputs = computed<ToolInputs>(() => ({
  speedFinder: finderInputs.value,
  camera: cameraInputs.value,
  logger: loggerInputs.value,
}));

/** Puts every tool's inputs back as a machine keeps them. */
export function setToolInputs(x: ToolInputs): void {
  batch(() => {
    setFinderInputs(x.speedFinder);
    setCameraInputs(x.camera);
    setLoggerInputs(x.logger);
  });
}
