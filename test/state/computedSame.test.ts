import { effect, signal } from '@preact/signals';
import { describe, expect, test } from 'vitest';
import { computedSame, sameFields, sameItems } from '../../src/state/computedSame';

describe('computedSame', () => {
  test('hands out the same object, and wakes nothing, while a new result equals the last', () => {
    const part = signal({ name: 'Fan', speedRpm: 1770, features: 6 });
    const shape = computedSame(() => {
      const { speedRpm: _speed, ...rest } = part.value;
      return rest;
    }, sameFields);
    const seen: object[] = [];
    const stop = effect(() => void seen.push(shape.value));
    const first = shape.value;
    part.value = { ...part.value, speedRpm: 1780 };
    part.value = { ...part.value, speedRpm: 1790 };
    expect(shape.value).toBe(first);
    expect(seen).toHaveLength(1);
    part.value = { ...part.value, features: 8 };
    expect(shape.value).toEqual({ name: 'Fan', features: 8 });
    expect(seen).toHaveLength(2);
    stop();
  });

  test('compares lists item by item and objects key by key', () => {
    expect(sameItems(['a', 'b'], ['a', 'b'])).toBe(true);
    expect(sameItems(['a', 'b'], ['b', 'a'])).toBe(false);
    expect(sameItems(['a'], ['a', 'b'])).toBe(false);
    expect(sameFields({ a: 1, b: NaN }, { a: 1, b: NaN })).toBe(true);
    expect(sameFields({ a: 1 }, { a: 1, b: undefined })).toBe(false);
    const motor = { poles: 4 };
    expect(sameFields({ motor }, { motor: { poles: 4 } })).toBe(false);
  });
});
