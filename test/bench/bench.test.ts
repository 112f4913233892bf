// `npm run bench`: medians against budgets. Run by test/bench/vitest.config.ts only, never by
// `npm test`. Every benchmark is imported outright: one that cannot load or run fails the run
// loudly, never drops out of the table.
import { expect, test } from 'vitest';
import { runCoreBench } from './core.bench';
import { runParseBench } from './parse.bench';
import { runRenderBench } from './render.bench';
import { runSoundBench } from './sound.bench';
import type { BenchResult } from './measure';

test('every measured median stays within its budget', () => {
  const groups: Array<[string, () => BenchResult[]]> = [
    ['core', runCoreBench],
    ['sound', runSoundBench],
    ['text readers', runParseBench],
    ['render', runRenderBench],
  ];
  const results = groups.flatMap(([group, run]) => {
    const measured = run();
    // A group that measures nothing has not run: say which.
    expect(measured.length, `the ${group} benchmarks measured nothing`).toBeGreaterThan(0);
    return measured;
  });
  const rows = results.map((r) => {
    const ok = r.medianMs <= r.budgetMs;
    const show = (ms: number) =>
      ms < 0.01 ? `${(ms * 1000).toFixed(3)} µs` : `${ms.toFixed(3)} ms`;
    return `${ok ? 'ok  ' : 'OVER'}  ${r.name.padEnd(66)} median ${show(r.medianMs).padStart(11)}   budget ${show(r.budgetMs)}`;
  });
  console.log(['', 'Trueturn benchmarks (median)', ...rows, ''].join('\n'));
  for (const r of results) {
    expect(Number.isFinite(r.medianMs), `${r.name}: no time measured`).toBe(true);
    expect(r.medianMs, r.name).toBeLessThanOrEqual(r.budgetMs);
  }
});
