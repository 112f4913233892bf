// Where a Lighthouse run says the time went, in a few lines: the LCP element and its phases,
// main-thread work by kind, CPU time by script, the longest tasks, layout shifts and what
// blocks rendering. Read from Lighthouse's own audits (their tables), nothing recomputed.
import type { Result } from 'lighthouse';

type Item = Record<string, unknown>;

function items(lhr: Result, auditId: string): Item[] {
  const details = lhr.audits[auditId]?.details as { items?: unknown[] } | undefined;
  return (details?.items ?? []) as Item[];
}

const num = (x: unknown) => (typeof x === 'number' ? x : 0);
const text = (x: unknown) => (typeof x === 'string' ? x : '');
const ms = (x: unknown) => `${num(x).toFixed(0)} ms`;

/** A URL of the served app without its origin ("assets/x.js"), others as they are. */
function shortUrl(url: unknown): string {
  const u = text(url);
  const m = /^https?:\/\/127\.0\.0\.1:\d+\/(.*)$/.exec(u);
  return m ? m[1] || '(the page)' : u;
}

export function lighthouseDiagnostics(lhr: Result): string[] {
  const lines: string[] = [];

  const [elementTable, phaseTable] = items(lhr, 'largest-contentful-paint-element') as Array<{
    items?: Item[];
  }>;
  const node = elementTable?.items?.[0]?.node as Item | undefined;
  if (node) {
    lines.push(`LCP element: ${text(node.selector)} "${text(node.nodeLabel)}"`);
  }
  const phases = (phaseTable?.items ?? []).map((p) => `${text(p.phase)} ${ms(p.timing)}`);
  if (phases.length) lines.push(`LCP phases: ${phases.join(', ')}`);

  const work = items(lhr, 'mainthread-work-breakdown').map(
    (w) => `${text(w.groupLabel)} ${ms(w.duration)}`,
  );
  lines.push(`main-thread work: ${work.join(', ')}`);

  const scripts = items(lhr, 'bootup-time')
    .slice(0, 6)
    .map(
      (s) =>
        `${shortUrl(s.url)} ${ms(s.total)} (script ${ms(s.scripting)}, parse ${ms(s.scriptParseCompile)})`,
    );
  lines.push(`CPU time by script: ${scripts.join('; ')}`);

  const tasks = items(lhr, 'long-tasks')
    .slice(0, 6)
    .map((t) => `${ms(t.duration)} ${shortUrl(t.url)} at ${ms(t.startTime)}`);
  lines.push(`long tasks (simulated 4×): ${tasks.length ? tasks.join('; ') : 'none'}`);

  const shifts = items(lhr, 'layout-shifts').map(
    (s) => `${num(s.score).toFixed(3)} ${text((s.node as Item | undefined)?.selector)}`,
  );
  lines.push(`layout shifts: ${shifts.length ? shifts.join('; ') : 'none'}`);

  const blocking = items(lhr, 'render-blocking-insight').map(
    (b) => `${shortUrl(b.url)} ${ms(b.wastedMs)}`,
  );
  lines.push(`render-blocking: ${blocking.length ? blocking.join('; ') : 'none'}`);

  const unused = items(lhr, 'unused-javascript').map(
    (u) =>
      `${shortUrl(u.url)} ${(num(u.wastedBytes) / 1000).toFixed(1)} of ${(num(u.totalBytes) / 1000).toFixed(1)} kB`,
  );
  lines.push(`unused JavaScript at load: ${unused.length ? unused.join('; ') : 'none'}`);

  lines.push(
    `Lighthouse's CPU benchmark index on this machine: ${lhr.environment.benchmarkIndex.toFixed(0)}`,
  );
  return lines;
}
