// The spectrum chart's marks (src/ui/spectrum-chart/chart-data.ts) for the fan the speed finder
// hears: the blade-pass comb k·n·f (f = n·rpm/60 for the tone, common practice), the shaft line,
// and mains hum, a hum line that falls on the comb being named as possibly either. Speeds come
// from the core run on a generated 6-blade fan at 1750 rpm with 50 and 100 Hz hum; the hum at
// 350 Hz (7 × 50 Hz) falls on the blade pass's 2nd harmonic (2 × 175 Hz).
import { describe, expect, it } from 'vitest';
import { soundSpectrum, speedsFromSound } from '../../../src/core';
import {
  frequencyTicksHz,
  frequencyTickText,
  spectrumMarks,
} from '../../../src/ui/spectrum-chart/chart-data';
import { fanAt1750Rpm } from '../../helpers/sound/machineSound';

describe('spectrumMarks', () => {
  const spectrum = soundSpectrum(fanAt1750Rpm(48_000, 4), 48_000);
  const found = speedsFromSound(spectrum, { symmetry: 6 });
  const band = { minHz: spectrum.minToneHz, maxHz: spectrum.maxToneHz };
  const leader = found.candidates[0]!;

  it('marks the comb at k × 175 Hz, the lines found solid, and the shaft line', () => {
    const marks = spectrumMarks(leader, 6, found.hum, band, spectrum.binHz);
    const pattern = marks.comb.filter((c) => c.kind === 'pattern');
    expect(pattern[0]).toMatchObject({ label: '1×', order: 6, found: true });
    expect(pattern[0]!.hz).toBeCloseTo(175, 0);
    pattern.forEach((c, i) => expect(c.hz).toBeCloseTo((i + 1) * 6 * leader.speedHz, 0));
    expect(marks.comb.some((c) => c.kind === 'shaft' && Math.abs(c.hz - 1750 / 60) < 0.5)).toBe(
      true,
    );
  });

  it('names the comb line a hum line falls on, and no other', () => {
    // A hum line at 350 Hz (7 × 50 Hz) on the 2× line, one at 100 Hz on no line.
    const hum = [
      { hz: 350.02, mainsHz: 50 as const, harmonic: 7 },
      { hz: 100, mainsHz: 50 as const, harmonic: 2 },
    ];
    const marks = spectrumMarks(leader, 6, hum, band, spectrum.binHz);
    expect(marks.hum[0]).toMatchObject({ hz: 350.02, onComb: '2×' });
    expect(marks.hum[1]!.onComb).toBeUndefined();
    // Without a leader nothing is on a comb, and nothing is made up.
    expect(spectrumMarks(undefined, 6, hum, band, spectrum.binHz)).toEqual({ comb: [], hum });
  });
});

describe('the frequency axis', () => {
  it('ticks 1, 2 and 5 per decade, labelled in Hz and kHz', () => {
    expect(frequencyTicksHz({ minHz: 20, maxHz: 12_000 })).toEqual([
      20, 50, 100, 200, 500, 1000, 2000, 5000, 10_000,
    ]);
    expect([50, 1000, 12_000].map(frequencyTickText)).toEqual(['50', '1k', '12k']);
  });
});
