import { describe, expect, test } from 'vitest';
import { computeCheck } from '../../../src/state/check/lists';
import { defaultSetup, type Setup } from '../../../src/state/model';
import { previewInputOf, rateMapInputOf } from '../../../src/screens/check/widget-inputs';

function setupWith(change: Partial<Setup>): Setup {
  return structuredClone({ ...defaultSetup, ...change });
}

// A fictional packing line: a 6-blade cooling fan and a 4-spoke drive pulley.
const line = setupWith({
  parts: [
    { name: 'Cooling fan', speedRpm: 1770, features: 6, tolerancePercent: 1 },
    { name: '  ', speedRpm: -960, features: 4, tolerancePercent: 2 },
  ],
  activePart: 0,
});

describe('the preview of the check screen', () => {
  test('shows the part being checked under the strobe, each flash an instant', () => {
    const input = previewInputOf(computeCheck(defaultSetup), defaultSetup);
    // 1770 rpm = 29.5 rev/s; 1770 flashes a minute = 29.5 a second.
    expect(input).toEqual({
      part: { speedHz: 29.5, symmetry: 6 },
      sampler: 'flash',
      rateHz: 29.5,
      exposureS: 0,
      readoutS: 0,
    });
  });

  test('gives a camera its frames, exposure and rolling readout', () => {
    const s = setupWith({
      samplerKind: 'camera',
      camera: { frameRate: 24, exposure: { mode: 'angle', angleDeg: 180 }, readoutMs: 30 },
    });
    const input = previewInputOf(computeCheck(s), s)!;
    expect(input.sampler).toBe('frames');
    expect(input.rateHz).toBe(24);
    // A 180° shutter at 24 frames/s exposes 1/48 s (docs/physics.md, check sources).
    expect(input.exposureS).toBeCloseTo(1 / 48, 15);
    expect(input.readoutS).toBeCloseTo(0.03, 15);
  });

  test('shows flickering lighting as flashes at the flicker rate, and nothing to play for a steady light', () => {
    const flickering = setupWith({
      samplerKind: 'lighting',
      lighting: { mainsHz: 50, flicker: 'double', customHz: 300, modulationPercent: 30 },
    });
    const input = previewInputOf(computeCheck(flickering), flickering)!;
    // Mains at 50 Hz flickers at 100 Hz (docs/physics.md §6).
    expect(input.sampler).toBe('flash');
    expect(input.rateHz).toBe(100);
    expect(input.exposureS).toBe(0);
    const steady = setupWith({
      samplerKind: 'lighting',
      lighting: { ...flickering.lighting, modulationPercent: 0 },
    });
    expect(previewInputOf(computeCheck(steady), steady)).toBeNull();
  });
});

describe('the rate map of the check screen', () => {
  test('carries every part in the core’s units with its name, over the strobe’s own range', () => {
    const input = rateMapInputOf(computeCheck(line), line);
    expect(input.parts).toEqual([
      { speedHz: 29.5, symmetry: 6, tolerance: 0.01, name: 'Cooling fan' },
      // A blank name is left out, so the map calls it by its place.
      { speedHz: -16, symmetry: 4, tolerance: 0.02, name: undefined },
    ]);
    // 30 – 12,000 flashes a minute.
    expect(input.range).toEqual({ minHz: 0.5, maxHz: 200 });
    expect(input.rateHz).toBe(29.5);
    expect(input.samplerKind).toBe('strobe');
  });

  test('uses the camera span the check uses, stretched to hold the frame rate', () => {
    const s = setupWith({
      samplerKind: 'camera',
      camera: { frameRate: 2000, exposure: { mode: 'angle', angleDeg: 180 }, readoutMs: 0 },
    });
    expect(rateMapInputOf(computeCheck(s), s).range).toEqual({ minHz: 1, maxHz: 2000 });
  });

  test('keeps the last result the core accepted for the part being checked, so the map agrees with the verdict', () => {
    const accepted = computeCheck(line);
    const typedSince = structuredClone(line);
    typedSince.parts[0].speedRpm = 1200;
    typedSince.parts[1].speedRpm = 480;
    const input = rateMapInputOf(accepted, typedSince);
    expect(input.parts[0].speedHz).toBe(29.5);
    // The other parts are drawn as they are now.
    expect(input.parts[1].speedHz).toBe(8);
  });
});
