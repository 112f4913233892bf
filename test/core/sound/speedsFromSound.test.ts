/**
 * The tone finder on chosen cases: the fan, a missing fundamental, hum of either
 * supply, a louder motor, a single line, two explanations that fit equally, an expected
 * range, lines on the hum, a gear, clipping, fast and long recordings.
 * Relations of the trade (common practice): blade pass n·f, gear mesh z·f, shaft lines f, 2f…;
 * mains hum at the supply frequency and its multiples, strongest at twice it.
 */
import { describe, expect, it } from 'vitest';
import {
  soundSpectrum,
  speedsFromSound,
  type SoundSpeeds,
  type SpeedsFromSoundOptions,
} from '../../../src/core';
import {
  fanAt1750Rpm,
  machineSound,
  noiseOf,
  seededRandom,
  type MachineSoundSpec,
} from '../../helpers/sound/machineSound';

const FAN_HZ = 1750 / 60;

function speeds(
  spec: Omit<MachineSoundSpec, 'sampleRateHz' | 'durationS'>,
  opts: SpeedsFromSoundOptions,
  fs = 48_000,
): SoundSpeeds {
  const x = machineSound({ sampleRateHz: fs, durationS: 4, ...spec }, seededRandom(99));
  return speedsFromSound(soundSpectrum(x, fs), opts);
}

const near = (a: number, b: number, share = 0.001) => Math.abs(a - b) <= share * b;
const line = (order: number, amplitude: number, phase = order) => ({ order, amplitude, phase });

describe('speedsFromSound', () => {
  it('finds the 6-blade fan at 1750 rpm within ±2 rpm, clear, with the 100 Hz hum marked', () => {
    const r = speedsFromSound(soundSpectrum(fanAt1750Rpm(), 48_000), { symmetry: 6 });
    const top = r.candidates[0];
    expect(Math.abs(top.speedHz * 60 - 1750)).toBeLessThan(2);
    expect(top.precisionHz * 60).toBeLessThan(2);
    expect(top.confidence).toBe('clear');
    expect(top.basis).toBe('pattern');
    expect(top.toneHz).toBeCloseTo(175, 0);
    // Explained: the shaft line and blade-pass harmonics 1 and 3. The 2nd (350 Hz) sits on the
    // 7th harmonic of the 50 Hz supply, where it cannot be told from hum: set aside with it.
    expect(top.lines.map((l) => l.order)).toEqual([1, 6, 18]);
    expect(r.hum.map((h) => [h.mainsHz, h.harmonic])).toEqual([
      [50, 2],
      [50, 7],
    ]);
    expect(r.hum[0].hz).toBeCloseTo(100, 1);
    expect(r.noTone).toBeUndefined();
  });

  it('finds a part whose fundamental is missing from its harmonics', () => {
    // A 5-blade impeller at 24 rev/s: blade pass 120 Hz is silent, 240, 360, 480 Hz sing.
    const r = speeds(
      {
        speedHz: 24,
        lines: [line(10, 1), line(15, 0.7), line(20, 0.5)],
        noise: { colour: 'white', snrDb: 10 },
      },
      { symmetry: 5, mainsHz: 50 },
    );
    expect(near(r.candidates[0].speedHz, 24)).toBe(true);
    expect(r.candidates[0].lines.map((l) => l.order)).toEqual([10, 15, 20]);
  });

  it('marks hum of either supply, found without being told which', () => {
    for (const mainsHz of [50, 60] as const) {
      const r = speeds(
        {
          speedHz: 23.3,
          lines: [line(7, 0.5), line(14, 0.3)],
          hum: {
            mainsHz: mainsHz * 1.001,
            lines: [line(1, 0.2), line(2, 1), line(3, 0.3), line(4, 0.2), line(5, 0.1)],
          },
          noise: { colour: 'pink', snrDb: 10 },
        },
        { symmetry: 7 },
      );
      expect(r.hum.map((h) => h.harmonic)).toEqual([1, 2, 3, 4, 5]);
      expect(r.hum.every((h) => h.mainsHz === mainsHz)).toBe(true);
      expect(near(r.candidates[0].speedHz, 23.3)).toBe(true);
      // Hum, though louder, explains no candidate.
      for (const c of r.candidates) {
        for (const l of c.lines) expect(r.hum.some((h) => Math.abs(h.hz - l.hz) < 0.5)).toBe(false);
      }
    }
  });

  it('keeps the fan first when its motor sings louder than the fan’s shaft', () => {
    // Belt drive: 4-pole motor at 24.4 rev/s (1464 rpm), 8-blade fan at 16.1 rev/s.
    const quietSound = machineSound(
      {
        sampleRateHz: 48_000,
        durationS: 4,
        speedHz: 16.1,
        lines: [line(8, 1), line(16, 0.4), line(1, 0.05)],
        other: { speedHz: 24.4, lines: [line(1, 0.5), line(2, 0.4)] },
        noise: { colour: 'white', snrDb: 10 },
      },
      seededRandom(99),
    );
    const quiet = speedsFromSound(soundSpectrum(quietSound, 48_000), { symmetry: 8, mainsHz: 50 });
    expect(near(quiet.candidates[0].speedHz, 16.1)).toBe(true);
    expect(quiet.candidates[0].confidence).not.toBe('tied');
    // The motor's two lines could also be an 8-blade part at 3 rev/s: a nameplate range settles it.
    const nameplate = speedsFromSound(soundSpectrum(quietSound, 48_000), {
      symmetry: 8,
      mainsHz: 50,
      expect: { minHz: 14.5, maxHz: 17.7 },
    });
    expect(near(nameplate.candidates[0].speedHz, 16.1)).toBe(true);
    expect(nameplate.candidates[0].confidence).toBe('clear');
    // As loud as the fan's blade pass, in a range of 600–1800 rpm: the motor is listed, as a
    // shaft, after the fan (the blade pass is what an 8-blade fan sings).
    const loud = speeds(
      {
        speedHz: 16.1,
        lines: [line(8, 1), line(16, 0.4)],
        other: { speedHz: 24.4, lines: [line(1, 1), line(2, 0.8)] },
        noise: { colour: 'white', snrDb: 10 },
      },
      { symmetry: 8, mainsHz: 50, expect: { minHz: 10, maxHz: 30 } },
    );
    expect(near(loud.candidates[0].speedHz, 16.1)).toBe(true);
    const motor = loud.candidates.find((c) => near(c.speedHz, 24.4));
    expect(motor?.basis).toBe('shaft');
    expect(motor?.confidence).toBe('possible');
  });

  it('calls a single line likely, not clear: its harmonic number is a guess', () => {
    const r = speeds(
      { speedHz: FAN_HZ, lines: [line(6, 1)], noise: { colour: 'white', snrDb: 20 } },
      { symmetry: 6 },
    );
    expect(near(r.candidates[0].speedHz, FAN_HZ)).toBe(true);
    expect(r.candidates[0].confidence).toBe('likely');
  });

  it('never gives one confident number when two explanations fit equally', () => {
    // Two 6-blade fans side by side, equally loud, at 1750 and 1470 rpm: two speeds fit alike.
    const x = machineSound(
      {
        sampleRateHz: 48_000,
        durationS: 4,
        speedHz: FAN_HZ,
        lines: [line(6, 1), line(12, 0.4)],
        other: { speedHz: 24.5, lines: [line(6, 1), line(12, 0.4)] },
        noise: { colour: 'white', snrDb: 20 },
      },
      seededRandom(5),
    );
    const r = speedsFromSound(soundSpectrum(x, 48_000), { symmetry: 6, mainsHz: 50 });
    const tied = r.candidates.filter((c) => c.confidence === 'tied').map((c) => c.speedHz);
    expect(tied.some((f) => near(f, FAN_HZ))).toBe(true);
    expect(tied.some((f) => near(f, 24.5))).toBe(true);
    expect(r.candidates.some((c) => c.confidence === 'clear')).toBe(false);
    // An expected range (a nameplate 1750 rpm ± 10 %) settles it.
    const settled = speedsFromSound(soundSpectrum(x, 48_000), {
      symmetry: 6,
      mainsHz: 50,
      expect: { minHz: FAN_HZ * 0.9, maxHz: FAN_HZ * 1.1 },
    });
    expect(settled.candidates).toHaveLength(1);
    expect(near(settled.candidates[0].speedHz, FAN_HZ)).toBe(true);
    expect(settled.candidates[0].confidence).toBe('clear');
  });

  it('lists both readings of a 2-blade comb whose every multiple sings alike, choosing neither clearly', () => {
    // Lines at 30, 60, 90, 120 Hz, equally loud: a 2-blade part at 15 rev/s, or one at 30 rev/s
    // with shaft lines as loud as its blade pass.
    const r = speeds(
      {
        speedHz: 30,
        lines: [line(1, 1), line(2, 1), line(3, 1), line(4, 1)],
        noise: { colour: 'white', snrDb: 20 },
      },
      { symmetry: 2, mainsHz: 50 },
    );
    expect(r.candidates.some((c) => near(c.speedHz, 30))).toBe(true);
    expect(r.candidates.some((c) => near(c.speedHz, 15))).toBe(true);
    expect(r.candidates.some((c) => c.confidence === 'clear')).toBe(false);
  });

  it('searches only the expected range when one is given', () => {
    const r = speeds(
      {
        speedHz: FAN_HZ,
        lines: [line(6, 1), line(12, 0.5)],
        noise: { colour: 'white', snrDb: 10 },
      },
      { symmetry: 6, expect: { minHz: 25, maxHz: 35 } },
    );
    expect(r.searchedHz).toEqual({ minHz: 25, maxHz: 35 });
    for (const c of r.candidates)
      expect(c.speedHz >= 25 * 0.999 && c.speedHz <= 35 * 1.001).toBe(true);
  });

  it('says the sound holds only hum when the part’s only line sits on it', () => {
    // A 4-blade fan at exactly 25 rev/s on a 50 Hz site: blade pass on the 100 Hz hum.
    const r = speeds(
      {
        speedHz: 25,
        lines: [line(4, 0.3)],
        hum: { mainsHz: 50, lines: [line(2, 1), line(1, 0.2)] },
        noise: { colour: 'white', snrDb: 20 },
      },
      { symmetry: 4, mainsHz: 50 },
    );
    expect(r.candidates).toEqual([]);
    expect(r.noTone).toBe('hum-only');
  });

  it('still finds that fan from its shaft line, as a shaft', () => {
    const r = speeds(
      {
        speedHz: 25.3,
        lines: [line(4, 0.3), line(1, 0.1)],
        hum: { mainsHz: 50.6 / 0.506 / 2, lines: [line(2, 1)] }, // the hum sits on the blade pass
        noise: { colour: 'white', snrDb: 20 },
      },
      { symmetry: 4, mainsHz: 50, expect: { minHz: 20, maxHz: 30 } },
    );
    const shaft = r.candidates.find((c) => near(c.speedHz, 25.3));
    expect(shaft).toBeDefined();
  });

  it('finds a gear from its mesh line z·f and the shaft sidebands round it', () => {
    // 40 teeth at 24.5 rev/s: mesh at 980 Hz, sidebands 980 ± 24.5 Hz (common practice).
    const r = speeds(
      {
        speedHz: 24.5,
        lines: [line(40, 1), line(39, 0.3), line(41, 0.3), line(80, 0.4)],
        noise: { colour: 'pink', snrDb: 10 },
      },
      { symmetry: 40, mainsHz: 60 },
    );
    expect(near(r.candidates[0].speedHz, 24.5)).toBe(true);
  });

  it('reports no tone for noise alone, for silence, and for hum alone', () => {
    const fs = 48_000;
    for (const colour of ['white', 'pink'] as const) {
      const noise = noiseOf(colour, 4 * fs, seededRandom(3)).map((v) => 0.05 * v);
      expect(speedsFromSound(soundSpectrum(noise, fs), { symmetry: 3 }).noTone).toBe('no-lines');
    }
    const silent = speedsFromSound(soundSpectrum(new Float32Array(4 * fs), fs), { symmetry: 3 });
    expect(silent).toMatchObject({ candidates: [], noTone: 'silent' });
    const hum = machineSound(
      {
        sampleRateHz: fs,
        durationS: 4,
        speedHz: 1,
        lines: [],
        hum: { mainsHz: 60, lines: [line(2, 0.5), line(3, 0.1)] },
      },
      seededRandom(4),
    );
    expect(speedsFromSound(soundSpectrum(hum, fs), { symmetry: 3 }).noTone).toBe('hum-only');
  });

  it('flags a clipped recording and still finds the speed (clipping adds lines at the same multiples)', () => {
    const x = fanAt1750Rpm(48_000, 4).map((v) => Math.max(-1, Math.min(1, 4 * v)));
    const s = soundSpectrum(x, 48_000);
    expect(s.level.clipped).toBe(true);
    const r = speedsFromSound(s, { symmetry: 6, mainsHz: 50 });
    expect(r.clipped).toBe(true);
    expect(Math.abs(r.candidates[0].speedHz * 60 - 1750)).toBeLessThan(2);
  });

  it('reads 96 and 192 kHz recordings (decimated to 48 kHz) as well as 48 kHz ones', () => {
    for (const fs of [96_000, 192_000]) {
      const s = soundSpectrum(fanAt1750Rpm(fs, 4), fs);
      expect(s.sampleRateHz).toBe(48_000);
      const r = speedsFromSound(s, { symmetry: 6 });
      expect(Math.abs(r.candidates[0].speedHz * 60 - 1750)).toBeLessThan(2);
    }
  });

  it('analyses the middle 10 s of a 30 s recording', () => {
    const s = soundSpectrum(fanAt1750Rpm(16_000, 30), 16_000);
    expect(s.fromS).toBe(10);
    expect(s.analysedS).toBe(10);
    expect(s.durationS).toBe(30);
    const r = speedsFromSound(s, { symmetry: 6 });
    expect(Math.abs(r.candidates[0].speedHz * 60 - 1750)).toBeLessThan(2);
  });
});
