// Which of the check screen's fields each result is worked out from, by the fields' ids, so a
// result is withdrawn or marked "not current" exactly while a field it depends on is refused
// (src/state/fieldProblems.ts; docs/physics.md §10).

/** What the verdict reads: the part's speed (typed or from a motor) and blades, and the sampler's rate and exposure. */
export const VERDICT_FIELDS: readonly string[] = [
  'speed',
  'motor-poles',
  'motor-slip',
  'features',
  'flash-rate',
  'frame-rate',
  'shutter-angle',
  'exposure-time',
  'flicker-hz',
  'modulation',
];

/** What the lists, the rate map, the preview and the readouts read besides: tolerance, strobe range, readout, PWM duty. */
export const RESULT_FIELDS: readonly string[] = [
  ...VERDICT_FIELDS,
  'tolerance',
  'strobe-min',
  'strobe-max',
  'readout',
  'duty',
];

/** What the creep suggestions read besides: the creep wanted. */
export const CREEP_FIELDS: readonly string[] = [...RESULT_FIELDS, 'creep'];
