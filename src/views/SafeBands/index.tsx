import { formatPercent } from '../../lib/format';
import { formatRateSpan } from '../../lib/rates';
import { check } from '../../state/check';
import { flashUnit, setSamplerRateHz } from '../../state/setup';
import { Panel } from '../Panel';
import { bandWords } from './band-words';
import style from './style.module.css';

interface Props {
  class?: string;
}

/** The safe bands of the sampler's range nearest the current rate, and where the rate lies now. */
export function SafeBands({ class: extra }: Props) {
  const r = check.value;
  const unit = flashUnit.value;
  const span = (from: number, to: number) => formatRateSpan(from, to, r.samplerKind, unit);
  const b = r.bands;
  const current = b.current;
  const tolerance =
    r.part.tolerance > 0 ? ` for any speed within ±${formatPercent(r.part.tolerance * 100)}` : '';
  return (
    <Panel title="Safe rates" id="bands" class={extra}>
      {current && (
        <p
          class={style.current}
          data-safe={current.safe ? 'true' : 'false'}
          data-testid="current-band"
        >
          {current.safe
            ? `This rate lies in a safe band: ${span(current.fromHz, current.toHz)}.`
            : `This rate lies in a misleading band, ${span(current.fromHz, current.toHz)}: ${bandWords(current.causes)}.`}
        </p>
      )}
      {b.safeNearby.length > 0 ? (
        <>
          <p class={style.help}>
            Every rate in these bands shows the part turning its true way{tolerance}. Tap a band to
            use its middle.
          </p>
          <ul class={style.list} data-testid="safe-bands">
            {b.safeNearby.map((band) => (
              <li key={band.fromHz}>
                <button
                  type="button"
                  class={style.band}
                  aria-current={band === current ? 'true' : undefined}
                  onClick={() => setSamplerRateHz(Math.sqrt(band.fromHz * band.toHz))}
                >
                  {span(band.fromHz, band.toHz)}
                </button>
              </li>
            ))}
          </ul>
          {b.safeCount > b.safeNearby.length && (
            <p class={style.help}>
              {b.safeCount - b.safeNearby.length} more safe bands lie further from this rate.
            </p>
          )}
        </>
      ) : (
        <p class={style.none} data-testid="no-safe-band">
          {b.all.length === 0
            ? 'Too many lock-in rates lie close together here to list the bands.'
            : 'No rate in this range is safe: every one misleads.'}
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
