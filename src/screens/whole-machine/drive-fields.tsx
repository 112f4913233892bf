// How a part is driven by an earlier one: belt (pulleys, slip), gear pair (teeth) or the same shaft.

import { numberForField } from '../../words/format';
import { readTeeth } from '../../ui/toolFields';
import { partLabel, type PartDrive, type Setup } from '../../state/model';
import { ChoiceGroup } from '../../ui/choice-group';

import { NumberField } from '../../ui/number-field';

import { readBeltSlipPercent, readPulleyMm } from './fields';

import style from './style.module.css';

/** Starting values when a drive first becomes a belt or a gear pair: ratio 1, no slip (neutral; the user types the real ones). */
const NEW_DRIVE: { belt: PartDrive; gear: PartDrive } = {
  belt: { from: 0, kind: 'belt', driverMm: 100, drivenMm: 100, slipPercent: 0 },
  gear: { from: 0, kind: 'gear', driverTeeth: 20, drivenTeeth: 20 },
};

interface DriveProps {
  id: (field: string) => string;
  /** A field's name in a "fix …" note, from its label. */
  named: (label: string) => string;
  setup: Setup;
  index: number;
  drive: PartDrive;
  onDrive: (drive: PartDrive) => void;
}

export function DriveFields({ id, named, setup, index, drive, onDrive }: DriveProps) {
  const kinds: Array<{ value: PartDrive['kind']; label: string }> = [
    { value: 'belt', label: 'Belt' },
    { value: 'gear', label: 'Gears' },
    { value: 'shaft', label: 'Same shaft' },
  ];
  const changeKind = (kind: PartDrive['kind']) => {
    if (kind === drive.kind) return;
    onDrive(
      kind === 'shaft' ? { from: drive.from, kind } : { ...NEW_DRIVE[kind], from: drive.from },
    );
  };
  return (
    <div class={style.group}>
      <div class={style.nameField}>
        <label class={style.label} for={id('from')}>
          Driven by
        </label>
        <select
          id={id('from')}
          class={style.select}
          value={String(drive.from)}
          onChange={(e) =>
            onDrive({ ...drive, from: Number((e.currentTarget as HTMLSelectElement).value) })
          }
        >
          {setup.parts.slice(0, index).map((_, i) => (
            <option key={i} value={String(i)}>
              {i + 1}. {partLabel(setup, i)}
            </option>
          ))}
        </select>
      </div>
      <ChoiceGroup
        legend="Drive"
        name={id('kind')}
        options={kinds}
        value={drive.kind}
        onChange={changeKind}
      />
      {drive.kind === 'belt' && (
        <>
          <div class={style.pair}>
            <NumberField
              id={id('driver-mm')}
              label="Driver pulley"
              name={named('Driver pulley')}
              value={drive.driverMm}
              toText={numberForField}
              read={(text) => readPulleyMm(text, 'driver pulley')}
              onValue={(driverMm) => onDrive({ ...drive, driverMm })}
              unit="mm"
            />
            <NumberField
              id={id('driven-mm')}
              label="Driven pulley"
              name={named('Driven pulley')}
              value={drive.drivenMm}
              toText={numberForField}
              read={(text) => readPulleyMm(text, 'driven pulley')}
              onValue={(drivenMm) => onDrive({ ...drive, drivenMm })}
              unit="mm"
            />
          </div>
          <NumberField
            id={id('belt-slip')}
            label="Belt slip"
            name={named('Belt slip')}
            value={drive.slipPercent}
            toText={numberForField}
            read={readBeltSlipPercent}
            onValue={(slipPercent) => onDrive({ ...drive, slipPercent })}
            unit="%"
            hint="The driven pulley runs up to this much slower; a V-belt under load slips a little."
          />
        </>
      )}
      {drive.kind === 'gear' && (
        <>
          <div class={style.pair}>
            <NumberField
              id={id('driver-teeth')}
              label="Driver teeth"
              name={named('Driver teeth')}
              value={drive.driverTeeth}
              toText={numberForField}
              read={readTeeth}
              onValue={(driverTeeth) => onDrive({ ...drive, driverTeeth })}
            />
            <NumberField
              id={id('driven-teeth')}
              label="Driven teeth"
              name={named('Driven teeth')}
              value={drive.drivenTeeth}
              toText={numberForField}
              read={readTeeth}
              onValue={(drivenTeeth) => onDrive({ ...drive, drivenTeeth })}
            />
          </div>
          <p class={style.hint}>Two gears in mesh turn opposite ways.</p>
        </>
      )}
    </div>
  );
}
