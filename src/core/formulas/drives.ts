import {
  InputError,
  requireBetween,
  requireFinite,
  requireFiniteResult,
  requireNonNegative,
  requirePositive,
  requireWhole,
} from '../basics/InputError';

/**
 * Synchronous speed of an induction motor (docs/physics.md §8): 120·fm/P rpm = 2·fm/P rev/s.
 * Source: IEC 60034-1 / NEMA MG 1 synchronous-speed table (4 poles at 60 Hz = 1800 rpm).
 * Throws InputError for mains ≤ 0 or poles not an even whole number ≥ 2.
 * @example synchronousSpeedHz(60, 4) // 30 (1800 rpm)
 */
export function synchronousSpeedHz(mainsHz: number, poles: number): number {
  const fm = requirePositive(mainsHz, 'mains frequency');
  const P = requireWhole(poles, 'poles', 2, 1000);
  if (P % 2 !== 0)
    throw new InputError('poles', `poles come in pairs: give an even number (got ${P}).`);
  return requireFiniteResult((2 * fm) / P, 'mains frequency');
}

/**
 * Running speed of an induction motor with slip σ (0 = synchronous): (1 − σ)·2·fm/P rev/s.
 * @example motorSpeedHz(50, 4, 1 / 30) // 24.166666666666668 (1450 rpm)
 */
export function motorSpeedHz(mainsHz: number, poles: number, slip: number): number {
  const s = requireBetween(slip, 'slip', 0, 1);
  return (1 - s) * synchronousSpeedHz(mainsHz, poles);
}

/**
 * Slip from a measured speed: σ = 1 − f/f_sync.
 * @example slipFromSpeed(29.5, 60, 4) // 0.01666666666666672 (1770 vs 1800 rpm)
 */
export function slipFromSpeed(speedHz: number, mainsHz: number, poles: number): number {
  const f = requireNonNegative(speedHz, 'speed');
  return requireFiniteResult(1 - f / synchronousSpeedHz(mainsHz, poles), 'speed');
}

/**
 * Driven pulley speed of a belt drive without slip (docs/physics.md §8): f2 = f1·D1/D2.
 * Signs carry (an open belt keeps the direction).
 * @example beltSpeedHz(30, 0.1, 0.25) // 12
 */
export function beltSpeedHz(
  driverHz: number,
  driverDiameterM: number,
  drivenDiameterM: number,
): number {
  const f1 = requireFinite(driverHz, 'driver speed');
  const D1 = requirePositive(driverDiameterM, 'driver pulley diameter');
  const D2 = requirePositive(drivenDiameterM, 'driven pulley diameter');
  return requireFiniteResult((f1 * D1) / D2, 'driver speed');
}

/**
 * Driven gear speed (docs/physics.md §8): f2 = −f1·z1/z2 for an external mesh (direction reverses).
 * @example gearSpeedHz(30, 20, 60) // -10
 */
export function gearSpeedHz(driverHz: number, driverTeeth: number, drivenTeeth: number): number {
  const f1 = requireFinite(driverHz, 'driver speed');
  const z1 = requireWhole(driverTeeth, 'driver teeth', 1, 100_000);
  const z2 = requireWhole(drivenTeeth, 'driven teeth', 1, 100_000);
  return requireFiniteResult(-(f1 * z1) / z2, 'driver speed');
}

/**
 * Wheel speed from ground speed (docs/physics.md §8): f = v/(π·D).
 * @example wheelSpeedHz(100 / 3.6, 0.6319) // 13.992627445613348 rev/s (100 km/h on a 205/55R16)
 */
export function wheelSpeedHz(groundSpeedMps: number, diameterM: number): number {
  const v = requireFinite(groundSpeedMps, 'ground speed');
  const D = requirePositive(diameterM, 'wheel diameter');
  return requireFiniteResult(v / (Math.PI * D), 'ground speed');
}

const TYRE =
  /^\s*(\d{2,3}(?:\.\d+)?)\s*\/\s*(\d{2,3}(?:\.\d+)?)\s*(?:Z?R|-|D|B)\s*(\d{2}(?:\.\d)?)\b/i;

/**
 * Overall diameter of a tyre from its ISO metric size `W/AR R d` (ISO 4000-1, ETRTO):
 * D = d·25.4 mm + 2·W·AR/100 mm, in metres. Accepts spaces, lower case, ZR, and a
 * trailing load index and speed symbol ("205/55 R16 91V").
 * Throws InputError for anything else.
 * @example tyreDiameterM('205/55R16') // 0.6319
 */
export function tyreDiameterM(size: string): number {
  if (typeof size !== 'string')
    throw new InputError('tyre size', 'tyre size must be text such as 205/55R16.');
  const m = TYRE.exec(size);
  if (!m) {
    throw new InputError(
      'tyre size',
      `"${size.slice(0, 30)}" is not a tyre size: write width/aspect R rim, e.g. 205/55R16.`,
    );
  }
  const width = Number(m[1]);
  const aspect = Number(m[2]);
  const rim = Number(m[3]);
  if (width < 50 || width > 500 || aspect < 10 || aspect > 120 || rim < 8 || rim > 30) {
    throw new InputError(
      'tyre size',
      `"${size.slice(0, 30)}" is outside real tyre sizes (width 50–500 mm, aspect 10–120, rim 8–30 in).`,
    );
  }
  return Math.round((rim * 25.4 + (2 * width * aspect) / 100) * 1e4) / 1e7;
}
