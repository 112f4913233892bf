// What the check screen shows at the top, computed from the set-up by the core: pure (set-up
// in, plain result out) so it can be tested without a screen. Codes and numbers only;
// src/words/check.ts says them in words. The rates to try and the bands under it are worked
// out apart (lists.ts): they cost more, load later and follow a paint behind.
import {
  apparentMotion,
  blurDegrees,
  blurPitches,
  cautionFlags,
  exposureFromShutterAngle,
  flickerLimits,
  flickerRisk,
  lightHarmonics,
  rollingSkewDegrees,
  svm,
  type ApparentMotion,
  type FlickerRisk,
  type LightWave,
  type Part,
  type Range,
  type Sampler,
} from '../../core';
import { activeCorePart, samplerOf, type SamplerKind, type Setup } from '../model';
import { flickerHzOf, lightWaveOf, samplerRateHz } from '../setup';
import { isAliased, verdictOf, type Verdict } from './verdict';

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

/** Something about the entries worth saying beside the verdict (src/words/check.ts). */
export type CheckNote = 'rate-outside-range' | 'exposure-capped' | 'readout-too-long';

/** The answer at the top of the check screen: what the viewer sees, and the cautions it needs. */
export interface CheckAnswer {
  samplerKind: SamplerKind;
  sampler: Sampler;
  rateHz: number;
  range: Range;
  rateInRange: boolean;
  part: Required<Part>;
  motion: ApparentMotion;
  verdict: Verdict;
  camera?: CameraResult;
  lighting?: LightingResult;
  /**
   * docs/physics.md §4 and §10: the view is aliased (anything but the true motion with one image:
   * still, slowed forward, several images, backward, unclear, a creep asked for), so the
   * stillness and lock-out caution goes with the verdict.
   */
  showSafety: boolean;
  /** docs/physics.md §10: a flash rate between 3 and 60 per second. */
  showPhotosensitivity: boolean;
  /** Notes about the entries (a rate outside the strobe's range, a capped exposure…). */
  notes: CheckNote[];
}

/** A camera's practical frame-rate span, Hz: from slow time-lapse to phone slow motion (common practice). */
export const CAMERA_RANGE: Range = { minHz: 1, maxHz: 1000 };
/** Lighting flicker span, Hz: mains flicker to the dimmer frequencies IEEE Std 1789-2015 covers. */
export const LIGHTING_RANGE: Range = { minHz: 25, maxHz: 3000 };
/** Blur up to this is sharp to the eye, degrees of turn per exposure (a judgement, docs/physics.md §12). */
export const SHARP_BLUR_DEG = 1;
/** Rolling-shutter bend up to this looks straight, degrees (a judgement, docs/physics.md §12). */
export const STRAIGHT_SKEW_DEG = 2;

/** The rates the sampler can be set to (a camera's or a light's widened to take in the rate set). */
function samplerRange(s: Setup, rateHz: number): Range {
  if (s.samplerKind === 'strobe')
    return { minHz: s.strobe.minFpm / 60, maxHz: s.strobe.maxFpm / 60 };
  const base = s.samplerKind === 'camera' ? CAMERA_RANGE : LIGHTING_RANGE;
  return { minHz: Math.min(base.minHz, rateHz), maxHz: Math.max(base.maxHz, rateHz) };
}

function cameraResult(s: Setup, part: Required<Part>, notes: CheckNote[]): CameraResult {
  const { frameRate, exposure, readoutMs } = s.camera;
  const frameS = 1 / frameRate;
  let exposureS =
    exposure.mode === 'angle'
      ? exposureFromShutterAngle(exposure.angleDeg, frameRate)
      : exposure.seconds;
  // A camera caps an exposure at one frame (360°).
  if (exposureS > frameS * (1 + 1e-9)) {
    notes.push('exposure-capped');
    exposureS = frameS;
  }
  const shutterAngleDeg = Math.min(360, 360 * exposureS * frameRate);
  const readoutS = readoutMs / 1000;
  if (readoutS > frameS * (1 + 1e-9)) notes.push('readout-too-long');
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
  // The light's harmonics up to 2 kHz for its shape, each relative to the mean (docs/physics.md §6).
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

/** The check screen's answer for a set-up. Throws the core's InputError for a set-up it refuses. */
export function computeCheckAnswer(s: Setup): CheckAnswer {
  const part = activeCorePart(s);
  const sampler = samplerOf(s.samplerKind);
  const rateHz = samplerRateHz(s);
  const range = samplerRange(s, rateHz);
  const notes: CheckNote[] = [];
  const rateInRange = range.minHz <= rateHz * (1 + 1e-12) && rateHz <= range.maxHz * (1 + 1e-12);
  if (!rateInRange) notes.push('rate-outside-range');

  const motion = apparentMotion(part, rateHz, { sampler });
  const steadyLight = s.samplerKind === 'lighting' && s.lighting.modulationPercent === 0;
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
    verdict: verdictOf(motion, part, steadyLight),
    camera,
    lighting,
    showSafety: !steadyLight && isAliased(motion),
    showPhotosensitivity: flashes && cautionFlags({ flashRatesHz: [rateHz] }).photosensitivity,
    notes,
  };
}
