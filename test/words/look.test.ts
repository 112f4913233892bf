// How a part looks, in words (src/words/look.ts): one vocabulary in the forms the screens need.
import { describe, expect, it } from 'vitest';
import { apparentMotion } from '../../src/core';
import { canLookWords, imagesWords, lookPhrase, lookWords, viewWords } from '../../src/words/look';

describe('look words', () => {
  it('name every look of the core, with the apparent speed when given', () => {
    // Wikipedia, "Stroboscopic effect": a disc at 60 rev/s under 61 flashes/s turns back at 60 rpm.
    const back = apparentMotion({ speedHz: 60, symmetry: 1 }, 61);
    expect(lookWords(back.look, back.images, back.apparentHz * 60)).toBe('Turns backward (60 rpm)');
    expect(lookWords('true', 1)).toBe('True motion');
    expect(lookWords('still', 1)).toBe('Looks still');
    expect(lookWords('still', 3)).toBe('3 images standing still');
    expect(lookWords('unclear', 1)).toBe('Direction unclear');
    expect(lookWords('forward', 1, 12.25)).toBe('Turns forward, slower (12.25 rpm)');
  });

  it('say the same inside a sentence, in lower case', () => {
    expect(lookPhrase('still', 1)).toBe('looks still');
    expect(lookPhrase('backward', 1)).toBe('turns backward');
  });

  it('say what may be seen after "can", and image counts', () => {
    expect(canLookWords('still', 1)).toBe('look still');
    expect(canLookWords('still', 2)).toBe('show 2 images standing still');
    expect(canLookWords('unclear', 1)).toBe('look as if it turns with no clear direction');
    expect(imagesWords(1)).toBe('1 image');
    expect(imagesWords(4)).toBe('4 images');
  });

  it("say a strobe's predicted view, the group's drift for several images", () => {
    expect(viewWords({ images: 1, look: 'still', apparentRpm: 0 })).toBe(
      'a single image stands still',
    );
    expect(viewWords({ images: 2, look: 'forward', apparentRpm: -3 })).toBe(
      '2 images drift slowly (3 rpm)',
    );
    expect(viewWords({ images: 1, look: 'backward', apparentRpm: -1234 })).toBe(
      'creeps backward at 1234 rpm',
    );
    expect(viewWords({ images: 1, look: 'unclear', apparentRpm: 10 })).toBe(
      'flickers with no clear direction',
    );
  });
});
