// The cautions of docs/physics.md §10 in our own words: the one wording every screen, preview
// and printed report shows. Which apply is the core's rule (cautionCodes, cautionFlags).
import { cautionCodes, type CautionCode, type CautionContext } from '../core';

/** Apparent stillness is never a reason to reach in. */
export const STILLNESS_CAUTION =
  'A part that looks still, slow or backward is still turning at full speed. Never reach in, ' +
  'open a guard or touch it because of how it looks: stop it, isolate and lock out the machine ' +
  'first (local rules, e.g. OSHA 29 CFR 1910.147, ISO 14118).';

/** Flashing in the photosensitive-seizure range. */
export const FLASHING_CAUTION =
  'Flashing between about 3 and 60 times a second can trigger seizures in people with ' +
  'photosensitive epilepsy (WCAG 2.x success criterion 2.3.1 uses three flashes a second). ' +
  'Warn people nearby, and keep such rates short.';

/** The tool defers to local codes and licensed practice. */
export const PLANNING_AID_CAUTION =
  "This is a planning aid: local codes, the machine maker's instructions and licensed practice come first.";

/** Listening to a machine (docs/physics.md §11.10): where to stand, the ears, and what the figure is worth. */
export const SOUND_CAUTION =
  'Stay outside guards and barriers while recording: hold the phone out from where you stand, never ' +
  'reach in. Wear hearing protection where it is required. A speed from sound is a planning aid, ' +
  'like every figure here: a part that looks still under a strobe set from it is still turning.';

export const CAUTION_WORDS: Readonly<Record<CautionCode, string>> = {
  stillness: STILLNESS_CAUTION,
  flashing: FLASHING_CAUTION,
  'planning-aid': PLANNING_AID_CAUTION,
};

/**
 * The cautions that apply to a result, in words, most important first (the core's cautionCodes).
 * Throws the core's InputError as cautionCodes does.
 * @example safetyCautions({ flashRatesHz: [100] }) // [PLANNING_AID_CAUTION]
 */
export function safetyCautions(context: CautionContext = {}): string[] {
  return cautionCodes(context).map((code) => CAUTION_WORDS[code]);
}
