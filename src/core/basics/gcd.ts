import { InputError } from './InputError';

/**
 * Greatest common divisor of two whole numbers ≥ 0 (Euclid's algorithm).
 * Throws InputError for anything else (NaN or Infinity would otherwise loop for ever).
 * @example gcd(12, 18) // 6
 */
export function gcd(a: number, b: number): number {
  if (!(Number.isInteger(a) && Number.isInteger(b) && a >= 0 && b >= 0)) {
    throw new InputError(
      'whole numbers',
      `whole numbers of at least 0 are needed (got ${shown(a)} and ${shown(b)}).`,
    );
  }
  // A temporary, not a destructuring swap: this runs thousands of times per lock list.
  while (b !== 0) {
    const r = a % b;
    a = b;
    b = r;
  }
  return a;
}

/** A value for a message: never throws, whatever it is given. */
function shown(value: unknown): string {
  return typeof value === 'number'
    ? String(value)
    : `a ${value === null ? 'nothing' : typeof value}`;
}
