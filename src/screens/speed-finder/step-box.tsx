import type { ComponentChildren } from 'preact';
import { useState } from 'preact/hooks';
import { openCheckScreen } from '../../state/navigation';
import { flashUnit } from '../../state/setup';
import { applyRateToStrobe } from '../../state/speedFinder';
import { formatRate } from '../../words/rates';
import style from './style.module.css';

interface Props {
  /** The stage, for the box's colour (and tests): a strobe stage, or a sound one. */
  stage: string;
  title: string;
  instruction: string;
  /** The rate to set now, Hz, when there is one. */
  rateHz?: number;
  /** A way round the step, under it (one line). */
  aside?: ComponentChildren;
}

/**
 * The next step in a compact box: its heading, the instruction, and the rate to set with a
 * button that sets it on the Check screen's strobe. Kept short so that the stillness caution
 * under it shows on a phone's first screen (docs/physics.md §10).
 */
export function StepBox({ stage, title, instruction, rateHz, aside }: Props) {
  const [applied, setApplied] = useState<number | null>(null);
  const rate = (hz: number) => formatRate(hz, 'strobe', flashUnit.value);
  return (
    <div class={style.step} data-stage={stage} data-testid="finder-step">
      <p class={style.stage}>{title}</p>
      <p class={style.instruction} data-testid="finder-instruction">
        {instruction}
      </p>
      {rateHz !== undefined && (
        <div class={style.setRate}>
          <p class={style.rateLine}>
            Set <strong data-testid="finder-rate">{rate(rateHz)}</strong>
          </p>
          <button
            type="button"
            class={style.primary}
            onClick={() => {
              applyRateToStrobe(rateHz);
              setApplied(rateHz);
            }}
          >
            Use {rate(rateHz)} on the Check screen's strobe
          </button>
          {applied !== null && Math.abs(applied - rateHz) <= 1e-9 * applied && (
            <p class={style.applied} role="status">
              The Check screen's strobe now flashes at {rate(applied)}.{' '}
              <button type="button" class={style.link} onClick={() => openCheckScreen()}>
                Open the Check screen
              </button>
            </p>
          )}
        </div>
      )}
      {aside}
    </div>
  );
}
