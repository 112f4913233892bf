import { numberForField } from '../../../words/format';
import {
  readExposureSeconds,
  readFlashRateFpm,
  readFrameRate,
  readReadoutMs,
  readShutterAngle,
} from '../../../ui/fields';
import type { SamplerKind } from '../../../state/model';
import {
  flashUnit,
  setExposureSeconds,
  setFrameRate,
  setReadoutMs,
  setSamplerKind,
  setShutterAngle,
  setStrobeRateFpm,
  cameraShown,
  samplerKindShown,
  strobeShown,
} from '../../../state/setup';
import { ChoiceGroup } from '../../../ui/choice-group';
import { NumberField } from '../../../ui/number-field';
import { Panel } from '../../../ui/panel';
import { LightingFields } from '../../../ui/lighting-fields';
import { StrobeRangeFields } from '../../../ui/strobe-range-fields';
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
  const kind = samplerKindShown.value;
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
  const camera = cameraShown.value;
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
  const strobe = strobeShown.value;
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
