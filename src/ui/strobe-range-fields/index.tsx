import { InputError } from '../../core';
import { readFlashRateFpm } from '../fields';
import { numberForField } from '../../words/format';
import { flashUnit, setStrobeRange, strobeShown } from '../../state/setup';
import { NumberField } from '../number-field';
import style from './style.module.css';

interface Props {
  /** Prefix for the two fields' ids, unique on the page. */
  idPrefix: string;
  /** Labels of the two fields, e.g. "Lowest rate" / "Highest rate". */
  minLabel: string;
  maxLabel: string;
}

/**
 * The strobe's own range (lowest and highest rate), in the unit the flash rate is shown in.
 * One pair of fields for every screen that edits it: each refuses an empty or inverted range.
 */
export function StrobeRangeFields({ idPrefix, minLabel, maxLabel }: Props) {
  const strobe = strobeShown.value;
  const unit = flashUnit.value;
  const toText = (fpm: number) => numberForField(unit === 'fpm' ? fpm : fpm / 60);
  const unitWord = unit === 'fpm' ? 'fpm' : 'Hz';
  return (
    <div class={style.pair}>
      <NumberField
        id={`${idPrefix}-min`}
        label={minLabel}
        value={strobe.minFpm}
        unitKey={unit}
        toText={toText}
        read={(text) => {
          const v = readFlashRateFpm(text, unit, 'lowest rate');
          if (v >= strobeShown.peek().maxFpm)
            throw new InputError('lowest rate', 'The lowest rate must be below the highest.');
          return v;
        }}
        onValue={(v) => setStrobeRange(v, strobeShown.peek().maxFpm)}
        unit={unitWord}
      />
      <NumberField
        id={`${idPrefix}-max`}
        label={maxLabel}
        value={strobe.maxFpm}
        unitKey={unit}
        toText={toText}
        read={(text) => {
          const v = readFlashRateFpm(text, unit, 'highest rate');
          if (v <= strobeShown.peek().minFpm)
            throw new InputError('highest rate', 'The highest rate must be above the lowest.');
          return v;
        }}
        onValue={(v) => setStrobeRange(strobeShown.peek().minFpm, v)}
        unit={unitWord}
      />
    </div>
  );
}
