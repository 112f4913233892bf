import { check } from '../../state/check';
import style from './style.module.css';

interface Props {
  class?: string;
}

/**
 * The cautions of physics.md §10. They show whenever they apply and cannot be dismissed:
 * stillness that is not real, and flashing that can trigger seizures.
 */
export function Cautions({ class: extra }: Props) {
  const r = check.value;
  if (!r.showSafety && !r.showPhotosensitivity) return null;
  return (
    <div class={`${style.cautions} ${extra ?? ''}`}>
      {r.showSafety && (
        <aside class={style.caution} aria-labelledby="safety-title" data-testid="safety-notice">
          <h2 id="safety-title" class={style.title}>
            It is still turning
          </h2>
          <p>
            A part that looks still, backward or unclear under a strobe, a camera or flickering light is still turning at its
            true speed. Never reach in, open a guard or touch it because of what you see: isolate it and lock it out first
            (OSHA 29 CFR 1910.147, ISO 14118 and your site's rules).
          </p>
          <p class={style.small}>Trueturn is a planning aid; local codes and licensed practice come first.</p>
        </aside>
      )}
      {r.showPhotosensitivity && (
        <aside class={`${style.caution} ${style.flash}`} aria-labelledby="flash-title" data-testid="photosensitivity-notice">
          <h2 id="flash-title" class={style.title}>
            Flashing light
          </h2>
          <p>
            Flashing between about 3 and 60 times a second can trigger seizures in people with photosensitive epilepsy (WCAG
            2.x success criterion 2.3.1 counts from three flashes a second). Warn people nearby and keep such flashing short.
          </p>
        </aside>
      )}
    </div>
  );
}
