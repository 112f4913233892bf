import type { PartSpec } from '../../state/model';
import { readPoles, readSlipPercent } from '../fields';
import { numberForField } from '../../words/format';
import { ChoiceGroup } from '../choice-group';
import { NumberField } from '../number-field';
import style from './style.module.css';

type Motor = NonNullable<PartSpec['motor']>;

interface Props {
  /** The id of each field ('mains', 'poles', 'slip'), unique on the page. */
  id: (field: string) => string;
  motor: Motor;
  onMotor: (motor: Motor) => void;
  /** A field's name in a "fix …" note, from its label, where several motors share a page. */
  name?: (label: string) => string;
}

/**
 * An induction motor's nameplate: mains frequency, poles and slip. The caller wraps it and
 * says what the speed comes to; the part editor and the whole-machine screen both use it.
 */
export function MotorFields({ id, motor, onMotor, name = (label) => label }: Props) {
  return (
    <>
      <ChoiceGroup
        legend="Mains"
        name={id('mains')}
        options={[
          { value: '50', label: '50 Hz' },
          { value: '60', label: '60 Hz' },
        ]}
        value={motor.mainsHz === 60 ? '60' : '50'}
        onChange={(v) => onMotor({ ...motor, mainsHz: v === '60' ? 60 : 50 })}
      />
      <div class={style.pair}>
        <NumberField
          id={id('poles')}
          label="Poles"
          name={name('Poles')}
          value={motor.poles}
          toText={numberForField}
          read={readPoles}
          onValue={(poles) => onMotor({ ...motor, poles })}
        />
        <NumberField
          id={id('slip')}
          label="Slip"
          name={name('Slip')}
          value={motor.slipPercent}
          toText={numberForField}
          read={readSlipPercent}
          onValue={(slipPercent) => onMotor({ ...motor, slipPercent })}
          unit="%"
        />
      </div>
    </>
  );
}
