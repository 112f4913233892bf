// The kinds of turning part a machine holds. A kind sets the words a part is described in
// (src/words/partKinds.ts: blades, spokes, teeth, jaws) and which fields its form offers (a
// wheel takes a tyre size and a road speed); it changes no computation.

/** Every kind, in the order the part form lists them. */
export const PART_KINDS = [
  'fan',
  'propeller',
  'wheel',
  'gear',
  'pulley',
  'chuck',
  'coupling',
  'disc',
  'other',
] as const;

/** What sort of part it is: fan or impeller, propeller or rotor, wheel and tyre, … */
export type PartKind = (typeof PART_KINDS)[number];

/** A part's kind, reading an absent one (data older than kinds) as 'other'. */
export function kindOf(part: { kind?: PartKind }): PartKind {
  return part.kind ?? 'other';
}

/** Kinds whose form offers a road speed and a tyre size. */
export function rollsOnTheGround(kind: PartKind): boolean {
  return kind === 'wheel';
}
