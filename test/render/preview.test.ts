// Pixel checks on rendered frames: locks, blur, rolling readout, direction, fading.
import { describe, expect, it } from 'vitest';
import { apparentMotion, blurPitches, InputError, rollingSkewDegrees } from '../../src/core';
import { PreviewRenderer } from '../../src/render/preview';
import { bladeDutyFor } from '../../src/render/look';
import {
  HALF,
  SIZE,
  TIP_PX,
  harmonicPhase,
  newBuffer,
  probeLook,
  renderFrame,
  ringPixels,
  wrapHalf,
  type RingPixel,
} from './pixelProbe';

/** A ring well inside the blades: between the hub (29 px) and the tips (169 px). */
const RING_PX = 100;

function bytesDiffering(a: Uint8ClampedArray, b: Uint8ClampedArray): number {
  let count = Math.abs(a.length - b.length);
  for (let i = 0; i < Math.min(a.length, b.length); i++) if (a[i] !== b[i]) count++;
  return count;
}

function spread(values: number[]): { min: number; max: number } {
  return { min: Math.min(...values), max: Math.max(...values) };
}

describe('a locked rate gives identical frames', () => {
  it('a camera at one or two whole turns per frame repeats every frame byte for byte, blur and readout included', () => {
    for (const rateHz of [30, 15]) {
      const scene = { features: 3, speedHz: 30, rateHz, exposureS: 1 / 500, readoutS: 1 / 60 };
      const a = renderFrame({ ...scene, timeS: 3 / rateHz });
      const b = renderFrame({ ...scene, timeS: 4 / rateHz });
      expect(bytesDiffering(a, b)).toBe(0);
    }
  });

  it('a flash at one turn per flash shows the same fading image at the same point of every flash cycle', () => {
    const scene = { sampler: 'flash' as const, features: 3, speedHz: 30, rateHz: 30, fadeS: 0.06 };
    expect(
      bytesDiffering(
        renderFrame({ ...scene, timeS: 4.5 / 30 }),
        renderFrame({ ...scene, timeS: 3.5 / 30 }),
      ),
    ).toBe(0);
    expect(
      bytesDiffering(
        renderFrame({ ...scene, timeS: 4 / 30 }),
        renderFrame({ ...scene, timeS: 3 / 30 }),
      ),
    ).toBe(0);
    // …and the frames are not all the same picture: mid-cycle the image has faded.
    expect(
      bytesDiffering(
        renderFrame({ ...scene, timeS: 4.5 / 30 }),
        renderFrame({ ...scene, timeS: 4 / 30 }),
      ),
    ).toBeGreaterThan(1000);
  });

  it('at one pitch per frame the blades repeat but the marked blade moves on one pitch, so whole turns show', () => {
    // n·f/s = 3·30/90 = 1: the pattern locks (apparentMotion reads still), the part turns 1/3 turn a frame.
    expect(apparentMotion({ speedHz: 30, symmetry: 3 }, 90, { sampler: 'frames' }).look).toBe(
      'still',
    );
    const scene = { features: 3, speedHz: 30, rateHz: 90 };
    const a = ringPixels(renderFrame({ ...scene, timeS: 3 / 90 }), RING_PX);
    const b = ringPixels(renderFrame({ ...scene, timeS: 4 / 90 }), RING_PX);
    const bladeChange = Math.max(...a.map((p, i) => Math.abs(p.blade - b[i].blade)));
    expect(bladeChange).toBeLessThanOrEqual(1 / 255);
    const markStepTurns = wrapHalf(harmonicPhase(b, 1, 'mark') - harmonicPhase(a, 1, 'mark'));
    expect(markStepTurns).toBeCloseTo(1 / 3, 2);
  });
});

describe('blur of a pitch or more gives an even ring', () => {
  const features = 6;
  const speedHz = 30;
  const duty = bladeDutyFor(features, probeLook);
  /** Exposure that sweeps `pitches` pitches: blurPitches is n·|f|·t (docs/physics.md §5). */
  const exposureFor = (pitches: number) => pitches / (features * speedHz);

  it('sweeps the pitches asked for (the core agrees: 6 blades at 30 rev/s for 1/180 s is one pitch)', () => {
    expect(blurPitches(speedHz, features, exposureFor(1))).toBeCloseTo(1, 12);
  });

  it('is one even grey, the blades’ share of the pitch, for a sweep of one, two or three whole pitches', () => {
    for (const pitches of [1, 2, 3]) {
      for (const readoutS of [0, 1 / 60]) {
        const ring = ringPixels(
          renderFrame({ features, speedHz, exposureS: exposureFor(pitches), readoutS }),
          RING_PX,
        );
        const { min, max } = spread(ring.map((p) => p.blade * 255));
        expect(min).toBeGreaterThanOrEqual(255 * duty - 1);
        expect(max).toBeLessThanOrEqual(255 * duty + 1);
      }
    }
  });

  it('shows the true view of a fast part as the same even ring when the eye’s window spans a whole pitch', () => {
    const ring = ringPixels(
      renderFrame({ sampler: 'true', features, speedHz, exposureS: exposureFor(1), timeS: 0.123 }),
      RING_PX,
    );
    const { min, max } = spread(ring.map((p) => p.blade * 255));
    expect(max - min).toBeLessThanOrEqual(2);
  });

  it('keeps a ripple of at most duty/pitches between whole pitches, against full contrast when sharp', () => {
    const sharp = spread(
      ringPixels(renderFrame({ features, speedHz }), RING_PX).map((p) => p.blade),
    );
    expect(sharp.max - sharp.min).toBe(1);
    for (const pitches of [1.5, 2.5]) {
      const ring = ringPixels(
        renderFrame({ features, speedHz, exposureS: exposureFor(pitches) }),
        RING_PX,
      );
      const { min, max } = spread(ring.map((p) => p.blade));
      expect(max - min).toBeLessThanOrEqual(duty / pitches + 2 / 255);
      expect(max - min).toBeGreaterThan(0.5 * (duty / pitches));
    }
  });
});

/**
 * The bend of a single blade read out by a rolling shutter, in degrees over the whole frame
 * height: the blade's centre angle (midway between its two edges, found at half coverage with
 * sub-pixel interpolation) on each row below the hub, fitted by least squares against the row.
 */
function measuredSkewDegrees(data: Uint8ClampedArray): number {
  const rows: number[] = [];
  const angles: number[] = [];
  for (let dyPx = 40; dyPx <= 130; dyPx++) {
    const y = HALF + dyPx;
    const dy = y + 0.5 - HALF;
    const edges: number[] = [];
    for (let x = 0; x + 1 < SIZE; x++) {
      const v0 = data[(y * SIZE + x) * 4] - 127.5;
      const v1 = data[(y * SIZE + x + 1) * 4] - 127.5;
      if (v0 === 0 || Math.sign(v0) !== Math.sign(v1)) {
        const xEdge = x + v0 / (v0 - v1) + 0.5 - HALF;
        edges.push((Math.atan2(dy, xEdge) * 180) / Math.PI);
      }
    }
    expect(edges).toHaveLength(2);
    rows.push(y);
    angles.push((edges[0] + edges[1]) / 2);
  }
  const n = rows.length;
  const mx = rows.reduce((s, v) => s + v, 0) / n;
  const my = angles.reduce((s, v) => s + v, 0) / n;
  let sxy = 0;
  let sxx = 0;
  for (let i = 0; i < n; i++) {
    sxy += (rows[i] - mx) * (angles[i] - my);
    sxx += (rows[i] - mx) ** 2;
  }
  return (sxy / sxx) * SIZE;
}

describe('each frame integrates its own exposure', () => {
  it('centres a frame’s blur on the middle of its exposure, which starts at the frame time', () => {
    const scene = { features: 5, speedHz: 10, rateHz: 24, exposureS: 1 / 150 }; // 0.33 pitch of blur
    const frame = ringPixels(renderFrame({ ...scene, timeS: 7 / 24 }), RING_PX);
    const sharpAtMiddle = ringPixels(
      renderFrame({ sampler: 'true', ...scene, exposureS: 0, timeS: 7 / 24 + 1 / 300 }),
      RING_PX,
    );
    const sharpAtStart = ringPixels(
      renderFrame({ sampler: 'true', ...scene, exposureS: 0, timeS: 7 / 24 }),
      RING_PX,
    );
    const offset = (ring: RingPixel[]) =>
      wrapHalf(harmonicPhase(ring, 5, 'blade') - harmonicPhase(sharpAtMiddle, 5, 'blade'));
    expect(offset(frame)).toBeCloseTo(0, 2);
    expect(Math.abs(offset(sharpAtStart))).toBeGreaterThan(0.1);
  });
});

describe('a rolling readout bends the blades', () => {
  it.each([
    { speedHz: 10, readoutS: 1 / 60 },
    { speedHz: -10, readoutS: 1 / 60 },
    { speedHz: 4, readoutS: 0.03 },
    { speedHz: 12, readoutS: 0.022 },
  ])(
    'by rollingSkewDegrees over the frame height, within 3°, at $speedHz rev/s read out in $readoutS s',
    ({ speedHz, readoutS }) => {
      const features = 1;
      const bladeTurns = bladeDutyFor(features, probeLook);
      // Choose the frame-1 start angle so the blade points straight down at the middle measured row.
      const midRow = HALF + 85 + 0.5;
      const start = 0.25 - bladeTurns / 2 - (speedHz * readoutS * midRow) / SIZE;
      const startTurns = start - Math.floor(start);
      const rateHz = speedHz / (speedHz > 0 ? startTurns : startTurns - 1);
      const data = renderFrame({ features, speedHz, rateHz, readoutS, timeS: 1 / rateHz });
      const expected = Math.sign(speedHz) * rollingSkewDegrees(speedHz, readoutS);
      expect(Math.abs(measuredSkewDegrees(data) - expected)).toBeLessThan(3);
    },
  );

  it('leaves the blades straight with a global shutter', () => {
    const data = renderFrame({ features: 1, speedHz: 10, rateHz: 10 / 0.2, timeS: 1 / 50 });
    expect(Math.abs(measuredSkewDegrees(data))).toBeLessThan(0.5);
  });
});

describe('the motion between samples matches apparentMotion', () => {
  /** Step of the pattern between samples k and k+1, in pitches, read from the n-th harmonic. */
  function patternStep(
    scene: Parameters<typeof renderFrame>[0],
    features: number,
    channel: 'blade' | 'mark' = 'blade',
  ): number {
    const rateHz = scene.rateHz!;
    const a = ringPixels(renderFrame({ ...scene, features, timeS: 5 / rateHz }), RING_PX);
    const b = ringPixels(renderFrame({ ...scene, features, timeS: 6 / rateHz }), RING_PX);
    return wrapHalf(harmonicPhase(b, features, channel) - harmonicPhase(a, features, channel));
  }

  const cases = [
    { speedHz: 10, rateHz: 30 }, // n f/s = 1.67: step −0.33, backward
    { speedHz: 10, rateHz: 45 }, // 1.11: +0.11, forward
    { speedHz: 10, rateHz: 52 }, // 0.96: −0.04, backward
    { speedHz: 10, rateHz: 12 }, // 4.17: +0.17, forward
    { speedHz: 10, rateHz: 240 }, // 0.21: faithful, true
    { speedHz: -10, rateHz: 45 }, // reversed part: forward means anticlockwise
    { speedHz: -10, rateHz: 52 },
  ];

  it.each(cases)(
    'the marked single feature moves as apparentMotion says at $speedHz rev/s, $rateHz frames/s',
    ({ speedHz, rateHz }) => {
      const expected = apparentMotion({ speedHz, symmetry: 1 }, rateHz, { sampler: 'frames' });
      for (const sampler of ['frames', 'flash'] as const) {
        const step = patternStep({ sampler, speedHz, rateHz, exposureS: 0, fadeS: 0 }, 1, 'mark');
        expect(step).toBeCloseTo(expected.step, 2);
        const seen = expected.faithful
          ? 'true'
          : Math.sign(step) === Math.sign(speedHz)
            ? 'forward'
            : 'backward';
        expect(seen).toBe(expected.look);
      }
    },
  );

  it.each(cases)(
    'five blades step by apparentMotion’s step in pitches at $speedHz rev/s, $rateHz frames/s',
    ({ speedHz, rateHz }) => {
      const expected = apparentMotion({ speedHz, symmetry: 5 }, rateHz, { sampler: 'frames' });
      const step = patternStep({ speedHz, rateHz, exposureS: 1 / 2000, readoutS: 0.01 }, 5);
      expect(step).toBeCloseTo(expected.step, 2);
    },
  );

  it('moves the marked blade of five by f/s turns a frame, even where the pattern seems to step by a fraction of a pitch', () => {
    // 10 rev/s at 45 frames/s: the pattern steps +0.11 pitch, the marked blade 0.222 turn.
    const scene = { speedHz: 10, rateHz: 45 };
    const a = ringPixels(renderFrame({ ...scene, timeS: 5 / 45 }), RING_PX);
    const b = ringPixels(renderFrame({ ...scene, timeS: 6 / 45 }), RING_PX);
    expect(wrapHalf(harmonicPhase(b, 1, 'mark') - harmonicPhase(a, 1, 'mark'))).toBeCloseTo(
      10 / 45,
      2,
    );
  });
});

/** Separate lit runs of the marked blade around the ring, and the strength of each. */
function markRuns(ring: RingPixel[], threshold: number): number[] {
  const sorted = [...ring].sort((p, q) => p.turns - q.turns);
  // Start the walk in a dark pixel so no run is split across the wrap.
  const dark = sorted.findIndex((p) => p.mark < threshold);
  const walk = [...sorted.slice(dark), ...sorted.slice(0, dark)];
  const peaks: number[] = [];
  let inRun = false;
  for (const p of walk) {
    if (p.mark >= threshold) {
      if (!inRun) peaks.push(0);
      peaks[peaks.length - 1] = Math.max(peaks[peaks.length - 1], p.mark);
      inRun = true;
    } else inRun = false;
  }
  return peaks;
}

describe('under a flash, images fade on the eye', () => {
  it.each([
    { speedHz: 50, rateHz: 100 }, // r = 1/2: two images
    { speedHz: 50, rateHz: 150 }, // r = 1/3: three images
    { speedHz: 50, rateHz: 200 / 3 }, // r = 3/4: four images
  ])(
    'a lock at $speedHz rev/s and $rateHz flashes/s shows as many superimposed images as apparentMotion counts',
    ({ speedHz, rateHz }) => {
      const expected = apparentMotion({ speedHz, symmetry: 1 }, rateHz, { sampler: 'flash' });
      expect(expected.look).toBe('still');
      const ring = ringPixels(
        renderFrame({
          sampler: 'flash',
          features: 1,
          speedHz,
          rateHz,
          fadeS: 0.1,
          timeS: 20.3 / rateHz,
        }),
        RING_PX,
      );
      const peaks = markRuns(ring, 0.05);
      expect(peaks).toHaveLength(expected.images);
      // Each image is lit once every q flashes and the eye favours the latest flash, so the
      // images differ a little in strength, but each is at least half as strong as the brightest.
      expect(Math.min(...peaks) / Math.max(...peaks)).toBeGreaterThan(0.5);
    },
  );

  it.each([
    { speedHz: 10, rateHz: 9.98, images: 1 },
    { speedHz: 50, rateHz: 99.9, images: 2 },
  ])(
    'a near-lock ($images image(s)) creeps at apparentMotion’s drift speed',
    ({ speedHz, rateHz, images }) => {
      const expected = apparentMotion({ speedHz, symmetry: 1 }, rateHz, { sampler: 'flash' });
      expect(expected.images).toBe(images);
      const t0 = 10 / rateHz;
      const t1 = 210 / rateHz;
      const scene = { sampler: 'flash' as const, features: 1, speedHz, rateHz, fadeS: 0.1 };
      const a = ringPixels(renderFrame({ ...scene, timeS: t0 }), RING_PX);
      const b = ringPixels(renderFrame({ ...scene, timeS: t1 }), RING_PX);
      // The group of q images repeats every 1/q turn: its q-th harmonic moves q times the drift.
      const moved =
        wrapHalf(harmonicPhase(b, images, 'mark') - harmonicPhase(a, images, 'mark')) / images;
      expect(moved).toBeCloseTo(expected.driftHz * (t1 - t0), 2);
      expect(Math.abs(moved)).toBeGreaterThan(0.05);
    },
  );

  it('fades the blades between slow flashes but never changes the background or the hub', () => {
    const scene = { sampler: 'flash' as const, features: 4, speedHz: 7, rateHz: 5, fadeS: 0.05 };
    const justLit = renderFrame({ ...scene, timeS: 2 / 5 });
    const later = renderFrame({ ...scene, timeS: 2.9 / 5 });
    const corner = 0;
    const hub = (HALF * SIZE + HALF) * 4;
    for (const o of [corner, hub])
      expect([...later.subarray(o, o + 4)]).toEqual([...justLit.subarray(o, o + 4)]);
    const litRing = ringPixels(justLit, RING_PX);
    const fadedRing = ringPixels(later, RING_PX);
    expect(Math.max(...fadedRing.map((p) => p.blade))).toBeLessThan(
      0.5 * Math.max(...litRing.map((p) => p.blade)),
    );
  });
});

describe('the renderer', () => {
  it('refuses a scene it cannot draw with an InputError naming the field', () => {
    const renderer = new PreviewRenderer(probeLook);
    expect(() => renderer.render({ ...baseSceneFor(), features: 0 }, newBuffer())).toThrow(
      InputError,
    );
    expect(() => renderer.render({ ...baseSceneFor(), speedHz: NaN }, newBuffer())).toThrow(
      /speed/,
    );
  });

  it('refuses a buffer smaller than the size it claims', () => {
    const renderer = new PreviewRenderer(probeLook);
    expect(() =>
      renderer.render(baseSceneFor(), { data: new Uint8ClampedArray(16), width: 360, height: 360 }),
    ).toThrow(RangeError);
  });

  it('draws any size, with the blade tips inside the shorter side', () => {
    const renderer = new PreviewRenderer(probeLook);
    const wide = { data: new Uint8ClampedArray(200 * 100 * 4), width: 200, height: 100 };
    renderer.render({ ...baseSceneFor(), features: 1, speedHz: 0 }, wide);
    // The single blade points along +x (0 turns) at time 0; its tip ends at 0.94 of 50 px.
    const at = (x: number) => wide.data[(50 * 200 + x) * 4];
    expect(at(100 + 40)).toBe(255);
    expect(at(100 + 49)).toBe(0);
    expect(TIP_PX).toBeCloseTo(169.2, 1);
  });
});

function baseSceneFor() {
  return {
    features: 5,
    speedHz: 10,
    sampler: 'frames' as const,
    rateHz: 30,
    exposureS: 0,
    readoutS: 0,
    timeS: 0,
    fadeS: 0,
  };
}
