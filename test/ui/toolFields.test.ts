import { beforeEach, describe, expect, test } from 'vitest';
import { cautionCodes, cautionFlags, InputError } from '../../src/core';
import { readExposureSeconds } from '../../src/ui/fields';
import {
  readBits,
  readCapacitanceF,
  readList,
  readResistanceOhm,
  readSampleRateHz,
  readWhole,
  splitList,
} from '../../src/ui/toolFields';
import { defaultSetup, type PartSpec, type Setup } from '../../src/state/model';
import { addPart, removePart, renamePart, selectPart } from '../../src/state/parts';
import { replaceSetup, setup } from '../../src/state/setup';
import { DataError, MAX_PARTS } from '../../src/state/validate';

function refusal(read: () => unknown): string {
  try {
    read();
  } catch (error) {
    if (error instanceof InputError || error instanceof DataError) return error.message;
    throw error;
  }
  throw new Error('not refused');
}

describe('list fields', () => {
  test('splitList separates by spaces, semicolons and comma-space, and keeps a unit with its number', () => {
    expect(splitList('24; 29,97  60, 120')).toEqual(['24', '29,97', '60', '120']);
    expect(splitList('50 Hz 2 kHz')).toEqual(['50 Hz', '2 kHz']);
    expect(splitList('   ')).toEqual([]);
  });

  test('readList reads every item and names a bad one by its place', () => {
    expect(readList('500 1/1000', readExposureSeconds, 'shutter speeds', 0, 12)).toEqual([
      1 / 500,
      1 / 1000,
    ]);
    expect(
      refusal(() => readList('500 soon', readExposureSeconds, 'shutter speeds', 0, 12)),
    ).toMatch(/^Item 1 \("500 soon"\)/);
    expect(refusal(() => readList('', readExposureSeconds, 'frame rates', 1, 12))).toBe(
      'Give at least one value for frame rates.',
    );
    expect(refusal(() => readList('1 2 3', readExposureSeconds, 'shutter speeds', 0, 2))).toBe(
      'At most 2 values for shutter speeds.',
    );
  });
});

describe('logger field readers', () => {
  test('a whole number refuses fractions and trailing words', () => {
    expect(readWhole('16', 'converter bits', 1, 64)).toBe(16);
    expect(readBits('24 bits')).toBe(24);
    expect(refusal(() => readBits('16.5'))).toBe(
      'Converter bits must be a whole number from 1 to 64.',
    );
    expect(refusal(() => readBits('12abc'))).toBe('"12abc" is not a whole number.');
    expect(refusal(() => readBits('65'))).toBe(
      'Converter bits must be a whole number from 1 to 64.',
    );
  });

  test('a sample rate may carry kHz', () => {
    expect(readSampleRateHz('2 kHz')).toBe(2000);
    expect(readSampleRateHz('51,2 kHz')).toBeCloseTo(51200, 9);
    expect(refusal(() => readSampleRateHz('0'))).toMatch(/above 0 Hz/);
  });

  test('resistance reads Ω, k and M; capacitance reads nF by default and pF, µF', () => {
    expect(readResistanceOhm('10k')).toBe(10_000);
    expect(readResistanceOhm('2.2 MΩ')).toBeCloseTo(2.2e6, 6);
    expect(readResistanceOhm('470')).toBe(470);
    expect(readCapacitanceF('100')).toBeCloseTo(100e-9, 20);
    expect(readCapacitanceF('4.7 µF')).toBeCloseTo(4.7e-6, 18);
    expect(readCapacitanceF('470p')).toBeCloseTo(470e-12, 22);
    expect(refusal(() => readResistanceOhm('ten'))).toMatch(/is not a resistance/);
    expect(refusal(() => readCapacitanceF('5 litres'))).toMatch(/is not a capacitance/);
    expect(refusal(() => readCapacitanceF('2 F'))).toBe(
      'Capacitance must lie between 0.001 pF and 1 F.',
    );
  });
});

describe('caution flags follow the core', () => {
  test('stillness shows the safety caution; 3 to 60 flashes a second the seizure caution (docs/physics.md §10)', () => {
    expect(cautionFlags({ apparentStillness: true, flashRatesHz: [100] })).toEqual({
      safety: true,
      photosensitivity: false,
    });
    expect(cautionFlags({ flashRatesHz: [50] })).toEqual({ safety: false, photosensitivity: true });
    expect(cautionFlags({ flashSweepHz: { minHz: 1, maxHz: 2 } })).toEqual({
      safety: false,
      photosensitivity: false,
    });
    // The same decision as the core's list: one caution more than the planning-aid line each.
    for (const context of [
      { apparentStillness: true },
      { flashRatesHz: [3] },
      { flashRatesHz: [61] },
      {},
    ]) {
      const flags = cautionFlags(context);
      expect(cautionCodes(context).length).toBe(
        1 + Number(flags.safety) + Number(flags.photosensitivity),
      );
    }
  });
});

describe('the parts list of the set-up', () => {
  beforeEach(() => replaceSetup(defaultSetup));

  test('adding a part chooses it; the list holds at most MAX_PARTS parts', () => {
    addPart();
    // Every part has a kind; a new one is 'other' until the user chooses.
    expect(setup.value.parts[1]).toEqual({
      name: 'Part 2',
      kind: 'other',
      speedRpm: 1770,
      features: 1,
      tolerancePercent: 1,
    });
    expect(setup.value.activePart).toBe(1);
    while (setup.value.parts.length < MAX_PARTS) addPart();
    expect(refusal(addPart)).toMatch(/at most 20 parts/);
    expect(setup.value.parts).toHaveLength(MAX_PARTS);
  });

  test('removing a part keeps the chosen part chosen and never removes the last one', () => {
    addPart();
    addPart();
    selectPart(2);
    removePart(0);
    expect(setup.value.parts.map((p) => p.name)).toEqual(['Part 2', 'Part 3']);
    expect(setup.value.activePart).toBe(1);
    removePart(1);
    expect(refusal(() => removePart(0))).toBe('A set-up needs at least one part.');
  });

  test('a part driven by the removed one keeps its speed as a typed speed; later drives follow their driver', () => {
    // On the same shaft as its driver: the driver's speed and tolerance (1770 rpm, ±1 %).
    const driven = (from: number): PartSpec => ({
      name: `driven by ${from}`,
      speedRpm: 1770,
      features: 4,
      tolerancePercent: 1,
      drive: { from, kind: 'shaft' },
    });
    const s: Setup = {
      ...structuredClone(defaultSetup),
      parts: [
        defaultSetup.parts[0],
        { ...defaultSetup.parts[0], name: 'Motor' },
        driven(1),
        driven(0),
      ],
      activePart: 3,
    };
    replaceSetup(s);
    removePart(1);
    const parts = setup.value.parts as Array<PartSpec & { drive?: { from: number } }>;
    expect(parts.map((p) => p.name)).toEqual(['Fan', 'driven by 1', 'driven by 0']);
    expect(parts[1].drive).toBeUndefined();
    expect(parts[1].speedRpm).toBe(1770);
    expect(parts[2].drive?.from).toBe(0);
    expect(setup.value.activePart).toBe(2);
  });

  test('a name longer than 80 characters is refused and the set-up keeps the old one', () => {
    expect(refusal(() => renamePart(0, 'x'.repeat(81)))).toBe(
      "A part's name holds at most 80 characters (this one has 81).",
    );
    expect(setup.value.parts[0].name).toBe('Fan');
    renamePart(0, 'Cooler fan');
    expect(setup.value.parts[0].name).toBe('Cooler fan');
  });
});
