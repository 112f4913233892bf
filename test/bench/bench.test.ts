// `npm run bench`: medians against budgets. Run by test/bench/vitest.config.ts only, never by `npm test`.
import { expect, test } from 'vitest';
import { runCoreBench } from './core.bench';
import { runParseBench } from './parse.bench';
import { runSoundBench } from './sound.bench';
import type { BenchResult } from './measure';

async function optionalBench(path: string, exportName: string): Promise<BenchResult[]> {
  try {
    const mod = (await import(/* @vite-ignore */ path)) as Record<string, () => BenchResult[]>;
    return mod[exportName]?.() ?? [];
  } catch {
    return [];
  }
}

test('every measured median stays within its budget', async () => {
  const results = [
    ...runCoreBench(),
    ...runSoundBench(),
    ...runParseBench(),
    ...(await optionalBench('./render.bench.ts', 'runRenderBench')),
  ];
  const rows = results.map((r) => {
    const ok = r.medianMs <= r.budgetMs;
    const show = (ms: number) =>
      ms < 0.01 ? `${(ms * 1000).toFixed(3)} µs` : `${ms.toFixed(3)} ms`;
    return `${ok ? 'ok  ' : 'OVER'}  ${r.name.padEnd(66)} median ${show(r.medianMs).padStart(11)}   budget ${show(r.budgetMs)}`;
  });
  console.log(['', 'Trueturn benchmarks (median)', ...rows, ''].join('\n'));
  for (const r of results) expect(r.medianMs, r.name).toBeLessThanOrEqual(r.budgetMs);
});
