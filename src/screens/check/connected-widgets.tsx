// The preview and the rate map, fed from the set-up they follow (two paints behind the entries:
// src/state/check/listed.ts). Both load after the first paint
// (lazy-widgets.ts); until then a placeholder of about their size holds their place.
import { computed } from '@preact/signals';
import { picturedAnswer, picturedSetup } from '../../state/check';
import { screenGivesSafetyFor } from './screen-flags';
import { flashUnit, samplerRateHz, setSamplerRateHz, setup } from '../../state/setup';
import { Panel } from '../../ui/panel';
import { widgets as lazyWidgets } from './lazy-widgets';
import { previewInputOf, rateMapInputOf } from './widget-inputs';
import style from './style.module.css';

/**
 * Whether the pictures give the caution themselves: when the screen would not give it for the
 * set-up they picture. It follows that set-up (two paints behind the entries) rather than the
 * one on screen, so a keystroke that flips it leaves the pictures alone until they redraw, and
 * the caution stays the one for what they show. Nothing goes uncautioned in between: the screen
 * gives its own caution at once and keeps it until typing pauses (src/ui/heldOn.ts), far longer
 * than two paints. Handed over as a signal: only their caution re-renders when it flips, not the
 * chart or the preview.
 */
const picturesGiveCaution = computed(() => !screenGivesSafetyFor(picturedAnswer.value));

/**
 * The part being checked as the sampler shows it, beside the part as it really turns. Its
 * stillness caution is left to the screen's own cautions whenever those show (they do for every
 * verdict that is not to be trusted); otherwise the preview gives it itself.
 */
export function CheckPreview() {
  const input = previewInputOf(picturedAnswer.value, picturedSetup.value);
  const { module: widgets, failed } = lazyWidgets.use();
  return (
    <Panel title="Preview" id="preview" offscreenSkipped>
      {input === null ? (
        <p class={style.quiet}>Steady light samples nothing: the part looks as it really turns.</p>
      ) : widgets ? (
        <widgets.Preview {...input} showCautions={picturesGiveCaution} />
      ) : (
        <div class={style.previewPlaceholder} data-testid="preview-placeholder">
          <div class={style.square} />
          <div class={style.square} />
          <p class={style.placeholderText}>
            {failed
              ? 'The preview could not be loaded: reload the page to try again.'
              : 'Loading the preview…'}
          </p>
        </div>
      )}
    </Panel>
  );
}

/** The rate set right now (the map is drawn two paints behind it). */
const rateOnScreen = () => samplerRateHz(setup.peek());

/**
 * Every part's apparent speed over the sampler's range. Tapping or dragging it sets the rate
 * through the same setter as the suggested rates, so the rate field follows.
 */
export function CheckRateMap() {
  const input = rateMapInputOf(picturedAnswer.value, picturedSetup.value);
  const { module: widgets, failed } = lazyWidgets.use();
  return (
    <Panel title="Rate map" id="rate-map" offscreenSkipped>
      {widgets ? (
        <widgets.RateMap
          {...input}
          onRateChange={setSamplerRateHz}
          currentRateHz={rateOnScreen}
          flashUnit={flashUnit.value}
          showCautions={picturesGiveCaution}
        />
      ) : (
        <div class={style.mapPlaceholder} data-testid="rate-map-placeholder">
          <div class={style.mapToolbar} />
          <div class={style.mapPlot}>
            <p class={style.placeholderText}>
              {failed
                ? 'The rate map could not be loaded: reload the page to try again.'
                : 'Loading the rate map…'}
            </p>
          </div>
        </div>
      )}
    </Panel>
  );
}
