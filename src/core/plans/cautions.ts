import { InputError, requireFinite } from '../basics/InputError';

/** What a result could lead someone to trust, to pick the cautions that apply (docs/physics.md §10). */
export interface CautionContext {
  /** The result can show a turning part looking still, slow or backward. */
  apparentStillness?: boolean;
  /** Flash or flicker rates people will see, Hz (a strobe's rates, a lamp's flicker). */
  flashRatesHz?: number[];
  /** A sweep people will watch: every rate between these (a strobe brought down slowly), Hz. */
  flashSweepHz?: { minHz: number; maxHz: number };
}

/**
 * The cautions of docs/physics.md §10, by code, most important first (src/words/cautions.ts
 * says each in words): 'stillness', apparent stillness is never a reason to reach in;
 * 'flashing', flashing in the photosensitive-seizure range; 'planning-aid', local codes and
 * licensed practice come first.
 */
export type CautionCode = 'stillness' | 'flashing' | 'planning-aid';

/** Flash rates between these (Hz) are the photosensitive-seizure range named in docs/physics.md §10. */
export const SEIZURE_RISK_LOW_HZ = 3;
export const SEIZURE_RISK_HIGH_HZ = 60;

/** A flash rate in the photosensitive-seizure range, ends included (docs/physics.md §10). */
function inSeizureRange(hz: number): boolean {
  return hz >= SEIZURE_RISK_LOW_HZ && hz <= SEIZURE_RISK_HIGH_HZ;
}

/**
 * Which of the two cautions of docs/physics.md §10 a context calls for: the single rule behind
 * cautionCodes and the on-screen caution boxes. A rate that is not a finite number counts
 * as out of range here (cautionCodes refuses it before asking).
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
 * The cautions of docs/physics.md §10 that apply to a result, most important first. The
 * planning-aid caution always applies.
 * Sources: OSHA 29 CFR 1910.147 and ISO 14118 (lockout, prevention of unexpected start-up);
 * WCAG 2.x success criterion 2.3.1 (three flashes per second).
 * Throws InputError for a context that is not an object, flash rates that are not a list, or
 * a flash rate or sweep end that is not a finite number.
 * @example cautionCodes({ flashRatesHz: [100] }) // ['planning-aid']
 */
export function cautionCodes(context: CautionContext = {}): CautionCode[] {
  checkContext(context);
  (context.flashRatesHz ?? []).forEach((r, i) => requireFinite(r, `flash rate ${i + 1}`));
  if (context.flashSweepHz !== undefined) {
    requireFinite(context.flashSweepHz.minHz, 'lowest rate of the sweep');
    requireFinite(context.flashSweepHz.maxHz, 'highest rate of the sweep');
  }
  const flags = cautionFlags(context);
  const out: CautionCode[] = [];
  if (flags.safety) out.push('stillness');
  if (flags.photosensitivity) out.push('flashing');
  out.push('planning-aid');
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
