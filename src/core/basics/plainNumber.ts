/**
 * A number written for a sentence a technician reads: whole numbers from 100 up, three
 * significant figures below, no exponent, no trailing zeros, "-0" written as "0".
 * Non-finite input is a programming error here (the callers check their input first), so it
 * is written as "?" rather than "NaN" or "Infinity", which must never reach a screen.
 * @example plainNumber(1770.4) // '1770'
 * @example plainNumber(29.4999) // '29.5'
 * @example plainNumber(0.041666) // '0.0417'
 */
export function plainNumber(value: number): string {
  if (!Number.isFinite(value)) return '?';
  const magnitude = Math.abs(value);
  const rounded = magnitude >= 100 ? Math.round(value) : Number(value.toPrecision(3));
  if (rounded === 0) return '0';
  // From 1e21 up String() switches to an exponent; BigInt writes every digit.
  if (magnitude >= 1e21) return BigInt(rounded).toString();
  // toPrecision can give an exponent for very small numbers; fixed notation reads better.
  return Math.abs(rounded) < 1e-6 ? rounded.toFixed(9).replace(/0+$/, '') : String(rounded);
}
