// The words each kind of part is described in: what it is called in the kind chooser, and what
// its identical features are (blades, spokes, teeth, jaws), one and many.
import { kindOf, type PartKind } from '../state/model';
import { formatNumber } from './format';

interface KindWords {
  /** In the kind chooser. */
  label: string;
  /** Its identical features, one and many: "blade" / "blades". */
  one: string;
  many: string;
  /** The features field's label. */
  field: string;
  /** The hint under the features field. */
  hint: string;
}

export const KIND_WORDS: Readonly<Record<PartKind, KindWords>> = {
  fan: {
    label: 'Fan or impeller',
    one: 'blade',
    many: 'blades',
    field: 'Blades',
    hint: 'Identical blades or vanes; 1 = a single mark.',
  },
  propeller: {
    label: 'Propeller or rotor',
    one: 'blade',
    many: 'blades',
    field: 'Blades',
    hint: 'Identical blades; 1 = a single mark.',
  },
  wheel: {
    label: 'Wheel and tyre',
    one: 'spoke',
    many: 'spokes',
    field: 'Spokes',
    hint: 'Identical spokes or wheel bolts; 1 = a single mark.',
  },
  gear: {
    label: 'Gear',
    one: 'tooth',
    many: 'teeth',
    field: 'Teeth',
    hint: 'Teeth on the gear; 1 = a single mark.',
  },
  pulley: {
    label: 'Pulley',
    one: 'spoke',
    many: 'spokes',
    field: 'Spokes or marks',
    hint: 'Identical spokes or holes; 1 = a single mark.',
  },
  chuck: {
    label: 'Chuck or spindle',
    one: 'jaw',
    many: 'jaws',
    field: 'Jaws',
    hint: 'Identical jaws or flats; 1 = a single mark.',
  },
  coupling: {
    label: 'Coupling',
    one: 'bolt',
    many: 'bolts',
    field: 'Bolts or jaws',
    hint: 'Identical bolts, pins or jaws; 1 = a single mark.',
  },
  disc: {
    label: 'Disc or mark',
    one: 'mark',
    many: 'marks',
    field: 'Marks',
    hint: 'Identical marks round the disc; 1 = a single mark.',
  },
  other: {
    label: 'Other',
    one: 'mark',
    many: 'blades or marks',
    field: 'Blades or marks',
    hint: 'Identical blades, spokes, jaws or bolts; 1 = one mark.',
  },
};

/**
 * A part's features in its kind's words: "8 blades", "1 mark", "36 teeth".
 * @example featureWords({ kind: 'gear', features: 36 }) // "36 teeth"
 */
export function featureWords(part: { kind?: PartKind; features: number }): string {
  const w = KIND_WORDS[kindOf(part)];
  if (part.features === 1) return kindOf(part) === 'other' ? '1 mark' : `1 ${w.one}`;
  return `${formatNumber(part.features)} ${w.many}`;
}
