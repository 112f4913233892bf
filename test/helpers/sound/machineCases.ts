/**
 * Random machine-sound cases for the tone finder's accuracy test: a part with n blades or
 * teeth at a random speed, blade-pass (pattern) harmonics and shaft lines with random phases
 * and amplitudes, sometimes a missing fundamental, sometimes a driving motor's own lines,
 * always mains hum (50 or 60 Hz family, the supply a little off nominal), a slow speed drift
 * of up to ±0.2 % over the recording, and white or pink noise at a given SNR.
 */
import type { Range } from '../../../src/core';
import { machineSound, type Line, type MachineSoundSpec } from './machineSound';

export interface MachineCase {
  sampleRateHz: number;
  symmetry: number;
  speedHz: number;
  drift: number;
  missingFundamental: boolean;
  motorHz?: number;
  mainsHz: 50 | 60;
  /** The supply's actual frequency in the recording. */
  supplyHz: number;
  /** Told to the finder, or undefined (then both supplies are considered). */
  toldMainsHz?: 50 | 60;
  expect?: Range;
  /** Frequencies of the part's lines, Hz. */
  partLinesHz: number[];
  /** Frequencies of the other lines (hum, motor), Hz. */
  otherLinesHz: number[];
  samples: Float32Array;
}

const SYMMETRIES = [1, 2, 3, 4, 5, 6, 7, 8, 9, 11, 12, 16, 24, 36];
const DURATION_S = 4;

const between = (random: () => number, lo: number, hi: number) => lo + (hi - lo) * random();
const logBetween = (random: () => number, lo: number, hi: number) => lo * (hi / lo) ** random();
const pick = <T>(random: () => number, list: readonly T[]) =>
  list[Math.floor(random() * list.length)];

/**
 * Lines closer than this merge into one peak (the Hann main lobe is ±2 bins of 0.67–0.73 Hz):
 * no finder can tell them apart, so random cases keep the part's lines this far from the hum
 * and motor lines; such coincidences are tested on their own.
 */
export const RESOLVABLE_HZ = 2.5;

/**
 * A line this close to a multiple of the supply (up to the 40th) is taken for hum by the tone
 * finder, which cannot know that this recording's hum stops at its 4th harmonic: such cases
 * are tested on their own, not drawn at random. (The finder takes hum to within 0.05 % or
 * 0.3 bin; this is twice that.)
 */
function onHumHarmonic(hz: number, supplyHz: number): boolean {
  const m = Math.round(hz / supplyHz);
  return m >= 1 && m <= 40 && Math.abs(hz - m * supplyHz) <= Math.max(0.001 * hz, 0.5);
}

export function machineCase(
  random: () => number,
  noise: { colour: 'white' | 'pink'; snrDb: number },
): MachineCase {
  for (;;) {
    const { spec, ...c } = drawCase(random);
    const clear = c.partLinesHz.every(
      (x) =>
        c.otherLinesHz.every((y) => Math.abs(x - y) >= RESOLVABLE_HZ) &&
        !onHumHarmonic(x, c.supplyHz),
    );
    if (!clear) continue;
    const samples = machineSound({ ...spec, noise }, random);
    // Scale to a peak of 0.5: a recording with headroom, as a phone with its gain fixed gives.
    let peak = 0;
    for (const v of samples) peak = Math.max(peak, Math.abs(v));
    for (let i = 0; i < samples.length; i++) samples[i] *= 0.5 / peak;
    return { ...c, samples };
  }
}

function drawCase(random: () => number): Omit<MachineCase, 'samples'> & { spec: MachineSoundSpec } {
  const sampleRateHz = pick(random, [44100, 48000]);
  const symmetry = pick(random, SYMMETRIES);
  let speedHz: number;
  do speedHz = logBetween(random, 5, 60);
  while (symmetry * speedHz < 40 || symmetry * speedHz > 4000);
  const drift = between(random, -0.002, 0.002);

  const harmonics = 1 + Math.floor(random() * 5);
  const missingFundamental = harmonics >= 3 && random() < 0.2;
  const lines: Line[] = [];
  for (let k = 1; k <= harmonics; k++) {
    const amplitude = k === 1 ? (missingFundamental ? 0 : 1) : between(random, 0.15, 0.8);
    if (amplitude > 0)
      lines.push({ order: k * symmetry, amplitude, phase: between(random, 0, 2 * Math.PI) });
  }
  if (random() < 0.5) {
    for (let m = 1; m <= 3; m++) {
      if (m % symmetry === 0) continue;
      lines.push({
        order: m,
        amplitude: between(random, 0.05, 0.3),
        phase: between(random, 0, 2 * Math.PI),
      });
    }
  }
  let other: { speedHz: number; lines: Line[] } | undefined;
  if (random() < 0.3) {
    other = {
      // A belt-driven part: the motor turns at least 10 % faster or slower.
      speedHz: speedHz * (random() < 0.5 ? between(random, 0.55, 0.9) : between(random, 1.1, 1.8)),
      lines: [1, 2].map((order) => ({
        order,
        amplitude: between(random, 0.1, 0.4),
        phase: between(random, 0, 2 * Math.PI),
      })),
    };
  }
  const mainsHz = pick(random, [50, 60] as const);
  const supplyHz = mainsHz * (1 + between(random, -0.002, 0.002));
  const humLines: Line[] = [
    { order: 1, amplitude: between(random, 0, 0.2), phase: between(random, 0, 2 * Math.PI) },
    { order: 2, amplitude: between(random, 0.1, 0.8), phase: between(random, 0, 2 * Math.PI) },
    { order: 3, amplitude: between(random, 0, 0.2), phase: between(random, 0, 2 * Math.PI) },
    { order: 4, amplitude: between(random, 0, 0.2), phase: between(random, 0, 2 * Math.PI) },
  ];
  const toldMainsHz = random() < 0.5 ? mainsHz : undefined;
  const expect =
    random() < 0.5
      ? (() => {
          const shift = between(random, -0.08, 0.08);
          return { minHz: speedHz * (0.9 + shift), maxHz: speedHz * (1.1 + shift) };
        })()
      : undefined;

  return {
    spec: {
      sampleRateHz,
      durationS: DURATION_S,
      speedHz,
      drift,
      lines,
      other,
      hum: { mainsHz: supplyHz, lines: humLines },
    },
    sampleRateHz,
    symmetry,
    speedHz,
    drift,
    missingFundamental,
    motorHz: other?.speedHz,
    mainsHz,
    supplyHz,
    toldMainsHz,
    expect,
    partLinesHz: lines.map((l) => l.order * speedHz),
    otherLinesHz: [
      ...humLines.map((l) => l.order * supplyHz),
      ...(other ? other.lines.map((l) => l.order * other.speedHz) : []),
    ],
  };
}
