// Reading measurements back out of rendered frames. The probe look paints the background
// black, blades white, the marked blade red and the hub blue, so for any pixel outside the hub
//   red channel / 255            = blade coverage,
//   (red − green) / 255          = marked-blade coverage.
import { PreviewRenderer, type PixelBuffer } from '../../src/render/preview';
import { defaultPreviewLook, type PreviewLook } from '../../src/render/look';
import type { PreviewScene } from '../../src/render/scene';

export const SIZE = 360;
export const HALF = SIZE / 2;
/** Radii in pixels, from the probe look's proportions (same as the default look's). */
export const HUB_PX = defaultPreviewLook.hubRadius * HALF;
export const TIP_PX = defaultPreviewLook.tipRadius * HALF;

export const probeLook: PreviewLook = {
  ...defaultPreviewLook,
  background: [0, 0, 0],
  blade: [255, 255, 255],
  mark: [255, 0, 0],
  hub: [0, 0, 255],
};

export const baseScene: PreviewScene = {
  features: 5,
  speedHz: 10,
  sampler: 'frames',
  rateHz: 30,
  exposureS: 0,
  readoutS: 0,
  timeS: 0,
  fadeS: 0,
};

export function newBuffer(size = SIZE): PixelBuffer {
  return { data: new Uint8ClampedArray(size * size * 4), width: size, height: size };
}

/** Renders `scene` (over the base scene) with the probe look and returns a copy of the bytes. */
export function renderFrame(
  scene: Partial<PreviewScene>,
  renderer = new PreviewRenderer(probeLook),
  buffer = newBuffer(),
): Uint8ClampedArray {
  renderer.render({ ...baseScene, ...scene }, buffer);
  return buffer.data.slice();
}

export interface RingPixel {
  /** Angle of the pixel centre, turns, clockwise on screen from +x. */
  turns: number;
  blade: number;
  mark: number;
}

/** Every pixel whose centre lies within half a pixel of `radius` from the canvas centre. */
export function ringPixels(data: Uint8ClampedArray, radius: number, size = SIZE): RingPixel[] {
  const out: RingPixel[] = [];
  for (let y = 0; y < size; y++) {
    for (let x = 0; x < size; x++) {
      const dx = x + 0.5 - size / 2;
      const dy = y + 0.5 - size / 2;
      if (Math.abs(Math.hypot(dx, dy) - radius) > 0.5) continue;
      const o = (y * size + x) * 4;
      let turns = Math.atan2(dy, dx) / (2 * Math.PI);
      if (turns < 0) turns += 1;
      out.push({ turns, blade: data[o] / 255, mark: (data[o] - data[o + 1]) / 255 });
    }
  }
  return out;
}

/**
 * Phase of the m-th angular harmonic of a channel over a ring, in units of 1/m turn (pitches
 * when m is the feature count), in [−0.5, 0.5]: where a pattern repeating m times a turn sits. Weighted circular mean (Fisher, "Statistical Analysis of
 * Circular Data", 1993, §2.2: mean direction of the m-fold trigonometric moment).
 */
export function harmonicPhase(ring: RingPixel[], m: number, channel: 'blade' | 'mark'): number {
  let c = 0;
  let s = 0;
  for (const p of ring) {
    c += p[channel] * Math.cos(2 * Math.PI * m * p.turns);
    s += p[channel] * Math.sin(2 * Math.PI * m * p.turns);
  }
  return Math.atan2(s, c) / (2 * Math.PI);
}

/** x − round(x): a difference of phases wrapped into [−0.5, 0.5]. */
export function wrapHalf(x: number): number {
  return x - Math.round(x);
}
