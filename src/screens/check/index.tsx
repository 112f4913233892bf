import type { ComponentChildren } from 'preact';
import { useRef } from 'preact/hooks';
import { check, checkProblem, picturesBehind } from '../../state/check';
import { problemsAmong } from '../../state/fieldProblems';
import { Cautions } from '../../ui/cautions';
import { useHeldOn } from '../../ui/heldOn';
import { SETTLE_MS } from '../../ui/settled-status';
import { Later } from '../../ui/later';
import { NotCurrent } from '../../ui/not-current';
import { PartForm } from '../../ui/part-form';
import { SamplerForm } from './sampler-form';
import { VerdictPanel } from './verdict-panel';
import { CheckPreview, CheckRateMap } from './connected-widgets';
import { RESULT_FIELDS } from './field-ids';
import { checkNotes, screenShowsFlashing, screenShowsSafety } from './screen-flags';
import { CHECK_NOTE_WORDS } from '../../words/check';
import { results } from './lazy-results';
import { Following, ResultsGuard } from './results-guard';
import { useStickyInset } from './sticky-inset';
import style from './style.module.css';

interface Props {
  /**
   * Slot under the cautions for a moving picture of what the viewer sees: by default the
   * preview of the set-up; null leaves it out.
   */
  preview?: ComponentChildren;
  /**
   * Slot under the entries for a chart of the rate range: by default the rate map, which sets
   * the rate when tapped; null leaves it out.
   */
  chart?: ComponentChildren;
}

/**
 * The check screen: enter the part and what looks at it, and see at once what the viewer
 * will see, which rates to use and which to avoid. On a phone one column, verdict first and
 * pinned to the top, its cautions right under it; on a desktop, entries on the left and
 * results on the right. The rate map sits under the rate it sets; the preview sits under the
 * cautions that go with it. While an entry is refused, the verdict is withdrawn and every
 * result worked out from it is marked not current (docs/physics.md §10).
 */
export function CheckScreen({ preview = <CheckPreview />, chart = <CheckRateMap /> }: Props) {
  // The screen reads no signal itself: each part below reads what it shows, so a keystroke
  // re-renders the parts whose inputs changed, not the whole screen.
  const verdict = useRef<HTMLDivElement>(null);
  useStickyInset(verdict);
  return (
    <div class={style.screen}>
      <div class={style.verdict} ref={verdict}>
        <VerdictPanel />
      </div>
      <div class={style.warnings}>
        <CheckWarnings />
      </div>
      <div class={style.entries}>
        <PartForm />
        <SamplerForm />
        {chart && (
          <div class={style.slot}>
            <ResultsGuard>
              <Following behind={picturesBehind} keepTaps>
                {chart}
              </Following>
            </ResultsGuard>
          </div>
        )}
      </div>
      <div class={style.results}>
        {preview && (
          <div class={style.slot}>
            <ResultsGuard>
              <Following behind={picturesBehind} keepTaps>
                {preview}
              </Following>
            </ResultsGuard>
          </div>
        )}
        <LaterResults part="lists" />
      </div>
      <div class={style.report}>
        <LaterResults part="report" />
      </div>
    </div>
  );
}

/** The lists under the answer, or the report, once their chunk has loaded (lazy-results.ts). */
function LaterResults({ part }: { part: 'lists' | 'report' }) {
  const { module, failed } = results.use();
  if (module) {
    // Keeping the machine and the report come a paint and two after the lists: each is made in
    // a task of its own.
    return part === 'lists' ? (
      <>
        <Following>
          <module.CheckLists />
        </Following>
        <Later paints={1}>
          <module.KeepShare />
        </Later>
      </>
    ) : (
      <Later paints={2}>
        <module.CheckReport />
      </Later>
    );
  }
  if (part === 'report') return null;
  return (
    <p class={style.quiet} aria-busy={failed ? undefined : 'true'} data-testid="results-loading">
      {failed
        ? 'The rates to try, keeping the machine and the report could not be loaded: reload the page to try again.'
        : 'Working out the rates to try…'}
    </p>
  );
}

/**
 * The cautions and notes under the verdict: they re-render when one comes or goes. A caution
 * comes at once; while a value is being typed it stays until typing pauses (SETTLE_MS, as the
 * spoken verdict waits), so the values passed on the way do not flash it in and out and move
 * the form under the typing finger.
 */
function CheckWarnings() {
  const notes = checkNotes.value;
  const safety = useHeldOn(screenShowsSafety, check, SETTLE_MS);
  const flashing = useHeldOn(screenShowsFlashing, check, SETTLE_MS);
  return (
    <>
      {/* With the verdict withdrawn nothing says the view is true: keep the stillness caution. */}
      <Cautions show={{ safety: safety.value, photosensitivity: flashing.value }} />
      {notes.length > 0 && (
        <NotCurrent problems={problemsAmong(RESULT_FIELDS)} refusal={checkProblem.value}>
          <ul class={style.notes} data-testid="check-notes">
            {notes.map((n) => (
              <li key={n}>{CHECK_NOTE_WORDS[n]}</li>
            ))}
          </ul>
        </NotCurrent>
      )}
    </>
  );
}
