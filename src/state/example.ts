// The example machine a first visit finds in the list, so the saved-machines screen is never
// empty and shows what a useful entry looks like.
//
// Invented: the plant (Brackenfold Feed Mill), the line, the machine and the crew note are
// fictional, made up for this example. The numbers are chosen to be plausible for such a drive.

import { defaultToolInputs, type Machine, type Setup } from './model';

/** Mains frequency of the invented plant, Hz (a 50 Hz country). */
const MAINS_HZ = 50;
/** A 4-pole induction motor: synchronous speed 120·50/4 = 1500 rpm (IEC 60034-1 table). */
const MOTOR_POLES = 4;
/**
 * Full-load slip chosen so the motor runs at the typical 1450 rpm listed for a 4-pole 50 Hz
 * motor (Engineering ToolBox full-load speed table): 1 − 1450/1500 = 3.33 %.
 */
const MOTOR_SLIP_PERCENT = (1 - 1450 / 1500) * 100;
const MOTOR_RPM = ((120 * MAINS_HZ) / MOTOR_POLES) * (1 - MOTOR_SLIP_PERCENT / 100);

/** Invented belt drive: 140 mm motor pulley, 200 mm fan pulley; fan speed = motor · 140/200. */
const FAN_RPM = (MOTOR_RPM * 140) / 200;

/** The example's set-up: the cooler fan of pellet line 2, checked with a strobe. */
export const exampleSetup: Setup = {
  parts: [
    {
      name: 'Drive motor shaft (key mark)',
      kind: 'disc',
      speedRpm: MOTOR_RPM,
      features: 1,
      tolerancePercent: 1,
      motor: { mainsHz: MAINS_HZ, poles: MOTOR_POLES, slipPercent: MOTOR_SLIP_PERCENT },
    },
    // A V-belt creeps and slips a little under load: ±2 % is common practice for a belt drive.
    {
      name: 'Cooler fan (8 blades)',
      kind: 'fan',
      speedRpm: FAN_RPM,
      features: 8,
      tolerancePercent: 2,
    },
  ],
  activePart: 1,
  samplerKind: 'strobe',
  camera: { frameRate: 25, exposure: { mode: 'angle', angleDeg: 180 }, readoutMs: 25 },
  // Flashing once per fan turn freezes one blade in place; the range is the invented strobe's.
  strobe: { rateFpm: Math.round(FAN_RPM), minFpm: 30, maxFpm: 12000 },
  lighting: { mainsHz: MAINS_HZ, flicker: 'double', customHz: 300, modulationPercent: 30 },
  creepRpm: 2,
};

/** Where the invented example machine stands. */
export const EXAMPLE_SITE = 'Brackenfold Feed Mill, pellet line 2';

/** Name of the example machine in the list. */
export const EXAMPLE_MACHINE_NAME = 'Example: cooler fan, pellet line 2';

const EXAMPLE_NOTES =
  'Example entry (invented): Brackenfold Feed Mill, pellet line 2. A 4-pole motor drives the ' +
  'cooler fan through a V-belt. Crew B note: belt re-tensioned at the last stop; check the fan ' +
  'blades for cracks at each weekly inspection. A blade that looks still under the strobe is ' +
  'still turning: isolate and lock out the cooler before opening the guard.';

/**
 * The first-run example machine, with the given id and creation time (ISO 8601).
 * Returns a fresh object each time so callers may keep it.
 */
export function createExampleMachine(id: string, nowIso: string): Machine {
  return {
    id,
    name: EXAMPLE_MACHINE_NAME,
    site: EXAMPLE_SITE,
    notes: EXAMPLE_NOTES,
    assessedBy: '',
    assessedOn: '',
    setup: structuredClone(exampleSetup),
    tools: defaultToolInputs(),
    createdAt: nowIso,
    updatedAt: nowIso,
  };
}
