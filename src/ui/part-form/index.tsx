import { motorSpeedHz, synchronousSpeedHz } from '../../core';
import { formatNumber, numberForField } from '../../words/format';
import { KIND_WORDS } from '../../words/partKinds';
import { originLine } from '../../words/origin';
import { readFeatures, readSpeedRpm, readTolerancePercent } from '../fields';
import {
  PART_KINDS,
  kindOf,
  type PartKind,
  type PartSpec,
  type SpeedUnit,
} from '../../state/model';
import {
  activePart,
  defaultMotor,
  setFeatures,
  setKind,
  setMotor,
  setSpeedRpm,
  setTolerancePercent,
  setWheel,
  activeIndexShown,
  speedUnit,
} from '../../state/setup';
import { MotorFields } from '../motor-fields';
import { NumberField } from '../number-field';
import { Panel } from '../panel';
import { lazyModule } from '../lazyModule';
import type { DerivedSpeedInput } from '../../state/derivedSpeed';
import { DataError } from '../../state/read';
import { computedSame, sameFields } from '../../state/computedSame';
import { sessionMessage } from '../../state/sessionNotices';
import style from './style.module.css';

interface Props {
  /** Class the screen uses to place this panel. */
  class?: string;
}

const SPEED_UNITS: SpeedUnit[] = ['rpm', 'Hz', 'rad/s'];

// A wheel's fields and a motor's nameplate speed go through the drive chain, which the first
// screen does not need until a part is a wheel or a nameplate is used: both load then.
const wheelFields = lazyModule(() => import('../wheel-fields'));
const derivedSpeed = lazyModule(() => import('../../state/derivedSpeed'));

/** Applies a speed worked out for part `index` (a motor's nameplate) once its code is in. */
function applyDerived(index: number, input: DerivedSpeedInput): void {
  derivedSpeed
    .load()
    .then((m) => m.applyDerivedSpeed(index, input))
    .catch((error: unknown) => {
      sessionMessage.value = {
        kind: 'problem',
        text:
          error instanceof DataError
            ? error.message
            : 'The motor’s speed could not be applied: this part of Trueturn did not load. Reload the page, then try again.',
      };
    });
}

/** A wheel's road speed and tyre, and the button that applies them (to the speed on screen). */
function WheelPart({ index }: { index: number }) {
  const part = activePart.value;
  const { module, failed } = wheelFields.use();
  if (!part.wheel) return null;
  if (!module) {
    return (
      <p class={style.loading} aria-busy={failed ? undefined : 'true'}>
        {failed
          ? 'The wheel fields could not be loaded: reload the page to try again.'
          : 'Opening the wheel fields…'}
      </p>
    );
  }
  return (
    <>
      <module.WheelFields
        id={(field) => `wheel-${field}`}
        named={(label) => label}
        wheel={part.wheel}
        onWheel={setWheel}
      />
      <module.WheelApply index={index} part={part} wheel={part.wheel} />
    </>
  );
}

/** rpm shown in the chosen unit. */
function speedInUnit(rpm: number, unit: SpeedUnit): number {
  if (unit === 'rpm') return rpm;
  if (unit === 'Hz') return rpm / 60;
  return (rpm / 60) * 2 * Math.PI;
}

/** How a motor's speed is given: straight from its nameplate, or from mains, poles and slip. */
type MotorGiven = 'none' | 'nameplate' | 'poles';

function motorGivenOf(part: PartShape): MotorGiven {
  if (part.motor) return 'poles';
  return part.origin?.method === 'nameplate' ? 'nameplate' : 'none';
}

/** The part as its form lays it out: everything but the speed, which its own field follows. */
type PartShape = Omit<PartSpec, 'speedRpm'>;

/**
 * The active part without its speed, the same object for as long as nothing else about it
 * changes: a keystroke in the Speed field re-renders that field, not the whole form.
 */
const partShape = computedSame<PartShape>(() => {
  const { speedRpm: _speed, ...shape } = activePart.value;
  return shape;
}, sameFields);

/**
 * The turning part: its kind (which sets its words and fields), its speed (typed, from a
 * motor's nameplate rpm or its mains, poles and slip, or applied from a wheel's road speed),
 * its features and the speed tolerance, with where the speed came from.
 */
export function PartForm({ class: extra }: Props) {
  const part = partShape.value;
  const index = activeIndexShown.value;
  const motor = part.motor;
  const kind = kindOf(part);
  const words = KIND_WORDS[kind];
  const given = motorGivenOf(part);

  const setGiven = (next: MotorGiven) => {
    const speedRpm = activePart.peek().speedRpm;
    if (next === 'poles') setMotor({ ...defaultMotor });
    else if (next === 'nameplate') {
      const rpm = Math.abs(speedRpm);
      applyDerived(index, {
        speedRpm,
        origin: { method: 'nameplate', detail: { rpm } },
      });
    } else if (motor) setMotor(undefined);
    else setSpeedRpm(speedRpm);
  };

  return (
    <Panel title="The part" id="part" class={extra}>
      <div class={style.field}>
        <label class={style.label} for="part-kind">
          Kind of part
        </label>
        <select
          id="part-kind"
          class={style.kind}
          value={kind}
          onChange={(e) => setKind((e.currentTarget as HTMLSelectElement).value as PartKind)}
        >
          {PART_KINDS.map((k) => (
            <option key={k} value={k}>
              {KIND_WORDS[k].label}
            </option>
          ))}
        </select>
      </div>
      <SpeedField />
      {kind === 'wheel' && part.wheel && <WheelPart index={index} />}
      {kind !== 'wheel' && (
        <label class={style.toggle}>
          <input
            type="checkbox"
            checked={given !== 'none'}
            onChange={(e) =>
              setGiven((e.currentTarget as HTMLInputElement).checked ? 'poles' : 'none')
            }
          />
          <span>Speed from an induction motor</span>
        </label>
      )}
      {kind !== 'wheel' && given !== 'none' && (
        <div class={style.motor}>
          <fieldset class={style.given}>
            <legend class={style.label}>The motor's speed from</legend>
            <label class={style.radio}>
              <input
                type="radio"
                name="motor-given"
                checked={given === 'nameplate'}
                onChange={() => setGiven('nameplate')}
              />
              <span>Its nameplate rpm</span>
            </label>
            <label class={style.radio}>
              <input
                type="radio"
                name="motor-given"
                checked={given === 'poles'}
                onChange={() => setGiven('poles')}
              />
              <span>Mains, poles and slip</span>
            </label>
          </fieldset>
          {given === 'poles' && motor && <MotorWithSpeeds motor={motor} />}
          {given === 'nameplate' && <NameplateField index={index} />}
        </div>
      )}
      <div class={style.pair}>
        <NumberField
          id="features"
          label={words.field}
          value={part.features}
          toText={numberForField}
          read={readFeatures}
          onValue={setFeatures}
          hint={words.hint}
        />
        <NumberField
          id="tolerance"
          label="Tolerance"
          value={part.tolerancePercent}
          toText={numberForField}
          read={readTolerancePercent}
          onValue={setTolerancePercent}
          unit="± %"
          hint="Speed ± for slip, drift, nameplate."
        />
      </div>
    </Panel>
  );
}

interface MotorProps {
  motor: NonNullable<PartSpec['motor']>;
}

function MotorWithSpeeds({ motor }: MotorProps) {
  const syncRpm = synchronousSpeedHz(motor.mainsHz, motor.poles) * 60;
  const runRpm = motorSpeedHz(motor.mainsHz, motor.poles, motor.slipPercent / 100) * 60;
  return (
    <>
      <MotorFields id={(field) => `motor-${field}`} motor={motor} onMotor={setMotor} />
      <p class={style.note}>
        Synchronous {formatNumber(syncRpm)} rpm (120 × mains ÷ poles); running{' '}
        {formatNumber(runRpm)} rpm.
      </p>
    </>
  );
}

/** The Speed field, in the unit chosen, with where the speed came from. */
function SpeedField() {
  const part = activePart.value;
  const unit = speedUnit.value;
  return (
    <NumberField
      id="speed"
      label="Speed"
      value={part.speedRpm}
      unitKey={unit}
      toText={(rpm) => numberForField(speedInUnit(rpm, unit))}
      read={(text) => readSpeedRpm(text, unit)}
      onValue={setSpeedRpm}
      unit={
        <select
          class={style.select}
          aria-label="Speed unit"
          value={unit}
          onChange={(e) =>
            (speedUnit.value = (e.currentTarget as HTMLSelectElement).value as SpeedUnit)
          }
        >
          {SPEED_UNITS.map((u) => (
            <option key={u} value={u}>
              {u}
            </option>
          ))}
        </select>
      }
      hint={
        part.motor
          ? 'From the motor below. Typing a speed here stops following the motor.'
          : part.origin
            ? `${originLine(part.origin)} Typing a speed here replaces it.`
            : 'A unit may be typed too: 1780 rpm, 29.7 Hz.'
      }
    />
  );
}

/** A motor's nameplate rpm, which sets the part's speed (its sign kept). */
function NameplateField({ index }: { index: number }) {
  const speedRpm = activePart.value.speedRpm;
  return (
    <NumberField
      id="nameplate-rpm"
      label="Nameplate speed"
      value={Math.abs(speedRpm)}
      toText={numberForField}
      read={(text) => readSpeedRpm(text, 'rpm')}
      onValue={(rpm) =>
        applyDerived(index, {
          speedRpm: (speedRpm < 0 ? -1 : 1) * Math.abs(rpm),
          origin: { method: 'nameplate', detail: { rpm: Math.abs(rpm) } },
        })
      }
      unit="rpm"
      hint="The rated speed on the motor's plate, at full load."
    />
  );
}
