import { check } from '../../state/check';
import style from './style.module.css';

interface Props {
  class?: string;
  /** Which cautions to show, for a screen other than the check (defaults to the check's). */
  show?: { safety: boolean; photosensitivity: boolean };
}

/**
 * The cautions of physics.md §10. They show whenever they apply and cannot be dismissed:
 * stillness that is not real, and flashing that can trigger seizures.
 */
export function Cautions({ class: extra, show }: Props) {
  const r = show ? { showSafety: show.safety, showPhotosensitivity: show.photosensitivity } : check.value;
  if (!r.showSafety && !r.showPhotosensitivity) return null;
  return (
    <div class={`${style.cautions} ${extra ?? ''}`}>
      {r.showSafety && (
        <aside class={style.caution} aria-labelledby="safety-title" data-testid="safety-notice">
          <h2 id="safety-title" class={style.title}>
            Still turning: do not trust what you see
          </h2>
          <p>
            It moves at its true speed whatever it looks like. Never reach in, open a guard or touch it on the strength of
            this view: isolate and lock out first (OSHA 29 CFR 1910.147, ISO 14118, your site's rules).
          </p>
          <p class={style.small}>A planning aid: local codes and licensed practice come first.</p>
        </aside>
      )}
      {r.showPhotosensitivity && (
        <aside class={`${style.caution} ${style.flash}`} aria-labelledby="flash-title" data-testid="photosensitivity-notice">
          <h2 id="flash-title" class={style.title}>
            Flashing light
          </h2>
          <p>
            3 to 60 flashes a second can trigger seizures in people with photosensitive epilepsy (WCAG 2.x success
            criterion 2.3.1). Warn people nearby and keep it short.
          </p>
        </aside>
      )}
    </div>
  );
}
