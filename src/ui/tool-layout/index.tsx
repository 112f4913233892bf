import type { ComponentChildren } from 'preact';
import { problemsAmong } from '../../state/fieldProblems';
import { NotCurrent, Withdrawn } from '../not-current';
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
  /**
   * When the answer and results stop being current (docs/physics.md §10): while a field among
   * `fields` is refused (every field on the page when left out), or while the core refuses the
   * entries (`refusal`), the answer is withdrawn where it stands and the results are marked
   * not current. Left out, the tool's answer never depends on a field's text.
   */
  withdraw?: {
    fields?: readonly string[];
    /** Fields the answer does not read (a draft entry not yet added), left out of `fields`. */
    except?: readonly string[];
    refusal?: string;
  };
}

/**
 * The page of a field tool: on a phone one column (answer, warnings, entries, results); on a
 * desktop entries on the left and everything the tool found on the right.
 */
export function ToolLayout({
  summary,
  warnings,
  entries,
  results,
  report,
  testId,
  withdraw,
}: Props) {
  const problems = withdraw
    ? problemsAmong(withdraw.fields).filter((p) => !withdraw.except?.includes(p.id))
    : [];
  const refusal = withdraw?.refusal;
  const withdrawn = problems.length > 0 || refusal !== undefined;
  return (
    <div class={style.screen} data-testid={testId}>
      <div class={style.summary}>
        {withdrawn && (
          <section class={style.withdrawn} aria-label="Answer withdrawn" role="status">
            <Withdrawn
              problems={problems}
              refusal={problems.length > 0 ? undefined : refusal}
              what="answer"
            />
          </section>
        )}
        {/* Kept, hidden, so it comes back as it was once the entries are good again. */}
        <div hidden={withdrawn}>{summary}</div>
      </div>
      <div class={style.warnings}>{warnings}</div>
      <div class={style.entries}>{entries}</div>
      <div class={style.results}>
        <NotCurrent problems={problems} refusal={refusal}>
          {results}
        </NotCurrent>
      </div>
      {report && <div class={style.report}>{report}</div>}
    </div>
  );
}
