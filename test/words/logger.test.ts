// The data-logger plan in words: each sentence carries the plan's own figures.
import { describe, expect, it } from 'vitest';
import { loggerPlan } from '../../src/core';
import {
  ALIAS_AFTER_CONVERTER_NOTE,
  componentLabel,
  componentWords,
  loggerNoteWords,
  proposalWords,
} from '../../src/words/logger';

const none = { kind: 'none' as const };

describe('the logger plan in words', () => {
  it('names each component by where it comes from', () => {
    const plan = loggerPlan({
      tones: {
        shaftHz: 25,
        harmonics: 2,
        blades: [7],
        gearTeeth: [23],
        extraTones: [{ hz: 900 }, { label: 'bearing tone', hz: 750 }],
      },
      sampleHz: 5000,
      filter: none,
      bits: 12,
    });
    expect(plan.components.map(componentLabel)).toEqual([
      '1× shaft',
      '2× shaft',
      'blade pass (7 blades)',
      'gear mesh (23 teeth)',
      'added tone 1',
      'bearing tone',
    ]);
  });

  it('says a 20 Hz shaft sampled 18 times a second folds to 2 Hz and shows as a false tone', () => {
    // Common practice (docs/physics.md §13): 20 Hz sampled at 18 samples/s looks like 2 Hz.
    const plan = loggerPlan({ tones: { shaftHz: 20 }, sampleHz: 18, filter: none, bits: 12 });
    expect(componentWords(plan.components[0], plan)).toBe(
      '1× shaft at 20 Hz folds to 2 Hz and shows as a false tone: the filter takes off 0 dB of the 74 dB needed.',
    );
  });

  it('says a component just beyond a Butterworth cutoff is cut', () => {
    const filter = { kind: 'butterworth' as const, order: 4, cutoffHz: 100 };
    const plan = loggerPlan({ tones: { shaftHz: 101 }, sampleHz: 1000, filter, bits: 12 });
    expect(componentWords(plan.components[0], plan)).toMatch(/beyond the filter's cutoff/);
  });

  it('states that filtering after the converter cannot remove an alias, and flags a missing filter', () => {
    const plan = loggerPlan({
      tones: { shaftHz: 25, harmonics: 10 },
      sampleHz: 1000,
      filter: none,
      bits: 16,
    });
    const words = plan.notes.map((n) => loggerNoteWords(n, plan));
    expect(words).toContain(ALIAS_AFTER_CONVERTER_NOTE);
    expect(ALIAS_AFTER_CONVERTER_NOTE).toMatch(/after the converter cannot remove an alias/);
    expect(words.join(' ')).toMatch(
      /There is no anti-alias filter: anything in the signal above 500 Hz folds/,
    );
    expect(words.join(' ')).toMatch(/Content at 750 Hz and above folds onto the components/);
  });

  it('says why the proposal works, with its figures', () => {
    const plan = loggerPlan({
      tones: { shaftHz: 25, harmonics: 10 },
      sampleHz: 1000,
      filter: none,
      bits: 16,
    });
    expect(proposalWords(plan)).toMatch(
      /^Sample at 1600 Hz behind a Butterworth low-pass of order 8 with its cutoff at 299 Hz: the highest component \(250 Hz\) loses 0\.238 dB/,
    );
  });

  it('says when no filter within the limits works', () => {
    const plan = loggerPlan(
      { tones: { shaftHz: 25, harmonics: 10 }, sampleHz: 1000, filter: none, bits: 16 },
      { maxSampleHz: 1000 },
    );
    expect(proposalWords(plan)).toBe('');
    expect(loggerNoteWords('no-proposal', plan)).toMatch(/No Butterworth filter up to order 8/);
  });
});
