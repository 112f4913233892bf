// Budgets for the preview renderer and the rate map's data, run by `npm run bench`.
import { rateMapSeries } from '../../src/core';
import { PreviewRenderer } from '../../src/render/preview';
import type { PreviewScene } from '../../src/render/scene';
import { workshopParts } from './core.bench';
import { medianMs, type BenchResult } from './measure';

const SIZE = 360;

/** A phone filming a 6-blade fan at 1780 rpm: 30 frames/s, 1/250 s exposure, 30 ms readout. */
const cameraScene: PreviewScene = {
  features: 6,
  speedHz: 1780 / 60,
  sampler: 'frames',
  rateHz: 30,
  exposureS: 1 / 250,
  readoutS: 0.03,
  timeS: 0,
  fadeS: 0,
};

/** The same fan under a strobe at 1003 flashes/s, fading on the eye: the heaviest flash case. */
const strobeScene: PreviewScene = {
  ...cameraScene,
  sampler: 'flash',
  rateHz: 1003,
  exposureS: 10e-6,
  readoutS: 0,
  fadeS: 0.06,
};

export function runRenderBench(): BenchResult[] {
  const renderer = new PreviewRenderer();
  const target = { data: new Uint8ClampedArray(SIZE * SIZE * 4), width: SIZE, height: SIZE };
  const camera = { ...cameraScene };
  const strobe = { ...strobeScene };
  let frame = 0;
  const results: BenchResult[] = [
    {
      name: 'preview, one 360×360 camera frame with blur and rolling readout',
      medianMs: medianMs(() => {
        camera.timeS = ++frame / camera.rateHz;
        renderer.render(camera, target);
        return target.data[0];
      }),
      budgetMs: 8,
    },
    {
      name: 'rate map data, 6 parts over 2000 rates (linear), flash',
      medianMs: medianMs(
        () =>
          rateMapSeries(
            [...workshopParts],
            { minHz: 1, maxHz: 1000 },
            { points: 2000, sampler: 'flash' },
          ).rates.length,
      ),
      budgetMs: 5,
    },
    {
      name: 'rate map data, 6 parts over 2000 rates (log), flash',
      medianMs: medianMs(
        () =>
          rateMapSeries(
            [...workshopParts],
            { minHz: 1, maxHz: 1000 },
            { points: 2000, log: true, sampler: 'flash' },
          ).rates.length,
      ),
      budgetMs: 5,
    },
  ];
  // Reported, not budgeted by the issue: the fading strobe view, its heaviest case (16 flashes summed per pixel).
  const strobeMs = medianMs(() => {
    strobe.timeS = ++frame / 60;
    renderer.render(strobe, target);
    return target.data[0];
  });
  console.log(
    `preview (reported, no budget): one 360×360 strobe view fading over 16 flashes, median ${strobeMs.toFixed(2)} ms`,
  );
  return results;
}
