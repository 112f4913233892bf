import {
  InputError,
  requireFinite,
  requireFiniteResult,
  requireNonNegative,
  requirePositive,
  requireWhole,
} from '../basics/InputError';
import { MAX_SYMMETRY } from '../basics/types';

/**
 * Angle the part turns during one exposure (docs/physics.md §5): 360·|f|·t degrees.
 * Units: rev/s, seconds → degrees. Throws InputError for a non-finite speed or a negative exposure.
 * @example blurDegrees(30, 1 / 1000) // 10.8
 */
export function blurDegrees(speedHz: number, exposureS: number): number {
  const f = requireFinite(speedHz, 'speed');
  const t = requireNonNegative(exposureS, 'exposure');
  return requireFiniteResult(360 * Math.abs(f) * t, 'speed');
}

/**
 * Blur in feature pitches (docs/physics.md §5): n·|f|·t. At 1 pitch or more the features smear
 * into an even disc.
 * @example blurPitches(30, 6, 1 / 180) // 1
 */
export function blurPitches(speedHz: number, symmetry: number, exposureS: number): number {
  const f = requireFinite(speedHz, 'speed');
  const n = requireWhole(symmetry, 'features (blades, spokes)', 1, MAX_SYMMETRY);
  const t = requireNonNegative(exposureS, 'exposure');
  return requireFiniteResult(n * Math.abs(f) * t, 'speed');
}

/**
 * Exposure time from a shutter angle (docs/physics.md §5): t = (θ/360)/s.
 * Source: the cinema rule, e.g. 180° at 24 frames/s = 1/48 s.
 * Throws InputError for an angle outside (0, 360] or a rate ≤ 0.
 * @example exposureFromShutterAngle(180, 24) // 0.020833333333333332 (1/48 s)
 */
export function exposureFromShutterAngle(angleDeg: number, rateHz: number): number {
  const a = requirePositive(angleDeg, 'shutter angle');
  if (a > 360)
    throw new InputError('shutter angle', `shutter angle must be at most 360° (got ${a}).`);
  const s = requirePositive(rateHz, 'frame rate');
  return requireFiniteResult(a / 360 / s, 'frame rate');
}

/**
 * Shutter angle from an exposure time: θ = 360·t·s. Exposures longer than one frame
 * cannot happen and throw.
 * @example shutterAngleFromExposure(1 / 50, 24) // 172.8
 */
export function shutterAngleFromExposure(exposureS: number, rateHz: number): number {
  const t = requirePositive(exposureS, 'exposure');
  const s = requirePositive(rateHz, 'frame rate');
  const angle = 360 * t * s;
  if (angle > 360 * (1 + 1e-9)) {
    throw new InputError(
      'exposure',
      `An exposure of ${t} s is longer than one frame at ${s} frames/s.`,
    );
  }
  return Math.min(angle, 360);
}

/**
 * Arc a point at radius R travels during a strobe flash of duration t (docs/physics.md §5):
 * 2π·R·|f|·t metres.
 * @example flashArcBlurM(50, 0.1, 10e-6) // 0.00031415926535897936 (0.31 mm)
 */
export function flashArcBlurM(speedHz: number, radiusM: number, flashS: number): number {
  const f = requireFinite(speedHz, 'speed');
  const r = requireNonNegative(radiusM, 'radius');
  const t = requireNonNegative(flashS, 'flash duration');
  return requireFiniteResult(2 * Math.PI * r * Math.abs(f) * t, 'speed');
}

/**
 * Angle the part turns while a rolling shutter reads the frame top to bottom
 * (docs/physics.md §5): 360·|f|·T degrees. Straight blades bend; past one pitch they break up.
 * Source for typical T: Ringaby & Forssén, IJCV 2011 (phones 22–33 ms at 30 frames/s).
 * @example rollingSkewDegrees(10, 0.03) // 108
 */
export function rollingSkewDegrees(speedHz: number, readoutS: number): number {
  const f = requireFinite(speedHz, 'speed');
  const T = requireNonNegative(readoutS, 'readout time');
  return requireFiniteResult(360 * Math.abs(f) * T, 'speed');
}
