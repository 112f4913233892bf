// `npm run bench:ui` (through run.mjs): builds the app, serves it, and measures it in real
// Chromium against the budgets of "Instant on a cheap phone": Lighthouse mobile (3 runs), the
// script and style bytes before the first paint, and typing on the check screen (3 runs at 4×
// CPU slowdown, 3 unthrottled). Every figure is the median of its runs. A benchmark, not a
// test: figures over budget are marked OVER and the exit code stays 0; a measurement that
// cannot run throws, and run.mjs exits non-zero.
import { currentLoad, describeMachine, formatLoad } from './machine';
import { benchDistDir, benchOutputDir, buildForBench, serveBench } from './server';
import { lighthouseRun, type LighthouseFigures } from './lighthouse';
import { firstPaintFiles } from './first-paint';
import { typingRun, type TypingFigures } from './typing';
import { figureRows, longTaskLine, typingDetails, typingLine } from './figures';
import { formatTable, ms, summaryLine } from './report';
import { lighthouseDiagnostics } from './diagnostics';
import { profileRun } from './profile';

const RUNS = 3;

/** Runs `work`, naming `stage` in any error it throws. */
export async function stage<T>(name: string, work: () => T | Promise<T>): Promise<T> {
  try {
    return await work();
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    throw new Error(`${name}: ${message}`, { cause: error });
  }
}

const log = (line = '') => console.log(line);

export async function main(args: readonly string[]): Promise<void> {
  const machine = await stage('machine', describeMachine);
  log('Trueturn UI benchmark (npm run bench:ui)');
  log(`machine: ${machine.cpuModel}, ${machine.cores} cores`);
  log(`load average at start (1, 5, 15 min): ${formatLoad(machine.loadAtStart)}`);
  log(`Node ${machine.node}; ${machine.chromium} (${machine.chromiumPath})`);
  log();
  if (args.includes('--profile')) return profileRun(log);
  const typingOnly = args.includes('--typing');
  if (args.some((a) => a !== '--typing')) {
    throw new Error(`unknown arguments: ${args.join(' ')} (only --profile or --typing)`);
  }

  log('building the app …');
  await stage('build', () => buildForBench());
  const server = await stage('vite preview', () => serveBench());
  log(`serving ${benchDistDir} at ${server.url}`);

  const lighthouse: LighthouseFigures[] = [];
  const throttled: TypingFigures[] = [];
  const unthrottled: TypingFigures[] = [];
  try {
    // --typing: the typing runs alone, for trying a change quickly (not the budget report).
    for (let i = 1; i <= (typingOnly ? 0 : RUNS); i++) {
      const run = await stage(`Lighthouse run ${i}`, () =>
        lighthouseRun(server.url, benchOutputDir, `run-${i}`),
      );
      lighthouse.push(run);
      log(
        `Lighthouse run ${i}/${RUNS}: score ${run.performanceScore.toFixed(2)}, TBT ${ms(run.totalBlockingTimeMs)}, LCP ${ms(run.largestContentfulPaintMs)}, CLS ${run.cumulativeLayoutShift.toFixed(3)}`,
      );
    }
    // Each run types in fresh browsers: at 4× slowdown first, then unthrottled.
    for (let i = 1; i <= RUNS; i++) {
      const slow = await stage(`typing run ${i} at 4× slowdown`, () => typingRun(server.url, 4));
      throttled.push(slow);
      log(`typing run ${i}/${RUNS} at 4×: ${typingLine(slow)}`);
      const fast = await stage(`typing run ${i} unthrottled`, () => typingRun(server.url, 1));
      unthrottled.push(fast);
      log(`typing run ${i}/${RUNS} unthrottled: ${typingLine(fast)}`);
    }
  } finally {
    await server.stop();
  }
  if (typingOnly) {
    for (const [name, runs] of [
      ['4×', throttled],
      ['unthrottled', unthrottled],
    ] as const) {
      const all = runs.flatMap((r) => r.keyToRafMs);
      log(
        `${name}: ${typingLine({ ...runs[0], keyToRafMs: all, keyToFrameDoneMs: runs.flatMap((r) => r.keyToFrameDoneMs), longTasksMs: runs.flatMap((r) => r.longTasksMs) })} (all runs pooled)`,
      );
    }
    log(longTaskLine(throttled));
    return;
  }
  const firstPaint = await stage('first-paint size', () => firstPaintFiles(benchDistDir));
  const runs = { lighthouse, firstPaint, throttled, unthrottled };
  const rows = figureRows(runs);

  log();
  log(
    `Figures, median of ${RUNS} runs (load average at start ${formatLoad(machine.loadAtStart)}, at end ${formatLoad(currentLoad())}):`,
  );
  log();
  log(formatTable(rows));
  log();
  log('Before first paint (each file gzip -9; kB = 1000 bytes):');
  for (const f of firstPaint) {
    const kb = (bytes: number) => (bytes / 1000).toFixed(1);
    log(`  ${kb(f.gzipBytes).padStart(5)} kB gzip (${kb(f.bytes)} kB raw)  ${f.file}: ${f.why}`);
  }
  log();
  log('Typing: "next frame" is the first animation-frame callback after the update. Also:');
  for (const line of typingDetails(runs)) log(`  ${line}`);
  log();
  const byScore = [...lighthouse].sort((a, b) => a.performanceScore - b.performanceScore);
  const medianRun = byScore[Math.floor(byScore.length / 2)];
  log(
    `Where the start-up time goes (Lighthouse run with the median score, ${medianRun.reportPath}.html):`,
  );
  for (const line of lighthouseDiagnostics(medianRun.lhr)) log(`  ${line}`);
  log();
  log(summaryLine(rows));
}
