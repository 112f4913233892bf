import { apparentMotion, lockRates, rateBands, findSpeed, type Part } from '../../src/core';
import { medianMs, type BenchResult } from './measure';

// Budgets for this 2-core machine, from the foundation issue.
/** An invented workshop set: a 4-pole motor, its belt-driven fan, a rotor, a gear, a pulley, a screen. */
export const workshopParts: readonly Part[] = [
  { speedHz: 1470 / 60, symmetry: 1, tolerance: 0.01 },
  { speedHz: 980 / 60, symmetry: 6, tolerance: 0.02 },
  { speedHz: 1780 / 60, symmetry: 6, tolerance: 0.01 },
  { speedHz: 590 / 60, symmetry: 8, tolerance: 0.03 },
  { speedHz: 2950 / 60, symmetry: 3, tolerance: 0.01 },
  { speedHz: 245 / 60, symmetry: 24, tolerance: 0.02 },
];

export function runCoreBench(): BenchResult[] {
  const parts = [...workshopParts];
  let rate = 10;
  const results: BenchResult[] = [
    {
      name: 'apparentMotion, one call',
      medianMs: medianMs(
        () => apparentMotion(parts[2], (rate = rate > 990 ? 10 : rate + 0.37)).apparentHz,
        {
          batch: 20_000,
        },
      ),
      budgetMs: 0.001,
    },
    {
      name: 'lockRates, 1 Hz–10 kHz, up to 8 images (6-blade fan at 1780 rpm)',
      medianMs: medianMs(() => lockRates(parts[2], { minHz: 1, maxHz: 10_000 }, { maxImages: 8 })),
      budgetMs: 0.5,
    },
    {
      name: 'rateBands, 6 parts, 1–1000 Hz, flash',
      medianMs: medianMs(() => rateBands(parts, { minHz: 1, maxHz: 1000 }, { sampler: 'flash' })),
      budgetMs: 2,
    },
    {
      name: 'findSpeed, 6 readings',
      medianMs: medianMs(
        () =>
          findSpeed(
            [
              { rateHz: 178, images: 1 },
              { rateHz: 89, images: 1 },
              { rateHz: 356, images: 2 },
              { rateHz: 59.333333, images: 1 },
              { rateHz: 44.5, images: 1 },
              { rateHz: 534, images: 3 },
            ],
            6,
          ).candidates.length,
      ),
      budgetMs: 2,
    },
  ];
  return results;
}
