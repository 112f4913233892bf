import { FLASHING_CAUTION, PLANNING_AID_CAUTION, STILLNESS_CAUTION } from '../../words/cautions';
import style from './style.module.css';

interface Props {
  class?: string;
  /** Which cautions to show: the core's cautionFlags for what the screen's result shows. */
  show: { safety: boolean; photosensitivity: boolean };
}

/**
 * The cautions of docs/physics.md §10, in the one wording of src/words/cautions.ts (shared with
 * every tool and printed report). They show whenever they apply and cannot be dismissed.
 */
export function Cautions({ class: extra, show }: Props) {
  if (!show.safety && !show.photosensitivity) return null;
  return (
    <div class={`${style.cautions} ${extra ?? ''}`}>
      {show.safety && (
        <aside class={style.caution} aria-labelledby="safety-title" data-testid="safety-notice">
          <h2 id="safety-title" class={style.title}>
            Still turning: do not trust what you see
          </h2>
          <p>{STILLNESS_CAUTION}</p>
          <p class={style.small}>{PLANNING_AID_CAUTION}</p>
        </aside>
      )}
      {show.photosensitivity && (
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
