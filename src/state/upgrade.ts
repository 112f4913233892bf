// The one step from the first layout of a saved machine (a named set-up with notes) to the
// second (a machine with a site, a report header and every tool's inputs). Shared by the machines
// file (fileFormat.ts, version 1 → 2) and the device's records (store/records.ts, schema 1 → 2),
// so both upgrade old machines the same way. The strict check runs afterwards on the result.
import { readRecord } from './read';

/** A first-layout machine as a second-layout one: blank site and header, tools at their start. */
export function machineV1toV2(x: unknown, path: string): unknown {
  const m = readRecord(x, path, ['id', 'name', 'setup', 'createdAt', 'updatedAt', 'notes']);
  return {
    id: m.id,
    name: m.name,
    site: '',
    notes: m.notes,
    assessedBy: '',
    assessedOn: '',
    setup: m.setup,
    tools: {},
    createdAt: m.createdAt,
    updatedAt: m.updatedAt,
  };
}
