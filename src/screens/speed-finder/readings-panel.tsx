import { useEffect, useState } from 'preact/hooks';
import { readField, readFlashRateFpm } from '../../ui/fields';
import { numberForField } from '../../words/format';
import { flashUnit } from '../../state/setup';
import {
  addReading,
  changeReading,
  clearReadings,
  MAX_IMAGES_SEEN,
  readings,
  removeReading,
} from '../../state/speedFinder';
import { ChoiceGroup } from '../../ui/choice-group';
import { NumberField } from '../../ui/number-field';
import { Panel } from '../../ui/panel';
import { StrobeRangeFields } from '../../ui/strobe-range-fields';
import { imagesWords } from '../../words/look';
import style from './style.module.css';

interface Props {
  /** The rate the procedure proposes now, flashes per minute: the new reading starts there. */
  proposedFpm?: number;
}

const IMAGE_CHOICES = Array.from({ length: MAX_IMAGES_SEEN }, (_, i) => i + 1);

/**
 * The strobe's own range, the readings so far (each editable, each removable) and a row to add
 * the next one: the rate at which the image stood still and how many images stood there.
 */
export function ReadingsPanel({ proposedFpm }: Props) {
  const unit = flashUnit.value;
  const list = readings.value;
  const toText = (fpm: number) => numberForField(unit === 'fpm' ? fpm : fpm / 60);
  return (
    <Panel title="Strobe readings" id="finder-readings">
      <ChoiceGroup
        legend="Rates in"
        name="finder-rate-unit"
        options={[
          { value: 'fpm', label: 'Flashes/min' },
          { value: 'Hz', label: 'Hz' },
        ]}
        value={unit}
        onChange={(u) => (flashUnit.value = u)}
      />
      <StrobeRangeFields
        idPrefix="finder-strobe"
        minLabel="Strobe's lowest rate"
        maxLabel="Strobe's highest rate"
      />
      {list.length === 0 ? (
        <p class={style.quiet}>
          No readings yet. Follow the step above and record each rate where the image stood still.
        </p>
      ) : (
        <ol class={style.readings} data-testid="reading-list">
          {list.map((r, i) => (
            <li key={r.id} class={style.reading}>
              <NumberField
                id={`reading-${r.id}-rate`}
                label={`Reading ${i + 1}: rate`}
                value={r.rateFpm}
                unitKey={unit}
                toText={toText}
                read={(text) => readFlashRateFpm(text, unit, 'rate')}
                onValue={(rateFpm) => changeReading(r.id, { rateFpm })}
                unit={unit === 'fpm' ? 'fpm' : 'Hz'}
              />
              <ImagesChoice
                id={`reading-${r.id}-images`}
                label={`Reading ${i + 1}: images`}
                value={r.images}
                onChange={(images) => changeReading(r.id, { images })}
              />
              <button
                type="button"
                class={style.quietButton}
                onClick={() => removeReading(r.id)}
                aria-label={`Remove reading ${i + 1}`}
              >
                Remove
              </button>
            </li>
          ))}
        </ol>
      )}
      <NewReading proposedFpm={proposedFpm} />
      {list.length > 0 && (
        <button type="button" class={style.quietButton} onClick={clearReadings}>
          Start again (clear all readings)
        </button>
      )}
    </Panel>
  );
}

interface ImagesProps {
  id: string;
  label: string;
  /** The count chosen; undefined until the technician chooses one (a new reading). */
  value: number | undefined;
  onChange: (images: number) => void;
}

function ImagesChoice({ id, label, value, onChange }: ImagesProps) {
  return (
    <div class={style.field}>
      <label class={style.label} for={id}>
        {label}
      </label>
      <select
        id={id}
        class={style.select}
        value={value === undefined ? '' : String(value)}
        onChange={(e) => {
          const text = (e.currentTarget as HTMLSelectElement).value;
          if (text !== '') onChange(Number(text));
        }}
      >
        {value === undefined && (
          <option value="" disabled aria-label="not chosen yet">
            ?
          </option>
        )}
        {IMAGE_CHOICES.map((n) => (
          <option key={n} value={String(n)} aria-label={imagesWords(n)}>
            {n}
          </option>
        ))}
      </select>
    </div>
  );
}

/**
 * The next reading, added with a button: its rate starts at the proposed one, and the image
 * count is left for the technician to choose every time. What they saw is never filled in
 * from a prediction (docs/physics.md §7): a reading recorded with a predicted count would lead the
 * search astray. Text that is not a rate, or no count chosen, keeps its message and adds nothing.
 */
function NewReading({ proposedFpm }: Props) {
  const unit = flashUnit.value;
  const [rateFpm, setRateFpm] = useState(proposedFpm ?? NaN);
  const [images, setImages] = useState<number | undefined>(undefined);
  const [refused, setRefused] = useState<'rate' | 'images' | null>(null);

  // A new proposal fills the rate again; typing does not. The count is never filled in.
  useEffect(() => {
    if (proposedFpm !== undefined) setRateFpm(proposedFpm);
    setRefused(null);
  }, [proposedFpm]);

  const read = (text: string) => readFlashRateFpm(text, unit, 'rate');

  // The text in the field is what counts: the field passes on only good values, so a bad
  // text would otherwise add the last good one.
  const add = (event: Event) => {
    event.preventDefault();
    const input = (event.currentTarget as HTMLFormElement).querySelector<HTMLInputElement>(
      '#new-reading-rate',
    );
    const reading = readField(input?.value ?? '', read);
    if (!reading.ok) {
      setRefused('rate');
      return;
    }
    if (images === undefined) {
      setRefused('images');
      return;
    }
    setRefused(null);
    addReading(reading.value, images);
    setImages(undefined);
  };

  return (
    <form class={style.newReading} onSubmit={add} aria-label="Add a reading" data-print="hide">
      <NumberField
        id="new-reading-rate"
        label="Rate where it stood still"
        value={rateFpm}
        unitKey={unit}
        toText={(fpm) => numberForField(unit === 'fpm' ? fpm : fpm / 60)}
        read={read}
        onValue={(fpm) => {
          setRateFpm(fpm);
          setRefused(null);
        }}
        unit={unit === 'fpm' ? 'fpm' : 'Hz'}
      />
      <ImagesChoice
        id="new-reading-images"
        label="Images standing still"
        value={images}
        onChange={(n) => {
          setImages(n);
          setRefused(null);
        }}
      />
      <button type="submit" class={style.primary}>
        Add reading
      </button>
      {refused && (
        <p class={style.message} role="alert" data-testid="reading-refused">
          {refused === 'rate'
            ? 'Type the rate where the image stood still first; nothing was added.'
            : 'Choose how many images you saw standing still first; nothing was added.'}
        </p>
      )}
    </form>
  );
}
