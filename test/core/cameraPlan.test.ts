import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { cameraPlan, standardFrameRates, type CameraAbilities } from '../../src/core/cameraPlan';
import { anyFinite, bad, expectInputError, finiteOrInputError } from './expectInputError';

const wheel = { speedHz: 2, symmetry: 12 }; // Wikipedia, "Stroboscopic effect": 12 spokes at 2 rev/s
const fan = { speedHz: 1770 / 60, symmetry: 6 }; // Engineering ToolBox typical 4-pole 60 Hz full-load speed, 6 blades

describe('standardFrameRates', () => {
  it('lists the ITU-R BT.709 picture rates with the /1.001 family as exact fractions (SMPTE ST 12-1)', () => {
    expect(standardFrameRates.map((r) => r.label)).toEqual([
      '23.976',
      '24',
      '25',
      '29.97',
      '30',
      '50',
      '59.94',
      '60',
      '120',
      '240',
    ]);
    const hz = Object.fromEntries(standardFrameRates.map((r) => [r.label, r.hz]));
    expect(hz['23.976']).toBe(24000 / 1001);
    expect(hz['29.97']).toBe(30000 / 1001);
    expect(hz['59.94']).toBe(60000 / 1001);
    expect(hz['29.97']).toBeCloseTo(29.97002997, 8);
    expect([hz['24'], hz['25'], hz['30'], hz['50'], hz['60'], hz['120'], hz['240']]).toEqual([
      24, 25, 30, 50, 60, 120, 240,
    ]);
    for (const r of standardFrameRates) expect(r.source.length).toBeGreaterThan(0);
  });
});

describe('cameraPlan: settings ranked for a goal', () => {
  it('freezes the 12-spoke wheel at 24 frames/s and at no other rate offered (doc example)', () => {
    // Wikipedia, "Stroboscopic effect". At 45° and 24 frames/s the exposure is 1/192 s: blur 3.75°, 1/8 pitch.
    const plan = cameraPlan(
      { frameRatesHz: [24, 25, 30], shutterAnglesDeg: [45], readoutS: 0 },
      wheel,
      { kind: 'freeze' },
    );
    expect(plan.settings.map((s) => s.frameRate)).toEqual([24]);
    const [best] = plan.settings;
    expect(best).toMatchObject({ look: 'still', apparentRpm: 0, reaches: true, shutterAngle: 45 });
    expect(best.exposureS).toBeCloseTo(1 / 192, 15);
    expect(best.blurDegrees).toBeCloseTo(3.75, 12);
    expect(best.blurPitches).toBeCloseTo(0.125, 12);
    expect(plan.nearMisses.map((s) => s.frameRate).sort()).toEqual([25, 30]);
    expect(plan.cautions.join(' ')).toMatch(/lock out/);
  });

  it('converts exposures and shutter angles as in the cinema table: 180° = 1/48 s, 172.8° = 1/50 s, 144° = 1/60 s at 24 frames/s', () => {
    // A slow part (6 rpm, one mark) shows its true speed at 24 frames/s, so every setting is honest.
    const camera: CameraAbilities = {
      frameRatesHz: [24],
      shutterAnglesDeg: [180],
      exposuresS: [1 / 48, 1 / 50, 1 / 60],
      readoutS: 0,
    };
    const plan = cameraPlan(camera, { speedHz: 0.1, symmetry: 1 }, { kind: 'honest' });
    const byExposure = plan.settings
      .map((s) => [s.exposureS, s.shutterAngle])
      .sort((a, b) => b[0] - a[0]);
    expect(byExposure).toHaveLength(3); // 180° and 1/48 s are the same setting, listed once
    expect(byExposure[0][0]).toBeCloseTo(1 / 48, 15);
    expect(byExposure[0][1]).toBeCloseTo(180, 9);
    expect(byExposure[1][1]).toBeCloseTo(172.8, 9);
    expect(byExposure[2][1]).toBeCloseTo(144, 9);
  });

  it('creeps one mark at 1800 rpm forward at 1.8 rpm at 29.97 frames/s', () => {
    // SMPTE 30000/1001: apparent 30 − 30000/1001 rev/s = 30/1001 rev/s = 1800/1001 rpm (physics.md §2).
    const plan = cameraPlan(
      { frameRatesHz: standardFrameRates.map((r) => r.hz), shutterAnglesDeg: [90], readoutS: 0 },
      { speedHz: 30, symmetry: 1 },
      { kind: 'creep', creepHz: 1.8 / 60 },
    );
    expect(plan.settings.map((s) => s.frameRate)).toEqual([30000 / 1001]);
    expect(plan.settings[0].look).toBe('forward');
    expect(plan.settings[0].apparentRpm).toBeCloseTo(1800 / 1001, 9);
    expect(plan.settings[0].why).toMatch(/Seems to turn forward at 1.8 rpm/);
  });

  it('smears a 6-blade fan at 1770 rpm into an even disc at 30 frames/s and 180°, not at 45°', () => {
    // 180° at 30 frames/s: t = 1/60 s, b = 6·29.5/60 = 2.95 pitches, |sin(2.95π)/(2.95π)| = 0.0169.
    // 45°: b = 0.7375, the blades still show.
    const plan = cameraPlan({ frameRatesHz: [30], shutterAnglesDeg: [45, 180], readoutS: 0 }, fan, {
      kind: 'natural',
    });
    expect(plan.settings).toHaveLength(1);
    const [disc] = plan.settings;
    expect(disc.shutterAngle).toBe(180);
    expect(disc.blurPitches).toBeCloseTo(2.95, 12);
    expect(disc.residualContrast).toBeCloseTo(Math.sin(0.05 * Math.PI) / (2.95 * Math.PI), 12);
    expect(disc.why).toMatch(/even disc/);
    expect(plan.nearMisses[0].shutterAngle).toBe(45);
  });

  it('shows only rates above twice the pattern rate as honest for a sharp image of one mark at 10 rev/s', () => {
    // Nyquist–Shannon (Shannon 1949): s > 2·n·f = 20 frames/s shows the true speed; 12 and 15 show it backward.
    const plan = cameraPlan(
      { frameRatesHz: [12, 15, 24, 30], exposuresS: [1 / 1000], readoutS: 0 },
      { speedHz: 10, symmetry: 1 },
      { kind: 'honest' },
    );
    expect(plan.settings.map((s) => s.frameRate).sort()).toEqual([24, 30]);
    for (const s of plan.settings) expect(s.look).toBe('true');
    expect(plan.nearMisses.map((s) => [s.frameRate, s.look, s.misleading])).toEqual(
      expect.arrayContaining([
        [12, 'backward', true],
        [15, 'backward', true],
      ]),
    );
  });

  it('reports rolling-shutter skew and says when the blades break up', () => {
    // 10 rev/s for a 25 ms readout (a typical phone, Ringaby & Forssén, IJCV 2011): 360·10·0.025 = 90°, past a 60° pitch.
    const plan = cameraPlan(
      { frameRatesHz: [120], exposuresS: [1 / 2000], readoutS: 0.025 },
      { speedHz: 10, symmetry: 6 },
      { kind: 'honest' },
    );
    const [s] = [...plan.settings, ...plan.nearMisses];
    expect(s.skewDegrees).toBeCloseTo(90, 12);
    expect(s.why).toMatch(/break up/);
  });

  it('gives the apparent speeds at both ends of the tolerance', () => {
    // One mark at 30 rev/s ± 1 % at 30 frames/s: 29.7 and 30.3 rev/s appear at ∓0.3 rev/s = ∓18 rpm.
    const plan = cameraPlan(
      { frameRatesHz: [30], exposuresS: [1 / 1000], readoutS: 0 },
      { speedHz: 30, symmetry: 1, tolerance: 0.01 },
      { kind: 'freeze' },
    );
    const [s] = plan.settings;
    expect(s.apparentRpmRange[0]).toBeCloseTo(-18, 9);
    expect(s.apparentRpmRange[1]).toBeCloseTo(18, 9);
    expect(s.why).toMatch(/Freezes only at the nominal speed/);
  });

  it('ranks settings by score and keeps it between 0 and 100', () => {
    const plan = cameraPlan(
      {
        frameRatesHz: standardFrameRates.map((r) => r.hz),
        shutterAnglesDeg: [45, 90, 180, 360],
        exposuresS: [1 / 1000],
        readoutS: 0.025,
      },
      { ...fan, tolerance: 0.01 },
      { kind: 'natural' },
    );
    expect(plan.settings.length).toBeGreaterThan(0);
    for (let i = 1; i < plan.settings.length; i++)
      expect(plan.settings[i].score).toBeLessThanOrEqual(plan.settings[i - 1].score);
    for (const s of [...plan.settings, ...plan.nearMisses]) {
      expect(s.score).toBeGreaterThanOrEqual(0);
      expect(s.score).toBeLessThanOrEqual(100);
    }
    expect(plan.nearMisses.length).toBeLessThanOrEqual(5);
  });

  it('skips an exposure longer than a frame at that rate but uses it at slower rates', () => {
    const plan = cameraPlan(
      { frameRatesHz: [24, 60], exposuresS: [1 / 30], readoutS: 0 },
      { speedHz: 0.1, symmetry: 1 },
      { kind: 'honest' },
    );
    expect(plan.settings.map((s) => s.frameRate)).toEqual([24]);
  });
});

describe('cameraPlan: bad input', () => {
  const camera: CameraAbilities = { frameRatesHz: [24], shutterAnglesDeg: [180], readoutS: 0 };
  const goal = { kind: 'honest' as const };

  it('rejects a missing camera, no frame rates and a rate at or below zero', () => {
    expectInputError(() => cameraPlan(bad(null), wheel, goal), 'camera', 'frame rates');
    expectInputError(
      () => cameraPlan({ ...camera, frameRatesHz: [] }, wheel, goal),
      'frame rates',
      'frame rate',
    );
    expectInputError(
      () => cameraPlan({ ...camera, frameRatesHz: [0] }, wheel, goal),
      'frame rate 1',
    );
  });

  it('rejects no shutter setting, an angle outside (0, 360], an exposure at or below zero, and none that fits', () => {
    expectInputError(
      () => cameraPlan({ ...camera, shutterAnglesDeg: [] }, wheel, goal),
      'shutter',
      'shutter angle',
    );
    expectInputError(
      () => cameraPlan({ ...camera, shutterAnglesDeg: [400] }, wheel, goal),
      'shutter angle',
    );
    expectInputError(
      () => cameraPlan({ ...camera, shutterAnglesDeg: bad('180') }, wheel, goal),
      'shutter angles',
      'list',
    );
    expectInputError(
      () => cameraPlan({ ...camera, shutterAnglesDeg: undefined, exposuresS: [0] }, wheel, goal),
      'exposure 1',
    );
    expectInputError(
      () => cameraPlan({ ...camera, shutterAnglesDeg: undefined, exposuresS: [1] }, wheel, goal),
      'exposures',
      'within one frame',
    );
  });

  it('rejects a negative readout, an unknown goal, a creep at or below zero and a bad part', () => {
    expectInputError(() => cameraPlan({ ...camera, readoutS: -0.01 }, wheel, goal), 'readout time');
    expectInputError(() => cameraPlan(camera, wheel, bad({ kind: 'timelapse' })), 'goal', 'freeze');
    expectInputError(
      () => cameraPlan(camera, wheel, { kind: 'creep', creepHz: 0 }),
      'wanted creep speed',
    );
    expectInputError(() => cameraPlan(camera, { speedHz: Infinity, symmetry: 1 }, goal), 'speed');
  });

  it('refuses a frame rate at which over a million features pass per frame', () => {
    // 100 teeth at 1000 rev/s filmed at 0.01 frames/s: 10⁷ teeth per frame.
    expectInputError(
      () => cameraPlan({ ...camera, frameRatesHz: [0.01] }, { speedHz: 1000, symmetry: 100 }, goal),
      'frame rate',
      'million features',
    );
  });

  it('rejects bad options', () => {
    expectInputError(
      () => cameraPlan(camera, wheel, goal, { sharpBlurDeg: 0 }),
      'sharp blur limit',
    );
    expectInputError(
      () => cameraPlan(camera, wheel, goal, { maxResidualContrast: NaN }),
      'smooth disc contrast',
    );
    expectInputError(() => cameraPlan(camera, wheel, goal, { unclearStep: 2 }), 'unclear step');
  });
});

describe('cameraPlan: never NaN or Infinity', () => {
  it('returns finite numbers or throws InputError for any camera, part and goal', () => {
    fc.assert(
      fc.property(
        anyFinite(),
        fc.integer({ min: 1, max: 1000 }),
        fc.array(anyFinite(), { minLength: 1, maxLength: 3 }),
        fc.array(anyFinite(), { maxLength: 2 }),
        fc.array(anyFinite(), { maxLength: 2 }),
        anyFinite(),
        fc.oneof(
          fc.constant({ kind: 'freeze' as const }),
          fc.constant({ kind: 'natural' as const }),
          fc.constant({ kind: 'honest' as const }),
          anyFinite().map((creepHz) => ({ kind: 'creep' as const, creepHz })),
        ),
        (speedHz, symmetry, frameRatesHz, shutterAnglesDeg, exposuresS, readoutS, goal) =>
          finiteOrInputError(() =>
            cameraPlan(
              { frameRatesHz, shutterAnglesDeg, exposuresS, readoutS },
              { speedHz, symmetry },
              goal,
            ),
          ),
      ),
      { seed: 1949, numRuns: 500 },
    );
  });
});
