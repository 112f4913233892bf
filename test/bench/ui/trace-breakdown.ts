// A Chrome performance trace of the page's main thread (CDP Tracing), and its work split the way
// Lighthouse's "main-thread work breakdown" splits it (its own task tree and groups: script
// evaluation, style & layout, rendering, garbage collection, …).
import type { CDPSession } from 'playwright-core';
import type { TraceEvent } from 'lighthouse';
import { MainThreadTasks } from 'lighthouse/core/lib/tracehouse/main-thread-tasks.js';

/** The categories Lighthouse records for its own traces, less screenshots. */
const CATEGORIES = [
  '-*',
  'disabled-by-default-lighthouse',
  'loading',
  'v8',
  'v8.execute',
  'blink.user_timing',
  'devtools.timeline',
  'disabled-by-default-devtools.timeline',
].join(',');

export interface Tracing {
  stop(): Promise<TraceEvent[]>;
}

export async function startTracing(cdp: CDPSession): Promise<Tracing> {
  const events: TraceEvent[] = [];
  const collect = (params: { value: unknown[] }) => events.push(...(params.value as TraceEvent[]));
  cdp.on('Tracing.dataCollected', collect);
  await cdp.send('Tracing.start', { categories: CATEGORIES, transferMode: 'ReportEvents' });
  return {
    async stop() {
      const complete = new Promise<void>((done) =>
        cdp.once('Tracing.tracingComplete', () => done()),
      );
      await cdp.send('Tracing.end');
      await complete;
      cdp.off('Tracing.dataCollected', collect);
      return events;
    },
  };
}

export interface Breakdown {
  /** Lighthouse's group label → self time, largest first. */
  groups: Array<{ label: string; ms: number }>;
  /** Self time by trace event name ("Commit", "Layout", "RunMicrotasks" …), largest first. */
  events: Array<{ label: string; ms: number }>;
  totalMs: number;
  /** Top-level tasks of 50 ms or more. */
  longTasksMs: number[];
  longestTaskMs: number;
}

/** Splits the work of the busiest renderer main thread in `events`. */
export function mainThreadBreakdown(events: TraceEvent[]): Breakdown {
  const mains = events.filter(
    (e) => e.ph === 'M' && e.name === 'thread_name' && e.args?.name === 'CrRendererMain',
  );
  let best: { pid: number; tid: number; busyUs: number } | undefined;
  for (const m of mains) {
    const busyUs = events
      .filter((e) => e.pid === m.pid && e.tid === m.tid && e.name === 'RunTask' && e.ph === 'X')
      .reduce((n, e) => n + (e.dur ?? 0), 0);
    if (!best || busyUs > best.busyUs) best = { pid: m.pid, tid: m.tid, busyUs };
  }
  if (!best) throw new Error('the trace has no renderer main thread');
  const main = events
    .filter((e) => e.pid === best.pid && e.tid === best.tid && e.ph !== 'M')
    .sort((a, b) => a.ts - b.ts);
  const endTs = Math.max(...main.map((e) => e.ts + (e.dur ?? 0)));
  const tasks = MainThreadTasks.getMainThreadTasks(main, [], endTs);
  const groups = new Map<string, number>();
  const names = new Map<string, number>();
  for (const task of tasks) {
    groups.set(task.group.label, (groups.get(task.group.label) ?? 0) + task.selfTime);
    names.set(task.event.name, (names.get(task.event.name) ?? 0) + task.selfTime);
  }
  const sorted = (m: Map<string, number>) =>
    [...m].map(([label, ms]) => ({ label, ms })).sort((a, b) => b.ms - a.ms);
  const topLevel = tasks.filter((t) => !t.parent).map((t) => t.duration);
  return {
    groups: sorted(groups),
    events: sorted(names),
    totalMs: [...groups.values()].reduce((n, x) => n + x, 0),
    longTasksMs: topLevel.filter((d) => d >= 50).sort((a, b) => b - a),
    longestTaskMs: Math.max(0, ...topLevel),
  };
}
