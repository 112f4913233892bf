/**
 * Mains hum: lines at the supply frequency and its multiples (common practice: 50 Hz in most
 * of the world, 60 Hz in the Americas and parts of Asia; transformer hum strongest at twice
 * the supply, from magnetostriction).
 */
import { describe, expect, it } from 'vitest';
import { soundSpectrum } from '../../../src/core';
import { findHum } from '../../../src/core/sound/hum';
import { machineSound, seededRandom } from '../../helpers/sound/machineSound';

const FS = 44_100;
const line = (order: number, amplitude: number) => ({ order, amplitude, phase: order });
function spectrumOf(hum: { mainsHz: number; orders: number[] }, partHz: number[] = []) {
  const x = machineSound(
    {
      sampleRateHz: FS,
      durationS: 4,
      speedHz: 1,
      lines: partHz.map((hz) => line(hz, 0.5)),
      hum: { mainsHz: hum.mainsHz, lines: hum.orders.map((m) => line(m, m === 2 ? 1 : 0.3)) },
      noise: { colour: 'white', snrDb: 20 },
    },
    seededRandom(8),
  );
  return soundSpectrum(x, FS);
}

describe('findHum', () => {
  it('finds either supply, a little off nominal, without being told which', () => {
    for (const [mainsHz, actual] of [
      [50, 49.85],
      [60, 60.18],
    ] as const) {
      const hum = findHum(spectrumOf({ mainsHz: actual, orders: [1, 2, 3, 4, 6, 9] }));
      expect(hum.lines.map((l) => l.harmonic)).toEqual([1, 2, 3, 4, 6, 9]);
      for (const l of hum.lines) {
        expect(l.mainsHz).toBe(mainsHz);
        expect(l.hz).toBeCloseTo(l.harmonic * actual, 1);
      }
    }
  });

  it('marks no hum of the other supply when told which one the site has', () => {
    const s = spectrumOf({ mainsHz: 50, orders: [1, 2, 3] });
    expect(findHum(s, 60).lines).toEqual([]);
    expect(findHum(s, 50).lines).toHaveLength(3);
  });

  it('leaves a machine line four bins from a hum line alone, and masks only the hum’s main lobe', () => {
    const s = spectrumOf({ mainsHz: 50, orders: [2] }, [100 + 4 * (FS / 65_536)]);
    const hum = findHum(s, 50);
    expect(hum.lines).toHaveLength(1);
    const machine = s.peaks.find((p) => Math.abs(p.hz - 102.7) < 0.5)!;
    expect(hum.mask[machine.bin]).toBe(0);
    expect(hum.mask[Math.round(100 / s.binHz)]).toBe(1);
  });

  it('keeps a comb of machine lines 1.8 % off 50 Hz apart from the real 60 Hz hum', () => {
    // A 1-mark part at 49.1 rev/s with harmonics, on a 60 Hz site: the finder must not take
    // the part for 50 Hz hum (its lines are 1.8 % off any multiple of 50).
    const s = spectrumOf({ mainsHz: 60, orders: [1, 2, 3, 4] }, [49.1, 98.2, 147.3, 196.4]);
    const hum = findHum(s);
    expect(hum.lines.every((l) => l.mainsHz === 60)).toBe(true);
    expect(hum.lines).toHaveLength(4);
  });
});
