import {
  InputError,
  requireFinite,
  requirePositive,
  requireWhole,
  requireBetween,
} from './InputError';

/** A turning part: signed speed in rev/s, identical equally spaced features, relative speed tolerance. */
export interface Part {
  speedHz: number;
  symmetry: number;
  /** Relative speed tolerance, 0.02 = ±2 %. Default 0. */
  tolerance?: number;
}

/** A range of sampler rates (Hz), min < max. */
export interface Range {
  minHz: number;
  maxHz: number;
}

/** 'flash': a strobe or flickering light watched live; 'frames': a camera. */
export type Sampler = 'flash' | 'frames';

/** What the viewer reads off the sampled part (docs/physics.md §2). */
export type Look = 'true' | 'forward' | 'backward' | 'still' | 'unclear';

/** Largest feature count accepted: far beyond any fan or gear a person inspects by eye. */
export const MAX_SYMMETRY = 100_000;
/** Largest image count looked for: beyond about a dozen superimposed images nobody can count them. */
export const MAX_IMAGES_LIMIT = 64;

/** Validates a part; returns it with the tolerance filled in. Throws InputError. */
export function checkPart(part: unknown, field = 'part'): Required<Part> {
  if (typeof part !== 'object' || part === null) {
    throw new InputError(field, `${field} must give a speed and a number of features.`);
  }
  const p = part as Record<string, unknown>;
  const speedHz = requireFinite(p.speedHz, 'speed');
  const symmetry = requireWhole(p.symmetry, 'features (blades, spokes)', 1, MAX_SYMMETRY);
  const tolerance =
    p.tolerance === undefined ? 0 : requireBetween(p.tolerance, 'speed tolerance', 0, 0.5);
  // Twice the fastest pattern rate (the Nyquist rate of §2) must be a number: a speed of 1e308
  // rev/s would overflow it and every result built on it.
  if (!Number.isFinite(2 * symmetry * Math.abs(speedHz) * (1 + tolerance))) {
    throw new InputError(
      'speed',
      `The speed (${speedHz} rev/s) is too large to work with: check the units (rpm, Hz, rad/s).`,
    );
  }
  return { speedHz, symmetry, tolerance };
}

/** Validates a rate range: both ends finite, > 0, min < max. Throws InputError. */
export function checkRange(range: unknown, field = 'rate range'): Range {
  if (typeof range !== 'object' || range === null) {
    throw new InputError(field, `${field} must give a lowest and a highest rate.`);
  }
  const r = range as Record<string, unknown>;
  const minHz = requirePositive(r.minHz, `lowest ${field.replace(/ range$/, '')}`);
  const maxHz = requirePositive(r.maxHz, `highest ${field.replace(/ range$/, '')}`);
  if (!(minHz < maxHz)) {
    throw new InputError(
      field,
      `The ${field} is empty: the lowest (${minHz}) must be below the highest (${maxHz}).`,
    );
  }
  return { minHz, maxHz };
}

/** Validates the sampler kind. */
export function checkSampler(sampler: unknown): Sampler {
  if (sampler === undefined) return 'flash';
  if (sampler === 'flash' || sampler === 'frames') return sampler;
  throw new InputError(
    'sampler',
    `sampler must be 'flash' (strobe or lighting) or 'frames' (camera).`,
  );
}
