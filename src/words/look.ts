// How a part looks (the core's Look and image count) in words: written here once, in the few
// forms the screens and plans need (a headline or table cell, a phrase inside a sentence).
import { plainNumber, type Look, type StepPrediction } from '../core';
import { formatNumber } from './format';

/**
 * The look as a headline or table cell, with the apparent speed when given.
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

/**
 * The look inside a sentence: lower case.
 * @example lookPhrase('still', 1) // "looks still"
 */
export function lookPhrase(look: Look, images: number, apparentRpm?: number): string {
  const words = lookWords(look, images, apparentRpm);
  return words.charAt(0).toLowerCase() + words.slice(1);
}

/**
 * An image count in words, for tables and choices.
 * @example imagesWords(2) // "2 images"
 */
export function imagesWords(images: number): string {
  return images === 1 ? '1 image' : `${images} images`;
}

/**
 * What a strobe would show at a rate, as a prediction to compare with what is seen.
 * @example viewWords({ images: 2, look: 'still', apparentRpm: 0 }) // "2 images stand still"
 */
export function viewWords(view: StepPrediction): string {
  const speed = `${plainNumber(Math.abs(view.apparentRpm))} rpm`;
  if (view.look === 'still')
    return view.images === 1 ? 'a single image stands still' : `${view.images} images stand still`;
  if (view.look === 'true')
    return 'moves at its true speed (the rate is above twice the pattern rate)';
  if (view.images > 1) return `${view.images} images drift slowly (${speed})`;
  if (view.look === 'unclear') return 'flickers with no clear direction';
  return `creeps ${view.look} at ${speed}`;
}

/**
 * A misleading look after "can": how a part may look under a light although it turns.
 * @example canLookWords('still', 2) // "show 2 images standing still"
 */
export function canLookWords(look: Look, images: number): string {
  if (look === 'still') return images === 1 ? 'look still' : `show ${images} images standing still`;
  return look === 'backward'
    ? 'look as if it turns backward'
    : 'look as if it turns with no clear direction';
}
