// The check screen's results in words (src/words/check.ts), from the state's codes.
import { describe, expect, it } from 'vitest';
import { apparentMotion } from '../../src/core';
import { verdictOf, type Verdict } from '../../src/state/check';
import {
  CHECK_NOTE_WORDS,
  creepMissingWords,
  creepRateWords,
  narrowLocksWords,
  verdictHeadline,
} from '../../src/words/check';

const verdict = (change: Partial<Verdict>): Verdict => ({
  kind: 'true',
  look: 'true',
  trust: 'trust',
  images: 1,
  apparentRpm: 600,
  trueRpm: 600,
  ...change,
});

describe('the verdict in words', () => {
  it('gives every kind its headline', () => {
    expect(verdictHeadline(verdict({ kind: 'steady' }))).toBe('Steady light: true motion');
    expect(verdictHeadline(verdict({ kind: 'true' }))).toBe('True motion');
    expect(verdictHeadline(verdict({ kind: 'still', look: 'still' }))).toBe('Looks still');
    expect(verdictHeadline(verdict({ kind: 'unclear', look: 'unclear' }))).toBe(
      'Direction unclear',
    );
    expect(verdictHeadline(verdict({ kind: 'backward', look: 'backward' }))).toBe(
      'Turning backward',
    );
    expect(verdictHeadline(verdict({ kind: 'creeping', look: 'forward' }))).toBe(
      'Creeping forward',
    );
    expect(verdictHeadline(verdict({ kind: 'forward', look: 'forward' }))).toBe(
      'Forward, slower than real',
    );
  });

  it('names a group of images standing still, or the way its drift goes', () => {
    // docs/physics.md §2: half a turn per flash is two images standing still.
    const part = { speedHz: 60, symmetry: 1, tolerance: 0 };
    expect(verdictHeadline(verdictOf(apparentMotion(part, 120), part))).toBe(
      '2 images, standing still',
    );
    // One mark at 10 rev/s under 30.5 flashes/s: three images drift at 10 − 30.5/3 = −1/6 rev/s
    // (docs/physics.md §3), against the turn.
    const mark = { speedHz: 10, symmetry: 1, tolerance: 0 };
    expect(verdictHeadline(verdictOf(apparentMotion(mark, 30.5), mark))).toBe(
      '3 images, creeping backward',
    );
  });
});

describe('notes and missing suggestions in words', () => {
  it('say each note about the entries', () => {
    expect(CHECK_NOTE_WORDS['rate-outside-range']).toMatch(/outside this strobe's own range/);
    expect(CHECK_NOTE_WORDS['exposure-capped']).toMatch(/caps it at one frame/);
    expect(CHECK_NOTE_WORDS['readout-too-long']).toMatch(/longer than one frame/);
  });

  it('name the setting step of the sampler when narrow locks are left out', () => {
    expect(narrowLocksWords('flash')).toMatch(/less than one flash per minute/);
    expect(narrowLocksWords('frames')).toMatch(/less than 0\.01 frames\/s/);
  });

  it('say why no creep rate is offered, with the creep wanted', () => {
    expect(creepMissingWords('none-in-range', 2)).toBe(
      'No rate in the range shows it as one image creeping forward at 2 rpm.',
    );
    expect(creepMissingWords('not-turning', 2)).toMatch(/not turning/);
  });

  it('call a creep rate what it shows', () => {
    expect(creepRateWords({ rateHz: 29.5, side: 'below', look: 'forward', images: 1 })).toBe(
      'creeping forward',
    );
    expect(creepRateWords({ rateHz: 30, side: 'here', look: 'still', images: 2 })).toBe(
      '2 images standing still',
    );
  });
});
