import { describe, expect, test } from 'vitest';
import {
  apparentMotion,
  blurDegrees,
  blurPitches,
  exposureFromShutterAngle,
  flickerRisk,
  lockRates,
  rateBands,
  rollingSkewDegrees,
} from '../../src/core';
import { verdictOf } from '../../src/state/check';
import { computeCheck } from '../../src/state/check/lists';
import { attempt } from '../../src/state/outcome';
import { activeCorePart as corePart, defaultSetup, type Setup } from '../../src/state/model';
import {
  CHECK_NOTE_WORDS,
  creepMissingWords,
  narrowLocksWords,
  verdictHeadline,
} from '../../src/words/check';

function setupWith(change: Partial<Setup> & { part?: Partial<Setup['parts'][number]> }): Setup {
  const { part, ...rest } = change;
  const s: Setup = structuredClone({ ...defaultSetup, ...rest });
  if (part) s.parts = [{ ...s.parts[0], ...part }];
  return s;
}

/** One mark at 3600 rpm (60 rev/s), ± `tolerancePercent`, under a strobe at `fpm`. */
function disc(fpm: number, extra: Partial<Setup> = {}, tolerancePercent = 0): Setup {
  return setupWith({
    ...extra,
    part: { speedRpm: 3600, features: 1, tolerancePercent },
    samplerKind: 'strobe',
    strobe: { rateFpm: fpm, minFpm: 30, maxFpm: 12000 },
  });
}

describe('the verdict', () => {
  test('a disc at 60 rev/s under 61 flashes/s turns backward at 1 rev/s', () => {
    // Wikipedia, "Stroboscopic effect": 60 rev/s lit at 61 flashes/s seems to turn backwards at 1 rev/s.
    const r = computeCheck(disc(61 * 60));
    expect(r.verdict.kind).toBe('backward');
    expect(verdictHeadline(r.verdict)).toBe('Turning backward');
    expect(r.verdict.apparentRpm).toBeCloseTo(-60, 9);
    expect(r.verdict.trueRpm).toBe(3600);
    expect(r.verdict.trust).toBe('danger');
  });

  test('the same disc under 59 flashes/s turns forward at 1 rev/s, which is 60 rpm: a creep', () => {
    // Wikipedia, "Stroboscopic effect": at 59 flashes/s it seems to turn forwards at 1 rev/s.
    const r = computeCheck(disc(59 * 60));
    expect(r.verdict.kind).toBe('creeping');
    expect(verdictHeadline(r.verdict)).toBe('Creeping forward');
    expect(r.verdict.apparentRpm).toBeCloseTo(60, 9);
    expect(r.verdict.trust).toBe('caution');
  });

  test('a 12-spoke wheel at 2 rev/s filmed at 24 frames/s looks still', () => {
    // Wikipedia, "Stroboscopic effect": a 12-spoke wheel at 2 rev/s filmed at 24 frames/s seems still.
    const s = setupWith({
      part: { speedRpm: 120, features: 12, tolerancePercent: 0 },
      samplerKind: 'camera',
      camera: { frameRate: 24, exposure: { mode: 'angle', angleDeg: 180 }, readoutMs: 0 },
    });
    const r = computeCheck(s);
    expect(r.verdict.kind).toBe('still');
    expect(verdictHeadline(r.verdict)).toBe('Looks still');
    expect(r.showSafety).toBe(true);
  });

  test('half a turn per flash shows two images standing still', () => {
    // docs/physics.md §2: exactly half a turn per flash is two images standing still.
    const r = computeCheck(disc(120 * 60));
    expect(r.verdict.kind).toBe('images');
    expect(r.verdict.images).toBe(2);
    expect(verdictHeadline(r.verdict)).toBe('2 images, standing still');
  });

  test('a sampler above twice the pattern frequency shows true motion, and no caution', () => {
    // Nyquist–Shannon (Shannon 1949): s > 2·n·f shows the true speed.
    const s = setupWith({
      part: { speedRpm: 600, features: 1, tolerancePercent: 0 },
      samplerKind: 'camera',
      camera: { frameRate: 60, exposure: { mode: 'angle', angleDeg: 180 }, readoutMs: 0 },
    });
    const r = computeCheck(s);
    expect(r.verdict.kind).toBe('true');
    expect(r.verdict.apparentRpm).toBeCloseTo(600, 9);
    expect(r.showSafety).toBe(false);
  });

  test('matches the core for every look it can give', () => {
    const part = { speedHz: 30, symmetry: 6, tolerance: 0 };
    for (const rateHz of [7, 29.5, 35.9, 36, 90, 179, 181, 360, 1000]) {
      const m = apparentMotion(part, rateHz, { sampler: 'flash' });
      const v = verdictOf(m, part);
      const words = {
        true: 'true',
        forward: /creeping|forward/,
        backward: 'backward',
        still: /still|images/,
        unclear: 'unclear',
      };
      // Creeping groups of images read as images whatever the single-image look (docs/physics.md §3).
      const want = m.images > 1 && m.look !== 'still' ? 'images' : words[m.look];
      if (typeof want === 'string') expect(v.kind).toBe(want);
      else expect(v.kind).toMatch(want);
      expect(v.images).toBe(m.images);
    }
  });

  test('three marks creeping under a strobe above the Nyquist rate read as images, with the safety notice', () => {
    // One mark at 10 rev/s under 30.5 flashes/s: r = 0.328, near 1/3, the group of three drifts
    // at 10 − 30.5/3 = −1/6 rev/s (docs/physics.md §3).
    const part = { speedHz: 10, symmetry: 1, tolerance: 0 };
    const m = apparentMotion(part, 30.5, { sampler: 'flash' });
    expect(m.look).toBe('true');
    expect(m.images).toBe(3);
    const v = verdictOf(m, part);
    expect(verdictHeadline(v)).toBe('3 images, creeping backward');
    expect(v.apparentRpm).toBeCloseTo(-10, 9);
    expect(v.trust).toBe('danger');
  });

  test('steady light (0 % modulation) shows true motion', () => {
    const s = setupWith({
      samplerKind: 'lighting',
      lighting: { mainsHz: 50, flicker: 'double', customHz: 300, modulationPercent: 0 },
    });
    const r = computeCheck(s);
    expect(r.verdict.kind).toBe('steady');
    expect(r.showSafety).toBe(false);
    expect(r.showPhotosensitivity).toBe(false);
  });
});

describe('the cautions', () => {
  test('the safety notice shows for every aliased view, a forward creep included, and not for true motion', () => {
    // docs/physics.md §4: every view that is not faithful carries the stillness caution of §10.
    expect(computeCheck(disc(3600)).showSafety).toBe(true); // still
    expect(computeCheck(disc(61 * 60)).showSafety).toBe(true); // backward
    expect(computeCheck(disc(59 * 60)).showSafety).toBe(true); // creeping forward at 60 rpm
    expect(computeCheck(disc(100 * 60)).showSafety).toBe(true); // r = 0.6: forward, slowed
    expect(computeCheck(disc(121 * 60)).showSafety).toBe(false); // r < 0.5: faithful (Shannon 1949)
  });

  test('a fan creeping forward at 2 rpm carries the safety notice', () => {
    // 6 blades at 1750 rpm under 1748 flashes/min: a = (1750 − 1748)/60 rev/s (docs/physics.md §2).
    const r = computeCheck(
      setupWith({
        part: { speedRpm: 1750, features: 6, tolerancePercent: 0 },
        samplerKind: 'strobe',
        strobe: { rateFpm: 1748, minFpm: 30, maxFpm: 12000 },
      }),
    );
    expect(r.verdict.kind).toBe('creeping');
    expect(r.verdict.apparentRpm).toBeCloseTo(2, 9);
    expect(r.motion.faithful).toBe(false);
    expect(r.showSafety).toBe(true);
  });

  test('several images above the Nyquist rate carry the safety notice although the sampler is faithful', () => {
    // One mark at 10 rev/s under 30.5 flashes/s: three images creep (docs/physics.md §3).
    const r = computeCheck(
      setupWith({
        part: { speedRpm: 600, features: 1, tolerancePercent: 0 },
        samplerKind: 'strobe',
        strobe: { rateFpm: 30.5 * 60, minFpm: 30, maxFpm: 12000 },
      }),
    );
    expect(r.motion.faithful).toBe(true);
    expect(r.motion.images).toBe(3);
    expect(r.showSafety).toBe(true);
  });

  test('the photosensitivity caution shows for a flash rate from 3 to 60 per second', () => {
    // docs/physics.md §10, WCAG 2.x success criterion 2.3.1 counts from three flashes per second.
    expect(computeCheck(disc(3 * 60)).showPhotosensitivity).toBe(true);
    expect(computeCheck(disc(60 * 60)).showPhotosensitivity).toBe(true);
    expect(computeCheck(disc(2.9 * 60)).showPhotosensitivity).toBe(false);
    expect(computeCheck(disc(61 * 60)).showPhotosensitivity).toBe(false);
  });

  test('a camera is not a flash: no photosensitivity caution at 30 frames/s', () => {
    const s = setupWith({ samplerKind: 'camera' });
    expect(computeCheck(s).showPhotosensitivity).toBe(false);
  });

  test('lighting flickering at mains frequency (50 Hz) carries the photosensitivity caution', () => {
    const s = setupWith({
      samplerKind: 'lighting',
      lighting: { mainsHz: 50, flicker: 'mains', customHz: 300, modulationPercent: 30 },
    });
    expect(computeCheck(s).showPhotosensitivity).toBe(true);
  });
});

describe('rates to try', () => {
  test('lists the nearest single- and double-image rates on each side, as lockRates gives them', () => {
    const s = disc(3000, {}, 1);
    const r = computeCheck(s);
    // Suggestions stop at two images (check.ts, SUGGESTED_MAX_IMAGES): the ones a technician sets.
    const all = lockRates(corePart(s), { minHz: 0.5, maxHz: 200 }, { maxImages: 2 });
    const below = all.filter((l) => l.rateHz < 50).slice(-3);
    const above = all.filter((l) => l.rateHz > 50).slice(0, 3);
    // 60 rev/s at 50 flashes/s is the lock 6/5: five images, which the verdict names, not the list.
    expect(all.some((l) => l.rateHz === 50)).toBe(false);
    const want = [...below, ...above];
    expect(r.locks.map((l) => l.rateHz)).toEqual(want.map((l) => l.rateHz));
    expect(r.locks.map((l) => l.images)).toEqual(want.map((l) => l.images));
    expect(r.locks.filter((l) => l.side === 'below')).toHaveLength(3);
    expect(Math.max(...r.locks.map((l) => l.images))).toBe(2);
  });

  test('marks the lock at the current rate as here', () => {
    const r = computeCheck(disc(3600, {}, 1));
    const here = r.locks.find((l) => l.side === 'here');
    expect(here?.rateHz).toBe(60);
    expect(here?.images).toBe(1);
  });

  test('leaves out a lock whose freezing band is narrower than one flash per minute, and says why', () => {
    // docs/physics.md §4: a suggested rate is at least one setting step wide. One mark at exactly
    // 3600 rpm (no tolerance) freezes within 0.25 rpm of each single-image lock: 0.5 flash/min
    // wide, left out. The double image at 7200 flashes/min drifts half as fast for the same
    // rate error: 2 · 2 · 0.25 = 1 flash/min wide, exactly one step, and kept.
    const r = computeCheck(disc(3000));
    expect(r.locks.map((l) => [l.rateHz, l.images])).toEqual([[120, 2]]);
    expect(r.narrowLocksLeftOut).toBe(true);
    expect(narrowLocksWords(r.sampler)).toMatch(/less than one flash per minute/);
    // With ±1 % the same locks are 2 % of their rate wide, and listed.
    const wide = computeCheck(disc(3000, {}, 1));
    expect(wide.locks.length).toBeGreaterThan(0);
    expect(wide.narrowLocksLeftOut).toBe(false);
  });

  test('a camera only suggests single-image rates', () => {
    const r = computeCheck(setupWith({ samplerKind: 'camera' }));
    expect(r.locks.length).toBeGreaterThan(0);
    expect(r.locks.every((l) => l.images === 1)).toBe(true);
  });

  test('the creep rates show one image creeping forward under the sampler in use (docs/physics.md §4)', () => {
    // The default fan, 6 blades at 1770 rpm, creeping at 2 rpm under a strobe: every rate offered
    // shows one image creeping forward, never a group of images standing still.
    const r = computeCheck(setupWith({ creepRpm: 2 }));
    expect(r.creep.length).toBeGreaterThan(0);
    for (const c of r.creep) {
      expect(apparentMotion(corePart(setupWith({})), c.rateHz, { sampler: 'flash' })).toMatchObject(
        {
          images: 1,
          look: 'forward',
        },
      );
    }
  });

  test('the creep rate shows the part creeping forward at the wanted speed', () => {
    // docs/physics.md §4 worked check: f = 30 rev/s, one mark, creep 0.5 rev/s forward → 29.5 flashes/s.
    const s = setupWith({
      part: { speedRpm: 1800, features: 1, tolerancePercent: 0 },
      samplerKind: 'strobe',
      strobe: { rateFpm: 1800, minFpm: 30, maxFpm: 12000 },
      creepRpm: 30,
    });
    const r = computeCheck(s);
    const nearest = r.creep.find((c) => c.side === 'below');
    expect(nearest?.rateHz).toBeCloseTo(29.5, 12);
    expect(nearest?.look).toBe('forward');
    const m = apparentMotion(corePart(s), nearest!.rateHz);
    expect(m.apparentHz * 60).toBeCloseTo(30, 9);
  });

  test('explains why there is no creep rate for a part standing still or a creep faster than the part', () => {
    const still = computeCheck(setupWith({ part: { speedRpm: 0 } }));
    expect(still.creepMissing).toBe('not-turning');
    expect(creepMissingWords(still.creepMissing!, still.creepRpm)).toMatch(/not turning/);
    const fast = computeCheck(setupWith({ creepRpm: 5000 }));
    expect(fast.creepMissing).toBe('creep-too-fast');
    expect(creepMissingWords(fast.creepMissing!, fast.creepRpm)).toMatch(
      /slower than the true speed/,
    );
  });
});

describe('safe bands', () => {
  test("are the core's bands over the strobe's own range", () => {
    const s = disc(3000);
    const r = computeCheck(s);
    const bands = rateBands([corePart(s)], { minHz: 0.5, maxHz: 200 }, { sampler: 'flash' });
    expect(r.bands.all).toEqual(bands);
    expect(r.bands.partial).toBe(false);
    expect(r.bands.safeNearby.every((b) => b.safe)).toBe(true);
    // docs/physics.md §4: every band suggested is at least one flash per minute wide.
    expect(r.bands.safeNearby.every((b) => (b.toHz - b.fromHz) * 60 >= 1)).toBe(true);
  });

  test('keep the nearly-still margin: a 3-jaw chuck at 2000 rpm ±1 % is not safe at 5939 flashes/min', () => {
    // Reported case: at 1980 rpm (inside ±1 %) the chuck creeps at 0.33 rpm there (docs/physics.md §4).
    const s = setupWith({
      part: { speedRpm: 2000, features: 3, tolerancePercent: 1 },
      samplerKind: 'strobe',
      strobe: { rateFpm: 5939, minFpm: 30, maxFpm: 12000 },
    });
    const r = computeCheck(s);
    expect(r.bands.current?.safe).toBe(false);
    expect(r.bands.current?.causes).toContainEqual({ part: 0, kind: 'nearly-still', images: 1 });
    expect(r.bands.safeNearby.some((b) => b.fromHz <= 5939 / 60 && 5939 / 60 <= b.toHz)).toBe(
      false,
    );
  });

  test('find the band holding the current rate', () => {
    const r = computeCheck(disc(3600));
    expect(r.bands.current?.safe).toBe(false);
    expect(r.bands.current!.fromHz).toBeLessThanOrEqual(60);
    expect(r.bands.current!.toHz).toBeGreaterThanOrEqual(60);
  });

  test('for a camera, every rate above twice the pattern frequency with tolerance is safe', () => {
    // docs/physics.md §4: for frames every rate > 2·n·|f|·(1+u) is safe.
    const s = setupWith({
      part: { speedRpm: 600, features: 2, tolerancePercent: 5 },
      samplerKind: 'camera',
    });
    const r = computeCheck(s);
    const last = r.bands.all.at(-1)!;
    expect(last.safe).toBe(true);
    expect(last.fromHz).toBeLessThanOrEqual(2 * 2 * 10 * 1.05 + 1e-9);
    expect(last.toHz).toBe(1000);
  });

  test('a range too dense to list is searched around the rate only, quickly, and says so', () => {
    const s = setupWith({
      part: { speedRpm: 100_000, features: 500, tolerancePercent: 1 },
      samplerKind: 'strobe',
    });
    const r = computeCheck(s);
    expect(r.bands.partial).toBe(true);
    expect(r.bands.span.minHz).toBeGreaterThanOrEqual(0.5);
    expect(r.bands.span.maxHz).toBeLessThanOrEqual(200);
    expect(r.locks.length).toBeGreaterThan(0);
  });
});

describe('camera and lighting read-outs', () => {
  test("the camera read-out is the core's blur and rolling-shutter bend", () => {
    const s = setupWith({ samplerKind: 'camera' });
    const r = computeCheck(s);
    const f = 1770 / 60;
    const t = exposureFromShutterAngle(180, 30000 / 1001);
    expect(r.camera?.exposureS).toBeCloseTo(t, 15);
    expect(r.camera?.blurDeg).toBeCloseTo(blurDegrees(f, t), 9);
    expect(r.camera?.blurPitches).toBeCloseTo(blurPitches(f, 6, t), 9);
    expect(r.camera?.skewDeg).toBeCloseTo(rollingSkewDegrees(f, 0.025), 9);
    expect(r.camera?.blurLook).toBe('smeared');
    expect(r.camera?.skewLook).toBe('broken');
  });

  test('a short exposure on a slow part is sharp and a global shutter is straight', () => {
    const s = setupWith({
      part: { speedRpm: 60, features: 1 },
      samplerKind: 'camera',
      camera: { frameRate: 30, exposure: { mode: 'time', seconds: 1 / 2000 }, readoutMs: 0 },
    });
    const r = computeCheck(s);
    // blurDegrees(1 rev/s, 1/2000 s) = 0.18°.
    expect(r.camera?.blurDeg).toBeCloseTo(0.18, 12);
    expect(r.camera?.blurLook).toBe('sharp');
    expect(r.camera?.skewLook).toBe('straight');
  });

  test('an exposure longer than a frame is capped at one frame and noted', () => {
    const s = setupWith({
      samplerKind: 'camera',
      camera: { frameRate: 30, exposure: { mode: 'time', seconds: 0.5 }, readoutMs: 25 },
    });
    const r = computeCheck(s);
    expect(r.camera?.exposureS).toBeCloseTo(1 / 30, 15);
    expect(r.camera?.shutterAngleDeg).toBeCloseTo(360, 9);
    expect(r.notes).toEqual(['exposure-capped']);
    expect(CHECK_NOTE_WORDS['exposure-capped']).toMatch(/longer than one frame/);
  });

  test("the lighting read-out is the core's IEEE Std 1789-2015 class", () => {
    const s = setupWith({ samplerKind: 'lighting' });
    const r = computeCheck(s);
    expect(r.lighting?.flickerHz).toBe(100);
    expect(r.lighting?.risk).toBe(flickerRisk(100, 30));
    // IEEE Std 1789-2015 low-risk line at 100 Hz: 0.08·100 = 8 %.
    expect(r.lighting?.lowRiskPercent).toBeCloseTo(8, 12);
  });
});

describe('refused set-ups', () => {
  test("the core's refusal of a set-up comes as its message, not a throw", () => {
    const s = setupWith({ part: { features: 0 } });
    const outcome = attempt(() => computeCheck(s));
    expect(outcome.ok).toBe(false);
    if (!outcome.ok) expect(outcome.message).toMatch(/features/);
  });

  test("a strobe rate outside the strobe's own range is noted", () => {
    const r = computeCheck(setupWith({ strobe: { rateFpm: 20000, minFpm: 30, maxFpm: 12000 } }));
    expect(r.rateInRange).toBe(false);
    expect(r.notes).toEqual(['rate-outside-range']);
    expect(CHECK_NOTE_WORDS['rate-outside-range']).toMatch(/outside this strobe's own range/);
  });
});

describe('nothing computed is NaN or Infinity', () => {
  test('across speeds, feature counts and samplers', () => {
    const kinds = ['strobe', 'camera', 'lighting'] as const;
    for (const kind of kinds) {
      for (const speedRpm of [0, 1, -1770, 1770, 12_000, 600_000]) {
        for (const features of [1, 3, 60, 5000]) {
          const r = computeCheck(
            setupWith({ samplerKind: kind, part: { speedRpm, features, tolerancePercent: 2 } }),
          );
          const text = JSON.stringify(r, (_k, v) =>
            typeof v === 'number' && !Number.isFinite(v) ? 'BAD' : v,
          );
          expect(text, `${kind} ${speedRpm} rpm ${features}`).not.toContain('BAD');
        }
      }
    }
  });
});
