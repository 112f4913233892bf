import { describe, expect, it } from 'vitest';
import {
  CAUTION_WORDS,
  FLASHING_CAUTION,
  PLANNING_AID_CAUTION,
  safetyCautions,
  STILLNESS_CAUTION,
} from '../../src/words/cautions';

describe('the cautions in words (docs/physics.md §10)', () => {
  it('name lockout and its rules in the stillness caution', () => {
    // OSHA 29 CFR 1910.147 and ISO 14118 are named in the text.
    expect(STILLNESS_CAUTION).toMatch(/still turning/);
    expect(STILLNESS_CAUTION).toMatch(/lock out/);
    expect(STILLNESS_CAUTION).toMatch(/OSHA 29 CFR 1910\.147/);
    expect(STILLNESS_CAUTION).toMatch(/ISO 14118/);
  });

  it('name the seizure risk and its source in the flashing caution', () => {
    // WCAG 2.x success criterion 2.3.1 uses three flashes a second.
    expect(FLASHING_CAUTION).toMatch(/photosensitive epilepsy/);
    expect(FLASHING_CAUTION).toMatch(/WCAG 2\.x success criterion 2\.3\.1/);
  });

  it('defer to local codes in the planning-aid caution', () => {
    expect(PLANNING_AID_CAUTION).toMatch(/planning aid/);
    expect(PLANNING_AID_CAUTION).toMatch(/local codes/);
  });

  it('give each code its one wording, in the order of the core', () => {
    expect(safetyCautions()).toEqual([PLANNING_AID_CAUTION]);
    expect(safetyCautions({ apparentStillness: true, flashRatesHz: [10] })).toEqual([
      CAUTION_WORDS.stillness,
      CAUTION_WORDS.flashing,
      CAUTION_WORDS['planning-aid'],
    ]);
  });
});
