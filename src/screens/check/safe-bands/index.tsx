import { defaultLookOptions } from '../../../core';
import { formatNumber, formatPercent } from '../../../words/format';
import { formatRateSpan, settingStepWords } from '../../../words/rates';
import { listedCheck } from '../../../state/check/lists';
import { flashUnit, setSamplerRateHz } from '../../../state/setup';
import { Panel } from '../../../ui/panel';
import { bandWords } from '../../../words/bands';
import style from './style.module.css';

interface Props {
  class?: string;
}

/** The nearly-still threshold the bands are made with, rpm (docs/physics.md §4, lookOptions.ts). */
const NEARLY_STILL_RPM = defaultLookOptions.nearlyStillHz * 60;

/**
 * The bands of the sampler's range nearest the current rate in which the part is seen turning
 * its true way (docs/physics.md §4: at its true speed, or forward as one image at 6 rpm or more, for
 * every speed within the tolerance), and where the rate lies now. `safe` in the core.
 */
export function SafeBands({ class: extra }: Props) {
  const r = listedCheck.value;
  const unit = flashUnit.value;
  const span = (from: number, to: number) => formatRateSpan(from, to, r.samplerKind, unit);
  const b = r.bands;
  const current = b.current;
  const tolerance =
    r.part.tolerance > 0 ? ` for any speed within ±${formatPercent(r.part.tolerance * 100)}` : '';
  const step = settingStepWords(r.sampler);
  return (
    <Panel title="Rates that show its true way" id="bands" class={extra} offscreenSkipped>
      {current && (
        <p
          class={style.current}
          data-safe={current.safe ? 'true' : 'false'}
          data-testid="current-band"
        >
          {current.safe
            ? `This rate lies in a band where the part is ${current.promise.charAt(0).toLowerCase()}${current.promise.slice(1)}: ${span(current.fromHz, current.toHz)}.`
            : `This rate lies in a misleading band, ${span(current.fromHz, current.toHz)}: ${bandWords(current.causes, NEARLY_STILL_RPM)}.`}
        </p>
      )}
      {b.safeNearby.length > 0 ? (
        <>
          <p class={style.help}>
            In these bands the part is seen turning its true way{tolerance}: at its true speed, or
            forward as one image at {formatNumber(NEARLY_STILL_RPM)} rpm or more (one turn in{' '}
            {formatNumber(60 / NEARLY_STILL_RPM)} s or less). Never still, nearly still, doubled or
            backward. Tap a band to use its middle.
          </p>
          <ul class={style.list} data-testid="safe-bands">
            {b.safeNearby.map((band) => (
              <li key={band.fromHz}>
                <button
                  type="button"
                  class={style.band}
                  data-print="show"
                  aria-current={band === current ? 'true' : undefined}
                  onClick={() => setSamplerRateHz(Math.sqrt(band.fromHz * band.toHz))}
                >
                  {span(band.fromHz, band.toHz)}
                  <span class={style.promise}>{band.promise}</span>
                </button>
              </li>
            ))}
          </ul>
          {b.safeCount > b.safeNearby.length && (
            <p class={style.help}>
              {b.safeCount - b.safeNearby.length} more such bands lie further from this rate.
            </p>
          )}
        </>
      ) : (
        <p class={style.none} data-testid="no-safe-band">
          {b.all.length === 0
            ? 'Too many lock-in rates lie close together here to list the bands.'
            : `No rate in this range shows the part turning its true way, in a band at least ${step} wide.`}
        </p>
      )}
      <p class={style.help}>
        {b.partial
          ? `Searched ${span(b.span.minHz, b.span.maxHz)} only: the whole range holds too many lock-in rates to list.`
          : `Range searched: ${span(b.span.minHz, b.span.maxHz)}.`}
      </p>
    </Panel>
  );
}
