import { kmhToMps, mpsToKmh, mpsToMph, mphToMps } from '../../core';
import { readFeatures, readField, readSpeedRpm, readTolerancePercent } from '../../lib/fields';
import { useFollowingText } from '../../lib/followingText';
import { formatNumber, numberForField } from '../../lib/format';
import { readTeeth } from '../../lib/toolFields';
import { NameLengthNote, nameIsFull, nameNoteId } from '../NameLengthNote';
import {
  editChain,
  speedSourceOf,
  withDrive,
  withMotor,
  withoutPart,
  withPartFields,
  withSpeedSource,
  withWheel,
  type DerivedPart,
  type SpeedSource,
} from '../../state/chain';
import {
  partLabel,
  type PartDrive,
  type PartSpec,
  type Setup,
  type WheelSpec,
} from '../../state/model';
import { ChoiceGroup } from '../ChoiceGroup';
import { MotorFields } from '../MotorFields';
import { problemsAmong } from '../../state/fieldProblems';
import { fieldNames } from '../NotCurrent';
import { NumberField } from '../NumberField';
import { useReportedProblem } from '../NumberField/text-field';
import { readBeltSlipPercent, readGroundSpeed, readPulleyMm, readTyreSize } from './chain-fields';
import style from './style.module.css';

interface Props {
  setup: Setup;
  index: number;
  /** The speed band the chain gives the part (absent while the core refuses the chain). */
  derived?: DerivedPart;
  /** Reports an edit the saved list refuses (DataError), or clears the report. */
  onProblem: (message: string | null) => void;
}

/** Starting values when a drive first becomes a belt or a gear pair: ratio 1, no slip (neutral; the user types the real ones). */
const NEW_DRIVE: { belt: PartDrive; gear: PartDrive } = {
  belt: { from: 0, kind: 'belt', driverMm: 100, drivenMm: 100, slipPercent: 0 },
  gear: { from: 0, kind: 'gear', driverTeeth: 20, drivenTeeth: 20 },
};

/**
 * One part of the machine: its name and features, where its speed comes from (typed, a motor,
 * a wheel, or a drive from an earlier part) with the fields that go with it, and the speed band
 * that gives.
 */
export function PartCard({ setup, index, derived, onProblem }: Props) {
  const part = setup.parts[index];
  const source = speedSourceOf(part);
  // Any refused entry on the page may feed this part's speed along the chain.
  const stale = problemsAmong();
  const id = (field: string) => `part-${index}-${field}`;
  // Several parts share labels ("Speed"): a "fix …" note names the part too.
  const named = (label: string) => `${partLabel(setup, index)}: ${label}`;
  const act = (edit: (s: Setup) => Setup) => {
    try {
      editChain(edit);
      onProblem(null);
    } catch (error) {
      onProblem(error instanceof Error ? error.message : String(error));
    }
  };
  const sources: Array<{ value: SpeedSource; label: string }> = [
    { value: 'typed', label: 'Typed' },
    { value: 'motor', label: 'Motor' },
    { value: 'wheel', label: 'Wheel' },
    ...(index > 0 ? [{ value: 'drive' as const, label: 'Driven' }] : []),
  ];

  return (
    <li class={style.card} data-testid={`chain-part-${index}`}>
      <div class={style.cardHead}>
        <span class={style.number}>{index + 1}</span>
        <NameField
          id={id('name')}
          name={part.name}
          onName={(name) => act((s) => withPartFields(s, index, { name }))}
        />
      </div>
      <NumberField
        id={id('features')}
        label="Blades or marks"
        name={named('Blades or marks')}
        value={part.features}
        toText={numberForField}
        read={readFeatures}
        onValue={(features) => act((s) => withPartFields(s, index, { features }))}
      />
      <ChoiceGroup
        legend="Speed comes from"
        name={id('source')}
        options={sources}
        value={source}
        onChange={(next) => act((s) => withSpeedSource(s, index, next))}
      />
      {source === 'typed' && (
        <NumberField
          id={id('speed')}
          label="Speed"
          name={named('Speed')}
          value={part.speedRpm}
          toText={numberForField}
          read={(text) => readSpeedRpm(text, 'rpm')}
          onValue={(speedRpm) => act((s) => withPartFields(s, index, { speedRpm }))}
          unit="rpm"
        />
      )}
      {source === 'motor' && part.motor && (
        <div class={style.group}>
          <MotorFields
            id={id}
            name={named}
            motor={part.motor}
            onMotor={(m) => act((s) => withMotor(s, index, m))}
          />
        </div>
      )}
      {source === 'wheel' && part.wheel && (
        <WheelFields
          id={id}
          named={named}
          wheel={part.wheel}
          onWheel={(w) => act((s) => withWheel(s, index, w))}
        />
      )}
      {source === 'drive' && part.drive && (
        <DriveFields
          id={id}
          named={named}
          setup={setup}
          index={index}
          drive={part.drive}
          onDrive={(d) => act((s) => withDrive(s, index, d))}
        />
      )}
      {source !== 'drive' && (
        <NumberField
          id={id('tolerance')}
          label="Tolerance"
          name={named('Tolerance')}
          value={part.tolerancePercent}
          toText={numberForField}
          read={readTolerancePercent}
          onValue={(tolerancePercent) => act((s) => withPartFields(s, index, { tolerancePercent }))}
          unit="± %"
        />
      )}
      <p class={style.derived} data-testid={`chain-speed-${index}`}>
        {/* A speed carried from a refused entry is not the one on screen (physics.md §10). */}
        {stale.length > 0
          ? `Not current: fix ${fieldNames(stale)} first.`
          : derived
            ? speedWords(derived)
            : 'Speed not worked out: see the message above.'}
      </p>
      {setup.parts.length > 1 && (
        <button
          type="button"
          class={style.quietButton}
          onClick={() => act((s) => withoutPart(s, index))}
          aria-label={`Remove ${partLabel(setup, index)}`}
        >
          Remove this part
        </button>
      )}
    </li>
  );
}

/** "1,015 rpm ± 2 % (995 – 1,035 rpm), the other way to the first part". */
export function speedWords(p: DerivedPart): string {
  const rpm = formatNumber(Math.abs(p.speedHz * 60));
  const band =
    p.tolerance > 0
      ? ` ± ${formatNumber(p.tolerance * 100)} % (${formatNumber(p.lowHz * 60)} – ${formatNumber(p.highHz * 60)} rpm)`
      : '';
  const way = p.ratioToRoot < 0 ? ', turning the other way to the start of its chain' : '';
  return `${rpm} rpm${band}${way}`;
}

function NameField({
  id,
  name,
  onName,
}: {
  id: string;
  name: string;
  onName: (name: string) => void;
}) {
  return (
    <div class={style.nameField}>
      <label class={style.label} for={id}>
        Name
      </label>
      <input
        id={id}
        class={style.input}
        type="text"
        maxLength={80}
        value={name}
        aria-describedby={nameIsFull(name) ? nameNoteId(id) : undefined}
        onInput={(e) => onName((e.currentTarget as HTMLInputElement).value)}
      />
      <NameLengthNote id={nameNoteId(id)} name={name} />
    </div>
  );
}

interface WheelProps {
  id: (field: string) => string;
  /** A field's name in a "fix …" note, from its label. */
  named: (label: string) => string;
  wheel: WheelSpec;
  onWheel: (wheel: WheelSpec) => void;
}

function WheelFields({ id, named, wheel, onWheel }: WheelProps) {
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

interface DriveProps {
  id: (field: string) => string;
  /** A field's name in a "fix …" note, from its label. */
  named: (label: string) => string;
  setup: Setup;
  index: number;
  drive: PartDrive;
  onDrive: (drive: PartDrive) => void;
}

function DriveFields({ id, named, setup, index, drive, onDrive }: DriveProps) {
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
