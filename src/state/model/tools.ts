// What each tool was given for a machine, saved with it so every tool opens as it was left:
// the speed finder's readings and expectation, the camera planner's abilities and goal, the
// logger's tones, sampling and filter. (The lighting and the check screen's sampler live in the
// set-up itself; the whole machine's links live on the parts.)

/** A strobe reading: at rateFpm flashes per minute, `images` images stood still. */
export interface FinderReading {
  rateFpm: number;
  images: number;
}

/** What the technician expects of the speed: nothing, a range in rpm, or a motor's nameplate. */
/**
 * What the technician expects of the speed: nothing, a speed ± percent (a nameplate's), a range
 * in rpm, or a motor's poles and mains. Both speed-finder methods (strobe and sound) read it.
 */
export interface Expectation {
  mode: 'none' | 'nameplate' | 'rpm' | 'motor';
  nameplateRpm: number;
  /** How far the speed may lie from nameplateRpm, ± percent. */
  plusMinusPercent: number;
  fromRpm: number;
  toRpm: number;
  mainsHz: 50 | 60;
  poles: number;
  /** Slip range of the motor, percent of synchronous speed (loaded to unloaded). */
  minSlipPercent: number;
  maxSlipPercent: number;
}

/** What kind of part the speed finder looks at: its features are blades, teeth or marks (the words, and the tone's name, follow it). */
export type FinderPartKind = 'fan' | 'gear' | 'other';

export interface SpeedFinderInputs {
  partKind: FinderPartKind;
  readings: FinderReading[];
  /** Features counted on the part; null follows the chosen part. */
  features: number | null;
  expectation: Expectation;
}

export type CameraGoalKind = 'freeze' | 'creep' | 'natural' | 'honest';

export interface CameraPlanInputs {
  /** Labels of the standard frame rates ticked ("24", "25", "30", …). */
  standardLabels: string[];
  /** Frame rates typed in besides the standard ones, frames/s. */
  otherRatesHz: number[];
  shutterAnglesDeg: number[];
  exposuresS: number[];
  readoutMs: number;
  goal: CameraGoalKind;
}

export type LoggerFilterKind = 'none' | 'rc' | 'butterworth';

export interface LoggerInputs {
  harmonics: number;
  /** Blade counts typed; null: the part's own. */
  blades: number[] | null;
  gearTeeth: number[];
  extraTonesHz: number[];
  sampleHz: number;
  filterKind: LoggerFilterKind;
  /** How an RC stage is given: its cutoff, or R and C. */
  rcGiven: 'cutoff' | 'parts';
  rcCutoffHz: number;
  resistanceOhm: number;
  capacitanceF: number;
  order: number;
  cutoffHz: number;
  bits: number;
}

/** Every tool's inputs for one machine. */
export interface ToolInputs {
  speedFinder: SpeedFinderInputs;
  camera: CameraPlanInputs;
  logger: LoggerInputs;
}

/**
 * Until the technician types one: a motor slips between 0 % (unloaded) and 5 % (full load),
 * motorExpectedRange's default (common practice; Engineering ToolBox's typical speeds are 1.7–4 %).
 */
export const defaultExpectation: Expectation = {
  mode: 'none',
  // A nameplate speed ± 5 % until one is typed (nameplates are commonly 2–4 % off the running
  // speed: belts slip, drives vary; a judgement).
  nameplateRpm: 1500,
  plusMinusPercent: 5,
  fromRpm: 1000,
  toRpm: 2000,
  mainsHz: 50,
  poles: 4,
  minSlipPercent: 0,
  maxSlipPercent: 5,
};

/** What the camera planner starts with: a phone's usual video modes (common practice). */
export const defaultCameraInputs: CameraPlanInputs = {
  standardLabels: ['24', '25', '30', '60', '120', '240'],
  otherRatesHz: [],
  /** 180° is the cinema rule; a phone's automatic exposure often runs near it indoors. */
  shutterAnglesDeg: [180],
  /** Shutter speeds a phone's manual mode offers, seconds (1/500 … 1/4000 s). */
  exposuresS: [1 / 500, 1 / 1000, 1 / 2000, 1 / 4000],
  /** Typical phone readout, ms: Ringaby & Forssén, IJCV 2011, measured 22–33 ms at 30 frames/s. */
  readoutMs: 25,
  goal: 'freeze',
};

/** What the logger planner starts with (judgements for a first look, not recommendations). */
export const defaultLoggerInputs: LoggerInputs = {
  /** Shaft harmonics 1× … 4×: looseness and misalignment show up to about there (common practice). */
  harmonics: 4,
  blades: null,
  gearTeeth: [],
  extraTonesHz: [],
  /** A round rate many loggers offer, Hz. */
  sampleHz: 1000,
  filterKind: 'none',
  rcGiven: 'cutoff',
  rcCutoffHz: 200,
  /** 10 kΩ and 100 nF: fc = 1/(2π·10e3·100e-9) = 159.15 Hz. */
  resistanceOhm: 10_000,
  capacitanceF: 100e-9,
  order: 4,
  cutoffHz: 200,
  /** A common converter width. */
  bits: 16,
};

/** Fresh inputs for a machine no tool has been used on. */
export function defaultToolInputs(): ToolInputs {
  return structuredClone({
    speedFinder: { partKind: 'fan', readings: [], features: null, expectation: defaultExpectation },
    camera: defaultCameraInputs,
    logger: defaultLoggerInputs,
  });
}
