import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { cameraPlan, type CameraAbilities } from '../../../src/core/plans/cameraPlan';
import { standardFrameRates } from '../../../src/core/plans/frameRates';
import { anyFinite, bad, expectInputError, finiteOrInputError } from '../expectInputError';
import { replay, sceneOf } from '../simulator';

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
    // Wikipedia, "Stroboscopic effect". At 1/1000 s the wheel turns 2·360/1000 = 0.72°: 0.024 of a 30° pitch (docs/physics.md §5).
    const plan = cameraPlan(
      { frameRatesHz: [24, 25, 30], exposuresS: [1 / 1000], readoutS: 0 },
      wheel,
      { kind: 'freeze' },
    );
    expect(plan.settings.map((s) => s.frameRate)).toEqual([24]);
    const [best] = plan.settings;
    expect(best).toMatchObject({ look: 'still', apparentRpm: 0, reaches: true, blocks: [] });
    expect(best.blurDegrees).toBeCloseTo(0.72, 12);
    expect(best.blurPitches).toBeCloseTo(0.024, 12);
    expect(plan.nearMisses.map((s) => s.frameRate).sort()).toEqual([25, 30]);
    for (const s of plan.nearMisses) expect(s.blocks).toEqual(['look']);
    expect(plan.cautions).toContain('stillness');
  });

  it('does not call a blurred still picture a freeze: at 45° and 24 frames/s the spokes smear 3.75°, over the 2° kept sharp', () => {
    // 45° at 24 frames/s is 1/192 s (cinema rule t = (θ/360)/s); blur 360·2/192 = 3.75° (docs/physics.md §5).
    const plan = cameraPlan({ frameRatesHz: [24], shutterAnglesDeg: [45], readoutS: 0 }, wheel, {
      kind: 'freeze',
    });
    expect(plan.settings).toEqual([]);
    const [miss] = plan.nearMisses;
    expect(miss.look).toBe('still');
    expect(miss.blurDegrees).toBeCloseTo(3.75, 12);
    expect(miss.blocks).toEqual(['sharpness']);
    // The longest exposure that keeps 2°: 2/(360·2) s = 1/360 s.
    expect(plan.needs.sharpExposureS).toBeCloseTo(1 / 360, 15);
    expect(plan.met).toEqual({ look: 1, sharpness: 0, bend: 1 });
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
    // SMPTE 30000/1001: apparent 30 − 30000/1001 rev/s = 30/1001 rev/s = 1800/1001 rpm (docs/physics.md §2).
    const plan = cameraPlan(
      { frameRatesHz: standardFrameRates.map((r) => r.hz), shutterAnglesDeg: [90], readoutS: 0 },
      { speedHz: 30, symmetry: 1 },
      { kind: 'creep', creepHz: 1.8 / 60 },
    );
    expect(plan.settings.map((s) => s.frameRate)).toEqual([30000 / 1001]);
    expect(plan.settings[0].look).toBe('forward');
    expect(plan.settings[0].apparentRpm).toBeCloseTo(1800 / 1001, 9);
    // 90° at 30000/1001 frames/s is 1001/120000 s: 30 · 1001/120000 = 0.25025 of a turn, under half a pitch.
    expect(plan.settings[0].blurPitches).toBeCloseTo(0.25025, 12);
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
    expect(disc.evenDisc).toBe(true);
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
    expect(s.skewPitches).toBeCloseTo(1.5, 12);
    // docs/physics.md §5: past a pitch the blades break into pieces, so nothing honest is shown.
    expect(s.blocks).toContain('bend');
    expect(s.reaches).toBe(false);
  });

  it('gives the apparent speeds at both ends of the tolerance', () => {
    // One mark at 30 rev/s ± 1 % at 30 frames/s: 29.7 and 30.3 rev/s appear at ∓0.3 rev/s = ∓18 rpm.
    const plan = cameraPlan(
      { frameRatesHz: [30], exposuresS: [1 / 1000], readoutS: 0 },
      { speedHz: 30, symmetry: 1, tolerance: 0.01 },
      { kind: 'freeze' },
    );
    const [s] = [...plan.settings, ...plan.nearMisses];
    expect(s.apparentRpmRange[0]).toBeCloseTo(-18, 9);
    expect(s.apparentRpmRange[1]).toBeCloseTo(18, 9);
    expect(s.driftsWithinTolerance).toBe(true);
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
    expectInputError(
      () => cameraPlan(camera, wheel, goal, { creepBlurPitches: -1 }),
      'creep blur limit',
    );
    expectInputError(() => cameraPlan(camera, wheel, goal, { maxBendPitches: 0 }), 'bend limit');
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

describe('cameraPlan: every condition of the goal, and what blocks it', () => {
  // A 2-blade propeller at 6000 rpm (100 rev/s): the pattern passes 200 times a second.
  const propeller = { speedHz: 100, symmetry: 2 };
  // A phone's video rates and its 180° rule; readout 25 ms (Ringaby & Forssén, IJCV 2011: 22–33 ms).
  const phone: CameraAbilities = {
    frameRatesHz: [24, 25, 30, 60, 120, 240],
    shutterAnglesDeg: [180],
    readoutS: 0.025,
  };

  it('lists every sub-multiple of the pattern frequency in the camera’s span, 200 down to 25 frames/s, and marks 25 as offered', () => {
    // docs/physics.md §3: one image stands still at s = n·|f|/k; k = 1…8 lie in 24–240 frames/s.
    const plan = cameraPlan(phone, propeller, { kind: 'freeze' });
    const expected = [1, 2, 3, 4, 5, 6, 7, 8].map((k) => 200 / k); // 200, 100, 66.7, 50, 40, 33.3, 28.6, 25
    expect(plan.needs.lookRates.map((r) => r.rateHz)).toEqual(expected);
    expect(plan.needs.lookRateCount).toBe(8);
    expect(plan.needs.lookRates.filter((r) => r.offered).map((r) => r.rateHz)).toEqual([25]);
    // Independent check: an exact replay of the frames shows each of them still (test/core/simulator).
    for (const hz of expected) expect(replay(sceneOf(100, 2, hz, 'frames')).look).toBe('still');
    expect(plan.span).toEqual({ minHz: 24, maxHz: 240 });
  });

  it('names the long exposure as what blocks the freeze at 25 frames/s and 180°, not the rate', () => {
    // 180° at 25 frames/s is 1/50 s (t = (θ/360)/s): the propeller turns 720°, 4 pitches (docs/physics.md §5).
    const plan = cameraPlan({ ...phone, readoutS: 0 }, propeller, { kind: 'freeze' });
    expect(plan.settings).toEqual([]);
    const at25 = plan.nearMisses.find((s) => s.frameRate === 25)!;
    expect(at25.look).toBe('still');
    expect(at25.blurDegrees).toBeCloseTo(720, 9);
    expect(at25.blocks).toEqual(['sharpness']);
    expect(plan.nearMisses[0]).toBe(at25); // fewest conditions failed first
    expect(plan.met).toEqual({ look: 1, sharpness: 0, bend: plan.weighed });
    // 2° of turn at 100 rev/s takes 2/36000 s = 1/18,000 s.
    expect(plan.needs.sharpExposureS).toBeCloseTo(1 / 18000, 15);
  });

  it('reaches no freeze with fast shutter speeds while the rolling readout breaks the blades, and says what readout would do', () => {
    // 25 ms at 100 rev/s turns the propeller 360·100·0.025 = 900°, 5 pitches (docs/physics.md §5).
    const plan = cameraPlan(
      { ...phone, exposuresS: [1 / 500, 1 / 1000, 1 / 2000, 1 / 4000] },
      propeller,
      { kind: 'freeze' },
    );
    expect(plan.settings).toEqual([]);
    for (const s of plan.nearMisses) {
      expect(s.skewDegrees).toBeCloseTo(900, 9);
      expect(s.skewPitches).toBeCloseTo(5, 12);
      expect(s.blocks).toContain('bend');
    }
    expect(plan.met.bend).toBe(0);
    // A pitch of bend (docs/physics.md §5) at 200 pitches a second: a readout of 1/200 s = 5 ms.
    expect(plan.needs.bendReadoutS).toBeCloseTo(0.005, 15);
  });

  it('freezes the propeller at 25 frames/s with a global shutter and 1/20,000 s', () => {
    // 360·100/20000 = 1.8° of blur, under the 2° kept sharp; no readout, no bend.
    const plan = cameraPlan({ ...phone, exposuresS: [1 / 20000], readoutS: 0 }, propeller, {
      kind: 'freeze',
    });
    expect(plan.settings.map((s) => [s.frameRate, s.exposureS])).toEqual([[25, 1 / 20000]]);
    expect(plan.settings[0].blurDegrees).toBeCloseTo(1.8, 12);
  });

  it('ranks nothing misleading first for the goal "nothing misleading": no backward or still row reaches it', () => {
    // The propeller with the phone: every rate offered lies below 2·200 = 400 frames/s, so each
    // can mislead within the tolerance or at the nominal speed (Shannon 1949; docs/physics.md §4).
    const plan = cameraPlan(
      { ...phone, exposuresS: [1 / 500, 1 / 1000, 1 / 2000, 1 / 4000], readoutS: 0 },
      { ...propeller, tolerance: 0.02 },
      { kind: 'honest' },
    );
    for (const s of plan.settings) {
      expect(s.misleading).toBe(false);
      expect(['true', 'forward']).toContain(s.look);
    }
    const reached = new Set(plan.settings);
    for (const s of plan.nearMisses) expect(reached.has(s)).toBe(false);
    expect(plan.settings.some((s) => s.look === 'backward' || s.look === 'still')).toBe(false);
  });

  it('flags every rate whose readout is longer than a frame', () => {
    // 25 ms against frames of 1/30 s = 33.3 ms (fits) and 1/60 s = 16.7 ms (does not).
    const plan = cameraPlan(
      { frameRatesHz: [30, 60, 240], exposuresS: [1 / 1000], readoutS: 0.025 },
      { speedHz: 0.1, symmetry: 1 },
      { kind: 'honest' },
    );
    const flag = Object.fromEntries(
      plan.settings.map((s) => [s.frameRate, s.readoutLongerThanFrame]),
    );
    expect(flag).toEqual({ 30: false, 60: true, 240: true });
  });

  it('lists only creep rates at which the camera shows that creep, within the camera’s span', () => {
    // docs/physics.md §4: s = n·|f − a|/k; one mark at 30 rev/s creeping 0.5 rev/s → 29.5/k frames/s.
    const plan = cameraPlan(
      { frameRatesHz: [10, 30], exposuresS: [1 / 1000], readoutS: 0 },
      { speedHz: 30, symmetry: 1 },
      { kind: 'creep', creepHz: 0.5 },
    );
    const rates = plan.needs.lookRates.map((r) => r.rateHz);
    expect(rates[0]).toBeCloseTo(29.5, 12);
    for (const hz of rates) {
      expect(hz).toBeGreaterThanOrEqual(10);
      expect(replay(sceneOf(30, 1, hz, 'frames')).look).toBe('forward');
    }
  });

  it('reaches a goal only when every condition holds, and never ranks a failing setting above a reaching one', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.5, max: 200, noNaN: true }),
        fc.integer({ min: 1, max: 12 }),
        fc.double({ min: 0, max: 0.05, noNaN: true }),
        fc.uniqueArray(fc.constantFrom(...standardFrameRates.map((r) => r.hz)), {
          minLength: 1,
          maxLength: 6,
        }),
        fc.subarray([45, 90, 180, 360]),
        fc.subarray([1 / 250, 1 / 1000, 1 / 8000, 1 / 32000]),
        fc.constantFrom(0, 0.005, 0.025),
        fc.constantFrom('freeze', 'natural', 'honest', 'creep'),
        (speedHz, symmetry, tolerance, frameRatesHz, angles, exposures, readoutS, kind) => {
          if (angles.length === 0 && exposures.length === 0) return;
          const goal = kind === 'creep' ? { kind, creepHz: speedHz / 300 } : { kind };
          const part = { speedHz, symmetry, tolerance };
          let plan;
          try {
            plan = cameraPlan(
              { frameRatesHz, shutterAnglesDeg: angles, exposuresS: exposures, readoutS },
              part,
              goal as never,
            );
          } catch {
            return; // an InputError (no exposure fits a frame): covered above
          }
          for (const s of plan.settings) {
            expect(s.reaches && s.blocks.length === 0).toBe(true);
            // The contract's conditions, checked from the numbers (docs/physics.md §5; cameraPlan's defaults).
            if (kind === 'freeze') {
              expect(replay(sceneOf(speedHz, symmetry, s.frameRate, 'frames')).look).toBe('still');
              expect(s.blurDegrees).toBeLessThanOrEqual(2);
              expect(s.skewPitches).toBeLessThan(1);
            }
            if (kind === 'natural') {
              expect(s.blurPitches).toBeGreaterThanOrEqual(1);
              expect(s.residualContrast).toBeLessThanOrEqual(0.1);
            }
            if (kind === 'honest') {
              expect(s.misleading).toBe(false);
              expect(s.evenDisc || s.skewPitches < 1).toBe(true);
            }
            if (kind === 'creep') {
              expect(s.blurPitches).toBeLessThanOrEqual(0.5);
              expect(s.skewPitches).toBeLessThan(1);
              expect(['forward', 'true']).toContain(s.look);
            }
          }
          for (const s of plan.nearMisses) expect(s.reaches || s.blocks.length === 0).toBe(false);
          for (let i = 1; i < plan.settings.length; i++)
            expect(plan.settings[i].score).toBeLessThanOrEqual(plan.settings[i - 1].score);
          for (const c of plan.conditions)
            expect(plan.met[c]).toBeGreaterThanOrEqual(plan.settings.length);
        },
      ),
      { seed: 2018, numRuns: 300 },
    );
  });
});
