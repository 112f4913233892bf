import { numberForField } from '../../lib/format';
import {
  readExposureSeconds,
  readFlashRateFpm,
  readFlickerHz,
  readFrameRate,
  readDutyPercent,
  readModulationPercent,
  readReadoutMs,
  readShutterAngle,
} from '../../lib/fields';
import { DEFAULT_DUTY_PERCENT, type LightWaveform, type SamplerKind } from '../../state/model';
import {
  flashUnit,
  setCustomFlickerHz,
  setDutyPercent,
  setWaveform,
  setExposureSeconds,
  setFlickerMode,
  setFrameRate,
  setMainsHz,
  setModulationPercent,
  setReadoutMs,
  setSamplerKind,
  setShutterAngle,
  setStrobeRateFpm,
  setup,
} from '../../state/setup';
import { ChoiceGroup } from '../ChoiceGroup';
import { NumberField } from '../NumberField';
import { Panel } from '../Panel';
import { StrobeRangeFields } from './strobe-range';
import { FRAME_RATE_PRESETS, presetFor } from './presets';
import style from './style.module.css';

interface Props {
  class?: string;
}

const KINDS: ReadonlyArray<{ value: SamplerKind; label: string }> = [
  { value: 'strobe', label: 'Strobe' },
  { value: 'camera', label: 'Camera' },
  { value: 'lighting', label: 'Lighting' },
];

/** What looks at the part: a strobe, a camera, or the room's lighting. */
export function SamplerForm({ class: extra }: Props) {
  const kind = setup.value.samplerKind;
  return (
    <Panel title="Seen by" id="sampler" class={extra}>
      <ChoiceGroup
        legend="Seen by"
        quietLegend
        name="sampler-kind"
        options={KINDS}
        value={kind}
        onChange={setSamplerKind}
      />
      {kind === 'camera' && <CameraFields />}
      {kind === 'strobe' && <StrobeFields />}
      {kind === 'lighting' && <LightingFields />}
    </Panel>
  );
}

function CameraFields() {
  const camera = setup.value.camera;
  const preset = presetFor(camera.frameRate);
  const groups = ['Cinema', 'Broadcast', 'High speed'] as const;
  return (
    <div class={style.fields}>
      <div class={style.field}>
        <label class={style.label} for="frame-preset">
          Frame rate preset
        </label>
        <select
          id="frame-preset"
          class={style.select}
          value={preset ? String(preset.fps) : 'other'}
          onChange={(e) => {
            const v = (e.currentTarget as HTMLSelectElement).value;
            if (v !== 'other') setFrameRate(Number(v));
          }}
        >
          {groups.map((g) => (
            <optgroup key={g} label={g}>
              {FRAME_RATE_PRESETS.filter((p) => p.group === g).map((p) => (
                <option key={p.label} value={String(p.fps)}>
                  {p.label}
                </option>
              ))}
            </optgroup>
          ))}
          <option value="other">Other value</option>
        </select>
      </div>
      <NumberField
        id="frame-rate"
        label="Frame rate"
        value={camera.frameRate}
        toText={numberForField}
        read={readFrameRate}
        onValue={setFrameRate}
        unit="fps"
      />
      <ChoiceGroup
        legend="Exposure given as"
        name="exposure-mode"
        options={[
          { value: 'angle', label: 'As an angle' },
          { value: 'time', label: 'As a time' },
        ]}
        value={camera.exposure.mode}
        onChange={(mode) => {
          const e = camera.exposure;
          if (mode === e.mode) return;
          // Keep the same exposure when switching how it is given.
          if (mode === 'time' && e.mode === 'angle')
            setExposureSeconds(e.angleDeg / 360 / camera.frameRate);
          if (mode === 'angle' && e.mode === 'time')
            setShutterAngle(Math.min(360, 360 * e.seconds * camera.frameRate));
        }}
      />
      {camera.exposure.mode === 'angle' ? (
        <NumberField
          id="shutter-angle"
          label="Shutter angle"
          value={camera.exposure.angleDeg}
          toText={numberForField}
          read={readShutterAngle}
          onValue={setShutterAngle}
          unit="°"
          hint="180° = half the frame time."
        />
      ) : (
        <NumberField
          id="exposure-time"
          label="Exposure time"
          value={camera.exposure.seconds}
          toText={(s) => (s < 1 ? numberForField(1 / s) : numberForField(s))}
          read={readExposureSeconds}
          onValue={setExposureSeconds}
          unit="1/x s"
          hint="Type 500 for 1/500 s; 2 ms also works."
        />
      )}
      <NumberField
        id="readout"
        label="Rolling readout time"
        value={camera.readoutMs}
        toText={numberForField}
        read={readReadoutMs}
        onValue={setReadoutMs}
        unit="ms"
        hint="Top to bottom; phones take about 22–33 ms (Ringaby & Forssén 2011). 0 = global shutter."
      />
    </div>
  );
}

function StrobeFields() {
  const strobe = setup.value.strobe;
  const unit = flashUnit.value;
  const toText = (fpm: number) => numberForField(unit === 'fpm' ? fpm : fpm / 60);
  return (
    <div class={style.fields}>
      <NumberField
        id="flash-rate"
        label="Flash rate"
        value={strobe.rateFpm}
        unitKey={unit}
        toText={toText}
        read={(text) => readFlashRateFpm(text, unit)}
        onValue={setStrobeRateFpm}
        unit={
          <select
            class={style.unitSelect}
            aria-label="Flash rate unit"
            value={unit}
            onChange={(e) =>
              (flashUnit.value = (e.currentTarget as HTMLSelectElement).value as 'fpm' | 'Hz')
            }
          >
            <option value="fpm">fpm</option>
            <option value="Hz">Hz</option>
          </select>
        }
        hint="fpm = flashes per minute."
      />
      <StrobeRangeFields idPrefix="strobe" minLabel="Lowest rate" maxLabel="Highest rate" />
    </div>
  );
}

const WAVEFORMS: ReadonlyArray<{ value: LightWaveform; label: string }> = [
  { value: 'sine', label: 'Sine' },
  { value: 'rectangular', label: 'PWM (on–off)' },
  { value: 'rectified', label: 'Rectified mains' },
];

/** How the percent flicker sets each shape's levels (physics.md §6), in a line under the choice. */
const WAVEFORM_NOTES: Record<LightWaveform, string> = {
  sine: 'A smooth swing between max and min: its flicker component is the percent flicker itself.',
  rectangular:
    'Switches between max and min; at 100 % it goes fully off. Its harmonics count too: a 50 % square wave flickers 4/π times as strongly as a sine.',
  rectified:
    'Humps of a rectified sine sitting on the min level (a plain driver; 100 % = no smoothing at all). Its harmonics count too.',
};

/** Mains, flicker, modulation and waveform of the set-up's lighting (also used by the lighting check). */
export function LightingFields() {
  const lighting = setup.value.lighting;
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
