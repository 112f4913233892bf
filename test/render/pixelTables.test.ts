import { describe, expect, it } from 'vitest';
import { buildPixelTables, sharedPixelTables } from '../../src/render/pixelTables';
import { PreviewRenderer } from '../../src/render/preview';

describe('shared pixel tables', () => {
  it('hand every renderer of one size and look the same tables, equal to freshly built ones', () => {
    const a = sharedPixelTables(31, 31, 0.2, 0.9);
    const b = sharedPixelTables(31, 31, 0.2, 0.9);
    expect(b).toBe(a);
    const fresh = buildPixelTables(31, 31, 0.2, 0.9);
    expect(Array.from(a.angleTurns)).toEqual(Array.from(fresh.angleTurns));
    expect(Array.from(a.ringWeight)).toEqual(Array.from(fresh.ringWeight));
    expect(Array.from(a.hubWeight)).toEqual(Array.from(fresh.hubWeight));
  });

  it('build new tables for another size or other radii', () => {
    const a = sharedPixelTables(20, 20, 0.2, 0.9);
    expect(sharedPixelTables(21, 20, 0.2, 0.9)).not.toBe(a);
    expect(sharedPixelTables(20, 20, 0.25, 0.9)).not.toBe(a);
    expect(sharedPixelTables(20, 20, 0.2, 0.85).ringWeight).not.toEqual(a.ringWeight);
  });

  it('two renderers drawing the same scene into buffers of one size give the same pixels', () => {
    const scene = {
      sampler: 'flash' as const,
      features: 6,
      speedHz: 29.5,
      rateHz: 29.5,
      exposureS: 0,
      readoutS: 0,
      timeS: 0.3,
      fadeS: 0.1,
    };
    const first = { width: 24, height: 24, data: new Uint8ClampedArray(24 * 24 * 4) };
    const second = { width: 24, height: 24, data: new Uint8ClampedArray(24 * 24 * 4) };
    new PreviewRenderer().render(scene, first);
    new PreviewRenderer().render(scene, second);
    expect(Array.from(second.data)).toEqual(Array.from(first.data));
    expect(first.data.some((v, i) => i % 4 !== 3 && v !== first.data[0])).toBe(true);
  });
});
