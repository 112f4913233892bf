// The set-up on screen right now, as one signal, with one setter per field. Setters take
// values already checked by the field readers (src/ui/fields.ts) and always build a new
// object, so every computed view that reads `setup` follows at once.
import { computed, effect, signal } from '@preact/signals';
import { motorSpeedHz, type LightWave } from '../core';
import { loadMachines } from './machines';
import { decodeShareFragment } from './shareLink';
import { loadCurrentSetup, openStore, saveCurrentSetup } from './storage';
import {
  DEFAULT_DUTY_PERCENT,
  defaultSetup,
  type CameraSpec,
  type LightingSpec,
  type PartSpec,
  type SamplerKind,
  type Setup,
  type SpeedUnit,
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
export const activePart = computed<PartSpec>(() => {
  const s = setup.value;
  return s.parts[s.activePart] ?? s.parts[0];
});

/** Replaces the whole set-up (opening a machine, a share link, a stored session). */
export function replaceSetup(next: Setup): void {
  setup.value = copySetup(next);
}

function updatePart(change: (part: PartSpec) => PartSpec): void {
  const s = setup.value;
  const index = s.parts[s.activePart] ? s.activePart : 0;
  const parts = s.parts.map((p, i) => (i === index ? change({ ...p }) : p));
  setup.value = { ...s, parts };
}

/** Speed typed directly: the part no longer follows a motor's nameplate, a drive or a wheel. */
export function setSpeedRpm(rpm: number): void {
  updatePart((p) => {
    const { motor: _motor, drive: _drive, wheel: _wheel, ...rest } = p;
    return { ...rest, speedRpm: rpm };
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
 * Takes the speed from an induction motor: (1 − slip)·120·fm/P rpm (physics.md §8),
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
    const { drive: _drive, wheel: _wheel, ...rest } = p;
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

// --- The session: where the set-up on screen comes from, and keeping it across reloads ----

/** The saved machine the set-up was opened from (null = none, or it was deleted). */
export const openMachineId = signal<string | null>(null);

/** A message about how the session opened (a refused share link), for the top of the screen. */
export const sessionMessage = signal<{ kind: 'info' | 'problem'; text: string } | null>(null);

/** True once storage has been opened (or found unusable), so its status is worth showing. */
export const storageOpened = signal(false);

/** Where the starting set-up comes from: the page address, and the last set-up kept on the device. */
export interface SessionSources {
  /** The page address fragment (location.hash). */
  hash: string;
  /** Reads the share fragment (src/state/shareLink.ts). */
  decodeShare: (hash: string) => { ok: true; setup: Setup } | { ok: false; error: string | null };
  /** The set-up kept from the last visit, if any (src/state/storage.ts). */
  loadLast: () => Promise<Setup | null>;
  /** Removes the share data from the address once read, so a reload does not reopen it over later changes. */
  clearHash: () => void;
}

/**
 * Picks the starting set-up: a share link wins; a refused link shows its message and the
 * default set-up; otherwise the set-up from the last visit, else the default. A set-up the
 * user already changed (it is no longer `untouched`, the one the page opened with) is left alone.
 */
export async function openSession(
  sources: SessionSources,
  untouched: Setup = setup.peek(),
): Promise<void> {
  const shared = sources.decodeShare(sources.hash);
  if (shared.ok) {
    replaceSetup(shared.setup);
    openMachineId.value = null;
    sessionMessage.value = {
      kind: 'info',
      text: 'Opened a shared set-up. Save it as a machine to keep it.',
    };
    sources.clearHash();
    return;
  }
  if (shared.error !== null) {
    replaceSetup(defaultSetup);
    sessionMessage.value = {
      kind: 'problem',
      text: `${shared.error} The default set-up is shown instead.`,
    };
    sources.clearHash();
    return;
  }
  const last = await sources.loadLast();
  if (last && setup.peek() === untouched) replaceSetup(last);
}

/**
 * Opens the session for real: storage, the share link in the address, the last set-up;
 * then keeps every change of the set-up on the device, and loads the saved machines.
 */
export async function startSession(): Promise<void> {
  // What the page opened with: anything typed while storage opens must win over the last visit,
  // and must be kept from the first keystroke (a reload a moment later must not lose it). Until
  // something changes, nothing is written, so the last visit's set-up is there to be read.
  const untouched = setup.peek();
  effect(() => {
    const current = setup.value;
    if (current !== untouched) void saveCurrentSetup(current);
  });
  await openStore();
  storageOpened.value = true;
  await openSession(
    {
      hash: location.hash,
      decodeShare: decodeShareFragment,
      loadLast: loadCurrentSetup,
      clearHash: () => history.replaceState(history.state, '', location.pathname + location.search),
    },
    untouched,
  );
  await loadMachines();
}
