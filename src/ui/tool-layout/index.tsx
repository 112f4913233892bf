import type { ComponentChildren } from 'preact';
import { problemsAmong } from '../../state/fieldProblems';
import { NotCurrent, Withdrawn, withdrawnWords } from '../not-current';
import { SettledStatus } from '../settled-status';
import style from './style.module.css';

interface Props {
  /** The tool's answer in a few words, first on a phone. */
  summary: ComponentChildren;
  /**
   * The answer's headline in a sentence or two, read out once typing pauses (a withdrawn
   * answer says what to fix instead).
   */
  announce: string;
  /** Given where the answer can be a hazard: true says it as an alert (SettledStatus). */
  urgent?: boolean;
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
 * desktop entries on the left and everything the tool found on the right. The answer's headline
 * is read out once typing pauses.
 */
export function ToolLayout({
  summary,
  announce,
  urgent,
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
  const shownRefusal = problems.length > 0 ? undefined : refusal;
  return (
    <div class={style.screen} data-testid={testId}>
      <div class={style.summary}>
        <SettledStatus
          text={withdrawn ? withdrawnWords(problems, shownRefusal, 'answer') : announce}
          urgent={urgent === undefined ? undefined : urgent && !withdrawn}
          testId="tool-status"
        />
        {withdrawn && (
          <section class={style.withdrawn} aria-label="Answer withdrawn">
            <Withdrawn problems={problems} refusal={shownRefusal} what="answer" />
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
