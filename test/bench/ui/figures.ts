// The budgets of "Instant on a cheap phone" and the figures measured against them: each figure
// is the median over the runs of that run's value (for typing: the run's median or p90 over
// its keys). Lighthouse scores are compared as Lighthouse gives them (0–1, two decimals).
import type { FirstPaintFile } from './first-paint';
import type { LighthouseFigures } from './lighthouse';
import type { FigureRow } from './report';
import { ms } from './report';
import { median, percentile } from './stats';
import { MEASURED_KEYS, textsAfterKeys, type TypingFigures } from './typing';

export interface Runs {
  lighthouse: LighthouseFigures[];
  firstPaint: FirstPaintFile[];
  /** Typing at 4× CPU slowdown. */
  throttled: TypingFigures[];
  unthrottled: TypingFigures[];
}

const list = (xs: number[], show: (x: number) => string) => xs.map(show).join(', ');
const score = (x: number) => x.toFixed(2);
const sec = (x: number) => `${(x / 1000).toFixed(2)} s`;
const oneDecimal = (x: number) => x.toFixed(1);
/** A run with no long task had none of 50 ms or more (the Long Tasks API's threshold). */
const task = (x: number) => (x === 0 ? 'none ≥ 50 ms' : ms(x));

/** The longest task of a typing run, 0 when none reached 50 ms. */
export const longestTaskMs = (r: TypingFigures) => Math.max(0, ...r.longTasksMs);

export function figureRows(runs: Runs): FigureRow[] {
  const lh = (pick: (r: LighthouseFigures) => number) => runs.lighthouse.map(pick);
  const scores = lh((r) => r.performanceScore);
  const tbt = lh((r) => r.totalBlockingTimeMs);
  const lcp = lh((r) => r.largestContentfulPaintMs);
  const cls = lh((r) => r.cumulativeLayoutShift);
  const firstPaintKb = runs.firstPaint.reduce((sum, f) => sum + f.gzipBytes, 0) / 1000;
  const slowMedians = runs.throttled.map((r) => median(r.keyToRafMs));
  const slowP90s = runs.throttled.map((r) => percentile(r.keyToRafMs, 90));
  const fastP90s = runs.unthrottled.map((r) => percentile(r.keyToRafMs, 90));
  const longest = runs.throttled.map(longestTaskMs);

  return [
    {
      figure: 'Lighthouse mobile performance score',
      value: score(median(scores)),
      budget: '≥ 0.98',
      runs: list(scores, score),
      ok: median(scores) >= 0.98,
    },
    {
      figure: 'Total blocking time (Lighthouse mobile)',
      value: ms(median(tbt)),
      budget: '≤ 100 ms',
      runs: list(tbt, (x) => ms(x)),
      ok: median(tbt) <= 100,
    },
    {
      figure: 'LCP (Lighthouse mobile)',
      value: sec(median(lcp)),
      budget: '≤ 1.3 s',
      runs: list(lcp, sec),
      ok: median(lcp) <= 1300,
    },
    {
      figure: 'CLS (Lighthouse mobile)',
      value: median(cls).toFixed(3),
      budget: '0',
      runs: list(cls, (x) => x.toFixed(3)),
      ok: median(cls) === 0,
    },
    {
      figure: 'JS + CSS before first paint, gzip',
      value: `${firstPaintKb.toFixed(1)} kB`,
      budget: '≤ 40 kB',
      runs: 'one build',
      ok: firstPaintKb <= 40,
    },
    {
      figure: 'keydown → next frame, check screen, 4× slowdown, median / p90',
      value: `${oneDecimal(median(slowMedians))} / ${ms(median(slowP90s), 1)}`,
      budget: '≤ 24 / 40 ms',
      runs: slowMedians.map((m, i) => `${oneDecimal(m)} / ${oneDecimal(slowP90s[i])}`).join(', '),
      ok: median(slowMedians) <= 24 && median(slowP90s) <= 40,
    },
    {
      figure: 'keydown → next frame, unthrottled, p90',
      value: ms(median(fastP90s), 1),
      budget: '≤ 16 ms',
      runs: list(fastP90s, oneDecimal),
      ok: median(fastP90s) <= 16,
    },
    {
      figure: `longest task while typing ${MEASURED_KEYS} keys, 4× slowdown`,
      value: task(median(longest)),
      budget: '≤ 50 ms',
      runs: list(longest, task),
      ok: median(longest) <= 50,
    },
  ];
}

/** The same key presses seen other ways, for the lines under the table. */
export function typingDetails(runs: Runs): string[] {
  const over = (rs: TypingFigures[], pick: (r: TypingFigures) => number[], p: number) =>
    oneDecimal(median(rs.map((r) => (p === 50 ? median(pick(r)) : percentile(pick(r), p)))));
  const done = (r: TypingFigures) => r.keyToFrameDoneMs;
  const slow = runs.throttled;
  const fast = runs.unthrottled;
  return [
    `keydown → that frame's style, layout and paint done (main thread), 4×: median ${over(slow, done, 50)} / p90 ${over(slow, done, 90)} ms; unthrottled: median ${over(fast, done, 50)} / p90 ${over(fast, done, 90)} ms`,
    `keydown → next frame, unthrottled, median: ${over(fast, (r) => r.keyToRafMs, 50)} ms`,
    `Event Timing keydown duration (to the next paint; 8 ms steps, under 16 ms not reported), 4×: ${eventTiming(slow)}; unthrottled: ${eventTiming(fast)}`,
    longTaskLine(slow),
  ];
}

/** How many long tasks came while typing at 4×, and which key each followed. */
export function longTaskLine(slow: TypingFigures[]): string {
  const texts = textsAfterKeys();
  const where = slow.flatMap((r) =>
    r.longTasksMs.map((d, i) => {
      const key = r.longTaskKeys[i];
      const after = key === 0 ? 'before the first key' : `after key ${key} ("${texts[key - 1]}")`;
      return `${d.toFixed(0)} ms ${after}`;
    }),
  );
  const list = where.length ? `: ${where.join('; ')}` : '';
  return `long tasks while typing at 4×: ${where.length} in ${slow.length} runs of ${MEASURED_KEYS} keys${list}`;
}

/** Median and p90 of Event Timing durations, a key with no entry counting as under 16 ms. */
function eventTiming(runs: TypingFigures[]): string {
  const show = (x: number) => (x === 0 ? '< 16' : x.toFixed(0));
  const values = (r: TypingFigures) => r.eventTimingMs.map((x) => x ?? 0);
  // Nearest-rank median, so a key under 16 ms is never averaged with one over it.
  const med = median(runs.map((r) => percentile(values(r), 50)));
  const p90 = median(runs.map((r) => percentile(values(r), 90)));
  const reported = runs.reduce((n, r) => n + r.eventTimingMs.filter((x) => x !== null).length, 0);
  const total = runs.reduce((n, r) => n + r.eventTimingMs.length, 0);
  return `median ${show(med)} / p90 ${show(p90)} ms (${reported} of ${total} keys ≥ 16 ms)`;
}

export function typingLine(r: TypingFigures): string {
  const longest = longestTaskMs(r);
  return `keydown → next frame median ${oneDecimal(median(r.keyToRafMs))} / p90 ${oneDecimal(percentile(r.keyToRafMs, 90))} ms over ${r.keyToRafMs.length} keys (frame done ${oneDecimal(median(r.keyToFrameDoneMs))} / ${oneDecimal(percentile(r.keyToFrameDoneMs, 90))} ms), longest task ${task(longest)}`;
}
