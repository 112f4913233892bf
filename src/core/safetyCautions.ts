import { requireFinite } from './InputError';

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

/**
 * The safety cautions of physics.md §10 that apply to a result, in our own words, most
 * important first. The planning-aid caution always applies.
 * Sources: OSHA 29 CFR 1910.147 and ISO 14118 (lockout, prevention of unexpected start-up);
 * WCAG 2.x success criterion 2.3.1 (three flashes per second).
 * Throws InputError for a flash rate or sweep end that is not a finite number.
 * @example safetyCautions({ flashRatesHz: [100] }).length // 1 (only the planning-aid caution)
 */
export function safetyCautions(context: CautionContext = {}): string[] {
  const out: string[] = [];
  if (context.apparentStillness) {
    out.push(
      'A part that looks still, slow or backward is still turning at full speed. Never reach in, ' +
        'open a guard or touch it because of how it looks: stop it, isolate and lock out the machine ' +
        'first (local rules, e.g. OSHA 29 CFR 1910.147, ISO 14118).',
    );
  }
  const rates = (context.flashRatesHz ?? []).map((r, i) => requireFinite(r, `flash rate ${i + 1}`));
  const sweep = context.flashSweepHz;
  const sweepLow =
    sweep === undefined ? Infinity : requireFinite(sweep.minHz, 'lowest rate of the sweep');
  const sweepHigh =
    sweep === undefined ? -Infinity : requireFinite(sweep.maxHz, 'highest rate of the sweep');
  const inRisk = (r: number) => r >= SEIZURE_RISK_LOW_HZ && r <= SEIZURE_RISK_HIGH_HZ;
  if (
    rates.some(inRisk) ||
    (sweepLow <= SEIZURE_RISK_HIGH_HZ && sweepHigh >= SEIZURE_RISK_LOW_HZ)
  ) {
    out.push(
      'Flashing between about 3 and 60 times a second can trigger seizures in people with ' +
        'photosensitive epilepsy (WCAG 2.x success criterion 2.3.1 uses three flashes a second). ' +
        'Warn people nearby, and keep such rates short.',
    );
  }
  out.push(
    "This is a planning aid: local codes, the machine maker's instructions and licensed practice come first.",
  );
  return out;
}
