import { readFeatures, readSpeedRpm, readTolerancePercent } from '../../ui/fields';

import { numberForField } from '../../words/format';

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
} from '../../state/driveChain';
import { kindOf, partLabel, type Setup } from '../../state/model';
import { ChoiceGroup } from '../../ui/choice-group';
import { MotorFields } from '../../ui/motor-fields';
import { problemsAmong } from '../../state/fieldProblems';
import { fieldNames } from '../../ui/not-current';
import { NumberField } from '../../ui/number-field';
import { NameLengthNote, nameIsFull, nameNoteId } from '../../ui/name-length-note';

import { speedWords } from '../../words/wholeMachine';
import { DriveFields } from './drive-fields';
import { WheelApply, WheelFields } from '../../ui/wheel-fields';
import { KIND_WORDS } from '../../words/partKinds';
import { originLine } from '../../words/origin';
import style from './style.module.css';

interface Props {
  setup: Setup;
  index: number;
  /** The speed band the chain gives the part (absent while the core refuses the chain). */
  derived?: DerivedPart;
  /** Reports an edit the saved list refuses (DataError), or clears the report. */
  onProblem: (message: string | null) => void;
  /** Called once this part has been removed, so the screen can move the keyboard's focus. */
  onRemoved: (index: number) => void;
}

/**
 * One part of the machine: its name and features, where its speed comes from (typed, a motor,
 * a wheel, or a drive from an earlier part) with the fields that go with it, and the speed band
 * that gives.
 */
export function PartCard({ setup, index, derived, onProblem, onRemoved }: Props) {
  const part = setup.parts[index];
  const source = speedSourceOf(part);
  // Any refused entry on the page may feed this part's speed along the chain.
  const stale = problemsAmong();
  const id = (field: string) => `part-${index}-${field}`;
  // Several parts share labels ("Speed"): a "fix …" note names the part too.
  const named = (label: string) => `${partLabel(setup, index)}: ${label}`;
  const words = KIND_WORDS[kindOf(part)];
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
        label={words.field}
        name={named(words.field)}
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
        <>
          <WheelFields
            id={id}
            named={named}
            wheel={part.wheel}
            onWheel={(w) => act((s) => withWheel(s, index, w))}
          />
          <WheelApply index={index} part={part} wheel={part.wheel} />
        </>
      )}
      {part.origin && source !== 'drive' && source !== 'motor' && (
        <p class={style.derived} data-testid={`chain-origin-${index}`}>
          {originLine(part.origin)}
        </p>
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
        {/* A speed carried from a refused entry is not the one on screen (docs/physics.md §10). */}
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
          onClick={() => {
            act((s) => withoutPart(s, index));
            onRemoved(index);
          }}
          aria-label={`Remove this part: ${partLabel(setup, index)}`}
          data-remove-part
        >
          Remove this part
        </button>
      )}
    </li>
  );
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
