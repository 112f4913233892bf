// The data-logger planner's entries (the machine's tones, sample rate, anti-alias filter,
// converter bits) and its plan, from the core's loggerPlan (docs/physics.md §9). The shaft speed is
// read from the set-up's chosen part, never written; the entries live in toolInputs.ts and are
// saved with the machine.
import { batch, computed } from '@preact/signals';
import {
  loggerPlan,
  type AntiAliasFilter,
  type LoggerPlan,
  type LoggerProposal,
  type MachineTones,
} from '../core';
import { corePartOf, defaultLoggerInputs, type PartSpec } from './model';
import { keepLastGood } from './outcome';
import { activePart } from './setup';
import {
  capacitanceF,
  converterBits,
  extraTonesHz,
  filterCutoffHz,
  filterKind,
  filterOrder,
  gearTeeth,
  harmonics,
  bladeCounts,
  rcCutoffHz,
  rcGiven,
  resistanceOhm,
  sampleHz,
  setToolInputs,
  toolInputs,
} from './toolInputs';

export type FilterKind = AntiAliasFilter['kind'];

/** What the planner starts with (model/tools.ts), under the names the screens use. */
export const defaultLoggerEntries = {
  ...defaultLoggerInputs,
} as const;

export {
  bladeCounts,
  capacitanceF,
  converterBits,
  extraTonesHz,
  filterCutoffHz,
  filterKind,
  filterOrder,
  gearTeeth,
  harmonics,
  rcCutoffHz,
  rcGiven,
  resistanceOhm,
  sampleHz,
} from './toolInputs';

/** Puts the planner back to its starting entries. */
export function resetLoggerEntries(): void {
  setToolInputs({ ...toolInputs.peek(), logger: structuredClone(defaultLoggerInputs) });
}

/** The blade counts in use: the ones typed, else the part's own features when it has several. */
export function bladesFor(part: PartSpec, typed: number[] | null): number[] {
  if (typed !== null) return typed;
  return part.features > 1 ? [part.features] : [];
}

/** What the planner's entries say of the machine's tones. */
export interface ToneEntries {
  harmonics: number;
  /** Blade counts typed; null: the part's own. */
  blades: number[] | null;
  gearTeeth: number[];
  extraTonesHz: number[];
}

/** The machine's tones for the core; the shaft runs at the part's speed, either way round. */
export function tonesOf(part: PartSpec, entries: ToneEntries): MachineTones {
  return {
    shaftHz: Math.abs(corePartOf(part).speedHz),
    harmonics: entries.harmonics,
    blades: bladesFor(part, entries.blades),
    gearTeeth: entries.gearTeeth,
    extraTones: entries.extraTonesHz.map((hz) => ({ hz })),
  };
}

export const filter = computed<AntiAliasFilter>(() => {
  switch (filterKind.value) {
    case 'rc':
      return rcGiven.value === 'cutoff'
        ? { kind: 'rc', cutoffHz: rcCutoffHz.value }
        : { kind: 'rc', resistanceOhm: resistanceOhm.value, capacitanceF: capacitanceF.value };
    case 'butterworth':
      return { kind: 'butterworth', order: filterOrder.value, cutoffHz: filterCutoffHz.value };
    default:
      return { kind: 'none' };
  }
});

/** The plan for the current entries, kept at the last good plan when the core refuses one. */
export const loggerPlanning = keepLastGood<LoggerPlan>(() =>
  loggerPlan({
    tones: tonesOf(activePart.value, {
      harmonics: harmonics.value,
      blades: bladeCounts.value,
      gearTeeth: gearTeeth.value,
      extraTonesHz: extraTonesHz.value,
    }),
    sampleHz: sampleHz.value,
    filter: filter.value,
    bits: converterBits.value,
  }),
);

/** Takes the proposal: its sample rate and a Butterworth filter of its order and cutoff. */
export function applyProposal(p: LoggerProposal): void {
  batch(() => {
    sampleHz.value = p.sampleHz;
    filterKind.value = 'butterworth';
    filterOrder.value = p.order;
    filterCutoffHz.value = p.cutoffHz;
  });
}
