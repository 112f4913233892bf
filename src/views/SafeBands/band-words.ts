// Plain words for why a rate band misleads, for the one part on the check screen.
import type { RateBandCause } from '../../core';

/**
 * "looks still; 3 or 4 images; backward or unclear" from the core's causes.
 * @example bandWords([{ part: 0, kind: 'still', images: 1 }]) // "looks still"
 */
export function bandWords(causes: readonly RateBandCause[]): string {
  const words: string[] = [];
  if (causes.some((c) => c.kind === 'crawl')) words.push('turns too slowly to see');
  if (causes.some((c) => c.kind === 'still' && c.images === 1)) words.push('looks still');
  const multi = [
    ...new Set(causes.filter((c) => c.kind === 'still' && c.images > 1).map((c) => c.images)),
  ].sort((a, b) => a - b);
  if (multi.length > 0) words.push(`${joinOr(multi.map(String))} images standing still`);
  if (causes.some((c) => c.kind === 'backward')) words.push('backward or direction unclear');
  return words.join('; ');
}

function joinOr(items: string[]): string {
  if (items.length <= 1) return items.join('');
  return `${items.slice(0, -1).join(', ')} or ${items[items.length - 1]}`;
}
