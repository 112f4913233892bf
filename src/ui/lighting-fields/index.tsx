import { numberForField } from '../../words/format';
import { readDutyPercent, readFlickerHz, readModulationPercent } from '../fields';
import { DEFAULT_DUTY_PERCENT, type LightWaveform } from '../../state/model';
import {
  setCustomFlickerHz,
  setDutyPercent,
  setFlickerMode,
  setMainsHz,
  setModulationPercent,
  setWaveform,
  lightingShown,
} from '../../state/setup';
import { ChoiceGroup } from '../choice-group';
import { NumberField } from '../number-field';
import style from './style.module.css';

const WAVEFORMS: ReadonlyArray<{ value: LightWaveform; label: string }> = [
  { value: 'sine', label: 'Sine' },
  { value: 'rectangular', label: 'PWM (on–off)' },
  { value: 'rectified', label: 'Rectified mains' },
];

/** How the percent flicker sets each shape's levels (docs/physics.md §6), in a line under the choice. */
const WAVEFORM_NOTES: Record<LightWaveform, string> = {
  sine: 'A smooth swing between max and min: its flicker component is the percent flicker itself.',
  rectangular:
    'Switches between max and min; at 100 % it goes fully off. Its harmonics count too: a 50 % square wave flickers 4/π times as strongly as a sine.',
  rectified:
    'Humps of a rectified sine sitting on the min level (a plain driver; 100 % = no smoothing at all). Its harmonics count too.',
};

/** Mains, flicker, modulation and waveform of the set-up's lighting (also used by the lighting check). */
export function LightingFields() {
  const lighting = lightingShown.value;
  const waveform = lighting.waveform ?? 'sine';
  return (
    <div class={style.fields}>
      <ChoiceGroup
        legend="Mains frequency"
        name="mains"
        options={[
          { value: '50', label: '50 Hz' },
          { value: '60', label: '60 Hz' },
        ]}
        value={String(lighting.mainsHz) as '50' | '60'}
        onChange={(v) => setMainsHz(v === '60' ? 60 : 50)}
      />
      <ChoiceGroup
        legend="Flicker"
        name="flicker"
        options={[
          { value: 'double', label: `Twice mains (${2 * lighting.mainsHz} Hz)` },
          { value: 'mains', label: `At mains (${lighting.mainsHz} Hz)` },
          { value: 'custom', label: 'Other' },
        ]}
        value={lighting.flicker}
        onChange={setFlickerMode}
      />
      {lighting.flicker === 'custom' && (
        <NumberField
          id="flicker-hz"
          label="Flicker frequency"
          value={lighting.customHz}
          toText={numberForField}
          read={readFlickerHz}
          onValue={setCustomFlickerHz}
          unit="Hz"
          hint="A dimmer's or driver's own frequency."
        />
      )}
      <NumberField
        id="modulation"
        label="Modulation (percent flicker)"
        value={lighting.modulationPercent}
        toText={numberForField}
        read={readModulationPercent}
        onValue={setModulationPercent}
        unit="%"
        hint="100 × (max − min) ÷ (max + min) of the light level. 0 = steady light."
      />
      <ChoiceGroup
        legend="Light waveform"
        name="waveform"
        options={WAVEFORMS}
        value={waveform}
        onChange={setWaveform}
      />
      {waveform === 'rectangular' && (
        <NumberField
          id="duty"
          label="Duty cycle"
          value={lighting.dutyPercent ?? DEFAULT_DUTY_PERCENT}
          toText={numberForField}
          read={readDutyPercent}
          onValue={setDutyPercent}
          unit="%"
          hint="Share of each period the light is at its high level; 50 % = a square wave."
        />
      )}
      <p class={style.note}>{WAVEFORM_NOTES[waveform]}</p>
    </div>
  );
}
