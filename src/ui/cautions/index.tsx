import { FLASHING_CAUTION, PLANNING_AID_CAUTION, STILLNESS_CAUTION } from '../../core';
import { check } from '../../state/check';
import style from './style.module.css';

interface Props {
  class?: string;
  /** Which cautions to show, for a screen other than the check (defaults to the check's). */
  show?: { safety: boolean; photosensitivity: boolean };
}

/**
 * The cautions of physics.md §10, in the core's words (src/core/plans/safetyCautions.ts, shared with
 * every tool and printed report). They show whenever they apply and cannot be dismissed.
 */
export function Cautions({ class: extra, show }: Props) {
  const r = show
    ? { showSafety: show.safety, showPhotosensitivity: show.photosensitivity }
    : check.value;
  if (!r.showSafety && !r.showPhotosensitivity) return null;
  return (
    <div class={`${style.cautions} ${extra ?? ''}`}>
      {r.showSafety && (
        <aside class={style.caution} aria-labelledby="safety-title" data-testid="safety-notice">
          <h2 id="safety-title" class={style.title}>
            Still turning: do not trust what you see
          </h2>
          <p>{STILLNESS_CAUTION}</p>
          <p class={style.small}>{PLANNING_AID_CAUTION}</p>
        </aside>
      )}
      {r.showPhotosensitivity && (
        <aside
          class={`${style.caution} ${style.flash}`}
          aria-labelledby="flash-title"
          data-testid="photosensitivity-notice"
        >
          <h2 id="flash-title" class={style.title}>
            Flashing light
          </h2>
          <p>{FLASHING_CAUTION}</p>
        </aside>
      )}
    </div>
  );
}
