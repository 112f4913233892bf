// What the check screen hands its two pictures: plain values taken from the check result and
// the set-up, so the wiring can be tested without drawing anything.
import type { Part, Range, Sampler } from '../../core';
import type { CheckAnswer } from '../../state/check';
import { type SamplerKind, type Setup, activeIndex, corePartOf } from '../../state/model';

/** What the preview draws: one part as one sampler shows it. */
export interface PreviewInput {
  part: Part;
  sampler: Sampler;
  rateHz: number;
  /** Camera exposure; 0 for a strobe (the set-up has no flash duration: an instant) and for lighting. */
  exposureS: number;
  /** Camera rolling-shutter readout; 0 otherwise. */
  readoutS: number;
}

/** What the rate map draws: every part over the sampler's range. */
export interface RateMapInput {
  parts: Array<Required<Part> & { name?: string }>;
  range: Range;
  rateHz: number;
  samplerKind: SamplerKind;
}

/**
 * The preview of the part being checked, with the values the verdict was worked out from (the
 * last set-up the core accepted). null for steady light: with no flicker there is no sampling,
 * and the part looks as it really turns.
 */
export function previewInputOf(result: CheckAnswer, setup: Setup): PreviewInput | null {
  if (result.lighting && result.lighting.modulationPercent === 0) return null;
  const camera = result.camera;
  return {
    part: { speedHz: result.part.speedHz, symmetry: result.part.symmetry },
    sampler: result.sampler,
    rateHz: result.rateHz,
    exposureS: camera ? camera.exposureS : 0,
    readoutS: camera ? setup.camera.readoutMs / 1000 : 0,
  };
}

/**
 * Every part of the set-up on the rate map, in the core's units, over the range the check uses
 * (the strobe's own range; a camera's or lighting's usual span stretched to hold the rate). The
 * part being checked takes the values of the check result, so the map agrees with the verdict
 * when the newest entry was refused.
 */
export function rateMapInputOf(result: CheckAnswer, setup: Setup): RateMapInput {
  const active = activeIndex(setup);
  const parts = setup.parts.map((p, i) => {
    const name = p.name.trim() || undefined;
    return { ...(i === active ? result.part : corePartOf(p)), name };
  });
  return { parts, range: result.range, rateHz: result.rateHz, samplerKind: result.samplerKind };
}
