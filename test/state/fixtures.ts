// Shared test data: a valid set-up and machine (invented values for tests only, in the style of
// the first-run example), and a way to bend one field at a time.

import {
  defaultSetup,
  defaultToolInputs,
  type Machine,
  type MachineContent,
  type Setup,
} from '../../src/state/model';

/** A valid set-up with two parts, one of them driven by a motor. */
export function sampleSetup(): Setup {
  const s = structuredClone(defaultSetup);
  s.parts = [
    {
      name: 'Motor',
      speedRpm: 1450,
      features: 1,
      tolerancePercent: 1,
      motor: { mainsHz: 50, poles: 4, slipPercent: 3.3 },
    },
    { name: 'Blower wheel', speedRpm: -980.5, features: 12, tolerancePercent: 2 },
  ];
  s.activePart = 1;
  return s;
}

/** A valid saved machine; `overrides` replace whole top-level fields. */
export function sampleMachine(overrides: Partial<Machine> = {}): Machine {
  return {
    id: 'machine-1',
    name: 'Blower, test bay',
    site: '',
    assessedBy: '',
    assessedOn: '',
    setup: sampleSetup(),
    tools: defaultToolInputs(),
    createdAt: '2025-03-12T08:30:00.000Z',
    updatedAt: '2025-03-13T09:00:00.000Z',
    notes: 'Line one\nLine two',
    ...overrides,
  };
}

/** A plain JSON copy of `value` that `change` may bend freely (typed loosely on purpose). */
export function bent<T>(value: T, change: (copy: any) => void): unknown {
  const copy: unknown = JSON.parse(JSON.stringify(value));
  change(copy);
  return copy;
}

/** True while nothing has been added to Object.prototype (the mark of a polluted prototype). */
export function prototypeIsClean(): boolean {
  const probe: Record<string, unknown> = {};
  return (
    Object.getOwnPropertyNames(Object.prototype).every((k) => BASELINE.has(k)) &&
    probe.polluted === undefined &&
    probe.isAdmin === undefined
  );
}
const BASELINE = new Set(Object.getOwnPropertyNames(Object.prototype));

/** The content of sampleMachine (what the working copy holds), for saving as a new machine. */
export function sampleContent(overrides: Partial<MachineContent> = {}): MachineContent {
  const { id: _id, createdAt: _c, updatedAt: _u, ...content } = sampleMachine();
  return { ...content, ...overrides };
}
