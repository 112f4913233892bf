import type { ComponentChildren } from 'preact';
import { check, checkProblem } from '../../state/check';
import { CameraReadout } from '../CameraReadout';
import { Cautions } from '../Cautions';
import { KeepShare } from '../KeepShare';
import { LightingReadout } from '../LightingReadout';
import { PartForm } from '../PartForm';
import { RateSuggestions } from '../RateSuggestions';
import { SafeBands } from '../SafeBands';
import { SamplerForm } from '../SamplerForm';
import { VerdictPanel } from '../VerdictPanel';
import style from './style.module.css';

interface Props {
  /**
   * Slot under the verdict for a moving picture of what the viewer sees. Another tool fills
   * it; the screen works without it.
   */
  preview?: ComponentChildren;
  /** Slot after the suggestions for a chart of the rate range. */
  chart?: ComponentChildren;
}

/**
 * The check screen: enter the part and what looks at it, and see at once what the viewer
 * will see, which rates to use and which to avoid. On a phone one column, verdict first and
 * pinned to the top; on a desktop, entries on the left and results on the right.
 */
export function CheckScreen({ preview, chart }: Props) {
  const problem = checkProblem.value;
  const notes = check.value.notes;
  return (
    <div class={style.screen}>
      <div class={style.verdict}>
        <VerdictPanel />
      </div>
      <div class={style.warnings}>
        <Cautions />
        {(problem || notes.length > 0) && (
          <ul class={style.notes} data-testid="check-notes">
            {problem && <li>{problem} The results shown are for the last set-up that could be worked out.</li>}
            {notes.map((n) => (
              <li key={n}>{n}</li>
            ))}
          </ul>
        )}
      </div>
      <div class={style.entries}>
        <PartForm />
        <SamplerForm />
      </div>
      <div class={style.results}>
        {preview && <div class={style.slot}>{preview}</div>}
        <RateSuggestions />
        <SafeBands />
        <CameraReadout />
        <LightingReadout />
        {chart && <div class={style.slot}>{chart}</div>}
        <KeepShare />
      </div>
    </div>
  );
}
