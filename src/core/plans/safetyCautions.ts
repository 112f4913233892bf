import { InputError, requireFinite } from '../basics/InputError';

/** What a result could lead someone to trust, to pick the cautions that apply (physics.md §10). */
export interface CautionContext {
  /** The result can show a turning part looking still, slow or backward. */
  apparentStillness?: boolean;
  /** Flash or flicker rates people will see, Hz (a strobe's rates, a lamp's flicker). */
  flashRatesHz?: number[];
  /** A sweep people will watch: every rate between these (a strobe brought down slowly), Hz. */
  flashSweepHz?: { minHz: number; maxHz: number };
}

/** Flash rates between these (Hz) are the photosensitive-seizure range named in physics.md §10. */
export const SEIZURE_RISK_LOW_HZ = 3;
export const SEIZURE_RISK_HIGH_HZ = 60;

/** A flash rate in the photosensitive-seizure range, ends included (physics.md §10). */
function inSeizureRange(hz: number): boolean {
  return hz >= SEIZURE_RISK_LOW_HZ && hz <= SEIZURE_RISK_HIGH_HZ;
}

/**
 * Which of the two cautions of physics.md §10 a context calls for: the single rule behind
 * safetyCautions and the on-screen caution boxes. A rate that is not a finite number counts
 * as out of range here (safetyCautions refuses it before asking).
 * @example cautionFlags({ apparentStillness: true, flashRatesHz: [100] }) // { safety: true, photosensitivity: false }
 */
export function cautionFlags(context: CautionContext): {
  safety: boolean;
  photosensitivity: boolean;
} {
  checkContext(context);
  const sweep = context.flashSweepHz;
  return {
    safety: context.apparentStillness === true,
    photosensitivity:
      (context.flashRatesHz ?? []).some(inSeizureRange) ||
      (sweep !== undefined &&
        sweep.minHz <= SEIZURE_RISK_HIGH_HZ &&
        sweep.maxHz >= SEIZURE_RISK_LOW_HZ),
  };
}

/**
 * The safety cautions of physics.md §10 that apply to a result, in our own words, most
 * important first. The planning-aid caution always applies.
 * Sources: OSHA 29 CFR 1910.147 and ISO 14118 (lockout, prevention of unexpected start-up);
 * WCAG 2.x success criterion 2.3.1 (three flashes per second).
 * Throws InputError for a context that is not an object, flash rates that are not a list, or
 * a flash rate or sweep end that is not a finite number.
 * @example safetyCautions({ flashRatesHz: [100] }).length // 1 (only the planning-aid caution)
 */
/** physics.md §10, first rule: apparent stillness is never a reason to reach in. */
export const STILLNESS_CAUTION =
  'A part that looks still, slow or backward is still turning at full speed. Never reach in, ' +
  'open a guard or touch it because of how it looks: stop it, isolate and lock out the machine ' +
  'first (local rules, e.g. OSHA 29 CFR 1910.147, ISO 14118).';

/** physics.md §10, second rule: flashing in the photosensitive range. */
export const FLASHING_CAUTION =
  'Flashing between about 3 and 60 times a second can trigger seizures in people with ' +
  'photosensitive epilepsy (WCAG 2.x success criterion 2.3.1 uses three flashes a second). ' +
  'Warn people nearby, and keep such rates short.';

/** physics.md §10, third rule: the tool defers to local codes and licensed practice. */
export const PLANNING_AID_CAUTION =
  "This is a planning aid: local codes, the machine maker's instructions and licensed practice come first.";

export function safetyCautions(context: CautionContext = {}): string[] {
  if (typeof context !== 'object' || context === null) {
    throw new InputError(
      'cautions',
      'The cautions need an object saying what the result shows (it may be empty).',
    );
  }
  const rates = context.flashRatesHz ?? [];
  if (!Array.isArray(rates)) {
    throw new InputError('flash rates', 'The flash rates must be a list of numbers.');
  }
  rates.forEach((r, i) => requireFinite(r, `flash rate ${i + 1}`));
  if (context.flashSweepHz !== undefined) {
    const sweep: unknown = context.flashSweepHz;
    if (typeof sweep !== 'object' || sweep === null) {
      throw new InputError('sweep', 'The sweep must give its lowest and highest rate.');
    }
    requireFinite(context.flashSweepHz.minHz, 'lowest rate of the sweep');
    requireFinite(context.flashSweepHz.maxHz, 'highest rate of the sweep');
  }
  const flags = cautionFlags(context);
  const out: string[] = [];
  if (flags.safety) out.push(STILLNESS_CAUTION);
  if (flags.photosensitivity) out.push(FLASHING_CAUTION);
  out.push(PLANNING_AID_CAUTION);
  return out;
}

/** The shape of a caution context, or InputError (a wrongly typed argument, not a TypeError). */
function checkContext(context: unknown): asserts context is CautionContext {
  if (typeof context !== 'object' || context === null) {
    throw new InputError(
      'cautions',
      'The cautions need an object saying what the result shows (it may be empty).',
    );
  }
  const { flashRatesHz, flashSweepHz } = context as Record<string, unknown>;
  if (flashRatesHz !== undefined && !Array.isArray(flashRatesHz)) {
    throw new InputError('flash rates', 'The flash rates must be a list of numbers.');
  }
  if (flashSweepHz !== undefined && (typeof flashSweepHz !== 'object' || flashSweepHz === null)) {
    throw new InputError('sweep', 'The sweep must give its lowest and highest rate.');
  }
}
