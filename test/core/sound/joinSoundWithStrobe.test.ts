/**
 * Joining the sound estimate with strobe readings. A frozen single image at rate F means
 * n·f = k·F for some whole k (docs/physics.md §7; the stroboscope's whole-multiple ambiguity):
 * the strobe's candidates come from findSpeed, the sound's from speedsFromSound, and every
 * proposed rate is checked here against apparentMotion, independently of the join's own use
 * of it.
 */
import { describe, expect, it } from 'vitest';
import {
  apparentMotion,
  findSpeed,
  joinSoundWithStrobe,
  soundSpectrum,
  speedsFromSound,
  type SoundSpeedCandidate,
} from '../../../src/core';
import { fanAt1750Rpm, machineSound, seededRandom } from '../../helpers/sound/machineSound';

const FAN_HZ = 1750 / 60;
const fan = speedsFromSound(soundSpectrum(fanAt1750Rpm(48_000, 4), 48_000), { symmetry: 6 });
const near = (a: number, b: number, share = 0.001) => Math.abs(a - b) <= share * b;
const viewAt = (speedHz: number, symmetry: number, rateHz: number) => {
  const m = apparentMotion({ speedHz, symmetry }, rateHz);
  return `${m.look}:${m.images}`;
};

describe('joinSoundWithStrobe', () => {
  it('with no reading yet, proposes one image standing still at n·f to confirm a clear sound', () => {
    expect(fan.candidates[0].confidence).toBe('clear');
    const join = joinSoundWithStrobe(fan.candidates, undefined, { symmetry: 6 });
    expect(join.status).toBe('sound-only');
    expect(near(join.speedHz!, FAN_HZ)).toBe(true);
    expect(join.nextPurpose).toBe('confirm');
    expect(join.nextRateHz!).toBeCloseTo(6 * join.speedHz!, 9);
    expect(join.views![0]).toMatchObject({ images: 1, look: 'still' });
    expect(viewAt(join.speedHz!, 6, join.nextRateHz!)).toBe('still:1');
  });

  it('narrows a single-image reading’s whole multiples to the one the sound heard', () => {
    // One image stood still at 58.33 flashes/s: n·f = k·58.33, so 9.72, 19.44, 29.17… rev/s.
    const strobe = findSpeed([{ rateHz: 175 / 3, images: 1 }], 6);
    expect(strobe.candidates.length).toBeGreaterThan(2);
    const join = joinSoundWithStrobe(fan.candidates, strobe.candidates, { symmetry: 6 });
    expect(join.status).toBe('one');
    expect(join.matches).toHaveLength(1);
    expect(near(join.speedHz!, FAN_HZ)).toBe(true);
    expect(near(join.matches[0].strobeSpeedHz, FAN_HZ, 1e-9)).toBe(true);
    expect(join.precisionHz!).toBeGreaterThan(0);
    // The rate proposed shows the heard speed differently from every other strobe candidate.
    expect(join.nextPurpose).toBe('confirm');
    const lead = viewAt(join.speedHz!, 6, join.nextRateHz!);
    for (const c of strobe.candidates) {
      if (near(c.speedHz, FAN_HZ)) continue;
      expect(viewAt(c.speedHz, 6, join.nextRateHz!), `${c.speedHz} rev/s`).not.toBe(lead);
    }
    expect(join.views![0].speedHz).toBe(join.speedHz);
  });

  it('lets one reading choose between two speeds the sound could not tell apart', () => {
    // Two 6-blade fans equally loud at 1750 and 1470 rpm: the sound ties them.
    const x = machineSound(
      {
        sampleRateHz: 48_000,
        durationS: 4,
        speedHz: FAN_HZ,
        lines: [
          { order: 6, amplitude: 1, phase: 0 },
          { order: 12, amplitude: 0.4, phase: 1 },
        ],
        other: {
          speedHz: 24.5,
          lines: [
            { order: 6, amplitude: 1, phase: 2 },
            { order: 12, amplitude: 0.4, phase: 3 },
          ],
        },
        noise: { colour: 'white', snrDb: 20 },
      },
      seededRandom(5),
    );
    const sound = speedsFromSound(soundSpectrum(x, 48_000), { symmetry: 6, mainsHz: 50 });
    const alone = joinSoundWithStrobe(sound.candidates, [], { symmetry: 6 });
    expect(alone.status).toBe('sound-only');
    expect(alone.speedHz).toBeUndefined(); // tied: no speed taken
    expect(alone.nextPurpose).toBe('separate');
    const views = new Set(alone.views!.slice(0, 2).map((v) => `${v.look}:${v.images}`));
    expect(views.size).toBe(2);
    // The strobe on the fan at 1750 rpm: one image at 87.5 flashes/s (n·f = 2·87.5).
    const strobe = findSpeed([{ rateHz: 87.5, images: 1 }], 6);
    const join = joinSoundWithStrobe(sound.candidates, strobe.candidates, { symmetry: 6 });
    expect(join.status).toBe('one');
    expect(near(join.speedHz!, FAN_HZ)).toBe(true);
  });

  it('keeps several speeds open when a reading allows both, and proposes a rate that separates them', () => {
    const both: SoundSpeedCandidate[] = [
      { ...fan.candidates[0], confidence: 'tied' },
      { ...fan.candidates[0], speedHz: 24.5, precisionHz: 0.005, confidence: 'tied', score: 0.95 },
    ];
    // 7 flashes/s: 175 = 25·7 and 147 = 21·7, so both fit a single image there.
    const strobe = findSpeed([{ rateHz: 7, images: 1 }], 6, { minHz: 20, maxHz: 35 });
    const join = joinSoundWithStrobe(both, strobe.candidates, { symmetry: 6 });
    expect(join.status).toBe('several');
    expect(join.speedHz).toBeUndefined();
    expect(join.matches.map((m) => +m.speedHz.toFixed(2))).toEqual([+FAN_HZ.toFixed(2), 24.5]);
    expect(join.nextPurpose).toBe('separate');
    expect(viewAt(join.matches[0].speedHz, 6, join.nextRateHz!)).not.toBe(
      viewAt(24.5, 6, join.nextRateHz!),
    );
  });

  it('says so when the readings and the sound disagree, and proposes the sound’s confirmation', () => {
    // One image at 50 flashes/s: n·f = 50k, so 8.33, 16.67, 25, 33.3… rev/s; none is 29.17.
    const strobe = findSpeed([{ rateHz: 50, images: 1 }], 6);
    const join = joinSoundWithStrobe(fan.candidates, strobe.candidates, { symmetry: 6 });
    expect(join.status).toBe('disagree');
    expect(join.matches).toEqual([]);
    expect(join.speedHz).toBeUndefined();
    expect(join.views![0].speedHz).toBeCloseTo(fan.candidates[0].speedHz, 9);
  });

  it('keeps the proposed rate inside the strobe’s range', () => {
    // A strobe that reaches 150 flashes/s only: n·f = 175 is out of reach, half of it is not.
    const join = joinSoundWithStrobe(fan.candidates, [], {
      symmetry: 6,
      rateRange: { minHz: 5, maxHz: 150 },
    });
    expect(join.nextRateHz!).toBeLessThanOrEqual(150);
    expect(join.nextRateHz!).toBeCloseTo(87.5, 1);
    expect(viewAt(join.speedHz!, 6, join.nextRateHz!)).toBe('still:1');
    // None of the candidate rates in reach: no proposal, no invented one.
    const none = joinSoundWithStrobe(fan.candidates, [], {
      symmetry: 6,
      rateRange: { minHz: 100, maxHz: 150 },
    });
    expect(none.nextRateHz).toBeUndefined();
  });

  it('reports no sound when the sound gave no speed', () => {
    expect(joinSoundWithStrobe([], [{ speedHz: 10 }], { symmetry: 6 })).toEqual({
      status: 'no-sound',
      matches: [],
    });
  });
});
