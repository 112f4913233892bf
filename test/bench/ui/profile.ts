// `npm run bench:ui -- --profile`: where the time and the bytes go, for deciding what to change.
// Not the budgeted figures: this build is not minified and counts renders, and recording slows
// the page. It prints
//  - the first-paint scripts by source module (minified build and its source maps);
//  - start-up and typing the benchmark's keys at 4× CPU slowdown, from a Chrome trace:
//    main-thread work by kind (Lighthouse's groups) and long tasks;
//  - the same unthrottled, from a CPU profile: script self time by source module and by
//    function (CPU slowdown stretches a profile unevenly, so it is recorded at 1×), and which
//    components render how often per key;
// and keeps the traces and CPU profiles for Chrome DevTools.
import { existsSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { CDPSession } from 'playwright-core';
import { benchOutputDir, buildForBench, serveBench } from './server';
import { buildForProfile } from './profile-build';
import { chunkModules } from './bundle-modules';
import { firstPaintFiles } from './first-paint';
import { summariseProfile, type CpuProfile, type SelfTime } from './cpu-profile';
import { mainThreadBreakdown, startTracing, type Breakdown, type Tracing } from './trace-breakdown';
import { MEASURED_KEYS, textsAfterKeys, typingRun } from './typing';
import { median, percentile } from './stats';

type Log = (line?: string) => void;

const profileDir = join(benchOutputDir, 'profile-dist');
const sourceMapDir = join(benchOutputDir, 'sourcemap-dist');
const SAMPLING_US = 200;

/** Start-up and typing, traced at 4× slowdown. */
async function traceRun(url: string) {
  let tracing: Tracing | undefined;
  let startUp: Breakdown | undefined;
  let typing: Breakdown | undefined;
  const stop = async (name: string) => {
    const events = await tracing!.stop();
    writeFileSync(
      join(benchOutputDir, `${name}.trace.json`),
      JSON.stringify({ traceEvents: events }),
    );
    return mainThreadBreakdown(events);
  };
  const run = await typingRun(url, 4, {
    async beforeLoad(_page, cdp) {
      await cdp.send('Emulation.setCPUThrottlingRate', { rate: 4 });
      tracing = await startTracing(cdp);
    },
    async beforeTyping(_page, cdp) {
      startUp = await stop('profile-start-up-4x');
      tracing = await startTracing(cdp);
    },
    async afterTyping() {
      typing = await stop('profile-typing-4x');
    },
  });
  if (!startUp || !typing) throw new Error('the traces did not finish');
  return { startUp, typing, keyToRafMs: run.keyToRafMs };
}

/** Start-up and typing, CPU-profiled unthrottled, with the renders counted while typing. */
async function cpuProfileRun(url: string) {
  let startUp: CpuProfile | undefined;
  let typing: CpuProfile | undefined;
  let renders: Record<string, number> = {};
  let renderMs: Record<string, number> = {};
  const stop = async (cdp: CDPSession, name: string) => {
    const { profile } = (await cdp.send('Profiler.stop')) as unknown as { profile: CpuProfile };
    writeFileSync(join(benchOutputDir, `${name}.cpuprofile`), JSON.stringify(profile));
    return profile;
  };
  const start = async (cdp: CDPSession) => {
    await cdp.send('Profiler.enable');
    await cdp.send('Profiler.setSamplingInterval', { interval: SAMPLING_US });
    await cdp.send('Profiler.start');
  };
  const run = await typingRun(url, 1, {
    beforeLoad: (_page, cdp) => start(cdp),
    async beforeTyping(page, cdp) {
      startUp = await stop(cdp, 'profile-start-up-1x');
      await page.evaluate(() => {
        const counts = window.__trueturnRenders;
        const times = window.__trueturnRenderMs;
        if (!counts || !times) throw new Error('the render counter is not in this build');
        for (const name of Object.keys(counts)) delete counts[name];
        for (const name of Object.keys(times)) delete times[name];
      });
      await start(cdp);
    },
    async afterTyping(page, cdp) {
      typing = await stop(cdp, 'profile-typing-1x');
      renders = await page.evaluate(() => ({ ...window.__trueturnRenders }));
      renderMs = await page.evaluate(() => ({ ...window.__trueturnRenderMs }));
    },
  });
  if (!startUp || !typing) throw new Error('the CPU profiles did not finish');
  return { startUp, typing, renders, renderMs, keyToRafMs: run.keyToRafMs };
}

export async function profileRun(log: Log): Promise<void> {
  log('building: minified with source maps, and not minified with a render counter …');
  buildForBench(sourceMapDir, { sourcemap: true });
  await buildForProfile(profileDir);

  log();
  log(
    'First-paint files by source module (minified; gzip share scaled to the chunk; kB = 1000 B):',
  );
  for (const file of firstPaintFiles(sourceMapDir)) {
    log(`  ${file.file}: ${(file.gzipBytes / 1000).toFixed(1)} kB gzip (${file.why})`);
    // The bundler's own runtime chunk comes with no source map: nothing to break down.
    if (!file.file.endsWith('.js') || !existsSync(join(sourceMapDir, `${file.file}.map`))) continue;
    for (const m of chunkModules(join(sourceMapDir, file.file)).filter((x) => x.gzipKb >= 0.3)) {
      log(`    ${m.gzipKb.toFixed(1).padStart(5)} kB  ${m.module}`);
    }
  }

  const server = await serveBench(profileDir);
  let traced: Awaited<ReturnType<typeof traceRun>>;
  let profiled: Awaited<ReturnType<typeof cpuProfileRun>>;
  try {
    traced = await traceRun(server.url);
    profiled = await cpuProfileRun(server.url);
  } finally {
    await server.stop();
  }

  const keys = MEASURED_KEYS;
  const latency = (ms: number[]) =>
    `keydown → next frame median ${median(ms).toFixed(1)} / p90 ${percentile(ms, 90).toFixed(1)} ms while recording`;
  log();
  log('Start-up until the network is quiet and the page idle:');
  log('  at 4× slowdown (trace):');
  printBreakdown(log, traced.startUp, 1);
  log('  unthrottled (CPU profile):');
  const startUp = summariseProfile(profiled.startUp, profileDir);
  printSelfTimes(log, 'self time by module', startUp.byModule, 1, 15);
  printSelfTimes(log, 'self time by function', startUp.byFunction, 1, 15);

  log();
  log(`Typing ${keys} keys, per key:`);
  log(`  at 4× slowdown (trace; ${latency(traced.keyToRafMs)}):`);
  printBreakdown(log, traced.typing, keys);
  const texts = textsAfterKeys();
  const perKey = traced.keyToRafMs.map((ms, i) => `${texts[i]} ${ms.toFixed(0)}`).join(', ');
  log(`    keydown → next frame by the field's text after the key (ms): ${perKey}`);
  log(`  unthrottled (CPU profile; ${latency(profiled.keyToRafMs)}):`);
  const typing = summariseProfile(profiled.typing, profileDir);
  printSelfTimes(log, 'self time by module', typing.byModule, keys, 15);
  printSelfTimes(log, 'self time by function', typing.byFunction, keys, 25);
  log('    component renders per key:');
  const renders = Object.entries(profiled.renders).sort((a, b) => b[1] - a[1]);
  log(`      ${renders.map(([name, n]) => `${name} ${(n / keys).toFixed(1)}`).join(', ')}`);
  log('    component render time per key (ms, each including what it renders; while profiling):');
  const renderMs = Object.entries(profiled.renderMs).sort((a, b) => b[1] - a[1]);
  log(`      ${renderMs.map(([name, ms]) => `${name} ${(ms / keys).toFixed(2)}`).join(', ')}`);
  log();
  log(`Recordings: ${benchOutputDir}/profile-{start-up,typing}-{4x.trace.json,1x.cpuprofile}`);
}

function printBreakdown(log: Log, b: Breakdown, per: number): void {
  const groups = b.groups.map((g) => `${g.label} ${(g.ms / per).toFixed(1)}`).join(', ');
  log(`    main-thread work ${(b.totalMs / per).toFixed(1)} ms: ${groups} ms`);
  const events = b.events
    .slice(0, 8)
    .map((g) => `${g.label} ${(g.ms / per).toFixed(1)}`)
    .join(', ');
  log(`    by trace event (self time): ${events} ms`);
  const tasks = b.longTasksMs.map((d) => d.toFixed(0)).join(', ');
  log(`    long tasks (ms, whole phase): ${tasks || 'none'}`);
}

function printSelfTimes(log: Log, title: string, rows: SelfTime[], per: number, top: number) {
  log(`    ${title} (ms${per > 1 ? ' per key' : ''}):`);
  for (const r of rows.slice(0, top))
    log(`      ${(r.ms / per).toFixed(2).padStart(7)}  ${r.name}`);
}
