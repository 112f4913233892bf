import { formatNumber } from '../../../words/format';
import style from './style.module.css';

interface Props {
  /** Seconds recorded so far, and the total asked for. */
  doneS: number;
  totalS: number;
}

const RADIUS = 40;
const CIRCUMFERENCE = 2 * Math.PI * RADIUS;

/** How far the recording has come: a ring that fills, with the seconds in its middle. */
export function ProgressRing({ doneS, totalS }: Props) {
  const share = totalS > 0 ? Math.min(1, Math.max(0, doneS / totalS)) : 0;
  return (
    <div
      class={style.ring}
      role="progressbar"
      aria-label="Recording"
      aria-valuemin={0}
      aria-valuemax={totalS}
      aria-valuenow={Math.round(doneS * 10) / 10}
      aria-valuetext={`${formatNumber(doneS, 1)} of ${formatNumber(totalS)} seconds`}
    >
      <svg viewBox="0 0 100 100" aria-hidden="true">
        <circle class={style.ringTrack} cx="50" cy="50" r={RADIUS} />
        <circle
          class={style.ringFill}
          cx="50"
          cy="50"
          r={RADIUS}
          stroke-dasharray={CIRCUMFERENCE}
          stroke-dashoffset={CIRCUMFERENCE * (1 - share)}
        />
      </svg>
      <span class={style.ringText}>{formatNumber(doneS, 1)} s</span>
    </div>
  );
}
