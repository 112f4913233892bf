// The data-logger planner's entries (the machine's tones, sample rate, anti-alias filter,
// converter bits) and its plan, from the core's loggerPlan (docs/physics.md §9). The shaft speed is
// the set-up's chosen part; the rest lives here for the session.
import { batch, computed, signal } from '@preact/signals';
import {
  loggerPlan,
  type AntiAliasFilter,
  type LoggerPlan,
  type LoggerProposal,
  type MachineTones,
} from '../core';
import { corePartOf, type PartSpec } from './model';
import { keepLastGood } from './outcome';
import { activePart } from './setup';

export type FilterKind = AntiAliasFilter['kind'];

/** What the planner starts with (judgements for a first look, not recommendations). */
export const defaultLoggerEntries = {
  /** Shaft harmonics 1× … 4×: looseness and misalignment show up to about there (common practice). */
  harmonics: 4,
  /** null: the chosen part's blade count (when it has more than one feature). */
  blades: null as number[] | null,
  gearTeeth: [] as number[],
  extraTonesHz: [] as number[],
  /** A round rate many loggers offer, Hz. */
  sampleHz: 1000,
  filterKind: 'none' as FilterKind,
  /** How an RC stage is given: its cutoff, or R and C. */
  rcGiven: 'cutoff' as 'cutoff' | 'parts',
  rcCutoffHz: 200,
  /** 10 kΩ and 100 nF: fc = 1/(2π·10e3·100e-9) = 159.15 Hz. */
  resistanceOhm: 10_000,
  capacitanceF: 100e-9,
  order: 4,
  cutoffHz: 200,
  /** A common converter width. */
  bits: 16,
};

export const harmonics = signal(defaultLoggerEntries.harmonics);
export const bladeCounts = signal<number[] | null>(defaultLoggerEntries.blades);
export const gearTeeth = signal<number[]>([...defaultLoggerEntries.gearTeeth]);
export const extraTonesHz = signal<number[]>([...defaultLoggerEntries.extraTonesHz]);
export const sampleHz = signal(defaultLoggerEntries.sampleHz);
export const filterKind = signal<FilterKind>(defaultLoggerEntries.filterKind);
export const rcGiven = signal<'cutoff' | 'parts'>(defaultLoggerEntries.rcGiven);
export const rcCutoffHz = signal(defaultLoggerEntries.rcCutoffHz);
export const resistanceOhm = signal(defaultLoggerEntries.resistanceOhm);
export const capacitanceF = signal(defaultLoggerEntries.capacitanceF);
export const filterOrder = signal(defaultLoggerEntries.order);
export const filterCutoffHz = signal(defaultLoggerEntries.cutoffHz);
export const converterBits = signal(defaultLoggerEntries.bits);

/** Puts the planner back to its starting entries. */
export function resetLoggerEntries(): void {
  const d = defaultLoggerEntries;
  batch(() => {
    harmonics.value = d.harmonics;
    bladeCounts.value = d.blades;
    gearTeeth.value = [...d.gearTeeth];
    extraTonesHz.value = [...d.extraTonesHz];
    sampleHz.value = d.sampleHz;
    filterKind.value = d.filterKind;
    rcGiven.value = d.rcGiven;
    rcCutoffHz.value = d.rcCutoffHz;
    resistanceOhm.value = d.resistanceOhm;
    capacitanceF.value = d.capacitanceF;
    filterOrder.value = d.order;
    filterCutoffHz.value = d.cutoffHz;
    converterBits.value = d.bits;
  });
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
