import { motorSpeedHz, synchronousSpeedHz } from '../../core';
import { formatNumber, numberForField } from '../../words/format';
import { readFeatures, readSpeedRpm, readTolerancePercent } from '../fields';
import type { SpeedUnit } from '../../state/model';
import {
  activePart,
  defaultMotor,
  setFeatures,
  setMotor,
  setSpeedRpm,
  setTolerancePercent,
  speedUnit,
} from '../../state/setup';
import { MotorFields } from '../motor-fields';
import { NumberField } from '../number-field';
import { Panel } from '../panel';
import style from './style.module.css';

interface Props {
  /** Class the screen uses to place this panel. */
  class?: string;
}

const SPEED_UNITS: SpeedUnit[] = ['rpm', 'Hz', 'rad/s'];

/** rpm shown in the chosen unit. */
function speedInUnit(rpm: number, unit: SpeedUnit): number {
  if (unit === 'rpm') return rpm;
  if (unit === 'Hz') return rpm / 60;
  return (rpm / 60) * 2 * Math.PI;
}

/** The turning part: its speed (typed, or from a motor), its features and the speed tolerance. */
export function PartForm({ class: extra }: Props) {
  const part = activePart.value;
  const unit = speedUnit.value;
  const motor = part.motor;

  const unitChooser = (
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
  );

  return (
    <Panel title="The part" id="part" class={extra}>
      <NumberField
        id="speed"
        label="Speed"
        value={part.speedRpm}
        unitKey={unit}
        toText={(rpm) => numberForField(speedInUnit(rpm, unit))}
        read={(text) => readSpeedRpm(text, unit)}
        onValue={setSpeedRpm}
        unit={unitChooser}
        hint={
          motor
            ? 'From the motor below. Typing a speed here stops following the motor.'
            : 'A unit may be typed too: 1780 rpm, 29.7 Hz.'
        }
      />
      <label class={style.toggle}>
        <input
          type="checkbox"
          checked={motor !== undefined}
          onChange={(e) =>
            setMotor(
              (e.currentTarget as HTMLInputElement).checked ? { ...defaultMotor } : undefined,
            )
          }
        />
        <span>Speed from an induction motor</span>
      </label>
      {motor && <MotorWithSpeeds motor={motor} />}
      <div class={style.pair}>
        <NumberField
          id="features"
          label="Blades or marks"
          value={part.features}
          toText={numberForField}
          read={readFeatures}
          onValue={setFeatures}
          hint="Identical blades, spokes, jaws or bolts; 1 = one mark."
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
  motor: NonNullable<ReturnType<typeof activePart.peek>['motor']>;
}

function MotorWithSpeeds({ motor }: MotorProps) {
  const syncRpm = synchronousSpeedHz(motor.mainsHz, motor.poles) * 60;
  const runRpm = motorSpeedHz(motor.mainsHz, motor.poles, motor.slipPercent / 100) * 60;
  return (
    <div class={style.motor}>
      <MotorFields id={(field) => `motor-${field}`} motor={motor} onMotor={setMotor} />
      <p class={style.note}>
        Synchronous {formatNumber(syncRpm)} rpm (120 × mains ÷ poles); running{' '}
        {formatNumber(runRpm)} rpm.
      </p>
    </div>
  );
}
