import { InputError, requireBetween, requirePositive, requireWhole } from '../basics/InputError';
import {
  converterRangeDb,
  foldedHz,
  lowPassGainDb,
  niceSampleRateHz,
  rcCutoffHz,
} from '../formulas/logger';

/** What the machine puts into the sensor signal (docs/physics.md §9). */
export interface MachineTones {
  /** Shaft speed, rev/s = the 1× frequency in Hz. */
  shaftHz: number;
  /** Include the shaft harmonics 1× … N×. Default 1 (the 1× alone). */
  harmonics?: number;
  /** Blade counts of fans or impellers on the shaft: blade pass n·f each. */
  blades?: number[];
  /** Tooth counts of gears on the shaft: gear mesh z·f each. */
  gearTeeth?: number[];
  /** Other tones the user adds (Hz), each with its own name if it has one. */
  extraTones?: Array<{ label?: string; hz: number }>;
}

/** The analog low-pass before the converter. */
export type AntiAliasFilter =
  | { kind: 'none' }
  /** First-order RC: give the cutoff, or R and C (fc = 1/(2πRC)). */
  | { kind: 'rc'; cutoffHz?: number; resistanceOhm?: number; capacitanceF?: number }
  | { kind: 'butterworth'; order: number; cutoffHz: number };

/** Where a component comes from: the shaft's k-th harmonic, a blade pass, a gear mesh, or a tone added. */
export type ComponentSource = 'shaft' | 'blades' | 'teeth' | 'tone';

export interface LoggerComponent {
  source: ComponentSource;
  /** The harmonic k (shaft), the blade or tooth count, or the tone's place among those added (from 1). */
  count: number;
  /** An added tone's own name, when it was given one. */
  label?: string;
  hz: number;
  /** Where it lands after sampling, in [0, fs/2]. */
  foldedHz: number;
  /** At or above half the sample rate: it folds onto a false frequency. */
  aliases: boolean;
  /** The filter's gain at its frequency, dB (≤ 0; 0 without a filter). */
  gainDb: number;
  /** Attenuation it needs: the converter's range for an alias, 0 in band. */
  neededDb: number;
  /** An alias buried below the converter's noise floor, or an in-band component cut by no more than 3.01 dB. */
  pass: boolean;
}

export interface LoggerProposal {
  /** The smallest "nice" sample rate that works, Hz. */
  sampleHz: number;
  /** Butterworth order (the lowest that works at that rate). */
  order: number;
  cutoffHz: number;
  /** Loss at the highest component of interest, dB (≥ 0). */
  droopDb: number;
  /** Attenuation at fs − fmax, the lowest frequency that folds onto the band of interest, dB. */
  aliasRejectionDb: number;
  /** The highest component of interest, Hz: what the droop is measured at. */
  highestHz: number;
}

/**
 * A plain statement about the plan, by code (src/words/logger.ts says each in words): no
 * filter at all; components folding with too little attenuation; content above the guard rate
 * folding onto the components; that filtering after the converter cannot remove an alias (always
 * there); no Butterworth filter within the limits.
 */
export type LoggerNote =
  'no-filter' | 'false-tones' | 'guard-short' | 'alias-after-converter' | 'no-proposal';

export interface LoggerPlan {
  nyquistHz: number;
  /** The converter's dynamic range, 6.02·bits + 1.76 dB: the attenuation an alias needs. */
  rangeDb: number;
  /** The cutoff and order in use (order 0 without a filter). */
  cutoffHz?: number;
  order: number;
  components: LoggerComponent[];
  /** Every component passes and anything folding onto them is attenuated enough. */
  allPass: boolean;
  /** Content at fs − fmax and above folds onto the components of interest: the filter's rejection there. */
  guard: { hz: number; attenuationDb: number; enough: boolean };
  /** Plain statements, including that filtering after the converter cannot remove an alias. */
  notes: LoggerNote[];
  /** The highest Butterworth order a proposal may use (the option maxOrder). */
  maxOrder: number;
  /** A sample rate and filter that would work (absent when none does within the limits). */
  proposal?: LoggerProposal;
}

/** What the planner weighs: the machine's tones, and the logger's sample rate, filter and converter. */
export interface LoggerPlanInput {
  tones: MachineTones;
  /** Samples per second, Hz. */
  sampleHz: number;
  filter: AntiAliasFilter;
  /** The converter's resolution, bits (1…64). */
  bits: number;
}

export interface LoggerPlanOptions {
  /** Loss allowed at the highest component of interest, dB (0.01…3.01). Default 1 dB (a judgement). */
  passbandDroopDb?: number;
  /** Highest Butterworth order to propose. Default 8 (a judgement: steeper analog filters are rare). */
  maxOrder?: number;
  /** The converter's fastest sample rate, Hz. Default: no limit. */
  maxSampleHz?: number;
}

/** Butterworth −3.01 dB point: a wanted component beyond the cutoff is itself being cut. */
const HALF_POWER_DB = 10 * Math.log10(2);

/**
 * Plans a data logger's sampling of a machine (docs/physics.md §9). For every component (1× and
 * harmonics, blade pass n·f, gear mesh z·f, added tones): where it lands after sampling
 * (foldedHz), whether it aliases (at or above fs/2), the anti-alias filter's gain there
 * (lowPassGainDb: an RC is order 1), and whether that buries it below the converter's noise
 * floor (converterRangeDb: 6.02·bits + 1.76 dB, for a component at full scale, the worst case).
 * Proposes the smallest nice sample rate and the lowest Butterworth order with a cutoff that keep
 * the highest component fmax within passbandDroopDb and attenuate fs − fmax (the lowest
 * frequency that folds onto the band of interest) by the converter's range:
 * fc ≥ fmax/(10^(droop/10) − 1)^(1/2m) and fs ≥ fmax + fc·(10^(range/10) − 1)^(1/2m); the
 * cutoff proposed is the geometric middle of the cutoffs that work at that rate. Components
 * and notes come as codes and numbers (src/words/logger.ts says them in words).
 *
 * Units: Hz, dB, bits. Throws InputError for input that is not an object, a shaft speed ≤ 0, a harmonic count, blade or
 * tooth count that is not a whole number ≥ 1, a tone ≤ 0, a sample rate ≤ 0, an unknown filter,
 * a cutoff ≤ 0, an order outside 1…20, bits outside 1…64, or bad options.
 *
 * @example
 * // 25 Hz shaft, harmonics to 10× (250 Hz), 16 bits (98.08 dB), no filter, 1000 samples/s:
 * // nothing aliases, but nothing stops content above 750 Hz from folding onto 0–250 Hz.
 * loggerPlan({ tones: { shaftHz: 25, harmonics: 10 }, sampleHz: 1000, filter: { kind: 'none' }, bits: 16 }).proposal
 * // { sampleHz: 1600, order: 8, cutoffHz: 299.2…, droopDb: 0.238…, aliasRejectionDb: 104.7…, highestHz: 250 }
 *
 * Sources: Shannon 1949 (Nyquist limit); the alias relation of any DSP text; Butterworth 1930
 * (|H| = 1/sqrt(1 + (f/fc)^(2m)), −3.01 dB at the cutoff); Bennett 1948 / Analog Devices MT-001
 * (6.02·N + 1.76 dB). The nice rates are common practice.
 */
export function loggerPlan(input: LoggerPlanInput, opts?: LoggerPlanOptions): LoggerPlan {
  if (typeof input !== 'object' || input === null) {
    throw new InputError(
      'logger',
      "Give the machine's tones, the sample rate, the filter and the converter's bits.",
    );
  }
  const { tones, sampleHz, filter, bits } = input;
  const list = componentsOf(tones);
  const fs = requirePositive(sampleHz, 'sample rate');
  const { cutoffHz, order } = checkFilter(filter);
  const rangeDb = converterRangeDb(bits);
  const droopDb = requireBetween(
    opts?.passbandDroopDb ?? 1,
    'passband loss allowed (dB)',
    0.01,
    HALF_POWER_DB,
  );
  const maxOrder = requireWhole(opts?.maxOrder ?? 8, 'highest filter order', 1, 20);
  const maxSampleHz =
    opts?.maxSampleHz === undefined
      ? Infinity
      : requirePositive(opts.maxSampleHz, 'fastest sample rate');

  const nyquistHz = fs / 2;
  const gain = (hz: number) => (cutoffHz === undefined ? 0 : lowPassGainDb(hz, cutoffHz, order));
  const components = list.map(({ hz, ...source }): LoggerComponent => {
    const aliases = hz >= nyquistHz;
    const g = gain(hz);
    const neededDb = aliases ? rangeDb : 0;
    const pass = aliases ? -g >= rangeDb : -g <= HALF_POWER_DB + 1e-9;
    return { ...source, hz, foldedHz: foldedHz(hz, fs), aliases, gainDb: g, neededDb, pass };
  });

  const fmax = Math.max(...list.map((c) => c.hz));
  const guardHz = Math.max(fs - fmax, nyquistHz);
  const guardDb = 0 - gain(guardHz); // 0 − 0 is +0: no "-0 dB" without a filter
  const guard = { hz: guardHz, attenuationDb: guardDb, enough: guardDb >= rangeDb };
  const allPass = components.every((c) => c.pass) && guard.enough;
  const proposal = propose(fmax, rangeDb, droopDb, maxOrder, maxSampleHz);

  const notes: LoggerNote[] = [];
  if (cutoffHz === undefined) notes.push('no-filter');
  if (components.some((c) => c.aliases && !c.pass)) notes.push('false-tones');
  else if (!guard.enough) notes.push('guard-short');
  notes.push('alias-after-converter');
  if (!proposal) notes.push('no-proposal');
  return {
    nyquistHz,
    rangeDb,
    ...(cutoffHz === undefined ? {} : { cutoffHz }),
    order,
    components,
    allPass,
    guard,
    notes,
    maxOrder,
    ...(proposal ? { proposal } : {}),
  };
}

/** No proposal above this rate (1 THz): far beyond any data logger, and safe from overflow. */
const MAX_PROPOSED_HZ = 1e12;

function propose(
  fmax: number,
  rangeDb: number,
  droopDb: number,
  maxOrder: number,
  maxSampleHz: number,
): LoggerProposal | undefined {
  const passK = Math.pow(10, droopDb / 10) - 1;
  const stopK = Math.pow(10, rangeDb / 10) - 1;
  const needs = [];
  for (let m = 1; m <= maxOrder; m++) {
    const fcMin = fmax / Math.pow(passK, 1 / (2 * m));
    const stretch = Math.pow(stopK, 1 / (2 * m));
    const fsMin = fmax + fcMin * stretch;
    // Beyond any converter (and beyond the nice series' reach): not a proposal.
    if (fsMin <= MAX_PROPOSED_HZ) needs.push({ m, fcMin, stretch, fsMin });
  }
  if (needs.length === 0) return undefined;
  const best = Math.min(...needs.map((n) => niceSampleRateHz(n.fsMin)));
  if (!(best <= maxSampleHz)) return undefined;
  const chosen = needs.find((n) => n.fsMin <= best * (1 + 1e-12));
  if (!chosen) return undefined;
  const fcMax = (best - fmax) / chosen.stretch;
  const cutoffHz = Math.sqrt(chosen.fcMin * Math.max(fcMax, chosen.fcMin));
  const droop = -lowPassGainDb(fmax, cutoffHz, chosen.m);
  const rejection = -lowPassGainDb(best - fmax, cutoffHz, chosen.m);
  return {
    sampleHz: best,
    order: chosen.m,
    cutoffHz,
    droopDb: droop,
    aliasRejectionDb: rejection,
    highestHz: fmax,
  };
}

/** A component before sampling: where it comes from and its frequency. */
type Source = Pick<LoggerComponent, 'source' | 'count' | 'label' | 'hz'>;

function componentsOf(tones: MachineTones): Source[] {
  if (typeof tones !== 'object' || tones === null) {
    throw new InputError('machine', "Give the shaft speed and the machine's tones.");
  }
  const f = requirePositive(tones.shaftHz, 'shaft speed');
  const harmonics = requireWhole(tones.harmonics ?? 1, 'harmonics', 1, 200);
  const out: Source[] = [];
  for (let k = 1; k <= harmonics; k++) {
    out.push({ source: 'shaft', count: k, hz: k * f });
  }
  listOf(tones.blades, 'blade counts').forEach((b, i) => {
    const n = requireWhole(b, `blade count ${i + 1}`, 1, 1000);
    out.push({ source: 'blades', count: n, hz: n * f });
  });
  listOf(tones.gearTeeth, 'tooth counts').forEach((z, i) => {
    const teeth = requireWhole(z, `tooth count ${i + 1}`, 1, 100_000);
    out.push({ source: 'teeth', count: teeth, hz: teeth * f });
  });
  listOf(tones.extraTones, 'added tones').forEach((t, i) => {
    const hz = requirePositive(t?.hz, `added tone ${i + 1}`);
    const label = typeof t?.label === 'string' ? t.label.trim() : '';
    out.push({ source: 'tone', count: i + 1, ...(label === '' ? {} : { label }), hz });
  });
  if (!out.every((c) => Number.isFinite(c.hz))) {
    throw new InputError(
      'shaft speed',
      'The shaft speed times the blade or tooth count is too large to work with.',
    );
  }
  return out;
}

function listOf<T>(list: T[] | undefined, field: string): T[] {
  if (list === undefined) return [];
  if (!Array.isArray(list)) throw new InputError(field, `${field} must be a list.`);
  return list;
}

function checkFilter(filter: AntiAliasFilter): { cutoffHz?: number; order: number } {
  if (typeof filter !== 'object' || filter === null) {
    throw new InputError('filter', "The filter must be 'none', 'rc' or 'butterworth'.");
  }
  switch (filter.kind) {
    case 'none':
      return { order: 0 };
    case 'rc':
      return {
        cutoffHz:
          filter.cutoffHz !== undefined
            ? requirePositive(filter.cutoffHz, 'cutoff frequency')
            : rcCutoffHz(filter.resistanceOhm as number, filter.capacitanceF as number),
        order: 1,
      };
    case 'butterworth':
      return {
        cutoffHz: requirePositive(filter.cutoffHz, 'cutoff frequency'),
        order: requireWhole(filter.order, 'filter order', 1, 20),
      };
    default:
      throw new InputError('filter', "The filter must be 'none', 'rc' or 'butterworth'.");
  }
}
