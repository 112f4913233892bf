// A wheel rolling on the ground: its ground speed (km/h or mph) and its tyre size.
import { kmhToMps, mpsToKmh, mpsToMph, mphToMps } from '../../core';
import { readField } from '../../ui/fields';
import { useFollowingText } from '../../ui/followingText';
import { numberForField } from '../../words/format';

import { type WheelSpec } from '../../state/model';

import { NumberField } from '../../ui/number-field';
import { useReportedProblem } from '../../ui/number-field/text-field';
import { readGroundSpeed, readTyreSize } from './fields';

import style from './style.module.css';

interface WheelProps {
  id: (field: string) => string;
  /** A field's name in a "fix …" note, from its label. */
  named: (label: string) => string;
  wheel: WheelSpec;
  onWheel: (wheel: WheelSpec) => void;
}

export function WheelFields({ id, named, wheel, onWheel }: WheelProps) {
  // Another unit keeps the same ground speed.
  const changeUnit = (unit: WheelSpec['unit']) => {
    if (unit === wheel.unit) return;
    const mps = wheel.unit === 'mph' ? mphToMps(wheel.groundSpeed) : kmhToMps(wheel.groundSpeed);
    onWheel({ ...wheel, unit, groundSpeed: unit === 'mph' ? mpsToMph(mps) : mpsToKmh(mps) });
  };
  return (
    <div class={style.group}>
      <NumberField
        id={id('ground')}
        label="Ground speed"
        name={named('Ground speed')}
        value={wheel.groundSpeed}
        unitKey={wheel.unit}
        toText={numberForField}
        read={(text) => readGroundSpeed(text, wheel.unit)}
        onValue={(groundSpeed) => onWheel({ ...wheel, groundSpeed })}
        unit={
          <select
            class={style.select}
            aria-label="Ground speed unit"
            value={wheel.unit}
            onChange={(e) =>
              changeUnit((e.currentTarget as HTMLSelectElement).value as WheelSpec['unit'])
            }
          >
            <option value="km/h">km/h</option>
            <option value="mph">mph</option>
          </select>
        }
      />
      <TyreField
        id={id('tyre')}
        name={named('Tyre size')}
        size={wheel.tyreSize}
        onSize={(tyreSize) => onWheel({ ...wheel, tyreSize })}
      />
    </div>
  );
}

/** A tyre size, checked at each keystroke like a number field: bad text keeps the last good size. */
function TyreField({
  id,
  name,
  size,
  onSize,
}: {
  id: string;
  /** The field's name in a "fix …" note: which part's tyre. */
  name: string;
  size: string;
  onSize: (size: string) => void;
}) {
  const { text, message, edit } = useFollowingText(
    size,
    (shown) => shown.trim() === size,
    () => size,
  );
  useReportedProblem(id, name, message);
  const onInput = (event: Event) => {
    const next = (event.currentTarget as HTMLInputElement).value;
    // readField turns the core's refusal into a sentence (and rethrows anything else).
    let clean = '';
    const reading = readField(next, (t) => {
      clean = readTyreSize(t);
      return 0;
    });
    edit(next, reading.ok ? null : reading.message);
    if (reading.ok && clean !== size) onSize(clean);
  };
  return (
    <div class={style.nameField}>
      <label class={style.label} for={id}>
        Tyre size
      </label>
      <input
        id={id}
        class={style.input}
        type="text"
        autoComplete="off"
        spellcheck={false}
        value={text}
        onInput={onInput}
        aria-invalid={message ? 'true' : undefined}
        aria-describedby={message ? `${id}-message` : `${id}-hint`}
      />
      {message && (
        <p id={`${id}-message`} class={style.message} role="alert">
          {message}
        </p>
      )}
      <p id={`${id}-hint`} class={style.hint}>
        As on the sidewall: width/aspect R rim, e.g. 205/55R16 (ISO metric size).
      </p>
    </div>
  );
}
