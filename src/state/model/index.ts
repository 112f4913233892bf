// The shapes the app keeps: what the user set up, and the machines they saved.
// Plain data in user-facing units (rpm, flashes per minute, percent), so a saved file reads
// naturally; the converters at the end of this file are the one way to the core's units.
// Beside it: the kinds of part (kinds.ts), where a speed came from (origin.ts), each tool's
// inputs (tools.ts) and the machine that holds them all (machine.ts).
import type { Part, Sampler } from '../../core';
import type { PartKind } from './kinds';
import type { SpeedOrigin } from './origin';

export * from './kinds';
export * from './origin';
export * from './tools';
export * from './machine';
export * from './derived';

export type SpeedUnit = 'rpm' | 'Hz' | 'rad/s';

/** Fastest speed a field accepts: beyond any machine part a person checks with a strobe or camera. */
export const MAX_SPEED_RPM = 1_000_000;
/** Fastest sampler a field accepts, Hz: strobes reach a few kHz, high-speed cameras far more. */
export const MAX_RATE_HZ = 1_000_000;
export type SamplerKind = 'camera' | 'strobe' | 'lighting';

/** A turning part. */
export interface PartSpec {
  /** What the crew calls it: "cooling fan", "drive pulley". */
  name: string;
  /** What sort of part it is (sets the words and the part form); absent reads as 'other'. */
  kind?: PartKind;
  /** Signed speed in rpm (+ = the viewer's reference direction). */
  speedRpm: number;
  /** Identical, equally spaced features: blades, spokes, jaws, bolts. 1 = a single mark. */
  features: number;
  /** Speed tolerance, ± percent (slip, drift, nameplate uncertainty). */
  tolerancePercent: number;
  /** When set, the speed comes from an induction motor's mains, poles and slip. */
  motor?: { mainsHz: number; poles: number; slipPercent: number };
  /**
   * When set, the part is driven by an earlier part of the same set-up (the whole-machine
   * screen), and speedRpm and tolerancePercent hold what the drive gives.
   */
  drive?: PartDrive;
  /**
   * A wheel's road speed and tyre size, kept with the part: the speed they give is applied with
   * one tap (applyDerivedSpeed), never written behind the user's back.
   */
  wheel?: WheelSpec;
  /** Where a speed applied from a derivation came from; absent for a speed typed or followed live. */
  origin?: SpeedOrigin;
}

/**
 * How a part is driven by parts[from] (an earlier part, counted from 0).
 * Belt: driven speed = driver speed × driverMm ÷ drivenMm, up to slipPercent slower.
 * Gear (an external mesh, which reverses the direction): driven speed = driver speed × driverTeeth ÷ drivenTeeth.
 * Shaft: on the same shaft, the same speed.
 */
export type PartDrive =
  | { from: number; kind: 'belt'; driverMm: number; drivenMm: number; slipPercent: number }
  | { from: number; kind: 'gear'; driverTeeth: number; drivenTeeth: number }
  | { from: number; kind: 'shaft' };

/** A wheel rolling at a ground speed (signed, in its unit) on a tyre of an ISO metric size ("205/55R16"). */
export interface WheelSpec {
  groundSpeed: number;
  unit: 'km/h' | 'mph';
  tyreSize: string;
}

/** A camera: frame rate, exposure and rolling-shutter readout. */
export interface CameraSpec {
  frameRate: number;
  /** Exposure given as a shutter angle (degrees) or a time (seconds, e.g. 1/500). */
  exposure: { mode: 'angle'; angleDeg: number } | { mode: 'time'; seconds: number };
  /** Top-to-bottom readout of a rolling shutter, ms (0 = global shutter). */
  readoutMs: number;
}

/** A stroboscope: its current rate and its own range, in flashes per minute. */
export interface StrobeSpec {
  rateFpm: number;
  minFpm: number;
  maxFpm: number;
}

/** Lighting on mains: flicker at twice mains, at mains, or a custom frequency. */
export interface LightingSpec {
  mainsHz: 50 | 60;
  flicker: 'double' | 'mains' | 'custom';
  customHz: number;
  /** Percent flicker, 100·(Lmax − Lmin)/(Lmax + Lmin). */
  modulationPercent: number;
  /**
   * The light's shape over a flicker period (docs/physics.md §6): a sine (the default, and what
   * older set-ups assumed), rectangular PWM, or the full-wave rectified sine of a plain driver.
   */
  waveform?: LightWaveform;
  /** Share of each period a PWM light is on, percent (kept while another shape is chosen). Default 50. */
  dutyPercent?: number;
}

/** The light's shape as the set-up keeps it. */
export type LightWaveform = 'sine' | 'rectangular' | 'rectified';

/** PWM duty when none was given: a square wave. */
export const DEFAULT_DUTY_PERCENT = 50;

/** Everything the check screen shows, as the user set it. */
export interface Setup {
  parts: PartSpec[];
  /** Index into parts of the part being checked. */
  activePart: number;
  samplerKind: SamplerKind;
  camera: CameraSpec;
  strobe: StrobeSpec;
  lighting: LightingSpec;
  /** Wanted slow forward creep for inspection, rpm. */
  creepRpm: number;
}

/** What a part is called on screen and in messages: its name, or its place in the list. */
export function partLabel(s: Setup, index: number): string {
  return s.parts[index]?.name.trim() || `Part ${index + 1}`;
}

/**
 * A new part for the end of the list: a single mark with the speed and tolerance of `like`,
 * named "Part n" with the first n no part of the list uses (names compare without case).
 */
export function newPartLike(parts: readonly PartSpec[], like: PartSpec): PartSpec {
  const taken = new Set(parts.map((p) => p.name.trim().toLowerCase()));
  let n = parts.length + 1;
  while (taken.has(`part ${n}`)) n++;
  return {
    name: `Part ${n}`,
    kind: 'other',
    speedRpm: like.speedRpm,
    features: 1,
    tolerancePercent: like.tolerancePercent,
  };
}

/**
 * The place of the part every screen works on: `activePart`, or the first part when it points
 * nowhere (a set-up edited elsewhere). The one rule for it: nothing else falls back on its own.
 */
export function activeIndex(s: Setup): number {
  return s.parts[s.activePart] ? s.activePart : 0;
}

/** The part every screen works on (see activeIndex). */
export function activePartOf(s: Setup): PartSpec {
  return s.parts[activeIndex(s)];
}

/**
 * The one converter from a part as the set-up keeps it (rpm, features, ± percent) to the core's
 * part (rev/s, symmetry, relative tolerance): the set-up's `features` is the core's `symmetry`.
 * @example corePartOf({ name: 'Fan', speedRpm: 1770, features: 6, tolerancePercent: 1 }) // { speedHz: 29.5, symmetry: 6, tolerance: 0.01 }
 */
export function corePartOf(part: PartSpec): Required<Part> {
  return {
    speedHz: part.speedRpm / 60,
    symmetry: part.features,
    tolerance: part.tolerancePercent / 100,
  };
}

/** The core's part for the part every screen works on. */
export function activeCorePart(s: Setup): Required<Part> {
  return corePartOf(activePartOf(s));
}

/** How the set-up's kind of sampler looks: a camera takes frames, a strobe or lighting flashes. */
export function samplerOf(kind: SamplerKind): Sampler {
  return kind === 'camera' ? 'frames' : 'flash';
}

/** The set-up a first visit opens with. */
export const defaultSetup: Setup = {
  parts: [{ name: 'Fan', speedRpm: 1770, features: 6, tolerancePercent: 1 }],
  activePart: 0,
  samplerKind: 'strobe',
  // 30000/1001 frames/s (SMPTE ST 12-1), 180° shutter, a typical phone readout (Ringaby & Forssén 2011).
  camera: { frameRate: 30000 / 1001, exposure: { mode: 'angle', angleDeg: 180 }, readoutMs: 25 },
  strobe: { rateFpm: 1770, minFpm: 30, maxFpm: 12000 },
  lighting: { mainsHz: 50, flicker: 'double', customHz: 300, modulationPercent: 30 },
  creepRpm: 2,
};
