// What the check screen shows, computed from the set-up by the core. `computeCheck` is pure
// (set-up in, plain result out) so it can be tested without a screen; `check` is its
// computed signal, which keeps the last good result when the core refuses a set-up.
import { computed } from '@preact/signals';
import {
  InputError,
  apparentMotion,
  blurDegrees,
  blurPitches,
  cautionFlags,
  defaultLookOptions,
  exposureFromShutterAngle,
  flickerLimits,
  flickerRisk,
  lightHarmonics,
  isSettableBand,
  lockRates,
  rateBands,
  ratesForApparent,
  rollingSkewDegrees,
  settingStepHz,
  svm,
  type ApparentMotion,
  type FlickerRisk,
  type LightWave,
  type Part,
  type RateBand,
  type Range,
  type Sampler,
} from '../core';
import { defaultSetup, type SamplerKind, type Setup } from './model';
import { flickerHzOf, lightWaveOf, samplerRateHz, setup } from './setup';
import { formatNumber } from '../words/format';

/** What the viewer reads, in the words the screen uses for its headline. */
export type VerdictKind =
  'true' | 'steady' | 'creeping' | 'forward' | 'backward' | 'still' | 'images' | 'unclear';

/** How far the viewer can trust what they see. */
export type Trust = 'trust' | 'caution' | 'danger';

export interface Verdict {
  kind: VerdictKind;
  /** The headline: "Turning backward", "6 images, standing still". */
  headline: string;
  trust: Trust;
  /** Images seen at once (1 for a single image). */
  images: number;
  /** Speed the viewer sees, rpm, signed like the true speed (+ = forward). */
  apparentRpm: number;
  trueRpm: number;
}

/** A rate worth tapping, with what the viewer would see there. */
export interface SuggestedRate {
  rateHz: number;
  images: number;
  /** Rate band the lock wanders over within the speed tolerance (equal to rateHz without tolerance). */
  lowHz: number;
  highHz: number;
  /** Where it lies against the current rate. */
  side: 'below' | 'here' | 'above';
}

export interface CreepRate {
  rateHz: number;
  side: 'below' | 'here' | 'above';
  look: ApparentMotion['look'];
  images: number;
}

export interface BandSummary {
  /** Every band in the span searched, ascending. */
  all: RateBand[];
  /** The span the bands cover: the sampler's range, or a window around the rate when the range holds too many locks to list. */
  span: Range;
  partial: boolean;
  /** The band holding the current rate, when the rate lies in the span. */
  current?: RateBand;
  /** Safe bands nearest the current rate, ascending: only bands at least one setting step wide. */
  safeNearby: RateBand[];
  /** Safe bands a person can set (at least one setting step wide), in the span searched. */
  safeCount: number;
}

export interface CameraResult {
  exposureS: number;
  /** Exposure as a shutter angle, degrees (360 when the exposure was longer than a frame and got capped). */
  shutterAngleDeg: number;
  blurDeg: number;
  blurPitches: number;
  blurLook: 'sharp' | 'streaked' | 'smeared';
  skewDeg: number;
  skewPitches: number;
  skewLook: 'straight' | 'bent' | 'broken';
}

export interface LightingResult {
  flickerHz: number;
  modulationPercent: number;
  risk: FlickerRisk;
  lowRiskPercent: number;
  noEffectPercent: number;
  /** The light's shape over a flicker period. */
  wave: LightWave;
  /** Amplitude of the component at the flicker frequency, relative to the mean (a sine's is the percent flicker / 100). */
  fundamental: number;
  /** Components counted by the SVM: the flicker frequency and its harmonics up to 2 kHz. */
  harmonicCount: number;
  /**
   * Stroboscopic visibility measure (CIE TN 006:2016, threshold fit of Perz et al. 2018) of
   * those components (1 = threshold; 0 with none below 2 kHz).
   */
  svm: number;
}

export interface CheckResult {
  samplerKind: SamplerKind;
  sampler: Sampler;
  rateHz: number;
  range: Range;
  rateInRange: boolean;
  part: Required<Part>;
  motion: ApparentMotion;
  verdict: Verdict;
  locks: SuggestedRate[];
  /** Why some lock-in rates near the current one are not suggested, when some are not. */
  locksNote?: string;
  creep: CreepRate[];
  creepRpm: number;
  /** Why no creep rate is offered, when none is. */
  creepNote?: string;
  bands: BandSummary;
  camera?: CameraResult;
  lighting?: LightingResult;
  /**
   * physics.md §4 and §10: the view is aliased (anything but the true motion with one image:
   * still, slowed forward, several images, backward, unclear, a creep asked for), so the
   * stillness and lock-out caution goes with the verdict.
   */
  showSafety: boolean;
  /** physics.md §10: a flash rate between 3 and 60 per second. */
  showPhotosensitivity: boolean;
  /** Plain-words notes about the inputs (a rate outside the strobe's range, a capped exposure…). */
  notes: string[];
}

/** A camera's practical frame-rate span, Hz: from slow time-lapse to phone slow motion (common practice). */
export const CAMERA_RANGE: Range = { minHz: 1, maxHz: 1000 };
/** Lighting flicker span, Hz: mains flicker to the dimmer frequencies IEEE Std 1789-2015 covers. */
export const LIGHTING_RANGE: Range = { minHz: 25, maxHz: 3000 };
/** Apparent speeds up to this are a creep an inspector can follow, rpm (a judgement). */
export const CREEP_LIMIT_RPM = 60;
/** Blur up to this is sharp to the eye, degrees of turn per exposure (a judgement). */
export const SHARP_BLUR_DEG = 1;
/** Rolling-shutter bend up to this looks straight, degrees (a judgement). */
export const STRAIGHT_SKEW_DEG = 2;
/**
 * Safe bands narrower than this share of their rate are too narrow to hold a sampler in
 * (speed drift, dial steps); they are listed only when there is nothing wider (a judgement).
 */
export const MIN_USEFUL_BAND = 0.005;
/** Suggested rates shown on each side of the current one. */
export const LOCKS_PER_SIDE = 3;
/** Largest loop the core may run for one keystroke; beyond it, search a window around the rate instead. */
const WORK_LIMIT = 40_000;

const look = defaultLookOptions;

/** The core part for the set-up's active part. */
export function corePart(s: Setup): Required<Part> {
  const p = s.parts[s.activePart] ?? s.parts[0];
  return { speedHz: p.speedRpm / 60, symmetry: p.features, tolerance: p.tolerancePercent / 100 };
}

function samplerMode(kind: SamplerKind): Sampler {
  return kind === 'camera' ? 'frames' : 'flash';
}

function samplerRange(s: Setup, rateHz: number): Range {
  if (s.samplerKind === 'strobe')
    return { minHz: s.strobe.minFpm / 60, maxHz: s.strobe.maxFpm / 60 };
  const base = s.samplerKind === 'camera' ? CAMERA_RANGE : LIGHTING_RANGE;
  return { minHz: Math.min(base.minHz, rateHz), maxHz: Math.max(base.maxHz, rateHz) };
}

/** The verdict in plain words, from the core's reading of the part (physics.md §2–3). */
export function verdictOf(
  motion: ApparentMotion,
  part: Required<Part>,
  steadyLight = false,
): Verdict {
  const trueRpm = part.speedHz * 60;
  if (steadyLight) {
    return {
      kind: 'steady',
      headline: 'Steady light: true motion',
      trust: 'trust',
      images: 1,
      apparentRpm: trueRpm,
      trueRpm,
    };
  }
  const images = motion.images;
  const apparentRpm = (images > 1 ? motion.driftHz : motion.apparentHz) * 60;
  const base = { images, apparentRpm, trueRpm };
  // Several images that creep as a group: the eye follows the group, so its drift sets the
  // direction seen, whatever the single-image step says (physics.md §3). Superimposed images
  // never show the true motion, so they always carry the safety notice.
  if (images > 1 && motion.look !== 'still') {
    const dir = Math.sign(motion.driftHz) === Math.sign(part.speedHz) ? 'forward' : 'backward';
    return {
      ...base,
      kind: 'images',
      headline: `${images} images, creeping ${dir}`,
      trust: 'danger',
    };
  }
  switch (motion.look) {
    case 'true':
      return { ...base, kind: 'true', headline: 'True motion', trust: 'trust' };
    case 'still':
      return images > 1
        ? { ...base, kind: 'images', headline: `${images} images, standing still`, trust: 'danger' }
        : { ...base, kind: 'still', headline: 'Looks still', trust: 'danger' };
    case 'unclear':
      return {
        ...base,
        kind: 'unclear',
        headline: images > 1 ? `${images} images, direction unclear` : 'Direction unclear',
        trust: 'danger',
      };
    case 'backward':
      return {
        ...base,
        kind: 'backward',
        headline: images > 1 ? `${images} images, turning backward` : 'Turning backward',
        trust: 'danger',
      };
    case 'forward': {
      const creeping = Math.abs(apparentRpm) <= CREEP_LIMIT_RPM;
      const words = creeping ? 'creeping forward' : 'forward, slower than real';
      return {
        ...base,
        kind: creeping ? 'creeping' : 'forward',
        headline:
          images > 1
            ? `${images} images, ${words}`
            : words.charAt(0).toUpperCase() + words.slice(1),
        trust: 'caution',
      };
    }
  }
}

function sideOf(rateHz: number, currentHz: number): 'below' | 'here' | 'above' {
  const gap = (rateHz - currentHz) / currentHz;
  return Math.abs(gap) < 1e-9 ? 'here' : gap < 0 ? 'below' : 'above';
}

/** Loop length of lockRates over a span: p runs over F·q/max … F·q/min for each q ≤ qMax. */
function lockWork(patternHz: number, qMax: number, span: Range): number {
  return patternHz * (1 / span.minHz - 1 / span.maxHz) * ((qMax * (qMax + 1)) / 2) + 1;
}

/** Loop length of rateBands over a span for a pattern frequency within [lo, hi] (lo, hi in Hz). */
function bandWork(loHz: number, hiHz: number, qMax: number, span: Range): number {
  const perQ = hiHz / span.minHz - loHz / span.maxHz;
  return perQ * ((qMax * (qMax + 1)) / 2 + 1) + 1;
}

/** A window [anchor/w, anchor·w] clipped to the range. */
function windowAround(anchorHz: number, w: number, range: Range): Range {
  return { minHz: Math.max(range.minHz, anchorHz / w), maxHz: Math.min(range.maxHz, anchorHz * w) };
}

function clampTo(range: Range, rateHz: number): number {
  return Math.min(range.maxHz, Math.max(range.minHz, rateHz));
}

/**
 * Runs `search` on windows growing around the anchor until it finds `perSide` results on
 * each side (or the window fills the range, or the next window would cost too much).
 * `searched` is false when even the first window was too costly to search.
 */
function searchAround<T>(
  anchorHz: number,
  range: Range,
  ratio: number,
  cost: (span: Range) => number,
  search: (span: Range) => T[],
  rateOf: (t: T) => number,
  perSide: number,
): { found: T[]; searched: boolean } {
  let w = 1 + 4 / Math.max(Math.abs(ratio), 1);
  let found: T[] = [];
  let searched = false;
  for (let i = 0; i < 40; i++) {
    const span = windowAround(anchorHz, w, range);
    if (!(span.minHz < span.maxHz) || cost(span) > WORK_LIMIT) break;
    found = search(span);
    searched = true;
    const below = found.filter((t) => rateOf(t) < anchorHz).length;
    const above = found.filter((t) => rateOf(t) > anchorHz).length;
    const lowDone = below >= perSide || span.minHz <= range.minHz;
    const highDone = above >= perSide || span.maxHz >= range.maxHz;
    if (lowDone && highDone) break;
    w = 1 + (w - 1) * 3;
  }
  return { found, searched };
}

/** The `perSide` entries nearest the anchor on each side, plus any right at it, ascending. */
function nearest<T>(items: T[], anchorHz: number, rateOf: (t: T) => number, perSide: number): T[] {
  const below = items
    .filter((t) => rateOf(t) < anchorHz * (1 - 1e-9))
    .sort((a, b) => rateOf(b) - rateOf(a));
  const here = items.filter((t) => Math.abs(rateOf(t) - anchorHz) <= anchorHz * 1e-9);
  const above = items
    .filter((t) => rateOf(t) > anchorHz * (1 + 1e-9))
    .sort((a, b) => rateOf(a) - rateOf(b));
  return [...below.slice(0, perSide).reverse(), ...here, ...above.slice(0, perSide)];
}

/**
 * Rates worth suggesting: a single image (to freeze) or a double image (the check at twice the
 * rate). Nobody sets a strobe on purpose for six superimposed images; the rate map and the
 * bands still show every lock up to the look options' limit (common practice).
 */
const SUGGESTED_MAX_IMAGES = 2;

function nearbyLocks(
  part: Required<Part>,
  rateHz: number,
  range: Range,
  sampler: Sampler,
): { locks: SuggestedRate[]; note?: string } {
  const patternHz = part.symmetry * Math.abs(part.speedHz);
  if (patternHz === 0) return { locks: [] };
  const maxImages = sampler === 'flash' ? Math.min(look.maxImages, SUGGESTED_MAX_IMAGES) : 1;
  const anchor = clampTo(range, rateHz);
  const { found } = searchAround(
    anchor,
    range,
    patternHz / anchor,
    (span) => lockWork(patternHz, maxImages, span),
    (span) => lockRates(part, span, { maxImages }),
    (l) => l.rateHz,
    LOCKS_PER_SIDE,
  );
  // physics.md §4: a lock is offered only when the rates that freeze it (its tolerance band
  // widened by the still threshold, n·stillHz·q/p) make a band a person can set and hold.
  const step = settingStepHz(sampler);
  const stillHz = part.symmetry * look.stillHz;
  const holdable = found.filter((l) =>
    isSettableBand(
      { fromHz: l.lowHz - (stillHz * l.q) / l.p, toHz: l.highHz + (stillHz * l.q) / l.p },
      step,
      l.rateHz,
    ),
  );
  const locks = nearest(holdable, rateHz, (l) => l.rateHz, LOCKS_PER_SIDE).map((l) => ({
    rateHz: l.rateHz,
    images: l.images,
    lowHz: l.lowHz,
    highHz: l.highHz,
    side: sideOf(l.rateHz, rateHz),
  }));
  // Left out only where one of the nearest locks would otherwise have been shown.
  const dropped = nearest(found, rateHz, (l) => l.rateHz, LOCKS_PER_SIDE).some(
    (l) => !holdable.includes(l),
  );
  if (!dropped) return { locks };
  const unit = sampler === 'frames' ? '0.01 frames/s' : 'one flash per minute';
  return {
    locks,
    note:
      `Some lock-in rates near here freeze the part over less than ${unit}: too narrow to set and ` +
      `hold, so they are left out. A speed tolerance widens them; the rate map shows every lock.`,
  };
}

function creepRates(
  part: Required<Part>,
  creepRpm: number,
  rateHz: number,
  range: Range,
  sampler: Sampler,
): { rates: CreepRate[]; note?: string } {
  const f = part.speedHz;
  if (f === 0) return { rates: [], note: 'The part is not turning, so no rate can make it creep.' };
  const creepHz = creepRpm / 60;
  if (!(creepHz > 0)) return { rates: [], note: 'Give a creep speed above zero.' };
  if (creepHz >= Math.abs(f)) {
    return { rates: [], note: 'The creep must be slower than the true speed.' };
  }
  const wanted = Math.sign(f) * creepHz;
  const gapHz = part.symmetry * Math.abs(f - wanted);
  const anchor = clampTo(range, rateHz);
  const { found, searched } = searchAround(
    anchor,
    range,
    gapHz / anchor,
    (span) => gapHz * (1 / span.minHz - 1 / span.maxHz) + 1,
    // physics.md §4: only rates where this sampler shows one image creeping forward.
    (span) => ratesForApparent(part, wanted, span, { sampler }),
    (r) => r.rateHz,
    1,
  );
  const rates = nearest(found, rateHz, (r) => r.rateHz, 1).map((r) => {
    const m = apparentMotion(part, r.rateHz, { sampler });
    return { rateHz: r.rateHz, side: sideOf(r.rateHz, rateHz), look: m.look, images: m.images };
  });
  if (rates.length > 0) return { rates };
  if (!searched)
    return {
      rates,
      note: 'The features pass too often per flash here to pick a creep rate: choose a faster rate.',
    };
  return {
    rates,
    note: `No rate in the range shows it as one image creeping forward at ${formatNumber(creepRpm)} rpm.`,
  };
}

function bandSummary(
  part: Required<Part>,
  rateHz: number,
  range: Range,
  sampler: Sampler,
): BandSummary {
  const patternHz = part.symmetry * Math.abs(part.speedHz);
  // rateBands' spans reach the nearly-still margin below a lock and the image-group margin above.
  const belowHz = part.symmetry * Math.max(look.stillHz, look.nearlyStillHz);
  const aboveHz = Math.max(part.symmetry * look.stillHz, look.groupSpacingsPerS);
  const loHz = Math.max(0, patternHz * (1 - part.tolerance) - belowHz);
  const hiHz = patternHz * (1 + part.tolerance) + aboveHz;
  const qMax = sampler === 'flash' ? look.maxImages : 1;
  const cost = (span: Range) => bandWork(loHz, hiHz, qMax, span);
  let span = range;
  let partial = false;
  if (patternHz > 0 && cost(span) > WORK_LIMIT) {
    // Too many locks to list over the whole range: shrink a window around the rate until it fits.
    partial = true;
    const anchor = clampTo(range, rateHz);
    let w = Math.max(range.maxHz / anchor, anchor / range.minHz);
    for (let i = 0; i < 60 && cost(windowAround(anchor, w, range)) > WORK_LIMIT; i++)
      w = 1 + (w - 1) / 2;
    span = windowAround(anchor, w, range);
  }
  const fits = span.minHz < span.maxHz && (patternHz === 0 || cost(span) <= WORK_LIMIT);
  const all = fits ? rateBands([part], span, { sampler }) : [];
  const current = all.find((b) => b.fromHz <= rateHz && rateHz <= b.toHz);
  // physics.md §4: a band narrower than one setting step is not offered.
  const step = settingStepHz(sampler);
  const safe = all.filter((b) => b.safe && isSettableBand(b, step));
  const wide = safe.filter(
    (b) => b.toHz - b.fromHz >= MIN_USEFUL_BAND * Math.sqrt(b.fromHz * b.toHz),
  );
  const mid = (b: RateBand) => Math.sqrt(b.fromHz * b.toHz);
  const safeNearby = [...(wide.length > 0 ? wide : safe)]
    .sort((a, b) => Math.abs(Math.log(mid(a) / rateHz)) - Math.abs(Math.log(mid(b) / rateHz)))
    .slice(0, 2 * LOCKS_PER_SIDE)
    .sort((a, b) => a.fromHz - b.fromHz);
  return {
    all,
    span: fits ? span : { minHz: rateHz, maxHz: rateHz },
    partial: partial || !fits,
    current,
    safeNearby,
    safeCount: safe.length,
  };
}

function cameraResult(s: Setup, part: Required<Part>, notes: string[]): CameraResult {
  const { frameRate, exposure, readoutMs } = s.camera;
  const frameS = 1 / frameRate;
  let exposureS =
    exposure.mode === 'angle'
      ? exposureFromShutterAngle(exposure.angleDeg, frameRate)
      : exposure.seconds;
  if (exposureS > frameS * (1 + 1e-9)) {
    notes.push('The exposure is longer than one frame; a camera caps it at one frame (360°).');
    exposureS = frameS;
  }
  const shutterAngleDeg = Math.min(360, 360 * exposureS * frameRate);
  const readoutS = readoutMs / 1000;
  if (readoutS > frameS * (1 + 1e-9)) {
    notes.push(
      'The readout time is longer than one frame: no camera reads that slowly at this frame rate.',
    );
  }
  const blurDeg = blurDegrees(part.speedHz, exposureS);
  const pitches = blurPitches(part.speedHz, part.symmetry, exposureS);
  const skewDeg = rollingSkewDegrees(part.speedHz, readoutS);
  const skewPitches = (skewDeg * part.symmetry) / 360;
  return {
    exposureS,
    shutterAngleDeg,
    blurDeg,
    blurPitches: pitches,
    blurLook: pitches >= 1 ? 'smeared' : blurDeg <= SHARP_BLUR_DEG ? 'sharp' : 'streaked',
    skewDeg,
    skewPitches,
    skewLook: skewPitches >= 1 ? 'broken' : skewDeg <= STRAIGHT_SKEW_DEG ? 'straight' : 'bent',
  };
}

export function lightingResult(
  flickerHz: number,
  modulationPercent: number,
  wave: LightWave,
): LightingResult {
  const limits = flickerLimits(flickerHz);
  // The light's harmonics up to 2 kHz for its shape, each relative to the mean (physics.md §6).
  const harmonics = lightHarmonics(wave, flickerHz, modulationPercent);
  return {
    flickerHz,
    modulationPercent,
    risk: flickerRisk(flickerHz, modulationPercent),
    ...limits,
    wave,
    fundamental: harmonics[0]?.amplitude ?? 0,
    harmonicCount: harmonics.length,
    svm: harmonics.length === 0 ? 0 : svm(harmonics),
  };
}

/**
 * An aliased view (physics.md §4): every view that is not the true motion with one image. A
 * sampler below the pattern's Nyquist rate (not faithful) always aliases; above it, several
 * superimposed images (one mark at 10 rev/s under 30.5 flashes/s shows three) are not the
 * true motion either.
 */
export function isAliased(motion: ApparentMotion): boolean {
  return !motion.faithful || motion.images > 1 || motion.look !== 'true';
}

/** Everything the check screen shows for a set-up. Throws the core's InputError for a set-up it refuses. */
export function computeCheck(s: Setup): CheckResult {
  const part = corePart(s);
  const sampler = samplerMode(s.samplerKind);
  const rateHz = samplerRateHz(s);
  const range = samplerRange(s, rateHz);
  const notes: string[] = [];
  const rateInRange = range.minHz <= rateHz * (1 + 1e-12) && rateHz <= range.maxHz * (1 + 1e-12);
  if (!rateInRange) notes.push("The flash rate lies outside this strobe's own range.");

  const motion = apparentMotion(part, rateHz, { sampler });
  const steadyLight = s.samplerKind === 'lighting' && s.lighting.modulationPercent === 0;
  const verdict = verdictOf(motion, part, steadyLight);
  const creep = creepRates(part, s.creepRpm, rateHz, range, sampler);
  const camera = s.samplerKind === 'camera' ? cameraResult(s, part, notes) : undefined;
  const lighting =
    s.samplerKind === 'lighting'
      ? lightingResult(
          flickerHzOf(s.lighting),
          s.lighting.modulationPercent,
          lightWaveOf(s.lighting),
        )
      : undefined;
  const flashes = sampler === 'flash' && !steadyLight;

  return {
    samplerKind: s.samplerKind,
    sampler,
    rateHz,
    range,
    rateInRange,
    part,
    motion,
    verdict,
    ...lockSuggestions(nearbyLocks(part, rateHz, range, sampler)),
    creep: creep.rates,
    creepRpm: s.creepRpm,
    creepNote: creep.note,
    bands: bandSummary(part, rateHz, range, sampler),
    camera,
    lighting,
    showSafety: !steadyLight && isAliased(motion),
    showPhotosensitivity: flashes && cautionFlags({ flashRatesHz: [rateHz] }).photosensitivity,
    notes,
  };
}

function lockSuggestions(found: { locks: SuggestedRate[]; note?: string }) {
  return found.note === undefined
    ? { locks: found.locks }
    : { locks: found.locks, locksNote: found.note };
}

/** A check result, or the reason the core refused the set-up. */
export type CheckOutcome = { ok: true; result: CheckResult } | { ok: false; message: string };

/** computeCheck that reports the core's refusal instead of throwing. */
export function tryCheck(s: Setup): CheckOutcome {
  try {
    return { ok: true, result: computeCheck(s) };
  } catch (error) {
    if (error instanceof InputError) return { ok: false, message: error.message };
    throw error;
  }
}

let lastGood: CheckResult | undefined;

/** The core's reading of the current set-up, or its refusal. */
export const checkOutcome = computed<CheckOutcome>(() => tryCheck(setup.value));

/** The newest result the core accepted: a refused set-up leaves the last good result on screen. */
export const check = computed<CheckResult>(() => {
  const outcome = checkOutcome.value;
  if (outcome.ok) lastGood = outcome.result;
  return lastGood ?? computeCheck(defaultSetup);
});

/** The core's refusal of the current set-up, if any (shown above the results). */
export const checkProblem = computed<string | undefined>(() => {
  const outcome = checkOutcome.value;
  return outcome.ok ? undefined : outcome.message;
});
