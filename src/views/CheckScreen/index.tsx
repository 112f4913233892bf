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
import { CheckPreview, CheckRateMap } from './connected-widgets';
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
 * pinned to the top; on a desktop, entries on the left and results on the right. The rate map
 * sits under the rate it sets; the preview sits under the cautions that go with it.
 */
export function CheckScreen({ preview = <CheckPreview />, chart = <CheckRateMap /> }: Props) {
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
            {problem && (
              <li>{problem} The results shown are for the last set-up that could be worked out.</li>
            )}
            {notes.map((n) => (
              <li key={n}>{n}</li>
            ))}
          </ul>
        )}
      </div>
      <div class={style.entries}>
        <PartForm />
        <SamplerForm />
        {chart && <div class={style.slot}>{chart}</div>}
      </div>
      <div class={style.results}>
        {preview && <div class={style.slot}>{preview}</div>}
        <RateSuggestions />
        <SafeBands />
        <CameraReadout />
        <LightingReadout />
        <KeepShare />
      </div>
    </div>
  );
}
