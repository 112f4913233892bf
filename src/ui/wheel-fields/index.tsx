// A wheel rolling on the ground: its road speed (km/h or mph) and its tyre size, and the speed
// they give, applied to the part with one tap (applyDerivedSpeed) and never behind its back.
import { InputError, kmhToMps, mpsToKmh, mpsToMph, mphToMps } from '../../core';
import { applyDerivedSpeed } from '../../state/derivedSpeed';
import { wheelSpeedRpm } from '../../state/driveChain';
import type { PartSpec, WheelSpec } from '../../state/model';
import { formatNumber, numberForField } from '../../words/format';
import { originWords } from '../../words/origin';
import { readField } from '../fields';
import { useFollowingText } from '../followingText';
import { NumberField } from '../number-field';
import { useReportedProblem } from '../number-field/text-field';
import { readGroundSpeed, readTyreSize } from './read';
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
    <div class={style.field}>
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

interface ApplyProps {
  /** The part's place in the machine. */
  index: number;
  part: PartSpec;
  wheel: WheelSpec;
}

/** The speed the road speed and tyre give, and the one tap that makes it the part's speed. */
export function WheelApply({ index, part, wheel }: ApplyProps) {
  let rpm: number;
  try {
    rpm = wheelSpeedRpm(wheel);
  } catch (error) {
    if (!(error instanceof InputError)) throw error;
    return null;
  }
  const detail = { groundSpeed: wheel.groundSpeed, unit: wheel.unit, tyreSize: wheel.tyreSize };
  const inUse =
    part.origin?.method === 'road-speed' &&
    part.origin.detail.groundSpeed === wheel.groundSpeed &&
    part.origin.detail.unit === wheel.unit &&
    part.origin.detail.tyreSize === wheel.tyreSize &&
    Math.abs(part.speedRpm - rpm) <= 1e-9 * Math.abs(rpm);
  return (
    <div class={style.apply} data-testid={`wheel-apply-${index}`}>
      <p class={style.gives}>
        At {formatNumber(wheel.groundSpeed)} {wheel.unit} on {wheel.tyreSize} the wheel turns at{' '}
        <strong>{formatNumber(rpm)} rpm</strong>
        {inUse ? ': the part uses this speed.' : '.'}
      </p>
      {!inUse && (
        <button
          type="button"
          class={style.button}
          onClick={() =>
            applyDerivedSpeed(index, { speedRpm: rpm, origin: { method: 'road-speed', detail } })
          }
        >
          Use {formatNumber(rpm)} rpm ({originWords({ method: 'road-speed', detail, at: '' })})
        </button>
      )}
    </div>
  );
}
