// Timing helpers for `npm run bench` only; unit tests never time anything.

export interface BenchResult {
  name: string;
  medianMs: number;
  budgetMs: number;
}

/**
 * Median wall time of `fn` in ms, over `samples` samples of `batch` calls each (batching
 * resolves sub-microsecond calls that performance.now() alone cannot). A warm-up lets the
 * JIT settle first. The result of every call feeds a sink so the work cannot be optimised away.
 */
export function medianMs(fn: () => unknown, { samples = 31, batch = 1, warmup = 20 } = {}): number {
  let sink = 0;
  for (let i = 0; i < warmup * batch; i++) sink ^= touch(fn());
  const times: number[] = [];
  for (let s = 0; s < samples; s++) {
    const t0 = performance.now();
    for (let i = 0; i < batch; i++) sink ^= touch(fn());
    times.push((performance.now() - t0) / batch);
  }
  if (sink === 0x7fffffff) console.log('');
  times.sort((a, b) => a - b);
  return times[Math.floor(times.length / 2)];
}

function touch(v: unknown): number {
  if (typeof v === 'number') return v | 0;
  if (Array.isArray(v)) return v.length;
  return v ? 1 : 0;
}
