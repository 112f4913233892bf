import type { ComponentChildren } from 'preact';
import style from './style.module.css';

interface Props {
  /** The tool's answer in a few words, first on a phone. */
  summary: ComponentChildren;
  /** Cautions and refusals, under the answer. */
  warnings?: ComponentChildren;
  /** What the user enters. */
  entries: ComponentChildren;
  /** Tables, remedies and proposals. */
  results: ComponentChildren;
  /** The report bar: last on screen, first on paper (its print header names the tool, machine, date and cautions). */
  report?: ComponentChildren;
  testId?: string;
}

/**
 * The page of a field tool: on a phone one column (answer, warnings, entries, results); on a
 * desktop entries on the left and everything the tool found on the right.
 */
export function ToolLayout({ summary, warnings, entries, results, report, testId }: Props) {
  return (
    <div class={style.screen} data-testid={testId}>
      <div class={style.summary}>{summary}</div>
      <div class={style.warnings}>{warnings}</div>
      <div class={style.entries}>{entries}</div>
      <div class={style.results}>{results}</div>
      {report && <div class={style.report}>{report}</div>}
    </div>
  );
}
