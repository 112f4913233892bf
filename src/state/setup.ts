// The set-up on screen right now, as one signal, with one setter per field. Setters take
// values already checked by the field readers (src/ui/fields.ts) and always build a new
// object, so every computed view that reads `setup` follows at once.
import { computed, signal } from '@preact/signals';
import { motorSpeedHz, type LightWave } from '../core';
import {
  DEFAULT_DUTY_PERCENT,
  defaultSetup,
  type CameraSpec,
  type LightingSpec,
  type PartKind,
  type PartSpec,
  type WheelSpec,
  type SamplerKind,
  type Setup,
  type SpeedUnit,
  activeIndex,
  activePartOf,
} from './model';

/** A deep copy, so no two set-ups share nested objects. */
export function copySetup(s: Setup): Setup {
  return structuredClone(s);
}

/** The set-up the check screen shows and edits. */
export const setup = signal<Setup>(copySetup(defaultSetup));

/** Unit the speed field is typed in (a display choice; the set-up keeps rpm). */
export const speedUnit = signal<SpeedUnit>('rpm');
/** Unit the strobe fields are typed in (a display choice; the set-up keeps flashes per minute). */
export const flashUnit = signal<'fpm' | 'Hz'>('fpm');

/** The part being checked. */
export const activePart = computed<PartSpec>(() => activePartOf(setup.value));

// Slices of the set-up: a form that reads one re-renders when that slice changes, not on
// every keystroke elsewhere (the setters keep untouched slices as they were).
/** What looks at the part. */
export const samplerKindShown = computed<SamplerKind>(() => setup.value.samplerKind);
/** The strobe's settings. */
export const strobeShown = computed(() => setup.value.strobe);
/** The camera's settings. */
export const cameraShown = computed<CameraSpec>(() => setup.value.camera);
/** The lighting's settings. */
export const lightingShown = computed<LightingSpec>(() => setup.value.lighting);
/** Index of the part being checked. */
export const activeIndexShown = computed<number>(() => activeIndex(setup.value));

/** Replaces the whole set-up (opening a machine, a share link, a stored session). */
export function replaceSetup(next: Setup): void {
  setup.value = copySetup(next);
}

function updatePart(change: (part: PartSpec) => PartSpec): void {
  const s = setup.value;
  const index = activeIndex(s);
  const parts = s.parts.map((p, i) => (i === index ? change({ ...p }) : p));
  setup.value = { ...s, parts };
}

/**
 * Speed typed directly: the part no longer follows a motor or a drive, and no recorded origin
 * holds any more (a wheel keeps its road speed and tyre, to apply again).
 */
export function setSpeedRpm(rpm: number): void {
  updatePart((p) => {
    const { motor: _motor, drive: _drive, origin: _origin, ...rest } = p;
    return { ...rest, speedRpm: rpm };
  });
}

/**
 * The kind of the chosen part (its words and form). A wheel gets a road speed and tyre to apply
 * (the everyday car size of `defaultWheelInputs`); another kind drops them. The speed stays.
 */
export function setKind(kind: PartKind): void {
  updatePart((p) => {
    const { wheel, ...rest } = p;
    if (kind !== 'wheel') return { ...rest, kind };
    const { motor: _motor, drive: _drive, ...free } = rest;
    return { ...free, kind, wheel: wheel ?? { ...defaultWheelInputs } };
  });
}

/** A wheel's road speed and tyre when a part first becomes one: 50 km/h on 205/55R16 (an everyday car size; our choice). */
export const defaultWheelInputs: WheelSpec = {
  groundSpeed: 50,
  unit: 'km/h',
  tyreSize: '205/55R16',
};

/** The chosen wheel's road speed and tyre; its speed waits until the user applies what they give. */
export function setWheel(wheel: WheelSpec): void {
  updatePart((p) => {
    const { motor: _motor, drive: _drive, ...rest } = p;
    return { ...rest, wheel: { ...wheel } };
  });
}

export function setFeatures(features: number): void {
  updatePart((p) => ({ ...p, features }));
}

export function setTolerancePercent(tolerancePercent: number): void {
  updatePart((p) => ({ ...p, tolerancePercent }));
}

/** Motor defaults when the speed first comes from a motor: 4 poles on 50 Hz, 3 % slip (common practice). */
export const defaultMotor = { mainsHz: 50, poles: 4, slipPercent: 3 } as const;

/**
 * Takes the speed from an induction motor: (1 − slip)·120·fm/P rpm (docs/physics.md §8),
 * keeping the direction the part had. `undefined` goes back to a typed speed.
 */
export function setMotor(motor: PartSpec['motor'] | undefined): void {
  updatePart((p) => {
    if (!motor) {
      const { motor: _motor, ...rest } = p;
      return rest;
    }
    const sign = p.speedRpm < 0 ? -1 : 1;
    const rpm = motorSpeedHz(motor.mainsHz, motor.poles, motor.slipPercent / 100) * 60;
    // A part takes its speed from one source only (src/state/validate.ts).
    const { drive: _drive, wheel: _wheel, origin: _origin, ...rest } = p;
    return { ...rest, motor: { ...motor }, speedRpm: sign * rpm };
  });
}

export function setSamplerKind(samplerKind: SamplerKind): void {
  setup.value = { ...setup.value, samplerKind };
}

function updateCamera(change: Partial<CameraSpec>): void {
  setup.value = { ...setup.value, camera: { ...setup.value.camera, ...change } };
}

export function setFrameRate(frameRate: number): void {
  updateCamera({ frameRate });
}

export function setShutterAngle(angleDeg: number): void {
  updateCamera({ exposure: { mode: 'angle', angleDeg } });
}

export function setExposureSeconds(seconds: number): void {
  updateCamera({ exposure: { mode: 'time', seconds } });
}

export function setReadoutMs(readoutMs: number): void {
  updateCamera({ readoutMs });
}

export function setStrobeRateFpm(rateFpm: number): void {
  setup.value = { ...setup.value, strobe: { ...setup.value.strobe, rateFpm } };
}

/** The strobe's own range, flashes per minute; the caller guarantees min < max. */
export function setStrobeRange(minFpm: number, maxFpm: number): void {
  setup.value = { ...setup.value, strobe: { ...setup.value.strobe, minFpm, maxFpm } };
}

function updateLighting(change: Partial<LightingSpec>): void {
  setup.value = { ...setup.value, lighting: { ...setup.value.lighting, ...change } };
}

export function setMainsHz(mainsHz: 50 | 60): void {
  updateLighting({ mainsHz });
}

export function setFlickerMode(flicker: LightingSpec['flicker']): void {
  updateLighting({ flicker });
}

export function setCustomFlickerHz(customHz: number): void {
  updateLighting({ customHz });
}

export function setModulationPercent(modulationPercent: number): void {
  updateLighting({ modulationPercent });
}

export function setWaveform(waveform: NonNullable<LightingSpec['waveform']>): void {
  updateLighting({ waveform });
}

/** PWM duty, percent; the caller guarantees 0 < duty < 100. */
export function setDutyPercent(dutyPercent: number): void {
  updateLighting({ dutyPercent });
}

/** The core's light wave for a lighting set-up (a sine when none was chosen). */
export function lightWaveOf(lighting: LightingSpec): LightWave {
  const shape = lighting.waveform ?? 'sine';
  return shape === 'rectangular'
    ? { shape, dutyCycle: (lighting.dutyPercent ?? DEFAULT_DUTY_PERCENT) / 100 }
    : { shape };
}

export function setCreepRpm(creepRpm: number): void {
  setup.value = { ...setup.value, creepRpm };
}

/** The flicker frequency a lighting set-up gives, Hz. */
export function flickerHzOf(lighting: LightingSpec): number {
  if (lighting.flicker === 'double') return 2 * lighting.mainsHz;
  if (lighting.flicker === 'mains') return lighting.mainsHz;
  return lighting.customHz;
}

/** The rate of whichever sampler is chosen, Hz. */
export function samplerRateHz(s: Setup): number {
  if (s.samplerKind === 'camera') return s.camera.frameRate;
  if (s.samplerKind === 'strobe') return s.strobe.rateFpm / 60;
  return flickerHzOf(s.lighting);
}

/**
 * Sets the chosen sampler to a rate in Hz (tapping a suggested rate). For lighting this
 * picks a custom flicker frequency, as a driver or dimmer would give.
 */
export function setSamplerRateHz(rateHz: number): void {
  if (!(Number.isFinite(rateHz) && rateHz > 0)) return;
  const s = setup.value;
  if (s.samplerKind === 'camera') setFrameRate(rateHz);
  else if (s.samplerKind === 'strobe') setStrobeRateFpm(rateHz * 60);
  else updateLighting({ flicker: 'custom', customHz: rateHz });
}
