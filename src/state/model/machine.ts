// A machine: an explicit, named set of parts (with the drives that link them), what every tool
// was given for it, and the header its reports carry. The working copy on screen is the same
// content with no id until it is saved (src/state/work.ts).
import type { Setup } from './index';
import type { ToolInputs } from './tools';

/** What a report's header says, filled once per machine. */
export interface MachineHeader {
  /** The machine's name (blank only while a working copy is unsaved). */
  name: string;
  /** Where the machine stands: plant, line, building. */
  site: string;
  /** Crew notes, line breaks allowed. */
  notes: string;
  /** Who assessed it, for the report. */
  assessedBy: string;
  /** The day of the assessment, YYYY-MM-DD, or '' for none given. */
  assessedOn: string;
}

/** Everything a machine holds apart from its identity and times. */
export interface MachineContent extends MachineHeader {
  /** The parts and the check screen's sampler (strobe, camera, lighting). */
  setup: Setup;
  tools: ToolInputs;
}

/** A saved machine. */
export interface Machine extends MachineContent {
  id: string;
  /** ISO 8601 times. */
  createdAt: string;
  updatedAt: string;
}

/** The header of a machine with nothing filled in but its name. */
export function blankHeader(name = ''): MachineHeader {
  return { name, site: '', notes: '', assessedBy: '', assessedOn: '' };
}

/** The content of a machine (its id and times left out). */
export function contentOf(m: MachineContent): MachineContent {
  const { name, site, notes, assessedBy, assessedOn, setup, tools } = m;
  return structuredClone({ name, site, notes, assessedBy, assessedOn, setup, tools });
}
