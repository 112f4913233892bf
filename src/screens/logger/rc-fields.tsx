// The anti-alias filter as a single RC stage: given by its cutoff, or by R and C.
import { rcCutoffHz as rcCutoffOf } from '../../core';
import { capacitanceF, rcCutoffHz, rcGiven, resistanceOhm } from '../../state/loggerPlanning';
import { ChoiceGroup } from '../../ui/choice-group';
import { NumberField } from '../../ui/number-field';
import { readCapacitanceF, readCutoffHz, readResistanceOhm } from '../../ui/toolFields';
import { formatNumber, numberForField } from '../../words/format';
import style from './style.module.css';

/** A resistance in ohms for its field: "10000". */
const ohmText = (ohm: number) => numberForField(ohm);
/** A capacitance in farads for its field, in nF: "100". */
const nanofaradText = (f: number) => numberForField(f * 1e9);

export function RcFields() {
  return (
    <>
      <ChoiceGroup
        legend="RC given as"
        name="logger-rc-given"
        options={[
          { value: 'cutoff', label: 'Its cutoff' },
          { value: 'parts', label: 'R and C' },
        ]}
        value={rcGiven.value}
        onChange={(v) => (rcGiven.value = v)}
      />
      {rcGiven.value === 'cutoff' ? (
        <NumberField
          id="logger-rc-cutoff"
          label="Cutoff"
          value={rcCutoffHz.value}
          toText={numberForField}
          read={readCutoffHz}
          onValue={(v) => (rcCutoffHz.value = v)}
          unit="Hz"
          hint="−3 dB point of the single RC stage."
        />
      ) : (
        <div class={style.pair}>
          <NumberField
            id="logger-r"
            label="Resistance"
            value={resistanceOhm.value}
            toText={ohmText}
            read={readResistanceOhm}
            onValue={(v) => (resistanceOhm.value = v)}
            unit="Ω"
            hint="10k works."
          />
          <NumberField
            id="logger-c"
            label="Capacitance"
            value={capacitanceF.value}
            toText={nanofaradText}
            read={readCapacitanceF}
            onValue={(v) => (capacitanceF.value = v)}
            unit="nF"
            hint="4.7 µF works."
          />
        </div>
      )}
      {rcGiven.value === 'parts' && (
        <p class={style.note} data-testid="logger-rc-result">
          Cutoff 1/(2πRC) = {formatNumber(rcCutoffOf(resistanceOhm.value, capacitanceF.value))} Hz.
        </p>
      )}
    </>
  );
}
