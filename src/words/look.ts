// How a part looks under a light or in a video, in the words the screens use.
import type { Look } from '../core';
import { formatNumber } from './format';

/**
 * @example lookWords('still', 2) // "2 images standing still"
 * @example lookWords('backward', 1, -12.5) // "Turns backward (12.5 rpm)"
 */
export function lookWords(look: Look, images: number, apparentRpm?: number): string {
  const speed = apparentRpm === undefined ? '' : ` (${formatNumber(Math.abs(apparentRpm))} rpm)`;
  switch (look) {
    case 'true':
      return 'True motion';
    case 'still':
      return images > 1 ? `${images} images standing still` : 'Looks still';
    case 'unclear':
      return 'Direction unclear';
    case 'backward':
      return `Turns backward${speed}`;
    case 'forward':
      return `Turns forward, slower${speed}`;
  }
}
