/**
 * The one error the core throws: bad input, named by field, in words a technician
 * understands. The UI shows `message` beside the field it names (`field`).
 */
export class InputError extends Error {
  readonly field: string;
  constructor(field: string, message: string) {
    super(message);
    this.name = 'InputError';
    this.field = field;
  }
}

/**
 * A finite number, or InputError naming the field.
 * @example requireFinite(3, 'speed') // 3
 */
export function requireFinite(value: unknown, field: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new InputError(field, `${field} must be a number (got ${describe(value)}).`);
  }
  return value;
}

/**
 * A computed result, passed through when finite. Inputs that are each valid but far apart in
 * size (a speed of 1e300 rev/s at 1e-300 Hz) can overflow; the core never returns NaN or
 * Infinity, so that throws InputError naming the field to check.
 * @example requireFiniteResult(2 * 30, 'speed') // 60
 */
export function requireFiniteResult(value: number, field: string): number {
  if (!Number.isFinite(value)) {
    throw new InputError(
      field,
      `${field} is too large or too small for a result to be computed: check the units.`,
    );
  }
  return value;
}

/** A finite number > 0. */
export function requirePositive(value: unknown, field: string): number {
  const v = requireFinite(value, field);
  if (v <= 0) throw new InputError(field, `${field} must be greater than zero (got ${v}).`);
  return v;
}

/** A finite number ≥ 0. */
export function requireNonNegative(value: unknown, field: string): number {
  const v = requireFinite(value, field);
  if (v < 0) throw new InputError(field, `${field} cannot be negative (got ${v}).`);
  return v;
}

/** A whole number in [min, max]. */
export function requireWhole(
  value: unknown,
  field: string,
  min: number,
  max = Number.MAX_SAFE_INTEGER,
): number {
  const v = requireFinite(value, field);
  if (!Number.isInteger(v) || v < min || v > max) {
    const upper = max === Number.MAX_SAFE_INTEGER ? '' : ` and at most ${max}`;
    throw new InputError(
      field,
      `${field} must be a whole number, at least ${min}${upper} (got ${v}).`,
    );
  }
  return v;
}

/** A finite number in [min, max]. */
export function requireBetween(value: unknown, field: string, min: number, max: number): number {
  const v = requireFinite(value, field);
  if (v < min || v > max) {
    throw new InputError(field, `${field} must lie between ${min} and ${max} (got ${v}).`);
  }
  return v;
}

function describe(value: unknown): string {
  if (typeof value === 'string') return `the text "${value.slice(0, 20)}"`;
  if (typeof value === 'number') return String(value);
  if (value === null) return 'nothing';
  return typeof value === 'undefined' ? 'nothing' : `a ${typeof value}`;
}
