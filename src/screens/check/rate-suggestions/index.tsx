import { computed } from '@preact/signals';
import { formatNumber, numberForField } from '../../../words/format';
import { readCreepRpm } from '../../../ui/fields';
import { formatRate, formatRateSpan, type FlashUnit } from '../../../words/rates';
import type { SamplerKind } from '../../../state/model';
import { memoWith } from '../../../ui/memo';
import { checkProblem, type SuggestedRate } from '../../../state/check';
import { listedCheck, listsProblem } from '../../../state/check/lists';
import { problemsAmong } from '../../../state/fieldProblems';
import { CREEP_FIELDS, RESULT_FIELDS } from '../field-ids';
import { NotCurrent } from '../../../ui/not-current';
import { flashUnit, setCreepRpm, setSamplerRateHz, setup } from '../../../state/setup';
import { NumberField } from '../../../ui/number-field';
import { Panel } from '../../../ui/panel';
import { creepMissingWords, creepRateWords, narrowLocksWords } from '../../../words/check';
import { imagesWords } from '../../../words/look';
import style from './style.module.css';

interface Props {
  class?: string;
}

/** The creep speed field's value: read apart, so other entries do not re-render the list at once. */
const creepRpmOnScreen = computed(() => setup.value.creepRpm);

/** Rates worth tapping: the nearest lock-in rates, and the rate for a slow forward creep. */
export function RateSuggestions({ class: extra }: Props) {
  const r = listedCheck.value;
  const unit = flashUnit.value;
  const kind = r.samplerKind;
  const rate = (hz: number) => formatRate(hz, kind, unit);
  const tolerance = r.part.tolerance > 0;
  // Rates worked out from a refused entry are marked not current, out of reach (docs/physics.md §10).
  const refusal = checkProblem.value ?? listsProblem.value;
  return (
    <Panel title="Rates to try" id="suggestions" class={extra} offscreenSkipped>
      <div class={style.block}>
        <h3 class={style.subtitle}>
          {r.sampler === 'frames' ? 'Rates that freeze it' : 'Lock-in rates nearby'}
        </h3>
        <NotCurrent problems={problemsAmong(RESULT_FIELDS)} refusal={refusal}>
          {r.locks.length === 0 ? (
            <p class={style.none}>
              {r.part.speedHz === 0
                ? 'The part is not turning.'
                : r.narrowLocksLeftOut
                  ? 'None near this rate that can be set and held.'
                  : 'None near this rate in the range.'}
            </p>
          ) : (
            <ul class={style.list} data-testid="lock-list">
              {r.locks.map((l) => (
                <li key={`${l.rateHz}-${l.images}`}>
                  <LockButton lock={l} kind={kind} unit={unit} tolerance={tolerance} />
                </li>
              ))}
            </ul>
          )}
          {r.narrowLocksLeftOut && (
            <p class={style.help} data-testid="locks-note">
              {narrowLocksWords(r.sampler)}
            </p>
          )}
        </NotCurrent>
        <p class={style.help}>
          {r.sampler === 'frames'
            ? 'At these frame rates each frame catches the features in the same place.'
            : 'At these rates the features stand still; several images mean the pattern shows up to that many times over.'}{' '}
          Tap a rate to use it.
        </p>
      </div>
      <div class={style.block}>
        <h3 class={style.subtitle}>Slow creep forward</h3>
        <NumberField
          id="creep"
          label="Creep speed wanted"
          value={creepRpmOnScreen.value}
          toText={numberForField}
          read={readCreepRpm}
          onValue={setCreepRpm}
          unit="rpm"
        />
        <NotCurrent problems={problemsAmong(CREEP_FIELDS)} refusal={refusal}>
          {r.creep.length > 0 ? (
            <ul class={style.list} data-testid="creep-list">
              {r.creep.map((c) => (
                <li key={c.rateHz}>
                  <button
                    type="button"
                    class={style.rate}
                    data-side={c.side}
                    data-print="show"
                    onClick={() => setSamplerRateHz(c.rateHz)}
                  >
                    <span class={style.value}>{rate(c.rateHz)}</span>
                    <span class={style.what}>{creepRateWords(c)}</span>
                  </button>
                </li>
              ))}
            </ul>
          ) : (
            <p class={style.none}>
              {r.creepMissing && creepMissingWords(r.creepMissing, r.creepRpm)}
            </p>
          )}
        </NotCurrent>
        <p class={style.help}>
          The part is seen as one image turning forward at {formatNumber(r.creepRpm)} rpm: slow
          enough to inspect, and its direction stays right. It is still turning at full speed.
        </p>
      </div>
    </Panel>
  );
}

interface LockProps {
  lock: SuggestedRate;
  kind: SamplerKind;
  unit: FlashUnit;
  tolerance: boolean;
}

function LockButtonView({ lock, kind, unit, tolerance }: LockProps) {
  const here = lock.side === 'here';
  const rate = (hz: number) => formatRate(hz, kind, unit);
  return (
    <button
      type="button"
      class={style.rate}
      data-side={lock.side}
      data-print="show"
      aria-current={here ? 'true' : undefined}
      onClick={() => setSamplerRateHz(lock.rateHz)}
    >
      <span class={style.value}>{rate(lock.rateHz)}</span>
      <span class={style.what}>
        {imagesWords(lock.images)}
        {here ? ' · this rate' : ''}
      </span>
      {tolerance && (
        <span class={style.span}>
          ± tolerance: {formatRateSpan(lock.lowHz, lock.highHz, kind, unit)}
        </span>
      )}
    </button>
  );
}

/** A suggested rate's button, drawn again only when what it shows changes (a list of up to ten). */
const LockButton = memoWith(
  LockButtonView,
  (a, b) =>
    a.kind === b.kind &&
    a.unit === b.unit &&
    a.tolerance === b.tolerance &&
    a.lock.rateHz === b.lock.rateHz &&
    a.lock.images === b.lock.images &&
    a.lock.side === b.lock.side &&
    a.lock.lowHz === b.lock.lowHz &&
    a.lock.highHz === b.lock.highHz,
);
