// The data-logger plan in words: each component's name and fate, the plan's notes (the
// statement that filtering after the converter cannot remove an alias among them) and the
// proposal, from the codes and numbers of the core's loggerPlan.
import { plainNumber, type LoggerComponent, type LoggerNote, type LoggerPlan } from '../core';

/** The statement every plan carries, in our words. */
export const ALIAS_AFTER_CONVERTER_NOTE =
  'Filtering after the converter cannot remove an alias: once a component has folded, it sits at the ' +
  'same frequency as real content and no digital filter can tell them apart. The anti-alias filter must act on ' +
  'the analog signal, before the converter.';

/**
 * What a component is called.
 * @example componentLabel({ source: 'blades', count: 6, … }) // "blade pass (6 blades)"
 */
export function componentLabel(c: Pick<LoggerComponent, 'source' | 'count' | 'label'>): string {
  switch (c.source) {
    case 'shaft':
      return `${c.count}× shaft`;
    case 'blades':
      return `blade pass (${c.count} blades)`;
    case 'teeth':
      return `gear mesh (${c.count} teeth)`;
    case 'tone':
      return c.label ?? `added tone ${c.count}`;
  }
}

/** What happens to a component, in a sentence. */
export function componentWords(c: LoggerComponent, plan: LoggerPlan): string {
  const at = `${componentLabel(c)} at ${plainNumber(c.hz)} Hz`;
  const cut = plainNumber(-c.gainDb);
  if (!c.aliases) {
    return c.pass
      ? `${at} is recorded where it is${c.gainDb < -0.01 ? ` (the filter takes off ${cut} dB)` : ''}.`
      : `${at} is beyond the filter's cutoff: it is cut by ${cut} dB.`;
  }
  const lands = `folds to ${plainNumber(c.foldedHz)} Hz`;
  const range = plainNumber(plan.rangeDb);
  return c.pass
    ? `${at} ${lands}, but the filter buries it (${cut} dB of the ${range} dB needed).`
    : `${at} ${lands} and shows as a false tone: the filter takes off ${cut} dB of the ${range} dB needed.`;
}

/** A note of the plan, in words, with the plan's figures. */
export function loggerNoteWords(note: LoggerNote, plan: LoggerPlan): string {
  const range = plainNumber(plan.rangeDb);
  switch (note) {
    case 'no-filter':
      return `There is no anti-alias filter: anything in the signal above ${plainNumber(plan.nyquistHz)} Hz folds into the record.`;
    case 'false-tones':
      return 'Some components fold onto false frequencies with too little attenuation: they will look like real tones in the record.';
    case 'guard-short':
      return (
        `Content at ${plainNumber(plan.guard.hz)} Hz and above folds onto the components of interest; the filter takes off ` +
        `${plainNumber(plan.guard.attenuationDb)} dB there, less than the ${range} dB the converter resolves.`
      );
    case 'alias-after-converter':
      return ALIAS_AFTER_CONVERTER_NOTE;
    case 'no-proposal':
      return (
        `No Butterworth filter up to order ${plan.maxOrder} buries aliases below the ${range} dB noise floor ` +
        'within the fastest sample rate allowed; use a steeper filter, or accept fewer effective bits.'
      );
  }
}

/** Why the proposal works, in a sentence. */
export function proposalWords(plan: LoggerPlan): string {
  const p = plan.proposal;
  if (!p) return '';
  return (
    `Sample at ${plainNumber(p.sampleHz)} Hz behind a Butterworth low-pass of order ${p.order} with its cutoff at ` +
    `${plainNumber(p.cutoffHz)} Hz: the highest component (${plainNumber(p.highestHz)} Hz) loses ${plainNumber(p.droopDb)} dB, and ` +
    `anything at ${plainNumber(p.sampleHz - p.highestHz)} Hz or above, which would fold onto the components of interest, ` +
    `is cut by at least ${plainNumber(p.aliasRejectionDb)} dB (the converter resolves ${plainNumber(plan.rangeDb)} dB).`
  );
}
