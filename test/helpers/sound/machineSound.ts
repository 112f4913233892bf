/**
 * Synthetic machine sound for the tests (and, written as a WAV file, for Chromium's fake
 * microphone): lines at multiples of a turning part's speed, a second machine's lines, mains
 * hum and white or pink noise at a chosen signal-to-noise ratio, all from a seeded generator
 * so that every case reproduces.
 */
import FFT from 'fft.js';

/**
 * A seeded generator of uniform numbers in [0, 1): mulberry32, a public-domain 32-bit
 * generator (common practice for reproducible test data; not for cryptography).
 */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** A standard normal number (Box–Muller transform, G. E. P. Box & M. E. Muller, Ann. Math. Stat. 29, 1958). */
export function gaussian(random: () => number): number {
  const u = Math.max(random(), 1e-300);
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * random());
}

/** One line of a comb: at `order` times the comb's speed, with an amplitude (full scale 1) and a phase (rad). */
export interface Line {
  order: number;
  amplitude: number;
  phase: number;
}

export interface MachineSoundSpec {
  sampleRateHz: number;
  durationS: number;
  /** The part's mean speed, rev/s. */
  speedHz: number;
  /** Relative speed change over the recording: the speed ramps from (1 − drift)·f to (1 + drift)·f. Default 0. */
  drift?: number;
  /** The part's lines (orders of its speed: a blade-pass harmonic k of n blades has order k·n). */
  lines: Line[];
  /** Lines of another machine (a driving motor), at its own steady speed. */
  other?: { speedHz: number; lines: Line[] };
  /** Mains hum: lines at multiples (order) of mainsHz. */
  hum?: { mainsHz: number; lines: Line[] };
  /** Noise, scaled so that the part's own lines stand snrDb above it over the whole band. */
  noise?: { colour: 'white' | 'pink'; snrDb: number };
}

/**
 * The sound as samples (full scale ±1, not clipped here). SNR is the ratio of the part's own
 * signal power (its lines, hum and the other machine excluded) to the noise power over the
 * whole band 0…fs/2.
 */
export function machineSound(spec: MachineSoundSpec, random: () => number): Float32Array {
  const { sampleRateHz: fs, durationS: T, speedHz: f0 } = spec;
  const count = Math.round(fs * T);
  const drift = spec.drift ?? 0;
  const part = new Float64Array(count);
  for (let i = 0; i < count; i++) {
    const t = i / fs;
    // Revolutions turned by t when f(t) = f0·(1 + drift·(2t/T − 1)): the integral of f.
    const turns = f0 * (t + drift * ((t * t) / T - t));
    let v = 0;
    for (const l of spec.lines)
      v += l.amplitude * Math.cos(2 * Math.PI * l.order * turns + l.phase);
    part[i] = v;
  }
  const out = new Float32Array(count);
  let signalPower = 0;
  for (let i = 0; i < count; i++) signalPower += part[i] * part[i];
  signalPower /= count;
  const noise = spec.noise ? noiseOf(spec.noise.colour, count, random) : undefined;
  const noiseGain = noise ? Math.sqrt(signalPower / 10 ** (spec.noise!.snrDb / 10)) : 0;
  for (let i = 0; i < count; i++) {
    const t = i / fs;
    let v = part[i];
    if (spec.other) {
      for (const l of spec.other.lines)
        v += l.amplitude * Math.cos(2 * Math.PI * l.order * spec.other.speedHz * t + l.phase);
    }
    if (spec.hum) {
      for (const l of spec.hum.lines)
        v += l.amplitude * Math.cos(2 * Math.PI * l.order * spec.hum.mainsHz * t + l.phase);
    }
    if (noise) v += noiseGain * noise[i];
    out[i] = v;
  }
  return out;
}

/**
 * Noise of unit power: white (independent normal samples), or pink (power falling as 1/f),
 * made by giving white noise's spectrum the amplitude 1/√f and transforming back.
 */
export function noiseOf(
  colour: 'white' | 'pink',
  count: number,
  random: () => number,
): Float64Array {
  const out = new Float64Array(count);
  if (colour === 'white') {
    for (let i = 0; i < count; i++) out[i] = gaussian(random);
    return normalise(out);
  }
  const size = 2 ** Math.ceil(Math.log2(count));
  const fft = new FFT(size);
  const spectrum = fft.createComplexArray() as number[];
  for (let k = 1; k < size / 2; k++) {
    const a = 1 / Math.sqrt(k);
    const re = gaussian(random) * a;
    const im = gaussian(random) * a;
    spectrum[2 * k] = re;
    spectrum[2 * k + 1] = im;
    spectrum[2 * (size - k)] = re;
    spectrum[2 * (size - k) + 1] = -im;
  }
  const time = fft.createComplexArray() as number[];
  fft.inverseTransform(time, spectrum);
  for (let i = 0; i < count; i++) out[i] = time[2 * i];
  return normalise(out);
}

function normalise(x: Float64Array): Float64Array {
  let power = 0;
  for (const v of x) power += v * v;
  const g = 1 / Math.sqrt(power / x.length);
  for (let i = 0; i < x.length; i++) x[i] *= g;
  return x;
}

/**
 * The sound of a 6-blade fan at 1750 rpm on a 50 Hz site: blade pass at 175 Hz with two
 * harmonics, a faint shaft line, 100 Hz hum, pink noise 10 dB down, the speed drifting 0.1 %
 * over the recording (`drift`; 0 for a steady fan). Invented test data (the fan of the issue's
 * browser check), peak 0.5 of full scale.
 */
export function fanAt1750Rpm(
  sampleRateHz = 48_000,
  durationS = 6,
  seed = 1750,
  drift = 0.001,
): Float32Array {
  const random = seededRandom(seed);
  const samples = machineSound(
    {
      sampleRateHz,
      durationS,
      speedHz: 1750 / 60,
      drift,
      lines: [
        { order: 6, amplitude: 1, phase: 0.4 },
        { order: 12, amplitude: 0.45, phase: 2.1 },
        { order: 18, amplitude: 0.2, phase: 4.0 },
        { order: 1, amplitude: 0.08, phase: 1.3 },
      ],
      hum: { mainsHz: 50, lines: [{ order: 2, amplitude: 0.6, phase: 0.9 }] },
      noise: { colour: 'pink', snrDb: 10 },
    },
    random,
  );
  let peak = 0;
  for (const v of samples) peak = Math.max(peak, Math.abs(v));
  for (let i = 0; i < samples.length; i++) samples[i] *= 0.5 / peak;
  return samples;
}
