// The preview's pure helpers: the scene drawn for a set of props, the counter under it, and
// when a playback must not start by itself.
import { SEIZURE_RISK_HIGH_HZ, SEIZURE_RISK_LOW_HZ, type Part, type Sampler } from '../../../core';
import type { PreviewScene } from '../../../render/scene';
import { formatNumber } from '../../../words/format';

/**
 * How long a flash's image lingers on the eye, as a time constant in the part's clock:
 * docs/physics.md §1 puts fusion of successive flashes at about 16 a second, so an image fades
 * over about 1/16 s. A judgement of ours; it is what makes multi-image locks superimpose.
 */
const EYE_FADE_S = 1 / 16;

/** A scene to start from, before the props fill it in. */
export const emptyScene: PreviewScene = {
  features: 1,
  speedHz: 0,
  sampler: 'true',
  rateHz: 1,
  exposureS: 0,
  readoutS: 0,
  timeS: 0,
  fadeS: EYE_FADE_S,
};

export function sceneFromProps(
  part: Part,
  sampler: Sampler,
  rateHz: number,
  exposureS: number,
  readoutS: number,
): PreviewScene {
  return {
    features: part.symmetry,
    speedHz: part.speedHz,
    sampler: sampler === 'flash' ? 'flash' : 'frames',
    rateHz,
    exposureS,
    readoutS: sampler === 'frames' ? readoutS : 0,
    timeS: 0,
    fadeS: EYE_FADE_S,
  };
}

/** "Flash 1,234 · 20.567 s · 10× slower": the sample count and the part's clock. */
export function counterText(sampler: Sampler, index: number, timeS: number, slow: number): string {
  const word = sampler === 'flash' ? 'Flash' : 'Frame';
  const pace = slow === 1 ? 'real time' : `${slow}× slower`;
  return `${word} ${formatNumber(index, 0)} · ${formatNumber(timeS, 3)} s · ${pace}`;
}

/** A strobe played back at a rate people should not watch flashing (docs/physics.md §10). */
export function flashesInRiskRange(sampler: Sampler, rateHz: number, slow: number): boolean {
  const shown = rateHz / slow;
  return sampler === 'flash' && shown >= SEIZURE_RISK_LOW_HZ && shown <= SEIZURE_RISK_HIGH_HZ;
}

export function prefersReducedMotion(): boolean {
  return typeof matchMedia === 'function' && matchMedia('(prefers-reduced-motion: reduce)').matches;
}
