// Applying a speed a tool worked out (a wheel's road speed, a belt or gear from another part, a
// speed found with the strobe or by sound): the one pure step behind applyDerivedSpeed
// (src/state/derivedSpeed.ts). The part takes the speed as its own, says where it came from,
// and stops following a motor or a drive, so nothing changes it again behind the user's back.
import type { PartSpec, Setup } from './index';
import type { SpeedOrigin } from './origin';

/** A speed a tool worked out, ready to apply to a part. */
export interface DerivedSpeed {
  /** Signed speed, rpm (+ = the viewer's reference direction). */
  speedRpm: number;
  /** ± percent the derivation carries; absent keeps the part's own tolerance. */
  tolerancePercent?: number;
  /** Features the derivation counted (the speed finder's); absent keeps the part's. */
  features?: number;
  origin: SpeedOrigin;
}

/**
 * The set-up with part `index` turning at the derived speed, its origin recorded. A motor or a
 * drive it followed is dropped (the applied speed is now its own); a wheel's road speed and tyre
 * stay with it, to apply again later. Returns null when `index` is not a part.
 * @example withDerivedSpeed(defaultSetup, 0, { speedRpm: 1800, origin })?.parts[0].speedRpm // 1800
 */
export function withDerivedSpeed(s: Setup, index: number, derived: DerivedSpeed): Setup | null {
  const before = s.parts[index];
  if (!before) return null;
  const { motor: _motor, drive: _drive, origin: _origin, ...rest } = before;
  const part: PartSpec = {
    ...rest,
    speedRpm: derived.speedRpm,
    tolerancePercent: derived.tolerancePercent ?? before.tolerancePercent,
    features: derived.features ?? before.features,
    origin: structuredClone(derived.origin),
  };
  return { ...s, parts: s.parts.map((p, i) => (i === index ? part : p)) };
}

/** A part whose speed is typed again: any recorded origin no longer holds. */
export function withoutOrigin(part: PartSpec): PartSpec {
  const { origin: _origin, ...rest } = part;
  return rest;
}
