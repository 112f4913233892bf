import { InputError } from '../../core';
import {
  readFeatures,
  readPlusMinusPercent,
  readPoles,
  readSlipPercent,
  readSpeedRpm,
} from '../../ui/fields';
import { formatNumber, numberForField } from '../../words/format';
import { activePart } from '../../state/setup';
import {
  expectation,
  featuresInUse,
  finderFeatures,
  finderPartKind,
  type Expectation,
  type FinderPartKind,
} from '../../state/speedFinder';
import { ChoiceGroup } from '../../ui/choice-group';
import { NumberField } from '../../ui/number-field';
import { Panel } from '../../ui/panel';
import style from './style.module.css';

/** The count field's label for each kind of part ("Blades or marks" stays the fan's, as before). */
const COUNT_LABELS: Record<FinderPartKind, string> = {
  fan: 'Blades or marks on the part',
  gear: 'Teeth on the gear',
  other: 'Features on the part (spokes, bolts, marks)',
};

interface Props {
  /** The expected range in rpm as the core reads it, when one is given and good. */
  expectedRpm?: { from: number; to: number };
}

function change(fields: Partial<Expectation>): void {
  expectation.value = { ...expectation.value, ...fields };
}

/** Starting a range in rpm: ±10 % around the set-up's speed for the part, when it has one (a judgement). */
function startRpmRange(): Partial<Expectation> {
  const rpm = Math.abs(activePart.peek().speedRpm);
  if (!(rpm > 0)) return {};
  return { fromRpm: Math.round(rpm * 0.9), toRpm: Math.round(rpm * 1.1) };
}

/** Starting from a nameplate speed: the set-up's speed for the part, when it has one. */
function startNameplate(): Partial<Expectation> {
  const rpm = Math.abs(activePart.peek().speedRpm);
  return rpm > 0 ? { nameplateRpm: Math.round(rpm) } : {};
}

/** Starting from a nameplate: the part's own motor, when the set-up has one. */
function startMotor(): Partial<Expectation> {
  const motor = activePart.peek().motor;
  if (!motor) return {};
  return { mainsHz: motor.mainsHz === 60 ? 60 : 50, poles: motor.poles };
}

/** The part both methods work on (its kind and features) and what speed to expect. */
export function FinderSetupPanel({ expectedRpm }: Props) {
  const e = expectation.value;
  const part = activePart.value;
  const kind = finderPartKind.value;
  return (
    <Panel title="The part" id="finder-setup">
      <ChoiceGroup
        legend="Kind of part"
        name="finder-kind"
        options={[
          { value: 'fan', label: 'Fan or impeller' },
          { value: 'gear', label: 'Gear' },
          { value: 'other', label: 'Other' },
        ]}
        value={kind}
        onChange={(k) => (finderPartKind.value = k)}
      />
      <NumberField
        id="finder-features"
        label={COUNT_LABELS[kind]}
        value={featuresInUse.value}
        toText={numberForField}
        read={readFeatures}
        onValue={(n) => (finderFeatures.value = n)}
        hint={`The Check screen's part${part.name.trim() ? ` (${part.name.trim()})` : ''} has ${part.features}. One reflective mark (1) makes a strobe reading unambiguous.`}
      />
      <ChoiceGroup
        legend="Expected speed"
        name="finder-expect"
        options={[
          { value: 'none', label: 'Not known' },
          { value: 'nameplate', label: 'A speed ± %' },
          { value: 'rpm', label: 'A range in rpm' },
          { value: 'motor', label: 'Motor nameplate' },
        ]}
        value={e.mode}
        onChange={(mode) => {
          if (mode === e.mode) return;
          change({
            mode,
            ...(mode === 'nameplate'
              ? startNameplate()
              : mode === 'rpm'
                ? startRpmRange()
                : mode === 'motor'
                  ? startMotor()
                  : {}),
          });
        }}
      />
      {e.mode === 'nameplate' && <NameplateRange e={e} />}
      {e.mode === 'rpm' && <RpmRange e={e} />}
      {e.mode === 'motor' && <MotorRange e={e} />}
      {expectedRpm && (
        <p class={style.quiet} data-testid="expected-range">
          Expected {formatNumber(expectedRpm.from)} – {formatNumber(expectedRpm.to)} rpm: speeds
          inside it rank first.
        </p>
      )}
    </Panel>
  );
}

function NameplateRange({ e }: { e: Expectation }) {
  return (
    <div class={style.pair}>
      <NumberField
        id="expect-nameplate"
        label="Speed"
        name="expected speed"
        value={e.nameplateRpm}
        toText={numberForField}
        read={(text) => {
          const v = Math.abs(readSpeedRpm(text, 'rpm'));
          if (!(v > 0)) throw new InputError('speed', 'The expected speed must be above 0 rpm.');
          return v;
        }}
        onValue={(nameplateRpm) => change({ nameplateRpm })}
        unit="rpm"
      />
      <NumberField
        id="expect-plus-minus"
        label="±"
        name="expected speed's ±"
        value={e.plusMinusPercent}
        toText={numberForField}
        read={readPlusMinusPercent}
        onValue={(plusMinusPercent) => change({ plusMinusPercent })}
        unit="%"
      />
    </div>
  );
}

function RpmRange({ e }: { e: Expectation }) {
  return (
    <div class={style.pair}>
      <NumberField
        id="expect-from"
        label="From"
        value={e.fromRpm}
        toText={numberForField}
        read={(text) => {
          const v = Math.abs(readSpeedRpm(text, 'rpm'));
          if (!(v > 0))
            throw new InputError('from', 'The lowest expected speed must be above 0 rpm.');
          if (v >= expectation.peek().toRpm)
            throw new InputError('from', 'The lowest speed must be below the highest.');
          return v;
        }}
        onValue={(fromRpm) => change({ fromRpm })}
        unit="rpm"
      />
      <NumberField
        id="expect-to"
        label="To"
        value={e.toRpm}
        toText={numberForField}
        read={(text) => {
          const v = Math.abs(readSpeedRpm(text, 'rpm'));
          if (v <= expectation.peek().fromRpm)
            throw new InputError('to', 'The highest speed must be above the lowest.');
          return v;
        }}
        onValue={(toRpm) => change({ toRpm })}
        unit="rpm"
      />
    </div>
  );
}

function MotorRange({ e }: { e: Expectation }) {
  return (
    <div class={style.motor}>
      <ChoiceGroup
        legend="Mains"
        name="expect-mains"
        options={[
          { value: '50', label: '50 Hz' },
          { value: '60', label: '60 Hz' },
        ]}
        value={e.mainsHz === 60 ? '60' : '50'}
        onChange={(v) => change({ mainsHz: v === '60' ? 60 : 50 })}
      />
      <NumberField
        id="expect-poles"
        label="Poles"
        value={e.poles}
        toText={numberForField}
        read={readPoles}
        onValue={(poles) => change({ poles })}
      />
      <div class={style.pair}>
        <NumberField
          id="expect-slip-min"
          label="Slip from"
          value={e.minSlipPercent}
          toText={numberForField}
          read={(text) => {
            const v = readSlipPercent(text);
            if (v >= expectation.peek().maxSlipPercent)
              throw new InputError('slip', 'The smallest slip must be below the largest.');
            return v;
          }}
          onValue={(minSlipPercent) => change({ minSlipPercent })}
          unit="%"
        />
        <NumberField
          id="expect-slip-max"
          label="Slip to"
          value={e.maxSlipPercent}
          toText={numberForField}
          read={(text) => {
            const v = readSlipPercent(text);
            if (v <= expectation.peek().minSlipPercent)
              throw new InputError('slip', 'The largest slip must be above the smallest.');
            return v;
          }}
          onValue={(maxSlipPercent) => change({ maxSlipPercent })}
          unit="%"
        />
      </div>
      <p class={style.quiet}>
        Unloaded near 0 %, full load a few percent (typical full-load speeds are 1.7–4 % below
        synchronous).
      </p>
    </div>
  );
}
