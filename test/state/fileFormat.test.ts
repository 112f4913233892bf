import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  exportMachinesJson,
  FILE_FORMAT_NAME,
  FILE_FORMAT_VERSION,
  MAX_FILE_BYTES,
  MAX_MACHINES,
  migrations,
  OLDEST_READABLE_VERSION,
  parseMachinesFile,
  utf8Bytes,
} from '../../src/state/fileFormat';
import { defaultToolInputs, type Machine } from '../../src/state/model';
import { DataError } from '../../src/state/validate';
import { prototypeIsClean, sampleMachine } from './fixtures';

const EXPORTED_AT = new Date('2025-04-01T10:00:00.000Z');

function fileOf(machines: unknown[], head: Record<string, unknown> = {}): string {
  return JSON.stringify({
    format: FILE_FORMAT_NAME,
    version: FILE_FORMAT_VERSION,
    exportedAt: EXPORTED_AT.toISOString(),
    machines,
    ...head,
  });
}

function errorOf(text: string): string {
  const r = parseMachinesFile(text);
  if (r.ok) throw new Error('expected the file to be refused');
  return r.error;
}

describe('exportMachinesJson', () => {
  it('writes the documented header and the machines, pretty-printed', () => {
    const text = exportMachinesJson([sampleMachine()], EXPORTED_AT);
    const parsed = JSON.parse(text);
    expect(Object.keys(parsed)).toEqual(['format', 'version', 'exportedAt', 'machines']);
    expect(parsed.format).toBe('trueturn-machines');
    expect(parsed.version).toBe(2);
    expect(parsed.exportedAt).toBe('2025-04-01T10:00:00.000Z');
    expect(parsed.machines).toEqual([sampleMachine()]);
    expect(text).toContain('\n  "format": "trueturn-machines",\n');
    expect(text.endsWith('\n')).toBe(true);
  });

  it('leaves out anything that is not part of a machine', () => {
    const m = { ...sampleMachine(), secret: 'x' } as Machine;
    expect(() => exportMachinesJson([m])).toThrow(DataError);
  });

  it('refuses more machines than a file may hold', () => {
    const many = Array.from({ length: MAX_MACHINES + 1 }, (_, i) => sampleMachine({ id: `m${i}` }));
    expect(() => exportMachinesJson(many)).toThrow(`A file holds at most ${MAX_MACHINES} machines`);
  });

  it('drops the indentation when that keeps a large export readable again', () => {
    // As many machines as fit compact (measured on one), which do not fit indented.
    const long = 'ü'.repeat(1000); // 2000 UTF-8 bytes of notes per machine
    const one = utf8Bytes(JSON.stringify(sampleMachine({ id: 'm000', notes: long }))) + 1;
    const count = Math.floor((MAX_FILE_BYTES - 200) / one);
    const many = Array.from({ length: count }, (_, i) =>
      sampleMachine({ id: `m${String(i).padStart(3, '0')}`, notes: long }),
    );
    expect(utf8Bytes(JSON.stringify({ machines: many }, null, 2))).toBeGreaterThan(MAX_FILE_BYTES);
    const text = exportMachinesJson(many, EXPORTED_AT);
    expect(utf8Bytes(text)).toBeLessThanOrEqual(MAX_FILE_BYTES);
    expect(text.startsWith('{"format":"trueturn-machines"')).toBe(true);
    const back = parseMachinesFile(text);
    expect(back.ok && back.machines.length).toBe(count);
  });

  it('refuses an export that could not be imported again', () => {
    const long = '€'.repeat(2000); // 6000 UTF-8 bytes of notes per machine
    const many = Array.from({ length: 200 }, (_, i) => sampleMachine({ id: `m${i}`, notes: long }));
    expect(() => exportMachinesJson(many)).toThrow('too large to import again');
  });
});

describe('parseMachinesFile', () => {
  it('reads back what exportMachinesJson wrote', () => {
    const machines = [sampleMachine(), sampleMachine({ id: 'machine-2', name: 'Second' })];
    expect(parseMachinesFile(exportMachinesJson(machines))).toEqual({ ok: true, machines });
  });

  it('reads a file with no machines', () => {
    expect(parseMachinesFile(fileOf([]))).toEqual({ ok: true, machines: [] });
  });

  it('ignores a byte-order mark at the start', () => {
    expect(parseMachinesFile('\uFEFF' + fileOf([sampleMachine()])).ok).toBe(true);
  });

  it('refuses text that is not JSON', () => {
    expect(errorOf('name,speed\nfan,1450')).toBe(
      'This is not a Trueturn machines file: it is not valid JSON text.',
    );
    expect(errorOf(fileOf([sampleMachine()]).slice(0, -10))).toMatch(/not valid JSON/);
  });

  it('refuses JSON that is not a machines file', () => {
    expect(errorOf('[1,2,3]')).toBe(
      'This is not a Trueturn machines file: it holds no "format" field.',
    );
    expect(errorOf('null')).toMatch(/it holds no "format" field/);
    expect(errorOf(fileOf([], { format: 'other-app' }))).toBe(
      'This is not a Trueturn machines file: "format" should be "trueturn-machines" (got the text "other-app").',
    );
  });

  it('refuses a newer version and says which version this app reads', () => {
    expect(errorOf(fileOf([], { version: 3 }))).toBe(
      'This file is machines-file version 3; this app reads versions 0 to 2. It was made by a newer Trueturn: update this app, then import it again.',
    );
  });

  it('refuses a version it has no upgrade for, and versions that are not whole numbers', () => {
    expect(errorOf(fileOf([], { version: -1 }))).toBe(
      'This file is machines-file version -1; this app reads versions 0 to 2.',
    );
    expect(errorOf(fileOf([], { version: '1' }))).toBe(
      `The file's "version" must be a whole number (got the text "1").`,
    );
    expect(errorOf(fileOf([], { version: 1.5 }))).toMatch(/must be a whole number \(got 1\.5\)/);
  });

  it('refuses a missing or extra field in the header', () => {
    const noDate = JSON.stringify({ format: FILE_FORMAT_NAME, version: 1, machines: [] });
    expect(errorOf(noDate)).toBe('file › exportedAt is missing.');
    expect(errorOf(fileOf([], { app: 'x' }))).toBe(
      'file has a field this app does not know: "app".',
    );
    expect(errorOf(fileOf([], { exportedAt: 'yesterday' }))).toMatch(
      /^exportedAt must be a date and time/,
    );
    expect(errorOf(fileOf([], { machines: {} }))).toBe(
      'machines must be a list […] (got a group of fields).',
    );
  });

  it('names the machine, the part and the field of a wrong value', () => {
    const bad = sampleMachine({ id: 'm3' });
    bad.setup.parts[0].features = 2.5;
    const text = fileOf([sampleMachine({ id: 'm1' }), sampleMachine({ id: 'm2' }), bad]);
    expect(errorOf(text)).toBe(
      'machine 3 › parts › 1 › features must be a whole number from 1 to 100000 (got 2.5).',
    );
  });

  it('refuses a machine with a missing field, an extra field or a wrong type', () => {
    const missing = JSON.parse(JSON.stringify(sampleMachine()));
    delete missing.updatedAt;
    expect(errorOf(fileOf([missing]))).toBe('machine 1 › updatedAt is missing.');
    expect(errorOf(fileOf([{ ...sampleMachine(), colour: 'red' }]))).toBe(
      'machine 1 has a field this app does not know: "colour".',
    );
    expect(errorOf(fileOf([{ ...sampleMachine(), name: 12 }]))).toBe(
      'machine 1 › name must be text (got 12).',
    );
  });

  it('refuses two machines with the same id', () => {
    expect(errorOf(fileOf([sampleMachine(), sampleMachine({ name: 'Other' })]))).toBe(
      'machine 2 has the same id as an earlier machine in the file.',
    );
  });

  it(`refuses more than ${MAX_MACHINES} machines`, () => {
    const many = Array.from({ length: MAX_MACHINES + 1 }, (_, i) => sampleMachine({ id: `m${i}` }));
    const text = fileOf(many);
    expect(utf8Bytes(text)).toBeLessThan(MAX_FILE_BYTES); // so it is the count that is refused
    expect(errorOf(text)).toBe('machines must hold 0 to 500 machines (it holds 501).');
  });

  it('refuses a file over 1 MB before reading it, counting UTF-8 bytes', () => {
    expect(errorOf(' '.repeat(MAX_FILE_BYTES + 1))).toBe(
      'This file is larger than 1 MB; a Trueturn machines file is never that big.',
    );
    // 400 000 characters of three bytes each: short as a string, too big as a file.
    const padded = fileOf([sampleMachine({ notes: '' })]).replace(
      '"notes":""',
      `"notes":"${'€'.repeat(400_000)}"`,
    );
    expect(padded.length).toBeLessThan(MAX_FILE_BYTES);
    expect(errorOf(padded)).toMatch(/^This file is larger than 1 MB/);
  });

  it('refuses __proto__, constructor and prototype keys anywhere and pollutes nothing', () => {
    const good = JSON.stringify(sampleMachine());
    const attacks = [
      fileOf([]).replace('{', '{"__proto__":{"polluted":true},'),
      fileOf([]).replace('{', '{"constructor":{"prototype":{"polluted":true}},'),
      fileOf([JSON.parse(good)]).replace('"id":', '"__proto__":{"isAdmin":true},"id":'),
      fileOf([JSON.parse(good)]).replace('"camera":{', '"camera":{"prototype":{"polluted":true},'),
      fileOf([JSON.parse(good)]).replace('"motor":{', '"motor":{"__proto__":{"polluted":true},'),
    ];
    for (const text of attacks) {
      expect(text).not.toBe(fileOf([])); // the replacement happened
      expect(errorOf(text)).toMatch(
        /contains a field called "(__proto__|constructor|prototype)"|has a field this app does not know/,
      );
    }
    expect(prototypeIsClean()).toBe(true);
  });

  it('never throws, whatever the text', () => {
    fc.assert(
      fc.property(fc.oneof(fc.string(), fc.json()), (text) => {
        const r = parseMachinesFile(text);
        expect(typeof r.ok).toBe('boolean');
      }),
    );
    expect(prototypeIsClean()).toBe(true);
  });
});

describe('migrations', () => {
  // Version 0 is the draft shape described in docs/file-format.md ("Older versions").
  function v0File(machines: unknown[]): string {
    return JSON.stringify({ format: FILE_FORMAT_NAME, version: 0, machines });
  }
  function v0Machine(extra: Record<string, unknown> = {}): Record<string, unknown> {
    const m = sampleMachine();
    return {
      id: m.id,
      name: m.name,
      setup: m.setup,
      savedAt: '2024-11-05T14:00:00.000Z',
      ...extra,
    };
  }

  it('has an upgrade for every version from the oldest readable one to the current one', () => {
    expect(OLDEST_READABLE_VERSION).toBe(0);
    for (let v = OLDEST_READABLE_VERSION; v < FILE_FORMAT_VERSION; v++) {
      expect(typeof migrations[v]).toBe('function');
    }
  });

  it('turns a version 0 machine into a current one: savedAt becomes both times, notes default to empty', () => {
    const r = parseMachinesFile(v0File([v0Machine()]));
    expect(r).toEqual({
      ok: true,
      machines: [
        {
          ...sampleMachine(),
          createdAt: '2024-11-05T14:00:00.000Z',
          updatedAt: '2024-11-05T14:00:00.000Z',
          notes: '',
        },
      ],
    });
  });

  it('keeps version 0 notes when present', () => {
    const r = parseMachinesFile(v0File([v0Machine({ notes: 'checked' })]));
    expect(r.ok && r.machines[0].notes).toBe('checked');
  });

  it('gives the upgraded file the newest machine time as its export time', () => {
    const upgraded = migrations[0]({
      format: FILE_FORMAT_NAME,
      version: 0,
      machines: [
        v0Machine({ savedAt: '2024-01-01T00:00:00.000Z' }),
        v0Machine({ savedAt: '2024-06-01T00:00:00.000Z' }),
      ],
    }) as { exportedAt: string; version: number };
    expect(upgraded.version).toBe(1);
    expect(upgraded.exportedAt).toBe('2024-06-01T00:00:00.000Z');
  });

  it('a version 1 file (the layout before this one) still imports, with a blank site and header and every tool at its start', () => {
    const { site: _s, assessedBy: _a, assessedOn: _o, tools: _t, ...old } = sampleMachine();
    const file = JSON.stringify({
      format: FILE_FORMAT_NAME,
      version: 1,
      exportedAt: '2025-04-01T10:00:00Z',
      machines: [old],
    });
    expect(parseMachinesFile(file)).toEqual({ ok: true, machines: [sampleMachine()] });
  });

  it('a version 1 machine with a field of the new layout is refused, naming it', () => {
    const file = JSON.stringify({
      format: FILE_FORMAT_NAME,
      version: 1,
      exportedAt: '2025-04-01T10:00:00Z',
      machines: [sampleMachine()],
    });
    expect(errorOf(file)).toMatch(
      /^machine 1 has a field this app does not know: "(site|assessedBy|assessedOn|tools)"\.$/,
    );
  });

  it('refuses a version 0 file that does not have the version 0 shape', () => {
    expect(errorOf(v0File([{ ...v0Machine(), createdAt: '2024-11-05T14:00:00Z' }]))).toBe(
      'machine 1 has a field this app does not know: "createdAt".',
    );
    const noSavedAt = v0Machine();
    delete noSavedAt.savedAt;
    expect(errorOf(v0File([noSavedAt]))).toBe('machine 1 › savedAt is missing.');
    expect(errorOf(v0File([v0Machine({ savedAt: 'then' })]))).toMatch(
      /^machine 1 › createdAt must be a date and time/,
    );
    expect(
      errorOf(
        JSON.stringify({ format: FILE_FORMAT_NAME, version: 0, machines: [], exportedAt: 'x' }),
      ),
    ).toBe('file has a field this app does not know: "exportedAt".');
  });

  it('still checks the upgraded machines strictly', () => {
    const bad = v0Machine();
    (bad.setup as { creepRpm: unknown }).creepRpm = 'slow';
    expect(errorOf(v0File([bad]))).toBe(
      'machine 1 › creepRpm must be a number (got the text "slow").',
    );
    const hostile = v0File([v0Machine()]).replace(
      '"savedAt"',
      '"__proto__":{"polluted":true},"savedAt"',
    );
    expect(errorOf(hostile)).toBe(
      'machine 1 contains a field called "__proto__", which is never allowed in Trueturn data.',
    );
    expect(prototypeIsClean()).toBe(true);
  });
});

describe('docs/file-format.md', () => {
  async function jsonBlocks(): Promise<string[]> {
    const doc = (await import('../../docs/file-format.md?raw')).default;
    return [...doc.matchAll(/```json\n([\s\S]*?)\n```/g)].map((m) => m[1]);
  }

  it('shows an example version 2 file that this app reads, with kinds, an origin and tools', async () => {
    const [example] = await jsonBlocks();
    expect(JSON.parse(example).version).toBe(FILE_FORMAT_VERSION);
    const r = parseMachinesFile(example);
    if (!r.ok) throw new Error(r.error);
    expect(r.machines.map((m) => m.name)).toEqual(['Cooler fan, pellet line 2']);
    const [m] = r.machines;
    expect(m.setup.parts.map((p) => p.kind)).toEqual(['disc', 'fan']);
    expect(m.setup.parts[1].origin?.method).toBe('strobe');
    expect(m.tools.speedFinder.readings).toHaveLength(2);
    // The example leaves the logger out: it starts from its defaults, as the page says.
    expect(m.tools.logger).toEqual(defaultToolInputs().logger);
  });

  it('shows a version 1 file that imports as the page says: blank header, every tool at its start', async () => {
    const [, old] = await jsonBlocks();
    expect(JSON.parse(old).version).toBe(1);
    const r = parseMachinesFile(old);
    if (!r.ok) throw new Error(r.error);
    const [m] = r.machines;
    expect(m.name).toBe('Sifter drive');
    expect([m.site, m.assessedBy, m.assessedOn, m.notes]).toEqual(['', '', '', '']);
    expect(m.tools).toEqual(defaultToolInputs());
    expect(m.setup.parts[0].kind).toBeUndefined();
  });

  it('names every field a machine can hold', async () => {
    const doc = (await import('../../docs/file-format.md?raw')).default;
    // A machine with every optional field present somewhere: kinds, motor, drive, wheel,
    // origin, the lighting's waveform and duty, and every tool's inputs.
    const m = sampleMachine();
    const full = {
      ...m,
      setup: {
        ...m.setup,
        parts: [
          {
            name: 'Motor',
            kind: 'disc',
            speedRpm: 1450,
            features: 1,
            tolerancePercent: 1,
            motor: { mainsHz: 50, poles: 4, slipPercent: 3 },
            origin: { method: 'nameplate', detail: { rpm: 1450 }, at: '2025-01-01T00:00:00Z' },
          },
          {
            name: 'Fan',
            speedRpm: 700,
            features: 6,
            tolerancePercent: 1,
            drive: { from: 0, kind: 'belt', driverMm: 100, drivenMm: 200, slipPercent: 1 },
          },
          {
            name: 'Wheel',
            speedRpm: 400,
            features: 5,
            tolerancePercent: 1,
            wheel: { groundSpeed: 50, unit: 'km/h', tyreSize: '205/55R16' },
          },
        ],
        lighting: { ...m.setup.lighting, waveform: 'rectangular', dutyPercent: 40 },
      },
      tools: defaultToolInputs(),
    };
    const keys = new Set<string>();
    const walk = (x: unknown): void => {
      if (Array.isArray(x)) x.forEach(walk);
      else if (typeof x === 'object' && x !== null) {
        for (const [k, v] of Object.entries(x)) {
          keys.add(k);
          walk(v);
        }
      }
    };
    walk(full);
    const missing = [...keys].filter((k) => !doc.includes(`\`${k}\``));
    expect(missing).toEqual([]);
  });
});
