import { InputError } from './InputError';

/**
 * Most entries a list-producing function will build. A phone stays responsive well past this,
 * and no person reads more: beyond it the range is too wide for the speed, and saying so
 * beats freezing the page (a judgement, not a published figure).
 */
export const MAX_WORK_ITEMS = 200_000;

/**
 * Throws InputError naming `field` when `count` (an estimate made before the work starts)
 * exceeds MAX_WORK_ITEMS, with advice in words.
 * @example requireWorkable(10, 'rate range', 'lock-in rates', 'raise the lowest rate') // 10
 */
export function requireWorkable(
  count: number,
  field: string,
  what: string,
  advice: string,
  limit = MAX_WORK_ITEMS,
): number {
  if (!(count <= limit)) {
    const shown = Number.isFinite(count)
      ? `about ${Math.round(count).toLocaleString('en')}`
      : 'too many';
    throw new InputError(
      field,
      `The ${field} holds ${shown} ${what}, more than can be listed: ${advice}.`,
    );
  }
  return count;
}
