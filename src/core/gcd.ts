/**
 * Greatest common divisor of two whole numbers ≥ 0 (Euclid's algorithm).
 * @example gcd(12, 18) // 6
 */
export function gcd(a: number, b: number): number {
  while (b !== 0) [a, b] = [b, a % b];
  return a;
}
