// Prints the UI benchmark's figures against their budgets as a Markdown table, OVER beside each
// figure over its budget, and a closing line counting the figures that meet theirs.

export interface FigureRow {
  figure: string;
  /** The figure as printed (median of the runs). */
  value: string;
  budget: string;
  /** Each run's value, so the spread is seen. */
  runs: string;
  ok: boolean;
}

export function formatTable(rows: readonly FigureRow[]): string {
  const header = ['figure', 'median', 'budget', '', 'runs'];
  const cells = rows.map((r) => [r.figure, r.value, r.budget, r.ok ? 'ok' : 'OVER', r.runs]);
  const widths = header.map((h, i) => Math.max(h.length, ...cells.map((c) => c[i].length)));
  const line = (c: string[]) => `| ${c.map((x, i) => x.padEnd(widths[i])).join(' | ')} |`;
  return [line(header), line(widths.map((w) => '-'.repeat(w))), ...cells.map(line)].join('\n');
}

export function summaryLine(rows: readonly FigureRow[]): string {
  const met = rows.filter((r) => r.ok).length;
  const over = rows.filter((r) => !r.ok).map((r) => r.figure);
  return `bench:ui: ${met} of ${rows.length} figures meet their budget${
    over.length ? ` (OVER: ${over.join('; ')})` : ''
  }`;
}

export const ms = (x: number, digits = 0) => `${x.toFixed(digits)} ms`;
