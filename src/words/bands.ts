// Plain words for why a rate band misleads, for the one part on the check screen.
import type { RateBandCause } from '../core';
import { formatNumber } from './format';

/**
 * "looks still; nearly still; 3 or 4 images standing still; backward or unclear" from the
 * core's causes. `nearlyStillRpm` is the nearly-still threshold the bands were made with.
 * @example bandWords([{ part: 0, kind: 'still', images: 1 }], 6) // "looks still"
 */
export function bandWords(causes: readonly RateBandCause[], nearlyStillRpm: number): string {
  const words: string[] = [];
  const counts = (kind: RateBandCause['kind']) =>
    [...new Set(causes.filter((c) => c.kind === kind && c.images > 1).map((c) => c.images))]
      .sort((a, b) => a - b)
      .map(String);
  if (causes.some((c) => c.kind === 'crawl')) words.push('turns too slowly to see');
  if (causes.some((c) => c.kind === 'still' && c.images === 1)) words.push('looks still');
  if (causes.some((c) => c.kind === 'nearly-still')) {
    words.push(`creeps slower than ${formatNumber(nearlyStillRpm)} rpm: nearly still`);
  }
  const standing = counts('still');
  if (standing.length > 0) words.push(`${joinOr(standing)} images standing still`);
  const drifting = counts('images');
  if (drifting.length > 0) words.push(`${joinOr(drifting)} images drifting`);
  if (causes.some((c) => c.kind === 'backward')) words.push('backward or direction unclear');
  return words.join('; ');
}

function joinOr(items: string[]): string {
  if (items.length <= 1) return items.join('');
  return `${items.slice(0, -1).join(', ')} or ${items[items.length - 1]}`;
}
